"""The function audit: interpolation, joined columns, the command line, the plot, the JSON."""

from __future__ import annotations

import contextlib
import io
import json
import math
from fractions import Fraction as F

import pandas as pd
import pytest

from functiongen import argument_text, interpolate, rounded, sexa, sine, tsv
from numcheck.audit import audit
from numcheck.cli import main
from numcheck.errors import NumcheckError, UnknownNameError
from numcheck.tables.join import header_joins, join_columns, parse_join


def _cli(argv):
    out = io.StringIO()
    with contextlib.redirect_stdout(out), contextlib.redirect_stderr(io.StringIO()):
        code = main(argv + ["--json"])
    assert code == 0
    return json.loads(out.getvalue())


def interpolated_sines():
    """Sines R = 60 every degree, to seconds: nodes every 6° computed, the rest interpolated
    (distributed linear interpolation, common practice of the zījes)."""
    args = [F(i) for i in range(0, 91)]
    return args, interpolate(lambda a: sine(a, 60), args, 6, 2)


def test_an_interpolated_table_is_recognised_and_checked_against_its_method():
    args, values = interpolated_sines()
    # between the nodes the interpolation is off the exact sine by far more than a second
    assert max(abs(float(v) - sine(float(a), 60)) for a, v in zip(args, values)) > 60 / 3600
    slips = {20: values[19] + F(10, 60), 55: values[54] - F(1, 3600) * 20}
    written = [slips.get(i + 1, v) for i, v in enumerate(values)]
    df = pd.DataFrame({"arc": [argument_text(a) for a in args], "sin": [sexa(v, 2) for v in written]})
    result = audit(df)
    s = {x["column"]: x for x in result.to_dict()["schemes"]}["sin"]
    assert s["model"] == "sine" and s["parameters"][0]["estimate"] == "1,0"
    assert s["interpolation"] != "none" and s["interpolation"]["step"] == 6
    assert s["interpolation"]["nodes"][:3] == [1, 7, 13]
    assert s["interpolation"]["node_arguments"][:3] == ["0", "6", "12"]
    assert {f["row"] for f in result.flags} == set(slips)
    by = {f["row"]: f for f in result.flags}
    assert by[20]["expected"] == sexa(values[19], 2)      # the interpolated value, not the sine


def test_an_exact_table_is_not_called_interpolated():
    args = [F(i) for i in range(0, 91)]
    df = pd.DataFrame({"arc": [argument_text(a) for a in args],
                       "sin": [sexa(rounded(sine(float(a), 60), 2), 2) for a in args]})
    s = {x["column"]: x for x in audit(df).to_dict()["schemes"]}["sin"]
    assert s["interpolation"] == "none" and s["cells_fit"] == 91


def test_header_joins_and_the_join_option():
    assert header_joins(["arc", "crd°", "crd′", "crd″", "x"]) == {"crd": ["crd°", "crd′", "crd″"]}
    assert header_joins(["a", "t deg", "t min"]) == {"t": ["t deg", "t min"]}
    assert parse_join("crd=A,B,C; t=D,E") == {"crd": ["A", "B", "C"], "t": ["D", "E"]}
    header, rows = join_columns(["arc", "A", "B", "C"], [["1", "1", "2", "50"]], "crd=A,B,C")
    assert header == ["arc", "crd"] and rows == [["1", "1;2,50"]]
    header, rows = join_columns(["arc", "A", "B"], [["α", "α", "β"]], {"c": ["A", "B"]})
    assert rows == [["α", "α β"]]


@pytest.mark.parametrize("join,error", [
    ("crd", NumcheckError), ("crd=A", NumcheckError), ("crd=A,Z", UnknownNameError),
    ("arc=A,B", NumcheckError), ("x=A,B;y=B,C", NumcheckError)])
def test_bad_joins_are_named(join, error):
    with pytest.raises(error):
        join_columns(["arc", "A", "B", "C"], [["1", "1", "2", "3"]], join)


