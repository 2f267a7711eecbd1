"""What a ``<num>``'s letters say about its attributes: value or range, and contradictions.

The decisions of :func:`numcheck.tei.annotate`, apart from the XML: whether
damage leaves the value open, whether the letters are a unit fraction, and
which of ``@value``/``@atLeast``/``@atMost`` to write, keep, or report as
contradicted by the letters.
"""

from __future__ import annotations

import warnings
from fractions import Fraction

from ..errors import NumcheckError, NumcheckWarning
from ..reading import Reading, Status, exact_text
from .write import Edit

__all__ = ["unresolved", "is_unit_fraction", "decide", "supports", "positive_range", "fix_refusal",
           "certainty_match", "CERTAINTY_MATCHES"]

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
        text = existing["value"].strip()
        if text.isascii() and text.isdigit():
            return False                # a whole number: no unit fraction
        try:
            written = Fraction(text)
        except (ValueError, ZeroDivisionError):
            return False
        return 0 < written < 1 and (1 / written).denominator == 1 and \
            reading.min <= 1 / written <= reading.max
    return False


#: Notations of letters, where a lost or unread numeral is never nothing: a
#: documentary number has no zero, so a lone illegible letter is at least 1.
_LETTER_NOTATIONS = {"greek", "greek-ascending", "greek-documentary", "greek-astronomical",
                     "attic", "roman", "abjad", "abjad-maghribi"}

#: The ``@match`` of the ``<certainty>`` elements annotate writes (and replaces).
CERTAINTY_MATCHES = ("../@value", "../@atLeast | ../@atMost", "../@atLeast", "../@atMost")


def certainty_match(attrs) -> str | None:
    """What a ``<certainty locus="value">`` points at, given the attributes the ``<num>`` has.

    ``../@value`` only where there is a ``@value`` (EpiDoc ``trans-numnoncongruent``);
    otherwise the bounds that exist (``@match`` is an XPath: EpiDoc ``ref-certainty``).

    >>> certainty_match({"atLeast", "atMost"})
    '../@atLeast | ../@atMost'
    """
    if "value" in attrs:
        return "../@value"
    bounds = [f"../@{k}" for k in ("atLeast", "atMost") if k in attrs]
    return " | ".join(bounds) or None


def positive_range(reading: Reading) -> tuple[Fraction, Fraction]:
    """The least and greatest value of *reading*, a lost letter counting at least 1.

    In a notation of letters a lost or unread letter is some numeral, never
    the absence of one: ``[.]`` is 1 to 9000, not 0 to 9000.
    """
    lo, hi = reading.min, reading.max
    if lo == 0 < hi and reading.damaged and reading.notation in _LETTER_NOTATIONS \
            and reading.count <= ENUMERATE_READINGS:
        positive = [v for v in reading.readings() if v > 0]
        if positive:
            lo = min(positive)
    return lo, hi


def _values(reading: Reading, unit_fraction: bool, lo: Fraction, hi: Fraction):
    """Every reading of *reading* within [lo, hi], as the ``<num>`` means it (None: too many)."""
    if reading.count > ENUMERATE_READINGS:
        return None
    out = []
    for v in reading.readings():
        v = 1 / v if unit_fraction and v else v
        if lo <= v <= hi:
            out.append(v)
    return out


def supports(reading: Reading, written: Fraction, unit_fraction: bool,
             lo: Fraction, hi: Fraction) -> bool:
    """Whether some valid reading of the letters gives *written*.

    The readings the traces allow, the unit fraction the letters also write
    (γ is 3 or 1/3), and the readings of the documentary conventions of the
    notation (a lone capital letter read as thousands).
    """
    values = _values(reading, unit_fraction, lo, hi)
    if values is None:
        if lo <= written <= hi:
            return True
    elif written in values:
        return True
    if 0 < written < 1 and (1 / written).denominator == 1 and not unit_fraction:
        back = _values(reading, False, reading.min, reading.max)
        if back is not None and 1 / written in back:
            return True
    return written in other_readings(reading)


def other_readings(reading: Reading) -> set[Fraction]:
    """Values the other conventions of the notation give the same letters.

    Greek letters read with the documentary conventions (a lone capital is
    thousands) are also read with the generic ones, which keep every
    reading open (``Α`` is 1 or 1000; ``ο`` is 0 or 70), and the other way round.
    """
    from ..notations import NOTATIONS
    from ..reader import read

    if not reading.notation.startswith("greek") or reading.notation == "greek-ascending":
        return set()
    out: set[Fraction] = set()
    for other in ("greek", "greek-documentary"):
        if other == reading.notation or other not in NOTATIONS:
            continue
        try:
            with warnings.catch_warnings():
                warnings.simplefilter("ignore", NumcheckWarning)
                alt = read(reading.text, notation=other)
        except NumcheckError:
            continue
        if alt.count <= ENUMERATE_READINGS:
            out.update(alt.readings())
    return out


