"""What the text of a plain TEI file tells without its tree.

lxml builds a tree of every element of a file; for a file all of whose
numbers were met before, annotate needs of it only that the file is well
formed, where its ``<num>`` elements are, the ``xml:lang`` in force at each
and that it nests no deeper than :data:`~numcheck.limits.MAX_XML_DEPTH`.
In a *plain* file the text alone says all of these (:func:`plain_body`):

- UTF-8 (as declared, or with no declaration) without a byte order mark
  or a NUL byte;
- no comment, CDATA section or DOCTYPE anywhere, and no processing
  instruction after the root's start tag (the ``<?xml-model?>`` lines of
  EpiDoc come before it): so every ``<`` of the body begins a tag;
- as many ``>`` as ``<`` in the body: so there is no ``>`` in an attribute
  value or in the text, and every tag ends at the first ``>`` after it;
- one namespace declaration, the root's default one, TEI's, and no
  prefixed name but ``xml:`` attributes: so every element is a TEI element
  named as written.

The file is read as bytes: in UTF-8 no byte of a multi-byte character is
one of the ASCII characters of the markup.  Each function returns None (or
False) where the text does not settle the question; the caller then builds
the tree.  That the file is well formed (its UTF-8 too) is checked by
libxml2 without building a tree (:func:`well_formed`).
``tests/test_tei_plaintext.py`` checks each against the tree on random files.
"""

from __future__ import annotations

import codecs
import re
from bisect import bisect_left
from itertools import accumulate, repeat
from operator import add, itemgetter

from lxml import etree

from .markup import TEI_NS

__all__ = ["plain_body", "split_nums", "source_key", "source_of", "langs", "nesting_within",
           "well_formed"]

_BOMS = (codecs.BOM_UTF8, codecs.BOM_UTF16_LE, codecs.BOM_UTF16_BE)
_ENCODING = re.compile(rb"""encoding\s*=\s*["']([^"']*)["']""")
_UTF8 = frozenset({b"utf-8", b"utf8"})
#: The root's declaration of TEI's namespace, as either quote writes it.
_TEI_DEFAULT = (f'xmlns="{TEI_NS}"'.encode(), f"xmlns='{TEI_NS}'".encode())
#: A prefixed element name (``<x:ab``, ``</x:ab``), or a prefixed attribute other than ``xml:``.
_PREFIXED = re.compile(rb"""</?[^\s/>:]*:|\s(?!xml:)[^\s=/>"'<]+:[^\s=/>"'<]*\s*=""")
_WHITESPACE = b" \t\r\n"


def plain_body(data: bytes) -> int | None:
    """Where the root's start tag of *data* begins, when the file is plain (module
    docstring); None otherwise."""
    if data.startswith(_BOMS) or b"\0" in data or _after_lt(data, b"!", 0):
        return None
    at = 0
    if data.startswith(b"<?xml"):
        end = data.find(b"?>")
        if end < 0:
            return None
        found = _ENCODING.search(data, 0, end)
        if found is not None and found.group(1).lower() not in _UTF8:
            return None
        at = end + 2
    while True:                             # processing instructions before the root
        at = data.find(b"<", at)
        if at < 0 or not data.startswith(b"<?", at):
            break
        at = data.find(b"?>", at)
        if at < 0:
            return None
        at += 2
    if at < 0 or _after_lt(data, b"?", at) or data.count(b"<", at) != data.count(b">", at):
        return None
    root_tag = data[at:data.find(b">", at)]
    declared = max(root_tag.find(d) for d in _TEI_DEFAULT)
    first = data.find(b"xmlns")
    if (data.find(b"xmlns", first + 1) >= 0 or declared < 1
            or root_tag[declared - 1] not in _WHITESPACE or not _outside_values(root_tag[:declared])):
        return None
    # No colon but those of xml: attributes and of the namespace: then no prefix; else look.
    namespace = at + declared + len(_TEI_DEFAULT[0]) - 1      # past TEI's URI
    colon = data.find(b":", at)
    while colon >= 0:
        if not (data[colon - 4:colon] == b" xml" or at + declared < colon < namespace):
            if _PREFIXED.search(data, at) is not None:
                return None
            break
        colon = data.find(b":", colon + 1)
    return at


