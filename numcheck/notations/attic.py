"""Attic (acrophonic) numerals of Greek inscriptions: ``Χ𐅅ΗΔΔΙΙ`` = 1622.

Signs and values: Ι 1, Π 5 (also the older Γ), Δ 10, Η 100, Χ 1000, Μ 10000;
the combined forms 50, 500, 5000, 50000 are a Π with Δ, Η, Χ or Μ inside it
(Heath, *A History of Greek Mathematics* I p. 30; EpiDoc Guidelines
``trans-numacrophonic`` recommend the Unicode signs).  Unicode signs read
(Ancient Greek Numbers block; names from ``unicodedata.name``):

* U+10140 GREEK ACROPHONIC ATTIC ONE QUARTER (1/4), U+10141 ONE HALF (1/2),
  U+10142 ONE DRACHMA (1), U+10143 FIVE, U+10144 FIFTY, U+10145 FIVE HUNDRED,
  U+10146 FIVE THOUSAND, U+10147 FIFTY THOUSAND.

ASCII fallbacks, for editors without these characters: ``I P D H X M`` for
Ι Π Δ Η Χ Μ, and ``Π(Δ)`` or ``P(D)`` for 50, ``Π(Η)``/``P(H)`` for 500,
``Π(Χ)``/``P(X)`` for 5000, ``Π(Μ)``/``P(M)`` for 50000.  numcheck writes the
Unicode signs back.

Signs stand largest first; a sign larger than the one before it is an error
(the order is impossible).  More than four of one sign, or two five-signs of
one decade, draw a warning (a well-formed number uses the five-sign).  Damage
as elsewhere: ``[.]`` one lost sign, ``[...]`` an unknown number (read as 0
to 4 signs), ``.`` a sign present but unread, ``[Δ]`` restored, ``<Δ>``
added, ``{Δ}`` superfluous, an underdot or ``?`` doubtful.
"""

from __future__ import annotations

import itertools
import unicodedata
import warnings as _warnings
from collections import Counter
from dataclasses import dataclass
from fractions import Fraction

from lark import Token
from lark.exceptions import UnexpectedCharacters, UnexpectedInput

from ..errors import LimitError, NumcheckSyntaxError, NumcheckWarning
from .grammars import parser_for
from .. import limits
from ..reading import Reading, Slot, Status
from .marks import RAW, join_marked

__all__ = ["NAME", "parse", "format", "render", "SIGN_VALUES", "BAD_EXAMPLES", "GAP_MAX_SIGNS"]

NAME = "attic"

#: Every sign read and its value.
SIGN_VALUES: dict[str, Fraction] = {
    "Ι": Fraction(1), "Π": Fraction(5), "Γ": Fraction(5), "Δ": Fraction(10), "Η": Fraction(100),
    "Χ": Fraction(1000), "Μ": Fraction(10000),
    "\U00010140": Fraction(1, 4), "\U00010141": Fraction(1, 2), "\U00010142": Fraction(1),
    "\U00010143": Fraction(5), "\U00010144": Fraction(50), "\U00010145": Fraction(500),
    "\U00010146": Fraction(5000), "\U00010147": Fraction(50000),
    "I": Fraction(1), "P": Fraction(5), "D": Fraction(10), "H": Fraction(100), "X": Fraction(1000),
    "M": Fraction(10000),
}
_INSIDE = {"Δ": 10, "Η": 100, "Χ": 1000, "Μ": 10000, "D": 10, "H": 100, "X": 1000, "M": 10000}
#: The sign numcheck writes for each value.
CANONICAL: dict[Fraction, str] = {
    Fraction(50000): "\U00010147", Fraction(10000): "Μ", Fraction(5000): "\U00010146",
    Fraction(1000): "Χ", Fraction(500): "\U00010145", Fraction(100): "Η", Fraction(50): "\U00010144",
    Fraction(10): "Δ", Fraction(5): "Π", Fraction(1): "Ι", Fraction(1, 2): "\U00010141",
    Fraction(1, 4): "\U00010140",
}
_WHOLE_VALUES = sorted((v for v in CANONICAL if v >= 1), reverse=True)
#: An unknown number of lost signs ('[...]') is read as 0 to this many signs.
GAP_MAX_SIGNS = 4
_UNDERDOT = "\u0323"
_BRACKET = {Status.LOST: "[", Status.RESTORED: "[", Status.ADDED: "<", Status.SUPERFLUOUS: "{"}

