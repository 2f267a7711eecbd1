"""Writing annotations back into an XML file without touching the rest of it.

A digital editor's file is more than its tree: the XML declaration, the
quoting of attributes, character references, comments, processing
instructions and line breaks are all the editor's.  A parse-and-serialise
round trip would rewrite them, so numcheck edits the *source text* instead:
it finds each element's start and end tags in the text (in document order,
the same order as lxml's tree) and splices in only the attributes and
elements it adds.  Everything else stays byte for byte.  When the text and
the tree cannot be matched (an unusual encoding, entities that expand to
elements), it falls back to lxml's serialisation and says so.
"""

from __future__ import annotations

import codecs
import functools
import itertools
import re
from dataclasses import dataclass, field

from lxml import etree

__all__ = ["ElementSpan", "Edit", "scan_elements", "scan_elements_plainly", "start_tags",
           "decode_source", "apply_edits", "apply_edits_tree"]

_NAME = re.compile(r"[^\s/>=]+")
_ATTR = re.compile(r"""(\s+)([^\s=/>]+)(\s*=\s*)(["'])(.*?)\4""", re.S)


@dataclass
class ElementSpan:
    """Where one element sits in the source text (character offsets)."""

    name: str                 # the qualified name as written (``tei:num``)
    start: int                # offset of "<"
    start_end: int            # offset just after the start tag's ">"
    empty: bool               # written as <x/>
    end_start: int = -1       # offset of "</" (the start for an empty element)
    end: int = -1             # offset just after the end tag

    def __post_init__(self):
        if self.empty:
            self.end_start = self.start
            self.end = self.start_end


@dataclass
class Edit:
    """What to change in one element: attributes to set or drop, children to add or drop."""

    set_attrs: dict[str, str] = field(default_factory=dict)     # in order of writing
    drop_attrs: list[str] = field(default_factory=list)
    drop_children: list[int] = field(default_factory=list)      # element indexes (document order)
    add_children: list[tuple[str, dict[str, str]]] = field(default_factory=list)  # (local name, attrs)


def decode_source(data: bytes, declared: str | None) -> tuple[str, str] | None:
    """Decode *data* to text that re-encodes to the very same bytes.

    Returns ``(text, codec)`` or ``None`` when no lossless codec is found.
    """
    if data.startswith(codecs.BOM_UTF8):
        candidates = ["utf-8"]
    elif data.startswith(codecs.BOM_UTF16_LE):
        candidates = ["utf-16-le"]
    elif data.startswith(codecs.BOM_UTF16_BE):
        candidates = ["utf-16-be"]
    else:
        candidates = [declared or "utf-8", "utf-8"]
    for enc in candidates:
        try:
            text = data.decode(enc)
            if text.encode(enc) == data:
                return text, enc
        except (LookupError, UnicodeError):
            continue
    return None


def _skip_to(text: str, i: int, token: str) -> int:
    k = text.find(token, i)
    if k < 0:
        raise ValueError(f"unterminated markup at offset {i}")
    return k + len(token)


def _tag_end(text: str, i: int) -> int:
    """Offset just after the ">" that closes the tag starting at *i* (quotes respected)."""
    quote = None
    n = len(text)
    while i < n:
        c = text[i]
        if quote:
            if c == quote:
                quote = None
        elif c in "\"'":
            quote = c
        elif c == ">":
            return i + 1
        i += 1
    raise ValueError("unterminated tag")


def _doctype_end(text: str, i: int) -> int:
    quote = None
    depth = 0
    n = len(text)
    while i < n:
        if quote:
            if text[i] == quote:
                quote = None
        elif text.startswith("<!--", i):
            i = _skip_to(text, i + 4, "-->")
            continue
        elif text[i] in "\"'":
            quote = text[i]
        elif text[i] == "[":
            depth += 1
        elif text[i] == "]":
            depth -= 1
        elif text[i] == ">" and depth <= 0:
            return i + 1
        i += 1
    raise ValueError("unterminated DOCTYPE")


#: One piece of markup: a comment, CDATA, a PI, "<!" (a DOCTYPE: left to the
#: plain scanner), an end tag or a start tag (its name, then its rest; quotes kept whole).
_MARKUP = re.compile(r"""<(?:
      !--.*?-->
    | !\[CDATA\[.*?\]\]>
    | \?.*?\?>
    | (?P<bang>!)
    | (?P<end>/)[^>"']*(?:(?:"[^"]*"|'[^']*')[^>"']*)*>
    | (?P<name>[^\s/>="'?!][^\s/>="']*|)(?P<rest>[^>"']*(?:(?:"[^"]*"|'[^']*')[^>"']*)*)>
    )""", re.S | re.X)


