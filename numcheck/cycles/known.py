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

__all__ = ["KnownRelation", "known_relations", "matching", "matching_spans", "attested_for"]

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
    #: The span as the statement gives it: ("sidereal years", 427), ("days", 6940) ...
    given: tuple[tuple[str, Fraction], ...] = ()

    @property
    def given_in(self) -> str:
        """Whether the relation states its span in years, in days, or both (and which year).

        >>> next(r for r in known_relations() if r.id == "act_jupiter").given_in
        'years (sidereal years)'
        """
        kinds = [u for u, _ in self.given]
        years = sorted({u for u in kinds if u.endswith("years")})
        parts = []
        if years:
            parts.append(f"years ({', '.join(years)})")
        if "synodic months" in kinds:
            parts.append("months")
        if "days" in kinds:
            parts.append("days")
        return " and ".join(parts) or "counts of cycles only"

    def span(self, unit: str) -> set[Fraction]:
        return {n for u, n in self.spans if u == unit}

    def count(self, body: str, cycle: str) -> set[Fraction]:
        return {n for key, n in self.counts if key == (body, cycle)}

    def to_dict(self) -> dict:
        return {"id": self.id, "statement": self.statement, "tradition": self.tradition,
                "source": self.source, "confidence": self.confidence, "given_in": self.given_in}


def _relation_rows():
    """The relation rows of the catalogue (:class:`numcheck.catalogue.Entry`)."""
    from .. import catalogue

    return catalogue.entries(kind="relation")


def _from_row(row) -> KnownRelation | None:
    spans, counts, given = [], [], []
    for side in row.sides:
        term = side.terms[0]  # "241 sidereal months + 10 2/3 degrees": the whole count
        unit = " ".join(term.unit.lower().split())
        if unit in _SPAN_UNITS:
            spans.append((_SPAN_UNITS[unit], term.number))
            given.append((unit, term.number))
        cycle = statement_cycle(unit)
        if cycle is not None:
            counts.append((cycle, term.number))
    if not counts and len(spans) < 2:
        return None
    return KnownRelation(row.id, row.statement, row.tradition, row.source, row.confidence,
                         tuple(spans), tuple(counts), tuple(given))


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


def attested_for(body: str) -> list[tuple[KnownRelation, str, Fraction, Fraction]]:
    """Every relation stating a span in years and a count of one of *body*'s cycles.

    Returns (relation, cycle, years, count), whether or not the relation is a
    best approximation: the ACT's 427 years = 391 synodic periods of Jupiter
    is attested, though no convergent of the modern ratio.
    """
    out = []
    for rel in known_relations():
        years = sorted(rel.span("years"))
        if not years:
            continue
        for (b, cycle), count in rel.counts:
            if b == body and not (b == "sun" and cycle in ("tropical", "sidereal")):
                out.append((rel, cycle, years[0], count))
    return out
