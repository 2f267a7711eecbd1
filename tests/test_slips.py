"""Slip signatures (schemes-and-slips.md §2.2): each class recognised from (written, expected)."""

from __future__ import annotations

from fractions import Fraction as F

import pytest

from numcheck.placevalue import digits_of, mantissa
from numcheck.slips import KINDS, classify, write_value

from tablegen import sx

CASES = [
    # (written, expected, keyword arguments, kind, note)
    ("29;32,20", "29;31,20", {}, "unit-slip", "one unit wedge more in the minutes"),
    ("29;21,20", "29;31,20", {}, "ten-slip", "one ten-corner fewer in the minutes"),
    ("29,31;20", "29;31,20", {}, "place-shift", "written one place high"),
    ("29;51,20", "29;31,20,20", {}, "merged-places", "31 and 20 merged"),
    ("29;30,1,20", "29;31,20", {}, "split-place", "31 split into 30 and 1"),
    ("29;2,40", "29;0,2,40", {}, "dropped-zero", "an internal empty place dropped"),
    ("29;0,0,2,40", "29;0,2,40", {}, "dropped-zero", "an empty place inserted"),
    ("58;4,40", "29;2,20", {}, "intermediate-value", "the double"),
    ("29;13,20", "29;31,20", {"neighbours": (sx("29;13,20"),)}, "copied-neighbour",
     "the line above copied"),
    ("1;7", "2;7", {"prev": sx("1;50")}, "carry", "1;50 + 0;17: the carry into the units dropped"),
    ("3;7", "2;7", {"prev": sx("1;50")}, "carry", "the carry added twice"),
    ("2;8", "2;7", {"prev": sx("1;50")}, "unit-slip", "no carry into the minutes: a wedge miscount"),
    ("44;10", "14;10", {"longitude": True}, "sign-error", "one sign too far"),
    ("2;0", "5;17", {}, "unexplained", "no signature fits"),
]


def test_no_case_repeats():
    keys = [(w, e, tuple(sorted(k))) for w, e, k, _, _ in CASES]
    assert len(keys) == len(set(keys))


@pytest.mark.parametrize("written, expected, kwargs, kind, note", CASES)
def test_signature(written, expected, kwargs, kind, note):
    assert kind in KINDS
    got = classify(sx(written), sx(expected), places=written.count(",") + 1 if ";" in written else 0,
                   **kwargs)
    assert got.kind == kind, (note, got)
    assert got.reason


def test_floating_digits_compare_without_magnitude():
    # 2,13,20 written 2,14,20 in a floating (cuneiform) table: one unit wedge.
    got = classify(F(2 * 3600 + 14 * 60 + 20), F(2 * 3600 + 13 * 60 + 20), floating=True)
    assert got.kind == "unit-slip"


def test_letter_confusion_greek():
    # Є (5) for Θ (9): a closed epsilon reads as theta (confusion data of numcheck.slips.confusions).
    got = classify(F(5), F(9), notation="greek")
    assert got.kind == "letter-confusion"


def test_a_scheme_diagnosis_wins():
    from numcheck.slips import Diagnosis
    special = Diagnosis("turning-point", "straight on past the maximum")
    assert classify(F(31), F(30), special=special) is special


@pytest.mark.parametrize("value, kwargs, text", [
    (sx("29;30"), {}, "29;30"),
    (sx("29;30"), {"places": 3}, "29;30,0,0"),
    (F(3375), {"floating": True}, "56,15"),
    (F(1, 60), {"floating": True}, "1"),
    (sx("206;10"), {"longitude": True}, "26;10 Libra"),
    (sx("206;10"), {"longitude": True, "sign_name": "Lib"}, "26;10 Lib"),
    (F(-1, 2), {}, "-0;30"),
])
def test_write_value(value, kwargs, text):
    assert write_value(value, **kwargs) == text


def test_helpers():
    assert mantissa(F(1, 81)) == F(44 * 3600 + 26 * 60 + 40)   # igi 1,21 = 44,26,40 (MCT)
    assert mantissa(F(1, 7)) is None                          # 7 is not regular
    assert digits_of(F(61, 2), 1) == ([30, 30], 1)
    assert digits_of(F(1, 7), 3) is None
