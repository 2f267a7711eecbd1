"""Evidence from mathematics: a relation the number should satisfy (``x^2 = 2``).

A scribe's table of squares, reciprocals or coefficients carries numbers that
satisfy a relation: the diagonal of YBC 7289, 1;24,51,10, has a square near 2;
a reciprocal times its number is 1.  A restoration can weigh such a relation
like an expected value: the relation is solved for the number ``x`` and a
reading agrees when the solution lies within one unit of its last written
place (the scribe cut or rounded it there).

The relations accepted (``x`` the number; a value ``V`` or ``c`` written ``2``, ``1/4``, ``1;30``
or ``7,30``)::

    x^k = V      (k = 2, 3 or 4; also x*x = V, x² = V, x³ = V): x is the k-th root of V
    1/x = V      x is the reciprocal of V
    c*x = V      (or x*c = V): x = V / c
    x = V        an expected value, as --expect

An irrational root is taken to ``ROOT_PLACES`` sexagesimal places, far below
any place a text writes, so the comparison is exact in practice (a true root
within 60^-ROOT_PLACES of a rounding boundary of the last written place is
the only case it could misjudge).
"""

from __future__ import annotations

import re
from dataclasses import dataclass
from fractions import Fraction

from ..errors import NumcheckRangeError, NumcheckSyntaxError
from ..reading import exact_text, sexagesimal_text

__all__ = ["Relation", "parse_relation", "solve", "ROOT_PLACES", "EXAMPLES"]

#: Sexagesimal places to which an irrational root is taken.
ROOT_PLACES = 12

#: Examples for help and error messages.
EXAMPLES = ("x^2 = 2", "1/x = 7,30", "3*x = 1", "x^3 = 27")

_POWER = re.compile(r"\s*x\s*(?:\^\s*(?P<k>\d+)|(?P<sup>[²³⁴])|(?P<xx>(?:\s*\*\s*x)+))?\s*")
_RECIPROCAL = re.compile(r"\s*1\s*/\s*x\s*")
_TIMES = re.compile(r"\s*(?:(?P<c1>[^*=x]+?)\s*\*\s*x|x\s*\*\s*(?P<c2>[^*=x]+?))\s*")
_SUPERSCRIPT = {"²": 2, "³": 3, "⁴": 4}


@dataclass(frozen=True)
class Relation:
    """A relation ``left = value`` in the number x: kind 'power' (k), 'reciprocal' or 'times' (c)."""

    text: str
    kind: str
    value: Fraction
    power: int = 1
    factor: Fraction = Fraction(1)

    @property
    def label(self) -> str:
        v = _show(self.value)
        if self.kind == "power" and self.power > 1:
            name = {2: "square", 3: "cube", 4: "fourth power"}[self.power]
            return f"its {name} is near {v} ({self.text.strip()})"
        if self.kind == "reciprocal":
            return f"it is the reciprocal of {v} ({self.text.strip()})"
        if self.kind == "times":
            return f"{_show(self.factor)} times it is near {v} ({self.text.strip()})"
        return f"the relation {self.text.strip()}"


def _show(value: Fraction) -> str:
    return exact_text(value) if value.denominator == 1 and value < 60 else sexagesimal_text(value, max_places=6)


def _number(text: str, whole: str, offset: int) -> Fraction:
    from ..reader import read
    from ..errors import NumcheckError

    from ..catalogue.statements import parse_number

    try:
        return parse_number(text.strip())       # 2, 1/4, 6585 1/3, 1;30
    except NumcheckError:
        pass
    try:
        reading = read(text.strip(), notation="sexagesimal")
    except NumcheckError:
        raise NumcheckSyntaxError(f"Cannot read the relation {whole!r}: {text.strip()!r} is not a number",
                                  whole, offset, expected="a number such as 2, 1;30 or 7,30") from None
    if reading.damaged:
        raise NumcheckSyntaxError(f"Cannot read the relation {whole!r}: its number {text.strip()!r} is damaged",
                                  whole, offset, expected="an undamaged number")
    return reading.value


def parse_relation(text: str) -> Relation:
    """Read a relation such as ``x^2 = 2``.

    >>> parse_relation("x^2 = 2").power, parse_relation("1/x = 7,30").kind
    (2, 'reciprocal')
    """
    if not isinstance(text, str) or text.count("=") != 1:
        raise NumcheckSyntaxError(f"Cannot read the relation {text!r}: it needs one '='",
                                  str(text), len(str(text)), expected=f"e.g. {' or '.join(EXAMPLES)}")
    left, right = text.split("=")
    offset = len(left) + 1
    value = _number(right, text, offset)
    m = _POWER.fullmatch(left)
    if m:
        k = int(m["k"]) if m["k"] else _SUPERSCRIPT.get(m["sup"] or "", 0) or (
            1 + m["xx"].count("x") if m["xx"] else 1)
        if not 1 <= k <= 4:
            raise NumcheckSyntaxError(f"Cannot read the relation {text!r}: the power {k} is not one numcheck "
                                      "solves", text, left.find("^") + 1, expected="a power of 1 to 4")
        if value <= 0 and k > 1:
            raise NumcheckRangeError(f"The relation {text!r} asks for a root of {exact_text(value)}.",
                                     value=value, legal="a positive number")
        return Relation(text, "power", value, power=k)
    if _RECIPROCAL.fullmatch(left):
        if value == 0:
            raise NumcheckRangeError(f"The relation {text!r} has no solution.", value=value, legal="not 0")
        return Relation(text, "reciprocal", value)
    m = _TIMES.fullmatch(left)
    if m:
        c_text = m["c1"] or m["c2"]
        factor = _number(c_text, text, left.find(c_text))
        if factor == 0:
            raise NumcheckRangeError(f"The relation {text!r} multiplies x by 0.", value=factor, legal="not 0")
        return Relation(text, "times", value, factor=factor)
    raise NumcheckSyntaxError(f"Cannot read the relation {text!r}: its left side is not x^k, 1/x or c*x",
                              text, 0, expected=f"e.g. {' or '.join(EXAMPLES)}")


def _root(value: Fraction, k: int) -> Fraction:
    """The k-th root of *value*, exact when it is rational, else to ROOT_PLACES places (rounded)."""
    num, den = value.numerator, value.denominator
    rn, rd = _int_root(num, k), _int_root(den, k)
    if rn ** k == num and rd ** k == den:
        return Fraction(rn, rd)
    scale = 60 ** ROOT_PLACES
    target = value * scale ** k           # x * scale is the k-th root of this
    lo = _int_root(target.numerator // target.denominator, k)
    # Round: compare (lo + 1/2)^k with the target.
    if (Fraction(2 * lo + 1, 2)) ** k <= target:
        lo += 1
    return Fraction(lo, scale)


def _int_root(n: int, k: int) -> int:
    """The integer k-th root of n (the largest r with r^k <= n)."""
    if n < 2:
        return n
    r = 1 << ((n.bit_length() + k - 1) // k)
    while True:
        s = ((k - 1) * r + n // r ** (k - 1)) // k
        if s >= r:
            break
        r = s
    while r ** k > n:
        r -= 1
    while (r + 1) ** k <= n:
        r += 1
    return r


def solve(relation: Relation) -> Fraction:
    """The number x the relation asks for (an irrational root to ROOT_PLACES places).

    >>> sexagesimal_text(solve(parse_relation("x^2 = 2")), max_places=4)
    '1;24,51,10...'
    """
    if relation.kind == "power":
        return _root(relation.value, relation.power)
    if relation.kind == "reciprocal":
        return 1 / relation.value
    return relation.value / relation.factor
