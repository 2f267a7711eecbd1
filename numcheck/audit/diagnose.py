"""Check every cell against its scheme and say where the scribe slipped.

Two chains run down a chained column: the *true* chain (the scheme computed
from a line that agrees with its neighbour, forwards and backwards) and the
*scribe's* chain (each line computed from the line the scribe actually wrote
before it).  A cell that matches neither is a slip; if the next line follows
from the wrong value, the scribe computed on with it, and the later lines
that only inherit it are marked ``carried-forward`` rather than reported as
new slips (Neugebauer's errors "carried on" versus copying errors,
schemes-and-slips.md §2.2).  A cell that follows the scribe's chain but not
the true one inherits an earlier slip.

Across columns the true values of a column's inputs are used: a progress
value that is wrong beside a longitude computed with the right one is a
copying slip in the progress column; a longitude computed with the wrong one
carries that slip forward.
"""

from __future__ import annotations

from dataclasses import dataclass, field

from ..placevalue import mantissa
from ..slips import Diagnosis, classify
from .blame import blame_input, writable
from .columns import ReciprocalScheme
from .gaps import advance, find_gaps, retreat
from .schemes import Frame, Scheme
from ..tables import Table

__all__ = ["Finding", "Pending", "diagnose"]


@dataclass
class Finding:
    """One flagged cell (index 0-based here; the output counts rows from 1)."""

    index: int
    column: str
    kind: str
    reason: str
    written: object
    expected: object
    carried_into: list[tuple[str, int]] = field(default_factory=list)   # (column, index)
    carried_from: tuple[str, int] | None = None
    notes: list[str] = field(default_factory=list)


@dataclass
class Pending:
    """A damaged cell and the value its scheme gives it."""

    index: int
    column: str
    expected: object
    scheme: Scheme
    notes: list[str] = field(default_factory=list)


def diagnose(table: Table, frame: Frame, schemes: list[Scheme]):
    """Return (findings, damaged cells with their expected values, true values per column)."""
    true = {name: list(vals) for name, vals in frame.written.items()}
    findings: list[Finding] = _missing_lines(frame, schemes)
    pending: list[Pending] = []
    index: dict[tuple[str, int], Finding] = {}
    for scheme in schemes:
        if scheme.chained:
            got = _chain(table, frame, scheme, true)
        else:
            got = _rows(table, frame, scheme, true)
        col_findings, col_pending, col_true = got
        true[scheme.column] = col_true
        for f in col_findings:
            _link_inputs(f, scheme, frame, true, index)
            findings.append(f)
            index[(f.column, f.index)] = f
        pending.extend(col_pending)
    _cross_notes(findings, schemes, frame, index)
    findings.sort(key=lambda f: (f.index, frame.names.index(f.column)))
    return findings, pending, true


def _missing_lines(frame, schemes) -> list[Finding]:
    """A gap in the argument column: lines missing (the chains step over it)."""
    argument, frame.gaps = find_gaps(frame, schemes)
    out = []
    for i, k in sorted(frame.gaps.items()):
        v = frame.written[argument][i]
        out.append(Finding(i, argument, "lines-missing",
                           f"{k - 1} line{'s' if k > 2 else ''} missing before this row: column "
                           f"{argument} steps {k} times its difference here (or the scribe "
                           "skipped them); the lines after it are checked across the gap",
                           v, v))
    return out


def _cross_notes(findings, schemes, frame, index) -> None:
    """Say what the columns computed from a slipped cell tell about it."""
    for f in findings:
        if f.kind == "carried-forward" or f.written is None:
            continue
        for s in schemes:
            if f.column not in s.inputs or frame.written[s.column][f.index] is None:
                continue
            other = index.get((s.column, f.index))
            if other is None:
                f.notes.append(f"column {s.column} was computed with the value due here: "
                               f"a copying slip in column {f.column}")
            elif other.kind == "carried-forward" and other.carried_from == (f.column, f.index):
                f.notes.append(f"the scribe computed column {s.column} with the value written "
                               "here, and carried the slip on")


def _link_inputs(f: Finding, scheme: Scheme, frame: Frame, true, index) -> None:
    """Tie a cell that inherits a slip of an input column to that slip."""
    if f.kind != "carried-forward" or f.carried_from is not None:
        return
    for name in scheme.inputs:
        for k in range(f.index, -1, -1):
            origin = index.get((name, k))
            if origin is not None and origin.kind != "carried-forward":
                f.carried_from = (name, k)
                f.reason = (f"follows from the slip in column {name}, row {k + 1}, "
                            "which the scribe computed with")
                if (f.column, f.index) not in origin.carried_into:
                    origin.carried_into.append((f.column, f.index))
                return


