"""The one error hierarchy of numcheck.

Every mistake a user can make ends in a :class:`NumcheckError`.  The
subclasses carry what a message needs: where the problem is (a position in the
input, with a caret line), what was found, and what would be valid.  They all
subclass :class:`ValueError` so that generic handlers keep working.
"""

from __future__ import annotations

from collections.abc import Iterable

__all__ = [
    "NumcheckError",
    "NumcheckSyntaxError",
    "NumcheckRangeError",
    "UnknownNameError",
    "LimitError",
    "NumcheckWarning",
    "caret_line",
]


class NumcheckWarning(UserWarning):
    """A tolerable oddity in the input, and how numcheck treated it."""


class NumcheckError(ValueError):
    """Base of every error a user of numcheck can cause."""


def caret_line(text: str, position: int) -> str:
    """Return the line of *text* holding *position* and a caret under it.

    >>> print(caret_line("29;61,3", 3))
      29;61,3
         ^
    """
    start = text.rfind("\n", 0, position) + 1
    end = text.find("\n", position)
    end = len(text) if end == -1 else end
    line = text[start:end]
    shown = line
    offset = position - start
    # Very long inputs: show a window around the position, not the whole line.
    if len(line) > 72:
        lo = max(0, offset - 35)
        shown = ("…" if lo else "") + line[lo : lo + 70] + ("…" if lo + 70 < len(line) else "")
        offset = offset - lo + (1 if lo else 0)
    shown = "".join(c if c.isprintable() else "\N{REPLACEMENT CHARACTER}" for c in shown)
    return "  " + shown + "\n  " + " " * offset + "^"


class NumcheckSyntaxError(NumcheckError):
    """The text cannot be read in the notation asked for.

    Carries the 0-based ``position``, the 1-based ``line`` and ``column``, the
    character ``found`` there (or ``None`` at the end) and a caret line.
    """

    def __init__(self, message: str, text: str, position: int, *, expected: str | None = None):
        self.text = text
        self.position = max(0, min(position, len(text)))
        self.line = text.count("\n", 0, self.position) + 1
        self.column = self.position - (text.rfind("\n", 0, self.position) + 1) + 1
        self.found = text[self.position] if self.position < len(text) else None
        self.expected = expected
        self.reason = message
        where = f"at column {self.column}" + (f" of line {self.line}" if "\n" in text else "")
        found = (
            f"found {self.found!r} (U+{ord(self.found):04X})"
            if self.found is not None
            else "found the end of the input"
        )
        parts = [f"{message} ({where}: {found})."]
        if expected:
            parts.append(f"Expected {expected}.")
        full = " ".join(parts) + "\n" + caret_line(text, self.position) if text else " ".join(parts)
        super().__init__(full)


class NumcheckRangeError(NumcheckError):
    """A value lies outside its legal range (a place written as 61, day 31 ...)."""

    def __init__(self, message: str, *, value=None, legal: str | None = None,
                 text: str | None = None, position: int | None = None):
        self.value = value
        self.legal = legal
        self.text = text
        self.position = position
        full = message
        if legal:
            full += f" The legal range is {legal}."
        if text is not None and position is not None:
            self.column = position + 1
            full = f"{full} (column {position + 1})\n" + caret_line(text, position)
        super().__init__(full)


class UnknownNameError(NumcheckError):
    """A unit, notation, body, calendar ... that numcheck does not know."""

    def __init__(self, kind: str, name: str, choices: Iterable[str]):
        self.kind = kind
        self.name = name
        self.choices = sorted(set(choices))
        import difflib   # here, not at the top: importing it costs every start 10 ms

        close = difflib.get_close_matches(str(name), self.choices, n=3, cutoff=0.5)
        hint = f" Did you mean {' or '.join(repr(c) for c in close)}?" if close else ""
        listed = ", ".join(self.choices)
        super().__init__(f"Unknown {kind} {name!r}.{hint} Known {kind} names: {listed}.")


class LimitError(NumcheckError):
    """An input or a search is larger than a named limit allows."""

    def __init__(self, what: str, size, limit, how_to_raise: str):
        self.what = what
        self.size = size
        self.limit = limit
        super().__init__(
            f"The {what} ({size}) is over numcheck's limit of {limit}. {how_to_raise}"
        )
