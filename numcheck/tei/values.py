"""What a ``<num>``'s letters say about its attributes: value or range, and contradictions.

The decisions of :func:`numcheck.tei.annotate`, apart from the XML: whether
damage leaves the value open, whether the letters are a unit fraction, and
which of ``@value``/``@atLeast``/``@atMost`` to write, keep, or report as
contradicted by the letters.
"""

from __future__ import annotations

from fractions import Fraction

from ..reading import Reading, Status, exact_text
from .write import Edit

__all__ = ["unresolved", "is_unit_fraction", "decide"]

#: Enumerate every reading of a damaged number up to this many when checking
#: an existing ``@value`` against the letters (beyond it, only the range).
ENUMERATE_READINGS = 20_000


def unresolved(reading: Reading) -> bool:
    """Whether lost or unread letters leave the value open (the editor restored none),
    or letters read clearly still allow two values (Reading.ambiguous)."""
    for s in reading.slots:
        if s.gap is not None:
            return True
        if s.status in (Status.LOST, Status.UNREAD) and s.editor is None and len(s.values) > 1:
            return True
        if s.status is Status.RESTORED and s.editor is None and len(s.values) > 1:
            return True
        if s.counted and not s.status.damaged and len(s.values) > 1:
            return True          # read, but its meaning open (a Greek 'ο': 0 or 70)
    return False


def is_unit_fraction(el, reading: Reading, existing: dict) -> bool:
    if reading.min <= 0 or any(v.denominator != 1 for v in (reading.min, reading.max)):
        return False
    if (el.get("type") or "").strip().lower() == "fraction":
        return True
    if "value" in existing:
        try:
            written = Fraction(existing["value"].strip())
        except (ValueError, ZeroDivisionError):
            return False
        return 0 < written < 1 and (1 / written).denominator == 1 and \
            reading.min <= 1 / written <= reading.max
    return False


def _allowed(reading: Reading, value: Fraction, unit_fraction: bool) -> bool:
    target = 1 / value if unit_fraction and value else value
    if reading.count <= ENUMERATE_READINGS:
        return any(v == target for v in reading.readings())
    return reading.min <= target <= reading.max


def decide(res, edit: Edit, existing: dict, reading: Reading,
            exact: Fraction | None, lo: Fraction, hi: Fraction, fix: bool) -> None:
    """Choose the attributes to write; report an existing value the letters contradict."""
    if "value" in existing:
        raw = existing["value"]
        try:
            written = Fraction(raw.strip())
        except (ValueError, ZeroDivisionError):
            written = None
        if written is not None and (written == exact if exact is not None
                                    else _allowed(reading, written, res.unit_fraction)):
            res.status = "kept"
            return
        if exact is not None:
            ours = exact_text(exact)
            res.message = (f"@value={raw!r} but the letters {res.text!r} give {ours}"
                           if written is not None else
                           f"@value={raw!r} is not a number; the letters {res.text!r} give {ours}")
        else:
            res.message = (f"@value={raw!r} is not a reading the letters {res.text!r} allow "
                           f"({exact_text(lo)} to {exact_text(hi)})")
        if not fix:
            res.status = "contradiction"
            return
        res.status = "fixed"
        if exact is not None:
            edit.set_attrs["value"] = exact_text(exact)
        else:
            edit.drop_attrs.append("value")
            edit.set_attrs["atLeast"] = exact_text(lo)
            edit.set_attrs["atMost"] = exact_text(hi)
        return
    if exact is not None:
        edit.set_attrs["value"] = exact_text(exact)
        res.status = "value-added"
        for k in ("atLeast", "atMost"):
            if k in existing:
                _check_bound(res, edit, existing, k, exact, fix)
        return
    wanted = {"atLeast": exact_text(lo), "atMost": exact_text(hi)}
    if not any(k in existing for k in wanted):
        edit.set_attrs.update(wanted)
        res.status = "range-added"
        return
    # The editor gave a range already.  A range narrower than the letters
    # allow is the editor's knowledge (EpiDoc's L[.] = 51-55 leaves out LX),
    # not a contradiction; a range reaching outside them, or holding no
    # reading at all, is.
    try:
        a = Fraction(existing["atLeast"].strip()) if "atLeast" in existing else lo
        b = Fraction(existing["atMost"].strip()) if "atMost" in existing else hi
        ok = lo <= a <= b <= hi and _any_between(reading, a, b, res.unit_fraction)
    except (ValueError, ZeroDivisionError):
        ok = False
    if ok:
        res.status = "kept"
        if (a, b) != (lo, hi):
            res.message = (f"the edition's range {exact_text(a)} to {exact_text(b)} is narrower than "
                           f"the letters {res.text!r} allow ({exact_text(lo)} to {exact_text(hi)})")
        return
    shown = ", ".join(f"@{k}={existing[k]!r}" for k in wanted if k in existing)
    res.message = (f"the letters {res.text!r} allow {exact_text(lo)} to {exact_text(hi)}, "
                   f"which contradicts {shown}")
    res.status = "fixed" if fix else "contradiction"
    if fix:
        edit.set_attrs.update(wanted)


def _any_between(reading: Reading, a: Fraction, b: Fraction, unit_fraction: bool) -> bool:
    if reading.count > ENUMERATE_READINGS:
        return True
    for v in reading.readings():
        v = 1 / v if unit_fraction and v else v
        if a <= v <= b:
            return True
    return False


def _check_bound(res, edit, existing, key, exact, fix) -> None:
    try:
        bound = Fraction(existing[key].strip())
        ok = exact >= bound if key == "atLeast" else exact <= bound
    except (ValueError, ZeroDivisionError):
        ok = False
    if not ok:
        res.message = f"@{key}={existing[key]!r} does not agree with the letters' value {exact_text(exact)}"
        res.status = "fixed" if fix else "contradiction"
        if fix:
            edit.drop_attrs.append(key)
