"""Linear zigzag functions: a difference d per line, reflected at M and m.

The rule at the turns (schemes-and-slips.md §1.1, after Neugebauer, ACT 1955
vol. 1, and the CDLI page of YPM BC 001878): when y + d passes the maximum M,
the overshoot is folded back, y' = 2M − (y + d), and the function falls; at
the minimum, y' = 2m − (y − d).  Hitting an extreme exactly writes it and
turns.  d is the mode of the absolute differences; M and m come from the pairs
of lines that straddle a turn, M = (y_n + y_n+1 + d)/2, m = (y_n + y_n+1 − d)/2,
each taken as the mode over all the turns, so that one slip cannot move them.
The period P = 2(M − m)/d in lines is matched against the period relations
of the catalogue when it is installed.
"""

from __future__ import annotations

from fractions import Fraction

from ..reading import exact_text, sexagesimal_text
from .schemes import Scheme, diffs, mode, value_text

__all__ = ["ZigzagScheme"]


class ZigzagScheme(Scheme):
    """A linear zigzag function with difference d between m and M.

    An extreme the lines do not determine (a fragment that shows only one
    turn) is ``None``: the column is then checked only where the scheme
    decides, that is between the values its lines show (``low``..``high``),
    and ``unknown`` names the missing parameters.
    """

    kind = "zigzag"

    def __init__(self, column, frame, d, M, m):
        super().__init__(column, frame)
        self.d, self.M, self.m = d, M, m
        known = [v for v in frame.written.get(column, ()) if v is not None]
        self.low = min(known) if known else None
        self.high = max(known) if known else None

    @property
    def unknown(self) -> list[str]:
        return [name for name, v in (("M", self.M), ("m", self.m)) if v is None]

    # state: (value, direction of the next step: +1 rising, -1 falling)
    def step(self, state, i, src):
        v, direction = state
        nv = v + direction * self.d
        if direction > 0:
            if self.M is not None and nv >= self.M:
                return (2 * self.M - nv, -1)
            if self.M is None and self.high is not None and nv > self.high:
                return None     # beyond every line shown, with M unknown: undecided
        if direction < 0:
            if self.m is not None and nv <= self.m:
                return (2 * self.m - nv, 1)
            if self.m is None and self.low is not None and nv < self.low:
                return None
        return (nv, direction)

    def _inside(self, v) -> bool:
        return (self.M is None or v <= self.M) and (self.m is None or v >= self.m)

    def start(self, value, i, nxt, src):
        if not self._inside(value):
            return None
        for direction in (1, -1):
            got = self.step((value, direction), i + 1, src)
            if got is not None and got[0] == nxt:
                return (value, direction)
        return None

    def back(self, state, i, src):
        v, direction = state
        d = self.d
        guesses = [v - direction * d, v + direction * d]
        if self.M is not None:
            guesses.append(2 * self.M - v - d)
        if self.m is not None:
            guesses.append(2 * self.m - v + d)
        for p in guesses:
            if not self._inside(p):
                continue
            for pd in (direction, -direction):
                if self.step((p, pd), i, src) == (v, direction):
                    return (p, pd)
        return None

    def special(self, prev, i, src, written):
        """A missed turn: the step taken straight on past M or m, or reflected too early."""
        if prev is None:
            return None
        v, direction = prev
        straight = v + direction * self.d
        turned = v - direction * self.d
        got = self.step(prev, i, src)
        if got is None:
            return None
        due = got[0]
        if due != straight and written == straight:
            from ..slips import Diagnosis
            limit = "maximum" if direction > 0 else "minimum"
            return Diagnosis("turning-point", f"the step went straight on past the {limit} "
                                              "instead of being reflected")
        if due == straight and written == turned:
            from ..slips import Diagnosis
            return Diagnosis("turning-point", "the direction was reversed before the turn was due")
        return None

    @property
    def period(self) -> Fraction | None:
        if self.M is None or self.m is None:
            return None
        return Fraction(2 * (self.M - self.m)) / Fraction(self.d)

    def params(self):
        f = self.frame.fraction
        out = {"d": value_text(f(self.d))}
        if self.M is not None:
            out["M"] = value_text(f(self.M))
        if self.m is not None:
            out["m"] = value_text(f(self.m))
        if self.M is not None and self.m is not None:
            out["mean"] = value_text(f(self.M + self.m) / 2)
            out["amplitude"] = value_text(f(self.M - self.m))
            out["period_lines"] = value_text(self.period)
            matches = [m for m in period_matches(self.period) if _fits(m, self.published)]
            if matches:
                out["period_relation"] = matches[0]
        if self.unknown:
            out["unknown"] = list(self.unknown)
        return out

    def describe(self):
        f = self.frame.fraction
        parts = [f"d = {sexagesimal_text(f(self.d))}"]
        if self.M is not None:
            parts.append(f"M = {sexagesimal_text(f(self.M))}")
        if self.m is not None:
            parts.append(f"m = {sexagesimal_text(f(self.m))}")
        if self.period is not None:
            parts.append(f"P = {sexagesimal_text(self.period)} lines ({exact_text(self.period)})")
        text = "linear zigzag, " + ", ".join(parts)
        if self.unknown:
            text += (f"; {' and '.join(self.unknown)} not determined by these lines "
                     "(checked only between the values they show)")
        return text

    @classmethod
    def fit(cls, column, frame):
        """d from the commonest difference; M and m from votes of the pairs that straddle a turn.

        Any two lines i < j (at most ``_WINDOW`` apart) whose values differ by
        less than (j − i)·d have a turn between them: M = (y_i + y_j + (j − i)·d)/2
        if it is a maximum, m = (y_i + y_j − (j − i)·d)/2 if a minimum.  A true
        extreme is proposed by every pair of good lines around its turn, so a
        slip next to a turn (which spoils the pairs that use it) does not move
        it; the commonest proposals are then tried, with "unknown" among them,
        and the pair that explains the most lines wins (ties: fewer parameters).
        """
        values = frame.written[column]
        pairs = diffs(values)
        if len(pairs) < 4:
            return None
        d, n = mode([abs(x) for _, x in pairs])
        # d from a third of the differences at least: two slips in a short
        # fragment spoil up to four of them (the chains decide afterwards)
        if not d or n < 3 or n * 3 <= len(pairs):
            return None
        maxima, minima = _turn_votes(values[:_SAMPLE], d)
        if not maxima and not minima:
            return None
        # a line that hits an extreme exactly is a candidate of its own (the
        # pairs through it lie on straight runs and propose nothing)
        peaks, troughs = _local_extremes(values[:_CHAIN_SAMPLE])
        maxima = _merged(maxima, peaks)
        minima = _merged(minima, troughs)
        best, best_score = None, (-1, -1.0)
        sample = values[:_SAMPLE]
        from .schemes import support_chained
        for M in [None] + _commonest(maxima):
            for m in [None] + _commonest(minima):
                if M is not None and m is not None and not m < M:
                    continue
                if M is None and m is None:
                    continue
                scheme = cls(column, frame, d, M, m)
                # most lines in one chain; then the fewest places (a slip at
                # the end of a fragment can propose an extreme one place
                # longer that explains as many lines); then most pairs
                score = (chain_score(scheme, values[:_CHAIN_SAMPLE]),
                         -_places(frame, M) - _places(frame, m),
                         support_chained(scheme, sample, None))
                if score > best_score:
                    best, best_score = scheme, score
        return best


