"""The evidence a restoration is weighed by: catalogue, context, expectation.

Three sources, all reduced to one shape (:class:`Target`: a value, how far
off still agrees, a weight, a plain-language label):

* the catalogue of periods and parameters, through
  :func:`numcheck.identify.catalogue_targets` (every catalogue value, or
  multiple of one, that the traces could reach, in the reading's unit);
* context passed in by the caller as :class:`Evidence` (the value a table's
  scheme or a relation expects in this cell);
* a value the user expects (``expect``: a text read with
  :func:`numcheck.read`, or an exact number);
* a relation from mathematics the number should satisfy (``satisfies``:
  ``x^2 = 2``, ``1/x = 7,30``; :mod:`numcheck.restore.mathematics`).

A catalogue value or an expected value agrees with a reading when it lies
less than one unit of the reading's last written place away (the scribe may
have rounded or cut the value there); context evidence carries its own
tolerance.
"""

from __future__ import annotations

from dataclasses import dataclass
from fractions import Fraction

from ..errors import NumcheckError, NumcheckRangeError
from ..reading import Reading, exact_text, sexagesimal_text
from . import scoring

__all__ = ["Evidence", "Target", "gather", "catalogue_source"]


def _short_repr(x) -> str:
    text = repr(x)
    return text if len(text) <= 60 else text[:59] + "…"


@dataclass(frozen=True)
class Evidence:
    """An expected value from the context of the number, with its tolerance.

    ``value`` is in the reading's unit (at the reading's scale for a fixed
    reading; a floating reading is tried at every magnitude); ``tolerance``
    is how far off still counts as agreeing; ``weight`` the strength of this
    evidence against "the number is none of these" (weight 1); ``label`` says
    where it comes from, in plain language.
    """

    value: Fraction
    tolerance: Fraction = Fraction(0)
    weight: float = 1.0
    label: str = ""

    def __post_init__(self):
        for name in ("value", "tolerance"):
            raw = getattr(self, name)
            try:
                if isinstance(raw, bool):
                    raise TypeError(raw)
                object.__setattr__(self, name, Fraction(raw))
            except (TypeError, ValueError, OverflowError, ZeroDivisionError, ArithmeticError):
                raise NumcheckRangeError(f"The {name} of evidence {self.label!r} is "
                                         f"{_short_repr(raw)}, not an exact number.", value=raw,
                                         legal="a finite number (an int, a Fraction, a finite "
                                               "float or a text like '19756/3')") from None
        if not isinstance(self.weight, (int, float)) or isinstance(self.weight, bool):
            raise NumcheckRangeError(f"The weight of evidence {self.label!r} is "
                                     f"{_short_repr(self.weight)}.", value=self.weight,
                                     legal="a number, 0 or more")
        if self.tolerance < 0:
            raise NumcheckRangeError(f"The tolerance of evidence {self.label!r} is {self.tolerance}.",
                                     value=self.tolerance, legal="0 or more")
        if not self.weight >= 0:
            raise NumcheckRangeError(f"The weight of evidence {self.label!r} is {self.weight}.",
                                     value=self.weight, legal="0 or more")


@dataclass(frozen=True)
class Target:
    """One value the evidence names, as the search uses it."""

    value: Fraction
    tolerance: Fraction | None   # None: less than one unit of the reading's last place
    weight: float
    label: str
    kind: str                    # "catalogue", "context", "expect" or "mathematics"
    group: str | None = None     # evidence of one group shares the group's weight
    id: str = ""


def catalogue_source():
    """The catalogue look-up, or None when the catalogue is not installed."""
    try:
        from ..identify import catalogue_targets
    except ImportError:
        return None
    return catalogue_targets


def _value_text(reading: Reading, value: Fraction) -> str:
    if reading.base == 60:
        return sexagesimal_text(value)
    return exact_text(value)


def _expect_target(reading: Reading, expect, notation: str | None) -> Target:
    from ..reader import read

    if isinstance(expect, str):
        try:
            expected = read(expect)
        except NumcheckError:        # not readable on its own: try the reading's notation
            if notation is None:
                raise
            expected = read(expect, notation=notation)
        if expected.damaged:        # a damaged expectation: any value it allows
            lo, hi = expected.min, expected.max
            return Target((lo + hi) / 2, (hi - lo) / 2, scoring.EXPECT_WEIGHT,
                          f"the expected value {expect} (any of its readings)", "expect", id="expect")
        value = expected.value
        label = f"the expected value {expect}"
    else:
        try:
            value = Fraction(expect)
        except (TypeError, ValueError, OverflowError):
            raise NumcheckRangeError(f"The expected value {expect!r} is not an exact number.", value=expect,
                                     legal="a text in the number's notation, or an int or Fraction"
                                     ) from None
        label = f"the expected value {_value_text(reading, value)}"
    return Target(value, None, scoring.EXPECT_WEIGHT, label, "expect", id="expect")


def _modern(ident: str) -> bool:
    """Whether a catalogue row is a modern value (no ancient scribe could have written it)."""
    from .. import catalogue

    try:
        return catalogue.by_id(ident).tradition.startswith("modern")
    except Exception:   # a row the catalogue does not know (a stand-in): keep it
        return False


