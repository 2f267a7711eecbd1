"""Schemes across columns: running sums, products, quotients, reciprocals.

* Running sum: B_n = B_n−1 + A_n, modulo 360° for a longitude written within
  signs (the sign advances whenever the sum passes 30°), schemes-and-slips.md §1.3.
* Product and quotient of two columns, C = A·B or C = A/B, exact; for
  floating (cuneiform) columns the magnitude is free, so the digits are
  compared without it.
* Reciprocal (igi): n × igi(n) is a power of 60 (Old Babylonian reciprocal
  tables, Neugebauer & Sachs, MCT 1945; schemes-and-slips.md §1.6).
"""

from __future__ import annotations

from .. import limits

from fractions import Fraction
from itertools import permutations

from ..placevalue import mantissa
from .schemes import Scheme, support_chained, support_row, value_text

__all__ = ["RunningSumScheme", "ProductScheme", "QuotientScheme", "MultipleScheme", "ReciprocalScheme",
           "fit_cross"]

#: Rows used to look for a relation between columns before checking it all.
_SAMPLE = 120


class RunningSumScheme(Scheme):
    """B_n = B_n−1 + A_n (modulo 360° for a longitude)."""

    kind = "running-sum"

    def __init__(self, column, frame, source, modulus):
        super().__init__(column, frame)
        self.source = source
        self.inputs = (source,)
        self.modulus = modulus

    def step(self, state, i, src):
        a = src[self.source][i]
        if a is None:
            return None
        return (self._norm(state[0] + a), None)

    def back(self, state, i, src):
        a = src[self.source][i]
        if a is None:
            return None
        return (self._norm(state[0] - a), None)

    def params(self):
        out = {"of": self.source}
        if self.modulus:
            out["modulus"] = value_text(self.frame.fraction(self.modulus))
        return out

    def describe(self):
        mod = f" modulo {self.frame.fraction(self.modulus)}" if self.modulus else ""
        return f"running sum of column {self.source}{mod}"


class _RowScheme(Scheme):
    chained = False

    def __init__(self, column, frame, a, b):
        super().__init__(column, frame)
        self.a, self.b = a, b
        self.inputs = (a, b)
        self.floating = frame.floating.get(column, False)

    def _fix(self, value, i):
        """Put a floating result at the magnitude of the written cell."""
        if not self.floating:
            return value
        m = mantissa(Fraction(value, self.frame.scale) if isinstance(value, int) else value / self.frame.scale)
        if m is None:
            return None
        written = self.frame.written[self.column][i]
        target = m * self.frame.scale
        if written is not None and mantissa(Fraction(written, self.frame.scale)) == m:
            return written
        return target if target.denominator != 1 else target.numerator

    def params(self):
        return {"of": [self.a, self.b], "operation": "product"}


class ProductScheme(_RowScheme):
    kind = "product"

    def expect(self, i, src):
        x, y = src[self.a][i], src[self.b][i]
        if x is None or y is None:
            return None
        v = Fraction(x * y, self.frame.scale)
        return self._fix(v.numerator if v.denominator == 1 else v, i)

    def describe(self):
        return f"product {self.column} = {self.a} × {self.b}"


class QuotientScheme(_RowScheme):
    # DESIGN.md's kinds have no "quotient": a quotient is a product with a reciprocal.
    kind = "product"

    def params(self):
        return {"of": [self.a, self.b], "operation": "quotient"}

    def expect(self, i, src):
        x, y = src[self.a][i], src[self.b][i]
        if x is None or not y:
            return None
        v = Fraction(x * self.frame.scale, y)
        return self._fix(v.numerator if v.denominator == 1 else v, i)

    def describe(self):
        return f"quotient {self.column} = {self.a} / {self.b}"


class MultipleScheme(_RowScheme):
    """C = k × A for a constant k (a multiplication table, a change of unit)."""

    kind = "product"

    def __init__(self, column, frame, a, factor: Fraction):
        super().__init__(column, frame, a, a)
        self.inputs = (a,)
        self.factor = factor

    def expect(self, i, src):
        x = src[self.a][i]
        if x is None:
            return None
        v = self.factor * x
        return self._fix(v.numerator if v.denominator == 1 else v, i)

    def params(self):
        return {"of": [self.a], "operation": "multiple", "factor": value_text(self.factor)}

    def describe(self):
        from ..reading import sexagesimal_text
        return f"{self.column} = {sexagesimal_text(self.factor)} × {self.a}"

    @classmethod
    def fit(cls, column, frame, a):
        from .schemes import mode
        floating = frame.floating.get(column, False)
        ratios = []
        for x, y in zip(frame.written[a][:_SAMPLE], frame.written[column][:_SAMPLE]):
            if x and y is not None:
                r = Fraction(y, x)
                ratios.append(mantissa(r) if floating else r)
        ratios = [r for r in ratios if r is not None]
        if len(ratios) < 3:
            return None
        k, count = mode(ratios)
        if k in (None, 0, 1) or count * 2 <= len(ratios):
            return None
        return cls(column, frame, a, k)


