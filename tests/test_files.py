"""Tests for numcheck.files: atomic writes and the refusal to write over an input."""

import hashlib
import os
import time

import pytest

from numcheck.errors import NumcheckError
from numcheck.files import OutputError, check_distinct, same_file, write_atomic


def _hash(path):
    return hashlib.sha256(path.read_bytes()).hexdigest()


def test_write_text_and_bytes(tmp_path):
    out = tmp_path / "a.txt"
    write_atomic(out, "λβ 1/32\n")
    assert out.read_bytes() == "λβ 1/32\n".encode("utf-8")
    write_atomic(out, b"\x00\x01")
    assert out.read_bytes() == b"\x00\x01"


def test_no_temporary_files_left(tmp_path):
    write_atomic(tmp_path / "a.txt", "x")
    assert sorted(p.name for p in tmp_path.iterdir()) == ["a.txt"]


def test_missing_folder_is_a_user_error(tmp_path):
    with pytest.raises(OutputError, match="does not exist"):
        write_atomic(tmp_path / "nope" / "a.txt", "x")


def test_folder_as_target_is_refused(tmp_path):
    with pytest.raises(OutputError, match="folder"):
        write_atomic(tmp_path, "x")


def test_output_equal_to_input_is_refused(tmp_path):
    src = tmp_path / "in.xml"
    src.write_text("<TEI/>")
    before = _hash(src)
    with pytest.raises(NumcheckError, match="same file as the input"):
        check_distinct([src], tmp_path / "sub" / ".." / "in.xml")
    with pytest.raises(OutputError):
        check_distinct(str(src), src)
    assert _hash(src) == before


def test_symlink_to_input_is_refused(tmp_path):
    src = tmp_path / "in.xml"
    src.write_text("<TEI/>")
    link = tmp_path / "link.xml"
    os.symlink(src, link)
    assert same_file(src, link)
    with pytest.raises(OutputError):
        check_distinct([tmp_path / "other.xml", src], link)


def test_distinct_paths_pass(tmp_path):
    check_distinct([tmp_path / "a.xml"], tmp_path / "b.xml")


def test_failed_write_keeps_old_file(tmp_path, monkeypatch):
    out = tmp_path / "a.txt"
    out.write_text("old")

    def boom(*args):
        raise OSError("disk full")

    monkeypatch.setattr(os, "replace", boom)
    with pytest.raises(OSError):
        write_atomic(out, "new")
    assert out.read_text() == "old"
    assert sorted(p.name for p in tmp_path.iterdir()) == ["a.txt"]


# -- issue 22: nesting, kinds of input, stale temporaries ----------------------

def test_output_inside_input_folder_or_holding_it_is_refused(tmp_path):
    ed = tmp_path / "ed"
    (ed / "sub").mkdir(parents=True)
    with pytest.raises(OutputError, match="lies inside the input folder"):
        check_distinct([ed], ed / "sub")
    with pytest.raises(OutputError, match="lies inside the input folder"):
        check_distinct([ed], ed / "new" / "deeper")          # not there yet: still inside
    with pytest.raises(OutputError, match="lies inside the output"):
        check_distinct([ed / "sub"], ed)
    with pytest.raises(OutputError, match="lies inside the output"):
        check_distinct([ed / "sub" / "a.xml"], ed)           # a file inside an output folder
    check_distinct([ed / "sub"], tmp_path / "elsewhere")     # apart: fine
    check_distinct([ed / "a.xml"], ed / "b.xml")              # two files side by side: fine


def test_input_kinds_are_refused_before_a_byte_is_read(tmp_path):
    from numcheck.files import InputFileError, check_input_file
    fifo = tmp_path / "t.tsv"
    os.mkfifo(fifo)
    with pytest.raises(InputFileError, match="FIFO"):
        check_input_file(fifo)                  # would block for ever if it were opened
    with pytest.raises(InputFileError, match="character device"):
        check_input_file("/dev/zero")
    with pytest.raises(InputFileError, match="folder"):
        check_input_file(tmp_path)
    binary = tmp_path / "b.tsv"
    binary.write_bytes(b"A\tB\n\x00\x01\x02")
    with pytest.raises(InputFileError, match="binary"):
        check_input_file(binary)
    utf16 = tmp_path / "u.tsv"
    utf16.write_bytes("A\tB\n1\t2\n".encode("utf-16"))
    assert check_input_file(utf16) == utf16.stat().st_size


