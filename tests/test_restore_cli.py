"""The restore command as a user meets it: JSON, the table, exit codes.

Published value: the mean synodic month 29;31,50,8,20 days (Neugebauer,
ACT 1955, lunar System B) = 765433/25920 days.
"""

import json

from numcheck.cli import main


def run_cli(capsys, *argv):
    code = main(list(argv))
    out, err = capsys.readouterr()
    return code, out, err


def test_restore_json_has_the_design_fields(capsys):
    code, out, err = run_cli(capsys, "restore", "29;31,5[x],8,20", "--unit", "days", "--top", "3", "--json")
    assert code == 0, err
    data = json.loads(out)
    assert data["space"] == 10
    assert len(data["candidates"]) == 3
    first = data["candidates"][0]
    assert first["text"] == "29;31,5[0],8,20"
    assert first["value"] == "765433/25920"
    assert 0.5 < first["probability"] <= 1.0
    assert any("bab_month_sysB" in r for r in first["reasons"])
    probs = [c["probability"] for c in data["candidates"]]
    assert probs == sorted(probs, reverse=True) and sum(probs) <= 1.0
    assert "not readings" in data["suggestion"]


def test_restore_table_says_these_are_suggestions(capsys):
    code, out, _ = run_cli(capsys, "restore", "29;31,[4]0,8,20", "--expect", "29;31,50,8,20",
                           "--no-catalogue", "--top", "2")
    assert code == 0
    assert "29;31,[5]0,8,20" in out
    assert "29;31,[4]0,8,20 (edition)" in out
    assert "suggestions for the editor's judgement, not readings" in out.replace("\n", " ")
    assert "6 readings are possible" in out


def test_restore_bad_input_exits_2(capsys):
    code, out, err = run_cli(capsys, "restore", "29;61,[x]")
    assert code == 2
    assert "Traceback" not in err
    assert "0 to 59" in err


def test_restore_bad_top_exits_2(capsys):
    try:
        code = main(["restore", "5[x]", "--top", "0"])
    except SystemExit as stop:
        code = stop.code
    _, err = capsys.readouterr()
    assert code == 2
    assert "1 or more" in err


def test_restore_bad_expect_exits_2(capsys):
    code, out, err = run_cli(capsys, "restore", "5[x]", "--expect", "5;;3", "--no-catalogue")
    assert code == 2
    assert "Traceback" not in err
