"""The catalogue: structure, honest provenance, and values recomputed exactly.

Where a row's value can be recomputed from its own statement or from the
published numbers it rests on, it is; the sources are named beside each case.
"""

from fractions import Fraction

import pytest

from numcheck import catalogue
from numcheck.errors import UnknownNameError
from numcheck.catalogue.statements import parse_number, parse_statement, side_unit_key
from numcheck.units import convert

M = parse_number("29;31,50,8,20")   # ACT System B; Almagest IV.3


def test_size_and_ids():
    es = catalogue.entries()
    assert len(es) >= 120
    ids = [e.id for e in es]
    assert len(ids) == len(set(ids))


def test_every_row_is_sourced_and_classed():
    df = catalogue.frame()
    assert list(df.columns[: len(catalogue.COLUMNS)]) == list(catalogue.COLUMNS)
    for e in catalogue.entries():
        assert e.source.strip(), e.id
        assert e.confidence in catalogue.CONFIDENCES, e.id
        assert e.kind in catalogue.KINDS, e.id
        assert e.cycle is None or e.cycle in catalogue.CYCLES, e.id
        assert e.value > 0, e.id


def test_from_memory_marks_are_kept():
    # A source that says a value is recalled must not be promoted to "published"
    # unless only a detail (a chapter, an attribution) is recalled.
    for e in catalogue.entries():
        if e.source.strip().endswith("- from memory") and e.source.count(";") == 0:
            assert e.confidence != "published", e.id


def _days(side):
    total = Fraction(0)
    for t in side.terms:
        key = side_unit_key(t.unit)
        out = convert(t.number, key, "days")
        assert out.convention is None
        total += t.sign * out.value
    return total


def test_period_values_follow_from_their_statements():
    checked = 0
    for e in catalogue.entries(kind="period"):
        sides = parse_statement(e.statement)
        count = sides[0].terms[0].number
        other = sides[1]
        if e.unit == "days":
            assert e.value == _days(other) / count, e.id
            checked += 1
        elif other.single and e.id != "eudoxus_mars_synodic":
            assert e.value == other.single.number / count, e.id
            checked += 1
    assert checked > 60


def test_relation_day_sides_match_the_value_column():
    for e in catalogue.entries(kind="relation"):
        if e.unit == "days":
            assert any(s.single and s.single.unit == "days" and s.single.number == e.value
                       for s in e.sides), e.id


PUBLISHED = [
    # (what, computed, expected, source)
    ("4267 months of 29;31,50,8,20 d = 126007 d 1;5 h", (4267 * M - 126007) * 24,
     parse_number("1;5,3,20"), "Ptolemy, Almagest IV.2-3 (126007 days 1 hour)"),
    ("251 months = 7412;10,44,51,40 d", 251 * M, parse_number("7412;10,44,51,40"), "Almagest IV.3"),
    ("molad = 29 d 12 h 793 parts", 29 + Fraction(1, 2) + Fraction(793, 1080 * 24), M,
     "Maimonides, Qiddush ha-Hodesh 6"),
    ("System A year from the solar zones", Fraction(194, 30) + 166 / parse_number("28;7,30"),
     parse_number("12;22,8"), "Neugebauer, ACT (1955) System A column B"),
    ("System B year from the zigzag of column A",
     2 * (parse_number("30;1,59") - parse_number("28;10,39,40")) / parse_number("0;18"),
     parse_number("12;22,8,53,20"), "Neugebauer, ACT (1955) System B column A"),
    ("Callippic year", Fraction(27759, 76), Fraction(1461, 4), "Geminus, Introduction 8.59-60"),
]


@pytest.mark.parametrize("what,computed,expected,source", PUBLISHED, ids=[p[0] for p in PUBLISHED])
def test_published_arithmetic(what, computed, expected, source):
    assert computed == expected, source


def _round(value: Fraction, places: int) -> Fraction:
    unit = Fraction(1, 60**places)
    return Fraction(round(value / unit)) * unit


