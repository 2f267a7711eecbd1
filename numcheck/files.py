"""Safe output files: write atomically, never over an input.

An editor's source files are precious.  numcheck never opens an input for
writing; every output is written to a temporary file in the same folder and
renamed over the target in one step, so that an interrupted run leaves either
the old file or the new one, never half a file.  An output path that is the
same file as one of the inputs is refused before anything is written.
"""

from __future__ import annotations

import os
import tempfile
from collections.abc import Iterable
from pathlib import Path

from .errors import NumcheckError

__all__ = ["OutputError", "write_atomic", "check_distinct", "same_file"]


class OutputError(NumcheckError):
    """An output cannot be written where it was asked for (it is an input, or the folder is missing)."""


def same_file(a: str | os.PathLike, b: str | os.PathLike) -> bool:
    """Whether two paths name the same file (through links and ``..`` too).

    >>> same_file("x/../a.xml", "a.xml")
    True
    """
    pa, pb = Path(a), Path(b)
    try:
        if pa.exists() and pb.exists():
            return os.path.samefile(pa, pb)
    except OSError:
        pass
    return os.path.normcase(os.path.realpath(pa)) == os.path.normcase(os.path.realpath(pb))


def check_distinct(inputs: Iterable[str | os.PathLike] | str | os.PathLike,
                   output: str | os.PathLike) -> None:
    """Refuse an *output* path that is one of the *inputs*.

    Raises :class:`OutputError` naming both paths; returns None when they differ.
    """
    if isinstance(inputs, (str, os.PathLike)):
        inputs = [inputs]
    for path in inputs:
        if same_file(path, output):
            raise OutputError(
                f"The output {str(output)!r} is the same file as the input {str(path)!r}; "
                "numcheck never writes over an input. Give another output path (-o).")


def write_atomic(path: str | os.PathLike, data: bytes | str, *, encoding: str = "utf-8") -> Path:
    """Write *data* to *path* through a temporary file in the same folder and a rename.

    Text is encoded with *encoding* (UTF-8 by default).  The folder must exist.
    Returns the path written.
    """
    target = Path(path)
    folder = target.parent if str(target.parent) else Path(".")
    if not folder.is_dir():
        raise OutputError(f"Cannot write {str(target)!r}: the folder {str(folder)!r} does not exist.")
    if target.is_dir():
        raise OutputError(f"Cannot write {str(target)!r}: it is a folder, not a file.")
    payload = data.encode(encoding) if isinstance(data, str) else bytes(data)
    fd, tmp = tempfile.mkstemp(prefix=f".{target.name}.", suffix=".tmp", dir=folder)
    try:
        with os.fdopen(fd, "wb") as handle:
            handle.write(payload)
            handle.flush()
            os.fsync(handle.fileno())
        # A fresh temporary file is private (0600); give the output the usual
        # permissions of a new file, as the user's umask says.
        umask = os.umask(0)
        os.umask(umask)
        os.chmod(tmp, 0o666 & ~umask)
        os.replace(tmp, target)
    except BaseException:
        try:
            os.unlink(tmp)
        except FileNotFoundError:
            pass
        raise
    return target
