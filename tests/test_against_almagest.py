"""identify finds published values: the Almagest and the Babylonian tables.

Each case names the published value it must find (G. J. Toomer, Ptolemy's
Almagest, 1984; O. Neugebauer, Astronomical Cuneiform Texts, 1955).
"""

from dataclasses import replace
from fractions import Fraction

import pytest

from numcheck import read
from numcheck.identify import identify

CASES = [
    # text, notation, unit, expected id, factor, scale, how, source
    ("1,49,45;20", None, "days", "saros_almagest", 1, 0, "exact",
     "Almagest IV.2: 6585 1/3 days = 223 months"),
    ("7,26", None, "months", "saros_almagest", 2, 0, "exact",
     "Almagest IV.2: twice 223 months"),
    ("7 26", "cuneiform", "months", "saros_almagest", 2, 0, "exact",
     "twice 223 months, from a floating (cuneiform) reading"),
    ("1 49 45 20", "cuneiform", "days", "saros_almagest", 1, -1, "exact",
     "6585;20 days from a floating reading: scale 60^-1"),
    ("29;31,50,8,20", None, "days", "bab_month_sysB", 1, 0, "exact",
     "ACT System B / Almagest IV.3: mean synodic month"),
    ("0;59,8,17", None, "degrees", "ptol_sun_motion", 1, 0, "truncated",
     "Almagest III.1: solar mean daily motion 0;59,8,17,13,12,31 deg, cut after three places"),
    ("0;59,8,17,13,12,31", None, None, "ptol_sun_motion", 1, 0, "exact", "Almagest III.1"),
    ("7412;10,44,51,40", None, "days", "bab_251_269", 1, 0, "exact", "Almagest IV.3: 251 months"),
    ("365;14,48", None, "days", "ptol_tropical_year", 1, 0, "exact", "Almagest III.1"),
    ("13;10,35", None, "degrees", "ptol_moon_lon", 1, 0, "rounded",
     "Almagest IV.4: lunar mean motion 13;10,34,58,... deg/day rounded"),
    ("2919;40", None, "days", "ptol_venus_ix3", 1, 0, "exact", "Almagest IX.3: 5 returns of Venus"),
    ("6940 days", None, None, "meton", 1, 0, "exact", "Geminus 8: Meton's 6940 days (a mixed quantity)"),
    ("1,55,40", None, "days", "meton", 1, 0, "exact", "Geminus 8: 6940 days in sexagesimal"),
]


@pytest.mark.parametrize("text,notation,unit,entry,factor,scale,how,source", CASES,
                         ids=[f"{c[0]}-{c[2]}" for c in CASES])
def test_identify_finds(text, notation, unit, entry, factor, scale, how, source):
    result = identify(text, notation=notation, unit=unit, top=10)
    hits = [m for m in result.matches if m.id == entry and m.factor == factor and m.scale == scale]
    assert hits, f"{source}: got {[(m.id, m.factor, m.scale) for m in result.matches]}"
    assert hits[0].how == how, source
    # the published value ranks among the best: nothing of a worse class above it
    first = result.matches[0]
    assert first.how == how or (first.how == "exact"), source


def test_saros_is_first_for_its_day_count():
    assert identify("1,49,45;20", unit="days").matches[0].id == "saros_almagest"


def test_twice_the_saros_from_a_whole_and_a_floating_reading():
    fixed = read("7,26")
    floating = replace(fixed, floating=True)
    for reading in (fixed, floating):
        best = identify(reading, unit="months").matches[0]
        assert best.factor == 2 and best.how == "exact" and best.scale == 0
        assert "223" in best.statement


def test_truncated_sun_residual_in_last_place():
    m = identify("0;59,8,17", unit="degrees").matches[0]
    true = Fraction(45985799551, 46656000000)     # 0;59,8,17,13,12,31 (Almagest III.1)
    assert m.residual == (Fraction(212897, 216000) - true) / Fraction(1, 60**3)
    assert -1 < m.residual < 0
