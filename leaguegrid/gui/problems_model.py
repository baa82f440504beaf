"""The problem list's model: every core.model.Problem found in a workbook, each shown as its
own text with an error or warning icon, the Problem itself behind it (UserRole)."""

from __future__ import annotations

from typing import Any

from PySide6.QtCore import QAbstractListModel, QModelIndex, Qt
from PySide6.QtGui import QIcon

from leaguegrid.core.model import Problem
from leaguegrid.core.wording import plural
from leaguegrid.gui.table_model import Index, Role


class ProblemsModel(QAbstractListModel):
    """The problems in the reader's order; `icons` maps a severity to its icon."""

    def __init__(self, icons: dict[str, QIcon], parent: Any = None) -> None:
        super().__init__(parent)
        self.icons = icons
        self.problems: list[Problem] = []

    def set_problems(self, problems: list[Problem]) -> None:
        self.beginResetModel()
        self.problems = list(problems)
        self.endResetModel()

    def heading(self) -> str:
        """'Problems: 3 errors, 1 warning (…)', or that there are none."""
        if not self.problems:
            return "No problems found."
        errors = sum(1 for p in self.problems if p.severity == "error")
        warnings = len(self.problems) - errors
        return (f"Problems: {plural(errors, 'error')}, {plural(warnings, 'warning')} "
                "(click one to go to it)")

    def rowCount(self, parent: Index = QModelIndex()) -> int:  # noqa: N802, B008
        return 0 if parent.isValid() else len(self.problems)

    def data(self, index: Index, role: int = Role.DisplayRole) -> Any:
        if not index.isValid() or index.row() >= len(self.problems):
            return None
        problem = self.problems[index.row()]
        if role in (Role.DisplayRole, Role.ToolTipRole):
            return str(problem)
        if role == Role.DecorationRole:
            return self.icons.get(problem.severity)
        if role == Qt.ItemDataRole.UserRole:
            return problem
        return None
