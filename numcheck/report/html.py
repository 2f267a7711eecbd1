"""One self-contained HTML report of an audit: schemes, flags, restorations, the plot.

The plot is embedded as a base64 PNG, so the file can be mailed or archived
alone.  Every text from the table is escaped.
"""

from __future__ import annotations

import base64
from html import escape

from ._common import (KEY, cell_marks, display_name, key_of, nothing_checked, numbering_columns,
                      rows_to_show, summary_line, write_output)

__all__ = ["html_text", "write_html"]

_CSS = """
body{font-family:Georgia,serif;margin:2em;max-width:70em;color:#222}
h1{font-size:1.4em}h2{font-size:1.15em;margin-top:1.6em}
table{border-collapse:collapse;font-size:.9em}td,th{border:1px solid #bbb;padding:.2em .5em;text-align:left}
th{background:#eee}.num{font-family:monospace}.slip{background:#fdd}.carried{background:#ffc}
.unexplained{background:#fdf}.restored{background:#dff}.note{font-style:italic;color:#555}
td a{color:inherit;text-decoration:none;border-bottom:1px dotted #888}.key span{padding:0 .4em;margin-right:.6em}
:target{outline:2px solid #c00}
"""

#: The CSS class of each KEY entry.
_CLASS = {"slip": "slip", "carried forward": "carried", "unexplained": "unexplained", "restored": "restored"}


def _cls(kind: str | None) -> str:
    k = key_of(kind)
    return _CLASS[k[0]] if k else ""


def _anchor(prefix: str, row: int, column: str) -> str:
    """An id for a flag or a restoration, safe in HTML whatever the column is called.

    >>> _anchor("flag", 8, "B 2")
    'flag-8-B-2'
    """
    import re

    return f"{prefix}-{row}-" + re.sub(r"[^A-Za-z0-9_-]+", "-", column)


def _key(used: set[str]) -> str:
    spans = "".join(f"<span class='{_CLASS[name]}'>{escape(name)} ({mark})</span>"
                    for name, _, mark, _, _ in KEY if name in used)
    return f"<p class='key'>Key: {spans} A marked cell links to its flag or restoration below.</p>"


def html_text(result, *, plot: bool = True) -> str:
    """The report as HTML text."""
    d = result.to_dict()
    name = display_name(d["source"])
    parts = [f"<!DOCTYPE html><html lang='en'><head><meta charset='utf-8'>"
             f"<title>numcheck audit: {escape(name)}</title><style>{_CSS}</style></head><body>",
             f"<h1>numcheck audit of {escape(name)}</h1>",
             f"<p>{d['rows']} rows; columns {escape(', '.join(d['columns']))}. "
             f"{escape(summary_line(d))}</p>",
             f"<p class='note'>{escape(d['note'])}</p>", "<h2>Schemes</h2>"]
    if d["schemes"]:
        parts.append("<table><tr><th>column</th><th>kind</th><th>scheme</th><th>lines that fit</th></tr>")
        for s in d["schemes"]:
            parts.append(f"<tr><td>{escape(s['column'])}</td><td>{escape(s['kind'])}</td>"
                         f"<td>{escape(s['description'])}</td><td>{s['support']:.1%}</td></tr>")
        parts.append("</table>")
    else:
        parts.append("<p>No column follows a scheme numcheck knows.</p>")
    if d["unchecked"]:
        parts.append(f"<p>Not checked (no scheme found): {escape(', '.join(d['unchecked']))}.</p>")
    parts.extend(_cells(result, d))
    parts.append("<h2>Flags</h2>")
    if d["flags"]:
        parts.append("<table><tr><th>row</th><th>column</th><th>written</th><th>expected</th>"
                     "<th>kind</th><th>reason</th></tr>")
        for f in d["flags"]:
            cls = _cls(f["kind"])
            parts.append(f"<tr class='{cls}' id='{_anchor('flag', f['row'], f['column'])}'>"
                         f"<td>{f['row']}</td><td>{escape(f['column'])}</td>"
                         f"<td class='num'>{escape(f['written'])}</td>"
                         f"<td class='num'>{escape(f['expected'])}</td><td>{escape(f['kind'])}</td>"
                         f"<td>{escape('; '.join([f['reason']] + f.get('notes', [])))}</td></tr>")
        parts.append("</table>")
    elif nothing_checked(d):
        parts.append("<p>No column follows a scheme numcheck knows: nothing was checked.</p>")
    else:
        parts.append("<p>No cell breaks its scheme.</p>")
    parts.append("<h2>Restorations of damaged cells</h2>")
    if d["restorations"]:
        parts.append("<table><tr><th>row</th><th>column</th><th>restored</th><th>probability</th>"
                     "<th>reasons</th></tr>")
        seen = set()
        for r in d["restorations"]:
            anchor = _anchor("restored", r["row"], r["column"])
            ident = f" id='{anchor}'" if anchor not in seen else ""
            seen.add(anchor)
            parts.append(f"<tr class='restored'{ident}><td>{r['row']}</td><td>{escape(r['column'])}</td>"
                         f"<td class='num'>{escape(r['text'])}</td><td>{r['probability']:.3f}</td>"
                         f"<td>{escape('; '.join(r['reasons']))}</td></tr>")
        parts.append("</table>")
    else:
        parts.append("<p>No damaged cell to restore.</p>")
    if plot:
        from .plot import plot_bytes
        png = base64.b64encode(plot_bytes(result, "png")).decode("ascii")
        parts.append("<h2>Plot</h2>")
        parts.append(f"<img alt='each checked column, its scheme and the flagged lines' "
                     f"src='data:image/png;base64,{png}'>")
    parts.append("<p class='note'>Written by numcheck audit.</p></body></html>")
    return "\n".join(parts)


def _cells(result, d) -> list[str]:
    """The table, flagged and restored cells coloured (a long table: rows around them)."""
    marks = cell_marks(d)
    rows = rows_to_show(result.table.nrows, [row for row, _ in marks])
    if not rows:
        return []
    names = list(result.table.columns)
    flagged = {(f["row"], f["column"]) for f in d["flags"]}
    numbered = bool(numbering_columns(result.table))
    head = "" if numbered else "<th>row</th>"
    out = ["<h2>Table</h2>", _key({key_of(k)[0] for k in marks.values()}),
           "<table><tr>" + head + "".join(f"<th>{escape(n)}</th>" for n in names) + "</tr>"]
    last = 0
    for row in rows:
        if last and row != last + 1:
            out.append(f"<tr><td>…</td>{'<td></td>' * (len(names) - (1 if numbered else 0))}</tr>")
        cells = []
        for name in names:
            kind = marks.get((row, name))
            cls = (" " + _cls(kind)) if kind else ""
            text = escape(result.table.columns[name].cells[row - 1].text)
            if kind:
                prefix = "flag" if (row, name) in flagged else "restored"
                text = f"<a href='#{_anchor(prefix, row, name)}' title='{escape(kind)}'>{text}</a>"
            cells.append(f"<td class='num{cls}'>{text}</td>")
        out.append(f"<tr>{'' if numbered else f'<td>{row}</td>'}{''.join(cells)}</tr>")
        last = row
    out.append("</table>")
    return out


def write_html(result, path):
    """Write the report to *path* (``.html``) atomically; returns the path."""
    return write_output(result, path, html_text(result), (".html", ".htm"), "report file")
