"""Tables and notes for the terminal that a scholar can read at 80 columns and paste.

Every command builds its screen from :class:`Sheet` (a table whose cells are
plain text) and :func:`notes` (numbered prose below it).  The rules:

* a ``number`` or ``key`` column is never wrapped: a sexagesimal number or a
  catalogue id is one piece, and the column is as wide as its widest cell;
* a ``text`` column wraps between words only: it is never narrower than its
  longest word, so no word is broken and nothing is cut with an ellipsis;
* long prose goes below the table as numbered notes, wrapped between words;
* on a terminal the header is underlined with a thin rule and cells may be
  coloured; through a pipe the same screen is plain text (no colour codes,
  ASCII rules), so it can be pasted into an edition or an e-mail.

Width follows the terminal (rich reads it, and ``COLUMNS`` when piped; 80 by
default).

Through a pipe the command line hands these functions a
:class:`~numcheck.report.plain.PlainConsole`: then each writes its lines
without rich where :mod:`numcheck.report.plain` can lay them out exactly as
rich would, so a command piped into a script does not pay for importing rich.
"""

from __future__ import annotations

from contextlib import contextmanager
from dataclasses import dataclass, field

from .plain import PlainConsole, fields_lines, notes_lines, sheet_lines, text_width, wrap

__all__ = ["Sheet", "notes", "note", "indented", "fields", "busy", "plain_box", "key_line",
           "singular_ones"]

#: Column kinds: how a column may be laid out.
KINDS = ("number", "key", "text")


def plain_box():
    """The frame of a table through a pipe: a header rule of ASCII hyphens, nothing else."""
    from rich import box

    return box.Box(
        "    \n"
        "    \n"
        " -- \n"
        "    \n"
        " -- \n"
        " -- \n"
        "    \n"
        "    \n",
        ascii=True,
    )


def _box(console):
    from rich import box

    return box.SIMPLE_HEAD if console.is_terminal else plain_box()


def _longest_word(text: str) -> int:
    from rich.cells import cell_len

    return max((cell_len(w) for w in text.split()), default=0)


@dataclass
class _Column:
    name: str
    kind: str
    justify: str


