"""Every number word of an ATF file, read: label, word, value or range, status, unit.

This is what ``numcheck annotate FILE.atf`` lists.  The file is never
changed; with an output path the listing is written as a TSV (through
:func:`numcheck.files.write_atomic`).  A number word that cannot be read is
listed with its error and the rest of the file is still read.
"""

from __future__ import annotations

from dataclasses import dataclass, field
from pathlib import Path

from .. import limits
from ..errors import LimitError, NumcheckError
from ..notations.atf import format as format_atf
from ..reading import Status, exact_text
from .lines import text_lines
from .words import number_words

__all__ = ["AtfAnnotation", "annotate_atf", "read_atf_file", "read_atf_text", "atf_listing",
           "LISTING_COLUMNS"]

_MARK_NAMES = (("#", "damaged"), ("?", "uncertain"), ("!", "corrected"), ("*", "collated"))


@dataclass
class AtfAnnotation:
    """The numbers of one ATF file."""

    input: str
    numbers: list[dict] = field(default_factory=list)
    not_numbers: list[dict] = field(default_factory=list)
    output: str | None = None

    def to_dict(self) -> dict:
        unread = [n for n in self.numbers if "error" in n]
        return {
            "input": self.input,
            "format": "atf",
            "numbers": len(self.numbers),
            "read": len(self.numbers) - len(unread),
            "unread": len(unread),
            "damaged": sum(1 for n in self.numbers if n.get("damaged")),
            "not_numbers": self.not_numbers,
            "nums": self.numbers,
            "output": self.output,
        }


def _status(reading) -> str:
    order = {Status.READ: 0, Status.ADDED: 1, Status.SUPERFLUOUS: 1, Status.DOUBTFUL: 2,
             Status.RESTORED: 3, Status.UNREAD: 4, Status.LOST: 5}
    return max((s.status for s in reading.slots), key=order.__getitem__).value


def _marks(text: str, reading) -> list[str]:
    marks = [name for flag, name in _MARK_NAMES if flag in text]
    statuses = {s.status for s in reading.slots}
    if Status.RESTORED in statuses:
        marks.append("restored")
    if Status.LOST in statuses:
        marks.append("lost")
    if any(s.status is Status.UNREAD and len(s.values) > 1 for s in reading.slots):
        marks.append("unknown count" if "n" in text.lower() else "unread sign")
    if Status.ADDED in statuses:
        marks.append("supplied")
    if Status.SUPERFLUOUS in statuses:
        marks.append("excised")
    return marks


def read_atf_text(source: str, name: str = "<atf>", *, math: bool = False) -> AtfAnnotation:
    """Read every number word of the ATF *source* text (*math*: as if ``#atf: use math`` were given)."""
    result = AtfAnnotation(input=name)
    for line in text_lines(source):
        found, traps = number_words(line.content, math=line.math or math)
        for t in traps:
            result.not_numbers.append({"text_id": line.text_id, "label": line.label, "line": line.number,
                                       "column": line.offset + t.start + 1, "word": t.word,
                                       "reason": t.reason})
        for w in found:
            entry = {"text_id": line.text_id, "label": line.label, "line": line.number,
                     "column": line.offset + w.start + 1, "word": w.text}
            if w.reading is None:
                entry["error"] = w.error
                entry["status"] = "not-read"
                entry["damaged"] = False
            else:
                r = w.reading
                entry.update({
                    "value": exact_text(r.value), "min": exact_text(r.min), "max": exact_text(r.max),
                    "range": r.min != r.max, "status": _status(r), "damaged": r.damaged,
                    "marks": _marks(w.text, r), "floating": r.floating,
                    "written": format_atf(r),
                })
                unit = w.unit or r.unit
                if unit:
                    entry["unit"] = unit
                if w.system:
                    entry["system"] = w.system
                if w.quantity is not None:
                    value, lo, hi, qunit, qtext = w.quantity
                    entry["quantity"] = {"value": exact_text(value), "min": exact_text(lo),
                                         "max": exact_text(hi), "unit": qunit, "text": qtext}
                notes = [n for n in r.warnings if line.math or math or not n.startswith("only disz and u")]
                notes += w.notes
                if notes:
                    entry["notes"] = notes
            result.numbers.append(entry)
            if len(result.numbers) > limits.MAX_ATF_NUMBERS:
                raise LimitError(f"number of number words in {name!r}", len(result.numbers),
                                 limits.MAX_ATF_NUMBERS,
                                 "Set numcheck.limits.MAX_ATF_NUMBERS higher to read it.")
    return result


def annotate_atf(path, output=None, *, math: bool = False) -> AtfAnnotation:
    """Read every number word of the ATF file *path*; with *output*, write the listing as TSV.

    *math* reads CDLI graphemes of disz and u as floating place value in every text, as
    ``#atf: use math`` does for the texts that declare it.
    """
    from ..files import check_distinct, write_atomic

    result = read_atf_file(path, math=math)
    if output:
        check_distinct(Path(path), output)
        result.output = str(write_atomic(output, atf_listing(result)))
    return result


def read_atf_file(path, *, math: bool = False) -> AtfAnnotation:
    """:func:`read_atf_text` of the file *path* (checked as an input: kind, size, encoding)."""
    from ..tables.text import read_text_file

    src = Path(path)
    try:
        source = read_text_file(src)
    except NumcheckError as err:
        raise NumcheckError(str(err).replace("table", "ATF file")) from None
    return read_atf_text(source, str(src), math=math)


#: The columns of the TSV listing of an ATF file.
LISTING_COLUMNS = ("text_id", "label", "word", "value", "min", "max", "status", "unit", "note")


def atf_listing(result: AtfAnnotation) -> str:
    """The TSV listing of *result*: one row per number word (:data:`LISTING_COLUMNS`)."""
    rows = ["\t".join(LISTING_COLUMNS)]
    for n in result.numbers:
        rows.append("\t".join(str(x) for x in (
            n["text_id"], n["label"], n["word"], n.get("value", ""), n.get("min", ""),
            n.get("max", ""), n["status"], n.get("unit", ""), n.get("error", ""))))
    return "\n".join(rows) + "\n"
