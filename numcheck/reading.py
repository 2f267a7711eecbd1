"""The core model: a number as read, with what is lost or uncertain.

A :class:`Reading` is a row of :class:`Slot` s.  Each slot is one place (or, in
an additive notation, one sign) and holds the *set* of values the traces allow
for it, its status (read, doubtful, lost, restored ...), the text as written
and its span in the input.  A slot contributes ``value * base ** place`` to
the number.  Everything is exact (:class:`fractions.Fraction`); the model knows
no notation: the notations build Readings and format them back.

An unknown number of lost places (``[...]``) is a *gap* slot: it stands for
between ``gap[0]`` and ``gap[1]`` lost places.  Slots to its left carry the
place they would have with the fewest lost places; :meth:`Reading.expansions`
gives one gapless Reading per possible count.
"""

from __future__ import annotations

import itertools
import math
from collections.abc import Iterator
from dataclasses import dataclass, field, replace
from enum import Enum
from fractions import Fraction

__all__ = ["Status", "Slot", "Reading", "exact_text", "sexagesimal_text", "parse_exact", "place_sum"]


class Status(str, Enum):
    """What the text says about a slot (after the Leiden conventions)."""

    READ = "read"                # clearly read
    DOUBTFUL = "doubtful"        # read, but doubtful (underdot or ?)
    UNREAD = "unread"            # present on the original but not read (x)
    LOST = "lost"                # lost, not restored ([x], [...])
    RESTORED = "restored"        # lost, restored by the editor ([5])
    ADDED = "added"              # added by the editor (< >)
    SUPERFLUOUS = "superfluous"  # written by the scribe, suppressed ({ })

    @property
    def damaged(self) -> bool:
        return self in (Status.DOUBTFUL, Status.UNREAD, Status.LOST, Status.RESTORED)


class _computed_once:
    """:func:`functools.cached_property` without its lock: Python 3.11 takes one at the first
    access of each value, a good part of reading a plain number.  A Reading is immutable,
    so two threads that compute the same value at once only do the work twice."""

    def __init__(self, fn):
        self.fn = fn
        self.__doc__ = fn.__doc__

    def __set_name__(self, owner, name: str) -> None:
        self.name = name

    def __get__(self, obj, owner=None):
        if obj is None:
            return self
        value = obj.__dict__[self.name] = self.fn(obj)
        return value


def place_sum(terms, base: int = 60) -> Fraction:
    """The exact sum of value x base**place over (value, place) pairs.

    Whole values are summed as one integer over the lowest place (one
    Fraction at the end, not one per place), which is what makes reading a
    corpus of numbers cheap; fractional values (a unit fraction in a slot)
    are added as Fractions.

    >>> place_sum([(Fraction(1), 1), (Fraction(49), 0), (Fraction(20), -1)])
    Fraction(328, 3)
    """
    terms = list(terms)
    low = min((p for _, p in terms), default=0)
    shift = -low if low < 0 else 0
    whole = 0
    rest = Fraction(0)
    for v, p in terms:
        if v.denominator == 1:
            whole += v.numerator * base ** (p + shift)
        else:
            rest += v * Fraction(base) ** p
    return Fraction(whole, base ** shift) + rest


@dataclass(frozen=True)
class Slot:
    """One place (or sign) of a reading and the values it may take.

    ``values`` are the possible values in units of the slot's place, ascending
    and distinct; ``editor`` is the editor's restoration when there is one (it
    is also among ``values``).  ``form`` is private to the notation that made
    the slot (it needs it to write a chosen value back with the same marks).
    """

    values: tuple[Fraction, ...]
    place: int = 0
    status: Status = Status.READ
    text: str = ""
    span: tuple[int, int] = (0, 0)
    editor: Fraction | None = None
    gap: tuple[int, int] | None = None
    form: tuple = field(default=(), compare=False)

    @property
    def counted(self) -> bool:
        """Whether the slot adds to the number (a superfluous sign does not)."""
        return self.status is not Status.SUPERFLUOUS

    @property
    def preferred(self) -> Fraction:
        """The value the edition gives: the editor's, else the lowest allowed."""
        return self.editor if self.editor is not None else self.values[0]


def _is_gap(slot: Slot) -> bool:
    return slot.gap is not None


