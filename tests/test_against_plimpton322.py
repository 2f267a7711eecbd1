"""Plimpton 322: a slip in the inputs of a relation is put down to the input.

Short side b and diagonal d of five rows (rows 1, 2, 9, 13 and 15 of the
tablet), with the slips the tablet is known for, all values from memory
(Neugebauer and Sachs, Mathematical Cuneiform Texts, 1945; the reading of
the errors also from memory): row 9 writes b = 9,1 for 8,1; row 13 writes
b = 7,12,1, the square of 2,41; row 15 writes d = 53, half of 1,46; row 2
writes d = 3,12,1 for 1,20,25.  The first column is computed here as
d²/(d² − b²) from the true sides, so that every line of it is as due.
"""

from __future__ import annotations

from fractions import Fraction as F

import pandas as pd

from numcheck.audit import audit
from numcheck.reading import sexagesimal_text as sxt

TRUE = [(119, 169), (3367, 4825), (481, 769), (161, 289), (56, 106)]   # from memory


def _table():
    col_i = [sxt(F(d * d, d * d - b * b)) for b, d in TRUE]
    b = [sxt(F(x)) for x, _ in TRUE]
    d = [sxt(F(y)) for _, y in TRUE]
    d[1] = "3,12,1"     # row 2
    b[2] = "9,1"        # row 9
    b[3] = "7,12,1"     # row 13
    d[4] = "53"         # row 15
    return pd.DataFrame({"I": col_i, "b": b, "d": d})


def test_first_line_of_column_i():
    assert sxt(F(169 * 169, 169 * 169 - 119 * 119)) == "1;59,0,15"   # the tablet's row 1 (from memory)


def test_the_slips_are_blamed_on_the_inputs_and_no_unwritable_value_is_offered():
    r = audit(_table(), relation="I = d*d/(d*d - b*b)")
    flags = {(f["row"], f["column"]): f for f in r.flags}
    assert (flags[(3, "b")]["kind"], flags[(3, "b")]["expected"]) == ("unit-slip", "8,1")
    assert (flags[(4, "b")]["kind"], flags[(4, "b")]["expected"]) == ("intermediate-value", "2,41")
    assert "square" in flags[(4, "b")]["reason"]
    # row 15: halving b or doubling d both explain the line (the tablet's own ambiguity)
    assert flags[(5, "I")]["expected"] == "" and "d = 1,46" in flags[(5, "I")]["reason"]
    # row 2: no single slip explains 3,12,1; the value the relation gives does not terminate
    assert flags[(2, "I")]["expected"] == "" and "does not terminate" in flags[(2, "I")]["reason"]
    for f in r.flags:
        assert not f["expected"].startswith("-")
    assert (3, "I") not in flags and (4, "I") not in flags
