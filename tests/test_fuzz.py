"""Fuzzing of every entry point under the bounded CI profile: only NumcheckError may escape.

Scholars paste anything.  Whatever text, table, XML file or command line
numcheck is given, it must answer with a result or a
:class:`~numcheck.errors.NumcheckError` (exit 2 at the command line), never
with another exception (exit 1).  The numbers mutated here are those of
``benchmarks/fuzz.py`` (its ``SEEDS``), which runs the same entry points on
10^5 inputs; the hypothesis profile of ``tests/conftest.py`` keeps this part
of the suite short (``NUMCHECK_HYPOTHESIS_PROFILE=long`` for a longer run).

Two kinds of strategy: for ``read`` (and ``relate``) explicit ones (random text, edits of a
valid number, damage marks), and for the structured inputs (tables, XML,
command lines) the generators of ``benchmarks/fuzz.py`` driven by a
hypothesis ``randoms()`` source, so that hypothesis chooses (and shrinks)
every random decision.
"""

from __future__ import annotations

import importlib.util
import tempfile
import unicodedata
import warnings
from pathlib import Path

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

import numcheck
from numcheck.errors import NumcheckError

_spec = importlib.util.spec_from_file_location(
    "numcheck_fuzz", Path(__file__).resolve().parents[1] / "benchmarks" / "fuzz.py")
fuzz = importlib.util.module_from_spec(_spec)
_spec.loader.exec_module(fuzz)

NOTATIONS = sorted(numcheck.reader.NOTATIONS)
# The profile's number of examples, and a share of it for the slower entry points.
EXAMPLES = settings.default.max_examples


def _share(fraction: float) -> settings:
    return settings(max_examples=max(10, int(EXAMPLES * fraction)))


def _quiet(fn, *args, **kwargs):
    """Call *fn*; a NumcheckError is an answer, warnings are allowed, anything else fails."""
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        try:
            return fn(*args, **kwargs)
        except NumcheckError:
            return None


# -- strategies for texts --------------------------------------------------

chars = st.one_of(
    st.sampled_from(fuzz.ALPHABET),
    st.characters(min_codepoint=0x20, max_codepoint=0x3000),
    st.characters(min_codepoint=0x10000, max_codepoint=0x12480),
)
random_text = st.text(chars, max_size=16)
notation_or_none = st.one_of(st.none(), st.sampled_from(NOTATIONS))


@st.composite
def edited(draw, notation: str | None = None):
    """A valid number of *notation* (any when None) with a few random edits."""
    name = notation or draw(st.sampled_from(sorted(fuzz.SEEDS)))
    text = draw(st.sampled_from(fuzz.SEEDS[name]))
    for _ in range(draw(st.integers(0, 3))):
        i = draw(st.integers(0, len(text)))
        op = draw(st.sampled_from(["insert", "delete", "replace", "mark", "wrap", "double", "nf"]))
        if op == "insert":
            text = text[:i] + draw(chars) + text[i:]
        elif op == "delete":
            text = text[:i] + text[i + 1:]
        elif op == "replace":
            text = text[:i] + draw(chars) + text[i + 1:]
        elif op == "mark":
            text = text[:i] + draw(st.sampled_from(fuzz.MARKS)) + text[i:]
        elif op == "wrap":
            j = draw(st.integers(i, len(text)))
            left, right = draw(st.sampled_from([("[", "]"), ("<", ">"), ("{", "}"), ("[", ""), ("", "]")]))
            text = text[:i] + left + text[i:j] + right + text[j:]
        elif op == "double":
            j = draw(st.integers(i, len(text)))
            text = text[:j] + text[i:j] + text[j:]
        else:
            text = unicodedata.normalize(draw(st.sampled_from(["NFD", "NFKD", "NFKC"])), text)
    return text


@st.composite
def damaged(draw, notation: str):
    """A valid number of *notation* with some of its characters lost, unread or doubtful."""
    text = draw(st.sampled_from(fuzz.SEEDS[notation]))
    out = []
    for ch in text:
        mark = draw(st.sampled_from(["", "", "", "lost", "x", "doubt", "dot"]))
        if mark == "lost" and not ch.isspace():
            out.append(f"[{ch}]")
        elif mark == "x" and ch.isalnum():
            out.append(draw(st.sampled_from(["x", "[x]", "[.]", "."])))
        elif mark == "doubt":
            out.append(ch + "?")
        elif mark == "dot":
            out.append(ch + "\u0323")
        else:
            out.append(ch)
    return "".join(out)


# -- read ------------------------------------------------------------------

@given(random_text, notation_or_none)
def test_read_random_text(text, notation):
    reading = _quiet(numcheck.read, text, notation=notation)
    if reading is not None:
        reading.to_dict()


@pytest.mark.parametrize("notation", sorted(fuzz.SEEDS))
@given(data=st.data())
def test_read_edits_of_valid_numbers(notation, data):
    text = data.draw(edited(notation))
    as_what = data.draw(st.sampled_from([None, notation]))
    reading = _quiet(numcheck.read, text, notation=as_what)
    if reading is not None:
        reading.to_dict()
        reading.min <= reading.value <= reading.max or pytest.fail(f"value outside min..max for {text!r}")


@pytest.mark.parametrize("notation", sorted(fuzz.SEEDS))
@given(data=st.data())
def test_read_damage_marks(notation, data):
    text = data.draw(damaged(notation))
    reading = _quiet(numcheck.read, text, notation=notation)
    if reading is not None:
        assert reading.min <= reading.value <= reading.max, text
        reading.to_dict()


