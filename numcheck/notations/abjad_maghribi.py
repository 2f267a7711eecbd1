"""Abjad numerals with the western (maghribi) letter values.

The same reading and writing as :mod:`numcheck.notations.abjad`; only six
letters change value (ص 60, ض 90, س 300, ظ 800, غ 900, ش 1000).
"""

from __future__ import annotations

from . import abjad
from .abjad import format, render  # noqa: F401 - the notation's writer is abjad's

__all__ = ["NAME", "parse", "format", "render"]

NAME = abjad.MAGHRIBI


def parse(text: str):
    """Read *text* as an abjad number in the western order."""
    return abjad.parse(text, notation=NAME)
