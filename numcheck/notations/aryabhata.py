"""Āryabhaṭa's alphabetic numerals: syllables whose consonants add and whose vowel scales them.

Āryabhaṭīya, Gītikāpāda 2 (ed. and tr. K. S. Shukla and K. V. Sarma, 1976;
the rule as commonly summarised, from memory): the 25 grouped consonants
(*varga*) k kh g gh ṅ c ch j jh ñ ṭ ṭh ḍ ḍh ṇ t th d dh n p ph b bh m are 1 to
25; the ungrouped ones (*avarga*) y r l v ś ṣ s h are 30, 40 ... 100.  The nine
vowels multiply by powers of 100: a 1, i 100, u 100², ṛ 100³, ḷ 100⁴, e 100⁵,
ai 100⁶, o 100⁷, au 100⁸ (long and short alike).  A syllable is a run of
consonants and its vowel (``khyu`` = (2 + 30) × 100² = 320000); the number is
the sum of its syllables, in any order (``khyughṛ`` = 4320000, the sun's
revolutions in a yuga).

Read in IAST (NFC), lower case; spaces and hyphens between syllables are
ignored (and not written back).  Each syllable is one slot at place 0 (the
number is additive, like a Roman numeral).  Damage: ``[.]`` a lost syllable
(any consonant with any vowel), ``x`` an unread one, letters in brackets
restored (``kh[y]u``: a consonant lost, the vowel read), ``< >`` added,
``{ }`` superfluous, ``?`` after a doubtful letter (the underdot belongs to
the letters).  ``[...]``, an unknown number of lost syllables, is refused:
write ``[.]`` for each.
"""

from __future__ import annotations

import itertools
from dataclasses import dataclass, replace
from fractions import Fraction

from lark.exceptions import UnexpectedCharacters, UnexpectedInput

from ..errors import LimitError, NumcheckSyntaxError
from .grammars import parser_for
from .. import limits
from ..reading import Reading, Slot, Status
from .marks import join_marked, status_in, track_bracket

__all__ = ["NAME", "parse", "format", "render", "CONSONANTS", "VOWELS", "BAD_EXAMPLES"]

NAME = "aryabhata"

#: Consonant -> value (Āryabhaṭīya, Gītikāpāda 2).
CONSONANTS: dict[str, int] = {
    **{c: k + 1 for k, c in enumerate(
        "k kh g gh ṅ c ch j jh ñ ṭ ṭh ḍ ḍh ṇ t th d dh n p ph b bh m".split())},
    **{c: 30 + 10 * k for k, c in enumerate("y r l v ś ṣ s h".split())},
}
#: Vowel -> multiplier (Āryabhaṭīya, Gītikāpāda 2).
VOWELS: dict[str, int] = {
    "a": 1, "ā": 1, "i": 100, "ī": 100, "u": 100 ** 2, "ū": 100 ** 2, "ṛ": 100 ** 3, "ṝ": 100 ** 3,
    "ḷ": 100 ** 4, "ḹ": 100 ** 4, "e": 100 ** 5, "ai": 100 ** 6, "o": 100 ** 7, "au": 100 ** 8,
}
_SHORT = {1: "a", 100: "i", 100 ** 2: "u", 100 ** 3: "ṛ", 100 ** 4: "ḷ", 100 ** 5: "e",
          100 ** 6: "ai", 100 ** 7: "o", 100 ** 8: "au"}
_BY_VALUE = {v: c for c, v in CONSONANTS.items()}

#: Known-bad inputs, the column (1-based) the error must point at, and the label.
BAD_EXAMPLES: list[tuple[str, int, str]] = [
    ("khyughṛk", 8, "a consonant with no vowel after it"),
    ("akhyu", 1, "a vowel with no consonant before it"),
    ("khyu7", 5, "a character that is not part of Āryabhaṭa's numerals"),
    ("kh[...]", 3, "an unknown number of lost syllables"),
    ("?ka", 1, "a doubt mark with no letter before it"),
    ("[ka", 1, "a bracket opened and never closed"),
]

_OPEN = (Status.LOST, Status.RESTORED, Status.UNREAD)
_RANK = {Status.SUPERFLUOUS: -1, Status.READ: 0, Status.ADDED: 1, Status.DOUBTFUL: 2,
         Status.RESTORED: 3, Status.UNREAD: 4, Status.LOST: 5}
