"""The cycles numcheck relates spans of time to, and their lengths in days.

The question "is N years a period relation?" is asked of every cycle a text
might mean: the moon's synodic, sidereal, anomalistic and draconitic months,
the sun's tropical, sidereal and anomalistic years, and the synodic and
sidereal periods of the five planets.  Their lengths come from the catalogue
(:func:`numcheck.catalogue.period`): modern mean values, or the periods of
one tradition (``values="ancient"``) when a scholar wants to know how good a
relation was *for its authors*.  This module keeps no period values itself.
"""

from __future__ import annotations

from dataclasses import dataclass, field
from fractions import Fraction

from ..errors import NumcheckRangeError, UnknownNameError

__all__ = ["CYCLES", "BODIES", "UNITS", "VALUE_SETS", "PeriodSet", "statement_cycle", "unit_named"]

#: Every (body, cycle) relate() reports, in the order a historian lists them.
CYCLES: tuple[tuple[str, str], ...] = (
    ("moon", "synodic"), ("moon", "sidereal"), ("moon", "anomalistic"), ("moon", "draconitic"),
    ("sun", "tropical"), ("sun", "sidereal"), ("sun", "anomalistic"),
    *((planet, cycle) for planet in ("mercury", "venus", "mars", "jupiter", "saturn")
      for cycle in ("synodic", "sidereal")),
)
BODIES = tuple(dict.fromkeys(body for body, _ in CYCLES))

#: The units a span may be given in, and the cycle that defines each (days: none).
UNITS = {"years": ("sun", "tropical"), "months": ("moon", "synodic"), "days": None}
_UNIT_ALIASES = {"year": "years", "y": "years", "yr": "years", "yrs": "years", "month": "months",
                 "m": "months", "mo": "months", "day": "days", "d": "days"}
VALUE_SETS = ("modern", "ancient")

# How catalogue statements name the cycles (see numcheck.catalogue.statements): the unit
# of a term, lower case and plural, to (body, cycle).  Planetary "tropical
# revolutions" (Ptolemy's) are matched to the sidereal row: the count of whole
# revolutions is the same, and the table says which was stated.
_MONTHS = {"synodic months": "synodic", "sidereal months": "sidereal",
           "anomalistic months": "anomalistic", "draconitic months": "draconitic"}
_YEARS = {"tropical years": "tropical", "sidereal years": "sidereal",
          "anomalistic years": "anomalistic"}
_PLANET_UNITS = {"synodic periods": "synodic", "sidereal revolutions": "sidereal",
                 "tropical revolutions": "sidereal"}


def statement_cycle(unit: str) -> tuple[str, str] | None:
    """The (body, cycle) a catalogue statement's unit counts, or None.

    >>> statement_cycle("venus synodic periods"), statement_cycle("draconitic months")
    (('venus', 'synodic'), ('moon', 'draconitic'))
    """
    key = " ".join(unit.lower().split())
    if key in _MONTHS:
        return "moon", _MONTHS[key]
    if key in _YEARS:
        return "sun", _YEARS[key]
    body, _, rest = key.partition(" ")
    if body in BODIES and rest in _PLANET_UNITS:
        return body, _PLANET_UNITS[rest]
    return None


def unit_named(unit: str) -> str:
    """``years``, ``months`` or ``days`` for *unit* (with short forms), or an error."""
    key = str(unit).strip().lower()
    key = _UNIT_ALIASES.get(key, key)
    if key not in UNITS:
        raise UnknownNameError("unit", unit, UNITS)
    return key


def _catalogue_entry(body: str, cycle: str, tradition: str):
    """The standard catalogue row for this period in *tradition*, or None."""
    from .. import catalogue

    found = catalogue.periods(body, cycle, tradition)
    return found[0] if found else None


@dataclass
class PeriodSet:
    """The periods (days) of one set of values: modern, or one tradition's.

    Looks each period up in the catalogue once.  A cycle the tradition gives
    no value for is *missing* (listed, not guessed).
    """

    values: str = "modern"
    tradition: str | None = None
    _cache: dict = field(default_factory=dict, repr=False)

    def __post_init__(self):
        if self.values not in VALUE_SETS:
            raise UnknownNameError("set of values", self.values, VALUE_SETS)
        if self.values == "ancient" and not self.tradition:
            raise NumcheckRangeError(
                "--values ancient needs a tradition whose periods to use.",
                legal="a tradition of the catalogue, e.g. greek, babylonian, indian, islamic")
        if self.values == "modern":
            if self.tradition not in (None, "modern"):
                raise NumcheckRangeError(
                    f"A tradition ({self.tradition!r}) was named with the modern values.",
                    legal="--values ancient with --tradition, or --values modern alone")
            self.tradition = "modern"

    def entry(self, body: str, cycle: str):
        """The catalogue row giving this period (with its id and source), or None."""
        key = (body, cycle)
        if key not in self._cache:
            self._cache[key] = _catalogue_entry(body, cycle, self.tradition)
        return self._cache[key]

    def period(self, body: str, cycle: str) -> Fraction | None:
        """The period of *cycle* of *body* in days, or None when the set lacks it."""
        found = self.entry(body, cycle)
        return None if found is None else Fraction(found.value)

    def unit_days(self, unit: str) -> tuple[Fraction, str]:
        """Days in one *unit*, and what defines it (e.g. ``"sun tropical"``).

        Years are the set's tropical year; a tradition without one (the
        Babylonian reckons in sidereal years) uses its sidereal year.  Months
        are the set's synodic month.
        """
        if unit == "days":
            return Fraction(1), "day"
        body, cycle = UNITS[unit]
        choices = [(body, cycle)] + ([("sun", "sidereal")] if unit == "years" else [])
        for b, c in choices:
            value = self.period(b, c)
            if value is not None:
                return value, f"{b} {c}"
        raise NumcheckRangeError(
            f"The {self.tradition} values give no length for one of the {unit}.",
            legal=f"a tradition whose catalogue rows give the {' or '.join(f'{b} {c}' for b, c in choices)} period")
