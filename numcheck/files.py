"""Safe files: write atomically, never over an input; read only regular files of a sane size.

An editor's source files are precious.  numcheck never opens an input for
writing; every output is written to a temporary file in the same folder and
renamed over the target in one step, so that an interrupted run leaves either
the old file or the new one, never half a file.  An output path that is, holds
or lies inside one of the inputs (a file or a folder) is refused before any
work is done.  A temporary file left by a run that was killed (``kill -9``
cannot be caught) is swept the next time the same target is written.

On the reading side :func:`check_input_file` looks at what a path *is* before
a byte is read: a device (``/dev/zero``), a FIFO (which would block for ever),
a folder or a binary file is refused with a message, and so is a file over
its size limit.
"""

from __future__ import annotations

import errno
import itertools
import os
import stat
import time
from collections.abc import Iterable
from pathlib import Path

from . import limits
from .errors import LimitError, NumcheckError

__all__ = ["OutputError", "InputFileError", "write_atomic", "write_atomic_together",
           "write_pending", "commit_pending",
           "discard_pending", "check_target", "check_distinct", "same_file", "check_input_file",
           "read_input_file",
           "sweep_stale_temporaries", "pid_alive", "left_by_a_dead_process", "TEMP_MARK", "display_name", "short"]

#: Every temporary file numcheck writes is named ``.<target>.numcheck-<pid>-<random>.tmp``.
TEMP_MARK = ".numcheck-"


class OutputError(NumcheckError):
    """An output cannot be written where it was asked for (it is an input, or the folder is missing)."""


class InputFileError(NumcheckError):
    """An input path is not a regular file numcheck can read (a device, a FIFO, a binary file)."""


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
    return _real(pa) == _real(pb)


def _real(path: Path) -> Path:
    return Path(os.path.normcase(os.path.realpath(path)))


def _inside(inner: Path, outer: Path) -> bool:
    """Whether the real path *inner* lies strictly inside the real path *outer*."""
    return outer in inner.parents


def check_distinct(inputs: Iterable[str | os.PathLike] | str | os.PathLike,
                   output: str | os.PathLike) -> None:
    """Refuse an *output* path that is, holds or lies inside one of the *inputs*.

    Files and folders alike: ``annotate ed -o ed/sub`` (the output inside the
    input folder, where it would write over ``ed/sub/*.xml``) and ``annotate
    ed/sub -o ed`` (the input inside the output) are both refused.  Raises
    :class:`OutputError` naming both paths; returns None when they are apart.
    """
    if isinstance(inputs, (str, os.PathLike)):
        inputs = [inputs]
    out_real = _real(Path(output))
    for path in inputs:
        if same_file(path, output):
            raise OutputError(
                f"The output {str(output)!r} is the same file as the input {str(path)!r}; "
                "numcheck never writes over an input. Give another output path (-o).")
        in_real = _real(Path(path))
        if _inside(out_real, in_real):
            raise OutputError(
                f"The output {str(output)!r} lies inside the input folder {str(path)!r}; "
                "numcheck could write over an input there. Give an output path outside it.")
        if _inside(in_real, out_real):
            raise OutputError(
                f"The input {str(path)!r} lies inside the output {str(output)!r}; numcheck "
                "could write over an input there. Give an output path outside the input.")


def check_input_file(path: str | os.PathLike, *, max_bytes: int | None = None,
                     what: str = "file", limit_name: str | None = None) -> int:
    """Refuse an input that is not a regular, readable, text file within its size limit.

    Looks at the kind of the file first (no byte is read from a device or a
    FIFO), then its size against *max_bytes* (the limit named *limit_name*),
    then its first bytes: a NUL byte in them marks a binary file (UTF-16 text
    with a byte-order mark is let through).  Returns the size.
    """
    return read_input_file(path, max_bytes=max_bytes, what=what, limit_name=limit_name,
                           head_only=True)[0]


def _refuse_kind(p: str, mode: int, a_what: str) -> None:
    if stat.S_ISDIR(mode):
        raise InputFileError(f"{short(str(p))!r} is a folder, not {a_what}.")
    if not stat.S_ISREG(mode):
        kind = ("a named pipe (FIFO)" if stat.S_ISFIFO(mode) else
                "a character device" if stat.S_ISCHR(mode) else
                "a block device" if stat.S_ISBLK(mode) else
                "a socket" if stat.S_ISSOCK(mode) else "not a regular file")
        raise InputFileError(f"{short(str(p))!r} is {kind}, not {a_what}: numcheck reads only "
                             "regular files (a device or a pipe could be read for ever).")


