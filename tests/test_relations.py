"""relate(), the search for relations, their mathematics and the ``relate`` command."""

import json
from fractions import Fraction
from types import SimpleNamespace

import pytest
from hypothesis import given
from hypothesis import strategies as st

from numcheck import LimitError, NumcheckError, NumcheckRangeError, UnknownNameError
from numcheck.cycles import periods as relations_cycles
from numcheck.cli import main
from numcheck.cycles import relate, search
from numcheck.cycles.periods import CYCLES, statement_cycle
from numcheck.cycles.convergents import best_ratios, continued_fraction, convergents, record_spans

# ---- exact arithmetic, with invented periods (the catalogue monkeypatched) --

#: Invented round periods (days) so that every residual can be checked by hand.
FAKE = {("sun", "tropical"): Fraction(365), ("moon", "synodic"): Fraction(30),
        ("venus", "synodic"): Fraction(584), ("moon", "anomalistic"): Fraction(27)}


@pytest.fixture
def fake_catalogue(monkeypatch):
    def entry(body, cycle, tradition):
        value = FAKE.get((body, cycle))
        return None if value is None else SimpleNamespace(value=value, id=f"fake_{body}_{cycle}")
    monkeypatch.setattr(relations_cycles, "_catalogue_entry", entry)


def _row(result, body, cycle):
    return next(c for c in result.bodies if (c.body, c.cycle) == (body, cycle))


def test_exact_residuals_with_invented_periods(fake_catalogue):
    r = relate(8, "years", values="ancient", tradition="invented")
    assert r.span_days == 2920
    venus = _row(r, "venus", "synodic")
    assert (venus.count, venus.nearest, venus.residual_days) == (Fraction(2920, 584), 5, 0)
    moon = _row(r, "moon", "synodic")
    assert (moon.nearest, moon.residual_days, moon.residual_degrees) == (97, 10, 120)
    assert r.bodies[0] is venus                      # closest first
    assert ("saturn", "synodic") in r.missing        # no value: listed, not guessed
    assert all((c.body, c.cycle) != ("sun", "tropical") for c in r.bodies)  # defines the unit


def test_months_and_days_units(fake_catalogue):
    assert relate(12, "months", values="ancient", tradition="x").span_days == 360
    d = relate("6585 1/3", "days", values="ancient", tradition="x")
    assert d.span_days == Fraction(19756, 3)
    assert _row(d, "moon", "synodic").residual_days == Fraction(19756, 3) - 220 * 30


def test_defining_cycle_falls_back_to_sidereal_year(monkeypatch):
    def entry(body, cycle, tradition):
        table = {("sun", "sidereal"): Fraction(366), ("moon", "synodic"): Fraction(30)}
        value = table.get((body, cycle))
        return None if value is None else SimpleNamespace(value=value, id="x")
    monkeypatch.setattr(relations_cycles, "_catalogue_entry", entry)
    r = relate(1, "years", values="ancient", tradition="babylonian-like")
    assert (r.unit_days, r.unit_defined_by) == (366, "sun sidereal")


# ---- the real catalogue ------------------------------------------------------

def test_every_cycle_is_reported_with_modern_values():
    r = relate(19, "years")
    assert r.missing == ()
    assert {(c.body, c.cycle) for c in r.bodies} == set(CYCLES) - {("sun", "tropical")}


def test_sun_years_come_last_for_a_span_in_years():
    bodies = relate(19, "years").bodies
    assert [c.body for c in bodies[-2:]] == ["sun", "sun"]
    assert bodies[0].body != "sun"


def test_to_dict_fields():
    d = relate(8, "years").to_dict()
    venus = next(b for b in d["bodies"] if (b["body"], b["cycle"]) == ("venus", "synodic"))
    assert venus["nearest"] == 5
    assert venus["count"].startswith("5.00")
    assert float(venus["residual_days"]) == pytest.approx(2.33, abs=0.01)
    assert Fraction(venus["residual_days_exact"]) > 0
    assert {k["id"] for k in venus["known"]} >= {"goalyear_venus"}
    assert all(k["source"] for k in venus["known"])
    assert d["n"] == "8" and d["unit"] == "years" and d["values"] == "modern"


# (n, unit, error, words in the message, note)
BAD = [
    (0, "years", NumcheckRangeError, ["N = 0", "positive"], "zero"),
    (-5, "years", NumcheckRangeError, ["N = -5", "positive"], "negative"),
    ("-1/2", "days", NumcheckRangeError, ["positive"], "negative fraction"),
    ("abc", "years", NumcheckRangeError, ["not a number"], "not a number"),
    (True, "years", NumcheckRangeError, ["must be a number"], "a bool"),
    (19, "yeers", UnknownNameError, ["Did you mean 'years'"], "misspelt unit"),
]


@pytest.mark.parametrize("n, unit, error, words, note", BAD)
def test_bad_input(n, unit, error, words, note):
    with pytest.raises(error) as info:
        relate(n, unit)
    assert isinstance(info.value, NumcheckError)
    for word in words:
        assert word in str(info.value), note


def test_ancient_values_need_a_known_tradition():
    with pytest.raises(NumcheckRangeError, match="needs a tradition"):
        relate(19, "years", values="ancient")
    with pytest.raises(UnknownNameError, match="Did you mean 'greek'"):
        relate(19, "years", values="ancient", tradition="grek")
    with pytest.raises(NumcheckRangeError, match="tradition"):
        relate(19, "years", tradition="greek")


