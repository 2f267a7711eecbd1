"""Turn the signs of one Greek numeral group into slots of a Reading.

A group's letters each become a slot at the group's place (a whole group at
place 0, the n-th sexagesimal group at place -n).  Lost letters become slots
whose values are what their position allows: letters stand in descending
order, one per rank (thousands, hundreds, tens, units), so a lost letter can
only take a rank left free between its neighbours (``ι[.]`` is 11..19).  A
unit fraction becomes one slot holding the reciprocals of every denominator
its letters allow.
"""

from __future__ import annotations

import itertools
from fractions import Fraction


from ...errors import NumcheckRangeError
from ... import limits
from ...reading import Slot, Status
from .letters import CANONICAL, exponent
from .conventions import ASTRONOMICAL, GENERIC, capital_thousands, lone_letter
from .model import RANK_NAMES, STATUS_ORDER, UNDERDOT, ZERO, Form, Item, fail

__all__ = ["group_slots", "letter_text", "widen", "unread_mark_slot", "TWELFTHS"]

#: What an unread fraction sign may be: the fractional parts the half and the
#: unit fractions ∠ʹ γʹ δʹ ϛʹ ιβʹ make, in twelfths (0 to 11/12).
TWELFTHS = tuple(Fraction(k, 12) for k in range(12))

_BRACKET = {Status.LOST: "[", Status.RESTORED: "[", Status.ADDED: "<", Status.SUPERFLUOUS: "{"}
_PLACE_MAX = 59


