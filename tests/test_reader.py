"""``read``: normalisation, limits, choosing the notation, quantities and ``unit=``."""

import json
import unicodedata
from fractions import Fraction as F

import pytest

from numcheck import LimitError, NumcheckError, UnknownNameError, read
from numcheck import limits
from numcheck.cli import main


def test_nfc_normalisation_before_reading():
    decomposed = unicodedata.normalize("NFD", "X\u1eca")
    reading = read(decomposed, notation="roman")
    assert reading.text == "X\u1eca"


def test_surrounding_spaces_are_dropped():
    assert read("  1,40  ", notation="cuneiform").text == "1,40"


def test_text_longer_than_the_limit(monkeypatch):
    monkeypatch.setattr(limits, "MAX_TEXT_LENGTH", 10)
    with pytest.raises(LimitError, match="MAX_TEXT_LENGTH"):
        read("1," * 10 + "1")


def test_not_a_text():
    with pytest.raises(NumcheckError, match="Expected a text"):
        read(1640)


def test_unknown_notation_suggests():
    with pytest.raises(UnknownNameError, match="Did you mean 'roman'"):
        read("XII", notation="romn")


def test_detected_notation_is_reported():
    reading = read("1,49,45;20")
    assert reading.detected is not None and reading.detected.startswith("sexagesimal")
    assert read("1,49,45;20", notation="sexagesimal").detected is None


def test_notation_given_reads_each_number_of_a_quantity():
    assert read("1,40 UŠ", notation="cuneiform").floating
    assert not read("1,40 UŠ").floating


def test_quantity_notation_by_name():
    assert read("2 bēru 10 UŠ", notation="quantity").value == 70


def test_unit_words_make_a_quantity():
    reading = read("6585 1/3 days")
    assert reading.notation == "quantity" and reading.unit == "days"
    assert reading.value == F(19756, 3)
    assert reading.detected.startswith("quantity")


def test_unit_converts_or_names():
    assert read("3 signs 12;30°", unit="signs").value == F(41, 12)
    assert read("1,0", unit="days").unit == "days"


def test_unknown_unit():
    with pytest.raises(UnknownNameError, match="Unknown unit 'parsecs'"):
        read("12", unit="parsecs")


def test_incompatible_units():
    with pytest.raises(NumcheckError, match="arc is not a time"):
        read("3 signs", unit="days")


def run_cli(capsys, *argv):
    code = main(list(argv))
    out, err = capsys.readouterr()
    return code, out, err


@pytest.mark.parametrize("argv,value,extra", [
    (("read", "𒐏𒐉", "--notation", "cuneiform", "--json"), "44", {"floating": True}),
    (("read", "MDCLXVI", "--notation", "roman", "--json"), "1666", {"notation": "roman"}),
    (("read", "شسه", "--notation", "abjad", "--json"), "365", {"notation": "abjad"}),
    (("read", "3 signs 12;30°", "--json"), "205/2", {"unit": "degrees", "sexagesimal": "1,42;30"}),
    (("read", "2 bēru 10 UŠ", "--unit", "hours", "--json"), "14/3", {"unit": "hours"}),
])
def test_cli_json(capsys, argv, value, extra):
    code, out, _ = run_cli(capsys, *argv)
    assert code == 0
    data = json.loads(out)
    assert data["value"] == value
    for key, expected in extra.items():
        assert data[key] == expected


def test_cli_table_for_roman(capsys):
    code, out, _ = run_cli(capsys, "read", "MDCLXVI", "--notation", "roman")
    assert code == 0
    assert "1666" in out and "roman" in out


def test_cli_unknown_unit_exits_2(capsys):
    code, out, err = run_cli(capsys, "read", "6585 days", "--unit", "dayz")
    assert code == 2
    assert "Did you mean 'days'" in err + out
    assert "Traceback" not in err + out
