"""Difference columns beside a function column: D = (V_next − V)/k, within the table's rounding.

Ptolemy's chord table has a column of *sixtieths*: the increase of the chord
per minute of arc, the difference to the next line (half a degree on) divided
by 30, written to three places (Almagest I.11, from memory).  Such a column is
checked against the written differences of its function column, exactly but
with the tolerance its rounding allows: each value of V is rounded to ±u_V/2,
so their difference is known to ±u_V, and D itself to ±u_D/2:

    |D − (V_next − V)/k| ≤ u_V/k + u_D/2.

A cell also fits when it agrees with the model's own difference within
1½ units of its last place (an author may have taken the differences from
unrounded values).  The last line's difference is checked against the model.
"""

from __future__ import annotations

import math
from fractions import Fraction

import numpy as np

from ...reading import sexagesimal_text
from ..schemes import Frame, Scheme
from .scheme import FunctionScheme, column_places, scaled_unit

__all__ = ["DifferenceScheme", "fit_differences"]


class DifferenceScheme(Scheme):
    """D = (V_{i+1} − V_i)/k (forward) or (V_i − V_{i−1})/k (backward)."""

    kind = "function"
    chained = False

    def __init__(self, column: str, frame: Frame, base: FunctionScheme, k: int, forward: bool,
                 places: int):
        super().__init__(column, frame)
        self.base = base
        self.inputs = (base.column,)
        self.k = k
        self.forward = forward
        self.places = places
        self.unit = scaled_unit(frame, places)
        self.tolerance = Fraction(scaled_unit(frame, base.places), k) + Fraction(self.unit) / 2
        self._model = self._model_differences()
        # Taken from the written values (every cell their exact rounded difference), or
        # from the author's unrounded ones: the recomputed value follows the same way.
        w = frame.written[column]
        same = [w[i] == self._round(d) for i in range(len(w))
                if w[i] is not None and (d := self._written_difference(i, frame.written)) is not None]
        self.from_written = bool(same) and sum(same) * 2 > len(same)

    def _model_differences(self):
        fr = self.frame
        base = self.base
        x = np.array([np.nan if v is None else v / fr.scale for v in fr.written[base.argument]])
        known = ~np.isnan(x)
        h = float(np.median(np.diff(x[known]))) if known.sum() > 1 else 0.0
        f = base.model(x, base.fit.estimate)
        other = base.model(x + (h if self.forward else -h), base.fit.estimate)
        return (other - f) / self.k * (1 if self.forward else -1) * fr.scale

    def _written_difference(self, i, src):
        v = src[self.base.column]
        j = i + 1 if self.forward else i - 1
        if not 0 <= j < len(v) or v[i] is None or v[j] is None:
            return None
        d = Fraction(v[j] - v[i] if self.forward else v[i] - v[j], self.k)
        return d

    def _round(self, d) -> int | Fraction:
        unit = Fraction(self.unit)
        v = math.floor(Fraction(d) / unit + Fraction(1, 2)) * unit
        return v.numerator if v.denominator == 1 else v

    def fits(self, i, src) -> bool | None:
        w = self.frame.written[self.column][i]
        if w is None:
            return None
        j = i + 1 if self.forward else i - 1
        if not 0 <= j < len(src[self.base.column]):
            return True   # the end of the table: no line to take the difference to
        d = self._written_difference(i, src)
        if d is not None and abs(w - d) <= self.tolerance:
            return True
        m = self._model[i]
        return bool(np.isfinite(m) and abs(float(w) - m) <= 1.5 * float(self.unit))

    def expect(self, i, src):
        ok = self.fits(i, src)
        if ok:
            return self.frame.written[self.column][i]
        d = self._written_difference(i, src)
        m = self._model[i]
        if d is not None and (self.from_written or not np.isfinite(m)):
            return self._round(d)
        return self._round(float(m)) if np.isfinite(m) else None

    @property
    def restore_tolerance(self) -> Fraction:
        return self.frame.fraction(self.tolerance)

    def params(self):
        return {"of": self.base.column, "divisor": self.k,
                "direction": "forward" if self.forward else "backward"}

    def describe(self):
        nxt = "next line" if self.forward else "line before"
        return (f"differences of column {self.base.column} (to the {nxt}) divided by {self.k}, "
                f"within ±{sexagesimal_text(self.frame.fraction(self.tolerance))}")

    def to_dict(self):
        out = super().to_dict()
        out.update({"model": "difference", "of": self.base.column,
                    "from": "written values" if self.from_written else "the model's values", "divisor": self.k,
                    "direction": "forward" if self.forward else "backward", "places": self.places,
                    "tolerance": sexagesimal_text(self.frame.fraction(self.tolerance))})
        return out


def _divisor(frame: Frame, column: str, base: str, forward: bool) -> int | None:
    v, d = frame.written[base], frame.written[column]
    ratios = []
    for i in range(len(v)):
        j = i + 1 if forward else i - 1
        if 0 <= j < len(v) and v[i] is not None and v[j] is not None and d[i]:
            ratios.append(abs((v[j] - v[i]) / d[i]))
    if len(ratios) < 3:
        return None
    k = float(np.median(ratios))
    if k < 0.5:
        return None
    n = round(k)
    return n if abs(k - n) <= 0.05 * n else None


def fit_differences(frame: Frame, functions: list[FunctionScheme], free: list[str]):
    """Difference schemes for the free columns that hold the differences of a function column."""
    from ..schemes import support_row
    out = []
    for name in free:
        best = None
        for base in functions:
            if base.column == name:
                continue
            for forward in (True, False):
                k = _divisor(frame, name, base.column, forward)
                if k is None:
                    continue
                s = DifferenceScheme(name, frame, base, k, forward, column_places(frame, name))
                s.support = support_row(s, frame.written[name], frame.written)
                if s.support > 0.5 and (best is None or s.support > best.support):
                    best = s
        if best is not None:
            out.append(best)
    return out
