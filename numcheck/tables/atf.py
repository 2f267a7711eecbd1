"""A tabular ATF text as a table: one row per text line, one column per number word.

Mathematical tables (reciprocals, multiplications, lengths × rates) are
transliterated one entry per line: ``igi 2(disz) gal2-bi 3(u)`` or, in
Oracc's mathematical style, ``igi 2 gal₂-bi 30``.  Each text line with
numbers is a row; the number words of the line, in order, are its cells,
written back in their own style with balanced brackets.  A column is named
after the word before its numbers when every row has the same one (``igi``,
``gal2-bi``), else ``A``, ``B``, ...  Numbers of disz and u signs only, or
of the mathematical style, float (notation ``atf-math``); others are counts.
"""

from __future__ import annotations

import re
from collections import Counter

from ..atf.lines import text_lines
from ..atf.words import number_words
from ..errors import NumcheckError
from ..notations.atf import format as format_atf

__all__ = ["atf_rows"]

_COUNT_SIGN = re.compile(r"\((?!(?:disz|diš|asz|aš|u)(?:@[a-z])*\))[^()]+\)")


def atf_rows(source: str, name: str = "<atf>") -> tuple[list[str], list[list[str]], str]:
    """The header, the rows of cell texts and the notation of a tabular ATF text."""
    rows: list[tuple[str, list[str], list[str]]] = []    # label, cells, words before each number
    math = False
    for line in text_lines(source):
        math = math or line.math
        found, _traps = number_words(line.content, math=line.math)
        if not found:
            continue
        cells, before = [], []
        for w in found:
            # a number word that cannot be read stays as written: the table reports it and
            # audits the rest
            cells.append(w.text if w.reading is None else format_atf(w.reading))
            head = line.content[:w.start].split()
            before.append(head[-1].strip("[]#?!*<>") if head else "")
        rows.append((line.label, cells, before))
    if not rows:
        raise NumcheckError(f"The ATF file {name} has no text line with numbers: there is no table in it.")
    width = Counter(len(c) for _l, c, _b in rows).most_common(1)[0][0]
    for label, cells, _b in rows:
        if len(cells) != width:
            raise NumcheckError(f"Line {label} of {name} has {len(cells)} numbers but most lines of the "
                                f"table have {width}: the rows are ragged. Check line {label}.")
    header = []
    for j in range(width):
        names = {b[j] for _l, _c, b in rows}
        word = names.pop() if len(names) == 1 else ""
        header.append(word if word and word not in header and not word[0].isdigit() else
                      chr(ord("A") + j) if j < 26 else f"col{j + 1}")
    every = " ".join(c for _l, cells, _b in rows for c in cells)
    floating = math or not _COUNT_SIGN.search(every)
    return header, [cells for _l, cells, _b in rows], "atf-math" if floating else "atf"
