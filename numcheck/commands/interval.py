"""``numcheck interval DATE DATE --calendar C``: the days between two dates of a text."""

from __future__ import annotations

from ..calendars import CALENDARS, DATE_EXAMPLES, interval

NAME = "interval"
HELP = ("count the days between two dates (Egyptian with the eras of Nabonassar, Philip, Augustus and "
        "the kings of the Canon, Alexandrian, Hijra, Yazdegerd, Seleucid, Hebrew, Julian, or JD)")
ORDER = 60


def add_arguments(parser) -> None:
    examples = ", ".join(repr(e) for e in DATE_EXAMPLES)
    parser.add_argument("date1", metavar="DATE",
                        help=f"the first date, e.g. {examples} (put -- before the dates when one "
                             "begins with '-': numcheck interval -- -746-02-26 -323-11-12)")
    parser.add_argument("date2", metavar="DATE", help="the second date")
    parser.add_argument("--calendar", "-c", default="julian",
                        help="calendar of a date that names no era: "
                             + "; ".join(f"{k} ({v})" for k, v in CALENDARS.items())
                             + ". Default: julian. A date that begins with an era "
                               "(Nabonassar, Philip, Augustus, Hadrian ..., Diocletian, Hijra, "
                               "Yazdegerd, Seleucid, AM) carries its own calendar.")


def run(args, console) -> dict:
    result = interval(args.date1, args.date2, args.calendar)
    out = result.to_dict()
    if console is not None:
        _show(result, out, console)
    return out


def _show(result, out: dict, console) -> None:
    from rich.markup import escape
    from rich.table import Table

    table = Table(title="numcheck interval", header_style="bold", show_edge=False)
    table.add_column("")
    table.add_column("as given")
    table.add_column("calendar")
    table.add_column("JDN", justify="right")
    table.add_column("Julian")
    table.add_column("Egyptian (Nabonassar)")
    for label, date in (("from", out["dates"][0]), ("to", out["dates"][1])):
        eq = date["equivalents"]
        table.add_row(label, escape(date["text"]), date["calendar"], str(date["jd"]),
                      eq["julian"] + f"  ({eq['iso']})", eq.get("egyptian", "before the era"))
    console.print(table)
    years, rest = result.egyptian_years
    for date in out["dates"]:
        if date.get("note"):
            console.print(f"[dim]{escape(date['note'])}[/dim]")
    console.print(f"[bold]{result.days:,}[/bold] days"
                  f"  = {years} Egyptian years of 365 days + {rest} days"
                  f"  = {float(result.julian_years):.4f} Julian years"
                  "  (counted from civil day to civil day)")
