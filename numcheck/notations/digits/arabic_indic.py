"""The arabic-indic digits: see :mod:`numcheck.notations.digits` (e.g. ``١٥٧٧٩١٧٥٠٠``)."""

from __future__ import annotations

from fractions import Fraction

from ...reading import Reading
from . import SCRIPTS, format_in, parse_in

__all__ = ["NAME", "parse", "format", "render", "BAD_EXAMPLES"]

NAME = "arabic-indic"
_SCRIPT = SCRIPTS[NAME]

#: Known-bad inputs, the column (1-based) the error must point at, and the label.
BAD_EXAMPLES: list[tuple[str, int, str]] = [
    ("\u0661\u0662a", 3, "a character that is not part of a number in these digits"),
    ("\u06612", 2, "a digit of another script (ASCII) among them"),
    ("\u0661\u06f4", 2, "a digit of another script (Persian) among them"),
    ("\u0661\u060c\u060c\u0662", 3, "an empty place between two commas"),
]


def parse(text: str) -> Reading:
    """Read *text* written in arabic-indic digits."""
    return parse_in(text, _SCRIPT)


def format(reading: Reading, choice: tuple[Fraction, ...] | None = None) -> str:
    """Write *reading* back in arabic-indic digits, marks included."""
    return format_in(reading, _SCRIPT, choice)


def render(reading: Reading, choice: tuple[Fraction, ...]) -> str:
    """One reading of a damaged number, restored digits in brackets."""
    return format_in(reading, _SCRIPT, choice)
