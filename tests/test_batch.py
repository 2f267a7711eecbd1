"""Tests for numcheck.batch: folders of TEI files and tables, the summary, the report index."""

import hashlib
import io
import json
import os
import shutil
from pathlib import Path

import pytest
from lxml import etree

from numcheck import batch
from numcheck.cli import main
from numcheck.errors import NumcheckError
from numcheck.tei.markup import TEI_NS

DEMO = Path(__file__).resolve().parent.parent / "corpora_demo"


def tei(body: str) -> bytes:
    return (f'<?xml version="1.0" encoding="UTF-8"?>\n<TEI xmlns="{TEI_NS}"><text><body>'
            f"{body}</body></text></TEI>\n").encode()


def tree_hash(folder: Path, *, outputs_only: bool = False) -> dict:
    """The files of *folder* and their hashes (with *outputs_only*, not the run's summary and journal)."""
    def kept(p: Path) -> bool:
        rel = p.relative_to(folder)
        return not outputs_only or not (rel.parts[0].startswith(".numcheck")
                                         or rel.name in batch.SUMMARY_FILES)
    return {p.relative_to(folder).as_posix(): hashlib.sha256(p.read_bytes()).hexdigest()
            for p in sorted(folder.rglob("*")) if p.is_file() and kept(p)}


@pytest.fixture
def xml_folder(tmp_path):
    src = tmp_path / "in"
    (src / "sub").mkdir(parents=True)
    (src / "a.xml").write_bytes(tei("<p><num>0;30</num> <num value='3'>4</num></p>"))
    (src / "sub" / "b.xml").write_bytes(tei(
        '<p><num>1<gap reason="lost" quantity="1" unit="character"/></num></p>'))
    (src / "broken.xml").write_bytes(b"<TEI><p>")
    (src / "notes.txt").write_text("not xml")
    (src / ".hidden.xml").write_bytes(tei("<p><num>1</num></p>"))
    return src


def test_annotate_folder_summary(xml_folder, tmp_path):
    before = tree_hash(xml_folder)
    out = tmp_path / "out"
    result = batch.annotate_folder(xml_folder, out, workers=1)
    assert tree_hash(xml_folder) == before                    # inputs untouched
    files = {f["file"]: f for f in result.files}
    assert sorted(files) == ["a.xml", "broken.xml", "sub/b.xml"]
    assert "malformed XML" in files["broken.xml"]["error"]
    assert result.summary == {"files": 3, "failed": 1, "skipped": 0, "numbers": 3,
                              "damaged": 1, "flagged": 1, "restored": 0, "unreadable": 0}
    b = etree.parse(str(out / "sub" / "b.xml")).find(f".//{{{TEI_NS}}}num")
    assert (b.get("atLeast"), b.get("atMost")) == ("10", "19")
    assert not (out / "broken.xml").exists()
    assert not (out / ".hidden.xml").exists()


def test_annotate_folder_with_pool_matches_serial(tmp_path):
    src = tmp_path / "many"
    src.mkdir()
    for i in range(batch.POOL_MIN_FILES + 1):
        (src / f"t{i:02d}.xml").write_bytes(tei(f"<p><num>{i};30</num></p>"))
    pooled = batch.annotate_folder(src, tmp_path / "o1", workers=2)
    serial = batch.annotate_folder(src, tmp_path / "o2", workers=1)
    strip = [{k: v for k, v in f.items() if k != "output"} for f in pooled.files]
    assert strip == [{k: v for k, v in f.items() if k != "output"} for f in serial.files]
    assert tree_hash(tmp_path / "o1", outputs_only=True) == \
        tree_hash(tmp_path / "o2", outputs_only=True)
    assert pooled.summary["numbers"] == batch.POOL_MIN_FILES + 1


def test_progress_callback(xml_folder, tmp_path):
    seen = []
    batch.annotate_folder(xml_folder, tmp_path / "o", workers=1,
                          progress=lambda done, total, name: seen.append((done, total, name)))
    assert seen == [(1, 3, "a.xml"), (2, 3, "broken.xml"), (3, 3, "sub/b.xml")]


def test_output_folder_equal_to_input_refused(xml_folder):
    before = tree_hash(xml_folder)
    with pytest.raises(NumcheckError, match="is the input folder"):
        batch.annotate_folder(xml_folder, xml_folder / "." , workers=1)
    assert tree_hash(xml_folder) == before


