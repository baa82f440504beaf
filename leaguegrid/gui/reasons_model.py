"""The what-if table's model: the clash reasons of a what-if report (scheduling.whatif.Waived)
ranked by gain, each count as core.wording writes it, and whether the reason is waived now."""

from __future__ import annotations

from typing import Any

from leaguegrid.core import wording
from leaguegrid.gui.table_model import RIGHT, ReadOnlyTable, Role
from leaguegrid.scheduling.whatif import Waived

COLUMNS = ("Clash reason", "Kind", "Clashes it makes", "Schedules if waived",
           "Schedules gained", "Fewest rounds if waived", "Waived now")
TIPS = (
    "What makes these fixtures clash: a venue, a Clash on column's value, a Clashes or Apart "
    "row (a team's own clashes are never offered: a team cannot play twice in a round)",
    "Where the clash comes from",
    "Pairs of fixtures that clash only because of this reason",
    "Valid schedules for the rounds asked if this reason were waived",
    "How many times as many schedules waiving it gives (exact number on hover)",
    "The fewest rounds that would work if this reason were waived",
    "Waived in this window now (the workbook is unchanged)",
)
WAIVED_COLUMN = len(COLUMNS) - 1
EDGES_IN_TIP = 30  # clashes listed in a reason's tooltip


class ReasonsModel(ReadOnlyTable):
    """Ranked reasons, and the texts of those waived now (the last column)."""

    def __init__(self, parent: Any = None) -> None:
        super().__init__(COLUMNS, TIPS, parent)
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
        if role == Role.DisplayRole:
            if column == 3:
                return wording.cell_text(w.assignments_if_waived)
            if column == 4:
                return self._gained(w)
            return (w.reason, wording.REASON_KINDS.get(w.kind, w.kind), str(len(w.edges)),
                    None, None,
                    "" if w.min_rounds_if_waived is None else str(w.min_rounds_if_waived),
                    "yes" if w.reason in self.waived else "")[column]
        if role == Role.ToolTipRole:
            if column == 3:
                return wording.full_text(w.assignments_if_waived)
            if column == 4:
                return wording.gained_text(w.gain)
            if column == 0:
                return "\n".join(f"{a} – {b}" for a, b in w.edges[:EDGES_IN_TIP])
            return None
        if role == Role.TextAlignmentRole and column in (3, 4):
            return RIGHT
        return None  # no UserRole: Qt's variants hold 64-bit ints; exact counts are longer

    @staticmethod
    def _gained(w: Waived) -> str:
        """'3.2 × as many schedules' (the schedules now are those if waived less the gain)."""
        if w.assignments_if_waived is None or w.gain is None:
            return "" if w.reason and not w.edges else "not computed"
        return wording.times_text(w.assignments_if_waived, w.assignments_if_waived - w.gain)
