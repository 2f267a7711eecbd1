"""Screens through a pipe, written without loading rich.

A script or an editor that calls ``numcheck read`` once per number reads its
answer through a pipe, where the screen is plain text anyway (no colours,
ASCII rules).  Importing rich costs more than the rest of such a command, so
through a pipe the layouts of :mod:`numcheck.report.layout` are written here
as plain lines, character for character what rich writes for the same
layout: ``tests/test_plain_screens.py`` renders random sheets, notes and
panels both ways and compares them.

This module only writes what it can lay out exactly: a table that fits the
width without narrowing a column, prose wrapped between words, characters
whose width on a terminal it knows.  For anything else every function here
returns ``None`` and the caller lets rich draw it (rich is then imported, as
before).
"""

from __future__ import annotations

import os
import re
import unicodedata

__all__ = ["PlainConsole", "plain_width", "text_width", "wrap", "sheet_lines", "notes_lines",
           "fields_lines"]


def _char_width(c: str) -> int | None:
    """The cells a character takes on a terminal, or None when this module does not know.

    Known: printable ASCII, and below U+2500 (Latin, Greek, Hebrew, Arabic,
    Devanagari, punctuation, letterlike signs, number forms, arrows and
    mathematical operators) every letter, digit, mark, symbol and space
    except spacing combining marks (Mc) and the Hangul jamo, whose widths
    terminals and Unicode versions disagree on.  A test checks every known
    character against rich's own table.
    """
    if " " <= c <= "~":
        return 1
    cp = ord(c)
    if cp >= 0x2500 or 0x1100 <= cp < 0x1200:
        return None
    cat = unicodedata.category(c)
    if cat in ("Mn", "Me"):
        return 0
    if cat[0] == "C" or cat in ("Zl", "Zp", "Mc"):
        return None
    return 2 if unicodedata.east_asian_width(c) in "WF" else 1


def _clusters(text: str) -> list[tuple[str, int]] | None:
    """The text as (character with its combining marks, width) pieces, or None if unknown."""
    out: list[tuple[str, int]] = []
    for c in text:
        w = _char_width(c)
        if w is None:
            return None
        if w == 0:
            if not out or out[-1][0][0].isspace():
                return None        # a mark with nothing to sit on: leave it to rich
            out[-1] = (out[-1][0] + c, out[-1][1])
        else:
            out.append((c, w))
    return out


def text_width(text: str) -> int | None:
    """The cells *text* takes on a terminal, or None when a character is not known here."""
    if text.isascii():
        return len(text) if text.isprintable() else None
    pieces = _clusters(text)
    return None if pieces is None else sum(w for _, w in pieces)


def _chop(word: str, width: int) -> list[str]:
    """A word longer than the width, cut into pieces of at most *width* cells."""
    lines, line, size = [], "", 0
    for piece, w in _clusters(word) or []:
        if size + w > width:
            lines.append(line)
            line, size = "", 0
        line += piece
        size += w
    if size:
        lines.append(line)
    return lines


_WORD = re.compile(r"\s*\S+\s*")


def _breaks(text: str, width: int) -> list[int]:
    """Where a line of text breaks to fit *width*: a word goes whole to the next line
    when it does not fit; a word longer than a line is folded."""
    breaks: list[int] = []
    offset = 0
    for m in _WORD.finditer(text):
        start, word = m.start(), m.group(0)
        length = text_width(word.rstrip())
        if width - offset >= length:
            offset += text_width(word)
        elif length > width:
            pieces = _chop(word, width)
            for k, piece in enumerate(pieces):
                if start:
                    breaks.append(start)
                if k == len(pieces) - 1:
                    offset = text_width(piece)
                else:
                    start += len(piece)
        elif offset and start:
            breaks.append(start)
            offset = text_width(word)
    return breaks


def wrap(text: str, width: int) -> list[str] | None:
    """*text* wrapped between words to lines of at most *width* cells (a word longer than
    a line is folded), each line without trailing blanks; None if it cannot be laid out here."""
    if width < 1 or "\t" in text or text_width(text.replace("\n", "")) is None:
        return None
    lines = []
    for line in text.split("\n"):
        cuts = [0, *_breaks(line, width), len(line)]
        lines.extend(line[a:b].rstrip() for a, b in zip(cuts, cuts[1:]))
    return lines


def _no_emoji(text: str) -> bool:
    """True when rich would not take part of *text* for an emoji code (``:name:``)."""
    return not re.search(r":\S*?:", text)


def _plain_markup(text: str) -> bool:
    """True when rich would show *text* (a header or title read as markup) unchanged."""
    return "[" not in text and _no_emoji(text)


