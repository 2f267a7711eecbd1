"""The command line's output streams: a full disk, a closed stdout, narrow encodings, signals.

Each case runs ``numcheck`` in a subprocess (the streams are the process's
own) and checks the exit code and that no Python traceback is printed
(issue 22: ``--json > /dev/full`` ended in a traceback, ``--json`` with stdout
closed raised AttributeError, ``PYTHONIOENCODING=cp1252`` raised
UnicodeEncodeError on Greek).
"""

from __future__ import annotations

import json
import os
import signal
import subprocess
import sys
import time
from pathlib import Path

import pytest

ROOT = Path(__file__).resolve().parents[1]


def _run(args, *, stdout=subprocess.PIPE, env=None, **kw):
    full_env = dict(os.environ, PYTHONPATH=str(ROOT), **(env or {}))
    return subprocess.run([sys.executable, "-m", "numcheck.cli", *args], stdout=stdout,
                          stderr=subprocess.PIPE, env=full_env, timeout=120, **kw)


@pytest.mark.parametrize("json_flag", [["--json"], []])
def test_a_full_disk_is_a_clear_error(json_flag):
    with open("/dev/full", "wb") as full:
        done = _run(["read", "κθ λα ν η κ", *json_flag], stdout=full)
    assert done.returncode == 2
    assert b"Traceback" not in done.stderr
    assert b"No space left on device" in done.stderr


def test_a_closed_stdout_is_a_clear_error():
    done = subprocess.run(f"{sys.executable} -m numcheck.cli read 'κθ λα' --json >&-", shell=True,
                          stderr=subprocess.PIPE, env=dict(os.environ, PYTHONPATH=str(ROOT)),
                          timeout=120)
    assert done.returncode == 2
    assert b"Traceback" not in done.stderr and b"standard output is closed" in done.stderr


@pytest.mark.parametrize("encoding", ["cp1252", "ascii"])
def test_narrow_encodings_escape_what_they_cannot_hold(encoding):
    done = _run(["read", "κθ λα ν η κ", "--json"], env={"PYTHONIOENCODING": encoding})
    assert done.returncode == 0, done.stderr
    data = json.loads(done.stdout.decode(encoding))
    # 29;31,50,8,20 days (the README's example; the mean synodic month of the
    # Babylonian tradition, common practice) = 765433/25920
    assert data["value"] == "765433/25920" and data["text"] == "κθ λα ν η κ"
    table = _run(["read", "κθ λα ν η κ"], env={"PYTHONIOENCODING": encoding})
    assert table.returncode == 0 and b"Traceback" not in table.stderr
    assert b"\\u03ba" in table.stdout           # the letters escaped, not lost


def test_sigterm_stops_a_batch_cleanly_and_it_resumes(tmp_path):
    src = tmp_path / "in"
    src.mkdir()
    for i in range(400):
        (src / f"t{i:03d}.tsv").write_text("n\tA\n1\t2\n2\t4\n3\t6\n", encoding="utf-8")
    args = ["audit", str(src), "--summary", str(tmp_path / "s"), "--workers", "1", "--json"]
    code = ("import numcheck.limits as L; L.BATCH_JOURNAL_ENTRIES = 5; "
            f"from numcheck.cli import main; raise SystemExit(main({args!r}))")
    proc = subprocess.Popen([sys.executable, "-c", code], stdout=subprocess.DEVNULL,
                            stderr=subprocess.PIPE, env=dict(os.environ, PYTHONPATH=str(ROOT)))
    journal = tmp_path / "s" / ".numcheck-run"
    deadline = time.monotonic() + 120
    while time.monotonic() < deadline and len(list(journal.glob("part-*.jsonl"))) < 2:
        time.sleep(0.05)
    proc.send_signal(signal.SIGTERM)
    _, err = proc.communicate(timeout=120)
    assert proc.returncode == 128 + signal.SIGTERM, err
    assert b"Traceback" not in err and b"stopped by a signal" in err
    assert not [p for p in tmp_path.rglob("*.tmp")]                 # no temporary file left
    done = _run(args)
    assert done.returncode == 0
    out = json.loads(done.stdout)
    assert out["summary"]["files"] == 400 and 0 < out["resumed"] < 400
