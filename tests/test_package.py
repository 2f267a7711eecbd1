"""The package as installed: the front door, the grammars, the doctests."""

import doctest
import importlib
from pathlib import Path

import pytest

import numcheck
from numcheck.notations.grammars import grammar_dir


def test_front_door_is_pinned():
    assert numcheck.__all__ == [
        "read", "identify", "restore", "audit", "relate", "interval", "annotate",
        "Reading", "Slot", "Status",
        "NumcheckError", "NumcheckSyntaxError", "NumcheckRangeError", "UnknownNameError",
        "LimitError", "NumcheckWarning",
    ]


def test_errors_are_value_errors():
    assert issubclass(numcheck.NumcheckError, ValueError)
    for name in ("NumcheckSyntaxError", "NumcheckRangeError", "UnknownNameError", "LimitError"):
        assert issubclass(getattr(numcheck, name), numcheck.NumcheckError)


def test_grammars_are_found_and_ship_inside_an_installed_package():
    folder = grammar_dir()
    assert (folder / "common.lark").is_file() and (folder / "sexagesimal.lark").is_file()
    package = Path(numcheck.__file__).resolve().parent
    if "site-packages" in str(package):  # a non-editable install (as in CI)
        assert folder.resolve() == (package / "grammars").resolve()


MODULES = ["numcheck.reading", "numcheck.errors", "numcheck.reader", "numcheck.notations.detect",
           "numcheck.notations.marks"]


@pytest.mark.parametrize("name", MODULES)
def test_doctests(name):
    result = doctest.testmod(importlib.import_module(name), optionflags=doctest.ELLIPSIS)
    assert result.failed == 0


@pytest.mark.parametrize("name", ["identify", "restore", "audit"])
def test_front_door_functions_stay_callable_after_their_package_is_imported(name):
    importlib.import_module(f"numcheck.{name}")
    assert callable(getattr(numcheck, name))
    assert callable(importlib.import_module(f"numcheck.{name}"))


def test_restore_through_the_front_door_twice():
    first = numcheck.restore("29;31,5[x],8,20", unit="days")
    second = numcheck.restore("29;31,5[x],8,20", unit="days")
    assert first.to_dict() == second.to_dict()
    assert first.candidates[0].text == "29;31,5[0],8,20"
