"""Short fragments (8-20 lines) of published schemes: fitted, slips flagged exactly, scheme named.

Parameters as in numcheck/data/schemes.csv and ../shared/reference/schemes.csv:
* lunar System B, column F: d = 0;36, M = 15;16,5, m = 11;5,5, P = 251/18
  (Neugebauer, ACT 1955 vol. 1 and HAMA 1975; from memory, arithmetic exact);
* lunar System B, column A: d = 0;18, M = 30;1,59, m = 28;10,39,40
  (ACT vol. 1; d checked, M and m from memory);
* Jupiter System B: d = 1;48, M = 38;2, m = 28;15,30 (ACT vol. 2, Aaboe; from memory);
* lunar System A, column Φ: d = 0;2,45,55,33,20, M = 2;17,4,48,53,20,
  m = 1;57,47,57,46,40 (ACT vol. 1, from memory), P = 6247/448 (de Jong 2017,
  6247 months = 6695 anomalistic months, checked);
* MUL.APIN daylight: 4 and 2 mina, 0;20 a month (Hunger and Pingree 1989, from memory).
The fragments are generated with the reflection rule of tests/tablegen.py.
"""

from __future__ import annotations

import random
from fractions import Fraction as F

import pandas as pd
import pytest

from numcheck.audit import audit
from numcheck.reading import sexagesimal_text as sxt

from tablegen import sx, zigzag

SCHEMES = {
    "ACT-LUN-B-F": dict(d=sx("0;36"), M=sx("15;16,5"), m=sx("11;5,5")),
    "ACT-LUN-B-A": dict(d=sx("0;18"), M=sx("30;1,59"), m=sx("28;10,39,40")),
    "ACT-JUP-B": dict(d=sx("1;48"), M=sx("38;2"), m=sx("28;15,30")),
}


def _turns(ys):
    """Rows (0-based) where the direction changes (the line after the extreme)."""
    return [i for i in range(1, len(ys) - 1) if (ys[i] - ys[i - 1]) * (ys[i + 1] - ys[i]) < 0]


def _slip(value: F, rng) -> F:
    """A unit or ten slip in the last place (of two): it never lands on a turn pair's value."""
    return value + rng.choice((1, -1)) * rng.choice((1, 10)) * F(1, 3600)


def _fragment(sid, n, seed, slips):
    p = SCHEMES[sid]
    rng = random.Random(seed)
    start = p["m"] + (p["M"] - p["m"]) * F(rng.randrange(1, 20), 20)
    start = start - start % p["d"] + p["m"] % p["d"]     # a value on the scheme's grid
    ys = zigzag(n, start=start, rising=rng.random() < 0.5, **p)
    txt = [sxt(y) for y in ys]
    turns = _turns(ys)
    rows = []
    if turns:
        # slips next to a turn: on the extreme's line or the one after it
        t = turns[0]
        for r in (t, t + 2, t - 1, t + 1, t - 2):
            if 1 <= r < n - 1 and len(rows) < slips and all(abs(r - q) > 1 for q in rows):
                rows.append(r)
    for r in rows:
        txt[r] = sxt(_slip(ys[r], rng))
    return ys, txt, sorted(rows), turns


@pytest.mark.parametrize("sid", sorted(SCHEMES))
@pytest.mark.parametrize("n", [10, 14, 20])
@pytest.mark.parametrize("seed", range(4))
def test_fragment_with_a_turn_and_slips_is_fitted_flagged_and_named(sid, n, seed):
    ys, txt, rows, turns = _fragment(sid, n, seed, slips=1 + seed % 2)
    if not turns or not rows:
        pytest.skip("this fragment has no turn")
    if any(abs(a - b) == 1 for a in rows for b in rows if a != b):
        pytest.skip("two adjacent slips cannot be told from one")
    r = audit(pd.DataFrame({"F": txt}))
    (s,) = r.schemes
    assert s.kind == "zigzag"
    p = SCHEMES[sid]
    assert (s.frame.fraction(s.d), s.frame.fraction(s.M), s.frame.fraction(s.m)) == \
        (p["d"], p["M"], p["m"])
    published = s.to_dict()["published"]
    assert published and published[0]["id"] == sid
    # its own fit has the published parameters, or (a short fragment whose
    # slips leave too few good turn pairs) the published scheme explains it best
    assert published[0]["agreement"] == "parameters" or published[0].get("used")
    flagged = sorted(f["row"] - 1 for f in r.flags)
    assert flagged == rows
    for f in r.flags:
        assert f["expected"] == sxt(ys[f["row"] - 1])


