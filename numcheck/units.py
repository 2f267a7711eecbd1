"""Units of the texts and exact conversions between them.

A unit belongs to a *dimension* and is an exact :class:`~fractions.Fraction`
of that dimension's base: time (days), arc (degrees), lunar time (synodic
months) and solar time (years).  Within a dimension conversion is exact
arithmetic.  Between lunar or solar time and days a period length is needed,
and the ancient traditions disagree about it, so such a conversion takes a
named *convention* (:data:`CONVENTIONS`) and the result says which one it used:
a month is 29;31,50,8,20 days for a Babylonian or Hipparchan computation but
30 days in a schematic calendar, and a year may be 365, 365 1/4 or 365;14,48
days.

The zodiac (:data:`ZODIAC`) is here too: a number of degrees followed by a
sign name is a longitude (``12;30 Taurus`` = 42;30°).
"""

from __future__ import annotations

import unicodedata
from dataclasses import dataclass
from fractions import Fraction

from .errors import NumcheckError, UnknownNameError

__all__ = [
    "Unit",
    "Converted",
    "Convention",
    "UNITS",
    "CONVENTIONS",
    "DEFAULT_MONTH",
    "DEFAULT_YEAR",
    "ZODIAC",
    "IncompatibleUnitsError",
    "canonical_unit",
    "unit",
    "dimension",
    "convert",
    "to_days",
    "zodiac_index",
    "sign_longitude",
]


class IncompatibleUnitsError(NumcheckError):
    """Two units measure different things (days and degrees, say)."""


def _sexa(text: str) -> Fraction:
    """An exact value from modern sexagesimal notation (``29;31,50,8,20``).

    Kept here, small and strict, because units sit below the notations.

    >>> _sexa("12;22,8")
    Fraction(2783, 225)
    """
    whole, _, frac = text.partition(";")
    value = Fraction(0)
    for digit in whole.split(","):
        value = value * 60 + int(digit)
    weight = Fraction(1)
    for digit in frac.split(",") if frac else ():
        weight /= 60
        value += int(digit) * weight
    return value


@dataclass(frozen=True)
class Unit:
    """A unit: its dimension and its exact size in the dimension's base."""

    name: str
    dimension: str
    factor: Fraction
    aliases: tuple[str, ...]
    source: str


@dataclass(frozen=True)
class Converted:
    """The result of a conversion, with the convention that made it possible."""

    value: Fraction
    unit: str
    convention: str | None


@dataclass(frozen=True)
class Convention:
    """A named length of the month and/or the year (and, rarely, the cubit).

    ``month`` is in days; ``year`` is in days, or in synodic months when
    ``year_in_months`` (the Babylonian lunar theories count the year in months).
    """

    name: str
    month: Fraction | None
    year: Fraction | None
    year_in_months: bool
    cubit: Fraction | None
    source: str


#: Base unit of each dimension.
BASES = {"time": "days", "arc": "degrees", "months": "months", "years": "years"}

_MONTH = _sexa("29;31,50,8,20")

