"""Period relations: is N years (months, days) a whole number of cycles, and how good?

A scholar meets "8 years", "223 months", "59 years" in a text and asks which
cycles the span closes.  :func:`relate` answers for every cycle of the moon,
the sun and the five planets: the count of cycles in the span, the nearest
whole number, and what is left over (in days and in degrees of the cycle),
sorted by closeness, with the relations the catalogue attests marked with
their source.  :func:`search` finds the good relations themselves, from the
continued fraction of each cycle against the year and from spans that close
several cycles at once (:mod:`numcheck.cycles.convergents`).

Periods come from the catalogue: modern mean values at J2000.0 (pyerfa), or
with ``values="ancient"`` the periods of one tradition, to judge a relation
by the numbers its authors had.  A span in years is counted in the tropical
year of the chosen values (a tradition without one: its sidereal year), a
span in months in their synodic month.  The arithmetic is exact; decimals are
for display.
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from fractions import Fraction

from ..errors import LimitError, NumcheckRangeError, UnknownNameError
from .. import limits
from ..reading import decimal_text, exact_text
from .periods import BODIES, CYCLES, PeriodSet, unit_named
from .known import KnownRelation, attested_for, matching, matching_spans
from .convergents import best_ratios, record_spans

__all__ = ["relate", "search", "RelateResult", "SearchResult", "CycleCount", "SpanRecord",
           "DEFAULT_SEARCH_YEARS"]

#: Years the search walks when no --max-years is given.
DEFAULT_SEARCH_YEARS = 500


@dataclass(frozen=True)
class CycleCount:
    """How many cycles of one body fit in a span, and what is left over."""

    body: str
    cycle: str
    period: Fraction          # days
    period_id: str            # the catalogue row of the period
    span_days: Fraction
    nearest: int
    known: tuple[KnownRelation, ...] = ()

    @property
    def count(self) -> Fraction:
        return self.span_days / self.period

    @property
    def residual_days(self) -> Fraction:
        """The span minus ``nearest`` cycles, in days (positive: the span is longer)."""
        return self.span_days - self.nearest * self.period

    @property
    def residual_degrees(self) -> Fraction:
        """The residual as an arc of the cycle (360 degrees = one whole cycle)."""
        return self.residual_days / self.period * 360

    @property
    def closeness(self) -> float:
        """For sorting: the residual in turns; a span shorter than a cycle goes last."""
        return math.inf if self.nearest == 0 else abs(float(self.residual_degrees)) / 360

    def to_dict(self) -> dict:
        out = {
            "body": self.body,
            "cycle": self.cycle,
            "count": decimal_text(self.count, 6),
            "nearest": self.nearest,
            "residual_days": decimal_text(self.residual_days, 6),
            "residual_degrees": decimal_text(self.residual_degrees, 4),
            "residual_days_exact": exact_text(self.residual_days),
            "period_days": exact_text(self.period),
            "period_decimal": decimal_text(self.period, 9),
            "period_id": self.period_id,
            "known": [k.to_dict() for k in self.known],
        }
        if self.nearest == 0:
            out["note"] = "the span is shorter than half a cycle"
        return out


_SAME_KIND = "another kind of year: it differs from the tropical year only by precession or apsidal motion"


def _count(body, cycle, periods: PeriodSet, span_days: Fraction, nearest: int | None = None,
           known=()) -> CycleCount | None:
    entry = periods.entry(body, cycle)
    if entry is None:
        return None
    period = Fraction(entry.value)
    if nearest is None:
        nearest = round(span_days / period)
    return CycleCount(body, cycle, period, entry.id, span_days, nearest, tuple(known))


@dataclass(frozen=True)
class RelateResult:
    """Every cycle counted in a span of N units, closest first."""

    n: Fraction
    unit: str
    values: str
    tradition: str
    unit_days: Fraction
    unit_defined_by: str
    bodies: tuple[CycleCount, ...]
    missing: tuple[tuple[str, str], ...]

    @property
    def span_days(self) -> Fraction:
        return self.n * self.unit_days

    @property
    def known(self) -> tuple[CycleCount, ...]:
        """The counts that a relation of the catalogue attests."""
        return tuple(c for c in self.bodies if c.known)

    def _row(self, count: CycleCount) -> dict:
        row = count.to_dict()
        if self.unit == "years" and count.body == "sun":
            row["note"] = _SAME_KIND
        return row

    def to_dict(self) -> dict:
        return {
            "n": exact_text(self.n),
            "unit": self.unit,
            "values": self.values,
            "tradition": self.tradition,
            "span_days": exact_text(self.span_days),
            "span_days_decimal": decimal_text(self.span_days, 6),
            "unit_days": exact_text(self.unit_days),
            "unit_defined_by": self.unit_defined_by,
            "bodies": [self._row(c) for c in self.bodies],
            "missing": [f"{b} {c}" for b, c in self.missing],
        }


def _positive(n, what: str = "N") -> Fraction:
    if isinstance(n, bool):
        raise NumcheckRangeError(f"{what} must be a number, not {n!r}.", value=n,
                                 legal="a positive number of years, months or days")
    if isinstance(n, str):
        from ..catalogue.statements import parse_number

        text = n.strip()
        try:
            value = Fraction(text)
        except (ValueError, ZeroDivisionError):
            try:
                value = parse_number(text)
            except (ValueError, ZeroDivisionError):
                raise NumcheckRangeError(
                    f"{what} = {n!r} is not a number numcheck can read here.", value=n,
                    legal="a positive number: 19, 6585 1/3, 19756/3, 6585.333 or 1,49,45;20") from None
    else:
        try:
            value = Fraction(n)
        except (TypeError, ValueError, OverflowError):
            raise NumcheckRangeError(f"{what} = {n!r} is not a number.", value=n,
                                     legal="a positive number of years, months or days") from None
    if value <= 0:
        raise NumcheckRangeError(f"{what} = {exact_text(value)} is not a span of time.", value=value,
                                 legal="a positive number of years, months or days (greater than 0)")
    return value


def relate(n, unit: str, *, values: str = "modern", tradition: str | None = None) -> RelateResult:
    """Count every cycle of moon, sun and planets in N years, months or days.

    Sorted by closeness (the residual as a fraction of its cycle).  For a
    span in years the sun's other years (sidereal, anomalistic) come last:
    they differ from the tropical year only by precession and the motion of
    the apsides, so they are always "close" and say nothing about the span.

    >>> r = relate(8, "years")
    >>> venus = next(c for c in r.bodies if (c.body, c.cycle) == ("venus", "synodic"))
    >>> venus.nearest, round(float(venus.residual_days), 2), venus.known[-1].id
    (5, 2.33, 'goalyear_venus')
    """
    n = _positive(n)
    unit = unit_named(unit)
    periods = PeriodSet(values, tradition)
    unit_days, defined_by = periods.unit_days(unit)
    span = n * unit_days
    counts, missing = [], []
    for body, cycle in CYCLES:
        # The cycle that defines the unit counts N exactly: nothing to learn.
        if f"{body} {cycle}" == defined_by:
            continue
        found = _count(body, cycle, periods, span)
        if found is None:
            missing.append((body, cycle))
            continue
        known = matching(unit, n, body, cycle, found.nearest) if found.nearest else []
        counts.append(CycleCount(found.body, found.cycle, found.period, found.period_id, span,
                                 found.nearest, tuple(known)))
    counts.sort(key=lambda c: (unit == "years" and c.body == "sun", c.closeness))
    return RelateResult(n, unit, values, periods.tradition, unit_days, defined_by, tuple(counts),
                        tuple(missing))


@dataclass(frozen=True)
class Ratio:
    """p cycles of a body in q years: a best rational approximation."""

    kind: str                 # "convergent" or "semiconvergent"
    years: int
    counted: CycleCount

    def to_dict(self) -> dict:
        out = {"kind": self.kind, "years": self.years, "cycles": self.counted.nearest}
        out.update(self.counted.to_dict())
        return out


@dataclass(frozen=True)
class SpanRecord:
    """A span close to whole numbers of several cycles at once (a record span)."""

    span: int
    unit: str
    span_days: Fraction
    counts: tuple[CycleCount, ...]
    known: tuple[KnownRelation, ...]

    @property
    def worst_degrees(self) -> Fraction:
        return max(abs(c.residual_degrees) for c in self.counts)

    def to_dict(self) -> dict:
        return {"span": self.span, "unit": self.unit, "span_days": exact_text(self.span_days),
                "span_days_decimal": decimal_text(self.span_days, 6),
                "worst_degrees": exact_text(self.worst_degrees),
                "worst_degrees_decimal": decimal_text(self.worst_degrees, 4),
                "counts": [c.to_dict() for c in self.counts],
                "known": [k.to_dict() for k in self.known]}


@dataclass(frozen=True)
class SearchResult:
    """Best relations of each body's cycles with the year, and record spans for all."""

    bodies: tuple[str, ...]
    max_years: int
    values: str
    tradition: str
    year_days: Fraction
    year_defined_by: str
    ratios: tuple[Ratio, ...]
    reference: str
    span_unit: str
    targets: tuple[str, ...]
    spans: tuple[SpanRecord, ...]
    #: The relations of the catalogue for these bodies, best approximations or not.
    attested: tuple["Attested", ...] = ()
    year: str = "tropical"

    def to_dict(self) -> dict:
        return {
            "year": self.year,
            "attested": [a.to_dict() for a in self.attested],
            "search": list(self.bodies),
            "max_years": self.max_years,
            "values": self.values,
            "tradition": self.tradition,
            "year_days": exact_text(self.year_days),
            "year_defined_by": self.year_defined_by,
            "ratios": [r.to_dict() for r in self.ratios],
            "simultaneous": {"reference": self.reference, "unit": self.span_unit,
                             "cycles": list(self.targets),
                             "spans": [s.to_dict() for s in self.spans]},
        }


