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


# ---- the layout: one package per concern (DEVELOPERS.md, "Layout") --------

PACKAGE = Path(numcheck.__file__).parent


def test_the_package_root_holds_few_modules():
    modules = sorted(p.name for p in PACKAGE.glob("*.py"))
    assert len(modules) <= 14, modules


def test_no_family_of_prefix_named_modules_at_any_level():
    # calendars_x.py, calendars_y.py, calendars_z.py belong in a package calendars/.
    for folder in [PACKAGE, *(p for p in PACKAGE.iterdir() if (p / "__init__.py").is_file())]:
        stems = [p.stem for p in folder.glob("*.py") if not p.stem.startswith("_")]
        for stem in stems:
            family = [s for s in stems if s.startswith(stem + "_")]
            assert len(family) < 2, (folder.name, stem, family)


def test_the_core_imports_no_command_line_and_no_display_library():
    import ast

    core = [p for p in PACKAGE.rglob("*.py")
            if not {"commands", "report"} & set(p.relative_to(PACKAGE).parts)
            and p.name not in ("cli.py", "demo.py", "batch.py")]
    for path in core:
        tree = ast.parse(path.read_text(encoding="utf-8"))
        for node in ast.walk(tree):
            names = ([a.name for a in node.names] if isinstance(node, ast.Import) else
                     [node.module or ""] if isinstance(node, ast.ImportFrom) else [])
            for name in names:
                top = name.split(".")[0]
                assert top not in ("rich", "matplotlib"), (path, name)
                assert not (isinstance(node, ast.ImportFrom) and node.level and
                            name.split(".")[0] in ("commands", "cli", "report")), (path, name)
