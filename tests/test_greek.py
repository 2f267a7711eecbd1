"""Greek alphabetic numerals: values, damage, order, errors, round trips.

Letter values: Heath, A History of Greek Mathematics I (1921) p. 36.  The
published values (EpiDoc, Almagest) are in tests/test_against_epidoc.py and
tests/test_against_published_greek (below, marked with their source).
"""

import unicodedata
from fractions import Fraction

import pytest
from hypothesis import given
from hypothesis import strategies as st

from numcheck.errors import NumcheckError, NumcheckRangeError, NumcheckSyntaxError, NumcheckWarning
from numcheck.notations.greek import BAD_EXAMPLES, format, parse
from numcheck.reader import read
from numcheck.reading import Status

F = Fraction


# -- values -------------------------------------------------------------------

VALUES = [
    ("α", 1, "units"),
    ("θ", 9, "units"),
    ("ϛ", 6, "stigma"),
    ("ς", 6, "stigma typed as final sigma"),
    ("ϝ", 6, "digamma"),
    ("ϟ", 90, "koppa"),
    ("ϙ", 90, "archaic koppa"),
    ("ϡ", 900, "sampi"),
    ("ͳ", 900, "archaic sampi"),
    ("ϲ", 200, "lunate sigma"),
    ("ρκγ", 123, "hundreds, tens, units"),
    ("ΡΚΓ", 123, "capitals"),
    ("ωϟθ", 899, "largest three-letter"),
    ("͵θϡϟθ", 9999, "largest below a myriad"),
    ("͵α", 1000, "thousands sign"),
    ("βΜ", 20000, "two myriads, the count before Μ"),
    ("Μ", 40, "capital mu in a number in capitals is 40"),
    ("αΜ͵βτμε", 12345, "one myriad and 2345"),
    ("Μα", 10001, "a myriad sign with no count is one myriad"),
    ("κθʹ", 29, "keraia on the whole part marks a numeral"),
    ("κθ'", 29, "ASCII apostrophe for the keraia"),
    ("κθ’", 29, "typographic apostrophe for the keraia"),
    ("κθ\u0374", 29, "GREEK NUMERAL SIGN (NFC turns it into U+02B9)"),
    ("κ\u0305θ\u0305", 29, "combining overline"),
    ("ῑβ", 12, "iota with a macron, composed by NFC"),
    ("𐆊", 0, "the zero sign alone"),
    ("ō", 0, "ō typed for the zero sign"),
    ("ιβ∠", F(25, 2), "∠ for one half"),
    ("ιβ𐅵", F(25, 2), "GREEK ONE HALF SIGN"),
    ("ιβ𐅷", F(38, 3), "GREEK TWO THIRDS SIGN"),
    ("ιβ𐅸", F(51, 4), "GREEK THREE QUARTERS SIGN"),
    ("ιβ𐆋", F(49, 4), "GREEK ONE QUARTER SIGN"),
    ("κ ∠", F(41, 2), "a group of a fraction sign alone adds to the units"),
    ("ιβ γʹ δʹ", 12 + F(1, 3) + F(1, 4), "two unit fractions"),
    ("ιβ βʹ", F(25, 2), "βʹ = 1/2"),
    ("λ ιβʹ", 30 + F(1, 12), "a unit fraction of two letters"),
    ("κθ ο̄", 29, "a barred omicron in a place is the zero (with a warning)"),
]


@pytest.mark.parametrize("text, value, note", VALUES)
def test_values(text, value, note, recwarn):
    assert parse(text).value == value, note


def test_value_table_has_no_repeats():
    texts = [t for t, _, _ in VALUES]
    assert len(texts) == len(set(texts))


def test_slots_follow_the_model():
    r = parse("τξε ιδ μη")
    assert [(s.values, s.place) for s in r.slots] == [
        ((F(300),), 0), ((F(60),), 0), ((F(5),), 0), ((F(10),), -1), ((F(4),), -1),
        ((F(40),), -2), ((F(8),), -2)]
    assert r.base == 60 and r.notation == "greek"


def test_unit_fraction_is_one_slot_at_place_0():
    r = parse("ϛφπε γʹ")
    assert r.slots[-1].values == (F(1, 3),) and r.slots[-1].place == 0


