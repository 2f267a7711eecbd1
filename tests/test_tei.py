"""Tests for numcheck.tei: <num> in and out, on small TEI documents of our own."""

import hashlib
import re
from fractions import Fraction

import pytest
from hypothesis import given
from hypothesis import strategies as st
from lxml import etree

import numcheck
from numcheck.errors import LimitError, NumcheckError
from numcheck.tei import annotate, annotate_bytes, default_output
from numcheck.tei.markup import Piece, leiden_text, num_pieces
from numcheck.tables.tei import table_to_dataframe
from numcheck.tei.write import scan_elements

NS = {"t": "http://www.tei-c.org/ns/1.0"}
HEAD = '<?xml version="1.0" encoding="UTF-8"?>\n<TEI xmlns="http://www.tei-c.org/ns/1.0"><text><body>\n'
TAIL = "\n</body></text></TEI>\n"


def doc(body: str) -> bytes:
    return (HEAD + body + TAIL).encode("utf-8")


def nums_of(data: bytes):
    return etree.fromstring(data).findall(".//t:num", NS)


def run(body: str, **kw):
    out, result = annotate_bytes(doc(body), "test.xml", **kw)
    return out, result


def sha(path):
    return hashlib.sha256(path.read_bytes()).hexdigest()


# -- values -----------------------------------------------------------------

@pytest.mark.parametrize("body, attrs", [
    # (a <num> as an editor encodes it, the attributes numcheck must give it)
    ("<p><num>29;31,50,8,20</num></p>", {"value": "765433/25920"}),   # mean synodic month
    ("<p><num>1,49,45;20</num></p>", {"value": "19756/3"}),           # 6585 1/3 x 3
    ("<p><num>0;30</num></p>", {"value": "1/2"}),
    ("<p><num>12</num></p>", {"value": "12"}),
    ("<p><num>1,<supplied reason=\"lost\">49</supplied>,45;20</num></p>", {"value": "19756/3"}),
    ("<p><num>0;<unclear>3</unclear>0</num></p>", {"value": "1/2"}),
    ("<p><num>29;31,5<gap reason=\"lost\" quantity=\"1\" unit=\"character\"/>,8,20</num></p>",
     {"atLeast": "765433/25920", "atMost": "3827489/129600"}),        # 29;31,50.. to 29;31,59,8,20
    ("<p><num>1<gap reason=\"lost\" quantity=\"1\" unit=\"character\"/></num></p>",
     {"atLeast": "10", "atMost": "19"}),
])
def test_values_exact_and_ranges(body, attrs):
    out, result = run(body)
    (num,) = nums_of(out)
    assert {k: num.get(k) for k in attrs} == attrs
    for k in ("value", "atLeast", "atMost"):
        if k not in attrs:
            assert num.get(k) is None
    assert result.nums[0].status in ("value-added", "range-added")


def test_value_is_never_a_rounded_decimal():
    out, _ = run("<p><num>0;0,1</num></p>")
    assert nums_of(out)[0].get("value") == "1/3600"


def test_rest_of_document_is_unchanged_byte_for_byte():
    body = ("<!-- editor's note --><p rend='x'>A &amp; &#x3b9; <?pi data?>"
            "<num type='cardinal'>12</num>\n  <num\n   n=\"2\"\n  >0;30</num><![CDATA[<num>]]></p>")
    src = doc(body)
    out, _ = annotate_bytes(src, "t.xml")
    expected = src.replace(b"<num type='cardinal'>", b"<num type='cardinal' value=\"12\">")
    expected = expected.replace(b'n="2"\n  >', b'n="2" value="1/2"\n  >')
    assert out == expected


def test_no_change_gives_identical_bytes():
    src = doc('<p><num value="12">12</num></p>')
    out, result = annotate_bytes(src, "t.xml")
    assert out == src
    assert result.nums[0].status == "agrees"


def test_xml_declaration_and_encoding_kept(tmp_path):
    text = ("<?xml version='1.0' encoding='ISO-8859-1'?>\n"
            "<TEI xmlns='http://www.tei-c.org/ns/1.0'><p>caf\u00e9 <num>12</num></p></TEI>\n")
    src = tmp_path / "latin.xml"
    src.write_bytes(text.encode("latin-1"))
    out = tmp_path / "out.xml"
    annotate(src, out)
    assert out.read_bytes() == text.replace("<num>", '<num value="12">').encode("latin-1")


