"""The notations numcheck reads, one module each, and how to choose one.

Every notation module offers ``NAME``, ``parse(text) -> Reading``,
``format(reading) -> str`` (the text back, marks included) and
``render(reading, choice) -> str`` (one reading of a damaged number, the
chosen values of lost places shown as restorations).
"""

from __future__ import annotations

import importlib
from types import ModuleType

from ..errors import UnknownNameError

__all__ = ["NOTATIONS", "notation_module", "format_reading", "render_choice"]

#: Notation name -> module that implements it.
NOTATIONS: dict[str, str] = {
    "sexagesimal": "numcheck.notations.sexagesimal",
    "cuneiform": "numcheck.notations.cuneiform",
    "roman": "numcheck.notations.roman",
    "abjad": "numcheck.notations.abjad",
    "abjad-maghribi": "numcheck.notations.abjad_maghribi",
    "quantity": "numcheck.notations.quantity",
    "greek": "numcheck.notations.greek",
    "greek-ascending": "numcheck.notations.greek.ascending",
    "greek-astronomical": "numcheck.notations.greek.astronomical",
    "greek-documentary": "numcheck.notations.greek.documentary",
    "attic": "numcheck.notations.attic",
    "hebrew": "numcheck.notations.hebrew",
    "aryabhata": "numcheck.notations.aryabhata",
    "arabic-indic": "numcheck.notations.digits.arabic_indic",
    "persian": "numcheck.notations.digits.persian",
    "devanagari": "numcheck.notations.digits.devanagari",
    "atf": "numcheck.notations.atf",
    "atf-math": "numcheck.notations.atf.mathstyle",
}


def notation_module(name: str) -> ModuleType:
    """The module for the notation called *name*."""
    module = _LOADED.get(name) if isinstance(name, str) else None
    if module is None:
        if not isinstance(name, str) or name not in NOTATIONS:
            raise UnknownNameError("notation", name, NOTATIONS)
        module = _LOADED[name] = importlib.import_module(NOTATIONS[name])
    return module


_LOADED: dict[str, ModuleType] = {}


def format_reading(reading) -> str:
    """Write a Reading back in its own notation."""
    return notation_module(reading.notation).format(reading)


def render_choice(reading, choice) -> str:
    """Write one reading (one value per slot) in the Reading's notation."""
    return notation_module(reading.notation).render(reading, choice)
