"""The architecture as written in pyproject.toml's import-linter contracts: kept by the tree,
and broken (exit 1, the contract named) when a module imports against them."""

from __future__ import annotations

import os
import shutil
import subprocess
import sys
from pathlib import Path

ROOT = Path(__file__).resolve().parents[1]
PACKAGE = ROOT / "leaguegrid"


def lint_imports(cwd: Path, pythonpath: Path | None = None) -> subprocess.CompletedProcess:
    env = dict(os.environ)
    if pythonpath is not None:
        env["PYTHONPATH"] = str(pythonpath)
    code = "import sys; from importlinter.cli import lint_imports; sys.exit(lint_imports(" \
           "no_cache=True, show_timings=False, verbose=False))"
    return subprocess.run([sys.executable, "-c", code], cwd=cwd, env=env, capture_output=True,
                          text=True, timeout=120)


def test_the_tree_keeps_every_contract() -> None:
    done = lint_imports(ROOT)
    assert done.returncode == 0, done.stdout + done.stderr
    assert "Contracts: 4 kept, 0 broken." in done.stdout


def test_a_broken_contract_fails(tmp_path: Path) -> None:
    # A copy of the package in which the engine imports the application layer and the command
    # line imports the window: both contracts must be reported broken.
    copy = tmp_path / "leaguegrid"
    shutil.copytree(PACKAGE, copy, ignore=shutil.ignore_patterns("__pycache__"))
    shutil.copy(ROOT / "pyproject.toml", tmp_path / "pyproject.toml")
    graph = copy / "engine" / "graph.py"
    graph.write_text(graph.read_text() + "\nfrom leaguegrid.app import defaults  # noqa\n")
    exits = copy / "cli" / "exits.py"
    exits.write_text(exits.read_text() + "\nimport leaguegrid.gui.palette  # noqa\n")
    done = lint_imports(tmp_path, pythonpath=tmp_path)
    assert done.returncode == 1, done.stdout + done.stderr
    assert "The engine is pure: it imports nothing else of the package, nor Qt BROKEN" in (
        done.stdout.replace("\n", " "))
    assert "leaguegrid.engine.graph -> leaguegrid.app.defaults" in done.stdout
    assert "leaguegrid.cli.exits -> leaguegrid.gui.palette" in done.stdout


def test_the_command_line_loads_no_qt() -> None:
    code = ("import sys, leaguegrid.cli.main, leaguegrid.cli.commands, leaguegrid.launch; "
            "print(sorted(m for m in sys.modules if m.startswith('PySide6')))")
    done = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True,
                          timeout=60, check=True)
    assert done.stdout.strip() == "[]"


def test_the_package_never_reads_the_development_tools() -> None:
    hits = [str(path.relative_to(ROOT)) for path in PACKAGE.rglob("*.py")
            if any(word in path.read_text(encoding="utf-8")
                   for word in ("../shared", "shared/bench", "benchmarks"))]
    assert hits == []
