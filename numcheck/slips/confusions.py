"""Known scribal confusions between numeral signs, and what a value may have been meant as.

The facts live in ``numcheck/data/confusions.csv`` (one row per confusion,
with its mechanism, source and confidence; see the reference notes
numeral-confusions.csv and schemes-and-slips.md §2).  This module turns them
into *alternatives*: for a written value, the values the scribe may have
meant, each with a prior weight and a plain reason.  The restore and audit
code ask it; the parser never does (it reads what is written).

Weights are the confidence of the source turned into a number (high 1.0,
medium-high 0.8, medium 0.6, low-medium 0.4, low 0.25).  They are *not*
frequencies: no published frequencies of these slips exist
(schemes-and-slips.md §2.2), so the priors stay this flat on purpose.
"""

from __future__ import annotations

import csv
import functools
from dataclasses import dataclass
from fractions import Fraction
from importlib import resources

from ..errors import UnknownNameError

__all__ = ["Alternative", "Confusion", "alternatives", "letter_confusion", "confusion_table",
           "NOTATIONS_WITH_CONFUSIONS"]

#: The notations that have confusion data, and the data rows each one uses.
NOTATIONS_WITH_CONFUSIONS = ("sexagesimal", "cuneiform", "greek", "abjad", "abjad-maghribi",
                             "roman", "decimal")

#: Notations that share another's confusion data.
_ALIASES = {"greek-ascending": "greek", "greek-astronomical": "greek", "greek-documentary": "greek",
            "atf": "cuneiform", "atf-math": "cuneiform"}

#: Sexagesimal values are searched for confusions down to this many fractional places.
_MAX_FRACTION_PLACES = 8


@dataclass(frozen=True)
class Alternative:
    """A value the scribe may have meant instead of the one written."""

    value: Fraction      # what the scribe may have meant instead
    weight: float        # relative prior weight (0..1], 1 = very common slip
    reason: str          # short plain-language reason


@dataclass(frozen=True)
class Confusion:
    """One row of confusions.csv."""

    notation: str
    script: str
    written: str
    confused_with: str
    value_written: Fraction | None
    value_confused: Fraction | None
    mechanism: str
    weight: float
    source: str
    confidence: str
    rule: str
    kind: str
    symmetric: bool


@functools.cache
def confusion_table() -> tuple[Confusion, ...]:
    """Every row of ``numcheck/data/confusions.csv``, read once."""
    text = resources.files("numcheck").joinpath("data/confusions.csv").read_text(encoding="utf-8")
    rows = []
    for row in csv.DictReader(text.splitlines()):
        rows.append(Confusion(
            notation=row["notation"], script=row["script"], written=row["written"],
            confused_with=row["confused_with"],
            value_written=Fraction(row["value_written"]) if row["value_written"] else None,
            value_confused=Fraction(row["value_confused"]) if row["value_confused"] else None,
            mechanism=row["mechanism"], weight=float(row["weight"]), source=row["source"],
            confidence=row["confidence"], rule=row["rule"], kind=row["kind"],
            symmetric=row["symmetric"] == "yes"))
    return tuple(rows)


def _rows(notation: str, rule: str | None = None) -> list[Confusion]:
    return [r for r in confusion_table() if r.notation == notation and (rule is None or r.rule == rule)]


def _pairs(notation: str, rules: tuple[str, ...] = ("",)) -> dict[Fraction, list[tuple[Fraction, Confusion]]]:
    """value written -> [(value meant, row)] for the pair rows of a notation."""
    out: dict[Fraction, list[tuple[Fraction, Confusion]]] = {}
    for r in _rows(notation):
        if r.rule not in rules or r.value_written is None or r.value_confused is None:
            continue
        out.setdefault(r.value_written, []).append((r.value_confused, r))
        if r.symmetric:
            out.setdefault(r.value_confused, []).append((r.value_written, r))
    return out