@dataclass(frozen=True)
class Attested:
    """A relation of the catalogue between years and a body's cycles, counted with the search's year."""

    relation: KnownRelation
    years: Fraction
    counted: CycleCount
    best: bool                # among the best approximations the search found

    def to_dict(self) -> dict:
        out = {"id": self.relation.id, "statement": self.relation.statement,
               "given_in": self.relation.given_in, "years": exact_text(self.years),
               "cycles": self.counted.nearest, "best_approximation": self.best,
               "tradition": self.relation.tradition, "source": self.relation.source,
               "confidence": self.relation.confidence}
        out.update({k: v for k, v in self.counted.to_dict().items() if k not in ("known", "nearest")})
        return out


#: The years a search may count in.
SEARCH_YEARS = ("tropical", "sidereal")


def _bodies(names) -> tuple[str, ...]:
    if isinstance(names, str):
        names = [p for p in names.replace(",", " ").split() if p]
    out = []
    for name in names:
        key = str(name).strip().lower()
        if key not in BODIES:
            raise UnknownNameError("body", name, BODIES)
        if key not in out:
            out.append(key)
    if not out:
        raise UnknownNameError("body", "", BODIES)
    return tuple(out)


def _targets(bodies, cycles, periods: PeriodSet) -> list[tuple[str, str]]:
    """The cycles a simultaneous search closes, by default the ones a historian pairs."""
    if cycles:
        wanted = [c.strip().lower() for c in (cycles.split(",") if isinstance(cycles, str) else cycles)]
        known_cycles = {c for _, c in CYCLES}
        for c in wanted:
            if c not in known_cycles:
                raise UnknownNameError("cycle", c, known_cycles)
        chosen = [(b, c) for b in bodies for c in wanted if (b, c) in CYCLES]
    elif bodies == ("moon",):
        chosen = [("moon", "anomalistic"), ("moon", "draconitic")]
    elif len(bodies) == 1 and bodies[0] != "sun":
        chosen = [(bodies[0], "synodic"), (bodies[0], "sidereal")]
    else:
        chosen = [(b, "synodic" if b != "sun" else "sidereal") for b in bodies]
    return [t for t in chosen if periods.entry(*t) is not None]