def _trunc(value: Fraction, places: int) -> Fraction:
    unit = Fraction(1, 60**places)
    return Fraction(value // unit) * unit


@pytest.mark.parametrize("entry_id,value,places,cut,source", [
    ("ptol_sun_motion", 360 / parse_number("365;14,48"), 6, _round, "Almagest III.1: 360 deg / 365;14,48 d"),
    ("ptol_moon_elong", 360 / M, 6, _round, "Almagest IV.3: 360 deg / 29;31,50,8,20 d"),
    ("ptol_moon_lon", 360 / M + 360 / parse_number("365;14,48"), 6, _round,
     "Almagest IV.3: elongation plus the sun's motion"),
    ("ptol_moon_anom_uncorr", 269 * 360 / parse_number("7412;10,44,51,40"), 6, _round,
     "Almagest IV.3: 269 returns in 7412;10,44,51,40 d (Toomer's figures truncate here)"),
    ("ptol_saturn_synodic", parse_number("21551;18") / 57, 2, _trunc, "Almagest IX.3 day total / 57"),
    ("ptol_jupiter_synodic", parse_number("25927;37") / 65, 2, _trunc, "Almagest IX.3 day total / 65"),
    ("ptol_mars_synodic", parse_number("28857;53") / 37, 2, _trunc, "Almagest IX.3 day total / 37"),
    ("ptol_venus_synodic", parse_number("2919;40") / 5, 2, _trunc, "Almagest IX.3 day total / 5"),
    ("ptol_mercury_synodic", parse_number("16802;24") / 145, 2, _trunc, "Almagest IX.3 day total / 145"),
])
def test_ptolemy_values_recomputed(entry_id, value, places, cut, source):
    got = catalogue.by_id(entry_id).value
    assert abs(got - cut(value, places)) <= Fraction(1, 60**places), source


def test_derived_rows_recomputed():
    assert catalogue.by_id("bab_anomalistic_month").value == 251 * M / 269
    assert catalogue.by_id("hipp_draconitic_month").value == 5458 * M / 5923
    assert catalogue.by_id("bab_year_sysA_days").value == parse_number("12;22,8") * M
    assert catalogue.by_id("ss_synodic_month").value == Fraction(1577917828, 53433336)
    for e in catalogue.entries():
        if e.value_as_attested.startswith("not attested as such"):
            assert e.confidence != "published", e.id
            assert "derived here" in e.source or "derived here" in e.value_as_attested, e.id


def test_period_lookup():
    assert catalogue.period("moon", "synodic", "babylonian") == M
    assert catalogue.period("sun", "tropical", "greek") == parse_number("365;14,48")
    assert abs(float(catalogue.period("moon", "synodic")) - 29.530588855) < 1e-8


REQUIRED = ([("moon", c) for c in ("synodic", "sidereal", "anomalistic", "draconitic")]
            + [("sun", c) for c in ("tropical", "sidereal", "anomalistic")]
            + [(p, c) for p in ("mercury", "venus", "mars", "jupiter", "saturn") for c in ("synodic", "sidereal")])


@pytest.mark.parametrize("body,cycle", REQUIRED)
def test_required_periods_exist(body, cycle):
    assert catalogue.period(body, cycle) > 0
    ancient = [e for e in catalogue.periods(body, cycle) if not e.tradition.startswith("modern")]
    assert ancient, f"no ancient {body} {cycle} period"


def test_unknown_names_list_what_exists():
    with pytest.raises(UnknownNameError, match="moon"):
        catalogue.period("mon", "synodic")
    with pytest.raises(UnknownNameError, match="babylonian"):
        catalogue.period("moon", "synodic", "martian")
    with pytest.raises(UnknownNameError):
        catalogue.by_id("saros_almagestt")
    with pytest.raises(UnknownNameError):
        catalogue.entries(body="pluto")


def test_relations_have_several_sides():
    saros = catalogue.by_id("saros_almagest")
    counts = [(s.terms[0].number, s.terms[0].unit) for s in saros.sides]
    assert (223, "synodic months") in counts and (239, "anomalistic months") in counts
    assert (242, "draconitic months") in counts and (Fraction(19756, 3), "days") in counts


def _counts(entry_id):
    return [s.terms[0].number for s in catalogue.by_id(entry_id).sides]


@pytest.mark.parametrize("entry_id,inner", [
    ("act_saturn", False), ("act_jupiter", False), ("act_mars", False), ("act_venus", True), ("act_mercury", True),
    ("goalyear_mars_79", False), ("goalyear_mars_47", False), ("goalyear_jupiter_71", False),
    ("goalyear_jupiter_83", False), ("goalyear_saturn", False),
])
def test_planetary_relations_close_on_themselves(entry_id, inner):
    # Neugebauer, HAMA (1975): for an outer planet years Y = phenomena Pi + rotations Z;
    # for an inner planet Z = Pi + Y (the phenomena are counted against the sun).
    years, phenomena, rotations = _counts(entry_id)
    if inner:
        assert rotations == phenomena + years
    else:
        assert years == phenomena + rotations


def test_calendar_cycles_are_built_from_each_other():
    # Geminus 8; Neugebauer, HAMA (Hipparchus' 304 years); Sothic identity (Censorinus 18)
    meton, callippus, hipp = (catalogue.by_id(i) for i in ("meton", "callippus", "hipp_304"))
    assert callippus.value == 4 * meton.value - 1 and _counts("callippus")[0] == 4 * _counts("meton")[0]
    assert hipp.value == 4 * callippus.value - 1 and _counts("hipp_304")[0] == 4 * _counts("callippus")[0]
    assert catalogue.by_id("octaeteris").value == 8 * Fraction(1461, 4)
    assert 1461 * 365 == 1460 * Fraction(1461, 4)
    assert _counts("bab_sysA_6247")[0] == 24 * 251 + 223          # de Jong 2017


def test_indian_yuga_numbers_agree():
    # Surya-siddhanta I (tr. Burgess 1860): lunations = moon's revolutions - sun's;
    # tithis = 30 lunations; stellar days = civil days + years.
    days, years = 1577917828, 4320000
    moon = _counts("ss_moon")[0]
    lunations = _counts("ss_lunations")[0]
    assert lunations == moon - years
    assert _counts("ss_tithis")[0] == 30 * lunations
    assert _counts("ss_stellar_days")[0] == days + years
    assert _counts("ss_year") == [years, days]
    assert lunations - 12 * years == 1593336                       # intercalary months
    assert _counts("ss_tithis")[0] - days == 25082252               # omitted tithis


def test_doctests():
    import doctest

    import numcheck.catalogue
    import numcheck.catalogue.statements

    for mod in (numcheck.catalogue, numcheck.catalogue.statements):
        assert doctest.testmod(mod).failed == 0
