"""The standard Old Babylonian reciprocal table audits clean, and injected slips are found.

Source of the table: the standard OB reciprocal table, regular numbers 2 ...
1,21 with their reciprocals (Neugebauer & Sachs, Mathematical Cuneiform Texts,
1945; the list as computed in the project's reference notes,
schemes-and-slips.md §1.6, "reciprocals-ob.csv", each pair checked so that
n × igi(n) is a power of 60).  The check below recomputes each pair
independently with Fractions, so the table cannot drift.
"""

from __future__ import annotations


import pandas as pd
import pytest

from numcheck.audit import audit

# (n, igi(n)) in floating sexagesimal, as in MCT's standard table.
OB_RECIPROCALS = [
    ("2", "30"), ("3", "20"), ("4", "15"), ("5", "12"), ("6", "10"), ("8", "7,30"),
    ("9", "6,40"), ("10", "6"), ("12", "5"), ("15", "4"), ("16", "3,45"), ("18", "3,20"),
    ("20", "3"), ("24", "2,30"), ("25", "2,24"), ("27", "2,13,20"), ("30", "2"),
    ("32", "1,52,30"), ("36", "1,40"), ("40", "1,30"), ("45", "1,20"), ("48", "1,15"),
    ("50", "1,12"), ("54", "1,6,40"), ("1", "1"), ("1,4", "56,15"), ("1,12", "50"),
    ("1,15", "48"), ("1,20", "45"), ("1,21", "44,26,40"),
]


def _int(text: str) -> int:
    total = 0
    for p in text.split(","):
        total = total * 60 + int(p)
    return total


def test_the_table_itself_is_right():
    assert len(OB_RECIPROCALS) == 30 and len({n for n, _ in OB_RECIPROCALS}) == 30
    for n, igi in OB_RECIPROCALS:
        product = _int(n) * _int(igi)
        while product % 60 == 0:
            product //= 60
        assert product == 1, (n, igi)


def _table(rows=OB_RECIPROCALS):
    return pd.DataFrame({"n": [r[0] for r in rows], "igi": [r[1] for r in rows]})


@pytest.mark.parametrize("notation", ["cuneiform", "sexagesimal"])
def test_clean_table_audits_clean(notation):
    r = audit(_table(), notation=notation)
    assert r.flags == [] and r.restorations == []
    (scheme,) = r.schemes
    assert (scheme.column, scheme.kind, scheme.params()["of"]) == ("igi", "reciprocal", "n")


def _one_slip(row: int, column: str, text: str):
    rows = [list(r) for r in OB_RECIPROCALS]
    rows[row - 1][0 if column == "n" else 1] = text
    r = audit(_table(rows), notation="cuneiform")
    slips = [f for f in r.flags if f["kind"] != "carried-forward"]
    assert len(slips) == 1, r.flags
    return slips[0]


@pytest.mark.parametrize("row, written, kind, expected", [
    (16, "2,14,20", "unit-slip", "2,13,20"),     # 27: one unit wedge too many in the middle place
    (18, "1,42,30", "ten-slip", "1,52,30"),      # 32: one ten-corner too few
    (16, "15,20", "merged-places", "2,13,20"),   # 27: the separation between 2 and 13 lost
    (26, "50,6,15", "split-place", "56,15"),     # 1,4: 56 written as two places 50 and 6
    (14, "3", "copied-neighbour", "2,30"),       # 24: the igi of the line above (20: 3) copied
])
def test_slip_in_the_igi_column_is_found_and_corrected(row, written, kind, expected):
    f = _one_slip(row, "igi", written)
    assert (f["row"], f["column"], f["kind"], f["expected"]) == (row, "igi", kind, expected)


def test_a_number_that_is_not_regular_holds_the_slip():
    # 1,12 (72) written 1,13 (73, not regular): the slip is in n, not in its igi 50.
    f = _one_slip(27, "n", "1,13")
    assert (f["row"], f["column"], f["kind"], f["expected"]) == (27, "n", "unit-slip", "1,12")


def test_damaged_igi_is_restored():
    rows = [list(r) for r in OB_RECIPROCALS]
    rows[29][1] = "44,2[x],40"
    r = audit(_table(rows), notation="cuneiform")
    assert r.flags == []
    best = r.restorations[0]
    assert (best.index + 1, best.column, best.text) == (30, "igi", "44,2[6],40")
    assert best.probability > 0.5
    assert best.value == 44 * 3600 + 26 * 60 + 40        # at the scale the cell is read at
    texts = [x.text for x in r.restorations]
    assert len(texts) == len(set(texts))                  # one line per reading, all magnitudes summed
