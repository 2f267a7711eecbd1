"""``restore``: rank every reading a damaged number allows, by all the evidence.

The steps: the candidate space of the reading (:mod:`.space`), the evidence
(:mod:`.evidence`), the readings that agree with it (:mod:`.search`), the one
scoring model (:mod:`.scoring`), the reasons (:mod:`.explain`).  The result
is a list of suggestions for the editor's judgement, never a reading.
"""

from __future__ import annotations

from dataclasses import replace

import numpy as np

from .. import limits
from ..errors import LimitError, NumcheckRangeError
from ..notations import render_choice
from ..reading import Reading
from . import scoring
from .evidence import Target, gather
from .explain import NO_EVIDENCE, evidence_reason, position_reasons
from .result import Candidate, RestoreResult
from .search import estimate, find_matches, grid_for, inside, merge_windows, top_by_prior, windows_for
from .space import build_space

__all__ = ["restore"]

#: Agreements with evidence spelled out per candidate (the rest are counted).
REASONS_SHOWN = 3


def _reading(reading_or_text, notation, unit) -> Reading:
    if isinstance(reading_or_text, Reading):
        reading = reading_or_text
        if unit is not None and reading.unit is None:
            reading = replace(reading, unit=unit)
        return reading
    from ..reader import read

    return read(reading_or_text, notation=notation, unit=unit)


def restore(reading_or_text, *, notation=None, unit=None, expect=None, context=(), top=10,
            use_catalogue=True, tradition=None, satisfies=()) -> RestoreResult:
    """Rank the readings a damaged number allows, with probabilities and reasons.

    *reading_or_text* is a :class:`~numcheck.reading.Reading` or a text read
    with :func:`numcheck.read` (*notation*, *unit* as there).  *expect* is a
    value the user expects (a text or an exact number); *context* a sequence
    of :class:`Evidence` from the number's surroundings; the catalogue of
    periods is consulted unless ``use_catalogue=False``; *tradition*
    (babylonian, greek ...) weighs that tradition's catalogue rows above the
    others (without it, the tradition the notation says); *satisfies* is a
    relation from mathematics (``"x^2 = 2"``) or several, weighed like an
    expected value (:mod:`numcheck.restore.mathematics`).  Gives the *top*
    candidates, best first, with probabilities over the whole space.

    >>> restore("29;31,5[x],8,20", use_catalogue=False, expect="29;31,50,8,20").best.text
    '29;31,5[0],8,20'
    """
    if isinstance(top, bool) or not isinstance(top, int) or top < 1:
        raise NumcheckRangeError(f"The number of candidates asked for is {top!r}.", value=top,
                                 legal="a whole number, 1 or more")
    if top > limits.RESTORE_MAX_TOP:
        raise LimitError("number of candidates asked for", f"{top:,}", f"{limits.RESTORE_MAX_TOP:,}",
                         "Ask for fewer, or set numcheck.limits.RESTORE_MAX_TOP higher.")
    asked = top
    if top > limits.RESTORE_MAX_LISTED:
        # Listing 100,000 candidates printed 60 MB of JSON: list the best
        # ones, say so; the probabilities stay those of the whole space.
        top = limits.RESTORE_MAX_LISTED
    reading = _reading(reading_or_text, notation, unit)
    if tradition is not None:
        from .. import catalogue
        from ..errors import UnknownNameError

        if tradition not in catalogue.traditions():
            raise UnknownNameError("tradition", tradition, catalogue.traditions())
    space = build_space(reading)
    targets, ev_notes = gather(reading, space, expect=expect, context=context,
                               use_catalogue=use_catalogue, unit=unit or reading.unit,
                               tradition=tradition, satisfies=satisfies)
    notes = list(space.notes) + ev_notes
    if asked > top:
        notes.append(f"{asked:,} candidates were asked for; the best {top:,} are listed "
                     f"(numcheck.limits.RESTORE_MAX_LISTED). The probabilities are over the whole "
                     "space of readings.")
    grids = [grid_for(s) for s in space.subspaces]
    order = sorted(range(len(targets)), key=lambda i: targets[i].value)
    values = [targets[i].value for i in order]
    windows = [windows_for(g, targets, order, values) for g in grids]
    _drop_broad(targets, grids, windows, notes)
    match, norm, reach = find_matches(space, grids, windows, len(targets))
    possible = {i for i in range(len(targets)) if norm[i] > 0}
    pi0, pis = _weigh(targets, match, norm, reach, possible)
    unmatched = max(0.0, pi0 * (1.0 - float(match.prior.sum())))
    rows = _best_rows(grids, windows, match, pi0, top)

    def support(t: int, k: float) -> float:   # how much of a reading's probability evidence t gives
        return pis.get(t, 0.0) * k / norm[t] if norm[t] > 0 else 0.0

    candidates = [_candidate(targets, row, support) for row in rows]
    _space_notes(reading, space, targets, possible, notes)
    evidence = [{"id": t.id, "label": t.label, "kind": t.kind,
                 "possible": i in possible, "weight": pis.get(i, 0.0)}
                for i, t in enumerate(targets) if t.kind != "catalogue" or i in possible]
    return RestoreResult(reading.text, reading.notation, candidates, space.count, unmatched,
                         notes, evidence)


