"""Long fuzz run: throw N random inputs at every entry point; only NumcheckError may escape.

The test suite fuzzes each entry point with hypothesis under a bounded
profile (``tests/test_fuzz*.py``); this script is the long run, with a plain
seeded random generator so that 10^5 inputs take minutes, not hours.  Inputs
are random text, random mutations of valid numbers in every notation (a
character inserted, deleted, replaced, doubled; damage marks added), random
tables (as DataFrames and as TSV files), random XML (well formed or not, TEI
or not) and random command lines.

A crash is any exception other than :class:`numcheck.NumcheckError` (for
the command line: an exit code other than 0 or 2).  Each crash is printed
once per (entry point, exception type, place in the code) with the input
that caused it, to be kept as a regression test in
``tests/test_regressions.py``.  An input that takes longer than ``--slow``
seconds is reported as slow (a hang would show here).

An input still running after ``--timeout`` seconds (default 120) is stopped
and counted as a crash (a hang).

Run: ``python benchmarks/fuzz.py N [--seed S] [--only read,identify,...] [--slow 5] [--timeout 120]``
"""

from __future__ import annotations

import argparse
import contextlib
import io
import json
import os
import random
import re
import signal
import sys
import tempfile
import time
import traceback
import warnings
from collections import Counter
from pathlib import Path

import pandas as pd

import numcheck
from numcheck.errors import NumcheckError

# Valid numbers in each notation (common practice of editions; values need not matter).
SEEDS: dict[str | None, list[str]] = {
    "sexagesimal": ["1,49,45;20", "29;31,50,8,20", "29;31,5[x],8,20", "0;59,8,1[x],13,12,31",
                    "365;14,4[x]", "12;22,8,5[x],20", "[...];30", "6,40", "3<0>;1", "1{2},3", "2?,30",
                    "-1;30", "4\u0323;5"],
    "cuneiform": ["1,40", "1 40", "3,4[x]", "1 [x]5", "1 <0> 30", "𒌋[x]", "𒁹 {𒁹} 𒌋", "[...] 𒌋",
                  "𒐏𒐉", "n 30"],
    "greek": ["ϛφπε γʹ", "κθ λα ν η κ", "ιγ ι λδ νη λγ λ λ", "ϛφπ[.] γʹ", "κθ [...] ν", "ι[.] [..]",
              "τξε ιδ μη", "͵αφ", "\U0001018A λ", "ν[.]", "λ ι[.]ʹ", "ΚΘ [.]", "κθ λα ν [η] κ", "ō ιε",
              "ο νθ η ιζ ιγ ιβ λα", "κε ∠ʹ γʹ", "κε∠ʹγʹ", "κε U+2220ʹγʹ", "β ∠΄", "Αξδ", "'Αωϙγ", "Γ",
              "μὲ", "ιε.", "κθ ??", "o o ςʹ", "δʼ", "κθ ο λ"],
    "greek-ascending": ["ακ", "αι", "αχο", "α[.]"],
    "greek-documentary": ["Γ", "Αξδ", "'Αωϙγ", "ρκ 𐅵 δʹ", "ο"],
    "greek-astronomical": ["ο νθ η", "ο λβ γ", "Ϛ ∠ʹ", "ο ο ϛʹ"],
    "attic": ["Χ𐅅ΗΔΔΙΙ", "ΔΔΔΔΔ", "Χ[.]ΗΔΔΙΙ", "ΠΙ", "Π(Δ)ΙΙ"],
    "roman": ["XII", "XIV", "X[.]", "MC[..]", "IIII[.]V", "CCXXX[.]", "iiij", "ↀↁ", ".m.cc.lij.",
              "CIↃCCCXX", "IↃↃ", ".x[.]v."],
    "hebrew": ["תשצג", "ה׳תשפ״ג", "טו", "תש[.]ג", "ל מה", "{א}ב", "x ל"],
    "aryabhata": ["khyughṛ", "cayagiyiṅuśuchlṛ", "khyu[.]", "kh[y]ughṛ", "kha?"],
    "arabic-indic": ["١٥٧٧٩١٧٥٠٠", "٣٦٥؛١٤،٤٨", "٢٩;٣١,٥[x],٨,٢٠"],
    "persian": ["۳۶۵;۱۴,۴۸", "۱[x]"],
    "devanagari": ["१५७७९१७५००", "२९;३१,५[x],८,२०"],
    "abjad": ["{ب} نط", "ا {zero} ل", "ل [.]ه", "كط لا ن", "غكب"],
    "abjad-maghribi": ["كط لا ن", "ل [.]ه"],
    "atf": ["1(gesz2) 3(u) 7(disz)", "2(u@c) 9(aš@c)", "1(u) la2 1(disz)", "igi-6(disz)-gal2",
            "[1(u)] 9(disz)", "1(u@c)#?", "n(disz)", "4(ban2)# la2 1(asz@t)", "1(disz) 1/2(disz)",
            "1.40", "1 ME 43", "2 1/2", "43.KAM₂", "7(disz) 1(u) 5(disz)", "[x] la₂ 1(aš@c)",
            "2/3(disz) sila3 5(disz) gin2", "1(disz) gin2 la2 igi-6(disz)-gal2", "3(asz) sze gur"],
    "atf-math": ["7(disz) 3(u)", "1.40", "9.30", "03", "3(u)", "1.[40]"],
    "quantity": ["2 bēru 10 UŠ", "3 signs 1[x];30°", "6585 days", "12;30 Taurus", "1[x] UŠ",
                 "6585 1/3 days", "3 signs 12;30°"],
}
NOTATIONS = [n for n in SEEDS]
UNITS = [None, "days", "months", "years", "degrees", "signs", "UŠ", "us", "bēru", "hours", "tithis",
         "cubits", "fingers", "dayz"]
