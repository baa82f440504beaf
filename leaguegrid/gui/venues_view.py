"""Each venue's rounds by date in the chosen schedule: rounds down, pitches across, the
fixtures in each cell (the venue pages of the printout, app.printout.venue_parts)."""

from __future__ import annotations

from typing import Any

from PySide6.QtCore import Qt
from PySide6.QtWidgets import QComboBox, QHBoxLayout, QHeaderView, QLabel, QVBoxLayout, QWidget

from leaguegrid.app.printout import Part, venue_parts
from leaguegrid.core import wording
from leaguegrid.gui.document import LeagueDocument
from leaguegrid.gui.table_model import ReadOnlyTable, Role, row_view
from leaguegrid.scheduling.dates import DatesError


class VenueGridModel(ReadOnlyTable):
    """One venue's grid: a row per round it is used in, a column per pitch."""

    def __init__(self, parent: Any = None) -> None:
        super().__init__((), parent=parent)
        self.rows: tuple[tuple[str, ...], ...] = ()

    def set_part(self, part: Part | None) -> None:
        self.beginResetModel()
        self.columns = list(part.table.columns) if part is not None else []
        self.rows = part.table.rows if part is not None else ()
        self.endResetModel()

    def row_count(self) -> int:
        return len(self.rows)

    def column_tip(self, column: int) -> str | None:
        return wording.venue_column_tip(self.columns[column])

    def cell(self, row: int, column: int, role: int) -> Any:
        if role in (Role.DisplayRole, Role.ToolTipRole, Role.AccessibleTextRole):
            return self.rows[row][column] or None
        if role == Role.TextAlignmentRole:
            return Qt.AlignmentFlag.AlignLeft | Qt.AlignmentFlag.AlignTop
        return None


class VenuesView(QWidget):
    """Pick a venue; its rounds by date and pitch are shown underneath."""

    def __init__(self, doc: LeagueDocument, parent: QWidget | None = None) -> None:
        super().__init__(parent)
        self.doc = doc
        self.parts: list[Part] = []
        self.note = QLabel(wording.NO_VENUES)
        self.note.setObjectName("venuesNote")
        self.note.setWordWrap(True)
        self.venue_box = QComboBox()
        self.venue_box.setObjectName("venueBox")
        self.venue_box.setAccessibleName("Venue")
        self.venue_box.currentIndexChanged.connect(self._show)
        pick = QLabel("&Venue:")
        pick.setBuddy(self.venue_box)
        self.model = VenueGridModel(self)
        self.table = row_view("venueTable", self.model, "The venue's rounds by date and pitch")
        self.table.verticalHeader().setVisible(False)
        self.table.horizontalHeader().setSectionResizeMode(
            QHeaderView.ResizeMode.ResizeToContents)
        self.table.horizontalHeader().setStretchLastSection(True)
        self.table.setWordWrap(True)
        self.count = QLabel("")
        self.count.setObjectName("venueCount")
        top = QHBoxLayout()
        top.addWidget(pick)
        top.addWidget(self.venue_box, 1)
        top.addWidget(self.count)
        layout = QVBoxLayout(self)
        layout.addWidget(self.note)
        layout.addLayout(top)
        layout.addWidget(self.table, 1)
        doc.scheduleChanged.connect(self.refresh)
        doc.loaded.connect(self.refresh)

    def refresh(self) -> None:
        """The venues of the document's schedule, keeping the venue shown."""
        keep = self.venue_box.currentText()
        schedule, league = self.doc.schedule, self.doc.league  # edits add no fixture
        message = wording.NO_VENUES
        self.parts = []
        if schedule is not None and league is not None:
            try:
                self.parts = venue_parts(league, schedule)
                message = ""
            except DatesError as problem:
                message = wording.sentence(str(problem))
        self.venue_box.blockSignals(True)
        self.venue_box.clear()
        self.venue_box.addItems([p.title for p in self.parts])
        at = self.venue_box.findText(keep)
        self.venue_box.setCurrentIndex(at if at >= 0 else 0)
        self.venue_box.blockSignals(False)
        self.note.setText(message)
        self.note.setVisible(bool(message))
        self._show()

    def _show(self, *_args: object) -> None:
        i = self.venue_box.currentIndex()
        part = self.parts[i] if 0 <= i < len(self.parts) else None
        self.model.set_part(part)
        self.count.setText("; ".join(part.lines) if part is not None else "")
        self.table.resizeRowsToContents()
