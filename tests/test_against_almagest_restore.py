"""Lost digits of values in the Almagest restored by the catalogue (real look-up).

Ptolemy, Almagest IV.2 (tr. G. J. Toomer, Ptolemy's Almagest, 1984): the
223-month cycle is 6585 1/3 days, written 1,49,45;20 in sexagesimal and
͵ϛφπε γʹ in Greek numerals; Hipparchus' period of 4267 months; the mean
synodic month 29;31,50,8,20 days (κθ λα ν η κ).
"""

from fractions import Fraction

import pytest

from numcheck.restore import restore

#: Almagest IV.2 (Toomer 1984): 223 months = 6585 1/3 days.
SAROS_DAYS = Fraction(19756, 3)
#: Almagest IV.2 (Toomer 1984): Hipparchus' 4267 months.
HIPPARCHUS_MONTHS = Fraction(4267)
#: Almagest IV.2 (Toomer 1984): 29;31,50,8,20 days.
MONTH = Fraction(765433, 25920)


@pytest.mark.parametrize("damaged,restored", [
    ("1,49,4[x];20", "1,49,4[5];20"),
    ("1,4[x],45;20", "1,4[9],45;20"),
    ("1,49,45;[x]0", "1,49,45;[2]0"),
    ("1,[...],45;20", "1,[49],45;20"),
])
def test_saros_in_days(damaged, restored):
    result = restore(damaged, unit="days")
    assert result.best.value == SAROS_DAYS
    assert result.best.text == restored
    assert "saros_almagest" in result.best.reasons[0]


def test_saros_in_greek_numerals_with_a_lost_letter():
    result = restore("͵ϛφπ[.] γʹ", unit="days")
    assert result.best.value == SAROS_DAYS
    assert result.best.text == "͵ϛφπ[ε] γʹ"


@pytest.mark.parametrize("damaged,restored", [
    ("1,11,[x]", "1,11,[7]"),
    ("1,1[x],7", "1,1[1],7"),
])
def test_hipparchus_4267_months(damaged, restored):
    result = restore(damaged, unit="months")
    assert result.best.value == HIPPARCHUS_MONTHS
    assert result.best.text == restored
    assert "hipp_4267" in result.best.reasons[0]


def test_greek_month_with_a_lost_letter():
    result = restore("κθ λα ν [.] κ")
    assert result.best.value == MONTH
    assert result.best.text == "κθ λα ν [η] κ"
    assert "exactly" in result.best.reasons[0]
    assert result.space == 15
