"""Abjad numerals: Arabic letters with numeric values, eastern or western order.

The larger value is written first (``شسه`` = 300 + 60 + 5 = 365, ``نط`` =
59; Hogendijk & de Graaf, abjad handout §1–2), each of thousands, hundreds,
tens and units at most once.  In a table each place is one group of letters;
groups are separated by spaces: the first group is the whole part, the later
ones sexagesimal fractions of 0 to 59 (``شنط نط`` = 359;59).

Letter values come from ``numcheck/data/abjad_letters.csv``: the eastern
(mashriqi) order by default, the western (maghribi) values with
``notation="abjad-maghribi"``.  Persian and Urdu letter forms (ی ک ة ...) are
read as their Arabic letters; a dotless skeleton (ٮ) is read as a doubtful
letter that may be any letter of its group.

Damage: ``[.]`` a lost letter (``[..]`` two), ``[...]`` an unknown number,
``[ك]`` restored, ``x`` unread, ``< >`` added, ``{ }`` superfluous; a
doubtful letter takes ``?`` after it or half brackets ``⸢ ⸣`` around it
(underdots cannot be used in Arabic script, conventions.md §1.2).
"""

from __future__ import annotations

import csv
import functools
import itertools
import unicodedata
from dataclasses import dataclass, replace
from fractions import Fraction
from importlib import resources

from lark import Token
from lark.exceptions import UnexpectedCharacters, UnexpectedInput

from ..errors import LimitError, NumcheckRangeError, NumcheckSyntaxError
from .grammars import parser_for
from .. import limits
from ..reading import Reading, Slot, Status
from .marks import join_marked, status_in, track_bracket

__all__ = ["NAME", "MAGHRIBI", "parse", "format", "render", "letter_values", "BAD_EXAMPLES"]

NAME = "abjad"
MAGHRIBI = "abjad-maghribi"

#: Known-bad inputs, the column (1-based) the error must point at, and the label.
BAD_EXAMPLES: list[tuple[str, int, str]] = [
    ("طن", 2, "letters in an impossible order (the larger value is written first)"),
    ("نم", 2, "two letters of the same order (tens) in one group"),
    ("پ", 1, "a letter with no abjad value"),
    ("نa", 2, "a character that is not part of an abjad number"),
    ("ن 5", 3, "a character that is not part of an abjad number"),
    ("ا سا", 3, "a fractional place over 59"),
    ("?ن", 1, "a doubt mark with no letter before it"),
    ("[ن", 1, "a bracket opened and never closed"),
]

_ORDER_NAMES = {0: "units", 1: "tens", 2: "hundreds", 3: "thousands"}
_KIND_RANK = {Status.SUPERFLUOUS: -1, Status.READ: 0, Status.ADDED: 1, Status.DOUBTFUL: 2,
              Status.RESTORED: 3, Status.UNREAD: 4, Status.LOST: 5}
_OPEN = (Status.LOST, Status.RESTORED, Status.UNREAD)


@dataclass(frozen=True)
class LetterInfo:
    """One row of ``abjad_letters.csv``: the values a letter may stand for."""

    letter: str
    name: str
    kind: str                      # "letter", "variant", "dotless"
    eastern: tuple[int, ...]
    maghribi: tuple[int, ...]
    source: str


@functools.cache
def _table() -> dict[str, LetterInfo]:
    path = resources.files("numcheck") / "data" / "abjad_letters.csv"
    with path.open(encoding="utf-8", newline="") as fh:
        return {row["letter"]: LetterInfo(
            row["letter"], row["unicode_name"], row["kind"],
            tuple(int(v) for v in row["eastern"].split("|")),
            tuple(int(v) for v in row["maghribi"].split("|")), row["source"])
            for row in csv.DictReader(fh)}


def letter_values(notation: str = NAME) -> dict[str, tuple[int, ...]]:
    """Letter -> the values it may stand for, in the eastern or western order."""
    west = notation == MAGHRIBI
    return {k: (v.maghribi if west else v.eastern) for k, v in _table().items()}


@functools.cache
def _spelling(notation: str) -> dict[int, str]:
    """Value -> the letter written for it (main letters only)."""
    west = notation == MAGHRIBI
    return {(v.maghribi if west else v.eastern)[0]: k for k, v in _table().items() if v.kind == "letter"}


def _order(value: int) -> int:
    """0 for units, 1 tens, 2 hundreds, 3 thousands."""
    return len(str(value)) - 1


