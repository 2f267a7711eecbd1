"""Find the scheme of each column: its own (constant, linear, zigzag, step) or one across columns.

Each candidate is fitted from the majority of lines and scored by its
*support*, the share of lines it explains exactly; the best candidate with a
majority wins, a column's own scheme winning a tie (the scribe's own rule is
the simpler explanation).  A relation the user states replaces detection for
its column.  Columns are then ordered so that a column is checked after the
columns it is computed from.
"""

from __future__ import annotations

from .columns import fit_cross
from .published import _line_share, match_column
from .stated import parse_scheme, scheme_call
from .relation import RelationScheme, parse_relation
from .schemes import (ConstantScheme, Frame, LinearScheme, Scheme, lcm_all, support_chained,
                      support_row)
from .steps import StepDifferenceScheme, StepScheme
from ..tables import Table
from .zigzag import ZigzagScheme

__all__ = ["make_frame", "detect_schemes"]

_OWN = (ConstantScheme, LinearScheme, ZigzagScheme, StepScheme)


def make_frame(table: Table) -> Frame:
    """Scale every exact value of the table to an integer on one common scale."""
    dens = set()
    for col in table.columns.values():
        dens.update(60 ** p for p in col.cells.plain_places())
        for _, c in col.cells.kept():
            if c.num is not None:
                dens.add(60 ** c.places)
            elif c.exact is not None:
                dens.add(c.exact.denominator)
    # Twice the common denominator: a zigzag's extremes are half-sums of two
    # lines (M = (y_n + y_n+1 + d)/2), and so stay integers on this scale.
    scale = 2 * (lcm_all(dens) if dens else 1)
    written = {name: col.cells.scaled(scale) for name, col in table.columns.items()}
    modulus = {name: (360 * scale if col.longitude else None) for name, col in table.columns.items()}
    floating = {name: col.floating for name, col in table.columns.items()}
    return Frame(names=list(table.columns), written=written, scale=scale, modulus=modulus,
                 floating=floating, nrows=table.nrows)


def _own(frame: Frame, name: str) -> Scheme | None:
    """The column's own scheme: most pairs of lines explained, then most lines in one chain.

    A scheme is taken when it explains most pairs of lines, or (a short
    fragment with slips on both sides of a turn) one chain of it explains
    most lines.
    """
    best, best_key = None, None
    for cls in _OWN:
        scheme = cls.fit(name, frame)
        if scheme is None:
            continue
        if scheme.chained:
            scheme.support = support_chained(scheme, frame.written[name], frame.written)
            lines = _line_share(scheme, frame.written[name])
        else:
            scheme.support = support_row(scheme, frame.written[name], frame.written)
            lines = 0.0
        key = (scheme.support, lines)
        if (scheme.support > 0.5 or lines > 0.5) and (best is None or key > best_key):
            best, best_key = scheme, key
    return best


def _listed(texts) -> list[str]:
    # The door of relation= and scheme=: a text, or a list or tuple of texts.
    if texts is None or isinstance(texts, str):
        return [texts] if texts else []
    bad = texts if not isinstance(texts, (list, tuple)) else next(
        (t for t in texts if t is not None and not isinstance(t, str)), None)
    if bad is not None:
        from ..errors import NumcheckError
        raise NumcheckError(f"A relation or scheme is a text like 'C = A + B' (or a list of "
                            f"them), not {type(bad).__name__}.")
    return [t for t in texts if t]


def _stated(frame: Frame, relation, scheme) -> dict[str, Scheme]:
    """The relations and schemes the user states, by column (they replace detection there)."""
    out: dict[str, Scheme] = {}
    texts = [("relation", t) for t in _listed(relation)] + [("scheme", t) for t in _listed(scheme)]
    for how, text in texts:
        call = scheme_call(text) if how == "relation" else text
        if call is not None:
            s = parse_scheme(call, frame)
            s.stated = text
            match_column(frame, s.column, s, keep=True)
        else:
            target, tree, modulus = parse_relation(text, frame.names)
            s = RelationScheme(target, frame, text, tree, modulus)
        if s.chained:
            s.support = support_chained(s, frame.written[s.column], frame.written)
        else:
            s.support = support_row(s, frame.written[s.column], frame.written)
        out[s.column] = s
    return out


def detect_schemes(frame: Frame, relation=None, scheme=None, model=None) -> list[Scheme]:
    """The scheme of each column that has one, in the order they must be checked.

    *relation* and *scheme* are what the user states (a text or a list of
    texts each): those columns are checked against them and nothing else.
    *model* forces the model of function columns (``audit/functions``).
    """
    chosen: dict[str, Scheme] = _stated(frame, relation, scheme)
    stated = set(chosen.values())
    for name in frame.names:
        if name in chosen:
            continue
        # the column's own fit, or the published scheme that explains it better
        own = match_column(frame, name, _own(frame, name))
        if own is not None:
            chosen[name] = own
    taken = {n for n, s in chosen.items() if s in stated or s.support == 1.0}
    for scheme in fit_cross(frame, taken):
        if scheme.chained:
            scheme.support = support_chained(scheme, frame.written[scheme.column], frame.written)
        else:
            scheme.support = support_row(scheme, frame.written[scheme.column], frame.written)
        current = chosen.get(scheme.column)
        if current is None or scheme.support > current.support:
            chosen[scheme.column] = scheme
    _step_differences(frame, chosen)
    # Tables of computed functions (chords, declinations, ...): audit/functions/.
    from .functions import fit_functions
    fit_functions(frame, chosen, model=model, keep={s.column for s in stated})
    return _ordered(chosen, stated)


def _step_differences(frame: Frame, chosen: dict[str, Scheme]) -> None:
    """A column whose running sum is a step-function longitude holds its steps."""
    from .columns import RunningSumScheme
    for lon in [s for s in chosen.values() if isinstance(s, StepScheme)]:
        for name in frame.names:
            if name == lon.column or (name in chosen and chosen[name].support == 1.0):
                continue
            probe = RunningSumScheme(lon.column, frame, name, frame.modulus.get(lon.column))
            if support_chained(probe, frame.written[lon.column], frame.written) > 0.5:
                s = StepDifferenceScheme(name, frame, lon)
                s.support = support_row(s, frame.written[name], frame.written)
                if s.support > 0.5 and (name not in chosen or s.support > chosen[name].support):
                    chosen[name] = s


def _ordered(chosen: dict[str, Scheme], stated=frozenset()) -> list[Scheme]:
    """Columns after the columns they depend on; a cycle drops the weaker scheme (never a stated one)."""
    out: list[Scheme] = []
    done: set[str] = set()
    pending = dict(chosen)
    while pending:
        ready = [s for s in pending.values()
                 if all(d in done or d not in pending for d in s.inputs)]
        if not ready:
            weakest = min(pending.values(), key=lambda s: (s in stated, s.support))
            del pending[weakest.column]
            continue
        for s in sorted(ready, key=lambda s: list(chosen).index(s.column)):
            out.append(s)
            done.add(s.column)
            del pending[s.column]
    return out

