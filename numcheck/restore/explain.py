"""Short plain-language reasons for a restored reading.

Each candidate says which evidence it agrees with (and how closely), what it
puts in each lost or doubtful place (and whether that is the editor's
restoration), how it reads an unknown gap and at which magnitude it takes a
floating number.
"""

from __future__ import annotations

from fractions import Fraction
from functools import lru_cache

from ..reading import exact_text, sexagesimal_text
from .evidence import Target

__all__ = ["evidence_reason", "position_reasons", "NO_EVIDENCE"]

NO_EVIDENCE = "no evidence points to it: ranked by the traces alone"


@lru_cache(maxsize=1024)
def _num(value: Fraction, base: int) -> str:
    # Cached: the same catalogue values are written again for every reading near them.
    value = Fraction(value)
    if base == 60:
        return sexagesimal_text(value, max_places=8)
    return exact_text(value)


def evidence_reason(target: Target, value: Fraction, ulp: Fraction, base: int) -> str:
    """How *value* agrees with *target*: exactly, to the last place, or within a tolerance."""
    t = target.value
    if value == t:
        fit = "exactly"
    elif target.tolerance is None:
        fit = (f"to the last written place ({_num(t, base)} cut there)" if value < t
               else f"to the last written place ({_num(t, base)} rounded up there)")
    else:
        fit = f"off by {_num(abs(value - t), base)} (tolerance {_num(target.tolerance, base)})"
    what = {"catalogue": "agrees with the catalogue: ", "expect": "agrees with ",
            "context": "agrees with ", "mathematics": "agrees with mathematics: "}.get(target.kind, "agrees with ")
    return f"{what}{target.label}, {fit}"


def position_reasons(sub, chosen: dict[int, int]) -> list[str]:
    """What the reading puts in each open place; *chosen* maps position index -> option index."""
    out = []
    base = sub.expansion.base
    for pi, oi in sorted(chosen.items()):
        pos = sub.positions[pi]
        opt = pos.options[oi]
        v = exact_text(opt.value)
        where = f"place 60^{pos.place}" if base == 60 else f"place {pos.place}"
        written = f"'{pos.slot.text}'" if pos.slot.text else "a place"
        if opt.kind == "doubtful-read":
            out.append(f"doubtful {written} ({where}) kept as read: {v}")
        elif opt.kind == "ambiguous":
            others = ", ".join(exact_text(o.value) for o in pos.options)
            out.append(f"{written} ({where}) read as {v}: the text allows {others} (see the notes of read)")
        elif opt.kind == "doubtful-alternative":
            out.append(f"doubtful {written} ({where}) read as {v}: {opt.reason}")
        else:
            editor = pos.slot.editor
            if editor is not None and opt.editor:
                out.append(f"{written} ({where}) = {v}, the editor's restoration")
            elif editor is not None:
                out.append(f"{written} ({where}) = {v}, not the editor's {exact_text(editor)}")
            else:
                state = "unread" if opt.kind == "unread" else "lost"
                out.append(f"{written} ({where}, {state}) restored as {v}")
    if sub.gap_places:
        out.append("'[...]' taken as " + ", ".join(f"{n} lost place{'s' if n != 1 else ''}"
                                                     for n in sub.gap_places))
    if sub.expansion.floating:
        top = max((s.place for s in sub.expansion.counted_slots), default=0) + sub.scale
        out.append(f"magnitude: first place at 60^{top} (x 60^{sub.scale}; the text does not fix it)")
    return out
