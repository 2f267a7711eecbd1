"""The models of computed tables: each a published formula of one argument and one parameter.

Arguments and results are in degrees (hours for the daylight, the gnomon's
units for the shadow); the parameter is the one the author chose (the radius
R of the base circle, the obliquity ε, the eccentricity e or epicycle radius r
in parts of R = 60, the latitude φ, the gnomon g).  Every formula is evaluated
with numpy floats: the functions are transcendental, so the model is a float;
the comparison with the written cells keeps the cells exact and the tolerance
in units of their last place (see ``estimate.py``).

Sources of the formulas (the trade's standard ones):

* chord: crd a = 2R sin(a/2), Ptolemy's chord table with R = 60
  (Almagest I.10-11; Toomer 1984, p. 48-60, from memory);
* sine with a base R (Indian sines R = 3438 in Āryabhaṭa's Āryabhaṭīya,
  Gītikā 12; R = 150 in the Paitāmahasiddhānta and R = 60 in the zījes; from
  memory), cosine R cos a and versine R(1 − cos a) (common practice);
* declination δ = arcsin(sin ε sin λ), Almagest I.15 with ε = 23;51,20
  (Toomer 1984, p. 71-72, from memory);
* right ascension α = arctan(cos ε tan λ) in the quadrant of λ (Almagest
  I.16, from memory);
* oblique ascension ρ = α − arcsin(tan φ tan δ), the ascensional difference
  subtracted (Almagest II.7-8; a latitude φ, or the longest day M hours with
  sin((M − 12)/2 · 15°) = tan φ tan ε, from memory);
* equation of an eccentre with eccentricity e (or, by Apollonius'
  equivalence, of an epicycle of radius r): q = arctan(e sin a / (R + e cos a)),
  a the mean anomaly from the apogee, R = 60 (Almagest III.6 for the sun with
  e = 2;30; the planetary equation of the anomaly at mean distance, Almagest
  XI.11, is the same formula with r; from memory);
* shadow s = g cot h for a gnomon of g = 12 digits or 7 feet (al-Khwārizmī's
  and al-Bīrūnī's shadow tables; from memory);
* daylight D = 12 + (2/15)·arcsin(tan φ tan δ(λ)) hours, δ from ε (Almagest
  II.8, from memory).
"""

from __future__ import annotations

from dataclasses import dataclass, field, replace
from fractions import Fraction
from typing import Callable

import numpy as np

__all__ = ["Model", "MODELS", "AUTOMATIC", "OBLIQUITIES", "variants", "model_named", "PTOLEMY_OBLIQUITY",
           "latitude_from_longest_day", "longest_day_from_latitude"]

#: Ptolemy's obliquity of the ecliptic, 23;51,20 degrees (Almagest I.12/I.15).
PTOLEMY_OBLIQUITY = 23 + 51 / 60 + 20 / 3600
_RAD = np.pi / 180


@dataclass(frozen=True)
class Model:
    """A formula y = f(x; p) with its parameter's name, range and source."""

    name: str
    formula: str
    parameter: str               # "R", "ε", "e", "r", "φ", "g"
    unit: str                    # of the parameter
    low: float                   # the range searched for the parameter
    high: float
    usual: tuple[float, ...]     # published values, tried first and named
    source: str
    f: Callable = field(repr=False)
    linear: bool = False         # f(x; p) = p · g(x): the parameter's bounds are exact quotients
    aliases: tuple[str, ...] = ()
    fixed: tuple = ()            # (name, value, source) of a second parameter taken as published

    def __call__(self, x, p):
        with np.errstate(all="ignore"):
            return self.f(np.asarray(x, dtype=float), p if isinstance(p, np.ndarray) else float(p))


def _dec(lam, eps):
    return np.degrees(np.arcsin(np.sin(eps * _RAD) * np.sin(lam * _RAD)))


