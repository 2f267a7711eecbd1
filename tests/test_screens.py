"""What a scholar reads: every screen at 80 columns, piped output, the everyday inputs of the CLI.

The screens are rendered on rich's recording console at 80 columns and
checked for what the reader must never meet: a line wider than the screen,
a cell cut with an ellipsis, a number or an id broken across lines.
"""

import io
import json
import re
from pathlib import Path

import pytest
from rich.console import Console

from numcheck.cli import build_parser, main

ROOT = Path(__file__).resolve().parent.parent
WIDTH = 80


def _screen(argv: list[str], width: int = WIDTH) -> tuple[str, dict]:
    """The text a command shows on a console of *width* columns, and its JSON."""
    args = build_parser().parse_args(argv)
    console = Console(record=True, width=width, file=io.StringIO(), highlight=False, soft_wrap=False)
    out = args._module.run(args, console)
    return console.export_text(), out


def _words(text: str) -> set[str]:
    words = set()
    for w in text.split():
        words.add(w)
        words.add(w.strip(",.;:()"))
        words.add(w.rstrip(",.;:)"))
        words.add(w.lstrip("("))
    return words


def _assert_readable(text: str, must_stand_whole=()):
    lines = text.splitlines()
    from rich.cells import cell_len

    too_wide = [ln for ln in lines if cell_len(ln.rstrip()) > WIDTH]
    assert not too_wide, too_wide
    # The only ellipsis allowed is the one that stands for skipped lines of a table.
    cut = [ln for ln in lines if "…" in ln and ln.strip() != "…"]
    assert not cut, cut
    words = _words(text)
    broken = [t for t in must_stand_whole for w in str(t).split() if w not in words]
    assert not broken, broken


SCREENS = [
    (["identify", "1,49,45;20", "--unit", "days"], "identify"),
    (["identify", "7 26", "--notation", "cuneiform"], "identify"),
    (["identify", "κθ λα ν", "--unit", "days"], "identify"),
    (["identify", "0;59,8,17", "--unit", "degrees", "--full"], "identify"),
    (["catalogue"], "catalogue"),
    (["catalogue", "--body", "moon", "--full"], "catalogue"),
    (["relate", "6585 1/3", "--unit", "days"], "relate"),
    (["relate", "--search", "moon", "--max-years", "400"], "search"),
    (["restore", "29;31,5[x],8,20"], "restore"),
    (["restore", "κθ λα ν [.] κ"], "restore"),
    (["restore", "1,[...],45;20", "--unit", "days", "--full"], "restore"),
    (["audit", str(ROOT / "corpora_demo" / "ephemeris.tsv")], "audit"),
    (["audit", str(ROOT / "corpora_demo" / "ephemeris.tsv"), "--full"], "audit"),
    (["audit", str(ROOT / "examples" / "tables" / "igi.tsv"), "--notation", "cuneiform"], "audit"),
    (["read", "29;31,5[x],8,20"], "read"),
    (["annotate", str(ROOT / "corpora_demo" / "papyrus.xml"), "--alternatives", "2"], "annotate"),
    (["interval", "Nabonassar 1 Thoth 1", "Philip 1 Thoth 1"], "interval"),
]


def _whole(kind: str, out: dict) -> list[str]:
    """The pieces of a screen that must stand whole: numbers, readings, ids."""
    if kind == "identify":
        return [i for g in out["groups"] for i in g["ids"]] + [g["what"] for g in out["groups"]]
    if kind == "catalogue":
        return [e["id"] for e in out["entries"]]
    if kind == "relate":
        return [b["count"] for b in out["bodies"]] + [str(b["nearest"]) for b in out["bodies"]]
    if kind == "search":
        return []
    if kind == "restore":
        return [c["text"] for c in out["candidates"]] + \
            [c["sexagesimal"] for c in out["candidates"] if c["evidence"] or c["editor"]]
    if kind == "audit":
        slips = [f for f in out["flags"] if f["kind"] != "carried-forward"]   # one slip, one line
        return [f["written"] for f in slips] + [f["expected"] for f in slips] + \
            [r["text"] for r in out["restorations"]]
    if kind == "read":
        return [out["sexagesimal"], out["value"]]
    if kind == "annotate":
        return [n["text"] for n in out["nums"] if n["damaged"]]
    return []


