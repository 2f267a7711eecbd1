"""Give the pieces of an ATF number their values: a count, a floating place-value number, or Oracc math.

Three readings, chosen by what is written (or forced by *mode*):

* **count** (``mode="count"``): CDLI graphemes whose sign names fix the
  magnitude, summed: ``1(gesz2) 3(u) 7(disz)`` = 97, ``4(ban2) la2 1(asz@t)``
  = 39 sila3, ``1(disz) 1/2(disz)`` = 3/2, ``igi-6(disz)-gal2`` = 1/6.  One
  slot per grapheme (at place 0), holding count × sign value.
* **place** (``mode="place"``): CDLI graphemes of ``disz`` and ``u`` only, as
  mathematical texts write them; places are not marked, so a units sign
  ends a place and a tens sign after a tens sign starts one (``7(disz) 1(u)
  5(disz)`` = 7,15).  The number floats; an empty place is invisible.
* **math** (Oracc ``#atf: use math``): places joined by ``.`` (``1.40``,
  ``03``, ``00``, ``oo``), ``1 ME 43`` = 143, ``2 1/2``.  Place groups float;
  hundreds and fractions are counts.

Without *mode*, CDLI graphemes are a count when they can be one (descending
signs), else place value; a count of ``disz`` and ``u`` alone says that a
mathematical text would read it as floating.
"""

from __future__ import annotations

from dataclasses import dataclass
from fractions import Fraction

from ... import limits
from ...errors import LimitError
from ...reading import Reading, Slot, Status
from .pieces import Atom, atoms, syntax_error
from .quantities import build_quantity, merge_unit_words, unit_positions
from .signs import MAX_COUNT, is_unicode_spelling, numeral_signs, sign_key, split_modifiers

__all__ = ["build", "MODES", "Grapheme", "grapheme"]

MODES = ("count", "place", "math")

_FRACTIONS_OF_ONE = {Fraction(1, 2), Fraction(1, 3), Fraction(2, 3), Fraction(5, 6)}
_AREA_FRACTIONS = {Fraction(1, 4), Fraction(1, 2), Fraction(3, 4)}
_MINUS = {"la2", "lal", "la"}
_HUNDRED = {"me": 100, "lim": 1000}
_WORST = {Status.SUPERFLUOUS: -1, Status.READ: 0, Status.ADDED: 1, Status.DOUBTFUL: 2,
          Status.RESTORED: 3, Status.UNREAD: 4, Status.LOST: 5}


@dataclass(frozen=True)
class Grapheme:
    """A numeral grapheme ``COUNT(SIGN)`` taken apart."""

    count: str          # as written: '3', 'n', 'n+2', '1/2'
    sign: str           # the sign name as written, modifiers included ('u@c')
    key: str            # the table key ('u')
    low: Fraction       # the count, or its lowest value (n: 1)
    high: Fraction      # its highest value
    known: bool         # the count is written (not n)


def grapheme(text: str, atom: Atom, whole: str) -> Grapheme:
    """Split ``3(u@c)`` into count and sign and check both."""
    count, _, rest = atom.text.partition("(")
    inner, _, outer_mods = rest.rpartition(")")
    sign = inner + outer_mods
    key = sign_key(sign)
    info = numeral_signs().get(key)
    if info is None:
        if key[:1] == "n" and key[1:].isdigit():
            raise syntax_error(whole, atom.start, f"a proto-cuneiform numeral ({atom.text}): its "
                               "systems are not sexagesimal and numcheck does not read them",
                               "a sexagesimal or metrological count such as 3(u) or 2(ban2)")
        raise syntax_error(whole, atom.start, f"a sign numcheck cannot count with ({sign!r})",
                           "one of the signs " + ", ".join(numeral_signs()))
    most = MAX_COUNT.get(key, 9)
    if count in ("n", "N"):
        return Grapheme(count, sign, key, Fraction(1), Fraction(most), False)
    if count[:2] in ("n+", "N+"):
        k = int(count[2:])
        if k > most:
            raise syntax_error(whole, atom.start, f"at least {k} signs {sign}, more than {most}",
                               f"n+k with k at most {most}")
        return Grapheme(count, sign, key, Fraction(k), Fraction(most), False)
    if "/" in count:
        num, den = count.split("/")
        if num in ("n", "N") or not int(den):
            raise syntax_error(whole, atom.start, f"a fraction numcheck cannot read ({count})",
                               "1/2, 1/3, 2/3 or 5/6")
        value = Fraction(int(num), int(den))
        allowed = _FRACTIONS_OF_ONE if info.system == "counting" and info.value == 1 else \
            _AREA_FRACTIONS if key == "iku" else set()
        if value not in allowed:
            raise syntax_error(whole, atom.start, f"the fraction {count} of {sign} (numcheck reads "
                               "1/2 1/3 2/3 5/6 of disz or asz and 1/4 1/2 3/4 of iku)",
                               "1/2(disz), 1/3(disz), 2/3(disz), 5/6(disz) or 1/4(iku)")
        return Grapheme(count, sign, key, value, value, True)
    value = int(count)
    if value == 0 or value > most:
        raise syntax_error(whole, atom.start, f"{value} signs {sign} (one order holds 1 to {most}; "
                           "the next larger sign takes over)", f"a count from 1 to {most}")
    return Grapheme(count, sign, key, Fraction(value), Fraction(value), True)


