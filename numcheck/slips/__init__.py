"""What scribes get wrong: the slip classifier and the confusions of each script.

:mod:`numcheck.slips.classify` names the slip that turns an expected value
into the written one (a unit or ten slip, a place shift, a dropped zero ...)
and writes a value back as the scribe would have; :mod:`numcheck.slips.confusions`
holds the look-alike signs of each script, with their sources.
"""

from __future__ import annotations

from .classify import KINDS, Diagnosis, classify, write_value
from .confusions import Alternative, alternatives, confusion_table, letter_confusion

__all__ = ["KINDS", "Diagnosis", "classify", "write_value", "Alternative", "alternatives",
           "confusion_table", "letter_confusion"]
