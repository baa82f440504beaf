"""The read-only, one-row-at-a-time tables of the fixtures, counts and what-if views."""

from __future__ import annotations

from collections.abc import Sequence

from PySide6.QtWidgets import QAbstractItemView, QTableWidget


def row_table(name: str, columns: Sequence[str]) -> QTableWidget:
    """A table with these column titles whose cells cannot be edited and whose rows are
    selected whole, one at a time (`name` is its object name, for tests and styles)."""
    table = QTableWidget(0, len(columns))
    table.setObjectName(name)
    table.setHorizontalHeaderLabels(list(columns))
    table.setEditTriggers(QAbstractItemView.EditTrigger.NoEditTriggers)
    table.setSelectionBehavior(QAbstractItemView.SelectionBehavior.SelectRows)
    table.setSelectionMode(QAbstractItemView.SelectionMode.SingleSelection)
    return table
