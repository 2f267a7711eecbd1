"""Batch runs: annotate or audit every file of a folder, and sum up.

An edition is rarely one file.  ``annotate_folder`` and ``audit_folder`` run
the one-file functions over a whole folder (subfolders included), keep going
past a bad file (its error is reported with the others), and return one
summary: files, numbers read, damaged, flagged, restored.  Many files go to a
small process pool.  The library returns data; progress bars belong to the
command line, which passes a ``progress(done, total, name)`` callback.
"""

from __future__ import annotations

import html
import os
from collections.abc import Callable
from concurrent.futures import ProcessPoolExecutor
from dataclasses import dataclass, field
from pathlib import Path

from . import limits
from .errors import LimitError, NumcheckError
from .files import OutputError, same_file, write_atomic

__all__ = ["BatchResult", "annotate_folder", "audit_folder", "find_files", "POOL_MIN_FILES",
           "TABLE_SUFFIXES", "write_index"]

#: Use a process pool from this many files on (below it, starting the pool costs more).
POOL_MIN_FILES = 8
#: Workers of the pool (this project's machines have 2 cores).
DEFAULT_WORKERS = 2
#: The files ``audit_folder`` treats as tables.
TABLE_SUFFIXES = (".tsv", ".csv", ".xml")   # .xml: the first TEI <table> (numcheck.tables)

Progress = Callable[[int, int, str], None]


@dataclass
class BatchResult:
    """One batch run: per-file entries (dicts) and the summary."""

    kind: str                                   # "annotate" or "audit"
    folder: str
    out: str | None
    files: list[dict] = field(default_factory=list)
    index: str | None = None

    @property
    def summary(self) -> dict:
        ok = [f for f in self.files if "error" not in f and "skipped" not in f]
        return {
            "files": len(self.files),
            "failed": sum(1 for f in self.files if "error" in f),
            "skipped": sum(1 for f in self.files if "skipped" in f),
            "numbers": sum(f.get("numbers", 0) for f in ok),
            "damaged": sum(f.get("damaged", 0) for f in ok),
            "flagged": sum(f.get("flagged", 0) for f in ok),
            "restored": sum(f.get("restored", 0) for f in ok),
            "unreadable": sum(f.get("unreadable", 0) for f in ok),
        }

    def to_dict(self) -> dict:
        out = {"kind": self.kind, "folder": self.folder, "summary": self.summary,
               "files": self.files}
        if self.out is not None:
            out["out"] = self.out
        if self.index is not None:
            out["index"] = self.index
        return out


def find_files(folder: str | os.PathLike, suffixes: tuple[str, ...],
               exclude: str | os.PathLike | None = None) -> list[Path]:
    """The files under *folder* (subfolders too) with one of *suffixes*, sorted.

    Hidden files and folders (names starting with ".") and anything inside
    *exclude* (an output folder placed inside the input) are left out.
    """
    root = Path(folder)
    if not root.is_dir():
        raise NumcheckError(f"{str(root)!r} is not a folder.")
    skip = Path(exclude).resolve() if exclude is not None else None
    found = []
    for path in sorted(root.rglob("*")):
        rel = path.relative_to(root)
        if any(part.startswith(".") for part in rel.parts):
            continue
        if skip is not None and (path.resolve() == skip or skip in path.resolve().parents):
            continue
        if path.is_file() and path.suffix.lower() in suffixes:
            found.append(path)
    if len(found) > limits.MAX_BATCH_FILES:
        raise LimitError(f"number of files in {str(root)!r}", len(found), limits.MAX_BATCH_FILES,
                         "Set numcheck.limits.MAX_BATCH_FILES higher, or run on a subfolder.")
    return found


def _run(jobs: list[tuple], worker, progress: Progress | None, workers: int | None) -> list[dict]:
    """Run *worker* over *jobs* (in a pool when there are many); results in job order."""
    total = len(jobs)
    n_workers = DEFAULT_WORKERS if workers is None else max(1, int(workers))
    # More processes than files or than cores only costs: a pool of 100,000
    # would spend minutes starting processes (and may exhaust the machine).
    n_workers = min(n_workers, total or 1, max(1, os.cpu_count() or 1) * 4)
    results: list[dict | None] = [None] * total
    if total >= POOL_MIN_FILES and n_workers > 1:
        with ProcessPoolExecutor(max_workers=n_workers) as pool:
            futures = {pool.submit(worker, job): i for i, job in enumerate(jobs)}
            from concurrent.futures import as_completed
            for done, fut in enumerate(as_completed(futures), 1):
                i = futures[fut]
                results[i] = fut.result()
                if progress:
                    progress(done, total, results[i]["file"])
    else:
        for i, job in enumerate(jobs):
            results[i] = worker(job)
            if progress:
                progress(i + 1, total, results[i]["file"])
    return results  # type: ignore[return-value]


