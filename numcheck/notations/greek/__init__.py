"""Greek alphabetic (Milesian) numerals: ``͵αχο``, ``κθ λα ν η κ``, ``ϛφπε γʹ``.

The strict path only: this module reads what is written (letters, numeral
signs, the zero sign, fraction signs and the Leiden damage marks), marks what
is lost or doubtful, and writes a Reading back.  It never guesses what was
meant; :mod:`numcheck.slips.confusions` offers the alternatives to a doubtful letter.

What it accepts (letter values in :mod:`numcheck.notations.greek.letters`):

* Groups separated by spaces.  The first group is the whole part; a later
  group with a numeral sign (keraia) is a unit fraction (``γʹ`` = 1/3); a later
  group without one is the next sexagesimal place (DESIGN.md; ``κθ λα`` =
  29;31).  A later group of fraction signs only (``∠``) adds to the units.
* The numeral sign U+0374, its NFC form U+02B9, and what editors type for it
  (``'`` ``’`` ``′`` ``´`` ``ˊ`` and the tonos ``΄``); on the whole part it only
  marks the letters as a numeral.  Overlines and macrons (U+0305, U+0304,
  U+035E, ``¯``) mark a numeral and are dropped.
* ``͵`` (U+0375) before a units letter: thousands.  A units letter written
  just before a hundreds letter, or before lost letters, is read as
  thousands too, with a note: the EpiDoc Guidelines write 1670 as ``αχοʹ``.
* ``Μ`` (capital mu) in a number written in small letters is the myriad sign:
  the letters before it count the myriads (``βΜ`` = 20000), a ``Μ`` with no
  count before it is one myriad, the letters after it are added.  In a number
  written in capitals ``Μ`` is the letter mu (40).
* The zero sign 𐆊 U+1018A (or ``ō``), standing alone in its group; in a
  sexagesimal place a lone barred omicron ``ο̄`` is read as zero with a
  warning (the Byzantine form, Cajori §43), since 70 cannot stand there.
* Fraction signs 𐅵 𐅶 (1/2), 𐅷 (2/3), 𐅸 (3/4), 𐆋 (1/4), ``∠`` (1/2) after the
  letters of a group.
* Damage: ``[.]`` one lost letter, ``[..]`` two, ``[...]`` an unknown number;
  ``.`` outside brackets a letter present but not read; ``[η]`` a letter
  restored by the editor; ``<η>`` added; ``{η}`` superfluous; an underdot
  (U+0323) or ``?`` after a letter marks it doubtful.

Letters stand in descending order (larger first).  A lost letter can only be
a letter of a rank that fits between its neighbours: ``ι[.]`` is 11..19.
Letters out of that order draw a warning; with ``ascending=True`` (notation
``greek-ascending``) the smaller-first order of some inscriptions is expected
instead (Heath, *A History of Greek Mathematics* I p. 36).
"""

from __future__ import annotations

import functools
import re
import unicodedata
import warnings as _warnings
from dataclasses import replace
from fractions import Fraction

from ...errors import LimitError, NumcheckSyntaxError, NumcheckWarning
from ..grammars import parser_for
from ... import limits
from ...reading import Reading, Slot, Status
from .build import group_slots, unread_mark_slot
from .quick import plain_letters_reading
from .writing import format, render
from .letters import BARRED, letter_value
from .conventions import CONVENTIONS, GENERIC
from .model import FRACTION_SIGNS, ZERO_SIGNS, fail, Item
from .spelling import clean

__all__ = ["NAME", "parse", "format", "render", "BAD_EXAMPLES", "FRACTION_SIGNS", "ZERO_SIGNS"]

NAME = "greek"

