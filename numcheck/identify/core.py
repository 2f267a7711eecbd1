"""What is this number?  Compare a reading with every number of the catalogue.

For each power of 60 a floating reading may stand at (only the written
scale for a fixed one), every catalogue item times a simple factor, and
every period times a whole multiple, that lies near the reading is checked
exactly and classed:

* ``exact``      the reading equals it;
* ``truncated``  the reading is it cut at the last written place (texts truncate);
* ``rounded``    the reading is it rounded at the last written place;
* ``damage``     it lies within what the damaged reading allows (only when
  the damage leaves few readings; a wider gap is a job for ``restore``);
* ``near``       within one unit of the last written place, or (for the
  catalogue number itself, factor 1) within 1e-5 relative: how close good
  ancient periods come to modern ones.

Ranking (:mod:`numcheck.identify.ranking`) weighs the class of the match,
the simplicity of the factor, the scale, the confidence and tradition of the
catalogue row and the chance that any number of this precision would match;
matches that say the same thing are folded into one statement with all its
sources (``groups``).  The residual is in units of the last written place.
Matches are suggestions for the editor's judgement, not readings.
"""

from __future__ import annotations

from dataclasses import dataclass, field
from fractions import Fraction

from .. import limits
from ..errors import NumcheckError
from ..reading import Reading, decimal_text, exact_text, sexagesimal_text
from ..units import canonical_unit
from . import ranking as _rank
from . import targets as _t

__all__ = ["Match", "IdentifyResult", "identify", "CLASSES", "NEAR_ULPS", "NEAR_RELATIVE", "SCALES"]

#: The classes of a match, best first, with the score band each occupies.
CLASSES = {"exact": (0.9, 1.0), "truncated": (0.6, 0.9), "rounded": (0.6, 0.9),
           "damage": (0.6, 0.9), "near": (0.0, 0.6)}
_RANK = {"exact": 0, "truncated": 1, "rounded": 1, "damage": 1, "near": 2}
#: A near match lies within this many units of the last written place ...
NEAR_ULPS = 1
#: ... or within this relative distance (good ancient periods are within ~1e-5 of modern ones).
NEAR_RELATIVE = Fraction(1, 100_000)
#: Powers of 60 tried for a floating reading.
SCALES = range(-6, 7)


@dataclass(frozen=True)
class Match:
    """One way the reading fits the catalogue."""

    id: str
    statement: str
    factor: Fraction
    scale: int
    unit: str | None
    residual: Fraction          # reading minus target, in units of the last written place
    score: float
    how: str                    # a key of CLASSES
    target: Fraction            # the catalogue number times the factor, in ``unit``, at the reading's scale
    label: str
    what: str                   # the catalogue number as matched: "2 × 223 synodic months"
    convention: str | None
    tradition: str
    body: str
    confidence: str
    source: str
    explanation: str

    def to_dict(self) -> dict:
        return {
            "id": self.id,
            "statement": self.statement,
            "factor": exact_text(self.factor),
            "scale": self.scale,
            "unit": self.unit,
            "residual": exact_text(self.residual),
            "residual_decimal": float(self.residual),
            "score": round(self.score, 6),
            "match": self.how,
            "target": exact_text(self.target),
            "target_sexagesimal": sexagesimal_text(self.target, max_places=8),
            "side": self.label,
            "what": self.what,
            "convention": self.convention,
            "tradition": self.tradition,
            "body": self.body,
            "confidence": self.confidence,
            "source": self.source,
            "explanation": self.explanation,
        }


@dataclass(frozen=True)
class IdentifyResult:
    """The ranked matches of one reading, or the nearest entries when none fits."""

    reading: Reading
    unit: str | None
    matches: tuple[Match, ...]
    nearest: tuple[dict, ...] = field(default=())
    considered: int = 0
    notes: tuple[str, ...] = ()
    groups: tuple = ()              # ranking.MatchGroup: one per distinct statement, best first
    tradition: str | None = None    # the tradition weighed (asked for, or said by the notation)

    @property
    def found(self) -> bool:
        return bool(self.matches)

    @property
    def summary(self) -> str:
        note = (" " + " ".join(self.notes)) if self.notes else ""
        return self._summary() + note

    def _summary(self) -> str:
        if self.matches:
            best = self.matches[0]
            return (f"{len(self.matches)} match(es); best: {best.explanation} "
                    "(a suggestion for the editor's judgement, not a reading)")
        if self.nearest:
            n = self.nearest[0]
            return (f"No catalogue number fits {self.reading.text!r} within the tolerance; the nearest is "
                    f"{n['id']} ({n['statement']}), {n['relative']} away.")
        return f"No catalogue number fits {self.reading.text!r}."

    def to_dict(self) -> dict:
        r = self.reading
        return {
            "text": r.text,
            "notation": r.notation,
            "value": exact_text(r.value),
            "sexagesimal": sexagesimal_text(r.value, fixed=not r.floating),
            "floating": r.floating,
            "unit": self.unit,
            "last_place": r.last_place,
            "matches": [m.to_dict() for m in self.matches],
            "nearest": list(self.nearest),
            "considered": self.considered,
            "notes": list(self.notes),
            "summary": self.summary,
            "tradition": self.tradition,
            "groups": [g.to_dict() for g in self.groups],
        }