def _tradition_of(ident: str) -> str:
    from .. import catalogue

    try:
        return catalogue.by_id(ident).tradition
    except Exception:   # a row the catalogue does not know (a stand-in)
        return ""


def _catalogue(reading: Reading, space, unit: str | None, notes: list[str],
               tradition: str | None = None) -> list[Target]:
    """The catalogue values the traces could reach, one target per distinct value.

    Only the values themselves and their simple parts and multiples (n/m
    with n, m <= ``scoring.CATALOGUE_MAX_FACTOR``) count: a long whole
    multiple of a period (4260 months) fits almost any count and says
    nothing.  Modern values (the catalogue's ``modern`` traditions) are left
    out: they serve to judge an ancient value, not to restore one.  Rows that give the same value are one hypothesis, with the
    weight of the best of them.  A row of another tradition than *tradition*
    (asked for, or said by the notation: Greek letters, cuneiform, abjad)
    weighs less (:func:`numcheck.identify.ranking.tradition_weight`).
    """
    source = catalogue_source()
    if source is None:
        notes.append("The catalogue of periods is not installed, so only the evidence given was used.")
        return []
    spans = sorted((sub.bounds[0] - sub.ulp, sub.bounds[1] + sub.ulp) for sub in space.subspaces)
    ranges: list[tuple[Fraction, Fraction]] = []
    for lo, hi in spans:            # one look-up per stretch of values (gap counts, magnitudes)
        if ranges and lo <= ranges[-1][1]:
            ranges[-1] = (ranges[-1][0], max(hi, ranges[-1][1]))
        else:
            ranges.append((lo, hi))
    best: dict[Fraction, list] = {}   # value -> [weight, label, id, others]
    top = scoring.CATALOGUE_MAX_FACTOR
    from ..identify.ranking import text_tradition, tradition_weight

    wanted = tradition if tradition is not None else text_tradition(reading.notation)
    for lo, hi in ranges:
        for t in source(lo, hi, unit, max_factor=top):
            factor = Fraction(getattr(t, "factor", 1))
            if factor.numerator > top or factor.denominator > top:
                continue
            ident = str(getattr(t, "id", ""))
            if _modern(ident):
                continue
            value = Fraction(t.value)
            weight = float(getattr(t, "weight", 1.0)) ** scoring.CATALOGUE_SHARPNESS
            if wanted is not None and ident:
                weight *= tradition_weight(_tradition_of(ident), wanted)
            old = best.get(value)
            if old is not None:
                if ident != old[2] and weight <= old[0]:
                    old[3].add(ident)
                if weight <= old[0]:
                    continue
            statement = getattr(t, "statement", "") or ident
            label = f"{statement} ({ident})" if ident and ident not in statement else statement
            if factor != 1:
                label = f"{exact_text(factor)} x [{label}]"
            others = old[3] | ({old[2]} - {ident}) if old is not None else set()
            best[value] = [weight, label, ident, others]
    out = []
    for value, (weight, label, ident, others) in best.items():
        if others:
            label += f" and {len(others)} other row{'s' if len(others) > 1 else ''} ({', '.join(sorted(others)[:3])}" \
                     + (", ..." if len(others) > 3 else "") + ")"
        out.append(Target(value, None, weight, label, "catalogue", group="catalogue", id=ident))
    return sorted(out, key=lambda t: (t.value, t.id))


def _relation_targets(satisfies) -> list[Target]:
    from .mathematics import parse_relation, solve

    relations = [satisfies] if isinstance(satisfies, str) else list(satisfies)
    out = []
    for i, text in enumerate(relations):
        relation = parse_relation(text)
        out.append(Target(solve(relation), None, scoring.EXPECT_WEIGHT, relation.label, "mathematics",
                          id=f"relation-{i + 1}"))
    return out


def gather(reading: Reading, space, *, expect=None, context=(), use_catalogue=True,
           unit: str | None = None, tradition: str | None = None,
           satisfies=()) -> tuple[list[Target], list[str]]:
    """Every piece of evidence as :class:`Target` s, and notes on what was used."""
    notes: list[str] = []
    targets: list[Target] = []
    if context is None:
        context = ()
    if isinstance(context, (str, bytes, Evidence)) or not hasattr(context, "__iter__"):
        raise NumcheckError(f"context must be a list of Evidence objects, got "
                            f"{type(context).__name__} {_short_repr(context)}.")
    for i, ev in enumerate(context):
        if not isinstance(ev, Evidence):
            raise NumcheckError(f"context must hold Evidence objects, got {type(ev).__name__} "
                                f"{_short_repr(ev)} at position {i + 1}.")
        label = ev.label or f"context evidence {i + 1}"
        targets.append(Target(ev.value, ev.tolerance, float(ev.weight), label, "context",
                              id=f"context-{i + 1}"))
    if expect is not None:
        targets.append(_expect_target(reading, expect, reading.notation))
    if satisfies:
        targets.extend(_relation_targets(satisfies))
    if use_catalogue:
        targets.extend(_catalogue(reading, space, unit, notes, tradition))
    return [t for t in targets if t.weight > 0], notes
