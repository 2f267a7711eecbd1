"""Numbers as EpiDoc and the papyrus databank encode them (issue 14), on small documents of our own.

Sources, named beside each test:

* EpiDoc Guidelines (epidoc.stoa.org/gl/latest/; EpiDoc/Source guidelines/xml),
  as quoted in ../shared/reference/conventions.md §1.2-§1.3:
  ``trans-numknown`` (a number with its value), ``trans-fractionknown``
  (``<num value="1/2">``), ``trans-lostcharnumeral`` (``@atLeast``/``@atMost``
  for a number with lost letters), ``trans-numnoncongruent`` (alternatives as
  ``<certainty locus="value" match="../@value" assertedValue=.. degree=..>``),
  ``trans-linebreak`` (``<lb n>``), ``trans-textpart`` (``<div type="textpart" n>``),
  the Krummrey-Panciera appendix X.3 (a symbol expanded by the editor:
  ``<expan><ex>word</ex></expan>``).
* TEI P5 Guidelines, ``ref-num`` (a number "written in any form", so also in
  words), ``ref-att.ranging`` (``@atLeast`` and ``@atMost`` may be given alone),
  ``ref-certainty`` (``@match`` is an XPath).
* The Greek number words and obol words: the sourced table
  numcheck/data/greek_number_words.csv (H. W. Smyth, Greek Grammar §347-354; LSJ).
* The documentary reading of a lone capital letter as thousands: the Greek
  notation's documentary convention (numcheck.notations.greek, issue 13).
"""

import csv
from fractions import Fraction
from importlib import resources

import pytest
from lxml import etree

from numcheck.tei import annotate_bytes
from numcheck.tei.words import lookup, read_words, word_key

TEI = "http://www.tei-c.org/ns/1.0"
NS = {"tei": TEI}
HEAD = ('<?xml version="1.0" encoding="UTF-8"?>\n<TEI xmlns="http://www.tei-c.org/ns/1.0"><text><body>\n'
        '<div type="edition" xml:lang="grc"><ab>\n')
TAIL = "\n</ab></div></body></text></TEI>\n"


def doc(body: str) -> bytes:
    return (HEAD + body + TAIL).encode("utf-8")


def run(body: str, **kw):
    out, result = annotate_bytes(doc(body), "test.xml", **kw)
    return out, result


def nums(data: bytes):
    return etree.fromstring(data).findall(".//tei:num", NS)


# -- one unreadable number never stops a file ---------------------------------

def test_an_unreadable_number_is_reported_and_the_others_are_annotated():
    out, result = run('<lb n="1"/><num>ι§β</num> <num>ιβ</num>')
    bad, good = result.nums
    assert bad.status == "unreadable" and bad.message and bad.text_line == "1"
    assert (good.status, good.value) == ("value-added", 12)           # trans-numknown
    assert [n.get("value") for n in nums(out)] == [None, "12"]
    d = result.to_dict()
    assert d["unreadable"] == 1 and d["statuses"] == {"unreadable": 1, "value-added": 1}


# -- expansions: signs the editor wrote out ------------------------------------

@pytest.mark.parametrize("body, value", [
    # K-P X.3: the two-obol, four-obol, half-obol signs written out as words
    ('<num value="2"><expan><ex>διώβολον</ex></expan></num>', Fraction(2)),
    ('<num value="4"><expan><ex>τετρώβολον</ex></expan></num>', Fraction(4)),
    ('<num value="1/2"><expan><ex>ἡμιώβελιον</ex></expan></num>', Fraction(1, 2)),   # accent as written
    ('<num value="1"><expan><ex>ὀβολοῦ</ex></expan></num>', Fraction(1)),             # genitive
    # letters written and the rest expanded: the whole word is the quarter
    ('<num value="1/4"><expan>τέ<ex>ταρτον</ex></expan></num>', Fraction(1, 4)),
    ('<num value="10000"><expan>μ<ex>υριάς</ex></expan></num>', Fraction(10000)),
])
def test_an_expansion_is_read_from_its_meaning(body, value):
    out, result = run(body)
    (n,) = result.nums
    assert (n.status, n.read_from, n.value) == ("agrees", "expansion", value)
    assert out == doc(body)                               # nothing to change