def _context(table, frame, column, i, written, expected, prev, special) -> Diagnosis:
    f = frame.fraction
    cell = table.columns[column].cells[i]
    vals = frame.written[column]
    neighbours = []
    for j in (i - 1, i + 1):
        if 0 <= j < len(vals):
            neighbours.append(f(vals[j]))
    for other in frame.names:
        if other != column:
            neighbours.append(f(frame.written[other][i]))
    return classify(f(written), f(expected), places=cell.places, floating=cell.floating,
                    notation=cell.notation, longitude=bool(frame.modulus.get(column)),
                    prev=None if prev is None else f(prev), neighbours=tuple(neighbours),
                    special=special, modulus=f(frame.modulus.get(column)),
                    written_digits=list(cell.digits) if cell.digits is not None else None)


def _anchor_states(scheme: Scheme, w, src):
    """The true chain: states per line, from the first consistent pair of lines."""
    gaps = scheme.frame.gaps
    n = len(w)
    states = [None] * n
    i = 0
    while i < n - 1:
        if w[i] is None or w[i + 1] is None:
            i += 1
            continue
        st = scheme.start(w[i], i, w[i + 1], src)
        if st is None:
            i += 1
            continue
        states[i] = st
        k = i
        while k > 0 and states[k - 1] is None:
            prev = retreat(scheme, states[k], k, src, gaps)
            if prev is None:
                break
            states[k - 1] = prev
            k -= 1
        j = i + 1
        while j < n:
            nxt = advance(scheme, states[j - 1], j, src, gaps)
            if nxt is None:
                break
            if len(nxt) == 2 and nxt[0] == w[j] and type(nxt[0]) is type(w[j]):
                nxt = (w[j], nxt[1])    # the written value's object: one int less per line
            states[j] = nxt
            j += 1
        if j >= n:
            break
        i = j  # an input was missing: find a new anchor after it
    return states


def _chain(table, frame, scheme: Scheme, true):
    """Check a chained column line by line against the true and the scribe's chains."""
    column = scheme.column
    gaps = frame.gaps
    w = frame.written[column]
    n = len(w)
    T = _anchor_states(scheme, w, true)
    findings: list[Finding] = []
    pending: list[Pending] = []
    col_true = list(w)
    S = None
    origin: Finding | None = None
    two = bool(scheme.inputs)
    for i in range(n):
        t = T[i]
        wi = w[i]
        if t is None:
            S = None  # no true chain here: nothing to compute the next line from
            continue
        e_true = t[0]
        if e_true != wi or type(e_true) is not type(wi):
            col_true[i] = e_true    # (an equal value keeps the written one's object: less memory)
        if S is None:
            pred, pred_w = t, None
        else:
            pred = advance(scheme, S, i, true, gaps) or t
            pred_w = advance(scheme, S, i, frame.written, gaps) if two else None
        if wi is None:
            p = Pending(i, column, pred[0], scheme)
            if scheme.kind == "zigzag":
                p.notes.extend(_same_run(scheme, T, w, i, pred[0]))
            pending.append(p)
            S = pred
            continue
        if wi == e_true:
            S = t
            origin = None
            continue
        if wi == pred[0] or (pred_w is not None and wi == pred_w[0]):
            f = Finding(i, column, "carried-forward",
                        "inherits the slip of an earlier line (the scribe computed on from it)",
                        wi, e_true)
            if origin is not None:
                f.carried_from = (column, origin.index)
                f.reason = f"inherits the slip in row {origin.index + 1} (the scribe computed on from it)"
                origin.carried_into.append((column, i))
            findings.append(f)
            S = scheme.resume(pred if wi == pred[0] else pred_w, wi)
            continue
        special = scheme.special(S, i, true, wi) if S is not None and i not in gaps else None
        diag = _context(table, frame, column, i, wi, pred[0], None if S is None else S[0], special)
        f = Finding(i, column, diag.kind, diag.reason, wi, pred[0])
        findings.append(f)
        carried = _computed_on(scheme, pred, wi, i, w, T, true, frame.written if two else None)
        if carried:
            S = scheme.resume(pred, wi)
            origin = f
            f.notes.append("the scribe computed the following lines from this value")
        else:
            S = pred
            origin = None
    return findings, pending, col_true


def _same_run(scheme, T, w, i, value) -> list[str]:
    """The zigzag invariant: lines of one monotone run differ by multiples of d.

    So the trailing places of a damaged line must agree with those of any
    preserved line of its run (schemes-and-slips.md §1.1, item 4); the nearest
    such line is named as independent support for the restoration.
    """
    d = scheme.d
    for direction in (-1, 1):
        j = i
        while 0 <= j + direction < len(w):
            a, b = (j + direction, j) if direction < 0 else (j, j + direction)
            if T[a] is None or T[b] is None or T[b][0] - T[a][0] != T[a][1] * d:
                break   # a turn (or the end of the chain) closes the run
            j += direction
            if w[j] is not None:
                if (value - w[j]) % d == 0:
                    return [f"its trailing places agree with row {j + 1} of the same "
                            "monotone run (zigzag invariant: the lines of a run differ by "
                            "multiples of d)"]
                return []
    return []