def test_output_folder_inside_input_is_refused_before_any_work(xml_folder):
    # An output folder inside the input would be written over an input of the
    # same relative name (in/sub/b.xml is both an input and the output of
    # in/b.xml when -o in/sub): refused, and nothing written.
    before = tree_hash(xml_folder)
    for out in (xml_folder / "annotated", xml_folder / "sub"):
        with pytest.raises(NumcheckError, match="lies inside the input folder"):
            batch.annotate_folder(xml_folder, out, workers=1)
    assert tree_hash(xml_folder) == before
    assert not (xml_folder / "annotated").exists()


def test_not_a_folder(tmp_path):
    with pytest.raises(NumcheckError, match="is not a folder"):
        batch.annotate_folder(tmp_path / "nope", tmp_path / "o")


def test_audit_folder_with_reports_and_index(tmp_path):
    src = tmp_path / "tables"
    src.mkdir()
    shutil.copy(DEMO / "ephemeris.tsv", src)
    shutil.copy(DEMO / "papyrus.xml", src)
    (src / "letter.xml").write_bytes(tei("<p>no table here, <num>3</num></p>"))
    reports = tmp_path / "reports"
    out = batch.audit_folder(src, report_dir=reports, workers=1)
    files = {f["file"]: f for f in out["files"]}
    assert "no TEI <table>" in files["letter.xml"]["skipped"]
    eph = files["ephemeris.tsv"]
    assert eph["numbers"] == 36 * 3
    assert eph["damaged"] == 4 and eph["restored"] == 4   # corpora_demo/answer_key.json: 4 lost digits
    assert eph["flagged"] == 14                           # 14 slipped lines in the key
    assert files["papyrus.xml"]["numbers"] == 48
    assert out["summary"]["skipped"] == 1 and out["summary"]["failed"] == 0
    index = (reports / "index.html").read_text(encoding="utf-8")
    for name in ("ephemeris.tsv.html", "ephemeris.tsv.png", "papyrus.xml.html"):
        assert (reports / name).is_file()
        assert f'href="{name}"' in index
    assert out["index"] == str(reports / "index.html")


def test_cli_annotate_folder_json(xml_folder, tmp_path, capsys):
    code = main(["annotate", str(xml_folder), "-o", str(tmp_path / "o"), "--json", "--workers", "1"])
    assert code == 0
    data = json.loads(capsys.readouterr().out)
    assert data["summary"]["files"] == 3 and data["summary"]["failed"] == 1


def test_cli_annotate_folder_needs_output(xml_folder, capsys):
    assert main(["annotate", str(xml_folder)]) == 2
    assert "give an output folder" in capsys.readouterr().err


def test_cli_annotate_folder_table(xml_folder, tmp_path, capsys):
    assert main(["annotate", str(xml_folder), "-o", str(tmp_path / "o"), "--workers", "1"]) == 0
    text = capsys.readouterr().out
    assert "numcheck annotate" in text
    assert "broken.xml" in text and "malformed XML" in " ".join(text.split())


def test_audit_command_takes_a_single_tei_file(capsys):
    # The demo papyrus: its <table> is audited like a TSV, the notation read
    # from its letters (the demo generator put one ten-slip in it).
    import json
    from importlib import resources

    from numcheck.cli import main

    papyrus = resources.files("numcheck") / "data" / "demo" / "papyrus.xml"
    assert main(["audit", str(papyrus), "--json"]) == 0
    data = json.loads(capsys.readouterr().out)
    assert [f["kind"] for f in data["flags"]] == ["ten-slip"]
    assert data["restorations"]


# -- issues 21 and 22: whole corpora -------------------------------------------

def _tables(folder: Path, n: int, slip_every: int = 7) -> None:
    """*n* small tables, a ten-slip in every *slip_every*-th (generated here, common practice)."""
    folder.mkdir(parents=True, exist_ok=True)
    for i in range(n):
        rows = [f"{k}\t{3 * k + i}" for k in range(1, 9)]
        if i % slip_every == 0:
            k, v = rows[4].split("\t")
            rows[4] = f"{k}\t{int(v) + 10}"
        (folder / f"t{i:04d}.tsv").write_text("n\tA\n" + "\n".join(rows) + "\n", encoding="utf-8")