#: Known-bad inputs, the column (1-based) the error points at, and its label.
BAD_EXAMPLES: list[tuple[str, int, str]] = [
    ("ΔΙΔ", 3, "a sign larger than the one before it"),
    ("ΧΑ", 2, "a Greek letter that is not an Attic numeral sign"),
    ("Χδ", 2, "a small Greek letter (Attic numerals are capitals)"),
    ("Χ\U00010148", 2, "an acrophonic sign bound to a unit or a local system"),
    ("ΗΔ5", 3, "a digit among Attic signs (mixed notations)"),
    ("Η[Δ", 2, "a bracket opened and never closed"),
    ("ΗΔ]", 3, "a closing bracket with no opening bracket"),
    ("?Δ", 1, "a doubt mark with no sign before it"),
    ("ΙΙΙΙ[.]", 6, "more lost signs than can stand here"),
]


@dataclass(frozen=True)
class _Sign:
    char: str
    value: Fraction | None      # None for a lost or unread sign
    status: Status
    start: int
    end: int
    doubtful: bool = False
    gap: bool = False


def _fail(text: str, message: str, position: int, expected: str | None = None):
    raise NumcheckSyntaxError(f"Cannot read {text!r} as an Attic numeral: {message}", text, position,
                              expected=expected)


def _classify(ch: str) -> tuple[str, str]:
    name = unicodedata.name(ch, "")
    signs = "Ι Π Δ Η Χ Μ, the signs U+10140-U+10147, or damage marks"
    if "ACROPHONIC" in name:
        return "an acrophonic sign bound to a unit or a local system", "the bare Attic signs: " + signs
    if name.startswith("GREEK SMALL"):
        return "a small Greek letter (Attic numerals are capitals)", "capitals " + signs
    if name.startswith("GREEK"):
        return ("a Greek letter that is not an Attic numeral sign (for the alphabetic numerals "
                "use the notation 'greek')", signs)
    if ch.isdigit():
        return "a digit among Attic signs (mixed notations)", signs
    return "a character that is not an Attic numeral sign", signs


def parse(text: str) -> Reading:
    """Read *text* as an Attic acrophonic numeral.

    >>> parse("Χ𐅅ΗΔΔΙΙ").value
    Fraction(1622, 1)
    """
    text = unicodedata.normalize("NFC", text)
    if not text.strip():
        raise NumcheckSyntaxError("There is no number to read: the input is empty", text, 0,
                                  expected="an Attic numeral such as ΧΗΔΙ")
    try:
        tree = parser_for("attic").parse(text)
    except UnexpectedInput as err:
        if isinstance(err, UnexpectedCharacters):
            label, expected = _classify(text[err.pos_in_stream])
            _fail(text, label, err.pos_in_stream, expected)
        _fail(text, "the number ends too early", len(text), "a sign")
    signs = _signs(text, [t for t in tree.children if isinstance(t, Token)])
    if len(signs) > limits.MAX_PLACES:
        raise LimitError("number of signs", len(signs), limits.MAX_PLACES,
                         "Set numcheck.limits.MAX_PLACES higher to read it.")
    if not any(s.status is not Status.SUPERFLUOUS for s in signs):
        _fail(text, "no sign that counts", signs[0].start if signs else 0,
              "at least one sign outside { }")
    notes: list[str] = []     # plain notes (how '[...]' was bounded)
    oddities: list[str] = []  # tolerable oddities, also given as a NumcheckWarning
    slots = _slots(text, signs, notes, oddities)
    for note in oddities:
        _warnings.warn(note, NumcheckWarning, stacklevel=2)
    return Reading(text=text, notation=NAME, slots=tuple(slots), base=60,
                   warnings=tuple(oddities + notes))


