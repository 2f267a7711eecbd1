"""One walk over a parsed TEI document: what annotate needs to know of every ``<num>``.

Annotate needs, for each ``<num>``: its position among the document's
elements (the edits are keyed by it), its :class:`~.places.Place` (index,
XPath, text line, division) and the ``xml:lang`` in force.  Asking the tree
for each number apart (walking up its ancestors, counting its siblings, an
XPath query for the language) cost more than reading the number; one walk in
document order knows them all, since an element's parent comes before it.

:func:`num_places` (the walk per number) stays the reference:
``tests/test_tei_survey.py`` checks that both give the same places.
"""

from __future__ import annotations

from dataclasses import dataclass

from .markup import TEI_NS
from .places import Place, div_label

__all__ = ["Survey", "survey", "XML_LANG"]

XML_LANG = "{http://www.w3.org/XML/1998/namespace}lang"

_NUM, _LB = f"{{{TEI_NS}}}num", f"{{{TEI_NS}}}lb"
_LINE_HOLDERS = (f"{{{TEI_NS}}}l", f"{{{TEI_NS}}}row")


@dataclass
class Survey:
    """The elements of a document in order, its ``<num>``, their places and languages."""

    elements: list                  # every element (comments and PIs left out), document order
    index_of: dict[int, int]        # id(element) -> its position in ``elements``
    nums: list                      # the TEI <num> elements, document order
    places: dict[int, Place]        # id(<num>) -> its Place
    langs: dict[int, str | None]    # id(<num>) -> the xml:lang in force (None: none)


def _local(tag: str) -> str:
    return tag.rsplit("}", 1)[-1] if tag.startswith("{") else tag


def survey(root) -> Survey:
    """Walk *root* once, in document order (see the module's docstring)."""
    elements: list = []
    index_of: dict[int, int] = {}
    nums: list = []
    places: dict[int, Place] = {}
    langs: dict[int, str | None] = {}
    steps: dict[str, str] = {}          # tag -> "tei:name" (the XPath step without position)
    paths: dict[int, str] = {}          # id(element) -> its XPath
    divs_in: dict[int, tuple] = {}      # id(element) -> the <div> it is or is in (outermost first)
    labels: dict[int, str | None] = {}  # id(element) -> the label of divs_in
    lang_in: dict[int, str | None] = {}
    seen: dict[tuple, int] = {}         # (id(parent), tag) -> children with that tag so far
    last_lb = None                      # (n, id of the innermost <div> around it, or None)
    count = 0
    for el in root.iter():
        tag = el.tag
        if not isinstance(tag, str):
            continue
        me = id(el)
        index_of[me] = len(elements)
        elements.append(el)
        step = steps.get(tag)
        if step is None:
            step = steps[tag] = ("tei:" if tag.startswith(f"{{{TEI_NS}}}") else "") + _local(tag)
        parent = el.getparent()
        own_lang = el.get(XML_LANG)
        if parent is None:
            paths[me] = "/" + step
            divs, label, lang = (), None, own_lang
        else:
            up = id(parent)
            key = (up, tag)
            position = seen.get(key, 0) + 1
            seen[key] = position
            paths[me] = f"{paths[up]}/{step}[{position}]"
            divs, label = divs_in[up], labels[up]
            lang = own_lang if own_lang is not None else lang_in[up]
        lang_in[me] = lang
        if tag == _NUM:
            count += 1
            line = None
            if last_lb is not None and (last_lb[1] is None or any(id(d) == last_lb[1] for d in divs)):
                line = last_lb[0]
            if line is None:        # no <lb>: the verse <l n> or table <row n> that holds it
                line = next((a.get("n") for a in el.iterancestors()
                             if a.tag in _LINE_HOLDERS and a.get("n")), None)
            places[me] = Place(count, paths[me], line, label)
            langs[me] = lang
            nums.append(el)
        elif tag == _LB:
            last_lb = (el.get("n"), id(divs[-1]) if divs else None)
        if _local(tag) == "div":
            divs = divs + (el,)
            label = " > ".join(div_label(d) for d in divs)
        divs_in[me], labels[me] = divs, label
    return Survey(elements, index_of, nums, places, langs)
