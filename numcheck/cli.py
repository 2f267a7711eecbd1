"""The ``numcheck`` command line: thin, it parses options and calls the library.

Each command lives in a module of :mod:`numcheck.commands` that offers
``NAME``, ``HELP``, ``ORDER``, ``add_arguments(parser)`` and
``run(args, console) -> dict`` (the JSON object of the command; the module
prints its own readable table when ``--json`` is not given).

Exit codes: 0 success, 2 bad input (a :class:`~numcheck.errors.NumcheckError`,
one paragraph, no traceback; or a file the system will not let numcheck read
or write), 1 an internal error.
"""

from __future__ import annotations

import argparse
import importlib
import os
import re
import sys
import warnings

from . import commands as _commands_pkg
from .errors import NumcheckError

__all__ = ["main", "build_parser"]


def _command_names() -> list[str]:
    """The commands, one per module of :mod:`numcheck.commands`, found without importing them.

    The folder is listed rather than walked with pkgutil, which would import
    typing at every start.
    """
    names = set()
    for folder in _commands_pkg.__path__:
        for entry in os.listdir(folder):
            stem, dot, suffix = entry.partition(".")
            if dot and suffix in ("py", "pyc") and stem.isidentifier() and not stem.startswith("_"):
                names.add(stem)
    return sorted(names)


def _command_module(name: str):
    mod = importlib.import_module(f"{_commands_pkg.__name__}.{name}")
    return mod if hasattr(mod, "run") else None


def _command_modules():
    mods = [m for m in map(_command_module, _command_names()) if m is not None]
    return sorted(mods, key=lambda m: (getattr(m, "ORDER", 100), m.NAME))


def _chosen_command(argv: list[str], names: list[str]) -> str | None:
    """The command named on the command line, if it is one: the first word that is no option."""
    for word in argv:
        if word == "--":
            return None
        if not word.startswith("-"):
            return word if word in names else None
    return None


def _terminal_columns() -> int:
    """The terminal's width as shutil.get_terminal_size gives it (without importing shutil)."""
    try:
        columns = int(os.environ["COLUMNS"])
    except (KeyError, ValueError):
        columns = 0
    if columns <= 0:
        try:
            columns = os.get_terminal_size(sys.__stdout__.fileno()).columns
        except (AttributeError, ValueError, OSError):
            columns = 0
    return columns or 80


class _HelpFormatter(argparse.HelpFormatter):
    """argparse's help layout; the width is found here, so that a start need not import
    shutil (argparse makes a formatter for every argument it adds)."""

    def __init__(self, prog, indent_increment=2, max_help_position=24, width=None):
        super().__init__(prog, indent_increment, max_help_position,
                         _terminal_columns() - 2 if width is None else width)


class _Parser(argparse.ArgumentParser):
    """argparse, but bad options exit 2 with a one-line message (bad input).

    A word that begins with ``-`` and a digit is a value, never an option:
    ``numcheck read -3;30`` reads minus 3;30 and ``numcheck interval
    -746-02-26 -323-11-12`` takes astronomical years (no option of numcheck
    begins with a digit).
    """

    def __init__(self, *args, **kwargs):
        kwargs.setdefault("formatter_class", _HelpFormatter)
        super().__init__(*args, **kwargs)
        self._negative_number_matcher = re.compile(r"^-\d")

    def error(self, message):
        self.print_usage(sys.stderr)
        sys.stderr.write(f"{self.prog}: error: {message}\n")
        raise SystemExit(2)


def build_parser(argv: list[str] | None = None) -> argparse.ArgumentParser:
    """The parser of the command line.

    Given *argv*, only the module of the command it names is imported (the
    other commands are known by name alone), so that a command starts
    without loading what the others need; ``numcheck --help`` loads them all
    for their descriptions.
    """
    parser = _Parser(
        prog="numcheck",
        description="Read, identify, restore and audit the numbers of ancient and medieval "
                    "astronomical and mathematical texts.",
    )
    from . import __version__

    parser.add_argument("--version", action="version", version=f"numcheck {__version__}")
    sub = parser.add_subparsers(dest="command", metavar="COMMAND", parser_class=_Parser)
    names = _command_names()
    chosen = _chosen_command(argv, names) if argv is not None else None
    if chosen is None:
        modules = _command_modules()
    else:
        mod = _command_module(chosen)
        modules = [mod] if mod is not None else []
    for mod in modules:
        p = sub.add_parser(mod.NAME, help=mod.HELP, description=mod.HELP)
        mod.add_arguments(p)
        p.add_argument("--json", action="store_true", help="print one JSON object and nothing else")
        p.set_defaults(_module=mod)
    return parser


