"""Cuneiform numbers: floating sexagesimal place value, as the tablets write it.

A tablet writes 1,40 the same way whether it means 100, 1;40 or 1,40,0: the
text does not fix the magnitude.  A Reading of this notation is therefore
``floating`` (its value is given at integer scale, the last written place
being the units place) unless an editor wrote ``;`` to assert a magnitude.

Two written forms are read:

* digit transliterations, places separated by ``,`` or by spaces
  (``1,40`` or ``1 40``), with the damage marks of the sexagesimal notation and
  ``n`` for a place whose number is unknown.  These reuse
  :mod:`numcheck.notations.sexagesimal` (spaces are turned into commas of the
  same width, so every position in an error still points at the input);
* the Unicode signs (``grammars/cuneiform.lark``): the signs of one place
  written together, places separated by a space (``𒐏𒐉`` = 44).  A sign adds
  its contribution to its place, from ``numcheck/data/cuneiform_signs.csv``
  (FOUR U is 40 there, FOUR DISH 4: not the wedge counts of
  ``unicodedata.numeric``).
"""

from __future__ import annotations

import csv
import functools
import re
import unicodedata
from dataclasses import dataclass, replace
from fractions import Fraction
from importlib import resources

from lark import Token, Tree
from lark.exceptions import UnexpectedCharacters, UnexpectedInput

from ..errors import LimitError, NumcheckRangeError, NumcheckSyntaxError
from .grammars import parser_for
from .. import limits
from ..reading import Reading, Slot, Status
from . import sexagesimal
from .sexagesimal import assign_places
from .marks import join_marked, status_in, track_bracket

__all__ = ["NAME", "parse", "format", "render", "sign_table", "SignInfo", "BAD_EXAMPLES", "is_cuneiform_sign",
           "count_signs", "parse_count"]

NAME = "cuneiform"

#: Known-bad inputs, the column (1-based) the error points at, and the label.
BAD_EXAMPLES: list[tuple[str, int, str]] = [
    ("𒐏𒐉 4", 4, "a decimal digit among cuneiform signs (one number, one script)"),
    ("𒐕", 1, "a metrological sign, not a sexagesimal place-value digit"),
    ("𒀀", 1, "a cuneiform sign that is not a numeral"),
    ("𒐉𒐏", 2, "a tens sign after the units of its place"),
    ("𒐏𒐏", 2, "more than 50 in the tens of one place"),
    ("𒐉𒐉𒐉", 3, "more than 9 in the units of one place"),
    ("𒌋n", 2, "'n' (an unknown number) must stand as a place of its own"),
    ("1 4a", 4, "a character that is not part of a cuneiform number"),
    ("1,,40", 3, "an empty place between two separators"),
    ("1 61", 3, "a place over 59"),
]

_CUNEIFORM_RANGE = (0x12000, 0x1254F)
_TENS = tuple(Fraction(v) for v in range(0, 60, 10))
_UNITS = tuple(Fraction(v) for v in range(10))
_ANY = tuple(Fraction(v) for v in range(60))


@dataclass(frozen=True)
class SignInfo:
    """One row of ``cuneiform_signs.csv``."""

    char: str
    name: str
    column: str        # "units", "tens" or "zero"
    value: int         # contribution to its place
    wedges: int
    source: str


@functools.cache
def _all_signs() -> dict[str, SignInfo]:
    table = resources.files("numcheck") / "data" / "cuneiform_signs.csv"
    with table.open(encoding="utf-8", newline="") as fh:
        return {row["sign"]: SignInfo(row["sign"], row["unicode_name"], row["column"],
                                      int(row["place_value"]), int(row["wedges"]), row["source"])
                for row in csv.DictReader(fh)}


@functools.cache
def _signs() -> dict[str, SignInfo]:
    """The place-value digits (the counting signs GESH2, GESHU, SHAR2 ... are apart)."""
    return {k: v for k, v in _all_signs().items() if v.column != "count"}


@functools.cache
def count_signs() -> dict[str, SignInfo]:
    """Sign -> :class:`SignInfo` for every sign a count may use: the digits and GESH2 ... SHAR2 GAL.

    In a count the sign fixes its magnitude (ONE GESH2 is 60, whatever
    stands beside it); the digits count their own value (U is 10).
    """
    return dict(_all_signs())


def sign_table() -> dict[str, SignInfo]:
    """Sign -> :class:`SignInfo`, every sign read as a place-value digit."""
    return dict(_signs())


