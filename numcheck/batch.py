"""Batch runs over folders and whole corpora: pool, progress, resume, summaries.

An edition is rarely one file, and a databank is tens of thousands.
``annotate_folder`` and ``audit_folder`` run the one-file functions over a
whole folder (subfolders included, symbolic links that lead out of it left
out), keep going past a bad file (its error is reported with the others), and
return one summary: files, numbers read, damaged, flagged, restored.

Whole corpora:

- Many files go to a process pool no larger than the machine's cores, fed a
  few files at a time (memory stays flat for 10^5 files).
- With a summary folder (the output folder of ``annotate``, the report folder
  of ``audit``, or ``summary_dir``) the run keeps a journal there
  (``.numcheck-run/``): each finished file's entry is recorded, written
  atomically in small parts.  A run stopped by Ctrl-C or SIGTERM records
  everything finished; after ``kill -9`` at most the last
  ``limits.BATCH_JOURNAL_SECONDS`` of work is done again.  Running the same
  command again resumes: files already done (same size and modification time)
  are not redone, and the summary is the same as an uninterrupted run's.
- The summary folder gets ``numcheck-files.csv`` (one row per file, its
  counts), ``numcheck-summary.json`` (the whole batch) and
  ``numcheck-findings.csv`` (every contradiction, slip and restoration of the
  corpus, one row each, with the same columns for sorting).

The library returns data; progress bars belong to the command line, which
passes a ``progress(done, total, name)`` callback.
"""

from __future__ import annotations

import csv
import functools
import hashlib
import html
import io
import json
import os
import shutil
import signal
import tempfile
import time
from collections.abc import Callable
from dataclasses import dataclass, field
from pathlib import Path

from . import limits
from .errors import LimitError, NumcheckError
from .files import (OutputError, check_distinct, check_target, commit_pending, discard_pending,
                    display_name, left_by_a_dead_process, same_file, short, sweep_stale_temporaries, write_atomic,
                    write_atomic_together, write_pending)

__all__ = ["BatchResult", "annotate_folder", "audit_folder", "find_files", "POOL_MIN_FILES",
           "ANNOTATE_SUFFIXES",
           "TABLE_SUFFIXES", "write_index", "display_name", "machine_workers",
           "SUMMARY_FILES"]

#: Use a process pool from this many files on (below it, starting the pool costs more).
POOL_MIN_FILES = 8
#: Workers of the pool when none are asked for: the cores the machine gives this process.
DEFAULT_WORKERS = None
#: The files ``annotate_folder`` reads: TEI files, and ATF transliterations (listed as TSV).
ATF_SUFFIX = ".atf"
ANNOTATE_SUFFIXES = (".xml", ATF_SUFFIX)
#: The files ``audit_folder`` treats as tables.
TABLE_SUFFIXES = (".tsv", ".csv", ".xml")   # .xml: the first TEI <table> (numcheck.tables)
#: The summary files of a batch run (in the summary folder).
SUMMARY_FILES = ("numcheck-files.csv", "numcheck-summary.json", "numcheck-findings.csv")
#: The journal of a batch run, inside the summary folder.
JOURNAL_DIR = ".numcheck-run"

Progress = Callable[[int, int, str], None]


def machine_workers() -> int:
    """The cores this process may use (its CPU affinity, else ``os.cpu_count()``)."""
    try:
        return max(1, len(os.sched_getaffinity(0)))
    except (AttributeError, OSError):
        return max(1, os.cpu_count() or 1)


