"""Benchmark: the peak memory (and time) of ``numcheck audit FILE --json`` on a 10^6-line table.

An invented mean-motion table is written into a temporary folder: a column
``n`` of line numbers and a column ``lon`` of mean longitudes, each line the
one before plus 0;59,8,20 degrees modulo 360 (the sun's daily mean motion),
written with three sexagesimal places, with an isolated slip (one unit more
in the last place) every 100,000 lines.  The table is written as TSV and as
CSV (the sexagesimal cells quoted).  Each audit runs as its own process, as
the ``numcheck`` script runs it; its peak resident memory is the ``ru_maxrss``
of that child (``os.wait4`` gives the ``getrusage`` figures of the one child).

Baselines measured in the same run: the peak memory of
``python -c "import numcheck.audit"`` (what the code itself takes) and the
same audit on 10^4 lines.  Goal: 10^6 lines within 300 MB.

Run: python benchmarks/table_memory.py [--lines N] [--only tsv|csv]
"""

from __future__ import annotations

import argparse
import json
import os
import subprocess
import sys
import tempfile
import time
from pathlib import Path

GOAL_MB = 300.0
#: The daily mean motion of the sun, 0;59,8,20 degrees, in units of 60**-3 degree.
_STEP = 59 * 3600 + 8 * 60 + 20
_CIRCLE = 360 * 60 ** 3
_SLIP_EVERY = 100_000

_SCRIPT = "import sys; from numcheck.cli import main; sys.exit(main(sys.argv[1:]))"


def _sexagesimal(units: int) -> str:
    """*units* of 60**-3 degree as d;m,s,t."""
    d, rest = divmod(units, 60 ** 3)
    m, rest = divmod(rest, 60 ** 2)
    s, t = divmod(rest, 60)
    return f"{d};{m},{s},{t}"


def write_table(path: Path, lines: int, *, csv: bool) -> int:
    """Write the table of *lines* lines (header included); the number of slips put in."""
    slips = 0
    with path.open("w", encoding="utf-8") as out:
        out.write("n,lon\n" if csv else "n\tlon\n")
        value = 123 * 60 ** 3 + 45 * 3600
        for n in range(1, lines):
            written = value
            if n % _SLIP_EVERY == _SLIP_EVERY // 2:
                written = (value + 1) % _CIRCLE      # one unit more in the last place
                slips += 1
            text = _sexagesimal(written)
            out.write(f'{n},"{text}"\n' if csv else f"{n}\t{text}\n")
            value = (value + _STEP) % _CIRCLE
    return slips


def measure(argv: list[str], out_path: Path) -> tuple[float, float, float]:
    """Peak RSS (MB), wall time and CPU time (s) of the one child running *argv*."""
    env = dict(os.environ)
    env.pop("PYTHONDONTWRITEBYTECODE", None)
    with out_path.open("wb") as out:
        t = time.perf_counter()
        child = subprocess.Popen(argv, stdout=out, stderr=subprocess.DEVNULL, env=env)
        _, status, usage = os.wait4(child.pid, 0)
        wall = time.perf_counter() - t
        child.returncode = os.waitstatus_to_exitcode(status)
    # ru_maxrss is in kilobytes on Linux
    return usage.ru_maxrss / 1024, wall, usage.ru_utime + usage.ru_stime


def main() -> int:
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--lines", type=int, default=1_000_000, help="lines of the big table (header included)")
    ap.add_argument("--only", choices=("tsv", "csv"), help="one of the two formats only")
    args = ap.parse_args()
    ok = True
    with tempfile.TemporaryDirectory() as tmp:
        folder = Path(tmp)
        base_mb, _, base_cpu = measure([sys.executable, "-c", "import numcheck.audit"], folder / "o")
        print(f"python -c 'import numcheck.audit': {base_mb:.0f} MB peak, {base_cpu:.2f} s CPU")
        for kind in ("tsv", "csv"):
            if args.only and kind != args.only:
                continue
            small = folder / f"small.{kind}"
            big = folder / f"big.{kind}"
            write_table(small, 10_000, csv=kind == "csv")
            slips = write_table(big, args.lines, csv=kind == "csv")
            s_mb, _, s_cpu = measure([sys.executable, "-c", _SCRIPT, "audit", str(small), "--json"],
                                     folder / "small.json")
            b_mb, b_wall, b_cpu = measure([sys.executable, "-c", _SCRIPT, "audit", str(big), "--json"],
                                          folder / "big.json")
            result = json.loads((folder / "big.json").read_text(encoding="utf-8"))
            found = len([f for f in result["flags"] if f["kind"] != "carried-forward"])
            met = b_mb <= GOAL_MB
            ok = ok and met
            print(f"{kind}: 10^4 lines {s_mb:.0f} MB, {s_cpu:.2f} s CPU; "
                  f"{args.lines:,} lines {b_mb:.0f} MB, {b_cpu:.1f} s CPU ({b_wall:.1f} s wall); "
                  f"{slips} slips put in, {found} flagged; schemes "
                  f"{[s['kind'] for s in result['schemes']]}")
            print(f"{kind}: peak {b_mb / base_mb:.1f}x the import's, {b_mb / s_mb:.1f}x the 10^4 lines'; "
                  f"CPU {b_cpu / s_cpu:.0f}x the 10^4 lines'; "
                  f"goal <= {GOAL_MB:.0f} MB: {'met' if met else 'NOT met'}")
    return 0 if ok else 1


if __name__ == "__main__":
    raise SystemExit(main())
