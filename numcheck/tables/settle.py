"""A column read as a whole: its other cells decide the cells whose text allows two readings.

A cell may be read clearly and still mean two things: a Greek ``ο`` in the
whole-number place is 0 or 70 (the zero as digital texts of Greek tables type
it, or seventy), a lone capital letter of a papyrus is units or thousands.
Alone the cell cannot decide; its column can.  Three rules, tried in order,
each on the readings the cell allows:

1. every other cell of the column is below 60 (a column of minutes, of
   degrees within a sign, of small differences): a reading of 60 or more is
   ruled out;
2. the other cells span lo..hi, and no two neighbours differ by more than
   *step*: a reading outside lo - step .. hi + step is ruled out;
3. the nearest cells above and below: a reading between them, or at least
   four times nearer to them than the other readings, is taken.

A cell the rules leave open stays open (its value None, like a damaged
cell), so that the audit restores it from the column's scheme.  Each
decision is said in a note naming the row, the column and the reason.
"""

from __future__ import annotations

from dataclasses import replace
from fractions import Fraction

from .. import limits
from ..reading import Reading, sexagesimal_text

__all__ = ["settle_column"]

_DECISIVE = 4


def _fmt(value: Fraction) -> str:
    return sexagesimal_text(value, fixed=True, max_places=6)


def settle_column(column, source: str, make_cell) -> list[str]:
    """Decide the ambiguous cells of *column* from its other cells, in place; the notes.

    *make_cell(cell, reading)* rebuilds a cell from a narrowed Reading (the
    table reader's own constructor, so the cell keeps every other field).
    """
    cells = column.cells
    # only a cell kept whole has a Reading (numcheck.tables.cells.Cells)
    open_cells = [k for k, c in cells.kept()
                  if c.value is None and c.reading is not None and c.reading.ambiguous
                  and not c.reading.damaged and c.reading.count <= limits.SETTLE_MAX_READINGS]
    if not open_cells:
        return []
    known = [(k, v) for k, v in enumerate(cells.values()) if v is not None]
    if not known:
        return []
    values = [v for _, v in known]
    lo, hi = min(values), max(values)
    steps = [abs(b - a) for (_, a), (_, b) in zip(known, known[1:])]
    step = max(steps) if steps else Fraction(0)
    notes = []
    for k in open_cells:
        cell = cells[k]
        offset = _offset(cell)
        cands = sorted({v + offset for v in cell.reading.readings()})
        chosen, why = _decide(cands, k, known, lo, hi, step)
        if chosen is None:
            continue
        narrowed = _narrow(cell.reading, chosen - offset)
        if narrowed is None:
            continue
        cells[k] = make_cell(cell, narrowed)
        others = ", ".join(_fmt(c) for c in cands if c != chosen)
        notes.append(f"row {cell.row}, column {column.name!r} of {source}: {cell.text!r} read as "
                     f"{_fmt(chosen)}, not {others}: {why}")
    return notes


def _offset(cell) -> Fraction:
    # A longitude within a named sign: the readings are degrees within the sign.
    if cell.sign_name is None:
        return Fraction(0)
    from .cells import sign_index
    return Fraction(30 * sign_index(cell.sign_name))


def _decide(cands, k, known, lo, hi, step):
    left = cands
    if hi < 60:
        kept = [c for c in left if c < 60]
        if len(kept) == 1:
            return kept[0], "every other cell of the column is below 60"
        left = kept or left
    kept = [c for c in left if lo - step <= c <= hi + step]
    if len(kept) == 1:
        return kept[0], (f"the other cells of the column lie between {_fmt(lo)} and {_fmt(hi)}, "
                         f"neighbours at most {_fmt(step)} apart")
    left = kept or left
    above = next((v for j, v in reversed(known) if j < k), None)
    below = next((v for j, v in known if j > k), None)
    near = [v for v in (above, below) if v is not None]
    if not near or len(left) < 2:
        return None, ""

    def distance(c):
        if above is not None and below is not None and min(above, below) <= c <= max(above, below):
            return Fraction(0)
        return min(abs(c - v) for v in near)

    ranked = sorted(left, key=distance)
    best, second = distance(ranked[0]), distance(ranked[1])
    if best * _DECISIVE < second or (best == 0 and second > 0):
        where = " and ".join(f"{_fmt(v)} {side}" for v, side in ((above, "above"), (below, "below"))
                             if v is not None)
        return ranked[0], f"it fits its neighbours ({where})"
    return None, ""


def _narrow(reading: Reading, value: Fraction) -> Reading | None:
    """The reading with its open slots fixed to the choice that gives *value*."""
    for expansion, combo in reading.choices():
        if expansion.value_of(combo) == value:
            slots = tuple(replace(s, values=(v,)) if len(s.values) > 1 and s.counted else s
                          for s, v in zip(expansion.slots, combo))
            return replace(reading, slots=slots)
    return None
