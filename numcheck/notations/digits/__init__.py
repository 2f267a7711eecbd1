"""Numbers written in the decimal digits of another script, read as in the notation of modern scholarship.

Arabic-Indic digits (U+0660..U+0669, ``arabic-indic``), their Persian forms
(EXTENDED ARABIC-INDIC DIGIT, U+06F0..U+06F9, ``persian``) and the Devanagari
digits (U+0966..U+096F, ``devanagari``) stand one for one for 0..9 (the UCD's
decimal values; tests/test_against_unicode_numbers.py).  A number is a whole
number (a yuga's ١٥٧٧٩١٧٥٠٠ days) or places written as in sexagesimal
notation, with ``,`` between places and ``;`` after the units (the Arabic
comma U+060C and semicolon U+061B too), and the same damage marks.

How it reads (a choice, documented here): each digit is mapped to its ASCII
digit, keeping every position, and the text is read with the sexagesimal
grammar (``grammars/sexagesimal.lark``), so damage, limits and errors are
those of :mod:`numcheck.notations.sexagesimal`; errors point at the original
text.  Writing back maps the digits back to the script; the separators are
written in the forms the text used.  An underdot is written back as ``?``
(its canonical form; in Arabic script ``?`` is the only doubt mark,
conventions.md §1.2).
"""

from __future__ import annotations

from dataclasses import dataclass, replace
from fractions import Fraction

from ...errors import NumcheckRangeError, NumcheckSyntaxError
from ...reading import Reading
from .. import sexagesimal

__all__ = ["Script", "SCRIPTS", "parse_in", "format_in", "script_of"]


@dataclass(frozen=True)
class Script:
    """One script's digits and the separators it may use."""

    name: str          # the notation name
    label: str         # for messages
    zero: int          # code point of its digit zero
    comma: str = ","   # its own place separator, if any
    semicolon: str = ";"

    def digit(self, ch: str) -> int | None:
        offset = ord(ch) - self.zero
        return offset if 0 <= offset <= 9 else None


#: The scripts, by notation name (code points from the Unicode Standard, ch. 9 and 12).
SCRIPTS: dict[str, Script] = {
    "arabic-indic": Script("arabic-indic", "Arabic-Indic", 0x0660, "\u060c", "\u061b"),
    "persian": Script("persian", "Persian (extended Arabic-Indic)", 0x06F0, "\u060c", "\u061b"),
    "devanagari": Script("devanagari", "Devanagari", 0x0966),
}


def script_of(ch: str) -> Script | None:
    """The script whose digit *ch* is, if any."""
    for script in SCRIPTS.values():
        if script.digit(ch) is not None:
            return script
    return None


def _to_ascii(text: str, script: Script) -> str:
    """The text with the script's digits and separators as ASCII; every position kept."""
    out = []
    for i, ch in enumerate(text):
        d = script.digit(ch)
        if d is not None:
            out.append(str(d))
            continue
        other = script_of(ch)
        if other is not None or "0" <= ch <= "9":
            found = other.label if other is not None else "ASCII"
            own = next((c for c in text if script.digit(c) is not None), None)
            first = (f" (the first {script.label} digit is {own!r}, U+{ord(own):04X})" if own
                     else f" (no {script.label} digit at all)")
            raise NumcheckSyntaxError(
                f"Cannot read {text!r} as {script.label} digits: a digit of another script ({found})"
                f"{first}", text, i,
                expected=f"{script.label} digits only (or --notation {other.name if other else 'sexagesimal'})")
        out.append("," if ch == script.comma else ";" if ch == script.semicolon else ch)
    return "".join(out)


def parse_in(text: str, script: Script) -> Reading:
    """Read *text* written in *script*'s digits."""
    plain = _to_ascii(text, script)
    try:
        reading = sexagesimal.parse(plain, notation=script.name)
    except NumcheckSyntaxError as err:
        reason = err.reason.replace(repr(plain), repr(text)).replace(
            "as a sexagesimal number", f"as {script.label} digits").replace(
            "not part of sexagesimal notation", "not part of a number in these digits")
        raise NumcheckSyntaxError(reason, text, err.position, expected=err.expected) from None
    except NumcheckRangeError as err:
        message = str(err).split("\n")[0].split(" (column")[0]
        if err.legal and message.endswith(f" The legal range is {err.legal}."):
            message = message[: -len(f" The legal range is {err.legal}.")]
        raise NumcheckRangeError(message.replace(repr(plain), repr(text)), value=err.value,
                                 legal=err.legal, text=text if err.position is not None else None,
                                 position=err.position) from None
    slots = tuple(replace(s, text=text[s.span[0]:s.span[1]]) for s in reading.slots)
    return replace(reading, text=text, slots=slots)


def format_in(reading: Reading, script: Script, choice: tuple[Fraction, ...] | None = None) -> str:
    """Write *reading* back in *script*'s digits (separators as the text wrote them)."""
    plain = sexagesimal.format(replace(reading, notation=sexagesimal.NAME), choice)
    own_comma = script.comma != "," and script.comma in reading.text
    own_semi = script.semicolon != ";" and script.semicolon in reading.text
    out = []
    for ch in plain:
        if "0" <= ch <= "9":
            out.append(chr(script.zero + int(ch)))
        elif ch == "," and own_comma:
            out.append(script.comma)
        elif ch == ";" and own_semi:
            out.append(script.semicolon)
        else:
            out.append(ch)
    return "".join(out)
