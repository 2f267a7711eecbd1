"""Shared helpers for the restoration tests: a small stand-in catalogue and a brute force.

The stand-in catalogue answers like :func:`numcheck.identify.catalogue_targets`
with a handful of published values (sources named beside each), so that
the engine can be tested apart from the catalogue's own growth.  The brute
force scores every reading of a small space one by one with the model
documented in :mod:`numcheck.restore.scoring`: the search and the closed-form
unmatched mass must agree with it.
"""

from __future__ import annotations

import itertools
from dataclasses import dataclass
from fractions import Fraction

from numcheck.restore import scoring
from numcheck.restore.space import build_space


@dataclass(frozen=True)
class StandInTarget:
    value: Fraction
    unit: str | None
    id: str
    statement: str
    factor: Fraction = Fraction(1)
    scale: int = 0
    weight: float = 1.0


#: Published values: (id, value, unit, statement with its source).
PUBLISHED = [
    ("month_sysB", Fraction(765433, 25920), "days",
     "mean synodic month 29;31,50,8,20 days (Neugebauer, ACT 1955, lunar System B)"),
    ("saros_days", Fraction(19756, 3), "days",
     "223 months = 1,49,45;20 days (Ptolemy, Almagest IV.2, tr. Toomer 1984)"),
    ("hipparchus_months", Fraction(4267), "synodic months",
     "4267 months (Hipparchus in Ptolemy, Almagest IV.2, tr. Toomer 1984)"),
    ("year_sysA", Fraction(2783, 225), "synodic months",
     "1 year = 12;22,8 months (Neugebauer, ACT 1955, lunar System A)"),
    ("meton_days", Fraction(6940), "days",
     "19 years = 6940 days (Geminus, Introduction to the Phenomena 8)"),
]


def stand_in(values=PUBLISHED, weights=None):
    """A catalogue_targets look-alike over *values* (with their *weights*, 1 by default)."""
    weights = weights or [1.0] * len(values)

    def catalogue_targets(lo, hi, unit=None, *, floating=False, max_factor=None):
        return [StandInTarget(v, u, i, s, weight=w) for (i, v, u, s), w in zip(values, weights)
                if lo <= v <= hi and (unit is None or u == unit)]
    return catalogue_targets


def brute_force(reading, targets_exact):
    """Every reading's posterior by enumeration: [(value, probability)], unmatched mass.

    *targets_exact* is a list of (value, tolerance or None, weight, group); a
    catalogue weight is sharpened as the engine does (scoring.CATALOGUE_SHARPNESS).
    """
    space = build_space(reading)
    rows = []
    reached: dict[tuple[int, int], dict] = {}     # (target, sub) -> {value: kernel}
    for sub in space.subspaces:
        base = Fraction(sub.expansion.base)
        F = base ** sub.scale
        for combo in itertools.product(*[p.options for p in sub.positions]):
            prior = sub.mass
            total = Fraction(0)
            for p, o in zip(sub.positions, combo):
                prior *= o.prior
                total += o.value * base ** p.place
            value = sub.expansion.sign * total * F
            hits = []
            for ti, (t, tol, _, _) in enumerate(targets_exact):
                d = abs(value - t)
                if tol is None:
                    ok, tl = d < sub.ulp, sub.ulp
                else:
                    ok, tl = d <= tol, tol
                if ok:
                    k = scoring.kernel(float(d), float(tl))
                    hits.append((ti, k))
                    reached.setdefault((ti, sub.index), {})[value] = k
            rows.append((value, prior, hits))
    norm = [0.0] * len(targets_exact)
    for _, prior, hits in rows:
        for ti, k in hits:
            norm[ti] += prior * k
    possible = {i for i, n in enumerate(norm) if n > 0}
    reach = {}
    for (ti, si), seen in reached.items():
        mass = _grid_mass(space.subspaces[si], *targets_exact[ti][:2])
        reach[ti] = max(reach.get(ti, 0.0), min(1.0, sum(seen.values()) / mass))
    weights = {i: t[2] ** (scoring.CATALOGUE_SHARPNESS if t[3] == "catalogue" else 1.0)
               for i, t in enumerate(targets_exact)}
    pi0, pis = scoring.mixture(weights, possible,
                               {i: t[3] for i, t in enumerate(targets_exact) if t[3]},
                               {"catalogue": scoring.CATALOGUE_WEIGHT}, reach)
    out = []
    unmatched = 0.0
    for value, prior, hits in rows:
        p = prior * (pi0 + sum(pis[t] * k / norm[t] for t, k in hits))
        out.append((value, p))
        if not hits:
            unmatched += p
    return out, unmatched


def _grid_mass(sub, target, tol):
    """The kernel summed over every grid number the target accepts, one by one."""
    from numcheck.restore.search import grid_for

    step = Fraction(1, grid_for(sub).D) * Fraction(sub.expansion.base) ** sub.scale
    width = sub.ulp if tol is None else tol
    first = (target - width) // step
    total = 0.0
    n = first
    while n * step <= target + width:
        d = abs(n * step - target)
        if (d < width) if tol is None else (d <= width):
            total += scoring.kernel(float(d), float(width))
        n += 1
    return total
