"""Writing damage marks back: one bracket around each run of signs that shares it.

Every notation writes a reading back as a row of pieces, each with the
bracket it stands in (``"["`` lost or restored, ``"<"`` added, ``"{"``
superfluous, ``None`` read).  :func:`join_marked` opens and closes the
brackets so that a run of lost signs is written ``[ηκ]``, not ``[η][κ]``.
"""

from __future__ import annotations

from collections.abc import Sequence

from ..reading import Status

__all__ = ["CLOSERS", "SEPARATOR", "RAW", "join_marked", "BRACKET_TOKENS", "track_bracket", "status_in"]

#: The closing bracket of each opening bracket numcheck writes.
CLOSERS = {"[": "]", "<": ">", "{": "}", "\u2e22": "\u2e23", "<<": ">>"}

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


#: Grammar token -> (the bracket it opens or closes, whether it opens).
BRACKET_TOKENS = {
    "LOST_OPEN": ("lost", True), "LOST_CLOSE": ("lost", False),
    "ADD_OPEN": ("added", True), "ADD_CLOSE": ("added", False),
    "SUPERFLUOUS_OPEN": ("superfluous", True), "SUPERFLUOUS_CLOSE": ("superfluous", False),
    "HALF_OPEN": ("half", True), "HALF_CLOSE": ("half", False),
}


def track_bracket(token_type: str, position: int, state: dict, fail) -> bool:
    """Follow the brackets open at *position*; False when the token is no bracket.

    *state* maps a bracket name to the position where it was opened (or None);
    *fail(position, what, expected)* makes the notation's syntax error, raised
    for a bracket opened inside its own kind or closed without being opened.
    """
    entry = BRACKET_TOKENS.get(token_type)
    if entry is None:
        return False
    name, opening = entry
    if opening and state.get(name) is not None:
        raise fail(position, "a bracket opened inside the same kind of bracket",
                   f"the bracket opened at column {state[name] + 1} to be closed first")
    if not opening and state.get(name) is None:
        raise fail(position, "a closing bracket with no opening bracket", "an opening bracket before it")
    state[name] = position if opening else None
    return True


def status_in(state: dict, unread: bool) -> Status:
    """The status of a sign given the brackets open around it.

    *unread* is true for a sign that stands for a digit or letter not read
    (``x``, ``+``): lost inside ``[ ]``, unread outside.  A read sign inside
    ``[ ]`` is the editor's restoration.
    """
    if state.get("superfluous") is not None:
        return Status.SUPERFLUOUS
    if state.get("lost") is not None:
        return Status.LOST if unread else Status.RESTORED
    if unread:
        return Status.UNREAD
    return Status.ADDED if state.get("added") is not None else Status.READ
