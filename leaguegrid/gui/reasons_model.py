"""The what-if table's model: the clash reasons of a what-if report (scheduling.whatif.Waived)
ranked by gain, each count as core.wording writes it, and whether the reason is waived now."""

from __future__ import annotations

from typing import Any

from leaguegrid.core import wording
from leaguegrid.gui.table_model import RIGHT, ReadOnlyTable, Role
from leaguegrid.scheduling.whatif import Waived

COLUMNS = ("Clash reason", "Kind", "Clashes it makes", "Assignments if waived", "Gain",
           "Fewest rounds if waived", "Waived now")
WAIVED_COLUMN = len(COLUMNS) - 1
EDGES_IN_TIP = 30  # clashes listed in a reason's tooltip


class ReasonsModel(ReadOnlyTable):
    """Ranked reasons, and the texts of those waived now (the last column)."""

    def __init__(self, parent: Any = None) -> None:
        super().__init__(COLUMNS, parent=parent)
        self.rows: list[Waived] = []
        self.waived: set[str] = set()

    def set_rows(self, rows: list[Waived], waived: set[str]) -> None:
        self.beginResetModel()
        self.rows, self.waived = list(rows), set(waived)
        self.endResetModel()

    def set_waived(self, waived: set[str]) -> None:
        """The reasons waived now changed: only the last column shows anything new."""
        self.waived = set(waived)
        self.changed_column(WAIVED_COLUMN)

    def row_count(self) -> int:
        return len(self.rows)

    def cell(self, row: int, column: int, role: int) -> Any:
        w = self.rows[row]
        counts = {3: w.assignments_if_waived, 4: w.gain}
        if role == Role.DisplayRole:
            if column in counts:
                return wording.cell_text(counts[column])
            return (w.reason, w.kind, str(len(w.edges)),
                    None, None,
                    "" if w.min_rounds_if_waived is None else str(w.min_rounds_if_waived),
                    "yes" if w.reason in self.waived else "")[column]
        if role == Role.ToolTipRole:
            if column in counts:
                return wording.full_text(counts[column])
            if column == 0:
                return "\n".join(f"{a} – {b}" for a, b in w.edges[:EDGES_IN_TIP])
            return None
        if role == Role.TextAlignmentRole and column in counts:
            return RIGHT
        return None  # no UserRole: Qt's variants hold 64-bit ints; exact counts are longer
