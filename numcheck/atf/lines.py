"""The lines of an ATF file: texts, surfaces, columns, protocols, and the text lines with their labels.

ATF (the transliteration format of the Oracc and CDLI projects) writes one
line per line of the tablet: ``&P254020 = ...`` opens a text, ``@obverse``,
``@reverse``, ``@left edge``, ``@column 2`` name where the following lines
stand, ``#atf: use math`` is a protocol, ``#lem:``, ``#tr.en:`` and other
``#`` lines are notes, ``$`` lines are comments on the state of the tablet,
and a text line starts with its number (``3.``, ``2'.``, ``10a.``).  Each
text line gets a label as editions cite it: surface, column and line
(``o 3``, ``r ii 2'``).
"""

from __future__ import annotations

import re
from dataclasses import dataclass

__all__ = ["AtfLine", "text_lines", "SURFACES"]

#: Surface names of ATF and the abbreviations editions cite lines by (common practice).
SURFACES = {"obverse": "o", "reverse": "r", "left": "le", "right": "re", "top": "te",
            "bottom": "be", "edge": "e", "seal": "seal", "face": "f", "surface": "s"}

_LINE_NUMBER = re.compile(r"^([0-9]+[a-z]?'*)\.(?:[ \t]+|$)")
_ROMAN = ("", "i", "ii", "iii", "iv", "v", "vi", "vii", "viii", "ix", "x", "xi", "xii")


@dataclass(frozen=True)
class AtfLine:
    """One text line of an ATF file."""

    text_id: str        # P254020 (the '&' line), '' before any
    label: str          # 'o 3', 'r ii 2''
    number: int         # 1-based line of the file
    content: str        # the transliteration after the line number
    offset: int         # where *content* starts in the file line (0-based)
    math: bool          # '#atf: use math' is in force


def _surface(line: str) -> str | None:
    words = line[1:].split()
    if not words:
        return None
    name = words[0].lower()
    if name == "left" and len(words) > 1 and words[1].lower() == "edge":
        return "le"
    if name in ("right", "top", "bottom") and len(words) > 1 and words[1].lower() == "edge":
        return SURFACES[name]
    return SURFACES.get(name)


def text_lines(source: str) -> list[AtfLine]:
    """The text lines of an ATF file with their labels (comments, notes and translations left out).

    >>> [(l.label, l.content) for l in text_lines("&P1 = x\\n@obverse\\n1. 3(u) sze\\n#tr.en: 30 barley\\n")]
    [('o 1', '3(u) sze')]
    """
    out: list[AtfLine] = []
    text_id = ""
    surface = ""
    column = 0
    math = False
    for number, raw in enumerate(source.splitlines(), start=1):
        line = raw.rstrip()
        if not line.strip():
            continue
        if line.startswith("&"):
            text_id = line[1:].split("=")[0].strip()
            surface, column, math = "", 0, False
            continue
        if line.startswith("#"):
            if re.match(r"#atf:\s*use\s+math\b", line):
                math = True
            continue
        if line.startswith("@"):
            words = line[1:].split()
            if words and words[0].lower() == "column":
                column = int(words[1]) if len(words) > 1 and words[1].isdigit() else column + 1
                continue
            found = _surface(line)
            if found is not None:
                surface, column = found, 0
            continue
        if line.startswith(("$", "=", ">>", "<<")):
            continue
        m = _LINE_NUMBER.match(line)
        if not m:
            continue
        parts = [surface] if surface else []
        if column:
            parts.append(_ROMAN[column] if column < len(_ROMAN) else str(column))
        parts.append(m.group(1))
        out.append(AtfLine(text_id, " ".join(parts), number, line[m.end():], m.end(), math))
    return out
