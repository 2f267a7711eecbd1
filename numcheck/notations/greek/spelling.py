"""What digital editions type in Greek numerals, turned into the signs the grammar reads.

Texts made by optical character recognition or by converters carry marks no
editor meant as part of a numeral: an accent or breathing left on a letter
(``μὲ``), the half sign written out as the text ``U+2220``, a full stop after
the number.  Each is taken away (or written as the sign it names) and said in
a note naming the character, so nothing is changed silently.  The strict
grammar then reads the result; this module never guesses a value.
"""

from __future__ import annotations

import re
import unicodedata

__all__ = ["clean", "degree_sign_as_zero", "ACCENTS", "CODE_POINT_SIGNS"]

#: Combining accents and breathings a recognised Greek text leaves on letters
#: (Unicode names: COMBINING GRAVE/ACUTE ACCENT, COMBINING DIAERESIS, COMBINING
#: COMMA ABOVE / REVERSED COMMA ABOVE (psili, dasia), COMBINING GREEK
#: PERISPOMENI, COMBINING GREEK YPOGEGRAMMENI, COMBINING BREVE).  The macron
#: and overline (a numeral bar) and the underdot (doubt) are marks numcheck reads.
ACCENTS = frozenset("\u0300\u0301\u0308\u0313\u0314\u0342\u0345\u0306\u0343\u0344")

#: Signs a converter may write as their code point (``U+2220`` for ∠), and the sign.
CODE_POINT_SIGNS = {
    0x2220: "∠", 0x0374: "\u02b9", 0x0375: "\u0375", 0x1018A: "\U0001018A",
    0x10175: "\U00010175", 0x10176: "\U00010176", 0x10177: "\U00010177",
    0x10178: "\U00010178", 0x1018B: "\U0001018B",
}
_CODE_POINT = re.compile(r"[Uu]\+([0-9A-Fa-f]{4,5})")
# Signs after which a final '.' cannot be an unread letter: a units letter
# with a letter before it, a numeral sign, a fraction sign, the zero sign.
_UNITS = frozenset("αβγδεϛςϝζηθΑΒΓΔΕϚϜΖΗΘ")
_CLOSED = frozenset("\u02b9'\u2019\u2032\u00b4\u02ca\u0384\u02bc∠\U00010175\U00010176\U00010177"
                    "\U00010178\U0001018B\U0001018Aō")


_GREEK_LETTER = re.compile(r"[\u0370-\u03FF\u1F00-\u1FFF]")


def degree_sign_as_zero(text: str) -> bool:
    """Whether *text* is a Greek numeral with a degree sign standing alone as a group.

    Digital texts of Greek tables type the zero sign as ``°`` (a small circle):
    ``κθ ° λ`` is 29;0,30, not a quantity in degrees.

    >>> degree_sign_as_zero("κθ ° λ"), degree_sign_as_zero("12;30°")
    (True, False)
    """
    groups = text.split()
    return "°" in groups and any(_GREEK_LETTER.search(g) for g in groups if g != "°")


def _name(ch: str) -> str:
    return f"{ch!r} (U+{ord(ch):04X} {unicodedata.name(ch, 'unnamed')})"


def clean(text: str) -> tuple[str, list[str]]:
    """The text with typed stand-ins replaced, and one note per kind of change.

    *text* is NFC.  The result is NFC too.

    >>> clean("κε U+2220ʹ")[0]
    'κε ∠ʹ'
    >>> clean("μὲ")[0]
    'με'
    >>> clean("ιε.")[0]
    'ιε'
    """
    notes: list[str] = []

    def code_point(m: re.Match) -> str:
        cp = int(m.group(1), 16)
        sign = CODE_POINT_SIGNS.get(cp)
        return sign if sign is not None else m.group(0)

    replaced = _CODE_POINT.sub(code_point, text)
    if replaced != text:
        found = sorted(set(m.group(0) for m in _CODE_POINT.finditer(text)
                           if int(m.group(1), 16) in CODE_POINT_SIGNS))
        notes.append(f"{', '.join(repr(f) for f in found)} read as the sign "
                     f"{' '.join(CODE_POINT_SIGNS[int(f[2:], 16)] for f in found)}: a converter wrote "
                     "the code point as text")
        text = replaced
    out = []
    stripped: list[str] = []
    for ch in text:
        if ch in ACCENTS:
            stripped.append(ch)
            continue
        parts = unicodedata.normalize("NFD", ch)
        if len(parts) > 1 and any(p in ACCENTS for p in parts[1:]):
            stripped.append(ch)
            out.append(unicodedata.normalize("NFC", "".join(p for p in parts if p not in ACCENTS)))
        else:
            out.append(ch)
    if stripped:
        names = ", ".join(_name(c) for c in dict.fromkeys(stripped))
        notes.append(f"the accents and breathings of {names} left out: they are no part of a "
                     "numeral (a recognised text often leaves them on the letters); the bare letters "
                     "were read")
        text = unicodedata.normalize("NFC", "".join(out))
    groups = text.split(" ")
    if "°" in groups:
        notes.append("'°' (U+00B0 DEGREE SIGN) standing alone in a group read as the zero sign 𐆊: "
                     "digital texts of Greek tables type the zero as a small circle")
        groups = ["\U0001018A" if g == "°" else g for g in groups]
        text = " ".join(groups)
    if any(g in ("o", "O") for g in groups):
        notes.append("'o' (U+006F LATIN SMALL LETTER O) standing alone in a group read as the Greek "
                     "omicron ο: recognised texts type the Greek zero or seventy with the Latin letter")
        text = " ".join("ο" if g == "o" else "Ο" if g == "O" else g for g in groups)
    body = text.rstrip(" ")
    if body.endswith("\u00b7"):   # GREEK ANO TELEIA (NFC: MIDDLE DOT) as punctuation
        body = body[:-1] + "."
    if body.endswith(".") and not body.endswith("..") and len(body) > 1:
        before = body[-2]
        group = body[:-1].split(" ")[-1]
        if before in _CLOSED or (before in _UNITS and len(group) > 1 and group[-2] not in "[<{͵."):
            mark = text.rstrip(" ")[-1]
            notes.append(f"the {'full stop' if mark == '.' else 'ano teleia ·'} after {body[:-1]!r} left "
                         f"out: no letter can stand after {before!r}, so it is punctuation, not an "
                         "unread letter")
            text = body[:-1]
    return text, notes