def _classify(reading: "_Window", v: Fraction, target: Fraction, ulp: Fraction, tol: Fraction) -> str | None:
    diff = v - target
    if diff == 0:
        return "exact"
    if -ulp < diff < 0:
        return "truncated"
    if 2 * abs(diff) <= ulp:
        return "rounded"
    if reading.damaged and reading.min <= target <= reading.max:
        return "damage"
    if abs(diff) <= tol:
        return "near"
    return None


def _factor_text(factor: Fraction) -> str:
    if factor == 1:
        return ""
    if factor.numerator == 1:
        return f"1/{factor.denominator} of "
    return f"{exact_text(factor)} × "


def _explain(reading: Reading, m_how: str, factor: Fraction, item: _t.Item, scale: int,
             residual: Fraction, rel: float, convention: str | None, unit_shown: str,
             compared: Fraction | None = None) -> str:
    shown = sexagesimal_text(reading.value * Fraction(60) ** scale,
                             fixed=True, max_places=8) if reading.floating else reading.text
    if m_how == "damage" and compared is not None:
        shown = f"{reading.text} read as {sexagesimal_text(compared, fixed=True, max_places=8)}"
    what = f"{_factor_text(factor)}{_t.number_text(item.value)} {item.unit}"
    where = (f"{item.label} of {item.entry.id}" if item.label != "the value"
             else f"{item.entry.id}") + f"; {_short_source(item.entry.source)}, {item.entry.confidence}"
    how = {
        "exact": "exact",
        "truncated": "the catalogue value cut at the last written place (texts truncate)",
        "rounded": "the catalogue value rounded at the last written place",
        "damage": "agrees with a reading the damage allows",
        "near": f"off by {float(residual):+.3g} in the last written place ({rel:.1e} relative)",
    }[m_how]
    scale_text = f" read at 60^{scale}" if scale else ""
    conv = f", converted to {unit_shown} with the {convention} convention" if convention else ""
    return f"{shown}{scale_text} = {what} ({where}{conv}): {how}"


_HOW = {
    "exact": "exact",
    "truncated": "the catalogue value cut at the last written place (texts truncate)",
    "rounded": "the catalogue value rounded at the last written place",
    "damage": "agrees with a reading the damage allows",
}


def _describe(reading: Reading, ms) -> str:
    """One distinct statement in words, with every catalogue row that makes it.

    "1,49,45;20 = 223 synodic months, converted to days with the babylonian
    (default month) convention: off by +0.65 in the last written place.
    Rows: saros_almagest (a side: ...; Ptolemy, Almagest IV.2; published); ..."
    """
    m = ms[0]
    shown = (sexagesimal_text(reading.value * Fraction(60) ** m.scale, fixed=True, max_places=8)
             if reading.floating else reading.text)
    scale_text = f" read at 60^{m.scale}" if m.scale else ""
    conv = f", converted to {m.unit} with the {m.convention} convention" if m.convention else ""
    if m.how == "near":
        rel = float(abs(m.target - reading.value) / m.target) if m.target else 0.0
        how = f"off by {float(m.residual):+.3g} in the last written place ({rel:.1e} relative)"
    else:
        how = _HOW[m.how]
    rows = []
    for x in ms:
        side = f"{x.label}; " if x.label != "the value" else ""
        rows.append(f"{x.id} ({side}{_short_source(x.source)}; {x.confidence})")
    label = "Row" if len(rows) == 1 else f"{len(rows)} rows"
    return f"{shown}{scale_text} = {m.what}{conv}: {how}. {label}: " + "; ".join(rows) + "."


