"""Audit of generated ephemerides: every injected slip is located, classed and corrected.

The tables come from published parameters (tests/tablegen.py names the
sources: lunar System B column A and its longitude, Neugebauer ACT 1955 vol. 1;
Jupiter Systems A and B, ACT vol. 2).  Each test injects one slip of a known
kind and checks the row, the column, the kind and the expected text (which
must be the cell as the scheme gives it, in the cell's own notation).
"""

from __future__ import annotations

from fractions import Fraction as F

import pandas as pd
import pytest

from numcheck.audit import audit
from numcheck.reading import sexagesimal_text as sxt

from tablegen import (LUNAR_B_A, carry_into, jupiter_a, jupiter_b, longitude_text, lunar_b,
                      write_tsv)

N = 40


@pytest.fixture(scope="module")
def lunar():
    a, b = lunar_b(N)
    return a, b, [sxt(x) for x in a], [longitude_text(x) for x in b]


def _slips(result):
    return [f for f in result.flags if f["kind"] != "carried-forward"]


def _audit_ab(A, B, **kw):
    return audit(pd.DataFrame({"A": A, "B": B}), **kw)


def test_clean_lunar_table_has_no_flags(lunar):
    a, b, A, B = lunar
    r = _audit_ab(A, B)
    assert r.flags == []
    kinds = {s.column: s.kind for s in r.schemes}
    assert kinds == {"A": "zigzag", "B": "running-sum"}


def test_clean_lunar_table_from_a_tsv_file(lunar, tmp_path):
    a, b, A, B = lunar
    path = tmp_path / "ephemeris.tsv"
    write_tsv(path, ["A", "B"], [A, B])
    d = audit(path).to_dict()
    assert d["flags"] == [] and d["restorations"] == []
    assert d["schemes"][1]["params"]["of"] == "A"
    assert d["schemes"][1]["params"]["modulus"]["value"] == "360"


def _inject_a(lunar, row, text):
    a, b, A, B = lunar
    A2 = list(A)
    A2[row - 1] = text
    return _audit_ab(A2, B)


@pytest.mark.parametrize("row, mutate, kind", [
    # (1-based row, written value from the true one, kind)
    (11, lambda v: v + F(1, 60), "unit-slip"),          # one wedge more in the minutes
    (12, lambda v: v - F(10, 3600), "ten-slip"),        # one ten-corner fewer in the seconds
    (13, lambda v: v * 60, "place-shift"),              # written one place too high
    (20, lambda v: 2 * v, "intermediate-value"),        # the double copied from a worksheet
])
def test_isolated_slip_in_progress_column(lunar, row, mutate, kind):
    a, b, A, B = lunar
    r = _inject_a(lunar, row, sxt(mutate(a[row - 1])))
    slips = _slips(r)
    assert len(slips) == 1, r.flags
    f = slips[0]
    assert (f["row"], f["column"], f["kind"]) == (row, "A", kind)
    assert f["expected"] == A[row - 1]
    # B was computed with the right value: no flag in B at all, and A's flag says so.
    assert not [g for g in r.flags if g["column"] == "B"]
    assert f["notes"] == ["column B was computed with the value due here: a copying slip in column A"]


def test_copied_neighbour(lunar):
    a, b, A, B = lunar
    r = _inject_a(lunar, 6, A[4])
    (f,) = _slips(r)
    assert (f["row"], f["kind"], f["expected"]) == (6, "copied-neighbour", A[5])


def test_merged_and_split_places(lunar):
    a, b, A, B = lunar
    # Row 9 is 28;12,41,20: 12 and 41 merged give 28;53,20.
    assert A[8] == "28;12,41,20"
    (f,) = _slips(_inject_a(lunar, 9, "28;53,20"))
    assert (f["kind"], f["expected"]) == ("merged-places", "28;12,41,20")
    # Row 2 is 29;49,20: 49 split into 40 and 9.
    assert A[1] == "29;49,20"
    (f,) = _slips(_inject_a(lunar, 2, "29;40,9,20"))
    assert (f["kind"], f["expected"]) == ("split-place", "29;49,20")