# -- published values ---------------------------------------------------------

PUBLISHED = [
    ("κθ λα ν η κ", F(765433, 25920), "29;31,50,8,20 days, the mean synodic month: Ptolemy, "
     "Almagest IV.3 (tr. G. J. Toomer, Ptolemy's Almagest, 1984)"),
    ("τξε ιδ μη", 365 + F(14, 60) + F(48, 3600), "365;14,48 days, the tropical year: Ptolemy, "
     "Almagest III.1 (tr. Toomer 1984)"),
    ("ϛφπε γʹ", 6585 + F(1, 3), "6585 1/3 days, the period of 223 months: Ptolemy, Almagest IV.2 "
     "(tr. Toomer 1984)"),
    ("α 𐆊 λ", 1 + F(30, 3600), "1;0,30: the zero sign in an empty place (Cajori, A History of "
     "Mathematical Notations I §43; constructed example)"),
]


@pytest.mark.parametrize("text, value, source", PUBLISHED)
def test_published_values(text, value, source):
    assert read(text).value == value, source
    assert read(text).notation == "greek"


def test_cli_read_json_gives_the_exact_month(capsys):
    import json

    from numcheck.cli import main
    code = main(["read", "κθ λα ν η κ", "--json"])
    data = json.loads(capsys.readouterr().out)
    assert code == 0
    assert data["value"] == "765433/25920"          # Almagest IV.3 (tr. Toomer 1984)
    assert data["sexagesimal"] == "29;31,50,8,20"
    assert data["notation"] == "greek" and data["canonical"] == "κθ λα ν η κ"


def test_cli_bad_greek_exits_2_naming_the_code_point(capsys):
    from numcheck.cli import main
    code = main(["read", "κθ λo"])
    captured = capsys.readouterr()
    assert code == 2
    assert "U+006F" in captured.out + captured.err and "Traceback" not in captured.err


# -- damage -------------------------------------------------------------------

DAMAGE = [
    ("ι[.]", 11, 19, 9, Status.LOST, "one lost units letter after ι (the issue's example)"),
    ("[.]α", 11, 9001, 27, Status.LOST, "a lost tens, hundreds or thousands letter before α"),
    ("ρ[..]", 111, 199, 81, Status.LOST, "two lost letters: tens and units"),
    ("[.]", 0, 9000, 37, Status.LOST, "a lone lost sign: a letter or the zero sign"),
    ("κθ [.]", 29, 29 + F(50, 60), 15, Status.LOST, "a lost minutes letter: 1-9, 10-50 or zero"),
    ("κθ [..]", 29 + F(11, 60), 29 + F(59, 60), 45, Status.LOST, "two lost letters in a place"),
    ("ι[...]", 10, 19, 10, Status.LOST, "unknown number of letters after ι: none or one units letter"),
    ("κθ .α", 29 + F(11, 60), 29 + F(51, 60), 5, Status.UNREAD, "a letter present but unread"),
    ("ι[β]", 11, 19, 9, Status.RESTORED, "an editor's restoration; the traces allow 11..19"),
    ("ιβ̣", 12, 12, 1, Status.DOUBTFUL, "an underdot keeps the read value"),
    ("ιβ?", 12, 12, 1, Status.DOUBTFUL, "a question mark too"),
    ("ι<β>", 12, 12, 1, Status.ADDED, "an editor's addition counts"),
    ("ι{β}", 10, 10, 1, Status.SUPERFLUOUS, "a superfluous letter does not count"),
    ("͵[.]χο", 1670, 9670, 9, Status.LOST, "a lost thousands letter after ͵"),
    ("α[.]ο", 1170, 1970, 9, Status.LOST, "α before a lost letter is thousands, as in αχο"),
    ("α[.]", 1001, 1900, 27, Status.LOST, "α then a lost letter: thousands, and any rank below"),
]


@pytest.mark.parametrize("text, lo, hi, count, status, note", DAMAGE)
def test_damage(text, lo, hi, count, status, note, recwarn):
    r = parse(text)
    assert (r.min, r.max, r.count) == (lo, hi, count), note
    assert status in {s.status for s in r.slots}, note


def test_damage_table_has_no_repeats():
    assert len({d[0] for d in DAMAGE}) == len(DAMAGE)


