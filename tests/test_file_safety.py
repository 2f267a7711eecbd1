"""Files: inputs are never opened for writing, outputs are written whole or not at all,
an output that is an input is refused.

Every command that writes (audit --plot/--report/--csv, annotate -o, demo,
the folder runs of audit and annotate) is run through the command line with
``open``/``os.open`` watched: opening an input for writing fails the test.
Every file written must arrive by a rename (``os.replace``) of a temporary
file in the same folder, so that an interrupted run leaves the old file or the
new one, never half a file.  (``numcheck.files`` is tested on its own in
``tests/test_files.py``.)
"""

from __future__ import annotations

import builtins
import contextlib
import hashlib
import io
import os
import shutil
import warnings
from pathlib import Path

import pytest

from numcheck.cli import main

DEMO = Path(__file__).resolve().parents[1] / "numcheck" / "data" / "demo"
_WRITE_FLAGS = os.O_WRONLY | os.O_RDWR | os.O_APPEND | os.O_CREAT | os.O_TRUNC


def _digest(folder: Path) -> dict[str, str]:
    return {p.relative_to(folder).as_posix(): hashlib.sha256(p.read_bytes()).hexdigest()
            for p in sorted(folder.rglob("*")) if p.is_file()}


@pytest.fixture()
def corpus(tmp_path):
    """A copy of the demo corpus (inputs), a folder for outputs, and a watch on file access."""
    src = tmp_path / "in"
    shutil.copytree(DEMO, src)
    (tmp_path / "out").mkdir()
    return src


@pytest.fixture()
def watch(monkeypatch, corpus):
    """Fail on any open of an input for writing; record every rename."""
    inputs = {os.path.realpath(p) for p in corpus.rglob("*")}
    renamed: list[str] = []
    real_open, real_os_open, real_replace = builtins.open, os.open, os.replace

    def guarded_open(file, mode="r", *args, **kwargs):
        if isinstance(file, (str, os.PathLike)) and any(c in mode for c in "wax+"):
            assert os.path.realpath(file) not in inputs, f"input opened for writing: {file} ({mode})"
        return real_open(file, mode, *args, **kwargs)

    def guarded_os_open(path, flags, *args, **kwargs):
        if flags & _WRITE_FLAGS:
            assert os.path.realpath(path) not in inputs, f"input opened for writing: {path}"
        return real_os_open(path, flags, *args, **kwargs)

    def recording_replace(src, dst, *args, **kwargs):
        # Beside its target, or in a batch worker's staging folder in the output folder
        # (the same file system: the rename is atomic).
        folder = Path(src).parent.resolve()
        staged = folder.parent.name.startswith(".numcheck-staging-") and \
            folder.parent.parent in Path(dst).resolve().parents
        assert staged or folder == Path(dst).parent.resolve(), "temporary file in another folder"
        assert os.stat(folder).st_dev == os.stat(Path(dst).parent).st_dev
        renamed.append(os.path.realpath(dst))
        return real_replace(src, dst, *args, **kwargs)

    monkeypatch.setattr(builtins, "open", guarded_open)
    monkeypatch.setattr(io, "open", guarded_open)
    monkeypatch.setattr(os, "open", guarded_os_open)
    monkeypatch.setattr(os, "replace", recording_replace)
    return renamed


def _cli(*argv) -> tuple[int, str]:
    out, err = io.StringIO(), io.StringIO()
    with contextlib.redirect_stdout(out), contextlib.redirect_stderr(err), warnings.catch_warnings():
        warnings.simplefilter("ignore")
        try:
            code = main([str(a) for a in argv] + ["--json"])
        except SystemExit as stop:
            code = stop.code
    return code, out.getvalue() + err.getvalue()


def _written_by_rename(folder: Path, renamed: list[str]) -> None:
    files = [p for p in folder.rglob("*") if p.is_file()]
    assert files, f"nothing written to {folder}"
    for p in files:
        assert os.path.realpath(p) in renamed, f"{p} was not written through a temporary file and a rename"
        assert not p.name.endswith(".tmp")


