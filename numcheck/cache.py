"""What numcheck computes once and keeps on disk: compiled parsers, the catalogue's tables.

The folder is the user's cache folder (``$XDG_CACHE_HOME/numcheck``, by
default ``~/.cache/numcheck``); the environment variable ``NUMCHECK_CACHE``
names another folder, or turns the cache off when empty.  Each file is named
by a key made of what it was computed from (numcheck's version, the data
files, the source of the modules that computed it), so a changed package
computes it again; files of an older key are removed when a new one is
written.  A file that cannot be read or written is passed over: the cache
only saves time, it never changes a result (tests/test_fast_paths.py).

The files are the user's own, written by numcheck in the user's own folder;
they are loaded with :mod:`pickle` (or lark's own format for parsers), so a
cache folder shared with other users should not be named.
"""

from __future__ import annotations

import os

__all__ = ["cache_dir", "make_key", "load", "store", "remembered"]


def cache_dir():
    """The cache folder (a Path), or None when the cache is turned off."""
    from pathlib import Path

    chosen = os.environ.get("NUMCHECK_CACHE")
    if chosen is not None:
        return Path(chosen) if chosen.strip() else None
    base = os.environ.get("XDG_CACHE_HOME") or os.environ.get("LOCALAPPDATA")
    return (Path(base) if base else Path.home() / ".cache") / "numcheck"


def make_key(*parts: bytes | str) -> str:
    """A short digest of numcheck's version and *parts* (texts or file contents)."""
    import hashlib

    from . import __version__

    digest = hashlib.sha256(__version__.encode())
    for part in parts:
        data = part.encode() if isinstance(part, str) else part
        digest.update(len(data).to_bytes(8, "little") + data)
    return digest.hexdigest()[:20]


def _path(name: str, key: str, suffix: str):
    folder = cache_dir()
    return None if folder is None else folder / f"{name}-{key}{suffix}"


def load(name: str, key: str, *, suffix: str = ".pickle", reader=None):
    """The object kept under *name* and *key*, or None (no file, a damaged one, no cache).

    *reader* turns the open file into the object (default: :func:`pickle.load`).
    """
    path = _path(name, key, suffix)
    if path is None:
        return None
    try:
        with open(path, "rb") as fh:
            if reader is not None:
                return reader(fh)
            import pickle

            return pickle.load(fh)
    except FileNotFoundError:
        return None
    except Exception:       # damaged, foreign or from another Python: computed again
        return None


def store(name: str, key: str, obj=None, *, data: bytes | None = None, suffix: str = ".pickle") -> None:
    """Keep *obj* (pickled) or the bytes *data* under *name* and *key*; older keys are removed."""
    path = _path(name, key, suffix)
    if path is None:
        return
    from .errors import NumcheckError
    from .files import write_atomic

    try:
        if data is None:
            import pickle

            data = pickle.dumps(obj, protocol=pickle.HIGHEST_PROTOCOL)
        path.parent.mkdir(parents=True, exist_ok=True)
        write_atomic(path, data)
        for old in path.parent.glob(f"{name}-*{suffix}"):
            if old != path and old.name[len(name) + 1:-len(suffix)].isalnum():
                old.unlink(missing_ok=True)    # computed from another version
    except (OSError, NumcheckError, TypeError, AttributeError, RecursionError):
        pass                                   # no cache then: the result stands


def remembered(name: str, key: str, compute, item_type: type) -> tuple:
    """The tuple of *item_type* kept under *name* and *key*, else ``compute()`` (then kept).

    A kept file holding anything but such a tuple (damaged, or from other
    code) is passed over and computed again.
    """
    kept = load(name, key)
    if isinstance(kept, tuple) and all(isinstance(x, item_type) for x in kept):
        return kept
    out = compute()
    store(name, key, out)
    return out
