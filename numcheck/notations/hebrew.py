"""Hebrew letter numerals: the larger value first, 15 and 16 as טו and טז, thousands before a geresh.

Letter values (common practice; Maimonides writes the 793 parts of the molad
as תשצג, Mishneh Torah, Hilkhot Qiddush ha-Hodesh 6.3, from memory): א..ט
1..9, י..צ 10..90, ק ר ש ת 100..400; the final forms ך ם ן ף ץ have the
values of their letters (their use for 500..900 is a rarer convention, from
memory, not read here).  Hundreds past 400 repeat ת (תק 500, תתק 900).  15
and 16 are written טו and טז; יה and יו are read, with a warning.

Marks: a geresh (׳ U+05F3, or an ASCII ') after a single letter and a
gershayim (״ U+05F4, or ") before the last letter say that the letters are a
numeral (ג׳ = 3, תשצ״ג = 793); a geresh *followed* by more letters makes the
letters before it thousands (ה׳תשפ״ג = 5783, the Hebrew year, common
practice).  Vowel points and cantillation marks are ignored (and not written
back).  Groups separated by spaces: the first is the whole part, later groups
are sexagesimal places of 0 to 59 (ל מה = 30;45).

Damage: ``[.]`` a lost letter (``[..]`` two), ``[...]`` an unknown number
(1 to ``limits.GAP_MAX_PLACES``), ``x`` unread, ``[ק]`` restored, ``< >``
added, ``{ }`` superfluous, ``?`` after a doubtful letter.  A group with lost
letters is one slot whose values are every total the traces allow, found by
trying every letter at every lost position (like Roman numerals).
"""

from __future__ import annotations

import itertools
import unicodedata
import warnings
from dataclasses import dataclass, replace
from fractions import Fraction

from lark.exceptions import UnexpectedCharacters, UnexpectedInput

from ..errors import LimitError, NumcheckRangeError, NumcheckSyntaxError, NumcheckWarning
from .grammars import parser_for
from .. import limits
from ..reading import Reading, Slot, Status
from .marks import join_marked, status_in, track_bracket

__all__ = ["NAME", "parse", "format", "render", "LETTERS", "BAD_EXAMPLES", "spell"]

NAME = "hebrew"

#: Letter -> value (common practice); the final forms have their letter's value.
LETTERS: dict[str, int] = {
    "א": 1, "ב": 2, "ג": 3, "ד": 4, "ה": 5, "ו": 6, "ז": 7, "ח": 8, "ט": 9,
    "י": 10, "כ": 20, "ל": 30, "מ": 40, "נ": 50, "ס": 60, "ע": 70, "פ": 80, "צ": 90,
    "ק": 100, "ר": 200, "ש": 300, "ת": 400,
    "ך": 20, "ם": 40, "ן": 50, "ף": 80, "ץ": 90,
}
_MAIN = {v: k for k, v in LETTERS.items() if k not in "ךםןףץ"}
_VALUES = tuple(sorted(_MAIN))

#: Known-bad inputs, the column (1-based) the error must point at, and the label.
BAD_EXAMPLES: list[tuple[str, int, str]] = [
    ("גת", 2, "letters in an impossible order (the larger value is written first)"),
    ("כי", 2, "two letters of the tens in one group"),
    ("זב", 2, "two letters of the units in one group"),
    ("למ", 2, "letters in an impossible order (the larger value is written first)"),
    ("לכ", 2, "two letters of the tens in one group"),
    ("אa", 2, "a character that is not part of a Hebrew numeral"),
    ("ל ס", 3, "a sexagesimal place over 59"),
    ("?ל", 1, "a doubt mark with no letter before it"),
    ("[ל", 1, "a bracket opened and never closed"),
    ("״ג", 1, "a gershayim with no letter before it"),
    ("קת", 2, "letters in an impossible order (the larger value is written first)"),
]

_OPEN = (Status.LOST, Status.RESTORED, Status.UNREAD)
_RANK = {Status.SUPERFLUOUS: -1, Status.READ: 0, Status.ADDED: 1, Status.DOUBTFUL: 2,
         Status.RESTORED: 3, Status.UNREAD: 4, Status.LOST: 5}
_EXPECTED = "Hebrew letters (larger value first), a geresh or gershayim, a space between places, " \
            "or a damage mark ([.] [...] x [ ] < > { } ?)"


@dataclass(frozen=True)
class _Mark:
    """One written position of a group: a letter, a lost or unread letter, a gap, or a numeral mark."""

    text: str
    value: int            # the letter's value (0 for a position not read and for marks)
    kind: str             # "letter", "lost", "unread", "gap", "geresh", "gershayim"
    status: Status
    doubtful: bool
    start: int
    end: int