def letter_text(value: int, upper: bool = False) -> str:
    """The letters of a whole number below 10000, largest first, ``͵`` for thousands.

    >>> letter_text(1670)
    '͵αχο'
    """
    out = []
    for k in range(3, -1, -1):
        d = (value // 10**k) % 10
        if d:
            out.append(("͵" + CANONICAL[d]) if k == 3 else CANONICAL[d * 10**k])
    text = "".join(out)
    return text.upper() if upper else text


def group_slots(text: str, index: int, items: list[Item], group: Tree, gkind: str, place: int,
                ascending: bool, notes: list[str], upper: bool = False, convention: str = GENERIC,
                places: bool = False, alone: bool = False) -> list[Slot]:
    """The slots of one group (see the module docstring).

    *upper* is the case of the number so far: a group with no letter read
    (``[.]``) writes its restorations in that case.  *convention* is one of
    :data:`CONVENTIONS` (how a lone ``ο`` and a lone capital are read, see
    :mod:`numcheck.notations.greek.conventions`); *places* says that the
    number has sexagesimal places after its whole part, *alone* that the
    whole part is all there is.
    """
    keraia = any(t.type == "KERAIA" for t in group.children[1:])   # a leading one is ͵ ('Αωϙγ)
    letters = [i for i in items if i.kind == "letter"]
    if letters:
        upper = all(i.char.isupper() for i in letters)
    base = dict(group=index, gkind=gkind, upper=upper, keraia=keraia and gkind != "unitfrac",
                ascending=ascending)
    counted = [i for i in items if i.status is not Status.SUPERFLUOUS]
    span = (group.children[0].start_pos, group.children[-1].end_pos)
    group_text = text[span[0]:span[1]]
    if not counted:
        fail(text, "a group with no counted sign", items[0].start if items else 0,
             "a letter outside { } in every group")
    zeros = [i for i in counted if i.kind == "zero"]
    if zeros:
        if len(counted) > 1:
            other = zeros[0] if counted[0] is not zeros[0] else counted[1]
            fail(text, "the zero sign with letters in the same place", other.at,
                 "the zero sign 𐆊 standing alone in its place")
        z = zeros[0]
        return [Slot(values=(Fraction(0),), place=place, status=_status(z), text=text[z.start:z.end],
                     span=(z.start, z.end),
                     form=(Form(role="zero", pieces=((ZERO + (UNDERDOT if z.doubtful else ""),
                                                      _BRACKET.get(z.status)),), **base),))]
    only = counted[0] if len(counted) == 1 else None
    if gkind == "place" and only is not None and only.kind == "letter" and only.value == 70 \
            and (only.bar or only.char in "οΟ"):
        why = ("a barred omicron is the Byzantine form of the zero (Cajori, A History of Mathematical "
               "Notations I §43)" if only.bar else
               "digital texts of Greek tables type the zero as a plain omicron (Heiberg's Almagest "
               "prints it without its bar, Cajori §44)")
        if convention != ASTRONOMICAL:
            notes.append(True)
        notes.append(f"{group_text!r} read as the zero sign: {why}, and 70 cannot stand in a "
                     "sexagesimal place")
        return [Slot(values=(Fraction(0),), place=place, status=_status(only), text=group_text,
                     span=(only.start, only.end),
                     form=(Form(role="zero", pieces=((ZERO, _BRACKET.get(only.status)),), **base),))]
    if gkind == "whole" and only is not None and only.kind == "letter" and not keraia:
        special = lone_letter(only, group_text, convention, places, notes, alone=alone)
        if special is not None:
            values, role = special
            piece = only.char + (UNDERDOT if only.doubtful else "")
            start, end = widen(text, only.start, only.end)
            return [Slot(values=tuple(Fraction(v) for v in values), place=place, status=_status(only),
                         text=text[start:end], span=(start, end),
                         form=(Form(role=role, pieces=((piece, _BRACKET.get(only.status)),), **base),))]
    if gkind == "place" and only is not None and only.kind == "gap":
        notes.append(f"{group_text!r} read as 1 to {limits.GAP_MAX_PLACES} lost sexagesimal places "
                     "(numcheck.limits.GAP_MAX_PLACES)")
        return [Slot(values=tuple(Fraction(v) for v in range(60)), place=place, status=Status.LOST,
                     text=group_text, span=(only.start, only.end), gap=(1, limits.GAP_MAX_PLACES),
                     form=(Form(role="run", pieces=(("[...]", "gap"),), **base),))]
    if gkind == "unitfrac":
        return [_unit_fraction(text, items, place, ascending, notes, base, group_text, span)]
    top, limit = (1, _PLACE_MAX) if gkind == "place" else (3, None)
    slots: list[Slot] = []
    count_items, main_items = _split_myriad(text, items, gkind, upper)
    if count_items is not None:
        if any(i.status is not Status.SUPERFLUOUS for i in count_items):
            slots += _part(text, count_items, top, place, 10000, None, False, ascending, notes,
                           dict(base, count=True, myriad=True), group_text)
        else:
            slots.append(Slot(values=(Fraction(10000),), place=place, status=Status.READ, text="Μ",
                              span=(0, 0), form=(Form(role="myriad", pieces=(("Μ", None),), **base),)))
    slots += _part(text, main_items, top, place, 1, limit, count_items is None, ascending, notes, base,
                   group_text)
    if limit is not None:
        slots = _within_place(text, slots, group_text, items[0].start)
    return slots


def widen(text: str, start: int, end: int) -> tuple[int, int]:
    """Take in the brackets around a span when they hold it alone (``[.]``, ``<η>``)."""
    pairs = {"[": "]", "<": ">", "⟨": "⟩", "{": "}"}
    if start > 0 and end < len(text) and pairs.get(text[start - 1]) == text[end]:
        return start - 1, end + 1
    return start, end


def _status(item: Item) -> Status:
    if item.doubtful and item.status is Status.READ:
        return Status.DOUBTFUL
    return item.status


def _split_myriad(text: str, items: list[Item], gkind: str, upper: bool):
    """(count items or None, main items): a capital Μ among small letters is the myriad sign."""
    if gkind != "whole" or upper:
        return None, items
    marks = [k for k, i in enumerate(items) if i.kind == "letter" and i.char == "Μ"]
    if not marks:
        return None, items
    if len(marks) > 1:
        fail(text, "a second myriad sign", items[marks[1]].at, "one Μ, with the count of myriads before it")
    k = marks[0]
    return items[:k], items[k + 1:]


def _values_at(exps, limit: int | None) -> list[int]:
    out = sorted(d * 10**e for e in exps for d in range(1, 10))
    return [v for v in out if limit is None or v <= limit]


def _sums(exps: list[int], sizes, limit: int | None) -> list[int]:
    out: set[int] = set()
    for n in sizes:
        for combo in itertools.combinations(exps, n):
            partial = {0}
            for e in combo:
                partial = {p + d * 10**e for p in partial for d in range(1, 10)}
            out |= partial
    return sorted(v for v in out if limit is None or v <= limit)


def _part(text, items, top, place, mult, limit, allow_zero, ascending, notes, base, group_text):
    """Slots for a run of letters that share one order of ranks (before or after Μ)."""
    positions = [i for i in items if i.kind in ("letter", "dot", "gap")]
    fractions = [i for i in items if i.kind == "fraction"]
    exps: dict[int, int] = {}
    implicit: set[int] = set()
    for k, it in enumerate(positions):
        if it.status is Status.SUPERFLUOUS:
            continue
        if it.kind == "letter":
            e = exponent(int(it.value))
            if it.thousands:
                if e != 0:
                    fail(text, "the lower numeral sign before a letter that is not a units letter", it.at,
                         "a units letter α-θ after ͵ (͵α = 1000)")
                e = 3
            exps[k] = e
        elif it.kind == "dot" and it.thousands:
            exps[k] = 3
    keys = sorted(exps)
    if top >= 2:
        for k in capital_thousands(positions, exps, notes):
            exps[k] = 3
            implicit.add(k)
    if not ascending and top >= 2:
        for a, b in zip(keys, keys[1:]):
            if (b == a + 1 and exps[a] == 0 and exps[b] == 2 and positions[a].kind == "letter"
                    and not positions[a].thousands):
                exps[a] = 3
                implicit.add(a)
                notes.append(f"{positions[a].char!r} before {positions[b].char!r} read as thousands "
                             f"(͵{positions[a].char.lower()} = {int(positions[a].value) * 1000}): a units "
                             "letter standing before a hundreds letter, as the EpiDoc Guidelines write "
                             "1670 (αχοʹ)")
        for k in keys:
            # A units letter with lost letters after it: only as thousands can it
            # leave a rank for them (α[.]ο is ͵α[.]ο, as αχο is ͵αχο).
            after = positions[k + 1] if k + 1 < len(positions) else None
            later = [exps[j] for j in keys if j > k]
            if (exps[k] == 0 and positions[k].kind == "letter" and not positions[k].thousands
                    and after is not None and after.kind == "dot" and k + 1 not in exps
                    and (not later or later[0] < 3)):
                exps[k] = 3
                implicit.add(k)
                notes.append(f"{positions[k].char!r} before a lost letter read as thousands "
                             f"(͵{positions[k].char.lower()} = {int(positions[k].value) * 1000}): "
                             "no rank is left below a units letter for the lost letter")
    seq = [exps[k] for k in keys]
    seen: dict[int, int] = {}
    for k in keys:
        if exps[k] in seen:
            other = positions[seen[exps[k]]]
            fail(text, "two letters of the same rank", positions[k].at,
                 f"one letter for each rank; {other.char!r} already gives the {RANK_NAMES.get(exps[k], 'myriads')}")
        seen[exps[k]] = k
    desc = all(x > y for x, y in zip(seq, seq[1:]))
    asc = all(x < y for x, y in zip(seq, seq[1:]))
    ordered = asc if ascending else desc
    if len(seq) >= 2 and not ordered:
        usual = "ascending (smaller first)" if ascending else "descending"
        notes.append(True)
        notes.append(f"the letters of {group_text!r} are not in the usual {usual} order; read "
                     f"additively (use the notation 'greek-ascending' for inscriptions that write "
                     f"the smaller first)")

    def free(i: int, j: int, skip_restored: bool = False) -> list[int]:
        known = {k: e for k, e in exps.items()
                 if not (skip_restored and positions[k].status is Status.RESTORED)}
        if not ordered:
            return [e for e in range(top, -1, -1) if e not in known.values()]
        left = [known[k] for k in sorted(known) if k < i]
        right = [known[k] for k in sorted(known) if k > j]
        near_l = left[-1] if left else None
        near_r = right[0] if right else None
        if ascending:
            near_l, near_r = near_r, near_l
        hi = near_l if near_l is not None else top + 1
        lo = near_r if near_r is not None else -1
        out = [e for e in range(top, -1, -1) if lo < e < hi]
        return out[::-1] if ascending else out

    def slot(values, status, first: Item, last: Item, role, pieces, editor=None):
        vals = tuple(sorted({Fraction(v) * mult for v in values}))
        if not vals:
            fail(text, f"no letter can stand at {text[first.start:last.end]!r} in this place", first.start,
                 "a lost letter where a rank is left free for it")
        start, end = widen(text, first.start, last.end)
        return Slot(values=vals, place=place, status=status, text=text[start:end], span=(start, end),
                    editor=Fraction(editor) * mult if editor is not None else None,
                    form=(Form(role=role, pieces=tuple(pieces), mult=mult, **base),))

    slots: list[Slot] = []
    k = 0
    counted_positions = [p for p in positions if p.status is not Status.SUPERFLUOUS]
    while k < len(positions):
        it = positions[k]
        if it.status is Status.SUPERFLUOUS:
            letter = CANONICAL[int(it.value)] if it.value is not None else "."
            letter = letter.upper() if base["upper"] else letter
            slots.append(slot([it.value or 0], Status.SUPERFLUOUS, it, it, "letter",
                              [(("͵" if it.thousands else "") + letter, "{")]))
            k += 1
            continue
        if k in exps and it.kind == "letter":
            v = int(it.value) * (1000 if exps[k] == 3 and exponent(int(it.value)) == 0 else 1)
            letter = CANONICAL[int(it.value)]
            letter = letter.upper() if base["upper"] else letter
            piece = ("͵" if exps[k] == 3 else "") + letter + (UNDERDOT if it.doubtful else "")
            if it.status is Status.RESTORED:
                options = set(_values_at(free(k, k, skip_restored=True), limit)) | {v}
                slots.append(slot(options, Status.RESTORED, it, it, "letter", [(piece, "[")], editor=v))
            else:
                slots.append(slot([v], _status(it), it, it, "letter", [(piece, _BRACKET.get(it.status))]))
            k += 1
            continue
        if k in exps:   # a lost or unread letter after ͵: thousands
            slots.append(slot(_values_at([3], limit), it.status, it, it, "lost",
                              [("͵", None), (".", _BRACKET.get(it.status))]))
            k += 1
            continue
        j = k
        while j + 1 < len(positions) and positions[j + 1].kind in ("dot", "gap") and j + 1 not in exps:
            j += 1
        run = positions[k:j + 1]
        slots += _run(text, run, free(k, j), limit, allow_zero and len(counted_positions) == len(run)
                      and not fractions, slot, notes, group_text, ascending)
        k = j + 1
    for f in fractions:
        slots.append(slot([f.value], _status(f), f, f, "fraction",
                          [(f.char + (UNDERDOT if f.doubtful else ""), _BRACKET.get(f.status))]))
    return slots


def _run(text, run: list[Item], exps: list[int], limit, allow_zero, slot, notes, group_text, ascending):
    """Slots for consecutive lost or unread letters (``[..]``, ``[...]``, ``..``)."""
    dots = [i for i in run if i.kind == "dot"]
    gaps = [i for i in run if i.kind == "gap"]
    status = Status.LOST if any(i.status is Status.LOST for i in run) else Status.UNREAD
    pieces = [("[...]", "gap") if i.kind == "gap" else (".", _BRACKET.get(i.status)) for i in run]
    k = len(dots)
    if k > len(exps):
        fail(text, "more lost letters than ranks left for them", run[0].start,
             f"at most {len(exps)} lost letter(s) here, one for each rank left free"
             + (f" ({', '.join(RANK_NAMES[e] for e in exps)})" if exps else ""))
    if gaps:
        values = _sums(exps, range(k, len(exps) + 1), limit)
        ranks = ", ".join(RANK_NAMES[e] for e in exps) or "none"
        notes.append(f"'[...]' in {group_text!r} read as {k} to {len(exps)} lost letters, at most one "
                     f"for each rank left free ({ranks}); myriads are not considered")
        return [slot(values, Status.LOST, run[0], run[-1], "run", pieces)]
    if k == len(exps) and k > 1:
        return [slot(_values_at([e], limit), i.status, i, i, "lost", [(".", _BRACKET.get(i.status))])
                for i, e in zip(run, exps)]
    if k == 1:
        values = _values_at(exps, limit) + ([0] if allow_zero else [])
        return [slot(values, status, run[0], run[-1], "lost", pieces)]
    return [slot(_sums(exps, [k], limit), status, run[0], run[-1], "run", pieces)]


def _within_place(text: str, slots: list[Slot], group_text: str, start: int) -> list[Slot]:
    """Keep a sexagesimal place within 0..59: too much read is an error, lost letters are bounded."""
    counted = [s for s in slots if s.counted]
    low = sum((s.values[0] for s in counted), Fraction(0))
    if low > _PLACE_MAX:
        hint = " (for an empty place write the zero sign 𐆊)" if low == 70 else ""
        exact = all(len(s.values) == 1 for s in counted)
        raise NumcheckRangeError(
            f"The place {group_text!r} is {low}{'' if exact else ' or more'}, "
            f"but a sexagesimal place holds 0 to 59{hint}.",
            value=low, legal="0 to 59", text=text, position=start)
    out = []
    for s in slots:
        if not s.counted or len(s.values) == 1:
            out.append(s)
            continue
        room = _PLACE_MAX - (low - s.values[0])
        if s.editor is not None and s.editor > room:
            raise NumcheckRangeError(
                f"The editor's restoration in {group_text!r} makes the place more than 59.",
                value=s.editor, legal="0 to 59", text=text, position=s.span[0])
        out.append(Slot(values=tuple(v for v in s.values if v <= room), place=s.place, status=s.status,
                        text=s.text, span=s.span, editor=s.editor, gap=s.gap, form=s.form))
    return out


def _unit_fraction(text, items, place, ascending, notes, base, group_text, span) -> Slot:
    """One slot for a unit fraction (``γʹ`` = 1/3), holding every reciprocal the letters allow."""
    if any(i.kind == "fraction" for i in items):
        f = next(i for i in items if i.kind == "fraction")
        fail(text, "a fraction sign inside a unit fraction", f.at, "the fraction sign in a group of its own")
    parts = _part(text, items, 3, place, 1, None, False, ascending, notes, base, group_text)
    counted = [s for s in parts if s.counted]
    sums = {Fraction(0)}
    for s in counted:
        sums = {a + b for a in sums for b in s.values}
    dens = sorted(d for d in sums if d > 0)
    if not dens:
        fail(text, "a unit fraction with no denominator", items[0].start, "letters before the numeral sign")
    status = max((s.status for s in counted), key=STATUS_ORDER.__getitem__)
    open_slots = [s for s in counted if len(s.values) > 1 or s.status in (Status.LOST, Status.UNREAD)]
    editor = None
    if open_slots and all(s.editor is not None for s in open_slots):
        editor = 1 / sum(s.preferred for s in counted)
    read = tuple((exponent(int(s.values[0])), s.status is Status.DOUBTFUL) for s in counted
                 if len(s.values) == 1 and s.status in (Status.READ, Status.DOUBTFUL, Status.ADDED))
    pieces = tuple(p for s in parts for p in s.form[0].pieces)
    start, end = span
    return Slot(values=tuple(sorted(Fraction(1) / d for d in dens)), place=place, status=status,
                text=text[start:end], span=(start, end), editor=editor,
                form=(Form(role="unitfrac", pieces=pieces, read=read, **dict(base, keraia=True)),))



def unread_mark_slot(text: str, group: Tree, place: int, places: bool, notes: list[str], base: dict) -> Slot:
    """A group of recognition marks (``??``): a sign present but not read.

    With sexagesimal places in the number it is an unread place (0 to 59);
    otherwise an unread fraction of the units, 0 to 11/12 in twelfths.
    """
    start, end = group.children[0].start_pos, group.children[-1].end_pos
    mark = text[start:end]
    if places:
        values = tuple(Fraction(v) for v in range(_PLACE_MAX + 1))
        what = "an unread sexagesimal place (0 to 59)"
    else:
        values = TWELFTHS
        what = "an unread fraction (0 to 11/12 in twelfths, what ∠ʹ γʹ δʹ ϛʹ ιβʹ can make)"
    notes.append(True)
    notes.append(f"{mark!r} (the mark a recognised text leaves for a sign it could not read) read as {what}")
    return Slot(values=values, place=place, status=Status.UNREAD, text=mark, span=(start, end),
                form=(Form(role="unread-mark", pieces=((mark, None),), **base),))