def alternatives(notation: str, value: int | Fraction, *, place_max: int | None = None,
                 place: int | None = None) -> list[Alternative]:
    """The values a scribe may have meant where *value* is written, best first.

    *notation* is a notation name; one with no confusion data (``attic``)
    gives no alternatives, a name numcheck does not know is an error.
    *value* is what is written in one slot or place (in units of that place)
    or a whole number; *place* is the exponent of 60 of that place when known
    (a unit-fraction tick only makes sense in the units place, place 0).
    Alternatives below 0 or above *place_max* are dropped (an editor would
    see at once that a minute cannot be 70).

    >>> [a.value for a in alternatives("cuneiform", 21, place_max=59)]
    [Fraction(22, 1), Fraction(20, 1), Fraction(31, 1), Fraction(11, 1)]
    >>> alternatives("greek", 5)[0].reason
    'Є (5) written for Θ (9): round letters; a closed epsilon reads as theta (bterry.com outline of copying errors)'
    """
    notation = _ALIASES.get(notation, notation)
    if notation not in NOTATIONS_WITH_CONFUSIONS:
        from ..notations import NOTATIONS
        if notation in NOTATIONS:
            return []   # a notation we have no confusion data for (Attic, quantities)
        raise UnknownNameError("notation", notation, set(NOTATIONS) | set(NOTATIONS_WITH_CONFUSIONS))
    value = Fraction(value)
    if value < 0:
        return []
    found: list[Alternative]
    if notation in ("sexagesimal", "cuneiform"):
        found = _wedges(notation, value)
    elif notation == "greek":
        found = _greek(value, place)
    elif notation in ("abjad", "abjad-maghribi"):
        found = _letters(notation, value)
    elif notation == "roman":
        found = _roman(value)
    else:
        found = _digits(value)
    best: dict[Fraction, Alternative] = {}
    for alt in found:
        if alt.value == value or alt.value < 0 or (place_max is not None and alt.value > place_max):
            continue
        if alt.value not in best or alt.weight > best[alt.value].weight:
            best[alt.value] = alt
    return sorted(best.values(), key=lambda a: -a.weight)


def letter_confusion(notation: str, written: int | Fraction, expected: int | Fraction) -> Alternative | None:
    """Whether *written* where *expected* was due is a known confusion (for audits).

    >>> letter_confusion("abjad", 2, 10).reason
    'ب (2) written for ي (10): same tooth when joined (initial/medial forms), different dots (letter shapes (Unicode Joining_Group, ArabicShaping.txt))'
    >>> letter_confusion("greek", 5, 6) is None
    True
    """
    for alt in alternatives(notation, written):
        if alt.value == Fraction(expected):
            return alt
    return None


# -- sexagesimal and cuneiform: counts of wedges ----------------------------

def _place_name(k: int, many: bool) -> str:
    if not many:
        return ""
    if k == 0:
        return " of the units place"
    return f" of the place 60^{k}"


def _wedges(notation: str, value: Fraction) -> list[Alternative]:
    # Work on an integer in units of the lowest place written.
    shift = 0
    while value.denominator != 1:
        value *= 60
        shift += 1
        if shift > _MAX_FRACTION_PLACES:
            return []
    n = int(value)
    digits = []
    m = n
    while True:
        m, d = divmod(m, 60)
        digits.append(d)
        if not m:
            break
    unit = _rows(notation, "unit-wedge")[0]
    ten = _rows(notation, "ten-corner")[0]
    similar = _pairs(notation, ("similar-sign",))
    many = len(digits) > 1 or shift > 0
    out = []
    scale = Fraction(1, 60**shift)
    for k, d in enumerate(digits):
        weight = 60**k
        where = _place_name(k - shift, many)
        units, tens = d % 10, d // 10
        if units < 9:
            out.append(Alternative((n + weight) * scale, unit.weight, f"one unit wedge more{where} ({_cite(unit)})"))
        if units > 0:
            out.append(Alternative((n - weight) * scale, unit.weight, f"one unit wedge fewer{where} ({_cite(unit)})"))
        if tens < 5:
            out.append(Alternative((n + 10 * weight) * scale, ten.weight, f"one ten-corner more{where} ({_cite(ten)})"))
        if tens > 0:
            out.append(Alternative((n - 10 * weight) * scale, ten.weight, f"one ten-corner fewer{where} ({_cite(ten)})"))
        for part, size in ((units, 1), (tens * 10, 10)):
            for meant, row in similar.get(Fraction(part), []) if part else []:
                new = n + (int(meant) - part) * weight
                out.append(Alternative(new * scale, row.weight,
                                       f"{part} and {int(meant)} written alike{where} ({_cite(row)})"))
    return out


# -- letters: Greek and abjad ------------------------------------------------

def _descending(parts: list[tuple[int, int, int]]) -> bool:
    exps = [e for e, _, _ in parts]
    return all(a > b for a, b in zip(exps, exps[1:]))


