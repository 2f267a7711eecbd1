"""Attic acrophonic numerals: values, damage, order, errors, round trips.

Sign values: Heath, A History of Greek Mathematics I (1921) p. 30 (Ι Π Δ Η Χ
Μ and the combined fives); the Unicode signs by name, checked against the UCD
in tests/test_against_unicode.py.
"""

from fractions import Fraction

import pytest
from hypothesis import given
from hypothesis import strategies as st

from numcheck.errors import NumcheckSyntaxError, NumcheckWarning
from numcheck.notations.attic import BAD_EXAMPLES, format, parse, spell
from numcheck.reader import read
from numcheck.reading import Status

F = Fraction

VALUES = [
    ("Χ𐅅ΗΔΔΙΙ", 1622, "the issue's example"),
    ("ΧΠ(Η)ΗΔΔΙΙ", 1622, "ASCII fallback Π(Η) for 500"),
    ("XP(H)HDDII", 1622, "all-ASCII fallback"),
    ("ΙΙΙΙ", 4, "four unit strokes"),
    ("Π", 5, "five"),
    ("Γ", 5, "the older form of five"),
    ("𐅃ΙΙ", 7, "GREEK ACROPHONIC ATTIC FIVE"),
    ("𐅄ΔΔΔΔΠΙΙΙΙ", 99, "fifty, four tens, five, four units"),
    ("Μ𐅆ΧΧΧΧ𐅅ΗΗΗΗ𐅄ΔΔΔΔΠΙΙΙΙ", 19999, "every sign once or four times"),
    ("𐅇", 50000, "GREEK ACROPHONIC ATTIC FIFTY THOUSAND"),
    ("Π(Μ)Μ", 60000, "ASCII fifty thousand"),
    ("ΔΙ𐅁", F(23, 2), "GREEK ACROPHONIC ATTIC ONE HALF"),
    ("Ι𐅀", F(5, 4), "GREEK ACROPHONIC ATTIC ONE QUARTER"),
    ("𐅂𐅂", 2, "GREEK ACROPHONIC ATTIC ONE DRACHMA"),
    ("Η Δ Ι", 111, "spaces are ignored"),
]


@pytest.mark.parametrize("text, value, note", VALUES)
def test_values(text, value, note):
    assert parse(text).value == value, note


def test_values_do_not_repeat():
    assert len({v[0] for v in VALUES}) == len(VALUES)


DAMAGE = [
    ("Χ[.]ΗΔΔΙΙ", 1222, 2122, 3, Status.LOST, "Χ, 𐅅 or Η between Χ and Η"),
    ("ΔΔ[.]", 21, 30, 3, Status.LOST, "a lost Δ, Π or Ι after ΔΔ"),
    ("ΙΙΙ[.]", 4, 4, 1, Status.LOST, "only a fourth Ι fits"),
    ("Η[...]", 100, 450, 84, Status.LOST, "0 to 4 lost signs after Η"),
    ("ΗΗ[Δ]Ι", 202, 301, 5, Status.RESTORED, "a restored sign; the traces allow Η, 𐅄, Δ, Π, Ι"),
    ("ΗΔ.", 111, 120, 3, Status.UNREAD, "a sign present but unread"),
    ("ΗΔ̣Ι", 111, 111, 1, Status.DOUBTFUL, "an underdot"),
    ("ΗΔ?Ι", 111, 111, 1, Status.DOUBTFUL, "a question mark"),
    ("Η<Δ>Ι", 111, 111, 1, Status.ADDED, "an editor's addition"),
    ("Η{Δ}Ι", 101, 101, 1, Status.SUPERFLUOUS, "a superfluous sign"),
]


@pytest.mark.parametrize("text, lo, hi, count, status, note", DAMAGE)
def test_damage(text, lo, hi, count, status, note):
    r = parse(text)
    assert (r.min, r.max, r.count) == (lo, hi, count), note
    assert status in {s.status for s in r.slots}


def test_restoration_is_written_in_brackets():
    r = parse("Χ[.]ΗΔΔΙΙ")
    for expansion, choice in r.choices():
        text = format(expansion, choice)
        assert "[" in text and parse(text).value == expansion.value_of(choice)
    assert {format(e, c) for e, c in r.choices()} == {"Χ[Χ]ΗΔΔΙΙ", "Χ[𐅅]ΗΔΔΙΙ", "Χ[Η]ΗΔΔΙΙ"}


def test_too_many_of_one_sign_warns():
    with pytest.warns(NumcheckWarning, match="well-formed"):
        assert parse("ΔΔΔΔΔ").value == 50


@pytest.mark.parametrize("text, column, label", BAD_EXAMPLES)
def test_bad_input(text, column, label):
    with pytest.raises(NumcheckSyntaxError) as info:
        parse(text)
    assert info.value.column == column and label in str(info.value)
    if info.value.found is not None:
        assert f"U+{ord(info.value.found):04X}" in str(info.value)


def test_attic_through_read():
    r = read("Χ𐅅ΗΔΔΙΙ")
    assert r.notation == "attic" and r.to_dict()["value"] == "1622"


@given(st.integers(1, 99999))
def test_round_trip(n):
    text = spell(F(n))
    r = parse(text)
    assert r.value == n
    assert format(r) == text


@pytest.mark.parametrize("text", ["Χ𐅅ΗΔΔΙΙ", "Χ[.]ΗΔΔΙΙ", "Η[...]", "ΗΗ[Δ]Ι", "ΗΔ̣Ι", "Η<Δ>Ι", "Η{Δ}Ι", "ΗΔ."])
def test_canonical_forms_come_back(text):
    assert format(parse(text)) == text


@pytest.mark.parametrize("text", ["ΗΔ̣Ι", "Χ𐅅ΗΔΔΙΙ", "Η[.]Ι"])
def test_nfc_and_nfd_read_the_same(text):
    import unicodedata
    a = read(unicodedata.normalize("NFC", text), notation="attic")
    b = read(unicodedata.normalize("NFD", text), notation="attic")
    assert a.to_dict() == b.to_dict()


@given(st.text(alphabet="ΙΠΔΗΧΜ𐅄𐅅[].<>{}?\u0323 ", max_size=12))
def test_any_text_reads_or_raises_a_numcheck_error(text):
    import warnings

    from numcheck.errors import NumcheckError
    with warnings.catch_warnings():
        warnings.simplefilter("ignore", NumcheckWarning)
        try:
            r = parse(text)
        except NumcheckError:
            return
        assert r.min <= r.value <= r.max
        assert parse(format(r)).value == r.value
