"""The whole job on the demo corpus, in one call: identify, restore, audit, annotate.

``run_demo(out_dir)`` takes the invented corpus that ships with numcheck
(``numcheck/data/demo``, made by ``corpora_demo/generate.py``) and does what
an editor would: identifies and restores the stray numbers from fragments,
audits the ephemeris (HTML report, plot, flags), annotates the TEI papyrus
(and audits its table), then checks what it found against the generator's
answer key.  A step whose part of numcheck is missing or fails is reported
as skipped, with the reason, never faked.
"""

from __future__ import annotations

import csv
import io
import json
import os
from dataclasses import dataclass, field
from fractions import Fraction
from importlib import resources
from pathlib import Path

from . import limits
from .errors import NumcheckError
from .files import OutputError, same_file, write_atomic
from .reading import exact_text, sexagesimal_text

__all__ = ["run_demo", "DemoResult", "demo_data", "DEFAULT_OUT"]

DEFAULT_OUT = "numcheck-demo-out"
_RESTORE_TOP = 5


def demo_data() -> Path:
    """The folder of the demo corpus inside the installed package."""
    return Path(str(resources.files("numcheck") / "data" / "demo"))


@dataclass
class Step:
    """One step of the demo: what it did, the files it wrote, or why it was skipped."""

    name: str
    status: str = "done"            # done, skipped, partial
    summary: str = ""
    files: list[str] = field(default_factory=list)
    reasons: list[str] = field(default_factory=list)
    data: dict = field(default_factory=dict)

    def skip(self, reason: str) -> None:
        self.status = "skipped" if not self.files else "partial"
        self.reasons.append(reason)

    def to_dict(self) -> dict:
        out = {"name": self.name, "status": self.status, "summary": self.summary,
               "files": list(self.files)}
        if self.reasons:
            out["reasons"] = list(self.reasons)
        out.update(self.data)
        return out


@dataclass
class DemoResult:
    out: str
    steps: list[Step]

    def to_dict(self) -> dict:
        return {"out": self.out, "steps": [s.to_dict() for s in self.steps],
                "note": "Restorations and diagnoses are suggestions for the editor's judgement, "
                        "not readings. The demo corpus is invented (see its README.md)."}


def run_demo(out_dir: str | os.PathLike = DEFAULT_OUT, *, data_dir: str | os.PathLike | None = None,
             progress=None) -> DemoResult:
    """Run the demo on the corpus in *data_dir* (the shipped one by default) into *out_dir*.

    *progress*, if given, is called with each step's name before it runs.
    """
    data = Path(data_dir) if data_dir is not None else demo_data()
    if not (data / "ephemeris.tsv").is_file():
        raise NumcheckError(f"The demo corpus is missing from {str(data)!r} (no ephemeris.tsv); "
                            "reinstall numcheck or run corpora_demo/generate.py.")
    out = Path(out_dir)
    if out.exists() and same_file(out, data):
        raise OutputError(f"The demo output folder {str(out)!r} is the corpus folder; give another (--out).")
    if out.exists() and not out.is_dir():
        raise OutputError(f"{str(out)!r} exists and is not a folder; give another output folder (--out).")
    out.mkdir(parents=True, exist_ok=True)
    key = json.loads((data / "answer_key.json").read_text(encoding="utf-8"))
    steps = []
    for name, fn in (("fragments", _fragments), ("ephemeris", _ephemeris), ("papyrus", _papyrus)):
        if progress:
            progress(name)
        step = Step(name)
        try:
            fn(data, out, key, step)
        except NumcheckError as err:
            step.skip(f"{type(err).__name__}: {err}")
        except ImportError as err:
            step.skip(f"this part of numcheck is not available ({err})")
        steps.append(step)
    result = DemoResult(str(out), steps)
    write_atomic(out / "summary.json", json.dumps(result.to_dict(), ensure_ascii=False, indent=1) + "\n")
    return result


# -- step 1: stray numbers from fragments -----------------------------------

def _read_tsv(path: Path) -> list[dict]:
    lines = [ln for ln in path.read_text(encoding="utf-8").splitlines() if ln and not ln.startswith("#")]
    return list(csv.DictReader(lines, delimiter="\t"))


