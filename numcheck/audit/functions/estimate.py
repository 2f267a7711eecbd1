"""Estimate a model's parameter from the cells: least squares, and the exact interval method.

* **Interval method.**  A cell written w with last-place unit u holds a true
  value in [w − u/2, w + u/2] if the author rounded, [w, w + u) if he
  truncated; each cell so bounds the parameter (the formula is monotone in it
  at a fixed argument).  The values consistent with every cell that is not a
  slip are where the most cell intervals overlap (a sweep over the interval
  ends): a minority of slips, whose intervals miss that region, cannot move it.
* **Least squares** on the cells that lie within the table's precision of the
  interval's value (the robust start), the parameter that minimises the sum
  of squared residuals (closed form for a model proportional to its
  parameter; Gauss–Newton otherwise).

The parameter the author used is then a published value of the model (its
``usual`` values) inside the interval, or else the value of fewest
sexagesimal places inside the wider interval that one more unit of the last
place allows, nearest the least-squares value (``models.nice``).

Residuals are in units of the last place: for a rounded table a cell fits
when |w − f| ≤ u/2; a cell off by up to one more unit is within the table's
precision (the author's own last-place inaccuracy, counted apart); beyond the
table's tolerance it is a slip.
"""

from __future__ import annotations

from dataclasses import dataclass, field
from fractions import Fraction

import numpy as np

from .models import Model, nice

__all__ = ["Fit", "fit_model", "screen", "cell_intervals", "deepest", "least_squares", "classify_residuals"]

_EPS = 1e-7          # in units of the last place: float noise of the model
_SAMPLE = 360        # lines used by the quick score of a model
_ITER = 48           # bisection steps (the range shrinks by 2**-48)
_SCREEN_ITER = 24    # enough to rank the models


@dataclass
class Fit:
    """A model fitted to one column."""

    model: Model
    rounding: str                 # "rounded" or "truncated"
    estimate: float               # the value used to recompute (fewest places in the interval)
    least_squares: float
    low: float
    high: float
    consistent: int               # cells whose interval holds the estimate region
    fits: np.ndarray              # per row: 0 fits, 1 within precision, 2 slip, -1 unknown
    residual: np.ndarray          # per row, in units of the last place (nan unknown)
    tolerance: float              # in units of the last place
    exact: object = None          # the estimate as a Fraction
    wide: tuple = (0.0, 0.0)      # the interval allowing one more unit (the table's precision)
    notes: list[str] = field(default_factory=list)

    @property
    def n_fit(self) -> int:
        return int(np.sum(self.fits == 0))

    @property
    def n_precision(self) -> int:
        return int(np.sum(self.fits == 1))

    @property
    def n_slips(self) -> int:
        return int(np.sum(self.fits == 2))

    @property
    def n_known(self) -> int:
        return int(np.sum(self.fits >= 0))


def _bounds(w, u, rounding):
    if rounding == "truncated":
        return w - _EPS * u, w + u * (1 + _EPS)
    return w - u * (0.5 + _EPS), w + u * (0.5 + _EPS)


def _solve(model: Model, x, target, a: float, b: float, iterations: int = _ITER):
    """Per cell, the parameter in [a, b] where f(x; p) = target (clipped to a or b)."""
    fa, fb = model(x, a), model(x, b)
    rising = fb >= fa
    lo = np.full(x.shape, a, dtype=float)
    hi = np.full(x.shape, b, dtype=float)
    for _ in range(iterations):
        mid = (lo + hi) / 2
        fm = model(x, mid)
        below = np.where(rising, fm < target, fm > target)
        lo = np.where(below, mid, lo)
        hi = np.where(below, hi, mid)
    return (lo + hi) / 2