def test_joined_degree_columns_audit_as_one_number(tmp_path):
    args = [F(i) for i in range(1, 91)]
    vals = [rounded(sine(float(a), 60), 2) for a in args]
    parts = [sexa(v, 2).replace(";", ",").split(",") for v in vals]
    parts[30][1] = str((int(parts[30][1]) + 10) % 60)     # a slip in the minutes
    path = tmp_path / "sines.tsv"
    path.write_text(tsv(["arc", "sin°", "sin′", "sin″"],
                        [[argument_text(a) for a in args]] + [[p[k] for p in parts] for k in range(3)]))
    d = _cli(["audit", str(path)])
    assert d["columns"] == ["arc", "sin"]
    assert [(f["row"], f["column"]) for f in d["flags"]] == [(31, "sin")]
    assert d["flags"][0]["written"] == ";".join([parts[30][0], ",".join(parts[30][1:])])


def test_the_command_line_model_option_and_its_json(tmp_path):
    from test_exactness import violations
    args = [F(i) for i in range(1, 91)]
    path = tmp_path / "s.tsv"
    path.write_text(tsv(["arc", "s"], [[argument_text(a) for a in args],
                                       [sexa(rounded(sine(float(a), 150), 1), 1) for a in args]]))
    d = _cli(["audit", str(path), "--model", "sine"])
    s = d["schemes"][1]
    assert s["kind"] == "function" and s["model"] == "sine"
    assert s["parameters"][0]["estimate"] == "2,30"          # R = 150
    assert violations(d) == []
    with pytest.raises(UnknownNameError):
        audit(path, model="sinus")


def test_the_plot_draws_the_residuals(tmp_path):
    args, values = interpolated_sines()
    df = pd.DataFrame({"arc": [argument_text(a) for a in args], "sin": [sexa(v, 2) for v in values]})
    import matplotlib
    from numcheck.report.plot import plot_bytes
    with matplotlib.rc_context({"svg.fonttype": "none"}):   # text as text, to be searched
        svg = plot_bytes(audit(df), "svg").decode()
    assert "units of the last place" in svg and "interpolated every 6 lines" in svg


def test_a_table_without_an_angle_column_is_left_to_the_other_schemes():
    df = pd.DataFrame({"n": ["1", "2", "3", "4", "5"], "sq": ["1", "4", "9", "16", "25"]})
    assert all(s["kind"] != "function" for s in audit(df).to_dict()["schemes"])


def test_parameters_recovered_for_every_published_radius():
    # Indian R = 3438 and 150, the zījes' R = 60 (from memory): a sine table of each
    for R, text in ((60, "1,0"), (150, "2,30"), (3438, "57,18")):
        args = [F(i * 3) for i in range(1, 31)]
        df = pd.DataFrame({"arc": [argument_text(a) for a in args],
                           "s": [sexa(rounded(sine(float(a), R), 1), 1) for a in args]})
        p = {x["column"]: x for x in audit(df).to_dict()["schemes"]}["s"]["parameters"][0]
        assert p["estimate"] == text and p["low_decimal"] <= R <= p["high_decimal"], R
        assert math.isclose(p["least_squares_decimal"], R, rel_tol=1e-3)


def test_a_damaged_cell_is_restored_within_the_tables_precision():
    from numcheck.audit.functions import MODELS
    args = [F(i) for i in range(1, 61)]
    vals = [rounded(sine(float(a), 60), 2) for a in args]
    texts = [sexa(v, 2) for v in vals]
    # the author's value one unit off in the seconds, and that cell damaged in its minutes
    k = 29
    off = vals[k] + F(1, 3600)
    texts[k] = sexa(off, 2).split(";")[0] + ";[x]," + sexa(off, 2).split(",")[-1]
    df = pd.DataFrame({"arc": [argument_text(a) for a in args], "sin": texts})
    result = audit(df)
    assert result.flags == []
    best = max((r for r in result.restorations if r.index == k), key=lambda r: r.probability)
    assert best.value == off
    assert MODELS["sine"](30.0, 60.0) == pytest.approx(30.0)


_E = math.radians(23 + 51 / 60 + 20 / 3600)      # Ptolemy's obliquity, Almagest I.12 (from memory)


def _ra(lam):
    a = math.degrees(math.atan2(math.cos(_E) * math.sin(math.radians(lam)), math.cos(math.radians(lam))))
    return a % 360 if lam < 360 else 360.0


