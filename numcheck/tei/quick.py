"""Annotate a file whose ``<num>`` were all met before, working on its text.

A corpus writes the same numbers again and again, and what annotate does to
a ``<num>`` without restorations follows from its markup, the language in
force, the options and the limits (:mod:`.outcomes`).  This module takes
that one step further: it keys the outcome by the element's *source text*
(from ``<num`` to ``</num>``) and the language, so that a file all of whose
numbers were met before is annotated with no Python step per element of the
tree: lxml parses it (and so checks it), one regular expression finds the
numbers in the text, each is looked up, and the edited start tags are
spliced in.  A number's place (its XPath, text line, division) is worked
out only when it is asked for.

The same source text means the same element only where the text is free of
context, and :func:`attempt` declines (returns None; the general path then
annotates the file) wherever it might not be:

- a DOCTYPE (its entities could expand to anything), a text that does not
  decode to itself, or markup the expression does not take;
- a ``<num>`` with a prefix, or a ``<num>`` found in the text that is not a
  TEI ``<num>`` of the tree (another namespace), or one inside another;
- a comment, CDATA section or processing instruction inside a ``<num>``;
- in a file that binds namespace prefixes, a ``:`` in a ``<num>``'s text
  other than ``xml:`` (its meaning would depend on the bindings);
- a number whose outcome depends on more than its markup: an empty
  ``<num>`` read from the words before it, one numcheck cannot read, and
  any edit of children (:func:`.outcomes.snapshot`).

``tests/test_tei_quick.py`` checks that every file annotates to the same
bytes and the same result through this path as through the general one.
"""

from __future__ import annotations

import re
from collections import Counter
from dataclasses import dataclass
from operator import attrgetter

from lxml import etree

from .. import limits
from ..errors import NumcheckError
from . import analogy, outcomes, plaintext
from .markup import TEI_NS, lang_hint, parse_tei
from .places import Place
from .survey import XML_LANG, survey
from .write import _edit_start_tag, decode_source

__all__ = ["Quick", "attempt", "attempt_text"]

_NUM = f"{{{TEI_NS}}}num"

#: A comment, CDATA, PI, "<!" (a DOCTYPE: declined), or a ``<num>`` start tag (quotes kept whole).
_MARKUP = re.compile(r"""<(?:!--.*?-->|!\[CDATA\[.*?\]\]>|\?.*?\?>|(!)
    |num(?=[\s/>])[^>"']*(?:(?:"[^"]*"|'[^']*')[^>"']*)*>)""", re.S | re.X)
_END = re.compile(r"</num\s*>")
#: A place for an outcome being learnt: it is overwritten whenever the outcome is given.
_NOWHERE = Place(0, "", None, None)


@dataclass(frozen=True, eq=False)
class _Known:
    """What annotate found for one ``<num>`` source text (in one language, options, limits)."""

    status: str
    damaged: bool
    out: bytes | None           # the source with its start tag edited (UTF-8), or None if it stays
    kept: tuple                 # for outcomes.revive: the NumResult and its edit


_STATUS = attrgetter("status")
_DAMAGED = attrgetter("damaged")


class Quick:
    """A file annotated by :func:`attempt` or :func:`attempt_text`: its bytes, and its results
    made when asked for (from the tree of *source*, parsed then, when no *root* is given)."""

    def __init__(self, data: bytes, root, known: list[_Known], source: bytes | None = None):
        self.data = data
        self._root, self._known, self._source = root, known, source

    def _results(self, which) -> list:
        if self._root is None:
            self._root = parse_tei("<input>", self._source)
        nums = list(self._root.iter(_NUM))
        places = survey(self._root).places
        return [outcomes.revive(self._known[i].kept, nums[i].sourceline,
                                places[id(nums[i])])[0] for i in which]

    def results(self) -> list:
        """Every number's NumResult, as the general path gives them."""
        return self._results(range(len(self._known)))

    def batch_fields(self) -> dict:
        """:func:`.annotation.batch_fields` of the result, making only the numbers it lists."""
        counts = Counter(map(_STATUS, self._known))
        listed = ([i for i, k in enumerate(self._known) if k.status in _LISTED]
                  if "contradiction" in counts or "fixed" in counts else [])
        return {"numbers": len(self._known), "damaged": sum(map(_DAMAGED, self._known)),
                "flagged": counts.get("contradiction", 0) + counts.get("fixed", 0),
                "restored": 0, "unreadable": 0, "statuses": dict(counts),
                "contradictions": [r.to_dict() for r in self._results(listed)] if listed else [],
                "unreadable_nums": []}


