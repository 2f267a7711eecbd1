"""``numcheck demo``: the whole job on the invented demo corpus, in one command."""

from __future__ import annotations

NAME = "demo"
HELP = ("run the whole job on the (invented) demo corpus: identify and restore stray numbers, "
        "audit an ephemeris, annotate a TEI papyrus; writes everything to ./numcheck-demo-out/")
ORDER = 90


def add_arguments(parser) -> None:
    parser.add_argument("--out", "-o", default=None, metavar="DIR",
                        help="the folder to write to (default ./numcheck-demo-out/)")


def run(args, console) -> dict:
    from ..demo import DEFAULT_OUT, run_demo

    out = args.out or DEFAULT_OUT
    if console is None:
        return run_demo(out).to_dict()
    with console.status("numcheck demo: starting") as status:
        result = run_demo(out, progress=lambda name: status.update(f"numcheck demo: {name}"))
    d = result.to_dict()
    _show(d, console)
    return d


def _show(d: dict, console) -> None:
    from ..report.layout import indented, note

    note(console, "numcheck demo on an invented corpus (see its README.md)", "bold")
    console.print()
    titles = {"fragments": "Stray numbers from fragments: identify and restore",
              "ephemeris": "Lunar ephemeris (System B): audit",
              "papyrus": "Greek papyrus in TEI/EpiDoc: annotate and audit its table"}
    colour = {"done": "green", "partial": "yellow", "skipped": "red"}
    for step in d["steps"]:
        note(console, f"{titles.get(step['name'], step['name'])}: {step['status']}",
             f"bold {colour.get(step['status'], 'white')}")
        if step["summary"]:
            indented(console, step["summary"])
        for c in step.get("contradictions", []):
            indented(console, "contradiction: " + c, style="red")
        for f in step.get("table_flags", []):
            indented(console, "flag: " + f)
        for reason in step.get("reasons", []):
            # the first line says what and why; summary.json keeps the whole message
            indented(console, "skipped: " + reason.splitlines()[0], style="yellow")
        if step["files"]:
            indented(console, "files: " + ", ".join(step["files"]))
        console.print()
    note(console, f"Everything is in {d['out']}/ (summary.json lists it).")
    note(console, d["note"])
