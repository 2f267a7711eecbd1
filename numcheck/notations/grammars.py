"""Find the lark grammars shipped with numcheck and build each parser once.

The grammars live in the project's top-level ``grammars/`` folder, which the
wheel installs as the package ``numcheck.grammars``.

Compiling a grammar into LALR tables takes longer than reading most numbers,
so each compiled parser is kept in the user's cache folder
(:mod:`numcheck.cache`; ``NUMCHECK_CACHE`` names another folder, or turns
the cache off when empty).  A cached parser is used only while the grammar files,
numcheck's version and lark's version are those it was built from (they make
its file name); a changed package rebuilds it, and a damaged or unwritable
cache is passed over.  tests/test_fast_paths.py proves that a cached parser
reads exactly as a freshly compiled one.  lark itself is imported only when a
grammar is needed (plain numbers are read without one).
"""

from __future__ import annotations

import functools

__all__ = ["grammar_dir", "parser_for", "build_parser"]


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


def build_parser(name: str):
    """Compile the LALR parser of ``grammars/<name>.lark`` (no cache)."""
    from lark import Lark

    folder = grammar_dir()
    text = (folder / f"{name}.lark").read_text(encoding="utf-8")
    return Lark(text, parser="lalr", import_paths=[str(folder)], propagate_positions=True,
                maybe_placeholders=False)


def _cache_key(name: str) -> str:
    import lark

    from .. import cache

    files = [path.name.encode() + b"\0" + path.read_bytes()    # the grammar and all it may import
             for path in sorted(grammar_dir().glob("*.lark"))]
    return cache.make_key(name, lark.__version__, *files)


@functools.cache
def parser_for(name: str):
    """The LALR parser of ``grammars/<name>.lark``, built once per process (and cached on disk)."""
    from .. import cache

    if cache.cache_dir() is None:
        return build_parser(name)
    from lark import Lark

    key = _cache_key(name)
    parser = cache.load(name, key, suffix=".lark-parser", reader=Lark.load)
    if parser is None:
        import io

        parser = build_parser(name)
        data = io.BytesIO()
        parser.save(data)
        cache.store(name, key, data=data.getvalue(), suffix=".lark-parser")
    return parser
