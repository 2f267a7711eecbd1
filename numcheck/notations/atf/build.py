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

from ... import limits
from ...errors import LimitError
from ...reading import Reading
from .count import can_count, read_count
from .dotted import read_dotted
from .graphemes import Grapheme, grapheme
from .pieces import Atom, atoms, syntax_error
from .places import read_places
from .quantities import build_quantity, merge_unit_words, unit_positions

__all__ = ["build", "MODES", "Grapheme", "grapheme"]

MODES = ("count", "place", "math")


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
        if mode == "place" or mode is None and not can_count(text, pieces):
            return read_places(text, pieces, notation)
        return read_count(text, pieces, notation)
    if places:
        return read_dotted(text, pieces, notation)
    first = pieces[0]
    raise syntax_error(text, first.start, f"{first.text!r} is no number by itself",
                       "a numeral grapheme such as 5(disz), or a place such as 1.40")

