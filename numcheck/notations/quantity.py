"""Mixed quantities: numbers followed by unit words, as the texts write them.

``3 signs 12;30°`` is 102;30 degrees, ``2 bēru 10 UŠ`` is 70 UŠ, ``1 cubit
4 fingers`` is 28 fingers, ``6585 1/3 days`` and ``6585 ⅓ days`` are 19756/3
days, and a zodiacal sign after a number of degrees makes a longitude
(``12;30 Taurus`` = 42;30°).  Each number is read in its own notation (given,
or detected from its characters), so ``κθ λα days`` works as well as
``29;31 days``.

The result is one Reading: its ``unit`` is the finest unit written (all units
must measure the same thing), every slot of every number is converted to it
exactly (:func:`numcheck.units.convert`), damage included, and the text can be
written back (:func:`format`).  :func:`with_unit` converts a Reading to
another unit, exactly.
"""

from __future__ import annotations

import re
import unicodedata
from dataclasses import dataclass, replace
from fractions import Fraction

from .. import units
from ..errors import NumcheckRangeError, NumcheckSyntaxError
from .grammars import parser_for
from ..reading import Reading, Slot, sexagesimal_text

__all__ = ["NAME", "parse", "format", "render", "has_units", "with_unit", "VULGAR_FRACTIONS",
           "BAD_EXAMPLES"]

NAME = "quantity"

#: Known-bad inputs, the column (1-based) the error points at, and the label.
BAD_EXAMPLES: list[tuple[str, int, str]] = [
    ("3 signs 12", 9, "a number with no unit after it"),
    ("days 3", 1, "a unit with no number before it"),
    ("3 days 4 degrees", 10, "units that measure different things"),
    ("40 Taurus", 1, "is not a position within the sign"),
    ("12 Taurus Gemini", 11, "a second zodiacal sign"),
    ("3 days 1,6a hours", 11, "a number that cannot be read"),
    ("3 signs [...];30°", 9, "lost places of unknown number ([...]) inside a quantity of several parts"),
]

#: Vulgar fraction characters and their exact values (checked against
#: ``unicodedata.numeric`` in tests/test_quantity.py).
VULGAR_FRACTIONS: dict[str, Fraction] = {
    c: Fraction(unicodedata.numeric(c)).limit_denominator(10)
    for c in "\u00bc\u00bd\u00be" + "".join(chr(x) for x in range(0x2150, 0x215F)) + "\u2189"
}

_MARK_UNITS = {"°": "degrees", "′": "arcminutes", "″": "arcseconds"}
_PRIME_RE = re.compile(r"(?<=[0-9\]?xX])([′″])")
_FRACTION_RE = re.compile(r"^(\d+)/(\d+)$")
_DECIMAL_RE = re.compile(r"^\d+$")
_NUMERALS_ONLY = re.compile(r"[-0-9,;]*")


@dataclass(frozen=True)
class _Word:
    text: str
    start: int
    end: int
    kind: str = "word"           # "word", "mark", "vulgar"


@dataclass(frozen=True)
class _Piece:
    """One part of the quantity as written: a number, a unit word or a zodiacal sign."""

    kind: str                    # "number", "unit", "zodiac"
    text: str
    start: int
    end: int
    unit: str | None = None      # canonical unit (for "unit") or sign index as text (for "zodiac")
    reading: Reading | None = None


def _words(text: str) -> list[_Word]:
    tree = parser_for("quantity").parse(text)
    out: list[_Word] = []
    for tok in tree.children:
        kind = {"MARK": "mark", "VULGAR": "vulgar"}.get(tok.type, "word")
        if kind != "word":
            out.append(_Word(str(tok), tok.start_pos, tok.end_pos, kind))
            continue
        # 30′ is thirty minutes of arc, but ′ after a letter is a Greek numeral sign.
        pos = tok.start_pos
        for part in _PRIME_RE.split(str(tok)):
            if not part:
                continue
            out.append(_Word(part, pos, pos + len(part), "mark" if part in _MARK_UNITS else "word"))
            pos += len(part)
    return out


def _unit_name(words: list[_Word], i: int) -> tuple[str, int] | None:
    """The canonical unit starting at word *i*, and how many words it takes."""
    w = words[i]
    if w.kind == "mark":
        return _MARK_UNITS[w.text], 1
    if w.kind != "word":
        return None
    for n in (3, 2, 1):
        if i + n > len(words) or any(x.kind != "word" for x in words[i:i + n]):
            continue
        name = " ".join(x.text for x in words[i:i + n])
        # Single letters (d, h, s) are left to the numerals: d is 500 in Roman.
        if len(name) < 2:
            continue
        found = units.find_unit(name)
        if found is not None:
            return found, n
    return None


def _zodiac(word: _Word) -> int | None:
    if word.kind != "word":
        return None
    return units.find_zodiac(word.text)