# name, dimension, factor to the base, aliases, source.  Kept in code (one
# screen): each value is a definition of the trade, not a measurement.
_UNIT_TABLE = [
    ("days", "time", Fraction(1), ("day", "d", "nychthemera"), "common practice (the base of time)"),
    ("hours", "time", Fraction(1, 24), ("hour", "h", "hr", "equinoctial hours"),
     "common practice: 24 equinoctial hours per day"),
    ("minutes", "time", Fraction(1, 1440), ("minute", "min"), "common practice: 60 minutes per hour"),
    ("seconds", "time", Fraction(1, 86400), ("second", "sec", "s"), "common practice: 60 seconds per minute"),
    ("UŠ", "time", Fraction(1, 360), ("us", "uš", "ush", "time-degree", "time-degrees", "time degrees"),
     "CDLI wiki 'Akkadian astronomy', metrology: 1 day = 6,0 UŠ (checked); Neugebauer, HAMA (1975)"),
    ("bēru", "time", Fraction(1, 12), ("beru", "danna", "double-hour", "double-hours", "double hours"),
     "CDLI wiki 'Akkadian astronomy': 1 bēru = 30 UŠ = 2 hours (checked); Hunger & Pingree 1999"),
    ("NINDA", "time", Fraction(1, 21600), ("ninda", "gar"),
     "CDLI wiki: 1 UŠ = 60 NINDA (checked); its use as a unit of time from memory"),
    ("ḥalaqim", "time", Fraction(1, 25920), ("halaqim", "halakim", "heleq", "helek"),
     "Maimonides, Mishneh Torah, Hilkhot Qiddush ha-Hodesh ch. 6: 1080 parts = 1 hour"),
    ("ghaṭikās", "time", Fraction(1, 60), ("ghatikas", "ghatika", "ghati", "nadika", "nadikas"),
     "common practice of Indian astronomy: 60 ghaṭikās per day (from memory)"),
    ("months", "months", Fraction(1), ("month", "synodic months", "synodic month", "lunations", "lunation"),
     "common practice: the synodic month (its length in days is a convention)"),
    ("tithis", "months", Fraction(1, 30), ("tithi", "lunar days", "lunar day"),
     "common practice of Indian astronomy: 30 tithis per synodic month (Sūrya-siddhānta I, tr. Burgess 1860)"),
    ("years", "years", Fraction(1), ("year", "y", "yr", "yrs"),
     "common practice (its length in days is a convention)"),
    ("degrees", "arc", Fraction(1), ("degree", "deg", "°", "UŠ of arc", "us of arc"),
     "common practice (the base of arc)"),
    ("signs", "arc", Fraction(30), ("sign", "zodiacal signs", "zodiacal sign"),
     "common practice: 12 signs of 30 degrees"),
    ("arcminutes", "arc", Fraction(1, 60), ("arcminute", "arcmin", "′", "'"), "common practice: 60′ per degree"),
    ("arcseconds", "arc", Fraction(1, 3600), ("arcsecond", "arcsec", "″", '"'), "common practice: 60″ per minute"),
    ("fingers", "arc", Fraction(1, 12), ("finger", "šu-si", "su-si", "si", "ubānu", "ubanu"),
     "CDLI wiki 'Akkadian astronomy': 1 degree = 12 fingers in late texts (checked)"),
    ("cubits", "arc", Fraction(2), ("cubit", "kùš", "kus", "kuš", "ammatu"),
     "CDLI wiki 'Akkadian astronomy': 1 cubit = 24 fingers = 2 degrees in Neo/Late Babylonian use (checked); "
     "some texts imply 2 1/2 degrees (from memory): convention 'cubit-2.5'"),
]

#: Canonical unit name -> :class:`Unit`.
UNITS: dict[str, Unit] = {
    name: Unit(name, dim, factor, aliases, source) for name, dim, factor, aliases, source in _UNIT_TABLE
}

_CONVENTION_TABLE = [
    # name, month (days), year, year in months?, cubit (degrees), source
    ("babylonian", _MONTH, None, False, None,
     "Neugebauer, ACT (1955) lunar System B: mean synodic month 29;31,50,8,20 d; "
     "= Ptolemy, Almagest IV.3 (Hipparchus)"),
    ("hipparchus", _MONTH, _sexa("365;14,48"), False, None,
     "Ptolemy, Almagest IV.3 (month 29;31,50,8,20 d) and III.1 (tropical year 365;14,48 d)"),
    ("geminus", Fraction(59, 2) + Fraction(1, 33), None, False, None,
     "Geminus, Introduction to the Phenomena 8.1-8.3: month 29 1/2 1/33 d"),
    ("schematic", Fraction(30), Fraction(360), False, None,
     "Hunger & Pingree, MUL.APIN (1989): ideal month of 30 d, year of 360 d (from memory)"),
    ("metonic", Fraction(6940, 235), Fraction(6940, 19), False, None,
     "Geminus, Introduction 8: 19 years = 235 months = 6940 days (Meton)"),
    ("callippic", Fraction(27759, 940), Fraction(27759, 76), False, None,
     "Geminus, Introduction 8.59-60: 76 years = 940 months = 27759 days (Callippus)"),
    ("islamic", Fraction(10631, 360), Fraction(10631, 30), False, None,
     "Doggett, 'Calendars', Explanatory Supplement (1992) ch. 12: 30 lunar years = 360 months = 10631 days"),
    ("egyptian", None, Fraction(365), False, None,
     "Ptolemy, Almagest III.7: Egyptian civil year of 365 days"),
    ("julian", None, Fraction(1461, 4), False, None,
     "Julian calendar (45 BC); IAU: Julian year = 365.25 d exactly"),
    ("gregorian", None, Fraction(146097, 400), False, None,
     "papal bull Inter gravissimas (1582): 97 leap years in 400 years"),
    ("hipparchus-sidereal", None, _sexa("365;15,25"), False, None,
     "Neugebauer, HAMA (1975) Book I, C 1: sidereal year 365 1/4 + 1/144 d (a reconstruction)"),
    ("babylonian-A", None, _sexa("12;22,8"), True, None,
     "Neugebauer, ACT (1955) lunar System A, column B: year = 12;22,8 months"),
    ("babylonian-B", None, _sexa("12;22,8,53,20"), True, None,
     "Neugebauer, ACT (1955) lunar System B, column A: year = 12;22,8,53,20 months"),
    ("battani", None, 365 + Fraction(5, 24) + Fraction(46, 1440) + Fraction(24, 86400), False, None,
     "Nallino, Al-Battani sive Albatenii Opus astronomicum (1899-1907): 365 d 5 h 46 min 24 s"),
    ("surya-siddhanta", Fraction(1577917828, 53433336), Fraction(1577917828, 4320000), False, None,
     "Surya-siddhanta I (tr. Burgess 1860): 1577917828 days, 53433336 months, 4320000 years per mahayuga"),
    ("aryabhata", Fraction(1577917500, 53433336), Fraction(1577917500, 4320000), False, None,
     "Aryabhatiya (AD 499): 1577917500 days, 53433336 months, 4320000 years per yuga"),
    ("sindhind", None, _sexa("365;15,30,22,30"), False, None,
     "Brahmagupta's kalpa year 365;15,30,22,30 d (Bhaskara II, Siddhanta-siromani I.2); "
     "its use by al-Khwarizmi from memory"),
    ("modern", Fraction("29.53058885"), Fraction("365.24219"), False, None,
     "J. Meeus, Astronomical Algorithms (1998): synodic month 29.53058885 d; mean tropical year "
     "365.24219 d (J2000); both recomputed from pyerfa in tests/test_against_pyerfa.py"),
    ("cubit-2.5", None, None, False, Fraction(5, 2),
     "cubit of 2 1/2 degrees implied by some Diary distances (from memory; e.g. A. Jones, AHES 58, 2004)"),
]