def read_input_file(path: str | os.PathLike, *, max_bytes: int | None = None,
                    what: str = "file", limit_name: str | None = None,
                    head_only: bool = False) -> tuple[int, bytes]:
    """The size and bytes of an input file, refused as :func:`check_input_file` says.

    The kind is looked at before the file is opened and again on the open
    file, which is opened once and without waiting (a FIFO that takes the
    place of the file in between does not block); with *head_only* only its
    first 4096 bytes are read.
    """
    p = os.fspath(path)
    a_what = ("an " if what[:1].lower() in "aeiou" or what.startswith("XML") else "a ") + what
    try:
        # Its kind before it is opened (opening a device can do something), and again
        # from the open file (the path may have changed in between).
        _refuse_kind(p, os.stat(p).st_mode, a_what)
        fd = os.open(p, os.O_RDONLY | getattr(os, "O_NONBLOCK", 0) | getattr(os, "O_BINARY", 0))
    except FileNotFoundError:
        raise InputFileError(f"No such {what}: {short(str(p))!r}.") from None
    except OSError as err:
        raise InputFileError(f"Cannot read {short(str(p))!r}: {err.strerror or err}.") from None
    try:
        st = os.fstat(fd)
        _refuse_kind(p, st.st_mode, a_what)
        if max_bytes is not None and st.st_size > max_bytes:
            raise LimitError(f"size in bytes of {short(str(p))!r}", st.st_size, max_bytes,
                             f"Set numcheck.limits.{limit_name or 'MAX_TABLE_BYTES'} higher to read it.")
        try:
            with open(fd, "rb", closefd=False) as handle:
                data = handle.read(4096) if head_only else handle.read()
        except OSError as err:
            raise InputFileError(f"Cannot read {short(str(p))!r}: {err.strerror or err}.") from None
    finally:
        os.close(fd)
    head = data[:4096]
    if b"\x00" in head and not head.startswith((b"\xff\xfe", b"\xfe\xff")):
        raise InputFileError(f"{short(str(p))!r} looks like a binary file (it holds NUL bytes), "
                             f"not {a_what}; numcheck reads text (TSV, CSV, XML).")
    return st.st_size, data


def display_name(text: str) -> str:
    """A file name as valid Unicode text: bytes that are not UTF-8 become U+FFFD.

    File names on Linux are bytes; Python keeps the undecodable ones as lone
    surrogates, which cannot be written as UTF-8 (JSON, HTML, CSV).

    >>> display_name("a" + chr(0xDCFF) + ".xml")
    'a\ufffd.xml'
    """
    return text.encode("utf-8", "surrogateescape").decode("utf-8", "replace")


def short(text: str, width: int | None = None) -> str:
    """*text* cut to at most *width* characters (``limits.MAX_ECHO``), with an ellipsis.

    Messages quote inputs only as a short excerpt, never a whole paste.

    >>> short("abcdef", 4)
    'abc…'
    """
    width = limits.MAX_ECHO if width is None else width
    text = str(text)
    return text if len(text) <= width else text[: max(1, width - 1)] + "…"


def left_by_a_dead_process(pid_text: str) -> bool:
    """Whether *pid_text*, the process id in one of numcheck's temporary names, names
    another process that is gone (so what it left may be removed)."""
    return pid_text.isdigit() and int(pid_text) != os.getpid() and not pid_alive(int(pid_text))


def pid_alive(pid: int) -> bool:
    """Whether a process *pid* is running (one this user may not signal counts as running)."""
    try:
        os.kill(pid, 0)
    except ProcessLookupError:
        return False
    except (PermissionError, OSError):
        return True
    return True


