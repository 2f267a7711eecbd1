"""Calendar and era arithmetic: how many days lie between two dates of a text.

The calendars are those of the ancient astronomical texts and of their modern
editors: the Egyptian 365-day calendar with the eras of Nabonassar and of
Philip (Ptolemy's), the Alexandrian calendar (era of Diocletian), the
proleptic Julian calendar, and Julian Day Numbers.  All counting is in whole
days with exact integers; a date comes to the JDN of its civil day (the
integer JD at its noon).  The date syntax is described in
:mod:`numcheck.calendars.parse`.

>>> interval("Nabonassar 1 Thoth 1", "Philip 1 Thoth 1").days
154760
"""

from __future__ import annotations

from dataclasses import dataclass
from fractions import Fraction

from .dates import CALENDARS, CalendarDate, calendar_named, date_from_jdn, date_from_parts
from .parse import DATE_EXAMPLES, parse_date
from ..reading import exact_text

__all__ = ["interval", "IntervalResult", "CalendarDate", "parse_date", "date_from_parts",
           "date_from_jdn", "CALENDARS", "DATE_EXAMPLES", "calendar_named"]

#: Days in an Egyptian year and in a mean Julian year (exact).
EGYPTIAN_YEAR = 365
JULIAN_YEAR = Fraction(1461, 4)


@dataclass(frozen=True)
class IntervalResult:
    """The days from one date to another (positive when the second is later)."""

    first: CalendarDate
    second: CalendarDate

    @property
    def days(self) -> int:
        return self.second.jdn - self.first.jdn

    @property
    def jd(self) -> tuple[int, int]:
        """The JDNs of the civil days of the two dates."""
        return self.first.jdn, self.second.jdn

    @property
    def egyptian_years(self) -> tuple[int, int]:
        """The interval as whole Egyptian years of 365 days and the days left over.

        The sign goes with the years: -1 day is (-1, 364).
        """
        return divmod(self.days, EGYPTIAN_YEAR)

    @property
    def julian_years(self) -> Fraction:
        """The interval in mean Julian years of 365 1/4 days, exact."""
        return Fraction(self.days) / JULIAN_YEAR

    def to_dict(self) -> dict:
        years, rest = self.egyptian_years
        return {
            "days": self.days,
            "jd": list(self.jd),
            "dates": [self.first.to_dict(), self.second.to_dict()],
            "egyptian_years": {"years": years, "days": rest},
            "julian_years": exact_text(self.julian_years),
        }


def interval(date1: str | CalendarDate, date2: str | CalendarDate,
             calendar: str = "julian") -> IntervalResult:
    """The exact number of days from *date1* to *date2*, and both JDNs.

    *calendar* (``julian``, ``egyptian``, ``alexandrian``, ``jd``) is the
    calendar of a date that does not name its own era; a date such as
    ``"Nabonassar 1 Thoth 1"`` carries its calendar with it.  The interval is
    counted from civil day to civil day: from a day to the next is 1.

    >>> r = interval("747 BC Feb 26", "Philip 1 Thoth 1")
    >>> r.days, r.jd
    (154760, (1448638, 1603398))
    """
    first = date1 if isinstance(date1, CalendarDate) else parse_date(date1, calendar)
    second = date2 if isinstance(date2, CalendarDate) else parse_date(date2, calendar)
    return IntervalResult(first, second)