@dataclass(frozen=True)
class _Mark:
    """One letter position of a group as written."""

    text: str
    options: tuple[int, ...]       # the values it may have (all letters when lost)
    kind: str                      # "letter", "lost", "unread", "gap", "zero"
    status: Status
    doubtful: bool
    half: bool                     # doubt written with half brackets
    start: int
    end: int
    written: int = 0               # the value of the letter as written (restored letters too)


def _error(text: str, pos: int, what: str, expected: str) -> NumcheckSyntaxError:
    return NumcheckSyntaxError(f"Cannot read {text!r} as an abjad number: {what}", text, pos,
                               expected=expected)


_EXPECTED = "abjad letters (larger value first), a space between places, or a damage mark " \
            "([.] [...] x [ ] < > { } ? ⸢ ⸣)"


def parse(text: str, *, notation: str = NAME) -> Reading:
    """Read *text* as an abjad number (``notation`` = ``abjad`` or ``abjad-maghribi``).

    >>> parse("شسه").value
    Fraction(365, 1)
    >>> parse("شنط نط").value
    Fraction(21599, 60)
    """
    if not text.strip():
        raise _error(text, 0, "the input is empty", "an abjad number such as شسه")
    try:
        tree = parser_for("abjad").parse(text)
    except UnexpectedInput as err:
        pos = getattr(err, "pos_in_stream", None)
        pos = len(text) if pos is None else pos
        what = ("a character that is not part of an abjad number" if isinstance(err, UnexpectedCharacters)
                else "a mark in the wrong place")
        raise _error(text, min(pos, len(text)), what, _EXPECTED) from None
    groups = [list(g.children) for g in tree.children]
    if len(groups) > limits.MAX_PLACES:
        raise LimitError("number of places", len(groups), limits.MAX_PLACES,
                         "Set numcheck.limits.MAX_PLACES higher to read it.")
    values = letter_values(notation)
    all_values = tuple(sorted({v for vs in values.values() for v in vs}))
    state: dict[str, int | None] = {"lost": None, "added": None, "superfluous": None, "half": None}
    slots: list[Slot] = []
    k = 0          # places counted so far: a superfluous group takes none
    for tokens in groups:
        marks = _marks(text, tokens, state, values, all_values)
        if not marks:
            raise _error(text, tokens[0].start_pos, "a place with no letter",
                         "a letter, x or [.] in every place")
        span = (tokens[0].start_pos, tokens[-1].end_pos)
        slots.append(_group_slot(text, marks, place=-k, fractional=k > 0, span=span))
        if slots[-1].status is not Status.SUPERFLUOUS:
            k += 1
    for name, opened in state.items():
        if opened is not None:
            raise _error(text, opened, "a bracket opened and never closed",
                         f"a closing bracket for the {name} part")
    return Reading(text=text, notation=notation, slots=tuple(slots), base=60)


def _marks(text: str, tokens: list[Token], state: dict, values: dict, all_values: tuple) -> list[_Mark]:
    marks: list[_Mark] = []
    for tok in tokens:
        t, start, end = tok.type, tok.start_pos, tok.end_pos
        if track_bracket(t, start, state, lambda pos, what, exp: _error(text, pos, what, exp)):
            continue
        if t == "DOUBT":
            if not marks or marks[-1].kind != "letter":
                raise _error(text, start, "a doubt mark with no letter before it", "a letter before '?'")
            marks[-1] = replace(marks[-1], doubtful=True, end=end)
        elif t == "LETTER":
            ch = str(tok)
            if ch not in values:
                raise _error(text, start, f"a letter with no abjad value ({unicodedata.name(ch, '?')})",
                             "one of the 28 abjad letters or a Persian/Urdu form of one")
            info = _table()[ch]
            status = status_in(state, False)
            doubtful = state["half"] is not None or info.kind == "dotless"
            # A restored letter is the editor's: the traces allow any letter there.
            options = all_values if status is Status.RESTORED else values[ch]
            marks.append(_Mark(ch, options, "letter", status, doubtful, state["half"] is not None,
                               start, end, written=values[ch][0]))
        elif t == "ZERO":
            marks.append(_Mark(str(tok), (0,), "zero", status_in(state, False), False, False, start, end))
        elif t == "UNREAD":
            marks.append(_Mark("x", all_values, "unread", status_in(state, True), False, False, start, end))
        elif t == "LOST_LETTERS":
            if state["lost"] is not None:
                raise _error(text, start, "lost-letter dots inside brackets", "'[.]' standing alone")
            for _ in range(len(tok) - 2):
                marks.append(_Mark(".", all_values, "lost", Status.LOST, False, False, start, end))
        elif t == "GAP":
            if state["lost"] is not None:
                raise _error(text, start, "'[...]' inside brackets", "'[...]' standing alone")
            marks.append(_Mark(str(tok), all_values, "gap", Status.LOST, False, False, start, end))
    return marks