def test_an_expansion_that_disagrees_is_reported_and_never_fixed():
    body = '<num value="3"><expan><ex>διώβολον</ex></expan></num>'
    out, result = run(body, fix=True)
    assert result.nums[0].status == "contradiction" and "διώβολον" in result.nums[0].message
    assert out == doc(body)


def test_an_unknown_expansion_keeps_the_editors_value():
    body = '<num value="7"><expan><ex>ἀρτάβαι</ex></expan></num>'
    out, result = run(body, fix=True)
    (n,) = result.nums
    assert (n.status, n.read_from, n.value) == ("not-checkable", None, None)
    assert out == doc(body)


# -- numbers written in words -----------------------------------------------------

@pytest.mark.parametrize("body, value", [
    ('<num value="6">ἕξ</num>', 6),                          # TEI ref-num: "in any form"
    ('<num value="21">μιᾷ καὶ εἰκάδι</num>', 21),            # the 21st day of the month
    ('<num value="65">ἑξήκοντα πέντε</num>', 65),
])
def test_a_number_in_words_inside_the_num(body, value):
    out, result = run(body)
    (n,) = result.nums
    assert (n.status, n.read_from, n.value) == ("word", "words", value)
    assert out == doc(body)


@pytest.mark.parametrize("body, value, words", [
    # the documented encoding of a number in words: the words, then an empty <num>
    ('δραχμὰς διακοσίας <num value="200"/>', 200, "διακοσίας"),
    ('ἑξ<unclear>ή</unclear><supplied reason="lost">κοντ</supplied>α πέντε <num value="65"/>', 65,
     "ἑξήκοντα πέντε"),
    ('<choice><reg>δεκατρεῖς</reg><orig>δεκατρῖς</orig></choice> <num value="13"/>', 13, "δεκατρεῖς"),
    # an ordinal for a fraction: the hundredth (tax)
    ('<expan><ex>ἑκατοστὸν</ex></expan> <num value="1/100"/>', Fraction(1, 100), "ἑκατοστὸν"),
])
def test_an_empty_num_takes_the_words_before_it(body, value, words):
    out, result = run(body)
    (n,) = result.nums
    assert (n.status, n.read_from, n.value, n.text) == ("word", "words before", value, words)
    assert out == doc(body)


def test_an_empty_num_after_other_words_keeps_the_editors_value():
    out, result = run('<lb n="3"/>ἐκ δραχμῶν <num value="6"/>')
    (n,) = result.nums
    assert (n.status, n.read_from, n.value, n.existing) == ("word", None, None, {"value": "6"})
    assert n.text_line == "3"


def test_an_empty_num_does_not_reach_past_the_line_break():
    _, result = run('πέντε <lb n="2"/><num value="5"/>')
    assert result.nums[0].read_from is None


# -- ranges --------------------------------------------------------------------------

def test_a_one_sided_range_the_letters_satisfy_agrees():
    # TEI att.ranging: @atLeast alone.  ι and a lost units letter: 11 to 19.
    _, result = run('<num atLeast="10">ι<gap reason="lost" quantity="1" unit="character"/></num>')
    assert result.nums[0].status == "agrees"
    _, result = run('<num atMost="15">ι<gap reason="lost" quantity="1" unit="character"/></num>')
    assert result.nums[0].status == "agrees"


def test_a_one_sided_range_no_reading_satisfies_is_a_contradiction():
    _, result = run('<num atLeast="30">ι<gap reason="lost" quantity="1" unit="character"/></num>')
    assert result.nums[0].status == "contradiction"


def test_a_lone_illegible_letter_is_at_least_one():
    # EpiDoc trans-lostcharnumeral: a number with a lost letter gets @atLeast/@atMost.
    out, result = run('<num><gap reason="illegible" quantity="1" unit="character"/></num>',
                      alternatives=5)
    (n,) = result.nums
    assert n.status == "range-added" and n.at_least == 1
    assert nums(out)[0].get("atLeast") == "1"
    assert all(Fraction(a["value"]) != 0 for a in n.alternatives)
    assert all(c.get("assertedValue") != "0" for c in nums(out)[0].findall("tei:certainty", NS))