def fix_refusal(res, written: Fraction | None = None) -> str | None:
    """Why ``--fix`` may not replace the editor's value here, or None when it may.

    Only where the letters are plainly a numeral and no loose reading of
    them gives the value: not where they were read only after cleaning
    (accents or breathings left out: a word, perhaps), nor where the editor
    expanded part of the number (``<ex>``), nor where the value is the
    letters' value in thousands (the thousands sign unwritten or lost), nor
    where the value fits if a counted lacuna held fewer letters (a numeral
    sign or a space counted among them).
    """
    from .words import looks_like_words

    if looks_like_words(res.text):
        return "the letters carry accents or breathings: a word, perhaps, not a numeral"
    if res.expanded:
        return "the editor expanded part of the number (<ex>)"
    if written is not None and res.value is not None and res.value and \
            written == 1000 * res.value and res.value < 10 and res.value.denominator == 1:
        return "the editor's value is the letter's in thousands: the thousands sign may be unwritten or lost"
    loose = getattr(res, "loose", None)
    if written is not None and loose is not None and loose[0] <= written <= loose[1]:
        return "the value fits if the lacuna holds fewer letters than counted (a numeral sign, a space)"
    return None


def decide(res, edit: Edit, existing: dict, reading: Reading,
            exact: Fraction | None, lo: Fraction, hi: Fraction, fix: bool) -> None:
    """Choose the attributes to write; report an existing value the letters contradict.

    ``fix`` replaces only a value that no valid reading of the letters gives.
    """
    if "value" in existing:
        raw = existing["value"]
        try:
            written = Fraction(raw.strip())
        except (ValueError, ZeroDivisionError):
            written = None
        if written is not None and (written == exact or
                                    supports(reading, written, res.unit_fraction, lo, hi)):
            res.status = "agrees"
            if exact is not None and written != exact:
                res.message = (f"@value={raw!r} is another valid reading of the letters "
                               f"{res.text!r} (numcheck reads {exact_text(exact)} first); kept")
                res.value = written
            return
        if exact is not None:
            ours = exact_text(exact)
            res.message = (f"@value={raw!r} but the letters {res.text!r} give {ours}"
                           if written is not None else
                           f"@value={raw!r} is not a number; the letters {res.text!r} give {ours}")
        else:
            res.message = (f"@value={raw!r} is not a reading the letters {res.text!r} allow "
                           f"({exact_text(lo)} to {exact_text(hi)})")
        refusal = fix_refusal(res, written) if fix else None
        if not fix or refusal:
            res.status = "contradiction"
            if refusal:
                res.message += f" (not changed: {refusal})"
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
    # The editor gave a range already, perhaps one-sided.  It agrees with the
    # letters when some reading of the letters lies within it: a range
    # narrower than the letters allow is the editor's knowledge (EpiDoc's
    # L[.] = 51-55 leaves out LX), an @atLeast alone a bound the letters may
    # satisfy (TEI att.ranging); a range holding no reading contradicts them.
    try:
        a = Fraction(existing["atLeast"].strip()) if "atLeast" in existing else None
        b = Fraction(existing["atMost"].strip()) if "atMost" in existing else None
        # Two bounds reaching outside what the letters allow deny the letters
        # read; one bound alone only says "at least" (or "at most").
        inside = a is None or b is None or lo <= a <= b <= hi
        ok = inside and _any_between(reading, a, b, res.unit_fraction, lo, hi)
    except (ValueError, ZeroDivisionError):
        ok = False
    if ok:
        res.status = "agrees"
        a_, b_ = (a if a is not None else lo), (b if b is not None else hi)
        if lo < a_ or b_ < hi:
            shown = " and ".join(f"@{k}={existing[k]!r}" for k in wanted if k in existing)
            res.message = (f"the edition's {shown} is narrower than the letters {res.text!r} "
                           f"allow ({exact_text(lo)} to {exact_text(hi)})")
        return
    shown = ", ".join(f"@{k}={existing[k]!r}" for k in wanted if k in existing)
    res.message = (f"the letters {res.text!r} allow {exact_text(lo)} to {exact_text(hi)}, "
                   f"which contradicts {shown}")
    refusal = fix_refusal(res) if fix else None
    if refusal:
        res.message += f" (not changed: {refusal})"
    res.status = "fixed" if fix and not refusal else "contradiction"
    if res.status == "fixed":
        edit.set_attrs.update(wanted)


def _any_between(reading: Reading, a, b, unit_fraction: bool, lo, hi) -> bool:
    """Whether a reading within [lo, hi] lies within the editor's bounds *a*, *b* (None: open)."""
    values = _values(reading, unit_fraction, lo, hi)
    if values is None:
        return (a is None or hi >= a) and (b is None or lo <= b) and (a is None or b is None or a <= b)
    return any((a is None or v >= a) and (b is None or v <= b) for v in values)


def _check_bound(res, edit, existing, key, exact, fix) -> None:
    try:
        bound = Fraction(existing[key].strip())
        ok = exact >= bound if key == "atLeast" else exact <= bound
    except (ValueError, ZeroDivisionError):
        ok = False
    if not ok:
        res.message = f"@{key}={existing[key]!r} does not agree with the letters' value {exact_text(exact)}"
        refusal = fix_refusal(res) if fix else None
        if refusal:
            res.message += f" (not changed: {refusal})"
        res.status = "fixed" if fix and not refusal else "contradiction"
        if res.status == "fixed":
            edit.drop_attrs.append(key)
