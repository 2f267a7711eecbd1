"""Determinism: the same input gives byte-identical JSON (and files) from every command.

Two fresh interpreters with different ``PYTHONHASHSEED`` (so that set and
dict orders built from hashed strings differ) run every command on the same
inputs; their ``--json`` outputs and every file written must be identical
byte for byte.  Set order, float formatting or an unstable sort would show
here.
"""

from __future__ import annotations

import json
import os
import subprocess
import sys
from pathlib import Path

import pytest

DEMO = Path(__file__).resolve().parents[1] / "numcheck" / "data" / "demo"

# One child runs every command in-process (one interpreter start per hash seed).
CHILD = r'''
import contextlib, hashlib, io, json, sys, warnings
from pathlib import Path
from numcheck.cli import main

demo = Path(sys.argv[1])
commands = {
    "read sexagesimal": ["read", "29;31,5[x],8,20"],
    "read greek": ["read", "ϛφπ[.] γʹ"],
    "read cuneiform": ["read", "3,4[x]"],
    "read roman": ["read", "CCXXX[.]"],
    "read abjad": ["read", "ل [.]ه"],
    "read attic": ["read", "Χ[.]ΗΔΔΙΙ"],
    "read quantity": ["read", "3 signs 1[x];30°", "--unit", "degrees"],
    "identify": ["identify", "1,49,45;20", "--unit", "days"],
    "identify damaged": ["identify", "6,3[x]", "--top", "5"],
    "identify floating": ["identify", "29,31,50,8,20"],
    "restore": ["restore", "29;31,5[x],8,20", "--unit", "days"],
    "restore greek": ["restore", "ϛφπ[.] γʹ", "--unit", "days"],
    "restore wide": ["restore", "1,[x],[x];30", "--top", "20"],
    "audit": ["audit", str(demo / "ephemeris.tsv"), "--csv", "flags.csv", "--report", "report.html"],
    "audit tei": ["audit", str(demo / "papyrus.xml")],
    "relate": ["relate", "19", "--unit", "years"],
    "relate months": ["relate", "223", "--unit", "months"],
    "relate search": ["relate", "--search", "venus", "--max-years", "300"],
    "interval": ["interval", "Nabonassar 1 Thoth 1", "Nabonassar 2 Thoth 1"],
    "interval julian": ["interval", "747 BC Feb 26", "1 AD Jan 1"],
    "annotate": ["annotate", str(demo / "papyrus.xml"), "-o", "papyrus-out.xml", "-k", "3"],
    "catalogue": ["catalogue", "--body", "moon"],
    "demo": ["demo", "-o", "demo-out"],
}
out = {}
for label, argv in commands.items():
    buf, err = io.StringIO(), io.StringIO()
    with contextlib.redirect_stdout(buf), contextlib.redirect_stderr(err):
        with warnings.catch_warnings():
            warnings.simplefilter("ignore")
            try:
                code = main(argv + ["--json"])
            except SystemExit as stop:
                code = stop.code
    out[label] = [code, buf.getvalue() or err.getvalue()]
files = {}
for path in sorted(Path(".").rglob("*")):
    if path.is_file():
        files[path.as_posix()] = hashlib.sha256(path.read_bytes()).hexdigest()
out["files written"] = files
sys.stdout.write(json.dumps(out, ensure_ascii=False, sort_keys=True))
'''


def _run_children(tmp_path: Path, seeds: tuple[str, ...]) -> list[dict]:
    procs = []
    for seed in seeds:
        cwd = tmp_path / f"seed{seed}"
        cwd.mkdir()
        env = dict(os.environ, PYTHONHASHSEED=seed, MPLBACKEND="Agg")
        procs.append(subprocess.Popen([sys.executable, "-c", CHILD, str(DEMO)], cwd=cwd, env=env,
                                      stdout=subprocess.PIPE, stderr=subprocess.PIPE))
    results = [p.communicate(timeout=300) for p in procs]
    for p, (stdout, stderr) in zip(procs, results):
        assert p.returncode == 0, stderr.decode()[-2000:]
    return [json.loads(stdout) for stdout, _ in results]


@pytest.fixture(scope="module")
def runs(tmp_path_factory):
    return _run_children(tmp_path_factory.mktemp("determinism"), ("0", "4242"))


def test_every_command_ran(runs):
    for label, (code, text) in ((k, v) for k, v in runs[0].items() if k != "files written"):
        assert code == 0, f"{label} exited {code}: {text[:300]}"
        json.loads(text)
    assert any(name.startswith("demo-out/") for name in runs[0]["files written"])
    assert "flags.csv" in runs[0]["files written"] and "papyrus-out.xml" in runs[0]["files written"]


@pytest.mark.parametrize("label", [
    "read sexagesimal", "read greek", "read cuneiform", "read roman", "read abjad", "read attic",
    "read quantity", "identify", "identify damaged", "identify floating", "restore", "restore greek",
    "restore wide", "audit", "audit tei", "relate", "relate months", "relate search", "interval",
    "interval julian", "annotate", "catalogue", "demo"])
def test_same_json_under_another_hash_seed(runs, label):
    assert runs[0][label] == runs[1][label]


def test_same_files_under_another_hash_seed(runs):
    a, b = runs[0]["files written"], runs[1]["files written"]
    assert sorted(a) == sorted(b)
    differ = [name for name in a if a[name] != b[name]]
    assert not differ, f"files that differ between the runs: {differ}"
