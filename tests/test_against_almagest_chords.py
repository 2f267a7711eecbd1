"""Ptolemy's table of chords (Almagest I.11) recomputed and audited as a function table.

Source: Ptolemy, Almagest I.10-11, chords of arcs from 0;30° to 180° every
half degree, in parts of which the diameter holds 120 (R = 60), to two
sexagesimal places, with a column of sixtieths, the thirtieth of the
difference to the next line (the increase per minute of arc), to three
places (G. J. Toomer, Ptolemy's Almagest, 1984, p. 57-60; the values below
are from memory).  The table is recomputed here from crd a = 120 sin(a/2),
slips are injected, and the audit must recover R = 60 and flag exactly them.
"""

from __future__ import annotations

import json
from fractions import Fraction as F
from pathlib import Path

import pandas as pd
import pytest

from functiongen import argument_text, chord, greek, rounded, sexa, tsv
from numcheck.audit import audit
from numcheck.audit.functions import MODELS

#: Published chords (Almagest I.11, Toomer 1984; from memory): arc -> chord.
PUBLISHED = {
    F(1, 2): "0;31,25", F(1): "1;2,50", F(3, 2): "1;34,15", F(36): "37;4,55",
    F(60): "60;0,0", F(72): "70;32,3", F(90): "84;51,10", F(120): "103;55,23", F(180): "120;0,0",
}


def _value(text: str) -> F:
    whole, _, frac = text.partition(";")
    v = F(int(whole))
    for k, p in enumerate(frac.split(","), 1):
        v += F(int(p), 60 ** k)
    return v


@pytest.mark.parametrize("arc", sorted(PUBLISHED))
def test_the_model_gives_the_published_chords(arc):
    got = float(MODELS["chord"](float(arc), 60.0))
    assert rounded(got, 2) == _value(PUBLISHED[arc]), (arc, got)


def chord_table():
    """Arcs, chords (two places) and sixtieths (three places) as Ptolemy's table lays them out."""

    arcs = [F(i, 2) for i in range(1, 361)]
    chords = [rounded(chord(float(a)), 2) for a in arcs]
    # the sixtieths from the unrounded chords (so they are not the exact thirtieths of the
    # written differences, as in Ptolemy's table); the last line's is 0
    sixtieths = [rounded((chord(float(a) + 0.5) - chord(float(a))) / 30, 3) for a in arcs[:-1]]
    return arcs, chords, sixtieths + [F(0)]


def test_the_first_sixtieths_are_the_published_ones():
    # Almagest I.11 (from memory): the sixtieths of 0;30° and 1° are both 0;1,2,50
    _, _, sixtieths = chord_table()
    assert sexa(sixtieths[0], 3) == "0;1,2,50" and sexa(sixtieths[1], 3) == "0;1,2,50"


# slips (row, column, written) in the scribe's own terms: a digit of one place confused
SLIPS = {
    (23, "chord"): lambda v: v + F(10, 60),          # minutes +10 (a ten-slip)
    (150, "chord"): lambda v: v + F(20, 3600),        # seconds 25 for 5 (κε for ε)
    (301, "chord"): lambda v: v - 1,                  # degrees one less (a unit slip)
    (77, "sixtieths"): lambda v: v + F(10, 60 ** 3),
    (250, "sixtieths"): lambda v: v - F(1, 60 ** 2),
}


def _slipped():
    arcs, chords, sixtieths = chord_table()
    cols = {"chord": list(chords), "sixtieths": list(sixtieths)}
    for (row, col), slip in SLIPS.items():
        cols[col][row - 1] = slip(cols[col][row - 1])
    return arcs, cols


def test_the_audit_recovers_R_and_flags_exactly_the_slips(tmp_path):
    arcs, cols = _slipped()
    path = tmp_path / "chords.tsv"
    path.write_text(tsv(["arc", "chord", "sixtieths"],
                        [[argument_text(a) for a in arcs], [sexa(v, 2) for v in cols["chord"]],
                         [sexa(v, 3) for v in cols["sixtieths"]]]))
    result = audit(path)
    schemes = {s["column"]: s for s in result.to_dict()["schemes"]}
    crd = schemes["chord"]
    assert crd["kind"] == "function" and crd["model"] == "chord" and crd["rounding"] == "rounded"
    p = crd["parameters"][0]
    assert p["name"] == "R" and p["estimate"] == "1,0"   # R = 60 (sexagesimal 1,0)
    assert p["low_decimal"] <= 60 <= p["high_decimal"]
    assert crd["interpolation"] == "none"
    assert schemes["sixtieths"]["model"] == "difference" and schemes["sixtieths"]["divisor"] == 30
    flagged = {(f["row"], f["column"]) for f in result.flags}
    assert flagged == set(SLIPS)
    by = {(f["row"], f["column"]): f for f in result.flags}
    assert by[(23, "chord")]["expected"] == sexa(chord_table()[1][22], 2)
    assert by[(23, "chord")]["kind"] == "ten-slip"
    assert by[(301, "chord")]["expected"] == sexa(chord_table()[1][300], 2)   # 116;2,44, one number
    assert by[(250, "sixtieths")]["expected"] == sexa(chord_table()[2][249], 3)