#: The same pieces of markup as _MARKUP, split out whole (group 1) with a start tag's name (group 2).
_SPLIT = re.compile(r"""(<(?:
      !--.*?-->
    | !\[CDATA\[.*?\]\]>
    | \?.*?\?>
    | /[^>"']*(?:(?:"[^"]*"|'[^']*')[^>"']*)*>
    | ([^\s/>="'?!][^\s/>="']*)[^>"']*(?:(?:"[^"]*"|'[^']*')[^>"']*)*>
    ))""", re.S | re.X)


def start_tags(text: str) -> tuple[list[str], list[int], list[int]] | None:
    """The name, start and end offset of every start tag of *text*, in document order.

    What :func:`scan_elements` gives of the start tags (``name``, ``start``,
    ``start_end``), without pairing the end tags: enough to edit the
    attributes of elements, and found by the regular expression engine in
    one pass (``re.split``), with no Python step per tag.  None when the
    text holds markup the expression does not take (a DOCTYPE, a stray
    ``<``): :func:`scan_elements` reads it.
    """
    parts = _SPLIT.split(text)
    texts, tags, names = parts[0::3], parts[1::3], parts[2::3]
    if "<" in "".join(texts):
        return None
    ends = list(itertools.accumulate(itertools.chain.from_iterable(
        zip(map(len, texts), map(len, tags)))))
    index = [k for k, name in enumerate(names) if name is not None]
    return ([names[k] for k in index], [ends[2 * k] for k in index],
            [ends[2 * k + 1] for k in index])


def scan_elements(text: str) -> list[ElementSpan]:
    """Every element of an XML text, in the order of its start tags.

    A small scanner for well-formed XML (lxml has already checked that): it
    skips comments, CDATA, PIs and the DOCTYPE and pairs start and end tags.
    One regular expression finds each piece of markup; a document it cannot
    take whole (a DOCTYPE, a quote in a tag name, anything unterminated)
    goes to :func:`scan_elements_plainly`, the character-by-character
    scanner, which gives the same spans (``tests/test_tei_outcomes.py``).
    """
    out: list[ElementSpan] = []
    stack: list[ElementSpan] = []
    new = ElementSpan.__new__
    at = 0
    for m in _MARKUP.finditer(text):
        j = m.start()
        if text.find("<", at, j) >= 0:
            return scan_elements_plainly(text)      # a "<" the expression could not take
        at = k = m.end()
        if m.group("end"):
            span = stack.pop()
            span.end_start, span.end = j, k
            continue
        name = m.group("name")
        if name is None:
            if m.group("bang"):
                return scan_elements_plainly(text)
            continue                                 # a comment, CDATA or PI
        rest = m.group("rest")
        if rest[:1] in ("'", '"') or not name:
            return scan_elements_plainly(text)      # the plain scanner's own reading of it
        span = new(ElementSpan)
        span.name, span.start, span.start_end = name, j, k
        if text[k - 2] == "/":
            span.empty, span.end_start, span.end = True, j, k
        else:
            span.empty, span.end_start, span.end = False, -1, -1
            stack.append(span)
        out.append(span)
    if text.find("<", at) >= 0:
        return scan_elements_plainly(text)
    if stack:
        raise ValueError("unclosed element")
    return out


def scan_elements_plainly(text: str) -> list[ElementSpan]:
    """:func:`scan_elements` one character at a time (any markup; the reference)."""
    out: list[ElementSpan] = []
    stack: list[ElementSpan] = []
    i = 0
    while True:
        j = text.find("<", i)
        if j < 0:
            break
        if text.startswith("<!--", j):
            i = _skip_to(text, j + 4, "-->")
        elif text.startswith("<![CDATA[", j):
            i = _skip_to(text, j + 9, "]]>")
        elif text.startswith("<?", j):
            i = _skip_to(text, j + 2, "?>")
        elif text.startswith("<!", j):
            i = _doctype_end(text, j + 2)
        elif text.startswith("</", j):
            k = _tag_end(text, j)
            span = stack.pop()
            span.end_start, span.end = j, k
            i = k
        else:
            m = _NAME.match(text, j + 1)
            k = _tag_end(text, j)
            empty = text[k - 2] == "/"
            span = ElementSpan(m.group(0) if m else "", j, k, empty)
            out.append(span)
            if not empty:
                stack.append(span)
            i = k
    if stack:
        raise ValueError("unclosed element")
    return out


