"""A date in one of the calendars numcheck knows, with its Julian Day Number.

A :class:`CalendarDate` is what a date written in a text comes to: the
calendar and era it is counted in, its year, month and day as written, and the
JDN of the civil day (see :mod:`numcheck.calendars.julian` for the
convention).  Its ``to_dict`` gives the same day in the other calendars too,
because a historian checking an interval usually wants to see both.
"""

from __future__ import annotations

from dataclasses import dataclass

from . import babylonian, hebrew, islamic, persian
from .egyptian import (EPAGOMENAL, alexandrian_to_jdn, egyptian_text, egyptian_to_jdn,
                                 jdn_to_alexandrian, jdn_to_egyptian)
from .julian import iso_text, jdn_to_julian, julian_text, julian_to_jdn
from .names import Era, era_named, months
from ..errors import UnknownNameError

__all__ = ["CALENDARS", "SYSTEMS", "CalendarDate", "calendar_named", "date_from_parts", "date_from_jdn",
           "era_text", "month_calendar"]

#: The calendars a date may be given in, and what each counts.
CALENDARS = {
    "julian": "proleptic Julian calendar (astronomical years: 1 BC = 0)",
    "egyptian": "Egyptian 365-day calendar, eras of Nabonassar and Philip",
    "alexandrian": "Alexandrian calendar (Egyptian months, leap day every 4th year), era of Diocletian",
    "islamic": "arithmetical Islamic calendar, era of the Hijra (AH)",
    "persian": "Persian 365-day year, era of Yazdegerd",
    "babylonian": "Babylonian lunisolar calendar, Seleucid Era (schematic months, 19-year cycle)",
    "hebrew": "fixed Hebrew calendar, Anno Mundi",
    "jd": "Julian Day Number of the civil day",
}

#: Calendar -> (date to JDN, JDN to date, the calendar whose month names it uses, a note or None).
SYSTEMS = {
    "egyptian": (egyptian_to_jdn, jdn_to_egyptian, "egyptian", None),
    "alexandrian": (alexandrian_to_jdn, jdn_to_alexandrian, "egyptian", None),
    "islamic": (islamic.islamic_to_jdn, islamic.jdn_to_islamic, "islamic", islamic.NOTE),
    "persian": (persian.persian_to_jdn, persian.jdn_to_persian, "persian", None),
    "babylonian": (babylonian.babylonian_to_jdn, babylonian.jdn_to_babylonian, "babylonian",
                   babylonian.NOTE),
    "hebrew": (hebrew.hebrew_to_jdn, hebrew.jdn_to_hebrew, "hebrew", None),
}


def month_calendar(calendar: str) -> str:
    """The calendar whose month names a date of *calendar* is written with."""
    return SYSTEMS[calendar][2] if calendar in SYSTEMS else calendar


def era_text(era: Era, year: int, month: int, day: int) -> str:
    """A date of an era as numcheck writes it (``Hijra 1 Muharram 1``, ``Seleucid 1 Nisannu 1``).

    >>> era_text(era_named("Hijra"), 1, 1, 1)
    'Hijra 1 Muharram 1'
    """
    if era.calendar in ("egyptian", "alexandrian"):
        return egyptian_text(era, year, month, day)
    if era.calendar == "persian" and month == persian.EPAGOMENAL:
        return f"{era.name} {year} epagomenal day {day}"
    return f"{era.name} {year} {months(month_calendar(era.calendar))[month - 1].name} {day}"
_ALIASES = {"jdn": "jd", "julian day": "jd", "julian day number": "jd", "nabonassar": "egyptian",
            "coptic": "alexandrian", "hijra": "islamic", "hijri": "islamic", "yazdegerd": "persian",
            "seleucid": "babylonian", "jewish": "hebrew"}


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
        return era_text(era_named(self.era), self.year, self.month, self.day)

    @property
    def month_name(self) -> str | None:
        if self.month is None:
            return None
        if self.calendar == "julian":
            return months("julian")[self.month - 1].name
        if self.calendar in ("egyptian", "alexandrian") and self.month == EPAGOMENAL:
            return "epagomenal days"
        return months(month_calendar(self.calendar))[self.month - 1].name

    @property
    def note(self) -> str | None:
        """What a date of this calendar means, when it is schematic (Hijra, Seleucid)."""
        return SYSTEMS[self.calendar][3] if self.calendar in SYSTEMS else None

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
        for key, name in (("hijra", "Hijra"), ("hebrew", "Anno Mundi")):
            era = era_named(name)
            y2, m2, d2 = SYSTEMS[era.calendar][1](self.jdn, era)
            if y2 >= 1:
                out[key] = era_text(era, y2, m2, d2)
        out["jd"] = f"JD {self.jdn}"
        return out

    def to_dict(self) -> dict:
        out = {"text": self.text, "calendar": self.calendar, "label": self.label, "jd": self.jdn}
        if self.era is not None:
            out["era"] = self.era
        if self.year is not None:
            out.update(year=self.year, month=self.month, month_name=self.month_name, day=self.day)
        if self.note:
            out["note"] = self.note
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
    jdn = SYSTEMS[calendar][0](era, year, month, day)
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
    y, m, d = SYSTEMS[calendar][1](jdn, era)
    return CalendarDate(calendar, jdn, era.name, y, m, d, era_text(era, y, m, d))