@functools.cache
def _canonical_sign() -> dict[tuple[str, int], str]:
    """The sign written back for a (column, value): the first row of the table."""
    out: dict[tuple[str, int], str] = {}
    for info in _signs().values():
        out.setdefault((info.column, info.value), info.char)
    return out


#: The digits Oracc writes for 4, 7, 8 and 9 (its math.xdf table: the "variant form"
#: code points, not FOUR..NINE DISH).  A number written with them is written back with them.
ORACC_DIGITS = {4: "\U0001243C", 7: "\U00012442", 8: "\U00012444", 9: "\U00012446"}


def _uses_oracc_digits(text: str) -> bool:
    return any(ch in ORACC_DIGITS.values() for ch in text)


def _table(oracc: bool) -> dict[tuple[str, int], str]:
    table = _canonical_sign()
    if not oracc:
        return table
    return {**table, **{("units", v): ch for v, ch in ORACC_DIGITS.items()}}


def is_cuneiform_sign(char: str) -> bool:
    """Whether *char* is in the Unicode cuneiform blocks."""
    return len(char) == 1 and _CUNEIFORM_RANGE[0] <= ord(char) <= _CUNEIFORM_RANGE[1]


def parse(text: str) -> Reading:
    """Read *text* as a cuneiform number (digits or Unicode signs).

    >>> parse("1,40").value, parse("1,40").floating
    (Fraction(100, 1), True)
    >>> parse("𒐏𒐉").value
    Fraction(44, 1)
    """
    if not text.strip():
        raise NumcheckSyntaxError("There is no number to read: the input is empty", text, 0,
                                  expected="a number such as 1,40 or 𒐏𒐉")
    if any(is_cuneiform_sign(c) for c in text):
        return _parse_signs(text)
    return _parse_digits(text)


# -- digit transliterations -----------------------------------------------

_GAP_RE = re.compile(r"\[ \.\.\. \]|\[- - -\]")
_N_RE = re.compile(r"(?<![0-9A-Za-z])n(?![0-9A-Za-z])")
_RUN_RE = re.compile(r"[ \t\u00a0]+")


def _as_commas(text: str) -> str:
    """Write spaces between places as commas of the same width (``1 40`` -> ``1,40``).

    Only when the text has no comma: a text with commas keeps its spaces as
    the sexagesimal notation does (``1, 40``).  Spaces inside a gap mark and
    next to ``;`` stay spaces.
    """
    if "," in text:
        return text
    protected = [m.span() for m in _GAP_RE.finditer(text)]
    chars = list(text)
    for m in _RUN_RE.finditer(text):
        a, b = m.span()
        if a == 0 or b == len(text) or any(p <= a < q for p, q in protected):
            continue
        if text[a - 1] in ";+-\u2212" or text[b] == ";":
            continue
        chars[a] = ","
    return "".join(chars)


def _parse_digits(text: str) -> Reading:
    unknown = [m.start() for m in _N_RE.finditer(text)]
    prepared = _N_RE.sub("x", _as_commas(text))
    try:
        reading = sexagesimal.parse(prepared, floating=True, notation=NAME)
    except NumcheckSyntaxError as err:
        label = err.reason.split(": ", 1)[-1].replace("sexagesimal notation", "a cuneiform number")
        raise NumcheckSyntaxError(f"Cannot read {text!r} as a cuneiform number: {label}", text,
                                  err.position, expected=err.expected) from None
    except NumcheckRangeError as err:
        raise NumcheckRangeError(str(err).split("\n", 1)[0].split(" (column")[0], value=err.value,
                                 text=text, position=err.position) from None
    slots = []
    for slot in reading.slots:
        a, b = slot.span
        form = slot.form
        if any(a <= i < b for i in unknown):
            others = [p for p in form if p.start not in unknown]
            if any(p.kind is not Status.SUPERFLUOUS for p in others):
                where = next(i for i in unknown if a <= i < b)
                raise NumcheckSyntaxError(
                    f"Cannot read {text!r} as a cuneiform number: 'n' (an unknown number) must "
                    "stand as a place of its own", text, where, expected="'n' alone between separators")
            form = tuple(replace(p, char="n") if p.start in unknown else p for p in form)
        slots.append(replace(slot, text=text[a:b], form=form))
    return replace(reading, text=text, slots=tuple(slots))


# -- Unicode signs --------------------------------------------------------

@dataclass(frozen=True)
class _Item:
    """One written mark of a place: a sign, ``x``, ``n`` or the empty-place sign."""

    char: str
    kind: str          # "sign", "x", "n"
    column: str        # "units", "tens", "zero", "" (x and n)
    value: int
    status: Status
    doubtful: bool
    start: int


