"""Āryabhaṭa's alphabetic numerals: syllables, damage, round trip, bad input (rule: Gītikāpāda 2)."""

from fractions import Fraction as F

import pytest
from hypothesis import given
from hypothesis import strategies as st

from numcheck import NumcheckError, Status, read
from numcheck.notations import format_reading, render_choice
from numcheck.notations.aryabhata import BAD_EXAMPLES, CONSONANTS, VOWELS

CASES = [
    ("ka", 1, "the first consonant with a"),
    ("ma", 25, "the last grouped consonant"),
    ("ha", 100, "the last ungrouped consonant"),
    ("ki", 100, "i multiplies by 100"),
    ("kī", 100, "long and short vowels alike"),
    ("kau", 10 ** 16, "au multiplies by 100^8"),
    ("khyu", 320000, "a cluster: consonants add, then the vowel scales them"),
    ("ghṛkhyu", 4320000, "syllables in any order"),
]


def test_no_input_repeats():
    assert len({t for t, *_ in CASES}) == len(CASES)


@pytest.mark.parametrize("text,value,note", CASES)
def test_values(text, value, note):
    reading = read(text, notation="aryabhata")
    assert reading.value == value
    assert format_reading(reading) == text


def test_tables_have_33_consonants_and_9_vowel_values():
    assert len(CONSONANTS) == 33 and sorted(CONSONANTS.values())[-9:] == [25, 30, 40, 50, 60, 70, 80, 90, 100]
    assert sorted(set(VOWELS.values())) == [100 ** k for k in range(9)]


def test_damage():
    lost = read("khyu[.]", notation="aryabhata")
    assert lost.slots[1].status is Status.LOST
    assert 4320000 in set(lost.readings())
    choice = next(c for r, c in lost.choices() if r.value_of(c) == 4320000)
    assert render_choice(lost, choice) == "khyu[ghṛ]"
    restored = read("kh[y]ughṛ", notation="aryabhata")
    assert restored.value == 4320000 and restored.slots[0].status is Status.RESTORED
    assert F(4320000) in set(restored.readings())
    assert format_reading(restored) == "kh[y]ughṛ"
    assert read("kha?", notation="aryabhata").slots[0].status is Status.DOUBTFUL
    assert read("{ka}kha", notation="aryabhata").value == 2
    assert read("<ka>kha", notation="aryabhata").value == 3


def test_bad_examples():
    for text, column, label in BAD_EXAMPLES:
        with pytest.raises(NumcheckError) as info:
            read(text, notation="aryabhata")
        assert info.value.column == column, (text, str(info.value))
        assert label in str(info.value)


_SYLLABLES = st.tuples(st.lists(st.sampled_from(sorted(CONSONANTS)), min_size=1, max_size=2),
                       st.sampled_from(sorted(VOWELS)))


@given(st.lists(_SYLLABLES, min_size=1, max_size=6))
def test_round_trip(syllables):
    text = "".join("".join(cs) + v for cs, v in syllables)
    # "kh" written as k + h would be read as the aspirate: skip spellings that merge.
    expected = sum(sum(CONSONANTS[c] for c in cs) * VOWELS[v] for cs, v in syllables)
    reading = read(text, notation="aryabhata")
    assert format_reading(reading) == text
    if all(not (a + b in CONSONANTS) for cs, _ in syllables for a, b in zip(cs, cs[1:])) and \
            all(not (cs[-1] + v[:1]).startswith(("ai", "au")) for cs, v in syllables):
        assert reading.value == expected
