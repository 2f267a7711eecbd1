"""Choose a notation from the characters of a text, and say why.

The rules, in the order they are tried (each names the evidence that decided):

1. Unicode cuneiform numeric signs (U+12400 block, DIŠ, MIN, U, U U, U U U)
   -> ``cuneiform``.
1a. ATF transliterations -> ``atf``: a CDLI grapheme ``COUNT(SIGN)``
   (``3(u)``, ``n(disz)``, ``1/2(disz)``), or Oracc's mathematical style:
   places joined by ``.`` with two digits after each dot (``1.40``, ``1.03``;
   ``29.5`` is not taken for it), a number glued to a logogram
   (``43.KAM₂``, ``15-KAM₂``), hundreds ``1 ME 43``.
2. Hebrew letters -> ``hebrew``.
2b. Arabic-script letters -> ``abjad`` (eastern order; ``--notation
   abjad-maghribi`` for the western values).
3. An Attic acrophonic sign (U+10140..U+10174) or the ASCII fallback of a
   combined sign (``Π(Δ)``) -> ``attic``.
4. Greek letters, the zero sign or Greek fraction signs (also written as
   their code point, ``U+2220``) -> ``greek``; except
   a number written only in the capitals Ι Π Γ Δ Η Χ Μ, which may be Attic:
   a repeated sign (ΔΔ, ΙΙΙ) points to Attic (alphabetic numerals never
   repeat a letter), and so does an order that is Attic (largest first) but
   not alphabetic; otherwise alphabetic, and the reason says Attic was possible.
4b. Arabic-Indic, Persian (extended Arabic-Indic) or Devanagari digits ->
   ``arabic-indic``, ``persian`` or ``devanagari``.
5. Roman numeral letters (I V X L C D M, j) or the Unicode Number Forms
   (U+2160 block), with no digits -> ``roman``; but a lone small ``x`` or an
   ``x`` with Leiden marks (``[x]``, ``x,x``) is an unread sexagesimal place.
5b. Latin letters that are all IAST letters of syllables (consonants and
   their vowels, khyughṛ), not only Roman numeral letters -> ``aryabhata``
   when the text is a whole number of syllables or carries an IAST diacritic.
6. Digits: with ``,`` or ``;`` -> ``sexagesimal``; groups separated by spaces
   with no ``;`` -> ``cuneiform`` (the magnitude floats); plain digits ->
   ``sexagesimal`` (one place, an integer).

``--notation`` overrides all of this.
"""

from __future__ import annotations

import re
import unicodedata

from .digits import script_of

__all__ = ["detect_notation", "ATTIC_CAPITALS"]

#: Greek capitals that are also Attic acrophonic signs (Γ is the older five).
ATTIC_CAPITALS = frozenset("ΙΠΓΔΗΧΜ")
_ATTIC_VALUES = {"Ι": 1, "Π": 5, "Γ": 5, "Δ": 10, "Η": 100, "Χ": 1000, "Μ": 10000}
_ALPHA_VALUES = {"Ι": 10, "Π": 80, "Γ": 3, "Δ": 4, "Η": 8, "Χ": 600, "Μ": 40}
_ATTIC_ASCII = re.compile(r"[ΠP]\([ΔΗΧΜDHXM]\)")
_GREEK_SIGNS = frozenset("\U0001018A\u014d\u0375\u2220") | frozenset(
    chr(c) for c in (0x10175, 0x10176, 0x10177, 0x10178, 0x1018B))
_ROMAN = frozenset("IVXLCDMJivxlcdmj")
_ATF_GRAPHEME = re.compile(r"(?:[0-9]+|[nN]|[nN]\+[0-9]+|[0-9]+/[0-9]+)\([^()\s]+\)")
_ATF_MATH = re.compile(r"(?<![\w.,;])[\[<]*[0-9]+(?:@v)?[\]#?!*>]*"
                       r"(?:\.:?[\[<]*[0-9]{2}(?:@v)?[\]#?!*>]*)+(?![\w.,;])"
                       r"|[0-9]+[.-](?:KAM|KÁM|kam|KAM₂|en|et|TA)\b"
                       r"|\b[0-9]+ (?:ME|LIM)(?: [0-9]+)?\b")
