"""Write an ATF Reading back in the style it was written in, and a value in that style.

:func:`format` rewrites every piece from its form (count, sign name as
spelled, flags, the words la2, igi ... gal2, ME, suffixes) and puts the
brackets back from the statuses, one bracket around each run (``[1(u)]
9(disz)``).  With a *choice* (one value per slot) a damaged piece is written
with the chosen count.  :func:`write_like` writes a new value as the scribe
of a given Reading would have: a count in its sign names (``2(u) 4(disz)``),
a floating number in ``disz``/``u`` places, or Oracc's ``1.40``.
"""

from __future__ import annotations

from dataclasses import replace
from fractions import Fraction

from ...placevalue import digits_of, mantissa
from ...reading import Reading, Slot, Status, exact_text
from ..marks import RAW, SEPARATOR, join_marked
from .pieces import OPENERS
from .signs import is_unicode_spelling, numeral_signs, sign_key, split_modifiers

__all__ = ["format", "render", "write_like", "write_count", "write_places", "write_math", "style_of"]

_UNICODE_NAMES = {"disz": "diš", "asz": "aš", "u": "u", "gesz2": "geš₂", "gesz'u": "geš'u",
                  "szar2": "šar₂", "szar'u": "šar'u", "szargal": "šargal"}
#: Counting signs from the largest down, as a count is written.
_DESCENDING = ("szargal", "szar'u", "szar2", "gesz'u", "gesz2", "u", "disz")
_FRACTIONS = (Fraction(5, 6), Fraction(2, 3), Fraction(1, 2), Fraction(1, 3))


def _bracket(status: Status) -> str | None:
    return OPENERS.get(status)


def format(reading: Reading, choice: tuple[Fraction, ...] | None = None) -> str:
    """*reading* as ATF, its marks included; with *choice*, that reading of it."""
    pieces: list[tuple[str, str | None]] = []
    style = None
    for k, slot in enumerate(reading.slots):
        chosen = None if choice is None else choice[k]
        if not slot.form:
            # a place of an unknown number of lost places, once their number is chosen
            style = style or style_of(reading)["style"]
            _formless_pieces(slot, chosen, pieces, style, first=k == 0)
            continue
        _slot_pieces(slot, chosen, pieces, first=k == 0)
    text = join_marked(pieces).strip()
    return text


def render(reading: Reading, choice: tuple[Fraction, ...]) -> str:
    """One reading of a damaged number, the chosen counts of lost signs in brackets."""
    return format(reading, choice)