@dataclass
class Sheet:
    """A table of plain-text cells laid out by the rules of this module.

    >>> from rich.console import Console
    >>> import io
    >>> c = Console(file=io.StringIO(), width=40)
    >>> s = Sheet(c, [("id", "key"), ("value", "number")])
    >>> s.row("saros_almagest", "6585;20")
    >>> s.print()
    >>> for line in c.file.getvalue().splitlines(): print(line.rstrip())
     id              value
    -------------------------
     saros_almagest  6585;20
    """

    console: object
    columns: list
    title: str | None = None
    _cols: list = field(default_factory=list, init=False)
    _rows: list = field(default_factory=list, init=False)

    def __post_init__(self):
        for spec in self.columns:
            name, kind = spec[0], spec[1]
            if kind not in KINDS:
                raise ValueError(f"column kind {kind!r} is not one of {KINDS}")
            justify = spec[2] if len(spec) > 2 else ("right" if kind == "number" else "left")
            self._cols.append(_Column(name, kind, justify))

    def row(self, *cells, style: str | None = None) -> None:
        """Add a row; a cell is a text or a (text, style) pair."""
        if len(cells) != len(self._cols):
            raise ValueError(f"{len(cells)} cells for {len(self._cols)} columns")
        out = []
        for cell in cells:
            text, cell_style = (cell, None) if isinstance(cell, str) else cell
            out.append((text or "", cell_style))
        self._rows.append((out, style))

    def section(self) -> None:
        """A rule between groups of rows."""
        self._rows.append((None, None))

    def __len__(self) -> int:
        return sum(1 for r, _ in self._rows if r is not None)

    def table(self):
        from rich.cells import cell_len
        from rich.table import Table

        color = self.console.is_terminal and not self.console.no_color
        t = Table(title=self.title, box=_box(self.console), show_edge=False, pad_edge=True,
                  header_style="bold" if color else None, title_style="bold" if color else None,
                  padding=(0, 1), collapse_padding=True)
        data = [[r[k][0] for r, _ in self._rows if r is not None] for k in range(len(self._cols))]
        wraps = [col.kind == "text" for col in self._cols]

        def width(k: int) -> int:
            words = [self._cols[k].name] + data[k]
            if wraps[k]:
                return max(_longest_word(c) for c in words)
            return max([_longest_word(self._cols[k].name)]
                       + [cell_len(ln) for c in data[k] for ln in (c.splitlines() or [""])])

        # Too wide for the screen even so: let the widest unbreakable column
        # that has spaces wrap between words rather than be cut.
        while sum(width(k) + 2 for k in range(len(self._cols))) > self.console.width:
            candidates = [k for k in range(len(self._cols))
                          if not wraps[k] and any(" " in c for c in data[k])]
            if not candidates:
                break
            wraps[max(candidates, key=width)] = True
        for k, col in enumerate(self._cols):
            if wraps[k]:
                t.add_column(col.name, justify=col.justify, min_width=width(k), overflow="fold")
            else:
                t.add_column(col.name, justify=col.justify, no_wrap=True, min_width=width(k),
                             overflow="ignore")
        pending_section = False
        for cells, style in self._rows:
            if cells is None:
                pending_section = True
                continue
            if pending_section:
                t.add_section()
                pending_section = False
            t.add_row(*[_cell(text, (s if color else None) or "", wraps[k])
                        for k, (text, s) in enumerate(cells)], style=style if color else None)
        return t

    def print(self) -> None:
        if isinstance(self.console, PlainConsole):
            lines = sheet_lines(self.title, [(c.name, c.kind == "text", c.justify) for c in self._cols],
                                [None if r is None else [text for text, _ in r] for r, _ in self._rows],
                                self.console.width)
            if lines is not None:
                self.console.lines(lines)
                return
        self.console.print(self.table())


def _cell(text: str, style: str, wraps: bool):
    """A cell: its lines; in a wrapping column a line that starts with spaces keeps
    that indent on every line it wraps to."""
    from rich.text import Text

    if not wraps or "\n" not in text:
        return Text(text, style=style)
    from rich.console import Group
    from rich.padding import Padding

    parts = []
    for line in text.split("\n"):
        indent = len(line) - len(line.lstrip(" "))
        piece = Text(line.lstrip(" "), style=style)
        parts.append(Padding(piece, (0, 0, 0, indent)) if indent else piece)
    return Group(*parts)


def notes(console, items, *, first: int = 1, marker: str = "{}.") -> None:
    """Numbered prose below a table, each note wrapped between words with a hanging indent."""
    items = list(items)
    if not items:
        return
    if isinstance(console, PlainConsole):
        pairs = [(marker.format(first + k), item) if isinstance(item, str) else item
                 for k, item in enumerate(items)]
        widths = [text_width(marker.format(first + k)) for k in range(len(items))]
        lines = None if None in widths else notes_lines(pairs, max(widths), console.width)
        if lines is not None:
            console.lines(lines)
            return
    from rich.cells import cell_len
    from rich.table import Table
    from rich.text import Text

    grid = Table.grid(padding=(0, 1))
    width = max(cell_len(marker.format(first + k)) for k in range(len(items)))
    grid.add_column(justify="right", no_wrap=True, min_width=width)
    grid.add_column(overflow="fold")
    for k, item in enumerate(items):
        label, text = (marker.format(first + k), item) if isinstance(item, str) else item
        grid.add_row(label, Text(text))
    console.print(grid)


def note(console, text: str, style: str | None = None) -> None:
    """One paragraph of prose, wrapped between words (no markup read in *text*)."""
    if isinstance(console, PlainConsole):
        lines = wrap(text, console.width)
        if lines is not None:
            console.lines(lines)
            return
    from rich.text import Text

    color = console.is_terminal and not console.no_color
    console.print(Text(text, style=(style if color else None) or ""))


