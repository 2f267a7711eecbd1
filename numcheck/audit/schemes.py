"""The computing schemes a column may follow, and how to fit each one robustly.

Every scheme works on the *scaled* values of a frame: each exact value times
one common integer scale, so that the check runs on Python integers (exact,
and fast enough for an ephemeris of 100,000 lines).  A parameter that does not
fall on the scale (a maximum halfway between two units) stays a Fraction;
mixed integer and Fraction arithmetic is still exact.

A *chained* scheme computes each line from the line before (constant
difference, zigzag, step function, running sum): it offers ``start`` (the
state of a line, given the next one), ``step`` (the next state), ``back`` (the
state before) and ``resume`` (the state after the scribe wrote another value).
A *row* scheme computes each cell from the other cells of its row (product,
quotient, reciprocal, a stated relation): it offers ``expect``.  Parameters
are estimated from the majority of lines (the mode of the differences, turn
pairs that agree), so that a minority of slips does not move them
(van Dalen's robust estimation, schemes-and-slips.md §1.7).
"""

from __future__ import annotations

import math
from array import array
from collections import Counter
from itertools import islice
from dataclasses import dataclass, field
from fractions import Fraction

from ..reading import exact_text, sexagesimal_text

__all__ = ["Frame", "Scheme", "ConstantScheme", "LinearScheme", "mode", "majority", "diffs", "DiffPairs", "value_text",
           "support_chained", "support_row"]


@dataclass
class Frame:
    """The audited columns as scaled exact numbers (``None`` for a damaged cell)."""

    names: list[str]
    written: dict[str, list]
    scale: int
    modulus: dict[str, int | None]      # 360 * scale for a longitude column
    floating: dict[str, bool]
    nrows: int
    #: rows a gap of missing lines precedes, and how many steps the argument takes there
    gaps: dict = field(default_factory=dict)

    def fraction(self, v) -> Fraction | None:
        return None if v is None else Fraction(v) / self.scale


def value_text(v: Fraction) -> dict:
    """An exact parameter for the JSON output: exact text and sexagesimal."""
    return {"value": exact_text(v), "sexagesimal": sexagesimal_text(v)}


def mode(items) -> tuple[object, int]:
    """The commonest item and its count (the first seen wins a tie)."""
    counts = Counter(items)
    if not counts:
        return None, 0
    best = max(counts.values())
    for item in items:
        if counts[item] == best:
            return item, best
    return None, 0  # pragma: no cover


def majority(items: list):
    """The item more than half of *items* are, or None: ``mode`` when its count is a majority.

    In constant memory (Boyer and Moore's vote), where ``mode`` counts every
    distinct item (a 10^6-line column of distinct values).

    >>> majority([3, 1, 3, 3, 2]), majority([1, 2, 1, 2])
    (3, None)
    """
    candidate, lead = None, 0
    for item in items:
        if lead == 0:
            candidate, lead = item, 1
        elif item == candidate:
            lead += 1
        else:
            lead -= 1
    if lead and sum(1 for item in items if item == candidate) * 2 > len(items):
        return candidate
    return None


def diffs(values: list, modulus=None) -> list[tuple[int, object]]:
    """(row index, difference to the line before) for each pair of known lines."""
    out = []
    prev = values[0] if values else None
    for i in range(1, len(values)):
        v = values[i]
        if v is not None and prev is not None:
            d = v - prev
            if modulus:
                d %= modulus
            out.append((i, d))
        prev = v
    return out


class DiffPairs:
    """The pairs of :func:`diffs` made on demand, one index per pair kept (a 10^6-line column).

    ``pairs[k]`` is the k-th ``(row index, difference)``; :meth:`differences`
    walks the differences alone, as often as asked.
    """

    __slots__ = ("values", "modulus", "index")

    def __init__(self, values: list, modulus=None):
        self.values = values
        self.modulus = modulus
        self.index = array("q", (i for i in range(1, len(values))
                                 if values[i] is not None and values[i - 1] is not None))

    def __len__(self) -> int:
        return len(self.index)

    def __getitem__(self, k: int) -> tuple[int, object]:
        i = self.index[k]
        d = self.values[i] - self.values[i - 1]
        if self.modulus:
            d %= self.modulus
        return i, d

    def differences(self) -> "_Differences":
        return _Differences(self)


