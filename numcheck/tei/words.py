"""Numbers written as Greek words, and signs the editor wrote out as words.

EpiDoc encodes a number written in words as the words themselves, either
inside the ``<num>`` (``<num value="6">ἕξ</num>``) or just before an empty
one (``ἕξ <num value="6"/>``), and a sign the editor expands as an
``<expan>`` whose ``<ex>`` holds the word (``<num value="2"><expan><ex>
διώβολον</ex></expan></num>``, the two-obol sign; EpiDoc Guidelines,
``trans-abbrevsymbol``; Krummrey-Panciera X.3, conventions.md §1.2).  Neither
is a numeral to be read letter by letter.  This module reads such words with
the sourced table ``numcheck/data/greek_number_words.csv``: plain cardinals,
ordinals (which stand for the number or, as fractions, for its part: τέταρτον
is the fourth or a quarter), the days of the month, the half, the obol signs
(values in obols) and the myriad.

A word not in the table is not guessed at: the caller keeps the editor's value.
"""

from __future__ import annotations

import csv
import functools
import re
import unicodedata
import warnings
from dataclasses import dataclass
from fractions import Fraction
from importlib import resources

__all__ = ["WordEntry", "WordsReading", "word_key", "lookup", "read_words", "trailing_number_words",
           "looks_like_words", "is_word"]

#: Marks dropped before looking a word up: accents, diaeresis, iota subscript,
#: length marks and the underdot.  Breathings stay: they tell ἕξ (six) from ἐξ
#: (out of) and εἷς (one) from εἰς (into).
_DROP = {"\u0300", "\u0301", "\u0342", "\u0308", "\u0345", "\u0304", "\u0306", "\u0323"}
#: Words that join number words without adding to them (μιᾷ καὶ εἰκάδι).
_JOINERS = {"και", "κε"}
_SPLIT = re.compile(r"[\s.,·;:·\u0387\u00b7\u02b9\u0374'’()\[\]⸢⸣]+")


@dataclass(frozen=True)
class WordEntry:
    """One row of the table: a value, its kind, what it means, and the source."""

    value: Fraction
    kind: str          # cardinal, ordinal, day, fraction, sign-word, myriad
    meaning: str
    source: str


@dataclass(frozen=True)
class WordsReading:
    """What a run of number words says: the values it may stand for (preferred first)."""

    values: tuple[Fraction, ...]
    words: tuple[str, ...]
    kinds: tuple[str, ...]

    @property
    def value(self) -> Fraction:
        return self.values[0]

    @property
    def signs(self) -> bool:
        """Whether the words are written-out signs (obols), not number words."""
        return all(k == "sign-word" for k in self.kinds)


def word_key(word: str) -> str:
    """The form a word is looked up by: lower case, no accents, final sigma as σ.

    >>> word_key("Ὀβολὸς")
    'ὀβολοσ'
    >>> word_key("ἕξ") != word_key("ἐξ")
    True
    """
    decomposed = unicodedata.normalize("NFD", word)
    kept = "".join(c for c in decomposed if c not in _DROP)
    return unicodedata.normalize("NFC", kept).lower().replace("ς", "σ")


@functools.lru_cache(maxsize=1)
def _table() -> dict[str, WordEntry]:
    path = resources.files("numcheck") / "data" / "greek_number_words.csv"
    out: dict[str, WordEntry] = {}
    with path.open(encoding="utf-8", newline="") as handle:
        for row in csv.DictReader(handle):
            entry = WordEntry(Fraction(row["value"]), row["kind"], row["meaning"], row["source"])
            for form in row["forms"].split():
                out.setdefault(word_key(form), entry)
    return out


def lookup(word: str) -> WordEntry | None:
    """The table's entry for *word* (any accentuation), or None.

    >>> lookup("διώβολον").value
    Fraction(2, 1)
    """
    return _table().get(word_key(word))


def _tokens(text: str) -> list[str]:
    return [t for t in _SPLIT.split(text) if t]


def _numeral(token: str) -> WordEntry | None:
    """A Greek numeral standing among number words (μυριάδες β), read as documents write it."""
    if looks_like_words(token):
        return None
    from ..errors import NumcheckError
    from ..reader import read

    try:
        with warnings.catch_warnings():
            warnings.simplefilter("ignore")
            reading = read(token, notation="greek-documentary")
    except NumcheckError:
        return None
    if reading.damaged or reading.count != 1:
        return None
    return WordEntry(reading.value, "numeral", "a numeral", "read as a Greek numeral")