def _group_slot(text: str, marks: list[_Mark], place: int, fractional: bool,
                span: tuple[int, int]) -> Slot:
    start, end = span
    written = text[start:end]
    counted = [m for m in marks if m.status is not Status.SUPERFLUOUS]
    if not counted:
        return Slot(values=(Fraction(sum(m.options[0] for m in marks)),), place=place,
                    status=Status.SUPERFLUOUS, text=written, span=(start, end), form=tuple(marks))
    if fractional and len(counted) == 1 and counted[0].kind == "gap":
        return Slot(values=tuple(Fraction(v) for v in range(60)), place=place, status=Status.LOST,
                    text=written, span=(start, end), gap=(1, limits.GAP_MAX_PLACES), form=())
    zeros = [m for m in counted if m.kind == "zero"]
    if zeros and len(counted) > 1:
        raise _error(text, zeros[0].start, "the zero sign shares its place with letters",
                     "the zero sign alone in its place")
    _check_order(text, [m for m in counted if m.kind == "letter" and m.status not in _OPEN])
    _check_order(text, [m for m in counted if m.kind == "letter"], as_written=True)
    totals = _totals(text, counted, fractional)
    editor = None
    opened = [m for m in counted if m.status in _OPEN]
    if opened and all(m.kind == "letter" for m in opened):
        editor = Fraction(sum(m.written for m in counted))
        if fractional and editor > 59:
            raise NumcheckRangeError(
                f"The editor's restoration {written!r} is {editor}, but a sexagesimal place holds "
                "0 to 59.", value=editor, legal="0 to 59", text=text, position=start)
    kinds = [m.status for m in counted] + [Status.DOUBTFUL for m in counted if m.doubtful]
    status = max(kinds, key=_KIND_RANK.__getitem__)
    return Slot(values=totals, place=place, status=status, text=written, span=(start, end),
                editor=editor, form=tuple(marks))


def _check_order(text: str, known: list[_Mark], as_written: bool = False) -> None:
    """Letters must fall in order; *as_written* checks the editor's restorations too."""
    known = [m for m in known if len(m.options) == 1 or as_written and m.status is Status.RESTORED]
    for a, b in zip(known, known[1:]):
        oa, ob = _order(a.written), _order(b.written)
        if ob == oa:
            raise _error(text, b.start, f"two letters of the same order ({_ORDER_NAMES[ob]}) in one group",
                         "at most one letter each for thousands, hundreds, tens and units")
        if ob > oa:
            raise _error(text, b.start, "letters in an impossible order (the larger value is written first)",
                         "thousands, hundreds, tens, units, in that order")


def _totals(text: str, counted: list[_Mark], fractional: bool) -> tuple[Fraction, ...]:
    """Every total the group's letters allow (larger first, one letter per order)."""
    widths = [range(1, limits.GAP_MAX_PLACES + 1) if m.kind == "gap" else (1,) for m in counted]
    open_most = sum(max(w) for m, w in zip(counted, widths) if len(m.options) > 1)
    if open_most > limits.MAX_LOST_LETTERS:
        raise LimitError("number of lost letters to try", open_most, limits.MAX_LOST_LETTERS,
                         "Set numcheck.limits.MAX_LOST_LETTERS higher to read it.")
    totals: set[int] = set()
    for counts in itertools.product(*widths):
        options = [m.options for m, n in zip(counted, counts) for _ in range(n)]
        for combo in _descending(options):
            totals.add(sum(combo))
    if fractional:
        over = [t for t in totals if t > 59]
        totals = {t for t in totals if t <= 59}
        if over and not totals:
            raise NumcheckRangeError(
                f"The fractional place {text[counted[0].start:counted[-1].end]!r} is {min(over)}, "
                "but a sexagesimal place holds 0 to 59.", value=min(over), legal="0 to 59",
                text=text, position=counted[0].start)
    if not totals:
        raise _error(text, counted[0].start, "no letter fits the lost places of this group",
                     "lost letters that can stand between the letters read")
    return tuple(Fraction(t) for t in sorted(totals))


def _descending(options: list[tuple[int, ...]], above: int = 4):
    """Combinations of one value per position with strictly falling orders."""
    if not options:
        yield ()
        return
    for v in options[0]:
        o = _order(v) if v else -1
        if v and o >= above:
            continue
        for rest in _descending(options[1:], o if v else above):
            yield (v,) + rest


