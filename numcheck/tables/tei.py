"""TEI tables: a ``<table>`` of ``<row>`` and ``<cell>`` read like a TSV, for the audit.

A table may also be written as lists, as some digital editions encode
tables: ``<list rend="table">`` holding one ``<list rend="row">`` per row,
whose ``<item>`` (or ``<label>``) children are the cells (TEI P5 §3.8 lists,
with ``@rend`` naming the layout; common practice of such editions).

Damage markup in a cell becomes Leiden text, so the audit reads the cell as
it reads the same cell in a TSV.  The same reading lets ``annotate`` rank
the restorations of a damaged ``<num>`` in a table by the table's scheme
(:mod:`numcheck.tei.table_context`) rather than by the number alone.
"""

from __future__ import annotations

import os
from dataclasses import dataclass, field

from ..tei.markup import (TEI_NS, NoTableError, TeiError, choose_notation, leiden_text, local_name,
                       num_pieces, parse_tei, plain_text)

__all__ = ["TableCells", "table_frame", "table_to_dataframe", "tei_tables", "is_table"]

_XML_ID = "{http://www.w3.org/XML/1998/namespace}id"


@dataclass
class TableCells:
    """A TEI table read for the audit: the DataFrame and where each cell came from."""

    frame: object                                   # pandas.DataFrame of Leiden texts
    cells: dict[tuple[int, str], object] = field(default_factory=dict)  # (row, column) -> <cell>


def table_frame(el, path="<table>", notation: str | None = None) -> TableCells:
    """Read the TEI ``<table>`` element *el* into a :class:`TableCells`.

    The first row whose ``@role`` is ``label`` (or whose cells all are) gives
    the column names; otherwise the columns are named ``1``, ``2`` ...
    Rows of tables nested inside *el* are not its rows.
    """
    import pandas as pd

    header: list[str] | None = None
    used: set[str] = set()
    rows: list[list[str]] = []
    row_cells: list[list] = []
    lines: list[int] = []
    for row, cells, is_label in _rows(el):
        if header is None and not rows and is_label:
            header = [plain_text(num_pieces(c)) or _default_name(i) for i, c in enumerate(cells)]
            continue
        texts = []
        for c in cells:
            pieces = num_pieces(c)
            cell_notation = notation or choose_notation(plain_text(pieces), c)
            used.add(cell_notation)
            texts.append(leiden_text(pieces, cell_notation))
        rows.append(texts)
        row_cells.append(cells)
        lines.append(row.sourceline)
    if not rows:
        what = "<table>" if local_name(el) == "table" else '<list rend="table">'
        raise TeiError(path, el.sourceline, f"the {what} has no data rows")
    width = max(len(r) for r in rows)
    if header is None:
        header = [_default_name(i) for i in range(width)]
    header = header + [_default_name(i) for i in range(len(header), width)]
    # Column names must be distinct for the audit to name them.
    seen: dict[str, int] = {}
    names = []
    for h in header[:width]:
        seen[h] = seen.get(h, 0) + 1
        names.append(h if seen[h] == 1 else f"{h} ({seen[h]})")
    frame = pd.DataFrame([r + [""] * (width - len(r)) for r in rows], columns=names, dtype=str)
    frame.attrs["source"] = str(path)
    frame.attrs["table_line"] = el.sourceline
    frame.attrs["row_lines"] = lines
    if len(used) == 1:
        frame.attrs["notation"] = used.pop()
    cells = {(i + 1, names[j]): c for i, cs in enumerate(row_cells) for j, c in enumerate(cs)}
    return TableCells(frame, cells)


def _default_name(i: int) -> str:
    # Not a bare number: the audit takes a header of numbers for a data row.
    return f"column {i + 1}"


def is_table(el) -> bool:
    """Whether *el* is a table: a ``<table>``, or a ``<list rend="table">``."""
    name = local_name(el)
    return name == "table" or (name == "list" and _rend(el) == "table")


def _rend(el) -> str:
    return (el.get("rend") or "").strip().lower()


def _is_row_list(el) -> bool:
    return local_name(el) == "list" and _rend(el) == "row"


def tei_tables(root) -> list:
    """Every table under *root* in document order: ``<table>`` and ``<list rend="table">``."""
    return [el for el in root.iter(f"{{{TEI_NS}}}table", f"{{{TEI_NS}}}list") if is_table(el)]


def _rows(el):
    """(row element, its cells, whether it is a row of labels) for each row of the table *el*."""
    if local_name(el) == "table":
        candidates = (r for r in el.iter(f"{{{TEI_NS}}}row"))
        cell_names = ("cell",)
    else:
        candidates = (r for r in el.iter(f"{{{TEI_NS}}}list") if _is_row_list(r))
        cell_names = ("item", "label")
    for row in candidates:
        if _owner_table(row) is not el:
            continue
        cells = [c for c in row if local_name(c) in cell_names]
        if not cells:
            continue
        is_label = (row.get("role") == "label" or (row.get("type") or "") in ("head", "label")
                    or all(c.get("role") == "label" or local_name(c) == "label" for c in cells))
        yield row, cells, is_label


def _owner_table(el):
    parent = el.getparent()
    while parent is not None and not is_table(parent):
        parent = parent.getparent()
    return parent


def table_to_dataframe(path: str | os.PathLike, *, table: int | str = 0,
                       notation: str | None = None):
    """A TEI ``<table>`` as a pandas DataFrame of cell texts, ready for ``audit``.

    *table* picks the table by position (0 = first) or by ``xml:id``.  The
    cells' notation is *notation*, or what their letters (and the
    ``xml:lang`` in force) say.  ``df.attrs`` holds the source path, the
    table's line, each data row's line and the notation when all cells share
    one.
    """
    root = parse_tei(path)
    tables = tei_tables(root)
    if isinstance(table, str):
        chosen = [t for t in tables if t.get(_XML_ID) == table]
        if not chosen:
            ids = [t.get(_XML_ID) or "(no id)" for t in tables]
            raise TeiError(path, None, f"no <table> with xml:id {table!r}; the tables here: "
                                       f"{', '.join(ids) or 'none'}")
        el = chosen[0]
    else:
        if not tables:
            raise NoTableError(path, None, "no TEI <table> in this file (a table to audit needs "
                                           "<table>, <row>, <cell>, or <list rend=\"table\"> "
                                           "with <list rend=\"row\"> and <item>)")
        if not 0 <= table < len(tables):
            raise TeiError(path, None, f"asked for table {table + 1}, but the file has {len(tables)}")
        el = tables[table]
    return table_frame(el, path, notation).frame
