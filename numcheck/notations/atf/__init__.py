"""Numbers as ATF transliterations write them (the format of the Oracc and CDLI projects).

Two styles are read (``../shared/reference/atf-numbers.md`` collects the
conventions):

* CDLI style, a count and a sign name per grapheme: ``1(gesz2) 3(u) 7(disz)``
  = 97, ``2(u@c) 9(aš@c)`` = 29, ``1(u) la2 1(disz)`` = 9, ``1/2(disz)``,
  ``igi-6(disz)-gal2`` = 1/6, ``n(disz)`` (an unknown count, at least 1),
  ``4(ban2) la2 1(asz@t)`` = 39 sila3.  Sign names fix the magnitude, so the
  value is absolute; graphemes of ``disz`` and ``u`` alone that cannot be a
  count (``7(disz) 3(u)``) are read as floating place value, as mathematical
  texts write them;
* Oracc's mathematical style: places joined by dots (``1.40``, ``9.30``,
  ``03``, ``00``, ``oo``), ``1 ME 43`` = 143, ``2 1/2``, ``43.KAM₂``.  Place
  groups float, as the cuneiform notation does.

The marks of ATF map onto the model: ``[ ]`` lost (signs inside restored by
the editor), ``[( )]`` perhaps lost, ``#`` damaged but read and ``?``
uncertain (doubtful), ``!`` corrected (the editor's value; noted), ``*``
collated (no effect), ``< >`` and ``<( )>`` supplied (added), ``<< >>``
excised (superfluous), ``x`` an unread sign, ``n`` an unknown count.
``--notation atf-math`` reads disz/u graphemes as floating place value.
"""

from __future__ import annotations

from ...errors import NumcheckSyntaxError
from ...reading import Reading
from .build import MODES, build
from .writing import format, render, style_of, write_count, write_like, write_math, write_places

__all__ = ["NAME", "parse", "format", "render", "write_like", "write_count", "write_places",
           "write_math", "style_of", "BAD_EXAMPLES", "MODES", "parse_in_line"]

NAME = "atf"

#: Known-bad inputs, the column (1-based) each error points at, and its label.
BAD_EXAMPLES: list[tuple[str, int, str]] = [
    ("3(gesz2) 1(u) 2(gesz2)", 15, "after a sign of a smaller value"),
    ("1(u) 1.40", 6, "a place of the mathematical style among COUNT(SIGN) graphemes"),
    ("12(disz)", 1, "12 signs disz (one order holds 1 to 9"),
    ("6(u)", 1, "6 signs u (one order holds 1 to 5"),
    ("3(lugal)", 1, "a sign numcheck cannot count with"),
    ("7(N14)", 1, "a proto-cuneiform numeral"),
    ("1/4(disz)", 1, "the fraction 1/4 of disz"),
    ("1.61", 1, "a place over 59"),
    ("la2 1(disz)", 1, "'la2' (less) with no number before it"),
    ("1(u) la2", 6, "nothing after 'la2'"),
    ("3(u) %", 6, "a character that is not part of an ATF number"),
    ("[3(u)", 1, "a bracket '[' is opened and never closed"),
    ("3(u)]", 5, "a closing bracket with no opening bracket"),
    ("12 30", 4, "two numbers side by side"),
    ("# 3(u)", 1, "a flag (# ? ! *) with no sign before it"),
]


def parse(text: str, mode: str | None = None) -> Reading:
    """Read *text* as an ATF number (either style; *mode* count, place or math forces one).

    >>> parse("1(gesz2) 3(u) 7(disz)").value
    Fraction(97, 1)
    >>> r = parse("7(disz) 3(u)"); r.value, r.floating
    (Fraction(450, 1), True)
    >>> parse("1 ME 43").value, parse("1.40").value
    (Fraction(143, 1), Fraction(100, 1))
    """
    if not isinstance(text, str) or not text.strip():
        raise NumcheckSyntaxError("There is no number to read: the input is empty", text or "", 0,
                                  expected="an ATF number such as 3(u) 7(disz) or 1.40")
    from ..cuneiform import is_cuneiform_sign, parse_count
    if any(is_cuneiform_sign(c) for c in text):
        return parse_count(text, notation=NAME)
    return build(text, mode=mode)


def parse_in_line(text: str, state: dict, mode: str | None = None) -> Reading:
    """Read a number word of an ATF line, with the brackets open before it (*state*, updated).

    Brackets may open before the word and close after it (``[n(disz) sila3
    kasz n(disz)]``): the state of the line is carried in and out.
    """
    return build(text, mode=mode, state=state, closed=False)