def test_a_killed_writers_temporary_file_is_swept(tmp_path):
    from numcheck.files import TEMP_MARK, sweep_stale_temporaries
    # A temporary file of a process that no longer runs (pid 2**22 + 1 is
    # above Linux's default pid_max), one of a live process, and a stranger's.
    dead = tmp_path / f".a.txt{TEMP_MARK}{2**22 + 1}-x1.tmp"
    live = tmp_path / f".a.txt{TEMP_MARK}{os.getppid()}-x2.tmp"
    other = tmp_path / ".a.txt.abc.tmp"
    for p in (dead, live, other):
        p.write_bytes(b"half a file")
    write_atomic(tmp_path / "a.txt", "whole")
    assert sorted(p.name for p in tmp_path.iterdir()) == sorted(["a.txt", live.name, other.name])
    old = time.time() - 2 * __import__("numcheck").limits.STALE_TEMP_SECONDS
    os.utime(live, (old, old))
    assert sweep_stale_temporaries(tmp_path) == [live.name]


def test_sigterm_during_a_write_leaves_no_temporary_file(tmp_path):
    import signal
    import subprocess
    import sys
    code = ("import os, signal, numcheck.files as f\n"
            "from numcheck.cli import _on_terminate\n"
            "signal.signal(signal.SIGTERM, _on_terminate)\n"
            "real = os.fsync\n"
            "def slow(fd):\n"
            "    os.kill(os.getpid(), signal.SIGTERM)\n"
            "    real(fd)\n"
            "os.fsync = slow\n"
            f"f.write_atomic({str(tmp_path / 'big.bin')!r}, b'x' * 5_000_000)\n")
    done = subprocess.run([sys.executable, "-c", code], capture_output=True, timeout=60)
    assert done.returncode == 128 + signal.SIGTERM
    assert list(tmp_path.iterdir()) == []


def test_a_batch_sweeps_each_output_folder_once(tmp_path):
    """annotate_folder sweeps its output folders before it starts, not at each file it writes."""
    from numcheck.batch import annotate_folder
    from numcheck.files import TEMP_MARK

    src, out = tmp_path / "in", tmp_path / "out"
    (src / "sub").mkdir(parents=True)
    (out / "sub").mkdir(parents=True)
    page = ('<TEI xmlns="http://www.tei-c.org/ns/1.0"><text><body><ab><num>ιβ</num></ab>'
            '</body></text></TEI>')
    for name in ("a.xml", "sub/b.xml"):
        (src / name).write_text(page, encoding="utf-8")
    dead = [out / f".a.xml{TEMP_MARK}{2**22 + 1}-x1.tmp", out / "sub" / f".b.xml{TEMP_MARK}{2**22 + 1}-x2.tmp"]
    live = out / f".a.xml{TEMP_MARK}{os.getppid()}-x3.tmp"
    for p in dead + [live]:
        p.write_bytes(b"half a file")
    annotate_folder(src, out, workers=1)
    assert not any(p.exists() for p in dead)
    assert live.exists()
    assert "12" in (out / "sub" / "b.xml").read_text(encoding="utf-8")


# -- outputs written pending and committed in groups (a batch: issue 20) ------

def test_pending_outputs_appear_only_when_committed(tmp_path):
    from numcheck.files import commit_pending, write_pending

    (tmp_path / "b.xml").write_text("old", encoding="utf-8")
    stage = tmp_path / "stage"
    stage.mkdir()
    pending = [(write_pending(tmp_path / "a.xml", b"new a"), tmp_path / "a.xml"),
               (write_pending(tmp_path / "b.xml", b"new b", str(stage)), tmp_path / "b.xml")]
    assert not (tmp_path / "a.xml").exists()
    assert (tmp_path / "b.xml").read_text(encoding="utf-8") == "old"
    commit_pending(pending)
    assert (tmp_path / "a.xml").read_bytes() == b"new a"
    assert (tmp_path / "b.xml").read_bytes() == b"new b"
    assert sorted(p.name for p in tmp_path.iterdir()) == ["a.xml", "b.xml", "stage"]
    assert list(stage.iterdir()) == []
    umask = os.umask(0)
    os.umask(umask)
    assert (tmp_path / "a.xml").stat().st_mode & 0o777 == 0o666 & ~umask


