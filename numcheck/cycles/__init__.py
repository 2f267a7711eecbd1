"""Spans of years, months and days against the cycles of sun, moon and planets.

The periods of each body and cycle (:mod:`.periods`), the relations the
catalogue attests (:mod:`.known`), the search for good relations by
continued fractions (:mod:`.convergents`), and :func:`relate` and
:func:`search` themselves (:mod:`.spans`).
"""

from __future__ import annotations

from .spans import (DEFAULT_SEARCH_YEARS, CycleCount, RelateResult, SearchResult, SpanRecord,
                    relate, search)

__all__ = ["relate", "search", "RelateResult", "SearchResult", "CycleCount", "SpanRecord",
           "DEFAULT_SEARCH_YEARS"]
