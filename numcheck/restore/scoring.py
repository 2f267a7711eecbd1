"""The one scoring model of restoration, in one place.

    posterior(reading)  ∝  prior(reading | traces, slip model) × likelihood(value | evidence)

**Prior.**  A product of independent factors, so that the mass of any set of
readings is known in closed form:

* each lost or unread place (or digit) takes every value the traces allow,
  uniformly, times a mild *simplicity* factor (:func:`simplicity`: a round
  value such as 0 or 30 is a little likelier, as scribes and editors meet
  round numbers often, but an empty last place is unlikely, as nobody needs
  to write it — common practice, not a measured frequency);
* an editor's restoration counts :data:`EDITOR_WEIGHT` times an unrestored
  value: the editor saw the original and its context, but the restoration is
  one candidate among the others, and evidence can overturn it;
* a doubtful digit keeps :data:`DOUBT_READ_MASS` for the value read; the rest
  goes to its alternatives in proportion to the weights of the confusion data
  (``numcheck.slips.confusions``: wedge miscounts, look-alike letters);
* an unknown gap ``[...]`` of *n* places more than its fewest weighs
  ``GAP_DECAY ** n``; every magnitude of a floating number in the window
  ``numcheck.limits.RESTORE_FLOAT_FIRST_PLACE`` is equally likely
  (:func:`scale_weight`).

No relative frequencies of scribal slips are published (see the reference
notes on schemes and slips), so these factors are deliberately mild and flat.

**Likelihood: a mixture of hypotheses.**  Either the number is none of the
values the evidence names (hypothesis 0, weight :data:`NONE_WEIGHT`), or it is
the value of one piece of evidence *e* (weight ``w_e``; the catalogue counts
as one source of weight :data:`CATALOGUE_WEIGHT`, shared among the distinct
catalogue values the traces allow, in proportion to their own weights raised
to :data:`CATALOGUE_SHARPNESS`; only values and their simple parts and
multiples n/m, n, m <= :data:`CATALOGUE_MAX_FACTOR`, count, and modern values
are left out: no ancient scribe wrote them).  Under
hypothesis *e* the value lies within the tolerance of the evidence, an exact
fit likelier than a near one (:func:`kernel`).  A catalogue value and an
expected value are met by a reading less than one step of its last written
place away (the scribe rounded or cut the value there; a written part such as
``1/3`` makes the step finer); context evidence brings its own tolerance.  So::

    likelihood(v) = π0 + Σ_e π_e · k_e(v) / N_e
    N_e = Σ_readings prior(r) · k_e(v_r)          (the readings that agree with e)
    π_e = w_e m_e / (NONE_WEIGHT + Σ_{e' possible} w_e' m_e'),  π0 = NONE_WEIGHT / (same)

where the *reach* ``m_e`` is the share of e's kernel mass (over every number
it accepts) that the traces allow, at the best gap count and magnitude: 1
when the damaged places can take every number e accepts, about 1/2 when e
falls between two numbers of the last place and a digit that is read rules
one of them out.  A hypothesis the traces only half allow earns half its
weight.  (In the catalogue group the shares are ``CATALOGUE_WEIGHT × w_e
m_e / Σ w_e'``.)

Evidence that no reading can meet is impossible under the traces and drops
out (its weight is not counted).  Because the prior sums to 1 over the whole
space, the posterior needs no further normalising: the readings no evidence
touches carry ``π0 × (1 − Σ prior of the readings that agree)`` between them,
computed in closed form, not by enumeration.

Ties are broken by the prior, then by the magnitude (a floating number's
first place nearer the units place first), then by the order of the
sub-spaces (fewer gap places first), then by the value: the same input
always gives the same ranking.
"""

from __future__ import annotations

from fractions import Fraction

__all__ = [
    "EDITOR_WEIGHT", "DOUBT_READ_MASS", "GAP_DECAY", "NONE_WEIGHT", "CATALOGUE_WEIGHT",
    "EXPECT_WEIGHT", "CATALOGUE_MAX_FACTOR", "CATALOGUE_SHARPNESS", "KERNEL_EDGE",
    "simplicity", "scale_weight", "kernel", "mixture",
]