def test_restored_letter_keeps_the_editor_value():
    r = parse("κθ λα ν [η] κ")
    assert r.value == F(765433, 25920)
    (slot,) = [s for s in r.slots if s.status is Status.RESTORED]
    assert slot.editor == 8 and set(range(1, 10)) <= set(slot.values) | {F(0)}


def test_a_gap_place_stands_for_one_to_three_places():
    r = parse("κθ [...] ν")
    # κ, θ, ν and one slot per lost place
    assert [len(e.slots) for e in r.expansions()] == [4, 5, 6]
    assert any("lost sexagesimal places" in w for w in r.warnings)


def test_lost_gap_letters_are_bounded_and_said():
    r = parse("[...]")
    assert (r.min, r.max) == (0, 9999)
    assert any("myriads are not considered" in w for w in r.warnings)


def test_lost_letter_in_a_place_stays_below_60():
    r = parse("ν[.]")
    assert r.min == 51 and r.max == 59


# -- order --------------------------------------------------------------------

def test_units_before_hundreds_are_thousands_with_a_note():
    r = parse("αχο")
    assert r.value == 1670
    assert any("read as thousands" in w for w in r.warnings)


def test_letters_out_of_order_warn_and_read_additively():
    with pytest.warns(NumcheckWarning, match="not in the usual descending order"):
        r = parse("αι")
    assert r.value == 11


def test_ascending_option_for_inscriptions():
    import warnings
    with warnings.catch_warnings():
        warnings.simplefilter("error")
        r = parse("ακ", ascending=True)
    assert r.value == 21
    lost = parse("α[.]", ascending=True)   # a larger letter after α: tens to thousands
    assert (lost.min, lost.max, lost.count) == (11, 9001, 27)
    with pytest.warns(NumcheckWarning, match="ascending"):
        parse("κα", ascending=True)


def test_ascending_is_a_notation():
    r = read("ακ", notation="greek-ascending")
    assert r.value == 21 and r.notation == "greek-ascending"


# -- errors -------------------------------------------------------------------

@pytest.mark.parametrize("text, column, label", BAD_EXAMPLES)
def test_bad_input_names_the_character_and_column(text, column, label):
    with pytest.raises(NumcheckSyntaxError) as info:
        parse(text)
    err = info.value
    assert err.column == column, str(err)
    assert label in str(err)
    if err.found is not None:
        assert f"U+{ord(err.found):04X}" in str(err)


def test_bad_examples_do_not_repeat():
    assert len({t for t, _, _ in BAD_EXAMPLES}) == len(BAD_EXAMPLES)


@pytest.mark.parametrize("text, column", [("κθ ξα", 4), ("κθ οα", 4), ("κθ ρ", 4), ("κθ [ξ]", 4)])
def test_a_place_over_59_is_a_range_error(text, column):
    with pytest.raises(NumcheckRangeError) as info:
        parse(text)
    assert info.value.column == column and "0 to 59" in str(info.value)


def test_latin_o_inside_greek_names_the_code_point():
    with pytest.raises(NumcheckError, match=r"Latin 'o'.*U\+006F"):
        read("κo", notation="greek")


def test_mixed_scripts_through_read():
    with pytest.raises(NumcheckSyntaxError) as info:
        read("κθ λa")
    assert info.value.column == 5 and "U+0061" in str(info.value)


# -- normalisation ------------------------------------------------------------

@pytest.mark.parametrize("text", ["κθ λα̣ ν [η] κ", "ῑβ", "ιβ γʹ", "κθ\u0374", "α 𐆊 λ", "ᾱ̣"])
def test_nfc_and_nfd_read_the_same(text, recwarn):
    nfc = unicodedata.normalize("NFC", text)
    nfd = unicodedata.normalize("NFD", text)
    a, b = read(nfc, notation="greek"), read(nfd, notation="greek")
    assert a.to_dict() == b.to_dict()


# -- writing back -------------------------------------------------------------

CANONICAL = ["κθ λα ν η κ", "͵αχο", "τξε ιδ μη", "͵ϛφπε γʹ", "α 𐆊 λ", "ι[.]", "κθ [.] ν", "βΜ",
             "αΜ͵βτμε", "ι̣β", "ι[...]", "κθ [...] ν", "ΚΘ", "ιβ∠", "<ι>{β}α", "ρ[..]", "κθ .α",
             "λ ιβʹ", "͵[.]χο"]