def _signs(text: str, tokens: list[Token]) -> list[_Sign]:
    state = {"lost": None, "added": None, "superfluous": None}
    names = {"LOST": "lost", "ADD": "added", "SUPERFLUOUS": "superfluous"}
    out: list[_Sign] = []
    for tok in tokens:
        t = tok.type
        if t.endswith("_OPEN"):
            name = names[t[:-5]]
            if state[name] is not None:
                _fail(text, "a bracket opened inside the same kind of bracket", tok.start_pos)
            state[name] = tok.start_pos
        elif t.endswith("_CLOSE"):
            name = names[t[:-6]]
            if state[name] is None:
                _fail(text, "a closing bracket with no opening bracket", tok.start_pos, "an opening bracket before it")
            state[name] = None
        elif t in ("DOUBT", "UNDERDOT"):
            if not out or out[-1].gap:
                _fail(text, "a doubt mark with no sign before it", tok.start_pos, "a sign before '?' or the underdot")
            last = out[-1]
            out[-1] = _Sign(last.char, last.value, last.status, last.start, tok.end_pos, True, last.gap)
        else:
            if t == "GAP":
                status = Status.LOST
            elif state["superfluous"] is not None:
                status = Status.SUPERFLUOUS
            elif state["lost"] is not None:
                status = Status.LOST if t in ("DOT", "GAP") else Status.RESTORED
            elif state["added"] is not None:
                status = Status.ADDED
            else:
                status = Status.UNREAD if t == "DOT" else Status.READ
            if t == "GAP" and state["lost"] is not None:
                _fail(text, "'[...]' inside brackets", tok.start_pos, "'[...]' standing alone")
            if t == "COMBINED":
                value = 5 * Fraction(_INSIDE[str(tok)[2]])
            elif t == "SIGN":
                value = SIGN_VALUES[str(tok)]
            else:
                value = None
            out.append(_Sign(str(tok), value, status, tok.start_pos, tok.end_pos, gap=t == "GAP"))
    for name, opened in state.items():
        if opened is not None:
            _fail(text, "a bracket opened and never closed", opened, f"a closing bracket for the {name} part")
    return out


def _decade(v: Fraction) -> tuple[int, bool]:
    """(power of ten, is a five-sign) of a whole sign value."""
    n = int(v)
    five = str(n)[0] == "5"
    return len(str(n)) - 1, five


def _well_formed(values: list[Fraction]) -> bool:
    """Largest first, at most four unit-signs and one five-sign per decade."""
    if any(a < b for a, b in zip(values, values[1:])):
        return False
    counts = Counter(_decade(v) for v in values if v >= 1)
    return all(c <= (1 if five else 4) for (_, five), c in counts.items())


def _slots(text: str, signs: list[_Sign], notes: list[str], oddities: list[str]) -> list[Slot]:
    counted = [s for s in signs if s.status is not Status.SUPERFLUOUS]
    known = [s for s in counted if s.value is not None]
    for a, b in zip(known, known[1:]):
        if a.value < b.value:
            _fail(text, "a sign larger than the one before it", b.start,
                  "the signs largest first (Attic numerals are written in descending order)")
    if known and not _well_formed([s.value for s in known]):
        oddities.append(f"{text!r} repeats a sign more often than a well-formed Attic numeral does "
                     "(four unit-signs and one five-sign per decade); read additively")
    slots: list[Slot] = []
    k = 0
    while k < len(signs):
        s = signs[k]
        if s.value is not None and s.status is not Status.RESTORED:
            status = Status.DOUBTFUL if s.doubtful and s.status is Status.READ else s.status
            start, end = _widen(text, s.start, s.end)
            slots.append(Slot(values=(s.value,), place=0, status=status, text=text[start:end],
                              span=(start, end), form=(((_canon(s.value) + (_UNDERDOT if s.doubtful else "")),
                                                            _BRACKET.get(s.status)),)))
            k += 1
            continue
        j = k
        if s.value is None:
            while j + 1 < len(signs) and signs[j + 1].value is None:
                j += 1
        else:
            # Restored signs side by side are one run: together they must keep
            # the number well formed (each on its own allowed '[ΗΗ𐅅]Δ' = 710,
            # which read itself rejects).
            while j + 1 < len(signs) and signs[j + 1].value is not None and \
                    signs[j + 1].status is Status.RESTORED:
                j += 1
        run = signs[k:j + 1]
        slots.append(_run_slot(text, signs, counted, run, notes))
        k += len(run)
    return slots