@dataclass(frozen=True)
class Reading:
    """A number as read from a text, exact, with its damage.

    ``base`` is the base of the place value (60 for sexagesimal; additive
    notations put every slot at place 0).  ``floating`` says that the text
    does not fix the magnitude (cuneiform): the value is then given at integer
    scale (the last written place is the units place).
    """

    text: str
    notation: str
    slots: tuple[Slot, ...]
    base: int = 60
    sign: int = 1
    floating: bool = False
    unit: str | None = None
    warnings: tuple[str, ...] = ()
    detected: str | None = None   # how the notation was chosen, when it was not given
    #: The factor a unit conversion multiplied the slot values by (a quantity
    #: read in UŠ and given in months): one unit of the last written place is
    #: then base**last_place times this.
    unit_factor: Fraction = Fraction(1)

    # -- structure --------------------------------------------------------
    @property
    def has_gap(self) -> bool:
        return any(_is_gap(s) for s in self.slots)

    @property
    def damaged(self) -> bool:
        return any(s.status.damaged for s in self.slots)

    @property
    def ambiguous(self) -> bool:
        """A slot read clearly still has several values (the text alone cannot decide).

        A Greek ``ο`` in the whole-number place is 0 or 70; a lone capital
        letter of a papyrus is units or thousands: the letters are read, their
        meaning is open, and the evidence (catalogue, table) decides.
        """
        return any(len(s.values) > 1 and not s.status.damaged and s.gap is None
                   for s in self.counted_slots)

    @property
    def counted_slots(self) -> tuple[Slot, ...]:
        return tuple(s for s in self.slots if s.counted)

    def expansions(self) -> Iterator["Reading"]:
        """Yield one gapless Reading per possible number of lost places."""
        gaps = [i for i, s in enumerate(self.slots) if _is_gap(s)]
        if not gaps:
            yield self
            return
        ranges = [range(self.slots[i].gap[0], self.slots[i].gap[1] + 1) for i in gaps]
        for counts in itertools.product(*ranges):
            yield self._expand(dict(zip(gaps, counts)))

    def _expand(self, counts: dict[int, int]) -> "Reading":
        # Stored places assume each gap at its fewest places.  A gap in the
        # whole part (place >= 0) pushes the slots to its left up; a gap in
        # the fractional part pushes the slots to its right down.
        shifts = [0] * len(self.slots)
        for i, n in counts.items():
            extra = n - self.slots[i].gap[0]
            if self.slots[i].place >= 0:
                for j in range(i):
                    shifts[j] += extra
            else:
                for j in range(i + 1, len(self.slots)):
                    shifts[j] -= extra
        out: list[Slot] = []
        for i, slot in enumerate(self.slots):
            place = slot.place + shifts[i]
            if i in counts:
                n = counts[i]
                if place >= 0:
                    new_places = range(place + n - 1, place - 1, -1)
                else:
                    new_places = range(place, place - n, -1)
                out.extend(replace(slot, place=p, gap=None, status=Status.LOST, form=())
                           for p in new_places)
            else:
                out.append(replace(slot, place=place) if place != slot.place else slot)
        return replace(self, slots=tuple(out))

    # -- values -----------------------------------------------------------
    def _weight(self, place: int) -> Fraction:
        return Fraction(self.base) ** place

    def _bounds_gapless(self) -> tuple[Fraction, Fraction]:
        slots = self.counted_slots
        lo = place_sum(((s.values[0], s.place) for s in slots), self.base)
        hi = place_sum(((s.values[-1], s.place) for s in slots), self.base)
        return (lo, hi) if self.sign > 0 else (-hi, -lo)

    @_computed_once
    def _bounds(self) -> tuple[Fraction, Fraction]:
        if not self.has_gap:
            lo, hi, _ = self._gapless_sums
            return (lo, hi) if self.sign > 0 else (-hi, -lo)
        bounds = [r._bounds_gapless() for r in self.expansions()]
        return min(b[0] for b in bounds), max(b[1] for b in bounds)

    @_computed_once
    def _gapless_sums(self) -> tuple[Fraction, Fraction, Fraction]:
        """The least, greatest and preferred place sums of a gapless reading (before its sign),
        in one pass over whole slot values (:func:`place_sum` where a value is a fraction)."""
        slots = self.counted_slots
        base = self.base
        low = min((s.place for s in slots), default=0)
        shift = -low if low < 0 else 0
        lo = hi = pref = 0
        for s in slots:
            a, b, p = s.values[0], s.values[-1], s.preferred
            if a.denominator != 1 or b.denominator != 1 or p.denominator != 1:
                return (place_sum(((s.values[0], s.place) for s in slots), base),
                        place_sum(((s.values[-1], s.place) for s in slots), base),
                        place_sum(((s.preferred, s.place) for s in slots), base))
            weight = base ** (s.place + shift)
            lo += a.numerator * weight
            hi += b.numerator * weight
            pref += p.numerator * weight
        scale = base ** shift
        return Fraction(lo, scale), Fraction(hi, scale), Fraction(pref, scale)

    @property
    def min(self) -> Fraction:
        """The smallest value the traces allow."""
        return self._bounds[0]

    @property
    def max(self) -> Fraction:
        """The largest value the traces allow."""
        return self._bounds[1]

    @_computed_once
    def value(self) -> Fraction:
        """The value as the edition gives it.

        Exact for an undamaged reading.  For a damaged one: the editor's
        restorations where given, lost digits at their lowest, a gap of
        unknown extent at its fewest places.
        """
        if not self.has_gap:
            return self.sign * self._gapless_sums[2]
        first = next(self.expansions())
        return self.sign * place_sum(((s.preferred, s.place) for s in first.counted_slots), self.base)

    @property
    def count(self) -> int:
        """How many readings the damage allows (1 for an undamaged number)."""
        total = 0
        for r in self.expansions():
            total += math.prod(len(s.values) for s in r.counted_slots)
        return total

    @property
    def last_place(self) -> int:
        """The exponent of the lowest written place."""
        places = [s.place for s in self.counted_slots if not _is_gap(s)]
        return min(places) if places else 0

    @property
    def ulp(self) -> Fraction:
        """One unit of the last written place (in the reading's unit, after any conversion)."""
        return self._weight(self.last_place) * self.unit_factor

    def choices(self) -> Iterator[tuple["Reading", tuple[Fraction, ...]]]:
        """Lazily yield (expansion, one value per slot) for every reading."""
        for r in self.expansions():
            options = [s.values if s.counted else (Fraction(0),) for s in r.slots]
            for combo in itertools.product(*options):
                yield r, combo

    def value_of(self, choice: tuple[Fraction, ...]) -> Fraction:
        """The value of one reading, given one value per slot of a gapless Reading."""
        total = sum((v * self._weight(s.place) for s, v in zip(self.slots, choice) if s.counted),
                    Fraction(0))
        return self.sign * total

    def readings(self) -> Iterator[Fraction]:
        """Lazily yield the value of every reading the damage allows."""
        for r, combo in self.choices():
            yield r.value_of(combo)

    def scaled(self, power: int) -> Fraction:
        """The value times ``base ** power`` (to fix a floating magnitude)."""
        return self.value * self._weight(power)

    # -- output -----------------------------------------------------------
    def to_dict(self) -> dict:
        """The JSON fields of DESIGN.md (exact values as strings)."""
        out = {
            "text": self.text,
            "notation": self.notation,
            "value": exact_text(self.value),
            "decimal": decimal_text(self.value),
            "sexagesimal": sexagesimal_text(self.value, fixed=not self.floating),
            "damaged": self.damaged,
            "ambiguous": self.ambiguous,
            "min": exact_text(self.min),
            "max": exact_text(self.max),
            "floating": self.floating,
            "readings": self.count,
            "places": [
                {
                    "text": s.text,
                    "status": s.status.value,
                    "place": s.place,
                    "values": _values_text(s),
                    "span": list(s.span),
                    **({"editor": exact_text(s.editor)} if s.editor is not None else {}),
                    **({"gap": list(s.gap)} if s.gap is not None else {}),
                }
                for s in self.slots
            ],
            "warnings": list(self.warnings),
        }
        if self.unit is not None:
            out["unit"] = self.unit
        if self.detected is not None:
            out["detected"] = self.detected
        return out


