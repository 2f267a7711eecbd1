"""Show an audit: a terminal table (rich), a plot (matplotlib), an HTML report, a CSV of flags.

Only this package and the command line import rich and matplotlib; the audit
itself never does.  Every file is written atomically (a temporary file and a
rename) and never over the audited table.
"""

from __future__ import annotations

__all__ = ["show", "write_plot", "plot_bytes", "write_html", "html_text", "write_flags_csv",
           "flags_csv_text"]

#: Each name and the module that holds it, loaded on first use: the screens
#: of read and identify use report.layout alone and must not pay for the
#: plots' numpy and matplotlib.
_HOME = {"show": "terminal", "write_plot": "plot", "plot_bytes": "plot", "write_html": "html",
         "html_text": "html", "write_flags_csv": "flags_csv", "flags_csv_text": "flags_csv"}


def __getattr__(name):
    if name in _HOME:
        import importlib

        return getattr(importlib.import_module(f"{__name__}.{_HOME[name]}"), name)
    raise AttributeError(f"module {__name__!r} has no attribute {name!r}")
