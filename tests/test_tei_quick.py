"""annotate on a file's text (numcheck.tei.quick) gives what the general path gives (issue 20).

The general path (``outcomes.ENABLED = False``: every number annotated from
its element) is the reference.  Every case of ``test_tei_outcomes.py``
(invented markup of many kinds, the papyri of ``../shared/realdata`` when
present, the demo files) is annotated both ways: the same bytes, results
and batch fields, the first time and again from memory.  Files whose text
could mean another tree are declined, and still annotated the same.
"""

from __future__ import annotations

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from numcheck.errors import NumcheckError
from numcheck.tei import annotation, outcomes, quick
from numcheck.tei.markup import parse_tei
from numcheck.tei.survey import XML_LANG

from test_tei_outcomes import CASES

TEI = "http://www.tei-c.org/ns/1.0"


def _both_ways(data: bytes, monkeypatch, **options):
    """(general, quick first time, quick from memory): each (bytes, JSON, batch fields)."""
    def run():
        out, result = annotation.annotate_bytes(data, "doc.xml", **options)
        fields = annotation._annotate(data, "doc.xml", options.get("alternatives", 0),
                                      options.get("fix", False), options.get("notation"))[1]
        fields = (fields.batch_fields() if isinstance(fields, quick.Quick)
                  else annotation.batch_fields(fields))
        return out, result.to_dict(), fields

    monkeypatch.setattr(outcomes, "ENABLED", False)
    slow = run()
    monkeypatch.setattr(outcomes, "ENABLED", True)
    outcomes.forget()
    return slow, run(), run()


def _taken(data: bytes, **options) -> bool:
    """Whether the quick path annotates *data* (after a first run has learnt its numbers)."""
    annotation.annotate_bytes(data, "doc.xml", **options)
    return isinstance(annotation._annotate(data, "doc.xml", 0, options.get("fix", False),
                                           options.get("notation"))[1], quick.Quick)


@pytest.mark.parametrize("options", [{}, {"fix": True}], ids=["plain", "fix"])
@pytest.mark.parametrize("name, data", CASES, ids=[c[0] for c in CASES])
def test_the_text_path_gives_the_general_paths_result(name, data, options, monkeypatch):
    try:
        slow, first, again = _both_ways(data, monkeypatch, **options)
    except NumcheckError as err:    # a file refused by a limit is refused either way
        pytest.skip(f"refused: {type(err).__name__}")
    assert first == slow
    assert again == slow


def _doc(body: str, head: str = "", root_attrs: str = "") -> bytes:
    return (f'<?xml version="1.0" encoding="UTF-8"?>\n{head}<TEI xmlns="{TEI}"{root_attrs}>'
            f'<text><body>{body}</body></text></TEI>\n').encode("utf-8")


_PLAIN = ('<div xml:lang="grc"><ab><lb n="1"/>κριθῆς <num value="12">ιβ</num> '
          '<num>ρκ<gap reason="lost" quantity="1" unit="character"/></num> '
          '<num value="13">ιβ</num><lb n="2"/><num value="125"><unclear>ρ</unclear>κε</num>'
          '</ab></div><div xml:lang="la"><ab><num>XII</num> <num value="12">ιβ</num></ab></div>')


def test_an_everyday_file_takes_the_text_path(monkeypatch):
    data = _doc(_PLAIN)
    assert _taken(data)
    slow, first, again = _both_ways(data, monkeypatch)
    assert first == slow == again
    # A contradicted value is listed with its place, found only when asked for.
    listed = first[2]["contradictions"]
    assert [(n["text"], n["text_line"], n["xpath"]) for n in listed] == [
        ("ιβ", "1", "/tei:TEI/tei:text[1]/tei:body[1]/tei:div[1]/tei:ab[1]/tei:num[3]")]


@pytest.mark.parametrize("body, head, root_attrs", [
    # A DOCTYPE: an entity could stand for markup.
    (_PLAIN, '<!DOCTYPE TEI [<!ENTITY twelve "ιβ">]>', ""),
    # A prefixed TEI <num>, and a <num> of another namespace beside a TEI one.
    ('<ab><t:num value="12">ιβ</t:num></ab>', "", ' xmlns:t="http://www.tei-c.org/ns/1.0"'),
    ('<ab><num value="12">ιβ</num><x:n xmlns:x="urn:other"><num xmlns="urn:other">ιβ</num>'
     '</x:n></ab>', "", ""),
    # A prefix inside a <num> in a file that binds one: its meaning is the binding's.
    ('<ab><num>ρκ<t:gap reason="lost" quantity="1" unit="character"/></num></ab>', "",
     ' xmlns:t="http://www.tei-c.org/ns/1.0"'),
    # A comment or PI inside a <num>; a <num> inside a <num>.
    ('<ab><num value="12">ι<!-- </num> -->β</num></ab>', "", ""),
    ('<ab><num value="12">ι<?pi </num>?>β</num></ab>', "", ""),
    ('<ab><num value="12">ιβ<num value="2">β</num></num></ab>', "", ""),
    # Outcomes that depend on more than the markup: words before an empty <num>, an unreadable one.
    ('<ab xml:lang="grc">ἕξ <num/></ab>', "", ""),
    ('<ab xml:lang="grc"><num>??</num></ab>', "", ""),
], ids=["doctype", "prefixed num", "other namespace", "prefix inside", "comment", "pi",
        "nested", "words before", "unreadable"])