# The half sign and the Greek numeral signs as a converter writes them (U+2220 for ∠).
_CODE_POINT_SIGN = re.compile(r"[Uu]\+(?:2220|0374|0375|1018[AaBb]|1017[5-8])")
_DIGIT_GROUPS = re.compile(r"[0-9xXn\]?>⟩}\u0323]\s+[0-9xXn\[<⟨{]")
_PLAIN_SEXAGESIMAL = re.compile(r"-?[0-9]+(?:,[0-9]+)*(?:;[0-9]+(?:,[0-9]+)*)?")
_SEPARATED = "digits with sexagesimal separators (',' between places, ';' after the units)"
_ONE_PLACE = "plain digits with no separator: one place, an integer"
# What a transliterated cuneiform number is made of (digits, x, n, Leiden marks).
_CUNEIFORM_CHARS = re.compile(r"[0-9xXn\[\]<>⟨⟩{}?\u0323\s]+")


#: Cuneiform signs outside the numeric block that write digits: DIŠ, MIN, U, U U, U U U.
_CUNEIFORM_DIGITS = frozenset("\U00012079\U0001222B\U0001230B\U00012399\U0001230D")


def _name(ch: str) -> str:
    return unicodedata.name(ch, f"U+{ord(ch):04X}")


def _is_greek_letter(ch: str) -> bool:
    return unicodedata.category(ch).startswith("L") and _name(ch).startswith("GREEK")


def _is_arabic_letter(ch: str) -> bool:
    cp = ord(ch)
    in_block = 0x0600 <= cp <= 0x06FF or 0x0750 <= cp <= 0x077F or 0xFB50 <= cp <= 0xFDFF or 0xFE70 <= cp <= 0xFEFF
    return in_block and unicodedata.category(ch).startswith("L")