# -- annotate -------------------------------------------------------------

def _annotate_one(job: tuple) -> dict:
    src, dst, rel, alternatives, fix, notation = job
    from .tei import annotate

    entry = {"file": rel, "output": str(dst)}
    try:
        Path(dst).parent.mkdir(parents=True, exist_ok=True)
        result = annotate(src, dst, alternatives=alternatives, fix=fix, notation=notation)
    except NumcheckError as err:
        entry["error"] = str(err)
        return entry
    d = result.to_dict()
    entry.update({k: d[k] for k in ("numbers", "damaged", "flagged", "restored", "unreadable",
                                    "statuses")})
    entry["contradictions"] = [n for n in d["nums"] if n["status"] in ("contradiction", "fixed")]
    # A number that cannot be read is listed with its place; the file was still annotated.
    entry["unreadable_nums"] = [n for n in d["nums"] if n["status"] == "unreadable"]
    if d["notes"]:
        entry["notes"] = d["notes"]
    return entry


def annotate_folder(in_dir: str | os.PathLike, out_dir: str | os.PathLike, *,
                    alternatives: int = 0, fix: bool = False, notation: str | None = None,
                    workers: int | None = None, progress: Progress | None = None) -> BatchResult:
    """Annotate every ``.xml`` file under *in_dir* into the same place under *out_dir*.

    *out_dir* must differ from *in_dir* (inputs are never written over).  A
    file that fails is reported in its entry (``error``) and the run goes on.
    """
    src_root, dst_root = Path(in_dir), Path(out_dir)
    if dst_root.exists() and same_file(src_root, dst_root):
        raise OutputError(f"The output folder {str(dst_root)!r} is the input folder; numcheck never "
                          "writes over its inputs. Give another folder (-o).")
    files = find_files(src_root, (".xml",), exclude=dst_root)
    dst_root.mkdir(parents=True, exist_ok=True)
    jobs = []
    for path in files:
        rel = path.relative_to(src_root)
        jobs.append((str(path), str(dst_root / rel), rel.as_posix(), alternatives, fix, notation))
    result = BatchResult("annotate", str(src_root), str(dst_root))
    result.files = _run(jobs, _annotate_one, progress, workers)
    return result


# -- audit ----------------------------------------------------------------

def _audit_one(job: tuple) -> dict:
    src, rel, report_dir, notation, relation, scheme, *rest = job
    model, join = rest if rest else (None, None)
    from .audit import audit

    from .tei.markup import NoTableError

    entry: dict = {"file": rel}
    try:
        result = audit(Path(src), notation=notation, relation=relation, scheme=scheme,
                       model=model, join=join)
    except NoTableError as err:
        entry["skipped"] = str(err)
        return entry
    except NumcheckError as err:
        entry["error"] = str(err)
        return entry
    d = result.to_dict()
    flags, restorations = d.get("flags", []), d.get("restorations", [])
    numbers, damaged = _cell_counts(result)
    entry.update({
        "numbers": numbers,
        "damaged": damaged,
        "flagged": len(flags),
        "restored": len({(r.get("row"), r.get("column")) for r in restorations}),
        "unreadable": len(d.get("unreadable", [])),
        "schemes": d.get("schemes", []),
        "flags": flags,
        "restorations": restorations,
    })
    if report_dir is not None:
        entry["reports"] = _write_reports(result, Path(report_dir), rel)
    return entry


def _cell_counts(result) -> tuple[int, int]:
    """(numbers read, damaged cells) of an audited table, from the audit's own cells."""
    table = getattr(result, "table", None)
    columns = getattr(table, "columns", None)
    if not isinstance(columns, dict):
        return 0, 0
    numbers = damaged = 0
    for column in columns.values():
        for cell in column.cells:
            if not str(cell.text).strip():
                continue
            numbers += 1
            reading = getattr(cell, "reading", None)
            if getattr(cell, "damaged", False) or (reading is not None and reading.damaged):
                damaged += 1
    return numbers, damaged


