"""``numcheck annotate IN.xml -o OUT.xml``: exact values into a TEI/EpiDoc file (or a folder of them)."""

from __future__ import annotations

from contextlib import contextmanager
from pathlib import Path

NAME = "annotate"
HELP = ("give every <num> of a TEI/EpiDoc file (or of every .xml file in a folder) its exact "
        "@value, or @atLeast/@atMost where damage leaves a range; report values the letters "
        "contradict; list the number words of an ATF file (or of every .atf file in a folder)")
ORDER = 70

#: List every <num> of a file up to this many; beyond, only the damaged and contradicted.
_LIST_ALL = 40


def add_arguments(parser) -> None:
    parser.add_argument("input", metavar="IN", help="a TEI/EpiDoc .xml file, or a folder of them; "
                        "or an ATF transliteration (.atf): every number word is listed (in a "
                        "folder, as NAME.atf.tsv in the output folder)")
    parser.add_argument("-o", "--output", metavar="OUT",
                        help="the annotated copy (a file; a folder when IN is a folder). "
                             "Without it nothing is written: the numbers are only checked")
    parser.add_argument("--alternatives", "-k", type=int, default=0, metavar="K",
                        help="add the K best restorations of each damaged number as "
                             "<certainty locus=\"value\" assertedValue=.. degree=..> (EpiDoc)")
    parser.add_argument("--fix", action="store_true",
                        help="replace an existing @value that no reading of the letters allows "
                             "(default: report it); a value any valid reading gives is never changed")
    parser.add_argument("--notation", "-n", help="the notation of the numbers (detected when left out)")
    add_batch_arguments(parser)


def add_batch_arguments(parser) -> None:
    """The options of a folder run (also used by ``audit DIR``)."""
    parser.add_argument("--workers", type=int, default=None,
                        help="processes for a folder of many files (default and most: the "
                             "machine's cores)")
    parser.add_argument("--summary", metavar="DIR",
                        help="for a folder: where to write numcheck-files.csv, "
                             "numcheck-summary.json, numcheck-findings.csv and the run's journal "
                             "(default: the output or report folder)")
    parser.add_argument("--fresh", action="store_true",
                        help="for a folder: redo every file (default: a stopped run resumes, "
                             "files already done are not redone)")


def run(args, console) -> dict:
    from ..errors import NumcheckError

    src = Path(args.input)
    if src.is_dir():
        if not args.output:
            raise NumcheckError(f"{str(src)!r} is a folder: give an output folder with -o OUTDIR "
                                "(the inputs are never written over).")
        return _run_folder(args, console)
    if src.suffix.lower() == ".atf":
        return _run_atf(args, console)
    from ..tei import annotate

    result = annotate(src, args.output, alternatives=args.alternatives, fix=args.fix,
                      notation=args.notation)
    out = result.to_dict()
    if console is not None:
        _show_file(out, console)
    return out


def _run_atf(args, console) -> dict:
    """An ATF transliteration: list every number word (numcheck.atf); the input is never changed."""
    from ..atf import annotate_atf
    from ..errors import NumcheckError
    from ..report.atf import show_atf

    if args.notation not in (None, "atf", "atf-math"):
        raise NumcheckError(f"An ATF file is read in the notation atf (or atf-math for "
                            f"mathematical texts), not {args.notation!r}.")
    out = annotate_atf(args.input, args.output, math=args.notation == "atf-math").to_dict()
    if console is not None:
        show_atf(out, console)
    return out


def _run_folder(args, console) -> dict:
    from ..batch import annotate_folder

    with progress_bar(console, "annotating") as progress:
        result = annotate_folder(args.input, args.output, alternatives=args.alternatives,
                                 fix=args.fix, notation=args.notation, workers=args.workers,
                                 progress=progress, summary_dir=args.summary, fresh=args.fresh)
    out = result.to_dict()
    if console is not None:
        show_batch(out, console, "annotate")
    return out


@contextmanager
def progress_bar(console, label: str):
    """A rich progress bar for a batch run; yields the ``progress(done, total, name)`` callback.

    With ``console=None`` (``--json``) it yields ``None``: nothing is drawn.
    Also used by ``numcheck audit DIR``.
    """
    if console is None or not console.is_terminal:
        yield None
        return
    from rich.progress import BarColumn, MofNCompleteColumn, Progress, TextColumn

    with Progress(TextColumn(label), BarColumn(), MofNCompleteColumn(),
                  TextColumn("{task.description}"), console=console, transient=True) as bar:
        task = bar.add_task("", total=None)

        def progress(done, total, name):
            bar.update(task, completed=done, total=total, description=name)

        yield progress


