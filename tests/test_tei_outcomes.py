"""annotate's fast paths give exactly what the slow ones give (issue 20: read fast).

- The same ``<num>`` markup is annotated once per process
  (numcheck.tei.outcomes): every file annotates to the same bytes and the
  same result with and without that memory, and a second time (all from
  memory) too.
- One walk over the document (numcheck.tei.survey) gives the places of
  ``num_places`` and the notation hint of ``notation_hint``.
- The regex scanner (write.scan_elements) finds the spans of the
  character-by-character one (write.scan_elements_plainly), and
  write.start_tags their start tags.
- The depth check asks libxml2 first: it refuses what the walk refuses.
- A batch entry takes the result's counts without building every number's JSON.
"""

from __future__ import annotations

from pathlib import Path

import pytest
from lxml import etree

from numcheck import limits
from numcheck.errors import LimitError
from numcheck.tei import annotation, outcomes
from numcheck.tei.markup import notation_hint, parse_tei
from numcheck.tei.places import num_places
from numcheck.tei.survey import survey
from numcheck.tei.write import scan_elements, scan_elements_plainly, start_tags

ROOT = Path(__file__).resolve().parents[1]
PAPYRI = ROOT / ".." / "shared" / "realdata" / "papyri"
TEI = "http://www.tei-c.org/ns/1.0"

#: <num> markup of many kinds (letters, damage, words, expansions, signs, empty, odd values).
NUMS = [
    '<num value="12">ιβ</num>', '<num>ιβ</num>', '<num value="13">ιβ</num>',
    '<num value="1/3">γ</num>', '<num type="fraction">γʹ</num>', '<num value="3000">Γ</num>',
    '<num>ρκ<gap reason="lost" quantity="1" unit="character"/></num>',
    '<num value="125"><unclear>ρ</unclear>κε</num>',
    '<num atLeast="10" atMost="20">ι<gap reason="lost" quantity="1" unit="character"/></num>',
    '<num atLeast="500">ρ<gap reason="illegible" quantity="2" unit="character"/></num>',
    '<num value="7"><supplied reason="lost">ζ</supplied></num>',
    '<num value="6">ἕξ</num>', '<num value="2"><expan><ex>διώβολον</ex></expan></num>',
    '<num value="4"><expan>τέ<ex>ταρτον</ex></expan></num>', '<num value="6"/>', '<num/>',
    '<num value="x">ιβ</num>', '<num value="1,49;20">1,49;20</num>', '<num>XIV</num>',
    '<num value="2"><g type="dipondius"/></num>', '<num>ιβ<!-- c --></num>',
    '<num><choice><sic>β</sic><corr>γ</corr></choice></num>', '<num>??</num>',
    '<num value="100"><hi rend="supraline">ρ</hi></num>', '<num>ε<lb n="2" break="no"/>ι</num>',
    '<num xml:id="n1" value="12">ιβ</num>', '<num rend="x" value="12">ιβ</num>',
    '<num xml:id="n2" value="125"><unclear>ρ</unclear>κε</num>', '<num xml:lang="la">XII</num>',
]


def _document(nums: list[str]) -> bytes:
    """The *nums* twice over: in Greek, then in Latin, on lines and in divisions of their own."""
    parts = ['<?xml version="1.0" encoding="UTF-8"?>\n<TEI xmlns="http://www.tei-c.org/ns/1.0">'
             '<text><body>']
    for lang, n in (("grc", "1"), ("la", "2")):
        parts.append(f'<div type="textpart" n="{n}" xml:lang="{lang}"><ab>')
        for i, num in enumerate(nums):
            num = num.replace('xml:id="', f'xml:id="{lang}{i}-')      # an @xml:id is unique
            parts.append(f'<lb n="{i + 1}"/>ἕξ καὶ {num}\n')
        parts.append("</ab></div>")
    parts.append('<ab>' + "".join(nums) + "</ab></body></text></TEI>\n")
    return "".join(parts).encode("utf-8")


def _papyri_nums() -> list[str]:
    found = []
    for path in sorted(PAPYRI.glob("*.xml")):
        root = etree.parse(str(path)).getroot()
        for el in root.iter(f"{{{TEI}}}num"):
            text = etree.tostring(el, with_tail=False, encoding="unicode")
            found.append(text.replace(f' xmlns="{TEI}"', ""))
    return found


def _cases() -> list[tuple[str, bytes]]:
    cases = [("kinds", _document(NUMS))]
    if PAPYRI.is_dir():
        cases.append(("papyri nums", _document(_papyri_nums())))
        cases += [(p.name, p.read_bytes()) for p in sorted(PAPYRI.glob("*.xml"))]
    for folder in ("examples", "corpora_demo", "numcheck/data/demo"):
        cases += [(p.name, p.read_bytes()) for p in sorted((ROOT / folder).rglob("*.xml"))]
    return cases


CASES = _cases()


def _annotate(data: bytes, **options):
    out, result = annotation.annotate_bytes(data, "doc.xml", **options)
    return out, result.to_dict(), result


