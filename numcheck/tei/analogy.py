"""Outcomes of plain Greek numbers found by analogy with one learnt the long way.

Most ``<num>`` of a documentary corpus are small letters in their usual
order with the editor's ``@value`` beside them: ``<num value="123">ρκγ</num>``,
or the same with its first letter unclear
(``<num value="123"><unclear>ρ</unclear>κγ</num>``).  When ``@value`` is what
the letters give, annotate finds the same for every such number of one
shape (the ranks its letters hold, whether the first is unclear), but for
three fields: the text read, the value and the ``@value`` kept.  So the
first number of a shape is learnt through the general path (:mod:`.quick`),
and when its outcome is that plain agreement it becomes the *model* of its
shape, under the same options, limits and language; every later number of
that shape is made from the model with those three fields put in.

Only the letters of :data:`_TAKEN` are taken, one at most of each rank,
hundreds before tens before units, and only where ``@value`` is written
as the letters' value in plain digits.  ``tests/test_tei_analogy.py``
compares the outcome made so with the general path's for every such
number, in each shape, language and option of annotate.
"""

from __future__ import annotations

import re
from fractions import Fraction

from ..notations.greek.letters import letter_value

__all__ = ["made", "offer", "forget"]

#: The letters taken: the usual letter of each value, and the archaic koppa ϙ beside ϟ.
_TAKEN = "αβγδεϛζηθικλμνξοπϙϟρστυφχψωϡ"
_VALUE_OF = {ch: letter_value(ch) for ch in _TAKEN}
_RANK_OF = {ch: len(str(v)) - 1 for ch, v in _VALUE_OF.items()}      # units 0, tens 1, hundreds 2
#: The key of a ``<num>`` (:func:`.plaintext.source_key`) of either shape, decoded.
_KEY = re.compile(r' value="([1-9][0-9]{0,2})">(?:<unclear>(.)</unclear>)?(.{0,3})\Z', re.S)
_DOT_BELOW = "\u0323"
#: The contexts in which the analogy is checked (the notation annotate is given).
_NOTATIONS = (None, "greek-documentary")

#: The model of each shape: (context, hint, unclear, ranks) -> its outcome.
_models: dict[tuple, object] = {}


def _shape(key: bytes):
    """``(unclear, ranks, text read, @value)`` of *key* (whether its first letter is
    unclear, the rank of each letter, the text as annotate writes it read), or None where
    it is not of a shape this module takes."""
    try:
        m = _KEY.match(key.decode("utf-8"))
    except UnicodeDecodeError:
        return None
    if m is None:
        return None
    value_text, unclear, rest = m.groups()
    letters = (unclear or "") + rest
    if not letters:
        return None
    ranks = []
    for ch in letters:
        rank = _RANK_OF.get(ch)
        if rank is None or (ranks and rank >= ranks[-1]):
            return None                     # not a letter taken, or out of order
        ranks.append(rank)
    if sum(map(_VALUE_OF.__getitem__, letters)) != int(value_text):
        return None                         # @value says another number: learnt the long way
    text = unclear + _DOT_BELOW + rest if unclear else letters
    return unclear is not None, tuple(ranks), text, value_text


def made(key: bytes, hint, context: tuple):
    """The outcome (:class:`.quick._Known`) of the ``<num>`` of *key* made from its shape's
    model, or None where there is none."""
    if context[0] not in _NOTATIONS:
        return None
    shape = _shape(key)
    if shape is None:
        return None
    unclear, ranks, text, value_text = shape
    model = _models.get((context, hint, unclear, ranks))
    if model is None:
        return None
    cls, fields, attrs, edit_cls = model.kept
    fields = dict(fields, text=text, value=Fraction(int(value_text)),
                  existing={"value": value_text})
    return type(model)(model.status, model.damaged, None, (cls, fields, attrs, edit_cls))


def offer(key: bytes, hint, context: tuple, known) -> None:
    """Make *known* (learnt the long way for *key*) its shape's model where it is the plain
    agreement the analogy holds for (a model learnt by another worker is as good: the
    context holds the options and limits)."""
    if (type(key) is not bytes or type(context) is not tuple or not context
            or context[0] not in _NOTATIONS or getattr(known, "out", True) is not None):
        return
    shape = _shape(key)
    if shape is None:
        return
    unclear, ranks, text, value_text = shape
    where = (context, hint, unclear, ranks)
    if where in _models:
        return
    cls, fields, attrs, _ = known.kept
    if (known.status == "agrees" and attrs is None and fields.get("text") == text
            and fields.get("value") == int(value_text)
            and fields.get("existing") == {"value": value_text}
            and not fields.get("warnings") and not fields.get("alternatives")
            and fields.get("damaged") == unclear == known.damaged):
        _models[where] = known


def forget() -> None:
    """Drop every model (with :func:`.outcomes.forget`)."""
    _models.clear()