def test_certainty_points_at_value_only_where_there_is_one():
    # trans-numnoncongruent: match="../@value" on a number with @value ...
    out, _ = run('<num value="11">[.]α</num>', alternatives=2)
    certs = nums(out)[0].findall("tei:certainty", NS)
    assert certs and all(c.get("match") == "../@value" for c in certs)
    # ... and at the bounds that exist elsewhere (ref-certainty: @match is an XPath).
    out, _ = run('<num>ι<gap reason="lost" quantity="1" unit="character"/></num>', alternatives=2)
    num = nums(out)[0]
    certs = num.findall("tei:certainty", NS)
    assert certs and all(c.get("match") == "../@atLeast | ../@atMost" for c in certs)
    for c in certs:
        assert [a.getparent() for a in c.xpath(c.get("match"))] == [num, num]


# -- --fix --------------------------------------------------------------------------

@pytest.mark.parametrize("body", [
    '<num value="1000">Α</num>',          # documentary: a lone capital letter is thousands
    '<num value="1">Α</num>',             # the generic reading: alpha is one
    '<num value="1/4">δ</num>',           # trans-fractionknown: the letters also write 1/4
    '<num value="15"><unclear>ιε</unclear></num>',
])
def test_fix_never_overwrites_a_value_a_reading_supports(body):
    out, result = run(body, fix=True)
    assert result.nums[0].status == "agrees"
    assert out == doc(body)


def test_fix_replaces_a_value_no_reading_allows_and_says_so():
    out, result = run('<num value="5">β</num>', fix=True)
    (n,) = result.nums
    assert n.status == "fixed" and "'5'" in n.message
    assert nums(out)[0].get("value") == "2"


# -- places ---------------------------------------------------------------------------

def test_every_number_has_its_text_line_division_index_and_xpath():
    body = ('<lb n="1"/>ἔτους <num value="17">ιζ</num>'
            '</ab><div type="textpart" n="B"><ab><lb n="7"/>ὀβολοὶ <num>β</num> καὶ <num>γ</num>'
            '</ab></div><ab>')
    out, result = run(body)
    root = etree.fromstring(out)
    got = [(n.index, n.text_line, n.div) for n in result.nums]
    assert got == [(1, "1", "edition"), (2, "7", "edition > textpart B"), (3, "7", "edition > textpart B")]
    everything = root.findall(".//tei:num", NS)
    for n in result.nums:
        assert root.xpath(n.xpath, namespaces=NS) == [everything[n.index - 1]]


def test_json_lists_every_number_with_the_editors_attributes():
    _, result = run('<num value="12">ιβ</num> <num>ε</num> <num value="3"/>')
    d = result.to_dict()
    assert [n["status"] for n in d["nums"]] == ["agrees", "value-added", "word"]
    for n in d["nums"]:
        for key in ("index", "xpath", "text_line", "text", "notation", "status", "existing"):
            assert key in n
    assert d["nums"][0]["existing"] == {"value": "12"} and d["nums"][1]["existing"] == {}
    assert d["nums"][1]["value"] == "5"


# -- the table of words ----------------------------------------------------------------

def _rows():
    path = resources.files("numcheck") / "data" / "greek_number_words.csv"
    with path.open(encoding="utf-8", newline="") as handle:
        return list(csv.DictReader(handle))


def test_every_word_row_has_a_source_and_no_form_means_two_values():
    seen = {}
    for row in _rows():
        assert row["source"].strip() and row["kind"] in (
            "cardinal", "ordinal", "day", "fraction", "sign-word", "myriad")
        for form in row["forms"].split():
            key = word_key(form)
            assert seen.setdefault(key, row["value"]) == row["value"], form


@pytest.mark.parametrize("word, meaning", [
    ("εἰς", None), ("ἐξ", None), ("ἐν", None),          # prepositions, not one, six, one
    ("εἷς", 1), ("ἕξ", 6), ("ἕν", 1),
])
def test_breathings_tell_number_words_from_prepositions(word, meaning):
    entry = lookup(word)
    assert (entry.value if entry else None) == meaning


def test_myriad_counts_the_number_before_it():
    assert read_words("δύο μυριάδες").value == 20000
    assert read_words("μυριάδες").value == 10000


def test_myriad_sign_expanded_beside_its_count_agrees_and_is_never_fixed():
    # K-P X.3: the myriad sign written out, its count a numeral beside it.
    body = '<num value="20000"><expan>μ<ex>υριάδες</ex></expan> β</num>'
    out, result = run(body, fix=True)
    assert (result.nums[0].status, result.nums[0].value) == ("agrees", 20000)
    assert out == doc(body)


