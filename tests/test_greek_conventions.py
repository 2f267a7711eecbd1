"""Greek numerals as digital editions write them: the conventions of astronomical
and documentary texts, the half and its companions, and what recognition leaves.

Sources, beside each row:
* Cajori, A History of Mathematical Notations I (1928) §§43-44: the zero of
  Greek tables, printed by Heiberg without its bar (hence a plain ``ο``).
* Ptolemy, Almagest III.1 (Heiberg's text, I p. 209): the solar daily motion
  ``ο νθ η ιζ ιγ ιβ λα`` = 0;59,8,17,13,12,31 degrees; I.10: the chord of 72°
  ``ο λβ γ`` = 70;32,3 (both as the First1KGreek digital text prints them;
  the values are the published ones, Toomer's translation, from memory).
* Documentary papyri as the Duke Databank edits them (papyri.info): a lone
  capital letter for thousands, a capital before small letters, a leading
  apostrophe for ͵ (common practice of those editions).
* Unicode: U+02BC MODIFIER LETTER APOSTROPHE, U+00B4 ACUTE ACCENT, U+02B9
  MODIFIER LETTER PRIME, U+0374 GREEK NUMERAL SIGN, U+2220 ANGLE (the
  half sign of printed editions, common practice).
"""

import re
import unicodedata
import warnings
from fractions import Fraction as F

import pytest

from numcheck.errors import NumcheckError, NumcheckWarning
from numcheck.notations import format_reading, render_choice
from numcheck.notations.greek import parse
from numcheck.reader import read

# -- spellings that must read (text, value, note) ------------------------------

SPELLINGS = [
    ("β ∠΄", F(5, 2), "the half with the tonos as numeral sign (common practice)"),
    ("μγ ∠ʹ", F(87, 2), "the half as its own group with the numeral sign"),
    ("κε ∠ʹ γʹ", 25 + F(5, 6), "½ ⅓ = 5/6, Ptolemy's usual way (Almagest star catalogue)"),
    ("κε∠ʹγʹ", 25 + F(5, 6), "the same written without spaces"),
    ("β ∠ʹ δʹ", F(11, 4), "a run of unit fractions after a whole number"),
    ("δ\u02bc", 4, "keraia typed as U+02BC MODIFIER LETTER APOSTROPHE"),
    ("δ\u00b4", 4, "keraia typed as U+00B4 ACUTE ACCENT"),
    ("δ\u02b9", 4, "keraia as U+02B9 MODIFIER LETTER PRIME"),
    ("δ\u0374", 4, "keraia as U+0374 GREEK NUMERAL SIGN"),
    ("δ'", 4, "keraia as an ASCII apostrophe"),
    ("ῑε", 15, "a macron on the letter is a numeral bar"),
    ("Αξδ", 1064, "a capital before small letters is thousands (documentary, common practice)"),
    ("Αωϙγ", 1893, "a capital before hundreds is thousands"),
    ("'Αωϙγ", 1893, "a leading apostrophe is the lower numeral sign"),
    ("ϛ γʹ ιβʹ", 6 + F(1, 3) + F(1, 12), "a run of unit fractions (documentary accounts)"),
    ("κθ ο λ", F(3481, 120), "ο in a sexagesimal place is the zero: 29;0,30"),
]


@pytest.mark.parametrize("text, value, note", SPELLINGS)
def test_spelling_reads(text, value, note):
    with warnings.catch_warnings():
        warnings.simplefilter("ignore", NumcheckWarning)
        r = read(text, notation="greek")
    assert r.value == value and r.count == 1, note


def test_spellings_do_not_repeat():
    assert len({t for t, _, _ in SPELLINGS}) == len(SPELLINGS)


# -- what recognition and converters leave: read, with a warning naming it ----

NOISY = [
    ("κε U+2220ʹγʹ", 25 + F(5, 6), "U+2220", "the half sign written out as its code point"),
    ("μὲ", 45, "U+1F72", "a grave accent left by recognition"),
    ("ία", 11, "U+03AF", "an acute accent on the first letter"),
    ("ιε.", 15, "full stop", "a trailing full stop"),
    ("κθ λα.", F(1771, 60), "full stop", "a full stop after a sexagesimal place"),
    ("δʹ.", 4, "full stop", "a full stop after the numeral sign"),
    ("κθ ° λ", F(3481, 120), "U+00B0", "the zero typed as a degree sign (a small circle)"),
]


def test_a_degree_sign_after_a_number_is_still_a_unit():
    assert read("12;30°").unit is not None and read("12;30°").value == F(25, 2)


@pytest.mark.parametrize("text, value, named, note", NOISY)
def test_noise_is_read_with_a_warning_naming_it(text, value, named, note):
    with pytest.warns(NumcheckWarning, match=re.escape(named)):
        r = read(text, notation="greek")
    assert r.value == value, note
    assert any(named in w for w in r.warnings)


