"""Roman numerals: I V X L C D M, subtractive and additive, as editions print them.

Letters in either case, a final ``j`` for ``i`` (``viij`` = 8), the Unicode
Number Forms characters (U+2160..U+2188, their values checked against
``unicodedata`` in the tests), and a combining overline (U+0305) multiplying
a letter by 1000 (EpiDoc Guidelines, ``trans-supralinearetc``: ``VIII`` with a
bar = 8000).  Subtractive pairs (IV IX XL XC CD CM, and their overlined
forms) and additive forms (IIII, VIIII) are both read; letters in an order no
scribe used (IIX, VV, IL) are an error naming the letter.

How a Roman numeral becomes a Reading (a choice, documented here): Roman
numerals have no places, so every slot is at place 0 and ``base`` is 10.  An
undamaged numeral has one slot per *term* (a letter, or a subtractive pair
read as one term: ``XIV`` is X, IV).  In a damaged numeral the letters do
not add independently (a lost letter before X may make it IX or XX), so all
the counted letters form **one** slot whose values are every total the
traces allow, found by trying every letter at every lost position.  A
superfluous letter (``{I}``) keeps a slot of its own that does not count.

Medieval forms (Cappelli, *Lexicon abbreviaturarum*, "Numeri romani", from
memory; common practice in editions of Latin astronomical tables): framing
points around and between the groups (``.m.cc.lij.`` = 1252, with ``.`` or
the middle dot) are punctuation and carry no value; they are kept for
writing the numeral back.  The apostrophic forms write 1000 as ``CIↃ``, 500
as ``IↃ``, 10000 as ``CCIↃↃ`` and 5000 as ``IↃↃ``: as many C before the I
as reversed C (U+2183, or the small U+2184) after it make 10^(n+2); an I
followed by n reversed C with no C before it makes 5 x 10^(n+1).  Each such
group is one letter of that value (``CIↃCCCXX`` = 1320).
"""

from __future__ import annotations

import itertools
import unicodedata
import warnings
from dataclasses import dataclass, replace
from fractions import Fraction

from lark.exceptions import UnexpectedCharacters, UnexpectedInput

from ..errors import LimitError, NumcheckSyntaxError, NumcheckWarning
from .grammars import parser_for
from .. import limits
from ..reading import Reading, Slot, Status
from .marks import join_marked, status_in, track_bracket

__all__ = ["NAME", "parse", "format", "render", "LETTERS", "BAD_EXAMPLES", "evaluate"]

NAME = "roman"

#: The letters and their values (common practice); ``j`` is a final ``i``.
LETTERS: dict[str, int] = {"I": 1, "V": 5, "X": 10, "L": 50, "C": 100, "D": 500, "M": 1000, "J": 1}

#: Known-bad inputs, the column (1-based) the error must point at, and the label.
BAD_EXAMPLES: list[tuple[str, int, str]] = [
    ("VV", 2, "a V, L or D written twice"),
    ("IIX", 3, "letters in an order no scribe used"),
    ("IL", 2, "a subtractive pair Roman numerals do not use"),
    ("VIX", 3, "letters in an order no scribe used"),
    ("IXI", 3, "letters in an order no scribe used"),
    ("jI", 1, "a j that is not the last letter"),
    ("X1", 2, "a character that is not part of a Roman numeral"),
    ("XΙ", 2, "a character that is not part of a Roman numeral"),
    ("\u0305X", 1, "an overline with no letter before it"),
    ("\u2183", 1, "a Number Forms character with no value of its own"),
    ("X]", 2, "a closing bracket with no opening bracket"),
    ("..", 1, "framing points with no letter"),
    ("X[.?]", 3, "a framing point inside brackets"),
    ("X.?", 3, "a doubt mark with no letter before it"),
    ("ↃI", 1, "a Number Forms character with no value of its own"),
    ("[X", 1, "a bracket opened and never closed"),
]

_SEARCH_LETTERS = ("I", "V", "X", "L", "C", "D", "M")
_OPEN_KINDS = (Status.LOST, Status.RESTORED, Status.UNREAD)