class _Differences:
    __slots__ = ("pairs",)

    def __init__(self, pairs: DiffPairs):
        self.pairs = pairs

    def __len__(self) -> int:
        return len(self.pairs)

    def __iter__(self):
        values, modulus = self.pairs.values, self.pairs.modulus
        for i in self.pairs.index:
            d = values[i] - values[i - 1]
            if modulus:
                d %= modulus
            yield d


class Scheme:
    """A computing scheme fitted to one column."""

    kind = ""
    chained = True
    inputs: tuple[str, ...] = ()

    def __init__(self, column: str, frame: Frame):
        self.column = column
        self.frame = frame
        self.modulus = frame.modulus.get(column)
        self.support = 0.0
        #: the catalogue schemes this one agrees with (numcheck.audit.published)
        self.published: list[dict] = []
        #: the text (or catalogue id) of a scheme the user stated for the column
        self.stated: str | None = None

    # -- output --------------------------------------------------------
    def params(self) -> dict:
        return {}

    def describe(self) -> str:
        return self.kind

    def to_dict(self) -> dict:
        text = self.describe()
        if self.published:
            first = self.published[0]
            text += (f"; agrees with the published {first['label']} ({first['id']}, by its "
                     f"{first['agreement']})")
        return {"column": self.column, "kind": self.kind, "params": self.params(),
                "support": round(self.support, 4), "description": text,
                "published": [dict(p) for p in self.published],
                **({"stated": self.stated} if self.stated else {})}

    def _norm(self, v):
        return v % self.modulus if self.modulus else v

    # -- chained schemes -------------------------------------------------
    def start(self, value, i: int, nxt, src) -> tuple | None:
        """The state of line *i* (value *value*) that leads to *nxt* at i+1."""
        state = (value, None)
        got = self.step(state, i + 1, src)
        return state if got is not None and got[0] == nxt else None

    def step(self, state, i: int, src) -> tuple | None:
        raise NotImplementedError

    def back(self, state, i: int, src) -> tuple | None:
        raise NotImplementedError

    def resume(self, predicted, value) -> tuple:
        return (value,) + tuple(predicted[1:])

    def special(self, prev, i: int, src, written):
        """A scheme's own diagnosis of a slip at line *i* (missed turn, zone boundary)."""
        return None

    # -- row schemes -----------------------------------------------------
    def expect(self, i: int, src):
        raise NotImplementedError


def support_chained(scheme: Scheme, values: list, src) -> float:
    """The share of consecutive known lines that follow the scheme exactly."""
    total = hits = 0
    for i in range(len(values) - 1):
        a, b = values[i], values[i + 1]
        if a is None or b is None:
            continue
        total += 1
        if scheme.start(a, i, b, src) is not None:
            hits += 1
    return hits / total if total else 0.0


def support_row(scheme: Scheme, values: list, src, limit: int | None = None) -> float:
    total = hits = 0
    for i, v in enumerate(values if limit is None else values[:limit]):
        if v is None:
            continue
        e = scheme.expect(i, src)
        if e is None:
            continue
        total += 1
        hits += e == v
    return hits / total if total else 0.0


class ConstantScheme(Scheme):
    """Every line holds the same value."""

    kind = "constant"
    chained = False

    def __init__(self, column, frame, value):
        super().__init__(column, frame)
        self.value = value

    def expect(self, i, src):
        return self.value

    def params(self):
        return {"value": value_text(self.frame.fraction(self.value))}

    def describe(self):
        return f"constant {sexagesimal_text(self.frame.fraction(self.value))}"

    @classmethod
    def fit(cls, column, frame):
        values = [v for v in frame.written[column] if v is not None]
        if len(values) < 3:
            return None
        v = majority(values)
        return cls(column, frame, v) if v is not None else None


