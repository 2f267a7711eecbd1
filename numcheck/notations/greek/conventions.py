"""The conventions of Greek numerals that differ between kinds of text.

Two kinds of edition write the same letters with different meanings:

* **Astronomical texts** (Ptolemy's tables and their digital editions) type
  the zero as a plain omicron ``ο``: the zero sign is a small circle with a
  bar (Cajori, *A History of Mathematical Notations* I §43), Heiberg's
  Almagest prints it without the bar (Cajori §44), and recognised or typed
  texts have ``ο``.  The solar daily motion is ``ο νθ η ιζ ιγ ιβ λα``
  (0;59,8,17,13,12,31), while the chord of 72° in the same text is
  ``ο λβ γ`` (70;32,3), where ``ο`` is seventy.
* **Documentary papyri** as the Duke Databank of Documentary Papyri edits
  them (papyri.info) write thousands as a capital letter: ``Γ`` alone is
  3000 and ``Αξδ`` is 1064, as the accounts' own totals show (common
  practice of those editions); a leading apostrophe stands for the lower
  numeral sign ``͵`` (``'Αωϙγ`` = 1893).

The notation ``greek`` knows both and keeps a reading open where the text
alone cannot decide: a lone ``ο`` in the whole-number place is a slot with
the values {0, 70}, a lone capital units letter a slot with {n, 1000 n},
each with a note saying why; ``identify``, ``restore`` and the audit then
choose by the evidence.  ``greek-astronomical`` and ``greek-documentary``
fix the convention for a whole file.  In a sexagesimal place ``ο`` is always
the zero (70 cannot stand there), and a capital units letter before small
letters is always thousands (no other reading gives a number).
"""

from __future__ import annotations

from .letters import exponent
from .model import Item

__all__ = ["GENERIC", "ASTRONOMICAL", "DOCUMENTARY", "CONVENTIONS", "lone_letter", "capital_thousands"]

GENERIC = "generic"
ASTRONOMICAL = "astronomical"
DOCUMENTARY = "documentary"
#: The conventions and the notation name that fixes each.
CONVENTIONS = {GENERIC: "greek", ASTRONOMICAL: "greek-astronomical", DOCUMENTARY: "greek-documentary"}

_OMICRON_WHY = ("'ο' is seventy, or the zero as digital texts of Greek tables type it (Heiberg's "
                "Almagest prints the zero without its bar, Cajori, A History of Mathematical "
                "Notations I §44)")


def lone_letter(item: Item, group_text: str, convention: str, places: bool,
                notes: list, alone: bool = True) -> tuple[tuple[int, ...], str] | None:
    """The values of a whole part written as one letter, when its convention matters.

    Returns ``(values, role)`` or None for an ordinary letter.  *places* says
    that sexagesimal places follow the whole part, *alone* that nothing
    follows it (a capital is thousands only standing alone: ``Ϛ ∠ʹ`` in an
    astronomical text is 6 1/2).
    """
    if item.thousands or item.value is None:
        return None
    value = int(item.value)
    if value == 70 and item.char in "οΟ":
        if convention == DOCUMENTARY:
            return None
        if convention == ASTRONOMICAL:
            notes.append(f"{group_text!r} read as the zero (notation greek-astronomical): "
                         "astronomical texts type the zero as a plain omicron")
            return (0,), "omicron"
        notes.append(f"{group_text!r} may be 0 or 70: {_OMICRON_WHY}; both readings are kept "
                     "(--notation greek-astronomical reads it as 0, greek-documentary as 70)")
        return (0, 70), "omicron"
    if item.char.isupper() and exponent(value) == 0 and alone:
        if convention == ASTRONOMICAL:
            return None
        if convention == DOCUMENTARY:
            notes.append(f"{group_text!r} read as {value * 1000} (notation greek-documentary): "
                         "documentary editions write thousands as a lone capital letter")
            return (value * 1000,), "capital"
        notes.append(f"{group_text!r} may be {value} or {value * 1000}: documentary editions write "
                     f"thousands as a lone capital letter ({group_text} = {value * 1000}); both "
                     "readings are kept (--notation greek-documentary reads it as thousands)")
        return (value, value * 1000), "capital"
    return None


def capital_thousands(positions: list[Item], exps: dict[int, int], notes: list) -> list[int]:
    """The positions of capital units letters written before small letters: thousands.

    ``Αξδ`` is 1064 in documentary editions (a capital before the hundreds,
    tens or units written small); read any other way the letters break the
    order of ranks.
    """
    out = []
    for k, e in exps.items():
        it = positions[k]
        if e != 0 or it.kind != "letter" or it.thousands or not it.char.isupper():
            continue
        later = [p for p in positions[k + 1:] if p.kind == "letter"]
        if later and all(p.char.islower() for p in later):
            out.append(k)
            notes.append(f"{it.char!r} before small letters read as thousands "
                         f"(͵{it.char.lower()} = {int(it.value) * 1000}): documentary editions write "
                         "thousands as a capital letter")
    return out
