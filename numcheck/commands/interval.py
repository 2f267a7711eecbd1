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
                        help=f"the first date, e.g. {examples} (astronomical years may begin with "
                             "'-': numcheck interval -746-02-26 -323-11-12)")
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
    from ..report.layout import Sheet, note

    note(console, "numcheck interval", "bold")
    table = Sheet(console, [("", "key"), ("as given", "text"), ("calendar", "key"), ("JDN", "number"),
                            ("Julian", "text"), ("Egyptian (Nabonassar)", "text")])
    for label, date in (("from", out["dates"][0]), ("to", out["dates"][1])):
        eq = date["equivalents"]
        table.row(label, date["text"], date["calendar"], str(date["jd"]),
                  eq["julian"] + f" ({eq['iso']})", eq.get("egyptian", "before the era"))
    table.print()
    years, rest = result.egyptian_years
    for date in out["dates"]:
        if date.get("note"):
            note(console, date["note"], "dim")
    note(console, f"{result.days:,} days = {years} Egyptian years of 365 days + {rest} days "
                  f"= {float(result.julian_years):.4f} Julian years (counted from civil day to civil day)")
