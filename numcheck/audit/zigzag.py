"""Linear zigzag functions: a difference d per line, reflected at M and m.

The rule at the turns (schemes-and-slips.md §1.1, after Neugebauer, ACT 1955
vol. 1, and the CDLI page of YPM BC 001878): when y + d passes the maximum M,
the overshoot is folded back, y' = 2M − (y + d), and the function falls; at
the minimum, y' = 2m − (y − d).  Hitting an extreme exactly writes it and
turns.  d is the mode of the absolute differences; M and m come from the pairs
of lines that straddle a turn, M = (y_n + y_n+1 + d)/2, m = (y_n + y_n+1 − d)/2,
each taken as the mode over all the turns, so that one slip cannot move them.
The period P = 2(M − m)/d in lines is matched against the period relations
of the catalogue when it is installed.
"""

from __future__ import annotations

from fractions import Fraction

from ..reading import exact_text, sexagesimal_text
from .schemes import Scheme, diffs, mode, value_text

__all__ = ["ZigzagScheme"]


class ZigzagScheme(Scheme):
    """A linear zigzag function with difference d between m and M."""

    kind = "zigzag"

    def __init__(self, column, frame, d, M, m):
        super().__init__(column, frame)
        self.d, self.M, self.m = d, M, m

    # state: (value, direction of the next step: +1 rising, -1 falling)
    def step(self, state, i, src):
        v, direction = state
        nv = v + direction * self.d
        if direction > 0 and self.M is not None and nv >= self.M:
            return (2 * self.M - nv, -1)
        if direction < 0 and self.m is not None and nv <= self.m:
            return (2 * self.m - nv, 1)
        return (nv, direction)

    def _inside(self, v) -> bool:
        return (self.M is None or v <= self.M) and (self.m is None or v >= self.m)

    def start(self, value, i, nxt, src):
        if not self._inside(value):
            return None
        for direction in (1, -1):
            got = self.step((value, direction), i + 1, src)
            if got[0] == nxt:
                return (value, direction)
        return None

    def back(self, state, i, src):
        v, direction = state
        d = self.d
        guesses = [v - direction * d, v + direction * d]
        if self.M is not None:
            guesses.append(2 * self.M - v - d)
        if self.m is not None:
            guesses.append(2 * self.m - v + d)
        for p in guesses:
            if not self._inside(p):
                continue
            for pd in (direction, -direction):
                if self.step((p, pd), i, src) == (v, direction):
                    return (p, pd)
        return None

    def special(self, prev, i, src, written):
        """A missed turn: the step taken straight on past M or m, or reflected too early."""
        if prev is None:
            return None
        v, direction = prev
        straight = v + direction * self.d
        turned = v - direction * self.d
        due = self.step(prev, i, src)[0]
        if due != straight and written == straight:
            from ..slips import Diagnosis
            limit = "maximum" if direction > 0 else "minimum"
            return Diagnosis("turning-point", f"the step went straight on past the {limit} "
                                              "instead of being reflected")
        if due == straight and written == turned:
            from ..slips import Diagnosis
            return Diagnosis("turning-point", "the direction was reversed before the turn was due")
        return None

    @property
    def period(self) -> Fraction | None:
        if self.M is None or self.m is None:
            return None
        return Fraction(2 * (self.M - self.m)) / Fraction(self.d)

    def params(self):
        f = self.frame.fraction
        out = {"d": value_text(f(self.d))}
        if self.M is not None:
            out["M"] = value_text(f(self.M))
        if self.m is not None:
            out["m"] = value_text(f(self.m))
        if self.M is not None and self.m is not None:
            out["mean"] = value_text(f(self.M + self.m) / 2)
            out["amplitude"] = value_text(f(self.M - self.m))
            out["period_lines"] = value_text(self.period)
            match = _period_relation(self.period)
            if match is not None:
                out["period_relation"] = match
        return out

    def describe(self):
        f = self.frame.fraction
        parts = [f"d = {sexagesimal_text(f(self.d))}"]
        if self.M is not None:
            parts.append(f"M = {sexagesimal_text(f(self.M))}")
        if self.m is not None:
            parts.append(f"m = {sexagesimal_text(f(self.m))}")
        if self.period is not None:
            parts.append(f"P = {sexagesimal_text(self.period)} lines ({exact_text(self.period)})")
        return "linear zigzag, " + ", ".join(parts)

    @classmethod
    def fit(cls, column, frame):
        values = frame.written[column]
        pairs = diffs(values)
        if len(pairs) < 4:
            return None
        d, n = mode([abs(x) for _, x in pairs])
        if not d or n * 2 <= len(pairs):
            return None
        dmap = dict(pairs)  # row index i -> y_i - y_{i-1}
        maxima, minima = [], []
        for i, _ in pairs:
            # the pair (i, i+1) straddles a turn when the line before rose by d
            # and the line after falls by d (or the converse at a minimum)
            before, after = dmap.get(i), dmap.get(i + 2)
            if before is None or after is None or i + 1 >= len(values) or values[i + 1] is None:
                continue
            total = values[i] + values[i + 1]
            if before == d and after == -d:
                maxima.append(_half(total + d))
            elif before == -d and after == d:
                minima.append(_half(total - d))
        if not maxima and not minima:
            return None
        # The commonest turn values; where turns disagree (a slip at a turn),
        # the pair that explains the most lines wins.
        best, best_support = None, -1.0
        sample = values[:_SAMPLE]
        from .schemes import support_chained
        for M in _commonest(maxima):
            for m in _commonest(minima):
                if M is not None and m is not None and not m < M:
                    continue
                scheme = cls(column, frame, d, M, m)
                support = support_chained(scheme, sample, None)
                if support > best_support:
                    best, best_support = scheme, support
        return best


#: Lines used to choose between turn values that disagree.
_SAMPLE = 2000


def _commonest(values: list, k: int = 3) -> list:
    """Up to *k* commonest values, commonest first ([None] when there are none)."""
    if not values:
        return [None]
    from collections import Counter
    return [v for v, _ in Counter(values).most_common(k)]


def _half(x):
    return x // 2 if isinstance(x, int) and x % 2 == 0 else Fraction(x) / 2


def _period_relation(period: Fraction) -> dict | None:
    """The catalogue entry whose value, or the ratio of two sides of a period
    relation, is this period (when the catalogue is installed)."""
    try:
        from .. import catalogue
        entries = catalogue.entries()
    except Exception:   # the catalogue is optional for the audit
        return None
    for entry in entries:
        ratios = {entry.value}
        singles = [side.terms[0].number for side in entry.sides if len(side.terms) == 1]
        for a in singles:
            for b in singles:
                if a and b and a != b:
                    ratios.add(Fraction(a) / Fraction(b))
        if period in ratios:
            return {"id": entry.id, "statement": entry.statement, "source": entry.source,
                    "period": exact_text(period)}
    return None
