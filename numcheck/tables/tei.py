"""TEI tables: a ``<table>`` of ``<row>`` and ``<cell>`` read like a TSV, for the audit.

Damage markup in a cell becomes Leiden text, so the audit reads the cell as
it reads the same cell in a TSV.  The same reading lets ``annotate`` rank
the restorations of a damaged ``<num>`` in a table by the table's scheme
(:mod:`numcheck.tei.table_context`) rather than by the number alone.
"""

from __future__ import annotations

import os
from dataclasses import dataclass, field

from ..tei.markup import (TEI_NS, NoTableError, TeiError, choose_notation, leiden_text, local_name,
                       num_pieces, parse_tei, plain_text, tei_elements)

__all__ = ["TableCells", "table_frame", "table_to_dataframe"]

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
    for row in el.iter(f"{{{TEI_NS}}}row"):
        if _owner_table(row) is not el:
            continue
        cells = [c for c in row if local_name(c) == "cell"]
        if not cells:
            continue
        is_label = row.get("role") == "label" or all(c.get("role") == "label" for c in cells)
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
        raise TeiError(path, el.sourceline, "the <table> has no data rows")
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


def _owner_table(el):
    parent = el.getparent()
    while parent is not None and local_name(parent) != "table":
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
    tables = list(tei_elements(root, "table"))
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
                                           "<table>, <row>, <cell>)")
        if not 0 <= table < len(tables):
            raise TeiError(path, None, f"asked for table {table + 1}, but the file has {len(tables)}")
        el = tables[table]
    return table_frame(el, path, notation).frame
