"""The read-only table model the window's tables share (Qt's model/view: a model holds the
data, a QTableView shows it), and the row-selecting view over one."""

from __future__ import annotations

from collections.abc import Sequence
from typing import Any

from PySide6.QtCore import QAbstractTableModel, QModelIndex, QPersistentModelIndex, Qt
from PySide6.QtGui import QFont
from PySide6.QtWidgets import QAbstractItemView, QTableView

RIGHT = Qt.AlignmentFlag.AlignRight | Qt.AlignmentFlag.AlignVCenter
Index = QModelIndex | QPersistentModelIndex
Role = Qt.ItemDataRole


def bold_font() -> QFont:
    """The font of a cell shown in bold."""
    font = QFont()
    font.setBold(True)
    return font


class ReadOnlyTable(QAbstractTableModel):
    """Fixed column titles (with tooltips) over rows a subclass holds: it gives `row_count` and
    `cell(row, column, role)`; row titles default to 1, 2, 3."""

    def __init__(self, columns: Sequence[str], tips: Sequence[str] = (),
                 parent: Any = None) -> None:
        super().__init__(parent)
        self.columns = list(columns)
        self.tips = list(tips)

    def row_count(self) -> int:
        raise NotImplementedError

    def cell(self, row: int, column: int, role: int) -> Any:
        raise NotImplementedError

    def row_title(self, row: int) -> str:
        return str(row + 1)

    def changed_column(self, column: int) -> None:
        """Tell the views that every cell of one column may show something else now."""
        if self.row_count():
            self.dataChanged.emit(self.index(0, column),
                                  self.index(self.row_count() - 1, column))

    def rowCount(self, parent: Index = QModelIndex()) -> int:  # noqa: N802, B008
        return 0 if parent.isValid() else self.row_count()

    def columnCount(self, parent: Index = QModelIndex()) -> int:  # noqa: N802, B008
        return 0 if parent.isValid() else len(self.columns)

    def data(self, index: Index, role: int = Role.DisplayRole) -> Any:
        if not index.isValid() or index.row() >= self.row_count():
            return None
        return self.cell(index.row(), index.column(), role)

    def headerData(self, section: int, orientation: Qt.Orientation,  # noqa: N802
                   role: int = Role.DisplayRole) -> Any:
        horizontal = orientation == Qt.Orientation.Horizontal
        if role == Role.DisplayRole:
            if horizontal:
                return self.columns[section] if section < len(self.columns) else None
            return self.row_title(section)
        if role == Role.ToolTipRole and horizontal and section < len(self.columns):
            return self.column_tip(section)
        return None

    def column_tip(self, column: int) -> str | None:
        """What a column holds, in words (its header's tooltip)."""
        return self.tips[column] if column < len(self.tips) else None


def row_view(name: str, model: ReadOnlyTable, label: str) -> QTableView:
    """A table view of `model` whose rows are selected whole, one at a time (`name` is its
    object name, for styles; `label` what a screen reader calls it)."""
    view = QTableView()
    view.setObjectName(name)
    view.setAccessibleName(label)
    view.setModel(model)
    view.setEditTriggers(QAbstractItemView.EditTrigger.NoEditTriggers)
    view.setSelectionBehavior(QAbstractItemView.SelectionBehavior.SelectRows)
    view.setSelectionMode(QAbstractItemView.SelectionMode.SingleSelection)
    return view


def selected_row(view: QTableView) -> int | None:
    """The row selected in `view`, or None."""
    rows = view.selectionModel().selectedRows()
    return rows[0].row() if rows else None
