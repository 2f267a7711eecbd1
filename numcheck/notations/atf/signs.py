"""ATF sign names as keys, and the values of the numeral signs and unit words.

ATF writes one sign in two spellings: ASCII (``gesz2``, ``sz``, ``s,``,
``t,``, ``h``) and Unicode (``geš₂``, ``š``, ``ṣ``, ``ṭ``, ``ḫ``), with
accents for the indices 2 and 3 (``KÁM`` = ``KAM₂``).  :func:`sign_key`
turns either into one key (lower case, ASCII, index digits) so that the
tables need one row per sign.  Modifiers that do not change the value
(``@c`` curved, ``@t`` slanting, ``@v`` variant, ``~a``) are cut off.

The tables are package data with a source on every row:
``numcheck/data/atf_numerals.csv`` (the signs a count is written with) and
``numcheck/data/atf_units.csv`` (the unit words of the metrological systems).
"""

from __future__ import annotations

import csv
import functools
import re
import unicodedata
from dataclasses import dataclass
from fractions import Fraction
from importlib import resources

__all__ = ["sign_key", "split_modifiers", "NumeralSign", "numeral_signs", "UnitWord", "unit_words",
           "unit_word", "unit_systems", "MAX_COUNT", "is_unicode_spelling"]

_SUBSCRIPTS = str.maketrans("₀₁₂₃₄₅₆₇₈₉ₓ", "0123456789x")
_LETTERS = {"š": "sz", "ṣ": "s,", "ṭ": "t,", "ḫ": "h", "ĝ": "j", "ŋ": "j", "ʾ": "'"}
_ACCENT_INDEX = {"\u0301": "2", "\u0300": "3"}   # á = a2, à = a3
_MODIFIERS = re.compile(r"(?:@[a-z0-9]+|~[a-z0-9]+)+$")


def split_modifiers(name: str) -> tuple[str, str]:
    """Cut the value-neutral modifiers off a sign name: ``('u', '@c')`` for ``u@c``.

    >>> split_modifiers("gesz2@c")
    ('gesz2', '@c')
    """
    m = _MODIFIERS.search(name)
    return (name[:m.start()], m.group()) if m else (name, "")


@functools.lru_cache(maxsize=4096)
def sign_key(name: str) -> str:
    """One key for the ASCII and Unicode spellings of a sign name.

    >>> sign_key("geš₂"), sign_key("gesz2"), sign_key("KÁM"), sign_key("aš@c")
    ('gesz2', 'gesz2', 'kam2', 'asz')
    """
    base, _ = split_modifiers(name)
    out = []
    index = ""
    lowered = "".join(_LETTERS.get(ch, ch) for ch in unicodedata.normalize("NFC", base.lower()))
    for ch in unicodedata.normalize("NFD", lowered):
        if ch in _ACCENT_INDEX:
            index = _ACCENT_INDEX[ch]
            continue
        out.append(ch)
    key = "".join(out).translate(_SUBSCRIPTS)
    key = unicodedata.normalize("NFC", key)
    if index and not key[-1:].isdigit():
        key += index
    return key


def is_unicode_spelling(name: str) -> bool:
    """Whether a sign name is spelled the Unicode way (``š``, subscript digits)."""
    return any(ch in "šṣṭḫĝŋŠṢṬḪĜŊ₀₁₂₃₄₅₆₇₈₉" for ch in name)


@dataclass(frozen=True)
class NumeralSign:
    """One row of ``atf_numerals.csv``: a sign a count is written with."""

    key: str
    system: str        # counting, capacity, area
    value: Fraction    # one such sign, in the system's base (units; sila3; iku)
    unit: str | None   # the unit of *value* (None for plain counts)
    source: str


@functools.cache
def numeral_signs() -> dict[str, NumeralSign]:
    """Sign key -> :class:`NumeralSign`."""
    table = resources.files("numcheck") / "data" / "atf_numerals.csv"
    with table.open(encoding="utf-8", newline="") as fh:
        return {row["sign"]: NumeralSign(row["sign"], row["system"], Fraction(row["value"]),
                                         row["unit"] or None, row["source"])
                for row in csv.DictReader(fh)}


#: The most signs of one kind a count writes before the next larger sign takes
#: over (nine units before a ten, five tens before a 60, ...; common practice,
#: ATF numbers.xdf); the capacity signs after the Ur III system (5 ban2 < 1 barig).
MAX_COUNT = {"disz": 9, "asz": 9, "u": 5, "gesz2": 9, "gesz'u": 5, "szar2": 9, "szar'u": 5,
             "szargal": 9, "ban2": 5, "barig": 4, "iku": 5, "esze3": 2, "bur3": 9, "bur'u": 5}


@dataclass(frozen=True)
class UnitWord:
    """One row of ``atf_units.csv``: a unit word and its size in its system's base unit."""

    name: str
    system: str
    in_base: Fraction
    base: str
    source: str


@functools.cache
def _unit_rows() -> dict[str, tuple[UnitWord, ...]]:
    table = resources.files("numcheck") / "data" / "atf_units.csv"
    out: dict[str, list[UnitWord]] = {}
    with table.open(encoding="utf-8", newline="") as fh:
        for row in csv.DictReader(fh):
            unit = UnitWord(row["unit"], row["system"], Fraction(row["in_base"]), row["base"],
                            row["source"])
            for spelling in dict.fromkeys([row["unit"], *row["aliases"].split()]):
                out.setdefault(sign_key(spelling), []).append(unit)
    return {k: tuple(v) for k, v in out.items()}


def unit_words() -> dict[str, UnitWord]:
    """Key of every spelling of a unit word -> its first :class:`UnitWord` (see :func:`unit_systems`)."""
    return {k: v[0] for k, v in _unit_rows().items()}


def unit_systems(word: str) -> tuple[UnitWord, ...]:
    """Every unit a word may name: ``gin2`` is a shekel of weight and 1/60 sila3 of capacity."""
    return _unit_rows().get(sign_key(word.strip("#?!*")), ())


def unit_word(word: str, system: str | None = None) -> UnitWord | None:
    """The unit a word names (``sila₃``, ``gin2``, ``KUŠ₃``), in *system* when given, or None.

    >>> unit_word("sila₃").name, unit_word("GIN₂").in_base, unit_word("gin2", "weight").in_base
    ('sila3', Fraction(1, 60), Fraction(1, 1))
    """
    for unit in unit_systems(word):
        if system is None or unit.system == system:
            return unit
    return None
