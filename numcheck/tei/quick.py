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
from dataclasses import dataclass

from lxml import etree

from . import outcomes
from .markup import TEI_NS, lang_hint
from .places import Place
from .survey import XML_LANG, survey
from .write import _edit_start_tag, decode_source

__all__ = ["Quick", "attempt"]

_NUM = f"{{{TEI_NS}}}num"

#: A comment, CDATA, PI, "<!" (a DOCTYPE: declined), or a ``<num>`` start tag (quotes kept whole).
_MARKUP = re.compile(r"""<(?:!--.*?-->|!\[CDATA\[.*?\]\]>|\?.*?\?>|(!)
    |num(?=[\s/>])[^>"']*(?:(?:"[^"]*"|'[^']*')[^>"']*)*>)""", re.S | re.X)
_END = re.compile(r"</num\s*>")
#: A place for an outcome being learnt: it is overwritten whenever the outcome is given.
_NOWHERE = Place(0, "", None, None)


@dataclass(frozen=True)
class _Known:
    """What annotate found for one ``<num>`` source text (in one language, options, limits)."""

    status: str
    damaged: bool
    new_tag: str | None         # the edited start tag, or None if it stays as written
    kept: tuple                 # for outcomes.revive: the NumResult and its edit


class Quick:
    """A file annotated by :func:`attempt`: its bytes, and its results made when asked for."""

    def __init__(self, data: bytes, root, nums: list, known: list[_Known]):
        self.data = data
        self._root, self._nums, self._known = root, nums, known

    def _results(self, which) -> list:
        places = survey(self._root).places
        return [outcomes.revive(self._known[i].kept, self._nums[i].sourceline,
                                places[id(self._nums[i])])[0] for i in which]

    def results(self) -> list:
        """Every number's NumResult, as the general path gives them."""
        return self._results(range(len(self._nums)))

    def batch_fields(self) -> dict:
        """:func:`.annotation.batch_fields` of the result, making only the numbers it lists."""
        counts: dict[str, int] = {}
        damaged = 0
        for k in self._known:
            counts[k.status] = counts.get(k.status, 0) + 1
            damaged += k.damaged
        listed = [i for i, k in enumerate(self._known) if k.status in ("contradiction", "fixed")]
        return {"numbers": len(self._known), "damaged": damaged,
                "flagged": counts.get("contradiction", 0) + counts.get("fixed", 0),
                "restored": 0, "unreadable": 0, "statuses": counts,
                "contradictions": [r.to_dict() for r in self._results(listed)] if listed else [],
                "unreadable_nums": []}


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


_HOLDERS = etree.XPath("//*[@xml:lang]")


def _langs(root, nums: list) -> list[str | None]:
    """The ``xml:lang`` in force at each of *nums* (None: none)."""
    langs: list[str | None] = [None] * len(nums)
    at = {id(el): i for i, el in enumerate(nums)}
    # In document order, so that an inner holder's language comes last.
    for holder in _HOLDERS(root):
        lang = holder.get(XML_LANG)
        for el in holder.iter(_NUM):
            langs[at[id(el)]] = lang
    return langs


def attempt(data: bytes, root, context: tuple, annotate_one, max_nums: int) -> Quick | None:
    """*data* (parsed as *root*) annotated on its text, or None where this path declines.

    *context* is what the outcomes depend on besides the markup and the
    language (notation, fix, limits); ``annotate_one(el, hint)`` gives the
    general path's ``(result, edit, own)`` for one number not met before.
    A file of more than *max_nums* numbers is declined (the general path
    refuses it by the limit).
    """
    nums = list(root.iter(_NUM))
    if not nums or len(nums) > max_nums or any(el.prefix is not None for el in nums):
        return None
    decoded = decode_source(data, root.getroottree().docinfo.encoding)
    if decoded is None:
        return None
    text, codec = decoded
    spans = _spans(text)
    if spans is None or len(spans) != len(nums):
        return None
    prefixed = "xmlns:" in text
    tables = outcomes.by_source(context)
    known: list[_Known] = []
    hint_of: dict[str | None, dict] = {}
    for el, (start, tag_end, end), lang in zip(nums, spans, _langs(root, nums)):
        source = text[start:end]
        if prefixed and ":" in source.replace("xml:", ""):
            return None
        table = hint_of.get(lang)
        if table is None:
            hint = lang_hint(lang)
            table = hint_of[lang] = tables.setdefault(hint, {})
        found = table.get(source)
        if found is None:
            hint = lang_hint(lang)
            found = _learn(el, hint, source[:tag_end - start], annotate_one)
            if found is None:
                return None
            table[source] = found
            outcomes.note(context, hint, source, found)
        known.append(found)
    pieces: list[str] = []
    at = 0
    for (start, tag_end, _), found in zip(spans, known):
        if found.new_tag is not None:
            pieces.append(text[at:start])
            pieces.append(found.new_tag)
            at = tag_end
    out = ("".join(pieces) + text[at:]).encode(codec) if pieces else data
    return Quick(out, root, nums, known)


def _learn(el, hint, tag: str, annotate_one) -> _Known | None:
    res, edit, own = annotate_one(el, hint, _NOWHERE)
    kept = outcomes.snapshot(res, edit) if own else None
    if kept is None:
        return None
    new_tag = None if edit is None else _edit_start_tag(tag, edit)
    return _Known(res.status, bool(res.damaged), None if new_tag == tag else new_tag, kept)