def _status(atom: Atom) -> Status:
    status = atom.status
    if status in (Status.READ, Status.ADDED) and (atom.damaged_flag or atom.doubtful):
        return Status.DOUBTFUL
    return status


def _notes(atom: Atom) -> list[str]:
    out = []
    if "!" in atom.flags:
        out.append(f"{atom.text}: corrected by the editor (!): the value is the editor's reading")
    if atom.damaged_flag:
        out.append(f"{atom.text}: damaged but read (#)")
    if "*" in atom.flags:
        out.append(f"{atom.text}: collated (*)")
    return out


def build(text: str, *, mode: str | None = None, state: dict | None = None, closed: bool = True,
          notation: str = "atf") -> Reading:
    """The Reading of an ATF number (see the module docstring for the modes)."""
    if mode is not None and mode not in MODES:
        raise syntax_error(text, 0, f"an unknown mode {mode!r}", "count, place or math")
    pieces = atoms(text, state, closed=closed)
    if not pieces:
        raise syntax_error(text, 0, "no number", "a number such as 3(u) 7(disz) or 1.40")
    if len(pieces) > limits.MAX_PLACES:
        raise LimitError("number of signs", len(pieces), limits.MAX_PLACES,
                         "Set numcheck.limits.MAX_PLACES higher to read it.")
    if any(a.kind == "word" for a in pieces):
        pieces = merge_unit_words(pieces)
    if unit_positions(pieces):
        return build_quantity(text, pieces, lambda run: _read_run(text, run, mode, notation), notation)
    return _read_run(text, pieces, mode, notation)


def _read_run(text: str, pieces: list[Atom], mode: str | None, notation: str) -> Reading:
    """One number (no unit words): a count, place value or the math style."""
    numerals = [a for a in pieces if a.kind == "numeral"]
    places = [a for a in pieces if a.kind == "places" or a.kind == "fraction" and not numerals]
    if numerals and any(a.kind == "places" for a in pieces):
        odd = next(a for a in pieces if a.kind == "places")
        raise syntax_error(text, odd.start, "a place of the mathematical style among COUNT(SIGN) "
                           "graphemes (one number, one style)", "3(u) 7(disz) or 37, not both")
    if numerals and mode != "math":
        if mode == "place" or mode is None and not _can_count(text, pieces):
            return _place_value(text, pieces, notation)
        return _count(text, pieces, notation)
    if places:
        return _math(text, pieces, notation)
    first = pieces[0]
    raise syntax_error(text, first.start, f"{first.text!r} is no number by itself",
                       "a numeral grapheme such as 5(disz), or a place such as 1.40")


# -- count ------------------------------------------------------------------

def _can_count(text: str, pieces: list[Atom]) -> bool:
    """Whether the graphemes stand in descending order, as a count writes them."""
    weights = []
    for a in pieces:
        if a.kind == "numeral" and grapheme(text, a, text).key not in ("disz", "asz", "u"):
            return True     # a sign that fixes the magnitude: a count whatever the order
        if a.kind == "word" and a.text.lower() in _MINUS:
            break
        if a.kind == "numeral":
            g = grapheme(text, a, text)
            if g.low.denominator != 1:
                continue
            weights.append(numeral_signs()[g.key].value)
    return all(x > y for x, y in zip(weights, weights[1:]))


def _count(text: str, pieces: list[Atom], notation: str) -> Reading:
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
            if word in _MINUS:
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
                sign_key(pieces[i + 1].text) in _MINUS and not slots
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
        status = _status(a)
        warnings += _notes(a)
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
    status = max((_status(igi), _status(num), _status(gal)), key=_WORST.__getitem__)
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


# -- place value (CDLI graphemes) ---------------------------------------------

def _place_value(text: str, pieces: list[Atom], notation: str) -> Reading:
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
        warnings += _notes(a)
        items.append((a.joined, a.text, a.flags, _status(a), g.key if g else a.text.lower()))
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
    status = max((_status(a) for a, _ in group), key=_WORST.__getitem__)
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
    status = _status(a)
    if not g.known:
        return tuple(Fraction(k * weight) for k in range(int(g.low), int(g.high) + 1)), None
    value = Fraction(int(g.low) * weight)
    if status in (Status.RESTORED, Status.LOST):
        return tuple(Fraction(k * weight) for k in range(1, most + 1)), value
    return (value,), None


