"""ATF files: lines and labels, number words across brackets, traps, annotate FILE.atf, audit FILE.atf.

The texts here are invented (a school at the invented town of Kurlil); the
values follow the ATF conventions (Oracc/CDLI numbers.xdf, math.xdf) and the
reciprocal pairs are recomputed with exact fractions.
"""

from __future__ import annotations

import json
from fractions import Fraction as F

import pytest
from hypothesis import given
from hypothesis import strategies as st

from numcheck.atf import number_words, read_atf_text, text_lines
from numcheck.audit import audit
from numcheck.cli import main

INVENTED = """&X900002 = Kurlil ration list 3 (invented)
#atf: lang sux
@obverse
@column 1
1. 5(disz) sila3 kasz [n(disz) sila3 ninda
2'. 3(disz)] gin2 i3 2(u) 4(disz) sze gur
#tr.en: 5 litres of beer ...
$ rest of column broken
@reverse
1. |SZU+LAGAB| 2/3(disz) sila3 5(disz) gin2 sum
2. 1(disz) gin2 la2 igi-6(disz)-gal2 ku3-babbar
3. mul1(IKU)gana₂ {d}30 u4 8(disz)-kam
"""


def test_labels_and_what_is_left_alone():
    lines = text_lines(INVENTED)
    assert [(l.label, l.text_id) for l in lines] == [
        ("o i 1", "X900002"), ("o i 2'", "X900002"), ("r 1", "X900002"), ("r 2", "X900002"),
        ("r 3", "X900002")]
    assert all("tr.en" not in l.content and "broken" not in l.content for l in lines)


def test_brackets_are_followed_over_the_whole_line_and_across_lines_not():
    first, second = text_lines(INVENTED)[:2]
    found, _ = number_words(first.content)
    assert [(w.text, w.reading.slots[0].status.value) for w in found] == [
        ("5(disz)", "read"), ("[n(disz)", "lost")]
    found, _ = number_words(second.content)
    # a bracket closed without being opened on its line: the number before it is still read
    assert [w.text for w in found] == ["3(disz)]", "2(u) 4(disz)"]
    assert found[1].unit == "gur"


def test_quantities_in_the_finest_unit_written():
    lines = text_lines(INVENTED)
    found, _ = number_words(lines[2].content)
    assert found[-1].quantity[:4] == (F(45), F(45), F(45), "gin2")
    found, _ = number_words(lines[3].content)
    assert found[-1].quantity[0] == F(5, 6) and found[-1].quantity[3] == "gin2"


def test_numerals_that_are_no_numbers_are_named_not_read():
    found, traps = number_words(text_lines(INVENTED)[4].content)
    assert [w.text for w in found] == ["8(disz)-kam"]
    assert len(traps) == 2 and "sign name" in traps[0].reason and "Sîn" in traps[1].reason
    # an omen line opening with 1 (DIŠ 'if'); 30 and 20 beside 'u' are gods
    found, traps = number_words("1 d30 ina la si-ma-ni IGI-ma")
    assert not found and "šumma" in traps[0].reason
    found, traps = number_words("[1 UD 14-KÁM 30 u 20 it]-ti")
    assert [w.text for w in found] == ["14-KÁM"]
    assert [t.word for t in traps] == ["[1", "30", "20"]
    # 9 SI GIN: the north wind blew, not nine fingers
    found, _ = number_words("9 SI GIN")
    assert found[0].unit is None


def test_a_word_that_cannot_be_read_is_reported_and_the_rest_still_read():
    result = read_atf_text("&X1 = t\n@obverse\n1. 7(N14) sze 3(u) sze\n")
    out = result.to_dict()
    assert out["numbers"] == 2 and out["read"] == 1 and out["unread"] == 1
    assert "proto-cuneiform" in out["nums"][0]["error"]


def run_cli(capsys, *argv):
    code = main(list(argv))
    captured = capsys.readouterr()
    return code, captured.out, captured.err


