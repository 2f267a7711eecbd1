"""Benchmark of matching short fragments against the catalogue of published schemes.

Generates 200 fragments of 8-20 lines of lunar System B column F (d = 0;36,
M = 15;16,5, m = 11;5,5; ACT 1955 vol. 1, from memory, see
numcheck/data/schemes.csv) with one slip each, audits them with the
catalogue matching on and, as the baseline in this same run, with the
matching off (numcheck.audit.published.match_column replaced by the
identity).  Prints the time of each and their ratio, and the share of
fragments whose published scheme is named.  Goal: the matching costs at
most 3 times the baseline.

Run: python benchmarks/fragments.py
"""

from __future__ import annotations

import random
import sys
import time
from fractions import Fraction as F
from pathlib import Path

sys.path.insert(0, str(Path(__file__).resolve().parent.parent / "tests"))

import pandas as pd  # noqa: E402

from tablegen import sx, zigzag  # noqa: E402

from numcheck.audit import audit, detect  # noqa: E402
from numcheck.reading import sexagesimal_text  # noqa: E402

GOAL_RATIO = 3.0
P = dict(d=sx("0;36"), M=sx("15;16,5"), m=sx("11;5,5"))


def fragments(count: int = 200, seed: int = 1) -> list[pd.DataFrame]:
    rng = random.Random(seed)
    out = []
    for _ in range(count):
        n = rng.randrange(8, 21)
        start = P["m"] + P["d"] * rng.randrange(1, 6)
        ys = zigzag(n, start=start, rising=rng.random() < 0.5, **P)
        txt = [sexagesimal_text(y) for y in ys]
        i = rng.randrange(1, n - 1)
        txt[i] = sexagesimal_text(ys[i] + F(1, 60))
        out.append(pd.DataFrame({"F": txt}))
    return out


def run(frames) -> tuple[float, int]:
    t = time.perf_counter()
    named = 0
    for df in frames:
        r = audit(df)
        named += any(s.published and s.published[0]["id"] == "ACT-LUN-B-F" for s in r.schemes)
    return time.perf_counter() - t, named


def main() -> int:
    frames = fragments()
    with_matching, named = run(frames)
    original = detect.match_column
    detect.match_column = lambda frame, name, own, keep=False: own
    try:
        baseline, _ = run(frames)
    finally:
        detect.match_column = original
    ratio = with_matching / baseline
    print(f"{len(frames)} fragments: {with_matching:.2f} s with the catalogue, "
          f"{baseline:.2f} s without (ratio {ratio:.2f}, goal <= {GOAL_RATIO})")
    print(f"published scheme named for {named} of {len(frames)} fragments ({named / len(frames):.0%})")
    return 0 if ratio <= GOAL_RATIO else 1


if __name__ == "__main__":
    raise SystemExit(main())
