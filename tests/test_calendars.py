"""Calendars, the date syntax, interval() and the ``interval`` command."""

import json

import pytest
from hypothesis import given
from hypothesis import strategies as st

from numcheck import NumcheckError, NumcheckRangeError, NumcheckSyntaxError, UnknownNameError
from numcheck.calendars import date_from_jdn, interval, parse_date
from numcheck.calendars.names import months
from numcheck.cli import main

# (text, calendar, expected JDN, note).  The epochs are Ptolemy's (Almagest,
# tr. Toomer 1984; see test_against_almagest_epochs.py); the rest follow from
# them by the rules of each calendar (common practice).
GOOD = [
    ("Nabonassar 1 Thoth 1", "julian", 1448638, "epoch of the era of Nabonassar"),
    ("nabonassar 1 thoth 1", "egyptian", 1448638, "case does not matter"),
    ("Nabonassar year 1, 1 Thoth", "julian", 1448638, "'year', a comma, day before month"),
    ("era of Nabonassar 1 Thouth 1", "julian", 1448638, "a spelling variant of Thoth"),
    ("Nabonassar 1 Phaophi 1", "julian", 1448668, "30-day months"),
    ("Nabonassar 1 Mesorê 30", "julian", 1448997, "diacritics are ignored"),
    ("Nabonassar 1 epagomenal day 5", "julian", 1449002, "last day of the 365-day year"),
    ("Nabonassar 1 Epag. 5", "julian", 1449002, "abbreviated"),
    ("Nabonassar 2 Thoth 1", "julian", 1449003, "next year: 365 days on"),
    ("Philip 1 Thoth 1", "julian", 1603398, "epoch of the era of Philip"),
    ("Philip 424 Thoth 1", "julian", 1603398 + 423 * 365, "the brief's example"),
    ("Diocletian 1 Thoth 1", "julian", 1825030, "Alexandrian; AD 284 Aug 29"),
    ("Diocletian 3 epagomenal 6", "alexandrian", 1826125, "a leap year of six epagomenal days"),
    ("Diocletian 4 Thoth 1", "alexandrian", 1826126, "Aug 30 in the year before a Julian leap year"),
    ("747 BC Feb 26", "julian", 1448638, "BC year, month, day"),
    ("26 Feb 747 BC", "julian", 1448638, "day, month, BC year"),
    ("Feb 26, 747 BC", "julian", 1448638, "month first"),
    ("747 B.C. Februarius 26", "julian", 1448638, "dotted BC, Latin month name"),
    ("-746-02-26", "julian", 1448638, "astronomical year, ISO order"),
    ("-746 Feb 26", "julian", 1448638, "signed astronomical year"),
    ("AD 2000 Jan 1", "julian", 2451558, "AD before the year"),
    ("2000 AD Jan 1", "julian", 2451558, "AD after the year"),
    ("1 BC Feb 29", "julian", 1721117, "1 BC = year 0 is a leap year"),
    ("AD 1 Jan 1", "julian", 1721424, "the day after 1 BC Dec 31"),
    ("JD 1448638", "egyptian", 1448638, "a JDN in any calendar"),
    ("JDN 0", "julian", 0, "JD 0"),
    ("1448638", "jd", 1448638, "a bare number with --calendar jd"),
]


def test_good_table_has_no_repeats():
    assert len({(t, c) for t, c, _, _ in GOOD}) == len(GOOD)


@pytest.mark.parametrize("text, calendar, jdn, note", GOOD)
def test_good_dates(text, calendar, jdn, note):
    assert parse_date(text, calendar).jdn == jdn, note


