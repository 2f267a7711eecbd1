"""Benchmark of restoration: numcheck against a naive enumeration, measured in one run.

Prints ratios, so the figures mean the same on any machine (not a timed test):

* numcheck vs a naive pure-Python enumeration that compares every reading
  the damage allows with every catalogue value, at 2 and 3 lost places.
  Two baselines: the literal one (each reading's exact value as a Fraction,
  the project's own arithmetic, against every catalogue value) and a strong
  one (integers in units of the last place, each catalogue value turned into
  its two neighbouring integers once).  At 3 lost places the literal
  baseline runs on a fixed 1/60 slice of the readings and is scaled up
  (pass ``--full`` to run it whole, about 60 times longer);
* how numcheck's cost grows from 1 lost digit to 4 and to 6 lost places
  (60**6 = 46,656,000,000 readings);
* peak memory (tracemalloc during the largest restoration, and the
  process's maximum resident size).

numcheck is timed end to end from the text (reading it included), with the
real catalogue (simple parts and multiples of every value, more than the
baselines are given).  Times are the best of several runs.  The damaged
numbers are the mean synodic month 29;31,50,8,20 days (Neugebauer, ACT 1955,
lunar System B) with its last places lost.

Run: ``python benchmarks/restore.py [--full]``
"""

from __future__ import annotations

import itertools
import math
import resource
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


def naive_exact(text: str, values: list[Fraction], fraction_of_space: int = 1) -> int:
    """Every reading's exact value against every catalogue value (the literal baseline).

    With *fraction_of_space* = n, only the first 1/n of the readings (in the
    order of enumeration) are tried.
    """
    reading = read(text)
    ulp = reading.ulp
    found = 0
    total = reading.count
    for i, value in enumerate(reading.readings()):
        if i * fraction_of_space >= total:
            break
        for c in values:
            if abs(value - c) < ulp:
                found += 1
                break
    return found


def naive_int(text: str, values: list[Fraction]) -> list[int]:
    """Every reading against every catalogue value, in integers of the last place (strong baseline)."""
    reading = read(text)
    last = reading.last_place
    scale = Fraction(60) ** (-last)
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


def best_time(fn, repeat: int) -> float:
    """The shortest wall time of *repeat* calls (the least disturbed by other work)."""
    times = []
    for _ in range(repeat):
        t0 = time.perf_counter()
        fn()
        times.append(time.perf_counter() - t0)
    return min(times)


def main(full: bool = False) -> int:
    values = [e.value for e in catalogue.entries()]
    restore(CASES["1 lost digit"], unit="days")          # load the catalogue once (not timed)
    print(f"catalogue values given to the baselines: {len(values)}")
    print()
    cost = {}
    for name, text in CASES.items():
        cost[name] = best_time(lambda: restore(text, unit="days"), 20)
        top = [c.value for c in restore(text, unit="days", top=3).candidates]
        where = "first" if top[0] == MONTH else ("in the top 3" if MONTH in top else "NOT in the top 3")
        print(f"numcheck  {name:14s} {text:28s} {read(text).count:>16,} readings "
              f"{cost[name] * 1000:8.2f} ms  (the month {where})")
    print()
    ratios = {}
    for name in ("2 lost places", "3 lost places"):
        text = CASES[name]
        t_int = best_time(lambda: naive_int(text, values), 2)
        scaled = MONTH * Fraction(60) ** (-read(text).last_place)
        assert int(scaled) in naive_int(text, values), "the baseline must find the month"
        part = 1 if (name == "2 lost places" or full) else 60
        t_exact = best_time(lambda: naive_exact(text, values, part), 1) * part
        ratios[name] = (t_exact / cost[name], t_int / cost[name])
        note = "" if part == 1 else f" (1/{part} of the readings, scaled up)"
        print(f"naive     {name:14s} exact values {t_exact:9.2f} s{note}: numcheck {ratios[name][0]:9.0f}x faster")
        print(f"          {'':14s} integers     {t_int:9.2f} s: numcheck {ratios[name][1]:9.0f}x faster")
    print()
    growth4 = cost["4 lost places"] / cost["1 lost digit"]
    growth6 = cost["6 lost places"] / cost["1 lost digit"]
    print(f"cost growth: 4 lost places = {growth4:.1f}x one lost digit; 6 lost places = {growth6:.1f}x "
          f"({cost['6 lost places'] * 1000:.1f} ms)")
    tracemalloc.start()
    restore(CASES["6 lost places"], unit="days")
    _, peak = tracemalloc.get_traced_memory()
    tracemalloc.stop()
    rss = resource.getrusage(resource.RUSAGE_SELF).ru_maxrss / 1024   # KiB on Linux
    print(f"peak memory: {peak / 2**20:.2f} MiB traced during the 6-place restoration; "
          f"process maximum resident size {rss:.0f} MiB")
    print()
    print(f"for information (not a goal): against the hand-tuned integer baseline numcheck is "
          f"{ratios['3 lost places'][1]:.0f}x faster at 3 lost places; about half of numcheck's time there "
          f"is reading the text and writing the ten candidates, not the search")
    print()
    goals = [
        (">= 1000x faster than the naive enumeration at 3 lost places", ratios["3 lost places"][0] >= 1000),
        ("4 lost places <= 20x one lost digit", growth4 <= 20),
        ("6 lost places under 5 s", cost["6 lost places"] < 5),
        ("under 300 MB", rss < 300),
    ]
    for goal, met in goals:
        print(f"{'met    ' if met else 'NOT MET'}  {goal}")
    return 0 if all(met for _, met in goals) else 1


if __name__ == "__main__":
    sys.exit(main(full="--full" in sys.argv[1:]))
