"""CDLI graphemes of ``disz`` and ``u`` as floating place value, as mathematical texts write them.

Places are not marked: a units sign ends a place and a tens sign after a
tens sign starts one (``7(disz) 1(u) 5(disz)`` = 7,15).  An empty place is
invisible, and the reading says so.
"""

from __future__ import annotations

from fractions import Fraction

from ... import limits
from ...errors import LimitError
from ...reading import Reading, Slot, Status
from .graphemes import WORST, Grapheme, grapheme, notes_of, status_of
from .pieces import Atom, syntax_error

__all__ = ["read_places"]

def read_places(text: str, pieces: list[Atom], notation: str) -> Reading:
    groups: list[list[tuple[Atom, Grapheme | None]]] = []
    suffix: list[Atom] = []
    prev_key = None
    for a in pieces:
        if a.kind == "word" and a.joined in ("-", ".") and groups:
            suffix.append(a)
            continue
        if a.kind == "word" and a.text in ("x", "X", "n", "N"):
            groups.append([(a, None)])
            prev_key = None
            continue
        if a.kind != "numeral":
            raise syntax_error(text, a.start, f"{a.text!r} in a place-value number", "disz and u "
                               "graphemes only (read a count with --notation atf)")
        g = grapheme(text, a, text)
        if g.key not in ("disz", "asz", "u") or g.low.denominator != 1:
            raise syntax_error(text, a.start, f"{a.text} in a place-value number (only disz and u "
                               "write places)", "disz and u graphemes, or read it as a count")
        new_place = not groups or prev_key in ("disz", "asz") or prev_key is None or \
            prev_key == "u" and g.key == "u"
        if new_place:
            groups.append([])
        groups[-1].append((a, g))
        prev_key = g.key
    if len(groups) > limits.MAX_PLACES:
        raise LimitError("number of places", len(groups), limits.MAX_PLACES,
                         "Set numcheck.limits.MAX_PLACES higher to read it.")
    slots = []
    warnings: list[str] = []
    n = len(groups)
    for k, group in enumerate(groups):
        slots.append(_place_slot(text, group, n - 1 - k, warnings))
    if suffix:
        last = slots[-1]
        tail = "".join(a.joined + a.text + a.flags for a in suffix)
        slots[-1] = Slot(values=last.values, place=last.place, status=last.status, text=last.text,
                         span=(last.span[0], suffix[-1].end), editor=last.editor,
                         form=last.form[:-1] + (last.form[-1] + tail,))
    if n > 1:
        warnings.append("places are not marked in this style: an empty place would be invisible "
                        "(1(disz) 3(u) may be 1,30 or 1,0,30)")
    return Reading(text=text, notation=notation, slots=tuple(slots), base=60, floating=True,
                   warnings=tuple(warnings))


def _place_slot(text: str, group, place: int, warnings: list[str]) -> Slot:
    start, end = group[0][0].start, group[-1][0].end
    items = []
    for a, g in group:
        warnings += notes_of(a)
        items.append((a.joined, a.text, a.flags, status_of(a), g.key if g else a.text.lower()))
    if group[0][1] is None:      # x or n: a whole place unknown
        a = group[0][0]
        status = Status.LOST if a.status is Status.LOST else Status.UNREAD
        return Slot(values=tuple(Fraction(v) for v in range(60)), place=place, status=status,
                    text=a.text, span=(start, end), form=("place", tuple(items), ""))
    tens = [(a, g) for a, g in group if g.key == "u"]
    units = [(a, g) for a, g in group if g.key != "u"]
    options_t, editor_t = _column(tens, 10, 5)
    options_u, editor_u = _column(units, 1, 9)
    values = tuple(sorted({t + u for t in options_t for u in options_u}))
    status = max((status_of(a) for a, _ in group), key=WORST.__getitem__)
    editor = None
    if editor_t is not None or editor_u is not None:
        editor = (editor_t if editor_t is not None else options_t[0]) + \
                 (editor_u if editor_u is not None else options_u[0])
    return Slot(values=values, place=place, status=status, text=text[start:end], span=(start, end),
                editor=editor if len(values) > 1 else None, form=("place", tuple(items), ""))


def _column(signs, weight: int, most: int):
    if not signs:
        return (Fraction(0),), None
    a, g = signs[0]
    status = status_of(a)
    if not g.known:
        return tuple(Fraction(k * weight) for k in range(int(g.low), int(g.high) + 1)), None
    value = Fraction(int(g.low) * weight)
    if status in (Status.RESTORED, Status.LOST):
        return tuple(Fraction(k * weight) for k in range(1, most + 1)), value
    return (value,), None


