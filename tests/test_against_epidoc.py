"""Greek numerals as the EpiDoc Guidelines encode them.

Source: EpiDoc Guidelines (EpiDoc/Source repository, guidelines/xml; pages
at epidoc.stoa.org/gl/latest/), as quoted in the reference notes
conventions.md §1.3 and §2.1:

* ``trans-numtick``: ``<num value="1670" rend="tick">αχο</num>``: 1670 with the
  tick and no thousands sign; a units letter before a hundreds letter is
  thousands.
* ``trans-numknown``: ``<num value="12">ιβ</num>``.
* ``trans-fractionknown``: ``<num value="1/2">𐅵</num>``.
* ``trans-numnoncongruent``: a two-digit number whose units letter survives
  (α) and whose tens letter is lost: alternatives 21, 31 ... 901 for the
  editor's 11 (BGU 3.734).
"""

from fractions import Fraction

import pytest

from numcheck.notations.greek import format, parse
from numcheck.reader import read


def test_1670_with_the_tick_as_epidoc_writes_it():
    r = read("αχοʹ", notation="greek")
    assert r.value == 1670                       # EpiDoc trans-numtick
    assert any("read as thousands" in w for w in r.warnings)


def test_1670_with_the_lower_numeral_sign():
    assert read("͵αχο").value == 1670             # the same number with ͵ (Heath I p. 36)
    assert format(parse("αχοʹ")) == "͵αχοʹ"       # written back with the sign made explicit


@pytest.mark.parametrize("tick", ["ʹ", "\u0374", "'", "’", "′"])
def test_the_tick_in_every_form_an_editor_types(tick):
    assert read("αχο" + tick, notation="greek").value == 1670


def test_twelve():
    assert read("ιβ").value == 12                 # EpiDoc trans-numknown


def test_one_half_sign():
    assert read("𐅵").value == Fraction(1, 2)      # EpiDoc trans-fractionknown


def test_lost_tens_letter_before_alpha():
    # EpiDoc trans-numnoncongruent: [.]α may be 11, 21, 31 ... 901.
    r = read("[.]α", notation="greek")
    values = set(r.readings())
    assert {11, 21, 31, 41, 51, 61, 71, 81, 91, 101, 201, 901} <= values
    assert r.value == 11
