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

from leaguegrid.core import wording
from leaguegrid.gui.count_plot import CountPlot, PlotPoint
from leaguegrid.gui.table_model import RIGHT, Cell, RowsModel, row_view, selected_row

COLUMNS = ("Rounds", "Assignments", "All rounds used", "Groupings")
FIELDS = ("rounds", "assignments", "all_rounds_used", "groupings")
HEADER_TIPS = (
    "K, the number of rounds available",
    "Ways to give every fixture a round in 1..K with no clash inside a round (pins respected; "
    "rounds may stay empty)",
    "Assignments in which every one of the K rounds holds a fixture",
    "Ways to split the fixtures into exactly K non-empty clash-free rounds, the order of the "
    "rounds not mattering (clash graph without pins)",
)


class CountsView(QWidget):
    """Shows one count report; emits roundsChosen(K) when a row is picked."""

    roundsChosen = Signal(int)

    def __init__(self, parent: QWidget | None = None) -> None:
        super().__init__(parent)
        self.report: Any = None
        self.summary = QLabel("Open a league and compute its counts (Ctrl+R).")
        self.summary.setWordWrap(True)
        self.summary.setTextInteractionFlags(Qt.TextInteractionFlag.TextSelectableByMouse)
        self.model = RowsModel(COLUMNS, HEADER_TIPS, parent=self)
        self.table = row_view("countsTable", self.model)
        self.table.verticalHeader().setVisible(False)
        self.table.horizontalHeader().setSectionResizeMode(QHeaderView.ResizeMode.Stretch)
        self.table.horizontalHeader().setSectionResizeMode(
            0, QHeaderView.ResizeMode.ResizeToContents)
        self.table.selectionModel().selectionChanged.connect(self._row_picked)
        self.plot = CountPlot()
        self.polynomial = QPlainTextEdit()
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
        self.model.set_rows([])
        self.polynomial.setPlainText("")
        self.copy_button.setEnabled(False)
        self.plot.set_data([], None)
        self.summary.setText(message or "No counts yet.")

    def show_report(self, report: Any, rules_note: str = "") -> None:
        """Fill the table, plot and polynomial from an analysis CountReport."""
        self.report = report
        self.summary.setText(self._summary_text(report, rules_note))
        self.model.set_rows([self._cells(report, row) for row in report.rows])
        text = report.polynomial_text
        self.polynomial.setPlainText(text if text else "not computed")
        self.copy_button.setEnabled(bool(text))
        self.plot.set_data([PlotPoint(row.rounds, row.assignments) for row in report.rows],
                           report.min_rounds)

    @staticmethod
    def _cells(report: Any, row: Any) -> list[Cell]:
        """One row of the table: K, then each count as the wording module writes it (the
        exact digits in the tooltip)."""
        k = row.rounds
        fewest = report.min_rounds == k
        first = Cell(str(k), tip=f"{k} rounds: the fewest that can work" if fewest
                     else f"{k} rounds", bold=fewest, align=RIGHT, value=k)
        return [first, *(Cell(wording.cell_text(v), tip=wording.full_text(v), align=RIGHT,
                               value=v) for v in (getattr(row, name) for name in FIELDS[1:]))]

    def values(self) -> list[dict[str, Any]]:
        """The values behind the table (exact ints, estimates or None), row by row."""
        if self.report is None:
            return []
        return [{name: getattr(row, name) for name in FIELDS} for row in self.report.rows]

    def copy_polynomial(self) -> None:
        if self.report is not None and self.report.polynomial_text:
            QGuiApplication.clipboard().setText(f"P(k) = {self.report.polynomial_text}")

    def _summary_text(self, report: Any, rules_note: str) -> str:
        low, high = report.min_rounds_bounds
        if report.min_rounds is not None:
            fewest = f"fewest rounds <b>{report.min_rounds}</b>"
        else:
            fewest = f"fewest rounds between {low} and {high} (not settled)"
        parts = [f"{report.fixtures} fixtures, {report.clashes} clashes, {fewest}."]
        if report.pinned:
            parts.append("Pins, ties and blocked rounds are respected in the assignments; the "
                         "polynomial and the groupings describe the clash graph itself.")
        if getattr(report, "cancelled", False):
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
