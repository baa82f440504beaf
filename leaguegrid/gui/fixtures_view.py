"""The fixtures as read, with their pins, ties and rounds; pin and tie from here."""

from __future__ import annotations

from PySide6.QtCore import QPoint, Qt, Signal
from PySide6.QtWidgets import QHeaderView, QLabel, QMenu, QVBoxLayout, QWidget

from leaguegrid.gui.document import LeagueDocument
from leaguegrid.gui.fixtures_model import FixturesModel
from leaguegrid.gui.pickers import ask_round, pick_tie_partner
from leaguegrid.gui.table_model import row_view, selected_row


class FixturesView(QWidget):
    """One row per fixture; selecting a row selects the fixture in every view."""

    pinRequested = Signal(str, object)  # label, round or None
    tieRequested = Signal(str, str)

    def __init__(self, doc: LeagueDocument, parent: QWidget | None = None) -> None:
        super().__init__(parent)
        self.doc = doc
        self.note = QLabel("Right-click a fixture to pin it to a round or to play it together "
                           "with another.")
        self.model = FixturesModel(self)
        self.table = row_view("fixturesTable", self.model, "Fixtures")
        self.table.horizontalHeader().setSectionResizeMode(
            QHeaderView.ResizeMode.ResizeToContents)
        self.table.horizontalHeader().setStretchLastSection(True)
        self.table.setContextMenuPolicy(Qt.ContextMenuPolicy.CustomContextMenu)
        self.table.customContextMenuRequested.connect(self._menu)
        self.table.selectionModel().selectionChanged.connect(self._picked)
        self._syncing = False
        layout = QVBoxLayout(self)
        layout.addWidget(self.note)
        layout.addWidget(self.table)
        doc.selectionChanged.connect(self._show_selection)
        doc.scheduleChanged.connect(self.refresh)
        doc.graphChanged.connect(self._graph_changed)

    @property
    def rows(self) -> dict[str, int]:
        """Fixture label -> its row in the table."""
        return self.model.row_of

    def refresh(self) -> None:
        league = self.doc.league
        fixtures = league.fixtures if league is not None else []
        schedule = self.doc.schedule
        tied: dict[str, list[str]] = {}
        for a, b in [(t.first, t.second) for t in (league.ties if league else [])] + \
                list(self.doc.edits.ties):
            tied.setdefault(a, []).append(b)
            tied.setdefault(b, []).append(a)
        pins = {f.label: self.doc.pin_of(f.label) for f in fixtures}
        rounds = dict(schedule.assignment) if schedule is not None else {}
        self._syncing = True
        self.model.set_fixtures(fixtures, pins, tied, rounds)
        self._syncing = False
        self._show_selection(self.doc.selected)

    def _graph_changed(self) -> None:
        self._show_selection(self.doc.selected)

    def _picked(self) -> None:
        if self._syncing:  # the selection follows the document; it is not a new pick
            return
        row = selected_row(self.table)
        self.doc.select(None if row is None else self.model.label(row))

    def _show_selection(self, label: str | None) -> None:
        self.model.set_clashes(self.doc.clashes_of(label) if label else {})
        if label in self.rows:
            row = self.rows[label]
            if selected_row(self.table) != row:
                self._syncing = True
                self.table.selectRow(row)
                self._syncing = False
            self.table.scrollTo(self.model.index(row, 0))

    def _menu(self, pos: QPoint) -> None:
        index = self.table.indexAt(pos)
        if not index.isValid():
            return
        label = self.model.label(index.row())
        if label is None:
            return
        menu = QMenu(self)
        pin_action = menu.addAction("Pin to a round…")
        unpin_action = menu.addAction("Unpin")
        unpin_action.setEnabled(self.doc.pin_of(label) is not None)
        tie_action = menu.addAction("Play together with…")
        chosen = menu.exec(self.table.viewport().mapToGlobal(pos))
        if chosen is pin_action:
            k = ask_round(self, "Pin fixture", label, self.doc.pin_of(label) or 1)
            if k is not None:
                self.pinRequested.emit(label, k)
        elif chosen is unpin_action:
            self.pinRequested.emit(label, None)
        elif chosen is tie_action:
            other = pick_tie_partner(self, label, [lbl for lbl in self.rows if lbl != label])
            if other:
                self.tieRequested.emit(label, other)
