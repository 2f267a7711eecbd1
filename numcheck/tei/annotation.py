"""TEI/EpiDoc in and out: give every ``<num>`` its exact value.

``annotate(in_path, out_path)`` reads each ``<num>`` (TEI namespace) from its
letters and its damage markup, and writes a copy of the file in which each
has ``@value`` (an exact integer or ratio ``p/q``, never a rounded decimal,
as ``teidata.numeric`` allows) or, when lost letters leave a range,
``@atLeast``/``@atMost`` (EpiDoc Guidelines ``trans-lostcharnumeral``).  With
``alternatives=K`` the K best restorations go in as EpiDoc's pattern for
numbers with non-sequential values (``trans-numnoncongruent``): one
``<certainty locus="value" match="../@value" assertedValue=".." degree=".."/>``
per alternative.  Restorations are suggestions for the editor, ranked by
numcheck's evidence, not readings.

An existing ``@value`` that the letters contradict is reported, and only
replaced with ``fix=True``.  The input is never opened for writing; the
output is written atomically; everything else in the file stays as it was.
"""

from __future__ import annotations

import os
import unicodedata
import warnings
from dataclasses import dataclass, field
from fractions import Fraction
from pathlib import Path

from lxml import etree

from .. import limits
from ..errors import LimitError, NumcheckError, NumcheckWarning
from ..files import check_distinct, write_atomic
from ..reader import read
from ..reading import Reading, exact_text
from .markup import (TEI_NS, TeiError, leiden_text, local_name, notation_hint, num_pieces,
                       parse_tei, plain_text, read_bytes)
from ..tables.tei import table_to_dataframe
from .table_context import table_restorations
from .values import decide, is_unit_fraction, unresolved
from .write import Edit, apply_edits, apply_edits_tree, decode_source, scan_elements

__all__ = ["annotate", "annotate_bytes", "AnnotateResult", "NumResult", "TeiError",
           "table_to_dataframe", "TEI_NS"]



@dataclass
class NumResult:
    """What annotate found and did for one ``<num>``."""

    line: int | None
    text: str                       # the Leiden text built from the markup
    notation: str
    status: str                     # value-added, range-added, kept, contradiction, fixed
    value: Fraction | None = None   # the letters' exact value (undamaged or restored)
    at_least: Fraction | None = None
    at_most: Fraction | None = None
    damaged: bool = False
    unit_fraction: bool = False
    existing: dict[str, str] = field(default_factory=dict)
    message: str = ""
    alternatives: list[dict] = field(default_factory=list)
    warnings: list[str] = field(default_factory=list)   # how the notation read odd letters
    text_line: str | None = None    # the text's own line: the last <lb n>, or the <row>/<l> n

    def to_dict(self) -> dict:
        # The text as numcheck read it (NFC): decomposed accents give the same JSON.
        out = {"line": self.line, "text": unicodedata.normalize("NFC", self.text), "notation": self.notation,
               "status": self.status, "damaged": self.damaged}
        if self.text_line is not None:
            out["text_line"] = self.text_line
        if self.value is not None:
            out["value"] = exact_text(self.value)
        if self.at_least is not None:
            out["atLeast"] = exact_text(self.at_least)
            out["atMost"] = exact_text(self.at_most)
        if self.unit_fraction:
            out["unit_fraction"] = True
        if self.existing:
            out["existing"] = dict(self.existing)
        if self.message:
            out["message"] = self.message
        if self.alternatives:
            out["alternatives"] = self.alternatives
        if self.warnings:
            out["warnings"] = list(self.warnings)
        return out


@dataclass
class AnnotateResult:
    """The outcome of annotating one file: one :class:`NumResult` per ``<num>``."""

    input: str
    output: str | None
    nums: list[NumResult]
    notes: list[str] = field(default_factory=list)

    @property
    def damaged(self) -> int:
        return sum(1 for n in self.nums if n.damaged)

    @property
    def contradictions(self) -> list[NumResult]:
        return [n for n in self.nums if n.status in ("contradiction", "fixed")]

    @property
    def restored(self) -> int:
        return sum(1 for n in self.nums if n.alternatives)

    def to_dict(self) -> dict:
        counts: dict[str, int] = {}
        for n in self.nums:
            counts[n.status] = counts.get(n.status, 0) + 1
        return {
            "input": self.input,
            "output": self.output,
            "numbers": len(self.nums),
            "damaged": self.damaged,
            "flagged": len(self.contradictions),
            "restored": self.restored,
            "statuses": counts,
            "nums": [n.to_dict() for n in self.nums],
            "notes": list(self.notes),
        }


def annotate(in_path: str | os.PathLike, out_path: str | os.PathLike | None, *,
             alternatives: int = 0, fix: bool = False,
             notation: str | None = None) -> AnnotateResult:
    """Annotate every ``<num>`` of the TEI file *in_path* and write the copy to *out_path*.

    With ``out_path=None`` nothing is written (a check only).  Raises
    :class:`~numcheck.errors.NumcheckError` naming the file and line for
    malformed XML, a file that is not TEI, an empty or unreadable ``<num>``,
    and an output path equal to the input.
    """
    if out_path is not None:
        check_distinct([in_path], out_path)
    data = read_bytes(in_path)
    out_bytes, result = annotate_bytes(data, in_path, alternatives=alternatives, fix=fix,
                                       notation=notation)
    if out_path is not None:
        write_atomic(out_path, out_bytes)
        result.output = str(out_path)
    return result


