"""Every crash the fuzzers found, kept as a regression test.

Each row is (entry point, input, note): the input once made numcheck raise
something other than a NumcheckError (or exit 1 at the command line, or take
far too long).  Now it must read or raise a NumcheckError, quickly.  The
entry points are those of ``benchmarks/fuzz.py`` and ``tests/test_fuzz*.py``.
"""

from __future__ import annotations

import contextlib
import io
import os
import time
import warnings
from decimal import Decimal

import pandas as pd
import pytest

import numcheck
from numcheck.errors import NumcheckError

TEI = '<TEI xmlns="http://www.tei-c.org/ns/1.0"><text><body><ab>{}</ab></body></text></TEI>'

# (entry point, input, note).  For "read", "identify", "restore" the input is
# (text, notation); for "audit" a dict of columns; for "annotate" XML bytes;
# for "cli" the argument list.
CASES = [
    ("read", ("كط لا[xx", None),
     "abjad: an unclosed bracket of lost letters in a fractional place left no total to "
     "report (min() of an empty list)"),
    ("read", ("xxxxxxxx", None),
     "sexagesimal: a place of eight unread digits enumerated 10^8 sums before keeping those "
     "up to 59 (28 s; a hang with more x's)"),
    ("restore", ("xxxxxxxx", None), "the same place through restore"),
    ("read", ("ↀ[ↁ]", "roman"),
     "roman: an editor's restoration in a letter the search does not try (ↁ) gave a value "
     "outside min..max (4000 > 2000)"),
    ("read", ("ل [ت]ه", None),
     "abjad: an editor's restoration over 59 in a fractional place gave a value outside "
     "min..max (now a range error, as in sexagesimal)"),
    ("read", ("6585 days 12;30 Taurus", "sexagesimal"),
     "quantity: a longitude (zodiacal sign) after a quantity of time raised StopIteration "
     "looking for the unit word that differs"),
    ("roundtrip", ("α[.][..]", "greek"),
     "greek: three lost letters written back as '[...]', which reads as lost places of unknown "
     "number (1000..1999 became a different range)"),
    ("roundtrip", ("Χ[.][..]ΗΔΔΙΙ", "attic"), "attic: the same"),
    ("roundtrip", ("[...],[3]0", "sexagesimal"),
     "sexagesimal: a gap beside a lost digit written back as '[...,3]0', which does not read"),
    ("audit", {"A": ["1" * 5000, "2", "3"]},
     "audit: a plain cell of 5000 digits went past the reader's limits into int() "
     "(ValueError: exceeds the limit for integer string conversion)"),
    ("audit", {"A": ["1," * 3000 + "1", "2", "3"]},
     "audit: a plain cell of 3001 places was read by the table's fast path past MAX_PLACES"),
    ("audit", {"A": ["x " * 3000 + "Taurus", "2", "3"]},
     "audit: a cell longer than MAX_TEXT_LENGTH went to the longitude pattern (quadratic)"),
    ("roundtrip", ("{29};31,50,8,20", "sexagesimal"),
     "sexagesimal: a superfluous whole place written back as '{29},31,50,8,20' (an integer)"),
    ("roundtrip", ("365{;14},4[x]", "sexagesimal"),
     "sexagesimal: a superfluous place after ';' written back as '365,{14};4[x]', which does not read"),
    ("restore", ("[Χ𐅅ΗΔΔΙΙ]", "attic"),
     "restore: a wholly lost Attic number (10^7 readings) walked 33 million windows for 40 s "
     "before its LimitError; the search now stops as soon as the matches pass the limit"),
    ("restore", ("[τξε ιδ μη]", "greek"), "restore: a wholly lost Greek number, the same (9 s)"),
    ("restore", ("ι[.] [..ʹ]", None),
     "restore: a lost unit fraction (486 denominators up to 9900) gave sums of integers past the "
     "range of a float (OverflowError in the kernel mass); now summed exactly"),
    ("restore-expect", float("nan"), "restore: expect=nan raised ValueError"),
    ("restore-expect", float("inf"), "restore: expect=inf raised OverflowError"),
    ("restore-expect", [1], "restore: expect=[1] raised TypeError"),
    ("identify-top", "3", "identify: top='3' raised TypeError"),
    ("identify-top", None, "identify: top=None raised TypeError"),
    ("read", ("{[...]}ακ", "greek-ascending"),
     "greek: lost places of unknown number inside a superfluous sign were read as a letter "
     "worth 0 and written back as '{.}' (now the error a lost letter inside { } already gave)"),
    ("audit", {"A": ["2;14", "-6"], "B": ["0,7,41", "0,9,55"], "C": ["ακ", "α[.]"]},
     "audit: a reciprocal scheme tried on a negative cell looped for ever (the magnitude of a "
     "negative reciprocal grew without end)"),
    ("audit", {"n": ["2", "-3", "4", "5"], "igi": ["30", "20", "15", "12"]},
     "audit: a negative number in the column of a reciprocal table"),
    ("cli", ["relate", "1/0", "--unit", "days"],
     "relate: N = 1/0 raised ZeroDivisionError (exit 1)"),
    ("relate", float("inf"), "relate: N = inf raised OverflowError"),
    ("batch-workers", 100_000,
     "annotate FOLDER --workers 100000 started a pool of 100,000 processes (ran past a minute); "
     "the pool is now at most the number of files"),
    ("identify", ("n 30", None),
     "identify: a floating number with an unknown place ('n') compared every catalogue multiple "
     "across its whole range of readings (16 s; 60 readings, a factor of 100 between min and max)"),
    ("identify", (".ϙ", None, "years"),
     "identify: a Greek number with an unread letter of any rank (18 readings, 190 to 9090) "
     "took 9 s the same way"),
    ("identify", ("𒌋[x]", None), "identify: a cuneiform sign with a lost units digit (4 s)"),
    ("identify", ("1[x] UŠ", "cuneiform", "months"),
     "a quantity converted to another unit kept one unit of its last place as 1 (in months, "
     "not 1 UŠ in months): identify compared 800,000 candidates (19 s)"),
    # Issues 21 and 22 (an outside fuzzer and an outside reliability test).
    ("annotate", TEI.format('<num>ι<gap reason="lost" quantity="99999999999999999999" '
                            'unit="character"/></num>').encode(),
     "annotate: a gap of 10^20 characters raised OverflowError (cannot fit 'int' into an "
     "index-sized integer); the count is now refused where it enters (markup._int_attr)"),
    ("annotate", TEI.format('<num>ι<gap reason="lost" quantity="1000000000" '
                            'unit="character"/></num>').encode(),
     "annotate: a gap of 10^9 characters in a 150-byte file allocated 5.7 GB"),
    ("annotate", TEI.format('<num>ι<!-- c -->[.]</num>').encode(),
     "annotate: a comment inside <num> raised ValueError (Invalid input tag)"),
    ("annotate", TEI.format('<num>ι[.]<?pi x?></num>').encode(),
     "annotate: a processing instruction inside <num> raised ValueError"),
    ("annotate", TEI.format('<num value="0x1F' + 'F' * 40 + '">ι</num>').encode(),
     "annotate: a hexadecimal @value raised OverflowError"),
    ("annotate", TEI.format('<num atLeast="1' + '0' * 5000 + '" atMost="2">ι[.]</num>').encode(),
     "annotate: an @atLeast of 5000 digits"),
    ("relate", "1" * 5000,
     "relate: a span of 5000 digits raised ValueError (exceeds the limit for integer string "
     "conversion), exit 1"),
    ("relate", "1e99999999", "relate: 1e99999999 built an integer of 10^8 digits (a hang)"),
    ("relate", 1e300, "relate: a float span of 10^300 days (past RELATE_MAX_SPAN)"),
    ("cli", ["relate", "1e99999999", "--unit", "tithis"], "relate: the same from the command line"),
    ("restore-context", float("nan"), "restore: context=nan raised TypeError"),
    ("restore-context", [1], "restore: context=[1] raised TypeError"),
    ("annotate-alternatives", object(), "annotate: alternatives=object() raised TypeError"),
    ("annotate-alternatives", 2.5, "annotate: alternatives=2.5 went on to slice with a float"),
    ("read", (Decimal("sNaN"), None), "read: Decimal('sNaN') raised InvalidOperation"),
    ("relate", Decimal("sNaN"), "relate: Decimal('sNaN') raised InvalidOperation"),
    ("restore", ("12", [1]), "restore: notation=[1] raised TypeError"),
    ("cli", ["audit", "/dev/zero"], "audit /dev/zero read until MemoryError (2.6 GB)"),
    ("cli", ["audit", "/dev/urandom"], "audit /dev/urandom: the same"),
    ("cli", ["annotate", "/dev/zero"], "annotate /dev/zero: a device is refused by its kind"),
    ("cli-fifo", "audit", "audit on a FIFO blocked for ever"),
    ("cli-fifo", "annotate", "annotate on a FIFO: the same"),
    ("folder", ("annotate", "ed", "-o", "ed/sub"),
     "annotate ed -o ed/sub exited 0 and wrote over the input ed/sub/a0.xml (data loss)"),
    ("folder", ("annotate", "ed/sub", "-o", "ed"),
     "annotate ed/sub -o ed processed 0 files and exited 0"),
    ("folder", ("audit", "ed", "--report", "ed/reports"),
     "audit ed --report ed/reports: the report folder inside the input folder"),
    ("folder", ("audit", "ed/sub", "--report", "ed"),
     "audit ed/sub --report ed: the input inside the report folder"),
    ("folder", ("audit", "empty"), "audit of a folder with no table exited 0 ('0 files')"),
    ("folder", ("annotate", "empty", "-o", "out"), "annotate of a folder with no .xml exited 0"),
    ("restore-readback", ("ϛ̣", None),
     "restore: a doubtful ϛ (read 6..6) was proposed as 1/6 with the same text"),
    ("restore-readback", ("θ̣", None),
     "restore: a doubtful Greek letter kept its letter whatever value it was given"),
    ("restore-readback", ("ي?", "abjad"),
     "restore: 'ي?' listed as 10, 2, 50, 400 and 500 with the same text"),
    ("restore-readback", ("XṾ", "roman"), "restore: a doubtful Roman letter, the same"),
    ("restore-readback", ("[ΗΗ]Δ", "attic"),
     "restore: Attic restorations that break the sign order ('[ΔΗ]Δ'), which read rejects"),
    ("restore-readback", ("[ΗΗΗ]Δ", "attic"), "restore: the same with three restored signs"),
    ("restore-readback", ("[...]Δ", "attic"), "restore: lost Attic signs of unknown number"),
    ("audit-file", (".tsv", b"\xff\xfe" + "A\tB\n1\t2\n".encode("utf-16-le") + b"\x00\xd8"
                    + "\t3\n".encode("utf-16-le")),
     "audit: a UTF-16 table with a lone surrogate raised UnicodeEncodeError"),
    ("audit-file", (".csv", ('A,B\n"' + "1" * 140_000 + '",2\n3,4\n').encode()),
     "audit: a quoted CSV cell over 131,072 characters raised _csv.Error"),
    ("audit-file", (".tsv", b"A\tB\n\x00\x01\x02\x03"), "audit: a binary file read as a table"),
    ("audit-relation", "B = A mod x", "audit --relation 'B = A mod x' raised ValueError"),
    ("audit-relation", "B = A mod 1e3", "audit --relation 'B = A mod 1e3' raised ValueError"),
    ("audit-relation", "B = " + "(" * 1000 + "A" + ")" * 1000,
     "audit: a relation of 1,000 parentheses raised RecursionError"),
    ("audit-relation", "B = " + " + ".join(["A"] * 1000),
     "audit: a relation of 1,000 terms raised RecursionError"),
    ("audit-relation", float("inf"), "audit: relation=inf raised TypeError"),
    ("audit-relation", [1], "audit: relation=[1] raised TypeError (a list of relations holds texts)"),
    ("restore", (" ".join(["κθ [...] ν"] * 10), "greek"),
     "restore: ten '[...]' in one Greek number made 3^10 gapless readings, each searched "
     "(73 s in the long fuzz run); now a LimitError before they are enumerated"),
    ("audit-wide", 300, "audit: 1,000 columns x 3 rows took 152 s (cubic cross-column fit); "
                        "300 columns here (the fit is now linear in the columns past 20)"),
    ("write-back", 50_000,
     "annotate: 60,000 <num> took 80 s, 199,999 ran past 300 s: each edit was spliced into "
     "the whole text (quadratic); here 50,000 edits spliced into one text"),
    ("audit-file", (".txt", ("A  B\n0,20,29  42;2\n0,19,54  45;16\n0,19,19  48;30\n0,18,44  51;44\n"
                             "0,18,9  54;58\n0,17,34  58;12\n0,16,59  1;6\n0,16,24  4;40\n0,15,49  7;54\n"
                             "0,15,14  11;8δ\n0,14,39  14;22\n0,14,4  17;36\n0,13,29  20;50\n"
                             "0,12,54  2424;4\n0,12,19  27;18\n0,11,44  30;32\n0,11,9  33;46\n"
                             "0,10,34  37;0\n0,9,59  40;14\n0,9,24  43;28\n0,8,49  46;42\n"
                             "0,8,14  49;56\n0,7,39  53;10\n0,7,4  56;24").encode()),
     "audit: a slip of one in a place the expected value does not have (2424;4 for 24;4) raised "
     "KeyError in slips.classify (long fuzz run, seed 2026120)"),
    ("restore", ("c[ayagiyiṅu]śuchlṛ", None, "months"),
     "restore: an Āryabhaṭa number with four restored syllables ran past 120 s (long fuzz run): "
     "each leaf of the search looked at thousands of catalogue windows, uncounted; now a "
     "LimitError within RESTORE_MAX_NODES steps (about 10 s)"),
]