def _weigh(targets, match, norm, reach, possible):
    """The mixing weights of the scoring model, and every agreeing reading's probability."""
    groups = {i: t.group for i, t in enumerate(targets) if t.group}
    pi0, pis = scoring.mixture({i: t.weight for i, t in enumerate(targets)}, possible, groups,
                               {"catalogue": scoring.CATALOGUE_WEIGHT},
                               {i: float(reach[i]) for i in possible})
    for r, hits in enumerate(match.hits):
        match.score[r] = match.prior[r] * (pi0 + sum(pis[t] * k / norm[t] for t, k in hits))
    return pi0, pis


def _best_rows(grids, windows, match, pi0, top):
    """The *top* readings: the best that agree with evidence, and the best the traces favour."""
    rows = []  # (probability, prior, sub index, V, grid, choice, hits)
    by_index = {g.sub.index: g for g in grids}
    # Only the best rows need the full (exact) tie-break; numpy picks them first.
    for r in np.lexsort((-match.prior, -match.score))[: 4 * top + 16]:
        g = by_index[int(match.sub[r])]
        choice = tuple(int(c) for c in match.choice[r][:len(g.contrib)])
        rows.append((float(match.score[r]), float(match.prior[r]), g.sub.index, match.value[r], g,
                     choice, match.hits[r]))
    merged = [merge_windows(w) for w in windows]

    def agrees(g, V) -> bool:      # a reading some evidence touches is already among the rows
        return inside(merged[g.sub.index], V)

    for g, choice, V, prior in top_by_prior(grids, agrees, top, limits.RESTORE_MAX_NODES):
        rows.append((pi0 * prior, prior, g.sub.index, V, g, choice, []))
    rows.sort(key=_rank_key)
    return rows[:top]


def _rank_key(row):
    prob, prior, sub, V, g, choice, _ = row
    # Then nearer the units place (a floating number), then by value (V orders values in a sub-space).
    return (-prob, -prior, abs(g.sub.scale + g.top), sub, g.sub.expansion.sign * V, choice)


def _drop_broad(targets, grids, windows, notes) -> None:
    """Set aside evidence that agrees with too many readings to narrow anything."""
    limit = limits.RESTORE_MAX_MATCHES // 2
    counts: dict[int, float] = {}
    for g, wins in zip(grids, windows):
        for w in wins:
            counts[w.target] = counts.get(w.target, 0.0) + estimate(g, w)
    broad = {t for t, n in counts.items() if n > limit}
    for t in sorted(broad):
        notes.append(f"{targets[t].label} agrees with about {int(counts[t]):,} readings, too many to "
                     f"narrow the search (numcheck.limits.RESTORE_MAX_MATCHES // 2 = {limit:,}); "
                     f"it was set aside. Give it a smaller tolerance.")
    if broad:
        for wins in windows:
            wins[:] = [w for w in wins if w.target not in broad]
    _keep_strongest_catalogue(targets, grids, windows, notes)


