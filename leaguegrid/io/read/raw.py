"""What reading a league file gives: its sheets as raw rows of cell values, or the one reason
it cannot be read."""

from __future__ import annotations

from dataclasses import dataclass, field
from typing import Literal

from openpyxl.utils import get_column_letter


class UnreadableFile(Exception):
    """The file cannot be read as a workbook or CSV; the message says why, for a coordinator."""


@dataclass
class RawSheet:
    """One sheet's non-empty rows: (row number as shown, {column number: value}), plus the cells
    whose value is missing (a formula never calculated) or is a spreadsheet error like #REF!."""

    name: str
    rows: list[tuple[int, dict[int, object]]] = field(default_factory=list)
    uncalculated: list[tuple[int, int]] = field(default_factory=list)
    error_cells: list[tuple[int, int, str]] = field(default_factory=list)


@dataclass
class RawBook:
    """The sheets read from one file; `sheet_names` lists every sheet, read or not, and
    `hidden` the sheets the workbook hides (name -> 'hidden' or 'veryHidden')."""

    kind: Literal["xlsx", "csv"]
    sheet_names: list[str]
    sheets: dict[str, RawSheet]
    hidden: dict[str, str] = field(default_factory=dict)


def cell_name(row: int, column: int) -> str:
    """The spreadsheet name of a cell, e.g. 'B7'."""
    return f"{get_column_letter(column)}{row}"