def test_statement_units():
    assert statement_cycle("Mars synodic periods") == ("mars", "synodic")
    assert statement_cycle("saturn tropical revolutions") == ("saturn", "sidereal")
    assert statement_cycle("sidereal years") == ("sun", "sidereal")
    assert statement_cycle("days") is None


# ---- the search ----------------------------------------------------------------

def test_search_finds_19_years_235_months_among_the_convergents():
    result = search("moon", max_years=100)
    synodic = [r for r in result.ratios if r.counted.cycle == "synodic"]
    found = {(r.counted.nearest, r.years): r for r in synodic}
    assert found[(235, 19)].kind == "convergent"
    assert "meton" in [k.id for k in found[(235, 19)].counted.known]   # Geminus 8
    assert found[(99, 8)].kind == "convergent"                         # octaeteris, Geminus 8


def test_search_finds_the_saros_as_a_record_span():
    result = search("moon", max_years=400)
    assert result.span_unit == "months"
    saros = next(s for s in result.spans if s.span == 223)           # Almagest IV.2
    assert {(c.cycle, c.nearest) for c in saros.counts} == {("anomalistic", 239), ("draconitic", 242)}
    assert "saros_almagest" in [k.id for k in saros.known]


@pytest.mark.parametrize("body, years, count", [
    ("venus", 8, 5), ("mercury", 46, 145), ("saturn", 59, 57), ("jupiter", 71, 65),
    ("jupiter", 83, 76), ("mars", 79, 37),
])
def test_search_finds_goal_year_periods_as_convergents(body, years, count):
    # Goal-year periods: Sachs 1948; Gray & Steele 2008 (see test_against_goal_years.py).
    ratios = search(body, max_years=100).ratios
    hit = [r for r in ratios if r.counted.cycle == "synodic" and (r.counted.nearest, r.years) == (count, years)]
    assert hit and hit[0].kind == "convergent"
    assert hit[0].counted.known


def test_search_mars_records_include_both_goal_years():
    spans = [s.span for s in search("mars", max_years=100).spans]
    assert 47 in spans and 79 in spans    # goalyear_mars_47 and goalyear_mars_79


def test_search_sun_gives_days_in_years():
    ratios = [r for r in search("sun", max_years=40).ratios if r.counted.body == "day"]
    found = {(r.counted.nearest, r.years): r.kind for r in ratios}
    assert found[(1461, 4)] == "convergent"     # the Julian year of 365 1/4 days (common practice)
    assert found[(365, 1)] == "convergent"


def test_search_several_bodies_and_limits():
    result = search("venus, mars", max_years=50)
    assert result.targets == ("venus synodic", "mars synodic")
    with pytest.raises(UnknownNameError, match="Did you mean 'venus'"):
        search("venis")
    with pytest.raises(LimitError):
        search("moon", max_years=10**9)
    with pytest.raises(NumcheckRangeError):
        search("moon", max_years=0)


# ---- the mathematics, against exact rationals ---------------------------------

@given(st.fractions(min_value=Fraction(1, 1000), max_value=1000))
def test_continued_fraction_gives_back_the_number(x):
    p, q = convergents(continued_fraction(x))[-1]
    assert Fraction(p, q) == x


@given(st.fractions(min_value=Fraction(1, 50), max_value=50).filter(lambda x: x.denominator > 1),
       st.integers(1, 400))
def test_best_ratios_are_best_approximations(x, max_q):
    ratios = best_ratios(x, max_q)
    for p, q, _ in ratios:
        error = abs(x - Fraction(p, q))
        # No fraction with a smaller denominator is closer (checked by brute force).
        for smaller in range(1, q):
            nearest = round(x * smaller)
            assert abs(x - Fraction(nearest, smaller)) >= error or nearest == 0


def test_record_spans_are_strictly_improving():
    spans = record_spans(Fraction(1), [Fraction(7, 3), Fraction(11, 4)], 200)
    assert spans == sorted(spans) and len(spans) == len(set(spans))
    assert 77 in spans   # 77 = 33 x 7/3 = 28 x 11/4: both whole


# ---- the command ---------------------------------------------------------------

def test_cli_relate_json(capsys):
    assert main(["relate", "19", "--unit", "years", "--json"]) == 0
    out = json.loads(capsys.readouterr().out)
    moon = next(b for b in out["bodies"] if (b["body"], b["cycle"]) == ("moon", "synodic"))
    assert moon["nearest"] == 235
    assert {"body", "cycle", "count", "nearest", "residual_days"} <= set(moon)


def test_cli_relate_table(capsys):
    assert main(["relate", "223", "--unit", "months", "--top", "3"]) == 0
    out = capsys.readouterr().out
    assert "draconitic" in out and "242" in out and "saros_almagest" in out


@pytest.mark.parametrize("argv, words", [
    (["relate", "0", "--unit", "years"], "positive"),
    (["relate", "-3", "--unit", "years"], "positive"),
    (["relate", "19"], "unit of N"),
    (["relate"], "needs a span"),
    (["relate", "19", "--unit", "years", "--search", "moon"], "not both"),
])
def test_cli_relate_bad_input_exits_2(argv, words, capsys):
    assert main(argv + ["--json"]) == 2
    assert words in json.loads(capsys.readouterr().out)["message"]


def test_cli_search_json(capsys):
    assert main(["relate", "--search", "moon", "--max-years", "50", "--json"]) == 0
    out = json.loads(capsys.readouterr().out)
    assert any(r["cycles"] == 235 and r["years"] == 19 and r["kind"] == "convergent"
               for r in out["ratios"])
    assert out["simultaneous"]["unit"] == "months"
