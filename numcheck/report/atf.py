"""The terminal listing of ``numcheck annotate FILE.atf``: every number word of the file."""

from __future__ import annotations

__all__ = ["show_atf"]


def show_atf(out: dict, console) -> None:
    """Print the numbers of an ATF file (label, word, value or range, unit, status)."""
    from rich.markup import escape
    from rich.table import Table

    table = Table(title=f"numcheck annotate  {escape(out['input'])}", header_style="bold")
    for col in ("text", "line", "word", "value", "unit", "status"):
        table.add_column(col)
    for n in out["nums"]:
        if "error" in n:
            value, status = "", "[red]not read[/]"
        else:
            value = n["value"] if not n["range"] else f"{n['value']} ({n['min']} to {n['max']})"
            if "quantity" in n:
                q = n["quantity"]
                value += f"; with the number before: {q['value']} {q['unit']}"
            status = n["status"] + (f" ({', '.join(n['marks'])})" if n.get("marks") else "")
        table.add_row(escape(n["text_id"]), escape(n["label"]), escape(n["word"]), escape(value),
                      escape(n.get("unit", "")), escape(status))
    console.print(table)
    for n in out["nums"]:
        if "error" in n:
            console.print(f"[red]{escape(n['text_id'])} {escape(n['label'])}:[/red] {escape(n['error'])}")
    for t in out["not_numbers"]:
        console.print(f"{escape(t['text_id'])} {escape(t['label'])}: not read as a number: "
                      f"{escape(t['reason'])}")
    where = f"listing written to {escape(out['output'])}" if out["output"] else \
        "nothing written (no -o given)"
    console.print(f"{out['numbers']} number words, {out['read']} read, {out['unread']} not read, "
                  f"{out['damaged']} damaged; {len(out['not_numbers'])} numerals that are no numbers; "
                  f"{where}.")
