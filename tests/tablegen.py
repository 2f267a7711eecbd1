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


# -- injecting slips ---------------------------------------------------------

#: The slip kinds the generator can put into column A (zigzag) of lunar_b.
A_KINDS = ("unit-slip", "ten-slip", "place-shift", "merged-places", "split-place",
           "dropped-zero", "copied-neighbour", "intermediate-value", "turning-point", "carry")
#: The slip kinds it can put into column B (the longitude).
B_KINDS = ("unit-slip", "ten-slip", "sign-error", "carry", "copied-neighbour")


def _places(value: F) -> list[int]:
    text = sexagesimal_text(value)
    whole, _, frac = text.partition(";")
    return [int(whole)] + ([int(p) for p in frac.split(",")] if frac else [])


def _from_places(places: list[int]) -> str:
    return f"{places[0]}" + (";" + ",".join(str(p) for p in places[1:]) if len(places) > 1 else "")


def _carried(prev: F, step: F, place: int) -> bool:
    """Whether prev + step carries (or borrows) into the place 60**place."""
    unit = F(60) ** place
    if step >= 0:
        return (prev % unit) + (step % unit) >= unit
    return (prev % unit) < ((-step) % unit)


def inject(column: str, kind: str, a: list[F], b: list[F], rng) -> tuple[int, str] | None:
    """Pick a line where *kind* has one clear signature and give its written text.

    Returns (0-based row, text) or None when no line of this table suits the
    kind.  *rng* is a random.Random.  Lines 0-1 and the last are avoided (the
    chain needs neighbours on both sides to tell an isolated slip).
    """
    values = a if column == "A" else b
    rows = list(range(2, len(values) - 1))
    rng.shuffle(rows)
    d = LUNAR_B_A["d"]
    for i in rows:
        v, prev = values[i], values[i - 1]
        step = (v - prev) if column == "A" else a[i]
        frac_v = v % 30 if column == "B" else v
        text = _place_slip(kind, v, prev, step, column, i, values, rng, frac_v, d, a)
        if text is not None:
            return i, text
    return None


def _write(column: str, value: F) -> str:
    return sexagesimal_text(value) if column == "A" else longitude_text(value)


def _place_slip(kind, v, prev, step, column, i, values, rng, frac_v, d, a):
    places = _places(frac_v)
    if kind in ("unit-slip", "ten-slip", "carry"):
        size = 1 if kind != "ten-slip" else 10
        for k in rng.sample(range(1, len(places)), len(places) - 1) if len(places) > 1 else []:
            place = -k
            carried = _carried(prev if column == "A" else prev % 360, step, place)
            if kind == "carry":
                if carried:
                    return _write(column, v - F(60) ** place if step > 0 else v + F(60) ** place)
                continue
            if carried:
                continue
            sign = rng.choice((1, -1))
            if 0 <= places[k] + sign * size <= 59:
                return _write(column, v + sign * size * F(60) ** place)
        return None
    if kind == "place-shift" and column == "A":
        return sexagesimal_text(v * 60)
    if kind == "intermediate-value" and column == "A":
        return sexagesimal_text(2 * v)
    if kind == "copied-neighbour":
        return _write(column, values[i - 1]) if values[i - 1] != v else None
    if kind == "sign-error" and column == "B":
        return longitude_text(v + rng.choice((30, -30)))
    if kind == "merged-places" and column == "A":
        for k in range(1, len(places) - 1):
            if places[k] and places[k + 1] and places[k] + places[k + 1] <= 59:
                return _from_places(places[:k] + [places[k] + places[k + 1]] + places[k + 2:])
        return None
    if kind == "split-place" and column == "A":
        for k in range(1, len(places)):
            if places[k] >= 11 and places[k] % 10:
                tens = places[k] - places[k] % 10
                return _from_places(places[:k] + [tens, places[k] % 10] + places[k + 1:])
        return None
    if kind == "dropped-zero" and column == "A":
        for k in range(1, len(places) - 1):
            if places[k] == 0:
                return _from_places(places[:k] + places[k + 1:])
        return None
    if kind == "turning-point" and column == "A":
        straight = prev + (d if values[i - 1] > values[i - 2] else -d)
        if straight != v and (straight > LUNAR_B_A["M"] or straight < LUNAR_B_A["m"]):
            return sexagesimal_text(straight)
        return None
    return None


def step_zones(n: int, *, bounds: list[F], rates: list[F], start: F) -> list[F]:
    """n longitudes of a step function with any number of zones (zone i from bounds[i]).

    Written independently of numcheck: the share of a line left at a boundary
    is spent at the next zone's rate.
    """
    out, lam = [], F(start)
    k = len(bounds)
    for _ in range(n):
        out.append(lam)
        i = max((j for j in range(k) if bounds[j] <= lam), default=k - 1)
        left, pos = F(1), lam
        while True:
            end = bounds[(i + 1) % k]
            x = (end - pos) % 360 or F(360)
            if rates[i] * left <= x:
                pos = (pos + rates[i] * left) % 360
                break
            left -= x / rates[i]
            pos, i = end % 360, (i + 1) % k
        lam = pos
    return out
