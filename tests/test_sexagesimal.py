"""The sexagesimal notation: reading, damage marks, errors, round trips."""

from fractions import Fraction as F

import pytest
from hypothesis import given
from hypothesis import strategies as st

from numcheck import NumcheckError, NumcheckRangeError, NumcheckSyntaxError, Status, read
from numcheck.notations import format_reading
from numcheck.notations.sexagesimal import BAD_EXAMPLES
from numcheck.reading import sexagesimal_text

# (input, exact value, note) — values worked by hand (common practice).
UNDAMAGED = [
    ("1,49,45;20", F(19756, 3), "three whole places and one fraction"),
    ("29;31,50,8,20", F(765433, 25920), "the mean synodic month of System B"),
    ("0;30", F(1, 2), "a half"),
    ("-0;30", F(-1, 2), "a sign"),
    ("\u22121,0", F(-60), "the minus sign U+2212"),
    ("+1,0", F(60), "an explicit plus"),
    ("1,0,0", F(3600), "zero places"),
    ("59", F(59), "one place at its largest"),
    ("0", F(0), "zero"),
    ("05;06", F(5) + F(6, 60), "a leading zero within a place"),
    ("1, 49, 45; 20", F(19756, 3), "spaces after separators"),
    ("6585", F(6585), "a lone whole number in decimal (common practice)"),
    ("60", F(60), "a lone whole number may reach 60"),
    ("365;14,48", F(365) + F(37, 150), "a lone whole place in decimal before a fraction"),
    ("1,<0>,30", F(3630), "an editor's addition counts"),
    ("1,{5},30", F(90), "a superfluous place does not count"),
]


def test_no_input_repeats():
    inputs = [t for t, _, _ in UNDAMAGED] + [t for t, _, _, _, _ in DAMAGED]
    assert len(inputs) == len(set(inputs))


@pytest.mark.parametrize("text,value,note", UNDAMAGED)
def test_undamaged_values(text, value, note):
    reading = read(text)
    assert reading.value == value
    assert reading.min == reading.max == value
    assert reading.count == 1


# (input, min, max, number of readings, value as the edition gives it)
DAMAGED = [
    ("29;31,5[x],8,20", F(765433, 25920), F(765433, 25920) + F(9, 3600), 10, F(765433, 25920)),
    ("2[x];30", F(41, 2), F(59, 2), 10, F(41, 2)),
    ("1,[x],45;20", F(3600 + 45) + F(1, 3), F(3600 + 59 * 60 + 45) + F(1, 3), 60, F(3645) + F(1, 3)),
    ("3[x]", F(30), F(39), 10, F(30)),
    ("[x]5", F(5), F(55), 6, F(5)),
    ("[1]5", F(5), F(55), 6, F(15)),
    ("[5]", F(0), F(59), 60, F(5)),
    ("x,30", F(30), F(59 * 60 + 30), 60, F(30)),
    ("x5", F(5), F(55), 6, F(5)),
    ("[1,49],45;20", F(45) + F(1, 3), F(59 * 3600 + 59 * 60 + 45) + F(1, 3), 3600, F(19756, 3)),
    ("5?,3", F(303), F(303), 1, F(303)),
    ("5\u0323,3", F(303), F(303), 1, F(303)),
    ("-2[x]", F(-29), F(-20), 10, F(-20)),
]


@pytest.mark.parametrize("text,lo,hi,count,value", DAMAGED)
def test_damaged_ranges(text, lo, hi, count, value):
    reading = read(text)
    assert reading.damaged
    assert (reading.min, reading.max, reading.count, reading.value) == (lo, hi, count, value)
    values = list(reading.readings())
    assert len(values) == count
    assert min(values) == lo and max(values) == hi


def test_gap_of_unknown_places_is_bounded_and_counted():
    reading = read("[...],45;20")
    # One to three lost places before 45;20 (numcheck.limits.GAP_MAX_PLACES).
    assert reading.count == 60 + 60**2 + 60**3
    assert reading.min == F(136, 3)
    assert reading.max == F(59 * 60**3 + 59 * 60**2 + 59 * 60 + 45) + F(1, 3)
    assert sorted({len(r.slots) for r in reading.expansions()}) == [3, 4, 5]


def test_gap_in_the_middle_shifts_the_places_to_its_left():
    reading = read("1,[...],0")
    lows = sorted(r._bounds_gapless()[0] for r in reading.expansions())
    assert lows == [F(3600), F(60**3), F(60**4)]


