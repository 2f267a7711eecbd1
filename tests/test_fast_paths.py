"""The fast paths give exactly what the slow ones give.

- A plain sexagesimal number (digits, ',' and ';') is read without the
  grammar (numcheck.notations.sexagesimal._plain): its Reading must be the
  very Reading the grammar builds, slot for slot, mark for mark.
- Compiled parsers are kept in a cache folder (numcheck.notations.grammars):
  a parser loaded from the cache must parse every text as a freshly
  compiled one, or fail at the same place.
- The catalogue is read with the csv module; its pandas frame must hold the
  same rows.
- The command line imports only the command it runs, and through a pipe
  writes its screens without rich.
- A Greek number of plain small letters is read without the general reader
  (numcheck.notations.greek.quick): the same Reading, slot for slot.
"""

from __future__ import annotations

import importlib.util
import ast
import subprocess
import sys
from dataclasses import replace
from pathlib import Path

import pytest
from hypothesis import given
from hypothesis import strategies as st

from numcheck import NumcheckError, catalogue, read
from numcheck.notations import grammars, sexagesimal
from numcheck.notations.grammars import build_parser, grammar_dir

_spec = importlib.util.spec_from_file_location(
    "numcheck_fuzz_seeds", Path(__file__).resolve().parents[1] / "benchmarks" / "fuzz.py")
_fuzz = importlib.util.module_from_spec(_spec)
_spec.loader.exec_module(_fuzz)
SEEDS = sorted({t for texts in _fuzz.SEEDS.values() for t in texts})


def _slow(text: str, *, floating: bool = False, notation: str = "sexagesimal"):
    tree = build_parser("sexagesimal").parse(text)
    return sexagesimal._build(text, tree, floating=floating, notation=notation)


# ---- plain sexagesimal numbers ---------------------------------------------

_place = st.integers(0, 59).map(str) | st.integers(0, 9).map(lambda d: f"0{d}")
_lone = st.integers(0, 10 ** 6 - 1).map(str)
_plain_text = st.builds(
    lambda sign, whole, frac: sign + ",".join(whole) + (";" + ",".join(frac) if frac else ""),
    st.sampled_from(["", "-"]),
    st.lists(_place, min_size=1, max_size=5) | st.lists(_lone, min_size=1, max_size=1),
    st.lists(_place, max_size=5),
)


@given(_plain_text, st.booleans())
def test_plain_numbers_read_as_the_grammar_reads_them(text, floating):
    notation = "cuneiform" if floating else "sexagesimal"
    fast = sexagesimal._plain(text, floating=floating, notation=notation)
    try:
        slow = _slow(text, floating=floating, notation=notation)
    except NumcheckError:       # a floating number has no decimal units place (100 is not a place)
        assert fast is None
        return
    assert fast is not None, text          # the fast path takes every plain number it can
    assert fast == slow


@given(st.text(alphabet="0123456789,;-", min_size=1, max_size=14), st.booleans())
def test_the_fast_path_declines_what_it_cannot_read_alone(text, floating):
    # Any string of these characters: the fast path either gives the grammar's
    # Reading or leaves the text to the grammar (which reads it or explains).
    fast = sexagesimal._plain(text, floating=floating, notation="sexagesimal")
    if fast is None:
        return
    assert fast == _slow(text, floating=floating)       # (the grammar would not raise here)


@pytest.mark.parametrize("text", ["1,49,45;20", "29;31,50,8,20", "6585", "365;14,48", "-0;30", "0"])
def test_everyday_numbers_take_the_fast_path(text):
    assert sexagesimal._plain(text, floating=False, notation="sexagesimal") is not None
    assert replace(read(text), detected=None) == _slow(text)


@pytest.mark.parametrize("text", ["1,60", "1;2,75", "1" * 41, "1, 49", "+1,0", "[1],2", "1,,2"])
def test_unusual_numbers_go_to_the_grammar(text):
    assert sexagesimal._plain(text, floating=False, notation="sexagesimal") is None


# ---- the parser cache ------------------------------------------------------

GRAMMARS = sorted(p.stem for p in grammar_dir().glob("*.lark") if p.stem != "common")


def _outcome(parser, text):
    try:
        return ("tree", parser.parse(text))
    except Exception as err:   # lark's own errors: compared by kind and place
        return ("error", type(err).__name__, getattr(err, "pos_in_stream", None))