def _attr_text(name: str, value: str, quote: str = '"') -> str:
    escaped = value.replace("&", "&amp;").replace("<", "&lt;").replace(quote, "&quot;" if quote == '"' else "&apos;")
    return f"{name}={quote}{escaped}{quote}"


def _edit_start_tag(tag: str, edit: Edit) -> str:
    """The start tag *tag* with the attributes of *edit* set and dropped."""
    return _edited_tag(tag, tuple(edit.set_attrs.items()), tuple(edit.drop_attrs))


@functools.lru_cache(maxsize=4096)
def _edited_tag(tag: str, set_attrs: tuple, drop_attrs: tuple) -> str:
    # A function of its strings alone, remembered: a corpus repeats its tags.
    edit = Edit(dict(set_attrs), list(drop_attrs))
    for name in edit.drop_attrs:
        tag = re.sub(r"\s+" + re.escape(name) + r"""\s*=\s*(["']).*?\1""", "", tag, count=1, flags=re.S)
    for name, value in edit.set_attrs.items():
        found = None
        for m in _ATTR.finditer(tag):
            if m.group(2) == name:
                found = m
                break
        if found:
            quote = found.group(4)
            tag = tag[:found.start(2)] + _attr_text(name, value, quote) + tag[found.end():]
        else:
            close = len(tag) - (2 if tag.endswith("/>") else 1)
            body = tag[:close]
            stripped = body.rstrip()
            tag = stripped + " " + _attr_text(name, value) + body[len(stripped):] + tag[close:]
    return tag


def _child_xml(prefix: str | None, name: str, attrs: dict[str, str]) -> str:
    qname = f"{prefix}:{name}" if prefix else name
    return "<" + " ".join([qname] + [_attr_text(k, v) for k, v in attrs.items()]) + "/>"


def apply_edits(text: str, spans, edits: dict[int, Edit],
                prefixes: dict[int, str | None]) -> str:
    """Splice *edits* (element index -> Edit) into the source *text*.

    *spans* is indexed by element index: every element's span, or (for edits
    of attributes alone) those of the edited elements.
    """
    changes: list[tuple[int, int, str]] = []  # (start, end, replacement)
    for index, edit in edits.items():
        span = spans[index]
        tag = text[span.start:span.start_end]
        new_tag = _edit_start_tag(tag, edit)
        for child in edit.drop_children:
            c = spans[child]
            changes.append((c.start, c.end, ""))
        added = "".join(_child_xml(prefixes.get(index), n, a) for n, a in edit.add_children)
        if added and span.empty:
            qname = span.name
            body = new_tag[:-2].rstrip()
            changes.append((span.start, span.start_end, f"{body}>{added}</{qname}>"))
        else:
            if new_tag != tag:
                changes.append((span.start, span.start_end, new_tag))
            if added:
                changes.append((span.end_start, span.end_start, added))
    # One pass from the start, joining the untouched stretches and the
    # replacements (splicing each change into the whole text was quadratic:
    # 200,000 <num> ran past five minutes).  The order is that of applying
    # the changes from the end: at one offset, a zero-width insert at an end
    # tag comes after the removal that ends there.
    changes.sort(key=lambda c: (c[0], c[1]), reverse=True)
    changes.reverse()
    pieces: list[str] = []
    at = 0
    for start, end, repl in changes:
        if start < at:                 # overlapping changes: keep the splice semantics
            return _splice_slowly(text, changes)
        pieces.append(text[at:start])
        pieces.append(repl)
        at = end
    pieces.append(text[at:])
    return "".join(pieces)


def _splice_slowly(text: str, changes: list[tuple[int, int, str]]) -> str:
    out = text
    for start, end, repl in sorted(changes, key=lambda c: (c[0], c[1]), reverse=True):
        out = out[:start] + repl + out[end:]
    return out


def apply_edits_tree(root, elements: list, edits: dict[int, Edit]) -> None:
    """The same edits applied to an lxml tree (the fallback path)."""
    for index, edit in edits.items():
        el = elements[index]
        for name in edit.drop_attrs:
            el.attrib.pop(name, None)
        for name, value in edit.set_attrs.items():
            el.set(name, value)
        for child in edit.drop_children:
            c = elements[child]
            parent = c.getparent()
            if c.tail:
                prev = c.getprevious()
                if prev is not None:
                    prev.tail = (prev.tail or "") + c.tail
                else:
                    parent.text = (parent.text or "") + c.tail
            parent.remove(c)
        ns = etree.QName(el).namespace
        for name, attrs in edit.add_children:
            child = etree.SubElement(el, f"{{{ns}}}{name}" if ns else name)
            for k, v in attrs.items():
                child.set(k, v)
