"""Find the number words of an ATF line, read them, and name the numerals that are no numbers.

A *number word* is a run of numeral graphemes a reader takes as one number:
``2(u) 4(disz)``, ``1(u) la2 1(disz)``, ``igi-6(disz)-gal2``, ``1.40``, ``1 ME
43``.  Brackets are followed over the whole line, so a number inside
``[n(disz) sila3 kasz n(disz)]`` is lost and restored although the bracket
opens before it.  A unit word right after a number (``sila3``, ``gin2``,
``gur``, ``KUŠ₃``) makes it a quantity of its metrological system; a
quantity written in several units (``2/3(disz) sila3 5(disz) gin2``) or as
``a UNIT la2 b`` is given in the finest unit written.

Numerals that are no numbers are reported with the reason, not read
(Oracc conventions; common practice): ``1`` opening an omen line (DIŠ,
*šumma* "if"), ``{d}30`` and ``30 u 20`` (the gods Sîn and Šamaš),
a numeral inside a sign name (``mul1(IKU)gana₂``), ``{disz}`` and ``{m}``
(determinatives).
"""

from __future__ import annotations

import re
from dataclasses import dataclass, field
from fractions import Fraction

from ..errors import NumcheckError
from ..notations.atf import parse_in_line
from ..notations.atf.pieces import BRACKETS
from ..notations.atf.signs import sign_key, unit_word
from ..reading import Reading, exact_text

__all__ = ["NumberWord", "number_words", "Trap"]

_GRAPHEME = r"(?:[0-9]+|[nN]|[nN]\+[0-9]+|[0-9]+/[0-9]+)\([^()\s]+\)(?:@[a-z0-9]+)*"
_CDLI_WORD = re.compile(rf"^(?:igi-)?{_GRAPHEME}(?:-gal2|-gal₂)?(?:-[A-Za-zšŠ0-9₀-₉]+)*$")
_MATH_WORD = re.compile(r"^(?:[0-9]+|oo|00~[a-d])(?:@v)?(?:\.:?(?:[0-9]+|oo|00~[a-d])(?:@v)?)*"
                        r"(?:[.-][A-Za-zÁáÉéÍíÚúŠš₀-₉0-9]+)*$|^[0-9]+/[0-9]+$")
_GLUED = re.compile(rf"[A-Za-zšŠḫḪ₀-₉]{_GRAPHEME}|{_GRAPHEME}[A-Za-zšŠḫḪ]")
_GOD = re.compile(r"\{d\}[0-9]")
_MARKS = str.maketrans("", "", "[]⸢⸣<>#?!*")
_MINUS = {"la2", "lal"}
_HUNDREDS = {"me", "lim"}
#: The gods written with numbers (Oracc conventions; 15 Ištar and 60 Anu from memory).
_GODS = {"30": "Sîn (the moon god)", "20": "Šamaš (the sun god)", "60": "Anu", "15": "Ištar",
         "40": "Ea", "50": "Enlil", "10": "Adad"}


@dataclass
class Trap:
    """A numeral that is no number, and why."""

    word: str
    start: int
    reason: str


@dataclass
class NumberWord:
    """A number word of a line, read."""

    text: str
    start: int                       # in the line's content
    end: int
    reading: Reading | None = None
    error: str | None = None
    unit: str | None = None          # the unit word right after it
    system: str | None = None
    quantity: tuple[Fraction, Fraction, Fraction, str, str] | None = None  # value, min, max, unit, text
    notes: list[str] = field(default_factory=list)


@dataclass
class _Word:
    text: str
    start: int
    end: int

    @property
    def core(self) -> str:
        return self.text.translate(_MARKS)


def _words(content: str) -> list[_Word]:
    # '_' opens and closes a language shift (logograms): no effect on numbers.
    cleaned = content.replace("_", " ")
    return [_Word(m.group(), m.start(), m.end()) for m in re.finditer(r"\S+", cleaned)]