def test_dropped_zero(lunar):
    a, b, A, B = lunar
    assert A[23] == "29;0,2,40"
    (f,) = _slips(_inject_a(lunar, 24, "29;2,40"))
    assert (f["row"], f["kind"], f["expected"]) == (24, "dropped-zero", "29;0,2,40")


def test_missed_turn_is_a_turning_point_slip(lunar):
    a, b, A, B = lunar
    # Row 15 is the first line after the maximum 30;1,59 is passed.
    row = next(i for i in range(1, N) if a[i] < a[i - 1] and a[i - 1] > a[i - 2]) + 0
    straight = a[row - 2] + LUNAR_B_A["d"]
    assert straight > LUNAR_B_A["M"]
    r = _inject_a(lunar, row, sxt(straight))
    (f,) = _slips(r)
    assert (f["row"], f["kind"], f["expected"]) == (row, "turning-point", A[row - 1])


def test_isolated_slip_in_longitude(lunar):
    a, b, A, B = lunar
    B2 = list(B)
    B2[20] = longitude_text(b[20] + F(10, 3600))
    r = _audit_ab(A, B2)
    assert [(f["row"], f["column"], f["kind"], f["expected"]) for f in r.flags] == \
        [(21, "B", "ten-slip", B[20])]


def test_sign_not_advanced(lunar):
    a, b, A, B = lunar
    B2 = list(B)
    B2[16] = longitude_text(b[16] - 30)
    (f,) = _audit_ab(A, B2).flags
    assert (f["row"], f["kind"], f["expected"]) == (17, "sign-error", B[16])


def test_dropped_carry_in_the_running_sum(lunar):
    a, b, A, B = lunar
    # Find a line whose sum carried into the degrees (units place) and drop the carry.
    row = next(i for i in range(5, N) if carry_into(b[i - 1] % 30, a[i], 0) and b[i] % 30 >= 1)
    B2 = list(B)
    B2[row] = longitude_text(b[row] - 1)
    (f,) = _audit_ab(A, B2).flags
    assert (f["row"], f["kind"], f["expected"]) == (row + 1, "carry", B[row])


def test_carried_slip_is_reported_once(lunar):
    a, b, A, B = lunar
    B2 = list(B[:25]) + [longitude_text(x + F(1, 60)) for x in b[25:]]
    r = _audit_ab(A, B2)
    slips = _slips(r)
    assert len(slips) == 1
    assert slips[0]["row"] == 26 and slips[0]["expected"] == B[25]
    assert slips[0]["carried_into"] == list(range(27, N + 1))
    carried = [f for f in r.flags if f["kind"] == "carried-forward"]
    assert [f["row"] for f in carried] == list(range(27, N + 1))
    assert all(f["expected"] == B[f["row"] - 1] for f in carried)
    assert all(f["carried_from"] == {"column": "B", "row": 26} for f in carried)


def test_longitude_computed_with_the_wrong_progress_carries_it(lunar):
    """A slip in A that the scribe used for B: one slip (in A); B inherits it."""
    a, b, A, B = lunar
    A2 = list(A)
    A2[10] = sxt(a[10] + F(1, 60))
    B2 = list(B[:10]) + [longitude_text(x + F(1, 60)) for x in b[10:]]
    r = _audit_ab(A2, B2)
    slips = _slips(r)
    assert [(f["row"], f["column"], f["kind"]) for f in slips] == [(11, "A", "unit-slip")]
    carried = [f for f in r.flags if f["kind"] == "carried-forward"]
    assert {f["column"] for f in carried} == {"B"}
    assert [f["row"] for f in carried] == list(range(11, N + 1))
    assert carried[0]["carried_from"] == {"column": "A", "row": 11}
    assert slips[0]["carried_into_columns"] == {"B": list(range(11, N + 1))}
    assert "carried the slip on" in slips[0]["notes"][0]


def test_slip_in_the_first_line(lunar):
    a, b, A, B = lunar
    (f,) = _slips(_inject_a(lunar, 1, sxt(a[0] + F(1, 60))))
    assert (f["row"], f["expected"]) == (1, A[0])