def _short_source(source: str) -> str:
    """The author, work and section of a source, without the notes that follow.

    >>> _short_source("Ptolemy, Almagest IV.2 (tr. G. J. Toomer, 1984); Geminus 18")
    'Ptolemy, Almagest IV.2'
    """
    return source.split(";")[0].split(" (")[0].strip()


def _scales(reading: Reading) -> range:
    return SCALES if reading.floating else range(0, 1)


def identify(reading_or_text, *, notation: str | None = None, unit: str | None = None,
             top: int = 10, tradition: str | None = None) -> IdentifyResult:
    """Which period, parameter or relation (or simple multiple or part of one) is this number?

    *reading_or_text* is a :class:`~numcheck.reading.Reading` or a text read
    with :func:`numcheck.read` (``notation`` as there).  With *unit* (or a
    unit the text itself carries) only catalogue numbers convertible to it
    are compared; without one, every number in its own unit.  *tradition*
    (babylonian, greek, indian, islamic ...) weighs that tradition's rows
    above the others; without it the tradition the notation says (Greek
    letters, cuneiform, abjad) is weighed.  ``top`` bounds both the matches
    and the distinct statements (``groups``).

    >>> identify("1,49,45;20", unit="days").matches[0].id
    'saros_almagest'
    """
    from ..reader import read

    if isinstance(top, bool) or not isinstance(top, int) or top < 1:
        raise NumcheckError(f"--top must be a whole number, at least 1, got {top!r}.")
    reading = reading_or_text if isinstance(reading_or_text, Reading) else read(
        reading_or_text, notation=notation, unit=unit)
    unit = unit if unit is not None else reading.unit
    unit = canonical_unit(unit) if unit is not None else None
    if tradition is not None:
        from .. import catalogue
        from ..errors import UnknownNameError

        known = catalogue.traditions()
        if tradition not in known:
            raise UnknownNameError("tradition", tradition, known)
    wanted = tradition if tradition is not None else _rank.text_tradition(reading.notation)
    tab = _t.table(unit)
    value = reading.value
    if value <= 0:
        return IdentifyResult(reading, unit, (), (), 0,
                              (f"The value {exact_text(value)} is not positive; the catalogue holds lengths "
                               "and counts only.",))
    notes: list[str] = []
    # An ambiguous reading (a Greek 'ο' that may be 0 or 70) is compared like a damaged one.
    open_reading = reading.damaged or reading.ambiguous
    use_range = open_reading and reading.count <= limits.IDENTIFY_DAMAGE_READINGS
    if open_reading and not use_range:
        notes.append(f"The damage allows {reading.count:,} readings (over numcheck.limits."
                     f"IDENTIFY_DAMAGE_READINGS = {limits.IDENTIFY_DAMAGE_READINGS}): only the edition's value "
                     f"({sexagesimal_text(value, fixed=not reading.floating)}) was compared. "
                     "Use 'numcheck restore' to rank the readings the traces allow.")
    found: dict[tuple, tuple] = {}
    considered = 0
    # A damaged reading is compared reading by reading: a catalogue number
    # matches when it agrees (exactly, or cut or rounded at the last place)
    # with one of the readings the damage allows -- not merely when it falls
    # between the least and the greatest, which a wide damage makes almost
    # any number do.
    allowed = sorted(set(reading.readings())) if use_range else [value]
    crowded = False
    for scale in _scales(reading):
        p = Fraction(60) ** scale
        ulp = reading.ulp * p
        for r in allowed:
            v = r * p
            restored = r != value
            tol = ulp if restored else max(NEAR_ULPS * ulp, NEAR_RELATIVE * v)
            window = _Window(False, v, v)
            lo = float(v - tol) * (1 - 1e-12)
            hi = float(v + tol) * (1 + 1e-12)
            # A number written to fewer than three significant figures (one
            # unit of its last place is over 1% of it) is met by long whole
            # multiples of almost any period: only simple factors say anything.
            items, nums, dens = _t.candidates(tab, lo, hi, multiples=100 * ulp <= v and not crowded)
            if considered + len(items) > limits.IDENTIFY_MAX_CANDIDATES and not crowded:
                # Too many long multiples within reach (wide damage, many scales):
                # compare simple parts and multiples only, and say so.
                crowded = True
                notes.append(f"More than {limits.IDENTIFY_MAX_CANDIDATES:,} catalogue multiples lie "
                             "within reach of the readings (numcheck.limits.IDENTIFY_MAX_CANDIDATES): "
                             "only simple parts and multiples were compared. Fewer lost places or the "
                             "unit would narrow it; set the limit higher to compare them all.")
                items, nums, dens = _t.candidates(tab, lo, hi, multiples=False)
            considered += len(items)
            for k in range(len(items)):
                idx, factor = int(items[k]), Fraction(int(nums[k]), int(dens[k]))
                item = tab.items[idx]
                target = item.value * tab.factors[idx] * factor
                # The relative tolerance compares values of different traditions;
                # with a factor it would let almost any long number "match".
                how = _classify(window, v, target, ulp, tol if factor == 1 else NEAR_ULPS * ulp)
                if how is None or (restored and how == "near"):
                    continue
                if restored:
                    how = "damage"
                key = (item.entry.id, item.value, item.unit, factor, scale)
                residual = (v - target) / ulp
                width = 2 * tol if how == "near" else ulp
                closeness = (float(abs(v - target) / tol) if how == "near"
                             else min(1.0, float(abs(residual))))
                sc = _rank.score(how, factor, scale, item.entry.confidence, item.entry.tradition,
                                 wanted, closeness,
                                 _rank.chance(width, item.value * tab.factors[idx], factor))
                rank = (-sc, _RANK[how], _t.factor_complexity(factor), abs(residual), abs(scale),
                        item.entry.id)
                if key not in found or rank < found[key][0]:
                    found[key] = (rank, how, item, idx, factor, scale, target, residual, v, sc)
    ranked = sorted(found.values(), key=lambda t: t[0])
    # Enough matches to fill *top* distinct statements (rows that say the same fold into one).
    pool = [_match(reading, tab, *row[1:]) for row in ranked[:top * 12]]
    matches = tuple(pool[:top])
    groups = _rank.group_matches(pool, describe=lambda ms: _describe(reading, ms))[:top]
    nearest = () if matches else _nearest(reading, tab)
    notes.extend(_t.coincidence_notes(reading, unit, len(found)))
    return IdentifyResult(reading, unit, matches, nearest, considered, tuple(notes), groups, wanted)


