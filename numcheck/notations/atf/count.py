"""ATF counts: CDLI graphemes whose sign names fix the magnitude, summed (``1(gesz2) 3(u) 7(disz)`` = 97).

One slot per grapheme (at place 0) holding count × sign value; ``la2``
subtracts what follows it, ``igi-N-gal2`` is 1/N, ``x`` beside numerals is
an unread sign of its neighbour's kind, ``-kam`` and other suffixes are kept.
"""

from __future__ import annotations

from fractions import Fraction

from ...reading import Reading, Slot, Status
from .graphemes import MINUS, WORST, Grapheme, grapheme, notes_of, status_of
from .pieces import Atom, syntax_error
from .signs import MAX_COUNT, numeral_signs, sign_key

__all__ = ["read_count", "can_count"]

def can_count(text: str, pieces: list[Atom]) -> bool:
    """Whether the graphemes stand in descending order, as a count writes them."""
    weights = []
    for a in pieces:
        if a.kind == "numeral" and grapheme(text, a, text).key not in ("disz", "asz", "u"):
            return True     # a sign that fixes the magnitude: a count whatever the order
        if a.kind == "word" and a.text.lower() in MINUS:
            break
        if a.kind == "numeral":
            g = grapheme(text, a, text)
            if g.low.denominator != 1:
                continue
            weights.append(numeral_signs()[g.key].value)
    return all(x > y for x, y in zip(weights, weights[1:]))


def read_count(text: str, pieces: list[Atom], notation: str) -> Reading:
    slots: list[Slot] = []
    warnings: list[str] = []
    sign = 1
    unit = None
    systems = set()
    i = 0
    pending: list[tuple[str, str, Atom]] = []   # words written before the next slot (la2, igi)
    last_weight: Fraction | None = None
    last_word = pieces[0]
    while i < len(pieces):
        a = pieces[i]
        if a.kind == "word":
            word = sign_key(a.text)
            if word in MINUS:
                if sign < 0 or not slots:
                    raise syntax_error(text, a.start, "'la2' (less) with no number before it"
                                       if not slots else "a second 'la2'", "a la2 b (a less b)")
                sign = -1
                last_weight = None
                last_word = a
                pending.append((a.joined, a.text + a.flags, a.status))
                i += 1
                continue
            if word == "igi" and i + 2 < len(pieces) and pieces[i + 1].kind == "numeral" and \
                    sign_key(pieces[i + 2].text) in ("gal2", "gal"):
                slots.append(_reciprocal(text, a, pieces[i + 1], pieces[i + 2], sign, pending))
                pending = []
                i += 3
                continue
            before_minus = i + 1 < len(pieces) and pieces[i + 1].kind == "word" and \
                sign_key(pieces[i + 1].text) in MINUS and not slots
            if word in ("x",) and (before_minus or i + 1 < len(pieces) and pieces[i + 1].kind == "numeral" or
                                   slots and slots[-1].form and slots[-1].form[0] == "numeral"):
                nxt = pieces[i + 1] if i + 1 < len(pieces) and pieces[i + 1].kind == "numeral" else None
                slots.append(_unread_sign(text, a, nxt, slots, sign, pending, before_minus))
                warnings.append(f"{a.text!r} at column {a.start + 1}: an unread sign beside the "
                                "numerals, taken as 0 or more signs of its neighbour's kind; it may "
                                "be no numeral at all")
                pending = []
                i += 1
                continue
            if a.joined in ("-", ".") and slots:
                slots[-1] = _with_suffix(slots[-1], a)
                i += 1
                continue
            raise syntax_error(text, a.start, f"a word that is not part of a number ({a.text!r})",
                               "numeral graphemes, la2, igi-N-gal2, or a suffix such as -kam")
        if a.kind == "gap":
            raise syntax_error(text, a.start, "'...' (signs of unknown number lost) inside a count: "
                               "its value has no bound", "the count with its lost signs as [x] or n(SIGN)")
        if a.kind != "numeral":
            raise syntax_error(text, a.start, f"{a.text!r} among COUNT(SIGN) graphemes",
                               "graphemes such as 3(u) 7(disz)")
        g = grapheme(text, a, text)
        info = numeral_signs()[g.key]
        if info.system != "counting":
            systems.add(info.system)
            unit = info.unit
        weight = info.value
        if last_weight is not None and g.low.denominator == 1 and weight >= last_weight:
            raise syntax_error(text, a.start, f"{a.text} after a sign of {'the same' if weight == last_weight else 'a smaller'} "
                               "value (a count writes its signs largest first)",
                               "the signs in descending order, e.g. 1(gesz2) 3(u) 7(disz)")
        if g.low.denominator == 1:
            last_weight = weight
        status = status_of(a)
        warnings += notes_of(a)
        slots.append(_numeral_slot(a, g, weight, sign, status, pending))
        pending = []
        i += 1
    if pending:
        a = last_word
        raise syntax_error(text, a.start, f"nothing after {a.text!r}", "a number after la2")
    if len(systems) > 1:
        raise syntax_error(text, 0, f"signs of more than one metrological system ({', '.join(sorted(systems))})",
                           "one system per number")
    keys = {sign_key(s.form[2]) for s in slots if s.form and s.form[0] == "numeral"}
    if keys <= {"disz", "asz", "u"} and len([s for s in slots if s.form and s.form[0] == "numeral"]) > 1 \
            and not unit:
        warnings.append("only disz and u signs: read as a count (absolute); in a mathematical text "
                        "the number floats (--notation atf-math)")
    return Reading(text=text, notation=notation, slots=tuple(slots), base=60, floating=False,
                   unit=unit, warnings=tuple(warnings))


