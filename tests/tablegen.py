"""Tables generated from published scheme parameters, with slips injected where asked.

Used by the audit tests and the benchmark.  Every value is exact (Fractions);
the parameters and their sources are in ../shared/reference/schemes.csv:

* lunar System B, column A (the sun's progress per month), zigzag with
  M = 30;1,59, m = 28;10,39,40, d = 0;18 (Neugebauer, ACT 1955 vol. 1; HAMA
  1975; M and m from memory there), and column B, its running sum modulo 360°
  written as degrees within a sign;
* Jupiter System A, step function: 30° per line from Gemini 25 to Scorpius 30,
  36° from Scorpius 30 to Gemini 25 (Schiaparelli; Neugebauer ACT vol. 2, from
  memory; checked against 391/36 lines per revolution);
* Jupiter System B, zigzag M = 38;2, m = 28;15,30, d = 1;48 (ACT vol. 2 and
  Aaboe, from memory; arithmetic consistent with 391/36).
"""

from __future__ import annotations

from fractions import Fraction as F

from numcheck.reading import sexagesimal_text
from numcheck.units import ZODIAC


def sx(text: str) -> F:
    """A sexagesimal text to an exact value (for parameters only)."""
    whole, _, frac = text.partition(";")
    total = F(0)
    for p in whole.split(","):
        total = total * 60 + int(p)
    for k, p in enumerate(frac.split(",") if frac else [], start=1):
        total += F(int(p), 60 ** k)
    return total


LUNAR_B_A = dict(M=sx("30;1,59"), m=sx("28;10,39,40"), d=sx("0;18"))
JUPITER_B = dict(M=sx("38;2"), m=sx("28;15,30"), d=sx("1;48"))
JUPITER_A = dict(fast=F(36), slow=F(30), b_fast=F(240), b_slow=F(85))  # Scorpius 30 = 240°, Gemini 25 = 85°


def zigzag(n: int, *, M, m, d, start, rising=True) -> list[F]:
    """n lines of a linear zigzag with the reflection rule at M and m."""
    out, y, direction = [], F(start), 1 if rising else -1
    for _ in range(n):
        out.append(y)
        ny = y + direction * d
        if direction > 0 and ny >= M:
            ny, direction = 2 * M - ny, -1
        elif direction < 0 and ny <= m:
            ny, direction = 2 * m - ny, 1
        y = ny
    return out


def running_sum(steps: list[F], start: F, modulus=F(360)) -> list[F]:
    out, total = [], F(start)
    for i, s in enumerate(steps):
        if i:
            total = (total + s) % modulus
        out.append(total)
    return out


def step_function(n: int, *, fast, slow, b_fast, b_slow, start) -> list[F]:
    """n longitudes of a two-zone step function with the boundary rule."""
    out, lam = [], F(start)
    span_fast = (b_slow - b_fast) % 360
    for _ in range(n):
        out.append(lam)
        in_fast = (lam - b_fast) % 360 < span_fast
        w, boundary, w2 = (fast, b_slow, slow) if in_fast else (slow, b_fast, fast)
        x = (boundary - lam) % 360
        step = x + (w - x) * w2 / w if 0 < x < w else w
        lam = (lam + step) % 360
    return out


def longitude_text(value: F) -> str:
    value = F(value) % 360
    sign = int(value // 30)
    return f"{sexagesimal_text(value - 30 * sign)} {ZODIAC[sign]}"


def lunar_b(n: int = 40, start_a: str = "29;31,20", start_b: F = 180 + sx("14;11,57,4")):
    """Exact columns (A, B) of a lunar System B ephemeris: column A and its running sum.

    The first longitude is 14;11,57,4 Libra (an invented starting point).
    """
    a = zigzag(n, start=sx(start_a), **LUNAR_B_A)
    b = running_sum(a, start_b)
    return a, b


def jupiter_a(n: int = 40, start: F = F(10)) -> list[F]:
    """Longitudes of a Jupiter System A ephemeris (step function)."""
    return step_function(n, start=start, **JUPITER_A)


def jupiter_b(n: int = 40, start: str = "33;8,45") -> list[F]:
    """Synodic arcs of Jupiter System B (zigzag)."""
    return zigzag(n, start=sx(start), **JUPITER_B)


def carry_into(prev: F, step: F, place: int) -> bool:
    """Whether prev + step carries into the place 60**place (a positive step)."""
    unit = F(60) ** place
    return (prev % unit) + (step % unit) >= unit


def write_tsv(path, header, columns) -> None:
    with open(path, "w", encoding="utf-8") as fh:
        fh.write(to_tsv(header, columns))


def to_tsv(header: list[str], columns: list[list[str]]) -> str:
    lines = ["\t".join(header)]
    for row in zip(*columns):
        lines.append("\t".join(row))
    return "\n".join(lines) + "\n"
