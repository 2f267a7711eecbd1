"""The numbers a catalogue row offers for comparison, and fast lookup among them.

A row offers its value; a relation offers every side (and every term of a
side written as a sum, like ``241 sidereal months + 10 2/3 degrees``); a
parameter offers its other sides (``1440 minutes`` a day).  Each of these
*items* may be met in a text as a simple multiple or part (n/m with small n,
m) and, for periods, as a whole multiple up to a few thousand (235 months,
4267 months).

For speed, items times simple factors are kept as one sorted list of
floats per unit (built once, cached), so a lookup is a binary search; whole
multiples are found by rounding value/period for each period.  The floats
only select candidates: every candidate is then checked exactly.  Plain
lists and :mod:`bisect`, not numpy: one identification compares a handful
of candidates, and importing numpy would cost more than all of them.
"""

from __future__ import annotations

import bisect
import math
from dataclasses import dataclass
from fractions import Fraction
from functools import lru_cache


from .. import catalogue
from .. import limits
from ..errors import NumcheckError
from ..catalogue.statements import side_unit_key
from ..units import UNITS, canonical_unit, convert, find_unit

__all__ = ["Item", "Table", "Target", "number_text", "table", "catalogue_targets", "candidates", "simple_factors",
           "chance_matches", "coincidence_notes", "RATE_FORMS",
           "factor_complexity", "factor_weight",
           "CONFIDENCE_WEIGHT"]

#: Whole numbers below this are counts (of years, revolutions ...): no parts of them are tried.
SMALL_COUNT = 60

#: How much a match is believed before its closeness is known, by the row's confidence.
CONFIDENCE_WEIGHT = {"published": 1.0, "common practice": 0.9, "from memory": 0.75}


@dataclass(frozen=True)
class Item:
    """One number a catalogue row offers, in its own unit."""

    value: Fraction
    unit: str                 # as displayed: "days", "anomalistic months", "degrees per day"
    unit_key: str | None      # the numcheck.units name of the numerator, when it has one
    per: str                  # "" or " per day" for rates
    entry: catalogue.Entry
    label: str                # which number of the row: "the value", "a side: 239 anomalistic months"
    multiples: bool           # whole multiples up to a few thousand are tried (periods)
    alone: bool = False       # compared only as written (factor 1): an excess like "+ 10 2/3 degrees"


def number_text(value: Fraction) -> str:
    """A catalogue number as historians write it: whole part in decimal, fraction sexagesimal.

    >>> number_text(Fraction(19756, 3)), number_text(Fraction(223))
    ('6585;20', '223')
    """
    from ..reading import sexagesimal_text

    whole = value.numerator // value.denominator
    if value == whole:
        return str(whole)
    frac = sexagesimal_text(value - whole, max_places=8)
    return f"{whole};{frac.split(';', 1)[1]}"


def factor_allowed(item: Item, factor: Fraction) -> bool:
    """Whether identify tries *item* times *factor* (the rule the tables apply in bulk)."""
    if item.alone:
        return factor == 1
    if factor.denominator != 1:
        return not (item.value.denominator == 1 and item.value < SMALL_COUNT and not item.multiples)
    if factor > limits.IDENTIFY_MAX_SIMPLE:
        return item.multiples and factor <= limits.IDENTIFY_MAX_MULTIPLE
    return True


def simple_factors() -> tuple[Fraction, ...]:
    """n/m with 1 <= n, m <= IDENTIFY_MAX_SIMPLE, reduced, ascending."""
    top = limits.IDENTIFY_MAX_SIMPLE
    return tuple(sorted({Fraction(n, m) for n in range(1, top + 1) for m in range(1, top + 1)}))


def factor_complexity(factor: Fraction) -> int:
    """How complex a factor is: n + m - 1 for n/m (1 for the value itself).

    >>> factor_complexity(Fraction(1)), factor_complexity(Fraction(2)), factor_complexity(Fraction(3, 2))
    (1, 2, 4)
    """
    return factor.numerator + factor.denominator - 1


