"""Benchmark: numcheck.read against a hand-written parse of the same texts.

The baseline is the least a reader can do: split the text at ',' and ';'
and sum the places into a Fraction (for Greek: look each letter up and sum).
numcheck.read does more (NFC, look-alike characters, limits, the notation,
a Reading with every slot, its status and its written form), so the goals
are ratios: plain sexagesimal <= 10x the hand parse, Greek <= 15x.

Run: python benchmarks/reader.py [--n N]
"""

from __future__ import annotations

import argparse
import random
import time
from fractions import Fraction

from numcheck import read

GOALS = {"sexagesimal": 10.0, "greek": 15.0}

_GREEK = {"α": 1, "β": 2, "γ": 3, "δ": 4, "ε": 5, "ϛ": 6, "ζ": 7, "η": 8, "θ": 9,
          "ι": 10, "κ": 20, "λ": 30, "μ": 40, "ν": 50, "ξ": 60, "ο": 70, "π": 80, "ϙ": 90,
          "ρ": 100, "σ": 200, "τ": 300, "υ": 400, "φ": 500, "χ": 600, "ψ": 700, "ω": 800, "ϡ": 900}
_TENS = "ικλμν"
_UNITS = "αβγδεϛζηθ"


def hand_sexagesimal(text: str) -> Fraction:
    whole, _, frac = text.partition(";")
    value = 0
    for p in whole.split(","):
        value = value * 60 + int(p)
    scale = 1
    n = 0
    for p in frac.split(",") if frac else ():
        n = n * 60 + int(p)
        scale *= 60
    return Fraction(value) + Fraction(n, scale)


def hand_greek(text: str) -> Fraction:
    groups = text.split()
    value = Fraction(sum(_GREEK[c] for c in groups[0]))
    scale = 1
    for g in groups[1:]:
        scale *= 60
        value += Fraction(sum(_GREEK[c] for c in g), scale)
    return value


def _greek_place(rng: random.Random, most: int = 59) -> str:
    n = rng.randint(1, most)
    tens, units = divmod(n, 10)
    return (_TENS[tens - 1] if tens else "") + (_UNITS[units - 1] if units else "")


def corpus(notation: str, n: int, seed: int = 7) -> list[str]:
    rng = random.Random(seed)
    out = []
    for _ in range(n):
        places = [rng.randint(0, 59) for _ in range(rng.randint(1, 5))]
        if notation == "sexagesimal":
            whole = rng.randint(1, 3)
            text = ",".join(map(str, places[:whole])) + (
                ";" + ",".join(map(str, places[whole:])) if places[whole:] else "")
        else:
            text = " ".join(_greek_place(rng) for _ in places)
        out.append(text)
    return out


def _rate(fn, texts: list[str], repeats: int = 5) -> float:
    """Seconds per text, the best of *repeats* runs."""
    best = []
    for _ in range(repeats):
        t0 = time.perf_counter()
        for t in texts:
            fn(t)
        best.append((time.perf_counter() - t0) / len(texts))
    return min(best)


def main() -> None:
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--n", type=int, default=5000)
    args = ap.parse_args()
    for notation, hand in (("sexagesimal", hand_sexagesimal), ("greek", hand_greek)):
        texts = corpus(notation, args.n)
        for t in texts[:200]:
            assert read(t, notation=notation).value == hand(t), t
        read(texts[0], notation=notation)      # the parser is built (or loaded) once
        ours = _rate(lambda t: read(t, notation=notation), texts)
        ours_detected = _rate(read, texts)
        base = _rate(hand, texts)
        ratio = ours / base
        goal = GOALS[notation]
        print(f"{notation:<12} hand {base * 1e6:7.1f} us  read {ours * 1e6:7.1f} us "
              f"({ratio:5.1f}x, goal <= {goal:g}x: {'met' if ratio <= goal else 'NOT met'})  "
              f"detected {ours_detected * 1e6:7.1f} us ({ours_detected / base:5.1f}x)")


if __name__ == "__main__":
    main()