_LISTED = ("contradiction", "fixed")


def _spans(text: str) -> list[tuple[int, int, int]] | None:
    """(start, end of the start tag, end) of every ``<num>`` in *text*; None to decline."""
    spans = []
    last = 0
    for m in _MARKUP.finditer(text):
        if m.group(1):
            return None                         # a DOCTYPE
        start = m.start()
        if text[start + 1] != "n":
            if start < last:
                return None                     # a comment, CDATA or PI inside a <num>
            continue
        if start < last:
            return None                         # a <num> inside a <num>
        tag_end = m.end()
        if text[tag_end - 2] == "/":
            spans.append((start, tag_end, tag_end))
            last = tag_end
            continue
        end = _END.search(text, tag_end)
        if end is None:
            return None
        spans.append((start, tag_end, end.end()))
        last = end.end()
    return spans


#: A whole ``<num>`` element (start tag, quotes kept whole, to the first ``</num>``), as one group.
#: A ``<num>`` element whole, to the first ``</num>`` after it.  An empty ``<num/>`` is found
#: whole only where this is not tried first: where it is, the match runs on into the next
#: ``<num>``, and the count of ``<num`` in the text then sends the file to the careful split.
_WHOLE = re.compile(r"(<num[\s>][^<]*(?:<(?!/num\s*>)[^<]*)*</num\s*>|<num(?:\s[^<>]*)?/>)")
_START = re.compile(r"""<num[^>"']*(?:(?:"[^"]*"|'[^']*')[^>"']*)*>""")


def _split_plain(text: str) -> list[str] | None:
    """*text* split into the text between ``<num>`` and the ``<num>`` (odd items), where that
    is safe by the text alone: no comment, CDATA, DOCTYPE or processing instruction (after
    the XML declaration), no namespace but the root's default one.  None otherwise."""
    start = text.index("?>") + 2 if text.startswith("<?xml") else 0
    if ("<!" in text or text.find("<?", start) >= 0 or "xmlns:" in text
            or text.count("xmlns=") > 1):
        return None
    parts = _WHOLE.split(text)
    # Every "<num" is then a TEI <num> start tag, found whole and not inside another.
    return parts if text.count("<num") == len(parts) // 2 else None


def _split_careful(text: str, nums: list) -> list[str] | None:
    """:func:`_split_plain` of any text, with the checks done on the tree; None to decline."""
    if any(el.prefix is not None for el in nums):
        return None
    spans = _spans(text)
    if spans is None or len(spans) != len(nums):
        return None
    parts: list[str] = []
    at = 0
    for start, _, end in spans:
        parts.append(text[at:start])
        parts.append(text[start:end])
        at = end
    parts.append(text[at:])
    if "xmlns:" in text and any(":" in src.replace("xml:", "") for src in parts[1::2]):
        return None             # a prefix in a <num>: its meaning depends on the bindings
    return parts


_LANG_ATTRIBUTES = etree.XPath("//@xml:lang")
_BEFORE = etree.XPath("count(preceding::t:num)", namespaces={"t": TEI_NS})
_WITHIN = etree.XPath("count(descendant-or-self::t:num)", namespaces={"t": TEI_NS})
#: Past this many elements with ``xml:lang`` the languages are found by walking the numbers.
_FEW_HOLDERS = 8