def test_summary_files_per_file_and_corpus_wide(tmp_path):
    _tables(tmp_path / "in", 8)
    (tmp_path / "in" / "bad.tsv").write_text("A\tB\n1\n", encoding="utf-8")
    out = batch.audit_folder(tmp_path / "in", summary_dir=tmp_path / "s", workers=1)
    assert out["summary"]["files"] == 9 and out["summary"]["failed"] == 1
    import csv
    files = list(csv.DictReader(io.StringIO(
        (tmp_path / "s" / "numcheck-files.csv").read_text(encoding="utf-8"))))
    assert [r["file"] for r in files] == ["bad.tsv"] + [f"t{i:04d}.tsv" for i in range(8)]
    assert files[0]["status"] == "failed" and "ragged" in files[0]["message"]
    assert {r["file"]: r["flagged"] for r in files}["t0001.tsv"] == "0"
    findings = list(csv.DictReader(io.StringIO(
        (tmp_path / "s" / "numcheck-findings.csv").read_text(encoding="utf-8"))))
    slipped = {(r["file"], r["row"], r["kind"]) for r in findings}
    # t0000 and t0007 carry the slip at row 5 (a ten more than 3k + i).
    assert ("t0000.tsv", "5", "ten-slip") in slipped and ("t0007.tsv", "5", "ten-slip") in slipped
    assert all(list(r) == list(batch.FINDING_COLUMNS) for r in findings)
    data = json.loads((tmp_path / "s" / "numcheck-summary.json").read_text(encoding="utf-8"))
    assert data["summary"] == out["summary"] and len(data["findings"]) == len(findings)


def test_a_run_killed_midway_resumes_to_the_same_summary(tmp_path):
    import os
    import signal
    import subprocess
    import sys
    import time

    _tables(tmp_path / "in", 60)
    whole = batch.audit_folder(tmp_path / "in", summary_dir=tmp_path / "whole", workers=1)
    env = dict(os.environ, PYTHONPATH=str(Path(batch.__file__).resolve().parents[1]))
    # The journal records every 5 files here (limits.BATCH_JOURNAL_ENTRIES), so
    # that the kill falls between two records.
    args = ["audit", str(tmp_path / "in"), "--summary", str(tmp_path / "s"), "--workers", "1",
            "--json"]
    argv = [sys.executable, "-c", "import numcheck.limits as L; L.BATCH_JOURNAL_ENTRIES = 5; "
            f"from numcheck.cli import main; raise SystemExit(main({args!r}))"]
    proc = subprocess.Popen(argv, stdout=subprocess.DEVNULL, stderr=subprocess.DEVNULL, env=env)
    journal = tmp_path / "s" / batch.JOURNAL_DIR
    deadline = time.monotonic() + 120
    while time.monotonic() < deadline and not list(journal.glob("part-*.jsonl")):
        time.sleep(0.05)
    proc.send_signal(signal.SIGKILL)              # kill -9: nothing can be cleaned up
    proc.wait()
    done_before = sum(len(p.read_text(encoding="utf-8").splitlines())
                      for p in journal.glob("part-*.jsonl"))
    assert 0 < done_before < 60, done_before
    resumed = batch.audit_folder(tmp_path / "in", summary_dir=tmp_path / "s", workers=1)
    assert resumed["resumed"] == done_before
    assert resumed["summary"] == whole["summary"] and resumed["files"] == whole["files"]
    for name in ("numcheck-files.csv", "numcheck-findings.csv"):
        assert (tmp_path / "s" / name).read_bytes() == (tmp_path / "whole" / name).read_bytes()
    again = batch.audit_folder(tmp_path / "in", summary_dir=tmp_path / "s", workers=1)
    assert again["resumed"] == 60                 # nothing redone
    (tmp_path / "in" / "t0003.tsv").write_text("n\tA\n1\t5\n2\t6\n3\t7\n", encoding="utf-8")
    changed = batch.audit_folder(tmp_path / "in", summary_dir=tmp_path / "s", workers=1)
    assert changed["resumed"] == 59               # a changed file is done again
    fresh = batch.audit_folder(tmp_path / "in", summary_dir=tmp_path / "s", workers=1, fresh=True)
    assert "resumed" not in fresh


def _interrupted_at(real, at: int):
    """*real* (a batch's one-file function), with Ctrl-C pressed at its *at*-th call."""
    calls = []

    def stop(job):
        calls.append(job[0])
        if len(calls) == at:
            raise KeyboardInterrupt
        return real(job)

    return stop