#: Known-bad inputs, the column (1-based) the error must point at, and the
#: plain-language label; the same table drives the tests (tests/test_greek.py).
BAD_EXAMPLES: list[tuple[str, int, str]] = [
    ("κo", 2, "a Latin 'o' inside a Greek numeral"),
    ("κθ λа", 5, "a Cyrillic letter inside a Greek numeral"),
    ("κθ λa", 5, "a Latin letter inside a Greek numeral (mixed scripts)"),
    ("κθ 31", 4, "a digit inside a Greek numeral (mixed notations)"),
    ("κθ,λα", 3, "a sexagesimal separator inside a Greek numeral"),
    ("ιͷ", 2, "a Greek letter that is not a numeral"),
    ("κλ", 2, "two letters of the same rank"),
    ("ιι", 2, "two letters of the same rank"),
    ("͵ι", 2, "the lower numeral sign before a letter that is not a units letter"),
    ("͵", 1, "the lower numeral sign with no letter after it"),
    ("αʹβ", 3, "a letter after the numeral sign"),
    ("κ𐆊", 2, "the zero sign with letters in the same place"),
    ("ι[.", 2, "a bracket opened and never closed"),
    ("ι]", 2, "a closing bracket with no opening bracket"),
    ("ι[[.]]", 3, "a bracket opened inside the same kind of bracket"),
    ("̣α", 1, "a doubt mark with no letter before it"),
    ("[.]..[.].", 2, "more lost letters than ranks left for them"),
    ("ι[.]α", 3, "more lost letters than ranks left for them"),
    ("κθ γʹ λ", 7, "a sexagesimal place after a fraction"),
    ("∠α", 2, "a letter after a fraction sign"),
    ("κ ι[...]]", 9, "a closing bracket with no opening bracket"),
    ("αΜβΜ", 4, "a second myriad sign"),
    ("κθ  ", 5, "the number ends too early"),
]


# -- errors -----------------------------------------------------------------

def _classify(ch: str) -> tuple[str, str]:
    """A label and an 'expected' hint for a character the grammar does not take."""
    name = unicodedata.name(ch, "")
    if ch in "oO":
        return ("a Latin 'o' inside a Greek numeral",
                "Greek omicron ο (U+03BF, 70) or the zero sign 𐆊 (U+1018A) or ō")
    if name.startswith("CYRILLIC"):
        return ("a Cyrillic letter inside a Greek numeral", "the Greek letter it looks like")
    if ch.isdigit():
        return ("a digit inside a Greek numeral (mixed notations)",
                "Greek numeral letters only, or the whole number in one notation")
    if name.startswith("LATIN"):
        return ("a Latin letter inside a Greek numeral (mixed scripts)",
                "Greek numeral letters (for an unread letter write '.')")
    if ch in ",;":
        return ("a sexagesimal separator inside a Greek numeral",
                "a space between Greek groups (κθ λα for 29;31)")
    if name.startswith("GREEK") and "WITH" in name:
        return ("a Greek letter with an accent or breathing",
                "the bare letter, and the numeral sign ʹ after the number")
    if name.startswith("GREEK") and ch.isalpha():
        return ("a Greek letter that is not a numeral",
                "the 24 letters, stigma ϛ, koppa ϟ or ϙ, sampi ϡ or ͳ")
    if not ch.isprintable():
        return ("a control character", "Greek numeral letters")
    return ("a character that is not part of Greek numerals",
            "Greek numeral letters, ͵ ʹ, the zero sign 𐆊, fraction signs, spaces between groups, "
            "or damage marks ([.] [...] . < > { } and an underdot)")


def _raise_from_lark(text: str, err):
    from lark.exceptions import UnexpectedCharacters

    if isinstance(err, UnexpectedCharacters):
        label, expected = _classify(text[err.pos_in_stream])
        fail(text, label, err.pos_in_stream, expected)
    pos = getattr(err, "pos_in_stream", None)
    token = getattr(err, "token", None)
    if pos is None or (token is not None and token.type == "$END"):
        fail(text, "the number ends too early", len(text), "a group after the space")
    fail(text, "a space where a group was expected", pos, "letters between the spaces")


# -- reading ----------------------------------------------------------------

