"""Scribal-slip models: what kind of slip turns the value due into the value written.

The audit finds *that* a cell breaks its scheme; this module says *how* the
scribe most likely went wrong, by the numerical signature of each class of
slip (schemes-and-slips.md §2.2, after Neugebauer's distinction of carried,
copying and scheme errors): one wedge or letter too many or too few in one
place, a place value shifted, two places merged, a neighbour copied, a carry
dropped, a sign not advanced ...  The test is exact: a signature either fits
the pair (written, expected) or it does not.  The result is a suggestion for
the editor, not a reading.

It also writes a value back *as the scribe would have written it*, in the
cell's own notation and number of places, so that ``expected`` can stand in
the cell.
"""

from __future__ import annotations

from dataclasses import dataclass
from fractions import Fraction

from ..placevalue import digits_of, mantissa
from ..reading import sexagesimal_text

__all__ = ["KINDS", "Diagnosis", "classify", "write_value"]

#: The flag kinds of DESIGN.md, in the order they are tried.
KINDS = (
    "unit-slip", "ten-slip", "place-shift", "merged-places", "split-place", "dropped-zero",
    "copied-neighbour", "carry", "turning-point", "zone-boundary", "sign-error",
    "letter-confusion", "intermediate-value", "carried-forward", "unexplained",
)

_BASE = 60


@dataclass(frozen=True)
class Diagnosis:
    """The kind of a slip and a one-line reason for it."""

    kind: str
    reason: str


def _needed_places(value: Fraction, most: int = 12) -> int | None:
    value = abs(Fraction(value))
    for p in range(most + 1):
        if (value * _BASE ** p).denominator == 1:
            return p
    return None