def test_ctrl_c_records_what_finished(tmp_path, monkeypatch):
    _tables(tmp_path / "in", 12)
    real = batch._audit_one
    monkeypatch.setattr(batch, "_audit_one", _interrupted_at(real, 5))
    with pytest.raises(KeyboardInterrupt):
        batch.audit_folder(tmp_path / "in", summary_dir=tmp_path / "s", workers=1)
    monkeypatch.setattr(batch, "_audit_one", real)
    resumed = batch.audit_folder(tmp_path / "in", summary_dir=tmp_path / "s", workers=1)
    assert resumed["resumed"] == 4 and resumed["summary"]["files"] == 12


def test_pool_is_bounded_by_the_machine(tmp_path, monkeypatch):
    seen = {}
    import concurrent.futures as cf
    real = cf.ProcessPoolExecutor

    def spy(*args, **kwargs):
        seen["workers"] = kwargs.get("max_workers")
        return real(*args, **kwargs)

    monkeypatch.setattr(cf, "ProcessPoolExecutor", spy)
    _tables(tmp_path / "in", batch.POOL_MIN_FILES + 2)
    out = batch.audit_folder(tmp_path / "in", workers=1000)
    assert out["summary"]["files"] == batch.POOL_MIN_FILES + 2
    assert 1 <= seen.get("workers", 1) <= batch.machine_workers()


def test_links_out_of_the_folder_are_not_followed(tmp_path):
    import os
    outside = tmp_path / "outside"
    outside.mkdir()
    (outside / "secret.tsv").write_text("SECRET LINE\t1\n2\t3\n", encoding="utf-8")
    _tables(tmp_path / "in", 2)
    os.symlink(outside / "secret.tsv", tmp_path / "in" / "link.tsv")
    os.symlink(outside, tmp_path / "in" / "linkdir")
    os.symlink(tmp_path / "in" / "t0000.tsv", tmp_path / "in" / "inside.tsv")   # stays inside: read
    out = batch.audit_folder(tmp_path / "in", workers=1)
    assert sorted(f["file"] for f in out["files"]) == ["inside.tsv", "t0000.tsv", "t0001.tsv"]
    assert "SECRET" not in json.dumps(out)


def test_file_names_that_are_not_utf8(tmp_path, capsys):
    import os
    src = tmp_path / "in"
    _tables(src, 1)
    name = os.fsencode(str(src)) + b"/caf\xe9.tsv"        # Latin-1 bytes, not UTF-8
    with open(name, "wb") as fh:
        fh.write(b"n\tA\n1\t2\n2\t3\n3\t4\n")
    assert main(["audit", str(src), "--report", str(tmp_path / "r"), "--json"]) == 0
    raw = capsys.readouterr().out
    data = json.loads(raw)
    assert raw.encode("utf-8").decode("utf-8") == raw
    assert sorted(f["file"] for f in data["files"]) == ["caf\ufffd.tsv", "t0000.tsv"]
    index = (tmp_path / "r" / "index.html").read_text(encoding="utf-8")
    assert "caf\ufffd.tsv" in index


def test_a_long_error_is_quoted_as_an_excerpt(tmp_path):
    src = tmp_path / "in"
    src.mkdir()
    (src / "long.xml").write_bytes(tei("<p><num>" + "q" * 1_000_000 + "</num></p>"))
    result = batch.annotate_folder(src, tmp_path / "o", workers=1)
    entry = result.files[0]
    messages = [entry.get("error", "")] + [n.get("message", "") for n in entry.get("unreadable_nums", [])]
    assert max(len(m) for m in messages) < 2500


def test_asking_how_the_pool_starts_leaves_the_choice_to_the_program():
    import multiprocessing

    before = multiprocessing.get_start_method(allow_none=True)
    batch._forks()
    assert multiprocessing.get_start_method(allow_none=True) == before


def _accounts(folder, n):
    folder.mkdir(parents=True, exist_ok=True)
    for i in range(n):
        (folder / f"acc{i:03d}.xml").write_text(
            '<TEI xmlns="http://www.tei-c.org/ns/1.0"><text><body><ab xml:lang="grc">'
            f'<num value="{i + 1}">{"αβγδεϛζηθ"[i % 9]}</num></ab></body></text></TEI>',
            encoding="utf-8")


