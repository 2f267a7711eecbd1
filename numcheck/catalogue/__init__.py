"""The catalogue of periods, parameters and period relations, with sources.

Two package files make the catalogue: ``data/periods.csv`` (written by hand
from published sources, one row per period, parameter or relation, each with
its source and an honest confidence) and ``data/periods_modern.csv`` (mean
periods at J2000.0 generated from the IERS 2003 fundamental arguments by
``data/make_modern_periods.py``).  Every row states what it asserts in the
``statement`` column, which :mod:`numcheck.catalogue.statements` reads into sides, so
that identify can match every side of a relation.

The loader gives a pandas DataFrame (:func:`frame`) and typed lookups
(:func:`entries`, :func:`by_id`, :func:`period`, :func:`bodies`).
"""

from __future__ import annotations

import os
from dataclasses import dataclass
from fractions import Fraction
from functools import lru_cache

from ..errors import NumcheckError, UnknownNameError
from .statements import Side, parse_number, parse_statement

__all__ = [
    "Entry",
    "COLUMNS",
    "KINDS",
    "CONFIDENCES",
    "CYCLES",
    "frame",
    "entries",
    "by_id",
    "period",
    "periods",
    "bodies",
    "traditions",
    "in_tradition",
    "parse_value",
]

#: The columns of the catalogue files, in order.
COLUMNS = ("id", "body", "kind", "tradition", "cycle", "statement", "value_as_attested",
           "value", "unit", "source", "confidence")
KINDS = ("period", "parameter", "relation")
CONFIDENCES = ("published", "from memory", "common practice")
#: Cycles a period row may be an estimate of (``cycle`` column).
CYCLES = ("synodic", "sidereal", "tropical", "anomalistic", "draconitic", "eclipse", "node",
          "apogee", "precession")

_FILES = ("periods.csv", "periods_modern.csv")


@dataclass(frozen=True)
class Entry:
    """One catalogue row, with its exact value and its statement read into sides."""

    id: str
    body: str
    kind: str
    tradition: str
    cycle: str | None
    statement: str
    value_as_attested: str
    value: Fraction
    unit: str
    source: str
    confidence: str
    sides: tuple[Side, ...]

    def to_dict(self) -> dict:
        """The row for JSON (exact value as a string)."""
        from ..reading import exact_text

        return {
            "id": self.id, "body": self.body, "kind": self.kind, "tradition": self.tradition,
            "cycle": self.cycle, "statement": self.statement, "value_as_attested": self.value_as_attested,
            "value": exact_text(self.value), "unit": self.unit, "source": self.source,
            "confidence": self.confidence,
        }


def parse_value(text: str) -> Fraction:
    """Read the exact ``value`` column: ``6585;20``, ``19756/3``, ``29.530588855`` or ``223``.

    >>> parse_value("29;31,50,8,20") == parse_value("765433/25920")
    True
    """
    text = str(text).strip()
    if "/" in text and " " not in text:
        return Fraction(text)
    if "." in text:
        return Fraction(text)
    return parse_number(text)


@lru_cache(maxsize=1)
def _rows() -> tuple[dict[str, str], ...]:
    """The rows of the catalogue files as text, in file order (lines starting with '#' are notes).

    Read with the csv module, not pandas: identify and restore need the
    catalogue at every start, and pandas alone takes longer to import than
    a whole identification.
    """
    import csv

    out = []
    for name in _FILES:
        with open(_data_file(name), encoding="utf-8", newline="") as fh:
            reader = csv.DictReader(line for line in fh if not line.lstrip().startswith("#"))
            missing = [c for c in COLUMNS if c not in (reader.fieldnames or ())]
            if missing:
                raise NumcheckError(f"The catalogue file {name} lacks the columns {missing}.")
            out.extend({c: (row[c] or "") for c in COLUMNS} for row in reader)
    return tuple(out)


@lru_cache(maxsize=1)
def frame():
    """The whole catalogue as a pandas DataFrame (strings as in the files; cached).

    A column ``exact`` holds the value as a :class:`~fractions.Fraction`.
    Callers must not modify the cached frame: take a ``.copy()`` to change it.
    """
    import pandas as pd

    df = pd.DataFrame(list(_rows()), columns=list(COLUMNS), dtype=str)
    df["exact"] = [parse_value(v) for v in df["value"]]
    return df


def source_key() -> str:
    """The cache key of what the catalogue is computed from: its files and this code."""
    from .. import cache

    here = os.path.dirname(os.path.abspath(__file__))
    paths = [_data_file(name) for name in _FILES] + [os.path.join(here, f) for f in ("__init__.py", "statements.py")]
    contents = []
    for path in paths:
        with open(path, "rb") as fh:
            contents.append(fh.read())
    return cache.make_key(*contents)


