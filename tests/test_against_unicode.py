"""Our Greek and Attic sign values checked against the Unicode Character Database.

Source: the UCD as compiled into Python's ``unicodedata`` (its version,
``unicodedata.unidata_version``, is printed in the test ids: 14.0.0 on Python
3.11, 15.0.0 on 3.12, 15.1.0 on 3.13; conventions.md §3.6).  The database
stores rationals (2/3); ``unicodedata.numeric`` returns a float, so we turn
it back into a fraction with a denominator of at most 12 (every value here
is a multiple of 1/12).

Every character the Greek and Attic grammars accept that has a numeric value
in the database is checked here; the Greek letters have none (conventions.md
§3.1: 0 of 135 in the Greek and Coptic block), which is why numcheck carries
its own letter table (numcheck/notations/greek/letters.py).
"""

import unicodedata
from fractions import Fraction

import pytest

from numcheck.notations.attic import SIGN_VALUES, parse as parse_attic
from numcheck.notations.greek import parse as parse_greek
from numcheck.notations.greek.letters import LETTER_VALUES
from numcheck.notations.greek.model import FRACTION_SIGNS, ZERO_SIGNS

UCD = unicodedata.unidata_version


def _ucd(ch: str) -> Fraction:
    return Fraction(unicodedata.numeric(ch)).limit_denominator(12)


GREEK_SIGNS = [c for c in list(FRACTION_SIGNS) + sorted(ZERO_SIGNS) if unicodedata.numeric(c, None) is not None]
ATTIC_SIGNS = [c for c in SIGN_VALUES if unicodedata.numeric(c, None) is not None and ord(c) > 0xFFFF]


def test_every_accepted_sign_with_a_value_is_checked():
    # The astral Greek signs we accept all carry a UCD value; ∠ and ō carry none.
    assert {f"U+{ord(c):04X}" for c in GREEK_SIGNS} == {
        "U+10175", "U+10176", "U+10177", "U+10178", "U+1018B", "U+1018A"}
    assert {f"U+{ord(c):04X}" for c in ATTIC_SIGNS} == {f"U+{c:04X}" for c in range(0x10140, 0x10148)}
    assert unicodedata.numeric("∠", None) is None and unicodedata.numeric("ō", None) is None


@pytest.mark.parametrize("ch", GREEK_SIGNS, ids=lambda c: f"U+{ord(c):04X}-UCD{UCD}")
def test_greek_signs_match_the_ucd(ch):
    # A sign alone is the whole part of the number.
    assert parse_greek(ch).value == _ucd(ch), unicodedata.name(ch)


@pytest.mark.parametrize("ch", ATTIC_SIGNS, ids=lambda c: f"U+{ord(c):04X}-UCD{UCD}")
def test_attic_signs_match_the_ucd(ch):
    assert "GREEK ACROPHONIC ATTIC" in unicodedata.name(ch)
    assert parse_attic(ch).value == _ucd(ch), unicodedata.name(ch)


@pytest.mark.parametrize("cp, name, value", [
    (0x10144, "GREEK ACROPHONIC ATTIC FIFTY", 50),
    (0x10145, "GREEK ACROPHONIC ATTIC FIVE HUNDRED", 500),
    (0x10146, "GREEK ACROPHONIC ATTIC FIVE THOUSAND", 5000),
    (0x10147, "GREEK ACROPHONIC ATTIC FIFTY THOUSAND", 50000),
    (0x1018A, "GREEK ZERO SIGN", 0),
    (0x10175, "GREEK ONE HALF SIGN", Fraction(1, 2)),
    (0x10177, "GREEK TWO THIRDS SIGN", Fraction(2, 3)),
    (0x10178, "GREEK THREE QUARTERS SIGN", Fraction(3, 4)),
    (0x1018B, "GREEK ONE QUARTER SIGN", Fraction(1, 4)),
])
def test_names_and_values_as_the_issue_gives_them(cp, name, value):
    ch = chr(cp)
    assert unicodedata.name(ch) == name
    assert _ucd(ch) == value


def test_greek_letters_have_no_ucd_value():
    # So the letter values cannot come from the database (conventions.md §3.1).
    assert all(unicodedata.numeric(c, None) is None for c in LETTER_VALUES)


def test_the_numeral_sign_becomes_modifier_letter_prime_under_nfc():
    assert unicodedata.normalize("NFC", "\u0374") == "\u02b9"
    assert unicodedata.name("\u0375") == "GREEK LOWER NUMERAL SIGN"
    assert parse_greek("κθ\u0374").value == parse_greek("κθ\u02b9").value == 29


@pytest.mark.parametrize("cp", [0x03DB, 0x03DD, 0x03D9, 0x03DF, 0x03E1, 0x0373])
def test_variant_letters_are_the_ones_the_names_say(cp):
    ch = chr(cp)
    name = unicodedata.name(ch)
    expected = {"STIGMA": 6, "DIGAMMA": 6, "KOPPA": 90, "SAMPI": 900}
    word = next(w for w in expected if w in name)
    assert LETTER_VALUES[ch] == expected[word], name
