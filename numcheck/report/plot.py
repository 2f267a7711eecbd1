"""Pictures of an audit that show what is wrong (matplotlib, Agg).

For each column of the table (a column that only numbers the lines gets no
panel) two panels side by side:

* the values as written, with the scheme found drawn through them, the
  value axis labelled in sexagesimal;
* the **residual**: written minus scheme, in units of the column's last
  written place, on a scale that is linear within ±1 and logarithmic beyond,
  so that a unit slip (±1), a ten slip (±10), a place shift (×60) and a
  carried slip (the same residual line after line) each look like what they are.

A column without a scheme is still drawn (its values alone, and a word that no
scheme was found).  One key for the marks and colours sits above the panels.
The figure is drawn on an Agg canvas directly (no pyplot, no screen, no global
backend switch).  Values become floats here, for drawing only: the check itself
was exact.
"""

from __future__ import annotations

import io
import math
import textwrap
from fractions import Fraction

from ._common import KEY, display_name, numbering_columns, write_output
from .function_plot import draw_function, is_function

__all__ = ["plot_bytes", "write_plot", "residuals", "sexagesimal_tick"]

#: Most flagged lines labelled on one panel (the rest are marked, unlabelled).
MAX_LABELS = 25
#: Label offsets in points, taken in turn so that neighbouring labels do not overlap:
#: below a point above the zero line, above one below it (away from the edges).
_OFFSETS_UP = ((6, -14), (6, -26))
_OFFSETS_DOWN = ((6, 8), (6, 20))
_COLOUR = {name: colour for name, _, _, _, colour in KEY}


def sexagesimal_tick(x: float, places: int = 2) -> str:
    """A tick label in sexagesimal notation, rounded to *places* fractional places.

    >>> sexagesimal_tick(29.5), sexagesimal_tick(28.125, 2), sexagesimal_tick(-0.5)
    ('29;30', '28;7,30', '-0;30')
    """
    from ..reading import sexagesimal_text

    scale = 60 ** places
    return sexagesimal_text(Fraction(round(x * scale), scale))


def _label(ax, points) -> None:
    """Label points so that no two labels overlap: each takes the first free place near its point.

    Places are tried below, above and further out (in points, away from the
    zero line first), inside the panel; a label that finds none is left out
    (the mark stays, and the flag is in the report).
    """
    fig = ax.figure
    fig.canvas.draw()                     # a renderer, to measure the text
    renderer = fig.canvas.get_renderer()
    taken = []
    frame = ax.get_window_extent(renderer)
    for x, y, text in points:
        first, second = (_OFFSETS_UP, _OFFSETS_DOWN) if y > 0 else (_OFFSETS_DOWN, _OFFSETS_UP)
        for dx, dy in first + second + ((6, 32 if y <= 0 else -38),):
            ann = ax.annotate(text, (x, y), textcoords="offset points", xytext=(dx, dy), fontsize=7,
                              color=_COLOUR["slip"])
            box = ann.get_window_extent(renderer)
            inside = frame.x0 <= box.x0 and box.x1 <= frame.x1 and frame.y0 <= box.y0 and box.y1 <= frame.y1
            if inside and not any(box.overlaps(b) for b in taken):
                taken.append(box)
                break
            ann.remove()


def _place_tick(v: float, places: int) -> str:
    """A residual tick at ±60^k units of the last place, named by its place.

    >>> _place_tick(3600.0, 3), _place_tick(-1.0, 3), _place_tick(0.0, 3)
    ('+1 at 60^-1', '-1 at 60^-3', '0')
    """
    if v == 0:
        return "0"
    k = round(math.log(abs(v), 60))
    return f"{'+' if v > 0 else '-'}1 at 60^{k - places}"