#: Lines used to choose between turn values that disagree.
_SAMPLE = 2000
#: Lines over which whole chains are compared (a slip at a turn can
#: explain its own pair of lines, never the lines after it).
_CHAIN_SAMPLE = 240
#: Lines a chain is anchored at, at most, when candidates are compared.
_ANCHORS = 12
#: How far apart two lines may be to propose the extreme of a turn between them.
_WINDOW = 4


def chain_score(scheme, values: list) -> int:
    """The most lines one chain of *scheme* explains, anchored at a pair of lines that agree.

    Whole chains tell a true extreme from one a slip at a turn proposes: the
    slipped value explains the pair it stands in, but the chain through it
    misses every line after the turn.
    """
    n = len(values)
    starts = [i for i in range(n - 1) if values[i] is not None and values[i + 1] is not None]
    if len(starts) > _ANCHORS:
        stride = len(starts) / _ANCHORS
        starts = [starts[int(k * stride)] for k in range(_ANCHORS)]
    best = 0
    for i in starts:
        st = scheme.start(values[i], i, values[i + 1], None)
        if st is None:
            continue
        count, s = 1, st
        for j in range(i + 1, n):
            s = scheme.step(s, j, None)
            if s is None:
                break
            count += values[j] == s[0]
        s = st
        for j in range(i - 1, -1, -1):
            s = scheme.back(s, j + 1, None)
            if s is None:
                break
            count += values[j] == s[0]
        best = max(best, count)
    return best


def _turn_votes(values: list, d) -> tuple[list, list]:
    """The extremes proposed by every pair of lines with a turn between them."""
    from collections import Counter
    maxima, minima = Counter(), Counter()
    known = [(i, v) for i, v in enumerate(values) if v is not None]
    if not known:
        return [], []
    # a maximum lies above the middle of the values shown, a minimum below it
    middle = Fraction(min(v for _, v in known) + max(v for _, v in known), 2)
    for k, (i, yi) in enumerate(known):
        for j, yj in known[k + 1:k + 1 + _WINDOW]:
            s = j - i
            if s > _WINDOW:
                break
            if abs(yj - yi) >= s * d:
                continue    # a straight run (or a slip away from the turns): no turn between
            total = yi + yj
            high, low = _half(total + s * d), _half(total - s * d)
            if high >= middle:
                maxima[high] += 1
            if low <= middle:
                minima[low] += 1
    # an extreme must lie beyond (or on) the lines it is proposed by; one
    # proposed by a single pair only is noise unless nothing better is there
    return _ranked(maxima), _ranked(minima)


