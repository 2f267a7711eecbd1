"""Calendars and eras of the texts: how many days lie between two dates.

One module per calendar (:mod:`.egyptian`, :mod:`.julian`), the names of
months and eras (:mod:`.names`), a date as the calendars know it
(:mod:`.dates`), the date parser (:mod:`.parse`) and the count of days
between two dates (:mod:`.between`).
"""

from __future__ import annotations

from .between import (CALENDARS, DATE_EXAMPLES, CalendarDate, IntervalResult, calendar_named,
                      date_from_jdn, date_from_parts, interval, parse_date)

__all__ = ["interval", "IntervalResult", "CalendarDate", "parse_date", "date_from_parts",
           "date_from_jdn", "CALENDARS", "DATE_EXAMPLES", "calendar_named"]
