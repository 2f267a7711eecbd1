"""``numcheck annotate IN.xml -o OUT.xml``: exact values into a TEI/EpiDoc file (or a folder of them)."""

from __future__ import annotations

from contextlib import contextmanager
from pathlib import Path

NAME = "annotate"
HELP = ("give every <num> of a TEI/EpiDoc file (or of every .xml file in a folder) its exact "
        "@value, or @atLeast/@atMost where damage leaves a range; report values the letters contradict")
ORDER = 70

#: List every <num> of a file up to this many; beyond, only the damaged and contradicted.
_LIST_ALL = 40


def add_arguments(parser) -> None:
    parser.add_argument("input", metavar="IN", help="a TEI/EpiDoc .xml file, or a folder of them")
    parser.add_argument("-o", "--output", metavar="OUT",
                        help="the annotated copy (a file; a folder when IN is a folder). "
                             "Without it nothing is written: the numbers are only checked")
    parser.add_argument("--alternatives", "-k", type=int, default=0, metavar="K",
                        help="add the K best restorations of each damaged number as "
                             "<certainty locus=\"value\" assertedValue=.. degree=..> (EpiDoc)")
    parser.add_argument("--fix", action="store_true",
                        help="replace an existing @value that the letters contradict (default: report it)")
    parser.add_argument("--notation", "-n", help="the notation of the numbers (detected when left out)")
    parser.add_argument("--workers", type=int, default=None,
                        help="processes for a folder of many files (default 2)")


def run(args, console) -> dict:
    from ..errors import NumcheckError

    src = Path(args.input)
    if src.is_dir():
        if not args.output:
            raise NumcheckError(f"{str(src)!r} is a folder: give an output folder with -o OUTDIR "
                                "(the inputs are never written over).")
        return _run_folder(args, console)
    from ..tei import annotate

    result = annotate(src, args.output, alternatives=args.alternatives, fix=args.fix,
                      notation=args.notation)
    out = result.to_dict()
    if console is not None:
        _show_file(out, console)
    return out


def _run_folder(args, console) -> dict:
    from ..batch import annotate_folder

    with progress_bar(console, "annotating") as progress:
        result = annotate_folder(args.input, args.output, alternatives=args.alternatives,
                                 fix=args.fix, notation=args.notation, workers=args.workers,
                                 progress=progress)
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
    # "line" is the text's own line (the last <lb n>, or the row of a table);
    # "xml" the line of the file, for finding the <num> in an editor.
    has_text_lines = any(n.get("text_line") for n in out["nums"])
    cols = ([("line", "key")] if has_text_lines else []) + [
        ("xml", "number"), ("as read", "key"), ("notation", "key"), ("value", "text"), ("status", "key")]
    table = Sheet(console, cols)
    style = {"contradiction": "red", "fixed": "yellow", "range-added": "cyan"}
    # A long file: list what needs the editor (damaged, contradicted), not every number.
    shown = out["nums"] if len(out["nums"]) <= _LIST_ALL else [
        n for n in out["nums"] if n["damaged"] or n["status"] in ("contradiction", "fixed")]
    for n in shown:
        value = _exact(n["value"]) if "value" in n else f"{_exact(n['atLeast'])} to {_exact(n['atMost'])}"
        status = n["status"]
        cells = ([n.get("text_line") or ""] if has_text_lines else []) + [
            str(n["line"] or ""), n["text"], n["notation"], value, (status, style.get(status))]
        table.row(*cells)
    table.print()
    if len(shown) < len(out["nums"]):
        note(console, f"{len(out['nums']) - len(shown)} undamaged numbers that agree with their "
                      "letters are not listed (--json lists every one).")
    for n in out["nums"]:
        where = _where(n)
        if n.get("message"):
            note(console, f"{where}: {n['message']}", "red")
        if n.get("alternatives"):
            alts = ", ".join(f"{a['text']} = {a['value']} ({a['probability']:.0%})"
                             for a in n["alternatives"])
            note(console, f"{where}: restorations (suggestions, not readings): {alts}")
    for msg in out["notes"]:
        note(console, f"note: {msg}", "yellow")
    where = f"written to {out['output']}" if out["output"] else "nothing written (no -o given)"
    note(console, f"{out['numbers']} numbers, {out['damaged']} damaged, {out['flagged']} contradicted "
                  f"by their letters, {out['restored']} with restorations; {where}.")


def _where(n: dict) -> str:
    """Where a <num> is, for a reader: the text's line and the file's.

    >>> _where({"line": 26, "text_line": "4"}), _where({"line": 26})
    ('line 4 (xml line 26)', 'xml line 26')
    """
    if n.get("text_line"):
        return f"line {n['text_line']} (xml line {n['line']})"
    return f"xml line {n['line']}"


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
                            ("flagged", "number"), ("restored", "number"), ("note", "text")])
    for f in out["files"]:
        if "error" in f:
            table.row(f["file"], "", "", "", "", ("not read (see below)", "red"))
        elif "skipped" in f:
            table.row(f["file"], "", "", "", "", "skipped (see below)")
        else:
            table.row(f["file"], str(f.get("numbers", 0)), str(f.get("damaged", 0)),
                      str(f.get("flagged", 0)), str(f.get("restored", 0)), "")
    s = out["summary"]
    table.section()
    files = f"{s['files']} file{'s' if s['files'] != 1 else ''}"
    table.row(files, str(s["numbers"]), str(s["damaged"]), str(s["flagged"]), str(s["restored"]),
              f"{s['failed']} failed, {s.get('skipped', 0)} skipped", style="bold")
    table.print()
    for f in out["files"]:
        if "error" in f:
            note(console, f"{f['file']}: {f['error']}", "red")
        elif "skipped" in f:
            note(console, f"{f['file']}: skipped: {f['skipped']}")
    if out.get("out"):
        note(console, f"output: {out['out']}")
    if out.get("index"):
        note(console, f"index of reports: {out['index']}")
