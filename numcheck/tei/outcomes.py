"""The outcomes of ``<num>`` markup already annotated in this process, kept to be given again.

A corpus writes the same numbers again and again: a thousand accounts hold
the same few thousand ``<num value="12">ιβ</num>``.  Without restorations,
what annotate finds for a number (its text, value, status, message and the
attributes to write) follows from the element's own markup, the language in
force, the options and the limits alone: only its place differs.  So the
outcome is kept under that key, and a number with the same markup gets a
copy of it, with its own place.

What depends on more than the element is never kept: an empty ``<num>``
(read from the words before it), a number numcheck cannot read (its reason
names the file and line), a sign without letters, and anything annotated
with restorations (they may come from the table around the number).
``tests/test_tei_outcomes.py`` checks that every file annotates the same
with and without this memory.
"""

from __future__ import annotations

from lxml import etree

from . import analogy

__all__ = ["ENABLED", "MAX_KEPT", "key", "recall", "keep", "forget", "snapshot", "revive",
           "by_source", "NOTING", "note", "take_new", "adopt"]

#: Whether annotate keeps outcomes (the tests turn it off to compare).
ENABLED = True
#: At most this many outcomes are kept (about 1.3 kB each); past it the memory starts again empty.
MAX_KEPT = 20_000

_kept: dict = {}


#: The attributes of the ``<num>`` itself that annotate reads (an ``@xml:id`` is no part of the key).
READ_ATTRIBUTES = frozenset({"value", "atLeast", "atMost", "type"})


def key(el, hint: str | None, notation: str | None, fix: bool, settings: tuple):
    """What a ``<num>``'s outcome depends on: its content, the attributes read, the language
    hint, the options and the limits."""
    items = el.items()
    read = tuple(kv for kv in items if kv[0] in READ_ATTRIBUTES)
    if not len(el):
        content = el.text
    elif len(read) == len(items):
        content = etree.tostring(el, with_tail=False)      # its attributes and content whole
    else:   # its text and each child whole (markup, attributes, text, tail)
        content = (el.text, tuple(etree.tostring(c) for c in el))
    return content, read, hint, notation, bool(fix), settings


def snapshot(res, edit):
    """What :func:`revive` needs to give *res* and *edit* again (None: children are edited)."""
    if edit is not None and (edit.add_children or edit.drop_children):
        return None                     # children are found by their index in one file
    fields = dict(vars(res))            # the place too, overwritten at each revival
    fields.update(existing=dict(res.existing), alternatives=list(res.alternatives),
                  warnings=list(res.warnings))
    attrs = None if edit is None else (dict(edit.set_attrs), list(edit.drop_attrs))
    return type(res), fields, attrs, type(edit)


def revive(kept, line: int | None, place):
    """A fresh copy of the outcome *kept* (a :func:`snapshot`), at *line* and *place*."""
    cls, fields, attrs, edit_cls = kept
    state = fields.copy()
    # The mutable fields fresh; the others are immutable (str, Fraction, tuple, bool).
    state["existing"] = fields["existing"].copy()
    state["alternatives"] = fields["alternatives"].copy()
    state["warnings"] = fields["warnings"].copy()
    state["line"] = line
    state["index"] = place.index
    state["xpath"] = place.xpath
    state["text_line"] = place.text_line
    state["div"] = place.div
    res = cls.__new__(cls)
    res.__dict__ = state
    edit = None if attrs is None else edit_cls(attrs[0].copy(), attrs[1].copy())
    return res, edit


def keep(k, res, edit) -> None:
    """Keep the outcome *res*, *edit* of the markup *k*."""
    kept = snapshot(res, edit)
    if kept is None:
        return
    if len(_kept) >= MAX_KEPT:
        _kept.clear()
    _kept[k] = kept


def recall(k, line: int | None, place):
    """A fresh copy of the outcome kept for *k*, at *line* and *place*; None if none is kept."""
    found = _kept.get(k)
    if found is None:
        return None
    return revive(found, line, place)


def by_source(context: tuple) -> dict[str | None, dict]:
    """The outcomes kept by their source text (:mod:`.quick`) under *context* (options,
    limits): a table for each language hint, of source text -> outcome."""
    tables = _by_source.get(context)
    if tables is None:
        if len(_by_source) >= 8:
            _by_source.clear()
        tables = _by_source[context] = {}
    elif sum(map(len, tables.values())) >= MAX_KEPT:
        tables.clear()
    return tables


_by_source: dict[tuple, dict] = {}


#: Whether the outcomes learnt by source text are noted to be given to other processes
#: (a batch's workers: :mod:`.sharing`); off, nothing is noted.
NOTING = False
_new: list[tuple] = []


def note(context: tuple, hint: str | None, source: str, outcome) -> None:
    """Note an outcome learnt by source text, for :func:`take_new` (when :data:`NOTING`)."""
    if NOTING:
        _new.append((context, hint, source, outcome))


def take_new() -> list[tuple]:
    """The outcomes noted since the last call, as ``(context, hint, source, outcome)``."""
    out = _new[:]
    _new.clear()
    return out


def adopt(records) -> None:
    """Keep outcomes another process learnt (what its :func:`take_new` gave)."""
    for context, hint, source, outcome in records:
        by_source(context).setdefault(hint, {}).setdefault(source, outcome)
        analogy.offer(source, hint, context, outcome)


def forget() -> None:
    """Drop every kept outcome."""
    _kept.clear()
    _by_source.clear()
    _new.clear()
    analogy.forget()
