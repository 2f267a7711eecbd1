"""A table column of Greek numbers read as a whole: its other cells decide an ambiguous ``ο``.

The table is computed here from the published method of the chord table
(Ptolemy, Almagest I.10-11: crd a = 120 sin(a/2), in sixtieths, rounded to
seconds; these are the computed chords, not Ptolemy's printed ones) and
written as digital texts of the Almagest type it: a plain ``ο`` for every
zero, in the whole-number place as in the minutes (Cajori, A History of
Mathematical Notations I §44: Heiberg prints the zero without its bar).
``ο`` is then 0 in ``ο λα κε`` (crd 0;30°) and 70 in ``ο λβ γ`` (crd 72°).
"""

import math
import warnings
from fractions import Fraction as F
from pathlib import Path

import pandas as pd
import pytest

from numcheck.audit import audit
from numcheck.errors import NumcheckWarning
from numcheck.notations.greek.build import letter_text
from numcheck.tables import read_table

REAL = Path(__file__).resolve().parents[1] / ".." / "shared" / "realdata" / "almagest"


def _place(n: int) -> str:
    return "ο" if n == 0 else letter_text(n)


def _greek(value: F, places: int) -> str:
    """Whole part and *places* sexagesimal places, zeros typed as ο."""
    whole = int(value)
    rest = value - whole
    out = [_place(whole)]
    for _ in range(places):
        rest *= 60
        d = int(rest)
        out.append(_place(d))
        rest -= d
    return " ".join(out)


def _chord(arc: F) -> F:
    seconds = round(120 * math.sin(math.radians(float(arc) / 2)) * 3600)
    return F(seconds, 3600)


ARCS = [F(k, 2) for k in range(1, 13)] + [F(k, 2) for k in range(120, 161)]


def _table():
    rows = [(arc, _chord(arc)) for arc in ARCS]
    df = pd.DataFrame({"arc": [_greek(a, 1) for a, _ in rows], "crd": [_greek(c, 2) for _, c in rows]})
    return df, rows


def test_the_scenario_has_both_kinds_of_omicron():
    df, rows = _table()
    assert "ο λα κε" in list(df["crd"])          # crd 0;30 = 0;31,25 (computed)
    assert "ο λβ γ" in list(df["crd"])           # crd 72 = 70;32,3 (Almagest I.11, from memory)
    assert any(c.endswith(" ο") or " ο " in c for c in df["crd"])


def test_every_cell_of_the_chord_table_reads_its_value():
    df, rows = _table()
    with warnings.catch_warnings():
        warnings.simplefilter("ignore", NumcheckWarning)
        tab = read_table(df, notation="greek")
    arcs = tab.columns["arc"].values
    crds = tab.columns["crd"].values
    assert arcs == [a for a, _ in rows]
    assert crds == [c for _, c in rows]
    decided = [n for n in tab.notes if "column 'crd'" in n]
    assert len(decided) == sum(1 for c in df["crd"] if c.startswith("ο "))


def test_audit_reads_the_table_without_one_misread_zero():
    df, rows = _table()
    with warnings.catch_warnings():
        warnings.simplefilter("ignore", NumcheckWarning)
        res = audit(df, notation="greek")
    d = res.to_dict()
    assert d["summary"]["damaged"] == 0
    assert res.table.columns["crd"].values == [c for _, c in rows]
    assert any("read as 1,10;32,3" in n for n in d["table_notes"])      # ο λβ γ = 70;32,3
    assert any("'ο λα κε' read as 0;31,25" in n for n in d["table_notes"])


def test_a_column_of_minutes_never_holds_seventy():
    df = pd.DataFrame({"deg": ["ιβ", "ιγ", "ιδ", "ιε"], "min": ["νε", "ο", "ε", "ι"]})
    tab = read_table(df, notation="greek")
    assert tab.columns["min"].values == [55, 0, 5, 10]
    assert "below 60" in tab.notes[0]


def test_a_column_that_cannot_decide_stays_open():
    # Nothing but the one cell: the audit's restoration must decide.
    df = pd.DataFrame({"a": ["ο", "ο"]})
    tab = read_table(df, notation="greek")
    assert tab.columns["a"].values == [None, None] and not tab.notes


def test_the_real_table_of_phases_reads_its_zeros():
    path = REAL / "almagest-phases-inner.tsv"
    if not path.is_file():
        pytest.skip("shared/realdata/almagest is not here")
    with warnings.catch_warnings():
        warnings.simplefilter("ignore", NumcheckWarning)
        tab = read_table(path, columns=["Ven_mr", "Mer_ms"])
    ven = tab.columns["Ven_mr"].values
    # Almagest XIII.10 as the First1KGreek text prints it: 'γ ο' = 3;0, 'ο λ' = 0;30, 'ο κδ' = 0;24.
    assert ven[0] == 3 and ven[7] == F(1, 2) and ven[8] == F(24, 60)
    assert tab.columns["Mer_ms"].values[4] == 10


def test_a_linear_greek_column_audits_clean_with_its_zeros():
    # A mean-motion column, day by day, at Ptolemy's solar rate cut to three places
    # (0;59,8,17 a day, Almagest III.1): its first cell 'ο νθ η ιζ' is 0 or 70 alone,
    # and 0 by its neighbours; zeros inside the places are typed as ο too.
    step = F(59, 60) + F(8, 3600) + F(17, 216000)
    values = [k * step for k in range(1, 31)]
    df = pd.DataFrame({"day": [letter_text(k) for k in range(1, 31)],
                       "sun": [_greek(v, 3) for v in values]})
    assert df["sun"][0] == "ο νθ η ιζ"
    with warnings.catch_warnings():
        warnings.simplefilter("ignore", NumcheckWarning)
        res = audit(df, notation="greek")
    assert res.table.columns["sun"].values == values
    kinds = {s.column: s.kind for s in res.schemes}
    assert kinds.get("sun") == "linear" and res.flags == []
