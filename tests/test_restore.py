"""Tests of the restoration engine: space, scoring, search, reasons, limits.

Published values used here are named with their source in
``test_restore_helpers.PUBLISHED``; the brute force there is the model of
``numcheck.restore.scoring`` applied reading by reading.
"""

import math
from fractions import Fraction

import pytest
from hypothesis import given, strategies as st

import numcheck
from numcheck import limits
from numcheck.errors import LimitError, NumcheckError, NumcheckRangeError
from numcheck.restore import Candidate, Evidence, RestoreResult, restore
from numcheck.restore import evidence as evidence_mod
from numcheck.restore.space import build_space

from test_restore_helpers import PUBLISHED, brute_force, stand_in

MONTH = Fraction(765433, 25920)   # 29;31,50,8,20 days (Neugebauer, ACT 1955, System B)
SAROS = Fraction(19756, 3)        # 1,49,45;20 days (Ptolemy, Almagest IV.2, tr. Toomer 1984)


@pytest.fixture
def catalogue(monkeypatch):
    """The stand-in catalogue of published values in place of identify's look-up."""
    monkeypatch.setattr(evidence_mod, "catalogue_source", lambda: stand_in())


def test_front_door_exports_restore():
    # numcheck.restore is the package once imported; it answers a call as the function does.
    assert numcheck.restore("5[x]", expect="52", use_catalogue=False).best.value == 52
    assert set(["restore", "Evidence", "RestoreResult", "Candidate"]) <= set(
        __import__("numcheck.restore", fromlist=["__all__"]).__all__)


def test_lost_digit_of_the_month_restored_by_the_catalogue(catalogue):
    result = restore("29;31,5[x],8,20")
    assert isinstance(result, RestoreResult)
    best = result.best
    assert isinstance(best, Candidate)
    assert best.value == MONTH
    assert best.text == "29;31,5[0],8,20"
    assert any("month_sysB" in r or "29;31,50,8,20" in r for r in best.reasons)
    assert result.space == 10
    assert best.probability > 0.5
    assert best.evidence == ("month_sysB",)


def test_expected_value_as_text_or_fraction_gives_the_same_ranking():
    a = restore("29;31,5[x],8,20", use_catalogue=False, expect="29;31,50,8,20")
    b = restore("29;31,5[x],8,20", use_catalogue=False, expect=MONTH)
    assert [c.value for c in a.candidates] == [c.value for c in b.candidates]
    assert a.best.value == MONTH
    # pi0 = 1 / (1 + EXPECT_WEIGHT); the expected reading takes the rest on top of its prior.
    pi0 = 1 / (1 + 4.0)
    assert a.best.probability == pytest.approx(pi0 * a.best.prior + (1 - pi0))


def test_expected_value_with_more_places_agrees_to_the_last_written_place():
    # 12;22,8,53,20 (System B year, Neugebauer ACT) at two fractional places: rounded
    # 12;22,9 (nearer, so a closer fit) and cut 12;22,8 both agree; nothing else does.
    result = restore("12;22,[x]", use_catalogue=False, expect="12;22,8,53,20")
    first, second = result.candidates[:2]
    assert first.value == Fraction(2783, 225) + Fraction(1, 3600)
    assert "rounded up" in first.reasons[0]
    assert second.value == Fraction(2783, 225)
    assert "cut there" in second.reasons[0]
    assert not result.candidates[2].evidence


def test_context_evidence_with_tolerance():
    ev = Evidence(value=Fraction(52), tolerance=Fraction(1), weight=2.0, label="zigzag scheme, row 12")
    result = restore("5[x]", context=[ev], use_catalogue=False, top=5)
    values = [c.value for c in result.candidates[:3]]
    assert values[0] == 52                          # exact fit beats near fits
    assert set(values[1:3]) == {51, 53}
    assert "zigzag scheme, row 12" in result.best.reasons[0]
    assert "off by 1" in result.candidates[1].reasons[0]