def parse(text: str, *, ascending: bool = False, notation: str = NAME, convention: str = GENERIC) -> Reading:
    """Read *text* as a Greek alphabetic numeral (NFC and NFD read the same).

    With ``ascending=True`` the letters are expected smaller first, as some
    inscriptions write them.  *convention* (``"generic"``, ``"astronomical"``,
    ``"documentary"``; :mod:`numcheck.notations.greek.conventions`) says how
    a lone ``ο`` and a lone capital letter are read.

    >>> parse("͵αχο").value
    Fraction(1670, 1)
    >>> parse("κθ λα ν η κ").value
    Fraction(765433, 25920)
    """
    text = unicodedata.normalize("NFC", text)
    if not text.strip():
        raise NumcheckSyntaxError("There is no number to read: the input is empty", text, 0,
                                  expected="a Greek numeral such as ͵αχο or κθ λα")
    if convention not in CONVENTIONS:
        raise ValueError(f"unknown Greek convention {convention!r}; expected one of {sorted(CONVENTIONS)}")
    text, cleaned = clean(text)
    if not cleaned and not ascending:
        quick = plain_letters_reading(text, notation, limits.MAX_PLACES, convention)
        if quick is not None:
            return quick
    notes: list = []
    for note in cleaned:
        notes += [True, note]
    from lark import Tree
    from lark.exceptions import UnexpectedInput

    tree = _plain_tree(text)
    if tree is None:
        try:
            tree = parser_for("greek").parse(text)
        except UnexpectedInput as err:
            _raise_from_lark(text, err)
    state = {"lost": None, "added": None, "superfluous": None}
    trees = [piece for g in tree.children if isinstance(g, Tree) for piece in _split_runs(g)]
    groups = [([] if _is_mark_group(g) else _items(text, g, state, notes), g) for g in trees]
    for name, opened in state.items():
        if opened is not None:
            fail(text, "a bracket opened and never closed", opened, f"a closing bracket for the {name} part")
    if sum(len(items) for items, _ in groups) > limits.MAX_PLACES:
        raise LimitError("number of signs", sum(len(i) for i, _ in groups), limits.MAX_PLACES,
                         "Set numcheck.limits.MAX_PLACES higher to read it.")
    slots: list[Slot] = []
    place = 0
    seen_fraction = None
    upper = False
    kinds = [_group_kind(index, items, g) for index, (items, g) in enumerate(groups)]
    places = "place" in kinds
    alone = len(kinds) == 1
    for index, (items, tree_group) in enumerate(groups):
        gkind = kinds[index]
        if gkind == "unread":
            if index == 0:
                fail(text, "a recognition mark '??' in place of the whole number", 0,
                     "the letters of the whole part first")
            if not places:
                seen_fraction = seen_fraction if seen_fraction is not None else index
            else:
                place -= 1
            base = dict(group=index, gkind="unread", upper=upper, keraia=False, ascending=ascending)
            slots.append(unread_mark_slot(text, tree_group, place if places else 0, places, notes, base))
            continue
        if gkind in ("unitfrac", "fraction"):
            seen_fraction = seen_fraction if seen_fraction is not None else index
        elif gkind == "place":
            if seen_fraction is not None:
                fail(text, "a sexagesimal place after a fraction", items[0].start if items else 0,
                      "the sexagesimal places before the unit fractions")
            place -= 1
        built = group_slots(text, index, items, tree_group, gkind, place if gkind == "place" else 0,
                            ascending, notes, upper=upper, convention=convention, places=places, alone=alone)
        upper = next((s.form[0].upper for s in built if s.form), upper)
        if gkind == "place" and len(built) == 1 and built[0].gap is not None:
            place -= built[0].gap[0] - 1
        slots.extend(built)
    # A True in the notes marks the next note as an oddity worth a NumcheckWarning;
    # the others (a thousands sign left out, how '[...]' was bounded) are plain notes.
    said: list[str] = []
    loud = False
    for note in notes:
        if note is True:
            loud = True
            continue
        if loud:
            _warnings.warn(note, NumcheckWarning, stacklevel=2)
        loud = False
        said.append(note)
    return Reading(text=text, notation=notation, slots=tuple(slots), base=60, warnings=tuple(said))


#: The terminals of a number with no damage marks: letters, numeral signs, bars, zero, fractions.
_PLAIN_TERMINALS = ("LETTER", "THOUSANDS", "KERAIA", "BAR", "ZERO", "FRACTION", "SPACE")


