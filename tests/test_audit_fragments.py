"""Mean-motion tables modulo the circle, floating reciprocals, the relation grammar's extensions."""

from __future__ import annotations

from fractions import Fraction as F

import pandas as pd
import pytest

from numcheck.audit import audit
from numcheck.errors import NumcheckError
from numcheck.reading import sexagesimal_text as sxt

from tablegen import sx

# Almagest IV.3-4, mean daily motion of the moon in longitude (as in the periods catalogue)
MOON = sx("13;10,34,58,33,30,30")


def test_a_mean_longitude_table_modulo_360_wraps_without_a_slip():
    lon = [(F(300) + k * MOON) % 360 for k in range(14)]
    txt = [sxt(v) for v in lon]
    txt[10] = sxt(lon[10] + F(10, 60))
    r = audit(pd.DataFrame({"day": [str(k + 1) for k in range(14)], "lon": txt}))
    (s,) = [s for s in r.schemes if s.column == "lon"]
    assert s.kind == "linear" and s.params()["modulus"]["value"] == "360"
    assert [(f["row"], f["column"]) for f in r.flags] == [(11, "lon")]
    assert s.published[0]["id"] == "ptol_moon_lon"


def test_a_table_in_signs_modulo_12():
    vals = [(F(10) + k * F(7, 6)) % 12 for k in range(15)]
    r = audit(pd.DataFrame({"s": [sxt(v) for v in vals]}))
    (s,) = r.schemes
    assert s.params()["modulus"]["value"] == "12" and r.flags == []


def test_floating_reciprocals_of_three_places_restore():
    # the standard table (reciprocals-ob.csv, computed; MCT 1945): 1,21 -> 44,26,40, 27 -> 2,13,20
    rows = [("2", "30"), ("3", "20"), ("4", "15"), ("5", "12"), ("6", "10"), ("8", "7,30"),
            ("9", "6,40"), ("27", "2,13,20"), ("1,4", "56,15"), ("1,21", "44,2[x],40"),
            ("2,13,20", "2[x]"), ("18", "3,2[x]")]
    r = audit(pd.DataFrame({"n": [a for a, _ in rows], "igi": [b for _, b in rows]}))
    best = {}
    for x in r.to_dict()["restorations"]:
        if x["row"] not in best:
            best[x["row"]] = x["text"]
    assert best == {10: "44,2[6],40", 11: "2[7]", 12: "3,2[0]"}
    assert r.flags == []


def test_relation_with_next_and_round():
    df = pd.DataFrame({"A": ["1", "2", "4", "7", "11"], "D": ["1", "2", "3", "4", "5"]})
    r = audit(df, relation="D = next(A) - A", columns=["A", "D"])
    assert r.flags == []
    df = pd.DataFrame({"A": ["1;20", "2;10", "3;25"], "B": ["0;30", "0;30", "0;30"],
                       "C": ["0;40", "1;5", "1;43"]})
    r = audit(df, relation="C = round(A * B, 1)", columns=["A", "B", "C"])
    # 3;25 x 0;30 = 1;42,30, rounded to one place: 1;43
    assert r.flags == []
    r = audit(df, relation="C = trunc(A * B, 1)", columns=["A", "B", "C"])
    assert [(f["row"], f["expected"]) for f in r.flags] == [(3, "1;42")]


@pytest.mark.parametrize("bad", ["C = round(A * B)", "C = round(A * B, x)", "C = next(Q)"])
def test_relation_errors(bad):
    df = pd.DataFrame({"A": ["1"], "B": ["2"], "C": ["2"]})
    with pytest.raises(NumcheckError):
        audit(df, relation=bad)


def test_the_schemes_catalogue_has_sources_and_exact_periods():
    from numcheck.catalogue.schemes import schemes
    rows = schemes()
    assert {r.id for r in rows} >= {"ACT-LUN-B-A", "ACT-LUN-B-F", "ACT-LUN-A-PHI", "ACT-JUP-A",
                                    "ACT-JUP-B", "SYS-A-RISING", "MULAPIN-DAYLIGHT"}
    for r in rows:
        assert r.source and r.confidence in ("high", "medium", "low") and r.label
        if r.kind == "zigzag":
            assert 2 * (r.M - r.m) / r.d == r.period_lines, r.id
    # System A rising times sum to the longest and shortest day, 3,36 and 2,24 UŠ (HAMA, via schemes.csv)
    rising = next(r for r in rows if r.id == "SYS-A-RISING").sequence
    assert sum(rising[3:9]) == 216 and sum(rising[:3]) + sum(rising[9:]) == 144


def test_lines_missing_in_the_argument_column_are_no_slips():
    # lunar System B columns A and B (tablegen; ACT vol. 1), lines 13-15 not copied
    from tablegen import longitude_text, lunar_b
    a, b = lunar_b(30)
    keep = [i for i in range(30) if i not in (12, 13, 14)]
    df = pd.DataFrame({"n": [str(i + 1) for i in keep], "A": [sxt(a[i]) for i in keep],
                       "B": [longitude_text(b[i]) for i in keep]})
    df.loc[5, "A"] = sxt(a[5] + F(1, 60))
    r = audit(df)
    assert [(f["row"], f["column"], f["kind"]) for f in r.flags] == \
        [(6, "A", "unit-slip"), (13, "n", "lines-missing")]
    (gap,) = [f for f in r.flags if f["kind"] == "lines-missing"]
    assert gap["reason"].startswith("3 lines missing")
    assert r.summary()["slips"] == 1 and r.summary()["lines_missing"] == 1


def test_a_slip_in_the_argument_column_carried_on_is_no_gap_when_a_column_says_so():
    from tablegen import lunar_b
    a, _ = lunar_b(20)
    n = [str(i + 1) for i in range(20)]
    n[8:] = [str(i + 3) for i in range(8, 20)]       # the numbers jump, but no line is missing
    r = audit(pd.DataFrame({"n": n, "A": [sxt(x) for x in a]}))
    assert all(f["kind"] != "lines-missing" for f in r.flags)


def test_the_command_line_states_schemes_and_relations_with_json(tmp_path, capsys):
    import json
    from numcheck.cli import main
    from tablegen import zigzag
    ys = zigzag(12, M=sx("15;16,5"), m=sx("11;5,5"), d=sx("0;36"), start=sx("13;10,35"))
    txt = [sxt(y) for y in ys]
    txt[5] = sxt(ys[5] + sx("0;0,10"))
    path = tmp_path / "fragment.tsv"
    path.write_text("F\n" + "\n".join(txt) + "\n", encoding="utf-8")
    for extra in (["--scheme", "F: ACT-LUN-B-F"], ["-s", "F: zigzag d=0;36 M=15;16,5 m=11;5,5"],
                  ["--relation", "F = zigzag(d=0;36, M=15;16,5, m=11;5,5)"]):
        assert main(["audit", str(path), *extra, "--json"]) == 0
        out = json.loads(capsys.readouterr().out)
        (s,) = out["schemes"]
        assert s["stated"] == extra[1] and s["published"][0]["id"] == "ACT-LUN-B-F"
        assert [(f["row"], f["expected"]) for f in out["flags"]] == [(6, sxt(ys[5]))]
    assert main(["audit", str(path), "--scheme", "F: zigzag d=0;36 Q=1", "--json"]) != 0
    out = json.loads(capsys.readouterr().out)
    assert "'Q'" in out["message"]