# -- writing back ---------------------------------------------------------

_OPEN_BRACKET = {Status.LOST: "[", Status.RESTORED: "[", Status.ADDED: "<", Status.SUPERFLUOUS: "{"}


def format(reading: Reading, choice: tuple[Fraction, ...] | None = None) -> str:
    """Write *reading* back in abjad letters, marks included.

    With *choice*, that reading: the letters of lost places in brackets.
    """
    groups = []
    for k, slot in enumerate(reading.slots):
        chosen = None if choice is None else choice[k]
        groups.append(_join(_group_pieces(reading.notation, slot, chosen)))
    return " ".join(groups)


def render(reading: Reading, choice: tuple[Fraction, ...]) -> str:
    """One reading of a damaged number, restored letters in brackets."""
    return format(reading, choice)


def _piece(m: _Mark) -> tuple[str, str | None]:
    if m.kind in ("lost",):
        return ("[.]", None)
    if m.kind == "gap":
        return (m.text, None)
    if m.half and m.status is Status.READ:
        return (m.text, "\u2e22")
    return (m.text + ("?" if m.doubtful and not m.half and len(m.options) == 1 else ""),
            _OPEN_BRACKET.get(m.status))


def _spell(notation: str, value: int) -> list[str]:
    table = _spelling(notation)
    out = []
    for weight in (1000, 100, 10, 1):
        digit = value // weight * weight if weight < 1000 else value // 1000 * 1000
        value -= digit
        if digit:
            out.append(table[digit])
    return out


def _group_pieces(notation: str, slot: Slot, chosen: Fraction | None) -> list[tuple[str, str | None]]:
    if slot.gap is not None or not slot.form:
        if chosen is None:
            return [("[...]", None)]
        letters = "".join(_spell(notation, int(chosen))) or "\u0660"
        return [(letters, "[" if slot.status is not Status.UNREAD else None)]
    marks: list[_Mark] = list(slot.form)
    if chosen is not None and len(slot.values) == 1 and chosen != slot.values[0] \
            and slot.status is Status.DOUBTFUL and chosen.denominator == 1 and chosen > 0:
        return _alternative_pieces(notation, marks, chosen)
    if chosen is None or len(slot.values) == 1:
        return [_piece(m) for m in marks]
    known = [m for m in marks if m.status not in _OPEN and m.status is not Status.SUPERFLUOUS
             and len(m.options) == 1]
    rest = int(chosen) - sum(m.options[0] for m in known)
    bracket = None if all(m.status is Status.UNREAD for m in marks if m.status in _OPEN) else "["
    restored = {_order(v): v for v in (_value_of(notation, s) for s in _spell(notation, rest))}
    pieces = []
    for m in marks:
        if m in known or m.status is Status.SUPERFLUOUS:
            while restored and max(restored) > (_order(m.options[0]) if m.options[0] else -1):
                o = max(restored)
                pieces.append((_spelling(notation)[restored.pop(o)], bracket))
            pieces.append(_piece(m))
    for o in sorted(restored, reverse=True):
        pieces.append((_spelling(notation)[restored[o]], bracket))
    return pieces


def _alternative_pieces(notation: str, marks: list[_Mark], chosen: Fraction) -> list[tuple[str, str | None]]:
    """A doubtful group given the value of a look-alike: its doubtful letters rewritten, still doubtful.

    The letters read for certain stay; the doubtful ones give way to the
    letters of what is left of *chosen*, each marked ``?``, so that the text
    reads back to the value (``ي?`` given 2 is ``ب?``).
    """
    known = [m for m in marks if not m.doubtful and m.status not in _OPEN
             and m.status is not Status.SUPERFLUOUS and len(m.options) == 1]
    rest = int(chosen) - sum(m.options[0] for m in known)
    if rest <= 0:
        return [_piece(m) for m in marks]
    letters = _spell(notation, rest)
    pieces = [(_piece(m)) for m in marks if m in known or m.status is Status.SUPERFLUOUS]
    doubtful = [(letter + "?", None) for letter in letters]
    # Letters go from the largest value to the smallest, as the script writes them.
    merged = sorted(pieces + doubtful,
                    key=lambda p: -_value_of(notation, p[0].rstrip("?")) if p[0].rstrip("?")
                    in letter_values(notation) else 0)
    return merged


def _value_of(notation: str, letter: str) -> int:
    return letter_values(notation)[letter][0]


def _join(pieces: list[tuple[str, str | None]]) -> str:
    return join_marked(pieces).replace("[.][.]", "[..]")
