"""The Julian and Alexandrian calendars against convertdate (a general-purpose
calendar library from the package registry, a test dependency).

convertdate's ``julian.to_jd`` (Meeus, Astronomical Algorithms ch. 7) returns
the Julian Date of the *midnight that begins* the civil day (…​.5); numcheck
counts the JDN of the civil day, the JD at its noon, so JDN = to_jd + 0.5
exactly.  ``from_jd`` takes any JD within the civil day, so from_jd(JDN) is the
date of that day.  Meeus' algorithm is stated for JD >= 0, so the random years
stay at or after 4712 BC (astronomical -4711).

The Coptic calendar of convertdate is the Alexandrian calendar counted in the
era of Diocletian (Era of the Martyrs), the same months with a sixth
epagomenal day in every fourth year: it checks numcheck's Alexandrian rule
(Thoth 1 = Julian Aug 29, Aug 30 in the Julian year before a leap year).
"""

from fractions import Fraction

import convertdate.coptic
import convertdate.julian
from hypothesis import given
from hypothesis import strategies as st

from numcheck.calendars import interval, parse_date
from numcheck.calendars.egyptian import alexandrian_to_jdn, jdn_to_alexandrian
from numcheck.calendars.julian import (iso_text, jdn_to_julian, julian_text, julian_to_jdn,
                                       month_length)
from numcheck.calendars.names import era_named

#: From convertdate's midnight JD to numcheck's JDN of the civil day.
HALF_DAY = Fraction(1, 2)
#: JD 0 is 4713 BC Jan 1 (astronomical -4712); stay inside Meeus' stated range.
FIRST_JDN, LAST_JDN = 0, 3_000_000


@st.composite
def julian_dates(draw):
    year = draw(st.integers(-4711, 3500))
    month = draw(st.integers(1, 12))
    day = draw(st.integers(1, month_length(year, month)))
    return year, month, day


@given(julian_dates())
def test_julian_to_jdn_matches_convertdate(date):
    assert julian_to_jdn(*date) == Fraction(convertdate.julian.to_jd(*date)) + HALF_DAY


@given(st.integers(FIRST_JDN, LAST_JDN))
def test_jdn_to_julian_matches_convertdate(jdn):
    assert jdn_to_julian(jdn) == tuple(convertdate.julian.from_jd(jdn))


@given(julian_dates())
def test_both_text_forms_read_back_as_convertdate_dates(date):
    expected = Fraction(convertdate.julian.to_jd(*date)) + HALF_DAY
    assert parse_date(iso_text(*date)).jdn == expected
    assert parse_date(julian_text(*date)).jdn == expected


@given(julian_dates(), julian_dates())
def test_interval_is_the_difference_of_convertdate_jds(a, b):
    expected = convertdate.julian.to_jd(*b) - convertdate.julian.to_jd(*a)
    assert interval(iso_text(*a), iso_text(*b)).days == expected


@st.composite
def alexandrian_dates(draw):
    year = draw(st.integers(1, 3000))
    month = draw(st.integers(1, 13))
    last = 30 if month < 13 else (6 if year % 4 == 3 else 5)  # convertdate.coptic's leap rule
    return year, month, draw(st.integers(1, last))


@given(alexandrian_dates())
def test_alexandrian_matches_convertdate_coptic(date):
    diocletian = era_named("Diocletian")
    assert alexandrian_to_jdn(diocletian, *date) == Fraction(convertdate.coptic.to_jd(*date)) + HALF_DAY


@given(st.integers(1825030, LAST_JDN))
def test_jdn_to_alexandrian_matches_convertdate_coptic(jdn):
    assert jdn_to_alexandrian(jdn, era_named("Diocletian")) == tuple(convertdate.coptic.from_jd(jdn))


def test_leap_epagomenal_day_where_convertdate_has_it():
    # Coptic year 3 has a sixth epagomenal day in convertdate (year % 4 == 3).
    assert parse_date("Diocletian 3 epagomenal day 6").jdn == convertdate.coptic.to_jd(3, 13, 6) + 0.5
