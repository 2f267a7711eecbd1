"""ATF files: their lines and labels (:mod:`.lines`), the number words of a line (:mod:`.words`),
and the listing of every number of a file (:mod:`.annotate`).

The numbers themselves are read by the notation :mod:`numcheck.notations.atf`.
"""

from __future__ import annotations

from .annotate import AtfAnnotation, annotate_atf, read_atf_text
from .lines import AtfLine, text_lines
from .words import NumberWord, Trap, number_words

__all__ = ["annotate_atf", "read_atf_text", "AtfAnnotation", "text_lines", "AtfLine",
           "number_words", "NumberWord", "Trap", "ATF_SUFFIXES"]

#: File suffixes read as ATF.
ATF_SUFFIXES = (".atf",)
