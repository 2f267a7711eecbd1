"""What the report writers share: output checks and colours per flag kind."""

from __future__ import annotations

from pathlib import Path

from ..files import check_distinct, write_atomic

#: A colour per flag kind (terminal style, plot and HTML).
KIND_STYLE = {"carried-forward": "yellow", "unexplained": "magenta"}
SLIP_STYLE = "bold red"
RESTORED_STYLE = "cyan"


def style_for(kind: str) -> str:
    return KIND_STYLE.get(kind, SLIP_STYLE)


def write_output(result, path, data, suffixes: tuple[str, ...], what: str) -> Path:
    """Check *path* (its suffix, not the input table) and write *data* atomically."""
    from ..errors import NumcheckError

    target = Path(path)
    if suffixes and target.suffix.lower() not in suffixes:
        raise NumcheckError(f"The {what} {str(target)!r} must end in "
                            f"{' or '.join(suffixes)}, not {target.suffix or 'nothing'!r}.")
    source = getattr(result, "source", None)
    if source and Path(source).exists():
        check_distinct(source, target)
    return write_atomic(target, data)
