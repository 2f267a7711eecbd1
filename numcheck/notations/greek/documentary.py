"""Greek numerals of documentary papyri: a lone capital letter is thousands.

The same reading as :mod:`numcheck.notations.greek`, with the convention of
documentary editions (the Duke Databank of Documentary Papyri on
papyri.info; common practice of those editions) fixed for a whole file:
``Γ`` alone is 3000, ``Αξδ`` is 1064, ``'Αωϙγ`` is 1893 (a leading
apostrophe for the lower numeral sign), and ``ο`` is always seventy (see
:mod:`numcheck.notations.greek.conventions`).
"""

from __future__ import annotations

from ...reading import Reading
from . import format, render
from . import parse as _parse
from .conventions import DOCUMENTARY

__all__ = ["NAME", "parse", "format", "render"]

NAME = "greek-documentary"


def parse(text: str) -> Reading:
    """Read *text* as a Greek numeral of a documentary papyrus.

    >>> parse("Γ").value
    Fraction(3000, 1)
    """
    return _parse(text, notation=NAME, convention=DOCUMENTARY)