def indented(console, text: str, indent: int = 2, style: str | None = None) -> None:
    """A paragraph indented as a whole (every wrapped line too), wrapped between words."""
    if isinstance(console, PlainConsole):
        lines = wrap(text, console.width - indent)
        if lines is not None:
            console.lines((" " * indent + line).rstrip() for line in lines)
            return
    from rich.padding import Padding
    from rich.text import Text

    color = console.is_terminal and not console.no_color
    console.print(Padding(Text(text, style=(style if color else None) or ""), (0, 0, 0, indent)))


def fields(console, title: str, rows) -> None:
    """A framed block of labelled values under a title (labels bold on a terminal).

    *rows* are (label, value) pairs of plain text (no markup read); a value
    wraps between words.  Through a pipe the frame is ASCII, so that the text
    pastes anywhere.
    """
    rows = list(rows)
    if isinstance(console, PlainConsole):
        lines = fields_lines(title, rows, console.width)
        if lines is not None:
            console.lines(lines)
            return
    from rich import box
    from rich.markup import escape
    from rich.panel import Panel
    from rich.table import Table

    grid = Table.grid(padding=(0, 2))
    grid.add_column(style="bold")
    grid.add_column()
    for label, value in rows:
        grid.add_row(escape(label), escape(value))
    console.print(Panel.fit(grid, title=escape(title),
                            box=box.ROUNDED if console.is_terminal else box.ASCII))


def key_line(pairs) -> str:
    """A key for the colours of a screen, as text for its last line.

    >>> key_line([("slip", "red"), ("restored", "cyan")])
    'key: slip red, restored cyan'
    """
    return "key: " + ", ".join(f"{what} {colour}" for what, colour in pairs)


#: A search shorter than this shows nothing; a longer one a spinner (seconds).
BUSY_AFTER = 1.0


@contextmanager
def busy(console, what: str, after: float | None = None):
    """Show that a slow search is running (a spinner and the time spent), on a terminal only.

    The spinner appears only once the search has taken *after* seconds
    (``BUSY_AFTER``), so quick answers print as before.  Through a pipe, with
    ``--json`` (``console`` None) or on a console that is not a terminal
    nothing is drawn, so no stray characters reach the output.  The spinner
    is transient: it vanishes when the search ends.
    """
    if console is None or not console.is_terminal:
        yield
        return
    import threading

    from rich.progress import Progress, SpinnerColumn, TextColumn, TimeElapsedColumn

    bar = Progress(SpinnerColumn(), TextColumn(what), TimeElapsedColumn(), console=console,
                   transient=True)
    bar.add_task(what, total=None)
    lock = threading.Lock()
    state = {"done": False, "shown": False}

    def show():
        with lock:
            if not state["done"]:
                bar.start()
                state["shown"] = True

    timer = threading.Timer(BUSY_AFTER if after is None else after, show)
    timer.daemon = True
    timer.start()
    try:
        yield
    finally:
        timer.cancel()
        with lock:
            state["done"] = True
            if state["shown"]:
                bar.stop()


_ONE_PLURAL = None


def singular_ones(text: str) -> str:
    """"1 synodic months" reads "1 synodic month" (a count of one is singular).

    >>> singular_ones("1 synodic months = 29;31,50,8,20 days")
    '1 synodic month = 29;31,50,8,20 days'
    >>> singular_ones("241 sidereal months + 10 2/3 degrees; 1 readings")
    '241 sidereal months + 10 2/3 degrees; 1 reading'
    """
    import re

    global _ONE_PLURAL
    if _ONE_PLURAL is None:
        _ONE_PLURAL = re.compile(r"(?<![\d/;,.:])\b1 ((?:[A-Za-zāēīōū]+ )?)([A-Za-z]+?)s\b")
    return _ONE_PLURAL.sub(lambda m: f"1 {m.group(1)}{m.group(2)}", text)
