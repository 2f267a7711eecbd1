"""A date in one of the calendars numcheck knows, with its Julian Day Number.

A :class:`CalendarDate` is what a date written in a text comes to: the
calendar and era it is counted in, its year, month and day as written, and the
JDN of the civil day (see :mod:`numcheck.calendars.julian` for the
convention).  Its ``to_dict`` gives the same day in the other calendars too,
because a historian checking an interval usually wants to see both.
"""

from __future__ import annotations

from dataclasses import dataclass

from .egyptian import (EPAGOMENAL, alexandrian_to_jdn, egyptian_text, egyptian_to_jdn,
                                 jdn_to_alexandrian, jdn_to_egyptian)
from .julian import iso_text, jdn_to_julian, julian_text, julian_to_jdn
from .names import Era, era_named, months
from ..errors import UnknownNameError

__all__ = ["CALENDARS", "CalendarDate", "calendar_named", "date_from_parts", "date_from_jdn"]

#: The calendars a date may be given in, and what each counts.
CALENDARS = {
    "julian": "proleptic Julian calendar (astronomical years: 1 BC = 0)",
    "egyptian": "Egyptian 365-day calendar, eras of Nabonassar and Philip",
    "alexandrian": "Alexandrian calendar (Egyptian months, leap day every 4th year), era of Diocletian",
    "jd": "Julian Day Number of the civil day",
}
_ALIASES = {"jdn": "jd", "julian day": "jd", "julian day number": "jd", "nabonassar": "egyptian",
            "coptic": "alexandrian"}


def calendar_named(name: str) -> str:
    """The calendar *name* means (``julian``, ``egyptian``, ``alexandrian``, ``jd``)."""
    key = " ".join(str(name).casefold().split())
    key = _ALIASES.get(key, key)
    if key not in CALENDARS:
        raise UnknownNameError("calendar", name, CALENDARS)
    return key


@dataclass(frozen=True)
class CalendarDate:
    """A date as written, in its calendar, and the JDN of its civil day.

    ``year`` is astronomical for the Julian calendar and the era year for the
    Egyptian and Alexandrian ones; ``month`` 13 is the epagomenal days.  For a
    bare JDN, ``year``, ``month`` and ``day`` are None.
    """

    calendar: str
    jdn: int
    era: str | None = None
    year: int | None = None
    month: int | None = None
    day: int | None = None
    text: str = ""

    @property
    def label(self) -> str:
        """The date written the way numcheck writes it in its own calendar."""
        if self.calendar == "jd":
            return f"JD {self.jdn}"
        if self.calendar == "julian":
            return julian_text(self.year, self.month, self.day)
        return egyptian_text(era_named(self.era), self.year, self.month, self.day)

    @property
    def month_name(self) -> str | None:
        if self.month is None:
            return None
        if self.calendar == "julian":
            return months("julian")[self.month - 1].name
        return "epagomenal days" if self.month == EPAGOMENAL else months("egyptian")[self.month - 1].name

    def equivalents(self) -> dict[str, str]:
        """The same civil day in each calendar numcheck knows."""
        y, m, d = jdn_to_julian(self.jdn)
        out = {"julian": julian_text(y, m, d), "iso": iso_text(y, m, d)}
        nabonassar = era_named("Nabonassar")
        ey, em, ed = jdn_to_egyptian(self.jdn, nabonassar)
        if ey >= 1:
            out["egyptian"] = egyptian_text(nabonassar, ey, em, ed)
        philip = era_named("Philip")
        py, pm, pd = jdn_to_egyptian(self.jdn, philip)
        if py >= 1:
            out["egyptian_philip"] = egyptian_text(philip, py, pm, pd)
        diocletian = era_named("Diocletian")
        ay, am, ad = jdn_to_alexandrian(self.jdn, diocletian)
        if ay >= 1:
            out["alexandrian"] = egyptian_text(diocletian, ay, am, ad)
        out["jd"] = f"JD {self.jdn}"
        return out

    def to_dict(self) -> dict:
        out = {"text": self.text, "calendar": self.calendar, "label": self.label, "jd": self.jdn}
        if self.era is not None:
            out["era"] = self.era
        if self.year is not None:
            out.update(year=self.year, month=self.month, month_name=self.month_name, day=self.day)
        out["equivalents"] = self.equivalents()
        return out


def date_from_parts(calendar: str, year: int, month: int, day: int, *, era: Era | None = None,
                    text: str = "") -> CalendarDate:
    """Build a date from its parts, checking each (range errors name the bad part)."""
    if calendar == "julian":
        jdn = julian_to_jdn(year, month, day)
        return CalendarDate("julian", jdn, None, year, month, day, text)
    if era is None or era.calendar != calendar:
        raise UnknownNameError("era", era.name if era else "",
                               [e.name for e in _eras_of(calendar)])
    convert = egyptian_to_jdn if calendar == "egyptian" else alexandrian_to_jdn
    jdn = convert(era, year, month, day)
    return CalendarDate(calendar, jdn, era.name, year, month, day, text)


def _eras_of(calendar: str):
    from .names import eras

    return [e for e in eras() if e.calendar == calendar]


def date_from_jdn(jdn: int, calendar: str = "jd", *, era: Era | None = None) -> CalendarDate:
    """The date of the civil day *jdn* in *calendar* (and *era*)."""
    if calendar == "jd":
        return CalendarDate("jd", jdn, text=f"JD {jdn}")
    if calendar == "julian":
        y, m, d = jdn_to_julian(jdn)
        return CalendarDate("julian", jdn, None, y, m, d, julian_text(y, m, d))
    era = era or _eras_of(calendar)[0]
    convert = jdn_to_egyptian if calendar == "egyptian" else jdn_to_alexandrian
    y, m, d = convert(jdn, era)
    return CalendarDate(calendar, jdn, era.name, y, m, d, egyptian_text(era, y, m, d))
