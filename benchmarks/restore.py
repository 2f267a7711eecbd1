"""Benchmark of restoration: numcheck against a naive enumeration, measured in one run.

Prints ratios, so the figures mean the same on any machine (not a timed test):

* numcheck vs a naive pure-Python enumeration that compares every reading
  the damage allows with every catalogue value, at 2 and 3 lost places;
* how numcheck's cost grows from 1 lost digit to 4 and to 6 lost places
  (60**6 = 46,656,000,000 readings);
* peak memory (tracemalloc for the restorations, and the process's maximum
  resident size).

The damaged numbers are the mean synodic month 29;31,50,8,20 days
(Neugebauer, ACT 1955, lunar System B) with its last places lost.  The naive
baseline is given every advantage a simple program could have: exact
integers in units of the last place, and only the catalogue's own values
(no parts or multiples), where numcheck also weighs simple parts and
multiples of every value.

Run: ``python benchmarks/restore.py``
"""

from __future__ import annotations

import itertools
import math
import resource
import statistics
import sys
import time
import tracemalloc
from fractions import Fraction

from numcheck import catalogue, read
from numcheck.restore import restore

MONTH = Fraction(765433, 25920)   # 29;31,50,8,20 days (Neugebauer, ACT 1955, System B)

CASES = {
    "1 lost digit": "29;31,50,8,2[x]",
    "2 lost places": "29;31,50,[x],[x]",
    "3 lost places": "29;31,[x],[x],[x]",
    "4 lost places": "29;[x],[x],[x],[x]",
    "6 lost places": "29;[x],[x],[x],[x],[x],[x]",
}


def naive(text: str, values: list[Fraction]) -> list[int]:
    """Every reading against every catalogue value, in plain Python (grid integers)."""
    reading = read(text)
    last = reading.last_place
    scale = Fraction(60) ** (-last)
    # Each catalogue value as the two grid integers around it (rounded or cut at the last place).
    near = [(math.floor(v * scale), math.ceil(v * scale)) for v in values]
    fixed = 0
    open_slots = []
    for slot in reading.slots:
        weight = 60 ** (slot.place - last)
        if len(slot.values) == 1:
            fixed += int(slot.values[0]) * weight
        else:
            open_slots.append([int(v) * weight for v in slot.values])
    found = []
    for combo in itertools.product(*open_slots):
        v = fixed + sum(combo)
        for lo, hi in near:
            if v == lo or v == hi:
                found.append(v)
                break
    return found


def timed(fn, repeat: int) -> float:
    """The median wall time of *repeat* calls."""
    times = []
    for _ in range(repeat):
        t0 = time.perf_counter()
        fn()
        times.append(time.perf_counter() - t0)
    return statistics.median(times)


def main() -> int:
    values = [e.value for e in catalogue.entries()]
    restore(CASES["1 lost digit"], unit="days")          # load the catalogue once (not timed)
    print(f"catalogue values compared by the naive baseline: {len(values)}")
    print()
    cost = {}
    for name, text in CASES.items():
        cost[name] = timed(lambda: restore(text, unit="days"), 5 if "6" not in name else 3)
        best = restore(text, unit="days").best
        ok = "month first" if best.value == MONTH else f"FIRST IS {best.text}"
        print(f"numcheck  {name:14s} {text:28s} {read(text).count:>16,} readings  "
              f"{cost[name] * 1000:9.2f} ms  ({ok})")
    print()
    ratios = {}
    for name in ("2 lost places", "3 lost places"):
        text = CASES[name]
        t = timed(lambda: naive(text, values), 1)
        found = naive(text, values)
        scaled = MONTH * Fraction(60) ** (-read(text).last_place)
        assert scaled.denominator == 1 and int(scaled) in found, "the naive search must find the month"
        ratios[name] = t / cost[name]
        print(f"naive     {name:14s} {t * 1000:12.1f} ms   numcheck is {ratios[name]:10.0f}x faster")
    print()
    growth4 = cost["4 lost places"] / cost["1 lost digit"]
    growth6 = cost["6 lost places"] / cost["1 lost digit"]
    print(f"cost growth: 4 lost places = {growth4:.1f}x one lost digit; 6 lost places = {growth6:.1f}x "
          f"({cost['6 lost places']:.3f} s)")

    tracemalloc.start()
    restore(CASES["6 lost places"], unit="days")
    _, peak = tracemalloc.get_traced_memory()
    tracemalloc.stop()
    rss = resource.getrusage(resource.RUSAGE_SELF).ru_maxrss / 1024   # KiB on Linux
    print(f"peak memory: {peak / 2**20:.1f} MiB traced during the 6-place restoration; "
          f"process maximum resident size {rss:.0f} MiB")
    print()
    goals = [
        (">= 1000x faster than naive at 3 lost places", ratios["3 lost places"] >= 1000),
        ("4 lost places <= 20x one lost digit", growth4 <= 20),
        ("6 lost places under 5 s", cost["6 lost places"] < 5),
        ("under 300 MB", rss < 300),
    ]
    for goal, met in goals:
        print(f"{'met    ' if met else 'NOT MET'}  {goal}")
    return 0 if all(met for _, met in goals) else 1


if __name__ == "__main__":
    sys.exit(main())
