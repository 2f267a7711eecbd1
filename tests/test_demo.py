"""The demo end to end: its corpus, its generator, and what `numcheck demo` finds in it.

The check values come from the generator's answer key (corpora_demo/answer_key.json),
which records every slip and lost digit it put in; the ephemeris itself is computed
from the published System B parameters (Neugebauer, ACT 1955, vol. 1, System B,
column A: M = 30;1,59, m = 28;10,39,40, d = 0;18).
"""

import contextlib
import importlib.util
import io
import json
from fractions import Fraction
from pathlib import Path

import pytest
from lxml import etree

from numcheck.cli import main
from numcheck.demo import demo_data, run_demo
from numcheck.errors import NumcheckError
from numcheck.tei.markup import TEI_NS

ROOT = Path(__file__).resolve().parent.parent
CORPUS = ROOT / "corpora_demo"
FILES = ["ephemeris.tsv", "papyrus.xml", "fragments.tsv", "answer_key.json"]


def _generator():
    spec = importlib.util.spec_from_file_location("demo_generate", CORPUS / "generate.py")
    mod = importlib.util.module_from_spec(spec)
    spec.loader.exec_module(mod)
    return mod


@pytest.fixture(scope="module")
def demo(tmp_path_factory):
    """One run of ``numcheck demo --json`` (the whole job; the slow part of this file)."""
    out = tmp_path_factory.mktemp("demo") / "numcheck-demo-out"
    buf = io.StringIO()
    with contextlib.redirect_stdout(buf):
        code = main(["demo", "--out", str(out), "--json"])
    assert code == 0
    return out, json.loads(buf.getvalue())


@pytest.fixture(scope="module")
def key():
    return json.loads((demo_data() / "answer_key.json").read_text(encoding="utf-8"))


def _step(d, name):
    return next(s for s in d["steps"] if s["name"] == name)


# -- the corpus and its generator ---------------------------------------------

def test_generator_is_deterministic_and_matches_shipped_files(tmp_path):
    gen = _generator()
    gen.generate([tmp_path])
    for name in FILES:
        made = (tmp_path / name).read_bytes()
        assert made == (CORPUS / name).read_bytes(), name
        assert made == (demo_data() / name).read_bytes(), name


def test_generator_zigzag_follows_system_b():
    # Neugebauer, ACT 1955, vol. 1, System B column A: M, m, d; the period
    # P = 2(M - m)/d = 12;22,8,53,20 = 10019/810 lines (reference/schemes.csv).
    gen = _generator()
    assert (gen.M, gen.m, gen.d) == (Fraction(108119, 3600), Fraction(304319, 10800), Fraction(3, 10))
    assert 2 * (gen.M - gen.m) / gen.d == Fraction(10019, 810)
    values = gen.zigzag(gen.A0, True, 40)
    assert all(gen.m <= v <= gen.M for v in values)
    steps = {abs(b - a) for a, b in zip(values, values[1:])}
    assert Fraction(3, 10) in steps and len(steps) > 1     # turns reflect


def test_corpus_says_it_is_invented():
    readme = (CORPUS / "README.md").read_text(encoding="utf-8")
    assert "invented" in readme.lower() and "generate.py" in readme
    assert (demo_data() / "README.md").read_text(encoding="utf-8") == readme


def test_answer_key_covers_the_slip_kinds(key):
    kinds = {s["kind"] for s in key["ephemeris"]["slips"]}
    assert {"unit-slip", "ten-slip", "place-shift", "copied-neighbour", "sign-error",
            "carried-forward"} <= kinds
    assert len(key["ephemeris"]["lost"]) == 4


# -- the demo run -----------------------------------------------------------------

def test_demo_writes_its_files(demo):
    out, d = demo
    for name in ("fragments-restored.tsv", "fragments.json", "ephemeris-audit.json",
                 "ephemeris-audit.html", "ephemeris-audit.png", "papyrus-annotated.xml",
                 "summary.json"):
        assert (out / name).is_file(), name
    assert (out / "ephemeris-audit.png").read_bytes()[:8] == b"\x89PNG\r\n\x1a\n"
    assert all(s["status"] == "done" for s in d["steps"]), [s.get("reasons") for s in d["steps"]]


def test_demo_finds_every_slip_in_the_ephemeris(demo, key):
    out, _ = demo
    gen = _generator()
    audit = json.loads((out / "ephemeris-audit.json").read_text(encoding="utf-8"))
    flags = {(f["row"], f["column"]): f for f in audit["flags"]}
    for slip in key["ephemeris"]["slips"]:
        cell = (slip["row"], slip["column"])
        assert cell in flags, slip
        assert flags[cell]["kind"] == slip["kind"], (slip, flags[cell])
        if slip["column"] == "A":
            # the audit may write more places than the true line has (29;8,39,0,0)
            assert Fraction(flags[cell]["expected_value"]) == gen.sexa(slip["expected"]), (slip, flags[cell])
        else:
            assert flags[cell]["expected"] == slip["expected"], (slip, flags[cell])
    injected = {(s["row"], s["column"]) for s in key["ephemeris"]["slips"]}
    assert set(flags) == injected                       # nothing else flagged


def test_demo_restores_the_lost_digits(demo, key):
    out, d = demo
    audit = json.loads((out / "ephemeris-audit.json").read_text(encoding="utf-8"))
    best = {}
    for r in audit["restorations"]:
        best.setdefault((r["row"], r["column"]), r)
    for lost in key["ephemeris"]["lost"]:
        r = best[(lost["row"], lost["column"])]
        assert r["expected"] == lost["true"], (lost, r)
        assert r["text"].replace("[", "").replace("]", "") == lost["true"]
    assert _step(d, "ephemeris")["lost_restored_right"] == 4