def _fragments(data: Path, out: Path, key: dict, step: Step) -> None:
    from .identify import identify
    from .reader import read
    from .restore import restore

    truth = {item["fragment"]: item for item in key["fragments"]["items"]}
    rows, items = [], []
    right_value = right_id = done = 0
    for frag in _read_tsv(data / "fragments.tsv"):
        name, text = frag["fragment"], frag["text"]
        notation, unit = frag["notation"] or None, frag["unit"] or None
        item = {"fragment": name, "text": text, "notation": notation, "unit": unit}
        try:
            reading = read(text, notation=notation, unit=unit)
            rest = restore(reading, unit=unit, top=_RESTORE_TOP)
            # Identify what the best restoration reads, not the damaged text at its lowest.
            ident = identify(_restored_reading(rest, reading, notation, unit), unit=unit, top=3)
        except NumcheckError as err:
            item["skipped"] = f"{type(err).__name__}: {err}"
            step.reasons.append(f"{name} ({text}): {item['skipped']}")
            items.append(item)
            continue
        done += 1
        matches = [{"id": m.id, "factor": exact_text(m.factor)} for m in ident.matches[:3]]
        cands = [{"text": c.text, "value": exact_text(c.value), "probability": round(float(c.probability), 4)}
                 for c in rest.candidates[:_RESTORE_TOP]]
        item.update({"identified": matches, "restorations": cands})
        want = truth.get(name, {})
        if cands and want and _same_value(cands[0]["value"], want["value"], reading.floating):
            right_value += 1
        if matches and want and matches[0]["id"] in want["catalogue"]:
            right_id += 1
        items.append(item)
        best = matches[0]["id"] if matches else ""
        for rank, c in enumerate(cands, 1):
            rows.append([name, text, notation or "", unit or "", str(rank), c["text"], c["value"],
                         sexagesimal_text(_fraction(c["value"]), fixed=not reading.floating),
                         f"{c['probability']:.4f}", best if rank == 1 else ""])
    header = ["fragment", "text", "notation", "unit", "rank", "restored", "value", "sexagesimal",
              "probability", "identified_as"]
    buf = io.StringIO()
    buf.write("# numcheck demo: restorations of the stray numbers, best first "
              "(suggestions for the editor, not readings)\n")
    writer = csv.writer(buf, delimiter="\t", lineterminator="\n")
    writer.writerow(header)
    writer.writerows(rows)
    write_atomic(out / "fragments-restored.tsv", buf.getvalue())
    write_atomic(out / "fragments.json", json.dumps(items, ensure_ascii=False, indent=1) + "\n")
    step.files += ["fragments-restored.tsv", "fragments.json"]
    total = len(items)
    step.data.update({"fragments": total, "read": done, "best_restoration_right": right_value,
                      "identified_right": right_id})
    step.summary = (f"{done} of {total} fragments read; the best restoration is the generator's "
                    f"value for {right_value}, the best identification its catalogue entry for {right_id}")
    if done < total:
        step.status = "partial" if done else "skipped"


#: Damage marks taken away from a restored reading to read it as the restorer proposes it.
_MARKS = str.maketrans("", "", "[]⸢⸣?\u0323")


def _restored_reading(rest, reading, notation, unit):
    """The best restoration read as if it were written so (the damaged reading if there is none).

    >>> from numcheck.restore import restore
    >>> from numcheck.reader import read
    >>> r = read("29;31,5[x],8,20")
    >>> _restored_reading(restore(r), r, None, "days").text
    '29;31,50,8,20'
    """
    from .reader import read

    if not reading.damaged or not rest.candidates:
        return reading
    text = rest.candidates[0].text.translate(_MARKS)
    try:
        return read(text, notation=notation, unit=unit)
    except NumcheckError:
        return reading


def _fraction(text: str) -> Fraction:
    return Fraction(text)


def _same_value(got: str, want: str, floating: bool) -> bool:
    """Whether a restored value is the true one (for a floating number: up to a power of 60).

    >>> _same_value("223/60", "223", True), _same_value("223/60", "223", False)
    (True, False)
    """
    a, b = _fraction(got), _fraction(want)
    if a == b:
        return True
    if not floating or a == 0 or b == 0:
        return False
    # A floating reading is restored digit for digit; its magnitude stays open.
    return any(a == b * Fraction(60) ** k for k in range(-limits.MAX_PLACES, limits.MAX_PLACES + 1))


# -- step 2: the ephemeris --------------------------------------------------

def _reports(result, out: Path, stem: str, step: Step) -> None:
    """The audit's HTML report, plot and flags CSV (skipped, with the reason, if unavailable)."""
    try:
        from . import report
    except ImportError as err:
        step.reasons.append(f"{stem}: the HTML report and plot were not written: the report "
                            f"module is not available ({err})")
        return
    for suffix, fn_name in ((".html", "write_html"), (".png", "write_plot"), ("-flags.csv", "write_flags_csv")):
        fn = getattr(report, fn_name, None)
        if fn is None:
            step.reasons.append(f"{stem}{suffix} not written: numcheck.report has no {fn_name}")
            continue
        try:
            fn(result, out / (stem + suffix))
        except NumcheckError as err:
            step.reasons.append(f"{stem}{suffix} not written: {err}")
            continue
        step.files.append(stem + suffix)