def _after_lt(data: bytes, mark: bytes, at: int) -> bool:
    """Whether ``<`` followed by the byte *mark* (``<!``, ``<?``) occurs in *data* from *at*
    (the rare byte is looked for, then what stands before it)."""
    pos = data.find(mark, at)
    while pos >= 0:
        if pos > at and data[pos - 1] == 0x3C:          # "<"
            return True
        pos = data.find(mark, pos + 1)
    return False


_END = b"</num>"
#: What may follow ``<num`` in a ``<num>`` start tag with content (not ``<numeral``), as
#: one-byte strings, and what may follow an element's name (as byte values).
_CONTENT_NAME_ENDS = frozenset(bytes([b]) for b in b">" + _WHITESPACE)
_NAME_ENDS = frozenset(b"/>" + _WHITESPACE)
_SEPARATOR, _AFTER, _INNER = itemgetter(1), itemgetter(2), itemgetter(0)


def source_key(source: bytes) -> bytes:
    """The key of a ``<num>``'s source text (UTF-8, ``<num`` to its end tag) in the tables
    of outcomes: what lies between ``<num`` and ``</num>``, or the whole source where it
    ends otherwise (an empty ``<num/>``; no inner part begins with ``<``)."""
    return source[4:-6] if source.endswith(_END) else source


def source_of(key: bytes) -> bytes:
    """The source text of *key* (:func:`source_key`)."""
    return key if key.startswith(b"<") else b"<num" + key + _END


def split_nums(data: bytes, at: int) -> tuple[list[bytes], list[bytes]] | None:
    """The pieces of *data* (plain, its root starting at *at*) after ``<num``
    (``data[at:].split(b"<num")``) and the key (:func:`source_key`) of the ``<num>``
    each piece but the first begins with; None where a ``<num`` is not one."""
    pieces = data[at:].split(b"<num")
    count = len(pieces) - 1
    rest = pieces[1:]
    if data.count(_END, at) == count and _CONTENT_NAME_ENDS.issuperset(map(_FIRST, rest)):
        # Every <num> has its own end tag (none is empty, none inside another, when the
        # file is well formed): each is cut at its first "</num>", all in C.
        cut = list(map(bytes.partition, rest, repeat(_END)))
        if all(map(_SEPARATOR, cut)):
            return pieces, list(map(_INNER, cut))
    keys = []
    for piece in rest:
        if not piece or piece[0] not in _NAME_ENDS:
            return None                     # another element (<numeral>), or no name
        tag = piece.find(b">")
        empty = tag > 0 and piece[tag - 1:tag] == b"/"
        close = -1 if empty else piece.find(b"</num", tag)
        if close >= 0:
            end = piece.find(b">", close) + 1
            if not end or piece[close + 5:end - 1].strip(_WHITESPACE):
                return None                 # </numeral>, or no end
        elif empty:
            end = tag + 1
        else:
            return None                     # a <num> inside it, or no end
        keys.append(source_key(b"<num" + piece[:end]))
    return pieces, keys


_FIRST = itemgetter(slice(0, 1))        # b"" for an empty piece

_LANG = re.compile(rb"""\sxml:lang\s*=\s*(?:"([A-Za-z0-9-]*)"|'([A-Za-z0-9-]*)')""")
#: Past this many ``xml:lang`` holders the tree finds the languages.
MAX_HOLDERS = 64


