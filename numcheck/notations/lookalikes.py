"""Characters from another script that look like the ones a notation uses.

A number pasted from a word processor, a PDF or another edition may hold a
character that looks right and is not: a Cyrillic ``Х`` for the Roman ``X``,
a Latin ``I`` among Greek Attic signs, the CJK angle bracket ``〈`` (U+3008)
that Unicode normalisation (NFC) makes of the old angle bracket U+2329.  The
reader names each such character with its code point, so that the editor
can find it in the source: an error where no notation could mean it
(Cyrillic letters), a warning where numcheck can read it safely (the angle
brackets are read as the editor's addition marks ⟨ ⟩; Latin capitals among
Attic signs as the Attic signs they stand for, which the Attic reader
allows as ASCII fallbacks).
"""

from __future__ import annotations

import unicodedata
import warnings

from ..errors import NumcheckSyntaxError, NumcheckWarning

__all__ = ["check_lookalikes", "check_attic_scripts", "describe"]

#: Cyrillic letters and the Latin and Greek letters they look like (Unicode
#: confusables, common practice of the trade: these are the ones that slip in).
CYRILLIC_LOOKALIKES: dict[str, str] = {
    "А": "AΑ", "В": "BΒ", "Е": "EΕ", "К": "KΚ", "М": "MΜ", "Н": "HΗ", "О": "OΟ", "Р": "PΡ",
    "С": "CϹ", "Т": "TΤ", "Х": "XΧ", "І": "IΙ", "Ј": "J", "а": "aα", "е": "eε", "о": "oο",
    "р": "pρ", "с": "cϲ", "х": "xχ", "і": "iι", "ј": "j", "у": "yγ", "к": "κ", "л": "λ", "п": "π",
    "Г": "Γ", "П": "Π", "Л": "Λ", "Ф": "Φ", "ѳ": "θ", "Ѳ": "Θ", "ѯ": "ξ", "ѱ": "ψ", "Ѱ": "Ψ",
}
#: Angle brackets read as the editor's addition marks ⟨ ⟩ (U+27E8, U+27E9).
#: NFC turns U+2329 and U+232A into U+3008 and U+3009, so the text reaches
#: the reader with the CJK brackets even when the editor typed the others.
ANGLE_BRACKETS: dict[str, tuple[str, str | None]] = {
    "\u3008": ("\u27e8", "\u2329"),
    "\u3009": ("\u27e9", "\u232a"),
}
#: Latin capitals that stand for Attic signs (the Attic reader's ASCII fallbacks).
_LATIN_ATTIC = {"I": "Ι", "P": "Π", "D": "Δ", "H": "Η", "X": "Χ", "M": "Μ"}


def describe(ch: str) -> str:
    """``'Х' (U+0425 CYRILLIC CAPITAL LETTER HA)``: a character as a message names it."""
    return f"{ch!r} (U+{ord(ch):04X} {unicodedata.name(ch, 'unnamed character')})"


def _script(ch: str) -> str | None:
    if not unicodedata.category(ch).startswith("L"):
        return None
    return unicodedata.name(ch, "").split(" ", 1)[0] or None


def check_lookalikes(text: str) -> str:
    """Refuse or flag look-alike characters in *text* (already NFC); return the text to parse.

    Raises :class:`~numcheck.errors.NumcheckSyntaxError` at a Cyrillic
    letter; warns (:class:`~numcheck.errors.NumcheckWarning`) and replaces the
    CJK angle brackets by ⟨ ⟩ (one character for one, so positions hold).
    """
    if text.isascii():      # neither a Cyrillic letter nor a CJK bracket
        return text
    for i, ch in enumerate(text):
        if _script(ch) == "CYRILLIC":
            like = CYRILLIC_LOOKALIKES.get(ch, "")
            hint = (" which looks like " + " or ".join(describe(c) for c in like)) if like else ""
            raise NumcheckSyntaxError(
                f"Cannot read {text!r}: a Cyrillic letter {describe(ch)}{hint}; no notation "
                "numcheck reads uses Cyrillic letters", text, i,
                expected=(f"the letter it looks like ({', '.join(like)})" if like
                          else "the characters of the number's own script"))
    if any(ch in ANGLE_BRACKETS for ch in text):
        for ch in sorted({c for c in text if c in ANGLE_BRACKETS}):
            mark, old = ANGLE_BRACKETS[ch]
            origin = f" (or {describe(old)}, which Unicode normalisation turns into it)" if old else ""
            warnings.warn(f"{text!r}: the CJK angle bracket {describe(ch)}{origin} is read as the "
                          f"editor's addition mark {describe(mark)}.", NumcheckWarning, stacklevel=3)
        text = "".join(ANGLE_BRACKETS[c][0] if c in ANGLE_BRACKETS else c for c in text)
    return text


def check_attic_scripts(text: str) -> None:
    """Warn when Latin capitals stand among Greek Attic signs (read as the signs they resemble)."""
    scripts = {_script(c) for c in text}
    if "GREEK" in scripts and "LATIN" in scripts:
        latin = sorted({c for c in text if c in _LATIN_ATTIC})
        if latin:
            named = ", ".join(f"{describe(c)} for {describe(_LATIN_ATTIC[c])}" for c in latin)
            warnings.warn(f"{text!r}: Latin capitals among Greek Attic signs, read as the Attic "
                          f"signs they resemble: {named}. Check the source for mixed scripts.",
                          NumcheckWarning, stacklevel=3)