def residuals(result, name: str) -> list[tuple[int, Fraction]]:
    """(row, written minus scheme in units of the column's last place) for each checked line.

    A longitude's residual is taken within ±180°.
    """
    frame = result.frame
    fitted = result.true.get(name)
    written = frame.written.get(name)
    if fitted is None or written is None:
        return []
    places = result.table.columns[name].usual_places
    modulus = frame.modulus.get(name)
    out = []
    for i, (w, t) in enumerate(zip(written, fitted)):
        if w is None or t is None:
            continue
        d = w - t
        if modulus:
            d = (d + modulus // 2) % modulus - modulus // 2
        out.append((i + 1, Fraction(d, frame.scale) * 60 ** places))
    return out


def _unit(result, name: str) -> str:
    return "degrees of longitude" if result.table.columns[name].longitude else "as written"


def _columns(result) -> list[str]:
    """The columns to draw: every column but one that numbers the lines, in table order."""
    skip = numbering_columns(result.table)
    names = [n for n in result.table.columns if n not in skip and n in result.frame.written]
    return names or [s.column for s in result.schemes][:1]


def plot_bytes(result, fmt: str = "png") -> bytes:
    """The plot as PNG or SVG bytes."""
    from matplotlib.backends.backend_agg import FigureCanvasAgg
    from matplotlib.figure import Figure
    from matplotlib.lines import Line2D
    from matplotlib.ticker import FuncFormatter, MaxNLocator, NullLocator

    names = _columns(result)
    fig = Figure(figsize=(11, 2.9 * max(1, len(names)) + 0.6), dpi=100)
    FigureCanvasAgg(fig)
    frame = result.frame
    schemes = {s.column: s for s in result.schemes}
    by_col: dict[str, list] = {}
    for f in result.findings:
        by_col.setdefault(f.column, []).append(f)
    restored: dict[str, dict] = {}
    for r in result.restorations:
        restored.setdefault(r.column, {}).setdefault(r.index, r)
    pending = []    # labels are placed once the axes have their final size
    for k, name in enumerate(names):
        scheme = schemes.get(name)
        function = next((s for s in result.schemes if s.column == name and is_function(s)), None)
        if function is not None:   # a computed function: its residuals (report/function_plot.py)
            draw_function(fig.add_subplot(len(names), 1, k + 1), result, function, by_col.get(name, []))
            continue
        ax = fig.add_subplot(len(names), 2, 2 * k + 1)
        written = frame.written.get(name, [])
        pts = [(i + 1, float(frame.fraction(v))) for i, v in enumerate(written) if v is not None]
        ax.plot([p[0] for p in pts], [p[1] for p in pts], ".", ms=3, color="#333333")
        fitted = result.true.get(name)
        limits = None
        if fitted is not None and scheme is not None:
            line = [(i + 1, float(frame.fraction(v))) for i, v in enumerate(fitted) if v is not None]
            ax.plot([p[0] for p in line], [p[1] for p in line], "-", lw=0.8, color="#1f77b4")
            if line:
                # Scale to the scheme, so that one wild value does not flatten the rest;
                # a value beyond is drawn at the edge as an arrow head.
                lo, hi = min(p[1] for p in line), max(p[1] for p in line)
                pad = (hi - lo) * 0.2 or abs(hi) * 0.05 or 1.0
                limits = (lo - pad, hi + pad)
        flagged = [f for f in by_col.get(name, []) if f.written is not None]
        slips = [f for f in flagged if f.kind != "carried-forward"]
        carried = [f for f in flagged if f.kind == "carried-forward"]
        if carried:
            ax.plot([f.index + 1 for f in carried], [float(frame.fraction(f.written)) for f in carried],
                    "o", mfc="none", color=_COLOUR["carried forward"], ms=6)
        if slips:
            inside, beyond = [], []
            for f in slips:
                y = float(frame.fraction(f.written))
                if limits and not limits[0] <= y <= limits[1]:
                    beyond.append((f.index + 1, limits[1] if y > limits[1] else limits[0], y > limits[1]))
                else:
                    inside.append((f.index + 1, y))
            ax.plot([p[0] for p in inside], [p[1] for p in inside], "x", color=_COLOUR["slip"], ms=8, mew=2)
            for x, y, up in beyond:
                ax.plot([x], [y], "^" if up else "v", color=_COLOUR["slip"], ms=7, clip_on=False)
        if limits:
            ax.set_ylim(*limits)
        rs = restored.get(name, {})
        if rs:
            ax.plot([i + 1 for i in rs], [float(r.value) for r in rs.values()], "s", mfc="none",
                    color=_COLOUR["restored"], ms=6)
        what = scheme.describe() if scheme else "no scheme found: not checked"
        ax.set_title(textwrap.fill(f"column {name}: {what}", 75), fontsize=8, loc="left")
        ax.set_xlabel("row", fontsize=7)
        ax.set_ylabel(f"{name} ({_unit(result, name)})", fontsize=7)
        ax.yaxis.set_major_locator(MaxNLocator(6))
        ax.yaxis.set_major_formatter(FuncFormatter(lambda x, _pos: sexagesimal_tick(x)))
        ax.tick_params(labelsize=7)

        rax = fig.add_subplot(len(names), 2, 2 * k + 2)
        res = residuals(result, name)
        if not res:
            rax.text(0.5, 0.5, "no scheme, so no residual", ha="center", va="center", fontsize=8,
                     transform=rax.transAxes)
            rax.set_xticks([])
            rax.set_yticks([])
            continue
        rows = [r for r, _ in res]
        vals = [float(v) for _, v in res]
        rax.axhline(0, color="#999999", lw=0.6)
        rax.plot(rows, vals, ".", ms=3, color="#333333")
        by_row = dict(res)
        if carried:
            rax.plot([f.index + 1 for f in carried], [float(by_row.get(f.index + 1, 0)) for f in carried],
                     "o", mfc="none", color=_COLOUR["carried forward"], ms=6)
        if slips:
            rax.plot([f.index + 1 for f in slips], [float(by_row.get(f.index + 1, 0)) for f in slips],
                     "x", color=_COLOUR["slip"], ms=8, mew=2)
            pending.append((rax, [(f.index + 1, float(by_row.get(f.index + 1, 0)), f"{f.index + 1}: {f.kind}")
                                  for f in slips[:MAX_LABELS]]))
        places = result.table.columns[name].usual_places
        top = max(1.0, max(abs(v) for v in vals))
        ks = range(0, int(math.log(top, 60)) + 2)
        ticks = [0.0] + [60.0 ** k for k in ks] + [-(60.0 ** k) for k in ks]
        rax.set_yscale("symlog", linthresh=1, base=60)
        rax.set_yticks(sorted(ticks))
        rax.yaxis.set_major_formatter(FuncFormatter(lambda v, _pos: _place_tick(v, places)))
        rax.yaxis.set_minor_locator(NullLocator())
        rax.set_title(f"column {name}: written minus scheme", fontsize=8, loc="left")
        rax.set_xlabel("row", fontsize=7)
        rax.set_ylabel("residual, in units of the place named", fontsize=7)
        rax.tick_params(labelsize=7)
    handles = [Line2D([], [], ls="", marker=".", color="#333333", label="written"),
               Line2D([], [], color="#1f77b4", lw=0.8, label="scheme"),
               Line2D([], [], ls="", marker="x", mew=2, color=_COLOUR["slip"], label="slip"),
               Line2D([], [], ls="", marker="o", mfc="none", color=_COLOUR["carried forward"],
                      label="carried forward"),
               Line2D([], [], ls="", marker="s", mfc="none", color=_COLOUR["restored"], label="restored")]
    fig.legend(handles=handles, loc="upper center", ncol=len(handles), fontsize=7, frameon=False)
    source = getattr(result, "source", "") or ""
    fig.suptitle(f"numcheck audit of {display_name(source)}", fontsize=9, x=0.01, ha="left", y=0.995)
    fig.tight_layout(rect=(0, 0, 1, 1 - 0.3 / fig.get_figheight()))
    for rax, points in pending:
        _label(rax, points)
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