_EXPECTED = "IAST consonants and vowels (khyughṛ), or a damage mark ([.] x [ ] < > { } ?)"


@dataclass(frozen=True)
class _Letter:
    text: str
    kind: str          # "consonant", "vowel", "lost" (a whole syllable), "unread"
    status: Status
    doubtful: bool
    start: int
    end: int


def _error(text: str, pos: int, what: str, expected: str = _EXPECTED) -> NumcheckSyntaxError:
    return NumcheckSyntaxError(f"Cannot read {text!r} as Āryabhaṭa's numerals: {what}", text, pos,
                               expected=expected)


def parse(text: str) -> Reading:
    """Read *text* as Āryabhaṭa's alphabetic numerals.

    >>> parse("khyughṛ").value
    Fraction(4320000, 1)
    """
    if not text.strip():
        raise _error(text, 0, "the input is empty", "a number such as khyughṛ")
    try:
        tokens = list(parser_for("aryabhata").parse(text).children)
    except UnexpectedInput as err:
        pos = getattr(err, "pos_in_stream", None)
        pos = len(text) if pos is None else pos
        what = ("a character that is not part of Āryabhaṭa's numerals"
                if isinstance(err, UnexpectedCharacters) else "a mark in the wrong place")
        raise _error(text, min(pos, len(text)), what) from None
    letters: list[_Letter] = []
    state: dict[str, int | None] = {"lost": None, "added": None, "superfluous": None}
    for tok in tokens:
        t, start, end = tok.type, tok.start_pos, tok.end_pos
        if track_bracket(t, start, state, lambda pos, what, exp: _error(text, pos, what, exp)):
            continue
        if t == "DOUBT":
            if not letters or letters[-1].kind not in ("consonant", "vowel"):
                raise _error(text, start, "a doubt mark with no letter before it", "a letter before '?'")
            letters[-1] = replace(letters[-1], doubtful=True, end=end)
        elif t in ("CONSONANT", "VOWEL"):
            letters.append(_Letter(str(tok), t.lower(), status_in(state, False), False, start, end))
        elif t == "UNREAD":
            letters.append(_Letter("x", "unread", status_in(state, True), False, start, end))
        elif t == "LOST_SYLLABLE":
            if state["lost"] is not None:
                raise _error(text, start, "lost-syllable dots inside brackets", "'[.]' standing alone")
            letters.append(_Letter("[.]", "lost", Status.LOST, False, start, end))
        elif t == "GAP_SYLLABLES":
            raise _error(text, start, "an unknown number of lost syllables",
                         "'[.]' for each lost syllable (the count matters in an additive notation)")
    for name, opened in state.items():
        if opened is not None:
            raise _error(text, opened, "a bracket opened and never closed",
                         f"a closing bracket for the {name} part")
    syllables = _syllables(text, letters)
    if len(syllables) > limits.MAX_PLACES:
        raise LimitError("number of syllables", len(syllables), limits.MAX_PLACES,
                         "Set numcheck.limits.MAX_PLACES higher to read it.")
    slots = tuple(_slot(text, s) for s in syllables)
    if not any(s.counted for s in slots):
        raise _error(text, 0, "every syllable is marked superfluous", "at least one counted syllable")
    return Reading(text=text, notation=NAME, slots=slots, base=10)


def _syllables(text: str, letters: list[_Letter]) -> list[list[_Letter]]:
    out: list[list[_Letter]] = []
    current: list[_Letter] = []
    for x in letters:
        if x.kind in ("lost", "unread"):
            if current:
                raise _error(text, x.start, "a consonant with no vowel after it", "a vowel to end the syllable")
            out.append([x])
        elif x.kind == "consonant":
            current.append(x)
        else:
            if not current:
                raise _error(text, x.start, "a vowel with no consonant before it",
                             "a consonant before each vowel (Āryabhaṭa writes no bare vowels)")
            current.append(x)
            out.append(current)
            current = []
    if current:
        raise _error(text, current[-1].start, "a consonant with no vowel after it", "a vowel to end the syllable")
    return out