@pytest.mark.parametrize("name", GRAMMARS)
def test_a_cached_parser_reads_as_a_fresh_one(name, tmp_path, monkeypatch):
    monkeypatch.setenv("NUMCHECK_CACHE", str(tmp_path))
    grammars.parser_for.cache_clear()
    try:
        first = grammars.parser_for(name)           # compiled, then stored
        stored = list(tmp_path.glob(f"{name}-*.lark-parser"))
        assert len(stored) == 1
        grammars.parser_for.cache_clear()
        cached = grammars.parser_for(name)          # loaded from the file
        assert cached is not first
        fresh = build_parser(name)
        for text in SEEDS:
            assert _outcome(cached, text) == _outcome(fresh, text), (name, text)
    finally:
        grammars.parser_for.cache_clear()


def test_a_damaged_cache_file_is_compiled_again(tmp_path, monkeypatch):
    monkeypatch.setenv("NUMCHECK_CACHE", str(tmp_path))
    grammars.parser_for.cache_clear()
    try:
        grammars.parser_for("roman")
        (path,) = tmp_path.glob("roman-*.lark-parser")
        path.write_bytes(b"not a parser")
        grammars.parser_for.cache_clear()
        parser = grammars.parser_for("roman")
        assert _outcome(parser, "XII") == _outcome(build_parser("roman"), "XII")
        assert path.read_bytes() != b"not a parser"          # replaced by a good one
    finally:
        grammars.parser_for.cache_clear()


def test_an_empty_setting_turns_the_cache_off(monkeypatch):
    monkeypatch.setenv("NUMCHECK_CACHE", "")
    from numcheck import cache

    assert cache.cache_dir() is None


# ---- the catalogue without pandas ------------------------------------------

def test_the_catalogue_rows_are_the_frame_rows():
    frame = catalogue.frame()
    rows = catalogue._rows()
    assert len(frame) == len(rows) == len(catalogue.entries())
    for record, row in zip(frame.to_dict("records"), rows):
        assert {c: record[c] for c in catalogue.COLUMNS} == row


# ---- the command line loads what it needs ----------------------------------

_PROBE = """
import sys
from numcheck.cli import main
main({argv!r})
heavy = [m for m in ("numpy", "pandas", "matplotlib", "lxml", "rich", "lark") if m in sys.modules]
others = [m for m in sys.modules if m.startswith("numcheck.commands.") and m != "numcheck.commands.{name}"]
print(repr((heavy, others)), file=sys.stderr)
"""


@pytest.mark.parametrize("argv,allowed", [
    (["read", "1,49,45;20", "--json"], []),
    (["identify", "1,49,45;20", "--unit", "days", "--json"], []),
    # The screens through a pipe (standard output is captured here) load no rich:
    (["read", "1,49,45;20"], []),
    (["read", "κθ λα ν η κ"], []),
    (["identify", "1,49,45;20", "--unit", "days"], []),
])
def test_a_command_imports_only_what_it_needs(argv, allowed):
    import os

    code = _PROBE.format(argv=argv, name=argv[0])
    env = {k: v for k, v in os.environ.items()
           if k not in ("FORCE_COLOR", "TTY_COMPATIBLE", "TTY_INTERACTIVE", "JUPYTER_COLUMNS")}
    proc = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, timeout=120,
                          env=env)
    assert proc.returncode == 0, proc.stderr
    heavy, others = ast.literal_eval(proc.stderr.strip().splitlines()[-1])
    assert [m for m in heavy if m not in allowed] == []
    assert others == []


# ---- identify's lookup without numpy ---------------------------------------

