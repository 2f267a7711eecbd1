"""The audit on the terminal: schemes, the table with flagged cells marked, the flags and restorations.

Compact by default (at 80 columns): the reasons go below the tables as
numbered notes, a long table shows only the lines around its marks, and a
damaged cell shows its best restoration with the others summed up in one
line.  ``full=True`` (``numcheck audit --full``) shows every line and every
restoration with its reasons.  Flagged cells are coloured on a terminal and
marked with a sign everywhere (the marks survive a pipe); a key says which.
"""

from __future__ import annotations

from ._common import (KEY, cell_marks, key_of, nothing_checked, numbering_columns, rows_to_show,
                      summary_line)

__all__ = ["show"]

#: The terminal shows a table this short whole (longer: the lines around the marks).
TERMINAL_ALL_ROWS = 20


def show(result, console, full: bool = False) -> None:
    """Print the audit to a rich console."""
    from .layout import Sheet, note

    d = result.to_dict()
    note(console, f"numcheck audit {d['source']}: {d['rows']} rows, columns {', '.join(d['columns'])}",
         "bold")
    schemes = Sheet(console, [("column", "key"), ("kind", "key"), ("scheme", "text"), ("fit", "number")],
                    title="schemes")
    for s in d["schemes"]:
        schemes.row(s["column"], s["kind"], s["description"], f"{s['support']:.1%}")
    for name in d["unchecked"]:
        schemes.row(name, "-", "no scheme found: not checked", "")
    schemes.print()
    _cells(result, d, console, full)
    if d["flags"]:
        _flags(d, console)
    elif nothing_checked(d):
        note(console, "No column follows a scheme numcheck knows: nothing was checked. "
                      "State a relation with --relation to check one.", "yellow")
    else:
        note(console, "No cell breaks its scheme.", "green")
    if d["restorations"]:
        _restorations(d, console, full)
    note(console, summary_line(d))
    note(console, d["note"], "dim")


def _mark(kind: str | None) -> str:
    k = key_of(kind)
    return f" {k[2]}" if k else ""


def _style(kind: str | None) -> str | None:
    k = key_of(kind)
    return k[1] if k else None


def _cells(result, d, console, full: bool) -> None:
    """The table itself, marked cells coloured and signed (only the lines around marks of a long table)."""
    from .layout import Sheet, note

    marks = cell_marks(d)
    nrows = result.table.nrows
    if full:
        rows = list(range(1, nrows + 1))
    elif nrows <= TERMINAL_ALL_ROWS:
        rows = rows_to_show(nrows, [row for row, _ in marks])
    else:
        wanted = set()
        for row, _ in marks:
            wanted.update(k for k in (row - 1, row, row + 1) if 1 <= k <= nrows)
        rows = sorted(wanted)
    if not rows:
        return
    names = list(result.table.columns)
    # A column that numbers the lines (1, 2, 3 ...) already says the row.
    numbered = bool(numbering_columns(result.table))
    sheet = Sheet(console, ([] if numbered else [("row", "number")]) + [(name, "key") for name in names],
                  title="the table")
    last = 0
    for row in rows:
        if last and row != last + 1:
            sheet.row(*(["…"] + ["" for _ in names[1 if numbered else 0:]]))
        cells = []
        for name in names:
            kind = marks.get((row, name))
            cells.append((result.table.columns[name].cells[row - 1].text + _mark(kind), _style(kind)))
        sheet.row(*([] if numbered else [str(row)]), *cells)
        last = row
    sheet.print()
    if len(rows) < nrows:
        note(console, f"{len(rows)} of {nrows} rows shown: those around the marks (--full shows all).",
             "dim")
    used = {key_of(kind)[0] for kind in marks.values()}
    if used:
        note(console, "key: " + ", ".join(f"{mark} {name} ({style.replace('bold ', '')})"
                                           for name, style, mark, _, _ in KEY if name in used), "dim")


def _flags(d, console) -> None:
    from .layout import Sheet, notes

    sheet = Sheet(console, [("row", "number"), ("column", "key"), ("written", "key"),
                            ("expected", "key"), ("kind", "key")], title="flags")
    reasons = []
    for f in d["flags"]:
        # A line that only inherits a slip is marked in the table above
        # and named on its origin's line: one slip, one line here.
        if f["kind"] == "carried-forward" and f.get("carried_from", {}).get("column") == f["column"]:
            continue
        reason = f["reason"]
        if f.get("carried_into"):
            reason += f"; carried into rows {_ranges(f['carried_into'])}"
        for col, rows in f.get("carried_into_columns", {}).items():
            reason += f"; carried into column {col}, rows {_ranges(rows)}"
        if "copying slip" in " ".join(f.get("notes", [])):
            reason += "; " + next(n for n in f["notes"] if "copying slip" in n)
        reasons.append((f"row {f['row']} {f['column']}:", reason))
        style = _style(f["kind"])
        sheet.row(str(f["row"]), f["column"], (f["written"], style), f["expected"], (f["kind"], style))
    sheet.print()
    notes(console, reasons)


def _restorations(d, console, full: bool) -> None:
    from .layout import Sheet, notes

    by_cell: dict[tuple, list] = {}
    for r in d["restorations"]:
        by_cell.setdefault((r["row"], r["column"]), []).append(r)
    cols = [("#", "number"), ("row", "number"), ("column", "key"), ("restored", "key"),
            ("probability", "number")]
    if not full:
        cols.append(("next readings", "text"))
    sheet = Sheet(console, cols, title="restorations of damaged cells")
    why = []
    for (row, column), rs in by_cell.items():
        for k, r in enumerate(rs if full else rs[:1]):
            why.append("; ".join(r["reasons"]))
            cells = [str(len(why)), str(row), column, (r["text"], _style("restored")), f"{r['probability']:.3f}"]
            if not full:
                cells.append(", ".join(f"{o['text']} {o['probability']:.3f}" for o in rs[1:]))
            sheet.row(*cells)
    sheet.print()
    notes(console, why)


def _ranges(rows: list[int]) -> str:
    """Rows as ranges: 32-40, 45.

    >>> _ranges([32, 33, 34, 40])
    '32-34, 40'
    """
    out, start, prev = [], None, None
    for r in rows:
        if start is None:
            start = prev = r
        elif r == prev + 1:
            prev = r
        else:
            out.append(f"{start}-{prev}" if prev != start else str(start))
            start = prev = r
    if start is not None:
        out.append(f"{start}-{prev}" if prev != start else str(start))
    return ", ".join(out)
