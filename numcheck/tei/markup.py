"""Reading TEI/EpiDoc safely, and turning a ``<num>``'s markup into Leiden text.

numcheck's notations read the Leiden conventions as editors print them
(``ι[.]``, ``29;31,5[x],8,20``).  An EpiDoc file says the same with markup:
``<gap reason="lost" quantity="1" unit="character"/>``, ``<supplied
reason="lost">``, ``<unclear>``, ``<surplus>``.  This module maps that markup
back to the printed sigla of the notation at hand, so that the one strict
parser of each notation reads both (EpiDoc Guidelines, "Appendix: Aligning
EpiDoc with Krummrey-Panciera 1980"; see reference/conventions.md §1.2).

XML is parsed with entities left unresolved, no network access and lxml's
default size guards; the limits of :mod:`numcheck.limits` bound the rest.
"""

from __future__ import annotations

import functools
import os
import re
from dataclasses import dataclass
from pathlib import Path

from lxml import etree

from .. import limits
from ..errors import LimitError, NumcheckError
from ..files import InputFileError, read_input_file

__all__ = [
    "TEI_NS",
    "TeiError",
    "NoTableError",
    "parse_tei",
    "num_pieces",
    "leiden_text",
    "plain_text",
    "word_text",
    "text_before",
    "has_expansion",
    "notation_hint",
    "lang_hint",
    "choose_notation",
    "tei_elements",
    "local_name",
]

TEI_NS = "http://www.tei-c.org/ns/1.0"

#: Notations whose lost letters are written as dots (``ι[.]``); the others
#: (digit strings) write a lost digit as ``x`` (``5[x]``).  Roman uses dots
#: because ``x`` is one of its letters.
_DOT_NOTATIONS = {"greek", "greek-ascending", "attic", "roman", "abjad", "abjad-maghribi"}


def _dots(notation: str) -> bool:
    # Every Greek convention (greek-documentary, greek-astronomical ...) writes letters.
    return notation in _DOT_NOTATIONS or notation.startswith("greek")


#: Notations where an underdot is not a mark of doubt (cuneiform: ṣ, ṭ are
#: letters; Arabic script: dots are part of the letters) and ``?`` is used.
_QUERY_NOTATIONS = {"cuneiform", "abjad", "abjad-maghribi"}

#: ``xml:lang`` of the text -> the notation its numbers are most likely in,
#: used only when a ``<num>`` has no legible letter to detect from.
_LANG_HINTS = {"grc": "greek", "el": "greek", "la": "roman", "akk": "cuneiform",
               "sux": "cuneiform", "ar": "abjad", "fa": "abjad"}

#: Elements whose content is not part of the number's text.
_SKIP = {"certainty", "note", "precision", "respons", "del", "sic", "orig", "abbr",
         "fw", "figure", "index", "interp", "interpGrp", "link", "bibl"}
#: In a ``<choice>``, the member read (first found wins).
_CHOICE_ORDER = ("corr", "reg", "expan", "sic", "orig", "abbr")


class TeiError(NumcheckError):
    """A TEI file numcheck cannot use: malformed, not TEI, or a bad ``<num>``.

    The message names the file and the line.
    """

    def __init__(self, path, line: int | None, message: str):
        self.path = str(path)
        self.line = line
        where = f"{self.path}, line {line}" if line else self.path
        super().__init__(f"{where}: {message}")


class NoTableError(TeiError):
    """A TEI file holds no ``<table>`` (a batch audit passes over it)."""


def _parser() -> etree.XMLParser:
    # No entity expansion (no "billion laughs"), no network, lxml's guards on
    # huge text nodes and deep trees kept on; comments, PIs and whitespace kept.
    return etree.XMLParser(resolve_entities=False, no_network=True, huge_tree=False,
                           load_dtd=False, dtd_validation=False, remove_blank_text=False,
                           remove_comments=False, remove_pis=False, strip_cdata=False)


def read_bytes(path: str | os.PathLike) -> bytes:
    """The bytes of *path*, after checking its kind and size limit (the file is only read)."""
    if not isinstance(path, (str, os.PathLike)):
        raise NumcheckError(f"Expected the path of an XML file, got {type(path).__name__}.")
    try:
        return read_input_file(path, max_bytes=limits.MAX_XML_BYTES, what="XML file",
                               limit_name="MAX_XML_BYTES")[1]
    except InputFileError as err:
        if not os.path.exists(path):
            raise TeiError(Path(path), None, "no such file") from None
        raise err from None


