"""One module per ``numcheck`` command (see :mod:`numcheck.cli`)."""

from contextlib import nullcontext


def busy(console, what: str):
    """A spinner for a slow search on a terminal (:func:`numcheck.report.layout.busy`).

    With ``--json`` (``console`` None) nothing of rich is even imported.
    """
    if console is None:
        return nullcontext()
    from ..report.layout import busy as _busy

    return _busy(console, what)
