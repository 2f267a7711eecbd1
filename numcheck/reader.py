"""``read``: the front door from a text to a Reading.

Normalises the text (NFC), enforces the input limits, chooses the notation
(given, or detected from the characters) and hands over to that notation.
"""

from __future__ import annotations

import unicodedata

from .errors import LimitError, NumcheckSyntaxError
from .limits import MAX_TEXT_LENGTH
from .notations import NOTATIONS, notation_module
from .notations.detect import detect_notation
from .reading import Reading

__all__ = ["read", "detect_notation"]


def read(text: str, notation: str | None = None, unit: str | None = None) -> Reading:
    """Read *text* into an exact :class:`~numcheck.reading.Reading`.

    >>> read("1,49,45;20").value
    Fraction(19756, 3)
    """
    if not isinstance(text, str):
        raise NumcheckSyntaxError(f"Expected a text to read, got {type(text).__name__}", "", 0)
    if len(text) > MAX_TEXT_LENGTH:
        raise LimitError("length of the text", f"{len(text)} characters", MAX_TEXT_LENGTH,
                         "Set numcheck.limits.MAX_TEXT_LENGTH higher to read it.")
    normal = unicodedata.normalize("NFC", text).strip()
    detected = None
    if notation is None:
        notation, why = detect_notation(normal)
        detected = f"{notation} ({why})"
    elif notation not in NOTATIONS:
        notation_module(notation)  # raises UnknownNameError with suggestions
    reading = notation_module(notation).parse(normal)
    if detected is not None:
        from dataclasses import replace
        reading = replace(reading, detected=detected)
    return reading