#: Convention name -> :class:`Convention`.
CONVENTIONS: dict[str, Convention] = {row[0]: Convention(*row) for row in _CONVENTION_TABLE}

#: The month used when none is named: the Babylonian (and Hipparchan) mean month.
DEFAULT_MONTH = "babylonian"
#: The year used when none is named: the Julian year of 365 1/4 days.
DEFAULT_YEAR = "julian"


def _fold(name: str) -> str:
    """Case- and accent-insensitive key (ASCII spellings of bēru, UŠ ...)."""
    decomposed = unicodedata.normalize("NFD", name.strip().lower())
    return "".join(c for c in decomposed if not unicodedata.combining(c)).replace("_", " ")


_LOOKUP: dict[str, str] = {}
for _u in UNITS.values():
    for _key in (_u.name, *_u.aliases):
        _LOOKUP.setdefault(_fold(_key), _u.name)
        _LOOKUP.setdefault(_key, _u.name)


def find_unit(name: str) -> str | None:
    """The canonical name of a unit written any accepted way, or None (no error to build).

    >>> find_unit("beru"), find_unit("°"), find_unit("Days"), find_unit("ρκε")
    ('bēru', 'degrees', 'days', None)
    """
    if isinstance(name, str):
        if name in _LOOKUP:
            return _LOOKUP[name]
        key = _fold(name)
        if key in _LOOKUP:
            return _LOOKUP[key]
        if key.endswith("s") and key[:-1] in _LOOKUP:
            return _LOOKUP[key[:-1]]
    return None


def canonical_unit(name: str) -> str:
    """The canonical name of a unit written any accepted way.

    >>> canonical_unit("beru"), canonical_unit("°"), canonical_unit("Days")
    ('bēru', 'degrees', 'days')
    """
    found = find_unit(name)
    if found is None:
        raise UnknownNameError("unit", str(name), UNITS)
    return found


def unit(name: str) -> Unit:
    """The :class:`Unit` called *name* (any accepted spelling)."""
    return UNITS[canonical_unit(name)]


def dimension(name: str) -> str:
    """The dimension of a unit: ``time``, ``arc``, ``months`` or ``years``."""
    return unit(name).dimension


def _convention(name: str | None) -> Convention | None:
    if name is None:
        return None
    if name in CONVENTIONS:
        return CONVENTIONS[name]
    folded = {_fold(k): v for k, v in CONVENTIONS.items()}
    if _fold(name) in folded:
        return folded[_fold(name)]
    raise UnknownNameError("convention", name, CONVENTIONS)


