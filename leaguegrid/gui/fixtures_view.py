"""The fixtures as read, with their pins, ties and rounds; pin and tie from here."""

from __future__ import annotations

from PySide6.QtCore import QPoint, Qt, Signal
from PySide6.QtWidgets import QHeaderView, QLabel, QMenu, QVBoxLayout, QWidget

from leaguegrid.gui.document import LeagueDocument
from leaguegrid.gui.pickers import ask_round, pick_tie_partner
from leaguegrid.gui.table_model import Cell, RowsModel, row_view, selected_row

COLUMNS = ("Fixture", "Home", "Away", "Venue", "Pitch", "Division", "Pinned round",
           "Round in schedule", "Clash with selected")


class FixturesView(QWidget):
    """One row per fixture; selecting a row selects the fixture in every view."""

    pinRequested = Signal(str, object)  # label, round or None
    tieRequested = Signal(str, str)

    def __init__(self, doc: LeagueDocument, parent: QWidget | None = None) -> None:
        super().__init__(parent)
        self.doc = doc
        self.note = QLabel("Right-click a fixture to pin it to a round or tie it to another.")
        self.model = RowsModel(COLUMNS, parent=self)
        self.table = row_view("fixturesTable", self.model)
        self.table.horizontalHeader().setSectionResizeMode(
            QHeaderView.ResizeMode.ResizeToContents)
        self.table.horizontalHeader().setStretchLastSection(True)
        self.table.setContextMenuPolicy(Qt.ContextMenuPolicy.CustomContextMenu)
        self.table.customContextMenuRequested.connect(self._menu)
        self.table.selectionModel().selectionChanged.connect(self._picked)
        self.rows: dict[str, int] = {}
        self._syncing = False
        layout = QVBoxLayout(self)
        layout.addWidget(self.note)
        layout.addWidget(self.table)
        doc.selectionChanged.connect(self._show_selection)
        doc.scheduleChanged.connect(self.refresh)
        doc.graphChanged.connect(self._graph_changed)

    def refresh(self) -> None:
        league = self.doc.league
        fixtures = league.fixtures if league is not None else []
        schedule = self.doc.schedule
        tied: dict[str, list[str]] = {}
        for a, b in [(t.first, t.second) for t in (league.ties if league else [])] + \
                list(self.doc.edits.ties):
            tied.setdefault(a, []).append(b)
            tied.setdefault(b, []).append(a)
        self.rows = {}
        rows = []
        for r, f in enumerate(fixtures):
            self.rows[f.label] = r
            pin = self.doc.pin_of(f.label)
            in_schedule = schedule.assignment.get(f.label) if schedule is not None else None
            first = Cell(f"{f.label}  (tied)" if f.label in tied else f.label,
                         tip="Tied with " + ", ".join(tied[f.label]) if f.label in tied else None,
                         value=f.label)
            rest = (f.home, f.away, f.venue, f.pitch, f.division,
                    "" if pin is None else str(pin) + (" (played)" if f.played else ""),
                    "" if in_schedule is None else str(in_schedule), "")
            rows.append([first, *(Cell(value or "") for value in rest)])
        self._syncing = True
        self.model.set_rows(rows)
        self._syncing = False
        self._show_selection(self.doc.selected)

    def _graph_changed(self) -> None:
        self._show_selection(self.doc.selected)

    def _label_at(self, row: int) -> str | None:
        return self.model.cell(row, 0).value if 0 <= row < self.model.rowCount() else None

    def _picked(self) -> None:
        if self._syncing:  # the selection follows the document; it is not a new pick
            return
        row = selected_row(self.table)
        self.doc.select(None if row is None else self._label_at(row))

    def _show_selection(self, label: str | None) -> None:
        clashes = self.doc.clashes_of(label) if label else {}
        last = len(COLUMNS) - 1
        for f_label, r in self.rows.items():
            reasons = clashes.get(f_label)
            self.model.update_cell(r, last, text="; ".join(str(x) for x in reasons)
                                   if reasons else "")
            self.model.update_cell(r, 0, bold=reasons is not None)
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
        label = self._label_at(index.row())
        if label is None:
            return
        menu = QMenu(self)
        pin_action = menu.addAction("Pin to a round…")
        unpin_action = menu.addAction("Unpin")
        unpin_action.setEnabled(self.doc.pin_of(label) is not None)
        tie_action = menu.addAction("Tie with…")
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
