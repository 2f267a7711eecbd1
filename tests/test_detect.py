"""Detection of the notation from the characters: one test per rule, and read() with it.

The expected notations follow the rules in numcheck/notations/detect.py
(common practice of the editions: Neugebauer's ',' and ';' for sexagesimal,
spaced digit groups for floating cuneiform transliterations, Greek letters,
Attic capitals, Roman letters, Arabic letters).
"""

import pytest

from numcheck.notations import NOTATIONS
from numcheck.notations.detect import detect_notation
from numcheck.reader import read

CASES = [
    ("1,49,45;20", "sexagesimal", "sexagesimal separators", "digits with ',' and ';'"),
    ("29;31", "sexagesimal", "sexagesimal separators", "';' alone"),
    ("1,40", "sexagesimal", "sexagesimal separators", "',' alone stays sexagesimal (read() unchanged)"),
    ("365", "sexagesimal", "plain digits", "plain digits: one place, an integer"),
    ("3[x]", "sexagesimal", "plain digits", "a damaged single place"),
    ("x", "sexagesimal", "unread", "a lone small x is an unread place (Leiden)"),
    ("[x],40", "sexagesimal", "sexagesimal separators", "x with digits and separators"),
    ("1 40", "cuneiform", "separated by spaces", "spaced digit groups, no ';'"),
    ("6585 1/3", "sexagesimal", "plain digits", "a fraction is not a cuneiform place"),
    ("1 x 40", "cuneiform", "separated by spaces", "spaced groups with an unread place"),
    ("𒐏𒐉", "cuneiform", "CUNEIFORM NUMERIC SIGN", "Unicode cuneiform numeric signs"),
    ("شسه", "abjad", "Arabic-script letters", "Arabic letters"),
    ("Χ𐅅ΗΔΔΙΙ", "attic", "GREEK ACROPHONIC ATTIC FIVE HUNDRED", "a U+10140-block sign"),
    ("ΧΠ(Η)ΗΔΔΙΙ", "attic", "ASCII form", "the ASCII fallback of a combined sign"),
    ("ΔΔΙΙ", "attic", "repeated", "repeated capitals point to Attic"),
    ("ΧΗΔΙ", "attic", "out of alphabetic order", "Attic order, not alphabetic order"),
    ("ΙΔ", "greek", "also Attic signs", "capitals in alphabetic order: Greek, Attic mentioned"),
    ("κθ λα ν η κ", "greek", "Greek letters", "small Greek letters"),
    ("ΡΚΓ", "greek", "Greek letters", "capitals that are not all Attic signs"),
    ("𐆊", "greek", "zero sign", "the Greek zero sign alone"),
    ("XIIII", "roman", "Roman numerals", "Latin Roman letters"),
    ("mcmxc", "roman", "Roman numerals", "small Roman letters"),
    ("Ⅻ", "roman", "ROMAN NUMERAL TWELVE", "Unicode Number Forms"),
]


@pytest.mark.parametrize("text, notation, evidence, note", CASES)
def test_rules(text, notation, evidence, note):
    name, reason = detect_notation(text)
    assert name == notation, note
    assert evidence in reason, reason
    assert name in NOTATIONS


def test_cases_do_not_repeat():
    assert len({c[0] for c in CASES}) == len(CASES)


def test_read_says_how_it_chose():
    r = read("ΔΔΙΙ")
    assert r.notation == "attic" and r.value == 22
    assert r.detected.startswith("attic (") and "repeated" in r.detected


def test_notation_overrides_detection():
    assert read("ΔΔΙΙ", notation="attic").value == 22
    assert read("ΙΔ").value == 14               # alphabetic: 10 + 4
    assert read("ΔΙ", notation="attic").value == 11


@pytest.mark.parametrize("text, value", [("1,49,45;20", "19756/3"), ("29;31,50,8,20", "765433/25920"),
                                         ("59", "59"), ("365;14,48", "54787/150"), ("0;30", "1/2")])
def test_sexagesimal_reading_unchanged(text, value):
    r = read(text)
    assert r.notation == "sexagesimal" and r.to_dict()["value"] == value


def test_greek_through_read():
    assert read("κθ λα ν η κ").to_dict()["value"] == "765433/25920"
    assert read("α 𐆊 λ").to_dict()["value"] == "121/120"