def test_gap_in_the_fraction_shifts_the_places_to_its_right():
    reading = read("0;[...],30")
    lows = sorted(r._bounds_gapless()[0] for r in reading.expansions())
    assert lows == [F(30, 60**4), F(30, 60**3), F(30, 60**2)]


@pytest.mark.parametrize("text,status", [
    ("29", Status.READ), ("2?", Status.DOUBTFUL), ("x", Status.UNREAD), ("[x]", Status.LOST),
    ("[2]", Status.RESTORED), ("<2>", Status.ADDED), ("3[x]", Status.LOST), ("[1]5", Status.RESTORED),
])
def test_status_of_a_place(text, status):
    assert read(text).slots[0].status is status


def test_superfluous_place_is_kept_but_not_counted():
    reading = read("1,{5},30")
    assert [s.status for s in reading.slots] == [Status.READ, Status.SUPERFLUOUS, Status.READ]
    assert not reading.damaged


# Bad inputs and the column (1-based) the error must point at.
BAD = [
    ("29;61,3", 4, NumcheckRangeError),
    ("1,,2", 3, NumcheckSyntaxError),
    ("29;;31", 4, NumcheckSyntaxError),
    ("[x", 1, NumcheckSyntaxError),
    ("3;4]", 4, NumcheckSyntaxError),
    ("", 1, NumcheckSyntaxError),
    ("1,\x07", 3, NumcheckSyntaxError),
    ("1,2,", 5, NumcheckSyntaxError),
    ("6[x]", 1, NumcheckRangeError),
    ("1,123", 3, NumcheckRangeError),
    ("[[1]]", 2, NumcheckSyntaxError),
    ("?5", 1, NumcheckSyntaxError),
    ("1[...]", 2, NumcheckSyntaxError),
]


@pytest.mark.parametrize("text,column,kind", BAD)
def test_bad_input_points_at_the_column(text, column, kind):
    with pytest.raises(kind) as info:
        read(text)
    err = info.value
    assert err.column == column
    assert "^" in str(err) or text == ""


@pytest.mark.parametrize("text,column,label", BAD_EXAMPLES)
def test_known_bad_examples_table(text, column, label):
    with pytest.raises(NumcheckSyntaxError) as info:
        read(text)
    assert info.value.column == column
    assert label in str(info.value)


def test_place_of_60_names_the_place():
    with pytest.raises(NumcheckRangeError, match="'61'"):
        read("29;61,3")


def test_long_input_answers_quickly():
    # 400,000 characters: a clear limit error, not a hang (numcheck.limits).
    with pytest.raises(NumcheckError, match="limit"):
        read("1," * 200_000)


# -- round trips ----------------------------------------------------------

places = st.integers(min_value=0, max_value=59)


@st.composite
def canonical_texts(draw):
    whole = draw(st.lists(places, min_size=1, max_size=5))
    frac = draw(st.lists(places, min_size=0, max_size=6))
    sign = draw(st.sampled_from(["", "-"]))
    if whole[0] == 0 and len(whole) > 1:
        whole[0] = draw(st.integers(1, 59))
    text = sign + ",".join(map(str, whole))
    if frac:
        text += ";" + ",".join(map(str, frac))
    return text


@given(canonical_texts())
def test_round_trip_text(text):
    assert format_reading(read(text)) == text


@given(st.fractions(min_value=-(60**4), max_value=60**4, max_denominator=60**6))
def test_round_trip_value(value):
    # Values whose denominator divides a power of 60 end within 12 places.
    value = F(round(value * 60**6), 60**6)
    text = sexagesimal_text(value)
    assert read(text).value == value


@st.composite
def damaged_texts(draw):
    marks = ["{d}", "[x]", "x", "[{d}]", "{t}[x]", "[x]{u}", "{d}?", "<{d}>"]
    n = draw(st.integers(1, 5))
    parts = []
    for _ in range(n):
        mark = draw(st.sampled_from(marks))
        parts.append(mark.format(d=draw(places), t=draw(st.integers(0, 5)), u=draw(st.integers(0, 9))))
    split = draw(st.integers(1, n))
    text = ",".join(parts[:split])
    if split < n:
        text += ";" + ",".join(parts[split:])
    return text


@given(damaged_texts())
def test_damaged_round_trip_and_bounds(text):
    reading = read(text)
    again = read(format_reading(reading))
    assert again.slots == reading.slots or [s.values for s in again.slots] == [s.values for s in reading.slots]
    assert (again.min, again.max, again.count) == (reading.min, reading.max, reading.count)
    assert reading.min <= reading.value <= reading.max


@given(st.text(max_size=30))
def test_any_text_gives_a_reading_or_our_error(text):
    try:
        read(text)
    except NumcheckError:
        pass
