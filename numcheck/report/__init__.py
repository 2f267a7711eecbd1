"""Show an audit: a terminal table (rich), a plot (matplotlib), an HTML report, a CSV of flags.

Only this package and the command line import rich and matplotlib; the audit
itself never does.  Every file is written atomically (a temporary file and a
rename) and never over the audited table.
"""

from __future__ import annotations

from .flags_csv import flags_csv_text, write_flags_csv
from .html import html_text, write_html
from .plot import plot_bytes, write_plot
from .terminal import show

__all__ = ["show", "write_plot", "plot_bytes", "write_html", "html_text", "write_flags_csv",
           "flags_csv_text"]
