"""Step functions (System A): a longitude advancing at a fixed rate per zone.

The ecliptic is divided into zones; in zone i the body advances w_i per line.
A step that crosses into zone j keeps its part up to the boundary, x, at the
old rate and converts the rest to the new one: Δλ = x + (w_i − x)·w_j/w_i
(schemes-and-slips.md §1.2, after Neugebauer, ACT 1955, and Aaboe 1958).
The fit (numcheck.audit.steps_fit) takes the commonest differences as the
rates; each crossing line proposes boundaries, and the set that explains most
lines exactly is kept.
"""

from __future__ import annotations

from bisect import bisect_right
from fractions import Fraction

from ..reading import sexagesimal_text
from .schemes import Scheme, value_text

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



class StepScheme(Scheme):
    """A step function on a longitude (modulo 360°): zones, each with its rate.

    ``bounds`` are where the zones begin, ascending on the circle; zone i runs
    from ``bounds[i]`` to ``bounds[i + 1]`` at ``rates[i]`` per line.
    """

    kind = "step"

    def __init__(self, column, frame, bounds, rates):
        super().__init__(column, frame)
        order = sorted(range(len(bounds)), key=lambda k: bounds[k])
        self.bounds = [bounds[k] for k in order]
        self.rates = [rates[k] for k in order]
        self.full = frame.modulus[column]

    def _index(self, lam) -> int:
        """The zone a longitude lies in (a boundary belongs to the zone it begins)."""
        k = bisect_right(self.bounds, lam) - 1
        return k if k >= 0 else len(self.bounds) - 1

    def advance(self, lam):
        """The step from *lam*: the boundary rule applied at every boundary crossed.

        The share of the line not yet used is carried across a boundary and
        spent at the next zone's rate: Δλ = x + (w_i − x)·w_j/w_i for one crossing.
        """
        i = self._index(lam)
        n = len(self.bounds)
        left = Fraction(1)   # the share of the line still to go
        pos, total = lam, 0
        for _ in range(n + 1):
            w = self.rates[i]
            x = (self.bounds[(i + 1) % n] - pos) % self.full or self.full
            if w * left <= x:
                return self._clean(total + w * left)
            total += x
            left -= Fraction(x) / w
            pos = self.bounds[(i + 1) % n]
            i = (i + 1) % n
        return self._clean(total)

    def step(self, state, i, src):
        return (self._clean((state[0] + self.advance(state[0])) % self.full), None)

    def back(self, state, i, src):
        lam2 = state[0]
        n = len(self.bounds)
        guesses = [(lam2 - w) % self.full for w in self.rates]
        for k in range(n):
            b, wi, wj = self.bounds[(k + 1) % n], self.rates[k], self.rates[(k + 1) % n]
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
        k = self._index(lam)
        for rate in (self.rates[k], self.rates[(k + 1) % len(self.rates)]):
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

    def _zones(self):
        """(from, to, rate) per zone, in ecliptic order from the fastest zone."""
        n = len(self.bounds)
        first = max(range(n), key=lambda k: self.rates[k])
        out = []
        for j in range(n):
            k = (first + j) % n
            out.append((self.bounds[k], self.bounds[(k + 1) % n], self.rates[k]))
        return out

    @property
    def lines_per_revolution(self) -> Fraction:
        return sum((Fraction((b - a) % self.full or self.full) / w for a, b, w in self._zones()),
                   Fraction(0))

    def params(self):
        f = self.frame.fraction
        return {
            "zones": [{"from": _where(f(a)), "to": _where(f(b)), "rate": value_text(f(w))}
                      for a, b, w in self._zones()],
            "lines_per_revolution": value_text(self.lines_per_revolution),
            "boundary_rule": "the part of a step beyond a boundary is converted by the ratio of the rates",
        }

    def describe(self):
        f = self.frame.fraction
        parts = [f"{degrees_text(f(w))} per line from {degrees_text(f(a))} to {degrees_text(f(b))}"
                 for a, b, w in self._zones()]
        return "step function: " + "; ".join(parts)

    @classmethod
    def fit(cls, column, frame):
        from .steps_fit import fit_step
        return fit_step(cls, column, frame)


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