def test_evidence_rejects_a_negative_tolerance():
    with pytest.raises(NumcheckRangeError):
        Evidence(Fraction(1), Fraction(-1))


def test_editor_restoration_is_one_candidate_marked_as_the_editors(catalogue):
    result = restore("29;31,[4]0,8,20", top=6)
    assert result.best.value == MONTH and not result.best.editor
    editors = [c for c in result.candidates if c.editor]
    assert len(editors) == 1 and editors[0].value == MONTH - Fraction(10, 3600)
    assert any("the editor's restoration" in r for r in editors[0].reasons)
    assert any("not the editor's 40" in r for r in result.best.reasons)


def test_editor_restoration_first_when_no_evidence():
    result = restore("29;31,[4]0,8,20", use_catalogue=False)
    assert result.best.editor
    assert result.best.text == "29;31,[4]0,8,20"


def test_gap_of_unknown_extent_is_bounded_and_said(catalogue):
    result = restore("1,[...],45;20")
    assert result.best.value == SAROS
    assert result.best.text == "1,[49],45;20"
    assert any("GAP_MAX_PLACES" in n for n in result.notes)
    assert any("1 lost place" in r for r in result.best.reasons)
    assert result.space == 60 + 60**2 + 60**3


def test_doubtful_digit_alternatives_come_from_the_confusion_data():
    result = restore("29;31,5?,8,20", use_catalogue=False, top=10)
    by_value = {c.value: c for c in result.candidates}
    assert result.best.value == MONTH - Fraction(45, 3600)   # the digit as read
    for alt in (4, 6, 15):
        value = Fraction(29) + Fraction(31, 60) + Fraction(alt, 3600) + Fraction(8, 60**3) + Fraction(20, 60**4)
        assert value in by_value
    assert by_value[MONTH - Fraction(35, 3600)].text == "29;31,15?,8,20"
    assert any("wedge" in r for r in by_value[MONTH - Fraction(44, 3600)].reasons)


def test_doubtful_digit_overturned_by_the_catalogue(catalogue):
    # 29;31,51?,8,20: one wedge too many for the System B month.
    result = restore("29;31,51?,8,20")
    assert result.best.value == MONTH
    assert any("wedge" in r for r in result.best.reasons)


def test_floating_reading_tries_magnitudes_and_says_which(catalogue):
    reading = numcheck.read("29,31,5[x],8,20")
    from dataclasses import replace
    floating = replace(reading, floating=True)
    result = restore(floating)
    assert result.best.value == MONTH
    assert result.best.scale == -4
    assert any("magnitude" in r for r in result.best.reasons)
    assert any("RESTORE_FLOAT_FIRST_PLACE" in n for n in result.notes)
    lo, hi = limits.RESTORE_FLOAT_FIRST_PLACE
    assert result.space == 10 * (hi - lo + 1)


def test_undamaged_number_has_one_reading():
    result = restore("29;31,50,8,20", use_catalogue=False)
    assert result.space == 1
    assert len(result.candidates) == 1
    assert result.best.probability == pytest.approx(1.0)
    assert any("Nothing is lost" in n for n in result.notes)


def test_wide_space_without_evidence_lists_the_prior_favourites_and_says_what_would_narrow_it():
    result = restore("[x],[x],[x],[x],[x],[x],[x],[x]", use_catalogue=False, top=5)
    assert result.space == 60**8
    assert len(result.candidates) == 5
    assert result.unmatched_mass == pytest.approx(1.0)
    assert any("would narrow it" in n for n in result.notes)
    # Round values first (the simplicity prior): empty places, but not an empty last place.
    assert result.best.value == 10
    assert result.best.text == "[0,0,0,0,0,0,0,10]"