def test_the_issue_fragment_slips_at_both_turns():
    # d = 0;3,36, M = 2;17, m = 1;50 (an invented scheme), 20 lines, a slip on
    # the line of each turn: M and m stay, and only the two slips are flagged.
    ys = zigzag(20, M=sx("2;17"), m=sx("1;50"), d=sx("0;3,36"), start=sx("2;0"))
    txt = [sxt(y) for y in ys]
    txt[5] = sxt(ys[5] + sx("0;1"))
    txt[12] = sxt(ys[12] + sx("0;0,10"))
    txt[8] = "2;[x],12"
    r = audit(pd.DataFrame({"F": txt}))
    (s,) = r.schemes
    assert s.kind == "zigzag"
    assert s.params()["M"]["sexagesimal"] == "2;17" and s.params()["m"]["sexagesimal"] == "1;50"
    assert [(f["row"], f["expected"]) for f in r.flags] == [(6, sxt(ys[5])), (13, sxt(ys[12]))]
    (top,) = {x["text"] for x in r.to_dict()["restorations"] if x["probability"] > 0.5}
    assert top == "2;[5],12"


def test_a_one_turn_fragment_names_its_unknown_extreme_and_flags_nothing_beyond():
    # 8 lines of an invented zigzag with one maximum only: m cannot be known.
    ys = zigzag(8, M=sx("2;17"), m=sx("1;0"), d=sx("0;3,36"), start=sx("2;0"))
    txt = [sxt(y) for y in ys]
    r = audit(pd.DataFrame({"F": txt}))
    (s,) = r.schemes
    assert s.unknown == ["m"] and s.params()["unknown"] == ["m"]
    assert "m not determined" in s.describe()
    assert r.flags == []


def test_a_one_turn_fragment_of_column_f_takes_m_from_the_published_scheme():
    p = SCHEMES["ACT-LUN-B-F"]
    ys = zigzag(9, start=sx("13;10,35"), **p)       # one maximum only
    txt = [sxt(y) for y in ys]
    txt[4] = sxt(ys[4] + sx("0;0,10"))
    r = audit(pd.DataFrame({"F": txt}))
    (s,) = r.schemes
    assert s.params()["m"]["sexagesimal"] == "11;5,5"        # ACT vol. 1 (from memory)
    assert s.published[0]["id"] == "ACT-LUN-B-F" and s.published[0]["label"] == "System B, column F"
    assert [f["row"] for f in r.flags] == [5]


def test_period_of_column_f_is_the_beat_of_251_and_269_months():
    p = SCHEMES["ACT-LUN-B-F"]
    ys = zigzag(30, start=sx("13;10,35"), **p)
    r = audit(pd.DataFrame({"F": [sxt(y) for y in ys]}))
    rel = r.schemes[0].params()["period_relation"]
    assert rel["id"] == "bab_251_269" and rel["how"] == "beat" and rel["period"] == "251/18"


def test_system_a_phi_period_is_tied_to_6247_and_6695_months():
    # M, m, d from memory (ACT vol. 1): they give P = 6247/448 exactly.
    ys = zigzag(30, M=sx("2;17,4,48,53,20"), m=sx("1;57,47,57,46,40"),
                d=sx("0;2,45,55,33,20"), start=sx("2;0"))
    r = audit(pd.DataFrame({"Φ": [sxt(y) for y in ys]}))
    (s,) = r.schemes
    p = s.params()
    assert p["period_lines"]["value"] == "6247/448"
    assert p["period_relation"]["id"] == "bab_sysA_6247"
    assert p["period_relation"]["how"] == "beat"      # 6247 / (6695 - 6247)
    assert s.published[0]["id"] == "ACT-LUN-A-PHI"


def test_daylight_period_of_12_months_names_no_relation_of_units():
    # MUL.APIN (from memory): 4 mina at the longest day, 2 at the shortest, 0;20 a month.
    ys = zigzag(15, M=F(4), m=F(2), d=F(1, 3), start=F(3))
    r = audit(pd.DataFrame({"day": [sxt(y) for y in ys]}))
    (s,) = r.schemes
    p = s.params()
    assert p["period_lines"]["value"] == "12"
    rel = p.get("period_relation")
    assert rel is None or "beru" not in rel["statement"]
    assert s.published[0]["id"] == "MULAPIN-DAYLIGHT"


def test_stated_scheme_by_parameters_and_by_catalogue_id():
    p = SCHEMES["ACT-LUN-B-F"]
    ys = zigzag(8, start=sx("13;10,35"), **p)
    txt = [sxt(y) for y in ys]
    txt[3] = sxt(ys[3] + sx("0;1"))
    for kw in ({"scheme": "F: zigzag d=0;36 M=15;16,5 m=11;5,5"}, {"scheme": "F: ACT-LUN-B-F"},
               {"relation": "F = zigzag(d=0;36, M=15;16,5, m=11;5,5)"}):
        r = audit(pd.DataFrame({"F": txt}), **kw)
        (s,) = r.schemes
        assert s.stated and s.params()["m"]["sexagesimal"] == "11;5,5"
        assert [(f["row"], f["expected"]) for f in r.flags] == [(4, sxt(ys[3]))]


def test_stated_scheme_errors_name_what_was_found():
    from numcheck.errors import NumcheckError
    df = pd.DataFrame({"F": ["1", "2", "3"]})
    for bad in ("F zigzag", "G: zigzag d=1", "F: zigzag M=3", "F: zigzag d=1 q=2", "F: NO-SUCH-ID"):
        with pytest.raises(NumcheckError):
            audit(df, scheme=bad)