# -- Oracc mathematical style ---------------------------------------------------

def _math(text: str, pieces: list[Atom], notation: str) -> Reading:
    """Places joined by '.', hundreds with ME, a fraction after a whole number."""
    groups: list[list[Atom]] = []        # one list per place-value number (space separated)
    words: list[Atom] = []
    suffix: list[Atom] = []
    for k, a in enumerate(pieces):
        if k and a.joined == "" and _digit_like(a) and _digit_like(pieces[k - 1]):
            raise syntax_error(text, a.start, "a bracket inside a number (ATF brackets whole "
                               "places: [12] or 1.[40])", "brackets around whole places")
        if a.kind == "places" and (a.joined == "." and groups and groups[-1]):
            groups[-1].append(a)
        elif a.kind in ("places",) or a.kind == "fraction":
            groups.append([a])
        elif a.kind == "word" and sign_key(a.text) in _HUNDRED:
            words.append(a)
            groups.append([a])
        elif a.kind == "word" and a.text in ("n", "N"):
            groups.append([a])
        elif a.kind == "word" and a.text in ("x", "X"):
            if a.joined == "." and groups:
                groups[-1].append(a)
            else:
                groups.append([a])
        elif a.kind == "word" and a.joined in ("-", ".") and groups:
            suffix.append(a)
        elif a.kind == "gap":
            groups.append([a])
        else:
            raise syntax_error(text, a.start, f"a word that is not part of a number ({a.text!r})",
                               "places joined by '.', ME (hundred), a fraction, or a suffix such as -KAM")
    warnings: list[str] = []
    hundreds = [k for k, g in enumerate(groups) if g[0].kind == "word" and sign_key(g[0].text) in _HUNDRED]
    fractions = [k for k, g in enumerate(groups) if g[0].kind == "fraction"]
    if len(groups) > 1 and not hundreds and not fractions:
        second = groups[1][0]
        raise syntax_error(text, second.start, "two numbers side by side (the mathematical style "
                           "joins the places of one number with '.')", "1.40, 1 ME 43 or 2 1/2")
    if hundreds or fractions:
        slots = _math_count(text, groups, warnings)
        floating = False
    else:
        slots = _math_places(text, groups[0], warnings)
        floating = True
    if suffix:
        last = slots[-1]
        tail = "".join(a.joined + a.text + a.flags for a in suffix)
        slots[-1] = Slot(values=last.values, place=last.place, status=last.status, text=last.text,
                         span=(last.span[0], suffix[-1].end), editor=last.editor, gap=last.gap,
                         form=last.form[:-1] + (last.form[-1] + tail,))
    return Reading(text=text, notation=notation if notation != "atf" else "atf", slots=tuple(slots),
                   base=60, floating=floating, warnings=tuple(warnings))


def _digit_like(a: Atom) -> bool:
    return a.kind in ("places", "fraction") or a.kind == "word" and a.text in ("x", "X", "n", "N")


def _math_place_values(text: str, a: Atom, digits: str, status: Status):
    """Values, editor and a label for one place of the math style."""
    core = digits.replace("@v", "")
    if core in ("oo",) or core.startswith("00"):
        return (Fraction(0),), None
    if core in ("x", "X", "n", "N"):
        return tuple(Fraction(v) for v in range(60)), None
    value = int(core)
    if value > 59:
        raise syntax_error(text, a.start, f"a place over 59 ({core})", "places 0 to 59, joined by '.'")
    if status in (Status.RESTORED, Status.LOST):
        return tuple(Fraction(v) for v in range(60)), Fraction(value)
    return (Fraction(value),), None


def _split_places(a: Atom) -> list[tuple[str, int, int]]:
    """The places of a token '1.40' or '10.:6' with their spans ('.:' is no zero: math.xdf)."""
    out = []
    pos = a.start
    for part in a.text.split("."):
        clean = part.lstrip(":")
        offset = len(part) - len(clean)
        out.append((clean, pos + offset, pos + len(part)))
        pos += len(part) + 1
    return out


