"""Which period relations of the catalogue a span of time and its counts match.

A relation found by arithmetic is worth more to a historian when it is
attested: "8 years = 5 synodic periods of Venus" is the Babylonian goal-year
period (Sachs 1948; Gray & Steele 2008).  This module reads the ``relation``
rows of the catalogue, splits each statement into its counts (with
:func:`numcheck.catalogue.statements.parse_statement`), and answers: which relations
state this span together with this count of that cycle?
"""

from __future__ import annotations

import functools
from dataclasses import dataclass
from fractions import Fraction

from .periods import statement_cycle

__all__ = ["KnownRelation", "known_relations", "matching", "matching_spans"]

# Statement units that measure a span (the left column of relate's question).
_SPAN_UNITS = {"tropical years": "years", "sidereal years": "years", "julian years": "years",
               "egyptian years": "years", "synodic months": "months", "days": "days"}


@dataclass(frozen=True)
class KnownRelation:
    """A relation row of the catalogue, with its counts by span unit and cycle."""

    id: str
    statement: str
    tradition: str
    source: str
    confidence: str
    spans: tuple[tuple[str, Fraction], ...]            # ("years", 8), ("days", 6585 1/3) ...
    counts: tuple[tuple[tuple[str, str], Fraction], ...]  # (("venus", "synodic"), 5) ...

    def span(self, unit: str) -> set[Fraction]:
        return {n for u, n in self.spans if u == unit}

    def count(self, body: str, cycle: str) -> set[Fraction]:
        return {n for key, n in self.counts if key == (body, cycle)}

    def to_dict(self) -> dict:
        return {"id": self.id, "statement": self.statement, "tradition": self.tradition,
                "source": self.source, "confidence": self.confidence}


def _relation_rows():
    """The relation rows of the catalogue (:class:`numcheck.catalogue.Entry`)."""
    from .. import catalogue

    return catalogue.entries(kind="relation")


def _from_row(row) -> KnownRelation | None:
    spans, counts = [], []
    for side in row.sides:
        term = side.terms[0]  # "241 sidereal months + 10 2/3 degrees": the whole count
        unit = " ".join(term.unit.lower().split())
        if unit in _SPAN_UNITS:
            spans.append((_SPAN_UNITS[unit], term.number))
        cycle = statement_cycle(unit)
        if cycle is not None:
            counts.append((cycle, term.number))
    if not counts and len(spans) < 2:
        return None
    return KnownRelation(row.id, row.statement, row.tradition, row.source, row.confidence,
                         tuple(spans), tuple(counts))


@functools.lru_cache(maxsize=1)
def known_relations() -> tuple[KnownRelation, ...]:
    """Every relation row of the catalogue that states counts numcheck can match."""
    return tuple(r for r in map(_from_row, _relation_rows()) if r is not None)


def matching(unit: str, span: Fraction, body: str, cycle: str, count: int) -> list[KnownRelation]:
    """The catalogue relations that state *span* *unit* = *count* cycles of *body*.

    A span in synodic months is also a count of the moon's synodic cycle, and
    one in tropical or sidereal years a count of the sun's: both ways of
    writing the Metonic 19 years = 235 months match.
    """
    span = Fraction(span)
    found = []
    for rel in known_relations():
        if span in rel.span(unit) and Fraction(count) in rel.count(body, cycle):
            found.append(rel)
    return found


def matching_spans(unit_a: str, a: Fraction, unit_b: str, b: Fraction) -> list[KnownRelation]:
    """The catalogue relations that state *a* *unit_a* = *b* *unit_b* (e.g. years and days)."""
    a, b = Fraction(a), Fraction(b)
    return [rel for rel in known_relations() if a in rel.span(unit_a) and b in rel.span(unit_b)]