def _error(text: str, pos: int, what: str, expected: str = _EXPECTED) -> NumcheckSyntaxError:
    return NumcheckSyntaxError(f"Cannot read {text!r} as a Hebrew numeral: {what}", text, pos,
                               expected=expected)


def parse(text: str) -> Reading:
    """Read *text* as a Hebrew letter numeral.

    >>> parse("תשצג").value
    Fraction(793, 1)
    >>> parse("ה׳תשפ״ג").value
    Fraction(5783, 1)
    """
    if not text.strip():
        raise _error(text, 0, "the input is empty", "a numeral such as תשצג")
    try:
        tree = parser_for("hebrew").parse(text)
    except UnexpectedInput as err:
        pos = getattr(err, "pos_in_stream", None)
        pos = len(text) if pos is None else pos
        what = ("a character that is not part of a Hebrew numeral" if isinstance(err, UnexpectedCharacters)
                else "a mark in the wrong place")
        raise _error(text, min(pos, len(text)), what) from None
    groups = [list(g.children) for g in tree.children]
    if len(groups) > limits.MAX_PLACES:
        raise LimitError("number of places", len(groups), limits.MAX_PLACES,
                         "Set numcheck.limits.MAX_PLACES higher to read it.")
    state: dict[str, int | None] = {"lost": None, "added": None, "superfluous": None}
    slots: list[Slot] = []
    k = 0
    for tokens in groups:
        marks = _marks(text, tokens, state)
        span = (tokens[0].start_pos, tokens[-1].end_pos)
        slot = _group_slot(text, marks, place=-k, fractional=k > 0, span=span)
        slots.append(slot)
        if slot.status is not Status.SUPERFLUOUS:
            k += 1
    for name, opened in state.items():
        if opened is not None:
            raise _error(text, opened, "a bracket opened and never closed",
                         f"a closing bracket for the {name} part")
    return Reading(text=text, notation=NAME, slots=tuple(slots), base=60)


def _marks(text: str, tokens, state: dict) -> list[_Mark]:
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
            if ch not in LETTERS:
                raise _error(text, start, f"a letter with no numeral value ({unicodedata.name(ch, '?')})",
                             "one of the 22 letters or a final form")
            marks.append(_Mark(ch, LETTERS[ch], "letter", status_in(state, False), False, start, end))
        elif t in ("GERESH", "GERSHAYIM"):
            name = "geresh" if t == "GERESH" else "gershayim"
            if not marks or marks[-1].kind in ("geresh", "gershayim"):
                raise _error(text, start, f"a {name} with no letter before it", "a letter before it")
            marks.append(_Mark(str(tok), 0, name, status_in(state, False), False, start, end))
        elif t == "UNREAD":
            marks.append(_Mark("x", 0, "unread", status_in(state, True), False, start, end))
        elif t == "LOST_LETTERS":
            if state["lost"] is not None:
                raise _error(text, start, "lost-letter dots inside brackets", "'[.]' standing alone")
            for _ in range(len(tok) - 2):
                marks.append(_Mark(".", 0, "lost", Status.LOST, False, start, end))
        elif t == "GAP":
            if state["lost"] is not None:
                raise _error(text, start, "'[...]' inside brackets", "'[...]' standing alone")
            marks.append(_Mark(str(tok), 0, "gap", Status.LOST, False, start, end))
    return marks


def _segments(text: str, marks: list[_Mark]) -> tuple[list[_Mark], list[_Mark]]:
    """(thousands, rest): the positions before a geresh that more letters follow, and the others."""
    counted = [m for m in marks if m.status is not Status.SUPERFLUOUS]
    cut = None
    for i, m in enumerate(counted):
        if m.kind == "geresh" and any(n.kind not in ("geresh", "gershayim") for n in counted[i + 1:]):
            if cut is not None:
                raise _error(text, m.start, "two thousands marks in one group", "one geresh for thousands")
            cut = i
    before, after = (counted[:cut], counted[cut + 1:]) if cut is not None else ([], counted)
    for i, m in enumerate(after):
        if m.kind == "gershayim":
            rest = [n for n in after[i + 1:] if n.kind not in ("geresh", "gershayim")]
            if len(rest) != 1:
                raise _error(text, m.start, "a gershayim that is not before the last letter",
                             "the gershayim before the last letter (תשצ״ג)")
        if m.kind == "geresh" and i != len(after) - 1:
            raise _error(text, m.start, "a geresh inside the letters", "a geresh after the thousands or at the end")
    def plain(ms):
        return [n for n in ms if n.kind not in ("geresh", "gershayim")]
    return plain(before), plain(after)