@pytest.mark.parametrize("argv,kind", SCREENS, ids=[" ".join(a[:2]) + (" --full" if "--full" in a else "")
                                                     for a, _ in SCREENS])
def test_screen_at_80_columns(argv, kind):
    text, out = _screen(argv)
    assert text.strip()
    _assert_readable(text, _whole(kind, out))


def test_identify_shows_one_row_per_statement_with_its_rows():
    text, out = _screen(["identify", "1,49,45;20", "--unit", "days"])
    # The three rows that give 223 synodic months are one statement of the screen.
    assert text.count("223 synodic months\n") + text.count("223 synodic months ") >= 1
    group = next(g for g in out["groups"] if g["what"] == "223 synodic months")
    assert set(group["ids"]) == {"goalyear_moon_18", "saros_almagest", "saros_bab_38"}
    assert sum(1 for line in text.splitlines() if re.match(r"\s*\d+\s+near\s+223 synodic months", line)) == 1
    # Full citations, not cut (Almagest IV.2 is the section of Ptolemy's value).
    assert "Ptolemy, Almagest IV.2" in text


def test_restore_sums_up_the_readings_no_evidence_singles_out():
    text, out = _screen(["restore", "29;31,5[x],8,20"])
    assert "no evidence points to it" not in text
    assert "#2-#10 (9 readings, 0.0490 each)" in " ".join(text.split())
    assert len(text.splitlines()) < 20
    full, _ = _screen(["restore", "29;31,5[x],8,20", "--full"])
    assert full.count("no evidence points to it") == 9


def test_audit_screen_is_compact_and_keeps_every_flag():
    text, out = _screen(["audit", str(ROOT / "corpora_demo" / "ephemeris.tsv")])
    assert len(text.splitlines()) < 110          # was 188 lines with 1-3 words a line
    for f in out["flags"]:
        if f["kind"] != "carried-forward":
            assert f"row {f['row']} {f['column']}:" in text
    assert "key: ! slip (red)" in text


# ---- piped: plain text to paste ----------------------------------------------

@pytest.mark.parametrize("argv", [["identify", "1,49,45;20", "--unit", "days"], ["catalogue", "--body", "sun"],
                                  ["restore", "29;31,5[x],8,20"], ["read", "29;31,5[x],8,20"],
                                  ["audit", str(ROOT / "examples" / "tables" / "sums.tsv")]])
def test_piped_output_is_plain_text(argv, capsys):
    assert main(argv) == 0
    out = capsys.readouterr().out
    assert "\x1b" not in out                                  # no colour codes
    assert not [ln for ln in out.splitlines() if ln != ln.rstrip()]   # no trailing blanks
    assert not set("┃━╇│─╭╮╰╯") & set(out)                    # ASCII rules only


# ---- everyday inputs ---------------------------------------------------------------

def test_a_negative_number_is_not_an_option(capsys):
    assert main(["read", "-3;30", "--json"]) == 0
    assert json.loads(capsys.readouterr().out)["value"] == "-7/2"
    assert main(["interval", "-746-02-26", "-323-11-12", "--json"]) == 0
    assert json.loads(capsys.readouterr().out)["days"] == 154760   # 424 Egyptian years of 365 days


def test_version(capsys):
    import numcheck

    with pytest.raises(SystemExit) as stop:
        main(["--version"])
    assert stop.value.code == 0
    assert capsys.readouterr().out.strip() == f"numcheck {numcheck.__version__}"


@pytest.mark.parametrize("argv,named", [
    (["relate", "8", "--unit", "years", "--cycles", "synodic"], "--cycles"),
    (["relate", "8", "--unit", "years", "--max-years", "100"], "--max-years"),
    (["restore", "29;31,5[x],8,20", "--no-catalogue", "--tradition", "greek"], "--tradition"),
])
def test_an_option_that_does_nothing_alone_says_so(argv, named, capsys):
    assert main(argv) == 2
    err = capsys.readouterr().err
    assert named in err and "nothing" in err


