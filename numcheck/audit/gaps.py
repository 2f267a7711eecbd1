"""Lines missing from a table: a gap in its argument column.

The argument column (the leftmost column with a constant positive
difference: line numbers, years, months, days) steps by d from line to line.
Where it steps by k·d (k from 2 to ``MAX_GAP_LINES``) and goes on by d after
it, k − 1 lines are missing between the two rows, as where a fragment
copies an excerpt or a line was skipped.  The row is reported as
``lines-missing`` (not a slip), and every own-column scheme of the table
steps k times across the gap, so the lines after it are no carried-forward
slips.  A column that follows its scheme with one step there, and not with
k, says the argument column slipped instead; then no gap is taken.
"""

from __future__ import annotations

from .schemes import LinearScheme, Scheme

__all__ = ["find_gaps", "advance", "retreat", "MAX_GAP_LINES"]

#: The most lines a gap may hide (larger jumps are left to the slip diagnosis).
MAX_GAP_LINES = 60


def _argument(frame, schemes: list[Scheme]) -> LinearScheme | None:
    by_column = {s.column: s for s in schemes}
    for name in frame.names:
        s = by_column.get(name)
        if s is None:
            continue
        if isinstance(s, LinearScheme) and not s.modulus and not s.segments and s.d > 0:
            return s
        return None     # the leftmost checked column is not an argument
    return None


def find_gaps(frame, schemes: list[Scheme]) -> tuple[str | None, dict[int, int]]:
    """(argument column, {row index: steps from the line before}) for the gaps of the table."""
    arg = _argument(frame, schemes)
    if arg is None:
        return None, {}
    w = frame.written[arg.column]
    d = arg.d
    known = [i for i, v in enumerate(w) if v is not None]
    gaps: dict[int, int] = {}
    for a, b in zip(known, known[1:]):
        step = w[b] - w[a]
        lines = b - a
        if step == lines * d or step <= 0 or step % d:
            continue
        k = step // d - (lines - 1)
        if not 2 <= k <= MAX_GAP_LINES:
            continue
        after = next((j for j in known if j > b), None)
        if after is not None and w[after] - w[b] != (after - b) * d:
            continue    # it does not go on by d: a slip, not a gap
        if _contradicted(frame, schemes, arg.column, b, k):
            continue
        gaps[b] = k
    return arg.column, gaps


def _contradicted(frame, schemes, argument: str, i: int, k: int) -> bool:
    """Whether another column follows its scheme in one step at row *i*, but not in k."""
    for s in schemes:
        if s.column == argument or not s.chained or s.inputs:
            continue
        w = frame.written[s.column]
        if i < 1 or w[i - 1] is None or w[i] is None or i + 1 >= len(w) or w[i + 1] is None:
            continue
        try:
            st = s.start(w[i], i, w[i + 1], None)
            if st is None:
                continue
            one = s.back(st, i, None)
            many = retreat(s, st, i, None, {i: k})
        except (TypeError, ValueError, ZeroDivisionError):
            continue
        if one is not None and one[0] == w[i - 1] and (many is None or many[0] != w[i - 1]):
            return True
    return False


def advance(scheme, state, i: int, src, gaps: dict[int, int]):
    """The state of line *i* from the line before, stepping over the lines a gap hides."""
    k = gaps.get(i, 1)
    if k == 1 or state is None:
        return scheme.step(state, i, src) if state is not None else None
    if scheme.inputs:
        return None     # the inputs of the hidden lines are lost with them
    for _ in range(k):
        state = scheme.step(state, i, src)
        if state is None:
            return None
    return state


def retreat(scheme, state, i: int, src, gaps: dict[int, int]):
    """The state of line i − 1 from line *i*, stepping back over a gap before line *i*."""
    k = gaps.get(i, 1)
    if k == 1:
        return scheme.back(state, i, src)
    if scheme.inputs:
        return None
    for _ in range(k):
        state = scheme.back(state, i, src)
        if state is None:
            return None
    return state
