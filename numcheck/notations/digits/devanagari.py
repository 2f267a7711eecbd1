"""The devanagari digits: see :mod:`numcheck.notations.digits` (e.g. ``१५७७९१७५००``)."""

from __future__ import annotations

from fractions import Fraction

from ...reading import Reading
from . import SCRIPTS, format_in, parse_in

__all__ = ["NAME", "parse", "format", "render", "BAD_EXAMPLES"]

NAME = "devanagari"
_SCRIPT = SCRIPTS[NAME]

#: Known-bad inputs, the column (1-based) the error must point at, and the label.
BAD_EXAMPLES: list[tuple[str, int, str]] = [
    ("\u0967\u0968a", 3, "a character that is not part of a number in these digits"),
    ("\u09671", 2, "a digit of another script (ASCII) among them"),
    ("\u0967,\u096c\u096d", 3, "a sexagesimal place over 59"),
]


def parse(text: str) -> Reading:
    """Read *text* written in devanagari digits."""
    return parse_in(text, _SCRIPT)


def format(reading: Reading, choice: tuple[Fraction, ...] | None = None) -> str:
    """Write *reading* back in devanagari digits, marks included."""
    return format_in(reading, _SCRIPT, choice)


def render(reading: Reading, choice: tuple[Fraction, ...]) -> str:
    """One reading of a damaged number, restored digits in brackets."""
    return format_in(reading, _SCRIPT, choice)