def sweep_stale_temporaries(folder: str | os.PathLike, name: str | None = None) -> list[str]:
    """Remove temporary files of numcheck's own naming left in *folder* by a killed run.

    Only names of the form ``.<target>.numcheck-<pid>-<random>.tmp`` are
    touched (for the one *name* when given), and only when the process that
    wrote them is gone or the file is older than ``limits.STALE_TEMP_SECONDS``:
    a concurrent run's temporary file is left alone.  Returns the names removed.
    """
    removed = []
    prefix = f".{name}{TEMP_MARK}" if name is not None else "."
    try:
        entries = list(os.scandir(folder))
    except OSError:
        return removed
    now = time.time()
    for entry in entries:
        n = entry.name
        if not (n.startswith(prefix) and TEMP_MARK in n and n.endswith(".tmp")):
            continue
        tail = n.rsplit(TEMP_MARK, 1)[1]
        pid_text = tail.split("-", 1)[0]
        try:
            if not entry.is_file(follow_symlinks=False):
                continue
            old = now - entry.stat(follow_symlinks=False).st_mtime > limits.STALE_TEMP_SECONDS
            dead = left_by_a_dead_process(pid_text)
            if old or dead:
                os.unlink(entry.path)
                removed.append(n)
        except OSError:
            continue
    return removed


def _encode(text: str, encoding: str) -> bytes:
    """*text* in *encoding*; a file name that was not UTF-8 (lone surrogates) shows U+FFFD."""
    try:
        return text.encode(encoding)
    except UnicodeEncodeError:
        text = text.encode("utf-8", "surrogateescape").decode("utf-8", "replace")
        return text.encode(encoding, "replace")


def write_atomic(path: str | os.PathLike, data: bytes | str, *, encoding: str = "utf-8",
                 sweep: bool = True) -> Path:
    """Write *data* to *path* through a temporary file in the same folder and a rename.

    Text is encoded with *encoding* (UTF-8 by default).  The folder must exist.
    Stale temporaries of an earlier, killed write of the same target are
    swept first, unless *sweep* is False: a batch sweeps each of its output
    folders once before it starts (listing a folder of 10^4 outputs for
    each one written made the writes quadratic).  The temporary file is removed on any exception, including
    ``KeyboardInterrupt`` and the ``SystemExit`` the command line raises on
    SIGTERM.  Returns the path written.
    """
    target = Path(path)
    folder = target.parent if str(target.parent) else Path(".")
    if not folder.is_dir():
        raise OutputError(f"Cannot write {str(target)!r}: the folder {str(folder)!r} does not exist.")
    check_target(target)
    payload = _encode(data, encoding) if isinstance(data, str) else bytes(data)
    if sweep:
        sweep_stale_temporaries(folder, target.name)
    tmp = _temporary(target, payload, sync=True)
    try:
        os.replace(tmp, target)
    except BaseException:
        _unlink(tmp)
        raise
    return target


def write_atomic_together(files: list[tuple[str | os.PathLike, bytes | str]]) -> None:
    """:func:`write_atomic` of each ``(path, data)`` of *files*, with one flush of the disk
    for all of them (their folders are swept of stale temporaries once each)."""
    pending = []
    try:
        for folder in {os.fspath(Path(path).parent) for path, _ in files}:
            if not os.path.isdir(folder or "."):
                raise OutputError(f"Cannot write into {folder!r}: the folder does not exist.")
            sweep_stale_temporaries(Path(folder or "."))
        for path, data in files:
            check_target(path)
            payload = _encode(data, "utf-8") if isinstance(data, str) else bytes(data)
            pending.append((write_pending(path, payload), path))
    except BaseException:
        discard_pending(pending)
        raise
    commit_pending(pending)


def check_target(path: str | os.PathLike) -> None:
    """Refuse to write *path* where it is a folder or not a regular file (a device, a pipe)."""
    try:
        mode = os.stat(path).st_mode
    except FileNotFoundError:
        return
    except OSError:
        return                  # the write itself will say what is wrong
    if stat.S_ISDIR(mode):
        raise OutputError(f"Cannot write {str(path)!r}: it is a folder, not a file.")
    if not stat.S_ISREG(mode):
        raise OutputError(f"Cannot write {str(path)!r}: it is not a regular file (a device or "
                          "a pipe); give a file path.")


def _temporary(target: Path, payload: bytes, *, sync: bool, folder: str | None = None) -> str:
    """A temporary file beside *target* (or in *folder*) holding *payload* (on the disk when
    *sync*); its path."""
    if folder is None:
        folder = os.fspath(target.parent) if str(target.parent) else "."
    stem = os.path.join(folder, f".{target.name}{TEMP_MARK}{os.getpid()}-{_token()}")
    while True:
        tmp = f"{stem}{next(_SERIAL)}.tmp"
        try:
            # Mode 0o666: the output gets the usual permissions of a new file, as
            # the user's umask says (the system applies it).
            fd = os.open(tmp, os.O_WRONLY | os.O_CREAT | os.O_EXCL | getattr(os, "O_BINARY", 0),
                         0o666)
        except FileExistsError:
            continue
        break
    try:
        with open(fd, "wb", closefd=True) as handle:
            handle.write(payload)
            if sync:
                handle.flush()
                os.fsync(fd)
    except BaseException:
        _unlink(tmp)
        raise
    return tmp


