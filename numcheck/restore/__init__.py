"""Restoration: rank every reading a damaged number allows, by all the evidence.

``restore(text_or_reading, ...)`` gives a :class:`RestoreResult`: the
candidates, best first, each a :class:`Candidate` with its probability over
the whole space and its reasons; the size of the space; the probability
left to the readings no evidence touches.  :class:`Evidence` is what a
caller knows from the context (a table's scheme, a relation).  The scoring
model is documented in :mod:`numcheck.restore.scoring`.
"""

import sys as _sys
import types as _types

from .engine import restore
from .evidence import Evidence
from .result import Candidate, RestoreResult

__all__ = ["restore", "Evidence", "RestoreResult", "Candidate"]


class _CallableModule(_types.ModuleType):
    """This package, callable as :func:`restore`.

    ``numcheck.restore`` is both this package and the front door's function:
    once the package is imported, Python binds the name on ``numcheck`` to
    the package, so the package must answer a call the way the function does.
    """

    def __call__(self, *args, **kwargs) -> RestoreResult:
        return restore(*args, **kwargs)


_sys.modules[__name__].__class__ = _CallableModule
