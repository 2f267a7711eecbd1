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
    parser.add_argument("--tradition", "-t",
                        help="weigh this tradition's catalogue values above the others (babylonian, "
                             "greek, indian, islamic ...); without it, the tradition the notation says")
    parser.add_argument("--full", action="store_true",
                        help="one row per candidate with all its reasons, also those no evidence "
                             "singles out (--json is always complete)")


def run(args, console) -> dict:
    from ..errors import NumcheckRangeError
    from . import busy

    if args.no_catalogue and args.tradition:
        raise NumcheckRangeError("--tradition weighs the catalogue's values, and --no-catalogue "
                                 "leaves the catalogue out: together --tradition does nothing.",
                                 legal="one of --tradition T or --no-catalogue")
    with busy(console, "ranking the readings the traces allow"):
        result = restore(args.text, notation=args.notation, unit=args.unit, expect=args.expect,
                         top=args.top, use_catalogue=not args.no_catalogue, tradition=args.tradition,
                         satisfies=tuple(getattr(args, "satisfies", None) or ()))
    out = result.to_dict()
    if console is not None:
        _show(result, console, full=args.full)
    return out


def _value(result, c) -> str:
    d = c.to_dict()
    return d["sexagesimal"] if result.notation != "decimal" else d["decimal"]


def _show(result, console, full: bool = False) -> None:
    from ..report.layout import Sheet, note, notes

    note(console, f"numcheck restore  {result.text}", "bold")
    cands = list(result.candidates)
    # The rows no evidence singles out are ranked by the traces alone: one line for them all
    # (unless they are all there is, or --full asks for every row).
    singled = [c for c in cands if c.evidence or c.editor]
    if full or not singled:
        shown, rest = cands, []
    else:
        shown, rest = singled, [c for c in cands if not (c.evidence or c.editor)]
    sheet = Sheet(console, [("#", "number"), ("reading", "key"), ("value", "number"),
                            ("probability", "number")])
    number = {id(c): i for i, c in enumerate(cands, 1)}
    for c in shown:
        mark = " (edition)" if c.editor else ""
        sheet.row(str(number[id(c)]), (c.text + mark, "bold" if c.evidence else None), _value(result, c),
                  f"{c.probability:.4f}")
    sheet.print()
    notes(console, [(f"{number[id(c)]}.", "; ".join(_reasons(c, full))) for c in shown])
    if rest:
        from rich.columns import Columns
        from rich.text import Text

        ranks = [number[id(c)] for c in rest]
        same = len({round(c.probability, 4) for c in rest}) == 1
        each = f", {rest[0].probability:.4f} each" if same else ""
        note(console, f"{_ranks(ranks)} ({len(rest)} reading{'s' if len(rest) != 1 else ''}{each}): "
                      "no evidence singles them out; ranked by the traces alone (--full gives "
                      "each its row):")
        console.print(Columns([Text(c.text if same else f"{c.text} {c.probability:.4f}", no_wrap=True)
                               for c in rest], padding=(0, 3)))
    readings = "reading is" if result.space == 1 else "readings are"
    note(console, f"{result.space:,} {readings} possible; the readings no evidence touches share "
                  f"probability {result.unmatched_mass:.4f}.")
    for n in result.notes:
        note(console, f"note: {n}", "dim")
    note(console, SUGGESTION, "bold")


def _reasons(c, full: bool) -> list[str]:
    from ..restore.explain import NO_EVIDENCE

    from ..report.layout import singular_ones

    return [singular_ones(r) for r in c.reasons if full or r != NO_EVIDENCE] or list(c.reasons)


def _ranks(ranks: list[int]) -> str:
    """#2-#10, or #4, #7.

    >>> _ranks([2, 3, 4]), _ranks([4, 7])
    ('#2-#4', '#4, #7')
    """
    if ranks == list(range(ranks[0], ranks[0] + len(ranks))) and len(ranks) > 1:
        return f"#{ranks[0]}-#{ranks[-1]}"
    return ", ".join(f"#{r}" for r in ranks)
