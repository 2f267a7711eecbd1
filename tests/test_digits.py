"""Arabic-Indic, Persian and Devanagari digits: values, damage, round trip, bad input."""

import pytest
from hypothesis import given
from hypothesis import strategies as st

from numcheck import NumcheckError, Status, read
from numcheck.notations import format_reading, notation_module
from numcheck.notations.digits import SCRIPTS

NAMES = sorted(SCRIPTS)


def _in(script: str, ascii_text: str) -> str:
    zero = SCRIPTS[script].zero
    return "".join(chr(zero + int(c)) if c.isdigit() else c for c in ascii_text)


@pytest.mark.parametrize("name", NAMES)
@pytest.mark.parametrize("ascii_text", ["1577917500", "365;14,48", "29;31,50,8,20", "0;59,8,17,13,12,31"])
def test_same_value_as_ascii_digits(name, ascii_text):
    text = _in(name, ascii_text)
    reading = read(text)
    assert reading.notation == name            # detected from the characters
    assert reading.value == read(ascii_text).value
    assert format_reading(reading) == text


@pytest.mark.parametrize("name", NAMES)
def test_damage_marks(name):
    reading = read(_in(name, "29;31,5[x],8,20"), notation=name)
    assert reading.count == 10
    assert reading.slots[2].status is Status.LOST
    assert reading.slots[2].text == _in(name, "5[x]")
    assert format_reading(reading) == _in(name, "29;31,5[x],8,20")
    doubtful = read(_in(name, "12?;30"), notation=name)
    assert doubtful.slots[0].status is Status.DOUBTFUL
    restored = read(_in(name, "1,[4]9"), notation=name)
    assert restored.slots[1].editor == 49


def test_arabic_separators_are_kept():
    text = "\u0663\u0666\u0665\u061b\u0661\u0664\u060c\u0664\u0668"      # ٣٦٥؛١٤،٤٨
    reading = read(text)
    assert reading.value == read("365;14,48").value
    assert format_reading(reading) == text


@pytest.mark.parametrize("name", NAMES)
def test_bad_examples(name):
    for text, column, label in notation_module(name).BAD_EXAMPLES:
        with pytest.raises(NumcheckError) as info:
            read(text, notation=name)
        assert info.value.column == column, (text, str(info.value))
        assert label.split(" (")[0] in str(info.value) or "sexagesimal place" in label, str(info.value)


@given(st.sampled_from(NAMES), st.integers(0, 10 ** 12), st.lists(st.integers(0, 59), max_size=4))
def test_round_trip(name, whole, fraction):
    ascii_text = str(whole) + (";" + ",".join(map(str, fraction)) if fraction else "")
    text = _in(name, ascii_text)
    reading = read(text, notation=name)
    assert reading.value == read(ascii_text).value
    assert format_reading(reading) == text