def test_a_failed_commit_removes_what_it_did_not_rename(tmp_path):
    from numcheck.files import commit_pending, write_pending

    (tmp_path / "folder.xml").mkdir()               # a target that cannot be replaced
    pending = [(write_pending(tmp_path / n, b"x"), tmp_path / n)
               for n in ("a.xml", "folder.xml", "c.xml")]
    with pytest.raises(OSError):
        commit_pending(pending)
    assert (tmp_path / "a.xml").read_bytes() == b"x"
    assert sorted(p.name for p in tmp_path.iterdir()) == ["a.xml", "folder.xml"]


def test_a_target_on_another_file_system_is_still_written_whole(tmp_path, monkeypatch):
    import errno

    from numcheck.files import commit_pending, write_pending

    real = os.replace
    calls = []

    def across(src, dst, *args, **kwargs):
        calls.append(dst)
        if len(calls) == 1:
            raise OSError(errno.EXDEV, "Invalid cross-device link")
        return real(src, dst, *args, **kwargs)

    monkeypatch.setattr(os, "replace", across)
    commit_pending([(write_pending(tmp_path / "a.xml", b"whole"), tmp_path / "a.xml")])
    assert (tmp_path / "a.xml").read_bytes() == b"whole"
    assert [p.name for p in tmp_path.iterdir()] == ["a.xml"]


def test_discarded_pending_outputs_leave_nothing(tmp_path):
    from numcheck.files import discard_pending, write_pending

    pending = [(write_pending(tmp_path / "a.xml", b"x"), tmp_path / "a.xml")]
    discard_pending(pending)
    discard_pending(pending)                        # twice: nothing to remove, no error
    assert list(tmp_path.iterdir()) == []


def test_without_syncfs_each_pending_output_is_flushed(tmp_path, monkeypatch):
    from numcheck import files

    flushed = []
    real = os.fsync
    monkeypatch.setattr(files, "_syncfs", lambda: None)            # a system without syncfs
    monkeypatch.setattr(os, "fsync", lambda fd: (flushed.append(fd), real(fd)))
    pending = [(files.write_pending(tmp_path / n, b"x"), tmp_path / n) for n in ("a.xml", "b.xml")]
    files.commit_pending(pending)
    assert len(flushed) == 2
    assert sorted(p.name for p in tmp_path.iterdir()) == ["a.xml", "b.xml"]


def test_a_failed_flush_renames_nothing_and_leaves_no_temporary(tmp_path, monkeypatch):
    from numcheck import files

    (tmp_path / "a.xml").write_text("old", encoding="utf-8")
    monkeypatch.setattr(files, "_syncfs", lambda: (lambda fd: -1))    # the disk refused
    pending = [(files.write_pending(tmp_path / "a.xml", b"new"), tmp_path / "a.xml")]
    with pytest.raises(OSError):
        files.commit_pending(pending)
    assert (tmp_path / "a.xml").read_text(encoding="utf-8") == "old"
    assert [p.name for p in tmp_path.iterdir()] == ["a.xml"]


def test_files_written_together_replace_their_targets_with_one_flush(tmp_path, monkeypatch):
    from numcheck import files

    (tmp_path / "a.csv").write_text("old")
    flushes = []
    real = files._sync_all
    monkeypatch.setattr(files, "_sync_all", lambda paths: (flushes.append(len(paths)), real(paths)))
    files.write_atomic_together([(tmp_path / "a.csv", "ä,1\n"), (tmp_path / "b.json", b"{}\n")])
    assert (tmp_path / "a.csv").read_bytes() == "ä,1\n".encode("utf-8")
    assert (tmp_path / "b.json").read_bytes() == b"{}\n"
    assert flushes == [2]
    assert sorted(p.name for p in tmp_path.iterdir()) == ["a.csv", "b.json"]


def test_files_written_together_are_all_refused_for_one_bad_target(tmp_path):
    from numcheck import files

    (tmp_path / "b.json").mkdir()
    with pytest.raises(files.OutputError, match="is a folder"):
        files.write_atomic_together([(tmp_path / "a.csv", "x"), (tmp_path / "b.json", "y")])
    assert sorted(p.name for p in tmp_path.iterdir()) == ["b.json"]       # no a.csv, no temporary
