"""ATF numbers checked against the ATF documentation and the editors' stated values.

Sources, named beside each value:
- the Oracc/CDLI ATF documentation: ``odoc/builder/numbers/numbers.xdf``
  ("All numbers are given with digits or a fraction followed by a qualifier
  in parenthesis, e.g., 1(disz)") and ``odoc/builder/math/math.xdf``
  (S. Tinney, 2008: the mathematical style, places joined by '.');
- the values CDLI's editors state in their translations of the tablets named
  (tablet and line), as collected in the project's reference notes on ATF;
- the arithmetic of the Tell Harmal problem text P254616 (CDLI), which checks
  the floating place value of CDLI-style numbers by its own computation.
"""

from fractions import Fraction as F

import pytest

from numcheck import read

EDITORS = [
    # (ATF as written, value the editors give, tablet and line)
    ("1(gesz2) 3(u) 7(disz)", F(97), "P416398 o 10, CDLI translation '97 ninda'"),
    ("3(gesz2) 2(u)", F(200), "P113323 r 5, CDLI: 200"),
    ("4(szar'u@c) 5(szar2@c) 4(gesz'u@c) 2(gesz2) 5(u@c) 1(asz@c)", F(164571),
     "P010721 o ii 1, CDLI: 164,571"),
    ("1(szar'u)", F(36000), "P339376 r 2, CDLI: '36,000 bundles'"),
    ("1(disz) 1/2(disz)", F(3, 2), "P416398 o 2, CDLI: 1 1/2"),
    ("5/6(disz)", F(5, 6), "P113323 o 1"),
    ("1(u) la2 1(disz)", F(9), "P113323 r 1, CDLI: '10 less 1'"),
    ("2(u@c) 9(aš@c)", F(29), "P010716 (curved numerals), Oracc"),
    ("2(u) ninda", None, "P416398 o 6: 2(u) is 20 (see below)"),
]


@pytest.mark.parametrize("text,value,source", [e for e in EDITORS if e[1] is not None])
def test_the_editors_values(text, value, source):
    r = read(text, notation="atf")
    assert r.value == value and not r.floating, source


def test_less_a_fraction_across_a_unit_word():
    # P113323 o 6: 1(disz) gin2 la2 igi-6(disz)-gal2 = 1 - 1/6 shekel (CDLI)
    from numcheck.atf import number_words
    found, _ = number_words("1(disz) gin2 la2 igi-6(disz)-gal2 kug-babbar")
    assert found[-1].quantity[0] == F(5, 6) and found[-1].quantity[3] == "gin2"


# The ATF documentation's own examples (numbers.xdf, math.xdf), as given.
DOCUMENTATION = [
    ("1(disz)", F(1), False, "numbers.xdf: 1(disz)"),
    ("1.40", F(100), True, "math.xdf: the number 1,40 (X500001 o 1)"),
    ("9.30", F(570), True, "math.xdf: 9;30 (X001001 o 3), floating"),
    ("1.03-KAM", F(63), True, "math.xdf: 'Year 63' (X001001 o 1)"),
    ("1 ME 43", F(143), False, "Oracc: 'Year 143' (X201681 o 1)"),
    ("2 1/2", F(5, 2), False, "Oracc: '2 1/2 cubits' (X201681 o 2)"),
    ("43.KAM₂", F(43), True, "Oracc X201681 o 1: 43 + logogram"),
    ("9@v.00.33", F(9 * 3600 + 33), True, "math.xdf: a variant 9, a zero, 33"),
    ("10.:6", F(606), True, "math.xdf: '.:' clarifies an empty tens column, no zero"),
    ("1/4(iku)", F(1, 4), False, "numbers.xdf: 1/4(iku), a fraction of a field"),
]


@pytest.mark.parametrize("text,value,floating,source", DOCUMENTATION)
def test_the_documentation_examples(text, value, floating, source):
    r = read(text, notation="atf")
    assert (r.value, r.floating) == (value, floating), source


