"""Read a date as a historian types it into a :class:`CalendarDate`.

The forms accepted (commas and spacing are free, names are matched without
regard to case, diacritics or dots):

* ``JD 1448638`` or ``JDN 1448638``: a Julian Day Number (of the civil day),
  in any calendar; with ``calendar="jd"`` a bare whole number is one too.
* Egyptian and Alexandrian dates start with their era, then the year, then
  the month and day in either order: ``Nabonassar 1 Thoth 1``,
  ``Philip 424, 1 Thoth``, ``Nabonassar 1 epagomenal day 5``,
  ``Diocletian 1 Thoth 1`` (Alexandrian).  An era in the date decides its
  calendar, whatever the default calendar is.
* Julian dates: ``-746-02-26`` (astronomical year: 1 BC = 0), ``747 BC Feb 26``,
  ``26 Feb 747 BC``, ``Feb 26, 747 BC``, ``AD 2000 Jan 1``, ``2000 Jan 1``,
  ``-746 Feb 26``.  Month names in English or Latin, whole or abbreviated
  (``Feb``, ``Februarius``).  When neither number is marked BC/AD, signed, or
  larger than 31, the year cannot be told from the day and numcheck asks.

The parser reads what is written and never guesses: a date it cannot read is
an error that points at the part that is wrong.
"""

from __future__ import annotations

import re
import unicodedata

from .dates import CalendarDate, calendar_named, date_from_parts, month_calendar
from .names import eras, find_era, is_month_name, month_named, normalise
from ..errors import LimitError, NumcheckRangeError, NumcheckSyntaxError, UnknownNameError
from .. import limits

__all__ = ["parse_date", "DATE_EXAMPLES"]

#: Examples shown in help and error messages, one per form.
DATE_EXAMPLES = ("Nabonassar 1 Thoth 1", "Philip 424 Thoth 1", "747 BC Feb 26", "-746-02-26",
                 "JD 1448638")

_TOKEN = re.compile(
    r"(?P<num>[+-]?\d+)(?:st|nd|rd|th)?(?![^\W\d_])"
    r"|(?P<word>[^\W\d_](?:[\w'\N{RIGHT SINGLE QUOTATION MARK}.]|-(?=[^\W\d_]))*)"
    r"|(?P<sep>[,;:/])|(?P<space>\s+)|(?P<other>.)"
)
_ISO = re.compile(r"\s*([+-]?\d+)-(\d{1,2})-(\d{1,2})\s*")
_JD = re.compile(r"\s*(?:J\.?D\.?N?\.?)\s*:?\s*([+-]?\d+)\s*", re.IGNORECASE)
_JD_FRACTION = re.compile(r"\s*J\.?D\.?N?\.?\s*:?\s*[+-]?\d+(\.)\d*\s*", re.IGNORECASE)
_FILLERS = {"era", "of", "the", "year", "anno", "in"}
_BC = {"bc", "bce"}
_AD = {"ad", "ce"}
_EXPECT_EGYPTIAN = "an era, a year, then a month and a day, e.g. 'Nabonassar 1 Thoth 1'"
_EXPECT_JULIAN = "a Julian date such as '747 BC Feb 26', '26 Feb 747 BC' or '-746-02-26'"


def _tokens(text: str) -> list[tuple[str, str, int]]:
    out = []
    for m in _TOKEN.finditer(text):
        kind = m.lastgroup
        if kind in ("space", "sep"):
            continue
        if kind == "other":
            raise NumcheckSyntaxError(f"Cannot read {text!r} as a date: a character that has no "
                                      "place in a date", text, m.start(),
                                      expected=f"e.g. {' or '.join(repr(e) for e in DATE_EXAMPLES)}")
        value = m.group("num") if kind == "num" else m.group("word")
        out.append((kind, value, m.start()))
    return out