def _day_ratios(year: Fraction, max_years: int) -> list[Ratio]:
    """Whole days in whole years: the calendar question (1461 days in 4 years ...)."""
    out = []
    for p, q, kind in best_ratios(year, max_years):
        known = matching_spans("years", Fraction(q), "days", Fraction(p))
        counted = CycleCount("day", "civil", Fraction(1), "", q * year, p, tuple(known))
        out.append(Ratio(kind, q, counted))
    return out


def search(bodies, *, max_years: int = DEFAULT_SEARCH_YEARS, values: str = "modern",
           tradition: str | None = None, cycles=None, year: str = "tropical") -> SearchResult:
    """The best period relations of *bodies* (a name, or several) up to *max_years*.

    Two parts: for each cycle of each body, the convergents and
    semiconvergents of (year / period), i.e. p cycles in q years with no
    better fraction of fewer years (for the sun also whole days in whole
    years, the calendar question); and the record spans that close the
    chosen *cycles* of all the bodies at once (the moon alone: whole synodic
    months closing the anomalistic and draconitic months, as the Saros does;
    otherwise whole years).  Relations the catalogue attests are marked, and
    listed apart (``attested``) even when they are no best approximation.
    *year* is ``tropical`` (the default) or ``sidereal``: the Babylonian
    relations count sidereal years.
    """
    if year not in SEARCH_YEARS:
        raise UnknownNameError("year", year, SEARCH_YEARS)
    bodies = _bodies(bodies)
    if isinstance(max_years, bool) or not isinstance(max_years, int) or max_years < 1:
        raise NumcheckRangeError(f"--max-years {max_years!r} is not a number of years.",
                                 value=max_years, legal=f"a whole number from 1 to {limits.RELATE_MAX_SEARCH_YEARS}")
    if max_years > limits.RELATE_MAX_SEARCH_YEARS:
        raise LimitError("longest span to search, in years", max_years, limits.RELATE_MAX_SEARCH_YEARS,
                         "Search a shorter span, or raise numcheck.limits.RELATE_MAX_SEARCH_YEARS.")
    periods = PeriodSet(values, tradition)
    year_kind = year
    year, year_by = periods.unit_days("years")
    if year_kind == "sidereal":
        sidereal = periods.period("sun", "sidereal")
        if sidereal is None:
            raise NumcheckRangeError(f"The {periods.tradition} values give no sidereal year.",
                                     legal="a tradition whose catalogue rows give the sun's sidereal period")
        year, year_by = sidereal, "sun sidereal"
    ratios = []
    for body in bodies:
        for b, cycle in CYCLES:
            if b != body or f"{b} {cycle}" == year_by:
                continue
            period = periods.period(b, cycle)
            if period is None:
                continue
            for p, q, kind in best_ratios(year / period, max_years):
                known = matching("years", Fraction(q), b, cycle, p)
                counted = _count(b, cycle, periods, q * year, nearest=p, known=known)
                ratios.append(Ratio(kind, q, counted))
        if body == "sun":
            ratios.extend(_day_ratios(year, max_years))
    targets = _targets(bodies, cycles, periods)
    if bodies == ("moon",) and not cycles:
        unit, ref_days, reference = "months", periods.unit_days("months")[0], "moon synodic"
        max_span = math.ceil(max_years * year / ref_days)
    else:
        unit, ref_days, reference, max_span = "years", year, year_by, max_years
    spans = []
    if targets:
        for n in record_spans(ref_days, [periods.period(*t) for t in targets], max_span):
            span_days = n * ref_days
            counts = tuple(_count(b, c, periods, span_days) for b, c in targets)
            known = {}
            for c in counts:
                for rel in matching(unit, Fraction(n), c.body, c.cycle, c.nearest):
                    known[rel.id] = rel
            counts = tuple(CycleCount(c.body, c.cycle, c.period, c.period_id, c.span_days, c.nearest,
                                      tuple(matching(unit, Fraction(n), c.body, c.cycle, c.nearest)))
                           for c in counts)
            spans.append(SpanRecord(n, unit, span_days, counts, tuple(known.values())))
    best = {(r.counted.body, r.counted.cycle, r.years, r.counted.nearest) for r in ratios}
    attested = []
    for body in bodies:
        for rel, cycle, years, count in attested_for(body):
            if years > max_years or count.denominator != 1:
                continue
            counted = _count(body, cycle, periods, years * year, nearest=int(count), known=(rel,))
            if counted is None:
                continue
            attested.append(Attested(rel, years, counted,
                                     (body, cycle, int(years), int(count)) in best))
    return SearchResult(bodies, max_years, values, periods.tradition, year, year_by, tuple(ratios),
                        reference, unit, tuple(f"{b} {c}" for b, c in targets), tuple(spans),
                        tuple(attested), year_kind)
