"""The reading of a Greek number of plain small letters, made directly.

Most numbers of a Greek table or account are small letters in their usual
order with no mark but the dot under a letter the editor could not read
surely (``ρ̣κε``, Leiden's unclear letter): ``κθ λα ν η κ``, ``ρκε``; the
commonest damage in an account is one letter lost at the end of a number
(``ρκ[.]``: 121 to 129).  For these the general reader (a parse tree,
items, groups, their conventions and the rank rules of lost letters) comes
to one slot per letter; this module builds those slots directly, several
times faster.  It takes only what it is sure of and returns None for
anything else, which the general reader then reads: another mark or
bracket, a capital, a barred letter, the numeral signs, letters out of
their order, a lone omicron (0 or 70; 70 in the documentary convention), a sexagesimal place over 59, a lost
letter after a units letter (which makes that letter thousands) or after
more than one group.  ``tests/test_fast_paths.py`` checks on random
numbers that the two give the same reading, slot for slot and form for form.
"""

from __future__ import annotations

import re
from fractions import Fraction

from ...reading import Reading, Slot, Status
from .conventions import DOCUMENTARY, GENERIC
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
#: Leiden's one lost letter, as the last sign of a one-group number.
_LOST = "[.]"
#: The letter values of each rank (units, tens, hundreds), smallest first.
_RANK_VALUES = tuple(tuple(Fraction(v * 10 ** r) for v in range(1, 10)) for r in range(3))

#: The slots made so far, by (letter with its dot, place, start, group): a slot is a value
#: (immutable), so numbers with the same letter at the same place share one.  The group
#: fixes its kind (the first is the whole number, the others places).
_SLOTS: dict[tuple, Slot] = {}
_SLOTS_KEPT = 20_000

#: The most a sexagesimal place holds.
_PLACE_MAX = 59


def plain_letters_reading(text: str, notation: str, max_signs: int,
                          convention: str = GENERIC) -> Reading | None:
    """The reading of *text* (NFC, cleaned) when it is groups of plain small letters in
    descending order, or one such group and one lost letter ``[.]``; None for the
    general reader.  *convention* is the reader's (:mod:`.conventions`): a lone
    ``ο`` is 70 only in the documentary one."""
    lost = text.endswith(_LOST)
    letters = text[:-len(_LOST)] if lost else text
    if (not _PLAIN.fullmatch(letters) or len(text) > max_signs * 4
            or (lost and " " in letters)):
        return None
    slots: list[Slot] = []
    start = 0
    groups = [_SIGN.findall(group) for group in letters.split(" ")]
    if sum(map(len, groups)) + lost > max_signs:
        return None
    for index, group in enumerate(groups):
        values = [_LETTERS[sign[0]] for sign in group]
        ranks = [exponent(v) for v in values]
        if any(a <= b for a, b in zip(ranks, ranks[1:])):
            return None            # not in descending order: the reader notes it
        if index == 0:
            if values == [70] and not lost and convention != DOCUMENTARY:
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
    if lost:
        if ranks[-1] == 0:
            return None             # after a units letter: read as thousands, with a note
        slots.append(_lost_slot(ranks[-1], start - 1))
    return Reading(text=text, notation=notation, slots=tuple(slots), base=60, warnings=())


def _lost_slot(below: int, start: int) -> Slot:
    """The slot of one lost letter at *start*, after a letter of rank *below*: any letter of
    a lower rank (``ρ[.]``: a ten or a unit; ``ρκ[.]``: a unit)."""
    key = (_LOST, below, start)
    slot = _SLOTS.get(key)
    if slot is None:
        if len(_SLOTS) >= _SLOTS_KEPT:
            _SLOTS.clear()
        slot = _SLOTS[key] = Slot(
            values=tuple(v for rank in range(below) for v in _RANK_VALUES[rank]), place=0,
            status=Status.LOST, text=_LOST, span=(start, start + len(_LOST)),
            form=(Form(group=0, gkind="whole", role="lost", pieces=((".", "["),)),))
    return slot
