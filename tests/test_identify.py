"""identify: classes, ranking, scales, units, bad input, JSON and the commands."""

import json
from dataclasses import replace
from fractions import Fraction

import pytest

import numcheck
from numcheck import read
from numcheck.cli import main
from numcheck.errors import NumcheckError, UnknownNameError
from numcheck.identify import Target, catalogue_targets, identify
from numcheck.identify.targets import factor_complexity, number_text, simple_factors

DESIGN_FIELDS = {"id", "statement", "factor", "scale", "unit", "residual", "score"}


def test_front_door_calls_identify_both_ways():
    assert numcheck.identify("7,26").matches[0].factor == 2
    import numcheck.identify as mod  # the package; calling it still identifies
    assert mod("7,26").matches[0].factor == 2


def test_json_fields_of_design():
    d = identify("1,49,45;20", unit="days").to_dict()
    assert d["matches"]
    for m in d["matches"]:
        assert DESIGN_FIELDS <= set(m)
        assert isinstance(m["factor"], str) and isinstance(m["residual"], str)
        Fraction(m["factor"]), Fraction(m["residual"])
        assert m["explanation"]
    scores = [m["score"] for m in d["matches"]]
    assert scores == sorted(scores, reverse=True)


def test_ranking_exact_then_simple_then_residual():
    ms = identify("1,49,45;20", unit="days", top=20).matches
    assert ms[0].how == "exact" and ms[0].factor == 1
    # Among matches of one class and one catalogue number, the simpler factor first.
    by_item = {}
    for m in ms:
        by_item.setdefault((m.how, m.id, m.label), []).append(factor_complexity(m.factor))
    assert all(v == sorted(v) for v in by_item.values())


@pytest.mark.parametrize("text,how", [
    ("29;31,50,8,20", "exact"),
    ("29;31,50,8", "truncated"),     # the month cut after the third place
    ("29;31", "truncated"),          # cut after the first place
    ("29;32", "rounded"),            # rounded there (31,50 -> 32)
    ("29;31,50,9", "near"),          # 40/60 of a unit off in the last place
    ("29;31,50,10", "near"),         # more than one unit off: still within 1e-5 relative
])
def test_classes_at_the_last_place(text, how):
    m = [x for x in identify(text, unit="days", top=30).matches if x.id == "bab_month_sysB" and x.factor == 1]
    assert m and m[0].how == how


def test_residual_is_in_units_of_the_last_written_place():
    m = [x for x in identify("29;31,50,10", unit="days", top=30).matches if x.id == "bab_month_sysB"][0]
    assert m.residual == (Fraction(10) - Fraction(8) - Fraction(20, 60))   # 29;31,50,10 - 29;31,50,8,20


def test_floating_reading_reports_its_scale():
    r = replace(read("1,49,45,20"), floating=True)
    m = identify(r, unit="days").matches[0]
    assert (m.id, m.scale, m.target) == ("saros_almagest", -1, Fraction(395120))


def test_fixed_reading_tries_only_its_own_scale():
    assert all(m.scale == 0 for m in identify("1,49,45,20").matches)


def test_unit_conversion_is_named():
    # 223 months in days with the default (Babylonian) month: a near match, convention named
    ms = identify("6585;19,21", unit="days", top=30).matches
    conv = [m for m in ms if m.id == "saros_almagest" and m.convention]
    assert conv and "babylonian" in conv[0].convention


def test_unknown_unit_lists_units():
    with pytest.raises(UnknownNameError, match="days"):
        identify("12", unit="dayz")


def test_top_must_be_positive():
    with pytest.raises(NumcheckError):
        identify("12", top=0)
    assert len(identify("1,49,45;20", top=3).matches) == 3


def test_nothing_matches_says_so_with_nearest():
    res = identify("1234;17,11,5")
    assert not res.matches
    assert res.nearest and "No catalogue number fits" in res.summary
    d = res.to_dict()
    assert d["matches"] == [] and d["nearest"][0]["relative"]


def test_damaged_reading_matches_within_its_range():
    res = identify("29;31,5[x],8,20", unit="days", top=30)
    ids = {(m.id, m.how) for m in res.matches}
    assert ("bab_month_sysB", "damage") in ids or ("bab_month_sysB", "exact") in ids


def test_simple_factors_and_text():
    fs = simple_factors()
    assert Fraction(1) in fs and Fraction(12) in fs and Fraction(1, 12) in fs and Fraction(7, 5) in fs
    assert len(fs) == len(set(fs))
    assert number_text(Fraction(19756, 3)) == "6585;20"


def test_catalogue_targets_window():
    ts = catalogue_targets(220, 230, "months")
    assert all(isinstance(t, Target) and 220 <= t.value <= 230 for t in ts)
    assert any(t.id == "saros_almagest" and t.value == 223 and t.factor == 1 for t in ts)
    assert all(0 < t.weight <= 1 for t in ts)
    assert [t.value for t in ts] == sorted(t.value for t in ts)


