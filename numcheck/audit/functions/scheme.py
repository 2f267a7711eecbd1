"""A column computed from a model of its argument column, as an audit scheme (``kind: "function"``).

A row scheme: ``expect`` gives the written cell back where the model (or the
author's interpolation) explains it within the table's precision, and the
recomputed value, written to the column's places as the author would round
or truncate it, where it does not; ``diagnose`` then names the slip of each
such cell with the slip model of the script.
"""

from __future__ import annotations

from fractions import Fraction

import numpy as np

from ...reading import sexagesimal_text
from ..schemes import Frame, Scheme
from .estimate import Fit
from .method import Interpolation
from .models import longest_day_from_latitude

__all__ = ["FunctionScheme", "scaled_unit", "column_places"]


def column_places(frame: Frame, name: str) -> int:
    """The number of sexagesimal places most cells of the column write (on the frame's scale)."""
    counts: dict[int, int] = {}
    for v in frame.written[name]:
        if v is None or not isinstance(v, int):
            continue
        k = 0
        while k < 12 and (v * 60 ** k) % frame.scale:
            k += 1
        counts[k] = counts.get(k, 0) + 1
    return max(counts, key=lambda k: (counts[k], k)) if counts else 0


def scaled_unit(frame: Frame, places: int) -> int | Fraction:
    unit = Fraction(frame.scale, 60 ** places)
    return unit.numerator if unit.denominator == 1 else unit


def _param_text(v: float) -> str:
    return sexagesimal_text(Fraction(round(v * 60 ** 4), 60 ** 4))


class FunctionScheme(Scheme):
    """y = f(x; p) of the argument column x, checked within the table's precision."""

    kind = "function"
    chained = False

    def __init__(self, column: str, frame: Frame, argument: str, fit: Fit, places: int,
                 interpolation: Interpolation | None = None, values=None, alternatives=()):
        super().__init__(column, frame)
        self.argument = argument
        self.inputs = (argument,)
        self.fit = fit
        self.places = places
        self.interpolation = interpolation
        self.alternatives = list(alternatives)
        self._unit = scaled_unit(frame, places)
        u = 1.0 / 60 ** places
        if values is None:
            x = _floats(frame, argument)
            f = fit.model(x, fit.estimate)
            q = f / u
            values = np.floor(q + 1e-9) if fit.rounding == "truncated" else np.floor(q + 0.5)
        else:
            values = np.round(values / u)
        self._units = [int(v) if np.isfinite(v) else None for v in values]

    @property
    def model(self):
        return self.fit.model

    @property
    def restore_tolerance(self) -> Fraction:
        """A damaged cell is restored to a reading within the table's precision of the model."""
        return Fraction(round(self.fit.tolerance * 2), 2) / 60 ** self.places

    def describe(self) -> str:
        p = self.parameter()
        text = (f"{self.model.name} of column {self.argument}: {self.model.formula}, "
                f"{p['name']} = {p['estimate']} (consistent {p['low']} to {p['high']}), "
                f"{self.fit.rounding}")
        if self.interpolation:
            text += f", interpolated linearly between nodes every {self.interpolation.step} lines"
        text += (f"; {self.fit.n_fit} cells fit, {self.fit.n_precision} within one unit of "
                 "the last place")
        return text

    def expect(self, i, src):
        w = self.frame.written[self.column][i]
        if w is not None and self.fit.fits[i] in (0, 1):
            return w
        n = self._units[i]
        if n is None:
            return None
        v = n * self._unit
        return v.numerator if isinstance(v, Fraction) and v.denominator == 1 else v

    # -- output --------------------------------------------------------
    def rows(self, code: int) -> list[int]:
        return [int(i) + 1 for i in np.nonzero(self.fit.fits == code)[0]]

    def parameter(self) -> dict:
        fit = self.fit
        out = {"name": fit.model.parameter, "unit": fit.model.unit,
               "estimate": sexagesimal_text(fit.exact), "estimate_decimal": float(fit.exact),
               "least_squares": _param_text(fit.least_squares),
               "least_squares_decimal": fit.least_squares,
               "low": _param_text(fit.low), "low_decimal": fit.low,
               "high": _param_text(fit.high), "high_decimal": fit.high,
               "cells_consistent": fit.consistent,
               "precision_low": _param_text(fit.wide[0]), "precision_low_decimal": fit.wide[0],
               "precision_high": _param_text(fit.wide[1]), "precision_high_decimal": fit.wide[1]}
        if fit.model.parameter == "φ":
            out["longest_day_hours_decimal"] = longest_day_from_latitude(float(fit.exact))
        return out

    def params(self) -> dict:
        return {"model": self.model.name, "argument": self.argument,
                self.model.parameter: sexagesimal_text(self.fit.exact)}

    def _interpolation(self):
        if not self.interpolation:
            return "none"
        step, first = self.interpolation.step, self.interpolation.offset
        rows = list(range(first, self.frame.nrows, step))
        args = self.frame.written[self.argument]
        known = [args[i] for i in rows if args[i] is not None]
        out = {"step": step, "nodes": [i + 1 for i in rows]}
        if len(known) >= 2:
            out["node_arguments"] = [sexagesimal_text(self.frame.fraction(a)) for a in known]
        return out

    def to_dict(self) -> dict:
        out = super().to_dict()
        fit = self.fit
        out.update({
            "model": self.model.name,
            "formula": self.model.formula,
            "model_source": self.model.source,
            "argument": self.argument,
            "parameters": [self.parameter()] + [
                {"name": n, "estimate": sexagesimal_text(Fraction(v).limit_denominator(60 ** 3)),
                 "estimate_decimal": v, "fixed": True, "source": src}
                for n, v, src in fit.model.fixed],
            "rounding": fit.rounding,
            "places": self.places,
            "tolerance_units": fit.tolerance,
            "interpolation": self._interpolation(),
            "cells_fit": fit.n_fit,
            "cells_within_precision": fit.n_precision,
            "within_precision_rows": self.rows(1),
            "cells_off": fit.n_slips,
            "cells_known": fit.n_known,
            "alternatives": self.alternatives,
            "notes": list(fit.notes),
        })
        return out


def _floats(frame: Frame, name: str) -> np.ndarray:
    s = frame.scale
    return np.array([np.nan if v is None else float(v) / s for v in frame.written[name]], dtype=float)