def _console_class():
    from rich.console import Console

    class _PipeAwareConsole(Console):
        """rich exits 1 when the reader of a pipe goes away; for us that is no error."""

        def on_broken_pipe(self) -> None:
            raise BrokenPipeError

    return _PipeAwareConsole


def _safe_streams() -> None:
    """Let standard output and error carry any text: what the encoding cannot hold is escaped.

    Under ``PYTHONIOENCODING=cp1252`` (or ``ascii``) Greek letters become
    ``\\u03ba`` instead of an UnicodeEncodeError; a file name that is not
    UTF-8 (a lone surrogate in Python) is escaped the same way, so the output
    stays valid text in its encoding.
    """
    for stream in (sys.stdout, sys.stderr):
        reconfigure = getattr(stream, "reconfigure", None)
        if reconfigure is not None:
            try:
                reconfigure(errors="backslashreplace")
            except (ValueError, OSError):      # a closed or detached stream
                pass


def _stream_is_utf8(stream) -> bool:
    encoding = (getattr(stream, "encoding", None) or "").lower().replace("_", "-")
    return encoding in ("utf-8", "utf8", "utf-8-sig")


def _json_text(data: dict) -> str:
    # JSON stays exact and valid in any encoding: ASCII escapes where the
    # output cannot hold the characters.
    import json

    return json.dumps(data, ensure_ascii=not _stream_is_utf8(sys.stdout), sort_keys=False) + "\n"


def _silence_stdout() -> None:
    """After a failed write, send what is left in Python's buffer to /dev/null (no noise at exit)."""
    import os

    try:
        os.dup2(os.open(os.devnull, os.O_WRONLY), sys.stdout.fileno())
    except (OSError, ValueError, AttributeError):
        pass


def _say(text: str) -> None:
    """A line on standard error, if there is one."""
    if sys.stderr is not None:
        try:
            sys.stderr.write(text)
            sys.stderr.flush()
        except (OSError, ValueError):
            pass


def _on_terminate(signum, frame):
    # SIGTERM or SIGHUP: unwind like Ctrl-C, so that temporary files are
    # removed and a batch run records what it finished.
    raise SystemExit(128 + signum)


class _TrimmedLines:
    """A pipe's stdout for rich: each line without the spaces that pad it to the width.

    What goes through a pipe is pasted into editions and e-mails; trailing
    blanks would only get in the way.
    """

    def __init__(self, out):
        self._out = out
        self._partial = ""
        self.encoding = getattr(out, "encoding", None) or "utf-8"

    def write(self, text: str) -> int:
        lines = (self._partial + text).split("\n")
        self._partial = lines.pop()
        for line in lines:
            self._out.write(line.rstrip() + "\n")
        return len(text)

    def flush(self) -> None:
        if self._partial:
            self._out.write(self._partial)
            self._partial = ""
        self._out.flush()

    def isatty(self) -> bool:
        return False

    def fileno(self) -> int:
        return self._out.fileno()


def _stdout():
    out = sys.stdout
    try:
        tty = out.isatty()
    except (AttributeError, ValueError):
        tty = False
    return out if tty else _TrimmedLines(out)


#: Set, these make rich treat a pipe as a terminal (or write for a notebook).
_RICH_TERMINAL_ENV = ("FORCE_COLOR", "TTY_COMPATIBLE", "TTY_INTERACTIVE", "JUPYTER_COLUMNS")


def _rich_console(file, width=None):
    return _console_class()(file=file, width=width, highlight=False, soft_wrap=False)


def _screen():
    """Where a command's readable screen goes: rich on a terminal; through a pipe plain
    lines (numcheck.report.plain), with rich loaded only for what those cannot lay out."""
    out = _stdout()
    if isinstance(out, _TrimmedLines) and not any(k in os.environ for k in _RICH_TERMINAL_ENV):
        from .report.plain import PlainConsole, plain_width

        width = plain_width()
        if width >= 20:
            return PlainConsole(out, width, _rich_console)
    return _rich_console(out)


