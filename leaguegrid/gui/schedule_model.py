"""The schedule grid's model: rounds (rows, titled with their dates where known) against venues
(columns, pitches apart), each cell the fixtures the schedule puts there, with what each breaks
where it stands. A fixture dropped on a cell asks for a move (the window's undo stack does it)."""

from __future__ import annotations

from collections.abc import Sequence
from typing import Any

from PySide6.QtCore import QMimeData, Qt, Signal

from leaguegrid.core.model import Fixture, Reason, Schedule
from leaguegrid.gui.table_model import Index, ReadOnlyTable, Role
from leaguegrid.scheduling.rules import Violation

MIME = "application/x-leaguegrid-fixture"
NO_VENUE = "(no venue)"
WARNING_MARK = "⚠ "


def venue_key(fixture: Fixture) -> str:
    """The grid column of a fixture: its venue, and pitch when it has one."""
    if not fixture.venue:
        return NO_VENUE
    return f"{fixture.venue} · {fixture.pitch}" if fixture.pitch else fixture.venue


def fixture_mime(label: str) -> QMimeData:
    """What a dragged fixture carries: its label."""
    data = QMimeData()
    data.setData(MIME, label.encode("utf-8"))
    data.setText(label)
    return data


class ScheduleGridModel(ReadOnlyTable):
    """One schedule laid out by round and venue; empty when there is none."""

    moveRequested = Signal(str, int)  # a fixture dropped on another round

    def __init__(self, parent: Any = None) -> None:
        super().__init__((), parent=parent)
        self.titles: list[str] = []
        self.cells: list[list[list[str]]] = []  # [round - 1][column] -> labels
        self.round_of: dict[str, int] = {}
        self.pins: dict[str, int | None] = {}
        self.broken: dict[str, list[str]] = {}  # label -> what it breaks where it stands
        self.selected: str | None = None
        self.near: dict[str, list[Reason]] = {}  # label -> why it clashes with the selected

    def column_tip(self, column: int) -> str | None:
        venue = self.columns[column]
        if venue == NO_VENUE:
            return "Fixtures with no venue given, round by round"
        return (f"Fixtures at {venue}, round by round; drag a fixture to another round to "
                "move it")

    def set_schedule(self, fixtures: Sequence[Fixture], schedule: Schedule | None,
                     titles: Sequence[str], pins: dict[str, int | None],
                     violations: Sequence[Violation]) -> None:
        """Lay out `schedule` (None: an empty grid) for the league's fixtures; `titles` are
        the rounds' headers, `violations` what the schedule breaks."""
        self.beginResetModel()
        by_label = {f.label: f for f in fixtures}
        self.columns = sorted({venue_key(f) for f in fixtures},
                              key=lambda v: (v == NO_VENUE, v.casefold())) if schedule else []
        k = schedule.rounds if schedule is not None else 0
        column = {v: i for i, v in enumerate(self.columns)}
        self.cells = [[[] for _v in self.columns] for _r in range(k)]
        self.round_of = {}
        assignment = schedule.assignment if schedule is not None else {}
        for label, r in sorted(assignment.items(), key=lambda kv: kv[0].casefold()):
            f = by_label.get(label)
            if f is not None and 1 <= r <= k:
                self.cells[r - 1][column[venue_key(f)]].append(label)
                self.round_of[label] = r
        self.titles = list(titles)[:k]
        self.pins = pins
        self.broken = {}
        for v in violations:
            for label in v.fixtures:
                self.broken.setdefault(label, []).append(str(v))
        self.endResetModel()

    def set_selection(self, selected: str | None, near: dict[str, list[Reason]]) -> None:
        """The selected fixture and those clashing with it (drawn apart in every cell)."""
        self.selected, self.near = selected, near
        if self.cells:
            self.dataChanged.emit(self.index(0, 0),
                                  self.index(len(self.cells) - 1, len(self.columns) - 1))

    def labels(self) -> list[str]:
        """Every fixture shown in the grid."""
        return list(self.round_of)

    def labels_at(self, row: int, column: int) -> list[str]:
        return self.cells[row][column]

    def chip_text(self, label: str) -> str:
        """A fixture as its chip shows it: a warning mark when it breaks something, its pin."""
        pin = self.pins.get(label)
        text = label + (f"  [pinned {pin}]" if pin is not None else "")
        return WARNING_MARK + text if label in self.broken else text

    def chip_tip(self, label: str) -> str:
        tip = [label, f"round {self.round_of[label]}", *self.broken.get(label, [])]
        if label in self.near:
            tip.append("clashes with the selected fixture: " +
                       "; ".join(str(r) for r in self.near[label]))
        return "\n".join(tip)

    def row_count(self) -> int:
        return len(self.cells)

    def row_title(self, row: int) -> str:
        return self.titles[row] if row < len(self.titles) else f"Round {row + 1}"

    def cell(self, row: int, column: int, role: int) -> Any:
        labels = self.cells[row][column]
        if role == Role.DisplayRole:
            return "\n".join(self.chip_text(label) for label in labels)
        if role == Role.ToolTipRole:
            return "\n\n".join(self.chip_tip(label) for label in labels) or None
        if role == Role.UserRole:
            return list(labels)
        return None

    # a fixture dropped on a cell: Qt's item views call these ---------------------------------
    def flags(self, index: Index) -> Qt.ItemFlag:
        if not index.isValid():
            return Qt.ItemFlag.NoItemFlags
        return Qt.ItemFlag.ItemIsEnabled | Qt.ItemFlag.ItemIsDropEnabled

    def mimeTypes(self) -> list[str]:  # noqa: N802
        return [MIME]

    def supportedDropActions(self) -> Qt.DropAction:  # noqa: N802
        return Qt.DropAction.MoveAction

    def canDropMimeData(self, data: QMimeData, action: Qt.DropAction, row: int,  # noqa: N802
                        column: int, parent: Index) -> bool:
        return data.hasFormat(MIME) and parent.isValid()

    def dropMimeData(self, data: QMimeData, action: Qt.DropAction, row: int,  # noqa: N802
                     column: int, parent: Index) -> bool:
        """A fixture dropped on a cell: ask for it to move to that cell's round."""
        if not self.canDropMimeData(data, action, row, column, parent):
            return False
        label = bytes(data.data(MIME).data()).decode("utf-8")
        if label not in self.round_of:
            return False
        self.moveRequested.emit(label, parent.row() + 1)
        return True
