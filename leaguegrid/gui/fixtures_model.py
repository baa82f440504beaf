"""The fixtures table's model: the league's fixtures as read, with their pins and ties as they
stand with the window's edits, their rounds in the chosen schedule, and their clashes with the
selected fixture."""

from __future__ import annotations

from typing import Any

from leaguegrid.core.model import Fixture, Reason
from leaguegrid.gui.table_model import ReadOnlyTable, Role, bold_font

COLUMNS = ("Fixture", "Home", "Away", "Venue", "Pitch", "Division", "Pinned round",
           "Round in schedule", "Clash with selected")
TIPS = (
    "The fixture's name (its label in the workbook, or home v away)",
    "The home side", "The away side",
    "The ground the fixture is played at", "The pitch at that ground, when there are several",
    "The division, grade or age group",
    "The round this fixture is fixed to: by the workbook (Round or Date column) or a pin here",
    "The round the current schedule gives it",
    "Why this fixture clashes with the selected one (it can never share its round)",
)
CLASH_COLUMN = len(COLUMNS) - 1


class FixturesModel(ReadOnlyTable):
    """One row per fixture; the fixture's label is behind every cell of its row (UserRole)."""

    def __init__(self, parent: Any = None) -> None:
        super().__init__(COLUMNS, TIPS, parent)
        self.fixtures: list[Fixture] = []
        self.pins: dict[str, int | None] = {}
        self.tied: dict[str, list[str]] = {}
        self.rounds: dict[str, int] = {}
        self.clashes: dict[str, list[Reason]] = {}
        self.row_of: dict[str, int] = {}

    def set_fixtures(self, fixtures: list[Fixture], pins: dict[str, int | None],
                     tied: dict[str, list[str]], rounds: dict[str, int]) -> None:
        """Every fixture, its pin with the edits (label -> round or None), the fixtures tied to
        it, and its round in the schedule (absent when there is none)."""
        self.beginResetModel()
        self.fixtures, self.pins, self.tied, self.rounds = list(fixtures), pins, tied, rounds
        self.row_of = {f.label: r for r, f in enumerate(self.fixtures)}
        self.endResetModel()

    def set_clashes(self, clashes: dict[str, list[Reason]]) -> None:
        """Fixture label -> why it clashes with the selected fixture (the last column; the
        fixture's label is bold when it clashes)."""
        self.clashes = clashes
        self.changed_column(0)
        self.changed_column(CLASH_COLUMN)

    def label(self, row: int) -> str | None:
        return self.fixtures[row].label if 0 <= row < len(self.fixtures) else None

    def row_count(self) -> int:
        return len(self.fixtures)

    def text(self, f: Fixture, column: int) -> str:
        if column == 0:
            return f"{f.label}  (together)" if f.label in self.tied else f.label
        if column == 6:
            pin = self.pins.get(f.label)
            return "" if pin is None else str(pin) + (" (played)" if f.played else "")
        if column == 7:
            return str(self.rounds[f.label]) if f.label in self.rounds else ""
        if column == CLASH_COLUMN:
            return "; ".join(str(r) for r in self.clashes.get(f.label, ()))
        return (f.home, f.away, f.venue, f.pitch, f.division)[column - 1] or ""

    def cell(self, row: int, column: int, role: int) -> Any:
        f = self.fixtures[row]
        if role == Role.DisplayRole:
            return self.text(f, column)
        if role == Role.ToolTipRole and column == 0 and f.label in self.tied:
            return "Together with " + ", ".join(self.tied[f.label])
        if role == Role.FontRole and column == 0 and f.label in self.clashes:
            return bold_font()
        if role == Role.UserRole:
            return f.label
        return None
