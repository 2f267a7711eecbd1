"""Every table source read into one :class:`Table` of exact cells, for the audit and the batch.

A table may come as a TSV, CSV or whitespace-aligned text file, as the first
``<table>`` of a TEI/EpiDoc file, as a tabular ATF transliteration (``.atf``), or as a pandas DataFrame of cell texts:
each source gives a header and rows of cell texts, and :func:`build_table`
reads them all the same way.
"""

from __future__ import annotations

from pathlib import Path

from ..errors import NumcheckError
from ..files import display_name
from .cells import ZODIAC, Cell, Column, ColumnReading, Table, build_table, read_column, sign_index
from .frame import frame_rows, is_dataframe
from .join import join_columns, needs_join
from .text import read_text_file, split_columns, split_text

__all__ = ["read_table", "read_column", "ColumnReading", "Table", "Column", "Cell", "split_text",
           "sign_index", "ZODIAC",
           "TEI_SUFFIXES", "ATF_SUFFIXES"]

#: File suffixes read as TEI/EpiDoc (their first ``<table>``).
TEI_SUFFIXES = (".xml",)
#: File suffixes read as ATF transliterations (one row per text line with numbers).
ATF_SUFFIXES = (".atf",)


def read_table(table, *, notation: str | None = None, columns=None, join=None) -> Table:
    """Read *table* (a path to a TSV/CSV/aligned text or TEI file, or a DataFrame) into a Table.

    *notation* is the notation of every cell (read from the characters, and
    in TEI from ``xml:lang``, when None).  *columns* limits the audit to those
    header names (the others, e.g. month names, are not read as numbers).
    *join* makes several columns one number (``"crd=A,B,C"``, see
    ``tables/join.py``; headers ``x°``, ``x′``, ``x″`` are joined by themselves).
    Errors name the row and the column.
    """
    if notation is not None:
        from ..notations import notation_module
        notation_module(notation)   # an unknown name fails here, with suggestions
    if is_dataframe(table):
        header, rows = frame_rows(table)
        source = str(table.attrs.get("source", "<DataFrame>"))
    elif isinstance(table, (str, Path)):
        path = Path(table)
        # The name shown (reports, plots, JSON): a file name that is not UTF-8
        # shows U+FFFD; the file itself is read by its real name.
        source = display_name(str(path))
        if path.suffix.lower() in ATF_SUFFIXES and path.is_file():
            from .atf import atf_rows
            header, rows, found = atf_rows(read_text_file(path), str(path))
            notation = notation or found
        elif path.suffix.lower() in TEI_SUFFIXES and path.is_file():
            from .tei import table_to_dataframe
            frame = table_to_dataframe(path, notation=notation)
            notation = notation or frame.attrs.get("notation")
            header, rows = frame_rows(frame)
        else:
            header, rows = split_columns(read_text_file(path), suffix=path.suffix.lower())
            if needs_join(header, join) and not isinstance(rows, list):
                rows = rows.rows()
    else:
        raise NumcheckError(f"Expected a path to a table or a pandas DataFrame, got "
                            f"{type(table).__name__}.")
    if isinstance(rows, list):
        header, rows = join_columns(header, rows, join, source=source)
    return build_table(header, rows, notation=notation, columns=columns, source=source)
