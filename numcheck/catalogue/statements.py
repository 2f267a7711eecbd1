"""Read the ``statement`` column of the catalogue into exact sides and terms.

A catalogue statement says what a row asserts in one line a historian can
read, and it is also the machine-readable form: ``223 synodic months = 6585
1/3 days = 239 anomalistic months``.  Each side is a sum of terms, each term
a number and a unit.  Keeping one form for both means a relation cannot say
one thing in prose and another in its numbers.

Grammar (the first side is the reference)::

    statement := side (" = " side)+
    side      := term ((" + " | " - ") term)*
    term      := number unit
    number    := 12 | 7.5 | 1/24 | 6585 1/3 | 29;31,50,8,20 | 6,5;14,48
"""

from __future__ import annotations

import re
from dataclasses import dataclass
from fractions import Fraction

from ..errors import NumcheckSyntaxError

__all__ = ["Term", "Side", "parse_statement", "parse_number", "side_unit_key"]

_NUMBER = re.compile(
    r"""(?P<sexa>\d+(?:,\d+)*;\d+(?:,\d+)*)          # 29;31,50,8,20
      | (?P<mixed>\d+)\s+(?P<mn>\d+)/(?P<md>\d+)    # 6585 1/3
      | (?P<ratio>\d+)/(?P<rd>\d+)                  # 1/24
      | (?P<dec>\d+\.\d+)                           # 7.5
      | (?P<int>\d+(?:,\d+)*)                       # 12 or 6,31 (places)
    """,
    re.VERBOSE,
)


@dataclass(frozen=True)
class Term:
    """One number with its unit, as the statement writes them."""

    number: Fraction
    unit: str        # as written, plural, e.g. "anomalistic months", "degrees of sidereal month"
    text: str
    sign: int = 1


@dataclass(frozen=True)
class Side:
    """One side of a statement: terms added or subtracted."""

    terms: tuple[Term, ...]
    text: str

    @property
    def single(self) -> Term | None:
        return self.terms[0] if len(self.terms) == 1 else None


def parse_number(text: str) -> Fraction:
    """An exact number in the statement grammar.

    >>> parse_number("6585 1/3"), parse_number("1,49,45;20"), parse_number("7.5")
    (Fraction(19756, 3), Fraction(19756, 3), Fraction(15, 2))
    """
    m = _NUMBER.fullmatch(text.strip())
    if not m:
        raise NumcheckSyntaxError("Not a catalogue number", text, 0,
                                  expected="e.g. 12, 7.5, 1/24, 6585 1/3 or 29;31,50,8,20")
    try:
        return _value(m)
    except ZeroDivisionError:
        raise NumcheckSyntaxError("A fraction with a zero denominator", text, text.find("/") + 1,
                                  expected="a denominator of 1 or more") from None


def _places(text: str) -> Fraction:
    value = Fraction(0)
    for digit in text.split(","):
        value = value * 60 + int(digit)
    return value


def _value(m: re.Match) -> Fraction:
    if m["sexa"]:
        whole, frac = m["sexa"].split(";")
        value = _places(whole)
        weight = Fraction(1)
        for digit in frac.split(","):
            weight /= 60
            value += int(digit) * weight
        return value
    if m["mixed"]:
        return int(m["mixed"]) + Fraction(int(m["mn"]), int(m["md"]))
    if m["ratio"]:
        return Fraction(int(m["ratio"]), int(m["rd"]))
    if m["dec"]:
        return Fraction(m["dec"])
    return _places(m["int"])


def _parse_term(text: str, statement: str, offset: int, sign: int) -> Term:
    m = _NUMBER.match(text)
    if not m or m.end() == len(text) or not text[m.end()].isspace():
        raise NumcheckSyntaxError("A statement term must be a number followed by a unit",
                                  statement, offset, expected="e.g. '223 synodic months'")
    unit = text[m.end():].strip()
    return Term(_value(m), unit, text, sign)


def parse_statement(statement: str) -> tuple[Side, ...]:
    """Split a statement into its sides and their terms.

    >>> sides = parse_statement("223 synodic months = 6585 1/3 days")
    >>> [(t.number, t.unit) for s in sides for t in s.terms]
    [(Fraction(223, 1), 'synodic months'), (Fraction(19756, 3), 'days')]
    """
    sides = []
    pos = 0
    for side_text in statement.split(" = "):
        terms = []
        # Split on " + " and " - " keeping the operator (a "-" inside a
        # number never has spaces around it).
        pieces = re.split(r" ([+-]) ", side_text)
        sign = 1
        inner = pos
        for i, piece in enumerate(pieces):
            if i % 2:
                sign = 1 if piece == "+" else -1
                inner += 3
                continue
            terms.append(_parse_term(piece.strip(), statement, inner, sign))
            inner += len(piece)
        sides.append(Side(tuple(terms), side_text.strip()))
        pos += len(side_text) + 3
    if len(sides) < 2:
        raise NumcheckSyntaxError("A statement needs at least two sides joined by ' = '",
                                  statement, len(statement), expected="'<number> <unit> = <number> <unit>'")
    return tuple(sides)


# Statement units that are units of numcheck.units (for conversion); the
# others (anomalistic months, degrees of a cycle ...) are counts of their own.
_UNIT_KEYS = {
    "days": "days", "hours": "hours", "minutes": "minutes", "seconds": "seconds",
    "ush": "UŠ", "beru": "bēru", "ninda": "NINDA", "synodic months": "months",
    "tithis": "tithis", "degrees": "degrees", "fingers": "fingers", "cubits": "cubits",
    "tropical years": "years", "sidereal years": "years", "julian years": "years",
    "egyptian years": "years",
}


def side_unit_key(unit: str) -> str | None:
    """The :mod:`numcheck.units` name for a statement unit, or ``None``.

    >>> side_unit_key("synodic months"), side_unit_key("anomalistic months")
    ('months', None)
    """
    key = unit.strip().lower()
    if key in _UNIT_KEYS:
        return _UNIT_KEYS[key]
    if not key.endswith("s") and key + "s" in _UNIT_KEYS:
        return _UNIT_KEYS[key + "s"]
    return None
