"""Month and era names of the calendars numcheck knows, read from package data.

The names live in ``data/calendar_months.csv`` and ``data/calendar_eras.csv``
with a source on every row, so that a new spelling or a new era is a line of
data, not code.  Names are matched case-insensitively, without diacritics,
dots or apostrophes, because editions spell the Egyptian months in many ways
(Thoth, Thouth, Thoyth ...).
"""

from __future__ import annotations

import csv
import functools
import unicodedata
from dataclasses import dataclass
from importlib import resources

from ..errors import UnknownNameError

__all__ = ["Month", "Era", "normalise", "months", "month_named", "eras", "era_named", "find_era",
           "is_month_name"]


@dataclass(frozen=True)
class Month:
    """One month of a calendar: its number (1-based), usual name and length."""

    calendar: str
    number: int
    name: str
    days: int
    source: str


@dataclass(frozen=True)
class Era:
    """An era: the calendar it counts in and the JDN of Thoth 1 of its year 1."""

    name: str
    calendar: str
    epoch_jdn: int
    epoch: str
    source: str
    #: The last year the era counts (a king's reign in the Canon of Kings), or None.
    last_year: int | None = None


def normalise(name: str) -> str:
    """The form a name is matched in: lower case, no diacritics, dots or apostrophes.

    >>> normalise("Mesorê")
    'mesore'
    >>> normalise("  B.C. ")
    'bc'
    """
    decomposed = unicodedata.normalize("NFKD", name)
    bare = "".join(c for c in decomposed if not unicodedata.combining(c))
    bare = bare.replace(".", "").replace("'", "").replace("\N{RIGHT SINGLE QUOTATION MARK}", "")
    return " ".join(bare.casefold().split())


def _rows(filename: str) -> list[dict]:
    text = resources.files("numcheck.data").joinpath(filename).read_text(encoding="utf-8")
    return list(csv.DictReader(text.splitlines()))


@functools.lru_cache(maxsize=None)
def _month_table() -> tuple[dict[str, tuple[Month, ...]], dict[tuple[str, str], Month]]:
    by_calendar: dict[str, list[Month]] = {}
    lookup: dict[tuple[str, str], Month] = {}
    for row in _rows("calendar_months.csv"):
        month = Month(row["calendar"], int(row["number"]), row["name"], int(row["days"]), row["source"])
        by_calendar.setdefault(month.calendar, []).append(month)
        for spelling in [row["name"], *filter(None, row["variants"].split("|"))]:
            lookup[(month.calendar, normalise(spelling))] = month
    return {k: tuple(v) for k, v in by_calendar.items()}, lookup


@functools.lru_cache(maxsize=None)
def _era_table() -> tuple[tuple[Era, ...], dict[str, Era]]:
    found: list[Era] = []
    lookup: dict[str, Era] = {}
    for row in _rows("calendar_eras.csv"):
        era = Era(row["era"], row["calendar"], int(row["epoch_jdn"]), row["epoch"], row["source"],
                  int(row["last_year"]) if row.get("last_year") else None)
        found.append(era)
        for spelling in [row["era"], *filter(None, row["variants"].split("|"))]:
            lookup[normalise(spelling)] = era
    return tuple(found), lookup


def months(calendar: str) -> tuple[Month, ...]:
    """The months of *calendar* (``egyptian``, ``julian``, ``islamic``, ``hebrew``, ``babylonian``, ``persian``)."""
    return _month_table()[0][calendar]


def is_month_name(calendar: str, name: str) -> bool:
    """Whether *name* is a spelling numcheck knows for a month of *calendar*."""
    return (calendar, normalise(name)) in _month_table()[1]


def month_named(calendar: str, name: str) -> Month:
    """The month of *calendar* that *name* spells, or an error with did-you-mean.

    >>> month_named("egyptian", "PHAMENOTH").number
    7
    """
    found = _month_table()[1].get((calendar, normalise(name)))
    if found is None:
        kind = f"{calendar.title()} month"
        raise UnknownNameError(kind, name, [m.name for m in months(calendar)])
    return found


def eras() -> tuple[Era, ...]:
    """Every era numcheck counts years in."""
    return _era_table()[0]


def find_era(name: str) -> Era | None:
    """The era *name* spells, or None."""
    return _era_table()[1].get(normalise(name))


def era_named(name: str) -> Era:
    """The era *name* spells, or an error listing the known eras (with did-you-mean)."""
    found = find_era(name)
    if found is None:
        raise UnknownNameError("era", name, [e.name for e in eras()])
    return found
