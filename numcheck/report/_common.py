"""What the report writers share: output checks and colours per flag kind."""

from __future__ import annotations

from pathlib import Path

from ..files import check_distinct, write_atomic

#: A colour per flag kind (terminal style, plot and HTML).
KIND_STYLE = {"carried-forward": "yellow", "unexplained": "magenta"}
SLIP_STYLE = "bold red"
RESTORED_STYLE = "cyan"


def style_for(kind: str) -> str:
    return KIND_STYLE.get(kind, SLIP_STYLE)


#: What a cell's colour (and, where there is no colour, its mark) means: the key of
#: every screen and picture of an audit.  (name, rich style, mark, HTML colour, plot colour)
KEY = (
    ("slip", SLIP_STYLE, "!", "#fdd", "tab:red"),
    ("carried forward", KIND_STYLE["carried-forward"], "^", "#ffc", "tab:olive"),
    ("unexplained", KIND_STYLE["unexplained"], "?", "#fdf", "tab:purple"),
    ("restored", RESTORED_STYLE, "+", "#dff", "tab:cyan"),
)


def key_of(kind: str | None) -> tuple | None:
    """The KEY row of a flag kind ("restored" for a restored cell), or None.

    >>> key_of("ten-slip")[0], key_of("carried-forward")[2], key_of(None)
    ('slip', '^', None)
    """
    if kind is None:
        return None
    name = {"carried-forward": "carried forward", "unexplained": "unexplained",
            "restored": "restored"}.get(kind, "slip")
    return next(k for k in KEY if k[0] == name)


def write_output(result, path, data, suffixes: tuple[str, ...], what: str) -> Path:
    """Check *path* (its suffix, not the input table) and write *data* atomically."""
    from ..errors import NumcheckError

    target = Path(path)
    if suffixes and target.suffix.lower() not in suffixes:
        raise NumcheckError(f"The {what} {str(target)!r} must end in "
                            f"{' or '.join(suffixes)}, not {target.suffix or 'nothing'!r}.")
    source = getattr(result, "source", None)
    if source and Path(source).exists():
        check_distinct(source, target)
    return write_atomic(target, data)


#: A table this short is shown whole; a longer one only around its flags.
SHOW_ALL_ROWS = 40


def rows_to_show(nrows: int, marked_rows) -> list[int]:
    """The 1-based rows to show: all of a short table, else each marked row and its neighbours.

    >>> rows_to_show(100, [50])
    [49, 50, 51]
    """
    if nrows <= SHOW_ALL_ROWS:
        return list(range(1, nrows + 1))
    wanted = set()
    for row in marked_rows:
        wanted.update(k for k in (row - 1, row, row + 1) if 1 <= k <= nrows)
    return sorted(wanted)[:3 * SHOW_ALL_ROWS]


def cell_marks(d: dict) -> dict:
    """(row, column) -> flag kind or "restored", from the JSON of an audit."""
    marks = {}
    for f in d["flags"]:
        marks[(f["row"], f["column"])] = f["kind"]
    for r in d["restorations"]:
        marks.setdefault((r["row"], r["column"]), "restored")
    return marks


def nothing_checked(d: dict) -> bool:
    return not d["schemes"]


def summary_line(d: dict) -> str:
    """The audit in one line.

    >>> summary_line({"summary": {"cells": 80, "checked": 80, "slips": 2, "carried_forward": 9,
    ...                           "damaged": 1, "restored": 1}})
    '80 cells, 80 checked against a scheme: 2 slips, 9 lines carrying one forward; 1 damaged, 1 restored.'
    """
    s = d["summary"]
    return (f"{s['cells']} cells, {s['checked']} checked against a scheme: "
            f"{s['slips']} slip{'s' if s['slips'] != 1 else ''}, "
            f"{s['carried_forward']} line{'s' if s['carried_forward'] != 1 else ''} carrying one forward; "
            f"{s['damaged']} damaged, {s['restored']} restored.")


def display_name(source: str) -> str:
    """The name a reader knows a table by: its file name, or what it was given as.

    >>> display_name("/usr/lib/python3/site-packages/numcheck/data/demo/ephemeris.tsv")
    'ephemeris.tsv'
    >>> display_name("<DataFrame>")
    'a table given as a DataFrame'
    """
    from pathlib import PurePath

    if source.startswith("<") and source.endswith(">"):
        return f"a table given as a {source[1:-1]}"
    return PurePath(source).name or source


def numbering_columns(table) -> set[str]:
    """The columns that only number the lines (1, 2, 3 ... down the table)."""
    want = [str(i) for i in range(1, table.nrows + 1)]
    return {name for name, col in table.columns.items()
            if [t.strip() for t in col.cells.texts()] == want}
