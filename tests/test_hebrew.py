"""Hebrew letter numerals: values, thousands, numeral marks, damage, round trip, bad input.

Letter values and the forms טו/טז, ת repeated past 400, thousands before a
geresh: common practice.  Published values are checked in
tests/test_against_hebrew_sources.py.
"""

import warnings
from fractions import Fraction as F

import pytest
from hypothesis import given
from hypothesis import strategies as st

from numcheck import NumcheckError, NumcheckWarning, Status, read
from numcheck.notations import format_reading, render_choice
from numcheck.notations.hebrew import BAD_EXAMPLES, spell

CASES = [
    ("א", 1, "one letter"),
    ("ג׳", 3, "a geresh after a single letter"),
    ("ג'", 3, "an ASCII apostrophe as geresh"),
    ("יא", 11, "ten and one"),
    ("טו", 15, "fifteen as nine and six"),
    ("טז", 16, "sixteen as nine and seven"),
    ("כט", 29, "twenty-nine"),
    ("נט", 59, "fifty-nine"),
    ("שסה", 365, "three hundred sixty-five"),
    ("תשצג", 793, "seven hundred ninety-three"),
    ("תשצ״ג", 793, "with gershayim"),
    ('תשצ"ג', 793, "with an ASCII double quote"),
    ("תק", 500, "five hundred as 400 + 100"),
    ("תתקצט", 999, "nine hundred ninety-nine"),
    ("ה׳תשפ״ג", 5783, "a year: thousands before a geresh"),
    ("ג׳תרכב", 3622, "thousands without gershayim"),
    ("ך", 20, "a final kaf has its letter's value"),
    ("תש״ם", 740, "a final mem at the end"),
]


def test_no_input_repeats():
    assert len({t for t, *_ in CASES}) == len(CASES)


@pytest.mark.parametrize("text,value,note", CASES)
def test_values(text, value, note):
    reading = read(text)
    assert reading.notation == "hebrew"
    assert reading.value == value
    assert format_reading(reading) == text


def test_places_after_the_whole_part():
    assert read("ל מה").value == F(123, 4)
    assert read("כט לא נ ח כ").value == read("29;31,50,8,20").value


def test_fifteen_written_as_ten_and_five_is_a_warning():
    with pytest.warns(NumcheckWarning, match="usual form is טו"):
        assert read("יה", notation="hebrew").value == 15


def test_lost_letter():
    reading = read("תש[.]ג")
    assert sorted(reading.readings()) == [F(703 + 10 * k) for k in range(1, 10)]
    assert reading.slots[0].status is Status.LOST
    choice = next(c for r, c in reading.choices() if r.value_of(c) == 793)
    assert render_choice(reading, choice) == "תש[צ]ג"
    assert format_reading(reading) == "תש[.]ג"


def test_restored_doubtful_added_superfluous():
    restored = read("תש[צ]ג")
    assert restored.value == 793 and restored.slots[0].editor == 793
    assert format_reading(restored) == "תש[צ]ג"
    assert read("תשצ?ג").slots[0].status is Status.DOUBTFUL
    assert read("תשצ<ג>").value == 793
    assert read("{א}ב").value == 2
    assert format_reading(read("תשצ?ג")) == "תשצ?ג"


def test_unread_letter_and_gap():
    assert read("xל").count == 4            # ק ר ש ת before ל
    gap = read("ל [...]")
    assert gap.slots[1].gap == (1, 3)


def test_bad_examples():
    for text, column, label in BAD_EXAMPLES:
        with pytest.raises(NumcheckError) as info:
            read(text, notation="hebrew")
        assert info.value.column == column, (text, str(info.value))
        assert label.split(" (")[0] in str(info.value) or "sexagesimal place" in label, str(info.value)


@given(st.integers(1, 9999).filter(lambda n: n % 1000))
def test_round_trip(n):
    # Whole thousands (א׳) read as the letter with a geresh, 1: the text alone cannot say.
    text = spell(n)
    with warnings.catch_warnings():
        warnings.simplefilter("error")
        reading = read(text, notation="hebrew")
    assert reading.value == n
    assert format_reading(reading) == text


@given(st.integers(11, 999).filter(lambda n: len(spell(n)) > 1))
def test_round_trip_with_gershayim_and_a_lost_letter(n):
    text = spell(n)
    marked = text[:-1] + "\u05f4" + text[-1]
    assert read(marked, notation="hebrew").value == n
    assert format_reading(read(marked, notation="hebrew")) == marked
    damaged = text[:-1] + "[.]"
    reading = read(damaged, notation="hebrew")
    assert F(n) in set(reading.readings())
    assert format_reading(reading) == damaged
