"""The fuller catalogue: schools kept apart, derived months and motions, mathematical constants.

Outside values:
- Ptolemy's solar motion per Egyptian year 359;45,24,45,21,8,35 deg and per
  hour 0;2,27,50,43,3,1 deg: Almagest III.2 (tr. Toomer 1984), from memory.
- Meton's month 29;31,54,53 and year 365;15,47 (truncated): as the issue
  and the standard histories give them (common practice).
- al-Battani's daily solar motion 0;59,8,20,46,56,14 in his tables (from
  memory): the exact 360 / 365;14,26 rounds to it.
- sqrt 2 = 1;24,51,10 (YBC 7289; Fowler & Robson 1998) against math.sqrt.
"""

import math

import pytest
from fractions import Fraction as F

from numcheck import identify, read
from numcheck.catalogue import by_id, entries, in_tradition, traditions


def test_schools_are_kept_apart_and_their_parent_chooses_all():
    assert {"indian", "indian/aryabhata", "indian/khandakhadyaka", "indian/surya-siddhanta"} <= set(traditions())
    kh = {e.id for e in entries(tradition="indian/khandakhadyaka")}
    arya = {e.id for e in entries(tradition="indian/aryabhata")}
    assert kh and arya and not kh & arya
    assert kh | arya <= {e.id for e in entries(tradition="indian")}
    assert in_tradition("indian/aryabhata", "indian") and not in_tradition("indian", "indian/aryabhata")
    # Midnight and sunrise reckonings: 300 civil days apart in a yuga.
    assert by_id("khanda_moon").value - by_id("arya_moon").value == 300


def test_aryabhata_rows_agree_with_the_number_words():
    for word, row in [("cayagiyiṅuśuchlṛ", "arya_moon"), ("ḍhuṅvighva", "arya_saturn"),
                      ("khricyubha", "arya_jupiter"), ("bhadlijhnukhṛ", "arya_mars"),
                      ("ṅiśibuṇḷṣkhṛ", "arya_stellar_days")]:
        assert str(read(word).value) == by_id(row).statement.split(" ")[0]


def test_derived_months_and_years():
    assert identify("29;31,54,53", unit="days").matches[0].id == "meton_month"
    assert identify("365;15,47", unit="days").matches[0].id == "meton_year"
    assert identify("29;31,50,8,9,20", unit="days").matches[0].id == "hipp_4267_month"


def test_daily_motion_per_egyptian_year_and_per_hour():
    year = identify("359;45,24,45,21,8,35", unit="degrees").matches[0]
    assert (year.id, year.how, year.unit) == ("ptol_sun_motion", "exact", "degrees per egyptian year")
    hour = identify("0;2,27,50,43,3,1", unit="degrees").matches[0]
    assert (hour.id, hour.unit) == ("ptol_sun_motion", "degrees per hour")
    assert hour.how in ("truncated", "rounded")


def test_daily_motions_from_the_sides_of_a_relation():
    # 4612 sidereal months less 7 1/2 deg in 126007 d 1 h: the moon's daily motion in
    # longitude, 13;10,34,50,56,33,... deg/day (computed exactly here).
    top = identify("13;10,34,50,56,33", unit="degrees").matches[0]
    assert (top.id, top.how, top.unit) == ("hipp_4267", "truncated", "degrees per day")
    # 223 months in 6585 1/3 days: the daily elongation 12;11,26,37,0,12,...
    saros = identify("12;11,26,37", unit="degrees").matches
    assert "saros_almagest" in {m.id for m in saros if m.how == "truncated"}


def test_battani_motion_rounds_to_his_table_value():
    exact = by_id("battani_sun_motion").value
    table = read("0;59,8,20,46,56,14").value
    assert abs(exact - table) <= F(1, 2 * 60 ** 6)


def test_square_root_of_two():
    value = by_id("sqrt2_ybc7289").value
    assert abs(float(value) - math.sqrt(2)) < 1e-6
    assert by_id("sqrt2_ybc7289_30").value == 30 * value
    top = identify("1 24 51 10", notation="cuneiform").matches[0]
    assert top.id == "sqrt2_ybc7289" and top.how == "exact"


def test_floating_matches_say_when_they_are_coincidences():
    notes = identify("2 5", notation="cuneiform").notes
    assert any("coincidences" in n for n in notes)
    assert not any("by chance" in n for n in identify("29;31,50,8,20", unit="days").notes)


@pytest.mark.parametrize("school", ["indian/aryabhata", "indian/khandakhadyaka"])
def test_a_yuga_closes_every_cycle_of_its_own_school(school):
    # The periods derived from a school's yuga numbers give back those numbers exactly.
    from numcheck.cycles import relate

    result = relate(4320000, "years", values="ancient", tradition=school)
    assert result.unit_defined_by == "sun sidereal"
    counted = {(c.body, c.cycle): c for c in result.bodies}
    for key in [("moon", "sidereal"), ("mars", "sidereal"), ("saturn", "sidereal")]:
        assert counted[key].residual_days == 0
    assert counted[("moon", "sidereal")].nearest == 57753336
