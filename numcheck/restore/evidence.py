"""The evidence a restoration is weighed by: catalogue, context, expectation.

Three sources, all reduced to one shape (:class:`Target`: a value, how far
off still agrees, a weight, a plain-language label):

* the catalogue of periods and parameters, through
  :func:`numcheck.identify.catalogue_targets` (every catalogue value, or
  multiple of one, that the traces could reach, in the reading's unit);
* context passed in by the caller as :class:`Evidence` (the value a table's
  scheme or a relation expects in this cell);
* a value the user expects (``expect``: a text read with
  :func:`numcheck.read`, or an exact number).

A catalogue value or an expected value agrees with a reading when it lies
less than one unit of the reading's last written place away (the scribe may
have rounded or cut the value there); context evidence carries its own
tolerance.
"""

from __future__ import annotations

from dataclasses import dataclass
from fractions import Fraction

from ..errors import NumcheckRangeError
from ..reading import Reading, exact_text, sexagesimal_text
from . import scoring

__all__ = ["Evidence", "Target", "gather", "catalogue_source"]


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
        object.__setattr__(self, "value", Fraction(self.value))
        object.__setattr__(self, "tolerance", Fraction(self.tolerance))
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
    kind: str                    # "catalogue", "context" or "expect"
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
        except Exception:
            if notation is None:
                raise
            expected = read(expect, notation=notation)
        value = expected.value
        label = f"the expected value {expect}"
    else:
        value = Fraction(expect)
        label = f"the expected value {_value_text(reading, value)}"
    return Target(value, None, scoring.EXPECT_WEIGHT, label, "expect", id="expect")


def _catalogue(reading: Reading, space, unit: str | None, notes: list[str]) -> list[Target]:
    source = catalogue_source()
    if source is None:
        notes.append("The catalogue of periods is not installed, so only the evidence given was used.")
        return []
    seen: dict[tuple, Target] = {}
    ranges = {}
    for sub in space.subspaces:
        lo, hi = sub.bounds
        ulp = sub.ulp
        key = (sub.scale,)
        old = ranges.get(key)
        ranges[key] = (min(lo - ulp, old[0]) if old else lo - ulp, max(hi + ulp, old[1]) if old else hi + ulp)
    for lo, hi in ranges.values():
        for t in source(lo, hi, unit):
            value = Fraction(t.value)
            k = (getattr(t, "id", ""), value)
            if k in seen:
                continue
            statement = getattr(t, "statement", "") or getattr(t, "id", "")
            label = f"{statement} ({t.id})" if getattr(t, "id", "") and t.id not in statement else statement
            factor = Fraction(getattr(t, "factor", 1))
            if factor != 1:
                label = f"{exact_text(factor)} x [{label}]"
            seen[k] = Target(value, None, float(getattr(t, "weight", 1.0)), label, "catalogue",
                             group="catalogue", id=str(getattr(t, "id", "")))
    return sorted(seen.values(), key=lambda t: (t.value, t.id))


def gather(reading: Reading, space, *, expect=None, context=(), use_catalogue=True,
           unit: str | None = None) -> tuple[list[Target], list[str]]:
    """Every piece of evidence as :class:`Target` s, and notes on what was used."""
    notes: list[str] = []
    targets: list[Target] = []
    for i, ev in enumerate(context):
        if not isinstance(ev, Evidence):
            raise TypeError(f"context must hold Evidence objects, got {type(ev).__name__}")
        label = ev.label or f"context evidence {i + 1}"
        targets.append(Target(ev.value, ev.tolerance, float(ev.weight), label, "context",
                              id=f"context-{i + 1}"))
    if expect is not None:
        targets.append(_expect_target(reading, expect, reading.notation))
    if use_catalogue:
        targets.extend(_catalogue(reading, space, unit, notes))
    return [t for t in targets if t.weight > 0], notes
