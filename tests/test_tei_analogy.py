"""An outcome made by analogy (numcheck.tei.analogy) is the general path's (issue 20).

For every number the analogy takes (each order of at most one letter of
each rank, plain or with its first letter unclear, ``@value`` its value),
in each language, option and notation annotate is given with, the outcome
made from its shape's model must equal the one the general path learns for
that number's own element: status, damage, edited text and the whole
result.  Nothing here is from outside the project: the reference is the
general path (the Greek letter values themselves are checked against
published tables in ``test_against_papyri_letters.py``).
"""

from __future__ import annotations

from itertools import product

import pytest

from numcheck.tei import analogy, annotation, outcomes, quick
from numcheck.tei.markup import lang_hint

UNITS, TENS, HUNDREDS = "αβγδεϛζηθ", "ικλμνξοπϙϟ", "ρστυφχψωϡ"


def _numbers() -> list[tuple[str, int]]:
    """Every spelling the analogy takes, with its value."""
    out = []
    for h, t, u in product(("",) + tuple(HUNDREDS), ("",) + tuple(TENS), ("",) + tuple(UNITS)):
        letters = h + t + u
        if letters:
            value = ((HUNDREDS.index(h) + 1) * 100 if h else 0) + \
                    ((TENS.index(t) + 1 if t != "ϟ" else 9) * 10 if t else 0) + \
                    (UNITS.index(u) + 1 if u else 0)
            out.append((letters, value))
    return out


def _key(letters: str, value: int, unclear: bool) -> bytes:
    inner = f"<unclear>{letters[0]}</unclear>{letters[1:]}" if unclear else letters
    return f' value="{value}">{inner}'.encode()


def _learner(notation, fix):
    settings = annotation._settings()

    def one(el, hint, place):
        return annotation._annotate_num(el, "doc.xml", notation, fix, 0, None, {}, None, place,
                                        hint, settings)
    return one, (notation, bool(fix), settings)


def _same(a, b) -> bool:
    return (a.status, a.damaged, a.out, a.kept) == (b.status, b.damaged, b.out, b.kept)


@pytest.mark.parametrize("lang", ["grc", None])
@pytest.mark.parametrize("fix", [False, True])
@pytest.mark.parametrize("notation", [None, "greek-documentary"])
@pytest.mark.parametrize("unclear", [False, True], ids=["plain", "unclear"])
def test_every_number_made_by_analogy_is_what_the_general_path_learns(unclear, notation, fix,
                                                                       lang):
    outcomes.forget()
    one, context = _learner(notation, fix)
    hint = lang_hint(lang)
    numbers = _numbers()
    assert len(numbers) == 10 * 11 * 10 - 1
    made = 0
    for letters, value in numbers:
        key = _key(letters, value, unclear)
        learnt = quick._learn_alone(key, lang, one)
        assert learnt is not None
        found = analogy.made(key, hint, context)
        if found is None:
            analogy.offer(key, hint, context, learnt)
            assert _same(analogy.made(key, hint, context), learnt), key.decode()
        else:
            made += 1
            assert _same(found, learnt), key.decode()
    assert made == len(numbers) - 7         # one model for each of the 7 orders of ranks
    outcomes.forget()


@pytest.mark.parametrize("key", [
    ' value="124">ρκγ',                          # @value is not what the letters give
    ' value="0123">ρκγ',                         # nor written so
    ' value="123">κργ',                          # out of order
    ' value="22">κβ ',                           # a space
    ' value="6">ς',                              # a letter not taken
    ' type="fraction" value="3">γ',              # another attribute
    ' value="1">ᾱ',
    ' value="123"><unclear>ρκ</unclear>γ',       # two unclear letters
    ' value="123">ρ<unclear>κ</unclear>γ',
    '>ρκγ',
])
def test_what_the_analogy_does_not_take(key):
    outcomes.forget()
    one, context = _learner(None, False)
    for letters, value in _numbers():           # every model there is
        k = _key(letters, value, False)
        analogy.offer(k, lang_hint("grc"), context, quick._learn_alone(k, "grc", one))
        k = _key(letters, value, True)
        analogy.offer(k, lang_hint("grc"), context, quick._learn_alone(k, "grc", one))
    assert analogy.made(key.encode(), lang_hint("grc"), context) is None
    outcomes.forget()


def test_a_number_that_disagrees_is_no_model():
    outcomes.forget()
    one, context = _learner(None, False)
    key = _key("ρκγ", 124, False)
    learnt = quick._learn_alone(key, "grc", one)
    assert learnt.status == "contradiction"
    analogy.offer(b' value="123">\xcf\x81\xce\xba\xce\xb3', lang_hint("grc"), context, learnt)
    assert analogy.made(_key("ρκδ", 124, False), lang_hint("grc"), context) is None
    outcomes.forget()
