"""Abjad numerals: letters, variants, places, both orders, damage marks, errors."""

import csv
import unicodedata
from fractions import Fraction as F
from importlib import resources

import pytest
from hypothesis import given
from hypothesis import strategies as st

from numcheck import NumcheckError, Status, read
from numcheck.notations import format_reading, render_choice
from numcheck.notations.abjad import BAD_EXAMPLES, letter_values

# (input, notation, value, note).  Values: conventions.md §5.1 (Hogendijk & de
# Graaf's handout for 1-300; larger values and the variants from memory).
UNDAMAGED = [
    ("شسه", "abjad", F(365), "300 + 60 + 5"),
    ("نط", "abjad", F(59), "50 + 9"),
    ("شنط نط", "abjad", F(359) + F(59, 60), "degrees and minutes: 359;59"),
    ("ل كح", "abjad", F(30) + F(28, 60), "30;28"),
    ("ا ٠ ل", "abjad", F(1) + F(30, 3600), "an Arabic-Indic zero as an empty place (common practice)"),
    ("غ", "abjad", F(1000), "ghayn, eastern"),
    ("غ", "abjad-maghribi", F(900), "ghayn, western"),
    ("شسه", "abjad-maghribi", F(1305), "shin is 1000 in the west, sin 300"),
    ("ی", "abjad", F(10), "Persian yeh"),
    ("ى", "abjad", F(10), "alef maksura"),
    ("ک", "abjad", F(20), "keheh (Persian/Urdu kaf)"),
    ("ة", "abjad", F(5), "teh marbuta as heh"),
    ("ہ", "abjad", F(5), "Urdu heh goal"),
    ("أ", "abjad", F(1), "alef with hamza"),
    ("نـط", "abjad", F(59), "a tatweel joining the letters carries no value"),
]


def test_no_input_repeats():
    inputs = [(t, n) for t, n, *_ in UNDAMAGED] + [(t, "abjad") for t, *_ in DAMAGED]
    assert len(inputs) == len(set(inputs))


@pytest.mark.parametrize("text,notation,value,note", UNDAMAGED)
def test_undamaged(text, notation, value, note):
    reading = read(text, notation=notation)
    assert reading.value == value
    assert reading.count == 1
    assert reading.notation == notation


# (input, min, max, readings, value as the edition gives it, status of the damaged slot)
DAMAGED = [
    ("ل [.]ه", F(30) + F(15, 60), F(30) + F(55, 60), 5, F(30) + F(15, 60), Status.LOST),
    ("[ن]ط", F(19), F(1009), 19, F(59), Status.RESTORED),
    ("xط", F(19), F(1009), 19, F(19), Status.UNREAD),
    ("ن?ط", F(59), F(59), 1, F(59), Status.DOUBTFUL),
    ("⸢ن⸣ط", F(59), F(59), 1, F(59), Status.DOUBTFUL),
    ("ٮ", F(2), F(500), 3, F(2), Status.DOUBTFUL),
    ("<ن>ط", F(59), F(59), 1, F(59), Status.ADDED),
    ("{ب}نط", F(59), F(59), 1, F(59), Status.READ),
    ("ق[..]", F(111), F(199), 81, F(111), Status.LOST),
    ("ا [...]", F(1), F(1) + F(59, 60) + F(59, 3600) + F(59, 216000), 60 + 60**2 + 60**3, F(1), Status.LOST),
]


@pytest.mark.parametrize("text,lo,hi,count,value,status", DAMAGED)
def test_every_damage_mark(text, lo, hi, count, value, status):
    reading = read(text, notation="abjad")
    assert (reading.min, reading.max, reading.count, reading.value) == (lo, hi, count, value)
    assert status in {s.status for s in reading.slots}
    assert format_reading(reading) == text


def test_superfluous_letter_does_not_count():
    reading = read("{ب}نط", notation="abjad")
    assert reading.value == 59
    assert [m.status for m in reading.slots[0].form][0] is Status.SUPERFLUOUS
    whole = read("{ب} نط", notation="abjad")
    assert whole.slots[0].status is Status.SUPERFLUOUS
    assert whole.value == 59
    assert read("ا {ب} ل", notation="abjad").value == F(3, 2)