def _report_stem(rel: str) -> str:
    """A flat, unique name for a file's reports (``sub/a.tsv`` -> ``sub__a.tsv``)."""
    return rel.replace("/", "__")


def _write_reports(result, report_dir: Path, rel: str) -> dict:
    from . import report

    stem = _report_stem(rel)
    out = {}
    for key, suffix, fn in (("plot", ".png", report.write_plot),
                            ("html", ".html", report.write_html),
                            ("flags", ".flags.csv", report.write_flags_csv)):
        path = report_dir / (stem + suffix)
        try:
            fn(result, path)
        except NumcheckError as err:
            out[key + "_error"] = str(err)
            continue
        out[key] = path.name
    return out


def audit_folder(in_dir: str | os.PathLike, *, report_dir: str | os.PathLike | None = None,
                 notation: str | None = None, relation=None, workers: int | None = None,
                 progress: Progress | None = None, scheme=None, model=None, join=None) -> dict:
    """Audit every table (``.tsv``, ``.csv``, a TEI ``.xml`` with a ``<table>``) under *in_dir*.

    With *report_dir*, each file gets its HTML report, plot and flags CSV
    there, and ``index.html`` links them all.  Returns the JSON object of the
    batch (``summary``, ``files``, ``index``).
    """
    src_root = Path(in_dir)
    files = find_files(src_root, TABLE_SUFFIXES,
                       exclude=report_dir if report_dir is not None else None)
    if report_dir is not None:
        rdir = Path(report_dir)
        if rdir.exists() and same_file(rdir, src_root):
            raise OutputError(f"The report folder {str(rdir)!r} is the input folder; give another one.")
        rdir.mkdir(parents=True, exist_ok=True)
    jobs = [(str(p), p.relative_to(src_root).as_posix(),
             str(report_dir) if report_dir is not None else None, notation, relation, scheme,
             model, join)
            for p in files]
    result = BatchResult("audit", str(src_root), str(report_dir) if report_dir is not None else None)
    result.files = _run(jobs, _audit_one, progress, workers)
    if report_dir is not None:
        index = Path(report_dir) / "index.html"
        write_index(result, index)
        result.index = str(index)
    return result.to_dict()


def write_index(result: BatchResult, path: str | os.PathLike) -> None:
    """One HTML page linking each file's report, with the batch summary."""
    esc = html.escape
    s = result.summary
    rows = []
    for f in result.files:
        reports = f.get("reports", {})
        link = (f'<a href="{esc(reports["html"])}">{esc(f["file"])}</a>'
                if "html" in reports else esc(f["file"]))
        plot = f'<a href="{esc(reports["plot"])}">plot</a>' if "plot" in reports else ""
        flags = f'<a href="{esc(reports["flags"])}">flags</a>' if "flags" in reports else ""
        if "error" in f or "skipped" in f:
            why = f.get("error") or "skipped: " + f["skipped"]
            rows.append(f"<tr class=\"err\"><td>{link}</td><td colspan=\"6\">{esc(why)}</td></tr>")
            continue
        kinds = ", ".join(sorted({s.get("kind", "?") for s in f.get("schemes", [])}))
        rows.append(f"<tr><td>{link}</td><td>{f.get('numbers', 0)}</td><td>{f.get('damaged', 0)}</td>"
                    f"<td>{f.get('flagged', 0)}</td><td>{f.get('restored', 0)}</td>"
                    f"<td>{esc(kinds)}</td><td>{plot} {flags}</td></tr>")
    page = f"""<!DOCTYPE html>
<html lang="en"><head><meta charset="utf-8"><title>numcheck audit: {esc(result.folder)}</title>
<style>body{{font-family:sans-serif;margin:2em}}table{{border-collapse:collapse}}
td,th{{border:1px solid #bbb;padding:.3em .6em;text-align:left}}tr.err td{{color:#a00}}</style></head>
<body><h1>numcheck audit of {esc(result.folder)}</h1>
<p>{s['files']} files ({s['failed']} could not be read, {s['skipped']} without a table),
{s['numbers']} numbers read,
{s['damaged']} damaged, {s['flagged']} flagged, {s['restored']} restorations proposed.</p>
<p>Flags and restorations are suggestions for the editor's judgement, not readings.</p>
<table><tr><th>file</th><th>numbers</th><th>damaged</th><th>flagged</th><th>restored</th>
<th>schemes found</th><th>files</th></tr>
{chr(10).join(rows)}
</table></body></html>
"""
    write_atomic(path, page)