def _show_file(out: dict, console) -> None:
    from ..report.layout import Sheet, note

    note(console, f"numcheck annotate  {out['input']}", "bold")
    # "#" counts the <num> of the file; "line" is the text's own line (the <lb n>
    # before it), with its <div> when that is not the edition.
    has_text_lines = any(n.get("text_line") is not None for n in out["nums"])
    cols = [("#", "number")] + ([("line", "key")] if has_text_lines else []) + [
        ("as read", "key"), ("notation", "key"), ("value", "text"), ("status", "key")]
    table = Sheet(console, cols)
    style = {"contradiction": "red", "fixed": "yellow", "range-added": "cyan", "unreadable": "red",
             "not-checkable": "magenta", "word": "blue"}
    # A long file: list what needs the editor (damaged, contradicted, unread), not every number.
    shown = out["nums"] if len(out["nums"]) <= _LIST_ALL else [
        n for n in out["nums"] if n["damaged"] or n["status"] not in ("agrees", "value-added")]
    for n in shown:
        status = n["status"]
        cells = [str(n["index"])] + ([_text_line(n)] if has_text_lines else []) + [
            n["text"], n["notation"], _value(n), (status, style.get(status))]
        table.row(*cells)
    table.print()
    if len(shown) < len(out["nums"]):
        note(console, f"{len(out['nums']) - len(shown)} undamaged numbers that agree with their "
                      "letters are not listed (--json lists every one).")
    for n in out["nums"]:
        where = _where(n)
        if n.get("message"):
            colour = "red" if n["status"] in ("contradiction", "unreadable", "fixed") else "blue"
            note(console, f"{where}: {n['message']}", colour)
        if n.get("alternatives"):
            alts = ", ".join(f"{a['text']} = {a['value']} ({a['probability']:.0%})"
                             for a in n["alternatives"])
            note(console, f"{where}: restorations (suggestions, not readings): {alts}")
    for msg in out["notes"]:
        note(console, f"note: {msg}", "yellow")
    where = f"written to {out['output']}" if out["output"] else "nothing written (no -o given)"
    note(console, f"{out['numbers']} numbers, {out['damaged']} damaged, {out['flagged']} contradicted "
                  f"by their letters, {out.get('unreadable', 0)} unreadable, {out.get('words', 0)} in "
                  f"words, {out['restored']} with restorations; {where}.")


def _where(n: dict) -> str:
    """Where a <num> is, for a reader: its place in the file, the text's line, else the XML line.

    >>> _where({"index": 3, "line": 26, "text_line": "4"}), _where({"index": 3, "line": 26})
    ('<num> 3 (line 4)', '<num> 3 (XML line 26)')
    """
    line = _text_line(n)
    return f"<num> {n.get('index', '')} ({'line ' + line if line else 'XML line ' + str(n['line'])})"


def _text_line(n: dict) -> str:
    if n.get("text_line") is None:
        return ""
    return f"{n['text_line']}" + (f" ({n['div']})" if n.get("div") and n["div"] != "edition" else "")


def _value(n: dict) -> str:
    if "value" in n:
        return _exact(n["value"])
    if "atLeast" in n or "atMost" in n:
        lo = _exact(n["atLeast"]) if "atLeast" in n else "…"
        hi = _exact(n["atMost"]) if "atMost" in n else "…"
        return f"{lo} to {hi}"
    if n.get("existing", {}).get("value"):
        return f"{n['existing']['value']} (the editor's)"
    return ""


def _exact(text: str) -> str:
    """An exact value for the table, with its sexagesimal form when it is not whole.

    The whole part stays decimal, as editions write degrees and days (92;14,5, not 1,32;14,5).

    >>> _exact("66409/720"), _exact("12")
    ('66409/720 (92;14,5)', '12')
    """
    from fractions import Fraction

    from ..identify.targets import number_text

    value = Fraction(text)
    return text if value.denominator == 1 else f"{text} ({number_text(value)})"


def show_batch(out: dict, console, kind: str) -> None:
    """The summary table of a batch run (also used by ``audit DIR``)."""
    from ..report.layout import Sheet, note

    note(console, f"numcheck {kind}  {out['folder']}", "bold")
    table = Sheet(console, [("file", "key"), ("numbers", "number"), ("damaged", "number"),
                            ("flagged", "number"), ("unreadable", "number"), ("restored", "number"),
                            ("note", "text")])
    for f in out["files"]:
        if "error" in f:
            table.row(f["file"], "", "", "", "", "", ("not read (see below)", "red"))
        elif "skipped" in f:
            table.row(f["file"], "", "", "", "", "", "skipped (see below)")
        else:
            table.row(f["file"], str(f.get("numbers", 0)), str(f.get("damaged", 0)),
                      str(f.get("flagged", 0)), str(f.get("unreadable", 0)),
                      str(f.get("restored", 0)), "")
    s = out["summary"]
    table.section()
    files = f"{s['files']} file{'s' if s['files'] != 1 else ''}"
    # Failures and skips only when there are some: "0 failed, 0 skipped" wrapped on 80 columns.
    trouble = ", ".join(f"{n} {what}" for n, what in ((s["failed"], "failed"),
                                                      (s.get("skipped", 0), "skipped")) if n)
    table.row(files, str(s["numbers"]), str(s["damaged"]), str(s["flagged"]), str(s.get("unreadable", 0)),
              str(s["restored"]), trouble, style="bold")
    table.print()
    for f in out["files"]:
        if "error" in f:
            note(console, f"{f['file']}: {f['error']}", "red")
        elif "skipped" in f:
            note(console, f"{f['file']}: skipped: {f['skipped']}")
    if out.get("resumed"):
        note(console, f"resumed: {out['resumed']} files were already done by an earlier run "
                      "(--fresh redoes them)")
    if out.get("out"):
        note(console, f"output: {out['out']}")
    for name in out.get("summary_files", []):
        note(console, f"summary: {name}")
    if out.get("index"):
        note(console, f"index of reports: {out['index']}")
