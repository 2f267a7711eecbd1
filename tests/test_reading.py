"""The Reading model, independent of any notation."""

from fractions import Fraction as F

from numcheck.reading import Reading, Slot, Status, decimal_text, exact_text, sexagesimal_text


def _slot(values, place, status=Status.READ, **kw):
    return Slot(values=tuple(F(v) for v in values), place=place, status=status, **kw)


def test_value_min_max_count_of_a_hand_built_reading():
    r = Reading(text="", notation="test", slots=(
        _slot([1], 1), _slot(range(60), 0, Status.LOST), _slot([30], -1)))
    assert r.value == F(60) + F(1, 2)
    assert (r.min, r.max, r.count) == (F(60) + F(1, 2), F(119) + F(1, 2), 60)
    assert r.ulp == F(1, 60) and r.last_place == -1


def test_negative_reading_swaps_bounds():
    r = Reading(text="", notation="test", sign=-1, slots=(_slot([1, 2], 0, Status.LOST),))
    assert (r.min, r.max, r.value) == (F(-2), F(-1), F(-1))


def test_editor_restoration_is_the_value_but_not_the_only_reading():
    r = Reading(text="", notation="test", slots=(_slot(range(60), 0, Status.RESTORED, editor=F(5)),))
    assert r.value == 5 and r.count == 60 and r.min == 0


def test_gap_expansion_counts():
    gap = _slot(range(60), 0, Status.LOST, gap=(1, 2))
    r = Reading(text="", notation="test", slots=(_slot([1], 1), gap))
    sizes = [len(e.slots) for e in r.expansions()]
    assert sizes == [2, 3]
    assert r.count == 60 + 3600


def test_to_dict_has_the_design_fields_as_exact_strings():
    r = Reading(text="", notation="test", slots=(_slot([6585], 0), _slot([20], -1)))
    d = r.to_dict()
    for key in ("value", "decimal", "sexagesimal", "notation", "damaged", "min", "max", "floating"):
        assert key in d
    assert d["value"] == d["min"] == d["max"] == "19756/3"
    assert d["sexagesimal"] == "1,49,45;20"
    assert d["damaged"] is False and d["floating"] is False


def test_text_helpers():
    assert exact_text(F(6585)) == "6585"
    assert exact_text(F(-1, 2)) == "-1/2"
    assert decimal_text(F(1, 3), 4) == "0.3333"
    assert decimal_text(F(-1, 2)) == "-0.5"
    assert sexagesimal_text(F(1, 7), max_places=3) == "0;8,34,17..."
    assert sexagesimal_text(F(100), fixed=False) == "1,40"
