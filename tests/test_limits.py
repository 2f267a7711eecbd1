"""Every limit of numcheck.limits is enforced with a clear error that names it and says how to raise it.

Each test lowers one limit (as a user would raise it: by setting the
attribute of ``numcheck.limits`` before the call), feeds an input just over
it, and checks the LimitError: it states the size found, the limit, and the
name of the setting to change.  Just under the limit the same input reads.
"""

from __future__ import annotations

import re
import time

import pandas as pd
import pytest

import numcheck
from numcheck import limits
from numcheck.errors import LimitError, NumcheckError
from numcheck.tei import annotate_bytes

TEI = '<TEI xmlns="http://www.tei-c.org/ns/1.0"><text><body><ab>{}</ab></body></text></TEI>'


def _raises_limit(name: str, fn, *args, **kwargs) -> LimitError:
    with pytest.raises(LimitError) as info:
        fn(*args, **kwargs)
    message = str(info.value)
    assert f"numcheck.limits.{name}" in message, message
    assert "over numcheck's limit of" in message
    assert re.search(r"higher|raise|lower|fewer|flatten|split|shorter", message), message
    return info.value


def test_every_limit_is_named_in_one_place():
    names = [n for n in dir(limits) if n.isupper()]
    assert len(names) >= 15
    for n in names:
        assert getattr(limits, n) is not None
    # Modules read the limits at call time (so that raising one takes effect).
    import pathlib
    root = pathlib.Path(numcheck.__file__).parent
    for path in root.rglob("*.py"):
        text = path.read_text(encoding="utf-8")
        assert not re.search(r"^from \.+limits import", text, re.M), f"{path.name} copies a limit at import"


def test_text_length(monkeypatch):
    monkeypatch.setattr(limits, "MAX_TEXT_LENGTH", 20)
    assert numcheck.read("1," * 9 + "1").value
    err = _raises_limit("MAX_TEXT_LENGTH", numcheck.read, "1," * 10 + "1")
    assert err.limit == 20 and "21" in str(err)
    _raises_limit("MAX_TEXT_LENGTH", numcheck.identify, "1," * 10 + "1")
    _raises_limit("MAX_TEXT_LENGTH", numcheck.restore, "1," * 10 + "1")
    _raises_limit("MAX_TEXT_LENGTH", numcheck.interval, "x" * 21, "AD 1 Jan 1")


def test_the_default_text_length_refuses_a_pasted_page():
    _raises_limit("MAX_TEXT_LENGTH", numcheck.read, "1," * 5000)


@pytest.mark.parametrize("notation, ok, over", [
    ("sexagesimal", "1" + ",1" * 7, "1" + ",1" * 8),
    ("cuneiform", "1" + " 1" * 7, "1" + " 1" * 8),
    ("greek", "α" + " α" * 7, "α" + " α" * 8),
    ("roman", "MDCLXVII", "MDCLXVIII"),
    ("abjad", "ا" + " ا" * 7, "ا" + " ا" * 8),
    ("attic", "ΧΧΧΧΗΗΗΗ", "ΧΧΧΧΗΗΗΗΔ")])
def test_number_of_places(monkeypatch, notation, ok, over):
    monkeypatch.setattr(limits, "MAX_PLACES", 8)
    numcheck.read(ok, notation=notation)
    _raises_limit("MAX_PLACES", numcheck.read, over, notation=notation)


def test_lost_letters(monkeypatch):
    monkeypatch.setattr(limits, "MAX_LOST_LETTERS", 2)
    numcheck.read("X[.][.]", notation="roman")
    _raises_limit("MAX_LOST_LETTERS", numcheck.read, "X[.][.][.]", notation="roman")
    _raises_limit("MAX_LOST_LETTERS", numcheck.read, "ك[...]", notation="abjad")


@pytest.mark.parametrize("kwargs", [dict(use_catalogue=False), dict(expect="1,2,3,4;5,6"),
                                    dict(unit="days")])
def test_restore_search_is_bounded(monkeypatch, kwargs):
    """A search without narrowing evidence is bounded: it stops with a LimitError naming the
    limit, or sets evidence aside with a note naming it; it does not hang."""
    monkeypatch.setattr(limits, "RESTORE_MAX_NODES", 50)
    monkeypatch.setattr(limits, "RESTORE_MAX_MATCHES", 10)
    start = time.perf_counter()
    try:
        result = numcheck.restore("[x],[x],[x],[x];[x],[x]", top=500, **kwargs)
    except LimitError as err:
        assert re.search(r"numcheck\.limits\.RESTORE_MAX_(NODES|MATCHES)", str(err))
    else:
        assert result.candidates
        if kwargs.get("unit"):
            assert any("RESTORE_MAX_MATCHES" in n for n in result.notes)
    assert time.perf_counter() - start < 5