def _advance(state: dict, text: str) -> None:
    """Follow the brackets of a word that is not read as a number."""
    i = 0
    tokens = [("[(", "PERHAPS_OPEN"), (")]", "PERHAPS_CLOSE"), ("<(", "IMPLIED_OPEN"),
              (")>", "IMPLIED_CLOSE"), ("<<", "EXCISE_OPEN"), (">>", "EXCISE_CLOSE"),
              ("[", "LOST_OPEN"), ("]", "LOST_CLOSE"), ("<", "ADD_OPEN"), (">", "ADD_CLOSE"),
              ("⸢", "HALF_OPEN"), ("⸣", "HALF_CLOSE")]
    while i < len(text):
        for mark, kind in tokens:
            if text.startswith(mark, i):
                name, opening = BRACKETS[kind]
                state[name] = i if opening else None
                i += len(mark)
                break
        else:
            i += 1


def _is_number(word: _Word, prev: _Word | None) -> bool:
    core = word.core
    if _CDLI_WORD.match(core):
        return True
    if core in ("n", "N") and prev is not None and _MATH_WORD.match(prev.core):
        return True
    return bool(_MATH_WORD.match(core))


def _trap(word: _Word, index: int, words: list[_Word]) -> str | None:
    core = word.core
    if _GOD.search(core):
        number = re.search(r"\{d\}([0-9]+)", core).group(1)
        return f"{{d}}{number}: the god {_GODS.get(number, 'written with a number')}, not a number"
    if "{" in core and re.search(r"\{(?:disz|diš|m|f)\}", core) and not _CDLI_WORD.match(core):
        return None
    if _GLUED.search(core) and not _CDLI_WORD.match(core):
        return f"{core}: a numeral written inside a sign name or word, not a number"
    if not _MATH_WORD.match(core) or "/" in core:
        return None
    nxt = words[index + 1].core if index + 1 < len(words) else ""
    prv = words[index - 1].core if index else ""
    if core in ("30", "20") and ("u" in (nxt, prv) or nxt.startswith("it") or prv in ("30", "20")):
        other = "30" if core == "20" else "20"
        if nxt == "u" or prv == "u":
            return f"{core}: the god {_GODS[core]} (beside 'u' and {other}), not a number"
    if index == 0 and core == "1" and nxt and not unit_word(nxt) and not _MATH_WORD.match(nxt):
        return "1 opening the line: the sign DIŠ for šumma 'if' (an omen), not a number"
    return None


def number_words(content: str, *, math: bool = False) -> tuple[list[NumberWord], list[Trap]]:
    """The number words of one line's content, read, and the numerals that are no numbers.

    >>> found, traps = number_words("5(disz) sila3 kasz 2(u) 4(disz) sze gur")
    >>> [(w.text, str(w.reading.value), w.unit) for w in found]
    [('5(disz)', '5', 'sila3'), ('2(u) 4(disz)', '24', None)]
    """
    words = _words(content)
    state: dict = {}
    found: list[NumberWord] = []
    traps: list[Trap] = []
    i = 0
    while i < len(words):
        w = words[i]
        reason = _trap(w, i, words)
        if reason is not None:
            traps.append(Trap(w.text, w.start, reason))
            _advance(state, w.text)
            i += 1
            continue
        starts_minus = (w.core in ("x", "X") and i + 2 < len(words) and
                        sign_key(words[i + 1].core) in _MINUS and _is_number(words[i + 2], None))
        if not (_is_number(w, words[i - 1] if i else None) or starts_minus):
            _advance(state, w.text)
            i += 1
            continue
        j = i + 1
        while j < len(words):
            nxt = words[j]
            key = sign_key(nxt.core)
            if _is_number(nxt, words[j - 1]) and _compatible(words[j - 1], nxt):
                j += 1
            elif key in _MINUS and j + 1 < len(words) and _is_number(words[j + 1], None):
                j += 2
            elif key in _HUNDREDS and j + 1 < len(words) and _MATH_WORD.match(words[j - 1].core):
                j += 1
            else:
                break
        found += _read_group(content, words[i:j], state, math)
        i = j
    _attach_units(content, words, found)
    return found, traps


def _compatible(a: _Word, b: _Word) -> bool:
    """Whether two adjacent numeral words belong to one number (same style)."""
    ca, cb = _CDLI_WORD.match(a.core) is not None, _CDLI_WORD.match(b.core) is not None
    if ca != cb:
        return False
    if not ca:
        # math style: a whole number and a fraction (2 1/2), or hundreds (1 ME 43)
        return "/" in b.core and "/" not in a.core
    # a suffix (-kam) or igi...gal2 ends a number
    return not re.search(r"\)-(?!gal)", a.core) and not a.core.startswith("igi-")


