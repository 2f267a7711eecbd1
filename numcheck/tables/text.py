"""Tables as text: TSV, CSV and whitespace-aligned columns, from a string or a file."""

from __future__ import annotations

import csv
import io
import re
from pathlib import Path

from ..errors import LimitError, NumcheckError
from .. import limits
from .cells import sign_index

__all__ = ["split_text", "read_text_file"]


def read_text_file(path: Path) -> str:
    """The text of the table file *path*, after checking that it exists and is not too big."""
    if not path.exists():
        raise NumcheckError(f"There is no table at {str(path)!r}: the file does not exist.")
    if path.is_dir():
        raise NumcheckError(f"{str(path)!r} is a folder, not a table file.")
    size = path.stat().st_size
    if size > limits.MAX_TABLE_BYTES:
        raise LimitError(f"size of the table {str(path)!r}", f"{size:,} bytes",
                         f"{limits.MAX_TABLE_BYTES:,} bytes",
                         "Set numcheck.limits.MAX_TABLE_BYTES higher to audit it, or split the table.")
    try:
        return path.read_text(encoding="utf-8-sig")
    except UnicodeDecodeError as err:
        raise NumcheckError(f"The table {str(path)!r} is not UTF-8 text "
                            f"(byte {err.start} cannot be decoded).") from err


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
        records = list(csv.reader(io.StringIO("\n".join(lines)), skipinitialspace=True))
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