def test_catalogue_targets_floating():
    ts = catalogue_targets(Fraction(6585), Fraction(6586), "days", floating=True)
    assert any(t.id == "saros_almagest" and t.scale == 0 for t in ts)
    small = catalogue_targets(Fraction(49, 100), Fraction(1, 2), "days", floating=True)
    # a reading 0;29,31,50,8,20 times 60^1 is the month: scale 1, as identify reports it
    sar = [t for t in small if t.id == "bab_month_sysB" and t.factor == 1]
    assert sar and sar[0].scale == 1 and sar[0].value == Fraction(765433, 25920) / 60


def test_cli_json_and_exit_codes(capsys):
    assert main(["identify", "1,49,45;20", "--unit", "days", "--json"]) == 0
    out = json.loads(capsys.readouterr().out)
    assert out["matches"][0]["id"] == "saros_almagest"
    assert main(["identify", "12", "--unit", "dayz", "--json"]) == 2
    capsys.readouterr()
    assert main(["catalogue", "--body", "venus", "--json"]) == 0
    cat = json.loads(capsys.readouterr().out)
    assert cat["count"] >= 10 and all(e["body"] == "venus" for e in cat["entries"])
    assert main(["catalogue", "--body", "mon"]) == 2
    assert "moon" in capsys.readouterr().err


def test_cli_table_text(capsys):
    assert main(["identify", "0;59,8,17", "--unit", "degrees"]) == 0
    out = capsys.readouterr().out
    assert "ptol_sun_motion" in out and "truncated" in out and "not readings" in out


def _brute_force(reading, unit):
    """Every item x every allowed factor, one by one, classified exactly."""
    from numcheck import limits
    from numcheck.identify import core, targets

    tab = targets.table(unit)
    factors = list(simple_factors()) + [Fraction(n) for n in range(limits.IDENTIFY_MAX_SIMPLE + 1,
                                                                    limits.IDENTIFY_MAX_MULTIPLE + 1)]
    pairs = [(f, f.numerator / f.denominator) for f in factors]
    v, ulp = reading.value, reading.ulp
    tol = max(core.NEAR_ULPS * ulp, core.NEAR_RELATIVE * v)
    window = core._Window(False, v, v)
    found = set()
    fv, ftol = float(v), 2 * float(tol)
    for i, item in enumerate(tab.items):
        base = item.value * tab.factors[i]
        fbase = float(base)
        for f, ff in pairs:
            if abs(fbase * ff - fv) > ftol:   # a coarse float gate; exact test below
                continue
            if not targets.factor_allowed(item, f):
                continue
            target = base * f
            if core._classify(window, v, target, ulp, tol if f == 1 else core.NEAR_ULPS * ulp):
                found.add((item.entry.id, item.label, f))
    return found


@pytest.mark.parametrize("text,unit", [("1,49,45;20", "days"), ("3,43", None), ("0;59,8,17", "degrees")])
def test_fast_search_equals_brute_force(text, unit):
    reading = read(text)
    fast = {(m.id, m.label, m.factor) for m in identify(reading, unit=unit, top=100_000).matches}
    assert fast == _brute_force(reading, unit)


def test_wide_damage_compares_the_edition_value_and_says_so():
    res = identify("1,[x],[x],[x]")
    assert res.notes and "restore" in res.notes[0]
    assert all(m.how != "damage" for m in res.matches)


def test_no_parts_of_small_counts_or_excess_terms():
    ms = identify("0;20", top=200).matches
    assert not any(m.factor.denominator != 1 and m.target.denominator == 1 and m.target / m.factor < 60
                   for m in ms)
    assert not any(m.label.startswith("a term") and m.factor != 1 for m in identify("3;20", top=200).matches)


from hypothesis import assume, given
from hypothesis import strategies as st

from numcheck.identify.targets import all_items, factor_allowed
from numcheck.reading import sexagesimal_text


@given(st.sampled_from(all_items()), st.sampled_from(simple_factors()))
def test_every_catalogue_number_times_a_factor_is_found_exactly(item, factor):
    assume(factor_allowed(item, factor))
    x = item.value * factor
    text = sexagesimal_text(x, max_places=8)
    assume("..." not in text)   # only values that end within 8 sexagesimal places
    ms = identify(read(text), top=100_000).matches
    assert any(m.id == item.entry.id and m.factor == factor and m.how == "exact" for m in ms), text


def test_doctests():
    import doctest

    from numcheck.identify import core, targets

    for mod in (core, targets):
        assert doctest.testmod(mod).failed == 0