class ReciprocalScheme(Scheme):
    """igi: the column holds the reciprocal of another, n × igi a power of 60."""

    kind = "reciprocal"
    chained = False

    def __init__(self, column, frame, source):
        super().__init__(column, frame)
        self.source = source
        self.inputs = (source,)

    def expect(self, i, src):
        n = src[self.source][i]
        if not n:
            return None
        s = self.frame.scale
        inv = Fraction(s * s, n)   # scaled value of 1/n
        written = self.frame.written[self.column][i]
        if written is not None and mantissa(Fraction(written) * n / (s * s)) == 1:
            return written
        # Put the reciprocal at the magnitude the written cell has (the
        # floating value is read at the scale of its last place).
        # The magnitude is found on the absolute value (a negative n would
        # otherwise grow without end), then the sign is put back.
        best = abs(inv)
        if written:
            while best * 60 <= abs(written) and best * 60 <= s * 60 ** 12:
                best *= 60
            while best > abs(written) * 60 and best > 0:
                best /= 60
        if inv < 0:
            best = -best
        return best.numerator if best.denominator == 1 else best

    def params(self):
        return {"of": self.source, "rule": "n × igi(n) is a power of 60"}

    def describe(self):
        return f"reciprocal of column {self.source} (n × igi a power of 60)"


def fit_cross(frame, taken: set[str]) -> list[Scheme]:
    """Every relation between columns that most sampled lines satisfy.

    Every pair and triple of columns is tried in a table of up to
    ``limits.AUDIT_CROSS_COLUMNS`` columns.  A wider table is searched among
    neighbours only (columns at most ``limits.AUDIT_CROSS_WINDOW`` apart),
    with a warning that says so: the full search is cubic in the columns
    (1,000 columns once took minutes).  A relation between distant columns
    can still be stated (``relation=``).
    """
    found: list[Scheme] = []
    names = frame.names
    wide = len(names) > limits.AUDIT_CROSS_COLUMNS
    window = max(2, int(limits.AUDIT_CROSS_WINDOW)) if wide else len(names)
    if wide:
        import warnings

        from ..errors import NumcheckWarning
        warnings.warn(f"The table has {len(names)} columns (over numcheck.limits."
                      f"AUDIT_CROSS_COLUMNS = {limits.AUDIT_CROSS_COLUMNS}): relations between "
                      f"columns were looked for only among columns at most {window} apart "
                      f"(numcheck.limits.AUDIT_CROSS_WINDOW); state a relation between distant "
                      "columns with --relation.", NumcheckWarning, stacklevel=3)
    index = {n: i for i, n in enumerate(names)}

    def near(*cols) -> bool:
        where = [index[c] for c in cols]
        return max(where) - min(where) <= window

    pairs = [(a, b) for a, b in permutations(names, 2) if near(a, b)] if wide \
        else list(permutations(names, 2))
    for a, b in pairs:
        if b in taken:
            continue
        for modulus in _moduli(frame, b):
            s = RunningSumScheme(b, frame, a, modulus)
            s.support = support_chained(s, frame.written[b][:_SAMPLE], frame.written)
            if s.support > 0.5:
                found.append(s)
                break
        if index[a] > index[b]:
            continue  # n × igi is symmetric: the igi is the column to the right
        r = ReciprocalScheme(b, frame, a)
        r.support = support_row(r, frame.written[b], frame.written, _SAMPLE)
        if r.support > 0.5 and _is_reciprocal_pair(frame, a, b):
            found.append(r)
        m = MultipleScheme.fit(b, frame, a)
        if m is not None:
            m.support = support_row(m, frame.written[b], frame.written, _SAMPLE)
            if m.support > 0.5:
                found.append(m)
    for a, b in pairs:
        lo, hi = min(index[a], index[b]), max(index[a], index[b])
        thirds = names[max(0, hi - window):lo + window + 1] if wide else names
        for c in thirds:
            if c in (a, b) or c in taken:
                continue
            for cls in ((ProductScheme,) if a < b else ()) + (QuotientScheme,):
                s = cls(c, frame, a, b)
                s.support = support_row(s, frame.written[c], frame.written, _SAMPLE)
                if s.support > 0.5:
                    found.append(s)
    return found


def _moduli(frame, column):
    mod = frame.modulus.get(column)
    return [mod] if mod else [None]


def _is_reciprocal_pair(frame, a, b) -> bool:
    # A column of ones beside another is not a reciprocal table; the source
    # must vary and not be a constant column.
    vals = [v for v in frame.written[a] if v is not None]
    return len(set(vals)) > 2
