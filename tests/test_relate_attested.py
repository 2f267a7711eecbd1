"""relate --search: sidereal years, and the attested relations listed even when not best.

The ACT System A relations (Neugebauer, ACT 1955, from memory in the
catalogue) close, in modern sidereal years and synodic periods (pyerfa
J2000 values), to the degrees the reference notes give (periods-notes.md §4,
"ACT System A"): Jupiter 391 / 427 0.73 deg, Mars 133 / 284 0.60 deg,
Mercury 1513 / 480 1.34 deg; tolerance 0.01 deg.
"""

import pytest

from numcheck import NumcheckError
from numcheck.cycles import search
from numcheck.cycles.known import known_relations


def _attested(result, rid, cycle):
    return next(a for a in result.attested if a.relation.id == rid and a.counted.cycle == cycle)


@pytest.mark.parametrize("body,rid,years,count,closure", [
    ("jupiter", "act_jupiter", 427, 391, 0.73),
    ("mars", "act_mars", 284, 133, 0.60),
    ("mercury", "act_mercury", 480, 1513, 1.34),
])
def test_act_relations_are_listed_in_sidereal_years(body, rid, years, count, closure):
    result = search(body, max_years=500, year="sidereal")
    assert result.year == "sidereal" and result.year_defined_by == "sun sidereal"
    found = _attested(result, rid, "synodic")
    assert (found.years, found.counted.nearest) == (years, count)
    assert abs(abs(float(found.counted.residual_degrees)) - closure) < 0.01
    assert found.relation.given_in == "years (sidereal years)"
    assert found.to_dict()["given_in"] == "years (sidereal years)"


def test_jupiter_427_is_attested_but_no_best_approximation():
    found = _attested(search("jupiter", max_years=500, year="sidereal"), "act_jupiter", "synodic")
    assert found.best is False
    assert found.to_dict()["best_approximation"] is False


def test_tropical_is_still_the_default():
    assert search("venus", max_years=10).year == "tropical"
    with pytest.raises(NumcheckError):
        search("venus", max_years=10, year="anomalistic")


def test_given_in_years_or_days():
    by_id = {r.id: r for r in known_relations()}
    assert by_id["meton"].given_in == "years (tropical years) and months and days"
    assert by_id["goalyear_venus"].given_in == "years (sidereal years)"
    assert "days" in by_id["saros_almagest"].given_in