@dataclass
class BatchResult:
    """One batch run: per-file entries (dicts) and the summary."""

    kind: str                                   # "annotate" or "audit"
    folder: str
    out: str | None
    files: list[dict] = field(default_factory=list)
    index: str | None = None
    resumed: int = 0
    summary_dir: str | None = None

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

    def findings(self) -> list[dict]:
        """Every contradiction, slip and restoration of the run, one flat row each, sorted.

        The columns are the same for every row (``FINDING_COLUMNS``), so the
        list sorts by any of them; here by file, then row or line.
        """
        rows = []
        for f in self.files:
            for n in f.get("contradictions", []):
                rows.append({"file": f["file"], "kind": n.get("status", "contradiction"),
                             "row": n.get("line") or "", "column": "", "written": n.get("text", ""),
                             "expected": n.get("value", ""),
                             "detail": short(n.get("message", ""))})
            for g in f.get("flags", []):
                rows.append({"file": f["file"], "kind": g.get("kind", ""), "row": g.get("row", ""),
                             "column": g.get("column", ""), "written": g.get("written", ""),
                             "expected": g.get("expected", ""), "detail": "slip (a suggestion)"})
            for r in f.get("restorations", []):
                rows.append({"file": f["file"], "kind": "restoration", "row": r.get("row", ""),
                             "column": r.get("column", ""), "written": "",
                             "expected": r.get("text", ""),
                             "detail": f"value {r.get('value', '')}, probability "
                                       f"{r.get('probability', '')} (a suggestion)"})
        for row in rows:
            row.update({k: str(v) for k, v in row.items()})
        rows.sort(key=lambda r: (r["file"], int(r["row"]) if r["row"].isdigit() else 0, r["column"]))
        return rows

    def to_dict(self) -> dict:
        out = {"kind": self.kind, "folder": self.folder, "summary": self.summary,
               "files": self.files}
        if self.out is not None:
            out["out"] = self.out
        if self.index is not None:
            out["index"] = self.index
        if self.resumed:
            out["resumed"] = self.resumed
        if self.summary_dir is not None:
            out["summary_files"] = [str(Path(self.summary_dir) / n) for n in SUMMARY_FILES]
        return out


#: The columns of ``numcheck-findings.csv`` (and of each row of ``findings()``).
FINDING_COLUMNS = ("file", "kind", "row", "column", "written", "expected", "detail")
#: The columns of ``numcheck-files.csv``.
FILE_COLUMNS = ("file", "status", "numbers", "damaged", "flagged", "restored", "message")


def find_files(folder: str | os.PathLike, suffixes: tuple[str, ...],
               exclude: str | os.PathLike | None = None) -> list[Path]:
    """The files under *folder* (subfolders too) with one of *suffixes*, sorted.

    Hidden files and folders (names starting with ".") and anything inside
    *exclude* are left out.  Symbolic links are followed only when they stay
    inside *folder*: a batch never reads a file outside the folder it was given.
    """
    return [Path(path) for _, path in _found_files(folder, suffixes, exclude)]


def _found_files(folder, suffixes: tuple[str, ...], exclude=None) -> list[tuple[str, str]]:
    """:func:`find_files` as ``(name relative to the folder, with "/"; path)`` pairs."""
    root = Path(folder)
    if not root.is_dir():
        raise NumcheckError(f"{short(display_name(str(root)))!r} is not a folder.")
    real_root = os.path.realpath(root)
    skip = os.path.realpath(exclude) if exclude is not None else None
    found: list[tuple[str, str]] = []

    def inside(real: str, outer: str) -> bool:
        return real.startswith(outer.rstrip(os.sep) + os.sep)

    def walk(path: str, rel: str) -> None:
        try:
            entries = sorted(os.scandir(path), key=lambda e: e.name)
        except OSError:
            return
        for entry in entries:
            name = entry.name
            if name.startswith("."):
                continue
            try:
                link = entry.is_symlink()
                if not link and entry.is_dir():
                    # A folder reached without a link lies inside the root.
                    real = os.path.join(real_root, rel, name)
                    if skip is not None and (real == skip or inside(real, skip)):
                        continue
                    walk(entry.path, f"{rel}{name}/")
                    continue
                if os.path.splitext(name)[1].lower() not in suffixes:
                    continue
                if link:
                    real = os.path.realpath(entry.path)
                    if not inside(real, real_root):
                        continue            # a link that leads out of the folder
                else:
                    real = os.path.join(real_root, rel, name)
                if skip is not None and (real == skip or inside(real, skip)):
                    continue
                if not entry.is_file():
                    continue                # a FIFO, a device, a dangling link, a folder's link
            except OSError:
                continue
            found.append((f"{rel}{name}", entry.path))
            if len(found) > limits.MAX_BATCH_FILES:
                raise LimitError(f"number of files in {short(display_name(str(root)))!r}",
                                 f"over {limits.MAX_BATCH_FILES}", limits.MAX_BATCH_FILES,
                                 "Set numcheck.limits.MAX_BATCH_FILES higher, or run on a subfolder.")

    walk(str(root), "")
    found.sort(key=lambda item: item[0])
    return found