def test_lost_letter_in_a_minutes_place_keeps_to_0_to_59():
    values = sorted(read("ل [.]ه", notation="abjad").slots[1].values)
    assert values == [F(15), F(25), F(35), F(45), F(55)]


def test_render_restores_lost_letters():
    reading = read("ل [.]ه", notation="abjad")
    texts = [render_choice(r, c) for r, c in reading.choices()]
    assert texts == ["ل [ي]ه", "ل [ك]ه", "ل [ل]ه", "ل [م]ه", "ل [ن]ه"]
    assert read(texts[1], notation="abjad").value == F(30) + F(25, 60)


@pytest.mark.parametrize("text,column,label", BAD_EXAMPLES)
def test_bad_input_points_at_the_column(text, column, label):
    with pytest.raises(NumcheckError) as info:
        read(text, notation="abjad")
    assert info.value.column == column
    if "over 59" not in label:
        assert label in str(info.value)
        assert f"U+{ord(text[column - 1]):04X}" in str(info.value)


def test_letter_table_has_sources_and_unicode_names():
    path = resources.files("numcheck") / "data" / "abjad_letters.csv"
    with path.open(encoding="utf-8", newline="") as fh:
        rows = list(csv.DictReader(fh))
    assert len(rows) >= 28
    for row in rows:
        assert row["source"] and row["maghribi_source"]
        assert unicodedata.name(row["letter"]) == row["unicode_name"]
        assert f"U+{ord(row['letter']):04X}" == row["code_point"]
        if int(row["eastern"].split("|")[0]) > 300 or row["kind"] != "letter":
            assert "from memory" in row["source"] or row["kind"] == "dotless"


def test_nfc_and_nfd_read_the_same():
    composed = "أ"                       # ALEF WITH HAMZA ABOVE
    decomposed = unicodedata.normalize("NFD", composed)
    assert decomposed != composed
    assert read(decomposed, notation="abjad").to_dict() == read(composed, notation="abjad").to_dict()


def _spell(n: int, notation: str = "abjad") -> str:
    by_value = {v[0]: k for k, v in letter_values(notation).items() if len(v) == 1}
    # The main letters only (the variants share their values).
    main = {v: by_value[v] for v in by_value}
    for letter, values in letter_values(notation).items():
        if unicodedata.name(letter).startswith("ARABIC LETTER") and len(values) == 1:
            main.setdefault(values[0], letter)
    table = {1: "ا", 2: "ب", 3: "ج", 4: "د", 5: "ه", 6: "و", 7: "ز", 8: "ح", 9: "ط", 10: "ي",
             20: "ك", 30: "ل", 40: "م", 50: "ن", 60: "س", 70: "ع", 80: "ف", 90: "ص", 100: "ق",
             200: "ر", 300: "ش", 400: "ت", 500: "ث", 600: "خ", 700: "ذ", 800: "ض", 900: "ظ",
             1000: "غ"}
    out = []
    for weight in (1000, 100, 10, 1):
        digit = n // weight * weight
        n -= digit
        if digit:
            out.append(table[digit])
    return "".join(out)


@given(st.integers(1, 1999), st.lists(st.integers(1, 59), max_size=3))
def test_round_trip(whole, fractions):
    text = " ".join([_spell(whole)] + [_spell(f) for f in fractions])
    reading = read(text, notation="abjad")
    expected = F(whole) + sum((F(f, 60 ** (k + 1)) for k, f in enumerate(fractions)), F(0))
    assert reading.value == expected
    assert format_reading(reading) == text
    assert read(format_reading(reading), notation="abjad") == reading


@pytest.mark.parametrize("zero", ["\u0660", "\u06f0"])
def test_zero_signs_agree_with_unicode(zero):
    # Unicode Character Database (unicodedata.unidata_version): ARABIC-INDIC
    # DIGIT ZERO and EXTENDED ARABIC-INDIC DIGIT ZERO have the value 0.
    assert unicodedata.numeric(zero) == 0
    assert read(f"ا {zero} ل", notation="abjad").slots[1].values == (F(0),)


def test_no_abjad_letter_has_a_unicode_numeric_value():
    # conventions.md §3.5: the abjad letters carry no numeric value in the UCD,
    # which is why numcheck ships its own table.
    assert all(unicodedata.numeric(c, None) is None for c in letter_values("abjad"))
