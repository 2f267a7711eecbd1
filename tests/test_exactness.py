"""Exactness: no float in an exact field of any command's JSON.

Exact fields (DESIGN.md, "JSON fields that other tools rely on") are strings
of an integer or a ratio (``"6585"``, ``"19756/3"``), or JSON integers for
counts and day numbers.  A float there would lose what the scribe computed.
Floats are allowed only in the fields meant for display and scores
(``probability``, ``score``, ``support``, ``*_decimal`` ...).  This walks the
``--json`` output of every command and fails on a float in an exact field,
and on an exact-value field whose string is not an integer or a ratio.
"""

from __future__ import annotations

import contextlib
import importlib.util
import io
import json
import re
import warnings
from pathlib import Path

import pytest
from hypothesis import given
from hypothesis import strategies as st

import numcheck
from numcheck.cli import main
from numcheck.errors import NumcheckError

DEMO = Path(__file__).resolve().parents[1] / "numcheck" / "data" / "demo"

#: Fields that hold an exact number: never a float.
EXACT = {
    "value", "min", "max", "factor", "residual", "expected", "written", "written_value",
    "expected_value", "days", "jd", "span_days", "residual_days", "residual_days_exact",
    "residual_degrees", "period_days", "worst_degrees", "julian_years", "year_days", "unit_days",
    "n", "nearest", "scale", "space", "count", "row", "difference",
}
#: Of those, the ones whose strings must be an integer or a ratio (the others
#: may be text in the cell's own notation, as ``expected``, or a decimal for
#: display, as relate's ``residual_days`` beside ``residual_days_exact``).
RATIO = {"value", "min", "max", "factor", "residual", "written_value", "expected_value",
         "span_days", "residual_days_exact", "period_days", "julian_years", "year_days", "unit_days"}
#: Paths (joined keys) where these names mean something else (text for people).
NOT_NUMBERS = {"equivalents.jd", "entries.value_as_attested", "catalogue.value"}
_RATIO = re.compile(r"-?\d+(/\d+)?")


def violations(obj, path=()) -> list[str]:
    """Every float in an exact field of *obj*, and every exact-value string that is not a ratio."""
    found = []
    if isinstance(obj, dict):
        for key, value in obj.items():
            found += violations(value, path + (str(key),))
    elif isinstance(obj, list):
        for item in obj:
            found += violations(item, path)
    elif path:
        key = path[-1]
        where = ".".join(path)
        if key not in EXACT or any(where.endswith(p) for p in NOT_NUMBERS):
            return found
        if isinstance(obj, float):
            found.append(f"{where} = {obj!r} (a float in an exact field)")
        elif key in RATIO and isinstance(obj, str) and not _RATIO.fullmatch(obj):
            found.append(f"{where} = {obj!r} (not an integer or a ratio)")
    return found


def test_the_walker_finds_floats():
    assert violations({"matches": [{"value": 1.5, "score": 0.3}]}) == [
        "matches.value = 1.5 (a float in an exact field)"]
    assert violations({"value": "1;30"}) == ["value = '1;30' (not an integer or a ratio)"]
    assert violations({"value": "19756/3", "probability": 0.5, "days": 3}) == []


COMMANDS = {
    "read sexagesimal": ["read", "29;31,5[x],8,20"],
    "read greek": ["read", "ϛφπ[.] γʹ"],
    "read cuneiform": ["read", "3,4[x]"],
    "read roman": ["read", "CCXXX[.]"],
    "read abjad": ["read", "ل [.]ه"],
    "read attic": ["read", "Χ[.]ΗΔΔΙΙ"],
    "read quantity": ["read", "3 signs 1[x];30°", "--unit", "degrees"],
    "identify": ["identify", "1,49,45;20", "--unit", "days"],
    "identify floating": ["identify", "29,31,50,8,20"],
    "identify no match": ["identify", "7,7,7;7,7"],
    "identify damaged": ["identify", "6,3[x]"],
    "restore": ["restore", "29;31,5[x],8,20", "--unit", "days"],
    "restore greek": ["restore", "ϛφπ[.] γʹ", "--unit", "days"],
    "restore expect": ["restore", "1,[x];30", "--expect", "1,5;30"],
    "audit": ["audit", str(DEMO / "ephemeris.tsv")],
    "audit tei": ["audit", str(DEMO / "papyrus.xml")],
    "relate": ["relate", "19", "--unit", "years"],
    "relate days": ["relate", "6585", "--unit", "days"],
    "relate search": ["relate", "--search", "venus", "--max-years", "300"],
    "interval": ["interval", "747 BC Feb 26", "Philip 1 Thoth 1"],
    "annotate": ["annotate", str(DEMO / "papyrus.xml"), "-k", "3"],
    "catalogue": ["catalogue", "--body", "moon"],
}


def _json(argv: list[str]) -> dict:
    out = io.StringIO()
    with contextlib.redirect_stdout(out), contextlib.redirect_stderr(io.StringIO()):
        with warnings.catch_warnings():
            warnings.simplefilter("ignore")
            code = main(argv + ["--json"])
    assert code == 0, out.getvalue()[:500]
    return json.loads(out.getvalue())


@pytest.mark.parametrize("label", sorted(COMMANDS))
def test_no_float_in_an_exact_field(label):
    result = _json(COMMANDS[label])
    assert _unknown(violations(result)) == []


def _unknown(found: list[str]) -> list[str]:
    return found


def test_identify_nearest_residual_is_exact():
    result = _json(COMMANDS["identify no match"])
    assert result["nearest"] and violations(result) == []
    assert all(isinstance(n["residual_decimal"], float) for n in result["nearest"])


def test_demo_files_have_no_float_in_an_exact_field(tmp_path):
    result = _json(["demo", "-o", str(tmp_path / "out")])
    assert violations(result) == []
    for path in sorted((tmp_path / "out").glob("*.json")):
        assert violations(json.loads(path.read_text(encoding="utf-8"))) == [], path.name


# Random numbers of every notation through the library's results too.
_spec = importlib.util.spec_from_file_location(
    "numcheck_fuzz", Path(__file__).resolve().parents[1] / "benchmarks" / "fuzz.py")
fuzz = importlib.util.module_from_spec(_spec)
_spec.loader.exec_module(fuzz)


@given(st.sampled_from(sorted(fuzz.SEEDS)).flatmap(lambda n: st.sampled_from(fuzz.SEEDS[n])),
       st.sampled_from(["read", "identify", "restore"]))
def test_no_float_in_exact_fields_of_random_results(text, what):
    fn = {"read": numcheck.read, "identify": numcheck.identify,
          "restore": lambda t: numcheck.restore(t, top=3, use_catalogue=False)}[what]
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        try:
            result = fn(text).to_dict()
        except NumcheckError:
            return
    assert _unknown(violations(result)) == []