def _slot(text: str, syllable: list[_Letter]) -> Slot:
    start, end = syllable[0].start, syllable[-1].end
    written = text[start:end]
    statuses = [x.status for x in syllable] + [Status.DOUBTFUL for x in syllable if x.doubtful]
    status = max(statuses, key=_RANK.__getitem__)
    if all(x.status is Status.SUPERFLUOUS for x in syllable):
        value = _value(syllable) if syllable[0].kind not in ("lost", "unread") else 0
        return Slot(values=(Fraction(value),), status=Status.SUPERFLUOUS, text=written, span=(start, end),
                    form=(tuple(syllable), ()))
    if not any(x.status in _OPEN for x in syllable):
        return Slot(values=(Fraction(_value(syllable)),), status=status, text=written, span=(start, end),
                    form=(tuple(syllable), ()))
    # Every value the traces allow, with one spelling of the open letters for each.
    if syllable[0].kind in ("lost", "unread"):
        positions = [("consonant", None), ("vowel", None)]
    else:
        positions = [(x.kind, x if x.status not in _OPEN else None) for x in syllable]
    open_count = sum(1 for _, x in positions if x is None)
    if open_count > limits.MAX_LOST_LETTERS:
        raise LimitError("number of lost letters to try", open_count, limits.MAX_LOST_LETTERS,
                         "Set numcheck.limits.MAX_LOST_LETTERS higher to read it.")
    choices = [(x.text,) if x is not None else tuple(CONSONANTS if kind == "consonant" else _SHORT.values())
               for kind, x in positions]
    spellings: dict[int, tuple[str, ...]] = {}
    for combo in itertools.product(*choices):
        total = sum(CONSONANTS[c] for (kind, _), c in zip(positions, combo) if kind == "consonant")
        total *= VOWELS[combo[-1]]
        spellings.setdefault(total, tuple(c for (_, x), c in zip(positions, combo) if x is None))
    editor = None
    if syllable[0].kind not in ("lost", "unread") and all(
            x.status is not Status.UNREAD and x.status is not Status.LOST for x in syllable):
        editor = Fraction(_value(syllable))
    return Slot(values=tuple(Fraction(v) for v in sorted(spellings)), status=status, text=written,
                span=(start, end), editor=editor, form=(tuple(syllable), tuple(sorted(spellings.items()))))


def _value(syllable: list[_Letter]) -> int:
    return sum(CONSONANTS[x.text] for x in syllable if x.kind == "consonant") * VOWELS[syllable[-1].text]


# -- writing back ---------------------------------------------------------

_BRACKET = {Status.LOST: "[", Status.RESTORED: "[", Status.ADDED: "<", Status.SUPERFLUOUS: "{"}


def format(reading: Reading, choice: tuple[Fraction, ...] | None = None) -> str:
    """Write *reading* back in IAST, marks included; with *choice*, that reading."""
    pieces: list[tuple[str, str | None]] = []
    for k, slot in enumerate(reading.slots):
        syllable, spelled = slot.form
        chosen = None if choice is None else choice[k]
        fills = dict(spelled).get(int(chosen)) if chosen is not None and len(slot.values) > 1 else None
        if fills is not None and syllable[0].kind in ("lost", "unread"):
            pieces.append(("".join(fills), None if syllable[0].status is Status.UNREAD else "["))
            continue
        fill_iter = iter(fills) if fills is not None else None
        for x in syllable:
            if fill_iter is not None and x.status in _OPEN:
                pieces.append((next(fill_iter), None if x.status is Status.UNREAD else "["))
            elif x.kind == "lost":
                pieces.append(("[.]", None))
            else:
                pieces.append((x.text + ("?" if x.doubtful else ""), _BRACKET.get(x.status)))
    return join_marked(_kept_apart(pieces))


def _kept_apart(pieces: list[tuple[str, str | None]]) -> list[tuple[str, str | None]]:
    """A hyphen (ignored when read) between a consonant and an h that would join it (k + h is not kh)."""
    out: list[tuple[str, str | None]] = []
    for text, bracket in pieces:
        if out and out[-1][1] == bracket and text[:1] == "h" and out[-1][0][-1:] + "h" in CONSONANTS:
            out.append(("-", bracket))
        out.append((text, bracket))
    return out


def render(reading: Reading, choice: tuple[Fraction, ...]) -> str:
    """One reading of a damaged number, the lost letters restored in brackets."""
    return format(reading, choice)