def _read_group(content: str, group: list[_Word], state: dict, math: bool) -> list[NumberWord]:
    text = content[group[0].start:group[-1].end].replace("_", " ")
    mode = "place" if math and any("(" in w.core for w in group) else None
    saved = dict(state)
    try:
        reading = parse_in_line(text, state, mode=mode)
        return [NumberWord(text, group[0].start, group[-1].end, reading)]
    except NumcheckError as err:
        if len(group) == 1:
            state.clear()
            state.update(saved)
            _advance(state, group[0].text)
            return [NumberWord(text, group[0].start, group[0].end, error=str(err).split("\n")[0])]
    state.clear()
    state.update(saved)
    out: list[NumberWord] = []
    for w in group:
        out += _read_group(content, [w], state, math)
    return out


def _attach_units(content: str, words: list[_Word], found: list[NumberWord]) -> None:
    """A unit word right after a number makes a quantity; several units of one system add up."""
    by_end = {w.end: k for k, w in enumerate(words)}
    starts = {w.start: k for k, w in enumerate(words)}
    for n in found:
        k = by_end.get(n.end)
        if k is None or k + 1 >= len(words) or n.reading is None:
            continue
        nxt = words[k + 1]
        after = words[k + 2].core if k + 2 < len(words) else ""
        unit = unit_word(nxt.core)
        if unit is not None and unit.name == "sze":
            # 'sze' is barley before a capacity unit (3(asz) sze gur); a grain only before gin2
            unit = unit_word(after) if unit_word(after) is not None else None
            if unit is not None and unit.name == "gin2":
                unit = unit_word(nxt.core)
        if unit is None or (sign_key(nxt.core) == "si" and sign_key(after) == "gin"):
            continue
        if n.reading.unit and n.reading.unit != unit.name:
            n.notes.append(f"{nxt.core} after a number counted in {n.reading.unit}")
            continue
        n.unit, n.system = unit.name, unit.system
    # compound quantities: NUMBER UNIT NUMBER UNIT (one system), NUMBER UNIT la2 NUMBER
    for a, b in zip(found, found[1:]):
        if a.unit is None or a.reading is None or b.reading is None:
            continue
        ka, kb = by_end.get(a.end), starts.get(b.start)
        if ka is None or kb is None:
            continue
        between = [words[x].core for x in range(ka + 1, kb)]
        ua = unit_word(between[0]) if between else None
        if len(between) == 1 and b.unit and ua and unit_word(b.unit, ua.system) is not None:
            # gin2 is capacity or weight: the unit before it decides
            b.system = ua.system
            _compound(a, b, ua, unit_word(b.unit, ua.system), +1)
        elif len(between) == 2 and sign_key(between[1]) in _MINUS and ua is not None:
            b.unit, b.system = b.unit or a.unit, ua.system
            _compound(a, b, ua, unit_word(b.unit, ua.system), -1)


def _compound(a: NumberWord, b: NumberWord, ua, ub, sign: int) -> None:
    finest = min((ua, ub), key=lambda u: u.in_base)
    fa, fb = ua.in_base / finest.in_base, ub.in_base / finest.in_base
    ra, rb = a.reading, b.reading
    base_a = a.quantity[0] if a.quantity else ra.value * fa
    lo_a = a.quantity[1] if a.quantity else ra.min * fa
    hi_a = a.quantity[2] if a.quantity else ra.max * fa
    if sign > 0:
        value, lo, hi = base_a + rb.value * fb, lo_a + rb.min * fb, hi_a + rb.max * fb
    else:
        value, lo, hi = base_a - rb.value * fb, lo_a - rb.max * fb, hi_a - rb.min * fb
    text = a.text + " " + (ua.name if sign > 0 else f"{ua.name} la2") + " " + b.text + \
        (" " + ub.name if sign > 0 else "")
    b.quantity = (value, lo, hi, finest.name, text)
    b.notes.append(f"with the number before it: {exact_text(value)} {finest.name}")
