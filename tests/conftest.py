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
