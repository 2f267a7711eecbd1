"""Benchmark: identify one number against the whole catalogue.

Identifies a floating (cuneiform) reading, so every power of 60 is tried,
with every simple factor n/m and every whole multiple of every period, and
compares the time with a plain loop over the same (scale, item, factor)
triples in the same run.  Both must find the same matches.

Run: python benchmarks/identify.py
"""

from __future__ import annotations

import statistics
import time
from fractions import Fraction

from numcheck import limits, read
from numcheck.identify import core, targets
from numcheck.identify import identify

TEXT = "1 49 45 20"          # 6585;20 days (the Saros), written without a magnitude
NOTATION = "cuneiform"
UNIT = "days"
GOAL_MS = 50.0


def plain_loop(reading, unit):
    """The obvious way: every scale x every item x every factor, one by one."""
    tab = targets.table(unit)
    simple = targets.simple_factors()
    found = set()
    value = reading.value
    for scale in core.SCALES:
        p = Fraction(60) ** scale
        v, ulp = value * p, reading.ulp * p
        tol = max(core.NEAR_ULPS * ulp, core.NEAR_RELATIVE * v)
        fv, ftol, fulp = float(v), float(tol), float(ulp)
        for i, item in enumerate(tab.items):
            base = float(tab.values[i])
            factors = list(simple)
            if item.multiples:
                factors += [Fraction(n) for n in range(limits.IDENTIFY_MAX_SIMPLE + 1,
                                                       limits.IDENTIFY_MAX_MULTIPLE + 1)]
            for f in factors:
                if not targets.factor_allowed(item, f):
                    continue
                x = base * f.numerator / f.denominator
                if abs(fv - x) > ftol + fulp:
                    continue
                target = item.value * tab.factors[i] * f
                how = core._classify(core._Window(False, v, v), v, target, ulp,
                                     tol if f == 1 else core.NEAR_ULPS * ulp)
                if how:
                    found.add((item.entry.id, item.label, f, scale))
    return found


def main() -> None:
    reading = read(TEXT, notation=NOTATION)
    t0 = time.perf_counter()
    first = identify(reading, unit=UNIT, top=1000)
    cold = (time.perf_counter() - t0) * 1000
    runs = []
    for _ in range(30):
        t0 = time.perf_counter()
        result = identify(reading, unit=UNIT, top=1000)
        runs.append((time.perf_counter() - t0) * 1000)
    warm = statistics.median(runs)
    t0 = time.perf_counter()
    loop_found = plain_loop(reading, UNIT)
    loop_ms = (time.perf_counter() - t0) * 1000
    tab = targets.table(UNIT)
    n_items = len(tab.items)
    n_periods = len(tab.period_index)
    triples = len(core.SCALES) * (n_items * len(tab.simple) +
                                  n_periods * (limits.IDENTIFY_MAX_MULTIPLE - limits.IDENTIFY_MAX_SIMPLE))
    print(f"identify {TEXT!r} ({NOTATION}, floating) in {UNIT}: {len(result.matches)} matches, "
          f"best {result.matches[0].id} (factor {result.matches[0].factor}, scale {result.matches[0].scale})")
    print(f"catalogue: {len(targets.all_items())} numbers ({n_items} in {UNIT}), {len(tab.simple)} simple factors, "
          f"multiples to {limits.IDENTIFY_MAX_MULTIPLE} for {n_periods} periods, {len(core.SCALES)} scales "
          f"= {triples:,} comparisons")
    print(f"first call (loads catalogue, builds tables): {cold:8.1f} ms")
    print(f"identify, warm (median of {len(runs)}):        {warm:8.2f} ms   goal < {GOAL_MS:.0f} ms: "
          f"{'met' if warm < GOAL_MS else 'NOT met'}")
    print(f"plain loop over the same comparisons:        {loop_ms:8.1f} ms")
    print(f"ratio plain loop / identify:                 {loop_ms / warm:8.0f} x")
    ours = {(m.id, m.label, m.factor, m.scale) for m in result.matches}
    same = ours == loop_found and len(first.matches) == len(result.matches)
    print(f"same matches found by both: {'yes' if same else 'NO'} ({len(loop_found)} vs {len(ours)})")


if __name__ == "__main__":
    main()
