"""A numeral grapheme ``COUNT(SIGN)`` taken apart and checked, and the status its marks give.

Shared by the three readings of :mod:`.build` (count, place value, math style).
"""

from __future__ import annotations

from dataclasses import dataclass
from fractions import Fraction

from ...reading import Status
from .pieces import Atom, syntax_error
from .signs import MAX_COUNT, numeral_signs, sign_key

__all__ = ["Grapheme", "grapheme", "status_of", "notes_of", "MINUS", "HUNDRED", "WORST"]

_FRACTIONS_OF_ONE = {Fraction(1, 2), Fraction(1, 3), Fraction(2, 3), Fraction(5, 6)}
_AREA_FRACTIONS = {Fraction(1, 4), Fraction(1, 2), Fraction(3, 4)}
MINUS = {"la2", "lal", "la"}
HUNDRED = {"me": 100, "lim": 1000}
WORST = {Status.SUPERFLUOUS: -1, Status.READ: 0, Status.ADDED: 1, Status.DOUBTFUL: 2,
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


def status_of(atom: Atom) -> Status:
    status = atom.status
    if status in (Status.READ, Status.ADDED) and (atom.damaged_flag or atom.doubtful):
        return Status.DOUBTFUL
    return status


def notes_of(atom: Atom) -> list[str]:
    out = []
    if "!" in atom.flags:
        out.append(f"{atom.text}: corrected by the editor (!): the value is the editor's reading")
    if atom.damaged_flag:
        out.append(f"{atom.text}: damaged but read (#)")
    if "*" in atom.flags:
        out.append(f"{atom.text}: collated (*)")
    return out