def cell_intervals(model: Model, x, lo, hi, a=None, b=None, iterations: int = _ITER):
    """(plow, phigh) per cell: the parameters for which the model lies in [lo, hi] (nan: none)."""
    a = model.low if a is None else a
    b = model.high if b is None else b
    n = len(x)
    plo = np.full(n, np.nan)
    phi = np.full(n, np.nan)
    if model.linear:
        g = model(x, 1.0)
        pos, neg = g > 1e-12, g < -1e-12
        with np.errstate(all="ignore"):
            plo = np.where(pos, lo / g, np.where(neg, hi / g, np.nan))
            phi = np.where(pos, hi / g, np.where(neg, lo / g, np.nan))
        flat = ~(pos | neg)
        inside = flat & (lo <= 0) & (hi >= 0)
        plo = np.where(inside, a, plo)
        phi = np.where(inside, b, phi)
        plo, phi = np.maximum(plo, a), np.minimum(phi, b)
    else:
        fa, fb = model(x, a), model(x, b)
        flat = np.abs(fb - fa) < 1e-12
        p1 = _solve(model, x, lo, a, b, iterations)
        p2 = p1 if hi is lo else _solve(model, x, hi, a, b, iterations)
        plo, phi = np.minimum(p1, p2), np.maximum(p1, p2)
        fmin, fmax = np.minimum(fa, fb), np.maximum(fa, fb)
        miss = (hi < fmin) | (lo > fmax)
        plo = np.where(miss, np.nan, plo)
        phi = np.where(miss, np.nan, phi)
        inside = flat & (lo <= fa) & (hi >= fa)
        plo = np.where(flat, np.where(inside, a, np.nan), plo)
        phi = np.where(flat, np.where(inside, b, np.nan), phi)
    empty = ~(plo <= phi)
    plo[empty] = np.nan
    phi[empty] = np.nan
    return plo, phi


def deepest(plo, phi, prefer: float | None = None):
    """The region where the most intervals overlap: (low, high, depth, how many such regions)."""
    ok = ~np.isnan(plo)
    if not ok.any():
        return None
    starts, ends = plo[ok], phi[ok]
    points = np.concatenate([starts, ends])
    kinds = np.concatenate([np.ones(len(starts)), -np.ones(len(ends))])
    order = np.lexsort((-kinds, points))   # a start before an end at the same point
    points, kinds = points[order], kinds[order]
    depth = np.cumsum(kinds)
    best = depth.max()
    regions = []
    for k in np.nonzero(depth == best)[0]:
        regions.append((float(points[k]), float(points[k + 1]) if k + 1 < len(points) else float(points[k])))
    if prefer is not None:
        chosen = min(regions, key=lambda r: 0 if r[0] <= prefer <= r[1] else min(abs(prefer - r[0]),
                                                                                    abs(prefer - r[1])))
    else:
        chosen = max(regions, key=lambda r: r[1] - r[0])
    return chosen[0], chosen[1], int(best), len(regions)


def least_squares(model: Model, x, y, start: float) -> float:
    """The parameter minimising Σ (y − f(x; p))², from *start*."""
    if len(x) == 0:
        return start
    if model.linear:
        g = model(x, 1.0)
        den = float(np.dot(g, g))
        return float(np.dot(g, y) / den) if den else start
    p = start
    span = model.high - model.low
    for _ in range(20):
        h = max(abs(p), 1.0) * 1e-6
        f0 = model(x, p)
        d = (model(x, p + h) - f0) / h
        den = float(np.dot(d, d))
        if not den:
            break
        step = float(np.dot(d, y - f0) / den)
        p = min(max(p + step, model.low), model.high)
        if abs(step) < 1e-13 * span:
            break
    return p


def classify_residuals(r, rounding: str, tolerance: float):
    """0 fits, 1 within the table's precision, 2 slip (nan → -1)."""
    out = np.full(r.shape, -1, dtype=int)
    known = ~np.isnan(r)
    if rounding == "truncated":
        d = -r   # model minus written, in units
        fit = (d >= -_EPS) & (d < 1 + _EPS)
        near = (d >= -(tolerance - 0.5) - _EPS) & (d < tolerance + 0.5 + _EPS)
    else:
        fit = np.abs(r) <= 0.5 + 1e-6
        near = np.abs(r) <= tolerance + 1e-6
    out[known & fit] = 0
    out[known & ~fit & near] = 1
    out[known & ~near] = 2
    return out