def test_files_whose_text_could_mislead_are_declined(body, head, root_attrs, monkeypatch):
    data = _doc(body, head, root_attrs)
    slow, first, again = _both_ways(data, monkeypatch)
    assert first == slow == again
    assert not _taken(data)


def test_a_comment_outside_the_numbers_is_no_hindrance(monkeypatch):
    data = _doc('<!-- <num>ιγ</num> --><ab xml:lang="grc"><num value="12">ιβ</num><?pi x?></ab>')
    assert _taken(data)
    slow, first, again = _both_ways(data, monkeypatch)
    assert first == slow == again


def test_the_language_is_part_of_the_key(monkeypatch):
    # The same text under Greek and under Latin: each read in its own language.
    data = _doc('<ab xml:lang="grc"><num>Ι</num></ab><ab xml:lang="la"><num>Ι</num></ab>'
                '<ab><num xml:lang="la">Ι</num><num>Ι</num></ab>')
    slow, first, again = _both_ways(data, monkeypatch)
    assert first == slow == again


def test_the_options_and_limits_are_part_of_the_key(monkeypatch):
    from numcheck import limits

    data = _doc('<ab xml:lang="grc"><num value="13">ιβ</num><num>ιβ</num></ab>')
    outcomes.forget()
    plain = annotation.annotate_bytes(data)[1].to_dict()
    fixed = annotation.annotate_bytes(data, fix=True)[1].to_dict()
    assert [n["status"] for n in plain["nums"]] == ["contradiction", "value-added"]
    assert [n["status"] for n in fixed["nums"]] == ["fixed", "value-added"]
    monkeypatch.setattr(limits, "MAX_PLACES", 1)
    assert {n["status"] for n in annotation.annotate_bytes(data)[1].to_dict()["nums"]} == {"unreadable"}


_SNIPPETS = ['<num value="12">ιβ</num>', '<num>ιβ</num>', "<num value='13'>ιβ</num>",
             '<num value="1/3" type="fraction">γʹ</num>', '<num rend="a>b" value="7">ζ</num>',
             '<num>ρκ<gap reason="lost" quantity="1" unit="character"/></num>',
             '<num value="125"><unclear>ρ</unclear>κε</num>', '<num value="6"/>',
             '<num\nvalue="20" >κ</num >', '<num value="2"><expan><ex>διώβολον</ex></expan></num>',
             '<num value="4">&#948;</num>', '<num>XIV</num>', '<num xml:lang="la">XII</num>']


@settings(max_examples=60, deadline=None)
@given(st.lists(st.tuples(st.sampled_from(_SNIPPETS), st.sampled_from([None, "grc", "la", "en"])),
                min_size=1, max_size=12))
def test_random_files_annotate_the_same_either_way(parts):
    body = "".join((f'<ab xml:lang="{lang}">' if lang else "<ab>") + f'<lb n="{i}"/>x {s}</ab>'
                   for i, (s, lang) in enumerate(parts))
    data = _doc(body)
    saved = outcomes.ENABLED
    try:
        outcomes.ENABLED = False
        slow = annotation.annotate_bytes(data, "doc.xml")
        outcomes.ENABLED = True
        for _ in range(2):
            out, result = annotation.annotate_bytes(data, "doc.xml")
            assert out == slow[0]
            assert result.to_dict() == slow[1].to_dict()
    finally:
        outcomes.ENABLED = saved
    root = parse_tei("doc.xml", data)
    assert len(quick._spans(data.decode("utf-8"))) == len(list(root.iter(f"{{{TEI}}}num")))


_NESTED = st.recursive(
    st.sampled_from(_SNIPPETS + ["x", "<lb/>", "<!-- c -->", "<?pi x?>", '<numeral n="1"/>']),
    lambda inner: st.tuples(st.sampled_from([None, "grc", "la"]), st.lists(inner, max_size=4)).map(
        lambda t: (f'<seg xml:lang="{t[0]}">' if t[0] else "<seg>") + "".join(t[1]) + "</seg>"),
    max_leaves=14)


@settings(max_examples=200, deadline=None)
@given(st.lists(_NESTED, min_size=1, max_size=6))
def test_the_plain_split_and_the_languages_agree_with_the_tree(parts):
    """The split by one expression, where it is taken, is the careful split; the languages
    from the few xml:lang holders are those found by walking every number."""
    data = _doc("<ab>" + "".join(parts) + "</ab>")
    root = parse_tei("doc.xml", data)
    text = data.decode("utf-8")
    nums = list(root.iter(f"{{{TEI}}}num"))
    careful = quick._split_careful(text, nums)
    plain = quick._split_plain(text)
    if plain is not None and len(plain) // 2 == len(nums):
        assert plain == careful
    if "<!--" not in text and "<?pi" not in text:
        assert careful is not None and len(careful) // 2 == len(nums)
    by_xpath = quick._langs(root, len(nums))
    saved = quick._FEW_HOLDERS
    try:
        quick._FEW_HOLDERS = -1
        by_walk = quick._langs(root, len(nums))
    finally:
        quick._FEW_HOLDERS = saved
    expected = []
    for el in nums:
        holder = next((a for a in el.iterancestors() if a.get(XML_LANG) is not None), None)
        expected.append(el.get(XML_LANG) if el.get(XML_LANG) is not None
                        else holder.get(XML_LANG) if holder is not None else None)
    assert by_xpath == by_walk == expected