@pytest.mark.parametrize("notation", sorted(n for n in fuzz.SEEDS if n != "quantity"))
@given(data=st.data())
def test_written_back_reads_the_same(notation, data):
    """A reading written back in its notation (marks included) reads to the same values."""
    from numcheck.notations import format_reading, render_choice

    text = data.draw(st.one_of(damaged(notation), edited(notation)))
    reading = _quiet(numcheck.read, text, notation=notation)
    if reading is None:
        return
    written = format_reading(reading)
    again = _quiet(numcheck.read, written, notation=notation)
    assert again is not None, (text, written)
    assert (again.value, again.min, again.max, again.count) == \
        (reading.value, reading.min, reading.max, reading.count), (text, written)
    for _, (expansion, choice) in zip(range(3), reading.choices()):
        render_choice(expansion, choice)


@given(edited(), st.sampled_from(fuzz.UNITS))
def test_read_with_a_unit(text, unit):
    _quiet(numcheck.read, text, unit=unit)


# -- identify and restore ------------------------------------------------------

@_share(0.5)
@given(st.one_of(edited(), random_text), notation_or_none, st.sampled_from(fuzz.UNITS))
def test_identify(text, notation, unit):
    result = _quiet(numcheck.identify, text, notation=notation, unit=unit, top=3)
    if result is not None:
        result.to_dict()


@_share(0.5)
@given(st.one_of(edited(), random_text), notation_or_none, st.booleans())
def test_restore(text, notation, use_catalogue):
    result = _quiet(numcheck.restore, text, notation=notation, top=3, use_catalogue=use_catalogue)
    if result is not None:
        d = result.to_dict()
        assert sum(c["probability"] for c in d["candidates"]) <= 1 + 1e-9


# -- relate and interval ------------------------------------------------------------

@given(st.randoms(use_true_random=False))
def test_relate(rng):
    _quiet(fuzz.call_relate, rng)


@given(st.randoms(use_true_random=False))
def test_interval(rng):
    _quiet(fuzz.call_interval, rng)


@given(st.one_of(st.text(max_size=12), st.floats(), st.integers(), st.fractions()),
       st.sampled_from(["years", "months", "days"]))
def test_relate_any_number(n, unit):
    _quiet(numcheck.relate, n, unit)


# -- audit -------------------------------------------------------------------

@_share(1.0)
@given(st.randoms(use_true_random=False))
def test_audit_random_dataframes(rng):
    _quiet(fuzz.call_audit_frame, rng)


@_share(1.0)
@given(st.randoms(use_true_random=False))
def test_audit_damaged_scheme_tables(rng):
    """Windows of a real scheme table (the demo ephemeris) with random damage and slips."""
    _quiet(fuzz.call_audit_scheme, rng)


@_share(1.0)
@given(st.randoms(use_true_random=False))
def test_audit_random_table_files(rng):
    with tempfile.TemporaryDirectory() as tmp:
        _quiet(fuzz.call_audit_file, rng, Path(tmp))


# -- annotate ----------------------------------------------------------------

@_share(1.0)
@given(st.randoms(use_true_random=False))
def test_annotate_random_xml(rng):
    with tempfile.TemporaryDirectory() as tmp:
        _quiet(fuzz.call_annotate, rng, Path(tmp))


@given(st.binary(max_size=200))
def test_annotate_random_bytes(data):
    from numcheck.tei import annotate_bytes
    _quiet(annotate_bytes, data)


# -- the command line ------------------------------------------------------------

@_share(1.0)
@given(st.randoms(use_true_random=False))
def test_cli_random_arguments(rng):
    """Exit 0 or 2, never 1 (an internal error), whatever the arguments."""
    with tempfile.TemporaryDirectory() as tmp:
        fuzz.call_cli(rng, Path(tmp))


# -- wrong types through the Python front door ----------------------------------------

anything = st.one_of(st.none(), st.booleans(), st.integers(-5, 10 ** 20), st.floats(), st.fractions(),
                     st.text(max_size=8), st.lists(st.integers(), max_size=2), st.binary(max_size=4))


@pytest.mark.parametrize("entry", ["read", "identify", "restore", "relate", "interval", "audit",
                                   "annotate"])
@given(data=st.data())
def test_wrong_types_are_numcheck_errors(entry, data):
    """A value of the wrong type for any argument is a NumcheckError, not a TypeError."""
    import pandas as pd

    frame = pd.DataFrame({"A": ["1", "2", "3"]}, dtype=object)
    calls = {
        "read": lambda a, b: numcheck.read(a if data.draw(st.booleans()) else "1,30",
                                           notation=b if data.draw(st.booleans()) else None,
                                           unit=data.draw(anything) if data.draw(st.booleans()) else None),
        "identify": lambda a, b: numcheck.identify("1,2[x]", unit=None, top=a),
        "restore": lambda a, b: numcheck.restore("1,2[x]", expect=a, top=3, use_catalogue=False),
        "relate": lambda a, b: numcheck.relate(a, b if data.draw(st.booleans()) else "days"),
        "interval": lambda a, b: numcheck.interval(a, "AD 1 Jan 1", calendar=b if data.draw(st.booleans())
                                                   else "julian"),
        "audit": lambda a, b: numcheck.audit(frame, columns=a, notation=b if data.draw(st.booleans()) else None),
        "annotate": lambda a, b: numcheck.annotate(a, None),
    }
    _quiet(calls[entry], data.draw(anything), data.draw(anything))
