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
    from rich.markup import escape

    console.print("[bold]numcheck demo[/bold] on an invented corpus (see its README.md)\n")
    titles = {"fragments": "Stray numbers from fragments: identify and restore",
              "ephemeris": "Lunar ephemeris (System B): audit",
              "papyrus": "Greek papyrus in TEI/EpiDoc: annotate and audit its table"}
    colour = {"done": "green", "partial": "yellow", "skipped": "red"}
    for step in d["steps"]:
        console.print(f"[bold]{titles.get(step['name'], step['name'])}[/bold]  "
                      f"[{colour.get(step['status'], 'white')}]{step['status']}[/]")
        if step["summary"]:
            console.print("  " + escape(step["summary"]))
        for c in step.get("contradictions", []):
            console.print("  [red]contradiction[/red] " + escape(c))
        for f in step.get("table_flags", []):
            console.print("  flag: " + escape(f))
        for reason in step.get("reasons", []):
            # the first line says what and why; summary.json keeps the whole message
            console.print("  [yellow]skipped:[/yellow] " + escape(reason.splitlines()[0]))
        if step["files"]:
            console.print("  files: " + ", ".join(escape(f) for f in step["files"]))
        console.print()
    console.print(f"Everything is in {escape(d['out'])}/ (summary.json lists it).")
    console.print(escape(d["note"]))