def parse_tei(path: str | os.PathLike, data: bytes | None = None) -> etree._Element:
    """Parse a TEI file safely and return its root element.

    Raises :class:`TeiError` (file and line) for malformed XML or a root that
    is not in the TEI namespace, :class:`LimitError` for a file too large or
    too deep.
    """
    if data is None:
        data = read_bytes(path)
    if len(data) > limits.MAX_XML_BYTES:
        raise LimitError(f"size of {str(path)!r}", f"{len(data)} bytes", f"{limits.MAX_XML_BYTES} bytes",
                         "Set numcheck.limits.MAX_XML_BYTES higher to read it.")
    try:
        root = etree.fromstring(data, _parser())
    except etree.XMLSyntaxError as err:
        line = err.lineno if err.lineno else None
        msg = err.msg or str(err)
        if "Excessive depth" in msg:
            # libxml2's own guard (256 levels without its "huge" option) met
            # before numcheck's: the same limit, said the same way.
            raise LimitError(f"element nesting of {str(path)!r} (at line {line})", "over 256",
                             min(limits.MAX_XML_DEPTH, 256),
                             "numcheck's XML parser reads at most 256 levels "
                             "(numcheck.limits.MAX_XML_DEPTH can only lower it); flatten the markup."
                             ) from None
        msg = re.sub(r", line \d+, column \d+$", "", msg)
        col = f" (column {err.position[1]})" if getattr(err, "position", None) else ""
        raise TeiError(path, line, f"malformed XML{col}: {msg}. Fix the markup and run again.") from None
    if root is None:
        raise TeiError(path, None, "the file holds no XML element")
    qname = etree.QName(root)
    if qname.namespace != TEI_NS:
        found = f"{{{qname.namespace}}}{qname.localname}" if qname.namespace else qname.localname
        hint = (" (TEI P4 or a file without the TEI namespace: add "
                f"xmlns=\"{TEI_NS}\" to the root)" if not qname.namespace else "")
        raise TeiError(path, root.sourceline,
                       f"not a TEI file: the root element is <{found}>, expected an element in "
                       f"the TEI namespace {TEI_NS}{hint}")
    _check_depth(path, root)
    return root


def _check_depth(path, root) -> None:
    # libxml2 finds whether any element lies deeper than the limit in one
    # pass; only then is the tree walked here, to name the first one.
    if _deeper_than(limits.MAX_XML_DEPTH)(root):
        _walk_depth(path, root)


@functools.lru_cache(maxsize=8)
def _deeper_than(depth: int):
    """An XPath true of a document with an element deeper than *depth* (the root is 1)."""
    if depth < 1:
        return lambda root: True
    return etree.XPath("boolean(" + "/*" * (int(depth) + 1) + ")")


def _walk_depth(path, root) -> None:
    stack = [(root, 1)]
    while stack:
        el, depth = stack.pop()
        if depth > limits.MAX_XML_DEPTH:
            raise LimitError(f"element nesting of {str(path)!r} (at line {el.sourceline})",
                             depth, limits.MAX_XML_DEPTH,
                             "Set numcheck.limits.MAX_XML_DEPTH higher to read it.")
        stack.extend((c, depth + 1) for c in el if isinstance(c.tag, str))


def local_name(el) -> str | None:
    """The local name of an element (``None`` for comments, PIs, entities)."""
    return etree.QName(el).localname if isinstance(el.tag, str) else None


@dataclass(frozen=True)
class Piece:
    """A run of a ``<num>``'s content and what the markup says about it.

    ``kind``: ``text`` (read), ``supplied`` (lost, restored by the editor),
    ``omitted`` (added by the editor), ``unclear`` (doubtful), ``surplus``
    (superfluous), ``ex`` (letters the editor wrote out in an ``<expan>``:
    not on the original), ``lost`` (``count`` letters lost, ``None`` =
    unknown) or ``illegible`` (``count`` letters present but not read).
    """

    kind: str
    text: str = ""
    count: int | None = None


def _int_attr(el, name: str) -> int | None:
    """A count attribute (``quantity``, ``atLeast`` ...): a whole number of at most 12 digits.

    The one door through which counts of the markup enter: a count larger than
    a number can have places (``limits.MAX_PLACES``) is refused here, with the
    line of the element, before anything is built from it (``quantity=
    "1000000000"`` once allocated gigabytes).
    """
    raw = el.get(name)
    if raw is None:
        return None
    text = raw.strip()
    if not (text.isascii() and text.isdigit()):
        return None                      # not a count ("-1", "1_000", "many"): as if absent
    n = int(text[:30])
    if n > limits.MAX_PLACES:
        line = getattr(el, "sourceline", None)
        raise LimitError(f"@{name} of <{local_name(el)}>" + (f" at line {line}" if line else ""),
                         text if len(text) <= 24 else text[:20] + "…", limits.MAX_PLACES,
                         "A number has at most numcheck.limits.MAX_PLACES places; write the "
                         "gap as of unknown extent (extent=\"unknown\") or set the limit higher.")
    return n