# Cases that still fail in code owned by another helper at the time of writing
# (marked xfail, not run: each would spend its full slowness in the suite).
XFAIL: dict[int, str] = {}

# Longest an entry point may take on one of these inputs (seconds of CPU): a hang is a bug too.
TIME_LIMIT = 10.0
# Cases whose end is a LimitError after a bounded search: it takes 7-8 s of CPU on the
# 2-core machine, and more in its slow hours; the hang it replaced ran past 120 s.
SLOW_LIMITS: dict[int, float] = {80: 30.0}


def _run(entry: str, data) -> None:
    if entry == "read":
        text, notation = data
        reading = numcheck.read(text, notation=notation)
        reading.to_dict()
        assert reading.min <= reading.value <= reading.max
    elif entry == "identify":
        text, notation, *rest = data
        numcheck.identify(text, notation=notation, unit=rest[0] if rest else None).to_dict()
    elif entry == "restore":
        text, notation, *rest = data
        numcheck.restore(text, notation=notation, unit=rest[0] if rest else None).to_dict()
    elif entry == "audit":
        numcheck.audit(pd.DataFrame(data, dtype=object)).to_dict()
    elif entry == "roundtrip":
        from numcheck.notations import format_reading
        text, notation = data
        reading = numcheck.read(text, notation=notation)
        again = numcheck.read(format_reading(reading), notation=notation)
        assert (again.value, again.min, again.max, again.count) == \
            (reading.value, reading.min, reading.max, reading.count)
    elif entry == "restore-expect":
        numcheck.restore("1,2[x]", expect=data, use_catalogue=False).to_dict()
    elif entry == "identify-top":
        numcheck.identify("1,2[x]", top=data).to_dict()
    elif entry == "relate":
        numcheck.relate(data, "days").to_dict()
    elif entry == "batch-workers":
        import tempfile
        from pathlib import Path

        from numcheck.batch import annotate_folder
        with tempfile.TemporaryDirectory() as tmp:
            src = Path(tmp) / "in"
            src.mkdir()
            demo = Path(numcheck.__file__).parent / "data" / "demo" / "papyrus.xml"
            from numcheck.batch import POOL_MIN_FILES
            for i in range(POOL_MIN_FILES):      # enough files for a pool
                (src / f"p{i}.xml").write_bytes(demo.read_bytes())
            annotate_folder(src, Path(tmp) / "out", workers=data)
    elif entry == "annotate":
        from numcheck.tei import annotate_bytes
        annotate_bytes(data)[1].to_dict()
    elif entry == "cli":
        _cli(list(data))
    elif entry == "restore-readback":
        text, notation = data
        result = numcheck.restore(text, notation=notation, use_catalogue=False, top=200)
        for cand in result.candidates:
            # The text reads (no error) and gives the candidate's value (a
            # restored sign counts as the editor wrote it).
            again = numcheck.read(cand.text, notation=notation)
            assert again.value == cand.value, (cand.text, cand.value)
        assert sum(c.probability for c in result.candidates) <= 1 + 1e-9
    elif entry == "audit-file":
        import tempfile
        from pathlib import Path
        suffix, raw = data
        with tempfile.TemporaryDirectory() as tmp:
            path = Path(tmp) / ("t" + suffix)
            path.write_bytes(raw)
            numcheck.audit(path).to_dict()
    elif entry == "audit-relation":
        frame = pd.DataFrame({"A": ["1", "2", "3"], "B": ["1", "3", "6"]}, dtype=object)
        numcheck.audit(frame, relation=data).to_dict()
    elif entry == "audit-wide":
        frame = pd.DataFrame({f"c{i}": [str(i), str(i + 1), str(i + 3)] for i in range(data)},
                             dtype=object)
        numcheck.audit(frame).to_dict()
    elif entry == "write-back":
        from numcheck.tei.write import Edit, apply_edits, scan_elements
        text = "<ab>" + "<num>ιβ</num>" * data + "</ab>"
        spans = scan_elements(text)
        edits = {i: Edit(set_attrs={"value": "12"}) for i in range(1, len(spans))}
        out = apply_edits(text, spans, edits, {})
        assert out.count('<num value="12">') == data
    elif entry == "restore-context":
        numcheck.restore("1,2[x]", context=data, use_catalogue=False).to_dict()
    elif entry == "annotate-alternatives":
        from numcheck.tei import annotate_bytes
        annotate_bytes(TEI.format("<num>ι[.]</num>").encode(), alternatives=data)[1].to_dict()
    elif entry == "cli-fifo":
        import tempfile
        from pathlib import Path
        with tempfile.TemporaryDirectory() as tmp:
            fifo = Path(tmp) / ("t.tsv" if data == "audit" else "t.xml")
            os.mkfifo(fifo)
            code, err = _cli([data, str(fifo)])
            assert code == 2 and "FIFO" in err, err
    elif entry == "folder":
        _folder_case(list(data))
    else:  # pragma: no cover - a typo in the table
        raise AssertionError(entry)


