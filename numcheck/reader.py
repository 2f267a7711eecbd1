"""``read``: the front door from a text to a Reading.

Normalises the text (NFC), names look-alike characters from another script
(:mod:`numcheck.notations.lookalikes`), enforces the input limits, chooses the notation
(given, or detected from the characters) and hands over to that notation.  A
text with unit words (``3 signs 12;30°``, ``6585 1/3 days``) is a mixed
quantity: :mod:`numcheck.notations.quantity` reads each number in its
notation (the one given, or detected) and gives the value in the finest unit
written.  ``unit=`` converts a quantity exactly to that unit, or says which
unit a bare number is in.
"""

from __future__ import annotations

import unicodedata
from dataclasses import replace

from .errors import LimitError, NumcheckSyntaxError
from .notations.lookalikes import check_attic_scripts, check_lookalikes
from . import limits
from .notations import NOTATIONS, notation_module
from .notations import quantity
from .notations.detect import detect_notation
from .reading import Reading

__all__ = ["read", "detect_notation"]


def _greek_zero_circle(text: str) -> bool:
    # 'κθ ° λ': a degree sign alone among Greek groups is the zero, not a unit (the
    # Greek package is imported only then, so plain numbers do not load its grammar).
    if "°" not in text:
        return False
    from .notations.greek.spelling import degree_sign_as_zero
    return degree_sign_as_zero(text)


def read(text: str, notation: str | None = None, unit: str | None = None) -> Reading:
    """Read *text* into an exact :class:`~numcheck.reading.Reading`.

    >>> read("1,49,45;20").value
    Fraction(19756, 3)
    >>> read("2 bēru 10 UŠ").value, read("2 bēru 10 UŠ").unit
    (Fraction(70, 1), 'UŠ')
    >>> read("2 bēru 10 UŠ", unit="hours").value
    Fraction(14, 3)
    """
    if not isinstance(text, str):
        raise NumcheckSyntaxError(f"Expected a text to read, got {type(text).__name__}", "", 0)
    if len(text) > limits.MAX_TEXT_LENGTH:
        raise LimitError("length of the text", f"{len(text)} characters", limits.MAX_TEXT_LENGTH,
                         "Set numcheck.limits.MAX_TEXT_LENGTH higher to read it.")
    normal = check_lookalikes(unicodedata.normalize("NFC", text).strip())
    if notation is not None and (not isinstance(notation, str) or notation not in NOTATIONS):
        notation_module(notation)  # raises UnknownNameError with suggestions
    if notation == quantity.NAME or (quantity.has_units(normal) and not _greek_zero_circle(normal)):
        reading = quantity.parse(normal, notation=None if notation == quantity.NAME else notation)
    else:
        detected = None
        if notation is None:
            notation, why = detect_notation(normal)
            detected = f"{notation} ({why})"
        reading = notation_module(notation).parse(normal)
        if reading.notation == "attic":
            check_attic_scripts(normal)
        if detected is not None:
            reading = replace(reading, detected=detected)
    if unit is not None:
        reading = quantity.with_unit(reading, unit)
    return reading
