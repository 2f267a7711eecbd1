"""numcheck's TEI output checked against the EpiDoc Guidelines' own published encodings.

Sources (EpiDoc Guidelines, snapshot of 2026, pages named by their file; see
reference/conventions.md §1.2, §1.3 and §6):

* ``trans-lostcharnumeral``: a Roman numeral whose units letter is lost,
  ``<num atLeast="51" atMost="55">L<gap reason="lost" quantity="1" unit="character"/></num>``.
* ``trans-fractionknown``: a fraction's value as a ratio, ``<num value="1/32">λβ</num>``
  and ``<num value="1/2">𐅵</num>``.
* ``trans-numtick``: ``<num value="1670" rend="tick">αχο</num>``.
* papyri.info ``leiden_plus.md``, "Number fraction": ``<num value="1/16">ιϛ</num>``
  beside ``<num value="16">ιϛ</num>`` (the same letters, integer or unit fraction).
* ``trans-numnoncongruent`` (numbers with non-sequential values): one
  ``<certainty locus="value" match="../@value" assertedValue=".."/>`` per value;
  ``@assertedValue`` is one token (TEIC/TEI issue #2067).

An encoding that follows these pages must come through ``annotate`` unchanged,
byte for byte (its values agree with its letters), and the same numbers without
their values must be given them.
"""

from fractions import Fraction

import pytest
from lxml import etree

from numcheck.tei import annotate_bytes

NS = "http://www.tei-c.org/ns/1.0"


def doc(inner: str, lang: str = "grc") -> bytes:
    return (f'<?xml version="1.0" encoding="UTF-8"?>\n<TEI xmlns="{NS}"><text><body>'
            f'<div type="edition" xml:lang="{lang}"><ab>{inner}</ab></div></body></text></TEI>\n').encode()


def the_num(data: bytes):
    return etree.fromstring(data).find(f".//{{{NS}}}num")


# (the published encoding, its xml:lang, the page it comes from)
PUBLISHED = [
    ('<num atLeast="51" atMost="55">L<gap reason="lost" quantity="1" unit="character"/></num>',
     "la", "trans-lostcharnumeral"),
    ('<num value="1/32">λβ</num>', "grc", "trans-fractionknown"),
    ('<num value="1/2">\U00010175</num>', "grc", "trans-fractionknown (GREEK ONE HALF SIGN)"),
    ('<num value="1670" rend="tick">αχο</num>', "grc", "trans-numtick"),
    ('<num value="1/16">ιϛ</num>', "grc", "leiden_plus.md, Number fraction"),
    ('<num value="16">ιϛ</num>', "grc", "leiden_plus.md, Number fraction"),
    ('<num value="1/32" rend="tick">λβ</num>', "grc", "conventions.md §1.3 (papyri.info rend=tick)"),
]


@pytest.mark.parametrize("inner, lang, page", PUBLISHED, ids=[p[2] for p in PUBLISHED])
def test_published_encodings_come_through_unchanged(inner, lang, page):
    src = doc(inner, lang)
    out, result = annotate_bytes(src, page)
    assert out == src
    (n,) = result.nums
    assert n.status == "agrees", n.message


def test_lost_units_letter_gives_a_range():
    # trans-lostcharnumeral publishes atLeast="51" for L + one lost letter.  Its
    # atMost="55" takes the lost letter for a units letter (LI .. LV); the letters
    # alone also allow LX = 60, and numcheck gives what the letters allow.
    out, result = annotate_bytes(doc('<num>L<gap reason="lost" quantity="1" unit="character"/></num>', "la"), "t")
    num = the_num(out)
    assert num.get("atLeast") == "51"
    assert num.get("value") is None
    assert int(num.get("atMost")) >= 55
    assert result.nums[0].notation == "roman"


def test_the_editors_narrower_range_is_kept_with_a_note():
    src = doc(PUBLISHED[0][0], "la")
    _, result = annotate_bytes(src, "t")
    assert "narrower" in result.nums[0].message


def test_greek_analogue_lost_units_letter():
    # ι (10) and one lost letter: a units letter α..θ, 11 to 19 (Greek letter values
    # after Heath, History of Greek Mathematics I, p. 36).
    out, result = annotate_bytes(doc('<num>ι<gap reason="lost" quantity="1" unit="character"/></num>'), "t")
    num = the_num(out)
    assert (num.get("atLeast"), num.get("atMost")) == ("11", "19")
    assert result.nums[0].text == "ι[.]"


def test_fraction_value_written_as_a_ratio():
    out, _ = annotate_bytes(doc('<num type="fraction">λβ</num>'), "t")
    assert the_num(out).get("value") == "1/32"
    out, _ = annotate_bytes(doc("<num>\U00010175</num>"), "t")
    assert the_num(out).get("value") == "1/2"


def test_integer_letters_without_a_fraction_mark_are_integers():
    out, _ = annotate_bytes(doc("<num>ιϛ</num>"), "t")
    assert the_num(out).get("value") == "16"
    out, _ = annotate_bytes(doc("<num>αχο</num>"), "t")
    assert the_num(out).get("value") == "1670"     # trans-numtick


def test_unit_fraction_range():
    # λ and a lost units letter read as a unit fraction: 1/39 .. 1/31
    out, _ = annotate_bytes(doc('<num type="fraction">λ<gap reason="lost" quantity="1" unit="character"/></num>'), "t")
    num = the_num(out)
    assert (Fraction(num.get("atLeast")), Fraction(num.get("atMost"))) == (Fraction(1, 39), Fraction(1, 31))


def test_alternatives_follow_the_non_sequential_values_pattern():
    out, result = annotate_bytes(
        doc('<num>ι<gap reason="lost" quantity="1" unit="character"/></num>'), "t", alternatives=4)
    num = the_num(out)
    certs = num.findall(f"{{{NS}}}certainty")
    assert len(certs) == 4
    for c in certs:
        # no @value (damage leaves a range): the certainty points at the bounds
        # that exist (EpiDoc ref-certainty: @match is an XPath)
        assert (c.get("locus"), c.get("match")) == ("value", "../@atLeast | ../@atMost")
        assert c.get("assertedValue").isdigit()                  # one token, TEIC/TEI #2067
        assert 11 <= int(c.get("assertedValue")) <= 19
        assert 0 <= float(c.get("degree")) <= 1                  # teidata.probability
    assert len({c.get("assertedValue") for c in certs}) == 4