def _valid_prefix(values: tuple[int, ...]) -> bool:
    """Whether the letters so far stand in an order scribes wrote (ט before ו or ז for 15, 16)."""
    for a, b in zip(values, values[1:]):
        if b > a or (b == a and a != 400):
            return False
    orders = [len(str(v)) - 1 for v in values]
    tens = [v for v, o in zip(values, orders) if o == 1]
    units = [v for v, o in zip(values, orders) if o == 0]
    small_hundreds = [v for v, o in zip(values, orders) if o == 2 and v != 400]
    if len(small_hundreds) > 1 or len(tens) > 1:
        return False
    if len(units) > 1 and not (len(units) == 2 and units[0] == 9 and units[1] in (6, 7) and not tens):
        return False
    return True


_ORDER_NAMES = {0: "units", 1: "tens", 2: "hundreds"}


def _order_error(text: str, letters: list[_Mark]) -> None:
    values: list[int] = []
    for m in letters:
        values.append(m.value)
        if not _valid_prefix(tuple(values)):
            prev = values[-2] if len(values) > 1 else 0
            order = len(str(m.value)) - 1
            if m.value < prev and order == len(str(prev)) - 1:
                raise _error(text, m.start, f"two letters of the {_ORDER_NAMES[order]} in one group",
                             "at most one letter each for the tens and the units (טו, טז for 15, 16)")
            raise _error(text, m.start, "letters in an impossible order (the larger value is written first)",
                         "hundreds (ת repeated past 400), tens, units, in that order")


def _totals(text: str, positions: list[_Mark]) -> dict[int, tuple[str, ...]]:
    """Every total the positions allow -> one spelling of its open positions."""
    widths = [range(1, limits.GAP_MAX_PLACES + 1) if m.kind == "gap" else (1,) for m in positions]
    most = sum(max(w) for m, w in zip(positions, widths) if m.status in _OPEN)
    if most > limits.MAX_LOST_LETTERS:
        raise LimitError("number of lost letters to try", most, limits.MAX_LOST_LETTERS,
                         "Set numcheck.limits.MAX_LOST_LETTERS higher to read it.")
    out: dict[int, tuple[str, ...]] = {}
    for counts in itertools.product(*widths):
        expanded = [(m, n) for m, n in zip(positions, counts)]

        def walk(i: int, values: tuple[int, ...], fills: tuple[str, ...]) -> None:
            if i == len(expanded):
                out.setdefault(sum(values), fills)
                return
            m, n = expanded[i]
            if m.status not in _OPEN:
                nxt = values + (m.value,)
                if _valid_prefix(nxt):
                    walk(i + 1, nxt, fills)
                return
            for combo in itertools.product(_VALUES, repeat=n):
                nxt = values + combo
                if _valid_prefix(nxt):
                    walk(i + 1, nxt, fills + ("".join(_MAIN[v] for v in combo),))

        walk(0, (), ())
    return out


