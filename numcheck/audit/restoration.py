"""Restore damaged cells from the scheme of their column, through the restore engine.

The value the scheme gives a damaged line (computed on from the scribe's own
previous line, so that a carried slip is kept as the scribe would have written
it) is handed to :func:`numcheck.restore.restore` as exact context evidence;
the engine weighs it against the traces and returns ranked readings with
probabilities.  In a zigzag column the trailing places of every line of one
monotone run agree modulo d (schemes-and-slips.md §1.1, item 4): the reason
says so when it applies.  These are suggestions for the editor.
"""

from __future__ import annotations

from dataclasses import dataclass, field
from fractions import Fraction

from ..reading import exact_text
from .diagnose import Pending
from .schemes import Frame
from ..tables import Table, sign_index

__all__ = ["Restoration", "restore_cells"]

#: How strongly the exact scheme value counts against "none of these"
#: (restore's own evidence weights are 1 for an ordinary hint).
SCHEME_WEIGHT = 20.0


@dataclass
class Restoration:
    """One proposed reading of a damaged cell."""

    index: int
    column: str
    text: str
    value: Fraction
    probability: float
    reasons: list[str] = field(default_factory=list)
    expected: str = ""

    def to_dict(self) -> dict:
        return {"row": self.index + 1, "column": self.column, "text": self.text,
                "value": exact_text(self.value), "probability": round(self.probability, 6),
                "reasons": list(self.reasons), "expected": self.expected}


def restore_cells(table: Table, frame: Frame, pending: list[Pending], top: int = 3):
    """Candidates for every damaged cell; cells no reading of the traces fits come back apart."""
    out: list[Restoration] = []
    misfits: list[tuple[Pending, str]] = []
    for p in pending:
        cell = table.columns[p.column].cells[p.index]
        due = frame.fraction(p.expected)
        offset = 30 * sign_index(cell.sign_name) if cell.sign_name else 0
        if cell.sign_name:
            due = (due - offset) % 360
        expected_text = table.columns[p.column].write(p.index, frame.fraction(p.expected))
        reason = f"the {p.scheme.kind} scheme of column {p.column} ({expected_text} here)"
        # a computed function is known only to the table's precision (audit/functions)
        tol = getattr(p.scheme, "restore_tolerance", Fraction(0))
        free = cell.floating or p.scheme.kind == "reciprocal"
        if free and cell.reading is not None:
            # a floating value (an igi) is due at every magnitude the traces allow
            cands = []
            for at in _magnitudes(due, cell.reading):
                cands.extend(c for c in _candidates(cell, at, reason, top)
                             if c[0] not in {x[0] for x in cands})
            if not cands:
                cands = _candidates(cell, due, reason, top)
        else:
            cands = _candidates(cell, due, reason, top, tol)
        fitting = [c for c in cands if abs(c[1] - due) <= tol or (free and _same_digits(c[1], due))]
        if not fitting:
            misfits.append((p, expected_text))
            continue
        for text, value, prob, reasons in cands:
            shown = f"{text} {cell.sign_name}" if cell.sign_name else text
            extra = p.notes if abs(value - due) <= tol else []
            out.append(Restoration(p.index, p.column, shown, value + offset, prob,
                                   list(reasons) + extra, expected_text))
    return out, misfits


def _magnitudes(due: Fraction, reading) -> list[Fraction]:
    """*due* times every power of 60 that falls inside the values the traces allow."""
    out = []
    if due is None or due == 0 or reading.min is None or reading.max is None:
        return out
    for k in range(-12, 13):
        v = due * Fraction(60) ** k
        if reading.min <= v <= reading.max:
            out.append(v)
    return out


def _same_digits(a: Fraction, b: Fraction) -> bool:
    from ..placevalue import mantissa
    return mantissa(a) == mantissa(b)


def _candidates(cell, due: Fraction, reason: str, top: int, tolerance=Fraction(0)):
    reading = cell.reading
    if reading is None:
        return []
    try:
        from ..restore import Evidence, restore
    except ImportError:
        return _direct(reading, due, reason)
    try:
        result = restore(reading, context=[Evidence(value=due, tolerance=tolerance,
                                                    weight=SCHEME_WEIGHT, label=reason)],
                         use_catalogue=False, top=top)
    except Exception:
        return _direct(reading, due, reason)
    # A floating reading comes back once per magnitude; the text is one reading.
    # Values are given at the reading's own scale (a floating number at the
    # scale of its last place, as numcheck.read gives it).
    merged: dict[str, list] = {}
    for c in result.candidates:
        value = c.value / Fraction(60) ** c.scale if reading.floating else c.value
        if c.text in merged:
            merged[c.text][2] += c.probability
        else:
            merged[c.text] = [c.text, value, c.probability, c.reasons]
    return [tuple(v) for v in merged.values()]


def _direct(reading, due: Fraction, reason: str):
    """Without the restore engine: the readings of the traces that equal the value due."""
    from ..limits import AUDIT_MAX_CELL_READINGS
    from ..notations import render_choice
    if reading.count > AUDIT_MAX_CELL_READINGS:
        return []
    for expansion, choice in reading.choices():
        value = expansion.value_of(choice)
        if value == due or (reading.floating and _same_digits(value, due)):
            return [(render_choice(expansion, choice), value, 1.0, [reason])]
    return []
