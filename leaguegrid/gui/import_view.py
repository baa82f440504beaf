"""What was read from the workbook: each sheet as the spreadsheet shows it, and every problem;
clicking a problem goes to its sheet, row and column."""

from __future__ import annotations

from PySide6.QtCore import QModelIndex, Qt
from PySide6.QtWidgets import (
    QAbstractItemView,
    QLabel,
    QListView,
    QSplitter,
    QStyle,
    QTableView,
    QTabWidget,
    QVBoxLayout,
    QWidget,
)

from leaguegrid.app.league import Preview
from leaguegrid.core.model import Problem
from leaguegrid.gui.problems_model import ProblemsModel
from leaguegrid.gui.sheet_model import SheetModel, SheetRows


class ImportView(QWidget):
    """Sheets as read (row numbers as the spreadsheet shows them) above the problem list."""

    def __init__(self, parent: QWidget | None = None) -> None:
        super().__init__(parent)
        self.heading = QLabel("No workbook open. Open one with Ctrl+O or drop it on the window.")
        self.heading.setWordWrap(True)
        self.sheets = QTabWidget()
        self.sheets.setObjectName("sheetTabs")
        icon = self.style().standardIcon
        self.problem_model = ProblemsModel(
            {"error": icon(QStyle.StandardPixmap.SP_MessageBoxCritical),
             "warning": icon(QStyle.StandardPixmap.SP_MessageBoxWarning)}, self)
        self.problems = QListView()
        self.problems.setObjectName("problemList")
        self.problems.setAccessibleName("Problems found in the workbook")
        self.problems.setModel(self.problem_model)
        self.problems.setEditTriggers(QAbstractItemView.EditTrigger.NoEditTriggers)
        self.problems.activated.connect(self.go_to_problem)
        self.problems.clicked.connect(self.go_to_problem)
        self.tables: dict[str, QTableView] = {}
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

    def show_workbook(self, path: str, sheets: Preview, problems: list[Problem],
                      summary: str) -> None:
        """Fill the sheet tabs (rows as (row number, cells)) and the problem list."""
        self.heading.setText(summary)
        self.sheets.clear()
        self.tables.clear()
        for name, rows in sheets.items():
            table = self._sheet_table(rows)
            table.setAccessibleName(f"Sheet {name} of the workbook")
            self.tables[name.casefold()] = table
            self.sheets.addTab(table, name)
        self.problem_model.set_problems(problems)
        self.problem_heading.setText(self.problem_model.heading())

    def _sheet_table(self, rows: SheetRows) -> QTableView:
        """A sheet as the spreadsheet shows it: lettered columns, its own row numbers."""
        table = QTableView()
        table.setModel(SheetModel(rows, table))
        table.setEditTriggers(QAbstractItemView.EditTrigger.NoEditTriggers)
        table.resizeColumnsToContents()
        return table

    @staticmethod
    def sheet_model(table: QTableView) -> SheetModel:
        """The model behind one sheet's table."""
        model = table.model()
        assert isinstance(model, SheetModel)
        return model

    def locate(self, problem: Problem) -> tuple[QTableView, int, int] | None:
        """The table, row index and column index a problem points at (-1 if unknown)."""
        if problem.sheet:
            table = self.tables.get(problem.sheet.casefold())
        elif problem.row is not None and len(self.tables) == 1:  # a CSV file's one sheet
            table = next(iter(self.tables.values()))
        else:
            return None
        if table is None:
            return None
        model = self.sheet_model(table)
        return table, model.row_of(problem.row), model.column_of(problem.column)

    def go_to_problem(self, index: QModelIndex) -> None:
        """Show the problem's sheet and select its row (and cell, when the column is known)."""
        problem = index.data(Qt.ItemDataRole.UserRole)
        found = self.locate(problem) if isinstance(problem, Problem) else None
        if found is None:
            return
        table, row, column = found
        self.sheets.setCurrentWidget(table)
        if row < 0:
            return
        table.clearSelection()
        cell = table.model().index(row, max(column, 0))
        if column >= 0:
            table.setCurrentIndex(cell)
        else:
            table.selectRow(row)
        table.scrollTo(cell, QAbstractItemView.ScrollHint.PositionAtCenter)
