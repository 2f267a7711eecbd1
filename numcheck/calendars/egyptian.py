"""The Egyptian 365-day calendar and the Alexandrian calendar, in exact integers.

The Egyptian civil year has twelve months of 30 days and five epagomenal days,
365 days always, so it wanders through the seasons (one day in four years
against the Julian year).  Ptolemy counts it from the era of Nabonassar and of
Philip (Almagest, tr. Toomer 1984; the epochs of the mean-motion tables).

The Alexandrian calendar keeps the Egyptian months but adds a sixth
epagomenal day every fourth year, so that it stays tied to the Julian year:
Thoth 1 falls on Julian August 29, or on August 30 in the Julian year before a
Julian leap year (common practice; the rule is checked in the tests against
the Coptic calendar of convertdate, which is the same calendar counted in the
era of Diocletian).  The rule is applied proleptically to every year, without
regard to when it came into use (under Augustus, from memory).

Months are numbered 1-12; the epagomenal days count as month 13.
"""

from __future__ import annotations

from .julian import jdn_to_julian, julian_to_jdn, range_error
from .names import Era, months

__all__ = ["EPAGOMENAL", "egyptian_to_jdn", "jdn_to_egyptian", "alexandrian_to_jdn",
           "jdn_to_alexandrian", "alexandrian_thoth1", "egyptian_text"]

#: The number given to the epagomenal days, counted as a short thirteenth month.
EPAGOMENAL = 13


def _check(era: Era, year: int, month: int, day: int, epagomenal_days: int) -> None:
    if era.last_year is not None and year > era.last_year:
        raise range_error(
            f"Year {year} of {era.name} is past the {era.last_year} years the Canon of Kings gives him.",
            "year", value=year, legal=f"years 1 to {era.last_year} of {era.name}")
    if year < 1:
        raise range_error(
            f"Year {year} of the era of {era.name} is before the era began.", "year",
            value=year, legal=f"years 1 and later (year 1 of {era.name} begins {era.epoch})")
    if not 1 <= month <= EPAGOMENAL:
        raise range_error(f"Month {month} of an Egyptian year does not exist.", "month", value=month,
                                 legal="months 1 to 12 (Thoth to Mesore) and the epagomenal days")
    if month == EPAGOMENAL:
        if not 1 <= day <= epagomenal_days:
            leap = " (an Alexandrian leap year)" if epagomenal_days == 6 else ""
            raise range_error(
                f"Epagomenal day {day} of {era.name} {year} does not exist{leap}.", "day", value=day,
                legal=f"epagomenal days 1 to {epagomenal_days} in {era.name} {year}")
    elif not 1 <= day <= 30:
        name = months("egyptian")[month - 1].name
        raise range_error(f"Day {day} of {name} does not exist.", "day", value=day,
                                 legal="days 1 to 30 (every Egyptian month has 30 days)")


def egyptian_to_jdn(era: Era, year: int, month: int, day: int) -> int:
    """The JDN of an Egyptian date counted in *era* (Nabonassar or Philip).

    >>> from numcheck.calendars.names import era_named
    >>> egyptian_to_jdn(era_named("Nabonassar"), 425, 1, 1)
    1603398
    """
    _check(era, year, month, day, 5)
    return era.epoch_jdn + 365 * (year - 1) + 30 * (month - 1) + (day - 1)


def jdn_to_egyptian(jdn: int, era: Era) -> tuple[int, int, int]:
    """The (year, month, day) in *era* of a JDN; month 13 = the epagomenal days.

    Years before the era come out as 0, -1, ... (counted backwards).
    """
    years, in_year = divmod(jdn - era.epoch_jdn, 365)
    month, day = divmod(in_year, 30)
    return years + 1, month + 1, day + 1


def _julian_year_of_epoch(era: Era) -> int:
    return jdn_to_julian(era.epoch_jdn)[0]


def alexandrian_thoth1(julian_year: int) -> int:
    """JDN of the Alexandrian Thoth 1 that falls in *julian_year* (astronomical).

    August 29, or August 30 when the next Julian year is a leap year.

    >>> from numcheck.calendars.julian import jdn_to_julian
    >>> jdn_to_julian(alexandrian_thoth1(283)), jdn_to_julian(alexandrian_thoth1(284))
    ((283, 8, 30), (284, 8, 29))
    """
    return julian_to_jdn(julian_year, 8, 30 if (julian_year + 1) % 4 == 0 else 29)


def _alexandrian_year(era: Era, year: int) -> tuple[int, int]:
    """(JDN of Thoth 1, number of epagomenal days) of *year* of *era*."""
    start_year = _julian_year_of_epoch(era) + year - 1
    start = alexandrian_thoth1(start_year)
    return start, alexandrian_thoth1(start_year + 1) - start - 360


def alexandrian_to_jdn(era: Era, year: int, month: int, day: int) -> int:
    """The JDN of an Alexandrian date counted in *era* (Diocletian).

    >>> from numcheck.calendars.names import era_named
    >>> alexandrian_to_jdn(era_named("Diocletian"), 1, 1, 1)
    1825030
    """
    if year < 1:
        _check(era, year, month, day, 5)
    start, epagomenal = _alexandrian_year(era, year)
    _check(era, year, month, day, epagomenal)
    return start + 30 * (month - 1) + (day - 1)


def jdn_to_alexandrian(jdn: int, era: Era) -> tuple[int, int, int]:
    """The Alexandrian (year, month, day) in *era* of a JDN."""
    julian_year = jdn_to_julian(jdn)[0]
    start_year = julian_year if jdn >= alexandrian_thoth1(julian_year) else julian_year - 1
    in_year = jdn - alexandrian_thoth1(start_year)
    month, day = divmod(in_year, 30)
    return start_year - _julian_year_of_epoch(era) + 1, month + 1, day + 1


def egyptian_text(era: Era, year: int, month: int, day: int) -> str:
    """An Egyptian or Alexandrian date as numcheck writes it.

    >>> from numcheck.calendars.names import era_named
    >>> egyptian_text(era_named("Philip"), 1, 13, 5)
    'Philip 1 epagomenal day 5'
    """
    if month == EPAGOMENAL:
        return f"{era.name} {year} epagomenal day {day}"
    return f"{era.name} {year} {months('egyptian')[month - 1].name} {day}"