@functools.cache
def _plain_lexer() -> re.Pattern:
    """One regular expression of the grammar's own plain terminals (so the two cannot drift)."""
    patterns = {t.name: t.pattern.to_regexp() for t in parser_for("greek").terminals}
    return re.compile("|".join(f"(?P<{name}>{patterns[name]})" for name in _PLAIN_TERMINALS))


def _plain_tree(text: str) -> Tree | None:
    """The parse tree of a number without damage marks, made without the LALR parser.

    The grammar's tree for such a text is a ``start`` of ``group`` trees
    (runs of signs) between ``SPACE`` tokens; building it from a regular
    expression of the same terminals is several times faster than the
    parser, and gives the very same tree (tests/test_fast_paths.py compares
    tokens and positions).  Anything else (brackets, dots, '?', an odd
    character) returns None and goes to the parser.
    """
    from lark import Token, Tree

    lexer = _plain_lexer()
    children: list = []
    group: list = []
    pos, end = 0, len(text)
    while pos < end:
        m = lexer.match(text, pos)
        if m is None:
            return None
        kind, stop = m.lastgroup, m.end()
        tok = Token(kind, m.group(), start_pos=pos, line=1, column=pos + 1, end_line=1,
                    end_column=stop + 1, end_pos=stop)
        if kind == "SPACE":
            if not group:
                return None           # a space before the first group: the parser says so
            children.append(Tree("group", group))
            children.append(tok)
            group = []
        else:
            group.append(tok)
        pos = stop
    if not group:
        return None
    children.append(Tree("group", group))
    return Tree("start", children)


def _is_mark_group(group: Tree) -> bool:
    """A group of '?' only: what a recognised text leaves for a sign it could not read."""
    return all(t.type == "DOUBT" for t in group.children)


def _group_kind(index: int, items: list[Item], group: Tree) -> str:
    if _is_mark_group(group):
        return "unread"
    if index == 0:
        return "whole"
    counted = [i for i in items if i.status is not Status.SUPERFLUOUS]
    # A fraction sign with the numeral sign (∠ʹ, as editions print the half)
    # is a fraction sign, not a unit fraction.
    if counted and all(i.kind == "fraction" for i in counted):
        return "fraction"
    if any(t.type == "KERAIA" for t in group.children[1:]):
        return "unitfrac"
    return "place"


_STARTS_SIGN = frozenset({"LETTER", "THOUSANDS", "ZERO", "FRACTION", "DOT", "GAP", "LOST_OPEN",
                          "ADD_OPEN", "SUPERFLUOUS_OPEN"})


def _split_runs(group: Tree) -> list[Tree]:
    """Split a group written without spaces into its parts: ``κε∠ʹγʹ`` is ``κε∠ʹ γʹ``.

    A numeral sign followed by more signs ends a part, but only when every
    later part ends with its own numeral sign (a run of unit fractions, as
    Ptolemy writes 25 5/6); otherwise the group stays whole and the reader
    says that a letter follows the numeral sign.
    """
    from lark import Tree

    children = group.children
    cuts = [k + 1 for k, tok in enumerate(children)
            if tok.type == "KERAIA" and k > 0 and k + 1 < len(children)
            and children[k + 1].type in _STARTS_SIGN]
    if not cuts:
        return [group]
    bounds = [0] + cuts + [len(children)]
    parts = [children[a:b] for a, b in zip(bounds, bounds[1:])]
    closing = ("KERAIA", "LOST_CLOSE", "ADD_CLOSE", "SUPERFLUOUS_CLOSE", "BAR", "UNDERDOT", "DOUBT")
    for part in parts[1:]:
        tail = [t for t in part if t.type not in closing[1:]]
        if not tail or tail[-1].type != "KERAIA":
            return [group]
    return [Tree("group", part) for part in parts]


