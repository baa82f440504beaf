"""What was read from the workbook: each sheet as the spreadsheet shows it, and every problem;
clicking a problem goes to its sheet, row and column."""

from __future__ import annotations

from typing import Any

from PySide6.QtCore import Qt
from PySide6.QtWidgets import (
    QAbstractItemView,
    QLabel,
    QListWidget,
    QListWidgetItem,
    QSplitter,
    QStyle,
    QTableView,
    QTabWidget,
    QVBoxLayout,
    QWidget,
)

from leaguegrid.core.model import Problem
from leaguegrid.core.wording import plural
from leaguegrid.gui.table_model import Cell, RowsModel


def column_letter(index: int) -> str:
    """0 -> A, 25 -> Z, 26 -> AA: the spreadsheet's own column names."""
    out = ""
    index += 1
    while index:
        index, rem = divmod(index - 1, 26)
        out = chr(65 + rem) + out
    return out


class ImportView(QWidget):
    """Sheets as read (row numbers as the spreadsheet shows them) above the problem list."""

    def __init__(self, parent: QWidget | None = None) -> None:
        super().__init__(parent)
        self.heading = QLabel("No workbook open. Open one with Ctrl+O or drop it on the window.")
        self.heading.setWordWrap(True)
        self.sheets = QTabWidget()
        self.sheets.setObjectName("sheetTabs")
        self.problems = QListWidget()
        self.problems.setObjectName("problemList")
        self.problems.itemActivated.connect(self.go_to_problem)
        self.problems.itemClicked.connect(self.go_to_problem)
        self.tables: dict[str, QTableView] = {}
        self.first_rows: dict[str, int] = {}
        split = QSplitter(Qt.Orientation.Vertical)
        split.addWidget(self.sheets)
        box = QWidget()
        box_layout = QVBoxLayout(box)
        box_layout.setContentsMargins(0, 0, 0, 0)
        self.problem_heading = QLabel("Problems")
        box_layout.addWidget(self.problem_heading)
        box_layout.addWidget(self.problems)
        split.addWidget(box)
        split.setStretchFactor(0, 3)
        split.setStretchFactor(1, 1)
        split.setSizes([480, 160])
        layout = QVBoxLayout(self)
        layout.addWidget(self.heading)
        layout.addWidget(split, 1)

    def show_workbook(self, path: str, sheets: dict[str, list[tuple[int, list[Any]]]],
                      problems: list[Problem], summary: str) -> None:
        """Fill the sheet tabs (rows as (row number, cells)) and the problem list."""
        self.heading.setText(summary)
        self.sheets.clear()
        self.tables.clear()
        self.first_rows.clear()
        for name, rows in sheets.items():
            table = self._sheet_table(rows)
            self.tables[name.casefold()] = table
            self.sheets.addTab(table, name)
        self.problems.clear()
        icon_error = self.style().standardIcon(QStyle.StandardPixmap.SP_MessageBoxCritical)
        icon_warn = self.style().standardIcon(QStyle.StandardPixmap.SP_MessageBoxWarning)
        for problem in problems:
            item = QListWidgetItem(icon_warn if problem.severity == "warning" else icon_error,
                                   str(problem))
            item.setData(Qt.ItemDataRole.UserRole, problem)
            item.setToolTip(str(problem))
            self.problems.addItem(item)
        errors = sum(1 for p in problems if p.severity == "error")
        warnings = len(problems) - errors
        self.problem_heading.setText(
            "No problems found." if not problems else
            f"Problems: {plural(errors, 'error')}, {plural(warnings, 'warning')} "
            "(click one to go to it)")

    def _sheet_table(self, rows: list[tuple[int, list[Any]]]) -> QTableView:
        """A sheet as the spreadsheet shows it: lettered columns, its own row numbers."""
        width = max((len(cells) for _n, cells in rows), default=0)
        model = RowsModel([column_letter(i) for i in range(width)], parent=self)
        model.set_rows([[Cell("" if v is None else str(v)) for v in cells] for _n, cells in rows],
                       [str(n) for n, _cells in rows])
        table = QTableView()
        table.setModel(model)
        table.setEditTriggers(QAbstractItemView.EditTrigger.NoEditTriggers)
        table.resizeColumnsToContents()
        return table

    @staticmethod
    def sheet_model(table: QTableView) -> RowsModel:
        """The model behind one sheet's table."""
        model = table.model()
        assert isinstance(model, RowsModel)
        return model

    def locate(self, problem: Problem) -> tuple[QTableView, int, int] | None:
        """The table, row index and column index a problem points at (column -1 if unknown)."""
        if problem.sheet:
            table = self.tables.get(problem.sheet.casefold())
        elif problem.row is not None and len(self.tables) == 1:  # a CSV file's one sheet
            table = next(iter(self.tables.values()))
        else:
            return None
        if table is None:
            return None
        model = self.sheet_model(table)
        numbers = [int(t) for t in model.row_titles]
        row = numbers.index(problem.row) if problem.row in numbers else -1
        column = -1
        if problem.column:
            wanted = problem.column.strip().casefold()
            header = next((cells for cells in model.rows if any(c.text for c in cells)), [])
            texts = [c.text.strip().casefold() for c in header]
            if wanted in texts:
                column = texts.index(wanted)
            elif problem.column.upper() in model.columns:
                column = model.columns.index(problem.column.upper())
        return table, row, column

    def go_to_problem(self, item: QListWidgetItem) -> None:
        """Show the problem's sheet and select its row (and cell, when the column is known)."""
        found = self.locate(item.data(Qt.ItemDataRole.UserRole))
        if found is None:
            return
        table, row, column = found
        self.sheets.setCurrentWidget(table)
        if row < 0:
            return
        table.clearSelection()
        index = table.model().index(row, max(column, 0))
        if column >= 0:
            table.setCurrentIndex(index)
        else:
            table.selectRow(row)
        table.scrollTo(index, QAbstractItemView.ScrollHint.PositionAtCenter)