_WORST = {Status.SUPERFLUOUS: -1, Status.READ: 0, Status.ADDED: 1, Status.DOUBTFUL: 2,
          Status.RESTORED: 3, Status.UNREAD: 4, Status.LOST: 5}


def _syntax(text: str, pos: int, what: str, expected: str) -> NumcheckSyntaxError:
    return NumcheckSyntaxError(f"Cannot read {text!r} as a cuneiform number: {what}", text, pos,
                               expected=expected)


def _parse_signs(text: str) -> Reading:
    try:
        tree = parser_for("cuneiform").parse(text)
    except UnexpectedInput as err:
        pos = getattr(err, "pos_in_stream", None)
        pos = len(text) if pos is None else pos
        if isinstance(err, UnexpectedCharacters):
            ch = text[pos]
            what = ("a decimal digit among cuneiform signs (one number, one script)" if ch.isdigit()
                    else "a character that is not part of a cuneiform number")
        else:
            what = "a separator with no place after it" if pos >= len(text.rstrip()) else \
                "a mark in the wrong place"
        raise _syntax(text, min(pos, len(text.rstrip())) if not isinstance(err, UnexpectedCharacters)
                      else pos, what, "cuneiform numeral signs, a space between places, "
                      "';' after the units place, or a damage mark ([ ] x n ? < > { })") from None
    whole: list[Tree] = []
    fraction: list[Tree] = []
    has_semi = False
    for child in tree.children:
        if isinstance(child, Token):
            has_semi = True
        elif child.data == "whole":
            whole = list(child.children)
        else:
            fraction = list(child.children)
    if len(whole) + len(fraction) > limits.MAX_PLACES:
        raise LimitError("number of places", len(whole) + len(fraction), limits.MAX_PLACES,
                         "Set numcheck.limits.MAX_PLACES higher to read it.")
    state: dict[str, int | None] = {"lost": None, "added": None, "superfluous": None}
    built_whole = [_sign_place(text, p.children, state) for p in whole]
    built_frac = [_sign_place(text, p.children, state) for p in fraction]
    for name, opened in state.items():
        if opened is not None:
            raise _syntax(text, opened, f"a bracket '{text[opened]}' is opened and never closed",
                          f"a closing bracket for the {name} part")
    slots = assign_places(built_whole, built_frac)
    return Reading(text=text, notation=NAME, slots=tuple(slots), base=60, floating=not has_semi)


def _sign_place(text: str, tokens: list[Token], state: dict) -> Slot:
    start, end = tokens[0].start_pos, tokens[-1].end_pos
    written = text[start:end]
    items: list[_Item] = []
    gap = None
    for tok in tokens:
        if track_bracket(tok.type, tok.start_pos, state, lambda pos, what, exp: _syntax(text, pos, what, exp)):
            continue
        if tok.type == "DOUBT":
            if not items:
                raise _syntax(text, tok.start_pos, "a doubt mark with no sign before it",
                              "a sign before '?'")
            items[-1] = replace(items[-1], doubtful=True)
        elif tok.type == "GAP":
            if state["lost"] is not None:
                raise _syntax(text, tok.start_pos, "'[...]' inside brackets", "'[...]' standing alone")
            gap = tok
        elif tok.type in ("UNREAD", "UNKNOWN"):
            items.append(_Item(str(tok), "x" if tok.type == "UNREAD" else "n", "", 0,
                               status_in(state, True), False, tok.start_pos))
        else:
            items.append(_sign_item(text, tok, state))
    if gap is not None:
        if items:
            raise _syntax(text, gap.start_pos, "'[...]' (lost places, number unknown) must stand "
                          "as a place of its own", "a space before and after '[...]'")
        return Slot(values=_ANY, status=Status.LOST, text=written, span=(start, end),
                    gap=(1, limits.GAP_MAX_PLACES), form=())
    if not items:
        raise _syntax(text, start, "a place with no sign", "a sign, x or n in every place")
    counted = [i for i in items if i.status is not Status.SUPERFLUOUS]
    if not counted:
        return Slot(values=(Fraction(sum(i.value for i in items)),), status=Status.SUPERFLUOUS,
                    text=written, span=(start, end), form=tuple(items))
    values, editor = _place_values(text, counted)
    kinds = [i.status for i in counted] + [Status.DOUBTFUL for i in counted if i.doubtful]
    status = max(kinds, key=_WORST.__getitem__)
    return Slot(values=values, status=status, text=written, span=(start, end), editor=editor,
                form=tuple(items))