def test_demo_annotates_the_papyrus(demo, key):
    out, d = demo
    root = etree.parse(str(out / "papyrus-annotated.xml")).getroot()
    rows = {int(r.get("n")): r.findall(f".//{{{TEI_NS}}}num") for r in root.iter(f"{{{TEI_NS}}}row")
            if r.get("n")}
    by_kind = {}
    for entry in key["papyrus"]["rows"]:
        by_kind.setdefault(entry["kind"], []).append(entry)
    lost4 = next(e for e in by_kind["lost"] if e["row"] == 4)
    motion = rows[4][1]
    assert (motion.get("atLeast"), motion.get("atMost")) == (lost4["atLeast"], lost4["atMost"])
    asserted = [c.get("assertedValue") for c in motion.findall(f"{{{TEI_NS}}}certainty")]
    assert asserted and asserted[0] == lost4["value"]         # 52;42,20 ranked first
    for entry in by_kind["supplied"] + by_kind["unclear"]:
        assert rows[entry["row"]][1].get("value") == entry["value"]
    wrong = by_kind["wrong-value"][0]
    assert rows[wrong["row"]][0].get("value") == wrong["value"]      # reported, not overwritten
    contradictions = _step(d, "papyrus")["contradictions"]
    assert len(contradictions) == 1 and "'11'" in contradictions[0] and "12" in contradictions[0]
    for day in range(1, 25):
        assert rows[day][0].get("value") in (str(day), "11")


def test_demo_audits_the_papyrus_table(demo, key):
    out, _ = demo
    audit = json.loads((out / "papyrus-audit.json").read_text(encoding="utf-8"))
    slip = next(e for e in key["papyrus"]["rows"] if e["kind"] == "ten-slip")
    flags = {(f["row"], f["column"]): f for f in audit["flags"]}
    assert flags[(slip["row"], "motion")]["kind"] == "ten-slip"
    assert Fraction(flags[(slip["row"], "motion")]["expected_value"]) == Fraction(slip["value"])
    restored = {}
    for r in audit["restorations"]:
        restored.setdefault(r["row"], r)
    for entry in key["papyrus"]["rows"]:
        if entry["kind"] == "lost":
            assert Fraction(restored[entry["row"]]["value"]) == Fraction(entry["value"])


def test_demo_restores_the_fragments(demo, key):
    out, d = demo
    items = {i["fragment"]: i for i in json.loads((out / "fragments.json").read_text(encoding="utf-8"))}
    truth = {i["fragment"]: i for i in key["fragments"]["items"]}
    # Values of reference/periods.csv: the mean synodic month (ACT, Almagest IV.3), the
    # tropical year 365;14,48 d, the System B year, the sun's mean daily motion, the
    # Saros 6585 1/3 d (Almagest IV.2), 235 months of the 19-year cycle.
    for name in ("Frag. K 1", "Frag. K 2", "Frag. K 3", "Frag. K 4", "Frag. T 1", "Frag. T 3"):
        assert items[name]["restorations"][0]["value"] == truth[name]["value"], name
    # Cuneiform is floating: the digits are restored (3,4[3] = 223 months, the Saros),
    # the magnitude stays open.
    k5 = items["Frag. K 5"]["restorations"][0]
    assert k5["text"] == "3,4[3]"
    assert any(Fraction(k5["value"]) * Fraction(60) ** k == 223 for k in range(-3, 4))
    assert _step(d, "fragments")["best_restoration_right"] == 8
    for name in ("Frag. K 1", "Frag. K 2", "Frag. K 3", "Frag. K 4", "Frag. T 1", "Frag. T 2"):
        assert items[name]["identified"][0]["id"] in truth[name]["catalogue"], name
    # The best restoration is identified, not the damaged text at its lowest reading:
    # 3,4[3] is the Saros (223 months), CCXXX[V] the 19-year cycle (235 months).
    assert _step(d, "fragments")["identified_right"] == 8
    tsv = (out / "fragments-restored.tsv").read_text(encoding="utf-8")
    best = {row[0]: row[-1] for row in (ln.split("\t") for ln in tsv.splitlines()[2:]) if row[4] == "1"}
    for name, want in truth.items():
        assert best[name] in want["catalogue"], (name, best[name])
    assert "29;31,5[0],8,20" in tsv and "suggestions" in tsv


def test_demo_summary_and_console_text(demo):
    from rich.console import Console

    from numcheck.commands.demo import _show

    out, d = demo
    assert d["out"] == str(out)
    assert json.loads((out / "summary.json").read_text(encoding="utf-8"))["steps"] == d["steps"]
    console = Console(record=True, width=200)
    _show(d, console)
    text = console.export_text()
    assert "the audit flagged 14 of them (14 with the same kind)" in text
    assert "contradiction: line" in text and "suggestions for the editor" in text


def test_demo_refuses_a_file_as_output(tmp_path):
    target = tmp_path / "file"
    target.write_text("keep me")
    with pytest.raises(NumcheckError, match="not a folder"):
        run_demo(target)
    assert target.read_text() == "keep me"


def test_demo_refuses_the_corpus_as_output():
    with pytest.raises(NumcheckError, match="corpus folder"):
        run_demo(demo_data())
