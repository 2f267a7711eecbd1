"""The terminal listing of ``numcheck annotate FILE.atf``: every number word of the file."""

from __future__ import annotations

__all__ = ["show_atf"]


def show_atf(out: dict, console) -> None:
    """Print the numbers of an ATF file (label, word, value or range, unit, status)."""
    from .layout import Sheet, note, notes

    sheet = Sheet(console, [("text", "key"), ("line", "key"), ("word", "text"), ("value", "text"),
                            ("unit", "key"), ("status", "text")],
                  title=f"numcheck annotate  {out['input']}")
    for n in out["nums"]:
        if "error" in n:
            value, status = "", ("not read", "red")
        else:
            value = n["value"] if not n["range"] else f"{n['value']} ({n['min']} to {n['max']})"
            if "quantity" in n:
                q = n["quantity"]
                value += f"; with the number before: {q['value']} {q['unit']}"
            status = n["status"] + (f" ({', '.join(n['marks'])})" if n.get("marks") else "")
        sheet.row(n["text_id"], n["label"], n["word"], value, n.get("unit", ""), status)
    sheet.print()
    said = [f"{n['text_id']} {n['label']}: {n['error']}" for n in out["nums"] if "error" in n]
    said += [f"{t['text_id']} {t['label']}: not read as a number: {t['reason']}"
             for t in out["not_numbers"]]
    notes(console, said)
    where = f"listing written to {out['output']}" if out["output"] else "nothing written (no -o given)"
    note(console, f"{out['numbers']} number words, {out['read']} read, {out['unread']} not read, "
                  f"{out['damaged']} damaged; {len(out['not_numbers'])} numerals that are no numbers; "
                  f"{where}.")
