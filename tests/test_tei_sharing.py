"""Outcomes one batch worker learnt, given to another (numcheck.tei.sharing).

A worker that takes what another learnt annotates every file to the same
bytes and results as one that learnt everything itself (the general path,
``outcomes.ENABLED = False``, is the reference).  The other worker is this
process under another name, its memory emptied between the two roles.
"""

from __future__ import annotations

import pickle

import pytest

from numcheck.tei import annotation, outcomes, sharing

from test_tei_outcomes import CASES

_SMALL = [c for c in CASES if len(c[1]) < 200_000]


@pytest.fixture
def noting(monkeypatch):
    monkeypatch.setattr(outcomes, "NOTING", True)
    outcomes.forget()
    yield
    outcomes.forget()


def _general(data):
    saved = outcomes.ENABLED
    outcomes.ENABLED = False
    try:
        out, result = annotation.annotate_bytes(data, "doc.xml")
    finally:
        outcomes.ENABLED = saved
    return out, result.to_dict()


@pytest.mark.parametrize("name, data", _SMALL, ids=[c[0] for c in _SMALL])
def test_a_worker_given_the_outcomes_annotates_the_same(name, data, tmp_path, noting, monkeypatch):
    reference = _general(data)
    first = sharing.Sharing(str(tmp_path))
    first.mine = "1-"
    annotation.annotate_bytes(data, "doc.xml")
    first.give(force=True)
    outcomes.forget()                           # another process, knowing nothing
    second = sharing.Sharing(str(tmp_path))
    second.mine = "2-"
    second.take()
    out, result = annotation.annotate_bytes(data, "doc.xml")
    assert (out, result.to_dict()) == reference
    assert outcomes.take_new() == []            # nothing learnt again that was given


def test_what_is_given_is_read_once_and_never_by_its_writer(tmp_path, noting):
    doc = (b'<TEI xmlns="http://www.tei-c.org/ns/1.0"><text><body><ab xml:lang="grc">'
           + "".join(f'<num value="{v}">{t}</num>' for v, t in
                     [(12, "ιβ"), (13, "ιγ"), (14, "ιδ"), (15, "ιε"), (16, "ιϛ"), (17, "ιζ"),
                      (18, "ιη"), (19, "ιθ"), (20, "κ")]).encode()
           + b"</ab></body></text></TEI>")
    a = sharing.Sharing(str(tmp_path))
    a.mine = "1-"
    annotation.annotate_bytes(doc, "doc.xml")
    a.give()                                    # nine new: more than GIVE_AT, written
    assert [p.name for p in tmp_path.iterdir()] == ["1-000001.pickle"]
    assert a.take() == 0                        # its own file is not read back
    b = sharing.Sharing(str(tmp_path))
    b.mine = "2-"
    assert b.take() == 9 and b.take() == 0


def test_an_unreadable_exchange_file_is_passed_over(tmp_path, noting):
    (tmp_path / "9-000001.pickle").write_bytes(b"not a pickle")
    (tmp_path / "9-000002.pickle").write_bytes(pickle.dumps([]))
    (tmp_path / "9-000003.pickle.part").write_bytes(b"half")
    s = sharing.Sharing(str(tmp_path))
    assert s.take() == 0


def test_nothing_is_noted_outside_a_batch(monkeypatch):
    monkeypatch.setattr(outcomes, "NOTING", False)
    outcomes.forget()
    annotation.annotate_bytes(b'<TEI xmlns="http://www.tei-c.org/ns/1.0"><text><body><ab>'
                              b'<num value="12">\xce\xb9\xce\xb2</num></ab></body></text></TEI>')
    assert outcomes.take_new() == []