def has_units(text: str) -> bool:
    """Whether *text* has a unit word, a degree mark or a zodiacal sign (a quantity)."""
    if _NUMERALS_ONLY.fullmatch(text) or not units.may_name_a_unit(text):
        return False      # no word can be a unit: the grammar is not needed to say so
    from lark.exceptions import UnexpectedInput

    try:
        words = _words(text)
    except UnexpectedInput:
        return False
    return any(_unit_name(words, i) is not None or _zodiac(words[i]) is not None
               for i in range(len(words)))


def _pieces(text: str, words: list[_Word]) -> list[_Piece]:
    pieces: list[_Piece] = []
    i = 0
    while i < len(words):
        w = words[i]
        found = _unit_name(words, i)
        if found is not None:
            name, n = found
            last = words[i + n - 1]
            pieces.append(_Piece("unit", text[w.start:last.end], w.start, last.end, unit=name))
            i += n
            continue
        sign = _zodiac(w)
        if sign is not None:
            pieces.append(_Piece("zodiac", w.text, w.start, w.end, unit=str(sign)))
            i += 1
            continue
        if pieces and pieces[-1].kind == "number":
            prev = pieces[-1]
            pieces[-1] = replace(prev, text=text[prev.start:w.end], end=w.end)
        else:
            pieces.append(_Piece("number", w.text, w.start, w.end))
        i += 1
    return pieces


def parse(text: str, *, notation: str | None = None) -> Reading:
    """Read a mixed quantity; numbers in *notation*, or detected one by one.

    >>> parse("3 signs 12;30°").value, parse("3 signs 12;30°").unit
    (Fraction(205, 2), 'degrees')
    """
    if not text.strip():
        raise NumcheckSyntaxError("There is no quantity to read: the input is empty", text, 0,
                                  expected="a number and a unit, such as 6585 1/3 days")
    from lark.exceptions import UnexpectedInput

    try:
        words = _words(text)
    except UnexpectedInput as err:
        pos = getattr(err, "pos_in_stream", None) or 0
        raise NumcheckSyntaxError(f"Cannot read {text!r} as a quantity", text, pos,
                                  expected="numbers and unit words") from None
    pieces = _pieces(text, words)
    components, zodiac = _components(text, pieces)
    reasons: list[str] = []
    readings = [_read_number(text, p, notation, reasons) for p, _ in components]
    _check_gaps(text, components, readings, zodiac)
    unit_names = [u for _, u in components]
    result_unit = _finest(text, components, pieces)
    slots: list[Slot] = []
    layout = tuple(pieces)
    for k, ((piece, name), reading) in enumerate(zip(components, readings)):
        factor = units.convert(Fraction(1), name, result_unit).value
        slots.extend(_converted_slots(reading, factor, piece.start, layout, k))
    if zodiac is not None:
        slots.append(_zodiac_slot(text, zodiac, components, readings, result_unit, layout))
    warnings = tuple(w for r in readings for w in r.warnings)
    detected = None
    if notation is None:
        detected = f"quantity (units: {', '.join(dict.fromkeys(unit_names))}; " \
                   f"numbers: {'; '.join(dict.fromkeys(reasons))})"
    return Reading(text=text, notation=NAME, slots=tuple(slots), base=60,
                   floating=any(r.floating for r in readings), unit=result_unit,
                   warnings=warnings, detected=detected)


def _components(text: str, pieces: list[_Piece]) -> tuple[list[tuple[_Piece, str]], _Piece | None]:
    """Pair every number with its unit; find the zodiacal sign, if any."""
    components: list[tuple[_Piece, str]] = []
    zodiac: _Piece | None = None
    pending: _Piece | None = None
    for k, p in enumerate(pieces):
        if p.kind == "number":
            if pending is not None:
                raise _syntax(text, p.start, "two numbers with no unit between them",
                              "a unit word after each number")
            pending = p
        elif p.kind == "unit":
            if pending is None:
                raise _syntax(text, p.start, "a unit with no number before it", "a number before the unit")
            components.append((pending, p.unit))
            pending = None
        else:
            if zodiac is not None:
                raise _syntax(text, p.start, "a second zodiacal sign", "one sign per longitude")
            zodiac = p
            if pending is not None:
                components.append((pending, "degrees"))
                pending = None
            elif k == 0 and len(pieces) > 1:
                continue
            elif not components:
                raise _syntax(text, p.start, "a zodiacal sign with no degrees", "degrees before the sign")
    if pending is not None:
        if zodiac is not None and pieces[0] is zodiac:
            components.append((pending, "degrees"))
        else:
            raise _syntax(text, pending.start, "a number with no unit after it",
                          "a unit word (days, degrees, signs, UŠ, bēru, cubits, fingers ...)")
    if not components:
        raise _syntax(text, 0, "no number", "a number and a unit")
    return components, zodiac


