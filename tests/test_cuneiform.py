"""The cuneiform notation: floating place value, digits and Unicode signs, damage, errors."""

import unicodedata
from fractions import Fraction as F

import pytest
from hypothesis import given
from hypothesis import strategies as st

from numcheck import NumcheckError, Status, read
from numcheck.notations import format_reading, render_choice
from numcheck.notations.cuneiform import BAD_EXAMPLES, parse, sign_table

# (input, value at integer scale, floating, note).  Place values are common
# practice (Neugebauer's notation, conventions.md §4.1, §4.3); the sign values
# are the Unicode names' counts in their place (numcheck/data/cuneiform_signs.csv).
UNDAMAGED = [
    ("1,40", F(100), True, "comma between places"),
    ("1 40", F(100), True, "space between places"),
    ("44,26,40", F(44 * 3600 + 26 * 60 + 40), True, "three places (a reciprocal pair of 1,21)"),
    ("1;40", F(5, 3), False, "';' asserts the magnitude"),
    ("1 40;30", F(100) + F(1, 2), False, "spaces and ';'"),
    ("𒐏𒐉", F(44), True, "FOUR U FOUR DISH: one place, 40 + 4"),
    ("𒐏𒐉 𒌋", F(44 * 60 + 10), True, "two places of signs"),
    ("𒁹 𒐏", F(100), True, "1,40 in signs"),
    ("𒌋𒈫", F(12), True, "U and MIN"),
    ("𒐐𒐎", F(59), True, "the largest place: FIVE U NINE DISH"),
    ("𒁹 𒑱 𒌋", F(3610), True, "the vertical colon as an empty place"),
    ("𒐏𒐉 ; 𒌋", F(44) + F(1, 6), False, "signs with ';'"),
    ("𒁹𒁹", F(2), True, "two DISH signs in one place add"),
]


def test_no_input_repeats():
    inputs = [t for t, *_ in UNDAMAGED] + [t for t, *_ in DAMAGED]
    assert len(inputs) == len(set(inputs))


@pytest.mark.parametrize("text,value,floating,note", UNDAMAGED)
def test_undamaged(text, value, floating, note):
    reading = read(text, notation="cuneiform")
    assert reading.value == value
    assert reading.floating is floating
    assert reading.count == 1
    assert reading.notation == "cuneiform"


def test_floating_value_is_at_integer_scale_and_scales_by_sixty():
    reading = read("1,40", notation="cuneiform")
    assert reading.last_place == 0
    assert reading.scaled(-1) == F(5, 3)      # 1;40
    assert reading.scaled(1) == F(6000)       # 1,40,0


# (input, min, max, number of readings, value as the edition gives it, status of the damaged slot)
DAMAGED = [
    ("1 x 40", F(3640), F(3600 + 59 * 60 + 40), 60, F(3640), Status.UNREAD),
    ("1 n 40", F(3640), F(3600 + 59 * 60 + 40), 60, F(3640), Status.UNREAD),
    ("1,[x]", F(60), F(119), 60, F(60), Status.LOST),
    ("1 [2]5", F(65), F(115), 6, F(85), Status.RESTORED),
    ("1 3[x]", F(90), F(99), 10, F(90), Status.LOST),
    ("5? 3", F(303), F(303), 1, F(303), Status.DOUBTFUL),
    ("𒌋[x]", F(10), F(19), 10, F(10), Status.LOST),
    ("x𒐉", F(4), F(54), 6, F(4), Status.UNREAD),
    ("[𒌋]𒐉", F(4), F(54), 6, F(14), Status.RESTORED),
    ("𒌋?𒐉", F(14), F(14), 1, F(14), Status.DOUBTFUL),
    ("𒁹 [x]", F(60), F(119), 60, F(60), Status.LOST),
    ("𒁹 n", F(60), F(119), 60, F(60), Status.UNREAD),
    ("𒁹 x", F(60), F(119), 60, F(60), Status.UNREAD),
]