_SERIAL = itertools.count()
_TOKENS: dict[int, str] = {}


def _token() -> str:
    """A random part of this process's temporary names (drawn again in a forked child)."""
    pid = os.getpid()
    token = _TOKENS.get(pid)
    if token is None:
        _TOKENS.clear()
        token = _TOKENS[pid] = os.urandom(4).hex() + "-"
    return token


def _unlink(path: str) -> None:
    try:
        os.unlink(path)
    except FileNotFoundError:
        pass


def write_pending(path: str | os.PathLike, data: bytes, folder: str | None = None) -> str:
    """Write *data* to a temporary file beside *path* (or in *folder*), to be renamed later; its path.

    The first half of :func:`write_atomic` for a batch: many outputs are
    written so, then made durable together by one :func:`commit_pending`
    (one flush of the file system instead of one per file).  A batch's
    worker writes into a *folder* of its own (workers creating files in one
    folder wait on each other).  The folder must exist and *path* must not
    be a folder or a device (:func:`write_atomic` checks it; a batch checks
    its folders once).  A temporary file that is never committed is removed
    by :func:`discard_pending`, or swept as stale by the next run once its
    process is gone.
    """
    return _temporary(Path(path), bytes(data), sync=False, folder=folder)


def commit_pending(pending: Iterable[tuple[str, str | os.PathLike]]) -> None:
    """Make the temporary files of :func:`write_pending` durable, then rename each to its target.

    *pending* holds ``(temporary, target)`` pairs.  The data reach the disk
    before any rename (one ``syncfs`` for each file system, where the system
    has it, else one ``fsync`` for each file), so that a power cut leaves
    each target either as it was or whole.  A target on another file system
    than its temporary is written by :func:`write_atomic`.  On an error the
    temporaries not yet renamed are removed and the error is raised.
    """
    pending = list(pending)
    renamed = 0
    try:
        if pending:
            _sync_all([tmp for tmp, _ in pending])
        for tmp, target in pending:
            try:
                os.replace(tmp, target)
            except OSError as err:
                if err.errno != errno.EXDEV:
                    raise
                with open(tmp, "rb") as handle:
                    write_atomic(target, handle.read(), sweep=False)
                _unlink(tmp)
            renamed += 1
    except BaseException:
        discard_pending(pending[renamed:])
        raise


def discard_pending(pending: Iterable[tuple[str, str | os.PathLike]]) -> None:
    """Remove the temporary files of *pending* (``(temporary, target)`` pairs) that are still there."""
    for tmp, _ in pending:
        _unlink(tmp)


def _sync_all(paths: list[str]) -> None:
    """Flush *paths* to the disk: one ``syncfs`` per file system where it exists, else fsync each."""
    syncfs = _syncfs()
    if syncfs is None:
        for path in paths:
            fd = os.open(path, os.O_RDWR | getattr(os, "O_BINARY", 0))     # Windows flushes only a writable file
            try:
                os.fsync(fd)
            finally:
                os.close(fd)
        return
    folders: dict[int, str] = {}
    for folder in sorted({os.path.dirname(path) or "." for path in paths}):
        folders.setdefault(os.stat(folder).st_dev, folder)
    for folder in folders.values():
        fd = os.open(folder, os.O_RDONLY)
        try:
            if syncfs(fd) != 0:
                import ctypes

                err = ctypes.get_errno()
                raise OSError(err, os.strerror(err), folder)
        finally:
            os.close(fd)


_SYNCFS: list = []


def _syncfs():
    """libc's ``syncfs`` (Linux), or None where there is none."""
    if not _SYNCFS:
        found = None
        if hasattr(os, "sched_getaffinity"):           # Linux
            try:
                import ctypes

                found = ctypes.CDLL(None, use_errno=True).syncfs
                found.argtypes = [ctypes.c_int]
            except (OSError, AttributeError):
                found = None
        _SYNCFS.append(found)
    return _SYNCFS[0]
