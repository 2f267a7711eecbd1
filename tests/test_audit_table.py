"""Reading tables for the audit: formats, longitudes within signs, and bad input.

Bad input must give a NumcheckError that names the row and the column; the
input file is never modified (its hash is the same before and after).
"""

from __future__ import annotations

import hashlib
from fractions import Fraction as F

import pandas as pd
import pytest

from numcheck import NumcheckError, read
from numcheck.audit import audit
from numcheck.tables import read_table, split_text


def _write(tmp_path, name, text):  # noqa: D103 - a file for one test
    p = tmp_path / name
    p.write_text(text, encoding="utf-8")
    return p


def _hash(path):
    return hashlib.sha256(path.read_bytes()).hexdigest()


TSV = "A\tB\n29;31,20\t14;11,57,4 Libra\n29;49,20\t14;1,17,4 Scorpius\n"
CSV = 'A,B\n"29;31,20","14;11,57,4 Libra"\n"29;49,20","14;1,17,4 Scorpius"\n'
ALIGNED = "A          B\n29;31,20   14;11,57,4 Libra\n29;49,20   14;1,17,4 Scorpius\n"


@pytest.mark.parametrize("name, text", [("t.tsv", TSV), ("t.csv", CSV), ("t.txt", ALIGNED)])
def test_formats_read_the_same(tmp_path, name, text):
    t = read_table(_write(tmp_path, name, text))
    assert list(t.columns) == ["A", "B"]
    assert [c.value for c in t.columns["A"].cells] == [F(2657, 90), F(1342, 45)]
    # 14;11,57,4 Libra = 180° + 14;11,57,4 (units: zodiac signs of 30°, common practice)
    b = t.columns["B"]
    assert b.longitude and b.cells[0].value == 180 + F(14) + F(11, 60) + F(57, 3600) + F(4, 216000)
    assert b.cells[1].value == 210 + F(14) + F(1, 60) + F(17, 3600) + F(4, 216000)


def test_single_space_aligned_table_keeps_sign_names():
    header, rows = split_text("A B\n29;31,20 14;11 Libra\n")
    assert header == ["A", "B"] and rows == [["29;31,20", "14;11 Libra"]]


@pytest.mark.parametrize("text", ["1,49,45;20", "29;31,50,8,20", "-0;30", "7", "1,4", "59;59,59",
                                  "365;14,48", "0;0,0,1", "180", "3438", "-75"])
def test_fast_path_gives_the_value_of_read(text):
    df = pd.DataFrame({"X": [text]})
    (cell,) = read_table(df).columns["X"].cells
    assert cell.value == read(text).value


def test_dataframe_input_and_damaged_cells():
    t = read_table(pd.DataFrame({"X": ["1;30", "1;[x]0", "[...]"]}))
    cells = t.columns["X"].cells
    assert cells[0].value == F(3, 2) and cells[1].damaged and cells[2].damaged


BAD = [
    # (file text, words the message must contain, note)
    ("A\tB\n1\t2\n3\n", ["Row 2", "ragged"], "ragged rows"),
    ("", ["empty"], "an empty file"),
    ("A\tB\n", ["no data rows"], "a header and nothing else"),
    ("A\tB\n1;30\t2\n1;30 Libra\t3\n", ["Column 'A'", "row 1"], "a longitude beside plain numbers"),
    ("29;31,20\t1\n29;49,20\t2\n", ["header"], "a header missing"),
    ("A\tA\n1\t2\n", ["twice"], "a column named twice"),
]

#: One bad cell is no reason to refuse the table: it is listed under
#: "unreadable" (row, column, text, message) and the audit goes on (issue 14).
UNREADABLE = [
    # (file text, (row, column, text), words the message must contain, note)
    ("A\tB\n1\t2\nNisannu\t3\n4\t4\n", (2, "A", "Nisannu"), ["Row 2", "'A'", "Nisannu"],
     "a word among numbers"),
    ("A\tB\n1\t1\n2\t\n3\t3\n", (2, "B", ""), ["Row 2", "'B'", "empty"], "an empty cell"),
    ("A\tB\n1;30\t2\n31;0 Libra\t3\n2;30\t4\n", (2, "A", "31;0 Libra"), ["Row 2", "30 degrees"],
     "more than 30 degrees within a sign"),
]


@pytest.mark.parametrize("text, cell, words, note", UNREADABLE)
def test_an_unreadable_cell_is_listed_and_the_audit_goes_on(tmp_path, text, cell, words, note):
    path = _write(tmp_path, "odd.tsv", text)
    out = audit(path).to_dict()
    (u,) = out["unreadable"]
    assert (u["row"], u["column"], u["text"]) == cell, note
    for w in words:
        assert w in u["message"], (note, u["message"])
    assert not any(f["row"] == cell[0] and f["column"] == cell[1] for f in out["flags"]), note