def parse_date(text: str, calendar: str = "julian") -> CalendarDate:
    """Read *text* as a date; *calendar* applies when the text names no era.

    >>> parse_date("Philip 1 Thoth 1").jdn
    1603398
    >>> parse_date("747 BC Feb 26").jdn
    1448638
    """
    if not isinstance(text, str):
        raise NumcheckSyntaxError(f"A date must be text, not {type(text).__name__}", "", 0)
    if len(text) > limits.MAX_TEXT_LENGTH:
        raise LimitError("length of the date text", len(text), limits.MAX_TEXT_LENGTH,
                         "Give one date of a few words (or set numcheck.limits.MAX_TEXT_LENGTH higher).")
    text = unicodedata.normalize("NFC", text)
    calendar = calendar_named(calendar)
    if not text.strip():
        raise NumcheckSyntaxError("An empty date", text, 0,
                                  expected=f"e.g. {' or '.join(repr(e) for e in DATE_EXAMPLES)}")
    fraction = _JD_FRACTION.fullmatch(text)
    if fraction:
        raise NumcheckSyntaxError(
            f"Cannot read {text!r}: numcheck counts whole Julian Day Numbers (the JDN of the "
            "civil day, i.e. the JD at its noon)", text, fraction.start(1),
            expected="a whole number, e.g. 'JD 1448638'")
    jd = _JD.fullmatch(text)
    if jd:
        return CalendarDate("jd", int(jd.group(1)), text=text)
    iso = _ISO.fullmatch(text)
    if iso:
        year, month, day = (int(g) for g in iso.groups())
        return _build(text, "julian", year, month, day, None,
                      {"year": iso.start(1), "month": iso.start(2), "day": iso.start(3)})
    tokens = _tokens(text)
    if calendar == "jd":
        if len(tokens) == 1 and tokens[0][0] == "num":
            return CalendarDate("jd", int(tokens[0][1]), text=text)
    lead = []
    while lead is not None and len(lead) < len(tokens) and tokens[len(lead)][0] == "word":
        lead.append(tokens[len(lead)])
    era_words = [w for w in lead if normalise(w[1]) not in _FILLERS]
    phrase = " ".join(w[1] for w in era_words)
    era = find_era(phrase) if era_words else None
    if era is not None and is_month_name("julian", phrase) and not any(
            t[0] == "word" and is_month_name(month_calendar(era.calendar), t[1]) for t in tokens[len(lead):]):
        era = None      # "Augustus 31, 30 BC" is the Latin month, not the era of Augustus
    if era is not None:
        return _era_date(text, era, tokens[len(lead):])
    if calendar not in ("julian", "jd"):
        choices = [e.name for e in eras() if e.calendar == calendar]
        if phrase and not is_month_name(month_calendar(calendar), phrase):
            raise UnknownNameError("era", phrase, choices)
        raise NumcheckSyntaxError(f"Cannot read {text!r} as an {calendar.title()} date: it must "
                                  "begin with its era", text, tokens[0][2],
                                  expected=f"one of {', '.join(choices)}, e.g. 'Nabonassar 1 Thoth 1'")
    if calendar == "jd":
        raise NumcheckSyntaxError(f"Cannot read {text!r} as a Julian Day Number", text, 0,
                                  expected="a whole number, e.g. 'JD 1448638' or '1448638'")
    return _julian_date(text, tokens)


def _era_date(text: str, era, rest: list) -> CalendarDate:
    if not rest or rest[0][0] != "num":
        where = rest[0][2] if rest else len(text)
        raise NumcheckSyntaxError(f"Cannot read {text!r}: a year of the era of {era.name} must "
                                  "follow the era", text, where, expected=_EXPECT_EGYPTIAN)
    year, year_pos = int(rest[0][1]), rest[0][2]
    rest = rest[1:]
    words = [t for t in rest if t[0] == "word"]
    nums = [t for t in rest if t[0] == "num"]
    if not words or not nums:
        missing = "month" if not words else "day"
        raise NumcheckSyntaxError(f"Cannot read {text!r}: the {missing} is missing", text, len(text),
                                  expected=_EXPECT_EGYPTIAN)
    if len(nums) > 1:
        raise NumcheckSyntaxError(f"Cannot read {text!r}: one number too many", text, nums[1][2],
                                  expected=_EXPECT_EGYPTIAN)
    # The month's words must stand together, before or after the day.
    first, last = rest.index(words[0]), rest.index(words[-1])
    if last - first + 1 != len(words):
        raise NumcheckSyntaxError(f"Cannot read {text!r}: the day stands inside the month's name",
                                  text, nums[0][2], expected=_EXPECT_EGYPTIAN)
    month = month_named(month_calendar(era.calendar), " ".join(w[1] for w in words))
    return _build(text, era.calendar, year, month.number, int(nums[0][1]), era,
                  {"year": year_pos, "month": words[0][2], "day": nums[0][2]})


