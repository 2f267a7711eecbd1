"""Unicode: NFC and NFD give the same results; look-alikes from another script are named.

Checked against the Unicode Character Database through :mod:`unicodedata`
(the normalisation forms of UAX #15, the character names).  The look-alike
pairs are Unicode's own confusables (UTS #39) for the letters numerals use.
"""

from __future__ import annotations

import importlib.util
import unicodedata
import warnings
from pathlib import Path

import pytest
from hypothesis import given
from hypothesis import strategies as st

import numcheck
from numcheck.errors import NumcheckError, NumcheckSyntaxError, NumcheckWarning
from numcheck.notations.lookalikes import ANGLE_BRACKETS, CYRILLIC_LOOKALIKES

_spec = importlib.util.spec_from_file_location(
    "numcheck_fuzz", Path(__file__).resolve().parents[1] / "benchmarks" / "fuzz.py")
fuzz = importlib.util.module_from_spec(_spec)
_spec.loader.exec_module(fuzz)

SEEDS = [(n, t) for n, texts in sorted(fuzz.SEEDS.items()) for t in texts]
# Texts whose NFD differs from their NFC (accents, underdots, the overline, ē of bēru ...).
DECOMPOSING = [
    ("sexagesimal", "4\u0323;5"), ("greek", "ρι\u0323η\u0323 λε ιε"), ("greek", "ϛφπε γ\u0374"),
    ("quantity", "2 bēru 10 UŠ"), ("greek", "ō ιε"), ("roman", "X\u0305II"),
    ("attic", "Χ[.]ΗΔΔΙΙ"), ("cuneiform", "1 [x]5"),
]


def _outcome(fn, *args, **kwargs):
    """The JSON object of a call, or the error's class (so that two calls can be compared)."""
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        try:
            return fn(*args, **kwargs).to_dict()
        except NumcheckError as err:
            return type(err).__name__


def test_the_normalisation_facts_this_relies_on():
    # UAX #15: the old angle brackets are canonically equivalent to the CJK ones.
    assert unicodedata.normalize("NFC", "\u2329\u232a") == "\u3008\u3009"
    assert unicodedata.decomposition("\u2329") == "3008"
    # The underdot and the overline are combining marks that NFC keeps apart from most letters.
    assert unicodedata.normalize("NFD", "ọ") == "o\u0323"
    assert unicodedata.normalize("NFD", "ē") == "e\u0304"
    assert unicodedata.normalize("NFC", "\u0374") == "\u02b9"


@pytest.mark.parametrize("notation, text", SEEDS + DECOMPOSING)
def test_nfc_and_nfd_read_the_same(notation, text):
    nfc, nfd = unicodedata.normalize("NFC", text), unicodedata.normalize("NFD", text)
    for as_what in (None, notation):
        assert _outcome(numcheck.read, nfd, notation=as_what) == _outcome(numcheck.read, nfc, notation=as_what)


@given(st.sampled_from(sorted(fuzz.SEEDS)).flatmap(
    lambda n: st.tuples(st.just(n), st.sampled_from(fuzz.SEEDS[n]),
                        st.lists(st.sampled_from(["\u0323", "\u0305", "\u0301", "\u0304", "\u0374", "?", "[", "]"]),
                                 max_size=2), st.integers(0, 20))))
def test_nfc_and_nfd_read_the_same_with_marks(case):
    notation, text, marks, at = case
    at = min(at, len(text))
    text = text[:at] + "".join(marks) + text[at:]
    nfc, nfd = unicodedata.normalize("NFC", text), unicodedata.normalize("NFD", text)
    assert _outcome(numcheck.read, nfd, notation=notation) == _outcome(numcheck.read, nfc, notation=notation)


@pytest.mark.parametrize("text", ["ϛφπε γʹ", "2 bēru 10 UŠ", "ρι\u0323η\u0323 λε ιε"])
def test_nfc_and_nfd_identify_and_restore_the_same(text):
    nfc, nfd = unicodedata.normalize("NFC", text), unicodedata.normalize("NFD", text)
    assert _outcome(numcheck.identify, nfd) == _outcome(numcheck.identify, nfc)
    assert _outcome(numcheck.restore, nfd, use_catalogue=False) == \
        _outcome(numcheck.restore, nfc, use_catalogue=False)


_GREEK = [(900, "ϡ"), (800, "ω"), (700, "ψ"), (600, "χ"), (500, "φ"), (400, "υ"), (300, "τ"),
          (200, "σ"), (100, "ρ"), (90, "ϟ"), (80, "π"), (70, "ο"), (60, "ξ"), (50, "ν"), (40, "μ"),
          (30, "λ"), (20, "κ"), (10, "ι"), (9, "θ"), (8, "η"), (7, "ζ"), (6, "ϛ"), (5, "ε"), (4, "δ"),
          (3, "γ"), (2, "β"), (1, "α")]


def _greek(n: int) -> str:
    """An integer below 1000 in Greek alphabetic numerals, ō for zero (common practice)."""
    if n == 0:
        return "ō"
    out = ""
    for value, letter in _GREEK:
        if n >= value:
            out, n = out + letter, n - value
    return out


