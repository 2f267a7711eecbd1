"""The ATF notation: both styles, the marks, the errors, writing back in the same style.

Values follow the ATF conventions (Oracc/CDLI numbers.xdf and math.xdf: a
count times its sign's value; places of the mathematical style 0-59);
outside checks with their sources are in tests/test_against_atf_documentation.py.
"""

from fractions import Fraction as F

import pytest
from hypothesis import given
from hypothesis import strategies as st

from numcheck import NumcheckError, Status, read
from numcheck.notations import format_reading, render_choice
from numcheck.notations.atf import BAD_EXAMPLES, parse, write_count, write_like, write_math, write_places

# (input, value, min, max, floating, note)
READINGS = [
    ("1(gesz2) 3(u) 7(disz)", F(97), F(97), F(97), False, "a count: 60 + 30 + 7"),
    ("2(u@c) 9(aš@c)", F(29), F(29), F(29), False, "curved forms, Unicode sign names"),
    ("1(u) la2 1(disz)", F(9), F(9), F(9), False, "ten less one"),
    ("igi-6(disz)-gal2", F(1, 6), F(1, 6), F(1, 6), False, "the reciprocal of 6"),
    ("1(disz) 1/2(disz)", F(3, 2), F(3, 2), F(3, 2), False, "a whole and a half"),
    ("n(disz)", F(1), F(1), F(9), False, "an unknown count is at least 1"),
    ("n+2(disz)", F(2), F(2), F(9), False, "at least two"),
    ("[1(u)] 9(disz)", F(19), F(19), F(59), False, "the tens restored"),
    ("1(u@c)#?", F(10), F(10), F(10), False, "damaged and uncertain, read"),
    ("4(ban2)# la2 1(asz@t)", F(39), F(39), F(39), False, "capacity: 40 sila3 less 1"),
    ("2(barig) 5(ban2)", F(170), F(170), F(170), False, "capacity: 2 x 60 + 5 x 10 sila3"),
    ("4(disz)-kam", F(4), F(4), F(4), False, "an ordinal suffix"),
    ("[x] la₂ 1(aš@c)", F(9), F(9), F(49), False, "unread tens less one"),
    ("<<3(disz)>>", F(0), F(0), F(0), False, "excised: not counted"),
    ("7(disz) 3(u)", F(450), F(450), F(450), True, "place value: 7,30 (cannot be a count)"),
    ("7(disz) 1(u) 5(disz)", F(435), F(435), F(435), True, "place value: 7,15"),
    ("1.40", F(100), F(100), F(100), True, "math style: two places"),
    ("03", F(3), F(3), F(3), True, "a leading zero"),
    ("9@v.00.33", F(9 * 3600 + 33), F(9 * 3600 + 33), F(9 * 3600 + 33), True, "a variant and a zero"),
    ("10.:6", F(606), F(606), F(606), True, "'.:' is no zero"),
    ("<oo>", F(0), F(0), F(0), True, "a zero supplied by the editor"),
    ("1 ME 43", F(143), F(143), F(143), False, "hundreds"),
    ("2 1/2", F(5, 2), F(5, 2), F(5, 2), False, "a whole and a fraction"),
    ("43.KAM₂", F(43), F(43), F(43), True, "a number glued to a logogram"),
    ("1.[40]", F(100), F(60), F(119), True, "a restored place"),
    ("2/3(disz) sila3 5(disz) gin2", F(45), F(45), F(45), False, "a quantity in the finest unit: gin2"),
    ("1(disz) gin2 la2 igi-6(disz)-gal2", F(5, 6), F(5, 6), F(5, 6), False, "a shekel less a sixth"),
    ("3(asz) sze gur", F(3), F(3), F(3), False, "barley counted in gur"),
    ("[5(disz) sila3] 3(disz) gin2", F(303), F(63), F(543), False, "a restored count of sila3"),
]


def test_no_input_repeats():
    inputs = [t for t, *_ in READINGS] + [t for t, *_ in BAD_EXAMPLES]
    assert len(inputs) == len(set(inputs))


@pytest.mark.parametrize("text,value,lo,hi,floating,note", READINGS)
def test_readings(text, value, lo, hi, floating, note):
    r = read(text, notation="atf")
    assert (r.value, r.min, r.max, r.floating) == (value, lo, hi, floating)


@pytest.mark.parametrize("text", [t for t, *_ in READINGS])
def test_written_back_as_it_came(text):
    written = format_reading(read(text, notation="atf"))
    # a unit word inside the brackets of its number is written after them
    assert written == text.replace("[5(disz) sila3]", "[5(disz)] sila3")


@pytest.mark.parametrize("text,column,label", BAD_EXAMPLES)
def test_bad_input_points_at_the_column(text, column, label):
    with pytest.raises(NumcheckError) as err:
        read(text, notation="atf")
    assert err.value.column == column
    assert label in str(err.value)


@pytest.mark.parametrize("text,status", [
    ("5(disz)#", Status.DOUBTFUL), ("5(disz)?", Status.DOUBTFUL), ("[5(disz)]", Status.RESTORED),
    ("<5(disz)>", Status.ADDED), ("<(5(disz))>", Status.ADDED), ("<<5(disz)>>", Status.SUPERFLUOUS),
    ("5(disz)*", Status.READ), ("5(disz)!", Status.READ), ("[n(disz)]", Status.LOST),
    ("n(disz)", Status.UNREAD), ("⸢5(disz)⸣", Status.DOUBTFUL), ("[(5(disz))]", Status.RESTORED),
])
def test_every_mark_maps_onto_a_status(text, status):
    (slot,) = parse(text).slots
    assert slot.status is status