def _data_file(name: str) -> str:
    """The path of a file of the package's data (numcheck/data/NAME).

    A plain path rather than importlib.resources, whose import costs more
    than reading the catalogue: the wheel installs the data as files.
    """
    return os.path.join(os.path.dirname(os.path.dirname(os.path.abspath(__file__))), "data", name)


@lru_cache(maxsize=1)
def _entries() -> tuple[Entry, ...]:
    """Every entry, parsed once and kept in numcheck's cache folder (:mod:`numcheck.cache`)."""
    from .. import cache

    return cache.remembered("catalogue", source_key(), _parse_entries, Entry)


def _parse_entries() -> tuple[Entry, ...]:
    out = []
    for row in _rows():
        out.append(Entry(
            id=row["id"], body=row["body"], kind=row["kind"], tradition=row["tradition"],
            cycle=row["cycle"] or None, statement=row["statement"],
            value_as_attested=row["value_as_attested"], value=parse_value(row["value"]),
            unit=row["unit"], source=row["source"], confidence=row["confidence"],
            sides=parse_statement(row["statement"]),
        ))
    return tuple(out)


def entries(*, body: str | None = None, kind: str | None = None,
            tradition: str | None = None) -> tuple[Entry, ...]:
    """Every catalogue entry, optionally only one body, kind or tradition."""
    if body is not None:
        _check("body", body, bodies())
    if kind is not None:
        _check("kind", kind, KINDS)
    if tradition is not None:
        _check("tradition", tradition, traditions())
    return tuple(e for e in _entries()
                 if (body is None or e.body == body) and (kind is None or e.kind == kind)
                 and (tradition is None or in_tradition(e.tradition, tradition)))


@lru_cache(maxsize=1)
def _by_id() -> dict[str, Entry]:
    return {e.id: e for e in _entries()}


def by_id(entry_id: str) -> Entry:
    """The entry with this id."""
    table = _by_id()
    if entry_id not in table:
        raise UnknownNameError("catalogue id", entry_id, table)
    return table[entry_id]


def bodies() -> tuple[str, ...]:
    """The bodies in the catalogue (moon, sun, the five planets, calendar, stars)."""
    return tuple(sorted({e.body for e in _entries()}))


def traditions() -> tuple[str, ...]:
    """The traditions in the catalogue (babylonian, greek, indian, islamic, modern ...).

    A tradition may name a school within it, ``indian/aryabhata``: its parent
    (``indian``) is listed too, and choosing it chooses every school.
    """
    names = {e.tradition for e in _entries()}
    return tuple(sorted(names | {n.split("/")[0] for n in names}))


def in_tradition(row_tradition: str, wanted: str) -> bool:
    """Whether a row of *row_tradition* belongs to the tradition *wanted* (a school or its parent).

    >>> in_tradition("indian/aryabhata", "indian"), in_tradition("indian/aryabhata", "indian/khandakhadyaka")
    (True, False)
    """
    return row_tradition == wanted or row_tradition.startswith(wanted + "/")


def _check(kind: str, name: str, known) -> None:
    if name not in known:
        raise UnknownNameError(kind, name, known)


def periods(body: str, cycle: str, tradition: str | None = None) -> tuple[Entry, ...]:
    """Every period row of *body* estimating *cycle* (in days), standard one first."""
    _check("body", body, bodies())
    _check("cycle", cycle, CYCLES)
    if tradition is not None:
        _check("tradition", tradition, traditions())
    return tuple(e for e in _entries()
                 if e.kind == "period" and e.body == body and e.cycle == cycle and e.unit == "days"
                 and (tradition is None or in_tradition(e.tradition, tradition)))


def period(body: str, cycle: str, tradition: str = "modern") -> Fraction:
    """The length in days of one *cycle* of *body* in a *tradition*.

    ``tradition="modern"`` gives the mean period at J2000.0 from the IERS
    2003 arguments (pyerfa).  When a tradition has several values (Greek:
    Hipparchus' month before Geminus'), the first row of the file, its
    standard value, is returned; :func:`periods` gives them all.

    >>> period("moon", "synodic", "babylonian")    # 29;31,50,8,20 days
    Fraction(765433, 25920)
    """
    found = periods(body, cycle, tradition)
    if not found:
        have = sorted({e.tradition for e in periods(body, cycle)})
        raise UnknownNameError(f"tradition for the {body}'s {cycle} period", tradition, have)
    return found[0].value
