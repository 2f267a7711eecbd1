"""A column that repeats a published sequence line by line (the System A rising times, say).

The scheme holds the values of one period; a line's state is its place in
the period, and the next line takes the next value, round and round.
"""

from __future__ import annotations

from ..reading import sexagesimal_text
from .schemes import Scheme, value_text

__all__ = ["SequenceScheme"]


class SequenceScheme(Scheme):
    """The values of one period, repeated: line k + 1 holds the value after line k's."""

    kind = "sequence"

    def __init__(self, column, frame, values):
        super().__init__(column, frame)
        self.values = list(values)

    def step(self, state, i, src):
        pos = (state[1] + 1) % len(self.values)
        return (self.values[pos], pos)

    def back(self, state, i, src):
        pos = (state[1] - 1) % len(self.values)
        return (self.values[pos], pos)

    def start(self, value, i, nxt, src):
        n = len(self.values)
        for pos, v in enumerate(self.values):
            if v == value and self.values[(pos + 1) % n] == nxt:
                return (value, pos)
        return None

    def resume(self, predicted, value):
        return (value, predicted[1])

    def params(self):
        f = self.frame.fraction
        out = {"values": [value_text(f(v)) for v in self.values]}
        return out

    def describe(self):
        f = self.frame.fraction
        return "repeated sequence " + " ".join(sexagesimal_text(f(v)) for v in self.values)
