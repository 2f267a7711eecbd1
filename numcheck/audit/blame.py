"""Blame the input: a line that breaks a relation because one of its inputs holds the slip.

When a row relation (``I = d*d / (d*d - b*b)``, a product, a quotient) fails
on a line, each input cell of that line is given the values the slips model
says the scribe may have meant instead of what he wrote (one unit wedge or
ten-corner more or less in one place, the value one place off, the double,
the half, the square root of a square copied from the worksheet, a
neighbour copied).  If one such value of one input makes the relation hold
with the result as written, the slip is that input's, and the result is
right.  A value the relation gives that no scribe could write (negative in
a column of positive numbers, or a fraction that does not terminate in base
60) is never offered as the expected value.
"""

from __future__ import annotations

from fractions import Fraction
from math import isqrt

__all__ = ["originals", "blame_input", "writable"]

#: Most sexagesimal places an input is varied in.
_PLACES = 8


def _regular(n: int) -> bool:
    for p in (2, 3, 5):
        while n % p == 0 and n:
            n //= p
    return n == 1


def writable(value: Fraction, column_values) -> bool:
    """Whether a scribe could write *value* in a column holding *column_values*."""
    value = Fraction(value)
    if not _regular(value.denominator):
        return False
    if value < 0 and all(v is None or v >= 0 for v in column_values):
        return False
    return True


def _sqrt(v: Fraction) -> Fraction | None:
    if v <= 0:
        return None
    a, b = isqrt(v.numerator), isqrt(v.denominator)
    return Fraction(a, b) if a * a == v.numerator and b * b == v.denominator else None


def originals(written: Fraction, places: int, neighbours=()) -> list[tuple[Fraction, str]]:
    """What the scribe may have meant instead of *written*, by the slips model (value, how)."""
    written = Fraction(written)
    out: list[tuple[Fraction, str]] = []
    top = 0
    while abs(written) >= Fraction(60) ** (top + 1) and top < _PLACES:
        top += 1
    for k in range(-places, top + 1):
        step = Fraction(60) ** k
        digit = (written // step) % 60
        for size, how in ((1, "a unit wedge"), (10, "a ten-corner")):
            for sign in (1, -1):
                if 0 <= digit + sign * size <= 59:
                    out.append((written + sign * size * step, how))
    out.append((written / 60, "one place off"))
    out.append((written * 60, "one place off"))
    out.append((written / 2, "the double copied"))
    out.append((written * 2, "the half copied"))
    root = _sqrt(written)
    if root is not None:
        out.append((root, "the square copied"))
    for n in neighbours:
        if n is not None and n != written:
            out.append((Fraction(n), "a neighbour copied"))
    seen, unique = {written}, []
    for v, how in out:
        if v not in seen:
            seen.add(v)
            unique.append((v, how))
    return unique


def blame_input(frame, scheme, i: int, written_result, true) -> list[tuple[str, object, str]]:
    """Every (input column, scaled value meant, how) whose slip alone explains line *i*.

    One entry blames that input; several leave the choice to the editor.
    """
    found = []
    s = frame.scale
    for name in scheme.inputs:
        w = true[name][i] if true[name][i] is not None else frame.written[name][i]
        if w is None or frame.written[name][i] is None:
            continue
        value = frame.fraction(frame.written[name][i])
        places = max(0, -_last_place(value))
        col = frame.written[name]
        neighbours = [frame.fraction(col[j]) for j in (i - 1, i + 1) if 0 <= j < len(col)]
        for cand, how in originals(value, places, neighbours):
            scaled = cand * s
            scaled = scaled.numerator if scaled.denominator == 1 else scaled
            saved = true[name][i]
            true[name][i] = scaled
            try:
                e = scheme.expect(i, true)
            finally:
                true[name][i] = saved
            if e is not None and e == written_result:
                found.append((name, scaled, how))
                break
    return found


def _last_place(value: Fraction) -> int:
    """The exponent of the last sexagesimal place of *value* (0 for a whole number)."""
    k = 0
    v = Fraction(value)
    while v.denominator != 1 and k < 12:
        v *= 60
        k += 1
    return -k
