"""Greek numbers of a real digital edition: Heiberg's Almagest as First1KGreek prints it.

The files are read in place from ``../shared/realdata/almagest/`` (TEI from
optical character recognition, and the star-catalogue lines and the table of
phases extracted from it, cells verbatim); the tests skip when the folder is
absent.  Values, beside each case:

* Almagest III.1: the solar mean daily motion 0;59,8,17,13,12,31 degrees
  (Toomer's translation, 1984; the catalogue row ptol_sun_motion).
* Almagest I.10: the side of the pentagon, crd 72° = 70;32,3 (Toomer, from memory).
* Almagest VII.5, the first stars of the catalogue (Ursa Minor), as Toomer
  gives them (from memory): the star at the end of the tail, Gemini 0 1/6,
  +66; the next, Gemini 2 1/2, +70; the one after, Gemini 16, +70 1/3 ... .
  The checks below use the figures the text itself prints (they need no
  outside value), and the latitudes of Ursa Minor near 70.
"""

import csv
import re
import unicodedata
import warnings
from fractions import Fraction as F
from pathlib import Path

import pytest

from numcheck.errors import NumcheckWarning
from numcheck.identify import identify
from numcheck.reader import read
from numcheck.tables import read_column

REAL = Path(__file__).resolve().parents[1] / ".." / "shared" / "realdata" / "almagest"
SUN = F(59, 60) + F(8, 60**2) + F(17, 60**3) + F(13, 60**4) + F(12, 60**5) + F(31, 60**6)


def _need(name: str) -> Path:
    path = REAL / name
    if not path.is_file():
        pytest.skip(f"{path} is not here (shared/realdata/almagest)")
    return path


@pytest.fixture(scope="module")
def running_text() -> str:
    return unicodedata.normalize("NFC", _need("almagest-heiberg-first1k.xml").read_text(encoding="utf-8"))


@pytest.fixture(scope="module")
def stars() -> list[dict]:
    with open(_need("almagest-stars-coordinates.tsv"), encoding="utf-8", newline="") as f:
        return list(csv.DictReader(f, delimiter="\t"))


def _quiet(fn, *args, **kw):
    with warnings.catch_warnings():
        warnings.simplefilter("ignore", NumcheckWarning)
        return fn(*args, **kw)


def test_solar_motion_as_the_text_prints_it(running_text):
    m = re.search(r"ἡλίου μοιρῶν (ο νθ η ιζ ιγ ιβ λα) ἔγγιστα", running_text)
    assert m, "the solar daily motion is no longer in the file"
    r = read(m.group(1))
    assert SUN in set(r.readings()) and r.ambiguous
    res = identify(m.group(1), unit="degrees")
    assert res.matches[0].id == "ptol_sun_motion" and res.matches[0].how == "exact"


def test_pentagon_side_keeps_seventy(running_text):
    m = re.search(r"τμημάτων (ο λβ γ) ἔγγιστα", running_text)
    assert m
    assert F(70) + F(32, 60) + F(3, 3600) in set(read(m.group(1)).readings())


def test_every_half_sign_of_the_text_reads(running_text):
    # The converter wrote the half sign as the text 'U+2220' (SOURCES.md of the folder).
    found = re.findall(r"(?<![^\s>])([α-ωϛϚ]{1,3} U\+2220[΄ʹ](?: γ[΄ʹ])?)(?=[\s<,.])", running_text)
    # 'βο' and 'νο' before a bare half are the words north and south, not numbers.
    found = [t for t in found if t.split()[0] not in ("βο", "νο")]
    assert len(found) > 50
    for text in found:
        r = _quiet(read, text, notation="greek")
        part = r.value - int(r.value)
        assert r.count == 1 and part in (F(1, 2), F(5, 6)), text      # ∠ʹ, or ∠ʹ γʹ


# -- the star catalogue -------------------------------------------------------------

def test_first_stars_of_the_catalogue(stars):
    lon = _quiet(read_column, "longitude", [r["longitude"] for r in stars[:40]], notation="greek")
    lat = _quiet(read_column, "latitude", [r["latitude"] for r in stars[:40]], notation="greek")
    lons = {c.row: c.value for c in lon.column.cells}
    lats = {c.row: c.value for c in lat.column.cells}
    assert lons[1] == F(1, 6) and lats[1] == 66        # 'o o ςʹ', 'ξς': Gemini 0 1/6, +66
    assert lons[2] == F(5, 2) and lats[2] == 70        # 'β U+2220΄', 'ο' decided by the column: +70
    assert lons[10] == 25 + F(5, 6)                     # 'κε U+2220ʹγʹ'
    assert lats[6] == 72 + F(5, 6)                      # 'οβ U+2220΄ γʹ'
    assert any("'ο' read as 1,10" in n for n in lat.notes)


def test_share_of_star_lines_read(stars):
    """At least 80% of the lines read whole (measured: 82.7%, see the closing note of the issue)."""
    failed: set[int] = set()
    for col in ("longitude", "latitude", "magnitude"):
        res = _quiet(read_column, col, [r[col] for r in stars], notation="greek")
        failed |= set(res.errors)
    share = 1 - len(failed) / len(stars)
    assert share >= 0.80, f"{len(failed)} of {len(stars)} star lines do not read"


def test_what_still_fails_is_not_a_number(stars):
    # The cells that fail hold words or a magnitude glued to the latitude
    # ('λε δʼ δʼ μ': latitude 35 1/4, magnitude 4, μ(είζων) 'brighter').
    res = _quiet(read_column, "latitude", [r["latitude"] for r in stars], notation="greek")
    glued = [r for r in res.errors if re.search(r"(μ|ἐλ\S*)$", stars[r - 1]["latitude"].strip())]
    assert len(glued) >= 0.8 * len(res.errors)


def test_table_of_phases_reads_whole():
    path = _need("almagest-phases-inner.tsv")
    with open(path, encoding="utf-8", newline="") as f:
        rows = list(csv.DictReader(f, delimiter="\t"))
    for col in [c for c in rows[0] if c != "sign"]:
        res = _quiet(read_column, col, [r[col] for r in rows], notation="greek")
        assert not res.errors and all(c.value is not None for c in res.column.cells), col
        assert all(c.value < 60 for c in res.column.cells), col
