"""identify: what is this number?  Ranked matches against the sourced catalogue.

``identify(text_or_reading, notation=None, unit=None, top=10)`` compares a
reading with every catalogue value and every side of every relation, times
simple factors, at every scale a floating reading allows.
``catalogue_targets(lo, hi, unit)`` lists the numbers the catalogue expects
in a range (restore uses it as astronomical evidence).
"""

from __future__ import annotations

import sys
import types

from .core import CLASSES, IdentifyResult, Match, identify
from .targets import Target, catalogue_targets

__all__ = ["identify", "IdentifyResult", "Match", "Target", "catalogue_targets", "CLASSES"]


class _CallableModule(types.ModuleType):
    """Let ``numcheck.identify(...)`` work after this package has been imported.

    ``numcheck/__init__.py`` offers ``identify`` lazily, but importing the
    package ``numcheck.identify`` binds the attribute ``numcheck.identify`` to
    this module; calling the module calls the function, so both spellings work.
    """

    def __call__(self, *args, **kwargs):
        return identify(*args, **kwargs)


sys.modules[__name__].__class__ = _CallableModule