def test_huge_space_with_catalogue_evidence_finds_the_matches(catalogue):
    result = restore("[x],[x],[x];[x],[x],[x],[x]", top=10)
    found = {c.value for c in result.candidates if c.evidence}
    assert {MONTH, SAROS, Fraction(4267), Fraction(2783, 225), Fraction(6940)} <= found


def test_broad_context_evidence_is_set_aside_with_a_note(monkeypatch):
    monkeypatch.setattr(limits, "RESTORE_MAX_MATCHES", 1000)
    ev = Evidence(Fraction(100000), Fraction(50000), label="a very loose scheme")
    result = restore("[x],[x],[x],[x]", context=[ev], use_catalogue=False, top=3)
    assert any("a very loose scheme" in n and "set aside" in n for n in result.notes)


def test_search_step_limit_is_an_error_not_a_hang(monkeypatch):
    monkeypatch.setattr(limits, "RESTORE_MAX_NODES", 3)
    ev = Evidence(Fraction(12345), Fraction(0), label="an exact value")
    with pytest.raises(LimitError, match="RESTORE_MAX_NODES"):
        restore("[x],[x],[x],[x],[x]", context=[ev], use_catalogue=False)


def test_impossible_evidence_is_said():
    result = restore("5[x]", expect="40", use_catalogue=False)
    assert any("No reading the traces allow agrees with the expected value 40" in n for n in result.notes)
    assert result.unmatched_mass == pytest.approx(1.0)


def test_bad_top_is_a_user_error():
    with pytest.raises(NumcheckError):
        restore("5[x]", top=0)
    with pytest.raises(LimitError, match="RESTORE_MAX_TOP"):
        restore("5[x]", top=limits.RESTORE_MAX_TOP + 1)


def test_to_dict_has_the_design_fields(catalogue):
    out = restore("29;31,5[x],8,20", top=3).to_dict()
    assert out["space"] == 10
    first = out["candidates"][0]
    assert first["text"] == "29;31,5[0],8,20"
    assert first["value"] == "765433/25920"
    assert isinstance(first["probability"], float)
    assert isinstance(first["reasons"], list) and first["reasons"]
    assert "suggestion" in out and "not readings" in out["suggestion"]


@pytest.mark.parametrize("text,targets", [
    ("29;31,5[x],8,20", [(MONTH, None, 1.0, "catalogue")]),
    ("29;31,[4]0,8,2[x]", [(MONTH, None, 1.0, "catalogue"), (MONTH + Fraction(1, 60**3), None, 0.5, "catalogue")]),
    ("͵ϛφπ[.] γʹ", [(SAROS, None, 1.0, "catalogue"), (SAROS - 1, None, 0.7, "catalogue")]),
    ("floating 5,[x]", [(Fraction(5, 60), None, 1.0, "catalogue"), (Fraction(5 * 60 + 7), Fraction(1), 1.0, None)]),
    ("29;31,5?,8,2[x]", [(MONTH, None, 1.0, "catalogue")]),
    ("[x]2;2[x],8", [(Fraction(2783, 225), Fraction(1, 60), 2.0, None)]),
])
def test_search_and_closed_form_agree_with_brute_force(monkeypatch, text, targets):
    cat = [(f"t{i}", v, None, f"target {i}") for i, (v, tol, w, g) in enumerate(targets) if g]
    monkeypatch.setattr(evidence_mod, "catalogue_source", lambda: stand_in(cat, weights=[
        w for (v, tol, w, g) in targets if g]))
    context = [Evidence(v, tol, w, f"context {i}") for i, (v, tol, w, g) in enumerate(targets) if not g]
    if text.startswith("floating "):
        from dataclasses import replace
        reading = replace(numcheck.read(text.split(" ", 1)[1]), floating=True)
    else:
        reading = numcheck.read(text)
    space_count = build_space(reading).count
    result = restore(reading, context=context, top=space_count)
    exact = [t for t in targets if not t[3]] + [t for t in targets if t[3]]
    rows, unmatched = brute_force(reading, exact)
    expected = sorted((p for _, p in rows), reverse=True)
    got = [c.probability for c in result.candidates]
    assert len(got) == min(len(rows), space_count)
    assert got == pytest.approx(expected[:len(got)], rel=1e-9, abs=1e-15)
    assert result.unmatched_mass == pytest.approx(unmatched, rel=1e-9, abs=1e-15)
    assert sum(got) == pytest.approx(1.0)


