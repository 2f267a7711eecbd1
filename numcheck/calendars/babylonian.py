"""The Babylonian lunisolar calendar counted in the Seleucid Era, schematically.

Years begin with Nisannu in spring; the Seleucid Era counts from Nisannu 1 of
311 BC (R. A. Parker and W. H. Dubberstein, Babylonian Chronology 626 B.C.-A.D.
75, 1956; epoch from memory).  From the fourth century BC the Babylonians
intercalated by a fixed 19-year cycle: a second Addaru (month 13 here) in
seven years of the cycle save one, which has a second Ululu (month 14).  In
Seleucid years the scheme is: Addaru II when SE mod 19 is 0, 3, 8, 11, 14 or
16; Ululu II when SE mod 19 is 6 (from memory, after Parker & Dubberstein;
it is the same pattern as the later Hebrew leap years, which tests check).

**The month beginnings are schematic.**  A real Babylonian month began on the
evening the new crescent was first seen, so it had 29 or 30 days as the sky
allowed.  Here month *n* after the epoch begins at the epoch plus *n* mean
synodic months of 29;31,50,8,20 days (rounded to the day), which agrees with
the observed beginnings to within a day or two; for a true date use the
tables of Parker & Dubberstein or the texts themselves.
"""

from __future__ import annotations

from fractions import Fraction

from .julian import range_error
from .names import Era, months

__all__ = ["intercalary_month", "months_before", "babylonian_to_jdn", "jdn_to_babylonian",
           "ADDARU_II", "ULULU_II", "MEAN_MONTH", "NOTE"]

#: Month numbers of the intercalary months.
ADDARU_II = 13
ULULU_II = 14
#: The mean synodic month of System B (ACT), 29;31,50,8,20 days.
MEAN_MONTH = Fraction(29) + Fraction(31, 60) + Fraction(50, 3600) + Fraction(8, 60 ** 3) + Fraction(20, 60 ** 4)
_ADDARU_YEARS = frozenset({0, 3, 8, 11, 14, 16})
_ULULU_YEARS = frozenset({6})

#: What the result of a Seleucid date means (shown with the interval).
NOTE = ("Babylonian month beginnings are schematic here (mean months from the epoch, with the "
        "19-year intercalation scheme); the real months began with the sighting of the crescent, "
        "so a date may be off by a day or two.")


def intercalary_month(year: int) -> int | None:
    """The intercalary month of Seleucid *year* (13 Addaru II, 14 Ululu II), or None.

    >>> [intercalary_month(y) for y in (3, 6, 7)]
    [13, 14, None]
    """
    r = year % 19
    if r in _ADDARU_YEARS:
        return ADDARU_II
    if r in _ULULU_YEARS:
        return ULULU_II
    return None


def _months_of(year: int) -> list[int]:
    """The months of *year* in the order they fall."""
    extra = intercalary_month(year)
    order = [1, 2, 3, 4, 5, 6] + ([ULULU_II] if extra == ULULU_II else []) + [7, 8, 9, 10, 11, 12]
    return order + ([ADDARU_II] if extra == ADDARU_II else [])


def months_before(year: int) -> int:
    """Months from Nisannu 1 of SE 1 to Nisannu 1 of SE *year* (any integer year)."""
    whole, rest = divmod(year - 1, 19)
    count = 235 * whole
    first = 1 + 19 * whole
    for y in range(first, first + rest):
        count += 13 if intercalary_month(y) else 12
    return count


def _start(era: Era, n: int) -> int:
    """JDN of the first day of month *n* after the epoch (schematic)."""
    return era.epoch_jdn + int((n * MEAN_MONTH + Fraction(1, 2)) // 1)


def babylonian_to_jdn(era: Era, year: int, month: int, day: int) -> int:
    """The JDN of a date of the Seleucid Era (schematic month beginnings).

    >>> from numcheck.calendars.names import era_named
    >>> babylonian_to_jdn(era_named("Seleucid"), 1, 1, 1)
    1607923
    """
    if year < 1:
        raise range_error(f"Year {year} of the Seleucid Era is before the era began.", "year",
                          value=year, legal="years 1 and later (SE 1 Nisannu 1 = 311 BC Apr 3)")
    order = _months_of(year)
    if month not in order:
        legal = ("months 1 to 12 (Nisannu to Addaru)" +
                 {ADDARU_II: " and 13 (Addaru II)", ULULU_II: " and 14 (Ululu II)"}.get(
                     intercalary_month(year), "; no intercalary month this year"))
        raise range_error(f"Month {month} does not exist in SE {year}.", "month", value=month, legal=legal)
    n = months_before(year) + order.index(month)
    length = _start(era, n + 1) - _start(era, n)
    if not 1 <= day <= 30 or day > length:
        name = months("babylonian")[month - 1].name
        raise range_error(f"Day {day} of {name} SE {year} does not exist in the schematic calendar.",
                          "day", value=day, legal=f"days 1 to {length} (schematic; 29 or 30 by observation)")
    return _start(era, n) + day - 1


def jdn_to_babylonian(jdn: int, era: Era) -> tuple[int, int, int]:
    """The (year, month, day) SE of a JDN (schematic month beginnings)."""
    n = int((jdn - era.epoch_jdn) / MEAN_MONTH)
    while _start(era, n + 1) <= jdn:
        n += 1
    while _start(era, n) > jdn:
        n -= 1
    year = n * 19 // 235 + 1
    while months_before(year + 1) <= n:
        year += 1
    while months_before(year) > n:
        year -= 1
    month = _months_of(year)[n - months_before(year)]
    return year, month, jdn - _start(era, n) + 1
