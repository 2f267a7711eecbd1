"""numcheck: read, identify, restore and audit the numbers of ancient texts.

The front door.  Everything a user needs is named here; the rest are modules
with one job each.
"""

from .errors import (
    LimitError,
    NumcheckError,
    NumcheckRangeError,
    NumcheckSyntaxError,
    NumcheckWarning,
    UnknownNameError,
)
from .reader import read
from .reading import Reading, Slot, Status

# The commands' functions are imported on first use, so that ``import numcheck``
# stays light and each command's module loads only when it is needed.
_LAZY = {
    "identify": "numcheck.identify",
    "restore": "numcheck.restore",
    "audit": "numcheck.audit",
    "relate": "numcheck.cycles",
    "interval": "numcheck.calendars",
    "annotate": "numcheck.tei",
}


def __getattr__(name):
    if name in _LAZY:
        import importlib

        return getattr(importlib.import_module(_LAZY[name]), name)
    raise AttributeError(f"module 'numcheck' has no attribute {name!r}")


__all__ = [
    "read",
    "identify",
    "restore",
    "audit",
    "relate",
    "interval",
    "annotate",
    "Reading",
    "Slot",
    "Status",
    "NumcheckError",
    "NumcheckSyntaxError",
    "NumcheckRangeError",
    "UnknownNameError",
    "LimitError",
    "NumcheckWarning",
]

__version__ = "0.1.0"
