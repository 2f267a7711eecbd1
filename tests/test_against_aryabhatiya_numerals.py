"""Āryabhaṭa's number words against the revolution numbers of the Āryabhaṭīya.

Source: Āryabhaṭīya, Gītikāpāda 3-4 (ed. and tr. K. S. Shukla and K. V. Sarma,
Indian National Science Academy, 1976); the words and numbers as recalled
(from memory), each checked here against the catalogue's yuga numbers where
the catalogue has them (arya_year: 4320000 years, 1577917500 civil days).
"""

import pytest

from numcheck import read

WORDS = [
    ("khyughṛ", 4320000, "revolutions of the sun in a yuga"),
    ("cayagiyiṅuśuchlṛ", 57753336, "revolutions of the moon"),
    ("ṅiśibuṇḷṣkhṛ", 1582237500, "rotations of the earth (sidereal days)"),
    ("ḍhuṅvighva", 146564, "revolutions of Saturn"),
    ("khricyubha", 364224, "revolutions of Jupiter"),
    ("bhadlijhnukhṛ", 2296824, "revolutions of Mars"),
]


@pytest.mark.parametrize("word,value,what", WORDS)
def test_words(word, value, what):
    reading = read(word)
    assert reading.notation == "aryabhata"
    assert reading.value == value


def test_civil_days_are_rotations_less_solar_revolutions():
    # The catalogue's 1577917500 civil days (arya_year) = sidereal days - solar years.
    from numcheck.catalogue import by_id
    civil = read("ṅiśibuṇḷṣkhṛ").value - read("khyughṛ").value
    assert civil == 1577917500
    assert "4320000 sidereal years = 1577917500 days" == by_id("arya_year").statement