# -- properties -------------------------------------------------------------

_place = st.integers(0, 59)


@st.composite
def damaged(draw):
    """A sexagesimal number with 2-5 places, some lost, some partly lost, some doubtful."""
    n = draw(st.integers(2, 5))
    digits = draw(st.lists(_place, min_size=n, max_size=n))
    marks = draw(st.lists(st.sampled_from(["read", "lost", "tens", "units", "doubt", "editor"]),
                          min_size=n, max_size=n))
    if all(m == "read" for m in marks):
        marks[draw(st.integers(0, n - 1))] = "lost"
    parts = []
    for d, m in zip(digits, marks):
        tens, units = divmod(d, 10)
        if m == "read":
            parts.append(str(d))
        elif m == "lost":
            parts.append("[x]")
        elif m == "tens":
            parts.append(f"[x]{units}" if tens else f"[x]{units}")
        elif m == "units":
            parts.append(f"{tens}[x]" if tens else "[x]")
        elif m == "doubt":
            parts.append(f"{d}?")
        else:
            wrong = (d + draw(st.integers(1, 59))) % 60
            parts.append(f"[{wrong}]")
    # At least two whole places: a lone whole place may be written in decimal beyond 59
    # (365;14,48), so its lost digits would follow other rules.
    split = draw(st.integers(2, n))
    text = ",".join(parts[:split]) + (";" + ",".join(parts[split:]) if split < n else "")
    whole = Fraction(0)
    for i, d in enumerate(digits):
        whole += Fraction(d) * Fraction(60) ** (split - 1 - i)
    return text, whole, "editor" in marks


@given(damaged())
def test_probabilities_are_in_range_non_increasing_and_sum_to_at_most_one(case):
    text, _, _ = case
    result = restore(text, use_catalogue=False, top=8)
    probs = [c.probability for c in result.candidates]
    assert all(0.0 <= p <= 1.0 for p in probs)
    assert all(a >= b for a, b in zip(probs, probs[1:]))
    assert sum(probs) <= 1.0 + 1e-9
    assert 0.0 <= result.unmatched_mass <= 1.0 + 1e-9


@given(damaged())
def test_same_input_same_ranking(case):
    text, true, _ = case
    ev = [Evidence(true, Fraction(0), 1.0, "the true value")]
    a = restore(text, context=ev, use_catalogue=False, top=6)
    b = restore(text, context=ev, use_catalogue=False, top=6)
    assert [(c.text, c.value, c.probability) for c in a.candidates] == \
           [(c.text, c.value, c.probability) for c in b.candidates]


@given(damaged())
def test_catalogue_value_the_damage_allows_ranks_first(monkeypatch_module, case):
    text, true, _ = case
    monkeypatch_module.setattr(evidence_mod, "catalogue_source",
                               lambda: stand_in([("true", true, None, "the value")]))
    result = restore(text, top=3)
    assert result.best.value == true
    assert result.best.evidence == ("true",)


@given(damaged().filter(lambda c: c[2]))
def test_wrong_editor_restoration_is_outranked_by_the_right_one(monkeypatch_module, case):
    text, true, _ = case
    monkeypatch_module.setattr(evidence_mod, "catalogue_source",
                               lambda: stand_in([("true", true, None, "the value")]))
    result = restore(text, top=50)
    assert result.best.value == true and not result.best.editor
    editors = [c for c in result.candidates if c.editor]
    for c in editors:
        assert c.probability < result.best.probability


