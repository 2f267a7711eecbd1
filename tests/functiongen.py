"""Tables of computed functions generated from published parameters, for the function audit's tests.

Each value is computed in floats from the formula and then written exactly,
rounded (or truncated) to the table's places, as the author would; slips are
injected into the cell texts where a test asks.  The formulas are written out
here again (not imported from numcheck) so that the tests check the package
against an independent computation.
"""

from __future__ import annotations

import math
from fractions import Fraction as F

__all__ = ["sexa", "rounded", "chord", "sine", "declination", "solar_equation", "interpolate",
           "tsv", "greek", "argument_text"]


def rounded(v: float, places: int, truncate: bool = False) -> F:
    q = v * 60 ** places
    n = math.floor(q + 1e-9) if truncate else math.floor(q + 0.5)
    return F(n, 60 ** places)


def sexa(value: F, places: int) -> str:
    """*value* (a multiple of 60**-places) as ``d;m,s`` with exactly *places* places."""
    sign = "-" if value < 0 else ""
    n = abs(value) * 60 ** places
    assert n.denominator == 1
    n = int(n)
    digits = []
    for _ in range(places):
        n, d = divmod(n, 60)
        digits.append(d)
    if not places:
        return f"{sign}{n}"
    return f"{sign}{n};" + ",".join(str(d) for d in reversed(digits))


def argument_text(a: F) -> str:
    whole = a.numerator // a.denominator
    frac = a - whole
    if not frac:
        return str(whole)
    m = frac * 60
    if m.denominator == 1:
        return f"{whole};{int(m)}"
    s = (m - int(m)) * 60
    return f"{whole};{int(m)},{int(s)}"


def chord(a: float, R: float = 60) -> float:
    return 2 * R * math.sin(math.radians(a) / 2)


def sine(a: float, R: float) -> float:
    return R * math.sin(math.radians(a))


def declination(lam: float, eps: float) -> float:
    return abs(math.degrees(math.asin(math.sin(math.radians(eps)) * math.sin(math.radians(lam)))))


def solar_equation(a: float, e: float, R: float = 60) -> float:
    return abs(math.degrees(math.atan2(e * math.sin(math.radians(a)), R + e * math.cos(math.radians(a)))))


def interpolate(values_at, args: list[F], step: int, places: int) -> list[F]:
    """Nodes every *step* lines computed exactly (rounded), the lines between interpolated linearly."""
    n = len(args)
    nodes = {i: rounded(values_at(float(args[i])), places) for i in range(0, n, step)}
    out = []
    for i in range(n):
        a = (i // step) * step
        b = a + step
        if i == a or b not in nodes:
            out.append(nodes[a] if i == a else rounded(values_at(float(args[i])), places))
            continue
        v = nodes[a] + F(i - a, step) * (nodes[b] - nodes[a])
        out.append(rounded(float(v), places))
    return out


def tsv(header: list[str], columns: list[list[str]]) -> str:
    lines = ["\t".join(header)]
    for row in zip(*columns):
        lines.append("\t".join(row))
    return "\n".join(lines) + "\n"


_UNITS = ["", "α", "β", "γ", "δ", "ε", "ϛ", "ζ", "η", "θ"]
_TENS = ["", "ι", "κ", "λ", "μ", "ν", "ξ", "ο", "π", "ϙ"]
_HUNDREDS = ["", "ρ"]


def greek(n: int) -> str:
    """A whole number below 200 in Greek letter numerals (0 as the zero sign 𐆊), common practice."""
    if n == 0:
        return "𐆊"
    return _HUNDREDS[n // 100] + _TENS[n // 10 % 10] + _UNITS[n % 10]
