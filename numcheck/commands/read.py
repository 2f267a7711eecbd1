"""``numcheck read TEXT``: the exact value of a number as written."""

from __future__ import annotations

from ..reader import read
from ..notations import format_reading
from ..reading import exact_text, sexagesimal_text

NAME = "read"
HELP = "read a number as written into its exact value, keeping what is lost or doubtful"
ORDER = 10


def add_arguments(parser) -> None:
    parser.add_argument("text", metavar="TEXT", help="the number as the edition prints it, e.g. '29;31,5[x],8,20'")
    parser.add_argument("--notation", "-n", help="the notation (detected from the characters when left out)")
    parser.add_argument("--unit", "-u", help="the unit of the number, or the unit to convert a quantity to")


def run(args, console) -> dict:
    reading = read(args.text, notation=args.notation, unit=args.unit)
    result = reading.to_dict()
    result["canonical"] = format_reading(reading)
    if console is not None:
        _show(reading, result, console)
    return result


def args_text(reading) -> str:
    """What the user typed (after the NFC normalisation every input gets)."""
    return reading.text


def _show(reading, result: dict, console) -> None:
    from ..report.layout import Sheet, fields, note

    head = [("as typed", args_text(reading))]
    if result["canonical"] != args_text(reading):
        head.append(("normalised", result["canonical"] + "  (the same number in numcheck's canonical form)"))
    head.append(("notation", result.get("detected") or result["notation"]))
    if reading.floating:
        head.append(("magnitude", "floating: the text does not fix it (shown at integer scale)"))
    head += [("sexagesimal", result["sexagesimal"]), ("exact", result["value"]),
             ("decimal", result["decimal"])]
    if "unit" in result:
        head.append(("unit", result["unit"]))
    if reading.damaged or reading.ambiguous:
        head.append(("range", f"{sexagesimal_text(reading.min, fixed=not reading.floating)} to "
                              f"{sexagesimal_text(reading.max, fixed=not reading.floating)}"
                              f"  ({exact_text(reading.min)} to {exact_text(reading.max)})"))
        head.append(("readings", f"{reading.count:,} reading{'s' if reading.count != 1 else ''} "
                                 f"remain{'' if reading.count != 1 else 's'} possible"))
        head.append(("value shown", "the edition's restorations, lost digits at their lowest"
                     if reading.damaged else "the lowest of the readings the text allows (see the notes)"))
    places = Sheet(console, [("written", "key"), ("place", "key"), ("status", "key"), ("may be", "text")],
                   title="places")
    style = {"read": None, "doubtful": "yellow", "unread": "magenta", "lost": "red",
             "restored": "cyan", "added": "green", "superfluous": "dim"}
    for p in result["places"]:
        where = ("60^" + str(p["place"])) if "gap" not in p else f"{p['gap'][0]}-{p['gap'][1]} places"
        places.row(p["text"], where, (p["status"], style[p["status"]]), p["values"])
    fields(console, f"numcheck read  {reading.text}", head)
    places.print()
    for w in reading.warnings:
        note(console, f"note: {w}", "yellow")