@pytest.mark.parametrize("options", [{}, {"fix": True}, {"notation": "greek"}],
                         ids=["plain", "fix", "greek"])
@pytest.mark.parametrize("name, data", CASES, ids=[c[0] for c in CASES])
def test_remembered_outcomes_are_the_outcomes(name, data, options, monkeypatch):
    try:
        monkeypatch.setattr(outcomes, "ENABLED", False)
        slow = _annotate(data, **options)
    except LimitError:
        pytest.skip("refused by a limit either way")
    monkeypatch.setattr(outcomes, "ENABLED", True)
    outcomes.forget()
    first = _annotate(data, **options)
    again = _annotate(data, **options)          # every number from memory now
    for fast in (first, again):
        assert fast[0] == slow[0]
        assert fast[1] == slow[1]
        assert fast[2].nums == slow[2].nums


def test_a_remembered_outcome_is_a_copy():
    data = _document(['<num value="12">ιβ</num>'])
    outcomes.forget()
    _, _, first = _annotate(data)
    first.nums[0].existing["value"] = "changed"
    first.nums[0].warnings.append("changed")
    _, again, _ = _annotate(data)
    assert again["nums"][0]["existing"] == {"value": "12"}
    assert "warnings" not in again["nums"][0]


def test_the_limits_are_part_of_the_key(monkeypatch):
    data = _document(['<num>ιβ</num>'])
    outcomes.forget()
    _annotate(data)
    monkeypatch.setattr(limits, "MAX_PLACES", 1)
    _, d, _ = _annotate(data)
    assert {n["status"] for n in d["nums"]} == {"unreadable"}


@pytest.mark.parametrize("name, data", CASES, ids=[c[0] for c in CASES])
def test_one_walk_gives_the_places_and_languages(name, data):
    root = parse_tei(name, data)
    found = survey(root)
    assert found.places == num_places(root)
    assert found.nums == [e for e in root.iter() if e.tag == f"{{{TEI}}}num"]
    assert found.elements == [e for e in root.iter() if isinstance(e.tag, str)]
    for el in found.nums:
        assert annotation.lang_hint(found.langs[id(el)]) == notation_hint(el)


HOSTILE_XML = [
    '<a x=">"><!-- <b> --><b/><c>t</c></a>',
    "<a y='\"&gt;'><![CDATA[<b>]]><?pi <c> ?><b  z = \"1\" /></a >",
    '<!DOCTYPE a [<!ENTITY e "x">]><a>&e;<b/></a>',
    '<?xml version="1.0"?>\n<!-- head --><a><b></b><c/><!----></a>\n<!-- tail -->',
    '<a><b x="1"y="2"/></a>', '<a>\n<tei:b xmlns:tei="t"/></a>', "<a>",
]


@pytest.mark.parametrize("text", HOSTILE_XML + [d.decode("utf-8", "replace") for _, d in CASES])
def test_the_regex_scanner_finds_the_plain_scanners_spans(text):
    try:
        plain = scan_elements_plainly(text)
    except (ValueError, IndexError) as err:
        with pytest.raises(type(err)):
            scan_elements(text)
        return
    assert scan_elements(text) == plain


@pytest.mark.parametrize("text", HOSTILE_XML + [d.decode("utf-8", "replace") for _, d in CASES])
def test_the_start_tags_are_the_scanners(text):
    try:
        spans = scan_elements_plainly(text)
    except (ValueError, IndexError):
        return                  # not well-formed: never given to start_tags (lxml refused it)
    found = start_tags(text)
    if found is None:           # a DOCTYPE: the scanner reads it
        assert "<!DOCTYPE" in text
        return
    assert found == ([s.name for s in spans], [s.start for s in spans], [s.start_end for s in spans])


def _nested(depth: int) -> bytes:
    return (f'<TEI xmlns="{TEI}">' + "<ab>" * (depth - 1) + "</ab>" * (depth - 1) + "</TEI>").encode()


@pytest.mark.parametrize("limit", [1, 2, 3, 10, 200])
def test_the_depth_check_refuses_what_the_walk_refuses(limit, monkeypatch):
    monkeypatch.setattr(limits, "MAX_XML_DEPTH", limit)
    for depth in (limit - 1, limit, limit + 1, limit + 2):
        if depth < 1 or depth > 255:
            continue
        data = _nested(depth)
        if depth > limit:
            with pytest.raises(LimitError, match="MAX_XML_DEPTH"):
                parse_tei("deep.xml", data)
        else:
            parse_tei("deep.xml", data)


def test_the_counts_are_the_head_of_the_json():
    _, d, result = _annotate(_document(NUMS))
    head = {k: v for k, v in d.items() if k not in ("nums", "notes")}
    assert result.counts() == head
    assert list(result.counts()) == list(head)


def test_the_memory_is_bounded(monkeypatch):
    monkeypatch.setattr(outcomes, "MAX_KEPT", 3)
    outcomes.forget()
    data = _document(NUMS[:8])
    out, d, _ = _annotate(data)
    assert len(outcomes._kept) <= 3
    monkeypatch.setattr(outcomes, "ENABLED", False)
    assert _annotate(data)[:2] == (out, d)
