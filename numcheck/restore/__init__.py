"""Restoration: rank every reading a damaged number allows, by all the evidence.

``restore(text_or_reading, ...)`` gives a :class:`RestoreResult`: the
candidates, best first, each a :class:`Candidate` with its probability over
the whole space and its reasons; the size of the space; the probability
left to the readings no evidence touches.  :class:`Evidence` is what a
caller knows from the context (a table's scheme, a relation).  The scoring
model is documented in :mod:`numcheck.restore.scoring`.
"""


from .._callable import make_package_callable
from .engine import restore
from .evidence import Evidence
from .result import Candidate, RestoreResult

__all__ = ["restore", "Evidence", "RestoreResult", "Candidate"]


make_package_callable(__name__, restore)