def test_nfc_and_nfd_audit_the_same():
    import pandas as pd

    # The moon's daily motion 13;10,35° (Almagest IV.4, from memory) summed day by day
    # in Greek numerals, with a slip in row 6; zeros written ō, which NFD splits in two.
    cells = []
    for day in range(1, 13):
        v = day * (13 * 3600 + 10 * 60 + 35) - (60 if day >= 6 else 0)
        cells.append(" ".join(_greek(p) for p in (v // 3600, v // 60 % 60, v % 60)))
    nfc = pd.DataFrame({"motion": cells}, dtype=object)
    nfd = pd.DataFrame({"motion": [unicodedata.normalize("NFD", c) for c in cells]}, dtype=object)
    assert any("ō" in c for c in cells) and list(nfd["motion"]) != cells
    a, b = _outcome(numcheck.audit, nfc), _outcome(numcheck.audit, nfd)
    assert isinstance(a, dict) and a["schemes"] and a["flags"]
    assert a == b


# -- look-alikes ------------------------------------------------------------------

def _code(ch: str) -> str:
    return f"U+{ord(ch):04X}"


def test_latin_o_in_a_greek_numeral_is_named():
    with pytest.raises(NumcheckSyntaxError) as info:
        numcheck.read("κo")
    assert "U+006F" in str(info.value) and "Latin" in str(info.value)
    assert info.value.position == 1


@pytest.mark.parametrize("cyrillic, like", sorted(CYRILLIC_LOOKALIKES.items()))
def test_cyrillic_letters_are_refused_with_their_code_point(cyrillic, like):
    assert unicodedata.name(cyrillic).startswith("CYRILLIC")
    for other in like:
        assert unicodedata.name(other).split()[0] in ("LATIN", "GREEK")
    # The Cyrillic letter in place of the letter it looks like, in a number of that script.
    host = {"LATIN": "XI", "GREEK": "κθ"}[unicodedata.name(like[0]).split()[0]]
    text = host + cyrillic
    with pytest.raises(NumcheckSyntaxError) as info:
        numcheck.read(text)
    message = str(info.value)
    assert _code(cyrillic) in message and unicodedata.name(cyrillic) in message
    assert info.value.position == len(host)
    assert all(_code(c) in message for c in like)


@pytest.mark.parametrize("text", ["ХII", "κθ λа", "1,3О", "ΔΔІ"])
def test_cyrillic_in_every_script_of_number(text):
    with pytest.raises(NumcheckSyntaxError, match="Cyrillic"):
        numcheck.read(text)


@pytest.mark.parametrize("typed", ["\u2329", "\u3008", "\u27e8"])
def test_angle_brackets_read_as_the_addition_marks(typed):
    close = {"\u2329": "\u232a", "\u3008": "\u3009", "\u27e8": "\u27e9"}[typed]
    text = f"29;31,5{typed}0{close}"
    plain = numcheck.read("29;31,5<0>")
    if typed == "\u27e8":   # the mathematical brackets are Leiden's own: no warning
        with warnings.catch_warnings():
            warnings.simplefilter("error")
            reading = numcheck.read(text)
    else:
        with pytest.warns(NumcheckWarning) as caught:
            reading = numcheck.read(text)
        messages = " ".join(str(w.message) for w in caught)
        assert "U+3008" in messages and "U+3009" in messages
        assert "U+2329" in messages    # the character the editor may have typed
    assert reading.value == plain.value and reading.min == plain.min and reading.max == plain.max


def test_cjk_brackets_in_greek_and_cuneiform():
    with pytest.warns(NumcheckWarning, match="CJK angle bracket"):
        assert numcheck.read("κθ \u3008λ\u3009").value == numcheck.read("κθ <λ>").value
    with pytest.warns(NumcheckWarning, match="CJK angle bracket"):
        r = numcheck.read("1 \u23290\u232a 30")
    assert r.notation == "cuneiform" and r.value == numcheck.read("1 <0> 30").value


def test_angle_bracket_table_matches_unicode():
    for cjk, (mark, old) in ANGLE_BRACKETS.items():
        assert unicodedata.normalize("NFC", old) == cjk
        assert "ANGLE BRACKET" in unicodedata.name(mark) and "ANGLE BRACKET" in unicodedata.name(cjk)


def test_latin_capitals_among_attic_signs_warn():
    with pytest.warns(NumcheckWarning, match="U\\+0049") as caught:
        r = numcheck.read("ΔΔII")
    assert r.value == 22 and "U+0399" in str(caught[0].message)
    with warnings.catch_warnings():
        warnings.simplefilter("error")
        assert numcheck.read("ΔΔΙΙ").value == 22      # all Greek: no warning
        assert numcheck.read("P(D)II", notation="attic").value == 52   # all ASCII fallbacks: none


@pytest.mark.parametrize("text, char", [("1,O5", "O"), ("1,l5", "l"), ("１２;３０", "１"), ("1٢", "٢")])
def test_other_look_alikes_are_named_by_code_point(text, char):
    # Arabic-Indic digits alone are a notation of their own (arabic-indic); mixed with
    # ASCII digits they are still named by code point.
    with pytest.raises(NumcheckError) as info:
        numcheck.read(text)
    assert _code(char) in str(info.value)


def test_nfc_and_nfd_annotate_the_same():
    from numcheck.tei import annotate_bytes

    doc = ('<TEI xmlns="http://www.tei-c.org/ns/1.0"><text><body><ab><num>ρνζ ζ ō</num> '
           '<num>ρ[ν]ζ ζ ō</num> <num>2 bēru 10 UŠ</num></ab></body></text></TEI>')
    nfc, nfd = unicodedata.normalize("NFC", doc), unicodedata.normalize("NFD", doc)
    assert nfc != nfd
    a = annotate_bytes(nfc.encode(), alternatives=2)
    b = annotate_bytes(nfd.encode(), alternatives=2)
    assert a[1].to_dict() == b[1].to_dict()
    # The editor's file keeps its own form: only the annotations are added.
    assert unicodedata.normalize("NFD", "ō").encode() in b[0]
