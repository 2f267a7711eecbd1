"""Find the lark grammars shipped with numcheck and build each parser once.

The grammars live in the project's top-level ``grammars/`` folder, which the
wheel installs as the package ``numcheck.grammars``.

Compiling a grammar into LALR tables takes longer than reading most numbers,
so each compiled parser is kept in the user's cache folder
(``$XDG_CACHE_HOME/numcheck``, by default ``~/.cache/numcheck``; the
environment variable ``NUMCHECK_CACHE`` names another folder, or turns the
cache off when empty).  A cached parser is used only while the grammar files,
numcheck's version and lark's version are those it was built from (they make
its file name); a changed package rebuilds it, and a damaged or unwritable
cache is passed over.  tests/test_fast_paths.py proves that a cached parser
reads exactly as a freshly compiled one.  lark itself is imported only when a
grammar is needed (plain numbers are read without one).
"""

from __future__ import annotations

import functools
import os

__all__ = ["grammar_dir", "parser_for", "cache_dir", "build_parser"]


def grammar_dir() -> Path:
    """The folder holding the ``.lark`` files (installed or in a checkout)."""
    from importlib import resources
    from pathlib import Path

    try:
        # numcheck.grammars is a namespace package once installed: files() gives
        # a MultiplexedPath, whose str() is not a path; a file inside it is.
        folder = Path(str(resources.files("numcheck.grammars") / "common.lark")).parent
        if (folder / "common.lark").is_file():
            return folder
    except ModuleNotFoundError:
        pass
    checkout = Path(__file__).resolve().parents[2] / "grammars"
    if (checkout / "common.lark").is_file():
        return checkout
    raise RuntimeError("numcheck's grammars are missing from this installation")


def cache_dir() -> Path | None:
    """The folder of compiled parsers, or None when the cache is turned off."""
    from pathlib import Path

    chosen = os.environ.get("NUMCHECK_CACHE")
    if chosen is not None:
        return Path(chosen) if chosen.strip() else None
    base = os.environ.get("XDG_CACHE_HOME") or os.environ.get("LOCALAPPDATA")
    return (Path(base) if base else Path.home() / ".cache") / "numcheck"


def build_parser(name: str):
    """Compile the LALR parser of ``grammars/<name>.lark`` (no cache)."""
    from lark import Lark

    folder = grammar_dir()
    text = (folder / f"{name}.lark").read_text(encoding="utf-8")
    return Lark(text, parser="lalr", import_paths=[str(folder)], propagate_positions=True,
                maybe_placeholders=False)


def _cache_key(name: str) -> str:
    import hashlib

    import lark

    from .. import __version__

    digest = hashlib.sha256(f"{name}|{__version__}|{lark.__version__}".encode())
    for path in sorted(grammar_dir().glob("*.lark")):     # the grammar and all it may import
        digest.update(path.name.encode() + b"\0" + path.read_bytes())
    return digest.hexdigest()[:20]


@functools.cache
def parser_for(name: str):
    """The LALR parser of ``grammars/<name>.lark``, built once per process (and cached on disk)."""
    folder = cache_dir()
    if folder is None:
        return build_parser(name)
    from lark import Lark

    path = folder / f"{name}-{_cache_key(name)}.lark-parser"
    try:
        with open(path, "rb") as fh:
            return Lark.load(fh)
    except FileNotFoundError:
        pass
    except Exception:       # a damaged or foreign file: compiled again below and replaced
        pass
    parser = build_parser(name)
    _store(parser, folder, path)
    return parser


def _store(parser, folder: Path, path: Path) -> None:
    import io

    from ..errors import NumcheckError
    from ..files import write_atomic

    data = io.BytesIO()
    parser.save(data)
    try:
        folder.mkdir(parents=True, exist_ok=True)
        write_atomic(path, data.getvalue())
        for old in folder.glob(f"{path.name.rpartition('-')[0]}-*.lark-parser"):
            if old != path:       # built from another version of the grammar
                old.unlink(missing_ok=True)
    except (OSError, NumcheckError):
        pass                      # no cache then: the parser still works
