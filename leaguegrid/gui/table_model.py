"""A read-only Qt table model over rows of cells the views prepare from the app layer's data
(Qt's model/view: the model holds the data, QTableView shows it), and the row-selecting view."""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass, replace
from typing import Any

from PySide6.QtCore import QAbstractTableModel, QModelIndex, QPersistentModelIndex, Qt
from PySide6.QtGui import QFont
from PySide6.QtWidgets import QAbstractItemView, QTableView

RIGHT = Qt.AlignmentFlag.AlignRight | Qt.AlignmentFlag.AlignVCenter
Index = QModelIndex | QPersistentModelIndex


@dataclass(frozen=True)
class Cell:
    """What one cell shows: its text, a tooltip, bold or not, its alignment, and a value behind
    it (UserRole: a fixture label, a Reason, an exact count)."""

    text: str = ""
    tip: str | None = None
    bold: bool = False
    align: Any = None
    value: Any = None


class RowsModel(QAbstractTableModel):
    """Rows of Cells under fixed column titles (with tooltips), optional row titles."""

    def __init__(self, columns: Sequence[str], tips: Sequence[str] = (),
                 parent: Any = None) -> None:
        super().__init__(parent)
        self.columns = list(columns)
        self.tips = list(tips)
        self.rows: list[list[Cell]] = []
        self.row_titles: list[str] = []

    def set_rows(self, rows: list[list[Cell]], row_titles: Sequence[str] = ()) -> None:
        """Replace every row (and the row titles, when given)."""
        self.beginResetModel()
        self.rows = [list(r) + [Cell()] * (len(self.columns) - len(r)) for r in rows]
        self.row_titles = list(row_titles)
        self.endResetModel()

    def set_columns(self, columns: Sequence[str]) -> None:
        """New column titles (the rows are cleared)."""
        self.beginResetModel()
        self.columns, self.rows, self.row_titles = list(columns), [], []
        self.endResetModel()

    def update_cell(self, row: int, column: int, **changes: Any) -> None:
        """Change some of one cell's fields (text, tip, bold, ...) and tell the views."""
        self.rows[row][column] = replace(self.rows[row][column], **changes)
        index = self.index(row, column)
        self.dataChanged.emit(index, index)

    def cell(self, row: int, column: int) -> Cell:
        return self.rows[row][column]

    def rowCount(self, parent: Index = QModelIndex()) -> int:  # noqa: N802, B008
        return 0 if parent.isValid() else len(self.rows)

    def columnCount(self, parent: Index = QModelIndex()) -> int:  # noqa: N802, B008
        return 0 if parent.isValid() else len(self.columns)

    def data(self, index: Index, role: int = Qt.ItemDataRole.DisplayRole) -> Any:
        if not index.isValid():
            return None
        cell = self.rows[index.row()][index.column()]
        if role == Qt.ItemDataRole.DisplayRole:
            return cell.text
        if role == Qt.ItemDataRole.ToolTipRole:
            return cell.tip
        if role == Qt.ItemDataRole.FontRole and cell.bold:
            font = QFont()
            font.setBold(True)
            return font
        if role == Qt.ItemDataRole.TextAlignmentRole and cell.align is not None:
            return cell.align
        if role == Qt.ItemDataRole.UserRole:
            return cell.value
        return None

    def headerData(self, section: int, orientation: Qt.Orientation,  # noqa: N802
                   role: int = Qt.ItemDataRole.DisplayRole) -> Any:
        horizontal = orientation == Qt.Orientation.Horizontal
        titles = self.columns if horizontal else self.row_titles
        if role == Qt.ItemDataRole.DisplayRole:
            if section < len(titles):
                return titles[section]
            return None if horizontal else str(section + 1)
        if role == Qt.ItemDataRole.ToolTipRole and horizontal and section < len(self.tips):
            return self.tips[section]
        return None


def row_view(name: str, model: RowsModel) -> QTableView:
    """A table view of `model` whose rows are selected whole, one at a time (`name` is its
    object name, for styles)."""
    view = QTableView()
    view.setObjectName(name)
    view.setModel(model)
    view.setEditTriggers(QAbstractItemView.EditTrigger.NoEditTriggers)
    view.setSelectionBehavior(QAbstractItemView.SelectionBehavior.SelectRows)
    view.setSelectionMode(QAbstractItemView.SelectionMode.SingleSelection)
    return view


def selected_row(view: QTableView) -> int | None:
    """The row selected in `view`, or None."""
    rows = view.selectionModel().selectedRows()
    return rows[0].row() if rows else None
