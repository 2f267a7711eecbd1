"""Benchmark: how long a command takes to start, against ``python -c pass``.

A scholar calls ``numcheck read`` from an editor or a script once per number,
so the time before the first line of output matters.  Each command is run as
a fresh interpreter, as the installed ``numcheck`` script runs it, several
times; the median CPU time is compared with the median of ``python -c pass``
measured in the same run, so the ratio means the same on any machine.

The parser cache (numcheck.notations.grammars) and the bytecode are warmed
once first: the figures are for a machine where numcheck has run before.  ``--cold`` turns
the cache off to show what it saves.

Run: python benchmarks/startup.py [--runs N] [--cold]
"""

from __future__ import annotations

import argparse
import os
import resource
import statistics
import subprocess
import sys
import tempfile

#: (label, arguments of numcheck, goal as a multiple of `python -c pass`).
CASES = [
    ("read 1,49,45;20", ["read", "1,49,45;20"], 6.0),
    ("read --json", ["read", "1,49,45;20", "--json"], 6.0),
    ("read κθ λα ν η κ", ["read", "κθ λα ν η κ"], None),
    ("identify --unit days", ["identify", "1,49,45;20", "--unit", "days"], 10.0),
    ("identify --json", ["identify", "1,49,45;20", "--unit", "days", "--json"], 10.0),
    ("--help", ["--help"], None),
]

_SCRIPT = "import sys; from numcheck.cli import main; sys.exit(main(sys.argv[1:]))"


def _time(argv: list[str], runs: int, env: dict) -> float:
    """The median CPU time (user + system) of *runs* runs of *argv*.

    CPU time rather than wall time: on a shared machine the wall time of a
    short process measures the other processes as much as this one.
    """
    times = []
    for _ in range(runs):
        before = resource.getrusage(resource.RUSAGE_CHILDREN)
        subprocess.run(argv, stdout=subprocess.DEVNULL, stderr=subprocess.DEVNULL, env=env, check=False)
        after = resource.getrusage(resource.RUSAGE_CHILDREN)
        times.append((after.ru_utime - before.ru_utime) + (after.ru_stime - before.ru_stime))
    return statistics.median(times)


def main() -> None:
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--runs", type=int, default=15)
    ap.add_argument("--cold", action="store_true", help="no parser cache (compile every grammar at start)")
    args = ap.parse_args()
    env = dict(os.environ, COLUMNS="80")
    # An installed numcheck has its bytecode compiled at install time; a
    # checkout run with PYTHONDONTWRITEBYTECODE would compile every module at
    # every start and measure the compiler, not numcheck.
    env.pop("PYTHONDONTWRITEBYTECODE", None)
    with tempfile.TemporaryDirectory() as cache:
        env["NUMCHECK_CACHE"] = "" if args.cold else cache
        for _, argv, _ in CASES:          # warm the cache and the file system
            subprocess.run([sys.executable, "-c", _SCRIPT, *argv], capture_output=True, env=env)
        base = _time([sys.executable, "-c", "pass"], args.runs, env)
        print(f"python -c pass: {base * 1000:.1f} ms of CPU (median of {args.runs}); cache "
              f"{'off' if args.cold else 'warm'}")
        print(f"{'command':<24} {'ms':>7} {'ratio':>7}  goal")
        for label, argv, goal in CASES:
            t = _time([sys.executable, "-c", _SCRIPT, *argv], args.runs, env)
            ratio = t / base
            verdict = "" if goal is None else (f"<= {goal:g}x  {'met' if ratio <= goal else 'NOT met'}")
            print(f"{label:<24} {t * 1000:7.1f} {ratio:7.1f}x  {verdict}")


if __name__ == "__main__":
    main()
