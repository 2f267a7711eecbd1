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

    from ..identify.targets import number_text

    table = Table(header_style="bold", show_edge=False, title=f"{len(found)} catalogue entries")
    for col in ("id", "body", "kind", "tradition", "statement", "value", "unit", "confidence", "source"):
        table.add_column(col, overflow="fold")
    for e in found:
        table.add_row(escape(e.id), e.body, e.kind, e.tradition, escape(e.statement), number_text(e.value),
                      escape(e.unit), e.confidence, escape(e.source))
    console.print(table)