def test_restore_wide_space_says_so():
    start = time.perf_counter()
    result = numcheck.restore("x,x,x,x,x,x,x,x,x,x,x,x", use_catalogue=False, top=3)
    assert result.to_dict()["space"] == 60 ** 12
    assert any("no evidence singles any out" in n for n in result.notes)
    assert time.perf_counter() - start < 10


def test_restore_top(monkeypatch):
    monkeypatch.setattr(limits, "RESTORE_MAX_TOP", 5)
    numcheck.restore("1,2[x]", top=5, use_catalogue=False)
    _raises_limit("RESTORE_MAX_TOP", numcheck.restore, "1,2[x]", top=6, use_catalogue=False)


def test_table_cells(monkeypatch, tmp_path):
    monkeypatch.setattr(limits, "MAX_TABLE_CELLS", 10)
    frame = pd.DataFrame({"A": [str(i) for i in range(1, 6)], "B": [str(2 * i) for i in range(1, 6)]})
    numcheck.audit(frame)
    bigger = pd.DataFrame({"A": [str(i) for i in range(1, 7)], "B": [str(2 * i) for i in range(1, 7)]})
    err = _raises_limit("MAX_TABLE_CELLS", numcheck.audit, bigger)
    assert "12" in str(err)
    path = tmp_path / "t.tsv"
    path.write_text("A\tB\n" + "".join(f"{i}\t{2 * i}\n" for i in range(1, 7)), encoding="utf-8")
    _raises_limit("MAX_TABLE_CELLS", numcheck.audit, path)


def test_table_bytes(monkeypatch, tmp_path):
    path = tmp_path / "t.tsv"
    path.write_text("A\n" + "".join(f"{i}\n" for i in range(1, 40)), encoding="utf-8")
    monkeypatch.setattr(limits, "MAX_TABLE_BYTES", path.stat().st_size)
    numcheck.audit(path)
    monkeypatch.setattr(limits, "MAX_TABLE_BYTES", path.stat().st_size - 1)
    _raises_limit("MAX_TABLE_BYTES", numcheck.audit, path)


def test_xml_bytes(monkeypatch, tmp_path):
    data = TEI.format("<num>ιβ</num>").encode()
    path = tmp_path / "a.xml"
    path.write_bytes(data)
    monkeypatch.setattr(limits, "MAX_XML_BYTES", len(data))
    numcheck.annotate(path, None)
    monkeypatch.setattr(limits, "MAX_XML_BYTES", len(data) - 1)
    _raises_limit("MAX_XML_BYTES", numcheck.annotate, path, None)
    _raises_limit("MAX_XML_BYTES", annotate_bytes, data)


def test_xml_depth(monkeypatch):
    def nested(n):
        return TEI.format("<hi>" * n + "<num>ιβ</num>" + "</hi>" * n).encode()
    monkeypatch.setattr(limits, "MAX_XML_DEPTH", 20)
    annotate_bytes(nested(10))
    _raises_limit("MAX_XML_DEPTH", annotate_bytes, nested(30))


def test_xml_depth_beyond_the_parser_guard():
    """libxml2 stops at 256 levels before numcheck's own check: still a LimitError naming the limit."""
    data = TEI.format("<hi>" * 300 + "<num>ιβ</num>" + "</hi>" * 300).encode()
    _raises_limit("MAX_XML_DEPTH", annotate_bytes, data)


def test_xml_nums(monkeypatch):
    monkeypatch.setattr(limits, "MAX_XML_NUMS", 2)
    annotate_bytes(TEI.format("<num>α</num><num>β</num>").encode())
    _raises_limit("MAX_XML_NUMS", annotate_bytes, TEI.format("<num>α</num><num>β</num><num>γ</num>").encode())


def test_atf_numbers(monkeypatch):
    from numcheck.atf import read_atf_text
    monkeypatch.setattr(limits, "MAX_ATF_NUMBERS", 2)
    read_atf_text("&X1 = t\n@obverse\n1. 1(disz) sze 2(disz) sze\n")
    _raises_limit("MAX_ATF_NUMBERS", read_atf_text, "&X1 = t\n@obverse\n1. 1(disz) sze 2(disz) sze 3(disz)\n")


def test_xml_entities_are_never_expanded(tmp_path):
    """No external entities (a local file, the network) and no entity bombs: lxml's safe settings."""
    secret = tmp_path / "secret.txt"
    secret.write_text("ΣΕΚΡΕΤ", encoding="utf-8")
    data = (f'<?xml version="1.0"?><!DOCTYPE TEI [<!ENTITY x SYSTEM "file://{secret}">'
            '<!ENTITY net SYSTEM "http://example.invalid/x">]>'
            + TEI.format("<num>ιβ&x;&net;</num>")).encode()
    out, result = annotate_bytes(data)
    assert "ΣΕΚΡΕΤ".encode() not in out and result.to_dict()["numbers"] == 1
    bomb = ('<?xml version="1.0"?><!DOCTYPE TEI [<!ENTITY a "αααααααααα">'
            + "".join(f'<!ENTITY {b} "{("&" + a + ";") * 10}">' for a, b in zip("abcdefg", "bcdefgh"))
            + "]>" + TEI.format("<num>&h;</num>"))
    start = time.perf_counter()
    try:
        out, _ = annotate_bytes(bomb.encode())
        assert len(out) < 10_000
    except NumcheckError:
        pass
    assert time.perf_counter() - start < 2


