"""The result of an audit: the schemes found, the flagged cells, the restorations."""

from __future__ import annotations

from dataclasses import dataclass, field

from ..reading import exact_text
from .diagnose import Finding
from .restoration import Restoration
from .schemes import Frame, Scheme
from ..tables import Table

__all__ = ["AuditResult", "SUGGESTION"]

#: Said wherever diagnoses and restorations are shown.
SUGGESTION = ("Diagnoses and restorations are suggestions for the editor's judgement, not "
              "readings: each fits the scheme found, and the scheme itself is an inference.")


@dataclass
class AuditResult:
    """Schemes, flags and restorations of one table (``to_dict`` gives the JSON of DESIGN.md)."""

    table: Table
    frame: Frame
    schemes: list[Scheme]
    findings: list[Finding]
    restorations: list[Restoration]
    unchecked: list[str] = field(default_factory=list)
    true: dict = field(default_factory=dict)

    @property
    def source(self) -> str:
        return self.table.source

    @property
    def flags(self) -> list[dict]:
        return [self._flag(f) for f in self.findings]

    @property
    def slips(self) -> list[dict]:
        """The flags that are slips of their own (not lines that inherit one, nor missing lines)."""
        return [f for f in self.flags if f["kind"] not in ("carried-forward", "lines-missing")]

    def _flag(self, f: Finding) -> dict:
        cell = self.table.columns[f.column].cells[f.index]
        fr = self.frame.fraction
        expected = fr(f.expected)
        out = {
            "row": f.index + 1,
            "column": f.column,
            "written": cell.text,
            # no expected value is offered where the scheme gives none a scribe could write
            "expected": self.table.columns[f.column].write(f.index, expected)
            if expected is not None else "",
            "kind": f.kind,
            "reason": f.reason,
            "written_value": exact_text(fr(f.written)) if f.written is not None else "",
            "expected_value": exact_text(expected) if expected is not None else "",
        }
        if f.carried_into:
            # rows of this column, and of other columns computed from it
            same = sorted(k + 1 for c, k in f.carried_into if c == f.column)
            if same:
                out["carried_into"] = same
            others: dict[str, list[int]] = {}
            for c, k in sorted(f.carried_into):
                if c != f.column:
                    others.setdefault(c, []).append(k + 1)
            if others:
                out["carried_into_columns"] = others
        if f.carried_from is not None:
            out["carried_from"] = {"column": f.carried_from[0], "row": f.carried_from[1] + 1}
        if f.notes:
            out["notes"] = list(f.notes)
        return out

    @property
    def numbers(self) -> int:
        """How many cells the audit read (damaged ones included)."""
        return sum(len(c.cells) for c in self.table.columns.values())

    def summary(self) -> dict:
        """Counts for a one-line account of the audit."""
        flags = self.flags
        checked = {s.column for s in self.schemes}
        return {
            "cells": self.numbers,
            "checked": sum(len(c.cells) for n, c in self.table.columns.items() if n in checked),
            "slips": sum(1 for f in flags if f["kind"] not in ("carried-forward", "lines-missing")),
            "lines_missing": sum(1 for f in flags if f["kind"] == "lines-missing"),
            "carried_forward": sum(1 for f in flags if f["kind"] == "carried-forward"),
            # a plain cell (not kept whole) always has its value
            "damaged": sum(1 for c in self.table.columns.values() for _, x in c.cells.kept()
                           if x.damaged),
            "restored": len({(r.index, r.column) for r in self.restorations}),
        }

    def to_dict(self) -> dict:
        return {
            "source": self.source,
            "rows": self.table.nrows,
            "columns": list(self.table.columns),
            "summary": self.summary(),
            "schemes": [s.to_dict() for s in self.schemes],
            "flags": self.flags,
            "restorations": [r.to_dict() for r in self.restorations],
            "unchecked": list(self.unchecked),
            # Cells that cannot be read (row, column, text, message): the audit
            # went on without them, as if they were lost.
            "unreadable": self.table.unreadable,
            "left_out": [{"column": k, "message": v} for k, v in self.table.left_out.items()],
            "table_notes": list(getattr(self.table, "notes", [])),
            "note": SUGGESTION,
        }