def test_the_oracc_json_equivalence_of_both_styles():
    # Oracc's JSON gives each math digit group its CDLI form: 43 is "4(u) 3(diš)".
    assert read("43", notation="atf").value == read("4(u) 3(diš)", notation="atf").value == 43


def _floating_equal(a: F, b: F) -> bool:
    """Equal up to a power of 60 (floating place value)."""
    while a and a.denominator == 1 and a % 60 == 0:
        a /= 60
    while b and b.denominator == 1 and b % 60 == 0:
        b /= 60
    for _ in range(6):
        if a == b:
            return True
        a *= 60
    return False


def test_the_tell_harmal_chain_checks_the_floating_place_value():
    # P254616 (CDLI): igi 15 = 4; igi 8 = 7,30; 7,30 x 58 = 7,15; 7,15 x 4 = 29.
    def m(text):
        return read(text, notation="atf-math")
    assert _floating_equal(F(1, 15), m("4(disz)").value)
    assert _floating_equal(F(1, 10), m("6(disz)").value)
    assert _floating_equal(m("6(disz)").value * 40, m("4(disz)").value)
    assert _floating_equal(F(1, 8), m("7(disz) 3(u)").value)
    seven15 = m("7(disz) 1(u) 5(disz)")
    assert seven15.value == 7 * 60 + 15 and len(seven15.slots) == 2
    assert _floating_equal(F(7, 60) + F(30, 3600), F(1, 8))
    assert (F(7) + F(30, 60)) / 60 * 58 == F(7) + F(15, 60)       # 0;7,30 x 58 = 7;15
    assert (F(7) + F(15, 60)) * 4 == 29                            # 7;15 x 4 = 29
    assert read("2(u) 9(disz)", notation="atf").value == 29


def test_unicode_counting_signs_by_their_names():
    # Unicode: CUNEIFORM NUMERIC SIGN n GESH2 / GESHU / SHAR2 carry the count n
    # (unicodedata.numeric); the name's unit gives the magnitude (GESH2 60,
    # GESHU 600, SHAR2 3600; numbers.xdf).
    import unicodedata
    from numcheck.notations.cuneiform import count_signs
    units = {"GESH2": 60, "GESHU": 600, "SHAR2": 3600, "SHARU": 36000}
    checked = 0
    for ch, info in count_signs().items():
        if info.column != "count":
            continue
        name = unicodedata.name(ch)
        unit = next((v for k, v in units.items() if name.split(" ")[4:5] == [k]), None)
        if unit is None:
            assert unicodedata.numeric(ch) == info.value     # SHAR2 TIMES GAL PLUS DISH: 216000
        else:
            assert unicodedata.numeric(ch) * unit == info.value, name
        checked += 1
    assert checked == 31


def test_a_number_of_min_or_u_u_alone_is_detected_as_cuneiform():
    # Unicode names: CUNEIFORM SIGN MIN (2), U U (20), U U U (30)
    for text, value in (("\U0001222B", 2), ("\U00012399", 20), ("\U0001230D", 30)):
        r = read(text)
        assert r.notation == "cuneiform" and r.value == value


def test_oracc_digit_code_points_are_read_and_written_back():
    # math.xdf's table: 4 U+1243C, 7 U+12442, 8 U+12444, 9 U+12446 (the "variant
    # form" code points), not FOUR..NINE DISH; a number written with them keeps them.
    import unicodedata
    from fractions import Fraction
    from numcheck.notations import render_choice
    from numcheck.notations.cuneiform import ORACC_DIGITS
    for value, ch in ORACC_DIGITS.items():
        assert "VARIANT FORM" in unicodedata.name(ch)
        assert read(ch, notation="cuneiform").value == value
    r = read("\U0001230B[\U00012442]", notation="cuneiform")      # 1[7]
    assert render_choice(r, (Fraction(18),)) == "\U0001230B[\U00012444]"
