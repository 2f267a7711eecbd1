"""Greek alphabetic numerals written smaller first, as some inscriptions do.

The same reading as :mod:`numcheck.notations.greek`, expecting ascending
order (``ια`` written ``αι``; Heath, *A History of Greek Mathematics* I p. 36,
on inscriptions of Asia Minor).  A lost letter then takes a rank between its
neighbours in that order.
"""

from __future__ import annotations

from ...reading import Reading
from . import format, render
from . import parse as _parse

__all__ = ["NAME", "parse", "format", "render"]

NAME = "greek-ascending"


def parse(text: str) -> Reading:
    """Read *text* as a Greek numeral whose letters stand smaller first.

    >>> parse("ακ").value
    Fraction(21, 1)
    """
    return _parse(text, ascending=True, notation=NAME)
