"""Tables of computed functions (``kind: "function"``): chords, sines, declinations, equations.

Most tables of Greek, Arabic and Latin astronomy tabulate a function of an
argument column in degrees.  For every column that no exact scheme explains,
beside an argument column of constant step, each model of ``models.py`` is
fitted (``estimate.py``: the exact interval method and least squares, for
rounded and for truncated values); the model that explains most cells within
the table's precision wins, and the others that explain as many are named.
The author's method is then looked for (``method.py``: distributed linear
interpolation between nodes), and difference columns beside a function column
are checked with its rounding as tolerance (``differences.py``).
"""

from __future__ import annotations

import numpy as np

from ...errors import NumcheckError
from ..schemes import Frame, Scheme
from .differences import DifferenceScheme, fit_differences
from .estimate import screen
from .method import best_fit, find_interpolation, find_steps
from .models import AUTOMATIC, MODELS, Model, model_named, variants
from .scheme import FunctionScheme, column_places

__all__ = ["fit_functions", "FunctionScheme", "DifferenceScheme", "MODELS", "model_named",
           "parse_models"]

#: Share of the known cells a model must explain (within precision) to be chosen.
_MIN_SHARE = 0.5
#: Models given the full fit after the quick score (the others cannot win).
_SHORTLIST = 4
#: Fewest known cells for a model to be chosen by itself (not forced with --model).
_MIN_CELLS = 8


def parse_models(text) -> dict[str | None, Model]:
    """``"chord"`` or ``"B=declination,C=sine"``: a model for every column, or per column."""
    if not text:
        return {}
    if isinstance(text, dict):
        return {k: (v if isinstance(v, Model) else model_named(v)) for k, v in text.items()}
    out: dict[str | None, Model] = {}
    for part in str(text).split(","):
        part = part.strip()
        if not part:
            continue
        column, eq, name = part.rpartition("=")
        out[column.strip() if eq else None] = model_named(name)
    return out


def _arguments(frame: Frame, chosen: dict[str, Scheme], forced: bool) -> list[str]:
    """The columns that may be the argument: a constant step, values within the circle."""
    out = []
    for name, s in chosen.items():
        if s.kind == "linear" and s.support >= 0.5:
            # on the frame's integer scale: no Fraction per line
            vals = [v for v in frame.written[name] if v is not None]
            if vals and -360 * frame.scale <= min(vals) and max(vals) <= 720 * frame.scale:
                out.append(name)
    if not out and forced and frame.names:
        out.append(frame.names[0])
    return out


def _floats(frame: Frame, name: str) -> np.ndarray:
    s = frame.scale
    return np.array([np.nan if v is None else v / s for v in frame.written[name]], dtype=float)


def _column_fit(frame, name, argument, models, forced=False):
    # a model may be infinite at an end of its range (the shadow at 0°): no warning, a misfit
    with np.errstate(all="ignore"):
        return _column_fit_quiet(frame, name, argument, models, forced)


def _column_fit_quiet(frame, name, argument, models, forced):
    x = _floats(frame, argument)
    w = _floats(frame, name)
    places = column_places(frame, name)
    u = 1.0 / 60 ** places
    steps = find_steps(w, u)
    if len(models) > _SHORTLIST:
        # a quick score first; the full fit (two roundings, intervals) for the best few
        scores = sorted(((screen(m, x, w, u), -k) for k, m in enumerate(models)), reverse=True)
        top = scores[0][0]
        # a model that explains most lines leaves out the ones that explain less than half as
        # many (an interpolated table explains few lines exactly: then the best few are kept)
        clear = top * 2 >= min(len(w), 360)
        models = [models[-k] for score, k in scores[:_SHORTLIST] if not clear or score * 2 >= top]
    options = []
    for m in models:
        exact = best_fit(m, x, w, u)
        if exact is None:
            continue
        found = find_interpolation(exact, x, w, u, steps) if steps is not None else None
        if found is not None:
            interp, refit, values = found
            options.append((refit, interp, values))
        else:
            options.append((exact, None, None))
    if not options:
        return None
    options.sort(key=lambda o: (o[0].n_fit + o[0].n_precision, o[0].n_fit), reverse=True)
    best, interp, values = options[0]
    if best.n_known == 0 or (best.n_fit + best.n_precision) / best.n_known < _MIN_SHARE:
        return None
    if not forced and (best.n_known < _MIN_CELLS or best.n_fit / best.n_known < _MIN_SHARE):
        return None
    alternatives = [{"model": f.model.name, "parameter": f.model.parameter,
                     "estimate_decimal": float(f.exact), "cells_fit": f.n_fit,
                     "cells_within_precision": f.n_precision}
                    for f, _, _ in options[1:] if f.n_fit + f.n_precision == best.n_fit + best.n_precision]
    if alternatives:
        best.notes.append("other models fit as many cells: " +
                          ", ".join(a["model"] for a in alternatives))
    return FunctionScheme(name, frame, argument, best, places, interp, values, alternatives)


def fit_functions(frame: Frame, chosen: dict[str, Scheme], model=None, keep=frozenset()) -> None:
    """Add a function scheme to *chosen* for each column a model explains (and its difference columns).

    The columns in *keep* (those the user stated a relation or scheme for) are left as they are.
    """
    from ..schemes import support_row
    forced = parse_models(model)
    for column in forced:
        if column is not None and column not in frame.names:
            raise NumcheckError(f"--model names column {column!r}, but the table's columns are "
                                f"{', '.join(frame.names)}.")
    arguments = _arguments(frame, chosen, bool(forced))
    if not arguments:
        return
    functions: list[FunctionScheme] = []
    # a column that another column follows exactly is the scribe's own data (the differences
    # of a running sum): a model would only blur it
    sources = {i for s in chosen.values() if s.support == 1.0 for i in s.inputs}
    for name in frame.names:
        if name in arguments or name in keep or (name in sources and name not in forced):
            continue
        current = chosen.get(name)
        asked = name in forced or None in forced
        if name in forced:
            models = variants(forced[name])
        elif None in forced:
            models = variants(forced[None])
        elif current is not None and current.support >= 0.9:
            continue
        else:
            models = [v for m in AUTOMATIC for v in variants(MODELS[m])]
        if current is not None and current.support == 1.0 and name not in forced:
            continue
        scheme = None
        for argument in arguments:     # a line number beside the arc: the better argument wins
            got = _column_fit(frame, name, argument, models, forced=asked)
            if got is None:
                continue
            got.support = support_row(got, frame.written[name], frame.written)
            if scheme is None or got.support > scheme.support:
                scheme = got
        if scheme is None:
            continue
        if current is None or scheme.support > current.support or asked:
            chosen[name] = scheme
            functions.append(scheme)
    if not functions:
        return
    free = [n for n in frame.names if n not in arguments and n not in keep]
    for s in fit_differences(frame, functions, free):
        current = chosen.get(s.column)
        if current is None or s.support > current.support:
            chosen[s.column] = s
