"""The author's method: rounding or truncation, exact computation or distributed linear interpolation.

Distributed linear interpolation: the author computed the function exactly
at *nodes* every k lines and filled the lines between by dividing the
difference of two nodes evenly, y = N_a + j/k · (N_b − N_a), rounded to the
table's places.  Its signature is in the second differences (zero within a
stretch between nodes, a jump at each node; Van Brummelen 1993, from memory):
the check here recomputes the table both ways and keeps interpolation when it
explains clearly more cells than the exact function.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from .estimate import Fit, classify_residuals, fit_model
from .models import Model

__all__ = ["Interpolation", "best_fit", "interpolated", "find_interpolation", "find_steps", "STEPS"]

#: Node steps (in lines) tried for distributed linear interpolation.
STEPS = (2, 3, 4, 5, 6, 8, 10, 12, 15, 20, 24, 30)


@dataclass
class Interpolation:
    step: int          # lines from one node to the next
    offset: int        # the row index (0-based) of the first node

    def nodes(self, n: int) -> np.ndarray:
        mask = np.zeros(n, dtype=bool)
        mask[self.offset::self.step] = True
        return mask


def _round(v, u, rounding):
    q = v / u
    return (np.floor(q + 1e-9) if rounding == "truncated" else np.floor(q + 0.5)) * u


def best_fit(model: Model, x, w, u, rounding: str | None = None):
    """The better of rounding and truncation (rounding wins a tie, with a note)."""
    fits = [f for f in (fit_model(model, x, w, u, r) for r in
                        ((rounding,) if rounding else ("rounded", "truncated"))) if f is not None]
    if not fits:
        return None
    best = max(fits, key=lambda f: (f.n_fit, f.n_fit + f.n_precision, f.rounding == "rounded"))
    others = [f for f in fits if f is not best and f.n_fit == best.n_fit]
    if others:
        best.notes.append(f"{others[0].rounding} values fit as many cells as {best.rounding} ones")
    return best


def interpolated(model: Model, x, w, u, p: float, rounding: str, interp: Interpolation,
                 tolerance: float = 1.5):
    """The values the author's interpolation gives every line (nodes: his own where within precision)."""
    n = len(x)
    f = model(x, p)
    exact_nodes = _round(f, u, rounding)
    nodes = interp.nodes(n)
    node_values = exact_nodes.copy()
    own = nodes & ~np.isnan(w) & (np.abs(w - f) <= tolerance * u + 1e-9 * u)
    node_values[own] = w[own]
    out = exact_nodes.copy()
    idx = np.nonzero(nodes)[0]
    for a, b in zip(idx[:-1], idx[1:]):
        j = np.arange(a, b + 1)
        t = (j - a) / (b - a)
        out[a:b + 1] = _round(node_values[a] + t * (node_values[b] - node_values[a]), u, rounding)
        out[a] = node_values[a] if own[a] else exact_nodes[a]
        out[b] = node_values[b] if own[b] else exact_nodes[b]
    # lines before the first node and after the last: from the nodes beyond the table's
    # ends, computed by the model as the author would have
    known_x = x[~np.isnan(x)]
    h = float(np.median(np.diff(known_x))) if len(known_x) > 1 else 0.0
    k = interp.step
    if len(idx) and h:
        first, last = idx[0], idx[-1]
        if first > 0 and not np.isnan(x[first]):
            before = float(_round(model(x[first] - k * h, p), u, rounding))
            j = np.arange(first - k + 1, first)
            keep = j >= 0
            t = (j[keep] - (first - k)) / k
            out[j[keep]] = _round(before + t * (node_values[first] - before), u, rounding)
        if last < n - 1 and not np.isnan(x[last]):
            after = float(_round(model(x[last] + k * h, p), u, rounding))
            j = np.arange(last + 1, min(n, last + k))
            t = (j - last) / k
            out[j] = _round(node_values[last] + t * (after - node_values[last]), u, rounding)
    return out


def _between(w, u, rounding, interp: Interpolation):
    """The values the written nodes give the lines between them (nan where a node is missing)."""
    n = len(w)
    j = np.arange(n)
    a = interp.offset + ((j - interp.offset) // interp.step) * interp.step
    b = a + interp.step
    ok = (j > a) & (a >= 0) & (b < n)
    out = np.full(n, np.nan)
    aj, bj, jj = a[ok], b[ok], j[ok]
    with np.errstate(invalid="ignore"):
        out[jj] = _round(w[aj] + (jj - aj) / interp.step * (w[bj] - w[aj]), u, rounding)
    return out


def find_steps(w, u):
    """The node step and rounding whose interpolation of the written nodes gives most lines between.

    Returns (interpolation, rounding, share of the lines between that it gives exactly), or None.
    This needs no model: the lines between follow from the nodes as written.
    """
    n = len(w)
    known = ~np.isnan(w)
    if known.sum() < 8:
        return None
    best = None
    for k in STEPS:
        if k * 3 > n:
            break
        for o in range(k):
            interp = Interpolation(k, o)
            between = known & ~interp.nodes(n)
            for rounding in ("rounded", "truncated"):
                values = _between(w, u, rounding, interp)
                ok = between & ~np.isnan(values)
                if ok.sum() < 4:
                    continue
                hits = int(np.sum(np.abs(w - values)[ok] < u * 1e-6))
                share = hits / ok.sum()
                if best is None or (share, -k) > (best[2], -best[0].step):
                    best = (interp, rounding, share, hits)
    return best


def find_interpolation(fit: Fit, x, w, u, found=None) -> tuple[Interpolation, Fit, np.ndarray] | None:
    """A node step that explains clearly more cells than the exact function, refitted on its nodes."""
    n = len(x)
    known = ~np.isnan(w)
    found = find_steps(w, u) if found is None else found
    if found is None:
        return None
    interp, rounding, share, hits = found
    between = known & ~interp.nodes(n)
    exact_hits = int(np.sum((fit.fits == 0)[between])) if fit is not None else 0
    if share < 0.5 or hits - exact_hits < max(3, 0.1 * known.sum()):
        return None
    refit = fit_model(fit.model, x, w, u, rounding, mask=interp.nodes(n))
    if refit is None:
        return None
    values = interpolated(fit.model, x, w, u, refit.estimate, rounding, interp, refit.tolerance)
    r = np.where(known, (w - values) / u, np.nan)
    refit.residual = r
    refit.fits = classify_residuals(r, "rounded", refit.tolerance)
    refit.fits[known & (np.abs(r) < 1e-6)] = 0
    refit.fits[known & (np.abs(r) >= 1e-6) & (refit.fits == 0)] = 1
    return interp, refit, values