def _items(text: str, group: Tree, state: dict, notes: list) -> list[Item]:
    """The signs of one group, with brackets, doubt marks and bars attached."""
    items: list[Item] = []
    thousands: Token | None = None
    keraia: Token | None = None
    children = group.children
    for k, tok in enumerate(children):
        t = tok.type
        if (t == "KERAIA" and k == 0 and k + 1 < len(children) and children[k + 1].type == "LETTER"):
            # 'Αωϙγ: documentary editions type the lower numeral sign as an apostrophe.
            notes.append(f"{str(tok)!r} before {str(children[k + 1])!r} read as the thousands sign ͵: "
                         "documentary editions type the lower numeral sign as an apostrophe")
            thousands = tok
            continue
        if t.endswith("_OPEN"):
            name = {"LOST_OPEN": "lost", "ADD_OPEN": "added", "SUPERFLUOUS_OPEN": "superfluous"}[t]
            if state[name] is not None:
                fail(text, "a bracket opened inside the same kind of bracket", tok.start_pos,
                      f"the bracket opened at column {state[name] + 1} to be closed first")
            state[name] = tok.start_pos
        elif t.endswith("_CLOSE"):
            name = {"LOST_CLOSE": "lost", "ADD_CLOSE": "added", "SUPERFLUOUS_CLOSE": "superfluous"}[t]
            if state[name] is None:
                fail(text, "a closing bracket with no opening bracket", tok.start_pos,
                      "an opening bracket before it")
            state[name] = None
        elif t == "THOUSANDS":
            if thousands is not None:
                fail(text, "a second lower numeral sign", tok.start_pos, "one ͵ before a units letter")
            thousands = tok
        elif t in ("LETTER", "DOT", "ZERO", "FRACTION", "GAP"):
            if keraia is not None:
                fail(text, "a letter after the numeral sign", tok.start_pos,
                      "the numeral sign ʹ at the end of its group")
            if items and items[-1].kind == "fraction" and t in ("LETTER", "DOT"):
                fail(text, "a letter after a fraction sign", tok.start_pos,
                      "the fraction signs after the letters of their group")
            if t == "GAP" and state["lost"] is not None:
                fail(text, "'[...]' inside brackets", tok.start_pos, "'[...]' standing alone")
            if t in ("DOT", "GAP") and (state["added"] is not None or state["superfluous"] is not None):
                fail(text, "a lost letter inside < > or { }", tok.start_pos, "letters inside < > and { }")
            items.append(_make_item(tok, state, thousands))
            if thousands is not None and t not in ("LETTER", "DOT"):
                fail(text, "the lower numeral sign before a sign that is not a letter", tok.start_pos,
                      "a units letter after ͵")
            thousands = None
        elif t in ("DOUBT", "UNDERDOT"):
            if not items or items[-1].kind == "gap":
                fail(text, "a doubt mark with no letter before it", tok.start_pos,
                      "a letter before the underdot or '?'")
            items[-1] = replace(items[-1], doubtful=True, end=tok.end_pos)
        elif t == "BAR":
            if items:
                items[-1] = replace(items[-1], bar=True, end=tok.end_pos)
        elif t == "KERAIA":
            if keraia is not None:
                fail(text, "a second numeral sign", tok.start_pos, "one numeral sign ʹ per group")
            keraia = tok
    if thousands is not None:
        fail(text, "the lower numeral sign with no letter after it", thousands.start_pos,
              "a units letter after ͵ (͵α = 1000)")
    return items


def _make_item(tok: Token, state: dict, thousands: Token | None) -> Item:
    t = tok.type
    start = thousands.start_pos if thousands is not None else tok.start_pos
    if state["superfluous"] is not None:
        status = Status.SUPERFLUOUS
    elif state["lost"] is not None:
        status = Status.LOST if t in ("DOT", "GAP") else Status.RESTORED
    elif state["added"] is not None:
        status = Status.ADDED
    elif t == "DOT":
        status = Status.UNREAD
    else:
        status = Status.READ
    if t == "LETTER":
        value = Fraction(letter_value(str(tok)))
    elif t == "ZERO":
        value = Fraction(0)
    elif t == "FRACTION":
        value = FRACTION_SIGNS[str(tok)]
    else:
        value = None
    kind = {"LETTER": "letter", "DOT": "dot", "ZERO": "zero", "FRACTION": "fraction", "GAP": "gap"}[t]
    return Item(kind, str(tok), value, status, start, tok.end_pos, thousands=thousands is not None,
                bar=str(tok) in BARRED, at=tok.start_pos)

