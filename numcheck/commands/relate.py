"""``numcheck relate N --unit U`` and ``numcheck relate --search BODY``: period relations."""

from __future__ import annotations

from ..errors import NumcheckRangeError
from ..cycles import DEFAULT_SEARCH_YEARS, relate, search
from ..cycles.periods import BODIES, UNITS, VALUE_SETS

NAME = "relate"
HELP = "count the cycles of moon, sun and planets in N years, months or days, or search for period relations"
ORDER = 50


def add_arguments(parser) -> None:
    parser.add_argument("n", metavar="N", nargs="?",
                        help="the span: a positive number (19, 6585 1/3, 19756/3, 1,49,45;20)")
    parser.add_argument("--unit", "-u", default=None, help=f"the unit of N: {', '.join(UNITS)}")
    parser.add_argument("--values", choices=VALUE_SETS, default="modern",
                        help="modern mean periods (pyerfa, J2000.0) or a tradition's own (ancient)")
    parser.add_argument("--tradition", "-t", default=None,
                        help="with --values ancient: whose periods (babylonian, greek, indian, islamic)")
    parser.add_argument("--search", metavar="BODY", default=None,
                        help=f"search for relations of a body or several, comma-separated: {', '.join(BODIES)}")
    parser.add_argument("--max-years", type=int, default=DEFAULT_SEARCH_YEARS,
                        help=f"with --search: the longest span in years (default {DEFAULT_SEARCH_YEARS})")
    parser.add_argument("--cycles", default=None,
                        help="with --search: the cycles to close at once, e.g. synodic,sidereal")
    parser.add_argument("--year", choices=("tropical", "sidereal"), default="tropical",
                        help="with --search: count spans in tropical (default) or sidereal years "
                             "(the Babylonian relations count sidereal years)")
    parser.add_argument("--top", type=int, default=None, help="show only the first K rows of the table")


def run(args, console) -> dict:
    if args.search is not None:
        if args.n is not None:
            raise NumcheckRangeError(f"Give either N ({args.n!r}) or --search, not both.",
                                     legal="'relate N --unit years' or 'relate --search BODY'")
        result = search(args.search, max_years=args.max_years, values=args.values,
                        tradition=args.tradition, cycles=args.cycles, year=args.year)
        out = result.to_dict()
        if console is not None:
            _show_search(result, console, args.top)
        return out
    if args.n is None:
        raise NumcheckRangeError("relate needs a span N (or --search BODY).",
                                 legal="a positive number with --unit years, months or days")
    if args.unit is None:
        raise NumcheckRangeError(f"The unit of N = {args.n} is missing.",
                                 legal="--unit years, --unit months (synodic) or --unit days")
    result = relate(args.n, args.unit, values=args.values, tradition=args.tradition)
    out = result.to_dict()
    if console is not None:
        _show_relate(result, out, console, args.top)
    return out


def _known_text(known) -> str:
    from rich.markup import escape

    return ", ".join(escape(k.id) for k in known)


def _legend(known_lists, console) -> None:
    """One line per attested relation shown: its id, statement and source."""
    from rich.markup import escape

    seen = {}
    for known in known_lists:
        for k in known:
            seen.setdefault(k.id, k)
    for k in seen.values():
        console.print(f"[bold]{escape(k.id)}[/bold]: {escape(k.statement)}  [dim]({escape(k.source)};"
                      f" {escape(k.confidence)})[/dim]")


def _show_relate(result, out: dict, console, top) -> None:
    from rich.table import Table

    values = "modern mean values (J2000.0)" if result.values == "modern" else f"{result.tradition} values"
    table = Table(title=f"numcheck relate  {out['n']} {result.unit}  = {out['span_days_decimal']} days "
                        f"({result.unit_defined_by}, {values})", header_style="bold", show_edge=False)
    for col, just in (("body", "left"), ("cycle", "left"), ("count", "right"), ("nearest", "right"),
                      ("residual days", "right"), ("residual °", "right"), ("known relation", "left")):
        table.add_column(col, justify=just)
    rows = out["bodies"] if top is None else out["bodies"][:max(0, top)]
    for count, row in zip(result.bodies, rows):
        style = "bold" if count.known else ""
        table.add_row(row["body"], row["cycle"], row["count"], str(row["nearest"]),
                      _short(row["residual_days"], 3), _short(row["residual_degrees"], 2),
                      _known_text(count.known), style=style)
    console.print(table)
    _legend([c.known for c in result.bodies[:len(rows)]], console)
    if result.missing:
        console.print(f"[dim]no {result.tradition} period for: {', '.join(out['missing'])}[/dim]")
    console.print("[dim]residual = the span minus the whole cycles; degrees = the residual as an arc of "
                  "the cycle. Sorted by closeness; the sun's other years last.[/dim]")


def _short(text: str, digits: int) -> str:
    value = float(text)
    return f"{value:+.{digits}f}"


def _show_search(result, console, top) -> None:
    from rich.table import Table

    table = Table(title=f"best relations with the year ({result.year_defined_by}), up to "
                        f"{result.max_years} years", header_style="bold", show_edge=False)
    for col, just in (("body", "left"), ("cycle", "left"), ("cycles", "right"), ("years", "right"),
                      ("kind", "left"), ("residual days", "right"), ("residual °", "right"),
                      ("known relation", "left")):
        table.add_column(col, justify=just)
    ratios = result.ratios if top is None else result.ratios[:max(0, top)]
    for r in ratios:
        c = r.counted
        table.add_row(c.body, c.cycle, str(c.nearest), str(r.years), r.kind,
                      f"{float(c.residual_days):+.3f}", f"{float(c.residual_degrees):+.2f}",
                      _known_text(c.known), style="bold" if c.known else "")
    console.print(table)
    _legend([r.counted.known for r in ratios], console)
    _show_attested(result, console)
    if not result.spans:
        return
    spans = Table(title=f"spans of whole {result.span_unit} ({result.reference}) close to whole "
                        f"numbers of {', '.join(result.targets)} at once (each better than every "
                        "shorter one)", header_style="bold", show_edge=False)
    for col, just in (("span", "right"), ("days", "right"), ("counts", "left"), ("worst °", "right"),
                      ("known relation", "left")):
        spans.add_column(col, justify=just)
    for s in result.spans:
        counts = ", ".join(f"{c.nearest} {c.body} {c.cycle} ({float(c.residual_degrees):+.2f}°)"
                           for c in s.counts)
        spans.add_row(f"{s.span} {s.unit if s.span != 1 else s.unit[:-1]}", f"{float(s.span_days):.3f}", counts,
                      f"{float(s.worst_degrees):.2f}", _known_text(s.known),
                      style="bold" if s.known else "")
    console.print(spans)
    _legend([s.known for s in result.spans], console)


def _show_attested(result, console) -> None:
    from rich.markup import escape
    from rich.table import Table

    if not result.attested:
        return
    table = Table(title=f"relations the catalogue attests, counted in {result.year} years "
                        "(best approximation or not)", header_style="bold", show_edge=False)
    for col, just in (("relation", "left"), ("span given in", "left"), ("years", "right"),
                      ("cycles", "right"), ("residual days", "right"), ("residual °", "right"),
                      ("best?", "left")):
        table.add_column(col, justify=just)
    for a in result.attested:
        c = a.counted
        table.add_row(escape(a.relation.id), escape(a.relation.given_in), str(a.years),
                      f"{c.nearest} {c.body} {c.cycle}", f"{float(c.residual_days):+.3f}",
                      f"{float(c.residual_degrees):+.2f}", "yes" if a.best else "no")
    console.print(table)
