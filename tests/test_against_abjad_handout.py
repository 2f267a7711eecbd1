"""Abjad letter values checked against the published table.

Source: J. Hogendijk & W. de Graaf, "Handout for the workshop
Abjad-numerals" (Utrecht), §1 (the values 1 to 300) and §1–2 (the larger
value is written first: 11 = يا, 123 = قكج), as summarised in
conventions.md §5.1.  The values 400 to 1000 and the western (maghribi)
values are from standard reference works *(from memory)*, marked so in
``numcheck/data/abjad_letters.csv`` and here.
"""

import pytest

from numcheck import read
from numcheck.notations.abjad import letter_values

# (letter, value): Hogendijk & de Graaf, abjad handout §1.
HANDOUT_1_TO_300 = [
    ("ا", 1), ("ب", 2), ("ج", 3), ("د", 4), ("ه", 5), ("و", 6), ("ز", 7), ("ح", 8), ("ط", 9),
    ("ي", 10), ("ك", 20), ("ل", 30), ("م", 40), ("ن", 50), ("س", 60), ("ع", 70), ("ف", 80),
    ("ص", 90), ("ق", 100), ("ر", 200), ("ش", 300),
]

# (letter, value): from memory (standard reference works), conventions.md §5.1.
REMEMBERED_400_TO_1000 = [("ت", 400), ("ث", 500), ("خ", 600), ("ذ", 700), ("ض", 800), ("ظ", 900),
                          ("غ", 1000)]

# Western order, the six letters that differ (from memory), conventions.md §5.1.
REMEMBERED_MAGHRIBI = [("ص", 60), ("ض", 90), ("س", 300), ("ظ", 800), ("غ", 900), ("ش", 1000)]


def test_no_letter_repeats():
    letters = [c for c, _ in HANDOUT_1_TO_300 + REMEMBERED_400_TO_1000]
    assert len(letters) == len(set(letters)) == 28


@pytest.mark.parametrize("letter,value", HANDOUT_1_TO_300)
def test_handout_values(letter, value):
    assert letter_values("abjad")[letter] == (value,)
    assert read(letter, notation="abjad").value == value


@pytest.mark.parametrize("letter,value", REMEMBERED_400_TO_1000)
def test_remembered_large_values(letter, value):
    assert read(letter, notation="abjad").value == value


@pytest.mark.parametrize("letter,value", REMEMBERED_MAGHRIBI)
def test_remembered_maghribi_values(letter, value):
    assert read(letter, notation="abjad-maghribi").value == value


def test_handout_writing_order_examples():
    # Hogendijk & de Graaf §1-2: larger value first.
    assert read("يا", notation="abjad").value == 11
    assert read("قكج", notation="abjad").value == 123


def test_values_named_in_the_issue():
    assert read("شسه", notation="abjad").value == 365      # 300 + 60 + 5
    assert read("نط", notation="abjad").value == 59        # 50 + 9 (conventions.md §5.1)
    assert read("شنط", notation="abjad").value == 359      # conventions.md §5.1 (from memory)