def read_words(text: str, numerals: bool = False) -> WordsReading | None:
    """The value of *text* when every word of it is a number word of the table, else None.

    Cardinals add up (ἑξήκοντα πέντε = 65); a myriad word counts the number
    before it in ten thousands (or, with nothing before it, the number just
    after it: μυριάδες β may be 20000); an ordinal alone stands for the number
    or for its part (τέταρτον: 4 or 1/4), and the value the editor gave
    decides between them.  With *numerals*, Greek numerals may stand among
    the words (the count of an expanded myriad sign).

    >>> read_words("ἑξήκοντα πέντε").value
    Fraction(65, 1)
    >>> read_words("μιᾷ καὶ εἰκάδι").value
    Fraction(21, 1)
    >>> sorted(read_words("ἑκατοστόν").values)
    [Fraction(1, 100), Fraction(100, 1)]
    >>> read_words("μυριάδες β", numerals=True).values
    (Fraction(20000, 1), Fraction(10002, 1))
    >>> read_words("πόλεως") is None
    True
    """
    words = [w for w in _tokens(text) if word_key(w) not in _JOINERS]
    if not words:
        return None
    entries = [lookup(w) or (_numeral(w) if numerals else None) for w in words]
    if any(e is None for e in entries) or all(e.kind == "numeral" for e in entries):
        return None
    kinds = tuple(e.kind for e in entries)
    if "myriad" in kinds:
        k = kinds.index("myriad")
        before = sum((e.value for e in entries[:k]), Fraction(0))
        after = [e.value for e in entries[k + 1:] if e.kind != "myriad"]
        values: tuple[Fraction, ...] = ((before or 1) * 10000 + sum(after, Fraction(0)),)
        if not before and after:
            values = (after[0] * 10000 + sum(after[1:], Fraction(0)),) + values
    else:
        total = sum((e.value for e in entries), Fraction(0))
        values = (total,)
        if all(k in ("ordinal", "day") for k in kinds) and "ordinal" in kinds and total:
            values = (total, 1 / total)
    return WordsReading(values, tuple(words), kinds)


def _greek(c: str) -> bool:
    return "\u0370" <= c <= "\u03ff" or "\u1f00" <= c <= "\u1fff"


def _marked_greek(text: str) -> bool:
    """Whether an accent or breathing sits on a Greek letter of *text* (any normal form)."""
    base = ""
    for c in unicodedata.normalize("NFD", text):
        if unicodedata.combining(c):
            if _greek(base) and (c in _DROP or c in ("\u0313", "\u0314")):
                return True
        else:
            base = c
    return False


def _greek_tokens(text: str) -> list[str]:
    return [t for t in _tokens(unicodedata.normalize("NFC", text)) if any(_greek(c) for c in t)]


def looks_like_words(text: str) -> bool:
    """Whether *text* is Greek words rather than a numeral (accents, breathings, or long).

    >>> looks_like_words("πεντώβολον"), looks_like_words("ιβ"), looks_like_words("2 bēru 10 UŠ")
    (True, False, False)
    """
    if _marked_greek(text):
        return True
    return any(len(t) > 4 and t.isalpha() for t in _greek_tokens(text))


def is_word(text: str) -> bool:
    """Whether *text* is plainly a written Greek word: accents or breathings, four letters or more.

    A numeral is a few bare letters; an editor's text may leave an accent on
    one (``μὲ``), but not on a run of four.

    >>> is_word("δίμοιρον"), is_word("μὲ"), is_word("αχο")
    (True, False, False)
    """
    return _marked_greek(text) and any(len(t) >= 4 and t.isalpha() for t in _greek_tokens(text))


def trailing_number_words(text: str) -> WordsReading | None:
    """The number words at the end of *text* (the words written before an empty ``<num>``).

    >>> trailing_number_words("πόλεως δραχμὰς διακοσίας").value
    Fraction(200, 1)
    >>> trailing_number_words("ἠγόρασας ἐκ δραχμῶν") is None
    True
    >>> Fraction(1, 50) in trailing_number_words("ἑκατοστὴν καὶ πεντηκοστὴν").values
    True
    """
    tokens = _tokens(text)
    run: list[str] = []
    for tok in reversed(tokens):
        if lookup(tok) is not None:
            run.insert(0, tok)
        elif word_key(tok) in _JOINERS and run:
            run.insert(0, tok)
        else:
            break
    while run and word_key(run[0]) in _JOINERS:
        run.pop(0)
    if not run:
        return None
    whole = read_words(" ".join(run))
    if whole is None or len(run) == 1:
        return whole
    # Two taxes named together (ἑκατοστὴν καὶ πεντηκοστήν) are no one number:
    # the last word alone is a reading too, after the run as a whole.
    last = read_words(run[-1])
    extra = tuple(v for v in last.values if v not in whole.values) if last else ()
    return WordsReading(whole.values + extra, whole.words, whole.kinds)