@pytest.fixture(scope="module")
def monkeypatch_module():
    mp = pytest.MonkeyPatch()
    yield mp
    mp.undo()


def test_published_values_in_the_stand_in_are_exact():
    # The stand-in must hold the published values exactly (see the sources in PUBLISHED).
    values = {i: v for i, v, _, _ in PUBLISHED}
    assert values["month_sysB"] == 29 + Fraction(31, 60) + Fraction(50, 60**2) + Fraction(8, 60**3) + Fraction(20, 60**4)
    assert values["saros_days"] == 1 * 3600 + 49 * 60 + 45 + Fraction(20, 60)
    assert values["year_sysA"] == 12 + Fraction(22, 60) + Fraction(8, 3600)


@given(damaged(), st.integers(-3, 3), st.integers(0, 2), st.floats(0.1, 5.0))
def test_search_agrees_with_brute_force_on_random_damage(case, offset, tol_steps, weight):
    """The branch and bound misses no agreeing reading, and the closed form is exact."""
    text, true, _ = case
    reading = numcheck.read(text)
    size = build_space(reading).count      # doubtful digits' alternatives included
    if size > 3600:
        return
    ulp = reading.ulp
    target = true + offset * ulp
    ev = Evidence(target, tol_steps * ulp, weight, "a scheme")
    result = restore(reading, context=[ev], use_catalogue=False, top=size)
    assert result.space == size
    rows, unmatched = brute_force(reading, [(target, tol_steps * ulp, weight, None)])
    expected = sorted((p for _, p in rows), reverse=True)
    got = [c.probability for c in result.candidates]
    assert got == pytest.approx(expected, rel=1e-9, abs=1e-15)
    assert result.unmatched_mass == pytest.approx(unmatched, rel=1e-9, abs=1e-15)


def test_beyond_int64_the_search_stays_exact():
    # 60**12 readings: values past 2**62 are searched with python integers.
    text = ",".join(["[x]"] * 12)
    true = sum(Fraction(d) * 60**i for i, d in enumerate([7, 0, 59, 1, 30, 2, 45, 3, 11, 4, 58, 5]))
    result = restore(text, context=[Evidence(true, Fraction(0), 1.0, "a known value")],
                     use_catalogue=False, top=3)
    assert result.space == 60**12
    assert result.best.value == true
    assert result.best.probability == pytest.approx(0.5, rel=1e-6)


def test_too_many_catalogue_values_keeps_the_strongest_and_says_so(catalogue, monkeypatch):
    monkeypatch.setattr(limits, "RESTORE_MAX_MATCHES", 3)
    result = restore("[x],[x],[x];[x],[x],[x],[x]", top=5)
    assert any("only the" in n and "RESTORE_MAX_MATCHES" in n for n in result.notes)
    weighed = {c.value for c in result.candidates if c.evidence}
    assert 0 < len(weighed) <= 3


@given(st.integers(-500, 500), st.integers(1, 7), st.integers(1, 40), st.integers(1, 5),
       st.integers(-30, 30), st.integers(0, 60))
def test_kernel_mass_closed_form_equals_the_sum(cn, cd, tn, td, start, length):
    from numcheck.restore import scoring
    from numcheck.restore.search import kernel_mass

    centre, tol = Fraction(cn, cd), Fraction(tn, td)
    lo = math.ceil(centre - tol) + max(0, start)
    hi = min(math.floor(centre + tol), lo + length)
    brute = sum(scoring.kernel(float(abs(V - centre)), float(tol)) for V in range(lo, hi + 1))
    assert kernel_mass(lo, hi, cn, cd, tol) == pytest.approx(brute, abs=1e-9)


def test_a_damaged_expected_value_accepts_any_of_its_readings():
    result = restore("2[x];30", expect="2[x];3[x]", use_catalogue=False, top=10)
    assert "any of its readings" in result.best.reasons[0]
    assert all(c.evidence == ("expect",) for c in result.candidates)
