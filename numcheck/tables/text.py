"""Tables as text: TSV, CSV and whitespace-aligned columns, from a string or a file."""

from __future__ import annotations

import csv
import io
import re
from pathlib import Path

from ..errors import LimitError, NumcheckError
from .. import limits
from ..files import check_input_file, short
from .cells import sign_index

__all__ = ["split_text", "read_text_file"]


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
    lines = [ln for ln in text.splitlines() if ln.strip() and not ln.lstrip().startswith("#")]
    if not lines:
        raise NumcheckError("The table is empty: no header row and no data rows were found.")
    first = lines[0]
    if "\t" in first:
        records = [ln.split("\t") for ln in lines]
    elif suffix == ".csv" or ("," in first and "  " not in first.strip() and suffix != ".tsv"):
        try:
            records = list(csv.reader(io.StringIO("\n".join(lines)), skipinitialspace=True))
        except csv.Error as err:
            # The csv module stops at a field over 131,072 characters; a cell
            # that long is over MAX_TEXT_LENGTH anyway.
            raise NumcheckError(f"The CSV table cannot be read: {err} (a cell holds far more "
                                f"than a number; numbers are at most {limits.MAX_TEXT_LENGTH:,} "
                                "characters long). Check the quotes of the file.") from None
    else:
        splitter = re.compile(r"\s{2,}") if re.search(r"\S\s{2,}\S", first) else re.compile(r"\s+")
        records = [splitter.split(ln.strip()) for ln in lines]
        if splitter.pattern == r"\s+":
            records = [_rejoin_signs(r) for r in records]
    records = [[c.strip() for c in r] for r in records]
    return records[0], records[1:]


def _rejoin_signs(cells: list[str]) -> list[str]:
    # In a single-space table "14;11 Libra" was split in two: put it back.
    out: list[str] = []
    for c in cells:
        if out and sign_index(c) is not None:
            out[-1] = f"{out[-1]} {c}"
        else:
            out.append(c)
    return out
