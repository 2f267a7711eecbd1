"""Restoration weighed by a relation from mathematics (--satisfies).

Outside values: YBC 7289's diagonal 1;24,51,10 (D. Fowler and E. Robson,
Historia Mathematica 25, 1998), whose square is 1;59,59,59,38,1,40, near 2;
the standard Old Babylonian reciprocals 27 : 2,13,20 and 1,21 : 44,26,40
(common practice; the shared reference table reciprocals-ob.csv).
"""

from fractions import Fraction as F

import pytest

from numcheck import NumcheckError, read, restore
from numcheck.cli import main
from numcheck.restore.mathematics import ROOT_PLACES, parse_relation, solve


def test_square_near_two_restores_ybc_7289():
    result = restore("1;24,5[x],10", satisfies="x^2 = 2", use_catalogue=False)
    best = result.best
    assert best.text == "1;24,5[1],10"
    assert best.probability > 0.5
    assert any("its square is near 2" in r for r in best.reasons)
    assert read("1;24,51,10").value ** 2 == read("1;59,59,59,38,1,40").value


def test_the_root_is_close_enough():
    root = solve(parse_relation("x^2 = 2"))
    assert abs(root * root - 2) < F(1, 60 ** (ROOT_PLACES - 1))
    assert solve(parse_relation("x^3 = 27")) == 3
    assert solve(parse_relation("x*x = 1/4")) == F(1, 2)


@pytest.mark.parametrize("text,relation,best", [
    ("0;2,13,2[x]", "1/x = 27", "0;2,13,2[0]"),
    ("0;0,44,2[x],40", "1/x = 1,21", "0;0,44,2[6],40"),
    ("0;[x]0", "3*x = 1", "0;[2]0"),
])
def test_reciprocals_and_parts(text, relation, best):
    assert restore(text, satisfies=relation, use_catalogue=False).best.text == best


@pytest.mark.parametrize("bad", ["x^2", "y^2 = 2", "x^5 = 2", "x^2 = abc", "0*x = 1", "x^2 = 1[x]"])
def test_bad_relations(bad):
    with pytest.raises(NumcheckError):
        parse_relation(bad)


def test_command_line(capsys):
    assert main(["restore", "1;24,5[x],10", "--satisfies", "x^2 = 2", "--no-catalogue", "--json"]) == 0
    import json

    out = json.loads(capsys.readouterr().out)
    assert out["candidates"][0]["text"] == "1;24,5[1],10"
    assert any(e["kind"] == "mathematics" for e in out.get("evidence", []))
