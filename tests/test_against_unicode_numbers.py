"""Indic digits and Roman apostrophic forms checked against the Unicode Character Database.

Source: the UCD as compiled into Python's ``unicodedata`` (version in
``unicodedata.unidata_version``): the decimal values of ARABIC-INDIC DIGIT
ZERO..NINE (U+0660..U+0669), EXTENDED ARABIC-INDIC DIGIT ZERO..NINE
(U+06F0..U+06F9, the Persian forms) and DEVANAGARI DIGIT ZERO..NINE
(U+0966..U+096F); the numeric values of ROMAN NUMERAL ONE THOUSAND C D
(U+2180), FIVE THOUSAND (U+2181) and TEN THOUSAND (U+2182), the single
characters for the apostrophic forms CIↃ, IↃↃ and CCIↃↃ.
"""

import unicodedata

import pytest

from numcheck import read

UCD = unicodedata.unidata_version


@pytest.mark.parametrize("written,char", [("CI\u2183", "\u2180"), ("I\u2183\u2183", "\u2181"),
                                           ("CCI\u2183\u2183", "\u2182"), ("I\u2183", "\u216e")])
def test_apostrophic_forms_equal_unicode_values(written, char):
    assert read(written, notation="roman").value == int(unicodedata.numeric(char)), UCD
    assert read(char, notation="roman").value == read(written, notation="roman").value


@pytest.mark.parametrize("zero,name", [(0x0660, "arabic-indic"), (0x06F0, "persian"), (0x0966, "devanagari")])
def test_every_digit_has_its_unicode_decimal_value(zero, name):
    for k in range(10):
        ch = chr(zero + k)
        assert read(ch, notation=name).value == unicodedata.decimal(ch), (UCD, unicodedata.name(ch))
        assert read(ch).notation == name
    # Two-digit numbers in each script, against the UCD values digit by digit.
    for tens in range(1, 10):
        text = chr(zero + tens) + chr(zero + 7)
        assert read(text).value == 10 * unicodedata.decimal(text[0]) + unicodedata.decimal(text[1])
