"""The notation ``atf-math``: ATF numbers of mathematical texts, whose place value floats.

CDLI graphemes of ``disz`` and ``u`` are grouped into places (``7(disz)
1(u) 5(disz)`` = 7,15) instead of summed as a count, and Oracc's ``1.40``
is read as the ``atf`` notation reads it.  Written back in the same style.
"""

from __future__ import annotations

from ...reading import Reading
from .build import build
from .writing import format, render, write_like

__all__ = ["NAME", "parse", "format", "render", "write_like"]

NAME = "atf-math"


def parse(text: str) -> Reading:
    """Read *text* as a floating ATF number.

    >>> parse("3(u)").floating, parse("1.40").value
    (True, Fraction(100, 1))
    """
    from . import parse as parse_any
    if any(ch == "(" for ch in text):
        return build(text, mode="place", notation=NAME)
    reading = parse_any(text, mode="math")
    from dataclasses import replace
    return replace(reading, notation=NAME)
