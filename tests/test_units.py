"""Units: exact conversions, conventions, zodiac.

Values checked against published definitions, named beside each case.
"""

from fractions import Fraction

import pytest

from numcheck.errors import NumcheckError, UnknownNameError
from numcheck.units import (
    CONVENTIONS,
    UNITS,
    ZODIAC,
    IncompatibleUnitsError,
    canonical_unit,
    convert,
    sign_longitude,
    zodiac_index,
)

MONTH = Fraction(29) + Fraction(31, 60) + Fraction(50, 60**2) + Fraction(8, 60**3) + Fraction(20, 60**4)

CASES = [
    # value, from, to, convention, expected, convention reported, note
    (1, "days", "UŠ", None, 360, None, "CDLI 'Akkadian astronomy': 1 day = 6,0 UŠ"),
    (1, "bēru", "UŠ", None, 30, None, "CDLI: 1 bēru = 30 UŠ"),
    (1, "beru", "hours", None, 2, None, "CDLI: 1 bēru = 2 hours"),
    (1, "UŠ", "minutes", None, 4, None, "CDLI: 1 UŠ = 4 minutes"),
    (1, "cubits", "fingers", None, 24, None, "CDLI: cubit = 24 fingers (Late Babylonian)"),
    (1, "degrees", "fingers", None, 12, None, "CDLI: 1 degree = 12 fingers"),
    (1, "cubits", "fingers", "cubit-2.5", 30, "cubit-2.5", "cubit of 2 1/2 degrees (from memory)"),
    (3, "signs", "degrees", None, 90, None, "common practice: 30 degrees per sign"),
    (1, "hours", "ḥalaqim", None, 1080, None, "Maimonides, Qiddush ha-Hodesh 6: 1080 parts per hour"),
    (1, "months", "tithis", None, 30, None, "Surya-siddhanta I: 30 tithis per month"),
    (1, "months", "days", None, MONTH, "babylonian (default month)", "ACT System B month 29;31,50,8,20 d"),
    (223, "months", "days", "hipparchus", 223 * MONTH, "hipparchus", "Almagest IV.3 month"),
    (1, "years", "days", "egyptian", 365, "egyptian", "Almagest III.7: Egyptian year 365 d"),
    (1, "years", "days", None, Fraction(1461, 4), "julian (default year)", "Julian year 365 1/4 d"),
    (1, "years", "days", "hipparchus", Fraction(365) + Fraction(14, 60) + Fraction(48, 3600), "hipparchus",
     "Almagest III.1: 365;14,48 d"),
    (1, "years", "months", "babylonian-A", Fraction(2783, 225), "babylonian-A", "ACT System A: 12;22,8 months"),
    (1, "years", "months", "babylonian-B", Fraction(10019, 810), "babylonian-B",
     "ACT System B: 12;22,8,53,20 months"),
    (19, "years", "months", "metonic", 235, "metonic", "Geminus 8: 19 years = 235 months"),
    (76, "years", "days", "callippic", 27759, "callippic", "Geminus 8.59-60: 76 years = 27759 days"),
    (360, "months", "days", "islamic", 10631, "islamic", "Doggett 1992: 360 months = 10631 days"),
    (400, "years", "days", "gregorian", 146097, "gregorian", "Inter gravissimas: 400 y = 146097 d"),
]


def test_cases_distinct():
    keys = [c[:4] for c in CASES]
    assert len(keys) == len(set(keys))


@pytest.mark.parametrize("value,src,dst,conv,expected,reported,note", CASES)
def test_convert(value, src, dst, conv, expected, reported, note):
    out = convert(Fraction(value), src, dst, conv)
    assert out.value == Fraction(expected), note
    assert out.convention == reported
    assert out.unit == canonical_unit(dst)


def test_round_trip_is_exact():
    for conv in ("babylonian", "metonic", "surya-siddhanta"):
        there = convert(Fraction(6585, 1), "days", "months", conv)
        assert convert(there.value, "months", "days", conv).value == 6585


def test_months_default_is_babylonian_month_exactly():
    assert convert(1, "months", "days").value == Fraction(765433, 25920)


@pytest.mark.parametrize("spelling,name", [
    ("us", "UŠ"), ("ush", "UŠ"), ("UŠ", "UŠ"), ("beru", "bēru"), ("Bēru", "bēru"),
    ("°", "degrees"), ("deg", "degrees"), ("day", "days"), ("d", "days"), ("tithi", "tithis"),
    ("finger", "fingers"), ("cubit", "cubits"), ("sign", "signs"), ("time-degree", "UŠ"),
])
def test_canonical_unit(spelling, name):
    assert canonical_unit(spelling) == name


def test_unknown_unit_suggests():
    with pytest.raises(UnknownNameError) as err:
        canonical_unit("dayz")
    assert "days" in str(err.value) and "Did you mean" in str(err.value)


def test_incompatible_dimensions():
    with pytest.raises(IncompatibleUnitsError):
        convert(1, "days", "degrees")
    assert issubclass(IncompatibleUnitsError, NumcheckError)


def test_convention_without_the_needed_period():
    with pytest.raises(NumcheckError, match="fixes no month"):
        convert(1, "months", "days", "egyptian")
    with pytest.raises(UnknownNameError):
        convert(1, "months", "days", "martian")


def test_every_unit_and_convention_has_a_source():
    assert all(u.source for u in UNITS.values())
    assert all(c.source for c in CONVENTIONS.values())


def test_zodiac():
    assert len(ZODIAC) == 12 and ZODIAC[0] == "Aries" and ZODIAC[11] == "Pisces"
    # Unicode: the twelve signs are U+2648 ARIES .. U+2653 PISCES
    import unicodedata
    for i, name in enumerate(ZODIAC):
        symbol = chr(0x2648 + i)
        # Unicode names Scorpio "SCORPIUS"
        assert unicodedata.name(symbol) == {"Scorpio": "SCORPIUS"}.get(name, name.upper())
        assert zodiac_index(symbol) == i
        assert zodiac_index(name.lower()) == i
    assert zodiac_index("Capricornus") == 9
    with pytest.raises(UnknownNameError, match="Did you mean"):
        zodiac_index("Tauros")


def test_sign_longitude():
    assert sign_longitude(Fraction(25, 2), "Taurus") == Fraction(85, 2)  # 12;30 Taurus = 42;30 deg
    with pytest.raises(NumcheckError):
        sign_longitude(30, "Aries")


def test_doctests():
    import doctest

    import numcheck.units

    assert doctest.testmod(numcheck.units).failed == 0


def test_every_unit_and_sign_name_holds_a_character_the_quick_test_looks_for():
    """units.may_name_a_unit passes over a text without one of these (ρκ[.] has none): no
    name may be spelled with full stops and hyphens alone."""
    from numcheck import units

    for key in (*units._LOOKUP, *units._ZODIAC_LOOKUP):
        assert not units._NAME_KEYS.isdisjoint(units._fold(key)), key
    assert not units.may_name_a_unit("ρκ[.]") and not units.may_name_a_unit("[..]-ιβ")
    assert units.may_name_a_unit("12 d.") and units.may_name_a_unit("κ° λʹ")