def test_audit_outputs(corpus, watch, tmp_path):
    before = _digest(corpus)
    out = tmp_path / "out"
    code, text = _cli("audit", corpus / "ephemeris.tsv", "--plot", out / "e.png",
                      "--report", out / "e.html", "--csv", out / "e.csv")
    assert code == 0, text
    assert sorted(p.name for p in out.iterdir()) == ["e.csv", "e.html", "e.png"]
    _written_by_rename(out, watch)
    assert _digest(corpus) == before


def test_annotate_output(corpus, watch, tmp_path):
    before = _digest(corpus)
    out = tmp_path / "out" / "p.xml"
    code, text = _cli("annotate", corpus / "papyrus.xml", "-o", out, "-k", "2")
    assert code == 0, text
    _written_by_rename(out.parent, watch)
    assert _digest(corpus) == before


def test_demo_outputs(corpus, watch, tmp_path):
    before = _digest(corpus)
    code, text = _cli("demo", "-o", tmp_path / "out" / "demo")
    assert code == 0, text
    _written_by_rename(tmp_path / "out" / "demo", watch)
    assert _digest(corpus) == before


def test_folder_runs(corpus, watch, tmp_path):
    before = _digest(corpus)
    code, text = _cli("annotate", corpus, "-o", tmp_path / "out" / "ann", "--workers", "1")
    assert code == 0, text
    code, text = _cli("audit", corpus, "--report", tmp_path / "out" / "rep")
    assert code == 0, text
    _written_by_rename(tmp_path / "out", watch)
    assert _digest(corpus) == before


# -- an output that is an input ---------------------------------------------------

@pytest.mark.parametrize("argv", [
    ("annotate", "{in}/papyrus.xml", "-o", "{in}/papyrus.xml"),
    ("annotate", "{in}/papyrus.xml", "-o", "{in}/../in/./papyrus.xml"),
    ("annotate", "{in}/papyrus.xml", "-o", "{link}"),
    ("annotate", "{in}", "-o", "{in}"),
    ("audit", "{in}/ephemeris.tsv", "--csv", "{in}/ephemeris.tsv"),
    ("audit", "{in}/ephemeris.tsv", "--report", "{in}/ephemeris.tsv"),
    ("audit", "{in}/ephemeris.tsv", "--plot", "{in}/ephemeris.tsv"),
    ("audit", "{in}", "--report", "{in}"),
    ("demo", "-o", "{data}"),
])
def test_output_equal_to_an_input_is_refused(corpus, tmp_path, argv):
    link = tmp_path / "link.xml"
    link.symlink_to(corpus / "papyrus.xml")
    before = _digest(corpus)
    args = [a.format(**{"in": corpus, "link": link, "data": DEMO}) for a in argv]
    demo_before = _digest(DEMO)
    code, text = _cli(*args)
    assert code == 2, text
    assert "input" in text or "corpus" in text or "must end in" in text
    assert _digest(corpus) == before and _digest(DEMO) == demo_before
    assert not list(corpus.rglob("*.tmp")) and not list(corpus.rglob(".*.tmp"))


def test_interrupted_write_leaves_the_old_file(tmp_path, monkeypatch):
    from numcheck.files import write_atomic

    target = tmp_path / "report.html"
    target.write_text("old report", encoding="utf-8")

    def disk_full(fd):
        raise OSError(28, "No space left on device")

    monkeypatch.setattr(os, "fsync", disk_full)
    with pytest.raises(OSError):
        write_atomic(target, "new report " * 1000)
    assert target.read_text(encoding="utf-8") == "old report"
    assert sorted(p.name for p in tmp_path.iterdir()) == ["report.html"]


def test_a_refused_file_system_exits_2_not_1(tmp_path, monkeypatch):
    """A full disk or a permission refused is the machine's answer, not a fault of numcheck."""
    def disk_full(fd):
        raise OSError(28, "No space left on device")

    monkeypatch.setattr(os, "fsync", disk_full)
    code, text = _cli("annotate", DEMO / "papyrus.xml", "-o", tmp_path / "p.xml")
    assert code == 2, text
    assert "No space left on device" in text
    assert not (tmp_path / "p.xml").exists()


def test_the_watch_sees_a_write_to_an_input(corpus, watch):
    with pytest.raises(AssertionError, match="input opened for writing"):
        open(corpus / "ephemeris.tsv", "a", encoding="utf-8")
    with pytest.raises(AssertionError, match="input opened for writing"):
        (corpus / "papyrus.xml").write_bytes(b"")