def test_two_slips_in_one_table(lunar):
    a, b, A, B = lunar
    A2, B2 = list(A), list(B)
    A2[5] = sxt(a[5] + F(1, 60))
    B2[30] = longitude_text(b[30] - F(1, 3600))
    r = _audit_ab(A2, B2)
    assert [(f["row"], f["column"]) for f in r.flags] == [(6, "A"), (31, "B")]


def test_damaged_cells_are_restored_from_the_scheme(lunar):
    a, b, A, B = lunar
    A2, B2 = list(A), list(B)
    assert A[7] == "28;26,38"
    A2[7] = "28;2[x],38"
    B2[12] = B[12].replace(B[12].split(";")[0], "[x]", 1)
    r = _audit_ab(A2, B2)
    assert r.flags == []
    best = {}
    for x in r.restorations:
        best.setdefault((x.index + 1, x.column), x)
    ra = best[(8, "A")]
    assert ra.value == a[7] and ra.text == "28;2[6],38" and ra.probability > 0.5
    assert any("same monotone run" in why for why in ra.reasons)   # the zigzag invariant
    rb = best[(13, "B")]
    assert rb.value == b[12] and rb.probability > 0.5
    assert rb.text.endswith(B[12].split()[-1])


def test_a_damaged_cell_no_reading_fits_is_flagged(lunar):
    a, b, A, B = lunar
    A2 = list(A)
    A2[7] = "29;2[x],38"   # the value due is 28;26,38: the traces cannot give it
    r = _audit_ab(A2, B)
    (f,) = r.flags
    assert (f["row"], f["kind"], f["expected"]) == (8, "unexplained", "28;26,38")


def test_jupiter_system_a_zone_boundary_slip():
    lam = jupiter_a(N)
    L = [longitude_text(x) for x in lam]
    clean = audit(pd.DataFrame({"L": L}))
    assert clean.flags == []
    # a line that crosses a boundary, written with the old zone's full rate
    span_fast = (F(85) - F(240)) % 360
    row = next(i for i in range(3, N) if (lam[i] - lam[i - 1]) % 360 not in (30, 36))
    in_fast = (lam[row - 1] - 240) % 360 < span_fast
    L2 = list(L)
    L2[row] = longitude_text(lam[row - 1] + (36 if in_fast else 30))
    r = audit(pd.DataFrame({"L": L2}))
    (f,) = _slips(r)
    assert (f["row"], f["kind"], f["expected"]) == (row + 1, "zone-boundary", L[row])


def test_jupiter_system_a_arcs_beside_longitudes():
    lam = jupiter_a(N + 1)
    arcs = [(lam[i] - lam[i - 1]) % 360 for i in range(1, N + 1)]
    A = [sxt(x) for x in arcs]
    L = [longitude_text(x) for x in lam[1:]]
    A2 = list(A)
    A2[10] = sxt(arcs[10] + 1)   # the longitude beside it used the right arc
    r = audit(pd.DataFrame({"arc": A2, "L": L}))
    assert {s.column: s.kind for s in r.schemes} == {"L": "step", "arc": "step"}
    (f,) = r.flags
    assert (f["row"], f["column"], f["kind"], f["expected"]) == (11, "arc", "unit-slip", A[10])


def test_jupiter_system_b_zigzag_slip():
    arcs = jupiter_b(N)
    A = [sxt(x) for x in arcs]
    A2 = list(A)
    A2[17] = sxt(arcs[17] - F(10, 60))   # 31;52,15 written 31;42,15
    (f,) = audit(pd.DataFrame({"arc": A2})).flags
    assert (f["row"], f["kind"], f["expected"]) == (18, "ten-slip", A[17])


def test_stated_relation_sum():
    df = pd.DataFrame({"A": ["1;30", "2", "3;15", "4"], "B": ["2", "2;30", "1", "0;45"],
                       "C": ["3;30", "4;30", "4;25", "4;45"]})
    r = audit(df, relation="C = A + B")
    (scheme,) = [s for s in r.schemes if s.column == "C"]
    assert scheme.kind == "relation"
    (f,) = r.flags
    assert (f["row"], f["column"], f["kind"], f["expected"]) == (3, "C", "ten-slip", "4;15")


