"""TEI/EpiDoc files: read each ``<num>`` from its letters and markup, give it an exact value.

The markup of a number as Leiden text (:mod:`.markup`), the value to write
(:mod:`.values`), the edits spliced into the source text (:mod:`.write`),
restorations ranked by a table's scheme (:mod:`.table_context`) and
:func:`annotate` itself (:mod:`.annotation`).  A TEI ``<table>`` read for the
audit is in :mod:`numcheck.tables.tei`.
"""

from __future__ import annotations

__all__ = ["annotate", "annotate_bytes", "AnnotateResult", "NumResult", "TeiError",
           "table_to_dataframe", "TEI_NS", "default_output"]


def __getattr__(name):
    # Loaded on first use: numcheck.tables reads TEI tables with .markup, and
    # .annotation audits tables, so importing it here would make a cycle.
    if name in __all__:
        from . import annotation
        return getattr(annotation, name)
    raise AttributeError(f"module 'numcheck.tei' has no attribute {name!r}")
