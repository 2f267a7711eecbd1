"""Match an audited column against the catalogue of published schemes (data/schemes.csv).

Each checkable catalogue scheme (zigzag, step, sequence) is put on the
column's scale and tried on its lines; a scheme record then lists, under
``published``, every catalogue scheme it agrees with and how well:

* ``parameters``: the fitted parameters are the published ones (d, M, m; the
  zones and rates of a step function);
* ``lines``: the published scheme explains most of the lines, though the
  column could not fit (all) its parameters itself, as in a short fragment;
* ``period``: only the period in lines agrees (a period relation of the
  catalogue, e.g. the planets' whose zones are not catalogued).

Where a published scheme explains more lines than the column's own fit, or
the own fit left a parameter unknown that the published scheme supplies, the
published scheme is the one the column is checked against.  A mean-motion
column (constant difference, modulo the circle) is matched by its difference
against the daily motions of the periods catalogue.
"""

from __future__ import annotations

from fractions import Fraction

from .schemes import LinearScheme, Scheme, support_chained

__all__ = ["published_instance", "match_column", "PUBLISHED_SAMPLE"]

#: Lines of a column tried against each catalogue scheme.
PUBLISHED_SAMPLE = 400


def _scaled(frame, v: Fraction | None):
    if v is None:
        return None
    x = Fraction(v) * frame.scale
    return x.numerator if x.denominator == 1 else x


def published_instance(entry, column: str, frame) -> Scheme | None:
    """The catalogue scheme *entry* as a scheme of *column* (None for a period-only row)."""
    if entry.kind == "zigzag":
        from .zigzag import ZigzagScheme
        return ZigzagScheme(column, frame, _scaled(frame, entry.d), _scaled(frame, entry.M),
                            _scaled(frame, entry.m))
    if entry.kind == "step":
        from .steps import StepScheme
        full = frame.modulus.get(column) or 360 * frame.scale
        saved = frame.modulus.get(column)
        frame.modulus[column] = full
        try:
            s = StepScheme(column, frame, [_scaled(frame, a) for a, _ in entry.zones],
                           [_scaled(frame, w) for _, w in entry.zones])
        finally:
            frame.modulus[column] = saved
        s.modulus = full
        return s
    if entry.kind == "sequence":
        from .sequence import SequenceScheme
        return SequenceScheme(column, frame, [_scaled(frame, v) for v in entry.sequence])
    return None


def _record(entry, agreement: str, support: float | None, differs=()) -> dict:
    out = {"id": entry.id, "label": entry.label, "system": entry.system,
           "agreement": agreement, "body": entry.body, "line_unit": entry.line_unit,
           "confidence": entry.confidence, "source": entry.source}
    if support is not None:
        out["support"] = round(support, 4)
    if differs:
        out["differs"] = list(differs)
    return out


def _same_parameters(own, inst) -> tuple[bool, list[str]]:
    """Whether *own*'s fitted parameters are those of the published *inst*, and which differ."""
    from .steps import StepScheme
    from .zigzag import ZigzagScheme
    if isinstance(own, ZigzagScheme) and isinstance(inst, ZigzagScheme):
        differs = [k for k in ("d", "M", "m")
                   if getattr(own, k) is not None and getattr(own, k) != getattr(inst, k)]
        return not differs, differs
    if isinstance(own, StepScheme) and isinstance(inst, StepScheme):
        same = own.bounds == inst.bounds and own.rates == inst.rates
        return same, [] if same else ["zones"]
    from .sequence import SequenceScheme
    if isinstance(own, SequenceScheme) and isinstance(inst, SequenceScheme):
        return own.values == inst.values, [] if own.values == inst.values else ["values"]
    return False, []


def _own_period(own):
    from .steps import StepScheme
    from .zigzag import ZigzagScheme
    if isinstance(own, ZigzagScheme):
        return own.period
    if isinstance(own, StepScheme):
        return own.lines_per_revolution
    return None