class LinearScheme(Scheme):
    """A constant difference d per line (modulo 360° for a longitude).

    The difference may change for good at a line (*segments*): the Old
    Babylonian multiplication tables run 1, 2, ... 20, then 30, 40, 50
    (common practice).  A change counts only when at least three lines in a
    row take the new difference, so that a slip (two differences that cancel,
    or one) is never read as a change.
    """

    kind = "linear"

    def __init__(self, column, frame, d, segments=()):
        super().__init__(column, frame)
        self.d = d
        self.segments = tuple(segments)     # (first row index, difference), ascending

    def _d(self, i):
        """The difference that leads to line *i*."""
        d = self.d
        for start, dd in self.segments:
            if i >= start:
                d = dd
        return d

    def step(self, state, i, src):
        return (self._norm(state[0] + self._d(i)), None)

    def back(self, state, i, src):
        return (self._norm(state[0] - self._d(i)), None)

    def start(self, value, i, nxt, src):
        return (value, None) if self._norm(value + self._d(i + 1)) == nxt else None

    def params(self):
        out = {"d": value_text(self.frame.fraction(self.d))}
        if self.segments:
            out["changes"] = [{"row": start + 1, "d": value_text(self.frame.fraction(dd))}
                              for start, dd in self.segments]
        if self.modulus:
            out["modulus"] = value_text(self.frame.fraction(self.modulus))
        return out

    def describe(self):
        text = f"constant difference {sexagesimal_text(self.frame.fraction(self.d))} per line"
        for start, dd in self.segments:
            text += f", {sexagesimal_text(self.frame.fraction(dd))} from row {start + 1}"
        return text

    @classmethod
    def fit(cls, column, frame):
        modulus = frame.modulus.get(column) or _circle(frame, column)
        pairs = DiffPairs(frame.written[column], modulus)
        ds = pairs.differences()
        if len(ds) < 2:
            return None
        d, n = mode(ds)
        if not d or n * 2 <= len(ds):
            return None
        scheme = cls(column, frame, d, _segments(pairs, d))
        scheme.modulus = modulus
        return scheme


#: Circles a mean-motion column may be reduced modulo (degrees, signs; a
#: day's 6,0 UŠ is 360 too): a wrap by one of them is no slip.
CIRCLES = (360, 12)


def _circle(frame, column) -> int | None:
    """The circle a constant-difference column is reduced modulo, if it wraps.

    The column is linear modulo K when its commonest difference d and the
    differences d − K (or d + K going down) explain its lines and every value
    lies in [0, K).
    """
    values = [v for v in frame.written[column] if v is not None]
    raw = DiffPairs(frame.written[column]).differences()
    if len(raw) < 2 or not values or min(values) < 0:
        return None
    d, n = mode(raw)
    best, best_wraps = None, 0
    for k in CIRCLES:
        full = k * frame.scale
        if max(values) >= full or not d or abs(d) >= full:
            continue
        wraps = sum(1 for x in raw if x != d and x % full == d % full)
        if wraps > best_wraps:
            best, best_wraps = full, wraps
    return best


#: Lines in a row that must take a new difference before it counts as a change.
_SEGMENT_RUN = 3


def _segments(pairs, d) -> list:
    """Lasting changes of the difference: runs of equal differences other than the current one."""
    out = []
    current = d
    # the differences walked in order; pairs[k] looked up only around a change
    walk = enumerate(pairs.differences() if isinstance(pairs, DiffPairs) else (x for _, x in pairs))
    for k, x in walk:
        # a difference that reverses the current one is a turn (a zigzag), not a change
        if x != current and x != -current:
            run = 1
            while (k + run < len(pairs) and pairs[k + run][1] == x
                   and pairs[k + run][0] == pairs[k + run - 1][0] + 1):
                run += 1
            if run >= _SEGMENT_RUN and x:
                out.append((pairs[k][0], x))
                current = x
                next(islice(walk, run - 1, run - 1), None)   # past the run: k += run
    return out


def lcm_all(numbers) -> int:
    out = 1
    for n in numbers:
        out = out * n // math.gcd(out, n)
    return out