def _keep_strongest_catalogue(targets, grids, windows, notes) -> None:
    """When the catalogue could meet too many readings, weigh its strongest values only.

    A number with almost every place lost can meet thousands of catalogue
    values in every gap count and magnitude; rather than stop, the values
    of highest weight are kept while the readings they can meet stay within
    ``limits.RESTORE_MAX_MATCHES``, and the note says how many were left out.
    """
    bound: dict[int, int] = {}      # at most this many readings meet each target
    for g, wins in zip(grids, windows):
        count = g.sub.count
        for w in wins:
            bound[w.target] = bound.get(w.target, 0) + min(w.hi - w.lo + 1, count)
    if sum(bound.values()) <= limits.RESTORE_MAX_MATCHES:
        return
    budget = limits.RESTORE_MAX_MATCHES - sum(n for t, n in bound.items() if targets[t].kind != "catalogue")
    catalogue = sorted((t for t in bound if targets[t].kind == "catalogue"),
                       key=lambda t: (-targets[t].weight, targets[t].value, t))
    kept = set()
    for t in catalogue:
        if bound[t] > budget:
            break
        budget -= bound[t]
        kept.add(t)
    left = len(catalogue) - len(kept)
    if not left:
        return
    for wins in windows:
        wins[:] = [w for w in wins if targets[w.target].kind != "catalogue" or w.target in kept]
    notes.append(f"The traces could meet {len(catalogue):,} catalogue values; only the {len(kept):,} of "
                 f"highest weight were weighed (numcheck.limits.RESTORE_MAX_MATCHES = "
                 f"{limits.RESTORE_MAX_MATCHES:,} readings). Fewer lost places, the unit, or an expected "
                 f"value would narrow it.")


def _candidate(targets: list[Target], row, support) -> Candidate:
    prob, prior, _, V, g, choice, hits = row
    sub = g.sub
    e = sub.expansion
    chosen = {pi: oi for pi, oi in zip(g.open_ids, choice)}
    values = []
    pos_of = {p.slot_index: (i, p) for i, p in enumerate(sub.positions)}
    for si, slot in enumerate(e.slots):
        if si in pos_of:
            pi, p = pos_of[si]
            values.append(p.options[chosen.get(pi, 0)].value)
        else:
            values.append(slot.values[0])
    value = g.value_of(V)
    text = render_choice(e, tuple(values))
    ranked = sorted(hits, key=lambda h: (-support(*h), h[0]))
    reasons = [evidence_reason(targets[t], value, sub.ulp, e.base) for t, _ in ranked[:REASONS_SHOWN]]
    if len(ranked) > REASONS_SHOWN:
        rest = len(ranked) - REASONS_SHOWN
        reasons.append(f"and {rest} more value{'s' if rest > 1 else ''} of the evidence, each weighing less")
    reasons += position_reasons(sub, chosen)
    if not hits:
        reasons.append(NO_EVIDENCE)
    editor_slots = [p for p in sub.positions if p.slot.editor is not None]
    is_editor = bool(editor_slots) and all(
        p.options[chosen.get(i, 0)].editor for i, p in enumerate(sub.positions) if p.slot.editor is not None)
    return Candidate(text, value, prob, tuple(reasons), is_editor, sub.scale, prior,
                     tuple(dict.fromkeys(targets[t].id for t, _ in ranked)))


def _space_notes(reading, space, targets, possible, notes) -> None:
    count = space.count
    if count == 1:
        from ..reading import Status

        doubtful = [s.text for s in reading.slots if s.status is Status.DOUBTFUL]
        if doubtful:
            which = ", ".join(repr(t) for t in doubtful)
            notes.append(f"The doubtful sign{'s' if len(doubtful) > 1 else ''} {which} "
                         f"{'have' if len(doubtful) > 1 else 'has'} no known confusion in numcheck's "
                         "table of look-alike signs, so the only reading is the one written. "
                         "Give the alternatives you see with --expect.")
        else:
            notes.append("Nothing is lost or doubtful: the only reading is the text itself.")
        return
    unmet = [t for i, t in enumerate(targets) if i not in possible and t.kind != "catalogue"]
    for t in unmet:
        notes.append(f"No reading the traces allow agrees with {t.label}.")
    if not possible:
        wide = count > limits.RESTORE_WIDE_SPACE
        notes.append(
            f"{count:,} readings are possible and no evidence singles any out; the list shows the "
            f"readings the traces favour." + (
                f" That is a wide space (over numcheck.limits.RESTORE_WIDE_SPACE = "
                f"{limits.RESTORE_WIDE_SPACE:,} readings): an expected value (--expect), the unit (so "
                "that the catalogue of periods can be consulted) or the values the table around it "
                "expects would narrow it." if wide else ""))
