"""Fixtures every layer's tests share: workbooks written under tmp_path, the demo folder."""

from __future__ import annotations

from collections.abc import Sequence
from pathlib import Path

import pytest
from openpyxl import Workbook

DEMO = Path(__file__).resolve().parents[1] / "demo_leagues"


def write_workbook(path: Path, sheets: dict[str, Sequence[Sequence[object]]]) -> Path:
    """A workbook with one sheet per entry (first row = header)."""
    wb = Workbook()
    wb.remove(wb.active)
    for title, rows in sheets.items():
        ws = wb.create_sheet(title)
        for row in rows:
            ws.append(list(row))
    wb.save(path)
    return path


@pytest.fixture
def demo() -> Path:
    """The demo_leagues folder."""
    return DEMO


@pytest.fixture
def workbook(tmp_path: Path):
    """Write a workbook under tmp_path: workbook(name, {sheet: rows})."""
    return lambda name, sheets: write_workbook(tmp_path / name, sheets)


@pytest.fixture
def round_robin(tmp_path: Path):
    """A league of `teams` teams in one division, fixtures generated from a Teams sheet."""

    def make(teams: int) -> Path:
        rows = [("Team", "Venue", "Division")]
        rows += [(f"Team {chr(65 + i)}", f"Ground {chr(65 + i)}", "Open") for i in range(teams)]
        return write_workbook(tmp_path / f"rr{teams}.xlsx", {"Teams": rows})

    return make


ROOT = Path(__file__).resolve().parents[1]
# A child of a large process starts with that process's peak as its own ru_maxrss (Linux keeps
# the high-water mark across fork and exec), so the child is started by a small launcher.
from benchmarks.hostile_project import LAUNCH as _LAUNCH  # noqa: E402
from benchmarks.hostile_project import PEAK as _PEAK  # noqa: E402


@pytest.fixture
def child():
    """Run Python code in a fresh process (POSIX): child(code, *args) -> (exit code, stdout,
    stderr, peak resident MiB: the child's own ru_maxrss, printed as it exits)."""
    import os
    import subprocess
    import sys

    def run(code: str, *args: str, timeout: float = 120) -> tuple[int, str, str, float]:
        env = dict(os.environ, PYTHONPATH=os.pathsep.join(
            [str(ROOT), *filter(None, [os.environ.get("PYTHONPATH")])]))
        done = subprocess.run([sys.executable, "-c", _LAUNCH, sys.executable, "-c", _PEAK + code,
                               *args], env=env,
                              capture_output=True, text=True, timeout=timeout)
        lines = done.stderr.splitlines(keepends=True)
        if not lines or not lines[-1].startswith("peak-kib"):
            return done.returncode, done.stdout, done.stderr, 0.0
        return done.returncode, done.stdout, "".join(lines[:-1]), int(lines[-1].split()[1]) / 1024

    return run