def write_value(value: Fraction, *, notation: str = "sexagesimal", places: int = 0,
                floating: bool = False, sign_name: str | None = None, longitude: bool = False,
                decimal_whole: bool = False, separator: str = ",") -> str:
    """Write *value* as the scribe would: in the cell's notation, with its places.

    Sexagesimal values get at least *places* fractional places (final zeros
    kept, as the cell wrote them); a floating (cuneiform) value is written
    without magnitude; a longitude as degrees within its sign.

    >>> write_value(Fraction(1, 2), places=2)
    '0;30,0'
    >>> write_value(Fraction(206, 1), longitude=True, sign_name="Libra")
    '26 Libra'

    With *decimal_whole* (the column writes its whole part in decimal, as
    a day count ``365;15``) the whole part is written so, not ``6,5;15``:

    >>> write_value(Fraction(7305, 4), decimal_whole=True)
    '1826;15'

    A floating value takes the *separator* of the cell's places (``6 40`` where
    the text writes places apart with spaces):

    >>> write_value(Fraction(20, 3), floating=True, separator=" ")
    '6 40'
    """
    value = Fraction(value)
    if longitude:
        from ..units import ZODIAC, zodiac_index
        value = value % 360
        index = int(value // 30)
        degrees = value - 30 * index
        name = ZODIAC[index]
        if sign_name is not None:
            try:
                if zodiac_index(sign_name) == index:
                    name = sign_name
            except ValueError:
                pass
        return f"{write_value(degrees, notation=notation, places=places)} {name}"
    if notation not in ("sexagesimal", "cuneiform"):
        text = _other_notation(value, notation, places)
        if text is not None:
            return text
    if floating:
        m = mantissa(value)
        if m is None:
            return sexagesimal_text(value, fixed=False)
        return separator.join(str(d) for d in digits_of(m, 0)[0])
    text = sexagesimal_text(value)
    if decimal_whole and value >= 0:
        whole = value.numerator // value.denominator
        text = str(whole) + (";" + sexagesimal_text(value - whole).split(";", 1)[1]
                             if value != whole else "")
    written = text.split(";")[1].count(",") + 1 if ";" in text else 0
    if written < places and not text.endswith("..."):
        text += (";" if written == 0 else ",") + ",".join(["0"] * (places - written))
    return text


def _other_notation(value: Fraction, notation: str, places: int) -> str | None:
    """*value* in a letter notation (Greek, abjad) or Roman numerals, read back to check.

    Places are groups separated by spaces (κθ λα ν = 29;31,50).  The text is
    read back with :func:`numcheck.read`; a value the notation cannot write
    (a zero place in abjad, a fraction in Roman numerals) gives None, and
    the caller writes sexagesimal instead.
    """
    got = digits_of(value, max(places, _needed_places(value) or 0))
    if got is None or value < 0:
        return None
    digits, whole = got
    whole_value = 0
    for d in digits[:whole]:
        whole_value = whole_value * _BASE + d
    groups = [whole_value] + digits[whole:]
    try:
        if notation in ("greek", "greek-ascending", "greek-documentary", "greek-astronomical"):
            from ..notations.greek.build import letter_text
            # Astronomical texts type the zero as a plain omicron; elsewhere ō is unambiguous.
            zero = "ο" if notation == "greek-astronomical" else "\u014d"
            text = " ".join(letter_text(g) if g else zero for g in groups)
        elif notation in ("abjad", "abjad-maghribi"):
            from ..notations.abjad import _spell
            if 0 in groups:
                return None
            text = " ".join("".join(_spell(notation, g)) for g in groups)
        elif notation == "roman":
            if len(groups) > 1:
                return None
            text = _roman(groups[0])
        else:
            return None
        from ..reader import read
        if read(text, notation=notation).value != value:
            return None
    except Exception:   # a writer the notation does not offer: sexagesimal instead
        return None
    return text


def _roman(n: int) -> str:
    """A whole number in Roman numerals (subtractive forms, common practice).

    >>> _roman(1994)
    'MCMXCIV'
    """
    out = []
    for v, sym in ((1000, "M"), (900, "CM"), (500, "D"), (400, "CD"), (100, "C"), (90, "XC"),
                   (50, "L"), (40, "XL"), (10, "X"), (9, "IX"), (5, "V"), (4, "IV"), (1, "I")):
        while n >= v:
            out.append(sym)
            n -= v
    return "".join(out)


def _aligned(value: Fraction, places: int, floating: bool) -> dict[int, int] | None:
    """Place exponent -> digit, for comparing two values place by place."""
    if floating:
        m = mantissa(value)
        if m is None:
            return None
        digits, whole = digits_of(m, 0)
        return {whole - 1 - i: d for i, d in enumerate(digits)}
    got = digits_of(value, places)
    if got is None:
        return None
    digits, whole = got
    return {whole - 1 - i: d for i, d in enumerate(digits)}


def _sequence(value: Fraction, places: int, floating: bool) -> list[int] | None:
    if floating:
        m = mantissa(value)
        return None if m is None else digits_of(m, 0)[0]
    got = digits_of(value, places)
    return None if got is None else got[0]


def classify(written: Fraction, expected: Fraction, *, places: int = 0, floating: bool = False,
             notation: str = "sexagesimal", longitude: bool = False,
             prev: Fraction | None = None, neighbours: tuple[Fraction | None, ...] = (),
             special: Diagnosis | None = None, written_digits: list[int] | None = None,
             modulus: Fraction | None = None) -> Diagnosis:
    """Name the slip that turns *expected* into *written*, by its signature.

    *places* is the number of fractional places of the cell; *prev* the value
    the scribe computed from (the line before, for a carry); *neighbours* the
    values around the cell (the lines above and below, the cells beside it);
    *special* a scheme's own diagnosis (a missed turn, a zone boundary), which
    wins when given; *modulus* the cycle of a longitude (360), so that a step
    past the end of the circle still counts as an addition.  ``unexplained`` when no signature fits.

    >>> classify(Fraction(1801, 60), Fraction(1800, 60), places=1).kind
    'unit-slip'
    """
    written, expected = Fraction(written), Fraction(expected)
    if special is not None:
        return special
    diff = written - expected
    if longitude and diff % 360 in (30, 330):
        sign = "+" if diff % 360 == 30 else "-"
        return Diagnosis("sign-error", f"off by {sign}30°: the sign was not advanced or advanced wrongly")
    own_places = max(places, _needed_places(written) or 0)
    places = max(own_places, _needed_places(expected) or 0)
    w = _aligned(written, places, floating)
    e = _aligned(expected, places, floating)
    if w is not None and e is not None and not floating or (floating and w and e and len(w) == len(e)):
        one = _one_place(w, e)
        if one is not None:
            k, dw = one
            what = _place_label(k, floating)
            if prev is not None and abs(dw) == 1 and not floating:
                carry = _carry_kind(prev, expected, written, k, modulus)
                if carry is not None:
                    return carry
            if abs(dw) in (1, 10) and notation.startswith(_LETTER_SCRIPTS):
                # In a script of letters a slip of one or ten is first a letter
                # confusion when the table of look-alikes knows it.
                alt = _letter(notation, w.get(k, 0), e.get(k, 0))
                if alt is not None:
                    return alt
            if abs(dw) == 1:
                return Diagnosis("unit-slip", _digit_reason(notation, 1, dw, what, w.get(k, 0), e.get(k, 0)))
            if abs(dw) == 10:
                return Diagnosis("ten-slip", _digit_reason(notation, 10, dw, what, w.get(k, 0), e.get(k, 0)))
            if notation not in ("sexagesimal", "cuneiform"):
                alt = _letter(notation, w.get(k, 0), e.get(k, 0))
                if alt is not None:
                    return alt
        else:
            if prev is not None and not floating:
                carry = _carry_kind(prev, expected, written, None, modulus)
                if carry is not None:
                    return carry
            ripple = _rippled(diff, floating)
            if ripple is not None:
                return ripple
    if not floating and expected != 0 and written in (expected * _BASE, expected / _BASE):
        return Diagnosis("place-shift", "the value is written one place off (×60 or ÷60)")
    ws = written_digits if written_digits is not None else _sequence(written, own_places, floating)
    for es in _expected_sequences(expected, places, floating):
        if ws is None or es is None:
            continue
        shape = _shape(ws, es)
        if shape is not None:
            return shape
    for n in neighbours:
        if n is not None and n == written:
            return Diagnosis("copied-neighbour", "the value of a neighbouring cell was copied")
    if notation not in ("sexagesimal", "cuneiform"):
        alt = _letter(notation, written, expected)
        if alt is not None:
            return alt
    if expected != 0 and written in (2 * expected, expected / 2, expected * expected):
        what = {2 * expected: "the double", expected / 2: "the half",
                expected * expected: "the square"}[written]
        return Diagnosis("intermediate-value", f"{what} of the value due (a worksheet value copied)")
    return Diagnosis("unexplained", "no known slip turns the value due into the one written")


def _rippled(diff: Fraction, floating: bool) -> Diagnosis | None:
    """±1 or ±10 units of one place whose carry ran on into the places above."""
    if floating or diff == 0:
        return None
    for k in range(-10, 6):
        unit = Fraction(_BASE) ** k
        for size, kind, what in ((1, "unit-slip", "unit"), (10, "ten-slip", "ten")):
            if abs(diff) == size * unit:
                more = "too many" if diff > 0 else "too few"
                return Diagnosis(kind, f"one {what} {more} in {_place_label(k, False)} "
                                       "(the carry ran on into the place above)")
    return None


def _place_label(k: int, floating: bool) -> str:
    if floating:
        return f"the place {k + 1} from the end" if k else "the last place"
    if k == 0:
        return "the units place"
    if k > 0:
        return f"the place 60^{k}"
    return {-1: "the first fractional place", -2: "the second fractional place",
            -3: "the third fractional place"}.get(k, f"the place 60^{k}")


def _one_place(w: dict[int, int], e: dict[int, int]) -> tuple[int, int] | None:
    keys = set(w) | set(e)
    differ = [k for k in keys if w.get(k, 0) != e.get(k, 0)]
    if len(differ) != 1:
        return None
    k = differ[0]
    return k, w.get(k, 0) - e.get(k, 0)


def _carry_kind(prev: Fraction, expected: Fraction, written: Fraction, k: int | None,
                modulus: Fraction | None = None) -> Diagnosis | None:
    """A carry dropped or doubled: ±1 in one place where the sum carried into it."""
    diff = written - expected
    step = expected - prev
    if modulus:
        step %= modulus
        if step > modulus / 2:
            step -= modulus
    for place in ([k] if k is not None else range(-8, 4)):
        unit = Fraction(_BASE) ** place
        if abs(diff) != unit:
            continue
        if step > 0:
            carried = (prev % unit) + (step % unit) >= unit
            if carried and diff < 0:
                return Diagnosis("carry", f"the carry into {_place_label(place, False)} was dropped")
            if carried and diff > 0:
                return Diagnosis("carry", f"the carry into {_place_label(place, False)} was added twice")
        elif step < 0:
            borrowed = (prev % unit) < ((-step) % unit)
            if borrowed and diff > 0:
                return Diagnosis("carry", f"the borrow from {_place_label(place, False)} was dropped")
            if borrowed and diff < 0:
                return Diagnosis("carry", f"the borrow from {_place_label(place, False)} was taken twice")
    return None


def _expected_sequences(expected, places, floating):
    seen = []
    for p in ([places] if floating else [_needed_places(expected) or places, places]):
        s = _sequence(expected, p, floating)
        if s is not None and s not in seen:
            seen.append(s)
    return seen


def _shape(ws: list[int], es: list[int]) -> Diagnosis | None:
    """Merged, split or dropped/inserted empty places, from the digit strings."""
    if len(ws) == len(es) - 1:
        for i in range(len(es) - 1):
            if ws == es[:i] + [es[i] + es[i + 1]] + es[i + 2:] and es[i] and es[i + 1]:
                return Diagnosis("merged-places", f"the places {es[i]} and {es[i + 1]} were written "
                                                  f"as one place {es[i] + es[i + 1]}")
        for i in range(1, len(es) - 1):
            if es[i] == 0 and ws == es[:i] + es[i + 1:]:
                return Diagnosis("dropped-zero", "an empty (zero) place inside the number was left out")
    if len(ws) == len(es) + 1:
        for i in range(len(ws) - 1):
            if es == ws[:i] + [ws[i] + ws[i + 1]] + ws[i + 2:] and ws[i] and ws[i + 1]:
                return Diagnosis("split-place", f"the place {es[i]} was split into two places "
                                                f"{ws[i]} and {ws[i + 1]}")
        for i in range(1, len(ws) - 1):
            if ws[i] == 0 and es == ws[:i] + ws[i + 1:]:
                return Diagnosis("dropped-zero", "an empty (zero) place was inserted inside the number")
    return None


#: Scripts that write numbers with letters (a slip of one or ten is a letter there).
_LETTER_SCRIPTS = ("greek", "abjad", "hebrew")
#: Notations of wedges and corners (cuneiform, its transcriptions and ATF).
_WEDGE_SCRIPTS = ("sexagesimal", "cuneiform", "atf")


def _digit_reason(notation: str, size: int, dw: int, what: str, written: int, expected: int) -> str:
    """A slip of one or ten in one place, in the script's own terms.

    Wedges and corners for cuneiform (and its modern transcription); letters
    for the Greek alphabetic numerals; the digits otherwise.

    >>> _digit_reason("sexagesimal", 10, 10, "the first fractional place", 25, 15)
    'one ten-corner too many in the first fractional place'
    >>> _digit_reason("greek", 10, 10, "the first fractional place", 25, 15)
    'the tens letter κ written for ι in the first fractional place (one ten too many)'
    """
    more = "too many" if dw > 0 else "too few"
    if notation.startswith(_WEDGE_SCRIPTS):
        sign = "unit wedge" if size == 1 else "ten-corner"
        return f"one {sign} {more} in {what}"
    if notation.startswith("greek"):
        try:
            from ..notations.greek.build import letter_text
        except ImportError:
            letter_text = None
        if letter_text is not None:
            def part(n: int) -> str:
                n = n % 10 if size == 1 else (n // 10) * 10
                return letter_text(n) if n else "no letter"
            rank = "units" if size == 1 else "tens"
            return (f"the {rank} letter {part(written)} written for {part(expected)} in {what} "
                    f"(one {'unit' if size == 1 else 'ten'} {more})")
    return f"{written} written for {expected} in {what} (one {'unit' if size == 1 else 'ten'} {more})"


def _letter(notation: str, written, expected) -> Diagnosis | None:
    try:
        from .confusions import letter_confusion
    except ImportError:
        return None
    try:
        alt = letter_confusion(notation, written, expected)
    except Exception:
        return None
    if alt is None:
        return None
    return Diagnosis("letter-confusion", alt.reason)