def _gap_piece(el) -> Piece:
    reason = (el.get("reason") or "lost").strip()
    unit = (el.get("unit") or "character").strip()
    count = _int_attr(el, "quantity")
    if unit not in ("character", "characters", "char", "chars", "digit", "letter", "sign"):
        count = None
    if el.get("precision") == "low" or el.get("extent") == "unknown":
        count = None
    if count is None and _int_attr(el, "atLeast") is not None and \
            _int_attr(el, "atLeast") == _int_attr(el, "atMost"):
        count = _int_attr(el, "atLeast")
    if count == 0:
        count = None
    return Piece("illegible" if reason == "illegible" else "lost", count=count)


def num_pieces(el) -> list[Piece]:
    """The content of a ``<num>`` (or a table cell) as a list of :class:`Piece`."""
    out: list[Piece] = []
    _walk(el, "text", out, top=True)
    return out


def _walk(el, mode: str, out: list[Piece], top: bool = False) -> None:
    if el.text:
        out.append(Piece(mode, el.text))
    for child in el:
        name = local_name(child)
        if name is None:
            pass  # a comment or PI inside the number: not part of it
        elif name == "gap":
            out.append(_gap_piece(child))
        elif name == "space":
            pass  # a deliberate blank, not a letter
        elif name == "lb":
            if child.get("break") != "no":
                out.append(Piece(mode, " "))
        elif name in _SKIP:
            pass
        elif name == "choice":
            members = {local_name(c): c for c in child if local_name(c)}
            for pick in _CHOICE_ORDER:
                if pick in members:
                    _walk(members[pick], mode, out)
                    break
        elif name == "supplied":
            reason = (child.get("reason") or "lost").strip()
            inner = "omitted" if reason == "omitted" else "supplied"
            _walk(child, mode if mode != "text" else inner, out)
        elif name == "unclear":
            _walk(child, mode if mode != "text" else "unclear", out)
        elif name == "ex":
            # The editor's expansion, never letters of the original, whatever
            # damage markup is around it (EpiDoc trans-abbrevsymbol).
            _walk(child, "ex", out)
        elif name == "surplus":
            _walk(child, mode if mode != "text" else "surplus", out)
        else:  # hi, g, add, seg, num, expan, ex, c, w, reg, corr ...: their letters count
            _walk(child, mode, out)
        if child.tail:
            out.append(Piece(mode, child.tail))


def plain_text(pieces: list[Piece]) -> str:
    """The letters the markup gives, without damage marks (for detecting the notation).

    The editor's expansions (``<ex>``) are not letters of the original and are left out.
    """
    text = "".join(p.text for p in pieces if p.kind not in ("lost", "illegible", "ex"))
    return " ".join(text.split())


def has_expansion(pieces: list[Piece]) -> bool:
    """Whether the editor wrote part of the content out (``<ex>``)."""
    return any(p.kind == "ex" and p.text.strip() for p in pieces)


def word_text(pieces: list[Piece]) -> str:
    """The words the markup gives, the editor's expansions and restorations included.

    A lost or unread stretch breaks the words (``…``); superfluous letters are left out.
    """
    parts = []
    for p in pieces:
        if p.kind in ("lost", "illegible"):
            parts.append(" … ")
        elif p.kind != "surplus":
            parts.append(p.text)
    return " ".join("".join(parts).split())


def _lost_mark(notation: str, count: int | None) -> str:
    if count is None:
        return "[...]"
    letter = "." if _dots(notation) else "x"
    if letter == "." and count == 3:
        # "[...]" is the sign for an unknown number of lost letters; three
        # counted letters are written one bracket each.
        return "[.][.][.]"
    return "[" + letter * count + "]"


#: How each notation writes a letter present but not read (Leiden: dots in
#: papyrology, "+" in Latin epigraphy, "x" for a digit; conventions.md §1.2).
_UNREAD = {"greek": ".", "greek-ascending": ".", "attic": ".", "roman": "+"}


def _unread_mark(notation: str, count: int | None) -> str:
    if count is None:
        return "[...]"
    return _UNREAD.get("greek" if notation.startswith("greek") else notation, "x") * count


