"""Helpers for the reader tests: build a workbook from plain rows, find one problem."""

from __future__ import annotations

import io
import re
import zipfile
from pathlib import Path

import openpyxl

from leaguegrid.core.model import LoadResult, Problem
from leaguegrid.io.read.league_reader import load_league

Rows = list[list[object]]


def write_book(path: Path, sheets: dict[str, Rows]) -> Path:
    """An .xlsx with one sheet per entry, rows written from row 1 (None leaves a cell blank)."""
    book = openpyxl.Workbook()
    book.remove(book.active)
    for name, rows in sheets.items():
        sheet = book.create_sheet(name)
        for r, row in enumerate(rows, start=1):
            for c, value in enumerate(row, start=1):
                if value is not None:
                    sheet.cell(r, c, value)
    book.save(path)
    return path


def load_book(tmp_path: Path, sheets: dict[str, Rows], name: str = "league.xlsx") -> LoadResult:
    return load_league(write_book(tmp_path / name, sheets))


def patch_cells(path: Path, sheet_xml: str, replacements: dict[str, str]) -> None:
    """Rewrite cells of one worksheet part: each `<c r="B3" .../>` element named in
    `replacements` is replaced by the raw XML given (to store what openpyxl cannot write)."""
    with zipfile.ZipFile(path) as archive:
        parts = {n: archive.read(n) for n in archive.namelist()}
    xml = parts[sheet_xml].decode("utf-8")
    for ref, cell in replacements.items():
        pattern = re.compile(rf'<c r="{ref}"[^>]*?(/>|>.*?</c>)', re.DOTALL)
        xml, count = pattern.subn(cell, xml)
        assert count == 1, ref
    parts[sheet_xml] = xml.encode("utf-8")
    buffer = io.BytesIO()
    with zipfile.ZipFile(buffer, "w", zipfile.ZIP_DEFLATED) as archive:
        for name, data in parts.items():
            archive.writestr(name, data)
    path.write_bytes(buffer.getvalue())


def errors(result: LoadResult) -> list[Problem]:
    return [p for p in result.problems if p.severity == "error"]


def warnings_of(result: LoadResult) -> list[Problem]:
    return [p for p in result.problems if p.severity == "warning"]


def one(problems: list[Problem]) -> Problem:
    """The only problem of a list (the test fails, showing them all, when there are others)."""
    assert len(problems) == 1, [str(p) for p in problems]
    return problems[0]


def six_teams() -> Rows:
    return [["Team", "Venue", "Division"]] + [
        [name, f"{name} Park", "U12"]
        for name in ("Alder", "Birch", "Cedar", "Damson", "Elm", "Fir")
    ]