def annotate_bytes(data: bytes, name: str | os.PathLike = "<input>", *, alternatives: int = 0,
                   fix: bool = False, notation: str | None = None) -> tuple[bytes, AnnotateResult]:
    """Annotate the TEI document *data*; return the new bytes and the result."""
    if alternatives < 0:
        raise NumcheckError(f"--alternatives must be 0 or more, not {alternatives}.")
    root = parse_tei(name, data)
    elements = [e for e in root.iter() if isinstance(e.tag, str)]
    index_of = {id(e): i for i, e in enumerate(elements)}
    nums = [e for e in elements if e.tag == f"{{{TEI_NS}}}num"]
    if len(nums) > limits.MAX_XML_NUMS:
        raise LimitError(f"number of <num> elements in {str(name)!r}", len(nums),
                         limits.MAX_XML_NUMS, "Set numcheck.limits.MAX_XML_NUMS higher to annotate it.")
    restore_fn, notes = _restore_function(alternatives, nums)
    in_tables: dict[int, list] = {}
    if restore_fn is not None:
        # A damaged number in a table is ranked by the table's scheme (the audit).
        damaged = [n for n in nums if any(local_name(c) in ("gap", "supplied", "unclear")
                                          for c in n.iter())]
        if damaged:
            in_tables = table_restorations(root, damaged, notation=notation, top=alternatives,
                                           notes=notes)
    edits: dict[int, Edit] = {}
    results: list[NumResult] = []
    problems: list[str] = []
    for el in nums:
        try:
            res, edit = _annotate_num(el, name, notation, fix, alternatives, restore_fn, index_of,
                                      in_tables.get(id(el)))
        except TeiError as err:
            problems.append(str(err))
            continue
        results.append(res)
        if edit is not None:
            edits[index_of[id(el)]] = edit
    if problems:
        shown = "\n".join(problems[:5])
        more = f"\n... and {len(problems) - 5} more" if len(problems) > 5 else ""
        raise TeiError(name, None, f"{len(problems)} <num> element(s) cannot be read; nothing was "
                                   f"written:\n{shown}{more}")
    out = _write(data, root, elements, edits, notes)
    return out, AnnotateResult(str(name), None, results, notes)


def _restore_function(alternatives: int, nums) -> tuple[object, list[str]]:
    if not alternatives or not nums:
        return None, []
    try:
        from ..restore import restore
    except ImportError as err:
        note = (f"alternatives were not written: the restoration module is not available ({err}).")
        warnings.warn(note, NumcheckWarning, stacklevel=3)
        return None, [note]
    return restore, []


def _line(el) -> int | None:
    return el.sourceline


def _text_line(el) -> str | None:
    """The line of the text a <num> stands on, as the edition numbers it.

    The ``n`` of the last ``<lb/>`` before it, else of the ``<l>`` or table
    ``<row>`` that holds it; None when the edition numbers no lines.
    """
    try:
        lbs = el.xpath("preceding::*[local-name()='lb'][@n][1]/@n")
        if lbs:
            return str(lbs[0])
        holders = el.xpath("ancestor::*[local-name()='l' or local-name()='row'][@n][1]/@n")
        return str(holders[0]) if holders else None
    except Exception:       # an element lxml cannot walk (a comment, a stand-in): no line
        return None


def _annotate_num(el, name, notation, fix, alternatives, restore_fn, index_of, from_table=None):
    line = _line(el)
    pieces = num_pieces(el)
    plain = plain_text(pieces)
    if not plain and not any(p.kind in ("lost", "illegible") for p in pieces):
        raise TeiError(name, line, "a <num> with no text (nothing to read; an empty <num> "
                                   "should hold the numeral as written, or be removed)")
    reading, text = _read_num(el, name, line, pieces, plain, notation)
    res = NumResult(line, text, reading.notation, "kept", damaged=reading.damaged,
                    warnings=list(reading.warnings), text_line=_text_line(el))
    is_open = unresolved(reading)
    lo, hi = reading.min, reading.max
    exact = None if is_open else reading.value
    existing = {k: el.get(k) for k in ("value", "atLeast", "atMost") if el.get(k) is not None}
    res.existing = existing
    # A unit fraction is written with its denominator's letters (γʹ is 3 or
    # 1/3): EpiDoc puts 1/3 in @value and may say type="fraction".
    res.unit_fraction = is_unit_fraction(el, reading, existing)
    if res.unit_fraction:
        exact = 1 / exact if exact else exact
        lo, hi = (1 / hi, 1 / lo) if lo > 0 else (lo, hi)
    res.value = exact
    if exact is None:
        res.at_least, res.at_most = lo, hi
    edit = Edit()
    decide(res, edit, existing, reading, exact, lo, hi, fix)
    if alternatives and restore_fn is not None and reading.count > 1:
        if from_table:
            res.alternatives = _table_alternatives(from_table, alternatives, res.unit_fraction)
        else:
            res.alternatives = _alternatives(restore_fn, reading, alternatives, res.unit_fraction)
        old = [c for c in el if etree.QName(c).localname == "certainty"
               and c.get("locus") == "value" and c.get("match") == "../@value"]
        edit.drop_children.extend(index_of[id(c)] for c in old)
        for alt in res.alternatives:
            edit.add_children.append(("certainty", {
                "locus": "value", "match": "../@value",
                "assertedValue": alt["value"], "degree": alt["degree"]}))
    has_edit = edit.set_attrs or edit.drop_attrs or edit.add_children or edit.drop_children
    return res, (edit if has_edit else None)