def test_a_corrected_sign_keeps_the_editors_value_and_says_so():
    r = parse("3(disz)!")
    assert r.value == 3 and any("corrected" in w for w in r.warnings)


def test_brackets_may_open_before_the_number_in_a_line():
    from numcheck.notations.atf import parse_in_line
    state = {"lost": 0}
    r = parse_in_line("n(disz)]", state)
    assert r.slots[0].status is Status.LOST and state["lost"] is None


@pytest.mark.parametrize("text,unit", [
    ("2/3(disz) sila3 5(disz) gin2", "gin2"), ("3(asz) sze gur", "gur"), ("4(ban2) la2 1(asz@t) sila3", "sila3"),
])
def test_quantities_carry_their_unit(text, unit):
    assert read(text, notation="atf").unit == unit


def test_units_of_two_systems_or_a_number_without_unit_are_errors():
    with pytest.raises(NumcheckError, match="more than one system"):
        read("1(disz) sila3 2(disz) ma-na", notation="atf")
    with pytest.raises(NumcheckError, match="no unit word after it"):
        read("2/3(disz) sila3 5(disz)", notation="atf")
    with pytest.raises(NumcheckError, match="counted in sila3"):
        read("3(ban2) gur", notation="atf")


def test_atf_math_reads_disz_and_u_as_floating_places():
    r = read("3(u)", notation="atf-math")
    assert r.floating and r.value == 30 and r.scaled(-1) == F(1, 2)
    assert read("1(u) 5(disz)", notation="atf").floating is False


def test_only_disz_and_u_says_a_mathematical_text_would_float():
    assert any("floats" in w for w in parse("2(u) 4(disz)").warnings)


@pytest.mark.parametrize("text,value,expected", [
    ("2(u) 4(disz)", F(39), "3(u) 9(disz)"),
    ("2(u@c) 9(aš@c)", F(97), "1(geš₂@c) 3(u@c) 7(aš@c)"),
    ("1.40", F(150), "2.30"),
    ("7(disz) 3(u)", F(3, 4), "4(u) 5(disz)"),
    ("1 ME 43", F(5, 2), "2 1/2"),
])
def test_a_value_is_written_as_the_scribe_of_the_cell_writes(text, value, expected):
    assert write_like(parse(text), value) == expected
    assert read(expected, notation="atf").value == value or read(expected, notation="atf-math").floating


def test_restorations_are_written_in_brackets_in_the_same_style():
    r = parse("[1(u)] 9(disz)")
    values = {render_choice(r, (F(v), F(9))) for v in (10, 20)}
    assert values == {"[1(u)] 9(disz)", "[2(u)] 9(disz)"}
    m = parse("1.[40]")
    assert render_choice(m, (F(1), F(41))) == "1.[41]"


@given(st.integers(min_value=1, max_value=216000 * 9 - 1))
def test_counts_round_trip(n):
    text = write_count(F(n))
    assert parse(text).value == n
    assert format_reading(parse(text)) == text


@given(st.lists(st.integers(min_value=1, max_value=59), min_size=1, max_size=5))
def test_math_places_round_trip(places):
    value = 0
    for p in places:
        value = value * 60 + p
    text = write_math(F(value))
    r = parse(text)
    assert r.floating and r.value == value and format_reading(r) == text


@given(st.lists(st.integers(min_value=1, max_value=59), min_size=1, max_size=4))
def test_cdli_place_value_round_trip(places):
    value = 0
    for p in places:
        value = value * 60 + p
    text = write_places(F(value))
    assert read(text, notation="atf-math").value == value


def test_detection_of_both_styles():
    assert read("1(gesz2) 3(u) 7(disz)").notation == "atf"
    assert read("1.40").notation == "atf" and "mathematical" in read("1.40").detected
    assert read("1 ME 43").value == 143
    # a decimal point with one digit after it is not taken for ATF
    with pytest.raises(NumcheckError):
        read("29.5")


def test_unicode_counting_signs_read_as_a_count():
    r = read("\U00012415\U0001230D\U00012442", notation="atf")
    assert r.value == 97 and not r.floating


_ATF_CHARS = list("0123456789()[]<>#?!*.-+/ :nNxX@cvt~a") + [
    "disz", "u", "asz", "gesz2", "geš₂", "ban2", "la2", "igi", "gal2", "ME", "KAM₂", "...", "…",
    "oo", "00", "<<", ">>", "[(", ")]", "<(", ")>", "⸢", "⸣", "sila3", "1/2", "n+"]


@given(st.lists(st.sampled_from(_ATF_CHARS), max_size=14).map("".join))
def test_any_text_of_atf_pieces_reads_or_fails_with_our_error(text):
    try:
        r = parse(text)
    except NumcheckError:
        return
    assert r.min <= r.value <= r.max
    again = read(format_reading(r), notation=r.notation)
    assert (again.value, again.min, again.max) == (r.value, r.min, r.max), (text, format_reading(r))
