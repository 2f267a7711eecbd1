"""The reading of an undamaged Greek number of plain small letters, made directly.

Most numbers of a Greek table or account are small letters in their usual
order with no mark but the dot under a letter the editor could not read
surely (``ρ̣κε``, Leiden's unclear letter): ``κθ λα ν η κ``, ``ρκε``.  For these the general reader
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

from ...reading import Reading, Slot, Status
from .letters import _LOWER, BARRED, CANONICAL, exponent
from .model import Form

__all__ = ["plain_letters_reading"]

#: The small letters read without a note (the barred ones carry a bar: not here).
_LETTERS = {ch: v for ch, v in _LOWER.items() if ch not in BARRED and len(ch) == 1}
#: Leiden's dot under a letter read with doubt (COMBINING DOT BELOW).
_DOT = "\u0323"
_GROUP = "(?:[" + "".join(sorted(_LETTERS)) + "]" + _DOT + "?)+"
_PLAIN = re.compile(f"{_GROUP}(?: {_GROUP})*")
#: One letter and its dot, if any.
_SIGN = re.compile("." + _DOT + "?")

#: The slots made so far, by (letter with its dot, place, start, group): a slot is a value
#: (immutable), so numbers with the same letter at the same place share one.  The group
#: fixes its kind (the first is the whole number, the others places).
_SLOTS: dict[tuple, Slot] = {}
_SLOTS_KEPT = 20_000

#: The most a sexagesimal place holds.
_PLACE_MAX = 59


def plain_letters_reading(text: str, notation: str, max_signs: int) -> Reading | None:
    """The reading of *text* (NFC, cleaned) when it is groups of plain small letters in
    descending order, or None for the general reader."""
    if not _PLAIN.fullmatch(text) or len(text) > max_signs * 4:
        return None
    slots: list[Slot] = []
    start = 0
    groups = [_SIGN.findall(group) for group in text.split(" ")]
    if sum(map(len, groups)) > max_signs:
        return None
    for index, group in enumerate(groups):
        values = [_LETTERS[sign[0]] for sign in group]
        ranks = [exponent(v) for v in values]
        if any(a <= b for a, b in zip(ranks, ranks[1:])):
            return None            # not in descending order: the reader notes it
        if index == 0:
            if values == [70]:
                return None        # 0 or 70, by the convention (dotted or not)
            gkind, place = "whole", 0
        else:
            if sum(values) > _PLACE_MAX or values == [70]:
                return None        # an error, or the zero typed as omicron
            gkind, place = "place", -index
        for sign, v in zip(group, values):
            key = (sign, place, start, index)
            slot = _SLOTS.get(key)
            if slot is None:
                if len(_SLOTS) >= _SLOTS_KEPT:
                    _SLOTS.clear()
                slot = _SLOTS[key] = Slot(
                    values=(Fraction(v),), place=place,
                    status=Status.DOUBTFUL if len(sign) > 1 else Status.READ,
                    text=sign, span=(start, start + len(sign)),
                    form=(Form(group=index, gkind=gkind, role="letter",
                               pieces=((CANONICAL[v] + sign[1:], None),)),))
            slots.append(slot)
            start += len(sign)
        start += 1
    return Reading(text=text, notation=notation, slots=tuple(slots), base=60, warnings=())
