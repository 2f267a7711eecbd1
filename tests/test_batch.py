"""Tests for numcheck.batch: folders of TEI files and tables, the summary, the report index."""

import hashlib
import json
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


def tree_hash(folder: Path) -> dict:
    return {p.relative_to(folder).as_posix(): hashlib.sha256(p.read_bytes()).hexdigest()
            for p in sorted(folder.rglob("*")) if p.is_file()}


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
    assert tree_hash(tmp_path / "o1") == tree_hash(tmp_path / "o2")
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


def test_output_folder_inside_input_is_not_read_again(xml_folder):
    out = xml_folder / "annotated"
    batch.annotate_folder(xml_folder, out, workers=1)
    again = batch.annotate_folder(xml_folder, out, workers=1)
    assert sorted(f["file"] for f in again.files) == ["a.xml", "broken.xml", "sub/b.xml"]


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
