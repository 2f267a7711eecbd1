"""The number words of the shared real ATF files read to the values their editors give.

Files (read in place, never copied; skipped when the folder is absent):
``../shared/realdata/atf/cdli_schoyen_ur3.atf`` (12 Ur III tablets of the
Schøyen Collection, CDLI) and ``../shared/realdata/atf/epsd2_P010716.atf``
(TSS 0045, ED IIIa Šuruppak, Oracc ePSD2, with the editors' ``#lem`` lines).

Three checks from outside numcheck:
1. the editors' transliteration states each value by the ATF definition
   (numbers.xdf: a count times its sign), recomputed here by a small
   evaluator of our own with the sign values of the ATF documentation;
2. the editors' lemmatisation of P010716 marks every numeral grapheme ``n``:
   numcheck finds exactly those, on every line;
3. the tablets check their own arithmetic: the totals (``|SZU+LAGAB|``,
   šu-nigin₂) of P254020, P250791 and P250790 are the sums of their entries,
   and the grand total of P010716 (8(geš₂) = 480) is not below the sum of
   the entries read.
"""

from __future__ import annotations

import re
from collections import defaultdict
from fractions import Fraction as F
from pathlib import Path

import pytest

from numcheck.atf import number_words, read_atf_text, text_lines
from numcheck.notations.atf.signs import unit_word

FOLDER = Path(__file__).resolve().parents[1] / ".." / "shared" / "realdata" / "atf"
UR3 = FOLDER / "cdli_schoyen_ur3.atf"
ED3 = FOLDER / "epsd2_P010716.atf"

pytestmark = pytest.mark.skipif(not UR3.is_file() or not ED3.is_file(),
                                reason="the shared real ATF files are not here")

# Sign values of the ATF documentation (numbers.xdf) and the Ur III capacity
# units in sila3 (common practice): the evaluator's own table.
_VALUES = {"disz": 1, "diš": 1, "asz": 1, "aš": 1, "u": 10, "gesz2": 60, "geš₂": 60,
           "ban2": 10, "barig": 60}
_GRAPHEME = re.compile(r"(\d+(?:/\d+)?)\(([^()@]+)(?:@[a-z])?\)")


def _editors_value(word: str) -> F | None:
    """The value the transliteration states, or None where it states none (n, x)."""
    if re.search(r"(?<![a-z])[nx](?![a-z])", word.replace("(", " ")) or "igi" in word:
        return None
    core = re.sub(r"[\[\]#?!*<>]", "", word)
    total, sign = F(0), 1
    for part in core.split():
        if part in ("la2", "la₂"):
            sign = -1
            continue
        m = _GRAPHEME.match(part)
        count = F(m.group(1))
        total += sign * count * _VALUES[m.group(2)]
    return total


def _all_numbers():
    out = []
    for path in (UR3, ED3):
        result = read_atf_text(path.read_text(encoding="utf-8"), path.name)
        out += [(path.name, n) for n in result.numbers]
    return out


def test_every_number_word_reads_to_the_editors_value():
    numbers = _all_numbers()
    assert len(numbers) == 322                       # 301 in the Ur III file, 21 in P010716
    assert all("error" not in n for _f, n in numbers)
    stated = [(f, n) for f, n in numbers if _editors_value(n["word"]) is not None]
    agree = [(f, n) for f, n in stated if F(n["value"]) == _editors_value(n["word"])]
    assert len(stated) == 290 and len(agree) == len(stated)
    # the rest hold n(disz) or an unread [x]: a range that includes 1 at least
    for _f, n in numbers:
        if _editors_value(n["word"]) is None:
            assert F(n["min"]) >= 1 and n["range"]


def test_the_lemmatisation_marks_exactly_the_numerals_found():
    lines = ED3.read_text(encoding="utf-8").splitlines()
    lem = {}
    for k, line in enumerate(lines):
        if line.startswith("#lem:"):
            lem[k] = line[5:].split(";")          # the line before is the text line
    checked = 0
    for line in text_lines(ED3.read_text(encoding="utf-8")):
        entries = [e.strip() for e in lem.get(line.number, [])]
        found, traps = number_words(line.content)
        graphemes = sum(len(re.findall(r"\d\(", w.text)) for w in found)
        assert graphemes == entries.count("n"), (line.label, line.content, entries)
        assert not traps
        checked += 1
    assert checked == 39


def _sums(text_id: str):
    """Entries and totals of a ration list, per commodity, in gin2 of capacity."""
    entries, totals = defaultdict(F), defaultdict(F)
    source = UR3.read_text(encoding="utf-8")
    for line in text_lines(source):
        if line.text_id != text_id:
            continue
        content = line.content
        found, _ = number_words(content)
        total = "LAGAB" in content
        for k, w in enumerate(found):
            unit = w.unit or w.reading.unit
            if unit is None or unit_word(unit).system != "capacity":
                continue
            if k + 1 < len(found) and found[k + 1].quantity is not None:
                continue          # counted with the number after it (2/3 sila3 5 gin2)
            after = content[w.end:].split()
            if w.unit is not None:
                after = after[1:]            # the unit word itself
            # the commodity: the word after the unit (kasz sag10 fine beer; DU ordinary)
            # P254020 writes 'sum' (garlic) on its first line only; the others leave it understood
            commodity = after[0].strip("#?[]") if after else "sum"
            if commodity == "kasz" and len(after) > 1 and after[1].strip("#?") == "sag10":
                commodity = "kasz sag10"
            if w.quantity is not None:
                value, unit = w.quantity[0], w.quantity[3]
            else:
                value = w.reading.value
            gin2 = value * unit_word(unit).in_base * 60
            (totals if total else entries)[commodity] += gin2
    return dict(entries), dict(totals)


@pytest.mark.parametrize("text_id,expected", [
    # the totals as the tablet writes them, in gin2 of capacity (1 sila3 = 60 gin2)
    ("P254020", {"kasz": 39 * 60, "ninda": 36 * 60, "sum": 45, "i3": 27, "naga": 18}),
    ("P250791", {"kasz sag10": 5 * 60, "kasz": 13 * 60, "ninda": 11 * 60, "sum": 20, "i3": 12,
                 "naga": 8}),
    ("P250790", {"kasz": 32 * 60, "ninda": 20 * 60, "sum": 40, "i3": 24, "naga": 16}),
])
def test_the_totals_are_the_sums_of_the_entries(text_id, expected):
    entries, totals = _sums(text_id)
    assert totals == {k: F(v) for k, v in expected.items()}
    assert entries == totals


def test_the_grand_total_of_p010716_is_not_below_its_entries():
    result = read_atf_text(ED3.read_text(encoding="utf-8"), ED3.name)
    *entries, total = result.numbers
    assert total["label"] == "r v 1" and total["value"] == "480"
    assert sum(F(n["value"]) for n in entries) == 394 <= 480