def factor_weight(factor: Fraction) -> float:
    """Prior weight of a factor in (0, 1]: 1 for the value itself, less for complex factors."""
    return 1.0 / (1.0 + math.log(factor.numerator * factor.denominator))


def _split_unit(unit: str) -> tuple[str, str]:
    head, sep, tail = unit.partition(" per ")
    return head, (f" per {tail}" if sep else "")


def _unit_key(unit: str) -> str | None:
    head, _ = _split_unit(unit)
    if head.startswith("degrees of "):
        head = "degrees"
    key = side_unit_key(head)
    if key is not None:
        return key
    return find_unit(head)


def _items_of(entry: catalogue.Entry) -> list[Item]:
    items: list[Item] = []
    seen: set[tuple[Fraction, str]] = set()

    def add(value: Fraction, unit: str, label: str, multiples: bool = False, alone: bool = False) -> None:
        if value <= 0 or value == 1 or (value, unit) in seen:
            return
        seen.add((value, unit))
        head, per = _split_unit(unit)
        items.append(Item(value, unit, _unit_key(unit), per, entry, label, multiples, alone))

    # Whole multiples of a period make sense for a measured length (29;31,50,8,20
    # days, 365 days), not for a small schematic count (Eudoxus' 2 years).
    measured = entry.value.denominator != 1 or (entry.unit == "days" and entry.value >= 360)
    add(entry.value, entry.unit, "the value", multiples=entry.kind == "period" and measured)
    if entry.kind == "period":
        return items
    head, per = _split_unit(entry.unit)
    if per == " per day":
        # Tables give a daily motion per Egyptian year and per hour as well
        # (Almagest III.2: the sun's motion per year, month, day and hour).
        # Compared as they stand: parts of a yearly motion are the daily motion's own multiples.
        for factor, name, label in RATE_FORMS:
            add(entry.value * factor, head + name, label, alone=True)
    for value, label in _daily_motions(entry):
        add(value, "degrees per day", label)
    for side in entry.sides:
        if entry.kind == "parameter" and side.single and side.single.number == 1:
            continue
        if side.single is not None:
            term = side.single
            unit = term.unit
            if entry.kind == "parameter":
                unit = entry.unit.split(" per ")[0] if term.unit.startswith("degrees of") else term.unit
                unit += _split_unit(entry.unit)[1]
            add(term.number, unit, f"a side: {side.text}")
            continue
        for term in side.terms:
            add(term.number, term.unit, f"a term of the side '{side.text}'", alone=True)
        total = _side_total(side)
        if total is not None:
            add(total, "days", f"the side '{side.text}' in days")
    return items


#: Other forms of a daily motion that tables give: (factor, unit suffix, label).
RATE_FORMS = ((Fraction(365), " per egyptian year", "the value x 365 (per Egyptian year of 365 days)"),
              (Fraction(1, 24), " per hour", "the value / 24 (per hour)"))


def _cycles(side) -> tuple[Fraction, str] | None:
    """A side as a number of turns of one cycle: 4612 sidereal months - 7 1/2 degrees of sidereal month."""
    count, cycle = Fraction(0), None
    for term in side.terms:
        unit = term.unit.strip().lower()
        if unit.startswith("degrees of "):
            name, amount = unit[len("degrees of "):], term.number / 360
        else:
            name, amount = unit, term.number
        name = name.rstrip("s")
        key = side_unit_key(name)
        # Years give the sun's motion, which the rows of daily motions state
        # themselves; a derived one would only crowd them.
        if key is not None and key != "months":
            return None
        if cycle not in (None, name):
            return None
        cycle = name
        count += term.sign * amount
    return (count, cycle) if cycle and count > 0 else None