def _group_slot(text: str, marks: list[_Mark], place: int, fractional: bool,
                span: tuple[int, int]) -> Slot:
    start, end = span
    written = text[start:end]
    counted = [m for m in marks if m.status is not Status.SUPERFLUOUS]
    if not counted:
        return Slot(values=(Fraction(sum(m.value for m in marks)),), place=place,
                    status=Status.SUPERFLUOUS, text=written, span=span, form=(tuple(marks), ()))
    letters_of = [m for m in counted if m.kind not in ("geresh", "gershayim")]
    if not letters_of:
        raise _error(text, start, "a place with no letter", "a letter, x or [.] in every place")
    if fractional and len(letters_of) == 1 and letters_of[0].kind == "gap":
        return Slot(values=tuple(Fraction(v) for v in range(60)), place=place, status=Status.LOST,
                    text=written, span=span, gap=(1, limits.GAP_MAX_PLACES), form=())
    thousands, rest = _segments(text, marks)
    for segment in (thousands, rest):
        _order_error(text, [m for m in segment if m.kind == "letter" and m.status not in _OPEN])
    if not any(m.status in _OPEN for m in letters_of):
        values = [m.value for m in rest]
        if len(values) >= 2 and values[-2:] in ([10, 5], [10, 6]):
            warnings.warn(f"{written!r}: {10 + values[-1]} written {_MAIN[10]}{_MAIN[values[-1]]}; "
                          f"the usual form is {_MAIN[9]}{_MAIN[values[-1] + 1]}; read as {10 + values[-1]}.",
                          NumcheckWarning, stacklevel=3)
    high = _totals(text, thousands) if thousands else {0: ()}
    low = _totals(text, rest) if rest else {0: ()}
    spellings: dict[int, tuple[str, ...]] = {}
    for h, hf in sorted(high.items()):
        for lo, lf in sorted(low.items()):
            spellings.setdefault(1000 * h + lo, hf + lf)
    if fractional:
        over = [t for t in spellings if t > 59]
        spellings = {t: f for t, f in spellings.items() if t <= 59}
        if not spellings and over:
            raise NumcheckRangeError(
                f"The sexagesimal place {written!r} is {min(over)}, but a sexagesimal place holds 0 to 59.",
                value=min(over), legal="0 to 59", text=text, position=start)
    if not spellings:
        raise _error(text, letters_of[0].start, "no letter fits the lost places of this group",
                     "lost letters that can stand between the letters read")
    editor = None
    opened = [m for m in letters_of if m.status in _OPEN]
    if opened and all(m.kind == "letter" for m in opened):
        editor = Fraction(1000 * sum(m.value for m in thousands) + sum(m.value for m in rest))
        if fractional and editor > 59:
            raise NumcheckRangeError(
                f"The editor's restoration {written!r} is {editor}, but a sexagesimal place holds 0 to 59.",
                value=editor, legal="0 to 59", text=text, position=start)
        spellings.setdefault(int(editor), tuple(m.text for m in opened))
    kinds = [m.status for m in counted] + [Status.DOUBTFUL for m in counted if m.doubtful]
    status = max(kinds, key=_RANK.__getitem__)
    return Slot(values=tuple(Fraction(v) for v in sorted(spellings)), place=place, status=status,
                text=written, span=span, editor=editor,
                form=(tuple(marks), tuple(sorted(spellings.items()))))


# -- writing back ---------------------------------------------------------

_BRACKET = {Status.LOST: "[", Status.RESTORED: "[", Status.ADDED: "<", Status.SUPERFLUOUS: "{"}


def spell(value: int) -> str:
    """A whole number in Hebrew letters, thousands before a geresh (common practice).

    >>> spell(793), spell(15), spell(5783)
    ('תשצג', 'טו', 'ה׳תשפג')
    """
    if value < 0:
        raise NumcheckRangeError(f"{value} has no Hebrew letter numeral.", value=value, legal="0 or more")
    thousands, rest = divmod(value, 1000)
    head = spell(thousands) + "\u05f3" if thousands else ""
    out = []
    while rest >= 400:
        out.append(_MAIN[400])
        rest -= 400
    for weight in (100, 10):
        digit = rest // weight * weight
        if rest % 100 in (15, 16) and weight == 10:
            out.extend([_MAIN[9], _MAIN[rest % 100 - 9]])
            rest = 0
            break
        if digit:
            out.append(_MAIN[digit])
        rest -= digit
    if rest:
        out.append(_MAIN[rest])
    return head + "".join(out)


def format(reading: Reading, choice: tuple[Fraction, ...] | None = None) -> str:
    """Write *reading* back in Hebrew letters, marks included; with *choice*, that reading."""
    groups = []
    for k, slot in enumerate(reading.slots):
        chosen = None if choice is None else choice[k]
        groups.append(_join(_pieces(slot, chosen)))
    return " ".join(groups)


def render(reading: Reading, choice: tuple[Fraction, ...]) -> str:
    """One reading of a damaged numeral, restored letters in brackets."""
    return format(reading, choice)


def _pieces(slot: Slot, chosen: Fraction | None) -> list[tuple[str, str | None]]:
    if slot.gap is not None or not slot.form:
        if chosen is None:
            return [("[...]", None)]
        # Hebrew letters write no zero: an empty lost place is shown as 0.
        return [(spell(int(chosen)) or "0", "[" if slot.status is not Status.UNREAD else None)]
    marks, spelled = slot.form
    fills = dict(spelled).get(int(chosen)) if chosen is not None and len(slot.values) > 1 else None
    fill_iter = iter(fills) if fills is not None else None
    pieces: list[tuple[str, str | None]] = []
    for m in marks:
        if fill_iter is not None and m.status in _OPEN:
            piece = next(fill_iter, "")
            pieces.append((piece, None if m.status is Status.UNREAD else "["))
        elif m.kind == "lost":
            pieces.append(("[.]", None))
        elif m.kind == "gap":
            pieces.append((m.text, None))
        else:
            pieces.append((m.text + ("?" if m.doubtful else ""), _BRACKET.get(m.status)))
    return pieces


def _join(pieces: list[tuple[str, str | None]]) -> str:
    return join_marked(pieces).replace("[.][.]", "[..]")