def test_the_scheme_is_fitted_on_the_cells_that_read(tmp_path):
    # A constant difference of 0;10 with one cell typed with a letter O for a zero.
    path = _write(tmp_path, "o.tsv", "A\n1;0\n1;10\n1;20\n1;3O\n1;40\n1;50\n2;0\n")
    out = audit(path).to_dict()
    assert [(u["row"], u["text"]) for u in out["unreadable"]] == [(4, "1;3O")]
    (scheme,) = out["schemes"]
    assert (scheme["kind"], scheme["params"]["d"]["value"]) == ("linear", "1/6")
    assert out["flags"] == []


def test_a_column_of_names_is_left_out(tmp_path):
    path = _write(tmp_path, "names.tsv", "month\tA\nNisannu\t1\nAyyaru\t2\nSimanu\t3\n")
    out = audit(path).to_dict()
    assert out["columns"] == ["A"] and out["unreadable"] == []
    assert [c["column"] for c in out["left_out"]] == ["month"]


@pytest.mark.parametrize("text, words, note", BAD)
def test_bad_input_is_named_and_the_file_is_untouched(tmp_path, text, words, note):
    path = _write(tmp_path, "bad.tsv", text)
    before = _hash(path)
    with pytest.raises(NumcheckError) as err:
        audit(path)
    message = str(err.value)
    for w in words:
        assert w in message, (note, message)
    assert _hash(path) == before


def test_mixed_notations_in_a_column(tmp_path):
    # A Roman numeral among sexagesimal numbers: named with its row and column.
    path = _write(tmp_path, "mixed.tsv", "A\n1;30\n2;30\nXII\n")
    with pytest.raises(NumcheckError) as err:
        audit(path)
    assert "Row 3" in str(err.value) or "row 3" in str(err.value)
    assert "'A'" in str(err.value)


def test_audit_never_modifies_its_input(tmp_path):
    from tablegen import longitude_text, lunar_b, write_tsv
    from numcheck.reading import sexagesimal_text as sxt
    a, b = lunar_b(30)
    A = [sxt(x) for x in a]
    A[5] = "29;[x]"
    path = tmp_path / "t.tsv"
    write_tsv(path, ["A", "B"], [A, [longitude_text(x) for x in b]])
    before = _hash(path)
    audit(path)
    assert _hash(path) == before


def test_columns_option_leaves_text_columns_out():
    df = pd.DataFrame({"month": ["Nisannu", "Ayyaru", "Simanu", "Duzu"], "A": ["1", "2", "3", "4"]})
    r = audit(df, columns=["A"])
    assert [s.kind for s in r.schemes] == ["linear"]
    # Without columns=, a column of names is left out (and said so), not an error.
    left = audit(df).to_dict()["left_out"]
    assert [c["column"] for c in left] == ["month"] and "month" in left[0]["message"]


def test_unknown_column_in_relation_or_columns():
    df = pd.DataFrame({"A": ["1", "2", "3"], "B": ["2", "4", "6"]})
    with pytest.raises(NumcheckError, match="Did you mean"):
        audit(df, relation="B = AA * 2")
    with pytest.raises(NumcheckError):
        audit(df, columns=["C"])
    with pytest.raises(NumcheckError):
        audit(df, relation="B = A +")


@pytest.mark.parametrize("text", ["14;11,57,4 Libra", "0;30 Aries", "29;59 Pisces", "2[x];11 Libra"])
def test_longitude_cells_agree_with_the_quantity_reader(text):
    """The table reader's longitudes within signs give what numcheck.read gives."""
    (cell,) = read_table(pd.DataFrame({"L": [text]})).columns["L"].cells
    reading = read(text)
    if reading.damaged:
        assert cell.damaged
    else:
        assert cell.value == reading.value


def test_unknown_notation_is_named_before_any_cell():
    with pytest.raises(NumcheckError, match="Did you mean 'cuneiform'") as err:
        audit(pd.DataFrame({"A": ["1", "2"]}), notation="cuneifrom")
    assert "Row" not in str(err.value)


def test_seven_digit_line_numbers_and_whole_places_are_read(tmp_path):
    # No six-digit limit on a lone whole place, in the reader or the table's fast path.
    from numcheck.tables.cells import _fast
    assert _fast(1, "d", "1577917500;30", "sexagesimal", "1577917500;30").value == F(3155835001, 2)
    path = tmp_path / "t.tsv"
    path.write_text("line\tvalue\n" + "".join(f"{1000000 + i}\t1,{i}\n" for i in range(1, 7)))
    table = read_table(path)
    assert table.columns["line"].values == list(range(1000001, 1000007))
    result = audit(path)
    assert not result.flags
