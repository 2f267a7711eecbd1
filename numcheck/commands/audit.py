"""``numcheck audit FILE``: the scheme of each column, the slips that break it, the fixes."""

from __future__ import annotations

from pathlib import Path

from ..errors import NumcheckError

NAME = "audit"
HELP = "find the computing scheme of each column of a table, flag the cells that break it, diagnose the slip and restore damaged cells"
ORDER = 40


def add_arguments(parser) -> None:
    parser.add_argument("file", metavar="FILE",
                        help="a table (TSV, CSV with quoted cells, or whitespace-aligned text) with a "
                             "header row; a folder audits every table in it")
    parser.add_argument("--notation", "-n", help="the notation of the cells (detected when left out)")
    parser.add_argument("--relation", "-r", action="append",
                        help="a relation between columns to check, e.g. 'C = A + B', "
                             "'B = prev(B) + A mod 360', 'C = round(A * B, 2)' or "
                             "'F = zigzag(d=0;36, M=15;16,5, m=11;5,5)' (may be given more than once)")
    parser.add_argument("--scheme", "-s", action="append",
                        help="a known scheme of a column, e.g. 'F: zigzag d=0;36 M=15;16,5 m=11;5,5', "
                             "'L: step 85:30 240:36' or a published scheme by id, 'F: ACT-LUN-B-F' "
                             "(numcheck catalogue lists the periods; the schemes are in "
                             "numcheck/data/schemes.csv; may be given more than once)")
    parser.add_argument("--columns", "-c", help="the columns to audit, comma-separated (others are left out)")
    parser.add_argument("--model", "-m", help="the model of the function columns: chord, sine, cosine, "
                        "versine, declination, right-ascension, oblique-ascension, equation, shadow, "
                        "daylight; or per column, 'B=sine,C=declination' (chosen automatically when left out)")
    parser.add_argument("--join", "-j", action="append", metavar="NAME=A,B,C",
                        help="read columns A, B, C (one sexagesimal place each) as one number in a "
                             "column NAME; repeat for several (headers x°, x′, x″ join by themselves)")
    parser.add_argument("--plot", metavar="OUT.png|svg", help="write a plot of each checked column")
    parser.add_argument("--report", metavar="OUT.html", help="write a self-contained HTML report "
                        "(for a folder: the folder to write the reports to)")
    parser.add_argument("--csv", metavar="OUT.csv", help="write the flags as CSV")
    from .annotate import add_batch_arguments
    add_batch_arguments(parser)
    parser.add_argument("--full", action="store_true",
                        help="show every line of the table and every restoration with its reasons "
                             "(--json is always complete)")


def run(args, console) -> dict:
    path = Path(args.file)
    if args.model or args.join:   # a bad name or join fails once, before any file is read
        from ..audit.functions import parse_models
        from ..tables.join import parse_join
        parse_models(args.model)
        parse_join(args.join)
    if path.is_dir():
        return _folder(args, path, console)
    from ..audit import audit

    outputs = [p for p in (args.plot, args.report, args.csv) if p]
    from ..files import check_distinct
    for out in outputs:
        check_distinct(path, out)
    columns = [c.strip() for c in args.columns.split(",")] if args.columns else None
    # A TEI file gives its first <table> (numcheck.tables reads every source).
    from . import busy

    with busy(console, f"auditing {path.name}"):
        result = audit(path, notation=args.notation, relation=args.relation, columns=columns,
                       scheme=args.scheme, model=args.model, join=args.join)
    from .. import report

    written = {}
    if args.plot:
        written["plot"] = str(report.write_plot(result, args.plot))
    if args.report:
        written["report"] = str(report.write_html(result, args.report))
    if args.csv:
        written["csv"] = str(report.write_flags_csv(result, args.csv))
    out = result.to_dict()
    if written:
        out["written"] = written
    if console is not None:
        report.show(result, console, full=args.full)
        from ..report.layout import note
        for table_note in out.get("table_notes", []):
            note(console, f"note: {table_note}", "yellow")
        _show_unreadable(out, console)
        for what, where in written.items():
            console.print(f"{what} written to {where}")
    return out


def _folder(args, path: Path, console) -> dict:
    try:
        from ..batch import audit_folder
    except ImportError as err:
        raise NumcheckError(f"{str(path)!r} is a folder: auditing folders needs numcheck.batch, "
                            "which is not installed.") from err
    from .annotate import progress_bar
    with progress_bar(console, "auditing") as progress:
        out = audit_folder(path, report_dir=args.report, notation=args.notation,
                           relation=args.relation, workers=args.workers, progress=progress,
                           summary_dir=args.summary, fresh=args.fresh, scheme=args.scheme,
                           model=args.model, join=args.join)
    if console is not None:
        from ..report.layout import Sheet, note

        note(console, f"audit of the folder {path}", "bold")
        t = Sheet(console, [("file", "key"), ("numbers", "number"), ("flagged", "number"),
                            ("restored", "number"), ("schemes", "text")])
        for f in out.get("files", []):
            if "error" in f or "skipped" in f:
                t.row(f["file"], "", "", "", (f.get("error") or "skipped: " + str(f["skipped"]), "red"))
                continue
            kinds = ", ".join(f"{s['column']}: {s['kind']}" for s in f.get("schemes", []))
            t.row(f["file"], str(f.get("numbers", 0)), str(f.get("flagged", 0)),
                  str(f.get("restored", 0)), kinds)
        t.print()
        if out.get("index"):
            note(console, f"reports: {out['index']}")
        if out.get("resumed"):
            note(console, f"resumed: {out['resumed']} files were already done by an earlier run "
                          "(--fresh redoes them)")
        for name in out.get("summary_files", []):
            note(console, f"summary: {name}")
    return out


def _show_unreadable(out: dict, console) -> None:
    """The cells the audit could not read, and the columns it left out."""
    from ..report.layout import note

    for u in out.get("unreadable", []):
        note(console, f"unreadable: row {u['row']}, column {u['column']} ({u['text']}): {u['message']}",
             "red")
    for c in out.get("left_out", []):
        note(console, f"left out: {c['message']}", "yellow")
    if out.get("unreadable"):
        n = len(out["unreadable"])
        note(console, f"{n} cell{'s' if n != 1 else ''} could not be read; the audit went on with "
                      "the others (an unreadable cell counts as lost).")
