"""The catalogue of published computing schemes (``data/schemes.csv``), with sources.

One row per column scheme of Babylonian mathematical astronomy as the
literature gives it: the lunar Systems A and B (columns A, B, F, Φ, the daily
lunar velocity), Jupiter's Systems A and B, the daylight schemes of System A
and MUL.APIN, and the period relations of the other planets.  Each row keeps
the value as published, its source and a confidence (``high``: checked
against a stored public page, or exact from checked values; ``medium``: from
memory, arithmetic consistent with its period relation; ``low``: from
memory, not cross-checked).

A row's ``kind`` says how a column is checked against it: ``zigzag`` (d, M,
m), ``step`` (zones ``start:rate`` on the circle), ``sequence`` (the values of
one period, line by line) or ``period`` (a period relation only).

>>> by_id("ACT-LUN-B-F").label
'System B, column F'
>>> by_id("ACT-LUN-B-F").period_lines
Fraction(251, 18)
"""

from __future__ import annotations

import csv
from dataclasses import dataclass
from fractions import Fraction
from functools import lru_cache
from importlib import resources

from ..errors import NumcheckError, UnknownNameError
from .statements import parse_number

__all__ = ["PublishedScheme", "SCHEME_COLUMNS", "SCHEME_KINDS", "SCHEME_CONFIDENCES",
           "schemes", "by_id"]

SCHEME_COLUMNS = ("id", "label", "system", "body", "column", "quantity", "kind", "d", "M", "m",
                  "zones", "sequence", "unit", "line_unit", "period_lines", "period_relation",
                  "value_as_published", "source", "confidence")
SCHEME_KINDS = ("zigzag", "step", "sequence", "period")
SCHEME_CONFIDENCES = ("high", "medium", "low")


@dataclass(frozen=True)
class PublishedScheme:
    """One published scheme, its exact parameters and its source."""

    id: str
    label: str
    system: str
    body: str
    column: str
    quantity: str
    kind: str
    d: Fraction | None
    M: Fraction | None
    m: Fraction | None
    zones: tuple[tuple[Fraction, Fraction], ...]     # (start on the circle, rate)
    sequence: tuple[Fraction, ...]
    unit: str
    line_unit: str
    period_lines: Fraction | None
    period_relation: str
    value_as_published: str
    source: str
    confidence: str

    def to_dict(self) -> dict:
        """The row for JSON (exact values as strings)."""
        from ..reading import exact_text

        def ex(v):
            return None if v is None else exact_text(v)
        return {
            "id": self.id, "label": self.label, "system": self.system, "body": self.body,
            "column": self.column, "quantity": self.quantity, "kind": self.kind,
            "d": ex(self.d), "M": ex(self.M), "m": ex(self.m),
            "zones": [{"from": ex(a), "rate": ex(w)} for a, w in self.zones],
            "sequence": [ex(v) for v in self.sequence],
            "unit": self.unit, "line_unit": self.line_unit,
            "period_lines": ex(self.period_lines), "period_relation": self.period_relation,
            "value_as_published": self.value_as_published, "source": self.source,
            "confidence": self.confidence,
        }


def _number(text: str, row: str, column: str) -> Fraction | None:
    text = text.strip()
    if not text:
        return None
    try:
        if "/" in text:
            return Fraction(text)
        return parse_number(text)
    except (ValueError, ZeroDivisionError, NumcheckError) as err:
        raise NumcheckError(f"schemes.csv, row {row!r}: column {column} holds {text!r}, "
                            "not a number (e.g. 0;18, 30;1,59 or 251/18)") from err


def _row(raw: dict) -> PublishedScheme:
    rid = raw["id"]
    if raw["kind"] not in SCHEME_KINDS:
        raise NumcheckError(f"schemes.csv, row {rid!r}: kind {raw['kind']!r} is not one of "
                            f"{', '.join(SCHEME_KINDS)}")
    if raw["confidence"] not in SCHEME_CONFIDENCES:
        raise NumcheckError(f"schemes.csv, row {rid!r}: confidence {raw['confidence']!r} is not "
                            f"one of {', '.join(SCHEME_CONFIDENCES)}")
    zones = []
    for part in raw["zones"].split():
        start, _, rate = part.partition(":")
        zones.append((_number(start, rid, "zones"), _number(rate, rid, "zones")))
    sequence = tuple(_number(v, rid, "sequence") for v in raw["sequence"].split())
    return PublishedScheme(
        id=rid, label=raw["label"], system=raw["system"], body=raw["body"], column=raw["column"],
        quantity=raw["quantity"], kind=raw["kind"], d=_number(raw["d"], rid, "d"),
        M=_number(raw["M"], rid, "M"), m=_number(raw["m"], rid, "m"), zones=tuple(zones),
        sequence=sequence, unit=raw["unit"], line_unit=raw["line_unit"],
        period_lines=_number(raw["period_lines"], rid, "period_lines"),
        period_relation=raw["period_relation"], value_as_published=raw["value_as_published"],
        source=raw["source"], confidence=raw["confidence"])


@lru_cache(maxsize=1)
def schemes() -> tuple[PublishedScheme, ...]:
    """Every published scheme of the package file, in file order (cached)."""
    with resources.files("numcheck.data").joinpath("schemes.csv").open("r", encoding="utf-8") as fh:
        lines = [ln for ln in fh if not ln.startswith("#")]
    reader = csv.DictReader(lines)
    missing = [c for c in SCHEME_COLUMNS if c not in (reader.fieldnames or ())]
    if missing:
        raise NumcheckError(f"schemes.csv lacks the columns {missing}.")
    return tuple(_row(raw) for raw in reader)


def by_id(scheme_id: str) -> PublishedScheme:
    """The published scheme with this id (an error names the ids there are)."""
    for s in schemes():
        if s.id.lower() == scheme_id.strip().lower():
            return s
    raise UnknownNameError("published scheme", scheme_id, [s.id for s in schemes()])