def _ascensional(lam, phi):
    d = math.asin(math.sin(_E) * math.sin(math.radians(lam)))
    return math.degrees(math.asin(math.tan(math.radians(phi)) * math.tan(d)))


# (model, published parameter, its source (from memory), arguments, places, formula written out)
PUBLISHED_MODELS = [
    ("right-ascension", 23 + 51 / 60 + 20 / 3600, "Almagest I.16, ε = 23;51,20",
     [10 * i for i in range(1, 37)], 2, _ra),
    ("oblique-ascension", 36.0, "Almagest II.8, the climate through Rhodes, φ = 36°",
     [10 * i for i in range(1, 36)], 2, lambda lam: (_ra(lam) - _ascensional(lam, 36.0)) % 360),
    ("daylight", 36.0, "Almagest II.8, Rhodes: the longest day 14½ hours",
     [6 * i for i in range(0, 61)], 2, lambda lam: 12 + 2 / 15 * _ascensional(lam, 36.0)),
    ("shadow", 12.0, "a gnomon of 12 digits (al-Khwārizmī's zīj)",
     list(range(1, 91)), 2, lambda h: 12 / math.tan(math.radians(h))),
    ("equation", 43 + 10 / 60, "Almagest XI.11, Venus' epicycle r = 43;10",
     [6 * i for i in range(1, 31)], 2,
     lambda a: abs(math.degrees(math.atan2((43 + 10 / 60) * math.sin(math.radians(a)),
                                           60 + (43 + 10 / 60) * math.cos(math.radians(a)))))),
    ("versine", 3438.0, "Āryabhaṭīya's R = 3438 (utkramajyā)",
     [15 * i / 4 for i in range(1, 25)], 0, lambda a: 3438 * (1 - math.cos(math.radians(a)))),
]


@pytest.mark.parametrize("name,p,source,args,places,formula", PUBLISHED_MODELS,
                         ids=[m[0] for m in PUBLISHED_MODELS])
def test_each_model_recovers_its_published_parameter(name, p, source, args, places, formula):
    vals = [rounded(formula(a), places) for a in args]
    slip = 5
    vals[slip] += F(7, 60 ** max(places - 1, 0)) if places else 70
    df = pd.DataFrame({"x": [argument_text(F(a).limit_denominator(4)) for a in args],
                       "y": [sexa(v, places) for v in vals]})
    result = audit(df)
    s = {x["column"]: x for x in result.to_dict()["schemes"]}["y"]
    assert s["model"] == name, source
    q = s["parameters"][0]
    assert q["low_decimal"] <= p <= q["high_decimal"], source
    assert abs(q["estimate_decimal"] - p) < 1e-9, source
    assert [f["row"] for f in result.flags] == [slip + 1], source


def test_two_models_that_fit_as_well_are_named():
    # right ascensions are the oblique ascensions of the sphaera recta (latitude 0): both
    # models explain every cell, and the audit says so (common practice)
    args = [10 * i for i in range(1, 37)]
    df = pd.DataFrame({"lon": [str(a) for a in args],
                       "asc": [sexa(rounded(_ra(a), 2), 2) for a in args]})
    s = {x["column"]: x for x in audit(df).to_dict()["schemes"]}["asc"]
    assert s["kind"] == "function" and s["cells_fit"] == 36
    named = {s["model"]} | {a["model"] for a in s["alternatives"]}
    assert named == {"right-ascension", "oblique-ascension"}
    assert any("other models fit as many cells" in n for n in s["notes"])


def test_a_folder_audit_takes_the_model_option(tmp_path):
    args = [F(i) for i in range(1, 31)]
    for k, R in enumerate((60, 150)):
        (tmp_path / f"t{k}.tsv").write_text(tsv(["arc", "s"], [
            [argument_text(a) for a in args], [sexa(rounded(sine(float(a), R), 1), 1) for a in args]]))
    d = _cli(["audit", str(tmp_path), "--model", "sine"])
    got = sorted(s["parameters"][0]["estimate"] for f in d["files"] for s in f["schemes"]
                 if s["kind"] == "function")
    assert got == ["1,0", "2,30"]
    out = io.StringIO()
    with contextlib.redirect_stdout(out), contextlib.redirect_stderr(out):
        assert main(["audit", str(tmp_path), "--model", "sinus"]) != 0
    assert "Unknown model 'sinus'" in out.getvalue()


