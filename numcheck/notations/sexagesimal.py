"""Sexagesimal numbers in modern scholarly notation: ``1,49,45;20``.

The strict path only: this module reads what is written, marks what is lost or
doubtful, and writes a Reading back.  It never guesses what was meant.
"""

from __future__ import annotations

from dataclasses import dataclass, replace
from fractions import Fraction

import re

from ..errors import LimitError, NumcheckRangeError, NumcheckSyntaxError
from .grammars import parser_for
from .. import limits
from ..reading import Reading, Slot, Status
from .marks import RAW, SEPARATOR, join_marked

__all__ = ["NAME", "parse", "format", "render", "parse_places", "BAD_EXAMPLES"]

NAME = "sexagesimal"

#: Known-bad inputs and the plain-language label each stands for.  The same
#: table drives lark's error matching and the tests (tests/test_sexagesimal.py),
#: with the column (1-based) the error must point at.
BAD_EXAMPLES: list[tuple[str, int, str]] = [
    ("1,,2", 3, "an empty place between two commas"),
    ("29;;31", 4, "a second ';' (only the units place is followed by ';')"),
    ("29;31;2", 6, "a second ';' (only the units place is followed by ';')"),
    ("1,2,", 5, "a separator with no place after it"),
    ("1;", 3, "a separator with no place after it"),
    (",1", 1, "a separator with no place before it"),
    (";30", 1, "a separator with no place before it (write 0;30)"),
    ("12a", 3, "a character that is not part of sexagesimal notation"),
    ("1 , 2 ,", 8, "a separator with no place after it"),
    ("--1", 2, "a second sign"),
]

_KIND_ORDER = {  # how bad each kind of digit position is, for the place's status
    Status.READ: 0, Status.ADDED: 1, Status.DOUBTFUL: 2, Status.RESTORED: 3,
    Status.UNREAD: 4, Status.LOST: 5, Status.SUPERFLUOUS: -1,
}


@dataclass(frozen=True)
class _Pos:
    """One written digit position inside a place."""

    char: str          # a digit, or "x" for a digit not read / lost
    kind: Status
    doubtful: bool
    start: int


def _raise_from_lark(text: str, err) -> None:
    from lark.exceptions import UnexpectedCharacters, UnexpectedEOF, UnexpectedToken

    label = None
    if not isinstance(err, UnexpectedCharacters):
        label = err.match_examples(parser_for("sexagesimal").parse, _examples_by_label(),
                                   use_accepts=True)
    pos = getattr(err, "pos_in_stream", None)
    if pos is None:
        pos = len(text)
    if isinstance(err, UnexpectedCharacters):
        ch = text[pos]
        what = label or (
            "a control character" if not ch.isprintable() else
            "a character that is not part of sexagesimal notation"
        )
        raise NumcheckSyntaxError(
            f"Cannot read {text!r} as a sexagesimal number: {what}", text, pos,
            expected="digits 0-9, ',' between places, ';' after the units place, "
                     "or a damage mark ([ ] x ? < > { })",
        ) from None
    if isinstance(err, UnexpectedEOF) or (isinstance(err, UnexpectedToken) and err.token.type == "$END"):
        pos = len(text.rstrip())
        what = label or "the number ends too early"
        raise NumcheckSyntaxError(f"Cannot read {text!r} as a sexagesimal number: {what}", text, pos,
                                  expected="a place after the last separator") from None
    what = label or "a mark in the wrong place"
    raise NumcheckSyntaxError(f"Cannot read {text!r} as a sexagesimal number: {what}", text, pos,
                              expected="a place (digits or damage marks)") from None


def _examples_by_label() -> dict[str, list[str]]:
    table: dict[str, list[str]] = {}
    for example, _, label in BAD_EXAMPLES:
        table.setdefault(label, []).append(example)
    return table


def parse(text: str, *, floating: bool = False, notation: str = NAME) -> Reading:
    """Read *text* (already normalised) as a sexagesimal number.

    With ``floating=True`` (cuneiform), a text without ``;`` has no fixed
    magnitude: its last place is taken as the units place and the Reading says
    so.  A ``;`` always fixes the magnitude.
    """
    if not text.strip():
        raise NumcheckSyntaxError("There is no number to read: the input is empty", text, 0,
                                  expected="a number such as 1,49,45;20")
    plain = _plain(text, floating=floating, notation=notation)
    if plain is not None:
        return plain
    from lark.exceptions import UnexpectedInput

    try:
        tree = parser_for("sexagesimal").parse(text)
    except UnexpectedInput as err:
        _raise_from_lark(text, err)
    return _build(text, tree, floating=floating, notation=notation)