def _syntax(text: str, pos: int, what: str, expected: str) -> NumcheckSyntaxError:
    return NumcheckSyntaxError(f"Cannot read {text!r} as a quantity: {what}", text, pos, expected=expected)


def _check_gaps(text: str, components, readings: list[Reading], zodiac: _Piece | None) -> None:
    """Refuse a ``[...]`` whose extra places would shift the other numbers.

    A gap of unknown extent in a whole part moves the places to its left up,
    and one in a fraction moves the places to its right down (see
    :meth:`Reading.expansions`); in a quantity those may belong to another
    number, so only a gap at the outer edge of the quantity is allowed.
    """
    last = len(readings) - 1
    for k, ((piece, _), reading) in enumerate(zip(components, readings)):
        for slot in reading.slots:
            if slot.gap is None:
                continue
            whole = slot.place >= 0
            if zodiac is not None or (whole and k > 0) or (not whole and k < last):
                raise _syntax(text, piece.start + slot.span[0],
                              "lost places of unknown number ([...]) inside a quantity of several parts",
                              "[x] for each lost place, or the quantity split into its parts")


def _finest(text: str, components: list[tuple[_Piece, str]], pieces: list[_Piece]) -> str:
    names = [u for _, u in components]
    first = units.dimension(names[0])
    if any(units.dimension(u) != first for u in names):
        # The first unit word that differs; else the first part whose unit
        # differs (a zodiacal sign is a longitude in degrees, not a unit word).
        bad = next((p for p in pieces if p.kind == "unit" and units.dimension(p.unit) != first),
                   None) or next(p for p, u in components if units.dimension(u) != first)
        listed = ", ".join(f"{u} ({units.dimension(u)})" for u in dict.fromkeys(names))
        raise _syntax(text, bad.start, f"units that measure different things ({listed})",
                      f"units of {first} only: "
                      f"{', '.join(u.name for u in units.UNITS.values() if u.dimension == first)}")
    finest = min(names, key=lambda u: (units.unit(u).factor, names.index(u)))
    # Minutes and seconds of arc written after degrees (12°30′) are the
    # degree's sexagesimal fractions: the quantity stays in degrees.
    if finest in ("arcminutes", "arcseconds") and "degrees" in names:
        return "degrees"
    return finest


def _read_number(text: str, piece: _Piece, notation: str | None, reasons: list[str]) -> Reading:
    """Read one number of the quantity: decimal with fractions, or in a notation."""
    from . import notation_module
    from .detect import detect_notation

    words = piece.text.split()
    fractions: list[tuple[Fraction, str]] = []
    while words and (_FRACTION_RE.match(words[-1]) or words[-1] in VULGAR_FRACTIONS):
        w = words.pop()
        m = _FRACTION_RE.match(w)
        if m and int(m.group(2)) == 0:
            raise _syntax(text, piece.start + piece.text.rfind(w), "a fraction over zero",
                          "a denominator of 1 or more")
        value = Fraction(int(m.group(1)), int(m.group(2))) if m else VULGAR_FRACTIONS[w]
        fractions.insert(0, (value, w))
    main = piece.text[:_main_length(piece.text, len(words))].rstrip()
    slots: list[Slot] = []
    base, floating, warnings, notation_used = 60, False, (), "decimal"
    if main and _DECIMAL_RE.match(main):
        slots.append(Slot(values=(Fraction(int(main)),), text=main, span=(0, len(main)), form=("decimal",)))
        reasons.append("decimal digits")
    elif main:
        name = notation
        if name is None:
            name, why = detect_notation(main)
            reasons.append(f"{name} ({why})")
        try:
            inner = notation_module(name).parse(main)
        except (NumcheckSyntaxError, NumcheckRangeError) as err:
            where = piece.start + (getattr(err, "position", 0) or 0)
            why = getattr(err, "reason", str(err).splitlines()[0])
            raise _syntax(text, where, f"a number that cannot be read ({why})",
                          f"a number in the {name} notation") from None
        slots.extend(inner.slots)
        base, floating, warnings, notation_used = inner.base, inner.floating, inner.warnings, name
    else:
        reasons.append("a fraction")
    for value, written in fractions:
        slots.append(Slot(values=(value,), text=written, span=(0, 0), form=("fraction",)))
    return Reading(text=piece.text, notation=notation_used, slots=tuple(slots), base=base,
                   floating=floating, warnings=warnings)


def _main_length(text: str, n_words: int) -> int:
    """Length of the first *n_words* words of *text*, spaces between them kept."""
    if n_words == 0:
        return 0
    matches = list(re.finditer(r"\S+", text))
    return matches[n_words - 1].end()