#: An editor's restored value against one unrestored value (prior odds).
EDITOR_WEIGHT = 3.0
#: Prior probability that a doubtful digit is what the editor read.
DOUBT_READ_MASS = 0.6
#: Each lost place of an unknown gap beyond its fewest multiplies the prior by this.
GAP_DECAY = 0.5
#: Weight of the hypothesis "the number is none of the values the evidence names".
NONE_WEIGHT = 1.0
#: Weight of the catalogue as a whole (shared among its possible values).
CATALOGUE_WEIGHT = 1.0
#: Catalogue values count with their parts and multiples n/m for n, m up to this.
CATALOGUE_MAX_FACTOR = 12
#: A catalogue value's weight (identify's belief in it, lower for a part or a
#: multiple and for a value from memory) is raised to this power: restoring a
#: number is a stronger claim than identifying it, and many parts and
#: multiples of unrelated values must not outweigh one value met as it is.
CATALOGUE_SHARPNESS = 3.0
#: Weight of a value the user expects (``--expect``).
EXPECT_WEIGHT = 4.0
#: A reading at the edge of a tolerance counts this much of an exact fit.
KERNEL_EDGE = 0.5


def simplicity(value: Fraction, last: bool = False) -> float:
    """A mild preference for round values in a lost place.

    An empty place at the end of a number is the exception: a scribe had no
    reason to write it (common practice), so a lost last place is seldom 0.

    >>> simplicity(Fraction(0)), simplicity(Fraction(30)), simplicity(Fraction(37))
    (1.5, 1.2, 1.0)
    >>> simplicity(Fraction(0), last=True)
    0.5
    """
    if value == 0:
        return 0.5 if last else 1.5
    if value.denominator == 1 and value % 10 == 0:
        return 1.2
    return 1.0


def scale_weight(expansion, scale: int) -> float:
    """Prior weight of a magnitude of a floating number: flat, the text says nothing of it.

    A floating number is written at integer scale (its last place is the
    units); *scale* is the power of 60 applied to it.  Ties between
    magnitudes are broken towards the units place (see the ranking).
    """
    return 1.0


def kernel(distance: float, tolerance: float) -> float:
    """How well a value at *distance* from the evidence fits: 1 exact, KERNEL_EDGE at the edge.

    >>> kernel(0.0, 0.0), kernel(0.5, 1.0)
    (1.0, 0.75)
    """
    if tolerance <= 0:
        return 1.0 if distance == 0 else 0.0
    return 1.0 - (1.0 - KERNEL_EDGE) * min(1.0, distance / tolerance)


def mixture(weights: dict[int, float], possible: set[int], groups: dict[int, str],
            group_weights: dict[str, float], reach: dict[int, float] | None = None
            ) -> tuple[float, dict[int, float]]:
    """The mixing weights π0 and π_e for the evidence that some reading can meet.

    *weights* are the evidence weights by index and *reach* the share of
    each one's kernel mass the traces allow (1 by default).  Evidence in a
    group (the catalogue) shares the group's weight in proportion to its own
    weight; its reach then scales its share.

    >>> mixture({0: 4.0}, {0}, {}, {})
    (0.2, {0: 0.8})
    >>> mixture({0: 1.0, 1: 1.0}, {0, 1}, {0: "c", 1: "c"}, {"c": 1.0}, {0: 1.0, 1: 0.5})
    (0.5714285714285714, {0: 0.2857142857142857, 1: 0.14285714285714285})
    """
    reach = reach or {}
    share: dict[int, float] = {}
    grouped: dict[str, list[int]] = {}
    for e in sorted(possible):
        g = groups.get(e)
        if g is None:
            share[e] = weights[e] * reach.get(e, 1.0)
        else:
            grouped.setdefault(g, []).append(e)
    for g, members in grouped.items():
        total = sum(weights[e] for e in members)
        for e in members:
            part = weights[e] / total if total > 0 else 1.0 / len(members)
            share[e] = group_weights[g] * part * reach.get(e, 1.0)
    denom = NONE_WEIGHT + sum(share.values())
    return NONE_WEIGHT / denom, {e: w / denom for e, w in share.items()}