@dataclass(frozen=True)
class _Letter:
    """One written position: a letter, a lost letter, an illegible one or a gap."""

    text: str            # as written, in NFC, without brackets
    value: int           # 0 for a position that was not read
    kind: str            # "letter", "lost", "illegible", "gap"
    status: Status
    doubtful: bool
    start: int           # positions in the NFC text
    end: int
    mark: str = "?"      # how the doubt was written: "?" or an underdot (U+0323)
    before: tuple = ()   # framing points written before it: ((text, bracket), ...)
    after: tuple = ()    # framing points written after it


class _OrderError(Exception):
    def __init__(self, index: int, label: str):
        super().__init__(label)
        self.index = index
        self.label = label


def _decomposed(text: str) -> tuple[str, list[int]]:
    """NFD of *text* and, per NFD character, its index in *text*.

    Underdots compose with Latin letters under NFC (I + U+0323 is U+1ECA), so
    the letters are read decomposed and every position mapped back.
    """
    out, where = [], []
    for i, ch in enumerate(text):
        for d in unicodedata.normalize("NFD", ch):
            out.append(d)
            where.append(i)
    where.append(len(text))
    return "".join(out), where


def _error(text: str, pos: int, what: str, expected: str) -> NumcheckSyntaxError:
    return NumcheckSyntaxError(f"Cannot read {text!r} as a Roman numeral: {what}", text, pos,
                               expected=expected)


_EXPECTED = "the letters I V X L C D M (either case, j for a final i), Number Forms, an overline, " \
            "or a damage mark ([.] [...] + [ ] < > { } ?)"


def _form_value(ch: str) -> int:
    value = unicodedata.numeric(ch, None)
    return int(value) if value is not None else 0


def parse(text: str) -> Reading:
    """Read *text* as a Roman numeral.

    >>> parse("MDCLXVI").value
    Fraction(1666, 1)
    >>> parse("X[.]").count
    5
    """
    if not text.strip():
        raise _error(text, 0, "the input is empty", "a numeral such as MDCLXVI")
    nfd, where = _decomposed(text)
    try:
        tokens = list(parser_for("roman").parse(nfd).children)
    except UnexpectedInput as err:
        pos = getattr(err, "pos_in_stream", None)
        pos = len(nfd) if pos is None else pos
        if isinstance(err, UnexpectedCharacters):
            raise _error(text, where[pos], "a character that is not part of a Roman numeral",
                         _EXPECTED) from None
        raise _error(text, where[min(pos, len(nfd))], "a mark in the wrong place", _EXPECTED) from None
    letters = _letters(text, nfd, where, tokens)
    if len(letters) > limits.MAX_PLACES:
        raise LimitError("number of letters", len(letters), limits.MAX_PLACES,
                         "Set numcheck.limits.MAX_PLACES higher to read it.")
    _check_j(text, letters)
    counted = [x for x in letters if x.status is not Status.SUPERFLUOUS]
    if not counted:
        raise _error(text, 0, "every letter is marked superfluous", "at least one counted letter")
    if any(x.status in _OPEN_KINDS for x in counted):
        slots = _damaged_slots(text, letters)
    else:
        slots = _term_slots(text, letters)
    return Reading(text=text, notation=NAME, slots=tuple(slots), base=10)


