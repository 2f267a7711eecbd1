"""Place-value arithmetic in base 60: the places of a value, and a floating value without its magnitude.

Cuneiform numbers float (the tablet does not fix the power of 60), so the
audit compares them by their *mantissa*, the value with its trailing empty
places and its magnitude removed; a correction is written back from the
value's places (:func:`digits_of`).
"""

from __future__ import annotations

from fractions import Fraction

__all__ = ["BASE", "mantissa", "digits_of"]

BASE = 60
_BASE = BASE


def mantissa(value: Fraction) -> Fraction | None:
    """A floating value with its magnitude removed: no trailing empty places.

    Returns None for a value that does not end in base 60 (1/7).

    >>> mantissa(Fraction(1, 2)), mantissa(Fraction(216000))
    (Fraction(30, 1), Fraction(1, 1))
    """
    value = Fraction(value)
    if value == 0:
        return Fraction(0)
    sign = -1 if value < 0 else 1
    value = abs(value)
    for _ in range(40):
        if value.denominator == 1:
            break
        value *= _BASE
    else:
        return None
    n = value.numerator
    while n % _BASE == 0:
        n //= _BASE
    return Fraction(sign * n)


def digits_of(value: Fraction, places: int) -> tuple[list[int], int] | None:
    """The sexagesimal places of |value| with *places* fractional places.

    Returns (digits, number of whole places), or None when the value does not
    end within those places.

    >>> digits_of(Fraction(3606, 60), 1)
    ([1, 0, 6], 2)
    """
    value = abs(Fraction(value))
    scaled = value * _BASE ** places
    if scaled.denominator != 1:
        return None
    n = scaled.numerator
    digits: list[int] = []
    for _ in range(places):
        n, d = divmod(n, _BASE)
        digits.append(d)
    whole = []
    while True:
        n, d = divmod(n, _BASE)
        whole.append(d)
        if not n:
            break
    return list(reversed(whole)) + list(reversed(digits)), len(whole)