def _daily_motions(entry: catalogue.Entry) -> list[tuple[Fraction, str]]:
    """Mean daily motions (degrees per day) a relation implies: 360 x turns / days."""
    if entry.kind != "relation":
        return []
    days = [_side_total(side) for side in entry.sides]
    days = [d for d in days if d]
    if not days:
        return []
    out = []
    for side in entry.sides:
        turns = _cycles(side)
        if turns is None:
            continue
        count, cycle = turns
        out.append((360 * count / days[0], f"daily motion in {cycle}: 360 x ({side.text}) / {days[0]} days"))
    return out


def _side_total(side) -> Fraction | None:
    """A side written as a sum of units of time, in days (None when it mixes kinds)."""
    total = Fraction(0)
    for term in side.terms:
        key = side_unit_key(term.unit)
        if key is None or UNITS[key].dimension != "time":
            return None
        total += term.sign * convert(term.number, key, "days").value
    return total


@lru_cache(maxsize=1)
def all_items() -> tuple[Item, ...]:
    """Every item of every catalogue row (computed once and kept in numcheck's cache folder)."""
    from pathlib import Path

    from .. import cache

    here = Path(__file__)
    key = cache.make_key(catalogue.source_key(), here.read_bytes(),
                         (here.parents[1] / "units.py").read_bytes())
    return cache.remembered("catalogue-items", key, compute_items, Item)


def compute_items() -> tuple[Item, ...]:
    """Every item of every catalogue row, computed from the catalogue (no cache)."""
    return tuple(item for entry in catalogue.entries() for item in _items_of(entry))


@dataclass(frozen=True)
class Table:
    """Items expressed in one unit, with sorted float arrays for lookup.

    ``factors[i]`` converts item ``items[i]`` into the table's unit exactly
    (1 when the table has no unit); ``conventions[i]`` names the convention
    that conversion needed, if any.
    """

    unit: str | None
    items: tuple[Item, ...]
    factors: tuple[Fraction, ...]
    conventions: tuple[str | None, ...]
    values: tuple[float, ...]         # float value of each item in the unit
    simple: tuple[Fraction, ...]
    simple_num: tuple[int, ...]
    simple_den: tuple[int, ...]
    confidence: tuple[float, ...]     # CONFIDENCE_WEIGHT of each item's row
    sorted_values: tuple[float, ...]  # the item values, ascending
    sorted_item: tuple[int, ...]      # item index of each sorted value
    factor_items: tuple[frozenset[int], ...]  # per simple factor: the items it is not tried on
    period_index: tuple[int, ...]     # items that take whole multiples
    period_values: tuple[float, ...]


def _convertible(item: Item, unit: str) -> tuple[Fraction, str | None] | None:
    if item.unit_key is None:
        return None
    src, dst = UNITS[item.unit_key], UNITS[unit]
    if src.dimension != dst.dimension:
        # A count of years or months is a length of time only through a
        # convention; allow it for periods and sides, never for rates.
        if item.per or "arc" in (src.dimension, dst.dimension):
            return None
    try:
        out = convert(1, item.unit_key, unit)
    except NumcheckError:
        return None
    return out.value, out.convention


@lru_cache(maxsize=64)
def table(unit: str | None) -> Table:
    """The lookup table for one unit (``None``: each item in its own unit)."""
    if unit is not None:
        unit = canonical_unit(unit)
    items, factors, conventions = [], [], []
    for item in all_items():
        if unit is None:
            items.append(item)
            factors.append(Fraction(1))
            conventions.append(None)
            continue
        conv = _convertible(item, unit)
        if conv is not None:
            items.append(item)
            factors.append(conv[0])
            conventions.append(conv[1])
    values = tuple(float(i.value * f) for i, f in zip(items, factors))
    simple = simple_factors()
    # A part of a small count (1/6 of "2 revolutions") means nothing; only
    # whole multiples of such counts are tried.  An item that stands alone
    # is tried only as itself.
    small = {i for i, item in enumerate(items)
             if item.value.denominator == 1 and item.value < SMALL_COUNT and not item.multiples}
    alone = {i for i, item in enumerate(items) if item.alone}
    skip = tuple(frozenset((small if f.denominator != 1 else set()) | (alone if f != 1 else set()))
                 for f in simple)
    order = sorted((x, i) for i, x in enumerate(values) if math.isfinite(x))
    period_index = tuple(k for k, i in enumerate(items) if i.multiples)
    return Table(
        unit=unit, items=tuple(items), factors=tuple(factors), conventions=tuple(conventions),
        values=values, simple=simple,
        simple_num=tuple(f.numerator for f in simple),
        simple_den=tuple(f.denominator for f in simple),
        confidence=tuple(CONFIDENCE_WEIGHT.get(i.entry.confidence, 0.5) for i in items),
        sorted_values=tuple(x for x, _ in order), sorted_item=tuple(i for _, i in order),
        factor_items=skip,
        period_index=period_index, period_values=tuple(values[k] for k in period_index),
    )