def _slot_pieces(slot: Slot, chosen: Fraction | None, pieces: list, *, first: bool) -> None:
    form = slot.form
    kind = form[0]
    if kind == "scaled":            # a number of a quantity: its own form, then its unit words
        _kind, factor, inner, tail = form
        unscaled = replace(slot, values=tuple(sorted(v / factor for v in slot.values)),
                           editor=None if slot.editor is None else slot.editor / factor, form=inner)
        if inner:
            _slot_pieces(unscaled, None if chosen is None else chosen / factor, pieces, first=first)
        else:
            _formless_pieces(unscaled, None if chosen is None else chosen / factor, pieces, "count",
                             first=first)
        if tail:
            pieces.append((" " + tail, RAW))
        return
    bracket = _bracket(slot.status)
    if chosen is not None and len(slot.values) == 1:
        chosen = None
    if kind == "sign":          # a Unicode counting sign, written as it stands
        pieces.append((form[1], bracket))
        return
    if kind in ("numeral", "igi", "x"):
        for joined, word, status in form[5]:
            pieces.append((joined, SEPARATOR))
            pieces.append((word, _bracket(status)))
        joined = form[4]
        if kind == "numeral":
            count, written = form[1], form[6]
            text = written
            if chosen is not None:
                weight = numeral_signs()[sign_key(form[2])].value
                text = exact_text(abs(chosen) / weight) + written[len(count):]
                if abs(chosen) == 0:
                    text = ""
            text += form[3]
        elif kind == "igi":
            # igi-N-gal2: three pieces, each in its own brackets
            if not (first and not form[5]):
                pieces.append((joined or " ", SEPARATOR))
            for k, (part_joined, part, status) in enumerate(form[6]):
                if k:
                    pieces.append((part_joined, SEPARATOR))
                pieces.append((part, _bracket(status)))
            if form[-1]:
                pieces.append((form[-1], RAW))
            return
        else:
            text = "x" + form[3]
            if chosen is not None:
                key = form[2]
                weight = numeral_signs()[key].value
                text = "" if chosen == 0 else f"{exact_text(abs(chosen) / weight)}({key})"
        if text:
            if not (first and not form[5]):
                pieces.append((joined or " ", SEPARATOR))
            pieces.append((text, bracket))
        if form[-1]:
            pieces.append((form[-1], RAW))
        return
    if kind == "place":
        items = form[1]
        if chosen is None:
            for j, (joined, written, flags, status, _key) in enumerate(items):
                if not (first and j == 0):
                    # signs glued only by a bracket ([x][x]) are written apart
                    pieces.append((joined or " ", SEPARATOR))
                pieces.append((written + flags, _bracket(status)))
        else:
            tens_sign, units_sign = _place_signs(items)
            t, u = divmod(int(chosen), 10)
            out = ([f"{t}({tens_sign})"] if t else []) + ([f"{u}({units_sign})"] if u else [])
            for j, text in enumerate(out):
                if not (first and j == 0):
                    pieces.append((" ", SEPARATOR))
                pieces.append((text, bracket if bracket else None))
        if form[-1]:
            pieces.append((form[-1], RAW))
        return
    # math
    digits, flags, joined, factor, suffix = form[1], form[2], form[3], form[4], form[5]
    text = digits
    if chosen is not None:
        value = Fraction(chosen) / factor
        text = exact_text(value)
        if len(text) == 1 and (len(digits) == 2 and digits.startswith("0") or joined in (".", ".:")):
            text = "0" + text       # a place after '.' has two digits (1.03)
    if joined and not first:
        pieces.append((joined, SEPARATOR))
    pieces.append((text + flags, bracket))
    if suffix:
        pieces.append((suffix, RAW))


def _formless_pieces(slot: Slot, chosen, pieces: list, style: str, *, first: bool) -> None:
    bracket = "[" if slot.status in (Status.LOST, Status.RESTORED) else None
    if chosen is None:
        text = "x"
    elif style == "math":
        text = f"{int(chosen):02d}" if not first else str(int(chosen))
    else:
        text = write_places(Fraction(chosen)) if chosen else None   # an empty place is not written
    if text is None:
        return
    if not first:
        pieces.append(("." if style == "math" else " ", SEPARATOR))
    pieces.append((text, bracket))


def _place_signs(items) -> tuple[str, str]:
    tens = next((w for _j, w, _f, _s, key in items if key == "u"), None)
    units = next((w for _j, w, _f, _s, key in items if key in ("disz", "asz")), None)
    tens_sign = tens.partition("(")[2].rstrip(")") if tens else "u"
    unicode = any(is_unicode_spelling(w) for _j, w, *_ in items)
    units_sign = units.partition("(")[2].rstrip(")") if units else ("diš" if unicode else "disz")
    return tens_sign, units_sign


# -- writing a value as the scribe would ----------------------------------------

def style_of(reading: Reading) -> dict:
    """How *reading* is written: ``style`` (count, place, math), Unicode spelling, sign modifier."""
    forms = [s.form[2] if s.form and s.form[0] == "scaled" else s.form for s in reading.slots]
    reading = replace(reading, slots=tuple(replace(s, form=f) for s, f in zip(reading.slots, forms)))
    kinds = {s.form[0] for s in reading.slots if s.form}
    if "math" in kinds:
        style = "math"
    elif "place" in kinds:
        style = "place"
    else:
        style = "count"
    names = [s.form[2] for s in reading.slots if s.form and s.form[0] == "numeral"]
    names += [w.partition("(")[2].rstrip(")") for s in reading.slots if s.form and s.form[0] == "place"
              for _j, w, *_ in s.form[1] if "(" in w]
    mods = {split_modifiers(n)[1] for n in names}
    units = "asz" if any(sign_key(n) == "asz" for n in names) else "disz"
    return {"style": style, "unicode": any(is_unicode_spelling(n) for n in names), "units": units,
            "modifier": mods.pop() if len(mods) == 1 else "", "floating": reading.floating}


