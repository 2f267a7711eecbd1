"""Oracc's mathematical style: places joined by '.' (``1.40``, ``03``, ``00``, ``oo``), ``1 ME 43``, ``2 1/2``.

Place groups float; hundreds and fractions are counts (their magnitude is fixed).
``.:`` clarifies an empty tens column and is no zero (math.xdf).
"""

from __future__ import annotations

from fractions import Fraction

from ... import limits
from ...errors import LimitError
from ...reading import Reading, Slot, Status
from .graphemes import HUNDRED, notes_of, status_of
from .pieces import Atom, syntax_error
from .signs import sign_key

__all__ = ["read_dotted"]

def read_dotted(text: str, pieces: list[Atom], notation: str) -> Reading:
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
        elif a.kind == "word" and sign_key(a.text) in HUNDRED:
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
    hundreds = [k for k, g in enumerate(groups) if g[0].kind == "word" and sign_key(g[0].text) in HUNDRED]
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
        status = status_of(a)
        if digits in ("x", "X", "n", "N"):
            status = Status.LOST if a.status is Status.LOST else Status.UNREAD
        warnings += notes_of(a) if k == 0 or parts[k - 1][0] is not a else []
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
            slots.append(Slot(values=(value,), place=0, status=status_of(a), text=a.text + a.flags,
                              span=(a.start, a.end), form=("math", a.text, a.flags, a.joined, 1, "")))
            k += 1
            continue
        if a.kind == "word" and sign_key(a.text) in HUNDRED:
            if not slots or slots[-1].form[0] != "math" or len(slots[-1].values) > 1 and slots[-1].editor is None \
                    and slots[-1].status is not Status.UNREAD:
                raise syntax_error(text, a.start, f"{a.text} with no count before it", "1 ME 43 (143)")
            factor = HUNDRED[sign_key(a.text)]
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
        status = status_of(a)
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
        warnings += notes_of(a)
        slots.append(Slot(values=values, place=0, status=status, text=a.text + a.flags, span=(a.start, a.end),
                          editor=editor, form=("math", a.text, a.flags, a.joined, 1, "")))
        k += 1
    return slots