def _wrap_words(text: str, left: str, right: str) -> str:
    return re.sub(r"\S+", lambda m: f"{left}{m.group(0)}{right}", text)


def leiden_text(pieces: list[Piece], notation: str) -> str:
    """The Leiden text of *pieces* in the conventions of *notation*.

    >>> leiden_text([Piece("text", "ι"), Piece("lost", count=1)], "greek")
    'ι[.]'
    >>> leiden_text([Piece("text", "29;31,5"), Piece("lost", count=1), Piece("text", ",8,20")], "sexagesimal")
    '29;31,5[x],8,20'
    """
    doubt_mark = "?" if notation in _QUERY_NOTATIONS else "\u0323"
    parts: list[str] = []
    for p in pieces:
        if p.kind == "text":
            parts.append(p.text)
        elif p.kind == "supplied":
            parts.append(_wrap_words(p.text, "[", "]"))
        elif p.kind == "omitted":
            parts.append(_wrap_words(p.text, "<", ">"))
        elif p.kind == "surplus":
            parts.append(_wrap_words(p.text, "{", "}"))
        elif p.kind == "unclear":
            parts.append("".join(c + doubt_mark if not c.isspace() else c for c in p.text))
        elif p.kind == "lost":
            parts.append(_lost_mark(notation, p.count))
        elif p.kind == "illegible":
            parts.append(_unread_mark(notation, p.count))
        # "ex": the editor's expansion is not part of the numeral as written
    text = " ".join("".join(parts).split())
    if not _dots(notation):
        # Adjacent lost runs are one lacuna: "[x][5]" -> "[x5]".  Counted dots
        # stay apart, lest three of them read as the unknown-extent "[...]".
        text = text.replace("][", "")
    return text


def notation_hint(el) -> str | None:
    """The notation the ``xml:lang`` in force at *el* suggests, if any."""
    lang = el.xpath("ancestor-or-self::*[@xml:lang][1]/@xml:lang")
    return lang_hint(str(lang[0]) if lang else None)


def lang_hint(lang: str | None) -> str | None:
    """The notation an ``xml:lang`` value suggests, if any.

    >>> lang_hint("grc-Latn"), lang_hint("en")
    ('greek', None)
    """
    if lang is None:
        return None
    return _LANG_HINTS.get(lang.split("-")[0].lower())


def tei_elements(root, name: str):
    """Every element *name* in the TEI namespace under *root*, in document order."""
    return root.iter(f"{{{TEI_NS}}}{name}")


def choose_notation(plain: str, el) -> str:
    """The notation of a number whose letters are *plain*, at element *el*.

    The letters choose it (:func:`detect_notation`); when they cannot be
    read that way and the ``xml:lang`` in force suggests another notation
    that reads them, that one is taken.
    """
    from ..notations.detect import detect_notation
    from ..reader import read

    hint = notation_hint(el)
    if not plain:
        return hint or "sexagesimal"
    detected = detect_notation(plain)[0]
    if hint is None or hint == detected:
        return detected
    try:
        read(plain, notation=detected)
        return detected
    except NumcheckError:
        pass
    try:
        read(plain, notation=hint)
        return hint
    except NumcheckError:
        return detected


#: Elements at which the words before an empty ``<num>`` stop being looked for.
_TEXT_BLOCKS = {"ab", "p", "div", "body", "text", "l", "lg", "cell", "item", "seg", "head"}


def text_before(el, max_chars: int = 200) -> str:
    """The words written before *el* on its text line (for an empty ``<num value=".."/>``).

    EpiDoc encodes a number written in words as the words followed by an
    empty ``<num>`` that carries the value.  The text is gathered backwards
    from *el* up to the line break (``<lb>``), another ``<num>``, the start
    of the block, or *max_chars*; the markup is read as for a ``<num>``
    (a ``<choice>`` gives its regularised member, restorations count).
    """
    parts: list[str] = []
    size = 0
    node = el
    while node is not None and size < max_chars:
        prev = node.getprevious()
        if prev is None:
            parent = node.getparent()
            if parent is None:
                break
            parts.append(parent.text or "")
            size += len(parent.text or "")
            if local_name(parent) in _TEXT_BLOCKS:
                break
            node = parent
            continue
        parts.append(prev.tail or "")
        name = local_name(prev)
        if name in ("lb", "num", "cb", "pb"):
            break
        if name in ("gap", "space"):
            parts.append(" … ")
        elif name is not None and name not in _SKIP:
            words = word_text(num_pieces(prev))
            parts.append(words)
            size += len(words)
        node = prev
    return " ".join("".join(reversed(parts)).split())
