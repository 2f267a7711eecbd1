"""What the text of a plain TEI file tells without its tree (numcheck.tei.plaintext, issue 20).

Each answer the text gives is checked against lxml's tree of the same file
on random files built to mislead: ``>`` and ``/>`` in attribute values and
in the text, both quotes, ``xml:lang`` written in the text or inside
another attribute, elements named like ``<num>``, nested holders of the same
name, prefixes bound and unbound, processing instructions, comments and
damaged markup.  Where the text answers, the answer is the tree's; and a
file annotated from its text alone is annotated as the general path does.
"""

from __future__ import annotations

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st
from lxml import etree

from numcheck.errors import NumcheckError
from numcheck.tei import annotation, outcomes, plaintext, quick
from numcheck.tei.markup import parse_tei
from numcheck.tei.survey import XML_LANG

TEI = "http://www.tei-c.org/ns/1.0"
NUM = f"{{{TEI}}}num"

#: Markup a plain file may hold (some of it misleading to a careless reader of the text) ...
_PLAIN_LEAVES = ['<num value="12">ιβ</num>', "<num>ιβ</num>", "<num value='13'>ιβ</num>",
                 '<num>ρκ<gap reason="lost" quantity="1" unit="character"/></num>',
                 '<num value="125"><unclear>ρ</unclear>κε</num>', '<num value="6"/>', "<num/>",
                 '<num\nvalue="20" >κ</num >', '<num xml:lang="la">XII</num>', "<numeral n='1'/>",
                 '<num n="say xml:lang=\'la\'">ι</num>', "<num n='it\"s'>ι</num>",
                 "x", ' xml:lang="la" ', "<lb/>", '<lb n="2"/>', "&amp;", "&#948;", "<segment>ι</segment>",
                 "<seg/>", '<seg xml:lang="grc"/>']
#: ... and markup that makes a file not plain, or not well formed.
_OTHER_LEAVES = ['<num rend="a>b" value="7">ζ</num>', '<num rend="x/>y">ζ</num>', "a > b", "a/>b",
                 "<!-- c -->", "<?pi x?>", "<![CDATA[<num>ι</num>]]>", "<t:seg>ι</t:seg>",
                 '<seg t:n="1">ι</seg>', '<x:n xmlns:x="urn:other"><num xmlns="urn:other">ι</num></x:n>',
                 '<seg xmlns="urn:other"><num>ι</num></seg>', "<num>", "</seg>", "&nbsp;"]
_LEAVES = st.one_of(*[st.sampled_from(_PLAIN_LEAVES)] * 6, st.sampled_from(_OTHER_LEAVES))
_HOLDERS = [None, "grc", "la", "en", "gr c", "grc&#45;x"]


def _element(name: str, lang, quote: str, inner: list[str]) -> str:
    attr = "" if lang is None else f" xml:lang={quote}{lang}{quote}"
    return f"<{name}{attr}>" + "".join(inner) + f"</{name}>"


_TREES = st.recursive(
    _LEAVES,
    lambda inner: st.builds(_element, st.sampled_from(["seg", "ab", "seg"]), st.sampled_from(_HOLDERS),
                            st.sampled_from(['"', "'"]), st.lists(inner, max_size=4)),
    max_leaves=16)

_PROLOGS = ['<?xml version="1.0" encoding="UTF-8"?>\n', "", "<?xml version='1.0'?>",
            '<?xml version="1.0" encoding="UTF-8"?>\n<?xml-model href="http://x/y.rng"?>\n',
            '<?xml version="1.0" encoding="ISO-8859-1"?>\n']
_ROOTS = [f'<TEI xmlns="{TEI}">', f"<TEI xmlns='{TEI}' xml:lang='grc'>",
          f'<TEI n="1" xmlns="{TEI}">', f'<TEI xmlns:t="{TEI}" xmlns="{TEI}">',
          f"<TEI n='xmlns=\"{TEI}\"'>", f'<TEIxmlns="{TEI}">', f'<t:TEI xmlns:t="{TEI}">']


@st.composite
def _files(draw) -> bytes:
    root = draw(st.sampled_from(_ROOTS[:3]) if draw(st.integers(0, 3)) else st.sampled_from(_ROOTS))
    body = "".join(draw(st.lists(_TREES, min_size=1, max_size=5)))
    close = "</t:TEI>" if root.startswith("<t:") else "</TEI>"
    text = draw(st.sampled_from(_PROLOGS)) + root + "<text><body><ab>" + body + "</ab></body></text>" + close
    data = text.encode("utf-8")
    if draw(st.integers(0, 5)) == 0:        # damaged: a byte cut out
        k = draw(st.integers(0, len(data) - 1))
        data = data[:k] + data[k + 1:]
    return data