def _score_flags(flags: list[dict], slips: list[dict]) -> dict:
    """How many injected slips the audit flagged at the right cell, and with the right kind."""
    by_cell = {(f["row"], f["column"]): f for f in flags}
    found = [s for s in slips if (s["row"], s["column"]) in by_cell]
    same_kind = [s for s in found if by_cell[(s["row"], s["column"])]["kind"] == s["kind"]]
    injected = {(s["row"], s["column"]) for s in slips}
    extra = [f for f in flags if (f["row"], f["column"]) not in injected]
    return {"injected": len(slips), "found": len(found), "same_kind": len(same_kind),
            "other_flags": len(extra)}


def _ephemeris(data: Path, out: Path, key: dict, step: Step) -> None:
    from .audit import audit

    result = audit(str(data / "ephemeris.tsv"))
    d = result.to_dict()
    write_atomic(out / "ephemeris-audit.json", json.dumps(d, ensure_ascii=False, indent=1) + "\n")
    step.files.append("ephemeris-audit.json")
    _reports(result, out, "ephemeris-audit", step)
    eph = key["ephemeris"]
    score = _score_flags(d.get("flags", []), eph["slips"])
    best = {}
    for r in d.get("restorations", []):
        best.setdefault((r["row"], r["column"]), r)
    restored_right = sum(1 for lost in eph["lost"]
                         if (lost["row"], lost["column"]) in best
                         and best[(lost["row"], lost["column"])].get("expected", None) is not None
                         and _same_cell(best[(lost["row"], lost["column"])], lost))
    schemes = [f"{s['column']}: {s.get('description') or s['kind']}" for s in d.get("schemes", [])]
    step.data.update({"schemes": schemes, "slips": score, "lost": len(eph["lost"]),
                      "lost_restored_right": restored_right, "flags": len(d.get("flags", []))})
    step.summary = (f"schemes: {'; '.join(schemes) or 'none found'}. The generator put in "
                    f"{score['injected']} slips (lines with a slip or inheriting one); the audit "
                    f"flagged {score['found']} of them ({score['same_kind']} with the same kind), "
                    f"and {score['other_flags']} other cells. Lost digits: {restored_right} of "
                    f"{len(eph['lost'])} restored to the generator's value.")


def _same_cell(restoration: dict, lost: dict) -> bool:
    """Whether the audit's best restoration of a cell is the true text."""
    from .reader import read

    try:
        true_value = read(lost["true"].split(" ")[0]).value
        got = read(restoration["text"].split(" ")[0]).value
    except NumcheckError:
        return restoration.get("expected") == lost["true"]
    return got == true_value


# -- step 3: the papyrus ------------------------------------------------------

def _papyrus(data: Path, out: Path, key: dict, step: Step) -> None:
    from .tei import annotate

    src = data / "papyrus.xml"
    annotated = out / "papyrus-annotated.xml"
    try:
        result = annotate(src, annotated, alternatives=3)
    except NumcheckError as err:
        step.reasons.append(f"annotate: {err}")
        result = None
    if result is not None:
        step.files.append("papyrus-annotated.xml")
        d = result.to_dict()
        contradictions = [f"line {n['line']}: {n['message']}" for n in d["nums"]
                          if n["status"] == "contradiction"]
        step.data.update({"numbers": d["numbers"], "damaged": d["damaged"],
                          "contradictions": contradictions, "with_alternatives": d["restored"]})
        step.summary = (f"{d['numbers']} <num> annotated ({d['damaged']} damaged, {d['restored']} "
                        f"with ranked restorations as <certainty>); {len(contradictions)} @value "
                        "contradicted by its letters")
        for note in d["notes"]:
            step.reasons.append(note)
    # The papyrus is a table too: audit it like a TSV.
    try:
        from .audit import audit
        table_result = audit(src)     # its first <table>, read by numcheck.tables
    except NumcheckError as err:
        step.reasons.append(f"table audit: {err}")
        step.status = "partial" if step.files else "skipped"
        return
    td = table_result.to_dict()
    write_atomic(out / "papyrus-audit.json", json.dumps(td, ensure_ascii=False, indent=1) + "\n")
    step.files.append("papyrus-audit.json")
    _reports(table_result, out, "papyrus-audit", step)
    flags = [f"day {f['row']}: {f['written']} -> {f['expected']} ({f['kind']})" for f in td.get("flags", [])]
    step.data["table_flags"] = flags
    step.summary += f"; its table audited: {len(flags)} flagged" if step.summary else \
        f"table audited: {len(flags)} flagged"
    if step.reasons and step.status == "done":
        step.status = "partial"
