"""The plain result objects of a restoration and their JSON form (DESIGN.md)."""

from __future__ import annotations

from dataclasses import dataclass, field
from fractions import Fraction

from ..reading import decimal_text, exact_text, sexagesimal_text

__all__ = ["Candidate", "RestoreResult", "SUGGESTION"]

#: Said wherever restorations are shown.
SUGGESTION = ("These are suggestions for the editor's judgement, not readings: the traces allow "
              "each of them, the evidence ranks them.")


@dataclass(frozen=True)
class Candidate:
    """One reading the traces allow, with its probability and the reasons for it."""

    text: str                         # the reading in the input's notation, restorations in brackets
    value: Fraction                   # exact (at the magnitude shown by ``scale``)
    probability: float                # posterior, over the whole space
    reasons: tuple[str, ...]
    editor: bool = False              # this is the edition's own reading
    scale: int = 0                    # power of 60 applied to a floating reading
    prior: float = 0.0                # probability from the traces alone
    evidence: tuple[str, ...] = ()    # ids of the evidence it agrees with

    def to_dict(self) -> dict:
        return {
            "text": self.text,
            "value": exact_text(self.value),
            "probability": self.probability,
            "reasons": list(self.reasons),
            "editor": self.editor,
            "scale": self.scale,
            "decimal": decimal_text(self.value),
            "sexagesimal": sexagesimal_text(self.value),
            "prior": self.prior,
            "evidence": list(self.evidence),
        }


@dataclass(frozen=True)
class RestoreResult:
    """The ranked readings of a damaged number and what the ranking rests on."""

    text: str
    notation: str
    candidates: list[Candidate]
    space: int                        # how many readings the traces allow
    unmatched_mass: float             # probability of the readings no evidence touches
    notes: list[str] = field(default_factory=list)
    evidence: list[dict] = field(default_factory=list)

    def __iter__(self):
        return iter(self.candidates)

    def __len__(self) -> int:
        return len(self.candidates)

    @property
    def best(self) -> Candidate | None:
        return self.candidates[0] if self.candidates else None

    def to_dict(self) -> dict:
        return {
            "text": self.text,
            "notation": self.notation,
            "candidates": [c.to_dict() for c in self.candidates],
            "space": self.space,
            "unmatched_mass": self.unmatched_mass,
            "evidence": list(self.evidence),
            "notes": list(self.notes),
            "suggestion": SUGGESTION,
        }