def _month_days(conv: Convention | None, used: list[str], strict: bool = True) -> Fraction:
    if conv is not None and conv.month is not None:
        used.append(conv.name)
        return conv.month
    if strict and conv is not None and conv.year is not None and not conv.year_in_months:
        # A year convention was named for a month conversion: say so, it is
        # almost certainly a mistake worth an error rather than a silent default.
        having = sorted(c.name for c in CONVENTIONS.values() if c.month is not None)
        raise NumcheckError(f"The convention {conv.name!r} fixes no month length. "
                            f"Conventions with a month: {', '.join(having)}.")
    used.append(f"{DEFAULT_MONTH} (default month)")
    return CONVENTIONS[DEFAULT_MONTH].month


def _year_days(conv: Convention | None, used: list[str], strict: bool = True) -> Fraction:
    if conv is None or conv.year is None:
        if strict and conv is not None and conv.month is not None:
            having = sorted(c.name for c in CONVENTIONS.values() if c.year is not None)
            raise NumcheckError(f"The convention {conv.name!r} fixes no year length. "
                                f"Conventions with a year: {', '.join(having)}.")
        used.append(f"{DEFAULT_YEAR} (default year)")
        return CONVENTIONS[DEFAULT_YEAR].year
    used.append(conv.name)
    if conv.year_in_months:
        return conv.year * _month_days(None, used, strict=False)
    return conv.year


def _to_base_days(dim: str, conv: Convention | None, used: list[str]) -> Fraction:
    """Days in one base unit of *dim* (1 for time)."""
    if dim == "time":
        return Fraction(1)
    if dim == "months":
        return _month_days(conv, used)
    return _year_days(conv, used)


def _months_per_year(conv: Convention | None, used: list[str]) -> Fraction:
    if conv is not None and conv.year_in_months:
        used.append(conv.name)
        return conv.year
    # Either period may come from the default when the convention names
    # only the other (an Egyptian year counted in Babylonian months).
    return _year_days(conv, used, strict=False) / _month_days(conv, used, strict=False)


def convert(value, from_unit: str, to_unit: str, convention: str | None = None) -> Converted:
    """Convert *value* exactly from one unit to another.

    Months, tithis and years are converted to days (and to each other) with
    a named convention; without one, the month is :data:`DEFAULT_MONTH` and
    the year :data:`DEFAULT_YEAR`.  ``Converted.convention`` names what was
    used (``None`` when the conversion needed none).

    >>> convert(Fraction(223), "months", "days").value
    Fraction(170691559, 25920)
    >>> convert(2, "signs", "degrees")
    Converted(value=Fraction(60, 1), unit='degrees', convention=None)
    >>> convert(1, "years", "days", "egyptian")
    Converted(value=Fraction(365, 1), unit='days', convention='egyptian')
    """
    value = Fraction(value)
    src, dst = unit(from_unit), unit(to_unit)
    conv = _convention(convention)
    used: list[str] = []
    factor_src, factor_dst = src.factor, dst.factor
    if conv is not None and conv.cubit is not None:
        if src.name == "cubits":
            factor_src, used = conv.cubit, [conv.name]
        if dst.name == "cubits":
            factor_dst, used = conv.cubit, [conv.name]
    if src.dimension == dst.dimension:
        return Converted(value * factor_src / factor_dst, dst.name, used[0] if used else None)
    dims = {src.dimension, dst.dimension}
    if "arc" in dims:
        raise IncompatibleUnitsError(
            f"Cannot convert {src.name} ({src.dimension}) to {dst.name} ({dst.dimension}): "
            f"an arc is not a time. Units of {src.dimension}: {', '.join(_units_of(src.dimension))}.")
    if dims == {"months", "years"}:
        per_year = _months_per_year(conv, used)
        base = value * factor_src
        out = base * per_year if src.dimension == "years" else base / per_year
        return Converted(out / factor_dst, dst.name, _named(used))
    days = value * factor_src * _to_base_days(src.dimension, conv, used)
    out = days / _to_base_days(dst.dimension, conv, used) / factor_dst
    return Converted(out, dst.name, _named(used))


def _named(used: list[str]) -> str | None:
    """The conventions used, each once, in the order they were needed."""
    return "; ".join(dict.fromkeys(used)) or None


def to_days(value, from_unit: str, convention: str | None = None) -> Converted:
    """Shorthand for ``convert(value, from_unit, "days", convention)``."""
    return convert(value, from_unit, "days", convention)


