"""The Persian year of the era of Yazdegerd: 365 days, no leap day, in exact integers.

Twelve months of 30 days and five epagomenal days, which the astronomical
tables place after the eighth month, Ābān (from memory; E. S. Kennedy, A
Survey of Islamic Astronomical Tables, 1956); like the Egyptian year it
wanders against the seasons.  The era begins with the accession of
Yazdegerd III: Farvardīn 1 of year 1 = AD 632 June 16 (Julian).  Months are
numbered 1-12; the epagomenal days are month 13.
"""

from __future__ import annotations

from .julian import range_error
from .names import Era, months

__all__ = ["EPAGOMENAL", "AFTER_MONTH", "persian_to_jdn", "jdn_to_persian"]

#: The epagomenal days, counted as a short thirteenth month.
EPAGOMENAL = 13
#: The month after which the epagomenal days stand (Ābān).
AFTER_MONTH = 8


def _offset(month: int) -> int:
    """Days from Farvardīn 1 to the first of *month*."""
    if month == EPAGOMENAL:
        return 30 * AFTER_MONTH
    return 30 * (month - 1) + (5 if month > AFTER_MONTH else 0)


def persian_to_jdn(era: Era, year: int, month: int, day: int) -> int:
    """The JDN of a date of the era of Yazdegerd.

    >>> from numcheck.calendars.names import era_named
    >>> persian_to_jdn(era_named("Yazdegerd"), 1, 1, 1)
    1952063
    """
    if year < 1:
        raise range_error(f"Year {year} of the era of {era.name} is before the era began.", "year",
                          value=year, legal=f"years 1 and later (year 1 begins {era.epoch})")
    if not 1 <= month <= EPAGOMENAL:
        raise range_error(f"Month {month} of a Persian year does not exist.", "month", value=month,
                          legal="months 1 to 12 (Farvardin to Esfand) and the epagomenal days")
    length = 5 if month == EPAGOMENAL else 30
    if not 1 <= day <= length:
        name = months("persian")[month - 1].name
        raise range_error(f"Day {day} of {name} does not exist.", "day", value=day,
                          legal=f"days 1 to {length}")
    return era.epoch_jdn + 365 * (year - 1) + _offset(month) + day - 1


def jdn_to_persian(jdn: int, era: Era) -> tuple[int, int, int]:
    """The (year, month, day) of a JDN in the era of Yazdegerd; month 13 = the epagomenal days."""
    years, in_year = divmod(jdn - era.epoch_jdn, 365)
    if 30 * AFTER_MONTH <= in_year < 30 * AFTER_MONTH + 5:
        return years + 1, EPAGOMENAL, in_year - 30 * AFTER_MONTH + 1
    if in_year >= 30 * AFTER_MONTH + 5:
        in_year -= 5
    month, day = divmod(in_year, 30)
    return years + 1, month + 1, day + 1
