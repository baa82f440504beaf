"""The fixtures as read, with their pins, ties and rounds; pin and tie from here."""

from __future__ import annotations

from PySide6.QtCore import QPoint, Qt, Signal
from PySide6.QtWidgets import (
    QHeaderView,
    QLabel,
    QMenu,
    QTableWidgetItem,
    QVBoxLayout,
    QWidget,
)

from leaguegrid.gui.document import LeagueDocument
from leaguegrid.gui.pickers import ask_round, pick_tie_partner
from leaguegrid.gui.tables import row_table

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
        self.table = row_table("fixturesTable", COLUMNS)
        self.table.horizontalHeader().setSectionResizeMode(
            QHeaderView.ResizeMode.ResizeToContents)
        self.table.horizontalHeader().setStretchLastSection(True)
        self.table.setContextMenuPolicy(Qt.ContextMenuPolicy.CustomContextMenu)
        self.table.customContextMenuRequested.connect(self._menu)
        self.table.itemSelectionChanged.connect(self._picked)
        self.rows: dict[str, int] = {}
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
        self.table.blockSignals(True)
        self.table.setRowCount(len(fixtures))
        self.rows = {}
        for r, f in enumerate(fixtures):
            self.rows[f.label] = r
            pin = self.doc.pin_of(f.label)
            in_schedule = schedule.assignment.get(f.label) if schedule is not None else None
            values = (f.label, f.home, f.away, f.venue, f.pitch, f.division,
                      "" if pin is None else str(pin) + (" (played)" if f.played else ""),
                      "" if in_schedule is None else str(in_schedule), "")
            for c, value in enumerate(values):
                item = QTableWidgetItem(value or "")
                if c == 0:
                    item.setData(Qt.ItemDataRole.UserRole, f.label)
                    if f.label in tied:
                        item.setToolTip("Tied with " + ", ".join(tied[f.label]))
                        item.setText(f"{f.label}  (tied)")
                self.table.setItem(r, c, item)
        self.table.blockSignals(False)
        self._show_selection(self.doc.selected)

    def _graph_changed(self) -> None:
        self._show_selection(self.doc.selected)

    def _label_at(self, row: int) -> str | None:
        item = self.table.item(row, 0)
        return None if item is None else item.data(Qt.ItemDataRole.UserRole)

    def _picked(self) -> None:
        rows = self.table.selectionModel().selectedRows()
        self.doc.select(self._label_at(rows[0].row()) if rows else None)

    def _show_selection(self, label: str | None) -> None:
        clashes = self.doc.clashes_of(label) if label else {}
        last = len(COLUMNS) - 1
        for f_label, r in self.rows.items():
            item = self.table.item(r, last)
            if item is None:
                continue
            reasons = clashes.get(f_label)
            item.setText("; ".join(str(x) for x in reasons) if reasons else "")
            font = self.table.item(r, 0).font()
            font.setBold(reasons is not None)
            self.table.item(r, 0).setFont(font)
        if label in self.rows:
            row = self.rows[label]
            if not any(i.row() == row for i in self.table.selectionModel().selectedRows()):
                self.table.blockSignals(True)
                self.table.selectRow(row)
                self.table.blockSignals(False)
            self.table.scrollToItem(self.table.item(row, 0))

    def _menu(self, pos: QPoint) -> None:
        item = self.table.itemAt(pos)
        if item is None:
            return
        label = self._label_at(item.row())
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