def _sign_item(text: str, tok: Token, state: dict) -> _Item:
    ch = str(tok)
    info = _signs().get(ch)
    if info is None:
        name = unicodedata.name(ch, "an unnamed code point")
        what = ("a metrological sign, not a sexagesimal place-value digit"
                if unicodedata.numeric(ch, None) is not None else "a cuneiform sign that is not a numeral")
        if ch in count_signs():
            what += f"; as a count it is {count_signs()[ch].value} (read counts with --notation atf)"
        raise _syntax(text, tok.start_pos, f"{what} ({name})",
                      "the place-value signs DISH, MIN, THREE..NINE DISH (units), U, U U, U U U, "
                      "FOUR U, FIVE U (tens) or the vertical colon (an empty place)")
    return _Item(ch, "sign", info.column, info.value, status_in(state, False), False, tok.start_pos)


def _place_values(text: str, items: list[_Item]) -> tuple[tuple[Fraction, ...], Fraction | None]:
    """The values a place may take (tens column + units column) and the editor's value."""
    first = items[0]
    unknown = [i for i in items if i.kind == "n"]
    if unknown:
        if len(items) > 1:
            other = next(i for i in items if i.kind != "n") if unknown[0] is first else unknown[0]
            raise _syntax(text, other.start, "'n' (an unknown number) must stand as a place of its own",
                          "'n' alone between spaces")
        return _ANY, None
    zero = [i for i in items if i.column == "zero"]
    if zero and len(items) > 1:
        raise _syntax(text, items[1].start if zero[0] is first else zero[0].start,
                      "the empty-place sign shares its place with other signs",
                      "the vertical colon alone between spaces")
    if zero:
        return (Fraction(0),), None
    signs = [i for i in items if i.kind == "sign"]
    if not signs:
        return _ANY, None
    seen_units = False
    for i in signs:
        if i.column == "units":
            seen_units = True
        elif seen_units:
            raise _syntax(text, i.start, "a tens sign after the units of its place",
                          "the tens (U signs) before the units (DISH signs)")
    columns = {"tens": [i for i in signs if i.column == "tens"],
               "units": [i for i in signs if i.column == "units"]}
    last_tens = max((k for k, i in enumerate(items) if i.column == "tens"), default=-1)
    first_units = min((k for k, i in enumerate(items) if i.column == "units"), default=len(items))
    for k, i in enumerate(items):
        if i.kind != "x":
            continue
        if k > last_tens and not columns["units"]:
            columns["units"].append(i)
        elif k < first_units and not columns["tens"]:
            columns["tens"].append(i)
        else:
            raise _syntax(text, i.start, "'x' between the signs of a place",
                          "'x' for the lost tens before the units, or for the lost units after the tens")
    tens, tens_editor = _column(text, columns["tens"], _TENS, 50, "the tens of one place")
    units, units_editor = _column(text, columns["units"], _UNITS, 9, "the units of one place")
    values = tuple(sorted({t + u for t in tens for u in units}))
    editor = None
    if tens_editor is not None or units_editor is not None:
        editor = (tens_editor if tens_editor is not None else tens[0]) + \
                 (units_editor if units_editor is not None else units[0])
        if tens_editor is None and len(tens) > 1 or units_editor is None and len(units) > 1:
            editor = None
    return values, editor


def _column(text: str, items: list[_Item], full: tuple[Fraction, ...], most: int, what: str):
    """Values of one column (tens or units) and the editor's restoration in it."""
    if not items:
        return (Fraction(0),), None
    read = sum(i.value for i in items if i.kind == "sign" and i.status in (Status.READ, Status.ADDED))
    total = sum(i.value for i in items if i.kind == "sign")
    if total > most:
        over = next(i for k, i in enumerate(items)
                    if sum(j.value for j in items[:k + 1] if j.kind == "sign") > most)
        raise _syntax(text, over.start, f"more than {most} in {what}",
                      f"signs adding up to at most {most} in {what}")
    open_items = [i for i in items if i.status in (Status.UNREAD, Status.LOST, Status.RESTORED)]
    if not open_items:
        return (Fraction(total),), None
    options = tuple(v for v in full if read <= v <= most)
    restored = all(i.kind == "sign" for i in open_items)
    return options, (Fraction(total) if restored else None)


# -- writing back ---------------------------------------------------------

def _style(reading: Reading) -> str:
    if any(is_cuneiform_sign(c) for c in reading.text):
        return "signs"
    return "commas" if "," in reading.text or len(reading.counted_slots) < 2 else "spaces"