def test_damaged_reading_is_matched_reading_by_reading():
    # 1,4[x],45;20 days allows 1,40,45;20 ... 1,49,45;20: the 223-month period
    # 6585;20 days (Ptolemy, Almagest IV.2, tr. Toomer 1984) is one of them.
    res = identify("1,4[x],45;20", unit="days", top=50)
    saros = [m for m in res.matches if m.id == "saros_almagest" and m.factor == 1]
    assert saros and saros[0].how == "damage"
    assert "read as 1,49,45;20" in saros[0].explanation
    # Every damage match agrees with one of the readings, not just lies in the range.
    readings = set(read("1,4[x],45;20").readings())
    for m in res.matches:
        if m.how == "damage":
            assert any(abs(r - m.target) < 1 for r in readings)


# ---- ranking: the right answer first (numcheck/identify/ranking.py) ----------------

def test_rows_that_say_the_same_are_one_statement():
    groups = identify("1,49,45;20", unit="days").groups
    assert groups[0].ids == ("saros_almagest",) and groups[0].how == "exact"
    saros = next(g for g in groups if g.what == "223 synodic months")
    assert set(saros.ids) == {"goalyear_moon_18", "saros_almagest", "saros_bab_38"}
    whats = [(g.what, g.how, g.scale) for g in groups]
    assert len(whats) == len(set(whats))
    d = identify("1,49,45;20", unit="days").to_dict()
    assert d["groups"][0]["ids"] == ["saros_almagest"] and d["groups"][0]["sources"][0]["source"]


def test_a_coincidence_of_precision_does_not_outrank_history():
    # 7,26,0,0 (at 60^2) is a whole number of 360-day years whatever its digits: it says nothing.
    groups = identify("7 26", notation="cuneiform", top=30).groups
    assert groups[0].what == "2 × 223 synodic months"         # 446 months: twice the Saros
    coincidence = [g for g in groups if g.what == "4460 × 360 days"]
    assert all(g.score < 0.1 for g in coincidence)


def test_the_notation_says_the_tradition():
    # A Greek month written to two places: the Hipparchan value (Almagest IV.3) first,
    # not behind Islamic, Indian and modern values.
    res = identify("κθ λα ν", unit="days")
    assert res.tradition == "greek"
    assert "hipp_month" in res.groups[0].ids
    plain = identify("29;31,50", unit="days")
    assert plain.tradition is None and plain.groups[0].ids == ("islamic_month",)
    asked = identify("29;31,50", unit="days", tradition="greek")
    assert "hipp_month" in asked.groups[0].ids


def test_modern_values_come_after_the_ancient_ones():
    groups = identify("29;31,50", unit="days").groups
    first_modern = min(i for i, g in enumerate(groups) if any(m.tradition.startswith("modern") for m in g.matches))
    first_bab = min(i for i, g in enumerate(groups) if "bab_month_sysB" in g.ids)
    assert first_bab < first_modern


def test_penalties_for_long_factors_high_scales_and_rows_from_memory():
    from numcheck.identify.ranking import score

    base = score("exact", Fraction(1), 0, "published", "greek", None, 0.0, 0.0)
    assert score("exact", Fraction(235), 0, "published", "greek", None, 0.0, 0.0) < \
        score("exact", Fraction(12), 0, "published", "greek", None, 0.0, 0.0) < base
    assert score("exact", Fraction(1), 3, "published", "greek", None, 0.0, 0.0) < \
        score("exact", Fraction(1), 1, "published", "greek", None, 0.0, 0.0) < base
    assert score("exact", Fraction(1), 0, "from memory", "greek", None, 0.0, 0.0) < base
    assert score("exact", Fraction(1), 0, "published", "greek", None, 0.0, 1.0) < 0.05


def test_an_unknown_tradition_is_named():
    with pytest.raises(UnknownNameError, match="tradition 'roman'"):
        identify("29;31,50", tradition="roman")
    from numcheck import restore

    with pytest.raises(UnknownNameError, match="tradition"):
        restore("29;31,5[x]", tradition="roman")


def test_restore_weighs_the_tradition_asked_for():
    from numcheck import restore

    # 29;31,50,[x] days: the Hipparchan month 29;31,50,8,20 (Almagest IV.3) cut there gives 8;
    # the Indian months of the catalogue's rows (Surya-siddhanta, Aryabhata, Khandakhadyaka)
    # give 6 or 7.  "indian" takes in its schools (indian/surya-siddhanta ...).
    greek = restore("29;31,50,[x]", unit="days", tradition="greek")
    indian = restore("29;31,50,[x]", unit="days", tradition="indian")
    assert greek.candidates[0].text == "29;31,50,[8]"
    assert indian.candidates[0].text in ("29;31,50,[6]", "29;31,50,[7]")


def test_identify_command_takes_tradition_and_full(capsys):
    assert main(["identify", "29;31,50", "--unit", "days", "--tradition", "greek", "--json"]) == 0
    d = json.loads(capsys.readouterr().out)
    assert d["tradition"] == "greek" and "hipp_month" in d["groups"][0]["ids"]
    assert main(["identify", "29;31,50", "--unit", "days", "--full"]) == 0
    assert "Almagest IV.3" in capsys.readouterr().out
