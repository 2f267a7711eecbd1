"""The candidate space: every reading a damaged number allows, with its prior.

A :class:`~numcheck.reading.Reading` says, slot by slot, which values the
traces allow.  This module turns that into the *space* the search walks: one
:class:`SubSpace` per way of fixing what the text leaves open as a whole (how
many places an unknown gap ``[...]`` stands for; at which power of 60 a
floating cuneiform number sits), each a row of :class:`Position` s (one per
counted slot) whose :class:`Option` s carry a prior probability.

The prior is a product of independent factors (one per position, one for
the gap count, one for the magnitude), so that the probability mass of any
set of readings the evidence does not touch is known in closed form.  The
factors are documented in :mod:`numcheck.restore.scoring`.
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from functools import cached_property, lru_cache
from fractions import Fraction

from .. import limits
from ..reading import Reading, Slot, Status
from . import scoring

__all__ = ["Option", "Position", "SubSpace", "Space", "build_space"]


@dataclass(frozen=True)
class Option:
    """One value a position may take, with its prior probability."""

    value: Fraction          # in units of the position's place
    prior: float             # probability within the position (the options sum to 1)
    kind: str                # "read", "lost", "doubtful-read", "doubtful-alternative", "ambiguous"
    editor: bool = False     # the editor's restoration
    reason: str = ""         # why this option is possible (for doubtful alternatives)


@dataclass(frozen=True)
class Position:
    """One counted slot of a gapless reading and the options it has."""

    slot_index: int          # index of the slot in the expansion
    place: int
    options: tuple[Option, ...]
    slot: Slot

    @cached_property
    def span(self) -> tuple[Fraction, Fraction]:
        """The smallest and largest value the position may take (in units of its place)."""
        if all(o.value.denominator == 1 for o in self.options):
            nums = [o.value.numerator for o in self.options]
            return Fraction(min(nums)), Fraction(max(nums))
        values = [o.value for o in self.options]
        return min(values), max(values)

    @property
    def open(self) -> bool:
        """Whether the traces leave this position more than one value."""
        return len(self.options) > 1


@dataclass(frozen=True)
class SubSpace:
    """A gapless reading at one magnitude, with the prior mass of that choice."""

    index: int
    expansion: Reading
    positions: tuple[Position, ...]
    scale: int               # power of 60 applied to the reading (0 unless floating)
    mass: float              # prior probability of this gap count and magnitude
    gap_places: tuple[int, ...]  # places each [...] stands for (empty without a gap)

    @cached_property
    def count(self) -> int:
        return math.prod(len(p.options) for p in self.positions)

    @cached_property
    def bounds(self) -> tuple[Fraction, Fraction]:
        """The smallest and largest value of the sub-space (doubtful alternatives included)."""
        base = Fraction(self.expansion.base)
        lo = sum((p.span[0] * base ** p.place for p in self.positions), Fraction(0))
        hi = sum((p.span[1] * base ** p.place for p in self.positions), Fraction(0))
        factor = base ** self.scale
        lo, hi = lo * factor, hi * factor
        return (lo, hi) if self.expansion.sign > 0 else (-hi, -lo)

    @cached_property
    def resolution(self) -> Fraction:
        """The finest step the reading writes, before scaling.

        One unit of the last written place; finer when a written part is
        finer (``6585 1/3`` is written to thirds of a day, not to days).
        """
        step = self.expansion.ulp
        base = Fraction(self.expansion.base)
        for p in self.positions:
            if len(p.options) == 1:
                v = p.options[0].value * base ** p.place
                part = v - (v.numerator // v.denominator)
                if 0 < part < step:
                    step = part
        return step

    @cached_property
    def ulp(self) -> Fraction:
        """The finest step the reading writes (:attr:`resolution`), at this magnitude."""
        return self.resolution * Fraction(self.expansion.base) ** self.scale


@dataclass(frozen=True)
class Space:
    """Every reading the traces allow, as sub-spaces, and what was assumed."""

    reading: Reading
    subspaces: tuple[SubSpace, ...]
    notes: tuple[str, ...]

    @property
    def count(self) -> int:
        """How many readings the traces allow (magnitudes counted apart)."""
        return sum(s.count for s in self.subspaces)


def _alternatives(notation: str, value: Fraction, place_max: int | None, place: int):
    """Confusion alternatives for a doubtful value, from the notations' slip data.

    Falls back on the one-wedge and one-ten miscount of the cuneiform and
    modern sexagesimal tradition while the confusion tables are not installed;
    a notation with no confusion data offers no alternative.
    """
    try:
        from ..slips.confusions import alternatives
    except ImportError:
        alternatives = None
    if alternatives is not None:
        from ..errors import UnknownNameError

        try:
            found = alternatives(notation, value, place_max=place_max, place=place)
        except UnknownNameError:
            return []
        return [(Fraction(a.value), float(a.weight), str(a.reason)) for a in found]
    out = []
    for delta, why in ((1, "one wedge more (common practice)"), (-1, "one wedge less (common practice)"),
                       (10, "one ten more (common practice)"), (-10, "one ten less (common practice)")):
        alt = value + delta
        if alt < 0 or (place_max is not None and alt > place_max):
            continue
        out.append((alt, 1.0, why))
    return out


def _place_max(reading: Reading, slot: Slot) -> int | None:
    # A place of a place-value notation holds base-1 at most; a lone whole
    # place (365;14,48) and additive signs have no such bound.
    if reading.base and slot.place < 0:
        return reading.base - 1
    leading = [s for s in reading.counted_slots if s.place > slot.place]
    return reading.base - 1 if leading and reading.base else None


def _options(reading: Reading, slot: Slot, last: bool = False) -> tuple[Option, ...]:
    status = slot.status
    if status is Status.DOUBTFUL and len(slot.values) == 1:
        read_value = slot.values[0]
        alts = [(v, w, why) for v, w, why in _alternatives(reading.notation, read_value,
                                                             _place_max(reading, slot), slot.place)
                if v != read_value and w > 0]
        merged: dict[Fraction, tuple[float, str]] = {}
        for v, w, why in alts:
            if v not in merged or merged[v][0] < w:
                merged[v] = (w, why)
        if not merged:
            return (Option(read_value, 1.0, "doubtful-read"),)
        total = sum(w for w, _ in merged.values())
        alt_mass = 1.0 - scoring.DOUBT_READ_MASS
        opts = [Option(read_value, scoring.DOUBT_READ_MASS, "doubtful-read")]
        opts += [Option(v, alt_mass * w / total, "doubtful-alternative", reason=why)
                 for v, (w, why) in sorted(merged.items())]
        return tuple(opts)
    if len(slot.values) == 1:
        return (Option(slot.values[0], 1.0, "read", editor=slot.editor is not None),)
    kind = "lost" if status in (Status.LOST, Status.RESTORED) else (
        "unread" if status is Status.UNREAD else
        "doubtful-read" if status.damaged else "ambiguous")   # a Greek 'ο': 0 or 70
    values = slot.values
    if all(v.denominator == 1 for v in values):   # a cheap key: the same sets recur (0-59, 50-59 ...)
        key = tuple(v.numerator for v in values)
        editor = slot.editor.numerator if slot.editor is not None and slot.editor.denominator == 1 \
            else slot.editor
        return _open_int_options(key, editor, kind, last)
    return _open_options(values, slot.editor, kind, last)


@lru_cache(maxsize=256)
def _open_int_options(values: tuple[int, ...], editor, kind: str, last: bool) -> tuple[Option, ...]:
    return _open_options(tuple(Fraction(v) for v in values),
                         Fraction(editor) if editor is not None else None, kind, last)


def _open_options(values: tuple[Fraction, ...], editor: Fraction | None, kind: str,
                  last: bool) -> tuple[Option, ...]:
    weights = [scoring.simplicity(v, last) * (scoring.EDITOR_WEIGHT if v == editor else 1.0)
               for v in values]
    total = sum(weights)
    return tuple(Option(v, w / total, kind, editor=(v == editor)) for v, w in zip(values, weights))


def _gap_counts(reading: Reading, expansion: Reading) -> tuple[int, ...]:
    counts = []
    j = 0
    slots = expansion.slots
    for slot in reading.slots:
        if slot.gap is None:
            j += 1
            continue
        # The expansion put the gap's places in a row of LOST slots with no gap.
        n = 0
        while j < len(slots) and slots[j].status is Status.LOST and slots[j].text == slot.text \
                and slots[j].span == slot.span:
            n += 1
            j += 1
        counts.append(n)
    return tuple(counts)


def _scales(expansion: Reading) -> list[int]:
    """Powers of 60 to try for a floating reading: its first place in the window."""
    top = max((s.place for s in expansion.counted_slots), default=0)
    lo, hi = limits.RESTORE_FLOAT_FIRST_PLACE
    return [lead - top for lead in range(lo, hi + 1)]


def build_space(reading: Reading) -> Space:
    """The candidate space of *reading*: sub-spaces, positions, options, priors."""
    notes: list[str] = []
    expansions = list(reading.expansions())
    gap_weights = []
    gap_lists = []
    for e in expansions:
        counts = _gap_counts(reading, e)
        gap_lists.append(counts)
        fewest = sum(s.gap[0] for s in reading.slots if s.gap is not None)
        gap_weights.append(scoring.GAP_DECAY ** (sum(counts) - fewest))
    if reading.has_gap:
        notes.append(f"'[...]' (lost places, number unknown) is taken as 1 to {limits.GAP_MAX_PLACES} "
                     f"places (numcheck.limits.GAP_MAX_PLACES); fewer places are a little more likely "
                     f"a priori.")
    total_gap = sum(gap_weights)
    subspaces: list[SubSpace] = []
    for e, gw, counts in zip(expansions, gap_weights, gap_lists):
        lowest = min((s.place for s in e.slots if s.counted), default=0)
        # A floating number's last place is its last written place too; an
        # additive notation (every sign at place 0) has no empty last place.
        additive = all(s.place == 0 for s in e.slots)
        positions = tuple(Position(i, s.place, _options(reading, s, s.place == lowest and not additive), s)
                          for i, s in enumerate(e.slots) if s.counted)
        scales = _scales(e) if reading.floating else [0]
        weights = [scoring.scale_weight(e, s) if reading.floating else 1.0 for s in scales]
        wsum = sum(weights)
        for s, w in zip(scales, weights):
            subspaces.append(SubSpace(len(subspaces), e, positions, s, (gw / total_gap) * (w / wsum),
                                      counts))
    if reading.floating:
        lo, hi = limits.RESTORE_FLOAT_FIRST_PLACE
        notes.append(f"The text does not fix the magnitude: its first place is tried from 60^{lo} to "
                     f"60^{hi} (numcheck.limits.RESTORE_FLOAT_FIRST_PLACE); each magnitude counts as a "
                     f"reading of its own.")
    return Space(reading, tuple(subspaces), tuple(notes))