def test_annotate_lists_every_number_and_writes_nothing_unless_asked(tmp_path, capsys):
    src = tmp_path / "kurlil.atf"
    src.write_text(INVENTED, encoding="utf-8")
    before = sorted(p.name for p in tmp_path.iterdir())
    code, out, _ = run_cli(capsys, "annotate", str(src), "--json")
    assert code == 0 and sorted(p.name for p in tmp_path.iterdir()) == before
    data = json.loads(out)
    assert data["numbers"] == 9 and data["read"] == 9 and len(data["not_numbers"]) == 2
    lost = next(n for n in data["nums"] if n["word"] == "[n(disz)")
    assert (lost["label"], lost["min"], lost["max"], lost["status"], lost["range"]) == \
        ("o i 1", "1", "9", "lost", True)
    gur = next(n for n in data["nums"] if n["word"] == "2(u) 4(disz)")
    assert (gur["value"], gur["unit"], gur["system"]) == ("24", "gur", "capacity")
    code, out, _ = run_cli(capsys, "annotate", str(src), "-o", str(tmp_path / "numbers.tsv"), "--json")
    assert code == 0 and json.loads(out)["output"].endswith("numbers.tsv")
    rows = (tmp_path / "numbers.tsv").read_text(encoding="utf-8").splitlines()
    assert rows[0].startswith("text_id\tlabel\tword") and len(rows) == 10
    code, _, err = run_cli(capsys, "annotate", str(src), "-o", str(src))
    assert code == 2 and "same file" in err


def test_annotate_prints_a_table(tmp_path, capsys):
    src = tmp_path / "kurlil.atf"
    src.write_text(INVENTED, encoding="utf-8")
    code, out, _ = run_cli(capsys, "annotate", str(src))
    assert code == 0 and "9 number words, 9 read" in out and "not read as a number" in out


# -- audit: a reciprocal table in ATF audits as the same table in TSV -------------

RECIPROCALS = [(2, 30), (3, 20), (4, 15), (5, 12), (6, 10), (8, 450), (9, 400), (10, 6), (12, 5),
               (15, 4), (16, 225), (18, 200), (20, 3), (24, 150), (25, 144), (27, 8000), (30, 2),
               (32, 6750), (36, 100), (40, 90), (45, 80), (48, 75), (50, 72), (54, 4000), (60, 1),
               (64, 3375), (72, 50), (75, 48), (80, 45), (81, 160000)]


def _places(n: int) -> list[int]:
    out = []
    while True:
        n, d = divmod(n, 60)
        out.append(d)
        if not n:
            return out[::-1]


def _cdli(n: int) -> str:
    # the editor's transliteration of a floating number: tens and units of each place (common practice)
    parts = []
    for d in _places(n):
        t, u = divmod(d, 10)
        parts += ([f"{t}(u)"] if t else []) + ([f"{u}(disz)"] if u else [])
    return " ".join(parts)


def _comma(n: int) -> str:
    return ",".join(str(d) for d in _places(n))


def test_the_reciprocal_pairs_are_right():
    for n, igi in RECIPROCALS:
        product = F(n * igi)
        while product % 60 == 0:
            product /= 60
        assert product == 1, (n, igi)


def _write(tmp_path, rows, style):
    if style == "tsv":
        path = tmp_path / "igi.tsv"
        path.write_text("n\tigi\n" + "".join(f"{_comma(a)}\t{_comma(b)}\n" for a, b in rows))
    else:
        path = tmp_path / f"igi_{style}.atf"
        lines = ["&X900003 = Kurlil reciprocal table (invented)"]
        if style == "math":
            lines.append("#atf: use math")
        lines.append("@obverse")
        for k, (a, b) in enumerate(rows, start=1):
            if style == "math":
                lines.append(f"{k}. igi {'.'.join(str(d) for d in _places(a))} gal₂-bi "
                             f"{'.'.join(f'{d:02d}' if i else str(d) for i, d in enumerate(_places(b)))}")
            else:
                lines.append(f"{k}. igi {_cdli(a)} gal2-bi {_cdli(b)}")
        path.write_text("\n".join(lines) + "\n", encoding="utf-8")
    return path


def _summary(result):
    return ([(s.kind, s.params().get("of") is not None) for s in result.schemes],
            [(f["row"], f["kind"]) for f in result.flags])