def test_prefixed_tei_namespace():
    src = (b'<tei:TEI xmlns:tei="http://www.tei-c.org/ns/1.0"><tei:p>'
           b'<tei:num>1<tei:gap reason="lost" quantity="1" unit="character"/></tei:num></tei:p></tei:TEI>')
    out, _ = annotate_bytes(src, "t.xml")
    assert b'<tei:num atLeast="10" atMost="19">' in out


def test_input_bytes_unchanged_and_output_atomic(tmp_path):
    src = tmp_path / "in.xml"
    src.write_bytes(doc("<p><num>29;31,50,8,20</num></p>"))
    before = sha(src)
    out = tmp_path / "out.xml"
    result = annotate(src, out)
    assert sha(src) == before
    assert result.output == str(out)
    assert nums_of(out.read_bytes())[0].get("value") == "765433/25920"
    assert sorted(p.name for p in tmp_path.iterdir()) == ["in.xml", "out.xml"]


def test_front_door_exports_annotate(tmp_path):
    src = tmp_path / "in.xml"
    src.write_bytes(doc("<p><num>0;30</num></p>"))
    result = numcheck.annotate(src, tmp_path / "o.xml")
    assert result.to_dict()["nums"][0]["value"] == "1/2"


def test_check_only_writes_nothing(tmp_path):
    src = tmp_path / "in.xml"
    src.write_bytes(doc("<p><num>0;30</num></p>"))
    result = annotate(src, None)
    assert result.output is None
    assert [p.name for p in tmp_path.iterdir()] == ["in.xml"]


def test_default_output_name():
    assert default_output("a/text.xml").name == "text.numcheck.xml"


# -- existing values ---------------------------------------------------------

def test_contradicting_value_reported_not_overwritten():
    out, result = run('<p><num value="3">4</num></p>')
    assert nums_of(out)[0].get("value") == "3"
    (n,) = result.nums
    assert n.status == "contradiction"
    assert "'3'" in n.message and "4" in n.message
    assert result.to_dict()["flagged"] == 1


def test_contradicting_value_fixed_with_fix():
    out, result = run('<p><num value="3">4</num></p>', fix=True)
    assert nums_of(out)[0].get("value") == "4"
    assert result.nums[0].status == "fixed"


def test_value_inside_damaged_range_is_kept():
    # The editor's value 15 is one of the readings 1[x] allows.
    out, result = run('<p><num value="15">1<gap reason="lost" quantity="1" unit="character"/></num></p>')
    assert nums_of(out)[0].get("value") == "15"
    assert nums_of(out)[0].get("atLeast") is None
    assert result.nums[0].status == "agrees"


def test_value_outside_damaged_range_is_reported_and_fixed():
    body = '<p><num value="25">1<gap reason="lost" quantity="1" unit="character"/></num></p>'
    _, result = run(body)
    assert result.nums[0].status == "contradiction"
    out, result = run(body, fix=True)
    (num,) = nums_of(out)
    assert num.get("value") is None
    assert (num.get("atLeast"), num.get("atMost")) == ("10", "19")


def test_equal_value_written_differently_is_kept():
    out, result = run('<p><num value="0.5">0;30</num></p>')
    assert nums_of(out)[0].get("value") == "0.5"
    assert result.nums[0].status == "agrees"


def test_wrong_existing_range_reported():
    _, result = run('<p><num atLeast="5" atMost="30">1<gap reason="lost" quantity="1" unit="character"/></num></p>')
    assert result.nums[0].status == "contradiction"


# -- alternatives -----------------------------------------------------------

def test_alternatives_as_certainty_elements():
    body = "<p><num>29;31,5<gap reason=\"lost\" quantity=\"1\" unit=\"character\"/>,8,20</num></p>"
    out, result = run(body, alternatives=3)
    (num,) = nums_of(out)
    certs = num.findall("t:certainty", NS)
    assert len(certs) == 3
    values = []
    for c in certs:
        assert c.get("locus") == "value"
        # no @value on a number damage leaves open: the certainty points at its bounds
        assert c.get("match") == "../@atLeast | ../@atMost"
        assert " " not in c.get("assertedValue")          # TEIC/TEI #2067: one token
        values.append(Fraction(c.get("assertedValue")))
        assert 0 <= float(c.get("degree")) <= 1
    # every alternative is a reading the letters allow: 29;31,5d,8,20 for d in 0..9
    allowed = {Fraction(765433, 25920) + Fraction(k, 3600) for k in range(10)}
    assert set(values) <= allowed
    degrees = [float(c.get("degree")) for c in certs]
    assert degrees == sorted(degrees, reverse=True)
    assert result.nums[0].alternatives[0]["value"] == certs[0].get("assertedValue")
    # the text of the number is unchanged by the added elements
    assert "".join(num.itertext()) == "29;31,5,8,20"


