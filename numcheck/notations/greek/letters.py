"""The values of the Greek alphabetic (Milesian) numeral letters, and spelling.

Kept in code: the table fits on one screen and is the standard one (Heath, *A
History of Greek Mathematics* I (1921) p. 36; Unicode NamesList for the
variant letters stigma, digamma, koppa, sampi).  Variants map to one value:
6 is stigma ϛ, also typed as final sigma ς or digamma ϝ; 90 is koppa ϟ or the
archaic ϙ; 900 is sampi ϡ or the archaic ͳ; 200 is σ or the lunate ϲ of
papyrus editions.  Precomposed letters with a macron (ᾱ ῑ ῡ) are the letter
with a numeral bar.
"""

from __future__ import annotations

__all__ = ["LETTER_VALUES", "CANONICAL", "letter_value", "exponent", "spell_parts"]

_LOWER = {
    "α": 1, "β": 2, "γ": 3, "δ": 4, "ε": 5, "ϛ": 6, "ς": 6, "ϝ": 6, "ζ": 7, "η": 8, "θ": 9,
    "ι": 10, "κ": 20, "λ": 30, "μ": 40, "ν": 50, "ξ": 60, "ο": 70, "π": 80, "ϟ": 90, "ϙ": 90,
    "ρ": 100, "σ": 200, "ϲ": 200, "τ": 300, "υ": 400, "φ": 500, "χ": 600, "ψ": 700, "ω": 800,
    "ϡ": 900, "ͳ": 900,
    "ᾱ": 1, "ῑ": 10, "ῡ": 400,  # NFC composes the letter and a combining macron
}
_UPPER = {
    "Α": 1, "Β": 2, "Γ": 3, "Δ": 4, "Ε": 5, "Ϛ": 6, "Ϝ": 6, "Ζ": 7, "Η": 8, "Θ": 9,
    "Ι": 10, "Κ": 20, "Λ": 30, "Μ": 40, "Ν": 50, "Ξ": 60, "Ο": 70, "Π": 80, "Ϟ": 90, "Ϙ": 90,
    "Ρ": 100, "Σ": 200, "Ϲ": 200, "Τ": 300, "Υ": 400, "Φ": 500, "Χ": 600, "Ψ": 700, "Ω": 800,
    "Ϡ": 900, "Ͳ": 900,
    "Ᾱ": 1, "Ῑ": 10, "Ῡ": 400,
}

#: Every letter numcheck reads as a numeral, lower and upper case, and its value.
LETTER_VALUES: dict[str, int] = {**_LOWER, **_UPPER}

#: The letter numcheck writes for each value (lower case, stigma, koppa ϟ, sampi ϡ).
CANONICAL: dict[int, str] = {
    1: "α", 2: "β", 3: "γ", 4: "δ", 5: "ε", 6: "ϛ", 7: "ζ", 8: "η", 9: "θ",
    10: "ι", 20: "κ", 30: "λ", 40: "μ", 50: "ν", 60: "ξ", 70: "ο", 80: "π", 90: "ϟ",
    100: "ρ", 200: "σ", 300: "τ", 400: "υ", 500: "φ", 600: "χ", 700: "ψ", 800: "ω", 900: "ϡ",
}

#: Letters written with a bar already composed in (NFC): they carry a numeral bar.
BARRED = frozenset("ᾱῑῡᾹῙῩ")


def letter_value(ch: str) -> int | None:
    """The value of one numeral letter, or None.

    >>> letter_value("ϟ"), letter_value("ς"), letter_value("x")
    (90, 6, None)
    """
    return LETTER_VALUES.get(ch)


def exponent(value: int) -> int:
    """The power of ten of a letter value (units 0, tens 1, hundreds 2).

    >>> exponent(300)
    2
    """
    e = 0
    while value >= 10:
        value //= 10
        e += 1
    return e


def spell_parts(n: int) -> list[tuple[int, int, int]]:
    """Split a whole number into its letters: ``(exponent, letter value, multiplier)``.

    The exponent is the power of ten the letter stands for in the number
    (thousands are a units letter times 1000, myriads a count times 10000);
    largest first, zeros left out.

    >>> spell_parts(1670)
    [(3, 1, 1000), (2, 600, 1), (1, 70, 1)]
    >>> spell_parts(20000)
    [(4, 2, 10000)]
    """
    out = []
    for k in range(len(str(n)) - 1, -1, -1):
        d = (n // 10**k) % 10
        if not d:
            continue
        myriads, k4 = divmod(k, 4)
        mult = 10 ** (4 * myriads)
        if k4 == 3:
            out.append((k, d, 1000 * mult))
        else:
            out.append((k, d * 10**k4, mult))
    return out