def _letters(text: str, nfd: str, where: list[int], tokens) -> list[_Letter]:
    letters: list[_Letter] = []
    pending: list[tuple[str, str | None]] = []     # points before the first letter
    state: dict[str, int | None] = {"lost": None, "added": None, "superfluous": None}
    for tok in tokens:
        start, end = where[tok.start_pos], where[tok.end_pos]
        t = tok.type
        if track_bracket(t, start, state, lambda pos, what, exp: _error(text, pos, what, exp)):
            continue
        if t == "POINT":
            if state["lost"] is not None:
                raise _error(text, start, "a framing point inside brackets",
                             "points outside [ ] ('[.]' is a lost letter)")
            bracket = _BRACKET_OF(state)
            if letters:
                letters[-1] = replace(letters[-1], after=letters[-1].after + ((str(tok), bracket),))
            else:
                pending.append((str(tok), bracket))
            continue
        if t == "APOSTROPHIC":
            letters.extend(_apostrophic(str(tok), start, state))
            continue
        if t in ("DOUBT", "UNDERDOT"):
            if not letters or letters[-1].kind != "letter" or letters[-1].after:
                raise _error(text, start, "a doubt mark with no letter before it", "a letter before it")
            letters[-1] = replace(letters[-1], doubtful=True, end=max(letters[-1].end, end),
                                  mark="?" if t == "DOUBT" else "\u0323")
        elif t == "OVERLINE":
            if not letters or letters[-1].kind != "letter" or letters[-1].after or letters[-1].value >= 1000 and \
                    letters[-1].text.endswith("\u0305"):
                raise _error(text, start, "an overline with no letter before it",
                             "a letter before the overline (U+0305)")
            last = letters[-1]
            letters[-1] = replace(last, text=last.text + "\u0305", value=last.value * 1000, end=end)
        elif t in ("LETTER", "FORM"):
            value = LETTERS[tok.upper()] if t == "LETTER" else _form_value(str(tok))
            if not value:
                raise _error(text, start, "a Number Forms character with no value of its own "
                             f"({unicodedata.name(str(tok))})", _EXPECTED)
            letters.append(_Letter(text[start:end] if t == "FORM" else str(tok), value, "letter",
                                   status_in(state, False), False, start, end))
        elif t == "ILLEGIBLE":
            letters.append(_Letter("+", 0, "illegible", status_in(state, True), False, start, end))
        elif t == "LOST_LETTERS":
            if state["lost"] is not None:
                raise _error(text, start, "lost-letter dots inside brackets", "'[.]' standing alone")
            for k in range(len(tok) - 2):
                letters.append(_Letter(".", 0, "lost", Status.LOST, False, start, end))
        elif t == "GAP":
            if state["lost"] is not None:
                raise _error(text, start, "'[...]' inside brackets", "'[...]' standing alone")
            letters.append(_Letter(str(tok), 0, "gap", Status.LOST, False, start, end))
    for name, opened in state.items():
        if opened is not None:
            raise _error(text, opened, "a bracket opened and never closed",
                         f"a closing bracket for the {name} part")
    if pending and not letters:
        raise _error(text, 0, "framing points with no letter", "a numeral between the points (.m.cc.lij.)")
    if pending:
        letters[0] = replace(letters[0], before=tuple(pending))
    return letters


def _BRACKET_OF(state: dict) -> str | None:
    """The bracket a point stands in (points are written back inside it)."""
    if state.get("superfluous") is not None:
        return "{"
    if state.get("lost") is not None:
        return "["
    return "<" if state.get("added") is not None else None


def _apostrophic(group: str, start: int, state: dict) -> list[_Letter]:
    """An apostrophic group (CIↃ, IↃ, CCIↃↃ ...) as its letters: extra C's, then one value."""
    n = sum(1 for c in group if c in "\u2183\u2184")
    cs = group.index(next(c for c in group if c in "Ii"))
    status = status_in(state, False)
    out = []
    if cs >= n:
        extra, value = cs - n, 10 ** (n + 2)
    else:
        extra, value = cs, 5 * 10 ** (n + 1)
    for k in range(extra):
        out.append(_Letter(group[k], 100, "letter", status, False, start + k, start + k + 1))
    out.append(_Letter(group[extra:], value, "letter", status, False, start + extra, start + len(group)))
    return out


def _check_j(text: str, letters: list[_Letter]) -> None:
    counted = [x for x in letters if x.status is not Status.SUPERFLUOUS]
    for k, x in enumerate(counted):
        if x.kind == "letter" and x.text[:1] in "jJ" and k != len(counted) - 1:
            raise _error(text, x.start, "a j that is not the last letter",
                         "j only for the final i of a numeral (viij)")


def evaluate(values: list[int]) -> tuple[int, list[tuple[int, int]]]:
    """The total of letter values in written order, and its terms as (first, last) indexes.

    Raises ``_OrderError`` (index of the letter at fault, label) for an order
    no scribe used.

    >>> evaluate([10, 1, 10])[0]
    19
    """
    terms: list[tuple[int, int, int]] = []   # (value, first index, last index)
    i = 0
    while i < len(values):
        v = values[i]
        if i + 1 < len(values) and values[i + 1] > v:
            big = values[i + 1]
            if not (_power_of_ten(v) and big in (5 * v, 10 * v)):
                raise _OrderError(i + 1, "a subtractive pair Roman numerals do not use")
            if terms and terms[-1][0] == 5 * v and terms[-1][1] == terms[-1][2]:
                raise _OrderError(i + 1, "letters in an order no scribe used")
            terms.append((big - v, i, i + 1))
            i += 2
            continue
        terms.append((v, i, i))
        i += 1
    for k in range(1, len(terms)):
        prev, cur = terms[k - 1], terms[k]
        prev_small = values[prev[1]] if prev[1] != prev[2] else None
        if cur[0] > prev[0] or (prev_small is not None and cur[0] >= prev_small):
            raise _OrderError(cur[2] if cur[1] != cur[2] else cur[1], "letters in an order no scribe used")
        if cur[1] == cur[2] and prev[1] == prev[2] and cur[0] == prev[0] and _is_five(cur[0]):
            raise _OrderError(cur[1], "a V, L or D written twice")
    return sum(t[0] for t in terms), [(t[1], t[2]) for t in terms]