def _ranked(counts) -> list:
    """The proposals, commonest first."""
    return [v for v, _ in counts.most_common()]


def _local_extremes(values: list) -> tuple[list, list]:
    peaks, troughs = [], []
    for i in range(1, len(values) - 1):
        a, b, c = values[i - 1], values[i], values[i + 1]
        if a is None or b is None or c is None:
            continue
        if b > a and b > c:
            peaks.append(b)
        elif b < a and b < c:
            troughs.append(b)
    return peaks, troughs


def _merged(ranked: list, extra: list, k: int = 5, most: int = 8) -> list:
    out = list(ranked[:k])
    for v in extra:
        if v not in out and len(out) < most:
            out.append(v)
    return out


def _commonest(values: list) -> list:
    """The candidates to try, commonest first."""
    return list(values)


def _places(frame, v) -> int:
    """Sexagesimal places of a parameter (0 for an unknown one)."""
    if v is None:
        return 0
    x = Fraction(v) / frame.scale
    k = 0
    while x.denominator != 1 and k < 12:
        x *= 60
        k += 1
    return k


def _half(x):
    return x // 2 if isinstance(x, int) and x % 2 == 0 else Fraction(x) / 2


#: Statement units that count cycles or time, so that a period in lines can
#: be a ratio of two of them; units of measure (bēru, UŠ, degrees) never are.
_CYCLE_WORDS = ("months", "periods", "revolutions", "years", "days", "tithis", "phenomena")


def _cycle_unit(unit: str) -> bool:
    u = unit.strip().lower()
    return not u.startswith("degrees") and any(u.endswith(w) for w in _CYCLE_WORDS)


def period_matches(period: Fraction) -> list[dict]:
    """The catalogue relations this period in lines is a ratio of, with the units it implies.

    Two sides a (the lines: synodic months, synodic phenomena, days) and b
    (another cycle) give the period a/b, as 391 phenomena = 36 revolutions
    gives Jupiter's 391/36; two cycles of one body also beat, a/(b − a), as
    6247 synodic = 6695 anomalistic months gives System A's 6247/448 (the
    anomaly seen from syzygy to syzygy) and 251 = 269 gives System B's
    251/18.  A period row (one cycle in days) matches a column of daily
    lines.  Sides in units of measure (1 day = 12 bēru) never match.
    """
    try:
        from .. import catalogue
        entries = catalogue.entries()
    except Exception:   # the catalogue is optional for the audit
        return []
    out = []
    for entry in entries:
        if entry.kind == "parameter":
            continue
        singles = [side.single for side in entry.sides if side.single is not None
                   and side.single.sign == 1 and _cycle_unit(side.single.unit)]
        found = None
        if entry.kind == "period" and period == entry.value and _cycle_unit(entry.unit):
            found = ("value", entry.unit, f"1 {entry.sides[0].terms[0].unit} = {exact_text(period)} {entry.unit}")
        for a in singles:
            for b in singles:
                if not found and a is not b and a.unit != b.unit and a.number and b.number \
                        and Fraction(a.number) / Fraction(b.number) == period:
                    found = ("ratio", a.unit, f"{a.text} / {b.text}")
        for a in singles:
            for b in singles:
                # a beat of two cycles of one kind (synodic and anomalistic months)
                if not found and a is not b and a.unit != b.unit and b.number > a.number \
                        and a.unit.split()[-1] == b.unit.split()[-1] \
                        and Fraction(a.number) / (b.number - a.number) == period:
                    found = ("beat", a.unit, f"{a.text} / ({b.text} − {a.text})")
        if found:
            how, lines, formula = found
            out.append({"id": entry.id, "statement": entry.statement, "source": entry.source,
                        "period": exact_text(period), "how": how, "lines_are": lines,
                        "formula": formula, "body": entry.body,
                        "_size": max(abs(t.number) for side in entry.sides for t in side.terms)})
    out.sort(key=lambda m: m["_size"])
    for m in out:
        del m["_size"]
    return out


def _fits(match: dict, published: list[dict]) -> bool:
    """Whether a period relation fits the column a published scheme says it is."""
    if not published or "line_unit" not in published[0]:
        return True
    line = published[0]["line_unit"].split()[-1]
    lines = match["lines_are"].split()[-1]
    same = {"phenomena": "periods"}
    return (same.get(line, line) == same.get(lines, lines)
            and match["body"] in (published[0].get("body"), "calendar"))


