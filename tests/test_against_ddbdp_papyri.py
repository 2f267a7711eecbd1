"""The editors' own ``<num>`` values of real documentary papyri, reproduced (issue 14).

Source: EpiDoc files of the Duke Databank of Documentary Papyri (papyri/idp.data,
DDB_EpiDoc_XML; CC BY 3.0), read in place from ../shared/realdata/papyri
(see its SOURCES.md); the tests skip when the folder is absent.  Each
``<num>`` there carries the editor's ``@value`` (or ``@atLeast``/``@atMost``):
the outside authority numcheck's reading is checked against.
"""

import hashlib
from fractions import Fraction
from pathlib import Path

import pytest
from lxml import etree

from numcheck import batch
from numcheck.tei import annotate, annotate_bytes

FOLDER = Path(__file__).resolve().parent.parent.parent / "shared" / "realdata" / "papyri"
TEI = "http://www.tei-c.org/ns/1.0"
NS = {"tei": TEI}


def _files():
    if not FOLDER.is_dir():
        return []
    return sorted(FOLDER.glob("*.xml"))


@pytest.fixture(scope="module")
def results():
    files = _files()
    if not files:
        pytest.skip("the shared papyri are not here (../shared/realdata/papyri)")
    return {p.name: annotate(p, None) for p in files}


def _reproduced(n) -> bool:
    """Whether numcheck read the number itself and got the editor's value (or range)."""
    if n.read_from is None or n.status in ("unreadable", "contradiction", "fixed"):
        return False
    ex = n.existing
    if "value" in ex:
        ed = Fraction(ex["value"])
        if n.value is not None:
            return n.value == ed
        return n.at_least <= ed <= n.at_most
    ours = [n.value] if n.value is not None else [n.at_least, n.at_most]
    return ("atLeast" not in ex or max(ours) >= Fraction(ex["atLeast"])) and \
        ("atMost" not in ex or min(ours) <= Fraction(ex["atMost"]))


def test_no_file_is_refused_and_every_num_is_listed(results):
    for name, result in results.items():
        root = etree.parse(str(FOLDER / name)).getroot()
        assert len(result.nums) == len(root.findall(".//tei:num", NS)), name


def test_at_least_97_percent_of_the_editors_values_are_reproduced(results):
    given = [n for r in results.values() for n in r.nums if n.existing]
    reproduced = [n for n in given if _reproduced(n)]
    assert len(given) >= 200
    assert len(reproduced) / len(given) >= 0.97, [
        (n.xpath, n.text, n.status, n.existing) for n in given if not _reproduced(n)][:10]


def test_nothing_is_contradicted_or_unreadable_on_the_shared_files(results):
    odd = [(name, n.index, n.text, n.status, n.message) for name, r in results.items()
           for n in r.nums if n.status in ("contradiction", "unreadable")]
    assert odd == []


def test_expansions_and_words_are_read_not_skipped(results):
    # o.bodl.2.1009: the two-obol sign written out; p.oxy.4.745: numbers in words
    # before an empty <num value=".."/>.
    expan = [n for n in results["o.bodl.2.1009.xml"].nums if n.read_from == "expansion"]
    assert [(n.text, n.value) for n in expan] == [("διώβολον", 2), ("διώβολον", 2)]
    words = [(n.text, n.value) for n in results["p.oxy.4.745.xml"].nums]
    assert words == [("ἑξήκοντα πέντε", 65), ("δέκα", 10), ("ἕξ", 6)]


def test_places_point_at_the_number(results):
    for name, result in results.items():
        root = etree.parse(str(FOLDER / name)).getroot()
        everything = root.findall(".//tei:num", NS)
        for n in result.nums:
            assert root.xpath(n.xpath, namespaces=NS) == [everything[n.index - 1]], (name, n.xpath)
            assert n.text_line is not None, (name, n.index)


def test_fix_changes_no_value_the_letters_support():
    files = _files()
    if not files:
        pytest.skip("the shared papyri are not here")
    for path in files:
        data = path.read_bytes()
        out, result = annotate_bytes(data, path.name, fix=True)
        assert not [n for n in result.nums if n.status == "fixed"], path.name
        before = [e.get("value") for e in etree.fromstring(data).iter(f"{{{TEI}}}num")]
        after = [e.get("value") for e in etree.fromstring(out).iter(f"{{{TEI}}}num")]
        assert [a for a, b in zip(after, before) if b is not None] == [b for b in before if b is not None]


def _tree_hash(folder: Path) -> str:
    h = hashlib.sha256()
    for p in sorted(folder.rglob("*")):
        if p.is_file():
            h.update(p.name.encode() + p.read_bytes())
    return h.hexdigest()


def test_the_folder_run_leaves_the_inputs_byte_identical(tmp_path):
    if not _files():
        pytest.skip("the shared papyri are not here")
    before = _tree_hash(FOLDER)
    result = batch.annotate_folder(FOLDER, tmp_path / "out", workers=1)
    assert _tree_hash(FOLDER) == before
    assert result.summary["failed"] == 0 and result.summary["unreadable"] == 0
    assert result.summary["files"] == len(_files())
