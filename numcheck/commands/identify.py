"""``numcheck identify TEXT``: which period, parameter or relation is this number?"""

from __future__ import annotations

from ..identify import identify

NAME = "identify"
HELP = "identify a number against the catalogue of periods and relations (multiples, parts, scales)"
ORDER = 20


def add_arguments(parser) -> None:
    parser.add_argument("text", metavar="TEXT", help="the number as the edition prints it, e.g. '1,49,45;20'")
    parser.add_argument("--notation", "-n", help="the notation (detected from the characters when left out)")
    parser.add_argument("--unit", "-u", help="the unit of the number (days, months, years, degrees, UŠ ...); "
                                             "only catalogue numbers convertible to it are compared")
    parser.add_argument("--top", "-k", type=int, default=10, help="how many matches to show (default 10)")


def run(args, console) -> dict:
    result = identify(args.text, notation=args.notation, unit=args.unit, top=args.top)
    out = result.to_dict()
    if console is not None:
        _show(result, console)
    return out


def _show(result, console) -> None:
    from rich.markup import escape
    from rich.table import Table

    r = result.reading
    unit = f" {result.unit}" if result.unit else ""
    scale = " (floating: every power of 60 tried)" if r.floating else ""
    console.print(f"[bold]numcheck identify[/bold]  {escape(r.text)}{escape(unit)}{scale}")
    for note in result.notes:
        console.print(f"[yellow]note:[/yellow] {escape(note)}")
    if not result.matches:
        console.print(escape(result._summary()))
        if result.nearest:
            near = Table(title="nearest catalogue numbers", header_style="bold", show_edge=False)
            for col in ("id", "value", "unit", "scale", "difference", "relative"):
                near.add_column(col)
            for n in result.nearest:
                near.add_row(escape(n["id"]), n["decimal"], escape(n["unit"]), str(n["scale"]),
                             n["difference"], n["relative"])
            console.print(near)
        return
    table = Table(header_style="bold", show_edge=False)
    for col in ("#", "match", "id", "what", "scale", "residual", "score"):
        table.add_column(col, overflow="fold")
    style = {"exact": "green", "truncated": "cyan", "rounded": "cyan", "damage": "magenta", "near": "yellow"}
    for i, m in enumerate(result.matches, 1):
        table.add_row(str(i), f"[{style[m.how]}]{m.how}[/]", escape(m.id), escape(m.what), str(m.scale),
                      f"{float(m.residual):+.3g}", f"{m.score:.3f}")
    console.print(table)
    for i, m in enumerate(result.matches, 1):
        console.print(f"{i:>2}. {escape(m.explanation)}", highlight=False)
    console.print("[dim]residual: reading minus catalogue number, in units of the last written place. "
                  "Matches are suggestions for the editor's judgement, not readings.[/dim]")