def _read_num(el, name, line, pieces, plain: str, notation: str | None):
    """Read a ``<num>``: in the notation given, else the one its letters suggest.

    Without a notation, the letters choose it (:func:`detect_notation`); when
    they cannot be read that way, the ``xml:lang`` in force (``grc`` ->
    greek, ``la`` -> roman ...) is tried before giving up.
    """
    if notation is not None:
        candidates = [notation]
    else:
        candidates = []
        if plain:
            from ..notations.detect import detect_notation
            candidates.append(detect_notation(plain)[0])
        hint = notation_hint(el)
        if hint is not None and hint not in candidates:
            candidates.append(hint)
        if not candidates:
            raise TeiError(name, line, "a <num> with no legible letter and no xml:lang to tell "
                                       "its notation; give the notation (--notation)")
    first_error = None
    for chosen in candidates:
        text = leiden_text(pieces, chosen)
        try:
            return read(text, notation=chosen), text
        except NumcheckError as err:
            if first_error is None:
                first_error = (chosen, text, err)
    chosen, text, err = first_error
    reason = str(err).split("\n", 1)[0]
    tried = f" (also tried: {', '.join(candidates[1:])})" if len(candidates) > 1 else ""
    raise TeiError(name, line, f"<num> read as {text!r} in {chosen} notation{tried}: {reason}")


def _alternatives(restore_fn, reading: Reading, top: int, unit_fraction: bool) -> list[dict]:
    result = restore_fn(reading, top=top)
    out = []
    for cand in list(result.candidates)[:top]:
        value = Fraction(cand.value)
        if unit_fraction and value:
            value = 1 / value
        out.append({"text": cand.text, "value": exact_text(value),
                    "probability": float(cand.probability),
                    "degree": _degree(cand.probability),
                    "reasons": list(getattr(cand, "reasons", ()) or ())})
    return out


def _table_alternatives(restorations: list[dict], top: int, unit_fraction: bool) -> list[dict]:
    """The audit's restorations of a table cell, in the form of :func:`_alternatives`."""
    out = []
    for r in restorations[:top]:
        value = Fraction(r["value"])
        if unit_fraction and value:
            value = 1 / value
        out.append({"text": r["text"], "value": exact_text(value),
                    "probability": float(r["probability"]), "degree": _degree(r["probability"]),
                    "reasons": list(r.get("reasons", [])), "from": "table scheme"})
    return out


def _degree(probability: float) -> str:
    """A probability for ``@degree`` (teidata.probability: 0 to 1), as short text."""
    p = min(1.0, max(0.0, float(probability)))
    text = f"{p:.4f}".rstrip("0").rstrip(".")
    return text or "0"


def _write(data: bytes, root, elements: list, edits: dict[int, Edit], notes: list[str]) -> bytes:
    """The document with *edits* spliced into its source (or, failing that, re-serialised)."""
    if not edits:
        return data
    docinfo = root.getroottree().docinfo
    decoded = decode_source(data, docinfo.encoding)
    if decoded is not None:
        text, codec = decoded
        try:
            spans = scan_elements(text)
        except (ValueError, AttributeError):
            spans = []
        names_agree = len(spans) == len(elements) and all(
            s.name.rsplit(":", 1)[-1] == etree.QName(e).localname for s, e in zip(spans, elements))
        if names_agree:
            prefixes = {i: elements[i].prefix for i in edits}
            return apply_edits(text, spans, edits, prefixes).encode(codec)
    note = ("the file could not be edited in place (its text and tree did not match); "
            "it was re-serialised by lxml, so quoting and character references may differ")
    notes.append(note)
    warnings.warn(note, NumcheckWarning, stacklevel=3)
    apply_edits_tree(root, elements, edits)
    tree = root.getroottree()
    return etree.tostring(tree, xml_declaration=data.lstrip().startswith(b"<?xml"),
                          encoding=docinfo.encoding or "UTF-8")


def default_output(in_path: str | os.PathLike) -> Path:
    """The default output name beside the input: ``text.xml`` -> ``text.numcheck.xml``."""
    p = Path(in_path)
    return p.with_name(p.stem + ".numcheck" + (p.suffix or ".xml"))