def _tree(data: bytes):
    """lxml's tree of *data* with numcheck's parser, or None where it is refused."""
    try:
        return parse_tei("doc.xml", data)
    except NumcheckError:
        return None


def _expected_langs(nums) -> list:
    out = []
    for el in nums:
        holder = next((a for a in el.iterancestors() if a.get(XML_LANG) is not None), None)
        own = el.get(XML_LANG)
        out.append(own if own is not None else holder.get(XML_LANG) if holder is not None else None)
    return out


def _depth(root) -> int:
    return max(len(list(el.iterancestors())) + 1 for el in root.iter())


@settings(max_examples=1200, deadline=None)
@given(_files())
def test_what_the_text_tells_is_what_the_tree_holds(data):
    at = plaintext.plain_body(data)
    if at is None:
        return
    checked = plaintext.well_formed(data)
    root = _tree(data)
    # libxml2's check without a tree refuses what the tree parse refuses.
    assert checked == (root is not None)
    if root is None:
        return
    nums = list(root.iter(NUM))
    split = plaintext.split_nums(data, at)
    if split is not None:
        pieces, keys = split
        assert data[:at] + b"<num".join(pieces) == data
        assert len(keys) == len(nums)
        sources = quick._split_careful(data.decode("utf-8"), nums)
        assert sources is not None
        assert [plaintext.source_of(k).decode("utf-8") for k in keys] == sources[1::2]
        found = plaintext.langs(data, at, pieces)
        if found is not None:
            assert found == _expected_langs(nums)
    depth = _depth(root)
    saved = plaintext._TAGS_A_PIECE
    try:
        for plaintext._TAGS_A_PIECE in (saved, 3, 1):     # cut into few pieces or many
            for limit in (1, 3, 5, 8, 200):
                if plaintext.nesting_within(data, at, limit):
                    assert depth <= limit
    finally:
        plaintext._TAGS_A_PIECE = saved


def test_everyday_files_are_plain():
    data = (f'<?xml version="1.0" encoding="UTF-8"?>\n<?xml-model href="http://x/y.rng"?>\n'
            f'<TEI xmlns="{TEI}"><text><body><div xml:lang="grc"><ab><lb n="1"/>'
            '<num value="12">ιβ</num> <num>ρκ<gap reason="lost" quantity="1" unit="character"/></num>'
            '</ab></div><div xml:lang="la"><ab><num>XII</num></ab></div></body></text></TEI>\n').encode()
    at = plaintext.plain_body(data)
    assert at is not None and data[at:].startswith(b"<TEI")
    pieces, keys = plaintext.split_nums(data, at)
    assert keys == [' value="12">ιβ'.encode(), '>ρκ<gap reason="lost" quantity="1" unit="character"/>'.encode(),
                    b">XII"]
    assert plaintext.langs(data, at, pieces) == ["grc", "grc", "la"]
    assert plaintext.nesting_within(data, at, 200) and not plaintext.nesting_within(data, at, 6)
    assert plaintext.well_formed(data)


@pytest.mark.parametrize("data", [
    b"\xef\xbb\xbf<TEI/>", "<TEI xmlns='x'>ι</TEI>".encode("utf-16"), b"<TEI>\0</TEI>",
    f'<!DOCTYPE TEI><TEI xmlns="{TEI}"/>'.encode(), f'<TEI xmlns="{TEI}"><?pi?></TEI>'.encode(),
    f'<?xml version="1.0" encoding="latin-1"?><TEI xmlns="{TEI}"/>'.encode(),
    f'<TEI xmlns="{TEI}"><ab n="a>b"/></TEI>'.encode(), f'<TEI xmlns="{TEI}"><x:ab/></TEI>'.encode(),
    f'<TEI xmlns="{TEI}"><ab xmlns="urn:x"/></TEI>'.encode(), b'<TEI xmlns="urn:x"/>',
], ids=["bom", "utf-16", "nul", "doctype", "pi inside", "latin-1", "> in a value", "prefix",
        "second namespace", "not tei"])
def test_files_the_text_cannot_vouch_for_are_not_plain(data):
    assert plaintext.plain_body(data) is None


@settings(max_examples=300, deadline=None)
@given(_files())
def test_a_file_annotated_from_its_text_is_annotated_as_the_general_path_does(data):
    def outcome():
        try:
            out, result = annotation.annotate_bytes(data, "doc.xml")
        except NumcheckError as err:
            return type(err).__name__, str(err)
        return out, result.to_dict()

    saved = outcomes.ENABLED
    try:
        outcomes.ENABLED = False
        slow = outcome()
        outcomes.ENABLED = True
        outcomes.forget()
        assert outcome() == slow        # learnt (from elements alone where the file is plain)
        assert outcome() == slow        # from memory
    finally:
        outcomes.ENABLED = saved