def _no_files(root: Path, suffixes: tuple[str, ...]) -> NumcheckError:
    return NumcheckError(
        f"No {' or '.join(suffixes)} files were found in {short(display_name(str(root)))!r} "
        "(hidden files and folders, and links that lead out of the folder, are left out); "
        "nothing was done.")


# -- the journal: what is done, so that a stopped run resumes ----------------

def _stamp(path: str) -> list:
    st = os.stat(path)
    return [st.st_size, st.st_mtime_ns]


class _Journal:
    """The entries of finished files, recorded in the summary folder in atomic parts."""

    def __init__(self, folder: Path | None, key: dict):
        self.folder = folder / JOURNAL_DIR if folder is not None else None
        self.key = key
        self.done: dict[str, dict] = {}
        self._pending: list[str] = []          # journal lines not yet written
        self._outputs: list[tuple] = []         # outputs written, not yet committed
        self._last = time.monotonic()
        self._part = 0

    def load(self) -> None:
        """Read the journal of an earlier run with the same key (command, folder, options)."""
        if self.folder is None or not self.folder.is_dir():
            return
        try:
            key = json.loads((self.folder / "key.json").read_text(encoding="utf-8"))
        except (OSError, ValueError):
            key = None
        if key != self.key:
            self.clear()
            return
        for part in sorted(self.folder.glob("part-*.jsonl")):
            try:
                lines = part.read_text(encoding="utf-8").splitlines()
            except (OSError, UnicodeDecodeError):
                continue
            for line in lines:
                try:
                    record = json.loads(line)
                    self.done[record["rel"]] = record
                except (ValueError, KeyError, TypeError):
                    continue
            self._part = max(self._part, int(part.stem.split("-")[1]) + 1)

    def clear(self) -> None:
        if self.folder is None or not self.folder.is_dir():
            return
        for part in self.folder.iterdir():
            if part.is_file() and (part.name.startswith("part-") or part.name == "key.json"):
                part.unlink()

    def start(self) -> None:
        if self.folder is None:
            return
        self.folder.mkdir(parents=True, exist_ok=True)
        write_atomic(self.folder / "key.json", json.dumps(self.key, sort_keys=True) + "\n")

    def finished(self, rel: str, stamp: list, entry: dict, line: str | None = None,
                 pending: tuple = ()) -> None:
        """Record a finished file: its *entry*, the journal *line* a worker made of it (made
        here if None), and the outputs *pending* (``(temporary, target)``) it wrote."""
        self.done[rel] = {"rel": rel, "stamp": stamp, "entry": entry}
        self._outputs.extend(pending)
        if self.folder is not None:
            self._pending.append(line if line is not None else _journal_line(rel, stamp, entry))
        if (max(len(self._pending), len(self._outputs)) >= limits.BATCH_JOURNAL_ENTRIES
                or time.monotonic() - self._last >= limits.BATCH_JOURNAL_SECONDS):
            self.flush()

    def flush(self) -> None:
        """Commit the pending outputs (on the disk, then renamed), then record their entries."""
        outputs, self._outputs = self._outputs, []
        commit_pending(outputs)
        self._last = time.monotonic()
        if self.folder is None or not self._pending:
            return
        write_atomic(self.folder / f"part-{self._part:06d}.jsonl", "".join(self._pending))
        self._part += 1
        self._pending = []

    def discard(self) -> None:
        """Remove the pending outputs without committing them (the run failed)."""
        outputs, self._outputs = self._outputs, []
        discard_pending(outputs)


