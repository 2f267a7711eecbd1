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
    kinds: dict[str, tuple] = {}        # tag -> (XPath step without position, is a <div>)
    # id(element) -> (its XPath, the <div> it is or is in (outermost first),
    # their label, the xml:lang in force)
    state: dict[int, tuple] = {}
    seen: dict[tuple, int] = {}         # (id(parent), tag) -> children with that tag so far
    last_lb = None                      # (n, id of the innermost <div> around it, or None)
    count = 0
    holders = root.xpath("//*[@xml:lang]")         # kept alive: their ids stay theirs
    with_lang = {id(e) for e in holders}
    for el in root.iter():
        tag = el.tag
        if tag.__class__ is not str:
            continue                    # a comment, PI or entity
        me = id(el)
        index_of[me] = len(elements)
        elements.append(el)
        kind = kinds.get(tag)
        if kind is None:
            local = _local(tag)
            kind = kinds[tag] = (("tei:" if tag.startswith(f"{{{TEI_NS}}}") else "") + local,
                                 local == "div")
        parent = el.getparent()
        if parent is None:
            position = 0
            path, divs, label, lang = "", (), None, None
        else:
            up = id(parent)
            key = (up, tag)
            position = seen[key] = seen.get(key, 0) + 1     # every element counts for its siblings
            path, divs, label, lang = state[up]
        if tag == _LB:
            last_lb = (el.get("n"), id(divs[-1]) if divs else None)
        if tag != _NUM and not len(el):
            continue                    # a leaf: no number is in it, nor needs its path
        path = f"{path}/{kind[0]}[{position}]" if position else "/" + kind[0]
        if me in with_lang:
            lang = el.get(XML_LANG)
        if tag == _NUM:
            count += 1
            line = None
            if last_lb is not None and (last_lb[1] is None or any(id(d) == last_lb[1] for d in divs)):
                line = last_lb[0]
            if line is None:        # no <lb>: the verse <l n> or table <row n> that holds it
                line = next((a.get("n") for a in el.iterancestors()
                             if a.tag in _LINE_HOLDERS and a.get("n")), None)
            places[me] = Place(count, path, line, label)
            langs[me] = lang
            nums.append(el)
        elif kind[1]:
            divs = divs + (el,)
            label = " > ".join(div_label(d) for d in divs)
        state[me] = (path, divs, label, lang)
    return Survey(elements, index_of, nums, places, langs)
