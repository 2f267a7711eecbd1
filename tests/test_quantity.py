"""Mixed quantities: numbers with unit words, zodiacal longitudes, exact conversion."""

import unicodedata
from fractions import Fraction as F

import pytest
from hypothesis import given
from hypothesis import strategies as st

from numcheck import NumcheckError, UnknownNameError, read
from numcheck.notations import format_reading, render_choice
from numcheck.notations.quantity import BAD_EXAMPLES, VULGAR_FRACTIONS, has_units, parse, with_unit

# (input, value, unit, note).  Unit sizes: numcheck.units (CDLI wiki 'Akkadian
# astronomy' for UŠ, bēru, cubit, finger; 30 degrees a sign, common practice).
QUANTITIES = [
    ("3 signs 12;30°", F(205, 2), "degrees", "3 signs = 90°, + 12;30° = 102;30°"),
    ("2 bēru 10 UŠ", F(70), "UŠ", "1 bēru = 30 UŠ"),
    ("2 beru 10 us", F(70), "UŠ", "ASCII spellings"),
    ("1 cubit 4 fingers", F(28), "fingers", "1 cubit = 24 fingers"),
    ("6585 1/3 days", F(19756, 3), "days", "the saros in days"),
    ("6585 ⅓ days", F(19756, 3), "days", "a vulgar fraction"),
    ("½ day", F(1, 2), "days", "a vulgar fraction alone"),
    ("12;30 Taurus", F(85, 2), "degrees", "a longitude: Taurus begins at 30°"),
    ("12;30° Taurus", F(85, 2), "degrees", "a longitude with a degree mark"),
    ("♉ 12;30", F(85, 2), "degrees", "a sign symbol before the degrees"),
    ("12°30′ Taurus", F(85, 2), "degrees", "degrees and minutes of arc"),
    ("29;31,50,8,20 days", F(765433, 25920), "days", "the mean synodic month, System B"),
    ("1 day 6 hours", F(30), "hours", "days and hours"),
    ("12 time degrees", F(12), "UŠ", "a unit of two words"),
    ("XII signs", F(12), "signs", "a Roman number of signs"),
]


def test_no_input_repeats():
    inputs = [t for t, *_ in QUANTITIES]
    assert len(inputs) == len(set(inputs))


@pytest.mark.parametrize("text,value,unit,note", QUANTITIES)
def test_quantities(text, value, unit, note):
    reading = read(text, notation="roman") if text.startswith("XII") else read(text)
    assert reading.value == value
    assert reading.unit == unit
    assert reading.notation == "quantity"
    assert read(format_reading(reading), notation="roman" if text.startswith("XII") else None).value == value


def test_damage_is_carried_through_in_the_unit():
    reading = read("3 signs 1[x];30°")
    assert reading.damaged
    assert (reading.min, reading.max, reading.count) == (F(201, 2), F(219, 2), 10)
    texts = [render_choice(r, c) for r, c in reading.choices()]
    assert texts[2] == "3 signs 1[2];30°"


@pytest.mark.parametrize("text,unit,value,note", [
    ("2 bēru 10 UŠ", "hours", F(14, 3), "70 UŠ = 280 minutes"),
    ("2 bēru 10 UŠ", "bēru", F(7, 3), "70 UŠ = 2;20 bēru"),
    ("3 signs 12;30°", "signs", F(41, 12), "102;30° = 3;25 signs"),
    ("1 cubit 4 fingers", "degrees", F(7, 3), "28 fingers = 2;20°"),
    ("6585 1/3 days", "hours", F(158048), "the saros in hours"),
])
def test_read_converts_exactly(text, unit, value, note):
    reading = read(text, unit=unit)
    assert reading.value == value
    assert reading.unit == unit
    assert format_reading(reading) == format_reading(read(text))


def test_conversion_carries_damage():
    reading = read("1[x] UŠ", unit="bēru")
    assert (reading.min, reading.max) == (F(1, 3), F(19, 30))


def test_unit_for_a_bare_number_names_it():
    reading = read("12;30", unit="beru")
    assert reading.unit == "bēru" and reading.value == F(25, 2)
    assert reading.notation == "sexagesimal"


def test_unknown_unit_says_did_you_mean():
    with pytest.raises(UnknownNameError, match="Did you mean 'days'"):
        read("6585 days", unit="dayz")


def test_with_unit_keeps_the_reading_exact():
    base = parse("2 bēru 10 UŠ")
    there = with_unit(base, "hours")
    back = with_unit(there, "UŠ")
    assert back.value == base.value == 70
    assert [s.values for s in back.slots] == [s.values for s in base.slots]


@pytest.mark.parametrize("text,column,label", BAD_EXAMPLES)
def test_bad_input_points_at_the_column(text, column, label):
    with pytest.raises(NumcheckError) as info:
        read(text)
    assert info.value.column == column
    assert label in str(info.value)


@pytest.mark.parametrize("char", sorted(VULGAR_FRACTIONS))
def test_vulgar_fractions_agree_with_unicode(char):
    # Unicode Character Database (unicodedata.unidata_version) numeric values.
    assert float(VULGAR_FRACTIONS[char]) == pytest.approx(unicodedata.numeric(char), abs=1e-12)
    assert VULGAR_FRACTIONS[char].denominator <= 10


@pytest.mark.parametrize("text,expected", [
    ("3 signs 12;30°", True), ("12;30°", True), ("12;30 Taurus", True), ("1,40", False),
    ("MDC", False), ("m d", False), ("κθ λα", False), ("𒐏𒐉 𒌋", False),
])
def test_has_units(text, expected):
    assert has_units(text) is expected


def test_nfc_and_nfd_read_the_same():
    text = "2 bēru 10 UŠ"
    nfd = unicodedata.normalize("NFD", text)
    assert nfd != text
    assert read(nfd).to_dict() == read(text).to_dict()


@given(st.integers(0, 11), st.integers(0, 29), st.integers(0, 59))
def test_round_trip_signs_and_degrees(signs, degrees, minutes):
    text = f"{signs} signs {degrees};{minutes}°"
    reading = read(text)
    assert reading.value == 30 * signs + degrees + F(minutes, 60)
    assert format_reading(reading) == text
    assert read(text, unit="signs").value == reading.value / 30


@given(st.integers(0, 29), st.integers(0, 59), st.integers(0, 11))
def test_round_trip_longitudes(degrees, minutes, sign):
    from numcheck.units import ZODIAC

    text = f"{degrees};{minutes} {ZODIAC[sign]}"
    reading = read(text)
    assert reading.value == 30 * sign + degrees + F(minutes, 60)
    assert format_reading(reading) == text