def _langs(root, count: int) -> list[str | None]:
    """The ``xml:lang`` in force at each of the *count* ``<num>`` of *root* (None: none)."""
    langs: list[str | None] = [None] * count
    holders = [a.getparent() for a in _LANG_ATTRIBUTES(root)]      # in document order
    if len(holders) <= _FEW_HOLDERS:
        # In document order, so that an inner holder's language comes last; the
        # numbers inside one element follow each other in document order.
        for holder in holders:
            first, n = int(_BEFORE(holder)), int(_WITHIN(holder))
            if n:
                langs[first:first + n] = [holder.get(XML_LANG)] * n
        return langs
    nums = list(root.iter(_NUM))        # kept: an element's id() holds while it lives
    at = {id(el): i for i, el in enumerate(nums)}
    for holder in holders:
        lang = holder.get(XML_LANG)
        for el in holder.iter(_NUM):
            langs[at[id(el)]] = lang
    return langs


def attempt_text(data: bytes, context: tuple, annotate_one, max_nums: int) -> Quick | None:
    """*data* annotated from its text alone, with no tree, or None where this path declines.

    It is taken when the file is plain (:mod:`.plaintext`): libxml2 checks
    the file without building a tree, and a number not met before (in the
    same language, under the same *context*) is learnt from its element
    parsed alone (:func:`_learn_alone`), at most :data:`LEARN_ALONE` of
    them, unless it is made by analogy with another (:mod:`.analogy`).
    Else :func:`attempt` (with the tree) or the general path annotates the
    file, and reports what is wrong with it.
    """
    if type(data) is not bytes or len(data) > limits.MAX_XML_BYTES:
        return None
    at = plaintext.plain_body(data)
    if at is None:
        return None
    split = plaintext.split_nums(data, at)
    if split is None or not 0 < len(split[1]) <= max_nums:
        return None
    pieces, keys = split
    langs = plaintext.langs(data, at, pieces)
    if langs is None:
        return None
    tables = outcomes.by_source(context)
    known = _look_up(tables, langs, keys)
    if None in known:
        _by_analogy(known, keys, langs, tables, context)
    if (known.count(None) > LEARN_ALONE
            or not plaintext.nesting_within(data, at, limits.MAX_XML_DEPTH)
            or not plaintext.well_formed(data)):
        return None
    if None in known and not _fill(known, keys, langs, tables, context,
                                   lambda i: _learn_alone(keys[i], langs[i], annotate_one)):
        return None
    if any(map(_EDITED, known)):
        pieces = pieces[:]
        for i, k in enumerate(known, 1):
            if k.out is not None:       # the edited source, then what followed the source
                pieces[i] = k.out[4:] + pieces[i][_source_length(keys[i - 1]):]
        out = data[:at] + b"<num".join(pieces)
    else:
        out = data
    return Quick(out, None, known, source=data)


_EDITED = attrgetter("out")


def _source_length(key: bytes) -> int:
    """The length of the source of *key* after its ``<num`` (:func:`.plaintext.source_key`)."""
    return len(key) - 4 if key.startswith(b"<") else len(key) + 6


#: At most this many numbers of a file are learnt each from its element alone; past it the
#: file's tree is built (:func:`attempt`).
LEARN_ALONE = 32
_ALONE_PARSER = etree.XMLParser(resolve_entities=False, no_network=True, huge_tree=False,
                                load_dtd=False)


def _learn_alone(key: bytes, lang: str | None, annotate_one) -> _Known | None:
    """What annotate finds for the ``<num>`` of *key* in a plain file, from that element
    parsed alone (None where it must be learnt in its file).

    What is kept depends on the element's markup alone (:func:`.outcomes.snapshot`:
    a number read from the words before it, or not read, is not kept), and in a
    plain file the element's text means the same alone as in its place.  Any
    error (a limit, which names the line) is left for the file's own tree to say.
    """
    source = plaintext.source_of(key)
    try:
        wrapper = etree.fromstring(b'<ab xmlns="' + _TEI_NS_BYTES + b'">' + source + b"</ab>",
                                   _ALONE_PARSER)
        return _learn(wrapper[0], lang_hint(lang), source.decode("utf-8"), annotate_one)
    except (etree.XMLSyntaxError, UnicodeDecodeError, NumcheckError):
        return None


