"""The eras of Ptolemy's Almagest: the epochs of the mean-motion tables.

Source: Ptolemy, Almagest, tr. G. J. Toomer (1984).  The era of Nabonassar
begins with Thoth 1 of year 1 = JD 1448638 (747 BC Feb 26, noon); the era of
Philip 424 Egyptian years later, JD 1603398 (324 BC Nov 12).  The book and
chapter (III.7) are from memory, and so are the two Julian dates as Toomer
prints them; the Julian dates are recomputed here from the JDNs, which the
issue gives.
"""

import pytest

from numcheck.calendars import interval, parse_date

NABONASSAR_EPOCH_JD = 1448638  # Toomer 1984, Almagest III.7 (chapter from memory)
PHILIP_EPOCH_JD = 1603398      # Toomer 1984, Almagest III.7 (chapter from memory)
YEARS_BETWEEN_ERAS = 424       # Egyptian years from Nabonassar to Philip (same source)


@pytest.mark.parametrize("text, jd", [
    ("Nabonassar 1 Thoth 1", NABONASSAR_EPOCH_JD),
    ("Philip 1 Thoth 1", PHILIP_EPOCH_JD),
    ("Nabonassar 425 Thoth 1", PHILIP_EPOCH_JD),
    ("747 BC Feb 26", NABONASSAR_EPOCH_JD),   # Julian date of the epoch (from memory)
    ("324 BC Nov 12", PHILIP_EPOCH_JD),       # Julian date of the epoch (from memory)
])
def test_epochs(text, jd):
    assert parse_date(text).jdn == jd


def test_philip_is_424_egyptian_years_after_nabonassar():
    result = interval("Nabonassar 1 Thoth 1", "Philip 1 Thoth 1")
    assert result.days == YEARS_BETWEEN_ERAS * 365 == 154760
    assert result.jd == (NABONASSAR_EPOCH_JD, PHILIP_EPOCH_JD)
    assert result.egyptian_years == (424, 0)


def test_the_same_day_in_both_eras():
    # Philip year Y is Nabonassar year Y + 424, month for month and day for day.
    assert parse_date("Philip 460 Pachon 7").jdn == parse_date("Nabonassar 884 Pachon 7").jdn
