"""A scheme the user states for a column: ``F: zigzag d=0;36 M=15;16,5 m=11;5,5``.

Forms (the column name, a colon, then the scheme)::

    F: zigzag d=0;36 M=15;16,5 m=11;5,5     (M or m may be left out: unknown)
    L: linear d=13;10,35 mod=360             (a constant difference, modulo the circle)
    L: step 85:30 240:36                     (zones: where each begins, and its rate)
    F: ACT-LUN-B-F                           (a scheme of the catalogue, by its id)

The same schemes can be stated as relations: ``F = zigzag(d=0;36, M=15;16,5,
m=11;5,5)``, ``L = step(85:30, 240:36)``.  The column is then checked
against the scheme as stated, and no other is fitted to it.
"""

from __future__ import annotations

import re
from fractions import Fraction

from ..errors import NumcheckSyntaxError, UnknownNameError
from .schemes import Scheme

__all__ = ["parse_scheme", "scheme_call", "STATED_KINDS"]

STATED_KINDS = ("zigzag", "linear", "step")
_NUM = r"-?\d+(?:,\d+)*(?:;\d+(?:,\d+)*)?(?:/\d+)?"
_PARAM = re.compile(rf"\s*(?P<key>[A-Za-z]+)\s*=\s*(?P<val>{_NUM})")
_ZONE = re.compile(rf"\s*(?P<start>{_NUM})\s*:\s*(?P<rate>{_NUM})")
_CALL = re.compile(r"^\s*(?P<target>[^=]+?)\s*=\s*(?P<kind>zigzag|linear|step)\s*\((?P<args>.*)\)\s*$")


def _number(text: str) -> Fraction:
    if "/" in text and ";" not in text and "," not in text:
        return Fraction(text)
    sign = -1 if text.startswith("-") else 1
    whole, _, frac = text.lstrip("-").partition(";")
    total = Fraction(0)
    for p in whole.split(","):
        total = total * 60 + int(p)
    for k, p in enumerate(frac.split(",") if frac else [], start=1):
        total += Fraction(int(p), 60 ** k)
    return sign * total


def scheme_call(text: str) -> str | None:
    """A relation ``F = zigzag(...)`` as a stated scheme ``F: zigzag ...`` (None for others)."""
    m = _CALL.match(text)
    if not m:
        return None
    args = m["args"].replace(", ", " ")
    return f"{m['target']}: {m['kind']} {args}"


def parse_scheme(text: str, frame) -> Scheme:
    """The scheme stated by *text* for one column of *frame*."""
    column, colon, body = text.partition(":")
    column = column.strip()
    if not colon or not body.strip():
        raise NumcheckSyntaxError(f"A stated scheme names a column, then ':', then the scheme: {text!r}",
                                  text, len(column), expected="e.g. 'F: zigzag d=0;36 M=15;16,5 m=11;5,5'")
    if column not in frame.names:
        raise UnknownNameError("column", column, frame.names)
    offset = len(column) + 1 + (len(body) - len(body.lstrip()))
    body = body.strip()
    kind, _, rest = body.partition(" ")
    scale = frame.scale

    def scaled(v):
        x = v * scale
        return x.numerator if x.denominator == 1 else x

    if kind not in STATED_KINDS:
        from ..catalogue.schemes import by_id
        from .published import published_instance
        entry = by_id(body)
        scheme = published_instance(entry, column, frame)
        if scheme is None:
            raise NumcheckSyntaxError(f"The catalogue scheme {entry.id} states a period only, "
                                      "nothing a column can be checked against", text, offset,
                                      expected="a zigzag, step or sequence scheme of the catalogue")
        scheme.stated = entry.id
        return scheme
    params, zones, pos = {}, [], 0
    while pos < len(rest):
        if not rest[pos:].strip():
            break
        m = _PARAM.match(rest, pos) if kind != "step" else _ZONE.match(rest, pos)
        if not m:
            want = "start:rate pairs, e.g. 85:30 240:36" if kind == "step" else "key=value, e.g. d=0;36"
            raise NumcheckSyntaxError(f"Cannot read the {kind} scheme {text!r}", text,
                                      offset + len(kind) + 1 + pos, expected=want)
        if kind == "step":
            zones.append((_number(m["start"]), _number(m["rate"])))
        else:
            params[m["key"]] = _number(m["val"])
        pos = m.end()
    if kind == "zigzag":
        from .zigzag import ZigzagScheme
        _need(params, ("d",), ("d", "M", "m"), text, offset)
        scheme = ZigzagScheme(column, frame, scaled(abs(params["d"])),
                              scaled(params["M"]) if "M" in params else None,
                              scaled(params["m"]) if "m" in params else None)
    elif kind == "linear":
        from .schemes import LinearScheme
        _need(params, ("d",), ("d", "mod"), text, offset)
        scheme = LinearScheme(column, frame, scaled(params["d"]))
        if "mod" in params:
            scheme.modulus = scaled(params["mod"])
    else:
        from .steps import StepScheme
        if len(zones) < 2:
            raise NumcheckSyntaxError("A step function needs two zones or more", text, len(text),
                                      expected="e.g. 'L: step 85:30 240:36'")
        saved = frame.modulus.get(column)
        frame.modulus[column] = saved or 360 * scale
        try:
            scheme = StepScheme(column, frame, [scaled(a) for a, _ in zones],
                                [scaled(w) for _, w in zones])
        finally:
            frame.modulus[column] = saved
        scheme.modulus = scheme.full
    scheme.stated = body
    return scheme


def _need(params, required, allowed, text, offset) -> None:
    for key in params:
        if key not in allowed:
            raise NumcheckSyntaxError(f"The scheme {text!r} has no parameter {key!r}", text,
                                      offset + text[offset:].find(key + "="),
                                      expected=", ".join(allowed))
    for key in required:
        if key not in params:
            raise NumcheckSyntaxError(f"The scheme {text!r} needs {key}=...", text, len(text),
                                      expected=", ".join(f"{k}=..." for k in allowed))
