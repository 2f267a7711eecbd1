"""The audit on the terminal: schemes, the table with flagged cells highlighted, one reason each."""

from __future__ import annotations

from rich.markup import escape
from rich.table import Table

from ._common import (RESTORED_STYLE, cell_marks, nothing_checked, rows_to_show, style_for,
                      summary_line)

__all__ = ["show"]

def show(result, console) -> None:
    """Print the audit to a rich console."""
    d = result.to_dict()
    console.print(f"[bold]numcheck audit[/bold] {escape(d['source'])}: {d['rows']} rows, "
                  f"columns {escape(', '.join(d['columns']))}")
    schemes = Table(title="schemes", show_edge=False, header_style="bold")
    for col in ("column", "kind", "scheme", "fit"):
        schemes.add_column(col)
    for s in d["schemes"]:
        schemes.add_row(escape(s["column"]), s["kind"], escape(s["description"]), f"{s['support']:.1%}")
    for name in d["unchecked"]:
        schemes.add_row(escape(name), "-", "no scheme found: not checked", "")
    console.print(schemes)
    _cells(result, d, console)
    if d["flags"]:
        flags = Table(title="flags", show_edge=False, header_style="bold")
        for col in ("row", "column", "written", "expected", "kind", "reason"):
            flags.add_column(col)
        for f in d["flags"]:
            # A line that only inherits a slip is coloured in the table above
            # and named on its origin's line: one slip, one line here.
            if f["kind"] == "carried-forward" and f.get("carried_from", {}).get("column") == f["column"]:
                continue
            style = style_for(f["kind"])
            reason = f["reason"]
            if f.get("carried_into"):
                reason += f"; carried into rows {_ranges(f['carried_into'])}"
            for col, rows in f.get("carried_into_columns", {}).items():
                reason += f"; carried into column {col}, rows {_ranges(rows)}"
            if "copying slip" in " ".join(f.get("notes", [])):
                reason += "; " + next(n for n in f["notes"] if "copying slip" in n)
            flags.add_row(str(f["row"]), escape(f["column"]), f"[{style}]{escape(f['written'])}[/]",
                          escape(f["expected"]), f"[{style}]{f['kind']}[/]", escape(reason))
        console.print(flags)
    elif nothing_checked(d):
        console.print("[yellow]No column follows a scheme numcheck knows: nothing was checked. "
                      "State a relation with --relation to check one.[/yellow]")
    else:
        console.print("[green]No cell breaks its scheme.[/green]")
    if d["restorations"]:
        rest = Table(title="restorations of damaged cells", show_edge=False, header_style="bold")
        for col in ("row", "column", "restored", "probability", "why"):
            rest.add_column(col)
        for r in d["restorations"]:
            rest.add_row(str(r["row"]), escape(r["column"]), f"[{RESTORED_STYLE}]{escape(r['text'])}[/]",
                         f"{r['probability']:.3f}", escape("; ".join(r["reasons"])))
        console.print(rest)
    console.print(escape(summary_line(d)))
    console.print(f"[dim]{escape(d['note'])}[/dim]")


def _cells(result, d, console) -> None:
    """The table itself, flagged cells coloured (only the rows around flags in a long table)."""
    marks = cell_marks(d)
    rows = rows_to_show(result.table.nrows, [row for row, _ in marks])
    if not rows:
        return
    t = Table(title="table (flagged cells coloured)", show_edge=False, header_style="bold")
    t.add_column("row", justify="right")
    names = list(result.table.columns)
    for name in names:
        t.add_column(escape(name))
    last = 0
    for row in rows:
        if last and row != last + 1:
            t.add_row("…", *["" for _ in names])
        cells = []
        for name in names:
            text = escape(result.table.columns[name].cells[row - 1].text)
            kind = marks.get((row, name))
            style = None if kind is None else RESTORED_STYLE if kind == "restored" else style_for(kind)
            cells.append(f"[{style}]{text}[/]" if style else text)
        t.add_row(str(row), *cells)
        last = row
    console.print(t)


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