#: A number written with digits, ',' and ';' only: every place read, nothing to bracket.
PLAIN = re.compile(r"-?[0-9]+(?:,[0-9]+)*(?:;[0-9]+(?:,[0-9]+)*)?")


def _plain(text: str, *, floating: bool, notation: str) -> Reading | None:
    """The Reading of an undamaged number, without the grammar; None when the grammar must decide.

    It gives exactly the Reading the grammar gives (tests/test_fast_paths.py
    proves it for random texts); anything out of the ordinary (marks, spaces,
    too many places, a place over 59, a long decimal units place) goes to the
    grammar, which reads it or says what is wrong.
    """
    if not PLAIN.fullmatch(text):
        return None
    sign = -1 if text[0] == "-" else 1
    body = text[1:] if sign < 0 else text
    offset = len(text) - len(body)
    whole_text, has_semi, frac_text = body.partition(";")
    whole = whole_text.split(",")
    fraction = frac_text.split(",") if has_semi else []
    if len(whole) + len(fraction) > limits.MAX_PLACES:
        return None
    lone_whole = len(whole) == 1 and (bool(has_semi) or not floating)
    slots: list[Slot] = []
    start = offset
    exponent = len(whole) - 1          # as assign_places counts: units place 0, fractions -1, -2 ...
    for k, place in enumerate(whole + fraction):
        value = int(place)
        capped = not (lone_whole and k == 0)
        if (capped and value > 59) or (not capped and len(place) > limits.MAX_WHOLE_PLACE_DIGITS):
            return None
        form = tuple(_Pos(ch, Status.READ, False, start + i) for i, ch in enumerate(place))
        slots.append(Slot(values=(Fraction(value),), status=Status.READ, text=place,
                          span=(start, start + len(place)), form=form, place=exponent))
        start += len(place) + 1          # and the ',' or ';' after it
        exponent -= 1
    return Reading(text=text, notation=notation, slots=tuple(slots), base=60, sign=sign,
                   floating=floating and not has_semi)


def parse_places(text: str):
    """The raw parse tree (for other notations that reuse these places)."""
    return parser_for("sexagesimal").parse(text)


def _build(text: str, tree, *, floating: bool, notation: str) -> Reading:
    from lark import Token, Tree

    sign = 1
    whole: list[list] = []
    fraction: list[list] = []
    has_semi = False
    for child in tree.children:
        if isinstance(child, Token):
            if child.type == "SIGN":
                sign = -1 if child in ("-", "\u2212") else 1
            elif child.type == "SEMI":
                has_semi = True
        elif child.data == "whole":
            whole = [list(p.children) for p in child.children if isinstance(p, Tree)]
        elif child.data == "fraction":
            fraction = [list(p.children) for p in child.children if isinstance(p, Tree)]
    if len(whole) + len(fraction) > limits.MAX_PLACES:
        from ..errors import LimitError
        raise LimitError("number of places", len(whole) + len(fraction), limits.MAX_PLACES,
                         "Set numcheck.limits.MAX_PLACES higher to read it.")

    state = {"lost": None, "added": None, "superfluous": None}
    # Scholarly usage writes a lone whole place in decimal beyond 59
    # (365;14,48 days, 359;59 degrees, 6585 days): a single whole place is
    # not capped at 59 when a fraction follows or when it is a plain integer
    # with every digit read.  A damaged lone place without ';' ([x]5) stays
    # one sexagesimal place, and so does every place of a floating number.
    lone_whole = len(whole) == 1 and (has_semi or (not floating and _all_read(whole[0])))
    built_whole = [_place(text, toks, state, capped=not lone_whole) for toks in whole]
    built_frac = [_place(text, toks, state) for toks in fraction]
    for name, opened in state.items():
        if opened is not None:
            raise NumcheckSyntaxError(
                f"Cannot read {text!r}: a bracket '{text[opened]}' is opened and never closed",
                text, opened, expected=f"a closing bracket for the {name} part")
    slots = assign_places(built_whole, built_frac)
    return Reading(text=text, notation=notation, slots=tuple(slots), base=60, sign=sign,
                   floating=floating and not has_semi)


