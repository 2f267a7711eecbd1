"""identify: what is this number?  Ranked matches against the sourced catalogue.

``identify(text_or_reading, notation=None, unit=None, top=10)`` compares a
reading with every catalogue value and every side of every relation, times
simple factors, at every scale a floating reading allows.
``catalogue_targets(lo, hi, unit)`` lists the numbers the catalogue expects
in a range (restore uses it as astronomical evidence).
"""

from __future__ import annotations


from .._callable import make_package_callable
from .core import CLASSES, IdentifyResult, Match, identify
from .targets import Target, catalogue_targets

__all__ = ["identify", "IdentifyResult", "Match", "Target", "catalogue_targets", "CLASSES"]


make_package_callable(__name__, identify)