def _math_places(text: str, group: list[Atom], warnings: list[str]) -> list[Slot]:
    parts = []
    for a in group:
        if a.kind == "gap":
            parts.append((a, "...", a.start, a.end))
            continue
        if a.kind == "word":
            parts.append((a, a.text, a.start, a.end))
            continue
        for digits, s, e in _split_places(a):
            parts.append((a, digits, s, e))
    if len(parts) > limits.MAX_PLACES:
        raise LimitError("number of places", len(parts), limits.MAX_PLACES,
                         "Set numcheck.limits.MAX_PLACES higher to read it.")
    slots = []
    n = len(parts)
    for k, (a, digits, s, e) in enumerate(parts):
        status = _status(a)
        if digits in ("x", "X", "n", "N"):
            status = Status.LOST if a.status is Status.LOST else Status.UNREAD
        warnings += _notes(a) if k == 0 or parts[k - 1][0] is not a else []
        if digits == "...":
            slots.append(Slot(values=tuple(Fraction(v) for v in range(60)), place=n - 1 - k,
                              status=Status.LOST, text="...", span=(s, e), gap=(1, limits.GAP_MAX_PLACES),
                              form=("math", "...", "", a.joined if k == 0 or parts[k - 1][0] is not a else ".", 1, "")))
            continue
        values, editor = _math_place_values(text, a, digits, status)
        joined = a.joined if k == 0 or parts[k - 1][0] is not a else "."
        if joined == "." and text[s - 2:s] == ".:":
            joined = ".:"
        flags = a.flags if k == n - 1 or parts[k + 1][0] is not a else ""
        slots.append(Slot(values=values, place=n - 1 - k, status=status, text=text[s:e] + flags,
                          span=(s, e), editor=editor, form=("math", digits, flags, joined, 1, "")))
    # places left of a gap keep the place they have with the fewest lost places
    return slots


def _math_count(text: str, groups: list[list[Atom]], warnings: list[str]) -> list[Slot]:
    """``1 ME 43`` = 143, ``2 1/2`` = 5/2: a count, its magnitude fixed."""
    slots: list[Slot] = []
    k = 0
    while k < len(groups):
        g = groups[k]
        a = g[0]
        if a.kind == "gap":
            raise syntax_error(text, a.start, "'...' (signs of unknown number lost) in a count with "
                               "ME or a fraction: its value has no bound", "1 ME 43 or 2 1/2")
        if a.kind == "fraction":
            num, den = a.text.split("/")
            if not int(den) or int(num) >= int(den):
                raise syntax_error(text, a.start, f"a fraction numcheck cannot read ({a.text})",
                                   "a proper fraction such as 1/2 or 2/3")
            value = Fraction(int(num), int(den))
            slots.append(Slot(values=(value,), place=0, status=_status(a), text=a.text + a.flags,
                              span=(a.start, a.end), form=("math", a.text, a.flags, a.joined, 1, "")))
            k += 1
            continue
        if a.kind == "word" and sign_key(a.text) in _HUNDRED:
            if not slots or slots[-1].form[0] != "math" or len(slots[-1].values) > 1 and slots[-1].editor is None \
                    and slots[-1].status is not Status.UNREAD:
                raise syntax_error(text, a.start, f"{a.text} with no count before it", "1 ME 43 (143)")
            factor = _HUNDRED[sign_key(a.text)]
            prev = slots[-1]
            slots[-1] = Slot(values=tuple(v * factor for v in prev.values), place=0, status=prev.status,
                             text=prev.text, span=prev.span,
                             editor=None if prev.editor is None else prev.editor * factor,
                             form=prev.form[:4] + (factor, prev.form[5] + " " + a.text + a.flags))
            k += 1
            continue
        if len(g) > 1 or "." in a.text:
            raise syntax_error(text, a.start, "a place-value number among the parts of a count "
                               "(1 ME 43, 2 1/2)", "one whole number and its ME, or a fraction after it")
        if a.kind == "word":       # n: an unknown number
            values = tuple(Fraction(v) for v in range(1, 100))
            status = Status.LOST if a.status is Status.LOST else Status.UNREAD
            slots.append(Slot(values=values, place=0, status=status, text=a.text, span=(a.start, a.end),
                              form=("math", a.text, a.flags, a.joined, 1, "")))
            k += 1
            continue
        status = _status(a)
        digits = a.text.replace("@v", "")
        if digits == "oo" or digits.startswith("00"):
            value = 0
        else:
            value = int(digits)
        if value > 99:
            raise syntax_error(text, a.start, f"{value} in a count with ME (at most 99 beside the hundreds)",
                               "1 ME 43")
        if status in (Status.RESTORED, Status.LOST):
            values, editor = tuple(Fraction(v) for v in range(100)), Fraction(value)
        else:
            values, editor = (Fraction(value),), None
        warnings += _notes(a)
        slots.append(Slot(values=values, place=0, status=status, text=a.text + a.flags, span=(a.start, a.end),
                          editor=editor, form=("math", a.text, a.flags, a.joined, 1, "")))
        k += 1
    return slots


def uses_unicode(reading: Reading) -> bool:
    """Whether the sign names of *reading* are spelled the Unicode way (geš₂, aš)."""
    return any(is_unicode_spelling(s.form[2]) for s in reading.slots
               if s.form and s.form[0] in ("numeral", "igi", "x"))


__all__.append("uses_unicode")