def test_xml_parser_settings(tmp_path):
    """numcheck's parser resolves no entity and loads no DTD (no file, no network)."""
    from lxml import etree

    from numcheck.tei.markup import _parser
    secret = tmp_path / "s.txt"
    secret.write_text("SECRET", encoding="utf-8")
    doc = (f'<!DOCTYPE a SYSTEM "http://example.invalid/a.dtd" [<!ENTITY x SYSTEM "file://{secret}">]>'
           '<a>&x;</a>').encode()
    root = etree.fromstring(doc, _parser())
    assert b"SECRET" not in etree.tostring(root)
    assert isinstance(root[0], etree._Entity)


def test_batch_files(monkeypatch, tmp_path):
    for i in range(3):
        (tmp_path / f"t{i}.tsv").write_text("A\n1\n2\n3\n", encoding="utf-8")
    monkeypatch.setattr(limits, "MAX_BATCH_FILES", 3)
    from numcheck.batch import audit_folder
    audit_folder(tmp_path)
    monkeypatch.setattr(limits, "MAX_BATCH_FILES", 2)
    _raises_limit("MAX_BATCH_FILES", audit_folder, tmp_path)


def test_relate_search_years():
    from numcheck.cycles import search
    with pytest.raises(LimitError, match="RELATE_MAX_SEARCH_YEARS"):
        search(["venus"], max_years=limits.RELATE_MAX_SEARCH_YEARS + 1)


def test_limit_errors_exit_2_at_the_command_line(capsys):
    from numcheck.cli import main
    assert main(["read", "1," * 3000 + "1"]) == 2
    err = capsys.readouterr().err
    assert "MAX_TEXT_LENGTH" in err and "Traceback" not in err


def test_restore_wide_space_note_names_its_limit():
    result = numcheck.restore("x,x,x,x", use_catalogue=False, top=2)
    assert any("numcheck.limits.RESTORE_WIDE_SPACE" in n for n in result.notes)


def test_identify_damage_readings(monkeypatch):
    monkeypatch.setattr(limits, "IDENTIFY_DAMAGE_READINGS", 5)
    result = numcheck.identify("6,3[x]")
    assert any("numcheck.limits.IDENTIFY_DAMAGE_READINGS" in n for n in result.notes)


def test_identify_candidates(monkeypatch):
    """Past the limit only simple parts and multiples are compared, quickly, with a note."""
    monkeypatch.setattr(limits, "IDENTIFY_MAX_CANDIDATES", 50)
    start = time.perf_counter()
    result = numcheck.identify("n 30")
    assert time.perf_counter() - start < 5
    assert any("numcheck.limits.IDENTIFY_MAX_CANDIDATES" in n for n in result.notes)
    assert all("×" not in m.what or m.factor.denominator <= limits.IDENTIFY_MAX_SIMPLE for m in result.matches)


def test_whole_place_digits(monkeypatch):
    # A lone whole place reads any integer an Indian yuga needs (Aryabhatiya's
    # 1577917500 civil days; the Brahmasphutasiddhanta's kalpa of 1577916450000 days).
    assert numcheck.read("1577917500").value == 1577917500
    assert numcheck.read("1577916450000;30").value == 1577916450000 + numcheck.read("0;30").value
    monkeypatch.setattr(limits, "MAX_WHOLE_PLACE_DIGITS", 9)
    err = _raises_limit("MAX_WHOLE_PLACE_DIGITS", numcheck.read, "1577917500")
    assert err.size == 10
    assert numcheck.read("157791750").value == 157791750


def test_whole_place_open_digits(monkeypatch):
    assert numcheck.read("15779x;0").count == 10
    monkeypatch.setattr(limits, "MAX_WHOLE_PLACE_OPEN_DIGITS", 2)
    assert numcheck.read("1577xx;0").count == 100
    _raises_limit("MAX_WHOLE_PLACE_OPEN_DIGITS", numcheck.read, "157xxx;0")


def test_settle_max_readings(monkeypatch):
    # A column decides a Greek 'ο' (0 or 70) only while the cell allows few readings.
    import pandas as pd
    from numcheck.tables import read_table

    df = pd.DataFrame({"min": ["νε", "ο", "ε", "ι"]})
    assert read_table(df, notation="greek").columns["min"].values[1] == 0
    monkeypatch.setattr(limits, "SETTLE_MAX_READINGS", 1)
    assert read_table(df, notation="greek").columns["min"].values[1] is None
