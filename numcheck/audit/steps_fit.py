"""Fit a step function to a longitude column: its rates, then its boundaries.

Pure steps give the rates: the commonest differences of the column.  A line
whose difference lies between two rates crossed a boundary: from λ at rate
w_i into a zone of rate w_j, the boundary lies at λ + x with
x = w_i(Δ − w_j)/(w_i − w_j) (the boundary rule solved for x).  Each crossing
proposes one boundary per pair of rates; a true boundary is proposed again by
every line that crosses it, a false one hardly ever, so the boundaries are the
proposals that recur.  Two zones are tried first (the lunar System A sun,
Jupiter System A), then more; the fit that explains most lines wins.
"""

from __future__ import annotations

from collections import Counter
from fractions import Fraction
from itertools import combinations

from .schemes import diffs, support_chained

__all__ = ["fit_step"]

#: Lines used to choose among the candidates (a few revolutions; the whole
#: column is checked afterwards).
SAMPLE = 400
#: Most zones tried (the Babylonian planetary schemes have two to six).
MAX_ZONES = 6


def _clean(v):
    return v.numerator if isinstance(v, Fraction) and v.denominator == 1 else v


def fit_step(cls, column, frame):
    """The best step function for *column*, or None when none explains most lines."""
    full = frame.modulus.get(column)
    values = frame.written[column]
    if not full:
        return None
    pairs = diffs(values, full)
    if len(pairs) < 6:
        return None
    counts = Counter(d for _, d in pairs)
    common = [d for d, c in counts.most_common(MAX_ZONES) if c >= 2 and d]
    if len(common) < 2:
        return None
    sample = values[:SAMPLE]
    best, best_support = None, 0.5
    for k in range(2, min(MAX_ZONES, len(common)) + 1):
        rates = common[:k]
        if sum(counts[r] for r in rates) * 2 < len(pairs):
            continue
        scheme = _fit_bounds(cls, column, frame, rates, pairs, values, full, sample)
        if scheme is None:
            continue
        s = support_chained(scheme, sample, None)
        if s > best_support + 1e-9:
            best, best_support = scheme, s
        if best_support == 1.0:
            break
    return best


def _fit_bounds(cls, column, frame, rates, pairs, values, full, sample):
    """Boundaries for these rates, from the crossing lines, or None."""
    proposals: Counter = Counter()   # (boundary, rate before, rate after) -> lines proposing it
    lo, hi = min(rates), max(rates)
    for i, dl in pairs[:SAMPLE]:
        if dl in rates or not lo < dl < hi:
            continue
        lam = values[i - 1]
        for wi in rates:
            for wj in rates:
                if wi == wj or not min(wi, wj) < dl < max(wi, wj):
                    continue
                x = Fraction(wi) * (dl - wj) / (wi - wj)
                if 0 < x < wi:
                    proposals[(_clean((lam + x) % full), wi, wj)] += 1
    if not proposals:
        return None
    k = len(rates)
    if k == 2:
        return _two_zones(cls, column, frame, rates, proposals, sample)
    return _many_zones(cls, column, frame, rates, proposals, sample)


def _two_zones(cls, column, frame, rates, proposals, sample):
    """Two zones: the pair of recurring boundaries that explains most lines."""
    fast, slow = max(rates), min(rates)
    into_slow = Counter({b: c for (b, wi, wj), c in proposals.items() if wi == fast})
    into_fast = Counter({b: c for (b, wi, wj), c in proposals.items() if wi == slow})
    best, best_support = None, 0.0
    for bs, _ in into_slow.most_common(8):
        for bf, _ in into_fast.most_common(8):
            if bs == bf:
                continue
            scheme = cls(column, frame, [bf, bs], [fast, slow])
            s = support_chained(scheme, sample, None)
            if s > best_support:
                best, best_support = scheme, s
    return best


def _many_zones(cls, column, frame, rates, proposals, sample):
    """k zones with k different rates: recurring boundaries whose rates chain around the circle.

    Every consistent choice is ranked by how many lines propose its
    boundaries; the few best are checked against the lines themselves.  (A
    scheme whose zones share a rate, or whose zones are too short for pure
    steps to be the commonest differences, is not found: the column is then
    left unchecked rather than wrongly flagged.)
    """
    recurring = sorted(((b, wi, wj, c) for (b, wi, wj), c in proposals.most_common(3 * len(rates))
                        if c >= 2), key=lambda t: t[0])
    k = len(rates)
    found = []
    for chosen in combinations(recurring, k):
        if len({t[0] for t in chosen}) != k or len({t[2] for t in chosen}) != k:
            continue
        # around the circle, the rate after each boundary is the rate before the next
        if all(chosen[j][2] == chosen[(j + 1) % k][1] for j in range(k)):
            found.append((sum(t[3] for t in chosen), [t[0] for t in chosen], [t[2] for t in chosen]))
    best, best_support = None, 0.0
    for _, bounds, after in sorted(found, key=lambda t: -t[0])[:5]:
        scheme = cls(column, frame, bounds, after)
        s = support_chained(scheme, sample, None)
        if s > best_support:
            best, best_support = scheme, s
    return best