def _left_over(folder):
    return sorted(p.name for p in folder.rglob("*")
                  if p.name.startswith(batch.STAGING_PREFIX) or p.name.endswith(".tmp"))


@pytest.mark.parametrize("workers", [1, 2])
def test_a_run_leaves_no_staging_folder_nor_temporary(tmp_path, workers):
    _accounts(tmp_path / "in", batch.POOL_MIN_FILES + 4)
    result = batch.annotate_folder(tmp_path / "in", tmp_path / "out", workers=workers)
    assert result.summary["files"] == batch.POOL_MIN_FILES + 4
    assert _left_over(tmp_path / "out") == []
    assert 'value="3"' in (tmp_path / "out" / "acc002.xml").read_text(encoding="utf-8")


def test_ctrl_c_commits_the_outputs_of_what_finished(tmp_path, monkeypatch):
    _accounts(tmp_path / "in", 12)
    real = batch._annotate_one
    monkeypatch.setattr(batch, "_annotate_one", _interrupted_at(real, 6))
    with pytest.raises(KeyboardInterrupt):
        batch.annotate_folder(tmp_path / "in", tmp_path / "out", workers=1)
    written = sorted(p.name for p in (tmp_path / "out").glob("*.xml"))
    assert written == [f"acc{i:03d}.xml" for i in range(5)]
    assert _left_over(tmp_path / "out") == []
    monkeypatch.setattr(batch, "_annotate_one", real)
    again = batch.annotate_folder(tmp_path / "in", tmp_path / "out", workers=1)
    assert again.resumed == 5 and again.summary["files"] == 12


def test_a_killed_runs_staging_folder_is_swept(tmp_path):
    _accounts(tmp_path / "in", 2)
    stale = tmp_path / "out" / f"{batch.STAGING_PREFIX}{2**22 + 3}-abc" / str(2**22 + 4)
    stale.mkdir(parents=True)
    (stale / ".acc000.xml.numcheck-1-x.tmp").write_bytes(b"half")
    live = tmp_path / "out" / f"{batch.STAGING_PREFIX}{os.getppid()}-def"
    live.mkdir()
    batch.annotate_folder(tmp_path / "in", tmp_path / "out", workers=1)
    assert not stale.parent.exists() and live.exists()


def test_a_worker_stopped_midway_removes_its_pending_outputs(tmp_path):
    from numcheck.files import write_pending

    made = []

    def worker(job):
        if job == ("c",):
            raise SystemExit(143)                   # SIGTERM from the parent
        tmp = write_pending(tmp_path / f"{job[0]}.xml", b"x")
        made.append(tmp)
        return {"file": job[0]}, ((tmp, str(tmp_path / f"{job[0]}.xml")),)

    with pytest.raises(SystemExit):
        batch._run_chunk(worker, [(("a",), [1, 2]), (("b",), [1, 2]), (("c",), [1, 2])])
    assert len(made) == 2 and list(tmp_path.iterdir()) == []


def test_chunks_are_small_enough_for_every_worker_to_get_many():
    assert batch._chunk_size(3, 2) == 1
    assert batch._chunk_size(1000, 2) == 16
    assert batch._chunk_size(100, 2) == 6