def _julian_date(text: str, tokens: list) -> CalendarDate:
    items = []
    for kind, value, pos in tokens:
        if kind == "num":
            items.append(("num", value, pos))
            continue
        key = normalise(value)
        if key in _BC or key in _AD:
            items.append(("bc" if key in _BC else "ad", value, pos))
        elif is_month_name("julian", value):
            items.append(("month", month_named("julian", value).number, pos))
        else:
            era_spellings = [e.name for e in eras()]
            if is_month_name("egyptian", value):
                raise NumcheckSyntaxError(
                    f"Cannot read {text!r}: {value!r} is an Egyptian month, and an Egyptian or "
                    f"Alexandrian date begins with its era ({', '.join(era_spellings)})", text, pos,
                    expected="e.g. 'Nabonassar 1 Thoth 1' or 'Diocletian 1 Thoth 1'")
            if pos == 0:
                # A date that begins with a word that is no month names an era.
                raise UnknownNameError("era", value, era_spellings)
            raise UnknownNameError("Julian month", value, [m for m in _julian_month_names()])
    months_found = [i for i, it in enumerate(items) if it[0] == "month"]
    nums = [i for i, it in enumerate(items) if it[0] == "num"]
    marks = [i for i, it in enumerate(items) if it[0] in ("bc", "ad")]
    if len(months_found) != 1:
        where = items[months_found[1]][2] if len(months_found) > 1 else len(text)
        what = "two month names" if len(months_found) > 1 else "no month name"
        raise NumcheckSyntaxError(f"Cannot read {text!r} as a Julian date: {what}", text, where,
                                  expected=_EXPECT_JULIAN)
    if len(nums) != 2:
        where = items[nums[2]][2] if len(nums) > 2 else len(text)
        what = "one number too many" if len(nums) > 2 else "a year and a day are both needed"
        raise NumcheckSyntaxError(f"Cannot read {text!r} as a Julian date: {what}", text, where,
                                  expected=_EXPECT_JULIAN)
    if len(marks) > 1:
        raise NumcheckSyntaxError(f"Cannot read {text!r}: a second BC/AD", text, items[marks[1]][2],
                                  expected=_EXPECT_JULIAN)
    year_index, mark = _which_is_year(text, items, nums, months_found[0], marks)
    day_index = nums[0] if year_index == nums[1] else nums[1]
    written = items[year_index][1]
    year = int(written)
    if mark is not None:
        if written[0] in "+-":
            raise NumcheckSyntaxError(f"Cannot read {text!r}: a signed year with {mark[1]!r} "
                                      "(a signed year is astronomical: -746 = 747 BC)",
                                      text, items[year_index][2], expected=_EXPECT_JULIAN)
        if year < 1:
            raise NumcheckRangeError(f"There is no year 0 {mark[1]} (astronomical year 0 is 1 BC).",
                                     value=year, legal="years 1 and later with BC or AD")
        if mark[0] == "bc":
            year = 1 - year
    day = int(items[day_index][1])
    return _build(text, "julian", year, items[months_found[0]][1], day, None,
                  {"year": items[year_index][2], "month": items[months_found[0]][2],
                   "day": items[day_index][2]})


def _build(text, calendar, year, month, day, era, positions) -> CalendarDate:
    """Make the date; a part out of range is reported at its place in *text*."""
    try:
        return date_from_parts(calendar, year, month, day, era=era, text=text)
    except NumcheckRangeError as err:
        part = getattr(err, "part", None)
        if part not in positions:
            raise
        raise NumcheckRangeError(f"In the date {text!r}, the {part} is impossible: {err.reason}",
                                 value=err.value, legal=err.legal, text=text,
                                 position=positions[part]) from None


def _which_is_year(text, items, nums, month_index, marks):
    """The index of the year among the two numbers, and the BC/AD mark on it."""
    if marks:
        m = marks[0]
        kind = items[m][0]
        before = m - 1 if m - 1 in nums else None
        after = m + 1 if m + 1 in nums else None
        # "747 BC", "AD 2000", and also "2000 AD".
        target = (before if before is not None else after) if kind == "bc" else (
            after if after is not None else before)
        if target is None:
            raise NumcheckSyntaxError(f"Cannot read {text!r}: {items[m][1]!r} must stand next to "
                                      "the year", text, items[m][2], expected=_EXPECT_JULIAN)
        return target, items[m]
    signed = [i for i in nums if items[i][1][0] in "+-"]
    if len(signed) == 1:
        return signed[0], None
    big = [i for i in nums if int(items[i][1]) > 31]
    if len(big) >= 1:
        return big[0], None
    if month_index < nums[0]:
        return nums[1], None
    raise NumcheckSyntaxError(
        f"Cannot tell the year from the day in {text!r}: mark the year with BC or AD "
        "(e.g. '12 BC Feb 5'), or write it as -YYYY-MM-DD (astronomical year)",
        text, items[nums[0]][2], expected=_EXPECT_JULIAN)


def _julian_month_names() -> list[str]:
    from .names import months

    return [m.name for m in months("julian")]
