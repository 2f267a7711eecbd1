"""Hebrew letter numerals against published values.

- Maimonides, Mishneh Torah, Hilkhot Qiddush ha-Hodesh 6.3 (from memory for the
  section): the month of the molad is 29 days 12 hours and 793 parts (תשצג).
- The Hebrew year of a civil date, as convertdate's hebrew calendar computes
  it, written in letters with thousands before a geresh (common practice:
  5783 = ה׳תשפ״ג, the year that began in September 2022).
"""

import warnings

import pytest
from convertdate import hebrew as cd_hebrew

from numcheck import read


def test_the_parts_of_the_molad():
    assert read("תשצג").value == 793
    # 29 d 12 h 793/1080 h is the month of the catalogue (hebrew_molad).
    from fractions import Fraction
    assert 29 + Fraction(12, 24) + Fraction(793, 1080 * 24) == read("29;31,50,8,20").value


@pytest.mark.parametrize("gregorian,written", [((2022, 10, 1), "ה׳תשפ״ג"), ((2000, 1, 1), "ה׳תש״ס"),
                                               ((1240, 10, 1), "ה׳א"), ((1300, 1, 1), "ה׳ס")])
def test_years_agree_with_convertdate(gregorian, written):
    with warnings.catch_warnings():
        # convertdate 2.5 warns about its own month_days inside from_gregorian.
        warnings.simplefilter("ignore", DeprecationWarning)
        year, _, _ = cd_hebrew.from_gregorian(*gregorian)
    assert read(written).value == year
