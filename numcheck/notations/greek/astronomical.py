"""Greek numerals of astronomical texts: a plain ``ο`` standing alone is the zero.

The same reading as :mod:`numcheck.notations.greek`, with the convention of
Ptolemy's tables as their digital editions type them fixed for a whole file:
``ο νθ η ιζ ιγ ιβ λα`` is 0;59,8,17,13,12,31 (the zero typed as omicron;
Cajori, *A History of Mathematical Notations* I §§43-44), and a lone capital
letter is a units letter, not thousands (see
:mod:`numcheck.notations.greek.conventions`).
"""

from __future__ import annotations

from ...reading import Reading
from . import format, render
from . import parse as _parse
from .conventions import ASTRONOMICAL

__all__ = ["NAME", "parse", "format", "render"]

NAME = "greek-astronomical"


def parse(text: str) -> Reading:
    """Read *text* as a Greek numeral of an astronomical text.

    >>> parse("ο νθ η").value
    Fraction(887, 900)
    """
    return _parse(text, notation=NAME, convention=ASTRONOMICAL)