def test_stated_running_sum_relation():
    df = pd.DataFrame({"A": ["10", "10", "10", "10", "10", "10"],
                       "B": ["5,50", "0", "10", "21", "31", "41"]})
    r = audit(df, relation="B = prev(B) + A mod 360", columns=["A", "B"])
    slips = _slips(r)
    assert [(f["row"], f["column"], f["kind"]) for f in slips] == [(4, "B", "unit-slip")]
    assert [f["row"] for f in r.flags if f["kind"] == "carried-forward"] == [5, 6]


def test_product_column_found():
    xs = [F(k, 2) for k in range(3, 15)]
    ys = [F(k) for k in range(20, 32)]
    df = pd.DataFrame({"a": [sxt(x) for x in xs], "b": [sxt(y) for y in ys],
                       "c": [sxt(x * y) for x, y in zip(xs, ys)]})
    r = audit(df)
    assert {s.column: s.kind for s in r.schemes}["c"] == "product"
    assert r.flags == []


def test_greek_table_letter_confusion_and_expected_in_greek():
    # A linear Greek column, 29;0,9 + k × 0;4 (invented), places as letter groups.
    from numcheck.slips import write_value
    vals = [29 + F(4 * k, 60) + F(9, 3600) for k in range(8)]
    G = [write_value(v, notation="greek") for v in vals]
    assert G[4] == "κθ ιϛ θ"
    G[4] = "κθ ιϛ ε"   # Є (5) for Θ (9), confusion data of numcheck.slips.confusions
    (f,) = audit(pd.DataFrame({"G": G})).flags
    assert (f["row"], f["kind"], f["expected"]) == (5, "letter-confusion", "κθ ιϛ θ")


def test_quotient_is_a_product_with_its_operation():
    xs = [F(k) for k in (3, 7, 2, 9, 4, 8, 5, 6, 12, 10, 11, 13)]
    ys = [F(k, 4) for k in (31, 37, 30, 41, 33, 35, 39, 32, 40, 34, 38, 36)]
    df = pd.DataFrame({"b": [sxt(x) for x in xs], "c": [sxt(y) for y in ys],
                       "a": [sxt(x * y) for x, y in zip(xs, ys)]})
    r = audit(df)
    (scheme,) = [s for s in r.schemes if s.kind == "product"]
    assert scheme.params()["operation"] in ("product", "quotient")
    assert r.flags == []
    df.loc[4, "c"] = "8;16"    # 33/4 = 8;15 written 8;16: the relation breaks on row 5
    (f,) = audit(df).flags     # (which of a and c holds it, the three columns cannot tell)
    assert f["row"] == 5


# -- every kind the generator injects is located, classed and corrected -------

from hypothesis import given  # noqa: E402
from hypothesis import strategies as st  # noqa: E402

from tablegen import A_KINDS, B_KINDS, inject  # noqa: E402

_CASES = [("A", k) for k in A_KINDS] + [("B", k) for k in B_KINDS]


@given(case=st.sampled_from(_CASES), seed=st.integers(0, 10_000), start=st.integers(0, 40))
def test_generated_slip_is_located_classed_and_corrected(case, seed, start):
    import random
    column, kind = case
    rng = random.Random(seed)
    a, b = lunar_b(N, start_a=sxt(LUNAR_B_A["m"] + F(start, 30) + F(1, 180)))
    A, B = [sxt(x) for x in a], [longitude_text(x) for x in b]
    got = inject(column, kind, a, b, rng)
    if got is None:
        return   # no line of this table suits the kind
    i, text = got
    (A if column == "A" else B)[i] = text
    r = _audit_ab(A, B)
    slips = _slips(r)
    assert [(f["row"], f["column"], f["kind"]) for f in slips] == [(i + 1, column, kind)], r.flags
    truth = (sxt(a[i]) if column == "A" else longitude_text(b[i]))
    assert slips[0]["expected"] == truth
    assert [f for f in r.flags if f["kind"] == "carried-forward"] == []


