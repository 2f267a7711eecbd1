"""Confusion data and the alternatives offered to restore and audit.

The facts come from the reference notes numeral-confusions.csv and
schemes-and-slips.md §2 (sources on each row of numcheck/data/confusions.csv);
the expected values below are computed by hand from the letter values (Heath,
A History of Greek Mathematics I p. 36; Hogendijk & de Graaf's abjad handout
for 1-300, larger abjad values from memory) and the wedge counts of a
cuneiform digit (common practice).
"""

import csv
from fractions import Fraction
from importlib import resources

import pytest
from hypothesis import given
from hypothesis import strategies as st

from numcheck.slips.confusions import Alternative, alternatives, confusion_table, letter_confusion
from numcheck.errors import NumcheckError

F = Fraction


def _values(notation, value, **kw):
    return {a.value for a in alternatives(notation, value, **kw)}


def test_every_row_has_a_source_and_a_confidence():
    text = resources.files("numcheck").joinpath("data/confusions.csv").read_text(encoding="utf-8")
    rows = list(csv.DictReader(text.splitlines()))
    assert len(rows) == len(confusion_table()) > 50
    for row in rows:
        assert row["source"].strip(), row
        assert row["confidence"] in {"high", "medium-high", "medium", "low-medium", "low"}, row
        assert 0 < float(row["weight"]) <= 1


def test_remembered_facts_stay_marked():
    # The minuscule pairs and the Maghribi values are from memory in the reference notes.
    for row in confusion_table():
        if row.script == "Greek minuscule" or row.notation == "abjad-maghribi":
            assert "from memory" in row.source, row


def test_no_row_repeats():
    keys = [(r.notation, r.written, r.confused_with, r.rule) for r in confusion_table()]
    assert len(keys) == len(set(keys))


@pytest.mark.parametrize("notation, value, place_max, expected, note", [
    ("cuneiform", 21, 59, {22, 20, 31, 11}, "±1 unit wedge, ±1 ten-corner (common practice)"),
    ("cuneiform", 59, 59, {58, 49, 57}, "no 10th unit wedge, no 6th ten-corner; 9 and 7 alike (common practice, no source)"),
    ("sexagesimal", 0, 59, {1, 10}, "an empty place gains a wedge"),
    ("sexagesimal", 44, 59, {45, 43, 54, 34}, "4 and 5, 40 and 50 alike (common practice, no source)"),
    ("greek", 5, 59, {9}, "Є/Θ (Grasshoff 1990 via jonvoisey.net); 70 and 200 above the limit"),
    ("greek", 31, None, {34}, "λα: α for δ keeps the order; α for λ would give λλ"),
    ("greek", 70, 59, {0, 5, 9}, "ο and the zero sign; ο and Є, Θ"),
    ("greek", F(1, 3), None, {3}, "γʹ lost its tick (Grasshoff 1990 via jonvoisey.net)"),
    ("abjad", 52, None, {12, 402, 502}, "نب: ن for ي, ت, ث (same tooth)"),
    ("abjad", 3, 59, {8}, "ج ح (HAH group)"),
    ("abjad", 7, None, {200}, "ز ر (REH group)"),
    ("abjad-maghribi", 60, None, {90}, "Maghribi ص 60, ض 90 (from memory)"),
    ("roman", 7, None, {6, 8, 4}, "vii: one minim more or fewer, u for ii"),
    ("roman", 4, None, {6}, "iu / ui"),
    ("decimal", 1274, None, {7274, 1214, 1275}, "4/5 and 7/1 (jonvoisey.net 2024)"),
])
def test_alternatives(notation, value, place_max, expected, note):
    assert _values(notation, value, place_max=place_max) == {F(v) for v in expected}, note


def test_sexagesimal_alternatives_work_in_any_place():
    # 29;31 (as 1771/60): the 31 minutes may be 32, 30, 41, 21; the 29 units 28, 39, 19.
    got = _values("sexagesimal", F(1771, 60))
    for minutes in (32, 30, 41, 21):
        assert F(29) + F(minutes, 60) in got
    for units in (28, 39, 19):
        assert F(units) + F(31, 60) in got


def test_alternatives_are_sorted_and_exact():
    alts = alternatives("greek", 5)
    assert all(isinstance(a, Alternative) and isinstance(a.value, Fraction) for a in alts)
    assert [a.weight for a in alts] == sorted((a.weight for a in alts), reverse=True)
    assert alts[0].value == 9 and "epsilon" in alts[0].reason


def test_unit_fraction_tick_only_in_the_units_place():
    assert F(3) in _values("greek", F(1, 3), place=0)
    assert F(3) not in _values("greek", F(1, 3), place=-1)


def test_thousands_sign_only_on_units_letters():
    # ͵αχο = 1670: α (thousands) for δ gives 4670; for λ it would need ͵λ, not a numeral.
    got = _values("greek", 1670)
    assert F(4670) in got
    assert F(30670) not in got


def test_letter_confusion_for_audits():
    alt = letter_confusion("abjad", 2, 10)
    assert alt is not None and alt.value == 10 and "dots" in alt.reason
    assert letter_confusion("greek", 9, 5).value == 5
    assert letter_confusion("greek", 5, 6) is None
    assert letter_confusion("cuneiform", 21, 22).reason.startswith("one unit wedge more")


def test_unknown_notation_is_a_numcheck_error():
    with pytest.raises(NumcheckError, match="Did you mean 'greek'"):
        alternatives("greeek", 5)


def test_notations_without_data_give_no_alternatives():
    assert alternatives("attic", 5) == []
    assert _values("greek-ascending", 5, place_max=59) == {F(9)}   # the Greek letter data


@given(st.sampled_from(["cuneiform", "sexagesimal", "greek", "abjad", "abjad-maghribi", "roman", "decimal"]),
       st.integers(0, 3000), st.sampled_from([None, 59, 359]))
def test_alternatives_stay_in_range_and_differ(notation, value, place_max):
    for alt in alternatives(notation, value, place_max=place_max):
        assert alt.value != value and alt.value >= 0
        assert place_max is None or alt.value <= place_max
        assert 0 < alt.weight <= 1 and alt.reason


@given(st.integers(0, 59))
def test_wedge_slips_are_symmetric(value):
    # One wedge more from v is one wedge fewer from v + 1 (common practice).
    for alt in alternatives("cuneiform", value, place_max=59):
        assert letter_confusion("cuneiform", alt.value, value) is not None