def write_like(reading: Reading, value: Fraction) -> str | None:
    """*value* written as the scribe of *reading* writes numbers (None if that style cannot).

    >>> from numcheck.notations.atf import parse
    >>> write_like(parse("2(u) 4(disz)"), Fraction(39))
    '3(u) 9(disz)'
    >>> write_like(parse("1.40"), Fraction(150))
    '2.30'
    """
    how = style_of(reading)
    if how["style"] == "math":
        return write_math(value, floating=how["floating"])
    if how["style"] == "place":
        return write_places(value, unicode=how["unicode"], modifier=how["modifier"], units=how["units"])
    return write_count(value, unicode=how["unicode"], modifier=how["modifier"], units=how["units"])


def _name(key: str, unicode: bool, modifier: str) -> str:
    return (_UNICODE_NAMES.get(key, key) if unicode else key) + modifier


def write_count(value: Fraction, *, unicode: bool = False, modifier: str = "",
                units: str = "disz") -> str | None:
    """A whole count (and one of the fractions 1/2 1/3 2/3 5/6) in the counting signs.

    >>> write_count(Fraction(97))
    '1(gesz2) 3(u) 7(disz)'
    >>> write_count(Fraction(3, 2), unicode=True)
    '1(diš) 1/2(diš)'
    """
    value = Fraction(value)
    if value < 0:
        return None
    whole = value.numerator // value.denominator
    frac = value - whole
    if frac and frac not in _FRACTIONS:
        return None
    out = []
    for key in _DESCENDING:
        weight = int(numeral_signs()[key].value)
        k, whole = divmod(whole, weight)
        if key == "szargal" and k > 9:
            return None
        if k:
            out.append(f"{k}({_name(units if key == 'disz' else key, unicode, modifier)})")
    if frac:
        out.append(f"{exact_text(frac)}({_name(units, unicode, modifier)})")
    return " ".join(out) if out else None


def write_places(value: Fraction, *, unicode: bool = False, modifier: str = "",
                 units: str = "disz") -> str | None:
    """A floating number in disz and u graphemes, place after place (empty places unwritten).

    >>> write_places(Fraction(435))
    '7(disz) 1(u) 5(disz)'
    """
    m = mantissa(Fraction(value))
    if m is None:
        return None
    digits = digits_of(m, 0)[0]
    out = []
    for d in digits:
        t, u = divmod(d, 10)
        if t:
            out.append(f"{t}({_name('u', unicode, modifier)})")
        if u:
            out.append(f"{u}({_name(units, unicode, modifier)})")
    return " ".join(out) if out else None


def write_math(value: Fraction, *, floating: bool = True) -> str | None:
    """Oracc's mathematical style: places joined by '.' (``1.40``); a fixed count as digits.

    >>> write_math(Fraction(100)), write_math(Fraction(5, 2), floating=False)
    ('1.40', '2 1/2')
    """
    value = Fraction(value)
    if value < 0:
        return None
    if floating:
        m = mantissa(value)
        if m is None:
            return None
        return ".".join(str(d) if i == 0 else f"{d:02d}" if d < 10 else str(d)
                        for i, d in enumerate(digits_of(m, 0)[0]))
    whole = value.numerator // value.denominator
    frac = value - whole
    if frac.denominator > 60:
        return None
    text = str(whole) if whole or not frac else ""
    if frac:
        text = (text + " " if text else "") + exact_text(frac)
    return text
