"""The fixed Hebrew calendar, in exact integers.

Years counted from the Creation (Anno Mundi); the year begins on Tishri 1,
set by the molad (mean conjunction) of Tishri in parts (1080 to the hour) and
the rules of postponement; 7 leap years (a second Adar) in every 19 (years
3, 6, 8, 11, 14, 17, 19 of the cycle).  Maimonides, Mishneh Torah, Hilkhot
Qiddush ha-Hodesh 6-8 (from memory); the arithmetic follows E. M. Reingold
and N. Dershowitz, Calendrical Calculations (from memory), and is checked
against convertdate.hebrew.  Months are numbered as convertdate numbers them:
Nisan 1 ... Elul 6, Tishri 7 ... Adar 12, Adar II 13.

The month of the molad is 29 days 12 hours 793 parts, the Babylonian and
Hipparchan 29;31,50,8,20 days (catalogue row hebrew_molad).
"""

from __future__ import annotations

import functools

from .julian import range_error
from .names import Era, months

__all__ = ["is_leap", "hebrew_to_jdn", "jdn_to_hebrew", "new_year", "year_length", "month_length"]

_PARTS_PER_DAY = 25920          # 24 hours of 1080 parts
_MONTH_PARTS = 29 * _PARTS_PER_DAY + 12 * 1080 + 793


def is_leap(year: int) -> bool:
    """Whether *year* AM has a second Adar.

    >>> [y for y in range(1, 20) if is_leap(y)]
    [3, 6, 8, 11, 14, 17, 19]
    """
    return (7 * year + 1) % 19 < 7


def _elapsed(year: int) -> int:
    """Days from the epoch to the molad-day of Tishri of *year*, after the first postponement."""
    months_elapsed = (235 * year - 234) // 19
    parts = 12084 + 13753 * months_elapsed
    day = 29 * months_elapsed + parts // _PARTS_PER_DAY
    return day + 1 if (3 * (day + 1)) % 7 < 3 else day


@functools.lru_cache(maxsize=4096)
def new_year(era_jdn: int, year: int) -> int:
    """JDN of Tishri 1 of *year* AM (the epoch JDN given)."""
    ny0, ny1, ny2 = _elapsed(year - 1), _elapsed(year), _elapsed(year + 1)
    correction = 2 if ny2 - ny1 == 356 else 1 if ny1 - ny0 == 382 else 0
    return era_jdn + ny1 + correction


def year_length(era_jdn: int, year: int) -> int:
    """Days in *year* AM (353-355 or 383-385)."""
    return new_year(era_jdn, year + 1) - new_year(era_jdn, year)


def month_length(era_jdn: int, year: int, month: int) -> int:
    """Days in *month* of *year* AM (0 for Adar II in a common year)."""
    if month == 13:
        return 29 if is_leap(year) else 0
    if month == 12:
        return 30 if is_leap(year) else 29
    if month == 8:
        return 30 if year_length(era_jdn, year) % 10 == 5 else 29
    if month == 9:
        return 29 if year_length(era_jdn, year) % 10 == 3 else 30
    return (30, 29, 30, 29, 30, 29, 30)[month - 1] if month <= 7 else (29, 30)[(month - 10)]


def _order(year: int) -> list[int]:
    """The months of *year* in the order they fall, from Tishri."""
    return [7, 8, 9, 10, 11, 12] + ([13] if is_leap(year) else []) + [1, 2, 3, 4, 5, 6]


def hebrew_to_jdn(era: Era, year: int, month: int, day: int) -> int:
    """The JDN of a Hebrew date.

    >>> from numcheck.calendars.names import era_named
    >>> hebrew_to_jdn(era_named("Anno Mundi"), 5783, 7, 1)
    2459849
    """
    if year < 1:
        raise range_error(f"Year {year} AM is before the era began.", "year", value=year,
                          legal="years 1 and later")
    if not 1 <= month <= 13 or (month == 13 and not is_leap(year)):
        legal = "months 1 to 13 (Adar II only in a leap year)"
        raise range_error(f"Month {month} of the Hebrew year {year} does not exist.", "month",
                          value=month, legal=legal)
    length = month_length(era.epoch_jdn, year, month)
    if not 1 <= day <= length:
        name = months("hebrew")[month - 1].name
        raise range_error(f"Day {day} of {name} {year} does not exist.", "day", value=day,
                          legal=f"days 1 to {length} in {name} {year}")
    jdn = new_year(era.epoch_jdn, year)
    for m in _order(year):
        if m == month:
            break
        jdn += month_length(era.epoch_jdn, year, m)
    return jdn + day - 1


def jdn_to_hebrew(jdn: int, era: Era) -> tuple[int, int, int]:
    """The (year, month, day) AM of a JDN (years before the era as 0, -1, ...)."""
    year = (jdn - era.epoch_jdn) * 98496 // 35975351 + 1
    while new_year(era.epoch_jdn, year + 1) <= jdn:
        year += 1
    while new_year(era.epoch_jdn, year) > jdn:
        year -= 1
    rest = jdn - new_year(era.epoch_jdn, year)
    for m in _order(year):
        length = month_length(era.epoch_jdn, year, m)
        if rest < length:
            return year, m, rest + 1
        rest -= length
    raise AssertionError("unreachable: the months fill the year")
