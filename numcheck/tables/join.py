"""One number spread over several columns (degrees, minutes, seconds) read as one cell.

Printed and manuscript tables often give each sexagesimal place a column of
its own under a header of degrees, minutes and seconds.  The columns are
joined into one before the cells are read, so the audit sees one value and a
flag shows the whole number:

* by their headers: consecutive columns named ``X°``, ``X′``, ``X″`` (or
  ``X'`` ``X"``, ``X deg`` ``X min`` ``X sec``, ``X_d`` ``X_m`` ``X_s``)
  become column ``X``;
* by the user: ``join={"crd": ["A", "B", "C"]}`` or the text
  ``"crd=A,B,C"`` (several joins separated by ``;``), the command line's
  ``--join crd=A,B,C``.

Plain digits are joined as ``A;B,C`` (the first column the whole part);
cells in another notation (Greek letter numerals) by a space, which that
notation reads as the next place.
"""

from __future__ import annotations

import re

from ..errors import NumcheckError, UnknownNameError

__all__ = ["join_columns", "needs_join", "parse_join", "header_joins"]

_DIGITS = re.compile(r"-?[0-9\[\]x.…]*[0-9\]][0-9\[\]x.…]*")
_FAMILIES = (("°", "′", "″", "‴"), ("°", "'", '"'), ("deg", "min", "sec"), ("d", "m", "s"))
_SEPARATORS = (" ", "_", ".", "-", "")


def parse_join(text) -> dict[str, list[str]]:
    """``"crd=A,B,C; t=D,E"`` (or a dict) as {new name: [columns]}."""
    if not text:
        return {}
    if isinstance(text, dict):
        return {str(k): [str(c) for c in v] for k, v in text.items()}
    if isinstance(text, (list, tuple)):
        out = {}
        for t in text:
            out.update(parse_join(t))
        return out
    out: dict[str, list[str]] = {}
    for part in str(text).split(";"):
        part = part.strip()
        if not part:
            continue
        name, eq, cols = part.partition("=")
        parts = [c.strip() for c in cols.split(",") if c.strip()]
        if not eq or not name.strip() or len(parts) < 2:
            raise NumcheckError(f"Cannot read the join {part!r}: write NAME=A,B,C (the new column "
                                "NAME from columns A, B, C, one place each, whole part first).")
        out[name.strip()] = parts
    return out


def header_joins(header: list[str]) -> dict[str, list[str]]:
    """Joins named by the headers themselves (``x°``, ``x′``, ``x″`` side by side)."""
    out: dict[str, list[str]] = {}
    j = 0
    while j < len(header):
        found = None
        for family in _FAMILIES:
            for sep in _SEPARATORS:
                first = family[0]
                h = header[j]
                if not h.endswith(sep + first) or len(h) <= len(sep + first):
                    continue
                base = h[: len(h) - len(sep + first)]
                if base != base.strip():
                    continue
                k = 1
                while j + k < len(header) and k < len(family) and header[j + k] == base + sep + family[k]:
                    k += 1
                if k >= 2 and base not in header:
                    found = (base, header[j:j + k])
                    break
            if found:
                break
        if found:
            out[found[0]] = list(found[1])
            j += len(found[1])
        else:
            j += 1
    return out


def _joined(parts: list[str]) -> str:
    if all(_DIGITS.fullmatch(p) for p in parts):
        return parts[0] + ";" + ",".join(parts[1:])
    return " ".join(parts)


def needs_join(header: list[str], join=None) -> bool:
    """Whether :func:`join_columns` would join any columns of *header* (a join asked, or named by the headers)."""
    return bool(parse_join(join)) or bool(header_joins(header))


def join_columns(header: list[str], rows: list[list[str]], join=None, *, source: str = "<table>"):
    """The header and rows with each join's columns made one (the header's own joins too)."""
    asked = parse_join(join)
    taken = {c for cols in asked.values() for c in cols}
    # the user's joins win over the ones the headers suggest
    joins = {n: cols for n, cols in header_joins(header).items()
             if not taken & set(cols) and n not in asked}
    joins.update(asked)
    if not joins:
        return header, rows
    for name, cols in joins.items():
        for c in cols:
            if c not in header:
                raise UnknownNameError("column", c, header)
        if name in header and name not in cols:
            raise NumcheckError(f"Cannot join {', '.join(cols)} into {name!r}: the table of "
                                f"{source} already has a column {name!r}.")
    used = [c for cols in joins.values() for c in cols]
    if len(set(used)) != len(used):
        dup = next(c for c in used if used.count(c) > 1)
        raise NumcheckError(f"Column {dup!r} of {source} is in two joins.")
    index = {h: j for j, h in enumerate(header)}
    first = {cols[0]: name for name, cols in joins.items()}
    members = set(used)
    new_header = []
    plan = []
    for h in header:
        if h in first:
            name = first[h]
            new_header.append(name)
            plan.append([index[c] for c in joins[name]])
        elif h not in members:
            new_header.append(h)
            plan.append([index[h]])
    new_rows = []
    for r in rows:
        if len(r) != len(header):
            new_rows.append(r)   # ragged: build_table names the row
            continue
        new_rows.append([r[p[0]] if len(p) == 1 else _joined([r[k].strip() for k in p]) for p in plan])
    return new_header, new_rows