def _numeral_slot(a: Atom, g: Grapheme, weight: Fraction, sign: int, status: Status,
                  pending) -> Slot:
    if g.known:
        low = high = g.low
    else:
        low, high = g.low, g.high
    counts = [low] if low == high else [Fraction(k) for k in range(int(low), int(high) + 1)]
    if status in (Status.RESTORED, Status.LOST) and g.known and low.denominator == 1:
        most = MAX_COUNT.get(g.key, 9)
        editor = sign * low * weight
        counts = [Fraction(k) for k in range(1, most + 1)]
    else:
        editor = None
    values = tuple(sorted(sign * c * weight for c in counts))
    return Slot(values=values, place=0, status=status, text=a.text + a.flags, span=(a.start, a.end),
                editor=editor, form=("numeral", g.count, g.sign, a.flags, a.joined, tuple(pending), a.text, ""))


def _reciprocal(text: str, igi: Atom, num: Atom, gal: Atom, sign: int, pending) -> Slot:
    g = grapheme(text, num, text)
    if not g.known or g.low.denominator != 1 or numeral_signs()[g.key].value != 1:
        raise syntax_error(text, num.start, "igi-N-gal2 with a count numcheck cannot invert",
                           "igi-6(disz)-gal2 (1/6)")
    value = Fraction(sign, int(g.low))
    status = max((status_of(igi), status_of(num), status_of(gal)), key=WORST.__getitem__)
    return Slot(values=(value,), place=0, status=status, text=text[igi.start:gal.end], span=(igi.start, gal.end),
                form=("igi", g.count, g.sign, num.flags, igi.joined, tuple(pending),
                      tuple((p.joined, p.text + p.flags, p.status) for p in (igi, num, gal)), ""))


def _unread_sign(text: str, a: Atom, nxt: Atom | None, slots: list[Slot], sign: int, pending,
                 before_minus: bool = False) -> Slot:
    if before_minus:
        # 'x la2 1': the tens a number 'less one' counts down from (common practice)
        values = tuple(Fraction(10 * k) for k in range(1, 6))
        status = Status.LOST if a.status is Status.LOST else Status.UNREAD
        return Slot(values=values, place=0, status=status, text=a.text, span=(a.start, a.end),
                    form=("x", "x", "u", a.flags, a.joined, tuple(pending), ""))
    if nxt is not None:
        key = sign_key(grapheme(text, nxt, text).sign)
    else:
        key = sign_key(slots[-1].form[2])
    weight = numeral_signs()[key].value
    most = MAX_COUNT.get(key, 9)
    values = tuple(sorted(sign * k * weight for k in range(0, most + 1)))
    status = Status.LOST if a.status is Status.LOST else Status.UNREAD
    return Slot(values=values, place=0, status=status, text=a.text, span=(a.start, a.end),
                form=("x", "x", key, a.flags, a.joined, tuple(pending), ""))


def _with_suffix(slot: Slot, word: Atom) -> Slot:
    form = slot.form
    new = form[:-1] + (form[-1] + word.joined + word.text + word.flags,)
    return Slot(values=slot.values, place=slot.place, status=slot.status, text=slot.text,
                span=(slot.span[0], word.end), editor=slot.editor, gap=slot.gap, form=new)


