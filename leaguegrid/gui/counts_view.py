"""The counts view: a table per round count, the log-scale plot, and the polynomial (copyable)."""

from __future__ import annotations

from typing import Any

from PySide6.QtCore import Qt, Signal
from PySide6.QtGui import QGuiApplication
from PySide6.QtWidgets import (
    QHBoxLayout,
    QHeaderView,
    QLabel,
    QPlainTextEdit,
    QPushButton,
    QSplitter,
    QVBoxLayout,
    QWidget,
)

from leaguegrid.app.counting import CountReport
from leaguegrid.core import wording
from leaguegrid.gui.count_plot import CountPlot, PlotPoint
from leaguegrid.gui.counts_model import CountsModel
from leaguegrid.gui.table_model import row_view, selected_row


class CountsView(QWidget):
    """Shows one count report; emits roundsChosen(K) when a row is picked."""

    roundsChosen = Signal(int)

    def __init__(self, parent: QWidget | None = None) -> None:
        super().__init__(parent)
        self.report: CountReport | None = None
        self.summary = QLabel("Open a league and compute its counts (Ctrl+R).")
        self.summary.setWordWrap(True)
        self.summary.setTextInteractionFlags(Qt.TextInteractionFlag.TextSelectableByMouse)
        self.model = CountsModel(self)
        self.table = row_view("countsTable", self.model, "Counts by number of rounds")
        self.table.verticalHeader().setVisible(False)
        self.table.horizontalHeader().setSectionResizeMode(QHeaderView.ResizeMode.Stretch)
        self.table.horizontalHeader().setSectionResizeMode(
            0, QHeaderView.ResizeMode.ResizeToContents)
        self.table.selectionModel().selectionChanged.connect(self._row_picked)
        self.plot = CountPlot()
        self.polynomial = QPlainTextEdit()
        self.polynomial.setAccessibleName("Chromatic polynomial")
        self.polynomial.setObjectName("polynomialText")
        self.polynomial.setReadOnly(True)
        self.polynomial.setMaximumHeight(90)
        self.polynomial.setPlaceholderText("The chromatic polynomial P(k) of the clash graph")
        self.copy_button = QPushButton("Copy polynomial")
        self.copy_button.clicked.connect(self.copy_polynomial)
        self.copy_button.setEnabled(False)

        poly_row = QHBoxLayout()
        poly_label = QLabel("P(k) =")
        poly_row.addWidget(poly_label, 0, Qt.AlignmentFlag.AlignTop)
        poly_row.addWidget(self.polynomial, 1)
        poly_row.addWidget(self.copy_button, 0, Qt.AlignmentFlag.AlignTop)
        top = QWidget()
        top_layout = QVBoxLayout(top)
        top_layout.setContentsMargins(0, 0, 0, 0)
        top_layout.addWidget(self.summary)
        top_layout.addWidget(self.table, 1)
        top_layout.addLayout(poly_row)
        split = QSplitter(Qt.Orientation.Vertical)
        split.addWidget(top)
        split.addWidget(self.plot)
        split.setStretchFactor(0, 3)
        split.setStretchFactor(1, 2)
        layout = QVBoxLayout(self)
        layout.addWidget(split)

    def clear(self, message: str = "") -> None:
        self.report = None
        self.model.set_report(None)
        self.polynomial.setPlainText("")
        self.copy_button.setEnabled(False)
        self.plot.set_data([], None)
        self.summary.setText(message or "No counts yet.")

    def show_report(self, report: CountReport, rules_note: str = "") -> None:
        """Fill the table, plot and polynomial from a count report."""
        self.report = report
        self.summary.setText(self._summary_text(report, rules_note))
        self.model.set_report(report)
        text = report.polynomial_text
        self.polynomial.setPlainText(text if text else wording.NOT_COMPUTED)
        self.copy_button.setEnabled(bool(text))
        self.plot.set_data([PlotPoint(row.rounds, row.assignments) for row in report.rows],
                           report.min_rounds)

    def values(self) -> list[dict[str, Any]]:
        """The values behind the table (exact ints, estimates or None), row by row."""
        return self.model.values()

    def copy_polynomial(self) -> None:
        if self.report is not None and self.report.polynomial_text:
            QGuiApplication.clipboard().setText(f"P(k) = {self.report.polynomial_text}")

    def _summary_text(self, report: CountReport, rules_note: str) -> str:
        low, high = report.min_rounds_bounds
        if report.min_rounds is not None:
            fewest = f"fewest rounds <b>{report.min_rounds}</b>"
        else:
            fewest = f"fewest rounds between {low} and {high} (not settled)"
        parts = [f"{wording.plural(report.fixtures, 'fixture')}, "
                 f"{wording.plural(report.clashes, 'clash', 'clashes')}, {fewest}."]
        if report.pinned:
            parts.append("Pins, Together and blocked rounds are respected in the schedules; the "
                         "polynomial and the groupings describe the clash graph itself and "
                         "ignore pins, so groupings can exceed schedules.")
        if report.cancelled:
            parts.append("Stopped before the end: what was not finished shows as "
                         f"“{wording.NOT_COMPUTED}”.")
        elif not report.complete:
            parts.append("Not everything finished in time: what is missing shows as "
                         f"“{wording.NOT_COMPUTED}” or as a labelled estimate.")
        parts += list(report.notes)
        if rules_note:
            parts.append(rules_note)
        return " ".join(parts)

    def _row_picked(self) -> None:
        row = selected_row(self.table)
        if row is not None and self.report is not None and row < len(self.report.rows):
            self.roundsChosen.emit(self.report.rows[row].rounds)