@pytest.mark.parametrize("text,lo,hi,count,value,status", DAMAGED)
def test_every_damage_mark(text, lo, hi, count, value, status):
    reading = read(text, notation="cuneiform")
    assert reading.floating
    assert (reading.min, reading.max, reading.count, reading.value) == (lo, hi, count, value)
    assert status in {s.status for s in reading.slots}
    assert sorted(reading.readings())[0] == lo


def test_gap_of_unknown_places():
    reading = read("[...] 𒌋", notation="cuneiform")
    assert reading.has_gap
    assert reading.count == 60 + 60**2 + 60**3
    assert format_reading(reading) == "[...] 𒌋"


def test_added_and_superfluous_places():
    assert read("1 <0> 30", notation="cuneiform").value == F(3630)
    reading = read("𒁹 {𒁹} 𒌋", notation="cuneiform")
    assert reading.value == F(70)
    assert reading.slots[1].status is Status.SUPERFLUOUS
    assert format_reading(reading) == "𒁹 {𒁹} 𒌋"


@pytest.mark.parametrize("text,column,label", BAD_EXAMPLES)
def test_bad_input_points_at_the_column(text, column, label):
    with pytest.raises(NumcheckError) as info:
        read(text, notation="cuneiform")
    assert info.value.column == column
    if "place over 59" not in label and "two separators" not in label:
        assert label in str(info.value)


def test_error_names_the_sign_and_its_code_point():
    with pytest.raises(NumcheckError, match=r"ONE GESH2.*U\+12415"):
        read("𒐕", notation="cuneiform")


def test_sign_table_has_a_source_on_every_row_and_names_match_unicode():
    table = sign_table()
    assert len(table) >= 30
    for char, info in table.items():
        assert info.source
        assert unicodedata.name(char) == info.name
        assert 0 <= info.value <= 50


def test_nfc_and_nfd_read_the_same():
    for text in ("𒐏𒐉 𒌋", "1 [x]5", "1,40"):
        nfd = unicodedata.normalize("NFD", text)
        assert read(nfd, notation="cuneiform").to_dict() == read(text, notation="cuneiform").to_dict()


def test_render_writes_lost_signs_as_restorations():
    reading = read("𒌋[x]", notation="cuneiform")
    texts = [render_choice(r, c) for r, c in reading.choices()]
    assert texts[4] == "𒌋[𒐉]"
    assert read(texts[4], notation="cuneiform").value == F(14)
    reading = read("1 [x]5", notation="cuneiform")
    assert [render_choice(r, c) for r, c in reading.choices()][2] == "1 [2]5"


_TENS = {1: "𒌋", 2: "𒎙", 3: "𒌍", 4: "𒐏", 5: "𒐐"}
_UNITS = {1: "𒁹", 2: "𒈫", 3: "𒐈", 4: "𒐉", 5: "𒐊", 6: "𒐋", 7: "𒐌", 8: "𒐍", 9: "𒐎"}


def _signs(value: int) -> str:
    tens, units = divmod(value, 10)
    return (_TENS.get(tens, "") + _UNITS.get(units, "")) or "𒑱"


places = st.lists(st.integers(0, 59), min_size=1, max_size=5).filter(lambda p: p[0] != 0)


@given(places, st.sampled_from([",", " "]))
def test_round_trip_digits(digits, separator):
    text = separator.join(str(d) for d in digits)
    reading = read(text, notation="cuneiform")
    expected = 0
    for d in digits:
        expected = expected * 60 + d
    assert reading.value == expected and reading.floating
    assert format_reading(reading) == text


@given(places)
def test_round_trip_signs(digits):
    text = " ".join(_signs(d) for d in digits)
    reading = parse(text)
    expected = 0
    for d in digits:
        expected = expected * 60 + d
    assert reading.value == expected
    assert format_reading(reading) == text
    assert parse(format_reading(reading)) == reading
