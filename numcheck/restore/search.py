"""Find the readings that agree with the evidence, without enumerating the space.

Every reading of a sub-space is an integer ``V`` in units of ``1/D`` (``D``
turns every place of the reading, down to the last, into a whole number):
each open position adds one of its contributions, the fixed positions a
constant.  The search is a branch and bound from the most significant open
position down: a node's readings lie in ``[S + min of the rest, S + max of the
rest]``, and a node whose interval meets no evidence window is pruned with
everything below it.  The last few positions (at most :data:`SUFFIX_BLOCK`
readings) are enumerated once with numpy, sorted, and answered by binary
search, so the work grows with the readings that can match, not with the
space.

The readings no evidence touches are never enumerated: the most probable of
them come from a best-first walk over the product of the positions' priors
(:func:`top_by_prior`).
"""

from __future__ import annotations

import heapq
import math
from bisect import bisect_left, bisect_right
from dataclasses import dataclass, field
from fractions import Fraction

import numpy as np

from .. import limits
from ..errors import LimitError
from .evidence import Target
from .space import Space, SubSpace

__all__ = ["Grid", "Window", "Match", "grid_for", "windows_for", "find_matches", "top_by_prior",
           "merge_windows", "inside", "estimate", "SUFFIX_BLOCK"]

#: Most readings of the trailing positions enumerated at once with numpy.
SUFFIX_BLOCK = 4096
_INT64_SAFE = 2**62


@dataclass
class Grid:
    """A sub-space in integer units: what each open position may add."""

    sub: SubSpace
    D: int                                  # readings are V / D (times base**scale, times sign)
    const: int                              # sum of the fixed positions
    open_ids: list[int]                     # indices of the open positions in sub.positions
    contrib: list[list[int]]                # per open position, contributions (option order)
    priors: list[list[float]]               # per open position, option priors
    lo: int = 0
    hi: int = 0
    dtype: object = np.int64

    @property
    def top(self) -> int:
        """The place of the first written place (before scaling)."""
        return max((p.place for p in self.sub.positions), default=0)

    def value_of(self, V: int) -> Fraction:
        """The exact value of grid integer *V*."""
        e = self.sub.expansion
        return e.sign * Fraction(V, self.D) * Fraction(e.base) ** self.sub.scale


@dataclass
class Window:
    """The grid integers one target accepts in one sub-space."""

    lo: int
    hi: int
    target: int                             # index into the targets
    cn: int                                 # the target in grid units is cn / cd
    cd: int
    tol: Fraction                           # the tolerance in grid units
    mass: float = 1.0                       # the kernel summed over every grid integer it accepts


@dataclass
class Match:
    """The readings found: one row per reading that agrees with some evidence."""

    sub: np.ndarray                         # sub-space index
    choice: np.ndarray                      # (n, open positions) option indices, -1 where unused
    value: list                             # grid integer V (python ints)
    prior: np.ndarray                       # prior probability (sub-space mass included)
    score: np.ndarray                       # posterior probability
    hits: list = field(default_factory=list)  # per row: list of (target index, kernel)


def grid_for(sub: SubSpace) -> Grid:
    """Turn a sub-space into integer contributions in units of its finest place."""
    base = sub.expansion.base
    D = sub.resolution.denominator     # a grid unit divides the finest step written
    for p in sub.positions:
        if p.place < 0:
            D = math.lcm(D, base ** -p.place)
        for o in p.options:
            if o.value.denominator != 1:
                D = math.lcm(D, (o.value * Fraction(base) ** p.place).denominator)
    const = 0
    open_ids, contrib, priors = [], [], []
    lo = hi = 0
    for i, p in enumerate(sub.positions):
        weight = Fraction(base) ** p.place * D           # a whole number: D clears every place
        if weight.denominator == 1:
            w = weight.numerator
            cs = [o.value.numerator * w // o.value.denominator if o.value.denominator != 1
                  else o.value.numerator * w for o in p.options]
        else:
            cs = [int(o.value * weight) for o in p.options]
        if len(cs) == 1:
            const += cs[0]
            continue
        open_ids.append(i)
        contrib.append(cs)
        priors.append([o.prior for o in p.options])
        lo += min(cs)
        hi += max(cs)
    lo += const
    hi += const
    big = max(abs(lo), abs(hi)) >= _INT64_SAFE
    return Grid(sub, D, const, open_ids, contrib, priors, lo, hi, object if big else np.int64)