def test_an_annotate_pool_killed_midway_resumes_to_the_same_outputs(tmp_path):
    """kill -9 of a run on 2 workers: every output the journal records is whole, what the
    killed run left pending is swept, and the resumed run's outputs and summary are those
    of an uninterrupted run."""
    import signal
    import subprocess
    import sys
    import time

    _accounts(tmp_path / "in", 120)
    whole = batch.annotate_folder(tmp_path / "in", tmp_path / "whole", workers=1)
    env = dict(os.environ, PYTHONPATH=str(Path(batch.__file__).resolve().parents[1]))
    args = ["annotate", str(tmp_path / "in"), "-o", str(tmp_path / "out"), "--workers", "2",
            "--json"]
    # Each file slowed a little, and a record every 10 files, so that the kill falls midway.
    argv = [sys.executable, "-c",
            "import time, numcheck.limits as L, numcheck.batch as b; L.BATCH_JOURNAL_ENTRIES = 10\n"
            "real = b._annotate_one\n"
            "def slow(job):\n    time.sleep(0.02)\n    return real(job)\n"
            "b._annotate_one = slow\n"
            f"from numcheck.cli import main; raise SystemExit(main({args!r}))"]
    proc = subprocess.Popen(argv, stdout=subprocess.DEVNULL, stderr=subprocess.DEVNULL, env=env)
    journal = tmp_path / "out" / batch.JOURNAL_DIR
    deadline = time.monotonic() + 120
    while time.monotonic() < deadline and len(list(journal.glob("part-*.jsonl"))) < 2:
        time.sleep(0.02)
    proc.send_signal(signal.SIGKILL)
    proc.wait()
    time.sleep(0.5)                               # the workers die with their parent
    recorded = [json.loads(line)["rel"] for p in journal.glob("part-*.jsonl")
                for line in p.read_text(encoding="utf-8").splitlines()]
    assert 0 < len(recorded) < 120, len(recorded)
    for rel in recorded:                          # recorded: written whole, as a full run writes it
        assert (tmp_path / "out" / rel).read_bytes() == (tmp_path / "whole" / rel).read_bytes()
    resumed = batch.annotate_folder(tmp_path / "in", tmp_path / "out", workers=2)
    assert resumed.resumed == len(recorded)
    assert resumed.summary == whole.summary
    assert _left_over(tmp_path / "out") == []
    for path in sorted((tmp_path / "whole").glob("*.xml")):
        assert (tmp_path / "out" / path.name).read_bytes() == path.read_bytes()
    assert (tmp_path / "out" / "numcheck-files.csv").read_bytes() == \
        (tmp_path / "whole" / "numcheck-files.csv").read_bytes()


_REAL_ATF = Path(__file__).resolve().parents[1].parent / "shared" / "realdata" / "atf"


@pytest.mark.skipif(not _REAL_ATF.is_dir(), reason="../shared/realdata/atf is not here")
@pytest.mark.parametrize("workers", [1, 2])
def test_a_folder_of_published_atf_files_is_listed_file_by_file(tmp_path, workers):
    """annotate DIR on the ATF transliterations as CDLI and ePSD2 publish them (read in
    place): each gets the very listing annotate FILE.atf -o writes, and its counts."""
    from numcheck.atf import annotate_atf

    result = batch.annotate_folder(_REAL_ATF, tmp_path / "out", workers=workers)
    names = sorted(p.name for p in _REAL_ATF.glob("*.atf"))
    assert [f["file"] for f in result.files] == names
    for entry, name in zip(result.files, names):
        single = annotate_atf(_REAL_ATF / name, tmp_path / f"{name}.single.tsv")
        listing = tmp_path / "out" / f"{name}.tsv"
        assert listing.read_bytes() == (tmp_path / f"{name}.single.tsv").read_bytes()
        d = single.to_dict()
        assert (entry["numbers"], entry["damaged"], entry["unreadable"]) == \
            (d["numbers"], d["damaged"], d["unread"])
        assert entry["format"] == "atf" and "error" not in entry
    assert result.summary["numbers"] == sum(f["numbers"] for f in result.files) > 0


def test_a_folder_of_tei_and_atf_files_does_both(tmp_path):
    src = tmp_path / "in"
    _accounts(src, 2)
    # An invented tablet (common practice of CDLI transliteration: 1(u) 2(disz) is 12).
    (src / "tablet.atf").write_text("&P000001 = Invented tablet\n#atf: lang sux\n@obverse\n"
                                    "1. 1(u) 2(disz) sze gur\n", encoding="utf-8")
    result = batch.annotate_folder(src, tmp_path / "out", workers=1)
    by_file = {f["file"]: f for f in result.files}
    assert set(by_file) == {"acc000.xml", "acc001.xml", "tablet.atf"}
    listing = (tmp_path / "out" / "tablet.atf.tsv").read_text(encoding="utf-8").splitlines()
    assert listing[1].split("\t")[2:4] == ["1(u) 2(disz)", "12"]
    assert by_file["tablet.atf"]["numbers"] == 1
    assert 'value="1"' in (tmp_path / "out" / "acc000.xml").read_text(encoding="utf-8")
    # A Greek notation is no notation of ATF: that file is reported, the others done.
    greek = batch.annotate_folder(src, tmp_path / "out2", workers=1, notation="greek")
    by_file = {f["file"]: f for f in greek.files}
    assert "atf" in by_file["tablet.atf"]["error"] and "error" not in by_file["acc000.xml"]
