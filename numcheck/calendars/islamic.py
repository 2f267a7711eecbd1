"""The arithmetical Islamic (Hijra) calendar, in exact integers.

Twelve lunar months of 30 and 29 days alternately (354 days), with a leap
day at the end of Dhu al-Hijja in 11 years of every 30: years 2, 5, 7, 10,
13, 16, 18, 21, 24, 26 and 29 of the cycle (the scheme most tables of Islamic
astronomy use; common practice, checked against convertdate.islamic).  The
epoch is the civil one, Muharram 1 of AH 1 = AD 622 July 16 (Julian).

The real months began with the sighting of the crescent, so a date in a
chronicle may differ by a day or two from this calendar: it is the
astronomers' schematic calendar, not a record of observed months.
"""

from __future__ import annotations

from .julian import range_error
from .names import Era, months

__all__ = ["is_leap", "islamic_to_jdn", "jdn_to_islamic", "NOTE"]

#: What the result of a Hijra date means (shown with the interval).
NOTE = ("Hijra dates are counted in the arithmetical calendar (30-year cycle); real months began "
        "with the sighting of the crescent and may differ by a day or two.")


def is_leap(year: int) -> bool:
    """Whether *year* AH has 355 days (a 30th of Dhu al-Hijja).

    >>> [y for y in range(1, 31) if is_leap(y)]
    [2, 5, 7, 10, 13, 16, 18, 21, 24, 26, 29]
    """
    return (11 * year + 14) % 30 < 11


def _month_length(year: int, month: int) -> int:
    return 30 if month % 2 == 1 or (month == 12 and is_leap(year)) else 29


def islamic_to_jdn(era: Era, year: int, month: int, day: int) -> int:
    """The JDN of a Hijra date.

    >>> from numcheck.calendars.names import era_named
    >>> islamic_to_jdn(era_named("Hijra"), 1, 1, 1)
    1948440
    """
    if year < 1:
        raise range_error(f"Year {year} of the Hijra is before the era began.", "year", value=year,
                          legal="years 1 and later (AH 1 Muharram 1 = AD 622 Jul 16)")
    if not 1 <= month <= 12:
        raise range_error(f"Month {month} of an Islamic year does not exist.", "month", value=month,
                          legal="months 1 to 12 (Muharram to Dhu al-Hijja)")
    length = _month_length(year, month)
    if not 1 <= day <= length:
        name = months("islamic")[month - 1].name
        raise range_error(f"Day {day} of {name} {year} does not exist.", "day", value=day,
                          legal=f"days 1 to {length} in {name} of AH {year}")
    return (era.epoch_jdn + 354 * (year - 1) + (3 + 11 * year) // 30 + (59 * (month - 1) + 1) // 2
            + day - 1)


def jdn_to_islamic(jdn: int, era: Era) -> tuple[int, int, int]:
    """The (year, month, day) AH of a JDN (years before the era as 0, -1, ...)."""
    year = (30 * (jdn - era.epoch_jdn) + 10646) // 10631
    while islamic_start(era, year + 1) <= jdn:
        year += 1
    while islamic_start(era, year) > jdn:
        year -= 1
    in_year = jdn - islamic_start(era, year)
    month = 1
    while month < 12 and in_year >= (59 * month + 1) // 2:
        month += 1
    return year, month, in_year - (59 * (month - 1) + 1) // 2 + 1


def islamic_start(era: Era, year: int) -> int:
    """JDN of Muharram 1 of *year* AH (any integer year)."""
    return era.epoch_jdn + 354 * (year - 1) + (3 + 11 * year) // 30