def langs(data: bytes, at: int, pieces: list[bytes]) -> list[str | None] | None:
    """The ``xml:lang`` in force at each ``<num>`` of *pieces* (:func:`split_nums`), or
    None where the text does not settle it."""
    count = len(pieces) - 1
    found: list[str | None] = [None] * count
    holders = []
    pos = data.find(b"xml:lang", at)
    while pos >= 0:
        m = _LANG.match(data, pos - 1)
        if m is None or len(holders) == MAX_HOLDERS:
            return None                     # one written otherwise (or in the text), or many
        holders.append(m)
        pos = data.find(b"xml:lang", m.end())
    if not holders:
        return found
    # Where each <num> begins: after the pieces before it and their "<num".
    ends = list(accumulate(map(len, pieces), initial=at))[1:]
    starts = list(map(add, ends, range(0, 4 * count, 4)))
    for m in holders:
        tag = data.rfind(b"<", 0, m.start())
        tag_end = data.find(b">", tag)
        if tag_end < m.end() or data[tag + 1:tag + 2] == b"/":
            return None                     # not an attribute of a start tag
        if not _outside_values(data[tag:m.start()]):
            return None
        extent = _element_end(data, tag, tag_end)
        if extent is None:
            return None
        first, last = bisect_left(starts, tag), bisect_left(starts, extent)
        if last > first:
            value = (m.group(1) if m.group(1) is not None else m.group(2)).decode("ascii")
            found[first:last] = [value] * (last - first)
    return found


def _outside_values(head: bytes) -> bool:
    """Whether the end of *head* (a start tag so far) surely lies outside every attribute value."""
    doubles, singles = head.count(b'"'), head.count(b"'")
    return not (doubles and singles) and (doubles + singles) % 2 == 0


_TAG_NAME_END = re.compile(rb"[/>\s]")


def _element_end(data: bytes, tag: int, tag_end: int) -> int | None:
    """Where the element whose start tag spans *tag* to *tag_end* ends (past its end tag)."""
    if data[tag_end - 1:tag_end] == b"/":
        return tag_end + 1
    name = data[tag + 1:_TAG_NAME_END.search(data, tag + 1).start()]
    opening, closing = b"<" + name, b"</" + name
    depth, pos = 1, tag_end + 1
    while depth:
        close = data.find(closing, pos)
        if close < 0:
            return None
        start = data.find(opening, pos, close)
        while start >= 0 and data[start + len(opening)] not in _NAME_ENDS:
            start = data.find(opening, start + 1, close)        # a longer name
        if start >= 0:
            end = data.find(b">", start)
            depth += data[end - 1:end] != b"/"
            pos = end + 1
            continue
        after = close + len(closing)
        pos = data.find(b">", after) + 1
        if data[after] in _NAME_ENDS and data[after] != ord("/"):
            depth -= 1
    return pos


#: At most about this many start tags lie in each piece the body is cut into to bound its
#: nesting (each cut at a tag's end).
_TAGS_A_PIECE = 64


def nesting_within(data: bytes, at: int, limit: int) -> bool:
    """Whether *data* (plain) surely nests no deeper than *limit* elements (the root is 1).

    In a plain body ``</`` ends an element and ``/>`` an empty one, so the
    depth at any cut after a tag is exact; within a piece it is at most the
    depth at its start and every start tag in it.  False means not sure.
    """
    end = len(data)
    tags = data.count(b"<", at)
    if tags <= limit:
        return True
    pieces = min(256, tags // _TAGS_A_PIECE + 1)
    depth, base = 0, at
    for k in range(1, pieces + 1):
        cut = end if k == pieces else data.find(b">", base + (end - base) * k // pieces) + 1
        if cut <= at:
            cut = end
        closes = data.count(b"</", at, cut)
        starts = data.count(b"<", at, cut) - closes
        if depth + starts > limit:
            return False
        depth += starts - data.count(b"/>", at, cut) - closes
        at = cut
        if at >= end:
            break
    return True


class _NoTree:
    """A parser target that keeps nothing: libxml2 checks the file and builds no tree."""

    def close(self) -> None:
        return None


_CHECKER = etree.XMLParser(target=_NoTree(), resolve_entities=False, no_network=True,
                           huge_tree=False, load_dtd=False)


def well_formed(data: bytes) -> bool:
    """Whether libxml2 parses *data* without an error (its namespaces are not checked:
    :func:`plain_body` leaves none to check)."""
    try:
        etree.fromstring(data, _CHECKER)
    except etree.XMLSyntaxError:
        return False
    return True
