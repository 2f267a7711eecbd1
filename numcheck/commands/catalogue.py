"""``numcheck catalogue``: the periods, parameters and relations numcheck knows, with sources."""

from __future__ import annotations

from .. import catalogue

NAME = "catalogue"
HELP = "list the catalogue of periods, parameters and period relations, with their sources"
ORDER = 70


def add_arguments(parser) -> None:
    parser.add_argument("--body", "-b", help="only this body (moon, sun, mercury ... calendar, stars)")
    parser.add_argument("--kind", choices=catalogue.KINDS, help="only periods, parameters or relations")
    parser.add_argument("--tradition", "-t", help="only this tradition (babylonian, greek, indian, islamic, modern ...)")


def run(args, console) -> dict:
    found = catalogue.entries(body=args.body, kind=getattr(args, "kind", None),
                              tradition=getattr(args, "tradition", None))
    out = {"count": len(found), "entries": [e.to_dict() for e in found]}
    if console is not None:
        _show(found, console)
    return out


def _show(found, console) -> None:
    from rich.markup import escape
    from rich.table import Table

    from ..identify.core import _short_source

    # The statement already holds body, value and unit; the full source is in --json.
    table = Table(header_style="bold", show_edge=False, expand=True, title=f"{len(found)} catalogue entries")
    table.add_column("id", overflow="fold", ratio=2)
    table.add_column("tradition", overflow="fold", ratio=1)
    table.add_column("statement", overflow="fold", ratio=4)
    table.add_column("confidence", overflow="fold", ratio=1)
    table.add_column("source", overflow="fold", ratio=3)
    for e in found:
        table.add_row(escape(e.id), e.tradition, escape(e.statement), e.confidence,
                      escape(_short_source(e.source)))
    console.print(table)
    console.print("[dim]Full sources, attested forms and exact values: numcheck catalogue --json[/dim]")
