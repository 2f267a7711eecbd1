"""Write a Greek numeral Reading back as text, marks included.

Without a choice the canonical form of what was read comes back: small
letters (stigma ϛ, koppa ϟ, sampi ϡ), ``͵`` for thousands, the zero sign 𐆊,
``ʹ`` (U+02B9, the NFC form of the numeral sign) on unit fractions, damage
marks as read.  With a choice (one value per slot) the chosen letters of lost
places are written inside brackets, as a restoration: ``κθ λα ν [η] κ``.
"""

from __future__ import annotations

from fractions import Fraction

from ...reading import Reading, Slot, Status
from .build import letter_text
from .letters import CANONICAL, spell_parts
from .model import KERAIA, UNDERDOT, ZERO
from ..marks import RAW, join_marked

__all__ = ["format", "render"]

_OPEN_STATUS = (Status.LOST, Status.UNREAD, Status.RESTORED)


def format(reading: Reading, choice: tuple[Fraction, ...] | None = None) -> str:
    """Write *reading* back in Greek numerals; with *choice*, that reading restored.

    >>> from numcheck.notations.greek import parse
    >>> r = parse("κθ λα ν [.] κ")
    >>> format(r)
    'κθ λα ν [.] κ'
    >>> format(r, tuple(s.values[0] if len(s.values) == 1 else Fraction(8) for s in r.slots))
    'κθ λα ν [η] κ'
    """
    groups: list[list[tuple[Slot, Fraction | None]]] = []
    keys: list[object] = []
    for i, slot in enumerate(reading.slots):
        key = slot.form[0].group if slot.form else ("expanded", i)
        if not keys or keys[-1] != key:
            keys.append(key)
            groups.append([])
        groups[-1].append((slot, choice[i] if choice is not None else None))
    return " ".join(_group_text(g, choice is not None) for g in groups)


def render(reading: Reading, choice: tuple[Fraction, ...]) -> str:
    """Write one reading of a damaged number, restored letters in brackets."""
    return format(reading, choice)


def _group_text(group: list[tuple[Slot, Fraction | None]], chosen: bool) -> str:
    pieces: list[tuple[str, str | None]] = []
    first = group[0][0]
    if not first.form:   # a place made by expanding '[...]'
        slot, value = group[0]
        if value is None:
            return "[...]"
        return "[" + (letter_text(int(value)) if value else ZERO) + "]"
    form = first.form[0]
    was_count = False
    for slot, value in group:
        f = slot.form[0]
        if was_count and not f.count:
            pieces.append(("Μ", None))
        was_count = f.count
        pieces += _slot_pieces(slot, f, value if chosen else None)
    if was_count:
        pieces.append(("Μ", None))
    if not any(text for text, _ in pieces):
        pieces = [(ZERO, "[")]
    out = _merge(pieces)
    if form.keraia or form.role == "unitfrac":
        out += KERAIA
    return out


def _slot_pieces(slot: Slot, f, value: Fraction | None) -> list[tuple[str, str | None]]:
    if value is None or not _is_open(slot, f):
        return list(f.pieces)
    bracket = None if slot.status is Status.UNREAD else "["
    if f.role in ("omicron", "capital"):
        # One letter read, its meaning open: write the reading chosen plainly.
        written = f.pieces[0][0]
        if f.role == "omicron":
            text = ZERO if value == 0 else written
        else:
            text = written if value < 1000 else "͵" + written
        return [(text, f.pieces[0][1])]
    if f.role == "unitfrac":
        return _unit_fraction_pieces(f, value)
    if f.role == "unread-mark":
        if f.gkind == "unread" and slot.place == 0:
            return [(fraction_text(value) or ZERO, bracket)]
        return [(letter_text(int(value)) if value else ZERO, bracket)]
    n = int(value / f.mult)
    if n == 0:
        return []
    text = letter_text(n, f.upper)
    letters = _split_letters(text)
    if f.ascending:
        letters = letters[::-1]
    return [(ch, bracket) for ch in letters]


def _is_open(slot: Slot, f) -> bool:
    return f.role in ("lost", "run") or slot.status in _OPEN_STATUS or len(slot.values) > 1


def _split_letters(text: str) -> list[str]:
    """Split '͵αχο' into ['͵α', 'χ', 'ο'] (the thousands sign stays with its letter)."""
    out: list[str] = []
    for ch in text:
        if out and out[-1] == "͵":
            out[-1] += ch
        else:
            out.append(ch)
    return out


def _unit_fraction_pieces(f, value: Fraction) -> list[tuple[str, str | None]]:
    read = dict(f.read)
    out = []
    for e, letter, mult in spell_parts(int(1 / value)):
        ch = ("͵" if mult == 1000 else "") + CANONICAL[letter]
        ch = ch.upper() if f.upper else ch
        if e in read:
            out.append((ch + (UNDERDOT if read[e] else ""), None))
        else:
            out.append((ch, "["))
    return out[::-1] if f.ascending else out


def _merge(pieces: list[tuple[str, str | None]]) -> str:
    """Join pieces, one bracket around each run that shares it."""
    return join_marked([(text, RAW if bracket == "gap" else bracket) for text, bracket in pieces])


_PARTS = (Fraction(1, 2), Fraction(1, 3), Fraction(1, 4), Fraction(1, 6), Fraction(1, 12))


def fraction_text(value: Fraction) -> str:
    """A fraction below 1 in twelfths as Ptolemy writes it: the half, then unit fractions.

    >>> fraction_text(Fraction(5, 6))
    '∠ʹ γʹ'
    """
    out = []
    rest = Fraction(value)
    for part in _PARTS:
        if part <= rest:
            out.append("∠" + KERAIA if part == Fraction(1, 2) else CANONICAL_TEXT[part.denominator] + KERAIA)
            rest -= part
    return " ".join(out)


CANONICAL_TEXT = {3: "γ", 4: "δ", 6: "ϛ", 12: "ιβ"}