def test_alternatives_replace_earlier_ones():
    body = "<p><num>1<gap reason=\"lost\" quantity=\"1\" unit=\"character\"/></num></p>"
    once, _ = run(body, alternatives=2)
    twice, _ = annotate_bytes(once, "t.xml", alternatives=2)
    assert len(nums_of(twice)[0].findall("t:certainty", NS)) == 2
    assert twice == once


def test_no_alternatives_for_an_undamaged_number():
    out, result = run("<p><num>12</num></p>", alternatives=3)
    assert nums_of(out)[0].findall("t:certainty", NS) == []


# -- markup to Leiden text -------------------------------------------------

@pytest.mark.parametrize("pieces, notation, text", [
    ([Piece("text", "ι"), Piece("lost", count=1)], "greek", "ι[.]"),
    ([Piece("text", "L"), Piece("lost", count=1)], "roman", "L[.]"),
    ([Piece("text", "ρ"), Piece("lost", count=3)], "greek", "ρ[.][.][.]"),
    ([Piece("text", "1,"), Piece("lost", count=None)], "sexagesimal", "1,[...]"),
    ([Piece("text", "29;3"), Piece("lost", count=1), Piece("supplied", "5")], "sexagesimal", "29;3[x5]"),
    ([Piece("text", "κ"), Piece("unclear", "θ")], "greek", "κθ\u0323"),
    ([Piece("text", "3,"), Piece("unclear", "4")], "cuneiform", "3,4?"),
    ([Piece("supplied", "κθ λα")], "greek", "[κθ] [λα]"),
    ([Piece("text", "1"), Piece("omitted", "2"), Piece("surplus", "3")], "sexagesimal", "1<2>{3}"),
    ([Piece("text", "1"), Piece("illegible", count=2)], "sexagesimal", "1xx"),
    ([Piece("text", "ι"), Piece("illegible", count=1)], "greek", "ι."),
    ([Piece("text", "L"), Piece("illegible", count=1)], "roman", "L+"),
    ([Piece("text", "ي"), Piece("unclear", "ب")], "abjad", "يب?"),
])
def test_leiden_text(pieces, notation, text):
    assert leiden_text(pieces, notation) == text


def test_pieces_from_markup():
    el = etree.fromstring(
        '<num xmlns="http://www.tei-c.org/ns/1.0"><hi rend="supraline">κ<unclear>θ</unclear></hi>'
        '<gap reason="lost" quantity="2" unit="character"/><supplied reason="lost">α</supplied>'
        '<choice><sic>β</sic><corr>γ</corr></choice><certainty locus="value" match="../@value"/>'
        '<!-- c --><del>δ</del><gap reason="illegible" quantity="1" unit="character"/>'
        '<gap reason="lost" extent="unknown" unit="character"/></num>')
    assert num_pieces(el) == [Piece("text", "κ"), Piece("unclear", "θ"), Piece("lost", count=2),
                              Piece("supplied", "α"), Piece("text", "γ"),
                              Piece("illegible", count=1), Piece("lost", count=None)]


def test_scanner_pairs_tags():
    text = '<a x=">"><!-- <b> --><b/><c>t</c></a>'
    spans = scan_elements(text)
    assert [s.name for s in spans] == ["a", "b", "c"]
    assert text[spans[2].start:spans[2].end] == "<c>t</c>"
    assert spans[1].empty and text[spans[1].start:spans[1].end] == "<b/>"


# -- bad input ---------------------------------------------------------------

def test_malformed_xml_names_file_and_line(tmp_path):
    src = tmp_path / "bad.xml"
    src.write_bytes(b'<TEI xmlns="http://www.tei-c.org/ns/1.0">\n<p>\n<num>12</p></TEI>')
    before = sha(src)
    with pytest.raises(NumcheckError, match=r"bad\.xml, line 3: malformed XML"):
        annotate(src, tmp_path / "out.xml")
    assert sha(src) == before
    assert not (tmp_path / "out.xml").exists()


