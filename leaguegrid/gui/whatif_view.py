"""What-if on clashes: the clash reasons ranked by what waiving each would gain, with
"waive this clash" and "add a clash" acting on a copy of the league (undoable)."""

from __future__ import annotations

from PySide6.QtCore import Signal
from PySide6.QtWidgets import (
    QHBoxLayout,
    QHeaderView,
    QLabel,
    QPushButton,
    QVBoxLayout,
    QWidget,
)

from leaguegrid.core import wording
from leaguegrid.core.model import Reason
from leaguegrid.gui.document import LeagueDocument
from leaguegrid.gui.pickers import pick_clash_partner, pick_pair
from leaguegrid.gui.reasons_model import ReasonsModel
from leaguegrid.gui.table_model import row_view, selected_row
from leaguegrid.scheduling.whatif import Waived, WhatIf


class WhatIfView(QWidget):
    """The ranked table; the buttons ask the window to waive or add (through the undo stack)."""

    waiveRequested = Signal(object, bool)  # Reason, waive (False = restore)
    addRequested = Signal(str, str)

    def __init__(self, doc: LeagueDocument, parent: QWidget | None = None) -> None:
        super().__init__(parent)
        self.doc = doc
        self.by_text: dict[str, Reason] = {}
        self.ranked_with = ""
        self.summary = QLabel("Rank the clash reasons (Ctrl+I) to see which ones cost the most "
                              "schedules. Waiving or adding a clash acts on a copy of the league: "
                              "the workbook is never changed, and Undo takes it back.")
        self.summary.setWordWrap(True)
        self.model = ReasonsModel(self)
        self.table = row_view("whatifTable", self.model, "Clash reasons ranked by schedules gained")
        self.table.horizontalHeader().setSectionResizeMode(QHeaderView.ResizeMode.ResizeToContents)
        self.table.horizontalHeader().setSectionResizeMode(0, QHeaderView.ResizeMode.Stretch)
        self.table.selectionModel().selectionChanged.connect(self._selection)
        self.waive_button = QPushButton("Waive this clash")
        self.waive_button.setEnabled(False)
        self.waive_button.clicked.connect(self._toggle)
        self.add_button = QPushButton("Add a clash…")
        self.add_button.clicked.connect(self._add)
        self.state = QLabel("")
        self.state.setWordWrap(True)
        buttons = QHBoxLayout()
        buttons.addWidget(self.waive_button)
        buttons.addWidget(self.add_button)
        buttons.addStretch(1)
        layout = QVBoxLayout(self)
        layout.addWidget(self.summary)
        layout.addWidget(self.table, 1)
        layout.addLayout(buttons)
        layout.addWidget(self.state)
        doc.edited.connect(self._show_state)
        doc.loaded.connect(self.clear)

    @property
    def rows(self) -> list[Waived]:
        """The reasons listed, in the table's order."""
        return self.model.rows

    def clear(self) -> None:
        self.model.set_rows([], set())
        self._show_state()

    def show_result(self, k: int, result: WhatIf, by_text: dict[str, Reason]) -> None:
        """Fill the table from the schedules' what-if result for K rounds; `by_text` maps each
        reason's text to its Reason. Reasons waived now are listed last, to restore them."""
        self.by_text = dict(by_text)
        self.ranked_with = self._edits_key()
        rows = list(result.reasons)
        listed = {row.reason for row in rows}
        for reason in self.doc.edits.waived:
            if str(reason) not in listed:
                self.by_text[str(reason)] = reason
                rows.append(Waived(str(reason), reason.kind, [], None, None, None))
        base = wording.cell_text(result.assignments)
        self.summary.setText(
            f"For {wording.plural(k, 'round')}: {base} valid schedules now, fewest rounds "
            f"{result.min_rounds}. "
            "Each row: the schedules if that reason were waived (every clash that exists only "
            "because of it removed) and how many times as many that is. Most gained first.")
        self.model.set_rows(rows, self._waived_texts())
        self._show_state()

    def _edits_key(self) -> str:
        edits = self.doc.edits
        return repr((sorted(edits.pins.items()), edits.ties, edits.waived, edits.added))

    def _waived_texts(self) -> set[str]:
        return {str(reason) for reason in self.doc.edits.waived}

    def current_reason(self) -> Reason | None:
        """The selected row's Reason (None when no row is selected)."""
        row = selected_row(self.table)
        return None if row is None else self.by_text.get(self.rows[row].reason)

    def _selection(self) -> None:
        reason = self.current_reason()
        self.waive_button.setEnabled(reason is not None)
        self.waive_button.setText("Restore this clash" if reason in self.doc.edits.waived
                                  else "Waive this clash")

    def _toggle(self) -> None:
        reason = self.current_reason()
        if reason is not None:
            self.waiveRequested.emit(reason, reason not in self.doc.edits.waived)

    def _add(self) -> None:
        league = self.doc.league
        if league is None:
            return
        pair = pick_pair(self, "Add a clash", [f.label for f in league.fixtures],
                         pick_clash_partner)
        if pair:
            self.addRequested.emit(*pair)

    def _show_state(self) -> None:
        edits = self.doc.edits
        parts = []
        if edits.waived:
            parts.append("Waived: " + "; ".join(str(r) for r in edits.waived) + ".")
        if edits.added:
            parts.append("Added clashes: " + "; ".join(f"{a} – {b}" for a, b in edits.added)
                         + ".")
        if self.rows and self.ranked_with != self._edits_key():
            parts.append("The ranking above was made before the latest change: rank again "
                         "(Ctrl+I) to update it.")
        self.state.setText(" ".join(parts) + (" The counts include these changes; the "
                                              "workbook is unchanged." if parts else ""))
        self.model.set_waived(self._waived_texts())
        self._selection()
