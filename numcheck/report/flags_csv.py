"""The flags of an audit as CSV, one flagged cell per line."""

from __future__ import annotations

import csv
import io

from ._common import write_output

__all__ = ["flags_csv_text", "write_flags_csv"]

FIELDS = ("row", "column", "written", "expected", "kind", "reason", "written_value",
          "expected_value", "carried_from_column", "carried_from_row", "carried_into")


def flags_csv_text(result) -> str:
    """The flags as CSV text with a header (exact values as ``"n/d"`` strings)."""
    out = io.StringIO()
    w = csv.writer(out, lineterminator="\n")
    w.writerow(FIELDS)
    for f in result.flags:
        src = f.get("carried_from") or {}
        w.writerow([f["row"], f["column"], f["written"], f["expected"], f["kind"], f["reason"],
                    f["written_value"], f["expected_value"], src.get("column", ""),
                    src.get("row", ""), " ".join(str(k) for k in f.get("carried_into", []))])
    return out.getvalue()


def write_flags_csv(result, path):
    """Write the flags to *path* (``.csv``) atomically; returns the path."""
    return write_output(result, path, flags_csv_text(result), (".csv",), "flags file")