def _journal_line(rel: str, stamp: list, entry: dict) -> str:
    return json.dumps({"rel": rel, "stamp": stamp, "entry": entry}, ensure_ascii=False) + "\n"


def _quiet_worker() -> None:
    """In a pool worker: Ctrl-C is the parent's to handle; die with the parent (Linux)."""
    signal.signal(signal.SIGINT, signal.SIG_IGN)
    signal.signal(signal.SIGTERM, _raise_exit)
    try:
        import ctypes

        libc = ctypes.CDLL(None)
        libc.prctl(1, signal.SIGKILL)        # PR_SET_PDEATHSIG: a kill -9 of the parent ends us too
    except (OSError, AttributeError):       # not Linux: the parent's shutdown ends us
        pass


def _raise_exit(signum, frame):
    raise SystemExit(128 + signum)


def _run(jobs: list[tuple], worker, progress: Progress | None, workers: int | None,
         journal: _Journal, stamps: list, prepare: Callable[[], None] | None = None) -> list[dict]:
    """Run *worker* over *jobs* (in a bounded pool when there are many); entries in job order.

    ``jobs[i][0]`` is the file's relative name (the key of the journal);
    ``worker(job)`` gives ``(entry, pending)``: the file's entry and the
    outputs it wrote pending (:func:`~numcheck.files.write_pending`), which
    the journal commits before it records their entries.  Files the journal
    already holds with the same stamp are not run again.  *prepare* runs
    before a pool is made: what it imports, workers forked from this process
    need not import each (each importing numcheck at once cost a run of a
    few files more than the files).
    """
    total = len(jobs)
    results: list[dict | None] = [None] * total
    todo = []
    for i, job in enumerate(jobs):
        record = journal.done.get(job[0])
        if record is not None and record.get("stamp") == stamps[i]:
            results[i] = record["entry"]
        else:
            todo.append(i)
    done = total - len(todo)
    if progress and done:
        progress(done, total, "(resumed)")
    n_workers = machine_workers() if workers is None else max(1, int(workers))
    # More processes than files or than cores only costs: a pool of 100,000
    # would spend minutes starting processes (and may exhaust the machine).
    n_workers = min(n_workers, len(todo) or 1, machine_workers())
    finished = False
    try:
        if len(todo) >= POOL_MIN_FILES and n_workers > 1:
            if prepare is not None and _forks():
                prepare()
            done = _run_pool(jobs, todo, worker, n_workers, results, journal, stamps,
                             progress, done, total)
        else:
            for i in todo:
                results[i], pending = worker(jobs[i])
                journal.finished(jobs[i][0], stamps[i], results[i], pending=pending)
                done += 1
                if progress:
                    progress(done, total, results[i]["file"])
        finished = True
    finally:
        try:
            journal.flush()     # stopped by Ctrl-C or SIGTERM too: what finished is kept
        except BaseException:
            journal.discard()
            if finished:
                raise
    return results  # type: ignore[return-value]


def _run_chunk(worker, items: list[tuple]) -> list[tuple]:
    """In a pool worker: *worker* over the ``(job, stamp)`` of *items*; ``(entry, pending,
    journal line)`` for each.  Stopped midway, it removes the outputs it left pending."""
    out: list[tuple] = []
    try:
        for job, stamp in items:
            entry, pending = worker(job)
            out.append((entry, pending, _journal_line(job[0], stamp, entry)))
    except BaseException:
        for _, pending, _ in out:
            discard_pending(pending)
        raise
    return out