def test_a_number_learnt_alone_is_learnt_as_in_its_file(monkeypatch):
    # The second file is plain and holds one number not met before: it is learnt from
    # its element alone, and the file is annotated from its text, as the general path does.
    first = (f'<TEI xmlns="{TEI}"><text><body><ab xml:lang="grc"><num value="12">ιβ</num>'
             '</ab></body></text></TEI>').encode()
    second = first.replace(b"</ab>", '<lb n="2"/><num value="13">ιβ</num></ab>'.encode())
    monkeypatch.setattr(outcomes, "ENABLED", False)
    slow = annotation.annotate_bytes(second, "doc.xml")
    monkeypatch.setattr(outcomes, "ENABLED", True)
    outcomes.forget()
    annotation.annotate_bytes(first, "doc.xml")
    out, done = annotation._annotate(second, "doc.xml", 0, False, None)
    assert isinstance(done, quick.Quick) and done._root is None      # no tree was built
    assert out == slow[0]
    result = annotation.annotate_bytes(second, "doc.xml")[1]
    assert result.to_dict() == slow[1].to_dict()
    listed = result.to_dict()["nums"][1]
    assert (listed["status"], listed["text_line"]) == ("contradiction", "2")


def test_a_checker_error_leaves_the_file_to_the_tree():
    data = f'<TEI xmlns="{TEI}"><ab><num>ι</num></ab>'.encode()     # no end tag
    at = plaintext.plain_body(data)
    assert at is not None and not plaintext.well_formed(data)
    with pytest.raises(etree.XMLSyntaxError):
        etree.fromstring(data)


@pytest.mark.parametrize("per_piece", [64, 3, 1])
@pytest.mark.parametrize("empties", [0, 5, 300])
def test_the_nesting_bound_is_never_below_the_depth(per_piece, empties, monkeypatch):
    # Empty elements before, beside and after a nest 9 deep: a bound of 8 is refused
    # however the body is cut.
    monkeypatch.setattr(plaintext, "_TAGS_A_PIECE", per_piece)
    nest = "<seg>" * 4 + "<lb/>" * empties + "<seg><num>ι</num></seg>" + "</seg>" * 4
    data = (f'<TEI xmlns="{TEI}"><text><body>' + '<lb n="1"/>' * empties + nest
            + "<lb/>" * empties + "</body></text></TEI>").encode()
    at = plaintext.plain_body(data)
    assert _depth(etree.fromstring(data)) == 9
    assert not plaintext.nesting_within(data, at, 8)
    assert plaintext.nesting_within(data, at, 200)


def _account(pairs) -> bytes:
    """An account of ``(value, letters)`` numbers, one to a line."""
    body = "".join(f'<ab><lb n="{i}"/><num value="{v}">{t}</num></ab>' for i, (v, t) in enumerate(pairs, 1))
    return f'<TEI xmlns="{TEI}"><text><body><div xml:lang="grc">{body}</div></body></text></TEI>'.encode()


_TEENS = list(zip(range(11, 20), "ια ιβ ιγ ιδ ιε ιϛ ιζ ιη ιθ".split()))


def test_a_file_of_many_new_numbers_is_learnt_from_its_tree(monkeypatch):
    monkeypatch.setattr(quick, "LEARN_ALONE", 3)
    outcomes.forget()
    first = _account(_TEENS)                        # 9 numbers not met before: more than 3
    done = annotation._annotate(first, "a.xml", 0, False, None)[1]
    assert isinstance(done, quick.Quick) and done._root is not None
    second = _account(_TEENS[:2] + [(21, "ιβ"), (22, "ιγ")])    # 2 new: contradicted values
    done = annotation._annotate(second, "b.xml", 0, False, None)[1]
    assert isinstance(done, quick.Quick) and done._root is None
    assert [n["status"] for n in annotation.annotate_bytes(second)[1].to_dict()["nums"]] == [
        "agrees", "agrees", "contradiction", "contradiction"]


def test_a_plain_file_with_bad_utf8_is_refused_by_the_general_path():
    outcomes.forget()
    good = _account(_TEENS[:2])
    annotation.annotate_bytes(good)
    bad = good.replace("ια".encode(), "ι".encode() + b"\xce")
    assert plaintext.plain_body(bad) is not None and not plaintext.well_formed(bad)
    with pytest.raises(NumcheckError, match="malformed XML"):
        annotation.annotate_bytes(bad)
