"""Every example command of the README runs (a README that lies is a bug).

Examples that need a file of the reader's own (ephemeris.tsv, edition.xml ...)
and the usage summaries in capitals are left out; the rest run through the
command line with --json and must succeed.  Some also pin the value the
README's comment promises.
"""

import json
import re
import shlex
from pathlib import Path

import pytest

from numcheck.cli import main

README = Path(__file__).resolve().parent.parent / "README.md"

_NEEDS_A_FILE = re.compile(r"\.(tsv|csv|xml|html|png|atf)\b|/\s|/$|\bDIR\b|\bTEXT\b|\bFILE\b|\bBODY\b|\bDATE\b|\bN\b|\[--")


def _examples() -> list[str]:
    text = README.read_text(encoding="utf-8")
    lines = []
    for block in re.findall(r"```\n(.*?)```", text, flags=re.S):
        for line in block.splitlines():
            line = line.split("  #")[0].strip()
            if line.startswith("numcheck ") and not _NEEDS_A_FILE.search(line):
                lines.append(line)
    return lines


EXAMPLES = _examples()


def test_the_readme_has_examples():
    assert len(EXAMPLES) >= 20
    assert len(EXAMPLES) == len(set(EXAMPLES))


@pytest.mark.parametrize("line", EXAMPLES)
def test_readme_example_runs(line, capsys, tmp_path, monkeypatch):
    monkeypatch.chdir(tmp_path)            # `numcheck demo` writes into the current folder
    argv = shlex.split(line)[1:]
    if "--json" not in argv:
        argv.append("--json")
    code = main(argv)
    out = capsys.readouterr().out
    assert code == 0, out
    json.loads(out)


# (example, JSON field, value the README's comment promises)
PROMISED = [
    ('numcheck read "1,49,45;20"', "value", "19756/3"),
    ('numcheck read "κθ λα ν η κ"', "value", "765433/25920"),
    ('numcheck read "ϛφπε γʹ"', "value", "19756/3"),
    ('numcheck read "αχοʹ"', "value", "1670"),
    ('numcheck read "ο λβ γ" --notation greek-documentary', "value", "84641/1200"),
    ('numcheck read "κε U+2220ʹγʹ"', "value", "155/6"),
    ('numcheck read "Γ" --notation greek-documentary', "value", "3000"),
    ("numcheck read \"'Αωϙγ\"", "value", "1893"),
    ('numcheck read "Χ𐅅ΗΔΔΙΙ"', "value", "1622"),
    ('numcheck read "𒐏𒐉" --notation cuneiform --json', "value", "44"),
    ('numcheck read "MDCLXVI" --notation roman', "value", "1666"),
    ('numcheck read "شسه" --notation abjad', "value", "365"),
    ('numcheck read "3 signs 12;30°" --json', "value", "205/2"),
    ('numcheck read "2 bēru 10 UŠ" --unit hours', "value", "14/3"),
    ('numcheck read "1(gesz2) 3(u) 7(disz)"', "value", "97"),
    ('numcheck read "1(u) la2 1(disz)"', "value", "9"),
    ('numcheck read "7(disz) 3(u)"', "value", "450"),
    ('numcheck read "1 ME 43"', "value", "143"),
]


@pytest.mark.parametrize("line,field,value", PROMISED)
def test_readme_promises(line, field, value, capsys):
    assert line in EXAMPLES
    argv = shlex.split(line)[1:]
    if "--json" not in argv:
        argv.append("--json")
    assert main(argv) == 0
    assert json.loads(capsys.readouterr().out)[field] == value