def test_an_unknown_era_is_named(capsys):
    assert main(["interval", "Kiddimar 1 Nisannu 1", "Nabonassar 1 Thoth 1"]) == 2   # an invented era
    err = capsys.readouterr().err
    assert "era 'Kiddimar'" in err and "Julian month" not in err
    assert main(["interval", "747 BC Feb 26", "1 Thoth 1"]) == 2
    assert "Egyptian month" in capsys.readouterr().err


def test_a_warning_shown_as_a_note_is_said_once(capsys):
    assert main(["read", "ηι"]) == 0
    captured = capsys.readouterr()
    assert (captured.out + captured.err).count("not in the usual descending order") == 1


def test_a_slow_search_shows_progress_only_on_a_terminal():
    from numcheck.report.layout import busy

    quiet = Console(file=io.StringIO(), force_terminal=False)
    with busy(quiet, "searching"):
        pass
    assert quiet.file.getvalue() == ""
    quick = Console(file=io.StringIO(), force_terminal=True, width=80)
    with busy(quick, "searching"):          # under a second: nothing shown
        pass
    assert quick.file.getvalue() == ""
    slow = Console(file=io.StringIO(), force_terminal=True, width=80)
    import time

    with busy(slow, "searching", after=0.0):
        time.sleep(0.3)
    assert "searching" in slow.file.getvalue()


# ---- words -------------------------------------------------------------------------

def test_read_labels_what_was_typed_and_the_normalised_form():
    text, _ = _screen(["read", "αχοʹ"])
    assert "as typed     αχοʹ" in text
    assert "normalised   ͵αχοʹ" in text


def test_a_doubtful_letter_without_a_known_confusion_says_so():
    from numcheck.restore import restore

    notes = " ".join(restore("κθ λα ν η\u0323 κ").notes)
    assert "no known confusion" in notes and "Nothing is lost or doubtful" not in notes


def test_expected_is_written_as_the_column_writes_its_numbers(tmp_path):
    from numcheck import audit

    days = tmp_path / "days.tsv"     # day counts of 365;15 days a year (common practice)
    rows = ["365;15", "730;30", "1095;45", "1461", "1826;25", "2191;30", "2556;45"]
    days.write_text("n\tdays\n" + "".join(f"{i}\t{r}\n" for i, r in enumerate(rows, 1)), encoding="utf-8")
    flags = audit(days).to_dict()["flags"]
    assert [(f["row"], f["expected"]) for f in flags] == [(5, "1826;15")]
    igi = audit(ROOT / "examples" / "tables" / "igi.tsv", notation="cuneiform").to_dict()["flags"]
    assert [(f["row"], f["written"], f["expected"]) for f in igi] == [(7, "6,50", "6,40")]  # igi 9 = 6,40 (MKT)


def test_a_greek_slip_is_named_in_letters():
    from fractions import Fraction

    from numcheck.slips import classify

    d = classify(Fraction(13 * 60 + 25, 60), Fraction(13 * 60 + 15, 60), places=1, notation="greek")
    assert d.kind in ("ten-slip", "letter-confusion")
    assert "ten-corner" not in d.reason and "letter" in d.reason


def test_annotate_line_is_the_text_line():
    from numcheck import annotate

    nums = annotate(ROOT / "corpora_demo" / "papyrus.xml", None).to_dict()["nums"]
    day4 = next(n for n in nums if n["damaged"] and n["text"].startswith("ν"))
    assert day4["text_line"] == "4"              # <row n="4"> of the papyrus table
    assert day4["line"] != 4                     # the XML line is another thing
    ostracon = annotate(ROOT / "examples" / "editions" / "ostracon.xml", None).to_dict()["nums"]
    assert [n["text_line"] for n in ostracon] == ["1", "2", "3"]   # <lb n="1"/> ...


@pytest.mark.parametrize("module", ["numcheck.report.layout", "numcheck.report.plot", "numcheck.report._common",
                                    "numcheck.report.html", "numcheck.identify.ranking",
                                    "numcheck.commands.restore", "numcheck.commands.annotate",
                                    "numcheck.slips.classify"])
def test_doctests_of_the_screens(module):
    import doctest
    import importlib

    result = doctest.testmod(importlib.import_module(module), optionflags=doctest.ELLIPSIS)
    assert result.failed == 0 and result.attempted > 0