def test_not_tei(tmp_path):
    src = tmp_path / "plain.xml"
    src.write_bytes(b"<doc>\n<num>12</num></doc>")
    with pytest.raises(NumcheckError, match=r"plain\.xml, line 1: not a TEI file: the root element is <doc>"):
        annotate(src, tmp_path / "out.xml")


def test_num_with_no_text_is_a_number_in_words(tmp_path):
    # EpiDoc: an empty <num value=".."/> carries the value of a number written
    # in words; no error, the editor's value is kept.
    src = tmp_path / "e.xml"
    src.write_bytes(doc("<p>\n<num value=\"2\"/></p>"))
    result = annotate(src, tmp_path / "out.xml")
    assert result.nums[0].status == "word"
    assert (tmp_path / "out.xml").read_bytes() == src.read_bytes()


def test_unreadable_num_names_line_and_the_rest_is_annotated(tmp_path):
    src = tmp_path / "u.xml"
    src.write_bytes(doc("<p>\n\n<num>1,,2</num> <num>1,2</num></p>"))
    result = annotate(src, tmp_path / "out.xml", notation="sexagesimal")
    bad, good = result.nums
    assert (bad.status, bad.line, bad.index) == ("unreadable", 5, 1)
    assert "1,,2" in bad.text and bad.message
    assert (good.status, good.value) == ("value-added", 62)
    assert result.to_dict()["unreadable"] == 1
    assert b'<num value="62">1,2</num>' in (tmp_path / "out.xml").read_bytes()


def test_output_equal_to_input_refused(tmp_path):
    src = tmp_path / "in.xml"
    src.write_bytes(doc("<p><num>12</num></p>"))
    before = sha(src)
    with pytest.raises(NumcheckError, match="same file as the input"):
        annotate(src, tmp_path / "." / "in.xml")
    assert sha(src) == before


def test_missing_file():
    with pytest.raises(NumcheckError, match="no such file"):
        annotate("/nonexistent/x.xml", None)


def test_entities_are_not_expanded():
    src = (b'<!DOCTYPE TEI [<!ENTITY e "12">]>\n<TEI xmlns="http://www.tei-c.org/ns/1.0">'
           b'<p><num>0;30</num> &e;</p></TEI>')
    out, _ = annotate_bytes(src, "t.xml")
    assert out == src.replace(b"<num>", b'<num value="1/2">')


def test_size_limit(tmp_path, monkeypatch):
    import numcheck.limits as limits
    src = tmp_path / "big.xml"
    src.write_bytes(doc("<p><num>12</num></p>"))
    monkeypatch.setattr(limits, "MAX_XML_BYTES", 10)
    with pytest.raises(LimitError, match="MAX_XML_BYTES"):
        annotate(src, None)


def test_depth_limit(monkeypatch):
    import numcheck.limits as limits
    monkeypatch.setattr(limits, "MAX_XML_DEPTH", 3)
    with pytest.raises(LimitError, match="MAX_XML_DEPTH"):
        annotate_bytes(doc("<p><hi><num>12</num></hi></p>"), "t.xml")


def test_negative_alternatives_refused():
    with pytest.raises(NumcheckError, match="alternatives"):
        annotate_bytes(doc("<p><num>12</num></p>"), "t.xml", alternatives=-1)


# -- tables -------------------------------------------------------------------

def test_table_to_dataframe(tmp_path):
    src = tmp_path / "t.xml"
    src.write_bytes(doc(
        '<table><row role="label"><cell role="label">n</cell><cell role="label">value</cell></row>\n'
        '<row><cell>1</cell><cell><num>0;30</num></cell></row>\n'
        '<row><cell>2</cell><cell><num>1;<gap reason="lost" quantity="1" unit="character"/>0</num></cell></row>'
        '</table>'))
    frame = table_to_dataframe(src, notation="sexagesimal")
    assert list(frame.columns) == ["n", "value"]
    assert frame["value"].tolist() == ["0;30", "1;[x]0"]
    assert frame.attrs["row_lines"] == [4, 5]


