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
    parser.add_argument("--full", action="store_true",
                        help="the whole source of each row, with its notes (--json is always complete)")


def run(args, console) -> dict:
    found = catalogue.entries(body=args.body, kind=getattr(args, "kind", None),
                              tradition=getattr(args, "tradition", None))
    out = {"count": len(found), "entries": [e.to_dict() for e in found]}
    if console is not None:
        _show(found, console, full=getattr(args, "full", False))
    return out


def _show(found, console, full: bool = False) -> None:
    from ..identify.core import _short_source
    from ..report.layout import Sheet, note, singular_ones

    # One table per tradition (so the tradition needs no column); the statement
    # holds body, value and unit; a row not published says how it is known.
    note(console, f"{len(found)} catalogue entr{'y' if len(found) == 1 else 'ies'}", "bold")
    by_tradition: dict[str, list] = {}
    for e in found:
        by_tradition.setdefault(e.tradition, []).append(e)
    for tradition, entries in by_tradition.items():
        sheet = Sheet(console, [("id", "key"), ("statement", "text"), ("source", "text")],
                      title=f"{tradition} ({len(entries)})")
        for e in entries:
            source = e.source if full else _short_source(e.source)
            if e.confidence != "published":
                source += f" ({e.confidence})"
            sheet.row(e.id, singular_ones(e.statement), (source, "dim" if e.confidence == "from memory" else None))
        sheet.print()
    note(console, "Rows marked 'from memory' are leads, not citations: check them against the source. "
                  + ("" if full else "The whole sources: --full; attested forms and exact values: --json."),
         "dim")
