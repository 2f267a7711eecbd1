"""The audit's outputs: terminal table, plot (PNG/SVG), self-contained HTML, CSV of flags, CLI."""

from __future__ import annotations

import csv
import hashlib
import io
import json
import os
from fractions import Fraction as F

import pytest
from rich.console import Console

from numcheck import NumcheckError
from numcheck.audit import audit
from numcheck.cli import main
from numcheck.reading import sexagesimal_text as sxt
from numcheck import report

from tablegen import longitude_text, lunar_b, write_tsv


@pytest.fixture()
def table(tmp_path):
    a, b = lunar_b(30)
    A = [sxt(x) for x in a]
    B = [longitude_text(x) for x in b]
    A[10] = sxt(a[10] + F(1, 60))                           # a unit slip (row 11)
    B[20:] = [longitude_text(x + F(1, 60)) for x in b[20:]]  # carried from row 21
    A[4] = "29;2[x],38"                                      # damaged (row 5)
    path = tmp_path / "ephemeris.tsv"
    write_tsv(path, ["A", "B"], [A, B])
    return path


def test_plot_png_and_svg(table, tmp_path):
    r = audit(table)
    png = report.write_plot(r, tmp_path / "p.png")
    assert png.read_bytes()[:8] == b"\x89PNG\r\n\x1a\n"
    svg = report.write_plot(r, tmp_path / "p.svg")
    text = svg.read_text()
    assert "<svg" in text and "11: unit-slip" in text
    with pytest.raises(NumcheckError, match=".png or .svg"):
        report.write_plot(r, tmp_path / "p.jpg")


def test_html_is_self_contained(table, tmp_path):
    r = audit(table)
    out = report.write_html(r, tmp_path / "r.html")
    text = out.read_text()
    assert "data:image/png;base64," in text
    assert "src='http" not in text and "<link" not in text and "<script" not in text
    for words in ("zigzag", "running-sum", "unit-slip", "carried-forward", "suggestions"):
        assert words in text


def test_html_escapes_table_text(tmp_path):
    import pandas as pd
    r = audit(pd.DataFrame({"<b>A</b>": ["1", "2", "3", "4"]}))
    text = report.html_text(r, plot=False)
    assert "<b>A</b>" not in text and "&lt;b&gt;A&lt;/b&gt;" in text


def test_flags_csv(table, tmp_path):
    r = audit(table)
    out = report.write_flags_csv(r, tmp_path / "f.csv")
    rows = list(csv.DictReader(io.StringIO(out.read_text())))
    slips = [x for x in rows if x["kind"] != "carried-forward"]
    assert [(x["row"], x["column"], x["kind"]) for x in slips] == [("11", "A", "unit-slip"),
                                                                   ("21", "B", "unit-slip")]
    carried = [x for x in rows if x["kind"] == "carried-forward"]
    assert [x["row"] for x in carried] == [str(k) for k in range(22, 31)]
    assert slips[1]["carried_into"] == " ".join(str(k) for k in range(22, 31))


def test_outputs_refuse_the_input_path(table):
    r = audit(table)
    before = hashlib.sha256(table.read_bytes()).hexdigest()
    for fn, name in ((report.write_flags_csv, ".csv"), (report.write_html, ".html")):
        target = table.with_suffix(name)
        os.link(table, target)      # the same file under another name
        with pytest.raises(NumcheckError, match="same file"):
            fn(r, target)
        target.unlink()
    assert hashlib.sha256(table.read_bytes()).hexdigest() == before
    assert sorted(p.name for p in table.parent.iterdir()) == ["ephemeris.tsv"]   # no temp files


def test_terminal_table(table):
    r = audit(table)
    console = Console(file=io.StringIO(), width=200, color_system=None)
    report.show(r, console)
    out = console.file.getvalue()
    assert "zigzag" in out and "unit-slip" in out
    assert "carried into rows 22-30" in out
    assert "60 cells, 60 checked against a scheme: 2 slips, 9 lines carrying one forward; " \
           "1 damaged, 1 restored." in " ".join(out.split())
    assert "28;2[6],38" in out or "restorations" in out