def _ra(lam, eps):
    out = np.degrees(np.arctan2(np.cos(eps * _RAD) * np.sin(lam * _RAD), np.cos(lam * _RAD)))
    return np.where(out < 0, out + 360, out) if np.ndim(out) else (out + 360 if out < 0 else out)


def _ascensional(lam, phi, eps=PTOLEMY_OBLIQUITY):
    t = np.tan(phi * _RAD) * np.tan(_dec(lam, eps) * _RAD)
    return np.degrees(np.arcsin(np.clip(t, -1, 1)))


def _oblique(lam, phi, eps=PTOLEMY_OBLIQUITY):
    out = _ra(lam, eps) - _ascensional(lam, phi, eps)
    return np.where(out < 0, out + 360, out)


def _equation(a, e):
    return np.abs(np.degrees(np.arctan2(e * np.sin(a * _RAD), 60 + e * np.cos(a * _RAD))))


def _daylight(lam, phi, eps=PTOLEMY_OBLIQUITY):
    return 12 + 2 / 15 * _ascensional(lam, phi, eps)


def latitude_from_longest_day(hours: float, eps: float = PTOLEMY_OBLIQUITY) -> float:
    """The latitude whose longest day is *hours* (sin η = tan φ tan ε, η = (M − 12)/2 · 15°)."""
    eta = (hours - 12) / 2 * 15
    return float(np.degrees(np.arctan(np.sin(eta * _RAD) / np.tan(eps * _RAD))))


def longest_day_from_latitude(phi: float, eps: float = PTOLEMY_OBLIQUITY) -> float:
    """The longest day in hours at latitude *phi*."""
    t = np.tan(phi * _RAD) * np.tan(eps * _RAD)
    return float(12 + 2 / 15 * np.degrees(np.arcsin(min(1.0, t))))


MODELS: dict[str, Model] = {m.name: m for m in [
    Model("chord", "crd a = 2R sin(a/2)", "R", "parts", 0.01, 1e6, (60.0, 120.0),
          "Ptolemy, Almagest I.10-11 (R = 60); Toomer 1984 (from memory)",
          lambda x, p: 2 * p * np.sin(x * _RAD / 2), linear=True),
    Model("sine", "Sin a = R sin a", "R", "parts", 0.01, 1e6, (60.0, 150.0, 3438.0, 1.0, 120.0),
          "Āryabhaṭīya, Gītikā 12 (R = 3438); Paitāmahasiddhānta (R = 150); zījes (R = 60) "
          "(from memory)",
          lambda x, p: p * np.sin(x * _RAD), linear=True),
    Model("cosine", "Cos a = R cos a", "R", "parts", 0.01, 1e6, (60.0, 150.0, 3438.0, 1.0),
          "common practice (the sine of the complement)",
          lambda x, p: p * np.cos(x * _RAD), linear=True),
    Model("versine", "Vers a = R (1 − cos a)", "R", "parts", 0.01, 1e6, (60.0, 150.0, 3438.0, 1.0),
          "common practice (Indian utkramajyā; from memory)",
          lambda x, p: p * (1 - np.cos(x * _RAD)), linear=True),
    Model("declination", "δ = arcsin(sin ε sin λ)", "ε", "degrees", 1.0, 45.0,
          (PTOLEMY_OBLIQUITY, 23.5, 23 + 35 / 60, 23 + 33 / 60, 24.0),
          "Ptolemy, Almagest I.15 (ε = 23;51,20); Toomer 1984 (from memory)",
          lambda x, p: np.abs(_dec(x, p))),
    Model("right-ascension", "α = arctan(cos ε tan λ), in the quadrant of λ", "ε", "degrees",
          1.0, 45.0, (PTOLEMY_OBLIQUITY, 23.5, 23 + 35 / 60, 24.0),
          "Ptolemy, Almagest I.16 (from memory)", _ra),
    Model("oblique-ascension", "ρ = α − arcsin(tan φ tan δ), ε = 23;51,20", "φ", "degrees",
          0.0, 66.0, (30 + 22 / 60, 36.0, 16 + 27 / 60, 23 + 51 / 60),
          "Ptolemy, Almagest II.7-8 (latitude φ or longest day; from memory)",
          _oblique),
    Model("equation", "q = arctan(e sin a / (60 + e cos a))", "e", "parts of 60",
          0.001, 59.0, (2.5, 5.25, 6.5, 11.5, 22.5, 39.5, 43 + 10 / 60),
          "eccentre or epicycle (Apollonius' equivalence): Almagest III.6 sun e = 2;30, IV.10 moon "
          "r = 5;15, XI.11 anomaly r (Saturn 6;30, Jupiter 11;30, Mars 39;30, Venus 43;10) "
          "(from memory)",
          _equation,
          aliases=("equation-of-centre", "eccentre", "epicycle", "anomaly")),
    Model("shadow", "s = g cot h", "g", "units of the gnomon", 0.01, 1e4, (12.0, 7.0, 6.5),
          "gnomon of 12 digits or 7 feet: al-Khwārizmī, al-Bīrūnī (from memory)",
          lambda x, p: p / np.tan(x * _RAD), linear=True),
    Model("daylight", "D = 12 + (2/15) arcsin(tan φ tan δ) hours, ε = 23;51,20", "φ", "degrees",
          0.0, 66.0, (30 + 22 / 60, 36.0, 16 + 27 / 60, 23 + 51 / 60),
          "Ptolemy, Almagest II.8 (from memory)",
          _daylight),
]}