def format(reading: Reading, choice: tuple[Fraction, ...] | None = None) -> str:
    """Write *reading* back in the form it was written (digits or signs), marks included.

    With *choice*, that reading, restored places in brackets.
    """
    style = _style(reading)
    if style != "signs":
        out = sexagesimal.format(reading, choice)
        return out.replace(",", " ") if style == "spaces" else out
    return _format_signs(reading, choice)


def render(reading: Reading, choice: tuple[Fraction, ...]) -> str:
    """One reading of a damaged number, restored places in brackets."""
    return format(reading, choice)


_OPEN = {Status.LOST: "[", Status.RESTORED: "[", Status.ADDED: "<", Status.SUPERFLUOUS: "{"}


def _format_signs(reading: Reading, choice) -> str:
    parts = []
    semi_done = False
    for k, slot in enumerate(reading.slots):
        chosen = None if choice is None else choice[k]
        if k:
            fractional = slot.place < 0 and not reading.floating and not semi_done
            parts.append(" ; " if fractional else " ")
            semi_done = semi_done or fractional
        parts.append(_bracketed(_slot_pieces(slot, chosen, _uses_oracc_digits(reading.text))))
    return "".join(parts)


def _bracketed(pieces: list[tuple[str, str | None]]) -> str:
    return join_marked(pieces)


def _signs_for(value: int, oracc: bool = False) -> str:
    tens, units = divmod(value, 10)
    table = _table(oracc)
    if value == 0:
        return table[("zero", 0)]
    return (table[("tens", tens * 10)] if tens else "") + (table[("units", units)] if units else "")


def _slot_pieces(slot: Slot, chosen: Fraction | None, oracc: bool = False) -> list[tuple[str, str | None]]:
    if slot.gap is not None or not slot.form:
        if chosen is None:
            return [("...", "[")]
        return [(_signs_for(int(chosen), oracc), "[" if slot.status is not Status.UNREAD else None)]
    items: list[_Item] = list(slot.form)
    if chosen is None or len(slot.values) == 1:
        return [(i.char + ("?" if i.doubtful else ""), _OPEN.get(i.status)) for i in items]
    # A damaged place with a chosen value: keep what was read, write the rest
    # of the value as the editor's restoration.
    read_items = [i for i in items if i.kind == "sign" and i.status in (Status.READ, Status.ADDED)]
    rest = int(chosen) - sum(i.value for i in read_items)
    bracket = "[" if any(i.status in (Status.LOST, Status.RESTORED) for i in items) else None
    pieces = []
    tens_read = [i for i in read_items if i.column == "tens"]
    units_read = [i for i in read_items if i.column == "units"]
    rest_tens, rest_units = divmod(rest, 10)
    table = _table(oracc)
    pieces += [(i.char + ("?" if i.doubtful else ""), _OPEN.get(i.status)) for i in tens_read]
    if rest_tens:
        pieces.append((table[("tens", rest_tens * 10)], bracket))
    pieces += [(i.char + ("?" if i.doubtful else ""), _OPEN.get(i.status)) for i in units_read]
    if rest_units:
        pieces.append((table[("units", rest_units)], bracket))
    if not pieces:
        pieces.append((table[("zero", 0)], bracket))
    return pieces


# -- counts (the sign names fix the magnitude) ----------------------------------

def parse_count(text: str, notation: str = NAME) -> Reading:
    """Read Unicode signs as a count: each sign adds its value (ONE GESH2 = 60, U = 10).

    Administrative texts write counts this way; the value is absolute (not
    floating).  Signs stand largest first; spaces between them are allowed.

    >>> parse_count("\U00012415\U0001230D\U00012442").value
    Fraction(97, 1)
    """
    table = count_signs()
    slots = []
    last = None
    for pos, ch in enumerate(text):
        if ch in " \t\u00a0":
            continue
        info = table.get(ch)
        if info is None or info.column == "zero":
            name = unicodedata.name(ch, f"U+{ord(ch):04X}")
            raise _syntax(text, pos, f"a sign that is not a counting sign ({name})",
                          "DISH ... NINE DISH, U ... FIVE U, ONE..NINE GESH2, ONE..FIVE GESHU, SHAR2 ...")
        if last is not None and info.value > last:
            raise _syntax(text, pos, "a sign larger than the one before it (a count writes the "
                          "largest first)", "the signs in descending order")
        last = info.value
        slots.append(Slot(values=(Fraction(info.value),), place=0, status=Status.READ, text=ch,
                          span=(pos, pos + 1), form=("sign", ch)))
    if not slots:
        raise _syntax(text, 0, "no sign", "counting signs")
    return Reading(text=text, notation=notation, slots=tuple(slots), base=60, floating=False)