def _all_read(tokens: list[Token]) -> bool:
    """Whether a place is written with plain digits only (no damage marks)."""
    return all(tok.type == "DIGIT" for tok in tokens)


def assign_places(whole: list[Slot], fraction: list[Slot]) -> list[Slot]:
    """Give every slot its exponent of 60.

    Whole places count up from the units place (right to left), fractional
    places down from -1.  A gap ``[...]`` occupies its fewest number of places;
    a superfluous place occupies none.
    """
    placed_whole: list[Slot] = []
    exponent = 0
    for slot in reversed(whole):
        placed_whole.append(replace(slot, place=exponent))
        if slot.status is Status.SUPERFLUOUS:
            continue
        exponent += slot.gap[0] if slot.gap is not None else 1
    placed_frac: list[Slot] = []
    exponent = -1
    for slot in fraction:
        placed_frac.append(replace(slot, place=exponent))
        if slot.status is Status.SUPERFLUOUS:
            continue
        exponent -= slot.gap[0] if slot.gap is not None else 1
    return list(reversed(placed_whole)) + placed_frac


def _place(text: str, tokens: list[Token], state: dict, capped: bool = True) -> Slot:
    start = tokens[0].start_pos
    end = tokens[-1].end_pos
    written = text[start:end]
    positions: list[_Pos] = []
    gap_token = None
    for tok in tokens:
        t = tok.type
        if t == "LOST_OPEN":
            _open(text, tok, state, "lost")
        elif t == "LOST_CLOSE":
            _close(text, tok, state, "lost", positions)
        elif t == "ADD_OPEN":
            _open(text, tok, state, "added")
        elif t == "ADD_CLOSE":
            _close(text, tok, state, "added", positions)
        elif t == "SUPERFLUOUS_OPEN":
            _open(text, tok, state, "superfluous")
        elif t == "SUPERFLUOUS_CLOSE":
            _close(text, tok, state, "superfluous", positions)
        elif t in ("DOUBT", "UNDERDOT"):
            if not positions:
                raise NumcheckSyntaxError(
                    f"Cannot read {text!r}: a doubt mark with no digit before it",
                    text, tok.start_pos, expected="a digit before '?' or the underdot")
            last = positions[-1]
            positions[-1] = _Pos(last.char, last.kind, True, last.start)
        elif t == "GAP":
            if state["lost"] is not None:
                raise NumcheckSyntaxError(f"Cannot read {text!r}: '[...]' inside brackets",
                                          text, tok.start_pos, expected="'[...]' standing alone")
            gap_token = tok
        elif t in ("DIGIT", "UNREAD"):
            positions.append(_Pos(tok.lower() if t == "UNREAD" else str(tok),
                                  _kind(t, state), False, tok.start_pos))
    if gap_token is not None:
        if positions:
            raise NumcheckSyntaxError(
                f"Cannot read {text!r}: '[...]' (lost places, number unknown) must stand as a place of its own",
                text, gap_token.start_pos, expected="',' before and after '[...]'")
        return (Slot(values=tuple(Fraction(v) for v in range(60)), status=Status.LOST,
                           text=written, span=(start, end), gap=(1, limits.GAP_MAX_PLACES),
                           form=()))
    counted = [p for p in positions if p.kind is not Status.SUPERFLUOUS]
    if not positions:
        raise NumcheckSyntaxError(f"Cannot read {text!r}: a place with no digit", text, start,
                                  expected="a digit or x in every place")
    if not counted:
        value = int("".join(p.char for p in positions).replace("x", "0") or 0)
        return (Slot(values=(Fraction(value),), status=Status.SUPERFLUOUS, text=written,
                           span=(start, end), form=tuple(positions)))
    if not capped:
        return _uncapped_place(text, counted, positions, written, start)
    if len(counted) > 2 and int("".join(p.char for p in counted).replace("x", "0")) > 59:
        raise NumcheckRangeError(
            f"The place {written!r} has more digits than a sexagesimal place holds.",
            value=written, legal="0 to 59 (two digits at most)", text=text, position=start)
    values, editor = _place_values(text, counted, written, start)
    kinds = [p.kind for p in counted] + [Status.DOUBTFUL for p in counted if p.doubtful]
    status = max(kinds, key=_KIND_ORDER.__getitem__)
    return (Slot(values=values, status=status, text=written, span=(start, end),
                       editor=editor, form=tuple(positions)))


