"""The mathematics of near-commensurability: continued fractions and record spans.

Two questions a historian asks of cycles.  *How many cycles fit in a whole
number of years, and which such pairs are the best?*  The answer is the
continued-fraction expansion of the ratio of the two periods: its convergents
p/q are the best approximations (no fraction with a smaller denominator comes
closer), and the intermediate fractions between them, the semiconvergents,
are the next best (the theory of best rational approximation, common
practice; e.g. A. Ya. Khinchin, Continued Fractions, 1935/1964, ch. II -
chapter from memory).  The Metonic 235 months in 19 years is a convergent of
the year measured in months.

*Which spans are close to whole numbers of several cycles at once?*  No
continued fraction answers that for three or more cycles; numcheck walks the
spans one by one (a whole number of a reference cycle) and keeps each span
that beats every shorter one ("records"): the Saros, 223 months = 239
anomalistic = 242 draconitic months, is such a record.

Everything that a result reports is exact (Fractions); the walk over spans
scores with floats, and the reported spans are recomputed exactly.
"""

from __future__ import annotations

from fractions import Fraction

import numpy as np

__all__ = ["continued_fraction", "convergents", "best_ratios", "record_spans"]


def continued_fraction(x: Fraction, max_terms: int = 64) -> list[int]:
    """The partial quotients [a0; a1, a2, ...] of a positive Fraction *x*.

    >>> continued_fraction(Fraction(235, 19))
    [12, 2, 1, 2, 2]
    """
    x = Fraction(x)
    terms = []
    while len(terms) < max_terms:
        a = x.numerator // x.denominator
        terms.append(a)
        rest = x - a
        if rest == 0:
            break
        x = 1 / rest
    return terms


def convergents(terms: list[int]) -> list[tuple[int, int]]:
    """The convergents (p, q) of a continued fraction.

    >>> convergents([12, 2, 1, 2, 2])
    [(12, 1), (25, 2), (37, 3), (99, 8), (235, 19)]
    """
    out = []
    p0, q0, p1, q1 = 1, 0, terms[0], 1
    out.append((p1, q1))
    for a in terms[1:]:
        p0, q0, p1, q1 = p1, q1, a * p1 + p0, a * q1 + q0
        out.append((p1, q1))
    return out


def best_ratios(x: Fraction, max_q: int) -> list[tuple[int, int, str]]:
    """Convergents and semiconvergents p/q of *x* with 1 <= q <= *max_q*, by q.

    Each item is (p, q, kind), kind ``"convergent"`` or ``"semiconvergent"``
    (an intermediate fraction (p[k-1] + j p[k]) / (q[k-1] + j q[k]),
    0 < j < a[k+1], kept only when it is closer to *x* than the convergent
    p[k]/q[k], so that every ratio listed is a best approximation: none with
    a smaller q is closer).  Ratios with p = 0 are left out.

    >>> best_ratios(Fraction(235, 19), 19)[-3:]
    [(99, 8, 'convergent'), (136, 11, 'semiconvergent'), (235, 19, 'convergent')]
    """
    x = Fraction(x)
    # Enough terms for every denominator up to max_q: they at least double
    # every two steps, so 2 * log2(max_q) + 4 terms suffice.
    terms = continued_fraction(x, max_terms=2 * max(1, int(max_q).bit_length()) + 4)
    found: dict[tuple[int, int], str] = {}
    p0, q0, p1, q1 = 1, 0, terms[0], 1
    if p1 > 0:
        found[(p1, q1)] = "convergent"
    for a in terms[1:]:
        for j in range(1, a):
            p, q = p0 + j * p1, q0 + j * q1
            if q > max_q:
                break
            # Keep only the intermediate fractions closer than the last
            # convergent: the best approximations (of the first kind).
            if p > 0 and abs(x - Fraction(p, q)) < abs(x - Fraction(p1, q1)):
                found.setdefault((p, q), "semiconvergent")
        p0, q0, p1, q1 = p1, q1, a * p1 + p0, a * q1 + q0
        if q1 > max_q:
            break
        if p1 > 0:
            found[(p1, q1)] = "convergent"
    return sorted(((p, q, kind) for (p, q), kind in found.items()), key=lambda t: (t[1], t[0]))


def record_spans(span_days: Fraction, periods: list[Fraction], max_span: int) -> list[int]:
    """Spans n (1..*max_span* units of *span_days*) that are records for all *periods* at once.

    The score of a span is the worst distance, in turns, of n * span_days /
    period from a whole number, over all periods; a span is a record when its
    score is lower than that of every shorter span.  A span shorter than one
    cycle of some period does not count (it is "whole" only by being zero).

    >>> from fractions import Fraction as F
    >>> record_spans(F(1), [F(10, 3)], 12)
    [2, 3, 10]
    """
    n = np.arange(1, max_span + 1, dtype=np.float64)
    worst = np.zeros_like(n)
    for period in periods:
        count = n * float(Fraction(span_days) / Fraction(period))
        off = np.abs(count - np.rint(count))
        off[np.rint(count) < 1] = np.inf
        worst = np.maximum(worst, off)
    records = []
    best = np.inf
    for i in range(len(n)):
        if worst[i] < best:
            best = worst[i]
            records.append(i + 1)
    return records