def test_nfd_accents_read_the_same():
    text = unicodedata.normalize("NFD", "μὲ")
    with pytest.warns(NumcheckWarning):
        assert read(text, notation="greek").value == 45


def test_a_lone_unread_dot_stays_a_leiden_mark():
    # 'ι.' is ten and an unread units letter (Leiden), not a full stop.
    r = parse("ι.")
    assert r.min == 11 and r.max == 19 and not r.warnings


def test_a_letter_after_the_numeral_sign_is_still_an_error():
    with pytest.raises(NumcheckError, match="a letter after the numeral sign"):
        parse("αʹβ")


# -- the ambiguous omicron ------------------------------------------------------

def test_leading_omicron_keeps_both_readings_with_a_note():
    r = parse("ο νθ η ιζ ιγ ιβ λα")
    first = r.slots[0]
    assert first.values == (F(0), F(70)) and r.ambiguous and not r.damaged
    assert r.count == 2
    assert any("0 or 70" in w for w in r.warnings)
    # Almagest III.1: 0;59,8,17,13,12,31 degrees a day.
    assert set(r.readings()) == {F(59, 60) + F(8, 60**2) + F(17, 60**3) + F(13, 60**4) + F(12, 60**5)
                                 + F(31, 60**6) + k for k in (0, 70)}


def test_omicron_in_a_fractional_place_is_zero_with_a_warning():
    with pytest.warns(NumcheckWarning, match="70 cannot stand"):
        r = parse("γ ο")
    assert r.value == 3 and r.count == 1


def test_chord_of_72_keeps_seventy():
    # Almagest I.10: crd 72° = 70;32,3 where the same text writes 'ο λβ γ'.
    r = parse("ο λβ γ")
    assert F(84641, 1200) in set(r.readings())


def test_astronomical_reads_zero_documentary_seventy():
    assert read("ο νθ η", notation="greek-astronomical").value == F(887, 900)
    assert read("ο νθ η", notation="greek-documentary").value == 70 + F(887, 900)
    assert read("ο", notation="greek-documentary").value == 70
    assert read("ο", notation="greek-astronomical").value == 0


def test_omicron_with_a_numeral_sign_is_seventy():
    r = parse("οʹ")
    assert r.value == 70 and not r.ambiguous


def test_written_back_as_read_and_as_chosen():
    r = parse("ο νθ η")
    assert format_reading(r) == "ο νθ η"
    zero = tuple(s.values[0] for s in r.slots)
    seventy = (F(70),) + zero[1:]
    assert render_choice(r, zero) == "𐆊 νθ η"
    assert render_choice(r, seventy) == "ο νθ η"
    assert parse(render_choice(r, zero)).value == F(887, 900)


def test_identify_finds_ptolemys_solar_motion():
    from numcheck.identify import identify

    res = identify("ο νθ η ιζ ιγ ιβ λα", unit="degrees")
    assert res.matches[0].id == "ptol_sun_motion"
    assert res.matches[0].how == "exact" and res.matches[0].factor == 1


# -- capitals of documentary papyri ----------------------------------------------

def test_lone_capital_keeps_units_and_thousands():
    r = parse("Γ")
    assert r.slots[0].values == (F(3), F(3000)) and r.ambiguous
    assert any("3000" in w for w in r.warnings)


def test_lone_capital_by_convention():
    assert read("Γ", notation="greek-documentary").value == 3000
    assert read("Α", notation="greek-documentary").value == 1000
    assert read("Γ", notation="greek-astronomical").value == 3


def test_capitals_throughout_are_not_thousands():
    # An inscription in capitals: Heath I p. 36 (ΡΚΓ = 123).
    assert parse("ΡΚΓ").value == 123 and not parse("ΡΚΓ").ambiguous


def test_capital_thousands_written_back():
    r = read("Γ", notation="greek")
    assert render_choice(r, (F(3000),)) == "͵Γ"
    assert render_choice(r, (F(3),)) == "Γ"


@pytest.mark.parametrize("text", ["ο νθ η ιζ ιγ ιβ λα", "ο λβ γ", "Γ", "ο", "κε ∠ʹ γʹ", "β ∠ʹ δʹ", "κθ ??",
                                  "κθ 𐆊 λ", "ϛ γʹ ιβʹ"])
def test_canonical_forms_write_back_as_read(text):
    with warnings.catch_warnings():
        warnings.simplefilter("ignore", NumcheckWarning)
        r = parse(text)
        assert format_reading(r) == text
        again = parse(format_reading(r))
    assert [s.values for s in again.slots] == [s.values for s in r.slots]


def test_every_choice_of_an_unread_fraction_reads_back():
    with warnings.catch_warnings():
        warnings.simplefilter("ignore", NumcheckWarning)
        r = parse("κθ ??")
        for v in r.slots[-1].values:
            choice = tuple(s.values[0] for s in r.slots[:-1]) + (v,)
            assert parse(render_choice(r, choice)).value == 29 + v
