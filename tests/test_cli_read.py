"""The read command as a user meets it: JSON, exit codes, messages."""

import json
import subprocess
import sys

import pytest

from numcheck.cli import main


def run_cli(capsys, *argv):
    code = main(list(argv))
    out, err = capsys.readouterr()
    return code, out, err


def test_read_json_of_a_damaged_number(capsys):
    code, out, _ = run_cli(capsys, "read", "29;31,5[x],8,20", "--json")
    assert code == 0
    data = json.loads(out)
    assert data["damaged"] is True
    assert data["min"] == "765433/25920"
    assert data["max"] == "3827489/129600"
    assert data["value"] == "765433/25920"
    assert data["sexagesimal"] == "29;31,50,8,20"
    assert data["floating"] is False
    assert data["notation"] == "sexagesimal"


def test_read_table_shows_marks_and_range(capsys):
    code, out, _ = run_cli(capsys, "read", "2[x];30")
    assert code == 0
    assert "2[x];30" in out
    assert "20;30 to 29;30" in out
    assert "10 readings" in out


def test_bad_input_exits_2_with_position_and_no_traceback(capsys):
    code, out, err = run_cli(capsys, "read", "29;61,3")
    assert code == 2
    assert "column 4" in err and "Traceback" not in err


def test_bad_input_json_is_one_object(capsys):
    code, out, _ = run_cli(capsys, "read", "1,,2", "--json")
    assert code == 2
    assert json.loads(out)["error"] == "NumcheckSyntaxError"


def test_unknown_option_exits_2(capsys):
    with pytest.raises(SystemExit) as info:
        main(["read", "1", "--nonsense"])
    assert info.value.code == 2


def test_console_script_runs():
    proc = subprocess.run([sys.executable, "-m", "numcheck.cli", "read", "1,49,45;20", "--json"],
                          capture_output=True, text=True, check=False)
    assert proc.returncode == 0, proc.stderr
    assert json.loads(proc.stdout)["value"] == "19756/3"


def test_a_reader_that_stops_early_is_no_error():
    # `numcheck catalogue | head -1`: the pipe closes under us; exit 0, no message.
    proc = subprocess.Popen([sys.executable, "-m", "numcheck.cli", "catalogue"],
                            stdout=subprocess.PIPE, stderr=subprocess.PIPE)
    proc.stdout.readline()
    proc.stdout.close()
    _, err = proc.communicate(timeout=60)
    assert proc.returncode == 0, err
    assert b"Traceback" not in err
