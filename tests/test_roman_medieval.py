"""Medieval Roman numerals: framing points and the apostrophic forms.

Framing points (.m.cc.lij.) and the apostrophic forms CIↃ / IↃ: Cappelli,
Lexicon abbreviaturarum, "Numeri romani" (from memory); common practice in
editions of Latin astronomical tables.  Unicode's own values for the
apostrophic thousands are checked in tests/test_against_unicode_numbers.py.
"""

import pytest
from hypothesis import given
from hypothesis import strategies as st

from numcheck import NumcheckError, Status, read
from numcheck.notations import format_reading

CASES = [
    (".m.cc.lij.", 1252, "framing points around and between groups"),
    ("·xij·", 12, "middle dots"),
    ("CI\u2183", 1000, "apostrophic thousand"),
    ("I\u2183", 500, "apostrophic five hundred"),
    ("CCI\u2183\u2183", 10000, "apostrophic ten thousand"),
    ("I\u2183\u2183", 5000, "apostrophic five thousand"),
    ("CCCI\u2183\u2183\u2183", 100000, "apostrophic hundred thousand"),
    ("CI\u2183CCCXX", 1320, "apostrophic thousand then letters"),
    ("CI\u2183I\u2183LX", 1560, "thousand and five hundred, apostrophic"),
    ("ci\u2184xv", 1015, "lower case with the small reversed c"),
    (".CI\u2183.cc.", 1200, "points and an apostrophic form"),
]


def test_no_input_repeats():
    assert len({t for t, *_ in CASES}) == len(CASES)


@pytest.mark.parametrize("text,value,note", CASES)
def test_value_and_round_trip(text, value, note):
    reading = read(text, notation="roman")
    assert reading.value == value
    assert format_reading(reading) == text


def test_points_are_detected_as_roman():
    assert read(".m.cc.lij.").notation == "roman"


def test_damage_inside_points():
    reading = read(".m.c[c].lij.", notation="roman")
    assert 1252 in reading.readings()
    assert reading.slots[0].status is Status.RESTORED
    assert format_reading(reading) == ".m.c[c].lij."
    lost = read(".x[.]v.", notation="roman")
    # The points change nothing: the same readings as x[.]v (XIV, XXV, XLV, XCV).
    assert sorted(lost.readings()) == sorted(read("x[.]v", notation="roman").readings()) == [14, 25, 45, 95]
    assert format_reading(lost) == ".x[.]v."


@pytest.mark.parametrize("text,column", [("..", 1), ("\u2183I", 1), ("CI\u2183\u2183", 2)])
def test_bad(text, column):
    with pytest.raises(NumcheckError) as info:
        read(text, notation="roman")
    assert info.value.column == column


@given(st.integers(1, 3999), st.sampled_from([".", "\u00b7"]))
def test_round_trip_with_points(n, point):
    letters = ""
    for value, sym in ((1000, "m"), (900, "cm"), (500, "d"), (400, "cd"), (100, "c"), (90, "xc"),
                       (50, "l"), (40, "xl"), (10, "x"), (9, "ix"), (5, "v"), (4, "iv"), (1, "i")):
        while n >= value:
            letters += sym
            n -= value
    text = point + point.join([letters[:1], letters[1:]] if len(letters) > 1 else [letters]) + point
    reading = read(text, notation="roman")
    assert format_reading(reading) == text
