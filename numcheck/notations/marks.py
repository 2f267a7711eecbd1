"""Writing damage marks back: one bracket around each run of signs that shares it.

Every notation writes a reading back as a row of pieces, each with the
bracket it stands in (``"["`` lost or restored, ``"<"`` added, ``"{"``
superfluous, ``None`` read).  :func:`join_marked` opens and closes the
brackets so that a run of lost signs is written ``[ηκ]``, not ``[η][κ]``.
"""

from __future__ import annotations

from collections.abc import Sequence

__all__ = ["CLOSERS", "SEPARATOR", "RAW", "join_marked"]

#: The closing bracket of each opening bracket numcheck writes.
CLOSERS = {"[": "]", "<": ">", "{": "}", "\u2e22": "\u2e23"}

#: A separator between places: it stays inside a bracket only when the piece
#: after it stands in the same bracket (``[1,49]``, but ``5[x],8``).
SEPARATOR = "separator"

#: A piece that carries its own marks (``[...]``): any open bracket closes first.
RAW = "raw"


def join_marked(pieces: Sequence[tuple[str, str | None]]) -> str:
    """Join (text, bracket) pieces into one text with the fewest brackets.

    >>> join_marked([("1", None), (",", SEPARATOR), ("4", "["), ("9", "[")])
    '1,[49]'
    >>> join_marked([("5", None), ("x", "["), (",", SEPARATOR), ("8", None)])
    '5[x],8'
    >>> join_marked([("1", "["), (",", SEPARATOR), ("49", "[")])
    '[1,49]'
    >>> join_marked([("α", None), (".", "["), (".", "["), (".", "[")])
    'α[..][.]'
    """
    out: list[str] = []
    opened: str | None = None
    start = 0      # where in *out* the open bracket stands

    def close() -> None:
        # Three lost letters in one bracket would read as '[...]', lost
        # places of unknown number: write them '[..][.]' instead.
        if opened == "[" and out[start + 1:] == [".", ".", "."]:
            out[start + 1:] = ["..", "][", "."]
        out.append(CLOSERS[opened])

    for i, (text, bracket) in enumerate(pieces):
        if bracket in (SEPARATOR, RAW):
            following = pieces[i + 1][1] if bracket == SEPARATOR and i + 1 < len(pieces) else None
            if opened and following != opened:
                close()
                opened = None
            out.append(text)
            continue
        if bracket != opened:
            if opened:
                close()
            if bracket:
                start = len(out)
                out.append(bracket)
            opened = bracket
        out.append(text)
    if opened:
        close()
    return "".join(out)
