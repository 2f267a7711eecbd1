"""Numbers the letters do not give: expansions, numbers in words, empty ``<num>``.

Three encodings of the EpiDoc Guidelines hold a number that is no numeral
to read letter by letter:

* an expansion: the editor writes a sign out as a word (``<num value="2">
  <expan><ex>διώβολον</ex></expan></num>``, the two-obol sign; ``<expan>τέ
  <ex>ταρτον</ex></expan>``; ``trans-abbrevsymbol``, Krummrey-Panciera X.3);
* a number in words inside the ``<num>`` (``<num value="6">ἕξ</num>``);
* an empty ``<num value="6"/>`` after the words that say it (``ἕξ <num
  value="6"/>``), the encoding of a number written out in words.

Each is read with the sourced table of :mod:`.words` where its words are
in it; otherwise the editor's value is kept and said to be not checkable.
None of them is ever changed by ``--fix``: only letters can contradict a value.
"""

from __future__ import annotations

from fractions import Fraction

from ..reading import exact_text
from .markup import text_before, word_text
from .words import read_words, trailing_number_words

__all__ = ["expansion_result", "words_result", "empty_result", "sign_result"]


def _editor_value(existing: dict) -> Fraction | None:
    try:
        return Fraction(existing["value"].strip()) if "value" in existing else None
    except (ValueError, ZeroDivisionError):
        return None


def _in_range(value: Fraction, existing: dict) -> bool | None:
    """Whether *value* lies within the editor's @atLeast/@atMost (None: no range given)."""
    try:
        a = Fraction(existing["atLeast"].strip()) if "atLeast" in existing else None
        b = Fraction(existing["atMost"].strip()) if "atMost" in existing else None
    except (ValueError, ZeroDivisionError):
        return False
    if a is None and b is None:
        return None
    return (a is None or value >= a) and (b is None or value <= b)


def _compare(res, words, what: str, contradict: bool) -> None:
    """Set *res* from a :class:`~.words.WordsReading`: agrees, or the disagreement."""
    existing = res.existing
    written = _editor_value(existing)
    if written is not None and written in words.values:
        res.value = written
        return
    if written is None:
        inside = [v for v in words.values if _in_range(v, existing)]
        res.value = inside[0] if inside else words.value
        if inside or _in_range(words.value, existing) is None:
            return
        shown = ", ".join(f"@{k}={existing[k]!r}" for k in ("atLeast", "atMost") if k in existing)
    else:
        res.value = words.value
        shown = f"@value={existing['value']!r}"
    ours = " or ".join(exact_text(v) for v in words.values)
    res.message = f"the {what} {' '.join(words.words)!r} give {ours}, not {shown}"
    if contradict:
        res.status = "contradiction"


def expansion_result(res, pieces, plain: str, letters_failed: bool = False) -> bool:
    """Read a ``<num>`` whose content the editor wrote out (``<ex>``); False to read its letters.

    The whole word (written letters and expansion) is looked up among the
    sign words and number words.  When it is not there and letters are
    written outside the expansion, those letters are to be read as a numeral
    first (False is returned, unless *letters_failed*); otherwise the
    editor's value is kept, not checkable.
    """
    words = word_text(pieces)
    reading = read_words(words, numerals=True)
    if reading is None and plain and not letters_failed:
        return False
    res.text, res.notation = words, "words"
    if reading is None:
        res.status = "not-checkable"
        res.read_from = None
        res.message = (f"the expansion {words!r} is not in numcheck's table of sign and number "
                       "words, and no numeral is written: the editor's value is kept, not "
                       "checked from letters")
        return True
    res.status = "agrees" if res.existing else "value-added"
    res.read_from = "expansion"
    _compare(res, reading, "expansion", contradict=True)
    return True


def words_result(res, plain: str) -> None:
    """A ``<num>`` whose text is words, not a numeral: a number in words."""
    res.text, res.notation, res.status = plain, "words", "word"
    reading = read_words(plain)
    if reading is None:
        res.read_from = None
        res.message = ("a number written in words that numcheck's table does not read; "
                       "the editor's value is kept")
        return
    res.read_from = "words"
    _compare(res, reading, "words", contradict=True)


def empty_result(res, el, pieces) -> None:
    """An empty ``<num>``: the value of the words before it (EpiDoc's number in words)."""
    res.notation, res.status = "words", "word"
    before = text_before(el)
    reading = trailing_number_words(before) if before else None
    if reading is None:
        res.text = ""
        res.read_from = None
        res.message = ("an empty <num> (a number written in words); the words before it are "
                       "not number words numcheck reads, so the editor's value is kept"
                       if res.existing else
                       "an empty <num> with no value: nothing to read and nothing given")
        return
    res.text = " ".join(reading.words)
    res.read_from = "words before"
    # The words are found by their place, not marked up: a disagreement is
    # said, not called a contradiction.
    _compare(res, reading, "words before it", contradict=False)


def sign_result(res, inside) -> None:
    """A ``<num>`` with markup but no letters to read (a ``<g>`` sign, a deletion ...)."""
    res.notation, res.status, res.read_from = "", "not-checkable", None
    shown = []
    for c in inside:
        name = c.tag.rsplit("}", 1)[-1]
        kind = c.get("type") or c.get("ref") or ""
        shown.append(f"<{name} {kind}>".replace(" >", ">") if kind else f"<{name}>")
    res.text = " ".join(shown)
    res.message = (f"no letters to read, only {res.text}: the editor's value is kept, not checked"
                   if res.existing else f"no letters to read, only {res.text}, and no value given")