def windows_for(grid: Grid, targets: list[Target], order: list[int] | None = None,
                values: list[Fraction] | None = None) -> list[Window]:
    """The window of grid integers each target accepts in this sub-space.

    With *order* (target indices by value) and *values* (their values in that
    order), only the targets near the sub-space's range are looked at.
    """
    e = grid.sub.expansion
    F = Fraction(e.base) ** grid.sub.scale
    U = grid.sub.resolution * grid.D       # the finest step written, in grid units
    if U.denominator != 1:                 # pragma: no cover - D clears the resolution
        raise ValueError("the grid is coarser than the finest step written")
    U = U.numerator
    if order is None:
        order = list(range(len(targets)))
    else:
        lo, hi = grid.sub.bounds
        reach = max([t.tolerance for t in targets if t.tolerance is not None] + [grid.sub.ulp])
        order = order[bisect_left(values, lo - reach):bisect_right(values, hi + reach)]
    out = []
    for ti in order:
        t = targets[ti]
        if t.tolerance is None:            # less than one unit of the last written place
            A = e.sign * t.value.numerator * grid.D * F.denominator
            B = t.value.denominator * F.numerator
            lo = (A - U * B) // B + 1
            hi = -((-(A + U * B)) // B) - 1
            if hi < grid.lo or lo > grid.hi:
                continue
            cn, cd, tol = A, B, Fraction(U)
        else:
            centre = e.sign * t.value * grid.D / F
            tol = t.tolerance * grid.D / F
            lo = math.ceil(centre - tol)
            hi = math.floor(centre + tol)
            cn, cd = centre.numerator, centre.denominator
        if hi < grid.lo or lo > grid.hi:
            continue
        mass = kernel_mass(lo, hi, cn, cd, tol)       # before the sub-space's range clips it
        lo, hi = max(lo, grid.lo), min(hi, grid.hi)
        if lo <= hi:
            out.append(Window(lo, hi, ti, cn, cd, tol, mass))
    return out


def kernel_mass(lo: int, hi: int, cn: int, cd: int, tol: Fraction) -> float:
    """The kernel summed over the integers lo..hi around the centre cn/cd, in closed form.

    Each integer V counts ``1 - (1 - KERNEL_EDGE) * |V - centre| / tol``
    (:func:`numcheck.restore.scoring.kernel`); a long run is summed as two
    arithmetic series, not one by one.

    >>> kernel_mass(3, 3, 3, 1, Fraction(1)), kernel_mass(2, 4, 3, 1, Fraction(2))
    (1.0, 2.5)
    """
    from .scoring import KERNEL_EDGE

    if hi < lo:
        return 0.0
    try:
        if tol == 0:
            return float(hi - lo + 1)
        slope = (1.0 - KERNEL_EDGE) * tol.denominator / (cd * tol.numerator)
        if hi - lo < 8:                 # the usual window: one or two places of the last digit
            return float(sum(1.0 - slope * abs(V * cd - cn) for V in range(lo, hi + 1)))
        return float(hi - lo + 1) - slope * _twice_distance(lo, hi, cn, cd) / 2
    except OverflowError:
        # Integers past the range of a float (the fine common unit of unit
        # fractions with large denominators): the same sum, exactly.
        mass = Fraction(hi - lo + 1)
        if tol:
            edge = Fraction(1.0 - KERNEL_EDGE) * Fraction(tol.denominator, cd * tol.numerator)
            mass -= edge * Fraction(_twice_distance(lo, hi, cn, cd), 2)
        try:
            return float(mass)
        except OverflowError:
            raise LimitError("number of readings in one window of the restoration search",
                             "over 10^308", "10^308 (the range of a floating-point number)",
                             "Give fewer lost letters at once, or an expected value that narrows "
                             "the search; this limit cannot be raised.") from None


def _twice_distance(lo: int, hi: int, cn: int, cd: int) -> int:
    """Twice the sum of |V * cd - cn| over V = lo..hi, exactly in integers."""
    def total(a: int, b: int) -> int:       # twice the sum of V over a..b
        return (a + b) * (b - a + 1) if b >= a else 0

    f = cn // cd
    left_hi, right_lo = min(hi, f), max(lo, f + 1)
    n1, n2 = max(0, left_hi - lo + 1), max(0, hi - right_lo + 1)
    return (2 * n1 * cn - cd * total(lo, left_hi)) + (cd * total(right_lo, hi) - 2 * n2 * cn)


def estimate(grid: Grid, window: Window) -> float:
    """Roughly how many readings of the sub-space fall in *window* (for the limit)."""
    count = math.prod(len(c) for c in grid.contrib)
    span = grid.hi - grid.lo + 1
    return count * min(1.0, (window.hi - window.lo + 1) / span)


class _Suffix:
    """Every reading of the trailing open positions, sorted by value."""

    def __init__(self, grid: Grid, start: int):
        sums = np.zeros(1, dtype=grid.dtype)
        prior = np.ones(1)
        self.sizes = [len(c) for c in grid.contrib[start:]]
        for cs, ps in zip(grid.contrib[start:], grid.priors[start:]):
            sums = np.add.outer(sums, np.array(cs, dtype=grid.dtype)).ravel()
            prior = np.multiply.outer(prior, np.array(ps)).ravel()
        order = np.argsort(sums, kind="stable")
        self.sums = sums[order]
        self.prior = prior[order]
        self.order = order
        self.min = int(self.sums[0])
        self.max = int(self.sums[-1])
        self.start = start


def _split(grid: Grid) -> int:
    """Index of the first open position enumerated in the numpy block."""
    start = len(grid.contrib)
    size = 1
    while start > 0 and size * len(grid.contrib[start - 1]) <= SUFFIX_BLOCK:
        start -= 1
        size *= len(grid.contrib[start])
    return min(start, max(len(grid.contrib) - 1, 0)) if grid.contrib else 0


def merge_windows(windows: list[Window]) -> tuple[list[int], list[int]]:
    """The union of the windows as sorted, disjoint spans (their starts, their ends)."""
    spans = sorted((w.lo, w.hi) for w in windows)
    los, his = [], []
    for lo, hi in spans:
        if los and lo <= his[-1] + 1:
            his[-1] = max(his[-1], hi)
        else:
            los.append(lo)
            his.append(hi)
    return los, his


def inside(merged: tuple[list[int], list[int]], V: int) -> bool:
    """Whether grid integer *V* lies in the union :func:`merge_windows` gave."""
    los, his = merged
    i = bisect_left(his, V)
    return i < len(los) and los[i] <= V


def _search_grid(grid: Grid, windows: list[Window], budget: list[int], matched: int = 0):
    """Branch and bound over the prefix; binary search in the sorted suffix block.

    *matched* readings already agree with the evidence (earlier grids): the
    search stops as soon as the total passes ``limits.RESTORE_MAX_MATCHES``
    (the same error :func:`find_matches` would give at the end, given early).
    """
    start = _split(grid)
    suffix = _Suffix(grid, start)
    prefix = [sorted(range(len(cs)), key=lambda i, cs=cs: (cs[i], i)) for cs in grid.contrib[:start]]
    pre_c = [[grid.contrib[j][i] for i in order] for j, order in enumerate(prefix)]
    k = start
    minrest = [0] * (k + 1)
    maxrest = [0] * (k + 1)
    minrest[k], maxrest[k] = suffix.min, suffix.max
    for j in range(k - 1, -1, -1):
        minrest[j] = minrest[j + 1] + pre_c[j][0]
        maxrest[j] = maxrest[j + 1] + pre_c[j][-1]
    ulos, uhis = merge_windows(windows)
    by_lo = sorted(windows, key=lambda w: (w.lo, w.hi, w.target))
    w_los = [w.lo for w in by_lo]
    widest = max(w.hi - w.lo for w in windows)
    leaves = []   # (S, prior, path, a, b, window)
    stack = [(0, grid.const, 1.0, ())]
    while stack:
        depth, S, prior, path = stack.pop()
        budget[0] += 1
        if budget[0] > limits.RESTORE_MAX_NODES:
            _over_budget()
        nlo, nhi = S + minrest[depth], S + maxrest[depth]
        if depth == k:
            i0 = bisect_left(w_los, nlo - widest)
            i1 = bisect_right(w_los, nhi)
            # Each window looked at is a step too: a leaf under thousands of
            # windows (a long number against the whole catalogue) is no one step.
            budget[0] += i1 - i0
            if budget[0] > limits.RESTORE_MAX_NODES:
                _over_budget()
            for w in by_lo[i0:i1]:
                if w.hi < nlo:
                    continue
                a = int(np.searchsorted(suffix.sums, w.lo - S, side="left"))
                b = int(np.searchsorted(suffix.sums, w.hi - S, side="right"))
                if b > a:
                    leaves.append((S, prior, path, a, b, w))
                    matched += b - a
            if matched > limits.RESTORE_MAX_MATCHES:
                _too_many_matches(matched)
            continue
        cs = pre_c[depth]
        children = set()
        u = bisect_left(uhis, nlo)
        while u < len(ulos) and ulos[u] <= nhi:
            budget[0] += 1
            c_lo = ulos[u] - S - maxrest[depth + 1]
            c_hi = uhis[u] - S - minrest[depth + 1]
            children.update(range(bisect_left(cs, c_lo), bisect_right(cs, c_hi)))
            u += 1
        order = prefix[depth]
        for ci in sorted(children, reverse=True):
            oi = order[ci]
            stack.append((depth + 1, S + cs[ci], prior * grid.priors[depth][oi], path + (oi,)))
    return suffix, leaves


def _over_budget():
    raise LimitError("restoration search", f"over {limits.RESTORE_MAX_NODES:,} steps",
                     f"{limits.RESTORE_MAX_NODES:,} steps",
                     "Give narrower evidence, or set numcheck.limits.RESTORE_MAX_NODES higher.")


def _too_many_matches(total: int):
    raise LimitError("number of readings that agree with the evidence", f"over {total:,}",
                     f"{limits.RESTORE_MAX_MATCHES:,}",
                     "Give narrower evidence, or set numcheck.limits.RESTORE_MAX_MATCHES higher.")


def find_matches(space: Space, grids: list[Grid], windows: list[list[Window]],
                 n_targets: int) -> tuple[Match, np.ndarray, np.ndarray]:
    """Every reading inside some window, with its kernel per target; N_e and reach per target.

    ``N_e`` sums prior × kernel over the readings that agree with target e;
    its *reach* is the largest share, over the sub-spaces, of the target's
    kernel mass that the traces can take (1 when the damage allows every
    value the target accepts, 1/2 when a read digit rules out one of the
    two neighbours of a value that falls between them).
    """
    reached: dict[tuple[int, int], dict] = {}   # (target, sub) -> {V: kernel}
    budget = [0]
    rows_sub, rows_choice, rows_value, rows_prior, rows_hits = [], [], [], [], []
    total = 0
    norm = np.zeros(n_targets)
    n_open = max((len(g.contrib) for g in grids), default=0)
    for grid, wins in zip(grids, windows):
        if not wins:
            continue
        if not grid.contrib:
            hits = [(w.target, _kernel_one(grid.const, w)) for w in wins if w.lo <= grid.const <= w.hi]
            if hits:
                _add_row(rows_sub, rows_choice, rows_value, rows_prior, rows_hits, grid, (), grid.const,
                         grid.sub.mass, hits, n_open)
                for t, kv in hits:
                    norm[t] += grid.sub.mass * kv
                    reached.setdefault((t, grid.sub.index), {})[grid.const] = kv
            continue
        suffix, leaves = _search_grid(grid, wins, budget, total)
        total += sum(b - a for _, _, _, a, b, _ in leaves)
        if total > limits.RESTORE_MAX_MATCHES:
            _too_many_matches(total)
        found: dict[tuple, int] = {}
        for S, prior, path, a, b, w in leaves:
            V = S + suffix.sums[a:b]
            kern = _kernel(V, w)
            pri = prior * suffix.prior[a:b] * grid.sub.mass
            norm[w.target] += float(np.sum(pri * kern))
            seen = reached.setdefault((w.target, grid.sub.index), {})
            for v, kv in zip(V.tolist(), kern.tolist()):
                seen[v] = kv
            for j in range(b - a):
                key = (path, int(suffix.order[a + j]))
                row = found.get(key)
                if row is None:
                    idx = np.unravel_index(int(suffix.order[a + j]), suffix.sizes)
                    choice = path + tuple(int(x) for x in idx)
                    row = _add_row(rows_sub, rows_choice, rows_value, rows_prior, rows_hits, grid,
                                   choice, int(V[j]), float(pri[j]), [], n_open)
                    found[key] = row
                rows_hits[row].append((w.target, float(kern[j])))
    match = Match(np.array(rows_sub, dtype=int),
                  np.array(rows_choice, dtype=int).reshape(len(rows_choice), n_open),
                  rows_value, np.array(rows_prior, dtype=float), np.zeros(len(rows_prior)), rows_hits)
    masses = {(w.target, g.sub.index): w.mass for g, wins in zip(grids, windows) for w in wins}
    reach = np.zeros(n_targets)
    for (t, si), seen in reached.items():
        reach[t] = max(reach[t], min(1.0, sum(seen.values()) / masses[(t, si)]))
    return match, norm, reach


def _add_row(rows_sub, rows_choice, rows_value, rows_prior, rows_hits, grid, choice, V, prior,
             hits, n_open) -> int:
    rows_sub.append(grid.sub.index)
    rows_choice.append(list(choice) + [-1] * (n_open - len(choice)))
    rows_value.append(V)
    rows_prior.append(prior)
    rows_hits.append(list(hits))
    return len(rows_sub) - 1


def _kernel(V: np.ndarray, w: Window) -> np.ndarray:
    from .scoring import KERNEL_EDGE

    base = w.cn // w.cd
    frac = (w.cn - base * w.cd) / w.cd
    d = np.abs((V - base).astype(float) - frac)
    if w.tol == 0:
        return np.ones(len(V))
    return 1.0 - (1.0 - KERNEL_EDGE) * np.minimum(1.0, d / float(w.tol))


def _kernel_one(V: int, w: Window) -> float:
    return float(_kernel(np.array([V], dtype=object), w)[0])


def top_by_prior(grids: list[Grid], skip, want: int, budget: int):
    """The most probable readings a priori, best first, leaving out those *skip* accepts.

    A best-first walk over the product of the open positions' priors: each
    reading is reached once (only positions at or after the last one moved
    are moved again), so the walk costs about *want* × positions steps.
    """
    heap = []
    orders = []
    for g in grids:
        order = [sorted(range(len(ps)), key=lambda i, ps=ps: (-ps[i], i)) for ps in g.priors]
        orders.append(order)
        idx = tuple(0 for _ in order)
        heapq.heappush(heap, (-g.sub.mass * _prod(g, order, idx), g.sub.index, idx, 0))
    found = []
    steps = 0
    by_index = {g.sub.index: (g, o) for g, o in zip(grids, orders)}
    while heap and len(found) < want and steps < budget:
        neg, si, idx, last = heapq.heappop(heap)
        steps += 1
        g, order = by_index[si]
        choice = tuple(order[j][i] for j, i in enumerate(idx))
        V = g.const + sum(g.contrib[j][c] for j, c in enumerate(choice))
        if not skip(g, V):
            found.append((g, choice, V, -neg))
        for j in range(last, len(idx)):
            if idx[j] + 1 < len(order[j]):
                nxt = idx[:j] + (idx[j] + 1,) + idx[j + 1:]
                heapq.heappush(heap, (-g.sub.mass * _prod(g, order, nxt), si, nxt, j))
    return found


def _prod(g: Grid, order, idx) -> float:
    p = 1.0
    for j, i in enumerate(idx):
        p *= g.priors[j][order[j][i]]
    return p
