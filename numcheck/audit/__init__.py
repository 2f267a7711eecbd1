"""``audit``: find the scheme of each column of a table, the slips that break it, and the fixes.

A scholar gives a table (an ephemeris, a reciprocal table, a table of
sexagesimal values); numcheck finds the computing scheme of each column
(constant, linear, zigzag, step function, running sum, product, quotient,
reciprocal, or a relation the user states), checks every cell against it
exactly, names the likely slip of each cell that breaks it and what the
scribe should have written, and restores damaged cells from the scheme.

>>> import pandas as pd
>>> df = pd.DataFrame({"n": ["1", "2", "3", "4", "5"], "sq": ["1", "4", "9", "16", "25"]})
>>> audit(df, relation="sq = n * n").flags
[]
"""

from __future__ import annotations

import gc

from .._callable import make_package_callable
from .detect import detect_schemes, make_frame
from .diagnose import diagnose
from .restoration import restore_cells
from .result import SUGGESTION, AuditResult
from ..tables import read_table

__all__ = ["audit", "AuditResult", "SUGGESTION"]


def audit(table, *, notation: str | None = None, relation=None, columns=None,
          scheme=None, model=None, join=None) -> AuditResult:
    """Audit *table* (a path to a TSV/CSV/aligned text table, or a DataFrame).

    *notation* is the default notation of every cell (detected otherwise);
    *relation* a relation between columns to check (``"C = A + B"``,
    ``"B = prev(B) + A mod 360"``, ``"F = zigzag(d=0;36, M=15;16,5, m=11;5,5)"``),
    or a list of them; *scheme* a known scheme of a column, or a list
    (``"F: zigzag d=0;36 M=15;16,5 m=11;5,5"``, ``"F: ACT-LUN-B-F"``);
    *columns* the header names to audit (the others are left out, e.g. a
    column of month names); *model* the model of the function columns
    (``"chord"``, or ``"B=declination"`` per column; chosen automatically
    otherwise, see ``numcheck.audit.functions``); *join* the columns that
    hold one number together (``{"crd": ["crd_d", "crd_m", "crd_s"]}`` or
    ``"crd=crd_d,crd_m,crd_s"``; columns headed ``x°``, ``x′``, ``x″`` are
    joined by themselves).
    """
    from .diagnose import Finding

    # An audit makes a few objects per cell and no reference cycles; the
    # cyclic garbage collector would walk all the cells made so far again and
    # again while a long table is read, so it is paused for the audit (the
    # time then grows in proportion to the lines).
    collecting = gc.isenabled()
    gc.disable()
    try:
        tab = read_table(table, notation=notation, columns=columns, join=join)
        frame = make_frame(tab)
        schemes = detect_schemes(frame, relation=relation, scheme=scheme, model=model)
        findings, pending, true = diagnose(tab, frame, schemes)
        restorations, misfits = restore_cells(tab, frame, pending)
    finally:
        if collecting:
            gc.enable()
    for p, _ in misfits:
        if tab.columns[p.column].cells[p.index].unreadable:
            continue   # listed under "unreadable", not a slip
        findings.append(Finding(p.index, p.column, "unexplained",
                                "no reading of the traces fits the scheme here", None, p.expected))
    findings.sort(key=lambda f: (f.index, frame.names.index(f.column)))
    found = {s.column for s in schemes}
    unchecked = [n for n in frame.names if n not in found]
    return AuditResult(tab, frame, schemes, findings, restorations, unchecked, true)


make_package_callable(__name__, audit)