_TEI_NS_BYTES = TEI_NS.encode("ascii")


def _look_up(tables: dict, langs: list, keys: list) -> list:
    """What was found for each source's key in its language (None: not met before)."""
    first = langs[0]
    if langs.count(first) == len(langs):             # one language for all (the usual case)
        return list(map(tables.setdefault(lang_hint(first), {}).get, keys))
    hints = {lang: lang_hint(lang) for lang in set(langs)}
    return [tables.setdefault(hints[lang], {}).get(key) for lang, key in zip(langs, keys)]


def _by_analogy(known: list, keys: list, langs: list, tables: dict, context: tuple) -> None:
    """Put in *known* each outcome not met before that its shape's model makes
    (:mod:`.analogy`), keeping it for the next files."""
    for i, found in enumerate(known):
        if found is None:
            hint = lang_hint(langs[i])
            found = analogy.made(keys[i], hint, context)
            if found is not None:
                tables.setdefault(hint, {})[keys[i]] = known[i] = found


def _fill(known: list, keys: list, langs: list, tables: dict, context: tuple, learn) -> bool:
    """Put in *known* what ``learn(i)`` finds for each number not met before, keeping it for
    the next files; False where one cannot be learnt (the file is declined)."""
    for i, found in enumerate(known):
        if found is None:
            hint = lang_hint(langs[i])
            table = tables.setdefault(hint, {})
            found = table.get(keys[i])      # the same markup earlier in this file
            if found is None:
                found = analogy.made(keys[i], hint, context)
                if found is None:
                    found = learn(i)
                    if found is None:
                        return False
                    analogy.offer(keys[i], hint, context, found)
                    outcomes.note(context, hint, keys[i], found)
                table[keys[i]] = found
            known[i] = found
    return True


def attempt(data: bytes, root, context: tuple, annotate_one, max_nums: int) -> Quick | None:
    """*data* (parsed as *root*) annotated on its text, or None where this path declines.

    *context* is what the outcomes depend on besides the markup and the
    language (notation, fix, limits); ``annotate_one(el, hint)`` gives the
    general path's ``(result, edit, own)`` for one number not met before.
    A file of more than *max_nums* numbers is declined (the general path
    refuses it by the limit).
    """
    count = int(_COUNT(root))
    if not count or count > max_nums:
        return None
    decoded = decode_source(data, root.getroottree().docinfo.encoding)
    if decoded is None:
        return None
    text, codec = decoded
    parts = _split_plain(text)
    nums = None
    if parts is None or len(parts) // 2 != count:
        nums = list(root.iter(_NUM))
        parts = _split_careful(text, nums)
        if parts is None:
            return None
    sources = parts[1::2]
    keys = [plaintext.source_key(src.encode("utf-8")) for src in sources]
    tables = outcomes.by_source(context)
    langs = _langs(root, count)
    known = _look_up(tables, langs, keys)
    if None in known:
        if nums is None:
            nums = list(root.iter(_NUM))
        learn = lambda i: _learn(nums[i], lang_hint(langs[i]), sources[i], annotate_one)  # noqa: E731
        if not _fill(known, keys, langs, tables, context, learn):
            return None
    if any(map(_EDITED, known)):
        parts[1::2] = [src if k.out is None else k.out.decode("utf-8")
                       for src, k in zip(sources, known)]
        out = "".join(parts).encode(codec)
    else:
        out = data
    return Quick(out, root, known)


_COUNT = etree.XPath("count(//t:num)", namespaces={"t": TEI_NS})


def _learn(el, hint, source: str, annotate_one) -> _Known | None:
    res, edit, own = annotate_one(el, hint, _NOWHERE)
    kept = outcomes.snapshot(res, edit) if own else None
    if kept is None:
        return None
    out = None
    if edit is not None:
        tag = _START.match(source).group()
        new_tag = _edit_start_tag(tag, edit)
        if new_tag != tag:
            out = (new_tag + source[len(tag):]).encode("utf-8")
    return _Known(res.status, bool(res.damaged), out, kept)
