"""The reading of an undamaged Greek number of plain small letters, made directly.

Most numbers of a Greek table or account are small letters in their usual
order with no mark: ``κθ λα ν η κ``, ``ρκε``.  For these the general reader
(a parse tree, items, groups and their conventions) comes to one slot per
letter; this module builds those slots directly, several times faster.  It
takes only what it is sure of and returns None for anything else, which the
general reader then reads: a mark or bracket, a capital, a barred letter,
the numeral signs, letters out of their order, a lone omicron (0 or 70), a
sexagesimal place over 59.  ``tests/test_fast_paths.py`` checks on random
numbers that the two give the same reading, slot for slot and form for form.
"""

from __future__ import annotations

import re
from fractions import Fraction

from ...reading import Reading, Slot
from .letters import _LOWER, BARRED, CANONICAL, exponent
from .model import Form

__all__ = ["plain_letters_reading"]

#: The small letters read without a note (the barred ones carry a bar: not here).
_LETTERS = {ch: v for ch, v in _LOWER.items() if ch not in BARRED and len(ch) == 1}
_GROUP = "[" + "".join(sorted(_LETTERS)) + "]+"
_PLAIN = re.compile(f"{_GROUP}(?: {_GROUP})*")

#: The most a sexagesimal place holds.
_PLACE_MAX = 59


def plain_letters_reading(text: str, notation: str, max_signs: int) -> Reading | None:
    """The reading of *text* (NFC, cleaned) when it is groups of plain small letters in
    descending order, or None for the general reader."""
    if not _PLAIN.fullmatch(text) or len(text) > max_signs * 2:
        return None
    slots: list[Slot] = []
    start = 0
    groups = text.split(" ")
    if sum(map(len, groups)) > max_signs:
        return None
    for index, group in enumerate(groups):
        values = [_LETTERS[ch] for ch in group]
        ranks = [exponent(v) for v in values]
        if any(a <= b for a, b in zip(ranks, ranks[1:])):
            return None            # not in descending order: the reader notes it
        if index == 0:
            if group in ("ο", "Ο"):
                return None        # 0 or 70, by the convention
            gkind, place = "whole", 0
        else:
            if sum(values) > _PLACE_MAX or group == "ο":
                return None        # an error, or the zero typed as omicron
            gkind, place = "place", -index
        for k, (ch, v) in enumerate(zip(group, values)):
            at = start + k
            slots.append(Slot(values=(Fraction(v),), place=place, text=ch, span=(at, at + 1),
                              form=(Form(group=index, gkind=gkind, role="letter",
                                         pieces=((CANONICAL[v], None),)),)))
        start += len(group) + 1
    return Reading(text=text, notation=notation, slots=tuple(slots), base=60, warnings=())
