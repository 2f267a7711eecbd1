"""Documentary papyri as the Duke Databank edits them: the letters of every plain ``<num>``.

The EpiDoc files are read in place from ``../shared/realdata/papyri/`` (DDbDP,
papyri.info; the tests skip when the folder is absent).  Each ``<num>`` that
holds letters only (no markup inside) is read with the notation
``greek-documentary`` and compared with the editors' own ``@value``: the
outside authority here is the edition.  A ``<num rend="tick">`` is a unit
fraction the TEI reader resolves (numcheck.tei), and a number written as a
word (διώβολον) is no numeral: both are left out.

The documentary conventions themselves (common practice of those editions;
Heath, A History of Greek Mathematics I p. 36 for the lower numeral sign):
``Γ`` alone 3000, ``Αξδ`` 1064, ``'Αωϙγ`` 1893.
"""

from fractions import Fraction as F
from pathlib import Path

import pytest
from lxml import etree

from numcheck.reader import read

PAPYRI = Path(__file__).resolve().parents[1] / ".." / "shared" / "realdata" / "papyri"
TEI = "{http://www.tei-c.org/ns/1.0}"
_LETTERS = set("αβγδεϛζηθικλμνξοπϙϟρστυφχψωϡΑΒΓΔΕϚΖΗΘΙΚΛΜΝΞΟΠϘΡΣΤΥΦΧΨΩϠ͵ʹ'𐅵𐅷𐅸𐆋")


def _plain_nums():
    if not PAPYRI.is_dir():
        pytest.skip(f"{PAPYRI} is not here (shared/realdata/papyri)")
    out = []
    parser = etree.XMLParser(resolve_entities=False, no_network=True, load_dtd=False)
    for path in sorted(PAPYRI.glob("*.xml")):
        root = etree.parse(str(path), parser).getroot()
        for num in root.iter(f"{TEI}num"):
            text = (num.text or "").strip()
            if len(num) or not text or num.get("value") is None or num.get("rend") == "tick":
                continue
            if set(text) <= _LETTERS:
                out.append((path.name, text, F(num.get("value"))))
    return out


def test_every_plain_letter_num_reads_the_editors_value():
    nums = _plain_nums()
    assert len(nums) >= 100
    wrong = [(f, t, v, read(t, notation="greek-documentary").value) for f, t, v in nums
             if read(t, notation="greek-documentary").value != v]
    assert not wrong


@pytest.mark.parametrize("text, value, note", [
    ("Γ", 3000, "a lone capital is thousands"),
    ("Α", 1000, "a lone capital alpha"),
    ("Αξδ", 1064, "a capital before tens and units"),
    ("'Αωϙγ", 1893, "a leading apostrophe for the lower numeral sign"),
    ("Βφ", 2500, "a capital before hundreds"),
    ("ο", 70, "omicron is seventy in a papyrus"),
    ("ρκ 𐅵 δʹ", F(483, 4), "whole number, then the half and a quarter (a run of fractions)"),
])
def test_documentary_conventions(text, value, note):
    assert read(text, notation="greek-documentary").value == value, note
