"""The proleptic Julian calendar and Julian Day Numbers, in exact integers.

Historians of ancient astronomy date in the Julian calendar carried back
without end ("proleptic"), and count days with Julian Day Numbers.  numcheck
uses the JDN *of the civil day*: the integer Julian Date at noon of that day
(JD 0 is noon of 4713 BC January 1, Julian), so that 747 BC February 26 is
JDN 1448638.  Years are astronomical (1 BC = year 0, 2 BC = year -1); the
text form writes "747 BC" or "AD 2000".  Every year divisible by four
(astronomical numbering) is a leap year: February has 29 days.

The arithmetic uses floor division throughout and so holds for every integer
year, negative ones included (common practice; checked against convertdate in
tests/test_against_convertdate.py).
"""

from __future__ import annotations

from .names import months
from ..errors import NumcheckRangeError

__all__ = ["range_error", "is_leap", "month_length", "julian_to_jdn", "jdn_to_julian", "year_label",
           "julian_text", "iso_text", "check_julian"]


def range_error(message: str, part: str, **kwargs) -> NumcheckRangeError:
    """A range error that also says which *part* of a date (year, month, day) is wrong.

    The date parser uses ``part`` to point at the place in the text.
    """
    err = NumcheckRangeError(message, **kwargs)
    err.part = part
    err.reason = message
    return err


def is_leap(year: int) -> bool:
    """Whether astronomical *year* is a Julian leap year.

    >>> is_leap(0), is_leap(-746), is_leap(-4)
    (True, False, True)
    """
    return year % 4 == 0


def month_length(year: int, month: int) -> int:
    """Days in *month* (1-12) of astronomical *year*."""
    if month == 2 and is_leap(year):
        return 29
    return months("julian")[month - 1].days


def year_label(year: int) -> str:
    """An astronomical year as a historian writes it.

    >>> year_label(-746), year_label(0), year_label(2000)
    ('747 BC', '1 BC', 'AD 2000')
    """
    return f"{1 - year} BC" if year <= 0 else f"AD {year}"


def check_julian(year: int, month: int, day: int) -> None:
    """Raise a range error naming the part of a Julian date that cannot be."""
    if not 1 <= month <= 12:
        raise range_error(f"Month {month} of a Julian date does not exist.", "month",
                          value=month, legal="1 to 12 (January to December)")
    last = month_length(year, month)
    if not 1 <= day <= last:
        name = months("julian")[month - 1].name
        why = ""
        if month == 2:
            why = (f" ({year_label(year)} is {'a' if is_leap(year) else 'not a'} Julian leap year;"
                   " leap years are divisible by 4 in astronomical numbering, 1 BC = year 0)")
        raise range_error(f"Day {day} of {name} {year_label(year)} does not exist{why}.", "day",
                          value=day, legal=f"1 to {last} for {name} {year_label(year)}")


def julian_to_jdn(year: int, month: int, day: int) -> int:
    """The JDN of the civil day *year*-*month*-*day* (astronomical year).

    >>> julian_to_jdn(-746, 2, 26)
    1448638
    """
    check_julian(year, month, day)
    # Count from March of a year far in the past so that the leap day falls at
    # the end of the counted year (the usual device; floor division keeps it
    # valid for negative years).
    a = (14 - month) // 12
    y = year + 4800 - a
    m = month + 12 * a - 3
    return day + (153 * m + 2) // 5 + 365 * y + y // 4 - 32083


def jdn_to_julian(jdn: int) -> tuple[int, int, int]:
    """The Julian (year, month, day) of a JDN, year astronomical.

    >>> jdn_to_julian(1448638)
    (-746, 2, 26)
    """
    c = jdn + 32082
    d = (4 * c + 3) // 1461
    e = c - (1461 * d) // 4
    m = (5 * e + 2) // 153
    day = e - (153 * m + 2) // 5 + 1
    month = m + 3 - 12 * (m // 10)
    year = d - 4800 + m // 10
    return year, month, day


def julian_text(year: int, month: int, day: int) -> str:
    """A Julian date as a historian writes it.

    >>> julian_text(-746, 2, 26)
    '747 BC Feb 26'
    """
    return f"{year_label(year)} {months('julian')[month - 1].name[:3]} {day}"


def iso_text(year: int, month: int, day: int) -> str:
    """A Julian date with the astronomical year, ``-746-02-26``.

    >>> iso_text(-746, 2, 26)
    '-746-02-26'
    """
    return f"{year}-{month:02d}-{day:02d}"
