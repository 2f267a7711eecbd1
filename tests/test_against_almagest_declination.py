"""Ptolemy's table of the declination (Almagest I.15) and the solar equation (Almagest III.6).

Sources: Ptolemy, Almagest I.12 and I.15: the obliquity ε = 23;51,20 and the
table of the arcs of the meridian between equator and ecliptic for every
degree of longitude, to seconds; Almagest III.4-6: the solar eccentricity
e = 2;30 in parts of which the eccentre's radius is 60, the table of the
solar equation (maximum 2;23) to minutes (G. J. Toomer, Ptolemy's Almagest,
1984; values from memory).  The tables are recomputed from the formulas,
slips are injected, and the audit must recover the parameter within the
interval its precision allows and flag exactly the slips.
"""

from __future__ import annotations

from fractions import Fraction as F

from functiongen import argument_text, declination, rounded, sexa, solar_equation, tsv
from numcheck.audit import audit

EPSILON = F(23) + F(51, 60) + F(20, 3600)    # Almagest I.12 (from memory)
ECCENTRICITY = F(5, 2)                        # Almagest III.4, 2;30 of 60 (from memory)


def _audit(tmp_path, name, header, columns, **kw):
    path = tmp_path / name
    path.write_text(tsv(header, columns))
    result = audit(path, **kw)
    return result, {s["column"]: s for s in result.to_dict()["schemes"]}


def test_declination_table_gives_the_obliquity(tmp_path):
    lams = [F(i) for i in range(1, 91)]
    dec = [rounded(declination(float(x), float(EPSILON)), 2) for x in lams]
    assert sexa(dec[-1], 2) == "23;51,20"   # δ(90°) = ε
    slips = {12: dec[11] + F(1, 60), 47: dec[46] - F(10, 3600), 80: dec[79] + F(30, 3600)}
    written = [slips.get(i + 1, v) for i, v in enumerate(dec)]
    result, schemes = _audit(tmp_path, "decl.tsv", ["lon", "decl"],
                             [[argument_text(x) for x in lams], [sexa(v, 2) for v in written]])
    s = schemes["decl"]
    assert s["model"] == "declination" and s["rounding"] == "rounded" and s["interpolation"] == "none"
    p = s["parameters"][0]
    assert p["name"] == "ε" and p["estimate"] == "23;51,20"
    assert p["low_decimal"] <= float(EPSILON) <= p["high_decimal"]
    assert p["high_decimal"] - p["low_decimal"] < 1 / 3600    # seconds pin ε within a second
    assert {f["row"] for f in result.flags} == set(slips)
    by = {f["row"]: f for f in result.flags}
    assert by[12]["expected"] == sexa(dec[11], 2)


def test_solar_equation_gives_the_eccentricity(tmp_path):
    args = [F(3 * i) for i in range(1, 61)]          # every 3° to 180°
    eq = [rounded(solar_equation(float(a), float(ECCENTRICITY)), 1) for a in args]
    assert max(eq) == F(2) + F(23, 60)               # Almagest III.6: the greatest equation 2;23
    slips = {7: eq[6] + F(10, 60), 33: eq[32] - 1, 50: eq[49] + F(2, 60)}
    written = [slips.get(i + 1, v) for i, v in enumerate(eq)]
    result, schemes = _audit(tmp_path, "sun.tsv", ["anomaly", "equation"],
                             [[argument_text(a) for a in args], [sexa(v, 1) for v in written]])
    s = schemes["equation"]
    assert s["model"] == "equation"
    p = s["parameters"][0]
    assert p["name"] == "e" and p["estimate"] == "2;30"
    assert p["low_decimal"] <= 2.5 <= p["high_decimal"]
    assert {f["row"] for f in result.flags} == set(slips)


def test_a_truncated_table_is_named_truncated(tmp_path):
    lams = [F(i) for i in range(1, 91)]
    dec = [rounded(declination(float(x), float(EPSILON)), 1, truncate=True) for x in lams]
    result, schemes = _audit(tmp_path, "trunc.tsv", ["lon", "decl"],
                             [[argument_text(x) for x in lams], [sexa(v, 1) for v in dec]])
    s = schemes["decl"]
    assert s["rounding"] == "truncated"
    p = s["parameters"][0]
    assert p["low_decimal"] <= float(EPSILON) <= p["high_decimal"]
    assert result.flags == []


def test_the_model_can_be_forced(tmp_path):
    lams = [F(i) for i in range(1, 91)]
    dec = [rounded(declination(float(x), float(EPSILON)), 2) for x in lams]
    result, schemes = _audit(tmp_path, "forced.tsv", ["lon", "decl"],
                             [[argument_text(x) for x in lams], [sexa(v, 2) for v in dec]],
                             model="decl=declination")
    assert schemes["decl"]["model"] == "declination"


def test_a_declination_table_by_degrees_of_the_signs(tmp_path):
    # the argument written as degrees within the zodiacal signs (common practice of the tables)
    signs = ["Aries", "Taurus", "Gemini", "Cancer", "Leo", "Virgo", "Libra", "Scorpius",
             "Sagittarius", "Capricornus", "Aquarius", "Pisces"]
    lams = [F(2 * i) for i in range(1, 180)]
    dec = [rounded(declination(float(x), float(EPSILON)), 2) for x in lams]
    written = list(dec)
    written[50] += F(1, 60)
    result, schemes = _audit(tmp_path, "signs.tsv", ["lon", "decl"],
                             [[f"{int(x % 30)} {signs[int(x // 30)]}" for x in lams],
                              [sexa(v, 2) for v in written]])
    assert schemes["decl"]["parameters"][0]["estimate"] == "23;51,20"
    assert [(f["row"], f["expected"]) for f in result.flags] == [(51, sexa(dec[50], 2))]