@pytest.mark.parametrize("text", CANONICAL)
def test_canonical_forms_come_back(text):
    assert format(parse(text)) == text


def test_restoration_is_written_in_brackets():
    r = parse("κθ λα ν [.] κ")
    choice = tuple(s.values[0] if len(s.values) == 1 else F(8) for s in r.slots)
    assert format(r, choice) == "κθ λα ν [η] κ"
    assert r.value_of(choice) == F(765433, 25920)


def test_every_choice_writes_back_to_its_value():
    r = parse("ι[.] [..]")
    for expansion, choice in r.choices():
        text = format(expansion, choice)
        assert parse(text).value == expansion.value_of(choice), text


def test_gap_expansions_write_back():
    r = parse("κθ [...] ν")
    for expansion, choice in list(r.choices())[:200]:
        text = format(expansion, choice)
        assert parse(text).value == expansion.value_of(choice), text


_UNITS = "αβγδεϛζηθ"
_TENS = "ικλμνξοπϟ"
_HUNDREDS = "ρστυφχψωϡ"


def _letters(n: int) -> str:
    """An independent speller (Heath's table) for the round trips."""
    out = ""
    if n >= 1000:
        out += "͵" + _UNITS[n // 1000 - 1]
    for k, row in ((100, _HUNDREDS), (10, _TENS), (1, _UNITS)):
        d = (n // k) % 10
        if d:
            out += row[d - 1]
    return out


@given(st.integers(1, 9999), st.lists(st.integers(0, 59), max_size=4))
def test_round_trip_sexagesimal_numbers(whole, places):
    text = " ".join([_letters(whole)] + [_letters(p) if p else "𐆊" for p in places])
    r = parse(text)
    expected = whole + sum(F(p, 60 ** (i + 1)) for i, p in enumerate(places))
    assert r.value == expected
    assert format(r) == text
    assert parse(format(r)).value == expected


@given(st.integers(1, 9999), st.lists(st.integers(2, 999), max_size=3))
def test_round_trip_unit_fractions(whole, denominators):
    text = " ".join([_letters(whole)] + [_letters(d) + "ʹ" for d in denominators])
    r = parse(text)
    assert r.value == whole + sum(F(1, d) for d in denominators)
    assert format(r) == text


@given(st.integers(10, 999), st.integers(0, 2))
def test_round_trip_with_a_lost_letter(n, which):
    letters = [c for c in _letters(n)]
    which = min(which, len(letters) - 1)
    damaged = "".join("[.]" if i == which else c for i, c in enumerate(letters))
    r = parse(damaged)
    assert r.min <= n <= r.max
    assert F(n) in set(r.readings())
    assert format(r) == damaged


@given(st.integers(10000, 99999999))
def test_round_trip_myriads(n):
    # Myriads: the count before the myriad sign Μ, the rest after it (Heath I p. 39, from memory).
    text = _letters(n // 10000) + "Μ" + _letters(n % 10000)
    r = parse(text)
    assert r.value == n
    assert format(r) == text


def test_lost_letter_in_a_unit_fraction():
    r = parse("λ ι[.]ʹ")
    assert set(r.readings()) == {30 + F(1, d) for d in range(11, 20)}
    for expansion, choice in r.choices():
        text = format(expansion, choice)
        assert text.startswith("λ ι[") and text.endswith("]ʹ")
        assert parse(text).value == expansion.value_of(choice)


def test_restorations_keep_the_case_of_the_number():
    r = parse("ΚΘ [.]")
    assert {format(e, c) for e, c in r.choices()} >= {"ΚΘ [Γ]", "ΚΘ [Ν]", "ΚΘ [𐆊]"}


@given(st.text(alphabet="αβιρκχ͵ʹ'[].<>{}?\u0323 𐆊∠Μ", max_size=12))
def test_any_text_reads_or_raises_a_numcheck_error(text):
    import warnings
    with warnings.catch_warnings():
        warnings.simplefilter("ignore", NumcheckWarning)
        try:
            r = parse(text)
        except NumcheckError:
            return
        assert r.min <= r.value <= r.max
        assert parse(format(r)).value == r.value