#: The models tried when none is forced (the aliases of the equation are one formula).
AUTOMATIC = tuple(MODELS)

#: Published obliquities a table of oblique ascensions or of daylight may be computed with
#: (from memory): Ptolemy 23;51,20 (Almagest I.12); al-Battānī 23;35; the Toledan and
#: Alfonsine tables 23;33,30; Ulugh Beg 23;30,17.
OBLIQUITIES = ((PTOLEMY_OBLIQUITY, "23;51,20", "Ptolemy, Almagest I.12"),
               (23 + 35 / 60, "23;35", "al-Battānī, Zīj"),
               (23 + 33 / 60 + 30 / 3600, "23;33,30", "Toledan and Alfonsine tables"),
               (23 + 30 / 60 + 17 / 3600, "23;30,17", "Ulugh Beg, Zīj"))


def variants(model: Model) -> list[Model]:
    """The model with each published value of its second parameter (ε for ascensions, daylight)."""
    if model.name not in ("oblique-ascension", "daylight"):
        return [model]
    base = _oblique if model.name == "oblique-ascension" else _daylight
    out = []
    for eps, text, source in OBLIQUITIES:
        out.append(replace(model, formula=model.formula.replace("23;51,20", text),
                           f=(lambda x, p, e=eps: base(x, p, e)), fixed=(("ε", eps, source),)))
    return out


def model_named(name: str) -> Model:
    """The model called *name* (or one of its aliases)."""
    from ...errors import UnknownNameError
    key = name.strip().lower()
    for m in MODELS.values():
        if key == m.name or key in m.aliases:
            return m
    raise UnknownNameError("model", name, sorted(list(MODELS) + [a for m in MODELS.values()
                                                                  for a in m.aliases]))


def nice(value: float, low: float, high: float, places: int = 4) -> Fraction:
    """The value of fewest sexagesimal places in [low, high], nearest to *value*.

    An author chose a round parameter (23;51,20, 2;30, 3438): the interval of
    the values consistent with the cells usually holds it.
    """
    if not (low <= value <= high):
        value = min(max(value, low), high)
    for k in range(places + 1):
        unit = 60 ** k
        lo, hi = int(np.ceil(low * unit - 1e-9)), int(np.floor(high * unit + 1e-9))
        if lo <= hi:
            best = min(range(lo, hi + 1) if hi - lo < 100 else (lo, hi, round(value * unit)),
                       key=lambda n: abs(n / unit - value))
            best = min(max(best, lo), hi)
            return Fraction(best, unit)
    return Fraction(round(value * 60 ** places), 60 ** places)
