"""Where a ``<num>`` is, in the terms a reader of the edition uses.

The XML line of an element says little to an editor; the text line does:
the ``@n`` of the ``<lb>`` before it (EpiDoc Guidelines, ``trans-linebreak``)
and the ``<div>`` it is in (``type="textpart"`` with its ``@n``: a column, a
fragment, a side; ``trans-textpart``).  Each number also gets its position
among the file's ``<num>`` in document order and an XPath that finds it
(with the prefix ``tei`` bound to the TEI namespace).
"""

from __future__ import annotations

from dataclasses import dataclass

from .markup import TEI_NS, local_name

__all__ = ["Place", "num_places", "div_label"]


@dataclass(frozen=True)
class Place:
    """Where one ``<num>`` is: its position, XPath, text line and division."""

    index: int                  # 1-based, among the file's <num> in document order
    xpath: str                  # e.g. /tei:TEI/tei:text[1]/tei:body[1]/tei:div[1]/tei:ab[1]/tei:num[3]
    text_line: str | None       # the @n of the <lb> before it, in the same division
    div: str | None             # e.g. "edition", "edition > textpart 2"

    def describe(self) -> str:
        """A short place for messages: ``text line 4 (edition > textpart A)``."""
        parts = []
        if self.text_line is not None:
            parts.append(f"text line {self.text_line}")
        if self.div:
            parts.append(f"({self.div})" if parts else f"in {self.div}")
        return " ".join(parts) or f"<num> {self.index}"


def _step(el) -> str:
    name = local_name(el) or "*"
    parent = el.getparent()
    position = 1
    if parent is not None:
        for c in parent:
            if c is el:
                break
            if c.tag == el.tag:
                position += 1
    prefix = "tei:" if el.tag.startswith(f"{{{TEI_NS}}}") else ""
    if parent is None:
        return f"/{prefix}{name}"
    return f"{prefix}{name}[{position}]"


def _xpath(el) -> str:
    steps = []
    node = el
    while node is not None:
        steps.append(_step(node))
        node = node.getparent()
    steps.reverse()
    return steps[0] + "".join("/" + s for s in steps[1:])


def div_label(div) -> str:
    bits = [div.get("type") or "div"]
    for attr in ("subtype", "n"):
        if div.get(attr):
            bits.append(div.get(attr))
    return " ".join(bits)


def _divs(el) -> list:
    out = []
    node = el.getparent()
    while node is not None:
        if local_name(node) == "div":
            out.append(node)
        node = node.getparent()
    out.reverse()
    return out


def num_places(root) -> dict[int, Place]:
    """The :class:`Place` of every ``<num>`` under *root*, keyed by ``id(element)``.

    Each number on its own, asking the tree; annotate takes them all from one
    walk (:func:`numcheck.tei.survey.survey`), which must give these.
    """
    num_tag, lb_tag = f"{{{TEI_NS}}}num", f"{{{TEI_NS}}}lb"
    places: dict[int, Place] = {}
    last_lb = None          # (n, the innermost <div> around it)
    count = 0
    for el in root.iter():
        if el.tag == lb_tag:
            divs = _divs(el)
            last_lb = (el.get("n"), divs[-1] if divs else None)
        elif el.tag == num_tag:
            count += 1
            divs = _divs(el)
            line = None
            if last_lb is not None and (last_lb[1] is None or last_lb[1] in divs):
                line = last_lb[0]
            if line is None:        # no <lb>: the verse <l n> or table <row n> that holds it
                line = next((a.get("n") for a in el.iterancestors()
                             if a.tag in (f"{{{TEI_NS}}}l", f"{{{TEI_NS}}}row") and a.get("n")), None)
            label = " > ".join(div_label(d) for d in divs) or None
            places[id(el)] = Place(count, _xpath(el), line, label)
    return places