@pytest.mark.parametrize("body", [
    '<num value="40">μὲ</num>',                              # accents: a word, perhaps
    '<num value="3"><expan>β<ex>αρβαρον</ex></expan></num>',  # part of it the editor's
])
def test_fix_leaves_alone_what_may_not_be_a_plain_numeral(body):
    out, result = run(body, fix=True)
    assert result.nums[0].status == "contradiction" and "not changed" in result.nums[0].message
    assert out == doc(body)


@pytest.mark.parametrize("name", ["numcheck.tei.words", "numcheck.tei.values", "numcheck.tei.markup"])
def test_doctests(name):
    import doctest
    import importlib

    assert doctest.testmod(importlib.import_module(name)).failed == 0


@pytest.mark.parametrize("body, reason", [
    # the thousands sign unwritten or lost: the editor reads thousands
    ('<num value="1000">α</num>', "thousands"),
    # two characters lost may be a numeral and its sign (papyri.info counts characters)
    ('<num value="2"><gap reason="lost" quantity="2" unit="character"/></num>', "fewer letters"),
])
def test_fix_leaves_alone_values_a_loose_reading_gives(body, reason):
    out, result = run(body, fix=True)
    (n,) = result.nums
    assert n.status == "contradiction" and reason in n.message
    assert out == doc(body)


def test_a_sign_glyph_keeps_the_editors_value_and_takes_no_words_from_before():
    # DDbDP writes some signs as <g type=".."/>: no letters to read
    out, result = run('δραχμὰς δύο <num value="1"><g type="obol"/></num>', fix=True)
    (n,) = result.nums
    assert (n.status, n.read_from, n.value) == ("not-checkable", None, None)
    assert "obol" in n.text


# -- tables written as lists ------------------------------------------------------

LIST_TABLE = '''<list rend="table">
  <list rend="row" type="head"><label>day</label><label>amount</label></list>
  <item><list rend="row"><item><num>α</num></item><item><num>ι</num></item></list></item>
  <list rend="row"><item><num>β</num></item><item><num>κ</num></item></list>
  <list rend="row"><item><num>γ</num></item><item><num>λ</num></item></list>
  <list rend="row"><item><num>δ</num></item><item><num>ν</num></item></list>
  <list rend="row"><item><num>ε</num></item><item><num>ν</num></item></list>
  <list rend="row"><item><num>ϛ</num></item><item>Ἀπολλώνιος</item></list>
</list>'''


def test_a_table_written_as_lists_is_audited(tmp_path):
    # <list rend="table"> of <list rend="row"> (TEI P5 §3.8 lists, @rend for the layout)
    from numcheck.audit import audit

    path = tmp_path / "list.xml"
    path.write_bytes(doc("</ab>" + LIST_TABLE + "<ab>"))
    out = audit(path).to_dict()
    assert out["columns"] == ["day", "amount"]
    # a name in the amount column is listed and the audit goes on with the rest
    assert [(u["row"], u["column"], u["text"]) for u in out["unreadable"]] == [(6, "amount", "Ἀπολλώνιος")]
    assert [(f["row"], f["column"], f["written"], f["expected"]) for f in out["flags"]] == [
        (4, "amount", "ν", "μ")]


def test_a_word_not_in_the_table_is_a_word_not_letters():
    # δίμοιρον (two-thirds) is not in the table: kept as a word, never read letter by letter
    body = '<num value="2/3">δίμοιρον</num>'
    out, result = run(body, fix=True)
    (n,) = result.nums
    assert (n.status, n.read_from, n.value) == ("word", None, None)
    assert out == doc(body)


@pytest.mark.parametrize("form", ["NFC", "NFD"])
def test_words_and_expansions_read_the_same_in_either_normal_form(form):
    import unicodedata

    body = unicodedata.normalize(form, '<num value="6">ἕξ</num> <num value="2"><expan><ex>διώβολον</ex>'
                                       '</expan></num> <num>2 bēru 10 UŠ</num>')
    _, result = run(body)
    assert [(n.status, n.value) for n in result.nums] == [("word", 6), ("agrees", 2), ("value-added", 70)]
