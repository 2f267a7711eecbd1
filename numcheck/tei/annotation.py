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
replaced with ``fix=True`` (never a value some valid reading of the letters
gives).  A number numcheck cannot read is reported with its place and the
reason (status ``unreadable``) and the rest of the file is still annotated;
numbers in words and expansions are read from the sourced table of
:mod:`.words`, or keep the editor's value.  The input is never opened for writing; the
output is written atomically; everything else in the file stays as it was.
"""

from __future__ import annotations

import functools
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
from .expansions import empty_result, expansion_result, sign_result, words_result
from .markup import (TEI_NS, TeiError, has_expansion, lang_hint, leiden_text, local_name,
                     num_pieces, parse_tei, plain_text, read_bytes)
from ..tables.tei import table_to_dataframe
from .table_context import table_restorations
from ..notations import NOTATIONS
from .survey import survey
from . import outcomes, quick
from .values import (CERTAINTY_MATCHES, certainty_match, decide, is_unit_fraction,
                     positive_range, unresolved)
from .words import is_word, looks_like_words, read_words
from .write import (Edit, ElementSpan, apply_edits, apply_edits_tree, decode_source,
                    scan_elements, start_tags)

__all__ = ["annotate", "annotate_bytes", "AnnotateResult", "NumResult", "TeiError",
           "table_to_dataframe", "TEI_NS"]



#: The statuses of a ``<num>``: what annotate found and did.
STATUSES = {
    "agrees": "the editor's value (or range) is one the letters, expansion or words give",
    "value-added": "no value was given: numcheck added @value",
    "range-added": "no value was given and damage leaves a range: numcheck added @atLeast/@atMost",
    "contradiction": "the editor's value is not one the letters allow (reported, not changed)",
    "fixed": "the editor's value was not one the letters allow and --fix replaced it",
    "unreadable": "numcheck cannot read the number (the reason is given); nothing was changed",
    "word": "a number written in words (inside the <num> or just before an empty one); "
            "the editor's value is kept",
    "not-checkable": "an expansion numcheck's table does not know and no letters to read: "
                     "the editor's value is kept, not checked",
}


@dataclass
class NumResult:
    """What annotate found and did for one ``<num>``."""

    line: int | None
    text: str                       # the Leiden text built from the markup (or the words)
    notation: str
    status: str                     # one of STATUSES
    value: Fraction | None = None   # the letters' exact value (undamaged or restored)
    at_least: Fraction | None = None
    at_most: Fraction | None = None
    damaged: bool = False
    unit_fraction: bool = False
    existing: dict[str, str] = field(default_factory=dict)
    message: str = ""
    alternatives: list[dict] = field(default_factory=list)
    warnings: list[str] = field(default_factory=list)   # how the notation read odd letters
    index: int = 0                  # 1-based position among the file's <num>
    xpath: str = ""
    text_line: str | None = None    # the @n of the <lb> before it
    div: str | None = None          # the <div> it is in
    read_from: str | None = None    # letters, expansion, words, words before; None: not read
    expanded: bool = False          # the editor wrote part of it out (<ex>)
    loose: tuple | None = None      # the range if each counted lacuna held fewer letters

    def to_dict(self) -> dict:
        # The text as numcheck read it (NFC): decomposed accents give the same JSON.
        out = {"index": self.index, "xpath": self.xpath, "line": self.line,
               "text_line": self.text_line, "div": self.div,
               "text": unicodedata.normalize("NFC", self.text), "notation": self.notation,
               "status": self.status, "damaged": self.damaged, "read_from": self.read_from}
        if self.value is not None:
            out["value"] = exact_text(self.value)
        if self.at_least is not None:
            out["atLeast"] = exact_text(self.at_least)
        if self.at_most is not None:
            out["atMost"] = exact_text(self.at_most)
        if self.unit_fraction:
            out["unit_fraction"] = True
        out["existing"] = dict(self.existing)
        if self.message:
            out["message"] = self.message
        if self.alternatives:
            out["alternatives"] = self.alternatives
        if self.warnings:
            out["warnings"] = list(self.warnings)
        return out

    @property
    def where(self) -> str:
        """The place for a message: text line and division, then the XML line."""
        bits = []
        if self.text_line is not None:
            bits.append(f"text line {self.text_line}")
        if self.div:
            bits.append(f"in {self.div}")
        bits.append(f"<num> {self.index}, XML line {self.line}")
        return ", ".join(bits)


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

    @property
    def unreadable(self) -> list[NumResult]:
        return [n for n in self.nums if n.status == "unreadable"]

    @property
    def words(self) -> int:
        return sum(1 for n in self.nums if n.status == "word")

    def counts(self) -> dict:
        """The head of :meth:`to_dict`: the input, the output and the counts, without the numbers."""
        counts: dict[str, int] = {}
        damaged = restored = 0
        for n in self.nums:
            counts[n.status] = counts.get(n.status, 0) + 1
            damaged += bool(n.damaged)
            restored += bool(n.alternatives)
        return {
            "input": self.input,
            "output": self.output,
            "numbers": len(self.nums),
            "damaged": damaged,
            "flagged": counts.get("contradiction", 0) + counts.get("fixed", 0),
            "restored": restored,
            "unreadable": counts.get("unreadable", 0),
            "words": counts.get("word", 0),
            "statuses": counts,
        }

    def to_dict(self) -> dict:
        out = self.counts()
        out["nums"] = [n.to_dict() for n in self.nums]
        out["notes"] = list(self.notes)
        return out


def annotate(in_path: str | os.PathLike, out_path: str | os.PathLike | None, *,
             alternatives: int = 0, fix: bool = False,
             notation: str | None = None) -> AnnotateResult:
    """Annotate every ``<num>`` of the TEI file *in_path* and write the copy to *out_path*.

    With ``out_path=None`` nothing is written (a check only).  Raises
    :class:`~numcheck.errors.NumcheckError` naming the file and line for
    malformed XML, a file that is not TEI, and an output path equal to the
    input; a ``<num>`` that cannot be read is no error (status ``unreadable``).
    """
    return annotate_path(in_path, out_path, alternatives=alternatives, fix=fix, notation=notation)


def annotate_path(in_path, out_path, *, alternatives: int = 0, fix: bool = False,
                  notation: str | None = None, sweep: bool = True) -> AnnotateResult:
    """:func:`annotate`; with ``sweep=False`` the output folder is not swept of stale
    temporaries first (a batch sweeps each of its folders once: :func:`~numcheck.files.write_atomic`)."""
    if out_path is not None:
        check_distinct([in_path], out_path)
    data = read_bytes(in_path)
    out_bytes, result = annotate_bytes(data, in_path, alternatives=alternatives, fix=fix,
                                       notation=notation)
    if out_path is not None:
        write_atomic(out_path, out_bytes, sweep=sweep)
        result.output = str(out_path)
    return result


def annotate_entry(in_path, *, alternatives: int = 0, fix: bool = False,
                   notation: str | None = None) -> tuple[bytes, dict]:
    """The annotated bytes of the file *in_path* and what a batch lists of it.

    The dictionary holds the counts (``numbers``, ``damaged``, ``flagged``,
    ``restored``, ``unreadable``, ``statuses``), the JSON of only the numbers
    a batch lists (``contradictions``: contradicted or fixed values;
    ``unreadable_nums``) and ``notes`` when there are any.  Nothing is
    written: the caller writes the bytes.
    """
    data = read_bytes(in_path)
    out_bytes, result = _annotate(data, in_path, alternatives, fix, notation)
    if isinstance(result, quick.Quick):
        return out_bytes, result.batch_fields()
    return out_bytes, batch_fields(result)


def batch_fields(result: AnnotateResult) -> dict:
    """The counts of *result* and the JSON of the numbers a batch lists (see :func:`annotate_entry`)."""
    # result.to_dict() would build every number's JSON; tests/test_batch.py compares the two.
    d = result.counts()
    out = {k: d[k] for k in ("numbers", "damaged", "flagged", "restored", "unreadable", "statuses")}
    out["contradictions"] = [n.to_dict() for n in result.nums
                             if n.status in ("contradiction", "fixed")]
    # A number that cannot be read is listed with its place; the file was still annotated.
    out["unreadable_nums"] = [n.to_dict() for n in result.nums if n.status == "unreadable"]
    if result.notes:
        out["notes"] = list(result.notes)
    return out


def annotate_bytes(data: bytes, name: str | os.PathLike = "<input>", *, alternatives: int = 0,
                   fix: bool = False, notation: str | None = None) -> tuple[bytes, AnnotateResult]:
    """Annotate the TEI document *data*; return the new bytes and the result."""
    out_bytes, result = _annotate(data, name, alternatives, fix, notation)
    if isinstance(result, quick.Quick):
        return out_bytes, AnnotateResult(str(name), None, result.results(), [])
    return out_bytes, result


def _annotate(data, name, alternatives, fix, notation) -> tuple[bytes, AnnotateResult | quick.Quick]:
    """:func:`annotate_bytes`; a file annotated on its text (:mod:`.quick`) gives its Quick."""
    if isinstance(alternatives, bool) or not isinstance(alternatives, int) or alternatives < 0:
        text = repr(alternatives)
        raise NumcheckError(f"--alternatives must be a whole number, 0 or more, not "
                            f"{text if len(text) <= 60 else text[:59] + '…'}.")
    if not (isinstance(fix, bool) or (type(fix) is int and fix in (0, 1))):
        raise NumcheckError(f"fix must be True or False, not {type(fix).__name__}.")
    if notation is not None:
        from ..notations import notation_module
        notation_module(notation)        # an unknown name (or not a name) fails here
    if isinstance(data, str):
        data = data.encode("utf-8")
    if not isinstance(data, (bytes, bytearray, memoryview)):
        raise NumcheckError(f"Expected the bytes of a TEI document, got {type(data).__name__}.")
    settings = _settings()
    if not alternatives and outcomes.ENABLED:
        def one(el, hint, place):
            return _annotate_num(el, name, notation, fix, 0, None, {}, None, place, hint, settings)

        done = quick.attempt_text(data, (notation, bool(fix), settings), one,
                                  limits.MAX_XML_NUMS)
        if done is not None:
            return done.data, done
    root = parse_tei(name, data)
    if not alternatives and outcomes.ENABLED:
        done = quick.attempt(data, root, (notation, bool(fix), settings), one,
                             limits.MAX_XML_NUMS)
        if done is not None:
            return done.data, done
    found = survey(root)
    elements, index_of, nums = found.elements, found.index_of, found.nums
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
    places, langs = found.places, found.langs
    # Without restorations a number's outcome is a function of its own markup
    # (and the language in force): the same markup is annotated once (.outcomes).
    remember = restore_fn is None and outcomes.ENABLED
    edits: dict[int, Edit] = {}
    results: list[NumResult] = []
    for el in nums:
        place, hint = places[id(el)], lang_hint(langs[id(el)])
        key = outcomes.key(el, hint, notation, fix, settings) if remember else None
        known = outcomes.recall(key, el.sourceline, place) if remember else None
        if known is not None:
            res, edit = known
        else:
            res, edit, own = _annotate_num(el, name, notation, fix, alternatives, restore_fn,
                                           index_of, in_tables.get(id(el)), place, hint,
                                           settings)
            if remember and own:
                outcomes.keep(key, res, edit)
        results.append(res)
        if edit is not None:
            edits[index_of[id(el)]] = edit
    unreadable = sum(1 for r in results if r.status == "unreadable")
    if unreadable:
        notes.append(f"{unreadable} of {len(results)} <num> could not be read (status "
                     "'unreadable', each with its reason); the others were annotated")
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


def _annotate_num(el, name, notation, fix, alternatives, restore_fn, index_of, from_table,
                  place, hint, settings):
    """One ``<num>``: its result, the edit to make (or None), and whether they are its own.

    They are its own (the third item) when they follow from the element's
    markup, *hint* and the options alone, not from the text around it nor
    from the file's name or line (see :mod:`.outcomes`).  Never raises for
    the number.
    """
    res, edit = _annotate_markup(el, name, notation, fix, alternatives, restore_fn, index_of,
                                 from_table, place, hint, settings)
    own = res.status != "unreadable" and res.read_from not in (None, "words before")
    return res, edit, own


def _annotate_markup(el, name, notation, fix, alternatives, restore_fn, index_of, from_table,
                     place, hint, settings):
    existing = {k: el.get(k) for k in ("value", "atLeast", "atMost") if el.get(k) is not None}
    res = NumResult(_line(el), "", "", "agrees", existing=existing, index=place.index,
                    xpath=place.xpath, text_line=place.text_line, div=place.div)
    pieces = num_pieces(el)
    plain = plain_text(pieces)
    has_letters = bool(plain) or any(p.kind in ("lost", "illegible") for p in pieces)
    res.expanded = has_expansion(pieces)
    if res.expanded and expansion_result(res, pieces, plain):
        return res, None
    if not has_letters:
        inside = [c for c in el if local_name(c) and local_name(c) not in ("certainty", "note")]
        if inside:
            sign_result(res, inside)
        else:
            empty_result(res, el, pieces)
        return res, None
    if looks_like_words(plain) and (read_words(plain) is not None or is_word(plain)):
        # ἕξ is the word six, not the letters ε and ξ; δίμοιρον is a word too.
        words_result(res, plain)
        return res, None
    try:
        reading, text = _read_num(name, res.line, pieces, plain, notation, hint, settings)
    except NumcheckError as err:
        if has_expansion(pieces):
            expansion_result(res, pieces, plain, letters_failed=True)
        elif looks_like_words(plain):
            words_result(res, plain)
        else:
            res.status = "unreadable"
            res.text = leiden_text(pieces, notation or "greek") if not plain else plain
            res.notation = notation or ""
            res.message = _reason(err)
        return res, None
    try:
        return _annotate_reading(el, res, reading, text, fix, alternatives, restore_fn, index_of,
                                 from_table, pieces)
    except NumcheckError as err:
        res.status = "unreadable"
        res.message = _reason(err)
        return res, None


def _reason(err) -> str:
    text = str(err)
    # A TeiError repeats the file and XML line: the result has its own place.
    if isinstance(err, TeiError) and ": " in text:
        text = text.split(": ", 1)[1]
    return text.split("\n", 1)[0]


def _loose_range(pieces, reading, unit_fraction: bool):
    """The range of the letters if each counted lacuna held fewer letters, or None.

    An editor's count of lost letters may include a numeral sign or a space;
    a value that fits a shorter lacuna is one ``--fix`` must not overwrite.
    """
    from .markup import Piece

    if not any(p.kind in ("lost", "illegible") and p.count for p in pieces):
        return None
    loose = [Piece(p.kind, p.text, None) if p.kind in ("lost", "illegible") else p for p in pieces]
    try:
        with warnings.catch_warnings():
            warnings.simplefilter("ignore", NumcheckWarning)
            other = read(leiden_text(loose, reading.notation), notation=reading.notation)
    except NumcheckError:
        return None
    lo, hi = other.min, other.max
    if unit_fraction:
        return (1 / hi, 1 / lo) if lo > 0 else None
    return lo, hi


def _annotate_reading(el, res, reading, text, fix, alternatives, restore_fn, index_of, from_table,
                      pieces):
    res.text, res.notation = text, reading.notation
    res.damaged, res.warnings = reading.damaged, list(reading.warnings)
    res.read_from = "letters"
    existing = res.existing
    is_open = unresolved(reading)
    lo, hi = positive_range(reading)
    exact = None if is_open else reading.value
    # A unit fraction is written with its denominator's letters (γʹ is 3 or
    # 1/3): EpiDoc puts 1/3 in @value and may say type="fraction".
    res.unit_fraction = is_unit_fraction(el, reading, existing)
    if res.unit_fraction:
        exact = 1 / exact if exact else exact
        lo, hi = (1 / hi, 1 / lo) if lo > 0 else (lo, hi)
    res.value = exact
    if exact is None:
        res.at_least, res.at_most = lo, hi
    if fix and reading.damaged:
        res.loose = _loose_range(pieces, reading, res.unit_fraction)
    edit = Edit()
    decide(res, edit, existing, reading, exact, lo, hi, fix)
    if alternatives and restore_fn is not None and reading.count > 1:
        if from_table:
            alts = _table_alternatives(from_table, alternatives, res.unit_fraction)
        else:
            alts = _alternatives(restore_fn, reading, alternatives, res.unit_fraction)
        # A lost numeral is never nothing: 0 is no restoration of a documentary number.
        res.alternatives = [a for a in alts if Fraction(a["value"]) != 0]
        final = {k for k in ("value", "atLeast", "atMost")
                 if (k in existing and k not in edit.drop_attrs) or k in edit.set_attrs}
        match = certainty_match(final)
        old = [c for c in el if local_name(c) == "certainty"
               and c.get("locus") == "value" and c.get("match") in CERTAINTY_MATCHES]
        edit.drop_children.extend(index_of[id(c)] for c in old)
        if match is not None:
            for alt in res.alternatives:
                edit.add_children.append(("certainty", {
                    "locus": "value", "match": match,
                    "assertedValue": alt["value"], "degree": alt["degree"]}))
    has_edit = edit.set_attrs or edit.drop_attrs or edit.add_children or edit.drop_children
    return res, (edit if has_edit else None)


#: The Greek convention annotate reads with when no notation is given.
DOCUMENTARY_GREEK = "greek-documentary"


def _read_once(text: str, notation: str, settings: tuple | None = None) -> Reading:
    """``read(text, notation=notation)`` with no warning raised, remembered: a corpus writes
    the same numbers again and again.

    A Reading is immutable and read() a function of its text, its notation
    and the limits in force (*settings*, part of the key), so a remembered
    Reading is the Reading read() would give; errors are not remembered.
    """
    return _remembered(text, notation, _settings() if settings is None else settings)


def _settings() -> tuple:
    """The limits in force (a document is read under one setting of them)."""
    if not _LIMIT_NAMES:
        _LIMIT_NAMES.extend(sorted(k for k in vars(limits) if k.isupper()))
    return tuple(map(vars(limits).get, _LIMIT_NAMES))


_LIMIT_NAMES: list[str] = []


@functools.lru_cache(maxsize=8192)
def _remembered(text: str, notation: str, settings: tuple) -> Reading:
    with warnings.catch_warnings():
        # How odd letters were read is kept in reading.warnings, one per
        # number, not raised once per <num> of a long file.
        warnings.simplefilter("ignore", NumcheckWarning)
        return read(text, notation=notation)


@functools.lru_cache(maxsize=8192)
def _detected(plain: str) -> str:
    """The notation :func:`~numcheck.notations.detect.detect_notation` finds for *plain*
    (a function of the text alone), remembered."""
    from ..notations.detect import detect_notation

    return detect_notation(plain)[0]


def _read_num(name, line, pieces, plain: str, notation: str | None, hint: str | None,
              settings: tuple | None = None):
    """Read a ``<num>``: in the notation given, else the one its letters suggest.

    Without a notation, the letters choose it (:func:`detect_notation`); when
    they cannot be read that way, the notation *hint* of the ``xml:lang`` in
    force (``grc`` -> greek, ``la`` -> roman ...) is tried before giving up.
    """
    if notation is not None:
        candidates = [notation]
    else:
        candidates = []
        if plain:
            candidates.append(_detected(plain))
        if hint is not None and hint not in candidates:
            candidates.append(hint)
        if not candidates:
            raise TeiError(name, line, "a <num> with no legible letter and no xml:lang to tell "
                                       "its notation; give the notation (--notation)")
    if notation is None:
        # EpiDoc's numbers are mostly those of documentary papyri and
        # inscriptions: read Greek with their conventions (a lone capital
        # units letter is thousands).  --notation greek keeps every reading open.
        candidates = [DOCUMENTARY_GREEK if c == "greek" and DOCUMENTARY_GREEK in NOTATIONS else c
                      for c in candidates]
    first_error = None
    for chosen in candidates:
        text = leiden_text(pieces, chosen)
        try:
            return _read_once(text, chosen, settings), text
        except NumcheckError as err:
            if first_error is None:
                first_error = (chosen, text, err)
    chosen, text, err = first_error
    reason = str(err).split("\n", 1)[0]
    tried = f" (also tried: {', '.join(candidates[1:])})" if len(candidates) > 1 else ""
    raise TeiError(name, line, f"<num> read as {text!r} in {chosen} notation{tried}: {reason}")


def _alternatives(restore_fn, reading: Reading, top: int, unit_fraction: bool) -> list[dict]:
    try:
        result = restore_fn(reading, top=top)
    except LimitError:
        # Too wide to restore (numcheck.limits): the number keeps its range,
        # and the rest of the file is still annotated.
        return []
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
        prefixes = {i: elements[i].prefix for i in edits}
        local = [e.tag.rpartition("}")[2] for e in elements]
        if not any(e.add_children or e.drop_children for e in edits.values()):
            # Attributes alone: the start tags are enough (write.start_tags).
            tags = start_tags(text)
            if tags is not None and len(tags[0]) == len(elements) and \
                    [n.rpartition(":")[2] for n in tags[0]] == local:
                names, starts, ends = tags
                spans = {i: ElementSpan(names[i], starts[i], ends[i], text[ends[i] - 2] == "/")
                         for i in edits}
                return apply_edits(text, spans, edits, prefixes).encode(codec)
        try:
            spans = scan_elements(text)
        except (ValueError, AttributeError):
            spans = []
        names_agree = len(spans) == len(elements) and (
            [s.name.rpartition(":")[2] for s in spans] == local)
        if names_agree:
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
