"""A workbook sheet's model, as the spreadsheet shows it: lettered columns and the sheet's own
row numbers (from app.league.preview_sheets), so a problem's row and column can be found."""

from __future__ import annotations

from typing import Any

from openpyxl.utils import get_column_letter

from leaguegrid.gui.table_model import ReadOnlyTable, Role

SheetRows = list[tuple[int, list[Any]]]  # (row number, cells A, B, ...)


class SheetModel(ReadOnlyTable):
    """The non-empty rows of one sheet; an empty cell shows as nothing."""

    def __init__(self, rows: SheetRows, parent: Any = None) -> None:
        width = max((len(cells) for _n, cells in rows), default=0)
        super().__init__([get_column_letter(i + 1) for i in range(width)], parent=parent)
        self.numbers = [n for n, _cells in rows]
        self.rows = [cells for _n, cells in rows]

    def row_count(self) -> int:
        return len(self.rows)

    def column_tip(self, column: int) -> str | None:
        return f"Column {self.columns[column]} of the sheet, as the workbook holds it"

    def row_title(self, row: int) -> str:
        return str(self.numbers[row]) if row < len(self.numbers) else str(row + 1)

    def cell(self, row: int, column: int, role: int) -> Any:
        cells = self.rows[row]
        value = cells[column] if column < len(cells) else None
        if role == Role.DisplayRole:
            return "" if value is None else str(value)
        return None

    def row_of(self, number: int | None) -> int:
        """The table row showing spreadsheet row `number`; -1 when it is not shown."""
        return self.numbers.index(number) if number in self.numbers else -1

    def column_of(self, name: str | None) -> int:
        """The column a problem names: a header cell's text (in the first non-empty row), or a
        column letter; -1 when unknown."""
        if not name:
            return -1
        wanted = name.strip().casefold()
        header = next((cells for cells in self.rows if any(v not in (None, "") for v in cells)),
                      [])
        texts = ["" if v is None else str(v).strip().casefold() for v in header]
        if wanted in texts:
            return texts.index(wanted)
        if name.upper() in self.columns:
            return self.columns.index(name.upper())
        return -1