def _cli(argv: list[str]) -> tuple[int, str]:
    from numcheck.cli import main
    out, err = io.StringIO(), io.StringIO()
    with contextlib.redirect_stdout(out), contextlib.redirect_stderr(err):
        try:
            code = main(argv)
        except SystemExit as stop:
            code = stop.code
    assert code in (0, 2, None), (code, err.getvalue())
    return code, err.getvalue()


def _folder_case(argv: list[str]) -> None:
    """A folder run whose output is, holds or lies in its input: exit 2, no input written."""
    import hashlib
    import tempfile
    from pathlib import Path

    demo = (Path(numcheck.__file__).parent / "data" / "demo" / "papyrus.xml").read_bytes()
    with tempfile.TemporaryDirectory() as tmp:
        root = Path(tmp)
        (root / "ed" / "sub").mkdir(parents=True)
        (root / "empty").mkdir()
        (root / "ed" / "a0.xml").write_bytes(demo)
        (root / "ed" / "sub" / "a0.xml").write_bytes(demo)
        before = {p: hashlib.sha256(p.read_bytes()).hexdigest() for p in root.rglob("*.xml")}
        cwd = os.getcwd()
        os.chdir(root)
        try:
            code, err = _cli(argv)
        finally:
            os.chdir(cwd)
        assert code == 2, err
        assert {p: hashlib.sha256(p.read_bytes()).hexdigest() for p in root.rglob("*.xml")} == before
        assert not (root / "out").exists() and not (root / "ed" / "reports").exists()


def _params():
    for i, (entry, data, note) in enumerate(CASES):
        marks = [pytest.mark.xfail(strict=False, run=False, reason=XFAIL[i])] if i in XFAIL else []
        yield pytest.param(entry, data, note, SLOW_LIMITS.get(i, TIME_LIMIT), id=f"{i}-{entry}",
                           marks=marks)


@pytest.mark.parametrize("entry, data, note, limit", list(_params()))
def test_regression(entry, data, note, limit):
    # CPU time, not wall time: other work on the machine does not make a case "hang".
    start = time.process_time()
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        try:
            _run(entry, data)
        except NumcheckError:
            pass
    assert time.process_time() - start < limit, f"too slow: {note}"


def test_a_converted_quantity_keeps_its_last_place_in_the_new_unit():
    """One UŠ is 4 minutes (1/360 day; common practice): 1/15 hour."""
    from fractions import Fraction

    assert numcheck.read("2 bēru 10 UŠ", unit="hours").ulp == Fraction(1, 15)
    assert numcheck.read("2 bēru 10 UŠ").ulp == 1
    assert numcheck.read("3 signs 12;30°", unit="signs").ulp == Fraction(1, 60 * 30)
