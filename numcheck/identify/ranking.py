"""How identify ranks its matches, and how it folds matches into distinct statements.

A match is believed in proportion to how unlikely it is to be chance.  The
score is a product of weights in (0, 1]:

* the **class** of the match: exact, then cut or rounded at the last
  written place (texts truncate), then a match the damage allows, then near
  (less the nearer it is to the edge of the tolerance);
* the **factor**: the value itself counts most, a simple part or multiple
  less, a long whole multiple (past ``limits.IDENTIFY_MAX_SIMPLE``) much less;
* the **scale** of a floating reading: each power of 60 away from the
  written places costs a little (a scribe's number is most often what it
  looks like);
* the **confidence** of the catalogue row: a row recalled from memory counts
  less than a published one;
* the **tradition**: modern mean values are for judging an ancient value,
  not what a scribe wrote; a tradition asked for (``--tradition``) or said by
  the notation (Greek letters, cuneiform signs, abjad) outranks the others;
* **chance**: a match that a number written to this precision would make
  anyway (a whole number of 360-day years in ``7,26,0,0``) says nothing.
  Its weight is one less the chance that a random reading of this precision
  meets the catalogue number's lattice within the window of its class.

The weights are judgements of the trade written down so that they can be
argued with (common practice, not a published method).
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from fractions import Fraction

from .. import limits

__all__ = ["CLASS_WEIGHT", "NOTATION_TRADITION", "MODERN_WEIGHT", "OTHER_TRADITION_WEIGHT",
           "SCALE_WEIGHT", "LONG_FACTOR_WEIGHT", "score", "chance", "factor_weight",
           "tradition_weight", "text_tradition", "group_matches", "MatchGroup"]

#: The weight of each class of match (its best case; near matches fall with distance).
CLASS_WEIGHT = {"exact": 1.0, "truncated": 0.85, "rounded": 0.8, "damage": 0.75, "near": 0.6}
#: Each power of 60 between the reading as written and the scale matched.
SCALE_WEIGHT = 0.85
#: A whole multiple longer than the simple ones (235, 4460 ...), on top of its length.
LONG_FACTOR_WEIGHT = 0.6
#: A modern value met in an ancient text (for judging, not for what a scribe wrote).
MODERN_WEIGHT = 0.8
#: Another tradition than the one asked for or said by the notation.
OTHER_TRADITION_WEIGHT = 0.75
#: Another school of the tradition asked for (indian/vedanga for indian/aryabhata).
SCHOOL_WEIGHT = 0.9
#: The floor of the chance weight: a certain coincidence still shows, last.
CHANCE_FLOOR = 0.02

#: The tradition a notation says: Greek letters are Greek, cuneiform signs Babylonian,
#: the abjad Arabic (the catalogue's "islamic").  Common practice.
NOTATION_TRADITION = {
    "greek": "greek", "greek-ascending": "greek", "attic": "greek",
    "cuneiform": "babylonian",
    "abjad": "islamic", "abjad-maghribi": "islamic",
}

_CONFIDENCE = {"published": 1.0, "common practice": 0.9, "from memory": 0.75}


def factor_weight(factor: Fraction) -> float:
    """1 for the value itself, less for a part or multiple, much less for a long multiple.

    >>> [round(factor_weight(Fraction(f)), 3) for f in (1, 2, Fraction(1, 3), 223)]
    [1.0, 0.743, 0.645, 0.162]
    """
    n, m = factor.numerator, factor.denominator
    w = 1.0 / (1.0 + 0.5 * math.log(n * m))
    if m == 1 and n > limits.IDENTIFY_MAX_SIMPLE:
        w *= LONG_FACTOR_WEIGHT
    return w


def chance(width: Fraction, item_value: Fraction, factor: Fraction) -> float:
    """The chance that a random reading meets ``item × factor`` within *width*.

    The multiples ``k/m × item`` of a factor with denominator m lie
    ``item/m`` apart; a window of *width* meets one of them by chance with
    probability about ``width × m / item`` (at most 1).

    >>> chance(Fraction(3600), Fraction(360), Fraction(4460))   # 7,26,0,0 days as 360-day years
    1.0
    >>> round(chance(Fraction(1), Fraction(223), Fraction(2)), 4)   # 7,26 months as 2 x 223
    0.0045
    """
    if item_value <= 0:
        return 1.0
    return float(min(Fraction(1), width * factor.denominator / item_value))


def text_tradition(notation: str | None) -> str | None:
    """The tradition a notation says, if any.

    >>> text_tradition("greek"), text_tradition("sexagesimal")
    ('greek', None)
    """
    return NOTATION_TRADITION.get(notation or "")


def tradition_weight(row_tradition: str, wanted: str | None) -> float:
    """How much a catalogue row's tradition is believed for this text.

    >>> tradition_weight("modern", None), tradition_weight("greek", "greek"), tradition_weight("indian", "greek")
    (0.8, 1.0, 0.75)
    >>> tradition_weight("indian/aryabhata", "indian"), tradition_weight("indian/vedanga", "indian/aryabhata")
    (1.0, 0.9)
    """
    modern = row_tradition.startswith("modern")
    if wanted is None:
        return MODERN_WEIGHT if modern else 1.0
    # A school belongs to its tradition: "indian" takes in "indian/surya-siddhanta".
    if (row_tradition == wanted or row_tradition.startswith(wanted + "/")
            or (wanted.startswith("modern") and modern)):
        return 1.0
    if row_tradition.split("/")[0] == wanted.split("/")[0]:
        return SCHOOL_WEIGHT            # the same tradition, another school
    return OTHER_TRADITION_WEIGHT * (MODERN_WEIGHT if modern else 1.0)


def score(how: str, factor: Fraction, scale: int, confidence: str, tradition: str,
          wanted: str | None, closeness: float, chance_of_it: float) -> float:
    """The score of one match, in (0, 1]; higher is better (see the module's docstring).

    *closeness* is the distance from the catalogue number as a share of the
    class's window (0 = on it, 1 = at the edge).

    >>> score("exact", Fraction(1), 0, "published", "greek", None, 0.0, 0.0)
    1.0
    """
    c = min(max(closeness, 0.0), 1.0)
    w = CLASS_WEIGHT[how] * (1.0 - (0.5 if how == "near" else 0.1) * c)
    w *= factor_weight(factor)
    w *= SCALE_WEIGHT ** abs(scale)
    w *= _CONFIDENCE.get(confidence, 0.75)
    w *= tradition_weight(tradition, wanted)
    w *= max(CHANCE_FLOOR, 1.0 - chance_of_it)
    return w


@dataclass(frozen=True)
class MatchGroup:
    """One distinct statement the reading fits, with every catalogue row that makes it."""

    what: str
    how: str
    scale: int
    residual: Fraction
    score: float
    matches: tuple      # the Match objects, best first
    explanation: str = ""

    @property
    def ids(self) -> tuple[str, ...]:
        return tuple(m.id for m in self.matches)

    def to_dict(self) -> dict:
        from ..reading import exact_text

        best = self.matches[0]
        return {
            "what": self.what,
            "match": self.how,
            "scale": self.scale,
            "factor": exact_text(best.factor),
            "unit": best.unit,
            "residual": exact_text(self.residual),
            "residual_decimal": float(self.residual),
            "score": round(self.score, 6),
            "ids": list(self.ids),
            "explanation": self.explanation,
            "sources": [{"id": m.id, "tradition": m.tradition, "confidence": m.confidence,
                         "source": m.source, "side": m.label} for m in self.matches],
        }


def group_matches(matches, describe=None) -> tuple[MatchGroup, ...]:
    """Fold matches that say the same thing (the same number, factor, scale and class) into one.

    Three rows that all give 223 synodic months are one statement with three
    sources; its score is that of its best row.  Groups keep the order of
    their best match.  *describe* (the matches of a group -> text) gives
    each group its explanation.
    """
    groups: dict[tuple, list] = {}
    for m in matches:
        key = (m.what, m.how, m.scale, m.residual)
        groups.setdefault(key, []).append(m)
    out = []
    for (what, how, scale, residual), ms in groups.items():
        ms.sort(key=lambda m: -m.score)
        out.append(MatchGroup(what, how, scale, residual, ms[0].score, tuple(ms),
                              describe(ms) if describe else ms[0].explanation))
    out.sort(key=lambda g: -g.score)
    return tuple(out)
