"""``numcheck restore TEXT``: rank the readings a damaged number allows."""

from __future__ import annotations

from ..restore import restore
from ..restore.result import SUGGESTION

NAME = "restore"
HELP = "rank every reading the damage allows, by the catalogue, an expected value and the traces"
ORDER = 30


def _top(text: str) -> int:
    import argparse

    try:
        value = int(text)
    except ValueError:
        raise argparse.ArgumentTypeError(f"expected a whole number of candidates, got {text!r}") from None
    if value < 1:
        raise argparse.ArgumentTypeError(f"expected 1 or more candidates, got {value}")
    return value


def add_arguments(parser) -> None:
    parser.add_argument("text", metavar="TEXT",
                        help="the number as the edition prints it, e.g. '29;31,5[x],8,20'")
    parser.add_argument("--notation", "-n", help="the notation (detected from the characters when left out)")
    parser.add_argument("--unit", "-u", help="the unit of the number (the catalogue is searched in it)")
    parser.add_argument("--expect", "-e", metavar="TEXT",
                        help="a value you expect, e.g. '29;31,50,8,20' (weighed as evidence, not imposed)")
    parser.add_argument("--satisfies", "-s", metavar="RELATION", action="append", default=[],
                        help="a relation from mathematics the number should satisfy, e.g. 'x^2 = 2' "
                             "(its square is near 2), '1/x = 7,30', '3*x = 1' (weighed as evidence; "
                             "may be given more than once)")
    parser.add_argument("--top", "-k", type=_top, default=10, metavar="K",
                        help="how many candidates to show (default 10)")
    parser.add_argument("--no-catalogue", action="store_true",
                        help="do not consult the catalogue of periods")


def run(args, console) -> dict:
    result = restore(args.text, notation=args.notation, unit=args.unit, expect=args.expect,
                     top=args.top, use_catalogue=not args.no_catalogue,
                     satisfies=tuple(getattr(args, "satisfies", None) or ()))
    out = result.to_dict()
    if console is not None:
        _show(result, console)
    return out


def _show(result, console) -> None:
    from rich.markup import escape
    from rich.table import Table

    table = Table(title=f"numcheck restore  {escape(result.text)}", header_style="bold",
                  show_lines=True)
    table.add_column("#", justify="right")
    table.add_column("reading", no_wrap=True)
    table.add_column("value", no_wrap=True)
    table.add_column("probability", justify="right")
    table.add_column("reasons")
    for i, c in enumerate(result.candidates, 1):
        value = c.to_dict()["sexagesimal"] if result.notation != "decimal" else c.to_dict()["decimal"]
        mark = " (edition)" if c.editor else ""
        table.add_row(str(i), escape(c.text) + mark, escape(value), f"{c.probability:.4f}",
                      escape("\n".join(c.reasons)))
    console.print(table)
    console.print(f"{result.space:,} readings are possible; the readings no evidence touches share "
                  f"probability {result.unmatched_mass:.4f}.")
    for note in result.notes:
        console.print(f"[dim]note:[/dim] {escape(note)}")
    console.print(f"[bold]{escape(SUGGESTION)}[/bold]")