def candidates(tab: Table, lo: float, hi: float, *, multiples: bool = True
               ) -> tuple[list[int], list[int], list[int]]:
    """Lists (item index, factor numerator, factor denominator) of every
    item x factor whose float lies in [lo, hi].

    Simple factors: for each factor, a binary search among the sorted item
    values (ordered by item value x factor, as one sorted list of all of
    them would give); whole multiples (past the simple ones, up to
    IDENTIFY_MAX_MULTIPLE) of periods by rounding, period by period, unless
    ``multiples`` is False.
    """
    hits = []    # (item value x factor, item, factor index)
    values, order = tab.sorted_values, tab.sorted_item
    n_f = len(tab.simple)
    for j, f in enumerate(tab.simple):
        fv = f.numerator / f.denominator
        # Bounds a little wide, then the exact float test the values must pass.
        low, high = lo / fv, hi / fv
        a = bisect.bisect_left(values, low - abs(low) * 1e-12)
        b = bisect.bisect_right(values, high + abs(high) * 1e-12)
        skip = tab.factor_items[j]
        for k in range(a, b):
            i = order[k]
            x = tab.values[i] * float(f)
            if lo <= x <= hi and i not in skip:
                hits.append((x, i * n_f + j))
    hits.sort()
    items = [k // n_f for _, k in hits]
    nums = [tab.simple_num[k % n_f] for _, k in hits]
    dens = [tab.simple_den[k % n_f] for _, k in hits]
    if multiples and tab.period_values and hi > 0:
        least, most = limits.IDENTIFY_MAX_SIMPLE + 1, limits.IDENTIFY_MAX_MULTIPLE
        for k, pv in zip(tab.period_index, tab.period_values):
            first, last = max(math.ceil(lo / pv), least), min(math.floor(hi / pv), most)
            if first <= last:
                items.extend([k] * (last - first + 1))
                nums.extend(range(first, last + 1))
                dens.extend([1] * (last - first + 1))
    return items, nums, dens


@dataclass(frozen=True)
class Target:
    """A number the catalogue expects: a catalogue value times a simple factor.

    ``value`` is in ``unit`` and, for a floating reading, already divided by
    ``60 ** scale`` so that it compares directly with the reading as written.
    ``weight`` is the prior belief in this target, in (0, 1]: higher for a
    simpler factor and a published source.
    """

    value: Fraction
    unit: str | None
    id: str
    statement: str
    factor: Fraction
    scale: int
    weight: float


def catalogue_targets(lo, hi, unit: str | None = None, *, floating: bool = False,
                      max_factor: int | None = None) -> list[Target]:
    """Every catalogue value x simple factor (or period x whole multiple) in [lo, hi].

    With *unit*, catalogue numbers convertible to it are converted exactly
    (months and years with the default conventions); without, each number
    counts in its own unit.  With ``floating=True`` the magnitude is free:
    a target ``t`` is returned as ``t / 60**scale`` for every scale that
    brings it into [lo, hi].  Sorted by value; at most
    ``limits.IDENTIFY_MAX_TARGETS`` (the highest weights are kept).
    With *max_factor*, only factors n/m with n, m <= max_factor are tried
    (no long whole multiples of periods): what restoration needs, and much
    faster over a wide range.

    >>> [t.id for t in catalogue_targets(6585, 6586, "days") if t.factor == 1][:1]
    ['saros_almagest']
    """
    lo, hi = Fraction(lo), Fraction(hi)
    if hi < lo:
        lo, hi = hi, lo
    tab = table(unit)
    scales = range(-6, 7) if floating else range(0, 1)
    found = []   # (item, num, den, weight, scale) of every candidate
    for scale in scales:
        p = Fraction(60) ** scale
        if hi * p <= 0:
            continue
        flo, fhi = float(lo * p) * (1 - 1e-12), float(hi * p) * (1 + 1e-12)
        items, nums, dens = candidates(tab, flo, fhi, multiples=max_factor is None)
        for idx, num, den in zip(items, nums, dens):
            if max_factor is not None and (num > max_factor or den > max_factor):
                continue
            weight = tab.confidence[idx] / (1.0 + math.log(float(num) * den))
            found.append((idx, num, den, weight, scale))
    if not found:
        return []
    if len(found) > limits.IDENTIFY_MAX_TARGETS:
        found = sorted(found, key=lambda c: -c[3])[: limits.IDENTIFY_MAX_TARGETS]   # stable
    items, nums, dens, weight, scale_arr = zip(*found)
    out: list[Target] = []
    for k in range(len(items)):
        idx, scale = int(items[k]), int(scale_arr[k])
        item = tab.items[idx]
        factor = Fraction(int(nums[k]), int(dens[k]))
        value = item.value * tab.factors[idx] * factor / Fraction(60) ** scale
        if not lo <= value <= hi:
            continue
        out.append(Target(
            value=value,
            unit=(tab.unit + item.per) if tab.unit else item.unit,
            id=item.entry.id, statement=item.entry.statement, factor=factor, scale=scale,
            weight=float(weight[k]),
        ))
    out.sort(key=lambda t: (t.value, -t.weight))
    return out


#: Relative offsets of the nearby numbers at which chance matches are counted.
_PROBES = (-0.0437, -0.0261, -0.0113, -0.0047, 0.0053, 0.0121, 0.0277, 0.0413)


def _count_near(tab: Table, value: Fraction, ulp: Fraction, scales) -> int:
    total = 0
    for scale in scales:
        p = Fraction(60) ** scale
        v, tol = float(value * p), float(ulp * p)
        items, _, _ = candidates(tab, v - tol, v + tol, multiples=100 * tol <= v)
        total += len(items)
    return total


def chance_matches(value: Fraction, ulp: Fraction, unit: str | None = None, scales=range(-6, 7)) -> float:
    """How many catalogue numbers (times simple factors, multiples) lie as close by chance.

    Counted at eight numbers a few percent either side of *value*, each
    within one *ulp* (unit of the last written place) at every scale: the
    number a text's value meets for no reason but the crowd of the catalogue.
    """
    tab = table(unit)
    counts = [_count_near(tab, value * Fraction(1 + d).limit_denominator(100_000), ulp, scales)
              for d in _PROBES]
    return sum(counts) / len(counts)


def coincidence_notes(reading, unit: str | None, found: int) -> list[str]:
    """A plain note when a floating reading without a unit meets the catalogue only by chance."""
    if not reading.floating or unit is not None or reading.value <= 0 or not found:
        return []
    expected = chance_matches(reading.value, reading.ulp)
    if expected < 0.5:
        return []
    if found <= 2 * expected:
        verdict = ("The matches found here are no more than that: treat them as coincidences unless the "
                   "text, a unit or the column they stand in supports them.")
    else:
        verdict = "More are found here than chance gives, but each still needs the text's support."
    return [f"A floating number without a unit is compared at every power of 60 with every catalogue "
            f"number and its simple parts and multiples: numbers a few percent from this one meet "
            f"{expected:.1f} of them on average as closely by chance. {verdict}"]