# (text, calendar, error class, words the message must hold, note)
BAD = [
    ("Nabonassar 1 Thoth 31", "egyptian", NumcheckRangeError, ["day", "31", "1 to 30"], "day 31"),
    ("Nabonassar 1 Thoth 0", "egyptian", NumcheckRangeError, ["day", "1 to 30"], "day 0"),
    ("Nabonassar 1 epagomenal 6", "egyptian", NumcheckRangeError, ["Epagomenal day 6", "1 to 5"],
     "no sixth epagomenal day in the Egyptian year"),
    ("Diocletian 4 epagomenal 6", "alexandrian", NumcheckRangeError, ["Epagomenal day 6", "1 to 5"],
     "Diocletian 4 is not an Alexandrian leap year"),
    ("Nabonassar 0 Thoth 1", "egyptian", NumcheckRangeError, ["year", "1 and later"],
     "before the era"),
    ("Nabonasar 1 Thoth 1", "egyptian", UnknownNameError, ["Nabonasar", "Did you mean 'Nabonassar'"],
     "misspelt era"),
    ("Olympiad 1 Thoth 1", "egyptian", UnknownNameError, ["era", "Nabonassar", "Philip"],
     "an era numcheck does not count"),
    ("Seleucid 1 Thoth 1", "egyptian", UnknownNameError, ["Babylonian month", "Nisannu"],
     "an Egyptian month in a Babylonian era"),
    ("Nabonassar 1 Toth 1", "egyptian", UnknownNameError, ["Egyptian month", "Did you mean 'Thoth'"],
     "misspelt month"),
    ("Thoth 1", "egyptian", NumcheckSyntaxError, ["must begin with its era", "Nabonassar"],
     "Egyptian date without an era"),
    ("Nabonassar 1", "egyptian", NumcheckSyntaxError, ["month is missing"], "year only"),
    ("Nabonassar 1 Thoth", "egyptian", NumcheckSyntaxError, ["day is missing"], "no day"),
    ("Nabonassar 1 Thoth 1 2", "egyptian", NumcheckSyntaxError, ["one number too many"], "extra"),
    ("747 BC Feb 30", "julian", NumcheckRangeError, ["Day 30 of February 747 BC", "1 to 28"],
     "Julian Feb 30"),
    ("-746-02-29", "julian", NumcheckRangeError, ["not a Julian leap year", "1 to 28"],
     "not a leap year"),
    ("-746-13-01", "julian", NumcheckRangeError, ["Month 13", "1 to 12"], "month 13"),
    ("0 BC Jan 1", "julian", NumcheckRangeError, ["no year 0 BC"], "no year 0 BC"),
    ("-746 BC Feb 26", "julian", NumcheckSyntaxError, ["signed year"], "sign and BC"),
    ("5 Feb 12", "julian", NumcheckSyntaxError, ["Cannot tell the year from the day"], "ambiguous"),
    ("747 BC Febrary 26", "julian", UnknownNameError, ["Julian month", "Did you mean 'February'"],
     "misspelt month"),
    ("747 BC 26", "julian", NumcheckSyntaxError, ["no month name"], "no month"),
    ("JD 1448637.5", "julian", NumcheckSyntaxError, ["whole Julian Day Numbers"], "JD at midnight"),
    ("Thoth 1 @ 5", "julian", NumcheckSyntaxError, ["no place in a date"], "stray character"),
    ("", "julian", NumcheckSyntaxError, ["empty date"], "empty"),
    ("Nabonassar 1 Thoth 1", "mayan", UnknownNameError, ["calendar", "egyptian"], "unknown calendar"),
]


def test_bad_table_has_no_repeats():
    assert len({(t, c) for t, c, *_ in BAD}) == len(BAD)


@pytest.mark.parametrize("text, calendar, error, words, note", BAD)
def test_bad_dates(text, calendar, error, words, note):
    with pytest.raises(error) as info:
        parse_date(text, calendar)
    assert isinstance(info.value, NumcheckError)
    for word in words:
        assert word in str(info.value), note


def test_range_error_points_at_the_day():
    with pytest.raises(NumcheckRangeError) as info:
        parse_date("Nabonassar 1 Thoth 31")
    assert info.value.position == len("Nabonassar 1 Thoth ")