def test_table_missing(tmp_path):
    src = tmp_path / "t.xml"
    src.write_bytes(doc("<p>no table</p>"))
    with pytest.raises(NumcheckError, match="no TEI <table>"):
        table_to_dataframe(src)


def test_alternatives_in_a_table_follow_its_scheme():
    # A column rising by 0;7,30 a line; line 4 has its units digit of minutes lost.
    # The table's scheme gives 1;22,30, so that is ranked first.
    rows = ["1;0", "1;7,30", "1;15", "1;2<gap reason=\"lost\" quantity=\"1\" unit=\"character\"/>,30",
            "1;30", "1;37,30"]
    body = "<table>" + "".join(f"<row><cell>{i + 1}</cell><cell><num>{r}</num></cell></row>"
                               for i, r in enumerate(rows)) + "</table>"
    out, result = run(body, alternatives=2)
    damaged = [n for n in result.nums if n.alternatives]
    assert len(damaged) == 1
    alts = damaged[0].alternatives
    assert alts[0]["value"] == "11/8" and alts[0]["from"] == "table scheme"   # 1;22,30 = 11/8
    cert = nums_of(out)[3].findall("t:certainty", NS)
    assert cert[0].get("assertedValue") == "11/8"
    assert result.notes == []


def test_table_without_header_gets_column_names(tmp_path):
    src = tmp_path / "t.xml"
    src.write_bytes(doc("<table><row><cell>1</cell><cell>0;30</cell></row>"
                        "<row><cell>2</cell><cell>1;0</cell></row></table>"))
    frame = table_to_dataframe(src)
    assert list(frame.columns) == ["column 1", "column 2"]


@pytest.mark.parametrize("inner, lang, at_least, at_most", [
    # (markup, xml:lang, the range the letters allow): illegible letters, per notation
    ('ι<gap reason="illegible" quantity="1" unit="character"/>', "grc", "11", "19"),
    ('L<gap reason="illegible" quantity="1" unit="character"/>', "la", "51", "60"),
    ('1;3<gap reason="illegible" quantity="1" unit="character"/>', "en", "3/2", "33/20"),   # 1;30 to 1;39
])
def test_illegible_letters(inner, lang, at_least, at_most):
    out, result = run(f'<p xml:lang="{lang}"><num>{inner}</num></p>')
    num = nums_of(out)[0]
    assert (num.get("atLeast"), num.get("atMost")) == (at_least, at_most)
    assert result.nums[0].damaged


# -- round trips ----------------------------------------------------------------

_places = st.lists(st.integers(0, 59), min_size=0, max_size=3)


@given(st.lists(st.tuples(st.integers(0, 59), _places, st.sampled_from(["'", '"']),
                          st.sampled_from(["", " ", "\n  "])), min_size=1, max_size=6))
def test_round_trip_values_exact_and_rest_unchanged(items):
    parts, expected = [], []
    for whole, frac, quote, space in items:
        text = str(whole) + (";" + ",".join(map(str, frac)) if frac else "")
        parts.append(f"<num type={quote}c{quote}{space}>{text}</num>")
        expected.append(Fraction(whole) + sum(Fraction(d, 60 ** (i + 1)) for i, d in enumerate(frac)))
    src = doc("<p>" + " &amp; ".join(parts) + "</p>")
    out, _ = annotate_bytes(src, "t.xml", notation="sexagesimal")
    assert [Fraction(n.get("value")) for n in nums_of(out)] == expected
    # taking the added attributes out again gives the input, byte for byte
    assert re.sub(rb' value="[0-9/]+"', b"", out) == src
    again, _ = annotate_bytes(out, "t.xml", notation="sexagesimal")
    assert again == out


@pytest.mark.parametrize("encoding, bom", [("utf-8", b"\xef\xbb\xbf"), ("utf-16-le", b"\xff\xfe"),
                                           ("utf-16-be", b"\xfe\xff")])
def test_byte_order_marks_kept(encoding, bom):
    text = ('<?xml version="1.0" encoding="UTF-16"?>\n' if encoding != "utf-8" else "") + \
        '<TEI xmlns="http://www.tei-c.org/ns/1.0"><p>λ <num>0;30</num></p></TEI>\n'
    src = bom + text.encode(encoding)
    out, _ = annotate_bytes(src, "t.xml")
    assert out == bom + text.replace("<num>", '<num value="1/2">').encode(encoding)
