"""The residual picture of a function column: written − model, in units of the last place.

One panel per function column: the residual of every cell against the
argument, the band of the table's precision shaded, the slips marked, the
model and its parameter in the title.  Floats here are for drawing only.
"""

from __future__ import annotations


__all__ = ["draw_function", "is_function"]


def is_function(scheme) -> bool:
    return getattr(scheme, "kind", "") == "function" and hasattr(scheme, "fit")


def draw_function(ax, result, scheme, findings) -> None:
    """Draw the residuals of *scheme*'s column on the matplotlib axes *ax*."""
    import numpy as np

    frame = result.frame
    fit = scheme.fit
    s = frame.scale
    x = np.array([np.nan if v is None else v / s for v in frame.written[scheme.argument]], dtype=float)
    r = np.asarray(fit.residual, dtype=float)
    known = ~np.isnan(r) & ~np.isnan(x)
    tol = fit.tolerance
    if fit.rounding == "truncated":
        ax.axhspan(-1, 0, color="#d9ead3", lw=0, label="truncation")
        ax.axhspan(-(tol + 0.5), tol - 0.5, color="#f4f4f4", lw=0, zorder=0, label="precision")
    else:
        ax.axhspan(-tol, tol, color="#f4f4f4", lw=0, zorder=0, label="precision")
        ax.axhspan(-0.5, 0.5, color="#d9ead3", lw=0, label="rounding")
    ax.plot(x[known], r[known], ".", ms=3, color="#333333", label="written − model")
    slips = [f for f in findings if f.kind != "carried-forward" and f.written is not None]
    if slips:
        idx = [f.index for f in slips]
        ys = np.clip(r[idx], -3 * tol, 3 * tol)
        ax.plot(x[idx], ys, "x", color="#d62728", ms=8, mew=2, label="slip")
        for f, y in list(zip(slips, ys))[:25]:
            ax.annotate(f"{f.index + 1}", (x[f.index], y), textcoords="offset points",
                        xytext=(4, 4), fontsize=7, color="#d62728")
    ax.set_ylim(-3 * tol - 0.5, 3 * tol + 0.5)
    p = scheme.parameter()
    method = fit.rounding
    if scheme.interpolation:
        method += f", interpolated every {scheme.interpolation.step} lines"
    ax.set_title(f"column {scheme.column}: {scheme.model.name}, {p['name']} = {p['estimate']} "
                 f"(consistent {p['low']} to {p['high']}), {method}", fontsize=8)
    ax.set_xlabel(f"argument ({scheme.argument})", fontsize=7)
    ax.set_ylabel("units of the last place", fontsize=7)
    ax.tick_params(labelsize=7)
    ax.legend(fontsize=6, loc="best")