def detect_notation(text: str) -> tuple[str, str]:
    """Return ``(notation name, reason)`` for *text* (already NFC).

    >>> detect_notation("1,49,45;20")[0]
    'sexagesimal'
    >>> detect_notation("κθ λα ν η κ")
    ('greek', 'Greek letters (alphabetic numerals)')
    >>> detect_notation("ΔΔΙΙ")[0]
    'attic'
    """
    if text.isascii() and _PLAIN_SEXAGESIMAL.fullmatch(text):   # rule 6 at once, the usual case
        return "sexagesimal", _SEPARATED if ("," in text or ";" in text) else _ONE_PLACE
    cuneiform = [c for c in text if 0x12400 <= ord(c) <= 0x1247F or c in _CUNEIFORM_DIGITS]
    if cuneiform:
        return "cuneiform", f"Unicode cuneiform numeric signs ({_name(cuneiform[0])})"
    grapheme = _ATF_GRAPHEME.search(text)
    if grapheme:
        return "atf", (f"an ATF numeral grapheme COUNT(SIGN) ({grapheme.group()}): CDLI-style "
                       "transliteration")
    math = _ATF_MATH.search(text)
    if math:
        return "atf", (f"ATF in Oracc's mathematical style ({math.group()}: places joined by '.', "
                       "a number glued to a logogram, or hundreds with ME)")
    hebrew = [c for c in text if 0x05D0 <= ord(c) <= 0x05EA]
    if hebrew:
        return "hebrew", f"Hebrew letters ({_name(hebrew[0])})"
    arabic = [c for c in text if _is_arabic_letter(c)]
    if arabic:
        return "abjad", ("Arabic-script letters (eastern abjad order; use --notation abjad-maghribi "
                         "for the western values)")
    attic = [c for c in text if 0x10140 <= ord(c) <= 0x10174]
    if attic:
        return "attic", f"an Attic acrophonic sign ({_name(attic[0])})"
    if _ATTIC_ASCII.search(text):
        return "attic", f"the ASCII form {_ATTIC_ASCII.search(text).group()} of a combined Attic sign"
    greek = [c for c in text if _is_greek_letter(c)]
    if greek:
        return _greek_or_attic(greek)
    if any(c in _GREEK_SIGNS for c in text):
        return "greek", "a Greek numeral sign (zero sign, fraction sign or lower numeral sign)"
    written = _CODE_POINT_SIGN.search(text)
    if written:
        return "greek", f"a Greek numeral sign written as its code point ({written.group()})"
    for c in text:
        script = script_of(c)
        if script is not None:
            return script.name, f"{script.label} digits ({_name(c)})"
    number_forms = [c for c in text if 0x2160 <= ord(c) <= 0x2188]
    if number_forms:
        return "roman", f"Unicode Roman numeral characters ({_name(number_forms[0])})"
    digits = any(c.isdigit() for c in text)
    letters = [c for c in text if c.isalpha()]
    if not digits and letters and set(letters) <= {"x", "X"} and (
            "x" in letters or any(c in text for c in "[],;?")):
        return "sexagesimal", ("only 'x' with Leiden marks: a place present but unread (for the "
                               "Roman ten use --notation roman)")
    if not digits and letters and all(c in _ROMAN for c in letters):
        return "roman", "the Latin letters of Roman numerals (I V X L C D M)"
    if not digits and letters and all(c in _IAST for c in letters) and _aryabhata_like(text):
        return "aryabhata", "IAST syllables (Āryabhaṭa's alphabetic numerals)"
    if digits:
        if "," in text or ";" in text:
            return "sexagesimal", _SEPARATED
        if _DIGIT_GROUPS.search(text) and _CUNEIFORM_CHARS.fullmatch(text):
            return "cuneiform", ("digit groups separated by spaces and no ';': a cuneiform number "
                                 "whose magnitude the text does not fix")
        return "sexagesimal", _ONE_PLACE
    return "sexagesimal", "no numeral letters or signs of another notation; read as sexagesimal"


_IAST = frozenset("aāiīuūṛṝḷḹeokgṅcjñṭḍṇtdnpbmyrlvśṣshx")
_IAST_MARKED = frozenset("āīūṛṝḷḹṅñṭḍṇśṣ")


def _aryabhata_like(text: str) -> bool:
    if any(c in _IAST_MARKED for c in text):
        return True
    from .aryabhata import parse
    from ..errors import NumcheckError
    try:
        parse(text)
    except NumcheckError:
        return False
    return True


def _greek_or_attic(letters: list[str]) -> tuple[str, str]:
    """Greek capitals that are all Attic signs may be either system: weigh the evidence."""
    if not all(c in ATTIC_CAPITALS for c in letters):
        return "greek", "Greek letters (alphabetic numerals)"
    repeated = next((a for a, b in zip(letters, letters[1:]) if a == b), None)
    if repeated is not None:
        return "attic", (f"capitals that are all Attic signs, with {repeated}{repeated} repeated: "
                         "alphabetic numerals never repeat a letter, Attic ones do")
    attic_order = all(_ATTIC_VALUES[a] >= _ATTIC_VALUES[b] for a, b in zip(letters, letters[1:]))
    alpha_order = all(_ALPHA_VALUES[a] > _ALPHA_VALUES[b] for a, b in zip(letters, letters[1:]))
    if len(letters) > 1 and attic_order and not alpha_order:
        return "attic", ("capitals that are all Attic signs, largest first as Attic numerals are "
                         "written, but out of alphabetic order")
    return "greek", ("Greek capitals read as alphabetic numerals; they are also Attic signs, so use "
                     "--notation attic if the text uses acrophonic numerals")