@pytest.mark.parametrize("style", ["cdli", "math"])
def test_a_reciprocal_table_in_atf_audits_as_the_converted_table(tmp_path, style):
    tsv = audit(_write(tmp_path, RECIPROCALS, "tsv"), notation="cuneiform")
    atf = audit(_write(tmp_path, RECIPROCALS, style))
    assert _summary(atf) == _summary(tsv)
    assert atf.flags == [] and [s.kind for s in atf.schemes] == ["reciprocal"]


@pytest.mark.parametrize("style,written,expected", [
    ("cdli", "2(disz) 1(u) 4(disz) 2(u)", "2(disz) 1(u) 3(disz) 2(u)"),
    ("math", "2.14.20", "2.13.20"),
])
def test_a_slip_is_found_alike_and_the_correction_is_written_in_atf(tmp_path, style, written, expected):
    rows = list(RECIPROCALS)
    rows[15] = (27, 2 * 3600 + 14 * 60 + 20)          # 2,13,20 written 2,14,20
    tsv = audit(_write(tmp_path, rows, "tsv"), notation="cuneiform")
    atf = audit(_write(tmp_path, rows, style))
    assert _summary(atf) == _summary(tsv)
    out = atf.to_dict()
    (flag,) = [f for f in out["flags"] if f["kind"] != "carried-forward"]
    assert (flag["row"], flag["kind"], flag["written"], flag["expected"]) == (16, "unit-slip", written, expected)


_LINE_PIECES = ["5(disz)", "[n(disz)", "3(disz)]", "sila3", "gin2", "kasz", "la2", "igi-6(disz)-gal2",
                "{d}30", "u", "20", "1", "1.40", "ME", "43", "2/3(disz)", "[x]", "x", "[...]", "#", "?",
                "_", "|SZU+LAGAB|", "mul1(IKU)gana₂", "2(u)", "4(ban2)#", "1(asz@t)", "sze", "gur",
                "KUŠ₃", "SI", "GIN", "<", ">", "<<", ">>", "(", ")", "7(N14)", "-kam", "@v", "00", "oo"]


@given(st.lists(st.lists(st.sampled_from(_LINE_PIECES), max_size=8).map(" ".join), max_size=5),
       st.booleans())
def test_any_atf_lines_are_read_and_never_crash(lines, math):
    source = "&X1 = t\n" + ("#atf: use math\n" if math else "") + "@obverse\n" + \
        "".join(f"{k}. {line}\n" for k, line in enumerate(lines, start=1))
    out = read_atf_text(source).to_dict()
    assert out["read"] + out["unread"] == out["numbers"]
    for n in out["nums"]:
        if "error" not in n:
            assert F(n["min"]) <= F(n["value"]) <= F(n["max"])


def test_an_unreadable_number_of_an_atf_table_is_reported_and_the_rest_audited(tmp_path):
    path = _write(tmp_path, RECIPROCALS, "cdli")
    text = path.read_text(encoding="utf-8").replace("igi 1(u) 2(disz) gal2-bi 5(disz)",
                                                     "igi 1(u) 2(disz) gal2-bi 12(disz)")
    path.write_text(text, encoding="utf-8")
    result = audit(path)
    out = result.to_dict()
    assert [s["kind"] for s in out["schemes"]] == ["reciprocal"]
    assert [(u["row"], u["text"]) for u in result.table.unreadable] == [(9, "12(disz)")]


def test_annotate_reads_a_mathematical_text_as_floating_place_value(tmp_path, capsys):
    src = tmp_path / "problem.atf"
    src.write_text("&X900004 = Kurlil problem text (invented)\n@obverse\n"
                   "1. i-gi 8(disz) i-li 7(disz) 3(u)\n2. 3(u) a-na 2(disz)\n", encoding="utf-8")
    code, out, _ = run_cli(capsys, "annotate", str(src), "--notation", "atf-math", "--json")
    nums = json.loads(out)["nums"]
    assert code == 0 and [(n["word"], n["value"], n["floating"]) for n in nums] == [
        ("8(disz)", "8", True), ("7(disz) 3(u)", "450", True), ("3(u)", "30", True), ("2(disz)", "2", True)]
    code, out, _ = run_cli(capsys, "annotate", str(src), "--json")
    assert [n["floating"] for n in json.loads(out)["nums"]] == [False, True, False, False]
    code, _, err = run_cli(capsys, "annotate", str(src), "--notation", "greek")
    assert code == 2 and "atf-math" in err
