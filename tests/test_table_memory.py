"""The compact paths that keep a 10^6-line table small give the plain paths' results.

Cells kept in arrays (numcheck.tables.cells.Cells), a text table split
column by column (numcheck.tables.text.split_columns), a constant found by
majority vote and differences walked without a list (numcheck.audit.schemes).
Memory itself is measured by benchmarks/table_memory.py, never here.
"""

from __future__ import annotations

import pytest

from numcheck.audit.schemes import DiffPairs, diffs, majority, mode
from numcheck.tables import cells as cells_module
from numcheck.tables import text as text_module
from numcheck.tables.cells import Cells, _cell, read_cells
from numcheck.tables.text import split_columns, split_text

TEXTS = [
    "1", "59", "60", "3438", "-1", "0;30", "1,2;3,4", "29;31,50", "-0;0,1", "05;07",
    "14;11,57,4 Libra", "29;59 Pisces", "31 Aries", "1;2 Nosign", "", "[...]", "1;60",
    "ιβ", "garbage", "1," * 30 + "1", "1,0,0,0,0,0,0,0,0,0,0,0;0,0,0,0,0,0,1",
]


@pytest.mark.parametrize("notation", [None, "sexagesimal", "cuneiform", "greek"])
def test_cells_give_the_cells_the_reader_makes(notation):
    got = read_cells("A", TEXTS, notation, "<t>")
    want = [_cell(i + 1, "A", t, notation, "<t>") for i, t in enumerate(TEXTS)]
    assert len(got) == len(want)
    assert list(got) == want
    assert [got[i] for i in range(-len(want), 0)] == want
    assert list(got.texts()) == TEXTS
    assert got.values() == [c.value for c in want]
    assert list(got.known_places()) == [c.places for c in want if c.value is not None]


def test_cells_of_cell_objects_and_replacing_one():
    want = [_cell(i + 1, "A", t, None, "<t>") for i, t in enumerate(TEXTS)]
    got = Cells.of("A", want)
    assert list(got) == want
    other = _cell(3, "A", "7", None, "<t>")
    got[2] = other
    assert got[2] is other


def _rows_of(data):
    return data if isinstance(data, list) else [list(r) for r in zip(*data.columns)]


TABLES = [
    ("n\tlon\n1\t1;2\n\n# a note\n2\t1;3\r\n3\t é\n", ""),
    ('n,lon\n1,"1;2,3"\n2,"1;2,\n4"\n# note\n3,"5"\n', ".csv"),
    ("A  B\n1;2  3;4\n5;6  7;8\n", ""),
    ("A B\n29;31,20 14;11 Libra\n1 2\n", ""),
    ("n\tlon\n1\t2\n3\n4\t5\n", ""),          # ragged
    ("A\u2028B\tC\n1\t2\x0c3\t4\n", ""),
]


@pytest.mark.parametrize("text,suffix", TABLES)
@pytest.mark.parametrize("chunk", [1, 3, 1 << 20])
def test_split_columns_reads_as_split_text(text, suffix, chunk, monkeypatch):
    import unicodedata
    monkeypatch.setattr(text_module, "_CHUNK", chunk)
    header, rows = split_text(text, suffix=suffix)
    got_header, data = split_columns(text, suffix=suffix)
    assert got_header == header
    nfc = [[unicodedata.normalize("NFC", c) for c in r] for r in rows]
    assert [[unicodedata.normalize("NFC", c) for c in r] for r in _rows_of(data)] == nfc


def test_majority_is_the_mode_when_it_is_most():
    for items in ([1], [1, 2], [2, 2, 1], [1, 2, 3, 1, 1], [5, 5, 6, 6], [0, 0, 1], list("abacad")):
        v, n = mode(items)
        assert majority(items) == (v if n * 2 > len(items) else None)


@pytest.mark.parametrize("modulus", [None, 7])
def test_diff_pairs_are_diffs(modulus):
    values = [1, 5, None, 9, 10, 30, None, None, 31, 2]
    pairs = DiffPairs(values, modulus)
    want = diffs(values, modulus)
    assert [pairs[k] for k in range(len(pairs))] == want
    assert list(pairs.differences()) == [d for _, d in want]


def _segments_by_index(pairs, d, run_length=3):
    # the walk as it was written before (pairs[k] for every k): the reference
    out, current, k = [], d, 0
    while k < len(pairs):
        i, x = pairs[k]
        if x != current and x != -current:
            run = 1
            while (k + run < len(pairs) and pairs[k + run][1] == x
                   and pairs[k + run][0] == pairs[k + run - 1][0] + 1):
                run += 1
            if run >= run_length and x:
                out.append((i, x))
                current = x
                k += run
                continue
        k += 1
    return out


@pytest.mark.parametrize("values", [
    [0, 1, 2, 3, 5, 7, 9, 11, 12, 13, 10, 7, 4, 1, 2],
    [0, 1, 2, 4, 6, 8, 10, 11, 12, 13, 14, 24, 34, 44],
    [0, 2, 4, None, 6, 8, 10, 12, 13, 14, 15, 16],
    [0, 5, 10, 15, 20],
])
def test_segments_walk_as_before(values):
    from numcheck.audit.schemes import _segments
    want = _segments_by_index(diffs(values), 1)
    assert _segments(DiffPairs(values), 1) == _segments(diffs(values), 1) == want
