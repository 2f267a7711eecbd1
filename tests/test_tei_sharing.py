"""Outcomes one batch worker learnt, given to another (numcheck.tei.sharing).

A worker that takes what another learnt annotates every file to the same
bytes and results as one that learnt everything itself (the general path,
``outcomes.ENABLED = False``, is the reference).  The other worker is this
process under another name, its memory emptied between the two roles.
"""

from __future__ import annotations

import pickle
import struct

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
    first = sharing.Sharing(str(tmp_path), name="1")
    annotation.annotate_bytes(data, "doc.xml")
    first.give(force=True)
    outcomes.forget()                           # another process, knowing nothing
    second = sharing.Sharing(str(tmp_path), name="2")
    second.take()
    out, result = annotation.annotate_bytes(data, "doc.xml")
    assert (out, result.to_dict()) == reference
    assert outcomes.take_new() == []            # nothing learnt again that was given


def test_what_is_given_is_read_once_and_never_by_its_writer(tmp_path, noting):
    doc = (b'<TEI xmlns="http://www.tei-c.org/ns/1.0"><text><body><ab xml:lang="grc">'
           # No @value: each is learnt, none made by analogy (numcheck.tei.analogy).
           + "".join(f'<num>{t}</num>' for v, t in
                     [(12, "ιβ"), (13, "ιγ"), (14, "ιδ"), (15, "ιε"), (16, "ιϛ"), (17, "ιζ"),
                      (18, "ιη"), (19, "ιθ"), (20, "κ")]).encode()
           + b"</ab></body></text></TEI>")
    a = sharing.Sharing(str(tmp_path), name="1")
    annotation.annotate_bytes(doc, "doc.xml")
    a.give()                                    # nine new: written
    assert [p.name for p in tmp_path.iterdir()] == ["1" + sharing.LOG_SUFFIX]
    assert a.take() == 0                        # its own log is not read back
    b = sharing.Sharing(str(tmp_path), name="2")
    assert b.take() == 9 and b.take() == 0


def test_a_frame_still_being_written_waits_for_the_next_look(tmp_path, noting):
    a = sharing.Sharing(str(tmp_path), name="1")
    records = [((None, False, ()), "grc", f"<num>{i}</num>", None) for i in range(3)]
    frame = pickle.dumps(records)
    whole = struct.pack("<Q", len(frame)) + frame
    log = tmp_path / ("2" + sharing.LOG_SUFFIX)
    log.write_bytes(whole[:11])                 # the writer is midway
    assert a.take() == 0
    with open(log, "ab") as handle:
        handle.write(whole[11:] + whole)
    assert a.take() == 6 and a.take() == 0


def test_an_unreadable_exchange_log_is_passed_over(tmp_path, noting):
    bad = b"not a pickle"
    (tmp_path / ("9" + sharing.LOG_SUFFIX)).write_bytes(
        struct.pack("<Q", len(bad)) + bad + struct.pack("<Q", 5) + pickle.dumps([]))
    (tmp_path / "8.other").write_bytes(b"half")
    s = sharing.Sharing(str(tmp_path))
    assert s.take() == 0


def test_a_worker_that_starts_late_is_heard_from_within_a_few_looks(tmp_path, noting):
    a = sharing.Sharing(str(tmp_path), name="1")
    assert a.take() == 0                        # no other log yet
    frame = pickle.dumps([((None, False, ()), "grc", "<num>1</num>", None)])
    (tmp_path / ("2" + sharing.LOG_SUFFIX)).write_bytes(struct.pack("<Q", len(frame)) + frame)
    taken = [a.take() for _ in range(sharing.LOOK_EVERY)]
    assert sum(taken) == 1
    a.close()
