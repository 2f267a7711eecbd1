"""Lost digits of Babylonian parameters restored by the catalogue (real look-up).

Values from O. Neugebauer, Astronomical Cuneiform Texts (ACT), 1955:
the mean synodic month of lunar System B, 29;31,50,8,20 days, and the year
of lunar System A, 12;22,8 synodic months.  Each damaged form below leaves
the published value possible; the restoration must rank it first, say why,
and write it in the input's notation with the restored digits in brackets.
"""

from fractions import Fraction

import pytest

from numcheck.restore import restore

#: Neugebauer, ACT (1955), lunar System B: the mean synodic month in days.
MONTH_SYSTEM_B = Fraction(29) + Fraction(31, 60) + Fraction(50, 60**2) + Fraction(8, 60**3) + Fraction(20, 60**4)
#: Neugebauer, ACT (1955), lunar System A: the year in synodic months.
YEAR_SYSTEM_A = Fraction(12) + Fraction(22, 60) + Fraction(8, 60**2)


@pytest.mark.parametrize("damaged,restored,unit", [
    ("29;31,5[x],8,20", "29;31,5[0],8,20", None),
    ("29;31,5[x],8,20", "29;31,5[0],8,20", "days"),
    ("29;3[x],50,8,20", "29;3[1],50,8,20", "days"),
    ("29;31,50,[x],20", "29;31,50,[8],20", "days"),
    ("29;31,50,8,2[x]", "29;31,50,8,2[0]", "days"),
    ("29;31,[x]0,8,20", "29;31,[5]0,8,20", "days"),
    ("29;31,[4]0,8,20", "29;31,[5]0,8,20", "days"),     # an editor's wrong restoration overturned
])
def test_system_b_month(damaged, restored, unit):
    result = restore(damaged, unit=unit)
    best = result.best
    assert best.value == MONTH_SYSTEM_B
    assert best.text == restored
    assert best.probability > 0.4
    assert best.probability > 2 * result.candidates[1].probability
    assert "bab_month_sysB" in best.reasons[0] and "exactly" in best.reasons[0]


@pytest.mark.parametrize("damaged,restored", [
    ("12;22,[x]", "12;22,[8]"),
    ("12;2[x],8", "12;2[2],8"),
    ("1[x];22,8", "1[2];22,8"),
])
def test_system_a_year(damaged, restored):
    result = restore(damaged, unit="months")
    assert result.best.value == YEAR_SYSTEM_A
    assert result.best.text == restored
    assert "bab_year_sysA" in result.best.reasons[0]


def test_month_in_floating_cuneiform_notation_finds_its_magnitude():
    result = restore("29 31 5[x] 8 20", notation="cuneiform", unit="days")
    assert result.best.value == MONTH_SYSTEM_B
    assert result.best.scale == -4
    assert any("magnitude" in r for r in result.best.reasons)