def _units_of(dim: str) -> list[str]:
    return [u.name for u in UNITS.values() if u.dimension == dim]


#: The twelve signs of the zodiac, in order from the vernal point.
ZODIAC: tuple[str, ...] = (
    "Aries", "Taurus", "Gemini", "Cancer", "Leo", "Virgo",
    "Libra", "Scorpio", "Sagittarius", "Capricorn", "Aquarius", "Pisces",
)

# Other spellings, index per sign.  English and Latin forms are common
# practice; the Late Babylonian sign names (transliterated logograms) are
# from memory (cf. Hunger & Pingree, Astral Sciences in Mesopotamia, 1999).
_ZODIAC_OTHER = {
    0: ("ari", "ram", "hun", "lu"),
    1: ("tau", "bull", "mul"),
    2: ("gem", "twins"),
    3: ("cnc", "can", "crab", "alla"),
    4: ("lion",),
    5: ("vir", "virgin", "maiden", "absin"),
    6: ("lib", "scales", "balance", "rin", "zibanitu"),
    7: ("sco", "scorpius", "scorpion", "gir", "gir.tab"),
    8: ("sgr", "sag", "archer", "pa", "pabilsag"),
    9: ("cap", "capricornus", "goat", "goat-fish", "suhur"),
    10: ("aqr", "aqu", "water-bearer", "water bearer", "gu"),
    11: ("psc", "pis", "fishes", "fish", "zib", "zib.me"),
}

_ZODIAC_LOOKUP: dict[str, int] = {}
for _i, _name in enumerate(ZODIAC):
    _ZODIAC_LOOKUP[_fold(_name)] = _i
    _ZODIAC_LOOKUP[chr(0x2648 + _i)] = _i   # ♈ ARIES .. ♓ PISCES (Unicode block Miscellaneous Symbols)
    for _alias in _ZODIAC_OTHER[_i]:
        _ZODIAC_LOOKUP[_fold(_alias)] = _i


def find_zodiac(name_or_symbol: str) -> int | None:
    """The index 0..11 of a zodiacal sign, or None when *name_or_symbol* names none."""
    text = str(name_or_symbol).strip().rstrip("\ufe0e\ufe0f")
    if text in _ZODIAC_LOOKUP:
        return _ZODIAC_LOOKUP[text]
    return _ZODIAC_LOOKUP.get(_fold(text))


def may_name_a_unit(text: str) -> bool:
    """False when no word of *text* can be a unit, a mark or a zodiacal sign (a quick test).

    A unit word needs at least one of the characters the unit and sign names
    are spelled with (after folding case and accents), besides a full stop or
    a hyphen; Greek, Arabic or cuneiform numerals alone have none, nor have
    Leiden's brackets and dots, so they are not searched for units.
    """
    return not _NAME_KEYS.isdisjoint(_fold(text))


def zodiac_index(name_or_symbol: str) -> int:
    """The index 0..11 of a zodiacal sign given by name, abbreviation or symbol.

    >>> zodiac_index("Taurus"), zodiac_index("♓"), zodiac_index("capricornus")
    (1, 11, 9)
    """
    # A variation selector may follow a symbol (emoji presentation).
    found = find_zodiac(name_or_symbol)
    if found is None:
        raise UnknownNameError("zodiacal sign", str(name_or_symbol).strip().rstrip("\ufe0e\ufe0f"),
                               ZODIAC)
    return found


def sign_longitude(degrees, sign: str) -> Fraction:
    """The longitude of *degrees* within a sign: ``12;30 Taurus`` is 42;30°.

    >>> sign_longitude(Fraction(25, 2), "Taurus")
    Fraction(85, 2)
    """
    degrees = Fraction(degrees)
    if not 0 <= degrees < 30:
        from .errors import NumcheckRangeError
        raise NumcheckRangeError(f"A position within a sign must be under 30 degrees, got {degrees}.",
                                 value=degrees, legal="0 to 29;59,... degrees")
    return 30 * zodiac_index(sign) + degrees


#: Every character a unit or sign name is spelled with, folded (see may_name_a_unit).
_NAME_CHARS = frozenset(c for key in (*_LOOKUP, *_ZODIAC_LOOKUP) for c in _fold(key) if not c.isspace())
#: The characters of :data:`_NAME_CHARS` but the full stop and the hyphen: every name holds
#: one of these (tests/test_units.py), so a text of numerals and Leiden marks (``ρκ[.]``)
#: is not searched for a unit.
_NAME_KEYS = _NAME_CHARS - frozenset(".-")