def _converted_slots(reading: Reading, factor: Fraction, offset: int, layout: tuple, k: int) -> list[Slot]:
    out = []
    for j, s in enumerate(reading.slots):
        weight = Fraction(1)
        place = s.place
        if reading.base != 60 and s.place != 0:
            weight, place = Fraction(reading.base) ** s.place, 0
        scale = weight * factor
        out.append(replace(
            s, values=tuple(v * scale for v in s.values), place=place,
            editor=None if s.editor is None else s.editor * scale,
            span=(s.span[0] + offset, s.span[1] + offset) if s.span != (0, 0) else s.span,
            form=(layout, k, j, scale, reading)))
    return out


def _zodiac_slot(text, zodiac: _Piece, components, readings, result_unit: str, layout) -> Slot:
    degrees_total = Fraction(0)
    for (piece, name), reading in zip(components, readings):
        degrees_total += units.convert(reading.min, name, "degrees").value
    if degrees_total >= 30:
        first = components[0][0]
        raise NumcheckRangeError(
            f"Cannot read {text!r} as a longitude: {sexagesimal_text(degrees_total)} degrees is not a "
            f"position within the sign {units.ZODIAC[int(zodiac.unit)]}.", value=degrees_total,
            legal="0 to 29;59,... degrees", text=text, position=first.start)
    index = int(zodiac.unit)
    value = units.convert(Fraction(30 * index), "degrees", result_unit).value
    return Slot(values=(value,), text=zodiac.text, span=(zodiac.start, zodiac.end),
                form=(layout, -1, 0, Fraction(1), None))


# -- conversion -----------------------------------------------------------

def with_unit(reading: Reading, unit: str, convention: str | None = None) -> Reading:
    """*reading* in *unit*: converted exactly when it has a unit, else given that unit.

    >>> with_unit(parse("2 bēru 10 UŠ"), "hours").value
    Fraction(14, 3)
    """
    target = units.canonical_unit(unit)
    if reading.unit is None:
        return replace(reading, unit=target)
    converted = units.convert(Fraction(1), reading.unit, target, convention)
    factor = converted.value
    slots = tuple(replace(s, values=tuple(v * factor for v in s.values),
                          editor=None if s.editor is None else s.editor * factor,
                          form=_rescaled_form(s.form, factor)) for s in reading.slots)
    notes = reading.warnings
    if converted.convention:
        notes += (f"converted from {reading.unit} to {target} with the convention {converted.convention}",)
    return replace(reading, slots=slots, unit=target, warnings=notes,
                   unit_factor=reading.unit_factor * factor)


def _rescaled_form(form: tuple, factor: Fraction) -> tuple:
    if len(form) == 5 and isinstance(form[0], tuple):
        layout, k, j, scale, reading = form
        return (layout, k, j, scale * factor, reading)
    return form


# -- writing back ---------------------------------------------------------

def format(reading: Reading, choice: tuple[Fraction, ...] | None = None) -> str:
    """Write a quantity back: each number in its notation, the unit words as written."""
    from . import notation_module

    if not reading.slots or any(len(s.form) != 5 for s in reading.slots):
        # An expanded gap has slots with no form left: write the value plainly.
        value = reading.value if choice is None else reading.value_of(choice)
        return f"{sexagesimal_text(value)} {reading.unit}"
    layout = reading.slots[0].form[0]
    chosen: dict[int, dict[int, Fraction]] = {}
    components: dict[int, Reading] = {}
    for n, s in enumerate(reading.slots):
        _, k, j, scale, comp = s.form
        if k < 0:
            continue
        components[k] = comp
        if choice is not None:
            chosen.setdefault(k, {})[j] = choice[n] / scale
    out: list[str] = []
    k = 0
    for piece in layout:
        if piece.kind == "number":
            comp = components[k]
            comp_choice = None
            if choice is not None:
                comp_choice = tuple(chosen[k][j] for j in range(len(comp.slots)))
            out.append(_write_number(comp, comp_choice, notation_module))
            k += 1
        elif piece.text in _MARK_UNITS and out:
            out[-1] += piece.text
        else:
            out.append(piece.text)
    return " ".join(out)


def _write_number(comp: Reading, choice, notation_module) -> str:
    main = [s for s in comp.slots if s.form[:1] not in (("decimal",), ("fraction",))]
    words = []
    if any(s.form[:1] == ("decimal",) for s in comp.slots):
        s = comp.slots[0]
        words.append(str(int(choice[0])) if choice is not None else s.text)
    elif main:
        sub = replace(comp, slots=tuple(main))
        sub_choice = None if choice is None else tuple(choice[:len(main)])
        words.append(notation_module(comp.notation).format(sub, sub_choice))
    words.extend(s.text for s in comp.slots if s.form[:1] == ("fraction",))
    return " ".join(words)


def render(reading: Reading, choice: tuple[Fraction, ...]) -> str:
    """One reading of a damaged quantity, restorations in brackets."""
    return format(reading, choice)

