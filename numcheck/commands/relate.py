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
    parser.add_argument("--max-years", type=int, default=None,
                        help=f"with --search: the longest span in years (default {DEFAULT_SEARCH_YEARS})")
    parser.add_argument("--cycles", default=None,
                        help="with --search: the cycles to close at once, e.g. synodic,sidereal")
    parser.add_argument("--year", choices=("tropical", "sidereal"), default="tropical",
                        help="with --search: count spans in tropical (default) or sidereal years "
                             "(the Babylonian relations count sidereal years)")
    parser.add_argument("--top", type=int, default=None, help="show only the first K rows of the table")


#: Options that only work with another, and the one they need.
_NEEDS_SEARCH = (("--max-years", "max_years"), ("--cycles", "cycles"))


def run(args, console) -> dict:
    from . import busy

    if args.search is None:
        given = [flag for flag, name in _NEEDS_SEARCH if getattr(args, name) is not None]
        if given:
            raise NumcheckRangeError(
                f"{' and '.join(given)} work{'s' if len(given) == 1 else ''} only with --search BODY; "
                f"without it {'it does' if len(given) == 1 else 'they do'} nothing.",
                legal=f"numcheck relate --search moon {' '.join(g + ' ...' for g in given)}, "
                      "or leave them out")
    if args.max_years is None:
        args.max_years = DEFAULT_SEARCH_YEARS
    if args.search is not None:
        if args.n is not None:
            raise NumcheckRangeError(f"Give either N ({args.n!r}) or --search, not both.",
                                     legal="'relate N --unit years' or 'relate --search BODY'")
        with busy(console, f"searching relations of {args.search} up to {args.max_years} years"):
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


class _Legend:
    """Attested relations as numbered marks in a table, cited in full below it."""

    def __init__(self):
        self.seen: dict[str, tuple[int, object]] = {}

    def marks(self, known) -> str:
        out = []
        for k in known:
            if k.id not in self.seen:
                self.seen[k.id] = (len(self.seen) + 1, k)
            out.append(f"[{self.seen[k.id][0]}]")
        return " ".join(out)

    def print(self, console) -> None:
        from ..report.layout import notes

        notes(console, [(f"[{n}]", f"{k.id}: {k.statement} ({k.source}; {k.confidence})")
                        for n, k in self.seen.values()])


def _show_relate(result, out: dict, console, top) -> None:
    from ..report.layout import Sheet, note

    values = "modern mean values (J2000.0)" if result.values == "modern" else f"{result.tradition} values"
    note(console, f"numcheck relate  {out['n']} {result.unit} = {out['span_days_decimal']} days "
                  f"({result.unit_defined_by}, {values})", "bold")
    sheet = Sheet(console, [("body", "key"), ("cycle", "key"), ("count", "number"),
                            ("nearest", "number"), ("residual days", "number"),
                            ("residual °", "number"), ("known", "key")])
    legend = _Legend()
    rows = out["bodies"] if top is None else out["bodies"][:max(0, top)]
    for count, row in zip(result.bodies, rows):
        sheet.row(row["body"], row["cycle"], row["count"], str(row["nearest"]),
                  _short(row["residual_days"], 3), _short(row["residual_degrees"], 2),
                  legend.marks(count.known), style="bold" if count.known else None)
    sheet.print()
    legend.print(console)
    if result.missing:
        note(console, f"no {result.tradition} period for: {', '.join(out['missing'])}", "dim")
    note(console, "residual = the span minus the whole cycles; degrees = the residual as an arc of "
                  "the cycle. Sorted by closeness; the sun's other years last. [n]: a relation "
                  "attested in the catalogue, cited above.", "dim")


def _short(text: str, digits: int) -> str:
    value = float(text)
    return f"{value:+.{digits}f}"


def _show_search(result, console, top) -> None:
    from ..report.layout import Sheet, note

    note(console, f"best relations with the year ({result.year_defined_by}), up to "
                  f"{result.max_years} years", "bold")
    sheet = Sheet(console, [("body", "key"), ("cycle", "key"), ("cycles", "number"),
                            ("years", "number"), ("kind", "key"), ("residual days", "number"),
                            ("residual °", "number"), ("known", "key")])
    legend = _Legend()
    ratios = result.ratios if top is None else result.ratios[:max(0, top)]
    for r in ratios:
        c = r.counted
        sheet.row(c.body, c.cycle, str(c.nearest), str(r.years), r.kind,
                  f"{float(c.residual_days):+.3f}", f"{float(c.residual_degrees):+.2f}",
                  legend.marks(c.known), style="bold" if c.known else None)
    sheet.print()
    _show_attested(result, console)
    if result.spans:
        note(console, f"spans of whole {result.span_unit} ({result.reference}) close to whole numbers of "
                      f"{', '.join(result.targets)} at once (each better than every shorter one)", "bold")
        spans = Sheet(console, [("span", "number"), ("days", "number"), ("counts", "text"),
                                ("worst °", "number"), ("known", "key")])
        for s in result.spans:
            counts = ", ".join(f"{c.nearest} {c.body} {c.cycle} ({float(c.residual_degrees):+.2f}°)"
                               for c in s.counts)
            spans.row(f"{s.span} {s.unit if s.span != 1 else s.unit[:-1]}", f"{float(s.span_days):.3f}",
                      counts, f"{float(s.worst_degrees):.2f}", legend.marks(s.known),
                      style="bold" if s.known else None)
        spans.print()
    legend.print(console)
    note(console, "kind: a convergent of the continued fraction is better than every shorter "
                  "relation, a semiconvergent better than every shorter one on its side. [n]: a "
                  "relation attested in the catalogue, cited above.", "dim")


def _show_attested(result, console) -> None:
    from ..report.layout import Sheet, note

    if not result.attested:
        return
    note(console, f"relations the catalogue attests, counted in {result.year} years "
                  "(best approximation or not)", "bold")
    table = Sheet(console, [("relation", "key"), ("span given in", "text"), ("years", "number"),
                            ("cycles", "text"), ("residual days", "number"), ("residual °", "number"),
                            ("best?", "key")])
    for a in result.attested:
        c = a.counted
        table.row(a.relation.id, a.relation.given_in, str(a.years), f"{c.nearest} {c.body} {c.cycle}",
                  f"{float(c.residual_days):+.3f}", f"{float(c.residual_degrees):+.2f}",
                  "yes" if a.best else "no")
    table.print()
