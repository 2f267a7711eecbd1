"""Every example command of the README runs (a README that lies is a bug).

The usage summaries in capitals are left out; every other example runs
through the command line with --json and must succeed.  Examples that name
files use the ones the repository ships (``examples/``, ``corpora_demo/``):
they run in a fresh folder holding a copy of both, as from a fresh checkout,
and every input they name must exist there.  Some also pin the value the
README's comment promises.
"""

import json
import re
import shlex
import shutil
from pathlib import Path

import pytest

from numcheck.cli import main

ROOT = Path(__file__).resolve().parent.parent
README = ROOT / "README.md"

#: A usage summary (placeholders in capitals, optional parts in brackets), not an example.
_PLACEHOLDERS = re.compile(r"\bDIR\b|\bTEXT\b|\bFILE\b|\bBODY\b|\bDATE\b|\bN\b|\[--")
#: An argument that names a file or folder.
_A_FILE = re.compile(r"\.(tsv|csv|xml|html|png|svg|atf)$|/$")
#: The folders the README's examples take their files from.
SHIPPED = ("examples", "corpora_demo")


def _examples() -> list[str]:
    text = README.read_text(encoding="utf-8")
    lines = []
    for block in re.findall(r"```\n(.*?)```", text, flags=re.S):
        for line in block.splitlines():
            line = line.split("  #")[0].strip()
            if line.startswith("numcheck ") and not _PLACEHOLDERS.search(line):
                lines.append(line)
    return lines


EXAMPLES = _examples()


def test_the_readme_has_examples():
    assert len(EXAMPLES) >= 20
    assert len(EXAMPLES) == len(set(EXAMPLES))


def _fresh_checkout(tmp_path: Path) -> None:
    for name in SHIPPED:
        shutil.copytree(ROOT / name, tmp_path / name)


def _inputs(argv: list[str]) -> list[str]:
    """The files an example reads (outputs follow -o, --plot, --report, --csv)."""
    outputs = {"-o", "--output", "--plot", "--report", "--csv", "--out"}
    return [a for i, a in enumerate(argv) if _A_FILE.search(a) and (i == 0 or argv[i - 1] not in outputs)]


def test_examples_with_files_are_run():
    with_files = [ln for ln in EXAMPLES if _inputs(shlex.split(ln)[1:])]
    assert len(with_files) >= 8, with_files
    assert any(" audit " in f" {ln} " for ln in with_files)
    assert any(" annotate " in f" {ln} " for ln in with_files)


@pytest.mark.parametrize("line", EXAMPLES)
def test_readme_example_runs(line, capsys, tmp_path, monkeypatch):
    _fresh_checkout(tmp_path)
    monkeypatch.chdir(tmp_path)            # `numcheck demo` writes into the current folder
    argv = shlex.split(line)[1:]
    for name in _inputs(argv):
        assert (tmp_path / name).exists(), f"the README's example names {name!r}, which is not shipped"
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


def test_example_files_are_generated_by_their_script(tmp_path):
    """examples/make_examples.py writes the shipped files byte for byte."""
    import importlib.util

    shutil.copytree(ROOT / "examples", tmp_path / "examples")
    spec = importlib.util.spec_from_file_location("make_examples", tmp_path / "examples" / "make_examples.py")
    mod = importlib.util.module_from_spec(spec)
    spec.loader.exec_module(mod)
    mod.main()
    for path in (ROOT / "examples").rglob("*"):
        if path.is_file() and path.suffix in (".tsv", ".xml", ".atf"):
            assert (tmp_path / "examples" / path.relative_to(ROOT / "examples")).read_bytes() == \
                path.read_bytes(), path.name


def test_demo_readme_cites_files_that_exist():
    text = (ROOT / "corpora_demo" / "README.md").read_text(encoding="utf-8")
    cited = set(re.findall(r"`([\w./-]+\.(?:tsv|csv|xml|json|py|md))`", text))
    assert cited
    missing = [c for c in cited if not ((ROOT / "corpora_demo" / c).exists() or (ROOT / c).exists())]
    assert not missing, missing
