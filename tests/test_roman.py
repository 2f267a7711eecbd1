"""Roman numerals: letters, subtractive and additive forms, Number Forms, overline, damage."""

import unicodedata
import warnings
from fractions import Fraction as F

import pytest
from hypothesis import given
from hypothesis import strategies as st

from numcheck import NumcheckError, NumcheckWarning, Status, read
from numcheck.notations import format_reading, render_choice
from numcheck.notations.roman import BAD_EXAMPLES

# (input, value, note).  Letter values and subtractive pairs: common practice;
# the overline as x1000: EpiDoc Guidelines, trans-supralinearetc (IRT 22,
# VIII with a bar = 8000); j for a final i (conventions.md §3.4, from memory).
UNDAMAGED = [
    ("MDCLXVI", F(1666), "every letter once"),
    ("MCMXCIX", F(1999), "three subtractive pairs"),
    ("XIV", F(14), "a subtractive pair at the end"),
    ("IIII", F(4), "additive four"),
    ("VIIII", F(9), "additive nine"),
    ("XXXX", F(40), "additive forty"),
    ("CCCC", F(400), "additive four hundred"),
    ("mdclxvi", F(1666), "lower case"),
    ("viij", F(8), "a final j"),
    ("xiiij", F(14), "a final j after additive units"),
    ("V\u0305III", F(5003), "an overline multiplies by 1000"),
    ("V\u0305I\u0305I\u0305I\u0305", F(8000), "EpiDoc's VIII with a bar"),
    ("X\u0305V\u0305CC", F(15200), "overlined thousands then hundreds"),
    ("\u216f\u216e\u216d\u216c\u2169\u2165", F(1666), "Number Forms letters"),
    ("\u216b", F(12), "ROMAN NUMERAL TWELVE as one character"),
    ("\u2188", F(100000), "ROMAN NUMERAL ONE HUNDRED THOUSAND"),
    ("\u2180", F(1000), "ROMAN NUMERAL ONE THOUSAND C D"),
    ("\u217f\u217d", F(1100), "small Number Forms"),
]


def test_no_input_repeats():
    inputs = [t for t, *_ in UNDAMAGED] + [t for t, *_ in DAMAGED]
    assert len(inputs) == len(set(inputs))


@pytest.mark.parametrize("text,value,note", UNDAMAGED)
def test_undamaged(text, value, note):
    reading = read(text, notation="roman")
    assert reading.value == value
    assert reading.count == 1
    assert not reading.floating
    assert all(s.place == 0 for s in reading.slots)


def test_subtractive_pair_is_one_slot():
    reading = read("XIV", notation="roman")
    assert [s.text for s in reading.slots] == ["X", "IV"]
    assert [s.values for s in reading.slots] == [(F(10),), (F(4),)]


def test_more_than_four_repeats_is_a_warning():
    with pytest.warns(NumcheckWarning, match="more than four"):
        assert read("IIIIII", notation="roman").value == 6


# (input, values the traces allow, value as the edition gives it, status)
DAMAGED = [
    ("X[.]", [11, 15, 20, 40, 90], 11, Status.LOST),
    ("[.]X", [9, 20, 60, 110, 510, 1010], 9, Status.LOST),
    ("+X", [9, 20, 60, 110, 510, 1010], 9, Status.UNREAD),
    ("X[I]V", [14, 25, 45, 95], 14, Status.RESTORED),
    ("X?IV", [14], 14, Status.DOUBTFUL),
    ("X\u0323IV", [14], 14, Status.DOUBTFUL),
    ("<X>II", [12], 12, Status.ADDED),
    ("{I}XII", [12], 12, Status.SUPERFLUOUS),
    ("MC[..]", None, 1102, Status.LOST),
    ("M[...]", None, 1001, Status.LOST),
]


@pytest.mark.parametrize("text,values,value,status", DAMAGED)
def test_every_damage_mark(text, values, value, status):
    reading = read(text, notation="roman")
    assert reading.value == value
    assert status in {s.status for s in reading.slots}
    if values is not None:
        assert sorted(set(reading.readings())) == [F(v) for v in values]
    assert format_reading(reading) == unicodedata.normalize("NFC", text)


def test_two_lost_letters_allow_only_orders_a_scribe_used():
    readings = set(read("MC[..]", notation="roman").readings())
    assert F(1102) in readings and F(1190) in readings and F(1140) in readings
    assert F(1101) not in readings          # one letter cannot fill two places


def test_render_restores_the_lost_letter():
    reading = read("X[.]", notation="roman")
    assert [render_choice(r, c) for r, c in reading.choices()] == [
        "X[I]", "X[V]", "X[X]", "X[L]", "X[C]"]


@pytest.mark.parametrize("text,column,label", BAD_EXAMPLES)
def test_bad_input_points_at_the_column(text, column, label):
    with pytest.raises(NumcheckError) as info:
        read(text, notation="roman")
    assert info.value.column == column
    assert label in str(info.value)
    assert f"U+{ord(text[column - 1]):04X}" in str(info.value)


@pytest.mark.parametrize("char", [chr(c) for c in range(0x2160, 0x2189) if c not in (0x2183, 0x2184)])
def test_number_forms_agree_with_unicode(char):
    # Unicode Character Database (unicodedata.unidata_version) numeric values.
    assert read(char, notation="roman").value == F(unicodedata.numeric(char))


def test_nfc_and_nfd_read_the_same():
    composed = "X\u1eca"                  # X + LATIN CAPITAL LETTER I WITH DOT BELOW
    decomposed = unicodedata.normalize("NFD", composed)
    assert decomposed != composed
    assert read(decomposed, notation="roman").to_dict() == read(composed, notation="roman").to_dict()


def _roman(n: int) -> str:
    out = []
    for value, letters in ((1000, "M"), (900, "CM"), (500, "D"), (400, "CD"), (100, "C"), (90, "XC"),
                           (50, "L"), (40, "XL"), (10, "X"), (9, "IX"), (5, "V"), (4, "IV"), (1, "I")):
        while n >= value:
            out.append(letters)
            n -= value
    return "".join(out)


@given(st.integers(1, 3999))
def test_round_trip(n):
    text = _roman(n)
    reading = read(text, notation="roman")
    assert reading.value == n
    assert format_reading(reading) == text


@given(st.integers(1, 3999))
def test_round_trip_lower_case_and_one_lost_letter(n):
    text = _roman(n)
    with warnings.catch_warnings():
        warnings.simplefilter("error")
        assert read(text.lower(), notation="roman").value == n
    damaged = text[:-1] + "[.]"
    reading = read(damaged, notation="roman")
    assert F(n) in set(reading.readings())
    assert format_reading(reading) == damaged


def test_too_many_lost_letters_is_a_limit_error():
    from numcheck import LimitError

    with pytest.raises(LimitError, match="MAX_LOST_LETTERS"):
        read("[...][...][...]", notation="roman")


def test_no_letter_fits_is_an_error_at_the_lost_place():
    with pytest.raises(NumcheckError) as info:
        read("IIII[.]V", notation="roman")
    assert info.value.column == 5
