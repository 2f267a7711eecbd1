"""Tests for numcheck.files: atomic writes and the refusal to write over an input."""

import hashlib
import os

import pytest

from numcheck.errors import NumcheckError
from numcheck.files import OutputError, check_distinct, same_file, write_atomic


def _hash(path):
    return hashlib.sha256(path.read_bytes()).hexdigest()


def test_write_text_and_bytes(tmp_path):
    out = tmp_path / "a.txt"
    write_atomic(out, "λβ 1/32\n")
    assert out.read_bytes() == "λβ 1/32\n".encode("utf-8")
    write_atomic(out, b"\x00\x01")
    assert out.read_bytes() == b"\x00\x01"


def test_no_temporary_files_left(tmp_path):
    write_atomic(tmp_path / "a.txt", "x")
    assert sorted(p.name for p in tmp_path.iterdir()) == ["a.txt"]


def test_missing_folder_is_a_user_error(tmp_path):
    with pytest.raises(OutputError, match="does not exist"):
        write_atomic(tmp_path / "nope" / "a.txt", "x")


def test_folder_as_target_is_refused(tmp_path):
    with pytest.raises(OutputError, match="folder"):
        write_atomic(tmp_path, "x")


def test_output_equal_to_input_is_refused(tmp_path):
    src = tmp_path / "in.xml"
    src.write_text("<TEI/>")
    before = _hash(src)
    with pytest.raises(NumcheckError, match="same file as the input"):
        check_distinct([src], tmp_path / "sub" / ".." / "in.xml")
    with pytest.raises(OutputError):
        check_distinct(str(src), src)
    assert _hash(src) == before


def test_symlink_to_input_is_refused(tmp_path):
    src = tmp_path / "in.xml"
    src.write_text("<TEI/>")
    link = tmp_path / "link.xml"
    os.symlink(src, link)
    assert same_file(src, link)
    with pytest.raises(OutputError):
        check_distinct([tmp_path / "other.xml", src], link)


def test_distinct_paths_pass(tmp_path):
    check_distinct([tmp_path / "a.xml"], tmp_path / "b.xml")


def test_failed_write_keeps_old_file(tmp_path, monkeypatch):
    out = tmp_path / "a.txt"
    out.write_text("old")

    def boom(*args):
        raise OSError("disk full")

    monkeypatch.setattr(os, "replace", boom)
    with pytest.raises(OSError):
        write_atomic(out, "new")
    assert out.read_text() == "old"
    assert sorted(p.name for p in tmp_path.iterdir()) == ["a.txt"]