def test_carried_slip_across_a_damaged_line(lunar):
    a, b, A, B = lunar
    B2 = list(B[:25]) + [longitude_text(x + F(1, 60)) for x in b[25:]]
    degrees, rest = B2[26].split(";", 1)
    B2[26] = f"{degrees[0]}[x];{rest}"            # the line after the slip is damaged
    r = _audit_ab(A, B2)
    slips = _slips(r)
    assert [(f["row"], f["column"]) for f in slips] == [(26, "B")]
    assert slips[0]["carried_into"] == list(range(28, N + 1))
    # the damaged line is restored as the scribe wrote it: with the carried slip
    best = next(x for x in r.restorations if x.index == 26)
    assert best.value == b[26] + F(1, 60) and best.probability > 0.5


def test_old_babylonian_multiplication_table_changes_its_difference():
    # Head numbers 1 ... 20, 30, 40, 50 (the layout of the OB multiplication
    # tables, common practice), with the multiples of 7 beside them.
    n = [str(k) for k in range(1, 21)] + ["30", "40", "50"]
    c = [sxt(F(7 * int(k))) for k in n]
    r = audit(pd.DataFrame({"n": n, "a7": c}))
    assert r.flags == []
    scheme = {s.column: s for s in r.schemes}["n"]
    assert scheme.params()["changes"] == [{"row": 21, "d": {"value": "10", "sexagesimal": "10"}}]
    c[12] = "1,30"          # 13 × 7 = 1,31
    (f,) = audit(pd.DataFrame({"n": n, "a7": c})).flags
    assert (f["row"], f["column"], f["kind"], f["expected"]) == (13, "a7", "unit-slip", "1,31")


def test_multiple_of_a_column():
    xs = [F(k) for k in (3, 7, 2, 9, 4, 8, 5, 6, 12, 10)]
    df = pd.DataFrame({"x": [sxt(x) for x in xs], "y": [sxt(x * F(5, 2)) for x in xs]})
    r = audit(df)
    scheme = {s.column: s for s in r.schemes}["y"]
    assert scheme.kind == "product" and scheme.params()["factor"]["sexagesimal"] == "2;30"
    df.loc[3, "y"] = "22;20"   # 9 × 2;30 = 22;30
    (f,) = audit(df).flags
    assert (f["row"], f["column"], f["kind"], f["expected"]) == (4, "y", "ten-slip", "22;30")


def test_carried_slip_in_a_zigzag_follows_the_scribes_own_turns(lunar):
    """The scribe computed on from a wrong value through the turns: one slip, the rest inherit it."""
    from tablegen import zigzag
    a, b, A, B = lunar
    row = 5
    wrong = a[row - 1] + F(1, 60)
    direction = a[row] > a[row - 1]
    tail = zigzag(N - row + 1, start=wrong, rising=direction, **LUNAR_B_A)
    A2 = A[:row - 1] + [sxt(x) for x in tail]
    r = audit(pd.DataFrame({"A": A2}))
    slips = _slips(r)
    assert [(f["row"], f["kind"], f["expected"]) for f in slips] == [(row, "unit-slip", A[row - 1])]
    later = [f["row"] for f in r.flags if f["kind"] == "carried-forward"]
    assert later == [k + 1 for k in range(row, N) if A2[k] != A[k]]
    assert len(later) > 20


def test_place_shift_correction_has_the_width_the_column_writes():
    # A column that writes its final empty places (…,0): a value shifted one
    # place down gains a place; the correction must be written as the column
    # writes, not with the shifted cell's extra place.
    import pandas as pd

    cells = ["28;0,0", "28;18,0", "28;36,0", "28;54,0", "29;12,0", "29;30,0", "29;48,0", "30;6,0"]
    shifted = list(cells)
    shifted[4] = "0;29,12,0"                                   # written one place too low
    d = audit(pd.DataFrame({"A": shifted})).to_dict()
    (flag,) = d["flags"]
    assert (flag["row"], flag["kind"], flag["expected"]) == (5, "place-shift", "29;12,0")