def _computed_on(scheme, pred, wi, i, w, T, true, written) -> bool:
    """Whether the next known line follows from the wrong value *wi* (a carried slip).

    Damaged lines in between are stepped over with the scheme.
    """
    state = scheme.resume(pred, wi)
    state_w = state
    for j in range(i + 1, len(w)):
        if T[j] is None:
            return False
        gaps = scheme.frame.gaps
        state = advance(scheme, state, j, true, gaps) if state is not None else None
        state_w = (advance(scheme, state_w, j, written, gaps)
                   if written is not None and state_w is not None else None)
        if w[j] is None:
            continue
        follows = (state is not None and w[j] == state[0]) or (state_w is not None and w[j] == state_w[0])
        return follows and w[j] != T[j][0]
    return False


def _rows(table, frame, scheme: Scheme, true):
    """Check a column computed from its row (product, reciprocal, relation) cell by cell."""
    column = scheme.column
    w = frame.written[column]
    findings: list[Finding] = []
    pending: list[Pending] = []
    col_true = list(w)
    for i, wi in enumerate(w):
        e = scheme.expect(i, true)
        if e is None:
            continue
        col_true[i] = e
        if wi is None:
            pending.append(Pending(i, column, e, scheme))
            continue
        if wi == e:
            continue
        ew = scheme.expect(i, frame.written) if scheme.inputs else None
        if ew is not None and wi == ew:
            findings.append(Finding(i, column, "carried-forward",
                                    "computed correctly from a slip in another column", wi, e))
            continue
        if isinstance(scheme, ReciprocalScheme):
            moved = _reciprocal_blame(table, frame, scheme, i, wi)
            if moved is not None:
                findings.append(moved)
                col_true[i] = wi
                continue
        elif scheme.inputs and _needs_blame(table, frame, scheme, i, wi, e, w):
            # the result's own slip would not explain it: look for the input's
            moved = _input_blame(table, frame, scheme, i, wi, e, w, true)
            if moved is not None:
                findings.append(moved)
                if moved.column != column:
                    col_true[i] = wi
                continue
        if not writable(frame.fraction(e), [frame.fraction(v) for v in w]):
            findings.append(Finding(
                i, column, "unexplained",
                f"the {scheme.kind} gives {_shown(frame.fraction(e))} here, which no scribe could "
                "write: an input of this line is likely wrong, but no single slip in one input "
                "explains the value written", wi, None))
            continue
        diag = _context(table, frame, column, i, wi, e, None, None)
        findings.append(Finding(i, column, diag.kind, diag.reason, wi, e))
    return findings, pending, col_true


def _shown(value) -> str:
    from ..reading import exact_text
    return ("a negative value" if value < 0 else
            f"{exact_text(value)}, a fraction that does not terminate in base 60,")


def _needs_blame(table, frame, scheme, i, wi, e, w) -> bool:
    if not writable(frame.fraction(e), [frame.fraction(v) for v in w]):
        return True
    return _context(table, frame, scheme.column, i, wi, e, None, None).kind == "unexplained"


def _input_blame(table, frame, scheme, i, wi, e, w, true):
    """The input cell whose slip explains a broken line (the result as written is right).

    When several inputs could each explain it, the result cell is flagged
    with the choices and no expected value of its own.
    """
    got = blame_input(frame, scheme, i, wi, true)
    if not got:
        return None
    if len(got) > 1:
        fr = frame.fraction
        choices = " or ".join(
            f"{name} = {table.columns[name].write(i, fr(meant))} ({how})" for name, meant, how in got)
        return Finding(i, scheme.column, "unexplained",
                       f"the {scheme.kind} holds as written if {choices}: one input slipped, "
                       "and the line alone cannot tell which", wi, None)
    name, meant, _how = got[0]
    written = frame.written[name][i]
    diag = _context(table, frame, name, i, written, meant, None, None)
    f = Finding(i, name, diag.kind, diag.reason, written, meant)
    f.notes.append(f"with this value the {scheme.kind} of column {scheme.column} holds as "
                   f"written: the slip is in column {name}, not in column {scheme.column}")
    return f


def _reciprocal_blame(table, frame, scheme, i, igi):
    """A number that is not regular has no igi: then the slip is in the number column."""
    from fractions import Fraction
    s = frame.scale
    n = frame.written[scheme.source][i]
    if n is None or not igi:
        return None
    if mantissa(Fraction(s, n)) is not None:
        return None   # n is regular: the slip is in the igi column
    due = Fraction(s * s, igi)
    target = due
    while target * 60 <= abs(n):
        target *= 60
    while target > abs(n) * 60:
        target /= 60
    due = target.numerator if target.denominator == 1 else target
    diag = _context(table, frame, scheme.source, i, n, due, None, None)
    return Finding(i, scheme.source, diag.kind,
                   diag.reason + f" ({frame.fraction(n)} is not a regular number and has no igi)",
                   n, due)