@dataclass(frozen=True)
class _Window:
    """What the damage allows, at one scale (computed once, not per candidate)."""

    damaged: bool
    min: Fraction
    max: Fraction


def _match(reading, tab, how, item, idx, factor, scale, target, residual, v, score) -> Match:
    unit_shown = tab.unit if tab.unit is not None else item.unit
    if tab.unit is not None:
        unit_shown = tab.unit + item.per
    rel = float(abs(v - target) / target) if target else 0.0
    convention = tab.conventions[idx]
    e = item.entry
    return Match(
        id=e.id, statement=e.statement, factor=factor, scale=scale, unit=unit_shown,
        residual=residual, score=score, how=how, target=target / Fraction(60) ** scale, label=item.label,
        what=f"{_factor_text(factor)}{_t.number_text(item.value)} {item.unit}",
        convention=convention, tradition=e.tradition, body=e.body, confidence=e.confidence,
        source=e.source,
        explanation=_explain(reading, how, factor, item, scale, residual, rel, convention, unit_shown,
                             compared=v),
    )


def _nearest(reading: Reading, tab: _t.Table, count: int = 5) -> tuple[dict, ...]:
    """The catalogue numbers (factor 1) closest to the reading, and how far they are."""
    value = float(reading.value)
    if not tab.values:
        return ()
    best = []
    for scale in _scales(reading):
        v = value * 60.0 ** scale
        rel = [abs(x - v) / x for x in tab.values]
        for i in sorted(range(len(rel)), key=rel.__getitem__)[:count]:
            best.append((rel[i], i, scale))
    best.sort()
    out, seen = [], set()
    for rel, i, scale in best:
        item = tab.items[i]
        if item.entry.id in seen:
            continue
        seen.add(item.entry.id)
        target = item.value * tab.factors[i]
        diff = reading.value * Fraction(60) ** scale - target
        out.append({
            "id": item.entry.id,
            "statement": item.entry.statement,
            "value": exact_text(target),
            "decimal": decimal_text(target, 9),
            "unit": (tab.unit + item.per) if tab.unit else item.unit,
            "scale": scale,
            "difference": decimal_text(diff, 9),
            "residual": exact_text(diff / (reading.ulp * Fraction(60) ** scale)),
            "residual_decimal": float(diff / (reading.ulp * Fraction(60) ** scale)),
            "relative": f"{rel:.2%}" if rel >= 1e-4 else f"{rel:.1e}",
        })
        if len(out) == count:
            break
    return tuple(out)
