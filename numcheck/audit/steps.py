"""Step functions (System A): a longitude advancing at a fixed rate per zone.

The ecliptic is divided into zones; in zone i the body advances w_i per line.
A step that crosses into zone j keeps its part up to the boundary, x, at the
old rate and converts the rest to the new one: Δλ = x + (w_i − x)·w_j/w_i
(schemes-and-slips.md §1.2, after Neugebauer, ACT 1955, and Aaboe 1958).
Two zones are fitted here (the lunar System A sun and Jupiter System A): the
two commonest differences are the rates, and each crossing line proposes a
boundary; the pair of boundaries that explains most lines exactly is kept.
"""

from __future__ import annotations

from collections import Counter
from fractions import Fraction

from ..reading import sexagesimal_text
from .schemes import Scheme, diffs, value_text

__all__ = ["StepScheme", "StepDifferenceScheme", "degrees_text"]


def degrees_text(v) -> str:
    """A longitude for display: whole degrees in decimal, fractions in sexagesimal.

    >>> degrees_text(Fraction(171, 2))
    '85;30°'
    """
    v = Fraction(v)
    whole = v.numerator // v.denominator
    frac = sexagesimal_text(v - whole)
    return f"{whole}{frac[1:] if frac != '0' else ''}°"

#: Lines used to choose the boundaries among the candidates (enough for a
#: few revolutions; the full table is then checked line by line).
_SAMPLE = 400


class StepScheme(Scheme):
    """A two-zone step function on a longitude (modulo 360°)."""

    kind = "step"

    def __init__(self, column, frame, fast, slow, b_fast, b_slow):
        super().__init__(column, frame)
        self.fast, self.slow = fast, slow          # rates, fast > slow
        self.b_fast, self.b_slow = b_fast, b_slow  # where each zone begins
        self.full = frame.modulus[column]

    def _zone(self, lam):
        """(rate, the boundary ahead, the rate beyond it) for a longitude."""
        span_fast = (self.b_slow - self.b_fast) % self.full
        if (lam - self.b_fast) % self.full < span_fast:
            return self.fast, self.b_slow, self.slow
        return self.slow, self.b_fast, self.fast

    def advance(self, lam):
        """The step from *lam*, with the boundary rule applied."""
        w, boundary, w2 = self._zone(lam)
        x = (boundary - lam) % self.full
        if 0 < x < w:
            return x + (w - x) * Fraction(w2) / w
        return w

    def step(self, state, i, src):
        return (self._clean((state[0] + self.advance(state[0])) % self.full), None)

    def back(self, state, i, src):
        lam2 = state[0]
        guesses = [(lam2 - self.fast) % self.full, (lam2 - self.slow) % self.full]
        for b, wi, wj in ((self.b_slow, self.fast, self.slow), (self.b_fast, self.slow, self.fast)):
            over = (lam2 - b) % self.full
            x = wi - over * Fraction(wi) / wj
            guesses.append((b - x) % self.full)
        for p in guesses:
            p = self._clean(p)
            if self.step((p, None), i, src)[0] == lam2:
                return (p, None)
        return None

    def special(self, prev, i, src, written):
        if prev is None:
            return None
        lam = prev[0]
        due = self.step(prev, i, src)[0]
        w, _, w2 = self._zone(lam)
        for rate in (w, w2):
            if written == self._clean((lam + rate) % self.full) != due:
                from ..slips import Diagnosis
                return Diagnosis("zone-boundary", "a zone boundary was crossed, but the step was "
                                                  "taken at a single zone's rate")
        return None

    @staticmethod
    def _clean(v):
        if isinstance(v, Fraction) and v.denominator == 1:
            return v.numerator
        return v

    def params(self):
        f = self.frame.fraction
        period = (Fraction(self.b_slow - self.b_fast) % self.full) / self.fast + \
            (Fraction(self.b_fast - self.b_slow) % self.full) / self.slow
        return {
            "zones": [
                {"from": _where(f(self.b_fast)), "to": _where(f(self.b_slow)),
                 "rate": value_text(f(self.fast))},
                {"from": _where(f(self.b_slow)), "to": _where(f(self.b_fast)),
                 "rate": value_text(f(self.slow))},
            ],
            "lines_per_revolution": value_text(period),
            "boundary_rule": "the part of a step beyond a boundary is converted by the ratio of the rates",
        }

    def describe(self):
        f = self.frame.fraction
        return (f"step function: {degrees_text(f(self.fast))} per line from "
                f"{degrees_text(f(self.b_fast))} to {degrees_text(f(self.b_slow))}, "
                f"{degrees_text(f(self.slow))} beyond")

    @classmethod
    def fit(cls, column, frame):
        full = frame.modulus.get(column)
        values = frame.written[column]
        if not full:
            return None
        pairs = diffs(values, full)
        if len(pairs) < 6:
            return None
        counts = Counter(d for _, d in pairs)
        common = counts.most_common(2)
        if len(common) < 2 or common[1][1] < 2 or common[0][1] + common[1][1] < len(pairs) // 2:
            return None
        fast, slow = max(common[0][0], common[1][0]), min(common[0][0], common[1][0])
        cand_slow: Counter = Counter()
        cand_fast: Counter = Counter()
        for i, dl in pairs[:_SAMPLE]:
            if not slow < dl < fast:
                continue
            lam = values[i - 1]
            x1 = Fraction(fast) * (dl - slow) / (fast - slow)       # fast zone into slow
            cand_slow[cls._clean((lam + x1) % full)] += 1
            x2 = Fraction(slow) * (fast - dl) / (fast - slow)       # slow zone into fast
            cand_fast[cls._clean((lam + x2) % full)] += 1
        if not cand_slow:
            return None
        best, best_support = None, 0.0
        sample = values[:_SAMPLE]
        from .schemes import support_chained
        for bs, _ in cand_slow.most_common(8):
            for bf, _ in cand_fast.most_common(8):
                if bs == bf:
                    continue
                scheme = cls(column, frame, fast, slow, bf, bs)
                s = support_chained(scheme, sample, None)
                if s > best_support:
                    best, best_support = scheme, s
        return best if best_support > 0.5 else None


def _where(longitude: Fraction) -> dict:
    """A boundary: exact degrees, and as the end of a sign (Scorpius 30 = 240°)."""
    from ..slips import write_value
    out = value_text(longitude)
    inside = longitude % 30
    if inside == 0:
        from ..units import ZODIAC
        out["sign"] = f"30 {ZODIAC[int(longitude // 30) - 1]}"
    else:
        out["sign"] = write_value(longitude, longitude=True)
    return out


class StepDifferenceScheme(Scheme):
    """The steps of a step-function longitude (e.g. the synodic arcs beside it)."""

    kind = "step"
    chained = False

    def __init__(self, column, frame, longitude: StepScheme):
        super().__init__(column, frame)
        self.longitude = longitude
        self.inputs = (longitude.column,)

    def expect(self, i, src):
        if i == 0:
            return None
        prev = src[self.longitude.column][i - 1]
        if prev is None:
            return None
        return self._clean(self.longitude.advance(prev))

    _clean = staticmethod(StepScheme._clean)

    def special(self, prev, i, src, written):
        return None

    def params(self):
        out = dict(self.longitude.params())
        out["of"] = self.longitude.column
        return out

    def describe(self):
        return f"steps of the step function of column {self.longitude.column}"