def _uncapped_place(text, counted: list[_Pos], positions, written: str, start: int) -> Slot:
    """A lone whole place written in decimal (365 in 365;14,48): any value."""
    open_kinds = (Status.UNREAD, Status.LOST, Status.RESTORED)
    if len(counted) > limits.MAX_WHOLE_PLACE_DIGITS:
        raise LimitError(f"number of decimal digits in the whole place {written!r}", len(counted),
                         limits.MAX_WHOLE_PLACE_DIGITS,
                         "Set numcheck.limits.MAX_WHOLE_PLACE_DIGITS higher to read it.")
    open_count = sum(1 for p in counted if p.kind in open_kinds)
    if open_count > limits.MAX_WHOLE_PLACE_OPEN_DIGITS:
        raise LimitError(f"number of unread or lost digits in the whole place {written!r}", open_count,
                         limits.MAX_WHOLE_PLACE_OPEN_DIGITS,
                         "Set numcheck.limits.MAX_WHOLE_PLACE_OPEN_DIGITS higher to read it.")
    sums = {0}
    n = len(counted)
    for i, pos in enumerate(counted):
        weight = 10 ** (n - 1 - i)
        opts = range(10) if pos.kind in open_kinds else (int(pos.char),)
        sums = {a + d * weight for a in sums for d in opts}
    editor = None
    if any(p.kind is Status.RESTORED for p in counted) and not any(p.char == "x" for p in counted):
        editor = Fraction(int("".join(p.char for p in counted)))
    kinds = [p.kind for p in counted] + [Status.DOUBTFUL for p in counted if p.doubtful]
    status = max(kinds, key=_KIND_ORDER.__getitem__)
    return Slot(values=tuple(Fraction(v) for v in sorted(sums)), status=status, text=written,
                span=(start, start + len(written)), editor=editor, form=tuple(positions))


def _place_values(text, counted: list[_Pos], written: str, start: int):
    """The values a place may take, and the editor's restoration if any."""
    open_kinds = (Status.UNREAD, Status.LOST, Status.RESTORED)
    if len(counted) == 1 and counted[0].kind in open_kinds:
        values = tuple(Fraction(v) for v in range(60))
        editor = Fraction(int(counted[0].char)) if counted[0].kind is Status.RESTORED else None
        return values, editor
    # Digit positions from the units up: each open position may be any digit
    # its column allows (tens of a sexagesimal place: 0-5).
    options: list[range | tuple[int, ...]] = []
    n = len(counted)
    for i, pos in enumerate(counted):
        weight = 10 ** (n - 1 - i)
        if pos.kind in open_kinds:
            options.append(tuple(d * weight for d in range(10)))
        else:
            options.append((int(pos.char) * weight,))
    # Sums over 59 are dropped as they arise (no digit is negative), so that a
    # place of many x's costs no more than a place of two.
    sums, least = {0}, 0
    for opt in options:
        least += min(opt)
        sums = {a + b for a in sums for b in opt if a + b <= 59}
    legal = sorted(sums)
    if not legal:
        raise NumcheckRangeError(
            f"The place {written!r} is {least} or more, but a sexagesimal place holds 0 to 59.",
            value=least, legal="0 to 59", text=text, position=start)
    editor = None
    if any(p.kind is Status.RESTORED for p in counted):
        editor_value = int("".join(p.char if p.char != "x" else "0" for p in counted))
        if any(p.char == "x" for p in counted):
            editor_value = None
        if editor_value is not None and editor_value > 59:
            raise NumcheckRangeError(
                f"The editor's restoration {written!r} is {editor_value}, but a sexagesimal place holds 0 to 59.",
                value=editor_value, legal="0 to 59", text=text, position=start)
        editor = Fraction(editor_value) if editor_value is not None else None
    return tuple(Fraction(v) for v in legal), editor


def _kind(token_type: str, state: dict) -> Status:
    if state["superfluous"] is not None:
        return Status.SUPERFLUOUS
    if state["lost"] is not None:
        return Status.LOST if token_type == "UNREAD" else Status.RESTORED
    if token_type == "UNREAD":
        return Status.UNREAD
    if state["added"] is not None:
        return Status.ADDED
    return Status.READ


