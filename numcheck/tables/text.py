"""Tables as text: TSV, CSV and whitespace-aligned columns, from a string or a file."""

from __future__ import annotations

import csv
import io
import re
from itertools import chain
from pathlib import Path

from ..errors import LimitError, NumcheckError
from .. import limits
from ..files import check_input_file, short
from .cells import sign_index

__all__ = ["split_text", "split_columns", "TextColumns", "read_text_file"]


def read_text_file(path: Path) -> str:
    """The text of the table file *path*, after checking its kind and size (no byte read before)."""
    if not path.exists() and not path.is_symlink():
        raise NumcheckError(f"There is no table at {short(str(path))!r}: the file does not exist.")
    check_input_file(path, max_bytes=limits.MAX_TABLE_BYTES, what="table file",
                     limit_name="MAX_TABLE_BYTES")
    data = path.read_bytes()
    return decode_table_bytes(data, str(path))


def decode_table_bytes(data: bytes, where: str) -> str:
    """The text of a table file: UTF-8 (with or without a BOM), or UTF-16 with its BOM.

    A byte sequence that is not text in its encoding (or a lone surrogate in
    UTF-16) is a NumcheckError naming the byte.
    """
    if data.startswith((b"\xff\xfe", b"\xfe\xff")):
        encoding = "utf-16"
    else:
        encoding = "utf-8-sig"
    try:
        return data.decode(encoding)
    except UnicodeDecodeError as err:
        raise NumcheckError(f"The table {short(where)!r} is not {encoding.upper()} text "
                            f"(byte {err.start} cannot be decoded).") from None


def split_text(text: str, *, suffix: str = "") -> tuple[list[str], list[list[str]]]:
    """Split the text of a table into a header and rows of cell texts.

    Tabs make a TSV; a ``.csv`` file, or a header with commas and no double
    spaces, is CSV (quote the sexagesimal cells: ``"29;31,50"``); anything
    else is a whitespace-aligned table whose columns are separated by two or
    more spaces (by single spaces when the header has no double space).
    Blank lines and lines starting with ``#`` (notes) are skipped; rows are
    counted from the first data row, as in the audit's output.
    """
    records = _records(text, suffix)
    header = next(records)
    return header, list(records)


class TextColumns:
    """The data rows of a text table kept column by column (no list per row).

    *columns* holds one list of cell texts per header name, NFC-normalised
    as :func:`numcheck.tables.cells.build_table` normalises rows.
    """

    def __init__(self, width: int):
        self.columns: list[list[str]] = [[] for _ in range(width)]
        self.nrows = 0

    def rows(self) -> list[list[str]]:
        """The rows again (for a join of columns)."""
        return [list(r) for r in zip(*self.columns)]


def split_columns(text: str, *, suffix: str = "") -> tuple[list[str], "TextColumns | list[list[str]]"]:
    """The header and the data of a table as :func:`split_text` reads them, column by column.

    A 10^6-line table then costs one string per cell, not a list per row.
    A ragged table gives its rows as :func:`split_text` does (build_table
    names the first ragged row).
    """
    records = _records(text, suffix)
    header = next(records)
    width = len(header)
    data = TextColumns(width)
    columns = data.columns
    nfc = _nfc
    try:
        for r in records:
            if len(r) != width:
                rest = [r, *records]
                rows = data.rows() + rest
                return header, rows
            data.nrows += 1
            for column, c in zip(columns, r):
                column.append(c if c.isascii() else nfc(c))
    finally:
        records.close()
    return header, data


def _nfc(text: str) -> str:
    import unicodedata
    return unicodedata.normalize("NFC", text)


#: Characters of a text table handled at a time (str.splitlines on each piece).
_CHUNK = 1 << 20


def _lines(text: str):
    """The lines of *text* that are neither blank nor notes (``#``), as ``str.splitlines`` splits.

    The text is split a piece at a time, each piece ending after a ``\n``
    (never inside a line break: only ``\r\n`` is a break of two characters).
    """
    start = 0
    end = len(text)
    while start < end:
        cut = text.find("\n", min(start + _CHUNK, end) - 1)
        stop = end if cut < 0 else cut + 1
        for ln in text[start:stop].splitlines():
            if ln.strip() and not ln.lstrip().startswith("#"):
                yield ln
        start = stop


def _joined_lines(lines, first: str):
    """The lines as ``io.StringIO("\\n".join(lines))`` gives them: each but the last with its "\\n"."""
    prev = first
    for ln in lines:
        yield prev + "\n"
        prev = ln
    yield prev


def _records(text: str, suffix: str):
    """The header, then each row, as lists of stripped cell texts."""
    lines = _lines(text)
    first = next(lines, None)
    if first is None:
        raise NumcheckError("The table is empty: no header row and no data rows were found.")
    if "\t" in first:
        yield [c.strip() for c in first.split("\t")]
        for ln in lines:
            yield [c.strip() for c in ln.split("\t")]
    elif suffix == ".csv" or ("," in first and "  " not in first.strip() and suffix != ".tsv"):
        try:
            for r in csv.reader(_joined_lines(lines, first), skipinitialspace=True):
                yield [c.strip() for c in r]
        except csv.Error as err:
            # The csv module stops at a field over 131,072 characters; a cell
            # that long is over MAX_TEXT_LENGTH anyway.
            raise NumcheckError(f"The CSV table cannot be read: {err} (a cell holds far more "
                                f"than a number; numbers are at most {limits.MAX_TEXT_LENGTH:,} "
                                "characters long). Check the quotes of the file.") from None
    else:
        splitter = re.compile(r"\s{2,}") if re.search(r"\S\s{2,}\S", first) else re.compile(r"\s+")
        rejoin = splitter.pattern == r"\s+"
        for ln in chain((first,), lines):
            r = splitter.split(ln.strip())
            if rejoin:
                r = _rejoin_signs(r)
            yield [c.strip() for c in r]


def _rejoin_signs(cells: list[str]) -> list[str]:
    # In a single-space table "14;11 Libra" was split in two: put it back.
    out: list[str] = []
    for c in cells:
        if out and sign_index(c) is not None:
            out[-1] = f"{out[-1]} {c}"
        else:
            out.append(c)
    return out
