"""A number written with unit words (``2/3(disz) sila3 5(disz) gin2``): one quantity in the finest unit.

Each run of numerals before a unit word is read as the notation reads a
number (count, place value or math style); its slots are scaled to the
finest unit written (``numcheck/data/atf_units.csv``: 1 sila3 = 60 gin2) and
the runs add up, or subtract after ``la2`` (``1(disz) gin2 la2
igi-6(disz)-gal2`` = 5/6 gin2).  Units of two systems in one number are an
error.  Each slot keeps its own form inside a ``("scaled", factor, form,
unit text)`` wrapper, so the writer can put the unit words back.
"""

from __future__ import annotations

from dataclasses import replace
from ...reading import Reading, Slot
from .pieces import Atom, syntax_error
from .signs import UnitWord, sign_key, unit_systems, unit_word

__all__ = ["unit_positions", "build_quantity", "merge_unit_words"]

_NOT_UNITS = {"la2", "lal", "me", "lim", "x", "n", "igi", "gal2", "gal", "u"}


def _unit(a: Atom) -> UnitWord | None:
    if a.kind != "word" or a.joined in ("-", ".") or sign_key(a.text) in _NOT_UNITS:
        return None
    return unit_word(a.text)


def merge_unit_words(pieces: list[Atom]) -> list[Atom]:
    """Join the parts of a unit word written with hyphens (``ma-na``, ``szu-si``) into one piece."""
    out: list[Atom] = []
    k = 0
    while k < len(pieces):
        a = pieces[k]
        if a.kind == "word" and a.joined not in ("-", "."):
            j = k + 1
            while j < len(pieces) and pieces[j].kind == "word" and pieces[j].joined == "-":
                j += 1
            if j > k + 1:
                word = "-".join(p.text for p in pieces[k:j])
                if unit_word(word) is not None:
                    out.append(Atom("word", word, a.start, pieces[j - 1].end, a.status,
                                    pieces[j - 1].flags, a.joined))
                    k = j
                    continue
        out.append(a)
        k += 1
    return out


def unit_positions(pieces: list[Atom]) -> list[int]:
    """Where the unit words stand among the pieces."""
    return [k for k, a in enumerate(pieces) if _unit(a) is not None]


def build_quantity(text: str, pieces: list[Atom], read_run, notation: str) -> Reading:
    """One Reading of a quantity in several units; *read_run(pieces)* reads one run of numerals."""
    runs: list[tuple[list[Atom], UnitWord | None, str, int]] = []   # pieces, unit, unit text, sign
    current: list[Atom] = []
    sign = 1
    k = 0
    while k < len(pieces):
        a = pieces[k]
        unit = _unit(a)
        if unit is None:
            current.append(a)
            k += 1
            continue
        words = [a]
        # 'sze gur': barley counted in gur; the first word is the commodity
        while k + 1 < len(pieces) and _unit(pieces[k + 1]) is not None:
            k += 1
            words.append(pieces[k])
            unit = _unit(pieces[k])
        if not current:
            raise syntax_error(text, a.start, f"a unit word ({a.text}) with no number before it",
                               "a number before each unit word, as in 2/3(disz) sila3 5(disz) gin2")
        label = " ".join(w.text + w.flags for w in words)
        next_sign = 1
        if k + 1 < len(pieces) and pieces[k + 1].kind == "word" and sign_key(pieces[k + 1].text) in ("la2", "lal"):
            k += 1
            label += " " + pieces[k].text + pieces[k].flags
            next_sign = -1
        runs.append((current, unit, label, sign))
        current, sign = [], next_sign
        k += 1
    if current:
        if sign > 0:
            raise syntax_error(text, current[0].start, "a number with no unit word after it, after "
                               "a quantity (two numbers?)", "a unit word after each number, or "
                               "la2 before a number subtracted in the unit before it")
        runs.append((current, None, "", sign))
    # one system for every unit word (gin2 is capacity or weight: the others decide)
    possible = None
    for _p, u, label, _s in runs:
        if u is not None:
            found = {x.system for x in unit_systems(u.name)}
            possible = found if possible is None else possible & found
    if not possible:
        systems = sorted({u.system for _p, u, _l, _s in runs if u is not None})
        raise syntax_error(text, 0, f"units of more than one system ({', '.join(systems)})",
                           "the units of one metrological system in one number")
    system = next(u.system for _p, u, _l, _s in runs if u is not None and u.system in possible)
    runs = [(p, None if u is None else unit_word(u.name, system), label, sg) for p, u, label, sg in runs]
    units = [u for _p, u, _l, _s in runs if u is not None]
    finest = min(units, key=lambda u: u.in_base)
    slots: list[Slot] = []
    warnings: list[str] = []
    last_unit = None
    for run, unit, label, sign in runs:
        reading = read_run(run)
        unit = unit or last_unit      # 'a gin2 la2 b': b in the unit of a
        if unit is None:
            raise syntax_error(text, run[0].start, "a number with no unit after it in a quantity",
                               "a unit word after each number")
        last_unit = unit
        if reading.unit is not None and reading.unit != unit.name:
            raise syntax_error(text, run[0].start, f"{label} after a number counted in "
                               f"{reading.unit} (the signs fix the unit)",
                               f"{reading.unit} or no unit word after it")
        factor = unit.in_base / finest.in_base
        warnings += reading.warnings
        run_slots = list(reading.slots)
        for j, s in enumerate(run_slots):
            values = tuple(sorted(sign * v * factor for v in s.values))
            editor = None if s.editor is None else sign * s.editor * factor
            tail = label if j == len(run_slots) - 1 else ""
            run_slots[j] = replace(s, values=values, editor=editor,
                                   form=("scaled", sign * factor, s.form, tail))
        slots += run_slots
    return Reading(text=text, notation=notation, slots=tuple(slots), base=60, floating=False,
                   unit=finest.name, warnings=tuple(warnings))

