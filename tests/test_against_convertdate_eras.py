"""The Hijra and Hebrew calendars against convertdate; eras against published epochs.

convertdate (a general-purpose calendar library from PyPI, 2.5): ``islamic``
is the arithmetical Islamic calendar (the same 30-year cycle), ``hebrew`` the
fixed Hebrew calendar (its month numbers are ours: Nisan 1 ... Tishri 7 ...
Adar II 13).  Its ``to_jd`` gives the JD at midnight (x.5); the JDN of the
civil day is that + 0.5.

Published epochs and dates:
- Augustus 1 Thoth 1 = Nabonassar 719 Thoth 1 = 30 BC Aug 31: Toomer,
  Ptolemy's Almagest (1984), introduction on chronology (from memory).
- Hadrian 17 Athyr 7 = AD 132 Sep 25, Ptolemy's autumn equinox: Almagest III.1
  (tr. Toomer 1984), from memory.
- Yazdegerd 1 Farvardin 1 = AD 632 Jun 16 (Julian): Kennedy, Survey of Islamic
  Astronomical Tables (1956), from memory.
- Seleucid 1 Nisannu 1 = 311 BC Apr 3: Parker & Dubberstein, Babylonian
  Chronology (1956), from memory.
"""

import warnings

import pytest
from convertdate import hebrew as cd_hebrew
from convertdate import islamic as cd_islamic

from numcheck import NumcheckError
from numcheck.calendars import date_from_jdn, interval, parse_date
from numcheck.calendars.babylonian import intercalary_month, months_before
from numcheck.calendars.hebrew import is_leap as hebrew_leap
from numcheck.calendars.names import era_named


def _quiet(fn, *args):
    with warnings.catch_warnings():
        warnings.simplefilter("ignore", DeprecationWarning)   # convertdate's own month_days
        return fn(*args)


JDNS = list(range(1948440 - 400, 1948440 + 800_000, 997)) + list(range(2459800, 2460600, 7))


@pytest.mark.parametrize("jdn", JDNS[::7])
def test_hijra_agrees_with_convertdate(jdn):
    era = era_named("Hijra")
    date = date_from_jdn(jdn, "islamic", era=era)
    y, m, d = cd_islamic.from_jd(jdn - 0.5)
    if y >= 1:
        assert (date.year, date.month, date.day) == (y, m, d)
        assert parse_date(date.label).jdn == jdn
        assert int(cd_islamic.to_jd(y, m, d) + 0.5) == jdn


@pytest.mark.parametrize("jdn", list(range(347998 + 100, 2_600_000, 40_009)) + list(range(2459800, 2460600, 13)))
def test_hebrew_agrees_with_convertdate(jdn):
    era = era_named("Anno Mundi")
    date = date_from_jdn(jdn, "hebrew", era=era)
    y, m, d = _quiet(cd_hebrew.from_jd, jdn - 0.5)
    assert (date.year, date.month, date.day) == (y, m, d)
    assert parse_date(date.label).jdn == jdn
    assert int(_quiet(cd_hebrew.to_jd, y, m, d) + 0.5) == jdn


def test_hebrew_epoch_and_leap_years_agree_with_convertdate():
    assert parse_date("AM 1 Tishri 1").jdn == int(_quiet(cd_hebrew.to_jd, 1, 7, 1) + 0.5) == 347998
    for year in range(5700, 5800):
        assert hebrew_leap(year) == cd_hebrew.leap(year)
        length = interval(f"AM {year} Tishri 1", f"AM {year + 1} Tishri 1").days
        assert length == _quiet(cd_hebrew.year_days, year)


@pytest.mark.parametrize("first,second,julian", [
    ("Augustus 1 Thoth 1", "Nabonassar 719 Thoth 1", "30 BC Aug 31"),
    ("Hadrian 17 Athyr 7", "Nabonassar 880 Athyr 7", "AD 132 Sep 25"),
    ("Yazdegerd 1 Farvardin 1", "632 AD Jun 16", "AD 632 Jun 16"),
    ("Seleucid 1 Nisannu 1", "311 BC Apr 3", "311 BC Apr 3"),
    ("Hijra 1 Muharram 1", "622 AD Jul 16", "AD 622 Jul 16"),
])
def test_published_epochs(first, second, julian):
    assert interval(first, second).days == 0
    assert parse_date(first).equivalents()["julian"] == julian


def test_canon_of_kings_follows_on():
    # Each emperor's year 1 follows the last year of the one before (the Canon's running count).
    kings = ["Augustus", "Tiberius", "Gaius", "Claudius", "Nero", "Vespasian", "Titus", "Domitian",
             "Nerva", "Trajan", "Hadrian", "Antoninus"]
    reigns = {"Augustus": 43}
    for a, b in zip(kings, kings[1:]):
        years = reigns.get(a) or era_named(a).last_year
        assert interval(f"{a} 1 Thoth 1", f"{b} 1 Thoth 1").days == 365 * years
    with pytest.raises(NumcheckError, match="past the 21 years"):
        parse_date("Hadrian 22 Thoth 1")


def test_the_babylonian_cycle():
    # 235 months in 19 years, 7 of them intercalary, one a second Ululu (the published scheme).
    for start in (1, 20, 300):
        assert months_before(start + 19) - months_before(start) == 235
    extras = [intercalary_month(y) for y in range(1, 20)]
    assert extras.count(13) == 6 and extras.count(14) == 1
    # The same years as the Hebrew leap years: SE n's Addaru falls in the spring of AM n + 3450.
    for n in range(1, 200):
        assert (intercalary_month(n) is not None) == hebrew_leap(n + 3450)
    # Schematic months stay within the mean month: 19 years = 6940 days within a day.
    span = interval("Seleucid 1 Nisannu 1", "Seleucid 20 Nisannu 1").days
    assert abs(span - 6939.69) < 1


def test_schematic_calendars_say_so():
    assert "crescent" in parse_date("Seleucid 100 Nisannu 1").to_dict()["note"]
    assert "crescent" in parse_date("AH 100 Muharram 1").to_dict()["note"]
    assert "note" not in parse_date("AM 5000 Nisan 1").to_dict()


def test_augustus_as_a_julian_month_still_reads():
    assert parse_date("Augustus 31, 30 BC").jdn == parse_date("Augustus 1 Thoth 1").jdn