def _values_text(slot: Slot) -> str:
    vals = slot.values
    if len(vals) == 1:
        return exact_text(vals[0])
    if all(v.denominator == 1 for v in vals) and vals[-1] - vals[0] == len(vals) - 1:
        return f"{exact_text(vals[0])}..{exact_text(vals[-1])}"
    return " ".join(exact_text(v) for v in vals)


def exact_text(value: Fraction | int) -> str:
    """Write an exact value as DESIGN.md asks: ``"6585"`` or ``"19756/3"``.

    >>> exact_text(Fraction(19756, 3))
    '19756/3'
    """
    value = Fraction(value)
    return str(value.numerator) if value.denominator == 1 else f"{value.numerator}/{value.denominator}"


def parse_exact(text: str) -> Fraction:
    """Read back what :func:`exact_text` wrote."""
    return Fraction(text)


def decimal_text(value: Fraction, digits: int = 12) -> str:
    """A decimal for display, rounded to *digits* places, trailing zeros dropped.

    >>> decimal_text(Fraction(765433, 25920))
    '29.530594135802'
    """
    value = Fraction(value)
    scaled = round(abs(value) * 10**digits)
    whole, frac = divmod(scaled, 10**digits)
    sign = "-" if value < 0 and scaled else ""
    frac_text = str(frac).rjust(digits, "0").rstrip("0")
    return f"{sign}{whole}" + (f".{frac_text}" if frac_text else "")


def sexagesimal_text(value: Fraction, *, fixed: bool = True, max_places: int = 12) -> str:
    """Write *value* in modern sexagesimal notation (``1,49,45;20``).

    A value that does not end within *max_places* fractional places is cut
    there and marked with a trailing ``...``.  With ``fixed=False`` (a floating
    number) the ``;`` is left out when the value is whole.

    >>> sexagesimal_text(Fraction(19756, 3))
    '1,49,45;20'
    >>> sexagesimal_text(Fraction(-1, 2))
    '-0;30'
    """
    value = Fraction(value)
    sign = "-" if value < 0 else ""
    value = abs(value)
    whole = value.numerator // value.denominator
    frac = value - whole
    ints = []
    while True:
        whole, digit = divmod(whole, 60)
        ints.append(digit)
        if not whole:
            break
    fracs = []
    while frac and len(fracs) < max_places:
        frac *= 60
        digit = frac.numerator // frac.denominator
        fracs.append(digit)
        frac -= digit
    text = sign + ",".join(str(d) for d in reversed(ints))
    if fracs:
        text += ";" + ",".join(str(d) for d in fracs)
        if frac:
            text += "..."
    return text