def _swap_letters(parts: list[tuple[int, int, int]], pairs, name) -> list[Alternative]:
    from ..notations.greek.letters import exponent
    value = sum(letter * mult for _, letter, mult in parts)
    out = []
    for i, (e, letter, mult) in enumerate(parts):
        for meant, row in pairs.get(Fraction(letter), []):
            meant = int(meant)
            if exponent(mult) % 4 == 3 and meant >= 10:
                continue  # only units letters take the thousands sign
            new_parts = list(parts)
            new_parts[i] = (exponent(meant) + exponent(mult), meant, mult)
            if not _descending(new_parts):
                continue  # the letter meant would not stand in that position
            new = value + (meant - letter) * mult
            out.append(Alternative(Fraction(new), row.weight,
                                   f"{name(row, letter)} ({letter}) written for {name(row, meant)} ({meant}): "
                                   f"{row.mechanism} ({_cite(row)})"))
    return out


def _cite(row: Confusion) -> str:
    """A short form of a row's source for a reason string."""
    low = row.source.lower()
    if low.startswith("common practice"):
        return "common practice"
    if low.startswith("from memory"):
        return "from memory"
    return row.source.split(";")[0].strip()


def _row_name(row: Confusion, letter: int) -> str:
    if row.value_written == letter:
        return row.written
    return row.confused_with


def _greek(value: Fraction, place: int | None) -> list[Alternative]:
    out: list[Alternative] = []
    if value.denominator == 1 and value >= 1:
        from ..notations.greek.letters import spell_parts
        out += _swap_letters(spell_parts(int(value)), _pairs("greek"), _row_name)
    if place in (None, 0):
        for row in _rows("greek", "tick"):
            frac, whole = row.value_written, row.value_confused
            if value == frac:
                out.append(Alternative(whole, row.weight, f"{row.written} ({frac}) written for {row.confused_with} "
                                                          f"({whole}): {row.mechanism} ({_cite(row)})"))
            elif value == whole:
                out.append(Alternative(frac, row.weight, f"{row.confused_with} ({whole}) written for {row.written} "
                                                         f"({frac}): {row.mechanism} ({_cite(row)})"))
    return out


def _letters(notation: str, value: Fraction) -> list[Alternative]:
    if value.denominator != 1 or value < 1 or value >= 2000:
        return []
    from ..notations.greek.letters import spell_parts
    n = int(value)
    # Abjad writes 1000 with a letter of its own (ghayn, or shin in the west).
    parts = [(3, 1000, 1)] if n >= 1000 else []
    parts += spell_parts(n % 1000)
    return _swap_letters(parts, _pairs(notation), _row_name)


# -- Roman minims and early Hindu-Arabic digits -----------------------------

def _roman(value: Fraction) -> list[Alternative]:
    if value.denominator != 1 or value < 1:
        return []
    n = int(value)
    units, tens = n % 10, (n // 10) % 10
    rows = {r.written: r for r in _rows("roman")}
    out = []
    count, u, order, ix = rows["iii"], rows["u"], rows["iu"], rows["ix"]
    if units in (1, 2, 3, 6, 7, 8):
        out.append(Alternative(Fraction(n - 1), count.weight, f"one minim (i) fewer: {count.mechanism} ({_cite(count)})"))
        out.append(Alternative(Fraction(n + 1), count.weight, f"one minim (i) more: {count.mechanism} ({_cite(count)})"))
    if units in (5, 6, 7, 8):
        out.append(Alternative(Fraction(n - 3), u.weight, f"u (5) written for ii (2): {u.mechanism} ({_cite(u)})"))
    if units in (2, 3):
        out.append(Alternative(Fraction(n + 3), u.weight, f"ii (2) written for u (5): {u.mechanism} ({_cite(u)})"))
    if units == 4:
        out.append(Alternative(Fraction(n + 2), order.weight, f"iu (4) written for ui (6): {order.mechanism} ({_cite(order)})"))
    if units == 6:
        out.append(Alternative(Fraction(n - 2), order.weight, f"ui (6) written for iu (4): {order.mechanism} ({_cite(order)})"))
    if units == 9:
        out.append(Alternative(Fraction(n + 2), ix.weight, f"ix (9) written for xi (11): {ix.mechanism} ({_cite(ix)})"))
    if units == 1 and tens:
        out.append(Alternative(Fraction(n - 2), ix.weight, f"xi (11) written for ix (9): {ix.mechanism} ({_cite(ix)})"))
    return out


def _digits(value: Fraction) -> list[Alternative]:
    if value.denominator != 1:
        return []
    text = str(int(value))
    pairs = _pairs("decimal", ("digit",))
    out = []
    for i, ch in enumerate(text):
        for meant, row in pairs.get(Fraction(int(ch)), []):
            new = text[:i] + str(int(meant)) + text[i + 1:]
            out.append(Alternative(Fraction(int(new)), row.weight,
                                   f"{ch} written for {int(meant)}: {row.mechanism} ({_cite(row)})"))
    return out
