"""How many of the editors' own ``<num>`` values numcheck reproduces, by class of disagreement.

Runs ``numcheck.tei.annotate`` (a check only: nothing is written) over every
``.xml`` file of a folder of EpiDoc files (by default the shared papyri,
``../shared/realdata/papyri`` from the repository root, read in place) and
sorts every ``<num>`` that carries an editor's ``@value``, ``@atLeast`` or
``@atMost`` into one class:

* ``reproduced``: numcheck read a value (or a range the editor's range holds)
  from the letters, the expansion or the number words, and it agrees;
* ``kept, not checkable``: nothing to read it from (an empty ``<num>`` whose
  words are not read, an expansion not in the table): the editor's value is kept;
* ``contradiction``: what numcheck read disagrees with the editor;
* ``unreadable``: numcheck could not read the number;
* ``file refused``: the whole file was refused, so the number was never checked.

A ``<num>`` with no editor's attribute is counted apart (numcheck adds one).

Run: python benchmarks/tei_agreement.py [FOLDER] [--list CLASS]
"""

from __future__ import annotations

import argparse
import sys
from collections import Counter
from fractions import Fraction
from pathlib import Path

from lxml import etree

from numcheck.errors import NumcheckError
from numcheck.tei import annotate

TEI = "{http://www.tei-c.org/ns/1.0}"
DEFAULT = Path(__file__).resolve().parent.parent.parent / "shared" / "realdata" / "papyri"
CLASSES = ("reproduced", "kept, not checkable", "contradiction", "unreadable", "file refused")


def _frac(text):
    try:
        return Fraction(str(text).strip())
    except (ValueError, ZeroDivisionError):
        return None


def classify(n: dict) -> str:
    """The class of one ``<num>`` of annotate's JSON (``nums`` entry)."""
    status = n["status"]
    if status == "unreadable":
        return "unreadable"
    if status in ("contradiction", "fixed"):
        return "contradiction"
    if n.get("read_from") in (None, "editor") and status in ("word", "not-checkable", "kept") \
            and "read_from" in n:
        return "kept, not checkable"
    existing = n.get("existing", {})
    if "value" in existing:
        ed = _frac(existing["value"])
        if "value" in n:
            return "reproduced" if _frac(n["value"]) == ed else "contradiction"
        lo, hi = _frac(n.get("atLeast")), _frac(n.get("atMost"))
        return "reproduced" if lo is not None and lo <= ed <= hi else "contradiction"
    # A range of the editor: numcheck's value or range must fall within it.
    lo = _frac(existing.get("atLeast")) if "atLeast" in existing else None
    hi = _frac(existing.get("atMost")) if "atMost" in existing else None
    ours = [_frac(n["value"])] if "value" in n else [_frac(n.get("atLeast")), _frac(n.get("atMost"))]
    if any(v is None for v in ours):
        return "contradiction"
    ok = (lo is None or max(ours) >= lo) and (hi is None or min(ours) <= hi)
    return "reproduced" if ok else "contradiction"


def measure(folder: Path, listing: str | None = None) -> Counter:
    counts: Counter = Counter()
    unattributed = 0
    files = sorted(folder.glob("*.xml"))
    refused = 0
    for path in files:
        try:
            result = annotate(path, None).to_dict()
        except NumcheckError as err:
            refused += 1
            root = etree.parse(str(path)).getroot()
            nums = [e for e in root.iter(TEI + "num")
                    if any(e.get(k) is not None for k in ("value", "atLeast", "atMost"))]
            counts["file refused"] += len(nums)
            if listing == "file refused":
                print(f"{path.name}: {str(err).splitlines()[0]}")
            continue
        for n in result["nums"]:
            if not n.get("existing"):
                unattributed += 1
                continue
            kind = classify(n)
            counts[kind] += 1
            if listing == kind:
                where = n.get("text_line") or n.get("line")
                print(f"{path.name} {where}: {n['text']!r} {n['status']} existing={n.get('existing')} "
                      f"ours={n.get('value', (n.get('atLeast'), n.get('atMost')))} {n.get('message', '')}")
    total = sum(counts.values())
    print(f"{len(files)} files, {refused} refused whole; {total} <num> with an editor's value "
          f"({unattributed} more without one)")
    for kind in CLASSES:
        share = counts[kind] / total if total else 0.0
        print(f"  {kind:22s} {counts[kind]:5d}  {share:7.1%}")
    return counts


def main(argv=None) -> int:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("folder", nargs="?", default=str(DEFAULT))
    parser.add_argument("--list", dest="listing", choices=CLASSES,
                        help="print every <num> of this class")
    args = parser.parse_args(argv)
    folder = Path(args.folder)
    if not folder.is_dir():
        print(f"no folder {folder}", file=sys.stderr)
        return 2
    measure(folder, args.listing)
    return 0


if __name__ == "__main__":
    sys.exit(main())