def _warn(message: str) -> None:
    """A warning on standard error, in yellow on a terminal."""
    try:
        tty = sys.stderr is not None and sys.stderr.isatty()
    except (AttributeError, ValueError):
        tty = False
    if not tty and not any(k in os.environ for k in _RICH_TERMINAL_ENV):
        from .report.plain import plain_width, wrap

        lines = wrap(f"warning: {message}", plain_width())
        if lines is not None:
            _say("".join(line + "\n" for line in lines))
            return
    from rich.console import Console
    from rich.markup import escape

    Console(stderr=True, highlight=False).print(f"[yellow]warning:[/yellow] {escape(message)}", markup=True)


def main(argv: list[str] | None = None) -> int:
    import signal

    argv = sys.argv[1:] if argv is None else list(argv)
    parser = build_parser(argv)
    args = parser.parse_args(argv)
    if not getattr(args, "_module", None):
        parser.print_help()
        return 2
    if sys.stdout is None or getattr(sys.stdout, "closed", False):
        _say(f"numcheck {args.command}: standard output is closed, so the result has nowhere "
             "to go; nothing was done. Run it with standard output open (or > FILE).\n")
        return 2
    _safe_streams()
    previous = {}
    for sig in (signal.SIGTERM, getattr(signal, "SIGHUP", None)):
        if sig is None:
            continue
        try:
            previous[sig] = signal.signal(sig, _on_terminate)
        except (ValueError, OSError):          # not the main thread
            pass
    try:
        code = _main(args)
        sys.stdout.flush()
        return code
    except BrokenPipeError:
        # The reader of our output went away (`numcheck catalogue | head`):
        # nothing is wrong; silence the flush at exit and stop.
        _silence_stdout()
        return 0
    except OSError as err:         # standard output itself failed (/dev/full)
        _silence_stdout()
        _say(f"numcheck {args.command}: cannot write the output: {err.strerror or err}.\n")
        return 2
    except SystemExit as stop:
        if stop.code in (128 + signal.SIGTERM, 128 + getattr(signal, "SIGHUP", 1)):
            _say(f"numcheck {args.command}: stopped by a signal; temporary files removed "
                 "(a folder run resumes when run again).\n")
        raise
    finally:
        for sig, handler in previous.items():
            try:
                signal.signal(sig, handler)
            except (ValueError, OSError, TypeError):
                pass


def _main(args) -> int:
    console = None
    if not args.json:   # rich is loaded only for the readable tables
        console = _screen()
    try:
        with warnings.catch_warnings(record=True) as caught:
            warnings.simplefilter("always")
            result = args._module.run(args, console)
        if args.json:
            sys.stdout.write(_json_text(result))
        else:
            console.file.flush()
            # A warning the command already showed as a note of its result is not said twice.
            shown = set()
            if isinstance(result, dict):
                for key in ("warnings", "notes"):
                    shown.update(str(n) for n in result.get(key) or () if isinstance(n, str))
            for w in caught:
                if str(w.message) in shown:
                    continue
                _warn(str(w.message))
        sys.stdout.flush()
        return 0
    except NumcheckError as err:
        message = str(err)
        if args.json:
            sys.stdout.write(_json_text({"error": type(err).__name__, "message": message}))
        _say(f"numcheck {args.command}: {message}\n")
        return 2
    except KeyboardInterrupt:
        _say(f"numcheck {args.command}: stopped (Ctrl-C); temporary files removed "
             "(a folder run resumes when run again).\n")
        return 130
    except BrokenPipeError:
        raise
    except OSError as err:  # the file system said no (permissions, a full disk): not a fault of numcheck
        if _is_stdout_error(err):
            raise
        where = f" {err.filename!r}" if getattr(err, "filename", None) else ""
        message = f"cannot read or write{where}: {err.strerror or err}."
        if args.json:
            sys.stdout.write(_json_text({"error": type(err).__name__, "message": message}))
        _say(f"numcheck {args.command}: {message}\n")
        return 2
    except Exception as err:  # an internal error: say so plainly, ask for a report
        _say(
            f"numcheck {args.command}: internal error ({type(err).__name__}: "
            f"{_short(str(err))}). This is a fault in numcheck, not in your input; please report "
            "it with the command you ran.\n")
        return 1


def _is_stdout_error(err: OSError) -> bool:
    """Whether *err* came from writing standard output (no file name: not a file of the user's)."""
    return getattr(err, "filename", None) is None and err.errno in (28, 5, 9, 27, 122)


def _short(text: str) -> str:
    from .files import short

    return short(text)


if __name__ == "__main__":  # pragma: no cover
    raise SystemExit(main())
