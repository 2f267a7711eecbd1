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
    parser.add_argument("--top", "-k", type=int, default=10,
                        help="how many distinct statements to show (default 10)")
    parser.add_argument("--tradition", "-t",
                        help="weigh this tradition's catalogue rows above the others (babylonian, greek, "
                             "indian, islamic ...); without it, the tradition the notation says")
    parser.add_argument("--full", action="store_true",
                        help="list every catalogue row of a statement on a line of its own "
                             "(--json is always complete)")


def run(args, console) -> dict:
    from . import busy

    with busy(console, "comparing with the catalogue"):
        result = identify(args.text, notation=args.notation, unit=args.unit, top=args.top,
                          tradition=args.tradition)
    out = result.to_dict()
    if console is not None:
        _show(result, console, full=args.full, asked=args.tradition is not None)
    return out


def _sources(reading, group) -> str:
    """Where a statement comes from: each row's citation, and how the reading was taken."""
    m = group.matches[0]
    head = []
    if m.scale:
        head.append(f"read at 60^{m.scale}")
    if m.convention:
        head.append(f"converted to {m.unit} with the {m.convention} convention")
    rows = []
    for x in group.matches:
        side = f" ({x.label})" if x.label != "the value" else ""
        rows.append(f"{x.id}{side}: {_citation(x.source)}, {x.confidence}")
    return ("; ".join(head) + ". " if head else "") + "; ".join(rows) + "."


def _citation(source: str) -> str:
    from ..identify.core import _short_source

    return _short_source(source)


#: The colour of each class of match on a terminal.
STYLE = {"exact": "green", "truncated": "cyan", "rounded": "cyan", "damage": "magenta", "near": "yellow"}


def _show(result, console, full: bool = False, asked: bool = False) -> None:
    from ..report.layout import Sheet, note, notes

    r = result.reading
    unit = f" {result.unit}" if result.unit else ""
    scale = " (floating: every power of 60 tried)" if r.floating else ""
    note(console, f"numcheck identify  {r.text}{unit}{scale}", "bold")
    if result.tradition:
        why = "as asked" if asked else "the notation says it; --tradition T weighs another"
        note(console, f"weighing the {result.tradition} tradition first ({why})", "dim")
    for n in result.notes:
        note(console, f"note: {n}", "yellow")
    if not result.matches:
        note(console, result._summary())
        if result.nearest:
            near = Sheet(console, [("id", "key"), ("value", "number"), ("unit", "text"),
                                   ("scale", "number"), ("difference", "number"),
                                   ("relative", "number")], title="nearest catalogue numbers")
            for n in result.nearest:
                near.row(n["id"], n["decimal"], n["unit"], str(n["scale"]), n["difference"],
                         n["relative"])
            near.print()
        return
    cols = [("#", "number"), ("match", "key"), ("statement and catalogue rows", "text")]
    if r.floating:
        cols.append(("scale", "number"))
    cols += [("residual", "number"), ("score", "number")]
    sheet = Sheet(console, cols)
    for i, g in enumerate(result.groups, 1):
        cells = [str(i), (g.how, STYLE[g.how]), f"{g.what}\n  " + ", ".join(g.ids)]
        if r.floating:
            cells.append(str(g.scale))
        cells += [f"{float(g.residual):+.3g}", f"{g.score:.3f}"]
        sheet.row(*cells)
    sheet.print()
    if full:
        notes(console, [g.explanation for g in result.groups])
    else:
        notes(console, [_sources(r, g) for g in result.groups])
    note(console, "residual: the reading minus the catalogue number, in units of the last written "
                  "place. score: higher is likelier, weighing the kind of match, the factor, the "
                  "scale, the row's confidence and tradition, and the chance of a coincidence. "
                  "Matches are suggestions for the editor's judgement, not readings.", "dim")
