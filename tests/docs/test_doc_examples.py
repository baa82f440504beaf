"""Every example in the user documentation runs as written and prints what it shows.

An example is a ```console block in docs/user/*.md or README.md: a line `$ leaguegrid ARGS`
is run in-process through `leaguegrid.launch.main`, and the lines under it, up to the next
`$` line, are its expected output (stdout, then stderr). A line `...` stands for any number
of lines; a line starting with `...` and more text matches a line ending with that text; a
last line `[exit N]` gives the exit code (otherwise 0). Each block runs in its own folder
holding copies of demo_leagues/ and docs/user/examples/, so relative paths read as from the
checkout and files an example writes stay out of it.
"""

from __future__ import annotations

import re
import shlex
import shutil
from dataclasses import dataclass, field
from functools import cache
from pathlib import Path

import pytest

from leaguegrid.cli.main import COMMANDS
from leaguegrid.launch import main, wants_window

ROOT = Path(__file__).resolve().parents[2]
DOCS = sorted((ROOT / "docs" / "user").glob("*.md")) + [ROOT / "README.md"]
COPIED = ("demo_leagues", "docs/user/examples")
GAP = "..."
EXIT = re.compile(r"\[exit (\d+)\]")
LINK = re.compile(r"\[[^\]]*\]\(([^)\s]+)\)")


@dataclass
class Command:
    argv: list[str]
    line: int
    expected: list[str] = field(default_factory=list)
    exit_code: int = 0


@dataclass
class Example:
    path: Path
    line: int
    commands: list[Command]

    @property
    def name(self) -> str:
        return f"{self.path.relative_to(ROOT).as_posix()}:{self.line}"


def parse_examples(path: Path) -> list[Example]:
    """The console blocks of one Markdown file, each a list of commands with their output."""
    examples: list[Example] = []
    block: Example | None = None
    for number, text in enumerate(path.read_text(encoding="utf-8").splitlines(), start=1):
        line = text.rstrip()
        if block is None:
            if line.strip() == "```console":
                block = Example(path, number, [])
            continue
        if line.strip() == "```":
            examples.append(_finish(block))
            block = None
        elif line.startswith("$ "):
            block.commands.append(Command(shlex.split(line[2:]), number))
        elif block.commands:
            block.commands[-1].expected.append(line)
        elif line:
            raise AssertionError(f"{path.name}:{number}: output before any `$` command")
    assert block is None, f"{path.name}:{block.line if block else 0}: console block not closed"
    return examples


def _finish(block: Example) -> Example:
    """Trailing blank lines dropped; a last `[exit N]` line becomes the expected exit code."""
    for command in block.commands:
        lines = command.expected
        while lines and not lines[-1]:
            lines.pop()
        if lines and (found := EXIT.fullmatch(lines[-1].strip())):
            command.exit_code = int(found[1])
            lines.pop()
            while lines and not lines[-1]:
                lines.pop()
    return block


def output_matches(expected: list[str], actual: list[str]) -> bool:
    """True when `actual` is `expected` with each `...` line standing for any lines."""

    @cache
    def match(i: int, j: int) -> bool:
        if i == len(expected):
            return j == len(actual)
        want = expected[i]
        if want == GAP:
            return match(i + 1, j) or (j < len(actual) and match(i, j + 1))
        if j == len(actual):
            return False
        got = actual[j]
        same = got.endswith(want[3:]) if want.startswith(GAP) else got == want
        return same and match(i + 1, j + 1)

    return match(0, 0)


ALL = [example for path in DOCS for example in parse_examples(path)]


def _workspace(folder: Path) -> None:
    for relative in COPIED:
        shutil.copytree(ROOT / relative, folder / relative)


def _run(argv: list[str], capsys) -> tuple[int, list[str]]:
    try:
        code = main(argv)
    except SystemExit as stop:  # argparse's own exits (usage errors, --version)
        code = stop.code if isinstance(stop.code, int) else 0 if stop.code is None else 2
    out, err = capsys.readouterr()
    lines = [line.rstrip() for line in (out + err).splitlines()]
    while lines and not lines[-1]:
        lines.pop()
    return code, lines


@pytest.mark.parametrize("example", ALL, ids=[e.name for e in ALL])
def test_example_prints_what_the_docs_show(example: Example, tmp_path, monkeypatch, capsys):
    for command in example.commands:
        assert command.argv[:1] == ["leaguegrid"], f"line {command.line}: not a leaguegrid command"
    _workspace(tmp_path)
    monkeypatch.chdir(tmp_path)
    for command in example.commands:
        args = command.argv[1:]
        assert not wants_window(args), f"line {command.line}: this would open the window"
        code, lines = _run(args, capsys)
        shown = "\n".join(lines)
        assert code == command.exit_code, f"line {command.line}: exit {code}\n{shown}"
        assert output_matches(command.expected, lines), (
            f"line {command.line}: `{shlex.join(command.argv)}` printed\n{shown}\n\n"
            "but the docs show\n" + "\n".join(command.expected))


def test_every_command_has_an_example():
    shown = {c.argv[1] for e in ALL for c in e.commands if len(c.argv) > 1}
    assert set(COMMANDS) - shown == set()


def test_the_matcher_is_strict():
    """Output lines the docs leave out, or change, fail unless a `...` line stands for them."""
    out = ["League: X", "Fixtures: 6", "Usable: yes"]
    assert output_matches(["League: X", GAP, "Usable: yes"], out)
    assert output_matches([GAP, "...: yes"], out)
    assert not output_matches(["League: X", "Usable: yes"], out)
    assert not output_matches(["League: X", "Fixtures: 7", "Usable: yes"], out)
    assert output_matches(["League: X", GAP], out)
    assert not output_matches(["Fixtures: 6", GAP], out)


def test_the_readme_test_command_is_the_one_ci_runs():
    command = 'pip install -e ".[test]" && pytest'
    assert command in (ROOT / "README.md").read_text(encoding="utf-8")
    assert command in (ROOT / ".ci" / "run").read_text(encoding="utf-8").splitlines()


def _anchors(path: Path) -> set[str]:
    """The anchors of a Markdown file's headings, as GitHub makes them (lower case, spaces to
    hyphens, other punctuation dropped)."""
    out = set()
    for line in path.read_text(encoding="utf-8").splitlines():
        if line.startswith("#"):
            title = line.lstrip("#").strip().lower()
            out.add(re.sub(r"[^\w\- ]", "", title).replace(" ", "-"))
    return out


def _broken(doc: Path, target: str) -> bool:
    if "://" in target or target.startswith("mailto:"):
        return False
    name, _, anchor = target.partition("#")
    path = doc.parent.joinpath(name) if name else doc
    if not path.exists():
        return True
    return bool(anchor) and path.suffix == ".md" and anchor not in _anchors(path)


DOC_FILES = ["README.md", "DEVELOPERS.md", *sorted(
    p.relative_to(ROOT).as_posix() for p in ROOT.glob("*/**/*.md")
    if not {"build", "dist", ".venv", "node_modules"} & set(p.relative_to(ROOT).parts)
    and "egg-info" not in p.as_posix())]


@pytest.mark.parametrize("doc", DOC_FILES)
def test_relative_links_point_at_files_and_headings(doc: str):
    path = ROOT / doc
    assert [t for t in LINK.findall(path.read_text(encoding="utf-8")) if _broken(path, t)] == []