def test_interpolation_with_nodes_off_the_first_line_and_a_slip_in_a_node():
    from functiongen import declination
    eps = 23 + 51 / 60 + 20 / 3600        # Almagest I.12 (from memory)
    args = [F(i) for i in range(0, 91)]
    values = interpolate(lambda a: declination(a, eps), args, 5, 2)
    args, values = args[3:], values[3:]   # the table starts at 3°: its first node is its row 3
    written = list(values)
    written[12] += F(10, 60)               # row 13 (15°) is a node
    written[30] += F(1, 60)
    df = pd.DataFrame({"lon": [argument_text(a) for a in args], "d": [sexa(v, 2) for v in written]})
    result = audit(df)
    s = {x["column"]: x for x in result.to_dict()["schemes"]}["d"]
    assert s["model"] == "declination" and s["parameters"][0]["estimate"] == "23;51,20"
    assert s["interpolation"]["step"] == 5 and s["interpolation"]["nodes"][:2] == [3, 8]
    assert [(f["row"], f["expected"]) for f in result.flags] == [
        (13, sexa(values[12], 2)), (31, sexa(values[30], 2))]


from hypothesis import given, settings  # noqa: E402
from hypothesis import strategies as st  # noqa: E402

_names = st.sampled_from(["a", "b", "c°", "c′", "c″", "d deg", "d min", "x_d", "x_m", "x_s", "c"])


@settings(max_examples=200, deadline=None)
@given(header=st.lists(_names, min_size=1, max_size=6, unique=True),
       cells=st.lists(st.sampled_from(["1", "59", "[x]", "α", "𐆊", "", "1;2", "-3"]), min_size=6,
                      max_size=6),
       join=st.sampled_from([None, "j=a,b", "j=c,a", "k=a", "a=b,c", "j=a,b;k=a,c", "z=q,r"]))
def test_joins_fail_only_with_our_errors(header, cells, join):
    rows = [cells[:len(header)]]
    try:
        new_header, new_rows = join_columns(header, rows, join)
    except NumcheckError:
        return
    assert len(new_header) == len(new_rows[0]) and len(set(new_header)) == len(new_header)


def test_a_line_number_beside_the_arc_is_not_taken_for_the_argument():
    args = [F(i, 2) for i in range(1, 121)]
    df = pd.DataFrame({"line": [str(i + 1) for i in range(len(args))],
                       "arc": [argument_text(a) for a in args],
                       "crd": [sexa(rounded(120 * math.sin(math.radians(float(a) / 2)), 2), 2)
                               for a in args]})
    s = {x["column"]: x for x in audit(df).to_dict()["schemes"]}["crd"]
    assert s["argument"] == "arc" and s["model"] == "chord" and s["cells_fit"] == 120


def test_oblique_ascensions_with_another_obliquity_name_it():
    # oblique ascensions for φ = 36° computed with the Toledan obliquity 23;33,30 (from memory)
    eps = math.radians(23 + 33 / 60 + 30 / 3600)

    def rho(lam):
        ra = math.degrees(math.atan2(math.cos(eps) * math.sin(math.radians(lam)),
                                     math.cos(math.radians(lam)))) % 360
        d = math.asin(math.sin(eps) * math.sin(math.radians(lam)))
        return (ra - math.degrees(math.asin(math.tan(math.radians(36)) * math.tan(d)))) % 360

    args = [10 * i for i in range(1, 36)]
    df = pd.DataFrame({"lon": [str(a) for a in args], "asc": [sexa(rounded(rho(a), 2), 2) for a in args]})
    s = {x["column"]: x for x in audit(df).to_dict()["schemes"]}["asc"]
    assert s["model"] == "oblique-ascension"
    phi, fixed = s["parameters"]
    assert phi["estimate"] == "36" and fixed["name"] == "ε" and fixed["estimate"] == "23;33,30"
    assert fixed["fixed"] is True