def _grid_candidates(tab, lo, hi):
    """The plain way: every item x every simple factor, one sorted list (as numcheck once did)."""
    from numcheck.identify.targets import SMALL_COUNT

    n_f = len(tab.simple)
    grid = []
    for i, item in enumerate(tab.items):
        small = item.value.denominator == 1 and item.value < SMALL_COUNT and not item.multiples
        for j, f in enumerate(tab.simple):
            if (small and f.denominator != 1) or (item.alone and f != 1):
                continue
            x = tab.values[i] * float(f)
            if lo <= x <= hi:
                grid.append((x, i * n_f + j))
    grid.sort()
    return ([k // n_f for _, k in grid], [tab.simple_num[k % n_f] for _, k in grid],
            [tab.simple_den[k % n_f] for _, k in grid])


@pytest.mark.parametrize("unit", [None, "days", "degrees", "months"])
@given(st.floats(-1e4, 1e6, allow_nan=False), st.floats(0, 0.05))
def test_identify_lookup_finds_what_the_full_grid_finds(unit, centre, width):
    from numcheck.identify import targets

    tab = targets.table(unit)
    lo, hi = centre - abs(centre) * width - 1e-9, centre + abs(centre) * width + 1e-9
    assert targets.candidates(tab, lo, hi, multiples=False) == _grid_candidates(tab, lo, hi)


# ---- Greek numbers without the LALR parser ---------------------------------

_GREEK_SIGNS = "αβγδεϛζηθικλμνξοπϙρστυφχψωϡΑΓΚΣ͵ʹ'’\u0305𐆊ō∠𐅵"


def _tokens(tree):
    return [(t.type, str(t), t.start_pos, t.end_pos, t.line, t.column, t.end_line, t.end_column)
            for t in tree.scan_values(lambda v: True)]


@given(st.lists(st.text(alphabet=_GREEK_SIGNS, min_size=1, max_size=4), min_size=1, max_size=5),
       st.sampled_from([" ", "  ", "\u00a0"]))
def test_a_plain_greek_number_gets_the_parsers_tree(groups, space):
    from numcheck.notations import greek

    text = space.join(groups)
    fast = greek._plain_tree(text)
    slow = build_parser("greek").parse(text)
    assert fast is not None
    assert fast == slow and _tokens(fast) == _tokens(slow)


@pytest.mark.parametrize("text", sorted(t for t in SEEDS if any("\u0370" <= c <= "\u03ff" for c in t)))
def test_greek_reads_the_same_with_and_without_the_parser(text, monkeypatch):
    import warnings

    from numcheck.notations import greek

    def outcome():
        with warnings.catch_warnings():
            warnings.simplefilter("ignore")
            try:
                return read(text, notation="greek")
            except NumcheckError as err:
                return (type(err).__name__, str(err))

    fast = outcome()
    monkeypatch.setattr(greek, "_plain_tree", lambda text: None)
    assert outcome() == fast


@pytest.mark.parametrize("text", ["κ[θ]", "κθ?", "κ.", " κθ", "κθ ", "κθ λα\u0323"])
def test_greek_with_marks_goes_to_the_parser(text):
    from numcheck.notations import greek

    assert greek._plain_tree(text) is None


# ---- the catalogue's tables kept on disk -----------------------------------

def test_the_catalogue_kept_on_disk_is_the_catalogue_computed(tmp_path, monkeypatch):
    from numcheck.identify import targets

    monkeypatch.setenv("NUMCHECK_CACHE", str(tmp_path))
    catalogue._entries.cache_clear()
    targets.all_items.cache_clear()
    try:
        computed = targets.all_items()                 # computed, then stored
        assert sorted(p.name.split("-")[0] for p in tmp_path.glob("*.pickle")) == ["catalogue", "catalogue"]
        catalogue._entries.cache_clear()
        targets.all_items.cache_clear()
        loaded = targets.all_items()                   # loaded from the files
        assert loaded is not computed
        assert loaded == computed == targets.compute_items()
        assert catalogue._entries() == catalogue._parse_entries()
    finally:
        catalogue._entries.cache_clear()
        targets.all_items.cache_clear()


def test_a_damaged_catalogue_file_is_computed_again(tmp_path, monkeypatch):
    monkeypatch.setenv("NUMCHECK_CACHE", str(tmp_path))
    catalogue._entries.cache_clear()
    try:
        catalogue._entries()
        (path,) = tmp_path.glob("catalogue-*.pickle")
        path.write_bytes(b"\x80\x05not a pickle")
        catalogue._entries.cache_clear()
        assert catalogue._entries() == catalogue._parse_entries()
    finally:
        catalogue._entries.cache_clear()


# ---- Greek numbers of plain small letters, without the general reader -------

_SMALL = "αβγδεϛζηθικλμνξοπϙϟρστυφχψωϡϝϲͳ"
_BY_RANK = ("αβγδεϛϝζηθ", "ικλμνξοπϙϟ", "ρσϲτυφχψωϡͳ")


@st.composite
def _small_letter_numbers(draw):
    """Groups of small letters: mostly one letter per rank in descending order, sometimes any."""
    groups = []
    for _ in range(draw(st.integers(1, 6))):
        if draw(st.booleans()):
            ranks = sorted(draw(st.sets(st.integers(0, 2), min_size=1)), reverse=True)
            groups.append("".join(draw(st.sampled_from(_BY_RANK[r])) for r in ranks))
        else:
            groups.append(draw(st.text(alphabet=_SMALL, min_size=1, max_size=3)))
    if draw(st.booleans()):     # Leiden's dot under some letters (an unclear letter)
        groups = ["".join(ch + "\u0323" * draw(st.booleans()) for ch in g) for g in groups]
    if draw(st.integers(0, 3)) == 0:    # one letter lost at the end (mostly of one group)
        groups = groups[:draw(st.sampled_from([1, 1, 1, 2]))]
        groups[-1] += "[.]"
    return " ".join(groups)


def _greek_outcome(text, convention):
    import warnings

    from numcheck.notations import greek

    with warnings.catch_warnings(record=True) as caught:
        warnings.simplefilter("always")
        try:
            r = greek.parse(text, convention=convention)
        except NumcheckError as err:
            return (type(err).__name__, str(err)), []
    return (r, [s.form for s in r.slots]), [str(w.message) for w in caught]


def _quick_reads_as_the_reader(text, convention):
    """The quick path's reading of *text*, checked against the general reader's (None if declined)."""
    from unittest import mock

    from numcheck import limits
    from numcheck.notations import greek
    from numcheck.notations.greek.quick import plain_letters_reading

    fast = plain_letters_reading(text, "greek", limits.MAX_PLACES, convention)
    with mock.patch.object(greek, "plain_letters_reading", lambda *a: None):
        slow, said = _greek_outcome(text, convention)
    if fast is not None:
        assert said == []
        assert (fast, [s.form for s in fast.slots]) == slow
        assert _greek_outcome(text, convention) == (slow, said)
    return fast


@given(_small_letter_numbers(), st.sampled_from(["generic", "astronomical", "documentary"]))
def test_plain_small_letters_read_as_the_general_reader_reads_them(text, convention):
    _quick_reads_as_the_reader(text, convention)


@pytest.mark.parametrize("text", ["ο", "ο\u0323", "ο κ", "ο[.]", "ο\u0323[.]", "κ ο"])
@pytest.mark.parametrize("convention", ["generic", "astronomical", "documentary"])
def test_a_lone_omicron_is_quick_only_where_the_convention_makes_it_seventy(text, convention):
    # The documentary convention reads a lone omicron as 70, the others as 0 or as 0 or 70;
    # before a lost letter it is 70 in all three.
    fast = _quick_reads_as_the_reader(text, convention)
    quick = "[" in text or (convention == "documentary" and text != "κ ο")
    assert (fast is not None) == quick


@pytest.mark.parametrize("text", ["κθ λα ν η κ", "ρκε", "μ ιϛ", "ϡϙθ νθ", "ρ\u0323κε", "κθ λ\u0323α\u0323",
                                  "ρκ[.]", "ρ[.]", "κ\u0323[.]"])
def test_everyday_greek_numbers_take_the_quick_path(text):
    from numcheck import limits
    from numcheck.notations.greek.quick import plain_letters_reading

    assert plain_letters_reading(text, "greek", limits.MAX_PLACES) is not None


@pytest.mark.parametrize("text", ["ο", "κ ο", "ξ ξ", "θκ", "Κθ", "κθ  λα", "ᾱ", "κ[θ]",
                                  "ο\u0323", "\u0323κ", "κ\u0323\u0323",
                                  "α[.]", "ρκ[.] κ", "κ [.]", "ρ[..]", "[.]κ", "[.]",
                                  "ρκ[.]\u0323"])
def test_greek_numbers_the_quick_path_leaves_to_the_reader(text):
    from numcheck import limits
    from numcheck.notations.greek.quick import plain_letters_reading

    assert plain_letters_reading(text, "greek", limits.MAX_PLACES) is None


# -- a gapless Reading's bounds and value in one pass (numcheck.reading) -------

_VALUE = st.one_of(st.integers(0, 70), st.fractions(min_value=0, max_value=5, max_denominator=12))


@st.composite
def _gapless(draw):
    from fractions import Fraction

    from numcheck.reading import Reading, Slot, Status

    slots = []
    for _ in range(draw(st.integers(0, 5))):
        values = tuple(sorted({Fraction(v) for v in draw(st.lists(_VALUE, min_size=1, max_size=3))}))
        editor = draw(st.sampled_from((None,) + values))
        slots.append(Slot(values=values, place=draw(st.integers(-3, 3)), editor=editor,
                          status=draw(st.sampled_from(list(Status)))))
    return Reading(text="x", notation="sexagesimal", slots=tuple(slots),
                   base=draw(st.sampled_from([10, 60])), sign=draw(st.sampled_from([1, -1])))


@given(_gapless())
def test_a_gapless_readings_bounds_and_value_are_the_place_sums(reading):
    from numcheck.reading import place_sum

    slots = reading.counted_slots
    lo = place_sum(((s.values[0], s.place) for s in slots), reading.base)
    hi = place_sum(((s.values[-1], s.place) for s in slots), reading.base)
    pref = place_sum(((s.preferred, s.place) for s in slots), reading.base)
    assert (reading.min, reading.max) == ((lo, hi) if reading.sign > 0 else (-hi, -lo))
    assert reading.value == reading.sign * pref
    values = list(reading.readings())
    assert min(values) == reading.min and max(values) == reading.max