def _open(text: str, tok: Token, state: dict, name: str) -> None:
    if state[name] is not None:
        raise NumcheckSyntaxError(f"Cannot read {text!r}: a bracket opened inside the same kind of bracket",
                                  text, tok.start_pos, expected=f"the {name} bracket opened at column "
                                                                f"{state[name] + 1} to be closed first")
    state[name] = tok.start_pos


def _close(text: str, tok: Token, state: dict, name: str, positions) -> None:
    if state[name] is None:
        raise NumcheckSyntaxError(f"Cannot read {text!r}: a closing bracket with no opening bracket",
                                  text, tok.start_pos, expected="an opening bracket before it")
    state[name] = None


# -- writing back ---------------------------------------------------------

_OPEN = {Status.LOST: "[", Status.RESTORED: "[", Status.ADDED: "<", Status.SUPERFLUOUS: "{"}


def format(reading: Reading, choice: tuple[Fraction, ...] | None = None) -> str:
    """Write *reading* back in canonical sexagesimal notation, marks included.

    With *choice* (one value per slot of a gapless reading), write that reading,
    the chosen digits of lost places inside brackets, as a restoration.
    """
    parts: list[tuple[str, list[tuple[str, str | None]]]] = []  # (separator, [(char, bracket)])
    seen_units = False
    for i, slot in enumerate(reading.slots):
        sep = ""
        if i:
            # ';' before the first fractional place, superfluous or not (the
            # scribe's extra sign stays where it was written: '{29};31', '365;{14},4').
            sep = ";" if (not seen_units and slot.place < 0) else ","
            if sep == ";":
                seen_units = True
        elif slot.place < 0 and not reading.floating:
            parts.append(("", [("0", None)]))
            sep = ";"
            seen_units = True
        chosen = choice[i] if choice is not None else None
        parts.append((sep, _slot_chars(slot, chosen)))
    # Flatten to (char, bracket) with separators in between; a bracket stays
    # open across a separator when the places on both sides share it.
    flat: list[tuple[str, str | None, bool]] = []  # (text, bracket, is_separator)
    for sep, chars in parts:
        if sep:
            flat.append((sep, None, True))
        flat.extend((ch, br, False) for ch, br in chars)
    sign = "-" if reading.sign < 0 else ""
    return sign + join_marked([(p, SEPARATOR if is_sep else b) for p, b, is_sep in flat])


def _slot_chars(slot: Slot, chosen: Fraction | None) -> list[tuple[str, str | None]]:
    if slot.gap is not None:
        if chosen is not None:
            return [(c, "[") for c in str(int(chosen))]
        return [("[...]", RAW)]   # its own brackets: never merged with a lost place beside it
    if not slot.form:
        # A place made by expanding a gap [...] is lost: its chosen digits are a restoration.
        bracket = "[" if slot.status in (Status.LOST, Status.RESTORED) else None
        return [(c, bracket) for c in str(int(chosen if chosen is not None else slot.values[0]))]
    positions: list[_Pos] = list(slot.form)
    counted = [p for p in positions if p.kind is not Status.SUPERFLUOUS]
    digits: list[str] | None = None
    if chosen is not None and counted:
        if len(counted) == 1 and counted[0].kind in (Status.UNREAD, Status.LOST, Status.RESTORED):
            text = str(int(chosen))
            bracket = None if counted[0].kind is Status.UNREAD else "["
            return [(c, bracket) for c in text]
        digits = list(str(int(chosen)).rjust(len(counted), "0"))
        if len(digits) > len(counted):  # a reading with more digits than written (5? read as 15)
            extra = len(digits) - len(counted)
            digits = ["".join(digits[:extra + 1])] + digits[extra + 1:]
    out = []
    k = 0
    for p in positions:
        ch = p.char
        if p.kind is not Status.SUPERFLUOUS and digits is not None:
            ch = digits[k]
            k += 1
        bracket = _OPEN.get(p.kind)
        mark = "?" if p.doubtful else ""
        out.append((ch + mark, bracket))
    return out


def render(reading: Reading, choice: tuple[Fraction, ...]) -> str:
    """Write one reading of a damaged number, restored digits in brackets."""
    return format(reading, choice)
