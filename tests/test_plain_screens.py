"""Screens through a pipe: the plain writer (numcheck.report.plain) gives rich's text exactly.

Through a pipe the command line writes its screens without importing rich
(a start in a third of the time).  Each layout of numcheck.report.layout is
drawn here both ways, by rich on a console that is not a terminal and by the
plain writer, on random contents, and the texts must be the same.  The
reference is rich itself (the library that draws the terminal screens).
"""

from __future__ import annotations

import io

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st
from rich.cells import get_character_cell_size
from rich.console import Console

from numcheck.report import layout
from numcheck.report.plain import PlainConsole, _char_width, text_width, wrap


def _rich_console(file, width):
    return Console(file=file, width=width, highlight=False, soft_wrap=False, force_terminal=False,
                   color_system=None)


def _text(console) -> str:
    return "\n".join(line.rstrip() for line in console.file.getvalue().split("\n"))


def _both(draw, width: int):
    """The screen *draw* makes, by rich and by the plain writer; and whether the plain
    writer needed rich."""
    rich = _rich_console(io.StringIO(), width)
    draw(rich)
    plain = PlainConsole(io.StringIO(), width, _rich_console)
    draw(plain)
    return _text(rich), _text(plain), plain._rich is not None


# Characters the screens show: ASCII, Greek with its marks, the signs of the
# notations, and a few the plain writer leaves to rich (wide CJK, a tab).
_COMMON = "abcdefghijklmnopqrstuvwxyz ABCXYZ 0123456789 ,;.:-+()[]/'\"_ "
_GREEK = "αβγδεϛζηθικλμνξοπϙρστυφχψωϡ͵ʹ" + "\u0323\u0300" + "×∠…—–·"
_HARD = "\u4e00\u3042\t\u200b"
_WORDS = st.text(alphabet=_COMMON + _GREEK, min_size=0, max_size=12)
_ANY = st.text(alphabet=_COMMON + _GREEK + _HARD, min_size=0, max_size=30)


def _prose(words):
    return st.lists(words, min_size=0, max_size=25).map(" ".join)


def test_character_widths_agree_with_rich():
    """Every character the plain writer measures itself has rich's width (rich's table)."""
    known = 0
    for cp in range(0x2600):
        if 0xD800 <= cp < 0xE000:
            continue
        c = chr(cp)
        w = _char_width(c)
        if w is not None:
            known += 1
            assert w == get_character_cell_size(c), hex(cp)
    assert known > 7000
    assert _char_width("\u4e00") is None and _char_width("\t") is None


@settings(max_examples=300, deadline=None)
@given(_ANY)
def test_text_width_agrees_with_rich(text):
    from rich.cells import cell_len

    w = text_width(text)
    if w is not None:
        assert w == cell_len(text)


@settings(max_examples=300, deadline=None)
@given(_prose(_WORDS) | _ANY, st.integers(20, 120))
def test_a_paragraph(text, width):
    r, p, _ = _both(lambda c: layout.note(c, text), width)
    assert p == r


@settings(max_examples=200, deadline=None)
@given(_prose(_WORDS), st.integers(20, 100), st.integers(0, 6))
def test_an_indented_paragraph(text, width, indent):
    r, p, _ = _both(lambda c: layout.indented(c, text, indent=indent), width)
    assert p == r


@settings(max_examples=200, deadline=None)
@given(st.lists(_prose(_WORDS) | _ANY, min_size=1, max_size=12), st.integers(20, 120),
       st.integers(1, 12), st.sampled_from(["{}.", "[{}]", "({})"]))
def test_numbered_notes(items, width, first, marker):
    r, p, _ = _both(lambda c: layout.notes(c, items, first=first, marker=marker), width)
    assert p == r


_CELL = st.one_of(_WORDS, _prose(_WORDS).map(lambda s: s[:40]),
                  st.tuples(_WORDS, _WORDS).map(lambda ab: f"{ab[0]}\n  {ab[1]}"), _ANY)


@st.composite
def _sheets(draw):
    kinds = draw(st.lists(st.sampled_from(layout.KINDS), min_size=1, max_size=6))
    names = draw(st.lists(st.sampled_from(["#", "id", "value", "may be", "statement and rows",
                                           "residual", "x"]), min_size=len(kinds),
                          max_size=len(kinds)))
    columns = [(n, k) for n, k in zip(names, kinds)]
    rows = draw(st.lists(st.one_of(st.none(), st.lists(_CELL, min_size=len(kinds), max_size=len(kinds))),
                         min_size=0, max_size=10))
    title = draw(st.one_of(st.none(), st.sampled_from(["places", "restorations of damaged cells",
                                                       "nearest catalogue numbers"])))
    return columns, rows, title


@settings(max_examples=400, deadline=None)
@given(_sheets(), st.integers(20, 140))
def test_a_sheet(sheet, width):
    columns, rows, title = sheet

    def draw(console):
        s = layout.Sheet(console, columns, title=title)
        for cells in rows:
            if cells is None:
                s.section()
            else:
                s.row(*cells)
        s.print()

    r, p, _ = _both(draw, width)
    assert p == r


@settings(max_examples=300, deadline=None)
@given(st.lists(st.tuples(st.sampled_from(["as typed", "notation", "sexagesimal", "value shown", "x"]),
                          _prose(_WORDS) | _ANY), min_size=1, max_size=8),
       _WORDS, st.integers(20, 120))
def test_a_framed_block(rows, title, width):
    r, p, _ = _both(lambda c: layout.fields(c, f"numcheck read  {title}", rows), width)
    assert p == r


def _screen_needs_no_rich(command, args) -> None:
    """The command's screen is written by the plain writer alone, and is rich's screen
    (drawn here on a rich console of the same width)."""
    plain = PlainConsole(io.StringIO(), 80, _rich_console)
    command.run(args, plain)
    assert plain._rich is None
    rich = _rich_console(io.StringIO(), 80)
    command.run(args, rich)
    assert _text(plain) == _text(rich)


@pytest.mark.parametrize("text", ["1,49,45;20", "κθ λα ν[.] η κ", "29;31,5[x],8,20", "ϛ̣ʹ"])
def test_read_screens_need_no_rich(text):
    from types import SimpleNamespace

    from numcheck.commands import read as read_command

    _screen_needs_no_rich(read_command, SimpleNamespace(text=text, notation=None, unit=None))


def test_the_demo_identify_screen_needs_no_rich():
    from types import SimpleNamespace

    from numcheck.commands import identify as identify_command

    _screen_needs_no_rich(identify_command, SimpleNamespace(text="1,49,45;20", notation=None, unit="days",
                                                            top=10, tradition=None, full=False))


def test_wrap_folds_a_word_longer_than_the_line():
    assert wrap("ab abcdefghij c", 4) == ["ab", "abcd", "efgh", "ij c"]