def test_thirteen_months_of_the_egyptian_year():
    names = [m.name for m in months("egyptian")]
    assert names[:12] == ["Thoth", "Phaophi", "Athyr", "Choiak", "Tybi", "Mechir", "Phamenoth",
                          "Pharmouthi", "Pachon", "Payni", "Epeiph", "Mesore"]
    assert sum(m.days for m in months("egyptian")) == 365
    assert all(m.source for m in months("egyptian"))


def test_every_era_and_month_row_has_a_source():
    from numcheck.calendars.names import eras

    assert {"Nabonassar", "Philip", "Diocletian", "Augustus", "Hadrian", "Hijra", "Yazdegerd", "Seleucid",
            "Anno Mundi"} <= {e.name for e in eras()}
    assert all(e.source for e in eras())
    assert all(m.source for m in months("julian"))
    assert "from memory" in next(e for e in eras() if e.name == "Nabonassar").source


@pytest.mark.parametrize("calendar", ["julian", "egyptian", "alexandrian", "jd"])
@given(jdn=st.integers(1_900_000, 2_600_000))
def test_label_reads_back_to_the_same_day(calendar, jdn):
    date = date_from_jdn(jdn, calendar)
    assert parse_date(date.label, calendar).jdn == jdn


@given(st.integers(1, 5000))
def test_egyptian_year_is_always_365_days(year):
    assert interval(f"Nabonassar {year} Thoth 1", f"Nabonassar {year + 1} Thoth 1").days == 365


@given(st.integers(1, 3000))
def test_alexandrian_year_is_365_or_366(year):
    days = interval(f"Diocletian {year} Thoth 1", f"Diocletian {year + 1} Thoth 1").days
    assert days == (366 if year % 4 == 3 else 365)


def test_sothic_period_1461_egyptian_years_are_1460_julian_years():
    # Censorinus, De die natali 18 (chapter from memory): an arithmetic identity.
    result = interval("Nabonassar 1 Thoth 1", "Nabonassar 1462 Thoth 1")
    assert result.days == 1461 * 365
    assert result.julian_years == 1460


def test_interval_is_signed_and_counts_civil_days():
    assert interval("AD 2000 Jan 2", "AD 2000 Jan 1").days == -1
    assert interval("AD 2000 Jan 1", "AD 2000 Jan 1").days == 0
    assert interval("1 BC Dec 31", "AD 1 Jan 1").days == 1


def test_interval_to_dict_fields():
    d = interval("Nabonassar 1 Thoth 1", "JD 1603398").to_dict()
    assert d["days"] == 154760
    assert d["jd"] == [1448638, 1603398]
    assert d["egyptian_years"] == {"years": 424, "days": 0}
    assert d["julian_years"] == "619040/1461"
    assert d["dates"][1]["equivalents"]["egyptian_philip"] == "Philip 1 Thoth 1"
    assert d["dates"][0]["equivalents"]["julian"] == "747 BC Feb 26"


def test_cli_interval_json(capsys):
    assert main(["interval", "Nabonassar 1 Thoth 1", "Philip 1 Thoth 1", "--json"]) == 0
    out = json.loads(capsys.readouterr().out)
    assert out["days"] == 154760 and out["jd"] == [1448638, 1603398]


def test_cli_interval_table(capsys):
    assert main(["interval", "747 BC Feb 26", "324 BC Nov 12"]) == 0
    out = capsys.readouterr().out
    assert "154,760 days" in out
    assert "424 Egyptian years of 365 days + 0 days" in out


def test_cli_interval_dash_dates(capsys):
    assert main(["interval", "--json", "--", "-746-02-26", "-323-11-12"]) == 0
    assert json.loads(capsys.readouterr().out)["days"] == 154760


def test_cli_interval_bad_day_exits_2(capsys):
    assert main(["interval", "Nabonassar 1 Thoth 31", "JD 0", "--json"]) == 2
    out = json.loads(capsys.readouterr().out)
    assert out["error"] == "NumcheckRangeError" and "1 to 30" in out["message"]
