"""Find the lark grammars shipped with numcheck and build each parser once.

The grammars live in the project's top-level ``grammars/`` folder, which the
wheel installs as the package ``numcheck.grammars``.
"""

from __future__ import annotations

import functools
from importlib import resources
from pathlib import Path

from lark import Lark

__all__ = ["grammar_dir", "parser_for"]


def grammar_dir() -> Path:
    """The folder holding the ``.lark`` files (installed or in a checkout)."""
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


@functools.cache
def parser_for(name: str) -> Lark:
    """The LALR parser of ``grammars/<name>.lark``, built once per process."""
    folder = grammar_dir()
    text = (folder / f"{name}.lark").read_text(encoding="utf-8")
    return Lark(text, parser="lalr", import_paths=[str(folder)], propagate_positions=True,
                maybe_placeholders=False)