# Characters a scholar's paste may hold: the notations' own, Leiden marks, look-alikes, controls.
ALPHABET = (
    "0123456789,;:. -+/°'\"[]<>{}()?x…nN·\u0323\u0305\u0304\u0301\u0300\u0374\u02b9\u0375"
    "αβγδεϛζηθικλμνξοπϙρστυφχψωϡ ΑΚΘΧΗΔΙΠΓΜ͵ʹ\U0001018A\U00010145\U00010146\U00010147"
    "IVXLCDMivxlcdmjↀↁↂↃↄ·"
    "אבגדהוזחטיכלמנסעפצקרשתךםןףץ׳״"
    "٠١٢٣٤٥٦٧٨٩۰۱۴۵۶०१२३४५६७८९،؛"
    "āīūṛṝḷṅñṭḍṇśṣkhgy"
    "ابجدهوزحطيكلمنسعفصقرشتثخذضظغپ"
    "𒁹𒌋𒐏𒐉𒐕𒀀"
    "oаеорсхΟ\u2329\u232a\u3008\u3009\ufeff\u200b\u200d\t\n\r\x00\x7f\ud7ff\ufffd"
)
_KINDS = ["0123456789", "αβγδεϛζηθικλμνξοπϙρστυφχψωϡ", "ΑΚΘΧΗΔΙΠΓΜ", "IVXLCDM", "ivxlcdmj",
          "ابجدهوزحطيكلمنسعفصقرشتثخذضظغ", "𒁹𒌋𒐏𒐉", ",;", "[]<>{}?"]
MARKS = ["[", "]", "[x]", "[.]", "[...]", "<", ">", "{", "}", "?", "\u0323", "x", "…", "[..]", "[", "]"]


def _rand_char(rng: random.Random) -> str:
    r = rng.random()
    if r < 0.85:
        return rng.choice(ALPHABET)
    if r < 0.97:
        return chr(rng.randrange(0x20, 0x3000))
    return chr(rng.choice([rng.randrange(0x10000, 0x10200), rng.randrange(0x12000, 0x12480),
                           rng.randrange(0xE000, 0xF900)]))


def random_text(rng: random.Random, size: int = 12) -> str:
    return "".join(_rand_char(rng) for _ in range(rng.randrange(0, size + 1)))


