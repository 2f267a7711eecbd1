"""One module per ``numcheck`` command (see :mod:`numcheck.cli`)."""