def test_cli_json_and_files(table, tmp_path, capsys):
    plot, html, flags = tmp_path / "o.png", tmp_path / "o.html", tmp_path / "o.csv"
    code = main(["audit", str(table), "--json", "--plot", str(plot), "--report", str(html),
                 "--csv", str(flags)])
    assert code == 0
    d = json.loads(capsys.readouterr().out)
    assert set(d) >= {"schemes", "flags", "restorations"}
    assert [s["kind"] for s in d["schemes"]] == ["zigzag", "running-sum"]
    f = d["flags"][0]
    assert set(f) >= {"row", "column", "written", "expected", "kind"}
    assert (f["row"], f["written"], f["expected"]) == (5, "29;2[x],38", "29;20,38") or f["row"] == 11
    assert all(set(r) >= {"row", "column", "text", "value", "probability"} for r in d["restorations"])
    assert plot.exists() and html.exists() and flags.exists()


def test_cli_refuses_output_equal_to_input_and_bad_input(table, tmp_path, capsys):
    assert main(["audit", str(table), "--csv", str(table)]) == 2
    assert "never writes over an input" in capsys.readouterr().err
    bad = tmp_path / "bad.tsv"
    bad.write_text("A\tB\n1\t2\n3\n")
    assert main(["audit", str(bad)]) == 2
    assert "Row 2" in capsys.readouterr().err


def test_cli_readable_output(table, capsys):
    assert main(["audit", str(table)]) == 0
    out = capsys.readouterr().out
    assert "schemes" in out and "flags" in out


# ---- pictures that show the error ---------------------------------------------------

DEMO = os.path.join(os.path.dirname(__file__), "..", "corpora_demo", "ephemeris.tsv")


def test_residual_in_units_of_the_last_place():
    from numcheck.report.plot import residuals

    r = audit(DEMO)
    res = dict(residuals(r, "A"))      # column A writes three fractional places
    assert res[9] == 3600              # a unit slip in the first fractional place: 60^2 last places
    assert res[15] == 36000            # a ten slip there
    assert res[1] == 0
    carried = dict(residuals(r, "B"))
    assert {carried[k] for k in range(28, 37)} == {600}   # ten in the second place, carried on


def test_plot_has_no_panel_for_the_line_numbers_and_names_the_file(tmp_path):
    from numcheck.report._common import numbering_columns
    from numcheck.report.plot import _columns

    r = audit(DEMO)
    assert numbering_columns(r.table) == {"line"}
    assert _columns(r) == ["A", "B"]
    svg = report.plot_bytes(r, "svg").decode("utf-8")
    assert "ephemeris.tsv" in svg and "site-packages" not in svg
    assert "written minus scheme" in svg and "29;30" in svg      # residual panel, sexagesimal ticks


def test_plot_shows_a_column_without_a_scheme(tmp_path):
    path = tmp_path / "t.tsv"
    path.write_text("A\tB\n1;0\t5;17\n2;0\t3;2\n3;0\t9;41\n4;0\t1;13\n5;0\t7;29\n", encoding="utf-8")
    r = audit(path)
    assert "B" in r.to_dict()["unchecked"]
    svg = report.plot_bytes(r, "svg").decode("utf-8")
    assert "no scheme found" in svg


def test_html_names_the_file_keys_the_colours_and_links_cells_to_flags():
    r = audit(DEMO)
    html = report.html_text(r, plot=False)
    assert "<h1>numcheck audit of ephemeris.tsv</h1>" in html
    assert "class='key'" in html and "slip (!)" in html
    for f in r.to_dict()["flags"]:
        anchor = f"flag-{f['row']}-{f['column']}"
        assert f"id='{anchor}'" in html and f"href='#{anchor}'" in html
    assert "href='#restored-3-A'" in html and "id='restored-3-A'" in html


def test_html_of_a_dataframe_says_so():
    import pandas as pd

    df = pd.DataFrame({"A": ["1;0", "2;0", "3;0", "4;1", "5;0"]})
    html = report.html_text(audit(df), plot=False)
    assert "<DataFrame>" not in html and "a table given as a DataFrame" in html