def test_rounding_is_left_alone_in_the_sixtieths():
    # exact arithmetic on (next − this)/30 disagrees with the three-place sixtieths in most
    # lines; with the table's own rounding as tolerance none of them is flagged
    arcs, chords, sixtieths = chord_table()
    disagree = sum(1 for i in range(359) if (chords[i + 1] - chords[i]) / 30 != sixtieths[i])
    assert disagree > 150
    import pandas as pd
    df = pd.DataFrame({"arc": [argument_text(a) for a in arcs], "chord": [sexa(v, 2) for v in chords],
                       "sixtieths": [sexa(v, 3) for v in sixtieths]})
    assert audit(df).flags == []


def _greek_place(v: F, places: int) -> list[str]:
    n = int(v * 60 ** places)
    digits = []
    for _ in range(places):
        n, d = divmod(n, 60)
        digits.append(d)
    return [greek(n)] + [greek(d) for d in reversed(digits)]


def _greek_arc(a: F) -> str:
    whole = int(a)
    return (greek(whole) if whole else "") + ("∠′" if a != whole else "")


def test_a_greek_chord_table_in_place_columns_with_recognition_defects(tmp_path):
    """Greek letter numerals, one column per place (joined with --join), OCR-like defects."""
    from numcheck.cli import main
    arcs, chords, sixtieths = chord_table()
    rows = []
    for a, c, s in zip(arcs, chords, sixtieths):
        rows.append([_greek_arc(a)] + _greek_place(c, 2) + _greek_place(s, 3))
    # recognition defects: omicron (70) read for the zero sign, a letter dropped, a letter misread
    defects = {}
    rows[4][1] = "ο"                # crd 2;30 = 2;37,4: its degrees 'β' read as omicron
    defects[(5, "crd")] = "ο λζ δ"
    rows[40][3] = "λ"               # crd 20;30 = 21;21,12: seconds 'ιβ' misread as 'λ'
    defects[(41, "crd")] = None
    rows[200][5] = "ι"              # sixtieths of 100;30 = 0;0,40,4: a zero sign read as 'ι'
    defects[(201, "six")] = None
    header = ["arc", "crd_d", "crd_m", "crd_s", "six_d", "six_m", "six_s", "six_t"]
    path = tmp_path / "chords_greek.tsv"
    path.write_text("\n".join("\t".join(r) for r in [header] + rows) + "\n", encoding="utf-8")
    out = __import__("io").StringIO()
    from contextlib import redirect_stdout
    with redirect_stdout(out):
        code = main(["audit", str(path), "--join", "crd=crd_d,crd_m,crd_s",
                     "--join", "six=six_d,six_m,six_s,six_t", "--json"])
    assert code == 0
    d = json.loads(out.getvalue())
    schemes = {s["column"]: s for s in d["schemes"]}
    assert schemes["crd"]["model"] == "chord"
    assert schemes["crd"]["parameters"][0]["estimate"] == "1,0"
    flagged = {(f["row"], f["column"]) for f in d["flags"]}
    assert flagged == set(defects)
    by = {(f["row"], f["column"]): f for f in d["flags"]}
    assert by[(5, "crd")]["written"] == "ο λζ δ"       # the flag shows the whole number
    assert by[(5, "crd")]["expected_value"] == str(F(2) + F(37, 60) + F(4, 3600))
    assert by[(5, "crd")]["expected"] == "β λζ δ"
    assert by[(201, "six")]["expected"] == "𐆊 𐆊 μ δ"     # in the column's own zero sign


# ---- the real text: chords stated in the running text of Almagest I.10 and I.12 -----------

REALDATA = Path(__file__).resolve().parents[1] / ".." / "shared" / "realdata" / "almagest"

#: The chords Ptolemy derives in I.10 (sides of the decagon, pentagon, square, triangle) and
#: the chord of the arc between the tropics, 2ε = 47;42,40, in I.12, as they stand in
#: Heiberg's text (the arcs are those of the propositions, from memory; the chords are read
#: from the file).
TEXT_CHORDS = [(F(36), "λζ δ νε"), (F(72), "ο λβ γ"), (F(90), "πδ να ι"), (F(120), "ργ νε κγ"),
               (F(47) + F(42, 60) + F(40, 3600), "μη λα νε")]


def test_the_chords_in_the_running_text_give_R_60():
    path = REALDATA / "almagest-heiberg-first1k.xml"
    if not path.is_file():
        pytest.skip("the real Almagest text is not here")
    text = path.read_text(encoding="utf-8")
    for _, chord_text in TEXT_CHORDS:
        assert chord_text in text, chord_text
    df = pd.DataFrame({"arc": [argument_text(a) if a.denominator == 1 else "47;42,40"
                               for a, _ in TEXT_CHORDS],
                       "chord": [c for _, c in TEXT_CHORDS]})
    result = audit(df, model="chord=chord")
    s = {x["column"]: x for x in result.to_dict()["schemes"]}["chord"]
    p = s["parameters"][0]
    assert p["estimate"] == "1,0" and p["low_decimal"] <= 60 <= p["high_decimal"]
    assert s["cells_fit"] == 5 and result.flags == []