def _tolerance(r, rounding) -> float:
    """The table's own precision: 1.5 units, wider when most cells are further off."""
    a = np.abs(r[~np.isnan(r)])
    if rounding == "truncated":
        a = np.abs(-r[~np.isnan(r)] - 0.5)
    if not len(a):
        return 1.5
    q = float(np.quantile(a, 0.75))
    return float(min(3.5, max(1.5, np.ceil(q * 2) / 2 + 0.5 if q > 1.0 else 1.5)))


def screen(model: Model, x, w, u) -> int:
    """A quick score: cells within 2 units of the model at the median of the cells' own parameters."""
    known = np.nonzero(~np.isnan(w) & ~np.isnan(x))[0]
    if len(known) < 3:
        return 0
    if len(known) > _SAMPLE:   # a long table: evenly spread lines are enough to rank the models
        known = known[np.linspace(0, len(known) - 1, _SAMPLE).astype(int)]
    target = w[known]
    plo, phi = cell_intervals(model, x[known], target, target, iterations=_SCREEN_ITER)
    mids = plo[~np.isnan(plo)]
    if not len(mids):
        return 0
    p = float(np.median(mids))
    return int(np.sum(np.abs(w[known] - model(x[known], p)) <= 2 * u))


def fit_model(model: Model, x, w, u, rounding: str, mask=None) -> Fit | None:
    """Fit *model* to the known cells (w, in units u) at arguments x, with the author's *rounding*.

    *mask* limits the cells used for the estimate (e.g. to the nodes of an
    interpolated table); every known cell is classified.
    """
    known = ~np.isnan(w) & ~np.isnan(x)
    use = known if mask is None else known & mask
    if use.sum() < 3:
        return None
    lo, hi = _bounds(w, u, rounding)
    plo, phi = cell_intervals(model, x[use], lo[use], hi[use])
    mids = (plo + phi) / 2
    finite = ~np.isnan(mids)
    # the robust start: the median of the cells' own parameters
    start = float(np.median(mids[finite])) if finite.any() else float(np.mean([model.low, model.high]))
    region = deepest(plo, phi, prefer=start)
    if region is None:
        low = high = start
        depth, many = 0, 1
    else:
        low, high, depth, many = region
    centre = (low + high) / 2
    shift = 0.5 if rounding == "truncated" else 0.0
    r0 = (w - model(x, centre)) / u + shift
    near = use & (np.abs(r0) <= 1.5)
    ls = least_squares(model, x[near], (w + shift * u)[near], centre) if near.sum() >= 2 else centre
    if not all(np.isfinite(v) for v in (ls, low, high)):
        return None
    # The wider interval the author's own last-place inaccuracy allows (one more unit):
    # the author's round parameter is looked for there (Āryabhaṭa's R = 3438 lies outside
    # the strict interval of his sines, four of which are one unit off).
    r_ls = np.where(known, (w - model(x, ls)) / u, np.nan)
    tol = _tolerance(r_ls[use], rounding)
    wide = (tol - 0.5) * u
    plo2, phi2 = cell_intervals(model, x[use], lo[use] - wide, hi[use] + wide)
    region2 = deepest(plo2, phi2, prefer=ls)
    wlow, whigh = (region2[0], region2[1]) if region2 else (low, high)
    wlow, whigh = min(wlow, low), max(whigh, high)
    # a published value inside the strict interval is the author's; else the roundest value
    usual = [Fraction(v).limit_denominator(60 ** 3) for v in model.usual]
    inside = [v for v in usual if low <= v <= high]
    exact = min(inside, key=lambda v: abs(v - ls)) if inside else nice(ls, wlow, whigh)
    est = float(exact)
    f = model(x, est)
    r = np.where(known, (w - f) / u, np.nan)
    fits = classify_residuals(r, rounding, tol)
    fit = Fit(model, rounding, est, ls, low, high, depth, fits, r, tol, exact)
    fit.wide = (wlow, whigh)
    if many > 1:
        fit.notes.append(f"{many} separate ranges of {model.parameter} agree with as many cells")
    return fit
