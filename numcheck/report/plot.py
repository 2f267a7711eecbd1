"""Plot each checked column, its fitted scheme and the flagged lines (matplotlib, Agg).

The figure is drawn on an Agg canvas directly (no pyplot, no screen, no
global backend switch).  Values are converted to floats here, for drawing
only; the check itself was exact.
"""

from __future__ import annotations

import io

from ._common import write_output
from .function_plot import draw_function, is_function

__all__ = ["plot_bytes", "write_plot"]

#: Most flagged lines labelled on one panel (the rest are marked, unlabelled).
MAX_LABELS = 25


def plot_bytes(result, fmt: str = "png") -> bytes:
    """The plot as PNG or SVG bytes."""
    from matplotlib.backends.backend_agg import FigureCanvasAgg
    from matplotlib.figure import Figure

    schemes = result.schemes
    names = [s.column for s in schemes] or list(result.table.columns)[:1]
    fig = Figure(figsize=(9, 2.6 * max(1, len(names))), dpi=100)
    FigureCanvasAgg(fig)
    frame = result.frame
    by_col = {}
    for f in result.findings:
        by_col.setdefault(f.column, []).append(f)
    restored = {}
    for r in result.restorations:
        restored.setdefault(r.column, {}).setdefault(r.index, r)
    for k, name in enumerate(names):
        ax = fig.add_subplot(len(names), 1, k + 1)
        function = next((s for s in schemes if s.column == name and is_function(s)), None)
        if function is not None:   # a computed function: its residuals (report/function_plot.py)
            draw_function(ax, result, function, by_col.get(name, []))
            continue
        written = frame.written[name]
        rows = [i + 1 for i, v in enumerate(written) if v is not None]
        ys = [float(frame.fraction(v)) for v in written if v is not None]
        ax.plot(rows, ys, ".", ms=3, color="#333333", label="written")
        fitted = result.true.get(name)
        scheme = next((s for s in schemes if s.column == name), None)
        if fitted is not None and scheme is not None:
            pts = [(i + 1, float(frame.fraction(v))) for i, v in enumerate(fitted) if v is not None]
            if pts:
                ax.plot([p[0] for p in pts], [p[1] for p in pts], "-", lw=0.8, color="#1f77b4",
                        label=f"scheme: {scheme.kind}")
        flagged = [f for f in by_col.get(name, []) if f.written is not None]
        slips = [f for f in flagged if f.kind != "carried-forward"]
        carried = [f for f in flagged if f.kind == "carried-forward"]
        if carried:
            ax.plot([f.index + 1 for f in carried], [float(frame.fraction(f.written)) for f in carried],
                    "o", mfc="none", color="#d4a017", ms=6, label="carried forward")
        if slips:
            ax.plot([f.index + 1 for f in slips], [float(frame.fraction(f.written)) for f in slips],
                    "x", color="#d62728", ms=8, mew=2, label="slip")
            for f in slips[:MAX_LABELS]:
                ax.annotate(f"{f.index + 1}: {f.kind}", (f.index + 1, float(frame.fraction(f.written))),
                            textcoords="offset points", xytext=(4, 6), fontsize=7, color="#d62728")
        rs = restored.get(name, {})
        if rs:
            ax.plot([i + 1 for i in rs], [float(r.value) for r in rs.values()], "s", mfc="none",
                    color="#17becf", ms=6, label="restored")
        ax.set_title(f"column {name}: {scheme.describe() if scheme else 'no scheme found'}", fontsize=8)
        ax.set_xlabel("row", fontsize=7)
        ax.tick_params(labelsize=7)
        ax.legend(fontsize=6, loc="best")
    fig.tight_layout()
    buf = io.BytesIO()
    fig.savefig(buf, format=fmt)
    return buf.getvalue()


def write_plot(result, path):
    """Write the plot to *path* (``.png`` or ``.svg``, by its suffix) atomically."""
    from pathlib import Path
    suffix = Path(path).suffix.lower()
    fmt = "svg" if suffix == ".svg" else "png"
    data = plot_bytes(result, fmt) if suffix in (".png", ".svg") else b""
    return write_output(result, path, data, (".png", ".svg"), "plot file")
