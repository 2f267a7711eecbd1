"""Reading published parameters: exact values checked against their sources."""

from fractions import Fraction as F

import pytest

from numcheck import read

# (text, exact value, source)
PUBLISHED = [
    ("29;31,50,8,20", F(765433, 25920),
     "mean synodic month of lunar System B, in days; Neugebauer, Astronomical Cuneiform Texts (1955)"),
    ("1,49,45;20", F(6585) + F(1, 3),
     "the 223-month eclipse period, 6585 1/3 days; Ptolemy, Almagest IV.2 (tr. Toomer 1984)"),
    ("12;22,8", F(2783, 225),
     "the System A year, in months; Neugebauer, Astronomical Cuneiform Texts (1955)"),
    ("365;14,48", F(365) + F(1, 4) - F(1, 300),
     "Hipparchus' tropical year, 365 1/4 - 1/300 days; Ptolemy, Almagest III.1 (tr. Toomer 1984)"),
]


@pytest.mark.parametrize("text,value,source", PUBLISHED)
def test_published_value(text, value, source):
    assert read(text).value == value


def test_synodic_month_decimal():
    # 765433/25920 = 29.530594135802... (Neugebauer, ACT 1955)
    assert read("29;31,50,8,20").to_dict()["decimal"].startswith("29.530594135802")