def match_column(frame, column: str, own: Scheme | None, keep: bool = False) -> Scheme | None:
    """The scheme *column* is checked against, with its ``published`` matches filled in.

    Returns *own* (annotated) or a published scheme that explains the lines
    better; None when neither exists.  *keep* keeps *own* (a scheme the user
    stated) and only annotates it.
    """
    try:
        from ..catalogue.schemes import schemes
        catalogue = schemes()
    except Exception:   # the catalogue is optional for the audit
        return own
    values = frame.written[column][:PUBLISHED_SAMPLE]
    matches: list[tuple[dict, Scheme | None, float]] = []
    own_support = own.support if own is not None else 0.0
    period = _own_period(own) if own is not None else None
    for entry in catalogue:
        inst = published_instance(entry, column, frame)
        if inst is None:
            if period is not None and entry.period_lines == period:
                matches.append((_record(entry, "period", None), None, 0.0))
            continue
        if type(inst).__name__ == "StepScheme" and not frame.modulus.get(column):
            continue    # a step function runs on a longitude
        support = support_chained(inst, values, None)
        lines = _line_share(inst, values)
        same, differs = _same_parameters(own, inst) if own is not None else (False, [])
        if same:
            matches.append((_record(entry, "parameters", support), inst, support))
        elif support > 0.5 or lines > 0.5:
            # most pairs of lines follow it, or one chain of it explains most lines
            matches.append((_record(entry, "lines", support, differs), inst, support))
        elif period is not None and entry.period_lines == period and entry.kind == own.kind:
            matches.append((_record(entry, "period", support, differs), None, support))
    chosen = own
    best = max((m for m in matches if m[1] is not None),
               key=lambda m: (m[2], m[0]["agreement"] == "parameters"), default=None)
    if best is not None and not keep:
        inst, support = best[1], best[2]
        unknown = getattr(own, "unknown", None)
        agrees = best[0]["agreement"] == "parameters" or not best[0].get("differs")
        # a published scheme is prior knowledge: it wins when one chain of it
        # explains as many lines as the column's own fit
        better = own is not None and _line_share(inst, values) >= _line_share(own, values) \
            and best[0]["agreement"] == "lines"
        if own is None or support > own_support or better or \
                (unknown and agrees and support >= own_support):
            inst.support = support
            best[0]["used"] = True      # the column is checked against this published scheme
            chosen = inst
    if chosen is None:
        return None
    if isinstance(chosen, LinearScheme):
        matches.extend((m, None, 0.0) for m in _mean_motion(chosen))
    chosen.published = [m[0] for m in sorted(matches, key=_rank)]
    return chosen


def _line_share(scheme, values) -> float:
    """The share of the known lines that one chain of *scheme* explains (own-column schemes)."""
    if not scheme.chained or scheme.inputs:
        return 0.0
    from .zigzag import chain_score
    values = values[:PUBLISHED_SAMPLE]
    known = sum(v is not None for v in values)
    try:
        return chain_score(scheme, values) / known if known else 0.0
    except (TypeError, NotImplementedError):
        return 0.0


def _rank(match) -> tuple:
    order = {"parameters": 0, "lines": 1, "period": 2, "mean motion": 0}
    return (order.get(match[0]["agreement"], 3), -match[2])


def _mean_motion(scheme: LinearScheme) -> list[dict]:
    """Daily motions of the periods catalogue equal to the difference of a mean-motion column."""
    try:
        from .. import catalogue
        entries = catalogue.entries(kind="parameter")
    except Exception:
        return []
    d = scheme.frame.fraction(scheme.d)
    out = []
    for e in entries:
        if e.unit == "degrees per day" and e.value in (d, -d):
            out.append({"id": e.id, "label": e.value_as_attested, "system": e.tradition,
                        "agreement": "mean motion", "confidence": e.confidence,
                        "source": e.source})
    return out