def _chunk_size(files: int, workers: int) -> int:
    """Files a pool task holds: few enough that every worker gets many tasks, at most 16."""
    return max(1, min(16, files // (workers * 8)))


def _forks() -> bool:
    """Whether the pool's workers are forked from this process (they inherit its modules)."""
    import multiprocessing

    # allow_none: asking must not fix the start method for the caller's program.
    method = multiprocessing.get_start_method(allow_none=True)
    return (method or multiprocessing.get_all_start_methods()[0]) == "fork"


def _import_annotation() -> None:
    from .tei import annotation  # noqa: F401


def _run_pool(jobs, todo, worker, n_workers, results, journal, stamps, progress, done, total):
    from concurrent.futures import FIRST_COMPLETED, ProcessPoolExecutor, wait

    pool = ProcessPoolExecutor(max_workers=n_workers, initializer=_quiet_worker)
    size = _chunk_size(len(todo), n_workers)
    chunks = iter([todo[k:k + size] for k in range(0, len(todo), size)])
    window = n_workers * 3          # tasks in flight: memory stays flat however many files
    pending: dict = {}

    def submit(chunk) -> None:
        pending[pool.submit(_run_chunk, worker, [(jobs[i], stamps[i]) for i in chunk])] = chunk

    try:
        for chunk in chunks:
            submit(chunk)
            if len(pending) >= window:
                break
        while pending:
            finished, _ = wait(pending, return_when=FIRST_COMPLETED)
            for fut in finished:
                chunk = pending.pop(fut)
                for i, (entry, outputs, line) in zip(chunk, fut.result()):
                    results[i] = entry
                    journal.finished(jobs[i][0], stamps[i], entry, line, outputs)
                    done += 1
                    if progress:
                        progress(done, total, entry["file"])
                nxt = next(chunks, None)
                if nxt is not None:
                    submit(nxt)
    except BaseException:
        # Stopped (Ctrl-C, SIGTERM): what finished is in the journal; end the
        # workers now (each removes the outputs it had pending; none is torn).
        for proc in list(getattr(pool, "_processes", {}).values()):
            try:
                proc.terminate()
            except (OSError, AttributeError):
                pass
        pool.shutdown(wait=False, cancel_futures=True)
        raise
    pool.shutdown(wait=True)
    return done


def _write_summary(result: BatchResult, folder: Path) -> None:
    """``numcheck-files.csv``, ``numcheck-summary.json`` and ``numcheck-findings.csv`` in *folder*."""
    buf = io.StringIO()
    w = csv.DictWriter(buf, fieldnames=FILE_COLUMNS, lineterminator="\n")
    w.writeheader()
    for f in result.files:
        status = "failed" if "error" in f else "skipped" if "skipped" in f else "ok"
        w.writerow({"file": f["file"], "status": status, "numbers": f.get("numbers", ""),
                    "damaged": f.get("damaged", ""), "flagged": f.get("flagged", ""),
                    "restored": f.get("restored", ""),
                    "message": short(f.get("error") or f.get("skipped") or "")})
    files = buf.getvalue()
    data = result.to_dict()
    findings = data["findings"] = result.findings()
    buf = io.StringIO()
    w = csv.DictWriter(buf, fieldnames=FINDING_COLUMNS, lineterminator="\n")
    w.writeheader()
    w.writerows(findings)
    write_atomic_together([(folder / SUMMARY_FILES[0], files),
                           (folder / SUMMARY_FILES[1], _summary_json(data)),
                           (folder / SUMMARY_FILES[2], buf.getvalue())])


def _summary_json(data: dict) -> str:
    """*data* as JSON, one key to a line and one item of a list to a line (readable, and
    written by the C encoder: ``indent`` would take the slow one, a second for 10^5 files)."""
    dump = functools.partial(json.dumps, ensure_ascii=False)
    lines = []
    for key, value in data.items():
        if isinstance(value, list) and value:
            items = ",\n  ".join(map(dump, value))
            lines.append(f"{dump(key)}: [\n  {items}\n ]")
        else:
            lines.append(f"{dump(key)}: {dump(value)}")
    return "{\n " + ",\n ".join(lines) + "\n}\n"


def _prepare(src_root: Path, out: Path | None, what: str) -> None:
    """Refuse an output (or summary) folder that is, holds or lies inside the input folder."""
    if out is None:
        return
    if out.exists() and same_file(src_root, out):
        raise OutputError(f"The {what} {short(display_name(str(out)))!r} is the input folder; "
                          "numcheck never writes over its inputs. Give another folder.")
    check_distinct([src_root], out)
    if out.exists() and not out.is_dir():
        raise OutputError(f"The {what} {short(display_name(str(out)))!r} is a file, not a folder.")


# -- annotate -------------------------------------------------------------

def _annotate_one(job: tuple) -> tuple[dict, tuple]:
    """One file of :func:`annotate_folder`: its entry, and its output written pending."""
    rel, src, dst, alternatives, fix, notation, refused, share, staging = job
    from .tei.annotation import annotate_entry

    entry = {"file": display_name(rel), "output": display_name(str(dst))}
    shared = _sharing(share)
    try:
        if refused:
            raise OutputError(refused)
        check_target(dst)
        if shared is not None:
            shared.take()
        if src.lower().endswith(ATF_SUFFIX):
            out_bytes, fields = _atf_entry(src, notation)
        else:
            out_bytes, fields = annotate_entry(src, alternatives=alternatives, fix=fix,
                                               notation=notation)
        if shared is not None:
            shared.give()
        # annotate_folder swept the output folders of stale temporaries once;
        # the journal commits this one (on the disk, then renamed) with others.
        pending = ((write_pending(dst, out_bytes, _own_folder(staging)), dst),)
    except NumcheckError as err:
        entry["error"] = short(str(err), limits.MAX_ECHO * 4)
        return entry, ()
    entry.update(fields)
    return entry, pending


def _atf_entry(src: str, notation: str | None) -> tuple[bytes, dict]:
    """The TSV listing of the ATF file *src* (what ``annotate FILE.atf -o`` writes) and its
    batch fields: every number word read, the input never changed."""
    from .atf.annotate import atf_listing, read_atf_file

    if notation not in (None, "atf", "atf-math"):
        raise NumcheckError(f"An ATF file is read in the notation atf (or atf-math for "
                            f"mathematical texts), not {notation!r}; this one was left out.")
    result = read_atf_file(src, math=notation == "atf-math")
    d = result.to_dict()
    fields = {"format": "atf", "numbers": d["numbers"], "damaged": d["damaged"], "flagged": 0,
              "restored": 0, "unreadable": d["unread"]}
    return atf_listing(result).encode("utf-8"), fields


#: In a pool worker: its side of the exchange of outcomes (:mod:`.tei.sharing`), by folder.
_SHARED: dict = {}


def _sharing(folder: str | None):
    if folder is None:
        return None
    shared = _SHARED.get(folder)
    if shared is None:
        from .tei.sharing import Sharing

        _SHARED.clear()
        shared = _SHARED[folder] = Sharing(folder)
    return shared


#: The folder, inside the output folder, where a batch's workers write their outputs pending.
STAGING_PREFIX = ".numcheck-staging-"


def _own_folder(staging: str) -> str:
    """This process's folder in the batch's *staging* folder (made at its first file)."""
    own = os.path.join(staging, str(os.getpid()))
    if own not in _MADE:
        os.makedirs(own, exist_ok=True)
        _MADE.add(own)
    return own


_MADE: set[str] = set()


def _sweep_staging(root: Path) -> None:
    """Remove the staging folders a killed run left in *root* (their process is gone)."""
    try:
        entries = [e for e in os.scandir(root) if e.name.startswith(STAGING_PREFIX)]
    except OSError:
        return
    for entry in entries:
        pid = entry.name[len(STAGING_PREFIX):].split("-", 1)[0]
        if left_by_a_dead_process(pid) and entry.is_dir(follow_symlinks=False):
            shutil.rmtree(entry.path, ignore_errors=True)


def _output_folders(src_root: Path, jobs_dst: list[str]) -> dict[str, str]:
    """Make the output folders of *jobs_dst*; returns why each folder refused is refused.

    A folder that cannot be made, or that is (through a link) the input
    folder or inside it, refuses its files (each gets the error, the run goes
    on).  Outputs are renamed into place, so a target that is itself a link
    to an input replaces the link, never the input.
    """
    refused: dict[str, str] = {}
    for folder in sorted({os.path.dirname(d) for d in jobs_dst}):
        try:
            check_distinct([src_root], folder)      # before it is made: not inside the input
            os.makedirs(folder, exist_ok=True)
        except (OSError, NumcheckError) as err:
            refused[folder] = short(str(err), limits.MAX_ECHO * 4)
            continue
        sweep_stale_temporaries(folder)     # once per folder, not once per file (quadratic)
    return refused


def annotate_folder(in_dir: str | os.PathLike, out_dir: str | os.PathLike, *,
                    alternatives: int = 0, fix: bool = False, notation: str | None = None,
                    workers: int | None = None, progress: Progress | None = None,
                    summary_dir: str | os.PathLike | None = None,
                    fresh: bool = False) -> BatchResult:
    """Annotate every ``.xml`` file under *in_dir* into the same place under *out_dir*.

    An ATF transliteration (``.atf``) gets the listing of its number words
    (what ``annotate FILE.atf -o`` writes) as ``<name>.atf.tsv`` there; the
    notation, if given, must then be ``atf`` or ``atf-math``.

    *out_dir* must be apart from *in_dir*: not the same folder, not inside
    it, not holding it (inputs are never written over); this is checked
    before any work.  A folder without a single ``.xml`` or ``.atf`` file is an error.  A
    file that fails is reported in its entry (``error``) and the run goes on.
    The summary files and the journal go to *summary_dir* (default:
    *out_dir*); a run stopped midway resumes where it stopped unless *fresh*.
    """
    src_root, dst_root = Path(in_dir), Path(out_dir)
    _prepare(src_root, dst_root, "output folder")
    sdir = Path(summary_dir) if summary_dir is not None else dst_root
    _prepare(src_root, sdir, "summary folder")
    found = _found_files(src_root, ANNOTATE_SUFFIXES)
    if not found:
        raise _no_files(src_root, ANNOTATE_SUFFIXES)
    dst_root.mkdir(parents=True, exist_ok=True)
    sdir.mkdir(parents=True, exist_ok=True)
    rels = [rel for rel, _ in found]
    files = [path for _, path in found]
    # An ATF file gets its listing beside it, named after it (tablet.atf -> tablet.atf.tsv).
    out_root = str(dst_root)
    targets = [os.path.join(out_root, *(rel + ".tsv" if rel.lower().endswith(ATF_SUFFIX)
                                        else rel).split("/")) for rel in rels]
    refused = _output_folders(src_root, targets)
    _sweep_staging(dst_root)
    staging = tempfile.mkdtemp(prefix=f"{STAGING_PREFIX}{os.getpid()}-", dir=dst_root)
    share = None
    if len(files) >= POOL_MIN_FILES and workers != 1 and machine_workers() > 1:
        share = tempfile.mkdtemp(prefix="numcheck-outcomes-")
    jobs = [(rel, path, dst, alternatives, fix, notation,
             refused.get(os.path.dirname(dst)), share, staging)
            for rel, path, dst in zip(rels, files, targets)]
    stamps = [_stamp(path) for path in files]
    key = {"kind": "annotate", "input": display_name(os.path.realpath(src_root)),
           "output": display_name(os.path.realpath(dst_root)), "alternatives": alternatives,
           "fix": bool(fix), "notation": notation}
    journal = _Journal(sdir, key)
    if not fresh:
        journal.load()
        for job in jobs:        # an output deleted since is made again
            record = journal.done.get(job[0])
            if record and "error" not in record["entry"] and not Path(job[2]).is_file():
                del journal.done[job[0]]
    else:
        journal.clear()
    journal.start()
    result = BatchResult("annotate", display_name(str(src_root)), display_name(str(dst_root)),
                         summary_dir=display_name(str(sdir)))
    already = sum(1 for i, j in enumerate(jobs)
                  if journal.done.get(j[0], {}).get("stamp") == stamps[i])
    try:
        result.files = _run(jobs, _annotate_one, progress, workers, journal, stamps,
                            prepare=_import_annotation)
    finally:
        shutil.rmtree(staging, ignore_errors=True)
        if share is not None:
            shutil.rmtree(share, ignore_errors=True)
    result.resumed = already
    _write_summary(result, sdir)
    return result


# -- audit ----------------------------------------------------------------

def _audit_one(job: tuple) -> dict:
    rel, src, report_dir, notation, relation, scheme, *rest = job
    model, join = rest if rest else (None, None)
    from .audit import audit

    from .tei.markup import NoTableError

    entry: dict = {"file": display_name(rel)}
    try:
        result = audit(Path(src), notation=notation, relation=relation, scheme=scheme,
                       model=model, join=join)
    except NoTableError as err:
        entry["skipped"] = short(str(err), limits.MAX_ECHO * 4)
        return entry
    except NumcheckError as err:
        entry["error"] = short(str(err), limits.MAX_ECHO * 4)
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
        entry["reports"] = _write_reports(result, Path(report_dir), display_name(rel))
    return entry


def _audited(job: tuple) -> tuple[dict, tuple]:
    """:func:`_audit_one` as :func:`_run` calls it (its reports are written whole: none pending)."""
    return _audit_one(job), ()


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
    return rel.replace("/", "__").replace("\ufffd", "_")


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
            out[key + "_error"] = short(str(err), limits.MAX_ECHO * 4)
            continue
        out[key] = path.name
    return out


def audit_folder(in_dir: str | os.PathLike, *, report_dir: str | os.PathLike | None = None,
                 notation: str | None = None, relation=None, workers: int | None = None,
                 progress: Progress | None = None, summary_dir: str | os.PathLike | None = None,
                 fresh: bool = False, scheme=None, model=None, join=None) -> dict:
    """Audit every table (``.tsv``, ``.csv``, a TEI ``.xml`` with a ``<table>``) under *in_dir*.

    With *report_dir*, each file gets its HTML report, plot and flags CSV
    there, and ``index.html`` links them all.  The summary files and the
    journal go to *summary_dir* (default: *report_dir*; none without either),
    and a run stopped midway resumes there unless *fresh*.  The report and
    summary folders must lie apart from *in_dir* (checked before any work); a
    folder without a single table is an error.  Returns the JSON object of
    the batch (``summary``, ``files``, ``index``).
    """
    src_root = Path(in_dir)
    rdir = Path(report_dir) if report_dir is not None else None
    _prepare(src_root, rdir, "report folder")
    sdir = Path(summary_dir) if summary_dir is not None else rdir
    _prepare(src_root, sdir, "summary folder")
    files = find_files(src_root, TABLE_SUFFIXES)
    if not files:
        raise _no_files(src_root, TABLE_SUFFIXES)
    for folder in (rdir, sdir):
        if folder is not None:
            folder.mkdir(parents=True, exist_ok=True)
    jobs, stamps = [], []
    for p in files:
        jobs.append((p.relative_to(src_root).as_posix(), str(p),
                     str(rdir) if rdir is not None else None, notation, relation, scheme,
                     model, join))
        stamps.append(_stamp(str(p)))
    key = {"kind": "audit", "input": display_name(os.path.realpath(src_root)),
           "reports": display_name(os.path.realpath(rdir)) if rdir is not None else None,
           "notation": notation, "relation": relation if isinstance(relation, str) else repr(relation),
           "scheme": scheme if scheme is None or isinstance(scheme, str) else repr(scheme),
           "model": model if model is None or isinstance(model, str) else repr(model),
           "join": join if join is None or isinstance(join, str) else repr(join)}
    journal = _Journal(sdir, key)
    if fresh:
        journal.clear()
    else:
        journal.load()
    journal.start()
    result = BatchResult("audit", display_name(str(src_root)),
                         display_name(str(rdir)) if rdir is not None else None,
                         summary_dir=display_name(str(sdir)) if sdir is not None else None)
    already = sum(1 for i, j in enumerate(jobs)
                  if journal.done.get(j[0], {}).get("stamp") == stamps[i])
    result.files = _run(jobs, _audited, progress, workers, journal, stamps)
    result.resumed = already
    if rdir is not None:
        index = rdir / "index.html"
        write_index(result, index)
        result.index = display_name(str(index))
    if sdir is not None:
        _write_summary(result, sdir)
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