def _power_of_ten(v: int) -> bool:
    while v >= 10 and v % 10 == 0:
        v //= 10
    return v == 1


def _is_five(v: int) -> bool:
    return v % 5 == 0 and _power_of_ten(v // 5)


def _evaluate_or_raise(text: str, letters: list[_Letter], values: list[int]) -> tuple[int, list]:
    try:
        return evaluate(values)
    except _OrderError as err:
        raise _error(text, letters[err.index].start, err.label,
                     "letters from the largest down, a smaller letter before a larger one only in "
                     "IV IX XL XC CD CM") from None


def _term_slots(text: str, letters: list[_Letter]) -> list[Slot]:
    counted = [x for x in letters if x.status is not Status.SUPERFLUOUS]
    total, terms = _evaluate_or_raise(text, counted, [x.value for x in counted])
    runs = _repeats(counted)
    if runs:
        warnings.warn(f"{text!r}: a letter written more than four times in a row "
                      f"({counted[runs[0]].text}); read additively.", NumcheckWarning, stacklevel=3)
    by_term = []
    for first, last in terms:
        group = counted[first:last + 1]
        status = Status.READ
        if any(x.status is Status.ADDED for x in group):
            status = Status.ADDED
        if any(x.doubtful for x in group):
            status = Status.DOUBTFUL
        value = group[-1].value - group[0].value if first != last else group[0].value
        by_term.append(Slot(values=(Fraction(value),), place=0, status=status,
                            text=text[group[0].start:group[-1].end], span=(group[0].start, group[-1].end),
                            form=tuple(group)))
    slots: list[Slot] = []
    term_iter = iter(by_term)
    done: set[int] = set()
    for x in letters:
        if x.status is Status.SUPERFLUOUS:
            slots.append(Slot(values=(Fraction(x.value),), place=0, status=Status.SUPERFLUOUS,
                              text=x.text, span=(x.start, x.end), form=(x,)))
            continue
        idx = counted.index(x)
        term = next(k for k, (a, b) in enumerate(terms) if a <= idx <= b)
        if term not in done:
            done.add(term)
            slots.append(next(term_iter))
    return slots


def _with_marks(text: str, start: int, end: int) -> tuple[int, int]:
    """Widen a span over the brackets and doubt marks written around it."""
    while start > 0 and text[start - 1] in "[<{":
        start -= 1
    while end < len(text) and text[end] in "]>}?":
        end += 1
    return start, end


def _repeats(counted: list[_Letter]) -> list[int]:
    out = []
    for k in range(4, len(counted)):
        window = counted[k - 4:k + 1]
        if len({x.value for x in window}) == 1 and all(x.kind == "letter" for x in window):
            out.append(k)
    return out


def _damaged_slots(text: str, letters: list[_Letter]) -> list[Slot]:
    counted = [x for x in letters if x.status is not Status.SUPERFLUOUS]
    open_idx = [k for k, x in enumerate(counted) if x.status in _OPEN_KINDS]
    widths = [range(1, limits.GAP_MAX_PLACES + 1) if counted[k].kind == "gap" else (1,) for k in open_idx]
    most = sum(max(w) for w in widths)
    if most > limits.MAX_LOST_LETTERS:
        raise LimitError("number of lost letters to try", most, limits.MAX_LOST_LETTERS,
                         "Set numcheck.limits.MAX_LOST_LETTERS higher to read it.")
    spellings: dict[int, tuple[str, ...]] = {}
    for counts in itertools.product(*widths):
        for fill in itertools.product(_SEARCH_LETTERS, repeat=sum(counts)):
            values, chosen = [], []
            fills = iter(fill)
            for k, x in enumerate(counted):
                if k in open_idx:
                    n = counts[open_idx.index(k)]
                    piece = "".join(next(fills) for _ in range(n))
                    chosen.append(piece)
                    values.extend(LETTERS[c] for c in piece)
                else:
                    values.append(x.value)
            try:
                total, _ = evaluate(values)
            except _OrderError:
                continue
            spellings.setdefault(total, tuple(chosen))
    if not spellings:
        raise _error(text, counted[open_idx[0]].start, "no letter fits the lost places",
                     "lost letters that can stand between the letters read")
    editor = None
    restored = [counted[k] for k in open_idx]
    if all(x.status is Status.RESTORED and x.kind == "letter" for x in restored):
        editor_total, _ = _evaluate_or_raise(text, counted, [x.value for x in counted])
        editor = Fraction(editor_total)
        # A restoration in a letter the search does not try (ↁ, an overline)
        # is still one of the readings the traces allow: the editor's.
        spellings.setdefault(editor_total, tuple(x.text for x in restored))
    kinds = [x.status for x in counted] + [Status.DOUBTFUL for x in counted if x.doubtful]
    worst = max(kinds, key=lambda s: {Status.READ: 0, Status.ADDED: 1, Status.DOUBTFUL: 2,
                                      Status.RESTORED: 3, Status.UNREAD: 4, Status.LOST: 5}[s])
    start, end = _with_marks(text, counted[0].start, counted[-1].end)
    whole = Slot(values=tuple(Fraction(v) for v in sorted(spellings)), place=0, status=worst,
                 text=text[start:end], span=(start, end),
                 editor=editor, form=(tuple(counted), tuple(sorted(spellings.items()))))
    slots: list[Slot] = []
    placed = False
    for x in letters:
        if x.status is Status.SUPERFLUOUS:
            slots.append(Slot(values=(Fraction(x.value),), place=0, status=Status.SUPERFLUOUS,
                              text=x.text, span=(x.start, x.end), form=(x,)))
        elif not placed:
            slots.append(whole)
            placed = True
    return slots


# -- writing back ---------------------------------------------------------

_OPEN = {Status.LOST: "[", Status.RESTORED: "[", Status.ADDED: "<", Status.SUPERFLUOUS: "{"}


def format(reading: Reading, choice: tuple[Fraction, ...] | None = None) -> str:
    """Write *reading* back as a Roman numeral, marks included.

    With *choice* (one value per slot), the lost letters of that reading are
    written inside brackets as a restoration.
    """
    pieces: list[tuple[str, str | None]] = []
    for k, slot in enumerate(reading.slots):
        chosen = None if choice is None else choice[k]
        form = slot.form
        if form and isinstance(form[0], tuple):      # the one slot of a damaged numeral
            letters, spelled = form
            fills = dict(spelled).get(chosen) if chosen is not None else None
            fill_iter = iter(fills) if fills is not None else None
            for x in letters:
                if fill_iter is not None and x.status in _OPEN_KINDS:
                    piece = next(fill_iter)
                    pieces.extend(_pieces(x, (piece, None if x.status is Status.UNREAD else "[")))
                else:
                    pieces.extend(_pieces(x, _piece(x)))
        else:
            for x in form:
                pieces.extend(_pieces(x, _piece(x)))
    return unicodedata.normalize("NFC", _join(pieces))


def _pieces(x: _Letter, main: tuple[str, str | None]) -> list[tuple[str, str | None]]:
    """A letter's piece with the framing points written around it."""
    return list(x.before) + [main] + list(x.after)


def _piece(x: _Letter) -> tuple[str, str | None]:
    if x.kind == "lost":
        return ("[.]", None)
    if x.kind == "gap":
        return (x.text, None)
    return (x.text + (x.mark if x.doubtful else ""), _OPEN.get(x.status))


def _join(pieces: list[tuple[str, str | None]]) -> str:
    return join_marked(pieces).replace("[.][.]", "[..]")


def render(reading: Reading, choice: tuple[Fraction, ...]) -> str:
    """One reading of a damaged numeral, the lost letters restored in brackets."""
    return format(reading, choice)
