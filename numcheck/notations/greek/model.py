"""The pieces a Greek numeral is read into, shared by its reader and writer."""

from __future__ import annotations

from dataclasses import dataclass
from fractions import Fraction

from ...errors import NumcheckSyntaxError
from ...reading import Status

__all__ = ["FRACTION_SIGNS", "ZERO_SIGNS", "ZERO", "KERAIA", "UNDERDOT", "Item", "Form", "fail", "RANK_NAMES", "STATUS_ORDER"]

#: Fraction signs and their values (Unicode names: GREEK ONE HALF SIGN,
#: ... ; ``∠`` ANGLE as printed for 1/2 before these code points existed).
FRACTION_SIGNS: dict[str, Fraction] = {
    "\U00010175": Fraction(1, 2), "\U00010176": Fraction(1, 2), "\U00010177": Fraction(2, 3),
    "\U00010178": Fraction(3, 4), "\U0001018B": Fraction(1, 4), "∠": Fraction(1, 2),
}
#: Signs read as zero: GREEK ZERO SIGN and the ō editors type for it.
ZERO_SIGNS = frozenset("\U0001018Aō\u014c")
ZERO = "\U0001018A"
KERAIA = "\u02b9"   # what NFC makes of GREEK NUMERAL SIGN U+0374
UNDERDOT = "\u0323"
#: The ranks of the letters, by power of ten, as an editor names them.
RANK_NAMES = {3: "thousands", 2: "hundreds", 1: "tens", 0: "units"}
#: How bad each status is, for the status of a slot made of several signs.
STATUS_ORDER = {Status.READ: 0, Status.ADDED: 1, Status.DOUBTFUL: 2, Status.RESTORED: 3,
                Status.UNREAD: 4, Status.LOST: 5, Status.SUPERFLUOUS: -1}


@dataclass(frozen=True)
class Item:
    """One written sign of a group, with the marks attached to it."""

    kind: str                     # "letter", "dot", "zero", "fraction", "gap"
    char: str
    value: Fraction | None
    status: Status
    start: int
    end: int
    doubtful: bool = False
    thousands: bool = False
    bar: bool = False
    at: int = -1                  # where the sign itself stands (after a ͵)


@dataclass(frozen=True)
class Form:
    """How a slot was written, so that :func:`format` can write it back."""

    group: int
    gkind: str                    # "whole", "place", "unitfrac", "fraction"
    role: str                     # "letter", "lost", "run", "zero", "fraction", "myriad", "unitfrac"
    pieces: tuple                 # ((text, bracket), ...) as written, canonical letters
    upper: bool = False
    keraia: bool = False
    mult: int = 1                 # 10000 for the letters that count myriads
    count: bool = False           # the slot is in the myriad count (before Μ)
    myriad: bool = False          # the group has a myriad sign after its count
    read: tuple = ()              # unit fractions: (exponent, doubtful) of the letters read
    ascending: bool = False


def fail(text: str, message: str, position: int, expected: str | None = None):
    raise NumcheckSyntaxError(f"Cannot read {text!r} as a Greek numeral: {message}", text, position,
                              expected=expected)


