"""Cut an ATF number into its pieces, each with the brackets and flags that mark it.

The grammar (``grammars/atf.lark``) gives the tokens; this module follows the
editorial brackets over them (they may open before the number and close
after it: a line reader passes the state at the number's first character)
and turns each token into an :class:`Atom`: a numeral grapheme, a place
group of the mathematical style, a fraction, or a word (``la2``, ``igi``,
``ME``, a suffix, ``x``, ``n``).  Values are given in :mod:`.build`.
"""

from __future__ import annotations

from dataclasses import dataclass, field

from lark.exceptions import UnexpectedCharacters, UnexpectedInput

from ...errors import NumcheckSyntaxError
from ...reading import Status
from ..grammars import parser_for

__all__ = ["Atom", "atoms", "BRACKETS", "syntax_error", "mark_status"]

#: Token type -> (bracket name, opens).  ATF's brackets (ATF quick reference,
#: GDL tutorial): [ ] broken, [( )] perhaps broken, < > supplied, <( )> implied,
#: << >> excised, half brackets (legacy) damaged.
BRACKETS = {
    "LOST_OPEN": ("lost", True), "LOST_CLOSE": ("lost", False),
    "PERHAPS_OPEN": ("perhaps", True), "PERHAPS_CLOSE": ("perhaps", False),
    "ADD_OPEN": ("added", True), "ADD_CLOSE": ("added", False),
    "IMPLIED_OPEN": ("implied", True), "IMPLIED_CLOSE": ("implied", False),
    "EXCISE_OPEN": ("excised", True), "EXCISE_CLOSE": ("excised", False),
    "HALF_OPEN": ("half", True), "HALF_CLOSE": ("half", False),
}

#: The bracket each status is written back in.
OPENERS = {Status.LOST: "[", Status.RESTORED: "[", Status.ADDED: "<", Status.SUPERFLUOUS: "<<"}


@dataclass
class Atom:
    """One piece of a number as written."""

    kind: str               # numeral, places, fraction, word, gap
    text: str               # as written (without brackets, without flags)
    start: int
    end: int
    status: Status = Status.READ
    flags: str = ""         # '#', '?', '!', '*' as written after the piece
    joined: str = " "       # what stands before it: ' ', '-', '.', '' (start)
    notes: list[str] = field(default_factory=list)

    @property
    def damaged_flag(self) -> bool:
        return "#" in self.flags

    @property
    def doubtful(self) -> bool:
        return "?" in self.flags


def syntax_error(text: str, pos: int, what: str, expected: str) -> NumcheckSyntaxError:
    return NumcheckSyntaxError(f"Cannot read {text!r} as an ATF number: {what}", text, pos,
                               expected=expected)


_EXPECTED = ("numeral graphemes COUNT(SIGN) such as 3(u) 7(disz), places joined by '.' such as "
             "1.40, fractions 1/2, the words la2, igi ... gal2, ME, x, n, or the marks [ ] < > # ? ! *")


def mark_status(state: dict, unread: bool) -> Status:
    """The status of a piece given the brackets open around it (see BRACKETS)."""
    if state.get("excised") is not None:
        return Status.SUPERFLUOUS
    if state.get("lost") is not None or state.get("perhaps") is not None:
        return Status.LOST if unread else Status.RESTORED
    if state.get("added") is not None or state.get("implied") is not None:
        return Status.ADDED
    if unread:
        return Status.UNREAD
    return Status.DOUBTFUL if state.get("half") is not None else Status.READ


def atoms(text: str, state: dict | None = None, *, closed: bool = True) -> list[Atom]:
    """The pieces of *text*, with statuses from the brackets and flags.

    *state* is the bracket state before the text (bracket name -> position or
    None); it is updated in place.  With *closed* a bracket left open at the
    end is an error (a number read alone); a line reader passes False.
    """
    if state is None:
        state = {}
    try:
        tree = parser_for("atf").parse(text)
    except UnexpectedInput as err:
        pos = getattr(err, "pos_in_stream", None)
        pos = len(text) if pos is None else pos
        what = ("a character that is not part of an ATF number" if isinstance(err, UnexpectedCharacters)
                else "the number ends too early")
        raise syntax_error(text, pos, what, _EXPECTED) from None
    out: list[Atom] = []
    for w, word in enumerate(tree.children):
        joined = "" if w == 0 else " "
        for tok in word.children:
            kind = tok.type
            if kind in BRACKETS:
                name, opening = BRACKETS[kind]
                if opening and state.get(name) is not None:
                    raise syntax_error(text, tok.start_pos, "a bracket opened inside the same kind of "
                                       "bracket", f"the bracket opened at column {state[name] + 1} "
                                       "to be closed first")
                if not opening and state.get(name) is None and closed:
                    raise syntax_error(text, tok.start_pos, "a closing bracket with no opening bracket",
                                       "an opening bracket before it")
                state[name] = tok.start_pos if opening else None
                continue
            if kind == "FLAGS":
                if not out or out[-1].end != tok.start_pos and not _only_brackets_between(text, out[-1].end, tok.start_pos):
                    raise syntax_error(text, tok.start_pos, "a flag (# ? ! *) with no sign before it",
                                       "a sign before the flag, as in 5(disz)#")
                out[-1].flags += str(tok)
                continue
            if kind == "JOIN":
                joined = str(tok)
                continue
            value = str(tok)
            atom_kind = {"NUMERAL": "numeral", "PLACES": "places", "FRACTION": "fraction",
                         "GAP": "gap", "NAME": "word"}[kind]
            unread = atom_kind == "word" and value in ("x", "X", "n", "N") or atom_kind == "gap"
            if atom_kind == "numeral" and value[:1] in "nN" and "(" in value and "/" not in value.split("(")[0]:
                unread = True   # n(disz): an unknown count of a sign that is there
            out.append(Atom(atom_kind, value, tok.start_pos, tok.end_pos, mark_status(state, unread),
                            joined=joined))
            joined = ""
        if joined in ("-", ".", "+"):
            raise syntax_error(text, len(text.rstrip()), f"a '{joined}' with nothing after it",
                               "a sign or a word after the joiner")
    if closed:
        for name, opened in state.items():
            if opened is not None:
                raise syntax_error(text, opened, f"a bracket '{text[opened]}' is opened and never closed",
                                   f"a closing bracket for the {name} part")
    return out


def _only_brackets_between(text: str, a: int, b: int) -> bool:
    return all(c in "[]<>()⸢⸣" for c in text[a:b])
