"""Tables given as a pandas DataFrame of cell texts."""

from __future__ import annotations

import math

from ..errors import NumcheckError
from .cells import check_cells

__all__ = ["is_dataframe", "frame_rows"]


def frame_rows(frame) -> tuple[list[str], list[list[str]]]:
    """The header and the rows of cell texts of the DataFrame *frame*."""
    check_cells(frame.shape[0] * frame.shape[1])
    header = [str(c) for c in frame.columns]
    rows = [[_frame_text(v, i, header[j]) for j, v in enumerate(rec)]
            for i, rec in enumerate(frame.itertuples(index=False), start=1)]
    return header, rows


def is_dataframe(obj) -> bool:
    return type(obj).__name__ == "DataFrame" and hasattr(obj, "itertuples")


def _frame_text(v, row: int, column: str) -> str:
    """The text of a DataFrame cell; a float that is not whole is refused (it is not exact)."""
    if _isna(v):
        return ""
    if isinstance(v, float) or type(v).__name__.startswith("float"):
        if float(v).is_integer():
            return str(int(v))
        raise NumcheckError(
            f"Row {row}, column {column!r} of the DataFrame holds the float {v!r}: a float is "
            "not the exact number the scribe wrote. Give the cells as text, as the edition "
            "prints them (e.g. read the file with dtype=str).")
    return str(v)


def _isna(v) -> bool:
    try:
        return v is None or (isinstance(v, float) or type(v).__name__.startswith("float")) and math.isnan(v)
    except TypeError:
        return False
