"""Our cuneiform sign values checked against the Unicode Character Database.

Source: the Unicode Character Database as compiled into Python's
``unicodedata`` (its version is ``unicodedata.unidata_version``: 14.0.0 on
Python 3.11, 15.0.0 on 3.12, 15.1.0 on 3.13; conventions.md §3.6).

Why our value differs from ``unicodedata.numeric``: the database gives each
numeric sign of the Cuneiform Numbers and Punctuation block the *count of its
wedges* (FOUR U = 4, FOUR DISH = 4; ONE GESH2 = 1 although it means 60),
conventions.md §3.3.  A place-value reading needs the sign's *contribution to
its sexagesimal place*: a Winkelhaken (U) is ten units of the place, so FOUR
U is 40 there, and 𒐏𒐉 is 44, not 8.  The basic signs DISH (1), MIN (2), U
(10), U U (20) and U U U (30) live in the main Cuneiform block and have no
numeric value in the database at all.
"""

import unicodedata
from fractions import Fraction

import pytest

from numcheck import read
from numcheck.notations.cuneiform import sign_table

UCD = unicodedata.unidata_version

SIGNS = sorted(sign_table().values(), key=lambda s: ord(s.char))
IN_NUMBERS_BLOCK = [s for s in SIGNS if 0x12400 <= ord(s.char) <= 0x1247F and s.column != "zero"]


def test_the_database_version_is_named():
    assert UCD.count(".") == 2 and int(UCD.split(".")[0]) >= 14


@pytest.mark.parametrize("sign", [s for s in IN_NUMBERS_BLOCK if s.column == "units"],
                         ids=lambda s: s.name)
def test_units_signs_agree_with_the_database(sign):
    # A DISH sign's wedges are units: Unicode's value and ours agree.
    assert Fraction(unicodedata.numeric(sign.char)) == sign.value == sign.wedges


@pytest.mark.parametrize("sign", [s for s in IN_NUMBERS_BLOCK if s.column == "tens"
                                  and "ELAMITE" not in s.name], ids=lambda s: s.name)
def test_tens_signs_are_ten_times_the_database_wedge_count(sign):
    # FOUR U: Unicode 4 (wedges), our place contribution 40.
    assert Fraction(unicodedata.numeric(sign.char)) == sign.wedges
    assert sign.value == 10 * Fraction(unicodedata.numeric(sign.char))


@pytest.mark.parametrize("sign", [s for s in IN_NUMBERS_BLOCK if "ELAMITE" in s.name],
                         ids=lambda s: s.name)
def test_elamite_tens_carry_their_value_in_the_database(sign):
    # ELAMITE FORTY / FIFTY: the database already gives 40 / 50 (conventions.md §3.3).
    assert Fraction(unicodedata.numeric(sign.char)) == sign.value


@pytest.mark.parametrize("sign", [s for s in SIGNS if not 0x12400 <= ord(s.char) <= 0x1247F],
                         ids=lambda s: s.name)
def test_main_block_signs_have_no_database_value(sign):
    assert unicodedata.numeric(sign.char, None) is None
    assert sign.value in (1, 2, 10, 20, 30)


def test_the_empty_place_sign_has_no_database_value():
    assert unicodedata.name("\U00012471") == "CUNEIFORM PUNCTUATION SIGN VERTICAL COLON"
    assert unicodedata.numeric("\U00012471", None) is None


def test_forty_four_is_not_the_wedge_sum():
    text = "\U0001240F\U00012409"
    assert [unicodedata.name(c) for c in text] == ["CUNEIFORM NUMERIC SIGN FOUR U",
                                                    "CUNEIFORM NUMERIC SIGN FOUR DISH"]
    wedges = sum(unicodedata.numeric(c) for c in text)
    assert wedges == 8
    assert read(text, notation="cuneiform").value == 44


def test_metrological_signs_are_refused_not_misread():
    # ONE GESH2 (60 in the metrological systems) has database value 1; reading
    # it as a place digit would silently be wrong, so it is an error.
    from numcheck import NumcheckError

    assert unicodedata.numeric("\U00012415") == 1
    with pytest.raises(NumcheckError, match="metrological"):
        read("\U00012415", notation="cuneiform")