def _pad(text: str, width: int, justify: str = "left") -> str:
    space = width - text_width(text)
    if justify == "right":
        return " " * space + text
    if justify == "center":
        return " " * (space // 2) + text + " " * (space - space // 2)
    return text + " " * space


def sheet_lines(title, columns, rows, width: int) -> list[str] | None:
    """The lines of a sheet (see layout.Sheet) when it fits *width* as it is.

    *columns* are (header, wraps, justify); *rows* are lists of cell texts, or
    None for a rule between sections.  None when a column would have to be
    narrowed, a header or the title is not plain text, or a character is not
    known here.
    """
    data = [cells for cells in rows if cells is not None]
    if not data:
        return None
    headers = [name for name, _, _ in columns]
    if not all(_plain_markup(h) for h in headers) or (title and not _plain_markup(title)):
        return None
    widths = []
    for k, (name, wraps, _) in enumerate(columns):
        cells = [name] + [cells[k] for cells in data]
        if any("\t" in c for c in cells):
            return None
        if wraps and any(ln and not ln.strip(" ") for c in cells if "\n" in c for ln in c.split("\n")):
            return None     # rich drops a line of spaces alone in a wrapping cell
        sizes = [text_width(ln) for c in cells for ln in c.split("\n")]
        if None in sizes:
            return None
        widths.append(max(sizes))
    pads = [(1, 1)] + [(0, 1)] * (len(columns) - 1)
    total = sum(w + a + b for w, (a, b) in zip(widths, pads)) + len(columns) - 1
    if total > width:
        return None
    if title:
        heading = wrap(title, total)
        if heading is None or len(heading) != 1:
            return None

    def line(cells: list[str]) -> list[str]:
        split = [c.split("\n") for c in cells]
        height = max(len(s) for s in split)
        out = []
        for i in range(height):
            parts = []
            for k, (_, wraps, justify) in enumerate(columns):
                text = split[k][i] if i < len(split[k]) else ""
                # rich right-aligns or centres only a column that may wrap; a
                # column that never wraps shows its text from the left.
                how = justify if wraps else "left"
                if how != "left":
                    text = text.rstrip()
                a, b = pads[k]
                parts.append(" " * a + _pad(text, widths[k], how) + " " * b)
            out.append(" ".join(parts).rstrip())
        return out

    lines = [_pad(heading[0], total, "center").rstrip()] if title else []
    lines += line(headers)
    lines.append("-" * total)
    seen_row = rule_due = False
    for cells in rows:
        if cells is None:
            rule_due = seen_row      # a rule only between two rows
            continue
        if rule_due:
            lines.append("-" * total)
            rule_due = False
        lines += line(cells)
        seen_row = True
    return lines


def notes_lines(items, label_width: int, width: int) -> list[str] | None:
    """Numbered notes (label, text) with a hanging indent, wrapped to *width*; None if not
    laid out here."""
    labels = [text_width(label) for label, _ in items]
    if None in labels or not all(_plain_markup(label) for label, _ in items):
        return None
    left = max([label_width, *labels])
    room = width - left - 1
    if room < 1:
        return None
    out = []
    for (label, text), size in zip(items, labels):
        lines = wrap(text, room)
        if lines is None:
            return None
        out.append((" " * (left - size) + label + " " + lines[0]).rstrip())
        out.extend((" " * (left + 1) + ln).rstrip() for ln in lines[1:])
    return out


def fields_lines(title: str, rows, width: int) -> list[str] | None:
    """A framed block of (label, value) lines under a title (see layout.fields), in ASCII.

    The frame is as wide as its widest line (the title's included) and no
    wider than *width*; the values wrap between words.  None when the labels
    would have to wrap too, or a character is not known here.
    """
    if not rows or "\n" in title or not _no_emoji(title):
        return None
    label = [text_width(a) for a, _ in rows]
    value_lines = [v.split("\n") for _, v in rows]
    if None in label or any(not _no_emoji(a + " " + v) or "\t" in v for a, v in rows):
        return None
    sizes = [text_width(ln) for vs in value_lines for ln in vs]
    if None in sizes or text_width(title) is None:
        return None
    w1, w2 = max(label) + 2, max(sizes)
    inner = width - 4                     # the frame and its padding
    if w1 + w2 > inner:
        excess = w1 + w2 - inner
        if excess > w2 - w1:
            return None
        w2 -= excess
        if any(len(w) > w2 for _, v in rows for w in v.split()):
            return None   # a value's word longer than its column: rich would cut it
    child = min(width - 2, max(w1 + w2 + 2, text_width(title) + 4))
    top_room = child - 2
    heading = f" {title} "
    if text_width(heading) > top_room:
        return None
    excess = top_room - text_width(heading)
    lines = ["+-" + "-" * (excess // 2) + heading + "-" * (excess - excess // 2) + "-+"]
    content = child - 2
    for (name, value), size in zip(rows, label):
        wrapped = wrap(value, w2)
        if wrapped is None:
            return None
        for k, ln in enumerate(wrapped):
            head = name + " " * (w1 - size) if k == 0 else " " * w1
            lines.append("| " + _pad(head + ln, content) + " |")
    lines.append("+" + "-" * child + "+")
    return lines


def plain_width(environ=None) -> int:
    """The width rich would give a console that is not a terminal: ``COLUMNS`` if set,
    else the size of the first standard stream that is a terminal, else 80."""
    environ = os.environ if environ is None else environ
    columns = environ.get("COLUMNS")
    if columns is not None and columns.isdigit():
        return int(columns)
    for fd in (0, 1, 2):
        try:
            size = os.get_terminal_size(fd).columns
        except (AttributeError, ValueError, OSError):
            continue
        return size or 80
    return 80


class PlainConsole:
    """What the screens print to through a pipe: plain lines, rich only on demand.

    The layouts write their lines here directly; whatever else a command
    prints (a rich renderable, text with markup, a status) goes to a rich
    console on the same stream with the same width, made on first use.
    """

    is_terminal = False
    no_color = True

    def __init__(self, file, width: int, fallback):
        self.file = file
        self.width = width
        self._fallback = fallback
        self._rich = None

    def lines(self, lines) -> None:
        self.file.write("".join(line + "\n" for line in lines))

    def rich(self):
        if self._rich is None:
            self._rich = self._fallback(self.file, self.width)
        return self._rich

    def print(self, *objects, **options) -> None:
        if not objects and not options:
            self.file.write("\n")
        else:
            self.rich().print(*objects, **options)

    def __getattr__(self, name):
        return getattr(self.rich(), name)
