"""The counts table's model: one row per round count K of an app.counting.CountReport, each
count as core.wording writes it in a cell and every digit in its tooltip; the values themselves
through `value` and `values` (a Qt variant would cut an exact count to 64 bits)."""

from __future__ import annotations

from typing import Any

from leaguegrid.app.counting import CountReport, CountRow
from leaguegrid.core import wording
from leaguegrid.gui.table_model import RIGHT, ReadOnlyTable, Role, bold_font

COLUMNS = ("Rounds", "Schedules", "Using every round", "Groupings")
FIELDS = ("rounds", "assignments", "all_rounds_used", "groupings")
TIPS = (
    "K, the number of rounds available",
    "Ways to give every fixture a round in 1..K with no clash inside a round (pins respected; "
    "rounds may stay empty)",
    "Schedules in which every one of the K rounds holds a fixture",
    "Ways to split the fixtures into exactly K non-empty clash-free rounds, the order of the "
    "rounds not mattering (clash graph without pins)",
)


class CountsModel(ReadOnlyTable):
    """The rows of one count report (none before the first count)."""

    def __init__(self, parent: Any = None) -> None:
        super().__init__(COLUMNS, TIPS, parent)
        self.report: CountReport | None = None

    def set_report(self, report: CountReport | None) -> None:
        self.beginResetModel()
        self.report = report
        self.endResetModel()

    @property
    def rows(self) -> list[CountRow]:
        return [] if self.report is None else self.report.rows

    def row_count(self) -> int:
        return len(self.rows)

    def value(self, row: int, column: int) -> Any:
        """The number behind a cell: K, an exact int, a labelled Estimate, or None."""
        return getattr(self.rows[row], FIELDS[column])

    def values(self) -> list[dict[str, Any]]:
        """The values behind the table, row by row, by field name."""
        return [{name: getattr(row, name) for name in FIELDS} for row in self.rows]

    def fewest(self, row: int) -> bool:
        return self.report is not None and self.report.min_rounds == self.rows[row].rounds

    def cell(self, row: int, column: int, role: int) -> Any:
        value = self.value(row, column)
        if role == Role.DisplayRole:
            return str(value) if column == 0 else wording.cell_text(value)
        if role == Role.ToolTipRole:
            if column:
                return wording.full_text(value)
            rounds = wording.plural(value, "round")
            return f"{rounds}: the fewest that can work" if self.fewest(row) else rounds
        if role == Role.TextAlignmentRole:
            return RIGHT
        if role == Role.FontRole and column == 0 and self.fewest(row):
            return bold_font()
        return None  # no UserRole: Qt's variants hold 64-bit ints; exact counts are longer