def mutate(rng: random.Random, text: str, rounds: int | None = None) -> str:
    """A few random edits of *text*: insert, delete, replace, double, damage marks, joins."""
    for _ in range(rounds if rounds is not None else rng.randrange(1, 4)):
        i = rng.randrange(len(text) + 1)
        op = rng.randrange(10)
        if op == 9 and text:
            # Same kind of character: another digit for a digit, another letter of the script.
            ch = text[min(i, len(text) - 1)]
            pool = next((p for p in _KINDS if ch in p), ALPHABET)
            j = min(i, len(text) - 1)
            text = text[:j] + rng.choice(pool) + text[j + 1:]
        elif op == 0:
            text = text[:i] + _rand_char(rng) + text[i:]
        elif op == 1 and text:
            text = text[:i] + text[i + 1:]
        elif op == 2 and text:
            text = text[:i] + _rand_char(rng) + text[i + 1:]
        elif op == 3:
            text = text[:i] + rng.choice(MARKS) + text[i:]
        elif op == 4 and text:
            j = rng.randrange(i, len(text) + 1)
            text = text[:i] + "[" + text[i:j] + "]" + text[j:]
        elif op == 5 and text:
            j = rng.randrange(i, len(text) + 1)
            text = text[:j] + text[i:j] + text[j:]
        elif op == 6:
            text = text + rng.choice([" ", ",", ";", " days", "°", " Taurus", "ʹ", " γʹ"]) + \
                rng.choice(SEEDS[rng.choice(NOTATIONS)])
        elif op == 7 and text:
            j = rng.randrange(i, len(text) + 1)
            text = text[:i] + "x" * (j - i) + text[j:]
        else:
            import unicodedata
            text = unicodedata.normalize(rng.choice(["NFD", "NFKC", "NFKD", "NFC"]), text)
    return text