def _run_slot(text, signs, counted, run, notes) -> Slot:
    """One slot for a restored sign or a run of lost ones: every sum that keeps the number well formed."""
    before = [s.value for s in counted if s.end <= run[0].start and s.value is not None]
    after = [s.value for s in counted if s.start >= run[-1].end and s.value is not None]
    hi = before[-1] if before else None
    lo = after[0] if after else Fraction(0)
    choices = [v for v in _WHOLE_VALUES if (hi is None or v <= hi) and v >= lo]
    restored = run[0].status is Status.RESTORED
    dots = len(run) if restored else sum(1 for s in run if not s.gap)
    sizes = [dots]
    if any(s.gap for s in run):
        sizes = list(range(dots, dots + GAP_MAX_SIGNS + 1))
        notes.append(f"'[...]' in {text!r} read as {dots} to {dots + GAP_MAX_SIGNS} lost signs "
                     "(numcheck.notations.attic.GAP_MAX_SIGNS)")
    sums: set[Fraction] = set()
    for n in sizes:
        for combo in itertools.combinations_with_replacement(choices, n):
            if _well_formed(before + list(combo) + after):
                sums.add(sum(combo, Fraction(0)))
    editor = sum((s.value for s in run), Fraction(0)) if restored else None
    if editor is not None:
        sums.add(editor)
    if not sums:
        _fail(text, "more lost signs than can stand here", run[0].start,
              "as many lost signs as the neighbours leave room for")
    status = Status.RESTORED if restored else (
        Status.LOST if any(s.status is Status.LOST for s in run) else Status.UNREAD)
    pieces = ((_canon(s.value), "[") if restored else
              ("[...]" if s.gap else ".", "gap" if s.gap else _BRACKET.get(s.status)) for s in run)
    start, end = _widen(text, run[0].start, run[-1].end)
    return Slot(values=tuple(sorted(sums)), place=0, status=status, text=text[start:end],
                span=(start, end), editor=editor, form=tuple(pieces))


def _widen(text: str, start: int, end: int) -> tuple[int, int]:
    """Take in the brackets around a span when they hold it alone (``[.]``, ``<Δ>``)."""
    pairs = {"[": "]", "<": ">", "⟨": "⟩", "{": "}"}
    if start > 0 and end < len(text) and pairs.get(text[start - 1]) == text[end]:
        return start - 1, end + 1
    return start, end


def _canon(value: Fraction) -> str:
    return CANONICAL[value]


def spell(value: Fraction) -> str:
    """The signs of a value, largest first (50 as 𐅄, 500 as 𐅅, ...).

    >>> spell(Fraction(1622))
    'Χ𐅅ΗΔΔΙΙ'
    """
    out = []
    rest = Fraction(value)
    for v in _WHOLE_VALUES + [Fraction(1, 2), Fraction(1, 4)]:
        while rest >= v:
            out.append(CANONICAL[v])
            rest -= v
    if rest:
        raise ValueError(f"{value} cannot be written in Attic signs")
    return "".join(out)


def format(reading: Reading, choice: tuple[Fraction, ...] | None = None) -> str:
    """Write *reading* back in Attic signs; with *choice*, restored signs in brackets."""
    pieces: list[tuple[str, str | None]] = []
    for i, slot in enumerate(reading.slots):
        value = choice[i] if choice is not None else None
        form = slot.form or ((".", "["),)
        if value is not None and (len(slot.values) > 1 or slot.status in (Status.LOST, Status.UNREAD)):
            bracket = None if slot.status is Status.UNREAD else "["
            pieces += [(ch, bracket) for ch in spell(value)]
        else:
            pieces += list(form)
    # '[...]' carries its own brackets.
    return join_marked([(p, RAW if b == "gap" else b) for p, b in pieces])


def render(reading: Reading, choice: tuple[Fraction, ...]) -> str:
    """Write one reading of a damaged number, restored signs in brackets."""
    return format(reading, choice)