def number_text(rng: random.Random) -> tuple[str, str | None]:
    """A text to read and the notation to read it in (None: detected)."""
    notation = rng.choice(NOTATIONS)
    r = rng.random()
    if r < 0.1:
        text = random_text(rng)
    elif r < 0.25:
        text = rng.choice(SEEDS[notation])
    elif r < 0.55:
        text = mutate(rng, rng.choice(SEEDS[notation]), 1)
    else:
        text = mutate(rng, rng.choice(SEEDS[notation]))
    if rng.random() < 0.02:
        # A long paste: the number (or a piece of it) many times over, past the limits.
        piece = text or "1,"
        text = piece * (rng.randrange(500, 7000) // len(piece) + 1)
    return text, (None if rng.random() < 0.6 else rng.choice(NOTATIONS))


def _json(result: dict) -> None:
    """The JSON object of a result must be JSON (no Fraction, no NaN)."""
    json.dumps(result, ensure_ascii=False, allow_nan=False)


#: The input of the case being run, printed with a crash or a slow case.
LAST: list = [None]


def call_read(rng):
    text, notation = number_text(rng)
    unit = rng.choice(UNITS) if rng.random() < 0.2 else None
    LAST[0] = (text, notation, unit)
    r = numcheck.read(text, notation=notation, unit=unit)
    _json(r.to_dict())
    if not r.min <= r.value <= r.max:
        raise AssertionError(f"value {r.value} outside {r.min}..{r.max}")
    # Written back in its notation, the reading reads the same (damage marks included).
    from numcheck.notations import format_reading, render_choice
    written = format_reading(r)
    if r.notation != "quantity":
        try:
            again = numcheck.read(written, notation=r.notation)
        except NumcheckError as err:
            raise AssertionError(f"written back as {written!r}, it does not read: {err}") from None
        if (again.value, again.min, again.max, again.count) != (r.value, r.min, r.max, r.count):
            raise AssertionError(f"written back as {written!r}, it reads differently")
    for _, (expansion, choice) in zip(range(3), r.choices()):
        render_choice(expansion, choice)


def call_identify(rng):
    text, notation = number_text(rng)
    unit = rng.choice(UNITS) if rng.random() < 0.3 else None
    LAST[0] = (text, notation, unit)
    _json(numcheck.identify(text, notation=notation, unit=unit, top=rng.choice([1, 3, 10])).to_dict())


def call_restore(rng):
    text, notation = number_text(rng)
    unit = rng.choice(UNITS) if rng.random() < 0.3 else None
    expect = None
    if rng.random() < 0.2:
        expect = mutate(rng, rng.choice(SEEDS["sexagesimal"]), 1)
    LAST[0] = (text, notation, unit, expect)
    _json(numcheck.restore(text, notation=notation, unit=unit, expect=expect, top=rng.choice([1, 3, 10]),
                     use_catalogue=rng.random() < 0.5).to_dict())


def random_table(rng) -> pd.DataFrame:
    cols = rng.randrange(1, 4)
    rows = rng.randrange(0, 12) if rng.random() < 0.2 else rng.randrange(3, 25)
    names = ["ABCD"[i] if rng.random() < 0.85 else rng.choice(["line", "x", "", "A", "Δ", "1"])
             for i in range(cols)]
    data = {}
    for ci in range(cols):
        kind = rng.randrange(4)
        start = rng.randrange(0, 60 ** 2)
        step = rng.randrange(-200, 200)
        column = []
        for ri in range(rows):
            v = start + step * ri
            if kind == 0:
                cell = f"{v // 60 % 60};{v % 60}" if v >= 0 else str(v)
            elif kind == 1:
                cell = f"{abs(v) // 3600},{abs(v) // 60 % 60},{abs(v) % 60}"
            elif kind == 2:
                cell = rng.choice(SEEDS[rng.choice(NOTATIONS)])
            else:
                cell = str(ri + 1)
            if rng.random() < 0.08:
                cell = mutate(rng, cell, 1)
            if rng.random() < 0.005:
                cell = (cell or "1") * rng.randrange(100, 3000)
            column.append(cell)
        data[names[ci] + ("" if names[ci] not in data else str(ci))] = column
    if rng.random() < 0.05 and rows:
        first = next(iter(data))
        data[first] = [rng.choice([None, 1.5, 3, float("nan")])] + data[first][1:]
    return pd.DataFrame(data, dtype=object)


_DEMO_TABLE: list[list[str]] = []


def _demo_rows() -> list[list[str]]:
    """The lines of the demo ephemeris (an invented table computed by lunar System B)."""
    if not _DEMO_TABLE:
        path = Path(numcheck.__file__).parent / "data" / "demo" / "ephemeris.tsv"
        lines = [ln for ln in path.read_text(encoding="utf-8").splitlines() if ln and not ln.startswith("#")]
        _DEMO_TABLE.extend(ln.split("\t") for ln in lines)
    return _DEMO_TABLE


def call_audit_scheme(rng):
    """A window of a real scheme table with random damage, slips and marks in its cells."""
    rows = _demo_rows()
    header, body = rows[0], rows[1:]
    start = rng.randrange(0, len(body) - 3)
    window = [list(r) for r in body[start:start + rng.randrange(3, 40)]]
    for r in window:
        for j in range(1, len(r)):
            x = rng.random()
            if x < 0.01:
                r[j] = mutate(rng, r[j], 1)
            elif x < 0.05:
                k = rng.randrange(len(r[j]))
                if r[j][k].isdigit():
                    r[j] = r[j][:k] + rng.choice(["x", "[x]", f"[{r[j][k]}]", str((int(r[j][k]) + 1) % 10)]) + \
                        r[j][k + 1:]
            elif x < 0.06:   # the number lost, the sign name kept
                r[j] = re.sub(r"^[\d;,]+", rng.choice(["[...]", "[x,x;x,x]", "x"]), r[j])
    frame = pd.DataFrame({h: [r[i] for r in window] for i, h in enumerate(header)}, dtype=object)
    kwargs = {}
    if rng.random() < 0.2:
        kwargs["relation"] = rng.choice(["B = prev(B) + A mod 360", "B = A + A", "A = B"])
    LAST[0] = (frame.to_dict("list"), kwargs)
    _json(numcheck.audit(frame, **kwargs).to_dict())


def call_audit_frame(rng):
    frame = random_table(rng)
    kwargs = {}
    if rng.random() < 0.2:
        kwargs["notation"] = rng.choice(NOTATIONS)
    if rng.random() < 0.1 and len(frame.columns) > 1:
        a, b = list(frame.columns)[:2]
        kwargs["relation"] = rng.choice([f"{b} = {a} + {a}", f"{b} = prev({b}) + {a} mod 360",
                                         f"{a} = {b} *", random_text(rng)])
    LAST[0] = (frame.to_dict("list"), kwargs)
    _json(numcheck.audit(frame, **kwargs).to_dict())


def call_audit_file(rng, tmp: Path):
    frame = random_table(rng)
    sep = rng.choice(["\t", ",", "  "])
    text = sep.join(frame.columns) + "\n" + "\n".join(sep.join(map(str, row)) for row in frame.values.tolist())
    if rng.random() < 0.3:
        text = mutate(rng, text, rng.randrange(1, 5))
    if rng.random() < 0.1:
        text = random_text(rng, 60)
    suffix = rng.choice([".tsv", ".csv", ".txt", ".tsv"])
    path = tmp / f"table{suffix}"
    LAST[0] = (suffix, text)
    mode = rng.random()
    if mode < 0.05:
        path.write_bytes(b"\xff\xfe\x00" + text.encode("utf-16-le", "surrogatepass"))
    else:
        path.write_text(text, encoding="utf-8", errors="surrogatepass")
    _json(numcheck.audit(path).to_dict())


TEI_HEAD = '<TEI xmlns="http://www.tei-c.org/ns/1.0"><text><body><div type="edition"><ab>'
TEI_TAIL = "</ab></div></body></text></TEI>"


def random_xml(rng) -> bytes:
    pieces = []
    for _ in range(rng.randrange(0, 5)):
        inner = mutate(rng, rng.choice(SEEDS[rng.choice(NOTATIONS)]), rng.randrange(0, 2)) \
            if rng.random() < 0.9 else ""
        for ch in "&<":
            inner = inner.replace(ch, "")
        attrs = ""
        if rng.random() < 0.3:
            attrs += f' value="{rng.choice(["1", "29", "-3", "1/3", "x", "", "1e3"])}"'
        if rng.random() < 0.2:
            attrs += f' type="{rng.choice(["fraction", "cardinal", "x"])}"'
        wrap = rng.random()
        if wrap < 0.15:
            inner = f"<supplied reason=\"lost\">{inner}</supplied>"
        elif wrap < 0.25:
            inner = f'<gap reason="lost" quantity="{rng.randrange(-1, 4)}" unit="character"/>{inner}'
        elif wrap < 0.3:
            inner = f"<unclear>{inner}</unclear>"
        elif wrap < 0.35:
            inner = f"<num>{inner}</num>"
        pieces.append(f"<num{attrs}>{inner}</num>")
    body = " ".join(pieces)
    r = rng.random()
    if r < 0.6:
        doc = TEI_HEAD + body + TEI_TAIL
    elif r < 0.7:
        rows = "".join(f"<row><cell>{p}</cell><cell>{q}</cell></row>" for p, q in zip(pieces, pieces[1:]))
        doc = TEI_HEAD + "</ab><table>" + rows + "</table><ab>" + TEI_TAIL
    elif r < 0.8:
        doc = "<root>" + body + "</root>"
    elif r < 0.85:
        doc = ('<?xml version="1.0"?><!DOCTYPE TEI [<!ENTITY xxe SYSTEM "file:///etc/passwd">]>'
               + TEI_HEAD + "<num>&xxe;</num>" + body + TEI_TAIL)
    else:
        doc = TEI_HEAD + body + TEI_TAIL
        doc = mutate(rng, doc, rng.randrange(1, 6))
    data = doc.encode("utf-8", "surrogatepass")
    if rng.random() < 0.05:
        data = b"\xef\xbb\xbf" + data
    return data


def call_annotate(rng, tmp: Path):
    from numcheck.tei import annotate_bytes
    data = random_xml(rng)
    kwargs = dict(alternatives=rng.choice([0, 0, 1, 3]), fix=rng.random() < 0.3,
                  notation=rng.choice([None, None, None] + NOTATIONS))
    LAST[0] = (data, kwargs)
    if rng.random() < 0.3:
        path = tmp / "in.xml"
        path.write_bytes(data)
        _json(numcheck.annotate(path, tmp / "out.xml" if rng.random() < 0.5 else None, **kwargs).to_dict())
    else:
        _json(annotate_bytes(data, **kwargs)[1].to_dict())


COMMANDS = ["read", "identify", "restore", "audit", "relate", "interval", "annotate", "catalogue"]
OPTIONS = ["--json", "--notation", "-n", "--unit", "-u", "--top", "-k", "--expect", "--no-catalogue",
           "--relation", "--columns", "--calendar", "--values", "--tradition", "--search",
           "--max-years", "--cycles", "--body", "--kind", "-o", "--alternatives", "--fix", "--csv",
           "--report", "--plot"]
VALUES = ["days", "months", "years", "moon", "sun", "venus", "julian", "egyptian", "alexandrian", "jd",
          "0", "1", "-1", "3", "100000000", "1e9", "babylonian", "greek", "modern", "ancient", "x", "",
          "Nabonassar 1 Thoth 1", "-747-02-26", "2000-01-01", "synodic,sidereal", "periods"]


SPANS = ["19", "6585 1/3", "1,49,45;20", "19756/3", "223", "8", "6585.333", "4267", "1/24", "0;59,8"]
DATES = ["Nabonassar 1 Thoth 1", "747 BC Feb 26", "AD 1 Jan 1", "-746-02-26", "JD 1448638",
         "Philip 1 Thoth 1", "1-01-01", "Nabonassar 748 Tybi 12", "Augustus 1 Thoth 1"]
CALENDARS = ["julian", "egyptian", "alexandrian", "jd", "babylonian", "x"]


def call_relate(rng):
    n = rng.choice(SPANS) if rng.random() < 0.3 else mutate(rng, rng.choice(SPANS), rng.randrange(1, 3))
    if rng.random() < 0.1:
        n = rng.choice([float("inf"), float("nan"), -1, 0, 10 ** 400, 1e300, True, None, [1]])
    unit = rng.choice(["years", "months", "days", "day", "x"])
    kwargs = {}
    if rng.random() < 0.3:
        kwargs["values"] = rng.choice(["modern", "ancient", "x"])
    if rng.random() < 0.2:
        kwargs["tradition"] = rng.choice(["babylonian", "greek", "indian", "x"])
    LAST[0] = (n, unit, kwargs)
    _json(numcheck.relate(n, unit, **kwargs).to_dict())


def call_interval(rng):
    def date():
        d = rng.choice(DATES)
        return d if rng.random() < 0.3 else mutate(rng, d, rng.randrange(1, 3))
    a, b, calendar = date(), date(), rng.choice(CALENDARS)
    LAST[0] = (a, b, calendar)
    _json(numcheck.interval(a, b, calendar=calendar).to_dict())


def _plausible_argv(rng, tmp: Path) -> list[str]:
    """A command line as a user would type it: the command, its arguments, some of its options."""
    def num():
        return number_text(rng)[0]

    def pick(*values):
        return rng.choice(values)

    command = rng.choice(COMMANDS)
    text, notation = number_text(rng)
    if command in ("read", "identify", "restore"):
        argv = [command, text]
        if notation and rng.random() < 0.5:
            argv += [pick("--notation", "-n"), notation]
        if rng.random() < 0.4:
            argv += [pick("--unit", "-u"), str(rng.choice(UNITS[1:]))]
        if command != "read" and rng.random() < 0.3:
            argv += [pick("--top", "-k"), pick("1", "3", "0", "-2", "100000", "x")]
        if command == "restore" and rng.random() < 0.3:
            argv += ["--expect", num()]
        if command == "restore" and rng.random() < 0.3:
            argv.append("--no-catalogue")
    elif command == "audit":
        argv = ["audit", str(tmp / pick("t.tsv", "t.tsv", "in.xml", "missing.tsv", "."))]
        if rng.random() < 0.3:
            argv += ["--csv", str(tmp / pick("f.csv", "t.tsv", "f.txt"))]
        if rng.random() < 0.2:
            argv += ["--report", str(tmp / pick("r.html", "t.tsv", "nofolder/r.html"))]
        if rng.random() < 0.1:
            argv += ["--plot", str(tmp / pick("p.png", "p.svg", "p.pdf"))]
        if rng.random() < 0.2:
            argv += ["--relation", pick("B = A + A", "B = prev(B) + A mod 360", "C = A * B", num())]
        if rng.random() < 0.2:
            argv += ["--columns", pick("A", "B", "A,B", "Z", "")]
        if rng.random() < 0.2:
            argv += ["--notation", rng.choice(NOTATIONS)]
    elif command == "relate":
        argv = ["relate"]
        if rng.random() < 0.8:
            argv += [pick(*SPANS) if rng.random() < 0.5 else mutate(rng, pick(*SPANS), 1),
                     "--unit", pick("years", "months", "days", "weeks")]
        else:
            argv += ["--search", pick("venus", "moon", "mars", "sun", "x"),
                     "--max-years", pick("50", "300", "0", "-1", "100000")]
        if rng.random() < 0.3:
            argv += ["--values", pick("modern", "ancient")]
        if rng.random() < 0.2:
            argv += ["--tradition", pick("babylonian", "greek", "indian", "x")]
        if rng.random() < 0.2:
            argv += ["--top", pick("1", "5", "0")]
    elif command == "interval":
        argv = ["interval", pick(*DATES) if rng.random() < 0.5 else mutate(rng, pick(*DATES), 1),
                pick(*DATES) if rng.random() < 0.5 else mutate(rng, pick(*DATES), 1)]
        if rng.random() < 0.4:
            argv += ["--calendar", rng.choice(CALENDARS)]
    elif command == "annotate":
        argv = ["annotate", str(tmp / pick("in.xml", "in.xml", "missing.xml", "t.tsv"))]
        if rng.random() < 0.5:
            argv += ["-o", str(tmp / pick("out.xml", "in.xml", "nofolder/out.xml"))]
        if rng.random() < 0.4:
            argv += ["-k", pick("0", "1", "3", "-1")]
        if rng.random() < 0.2:
            argv.append("--fix")
        if rng.random() < 0.2:
            argv += ["--notation", rng.choice(NOTATIONS)]
    else:
        argv = ["catalogue"]
        if rng.random() < 0.5:
            argv += ["--body", pick("moon", "sun", "venus", "x", "calendar")]
        if rng.random() < 0.3:
            argv += ["--kind", pick("periods", "parameters", "relations")]
        if rng.random() < 0.3:
            argv += ["--tradition", pick("babylonian", "greek", "indian", "islamic", "modern", "x")]
    return argv


def call_cli(rng, tmp: Path):
    from numcheck.cli import main
    if rng.random() < 0.7:
        argv = _plausible_argv(rng, tmp)
    else:
        argv = [rng.choice(COMMANDS)]
        for _ in range(rng.randrange(0, 5)):
            r = rng.random()
            if r < 0.35:
                argv.append(rng.choice(OPTIONS))
            elif r < 0.65:
                argv.append(rng.choice(VALUES))
            elif r < 0.9:
                argv.append(number_text(rng)[0])
            else:
                argv.append(str(tmp / rng.choice(["t.tsv", "in.xml", "missing.xml", "out.html"])))
    if rng.random() < 0.7:
        argv.append("--json")
    (tmp / "t.tsv").write_text("A\tB\n1;0\t2;0\n1;10\t2;20\n1;20\t2;4[x]\n", encoding="utf-8")
    (tmp / "in.xml").write_bytes(random_xml(rng))
    LAST[0] = argv
    out, err = io.StringIO(), io.StringIO()
    with contextlib.redirect_stdout(out), contextlib.redirect_stderr(err):
        try:
            code = main(argv)
        except SystemExit as stop:
            code = stop.code
    if code not in (0, 2, None):
        raise AssertionError(f"exit {code} for {argv!r}: {err.getvalue()[-400:]}")
    if "--json" in argv and code == 0:
        json.loads(out.getvalue())


ENTRY_POINTS = {
    "read": lambda rng, tmp: call_read(rng),
    "identify": lambda rng, tmp: call_identify(rng),
    "restore": lambda rng, tmp: call_restore(rng),
    "relate": lambda rng, tmp: call_relate(rng),
    "interval": lambda rng, tmp: call_interval(rng),
    "audit-frame": lambda rng, tmp: call_audit_frame(rng),
    "audit-scheme": lambda rng, tmp: call_audit_scheme(rng),
    "audit-file": call_audit_file,
    "annotate": call_annotate,
    "cli": call_cli,
}
# Share of the inputs each entry point gets (the cheap ones more).
WEIGHTS = {"read": 30, "identify": 10, "restore": 10, "relate": 6, "interval": 6, "audit-frame": 8,
           "audit-scheme": 6, "audit-file": 8, "annotate": 12, "cli": 9}


class Hang(Exception):
    """An input that took longer than ``--timeout`` seconds (a crash too: numcheck must not hang)."""


def _alarm(signum, frame):
    raise Hang(f"still running after the time allowed ({LAST[0]!r})")


def _where(err: BaseException) -> str:
    tb = traceback.extract_tb(err.__traceback__)
    frames = [f for f in tb if "numcheck" in f.filename] or tb
    last = frames[-1] if frames else None
    return f"{Path(last.filename).name}:{last.lineno}" if last else "?"


def run(n: int, seed: int, only: list[str], slow: float, timeout: int = 120) -> int:
    rng = random.Random(seed)
    if hasattr(signal, "SIGALRM"):
        signal.signal(signal.SIGALRM, _alarm)
    names = [k for k in ENTRY_POINTS if not only or k in only]
    weights = [WEIGHTS[k] for k in names]
    counts: Counter[str] = Counter()
    errors: Counter[str] = Counter()
    crashes: dict[tuple, tuple] = {}
    slowest: list[tuple[float, str, int]] = []
    longest: dict[str, float] = {}
    start = time.perf_counter()
    with tempfile.TemporaryDirectory() as tmpname:
        tmp = Path(tmpname)
        for i in range(n):
            name = rng.choices(names, weights)[0]
            case_seed = rng.randrange(2 ** 32)
            case_rng = random.Random(case_seed)
            t0 = time.perf_counter()
            LAST[0] = None
            if hasattr(signal, "SIGALRM"):
                signal.alarm(timeout)
            try:
                with warnings.catch_warnings():
                    warnings.simplefilter("ignore")
                    ENTRY_POINTS[name](case_rng, tmp)
            except NumcheckError:
                errors[name] += 1
            except Exception as err:  # the crashes this script looks for
                key = (name, type(err).__name__, _where(err))
                if key not in crashes:
                    crashes[key] = (case_seed, f"{type(err).__name__}: {str(err)[:300]}")
                    print(f"CRASH {name} seed={case_seed} at {key[2]}: {crashes[key][1]}\n"
                          f"      input: {LAST[0]!r}", flush=True)
            finally:
                if hasattr(signal, "SIGALRM"):
                    signal.alarm(0)
            took = time.perf_counter() - t0
            counts[name] += 1
            longest[name] = max(longest.get(name, 0.0), took)
            if took > slow:
                slowest.append((took, name, case_seed))
                print(f"SLOW {name} seed={case_seed}: {took:.1f} s; input: {LAST[0]!r}", flush=True)
            if (i + 1) % 5000 == 0:
                print(f"... {i + 1} inputs, {len(crashes)} distinct crashes, "
                      f"{time.perf_counter() - start:.0f} s", flush=True)
    total = time.perf_counter() - start
    print(f"\n{n} inputs in {total:.0f} s (seed {seed}):")
    for name in names:
        print(f"  {name:12} {counts[name]:7} inputs, {errors[name]:7} NumcheckError, "
              f"longest {longest.get(name, 0.0):.2f} s")
    print(f"distinct crashes: {len(crashes)}; inputs slower than {slow} s: {len(slowest)}")
    return 1 if crashes else 0


def replay(name: str, case_seed: int) -> None:
    """Run one case again with its traceback (``--replay NAME SEED``)."""
    with tempfile.TemporaryDirectory() as tmpname:
        rng = random.Random(case_seed)
        ENTRY_POINTS[name](rng, Path(tmpname))


def main(argv=None) -> int:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("n", type=int, nargs="?", default=10_000, help="how many inputs (default 10,000)")
    parser.add_argument("--seed", type=int, default=1)
    parser.add_argument("--only", default="", help=f"comma-separated entry points: {', '.join(ENTRY_POINTS)}")
    parser.add_argument("--slow", type=float, default=5.0, help="report inputs slower than this (seconds)")
    parser.add_argument("--timeout", type=int, default=120,
                        help="an input still running after this many seconds is a hang (a crash)")
    parser.add_argument("--replay", nargs=2, metavar=("ENTRY", "SEED"), help="rerun one case with its traceback")
    args = parser.parse_args(argv)
    if args.replay:
        replay(args.replay[0], int(args.replay[1]))
        return 0
    os.environ.setdefault("MPLBACKEND", "Agg")
    return run(args.n, args.seed, [s for s in args.only.split(",") if s], args.slow, args.timeout)


if __name__ == "__main__":
    sys.exit(main())
