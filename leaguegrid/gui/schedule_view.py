"""The chosen schedule as a grid of rounds against venues; drag a fixture to another round and
see at once whether the schedule still holds. Pin and tie from a fixture's menu."""

from __future__ import annotations

from typing import Any

from PySide6.QtCore import QMimeData, QPoint, Qt, Signal
from PySide6.QtGui import QColor, QDrag, QPalette
from PySide6.QtWidgets import (
    QAbstractItemView,
    QLabel,
    QMenu,
    QTableWidget,
    QVBoxLayout,
    QWidget,
)

from leaguegrid.app import planning
from leaguegrid.core import wording
from leaguegrid.gui import palette
from leaguegrid.gui.document import LeagueDocument
from leaguegrid.gui.pickers import ask_round, pick_tie_partner

MIME = "application/x-leaguegrid-fixture"
NO_VENUE = "(no venue)"


class Chip(QLabel):
    """One fixture in the grid: click selects it, drag moves it, right-click pins or ties it."""

    def __init__(self, view: ScheduleView, label: str, round_: int) -> None:
        super().__init__(label)
        self.view, self.label, self.round = view, label, round_
        self.setObjectName("fixtureChip")
        self.setCursor(Qt.CursorShape.OpenHandCursor)
        self._press: QPoint | None = None

    def mousePressEvent(self, event) -> None:  # noqa: N802
        if event.button() == Qt.MouseButton.LeftButton:
            self._press = event.position().toPoint()
            self.view.doc.select(self.label)
        super().mousePressEvent(event)

    def mouseMoveEvent(self, event) -> None:  # noqa: N802
        if self._press is None or not event.buttons() & Qt.MouseButton.LeftButton:
            return
        if (event.position().toPoint() - self._press).manhattanLength() < 6:
            return
        drag = QDrag(self)
        data = QMimeData()
        data.setData(MIME, self.label.encode("utf-8"))
        data.setText(self.label)
        drag.setMimeData(data)
        drag.setPixmap(self.grab())
        self._press = None
        drag.exec(Qt.DropAction.MoveAction)

    def contextMenuEvent(self, event) -> None:  # noqa: N802
        self.view.fixture_menu(self.label, self.round, event.globalPos())


class Cell(QWidget):
    """A round x venue cell: holds chips and accepts dropped fixtures (moving their round)."""

    def __init__(self, view: ScheduleView, round_: int) -> None:
        super().__init__()
        self.view, self.round = view, round_
        self.setAcceptDrops(True)
        self.box = QVBoxLayout(self)
        self.box.setContentsMargins(2, 2, 2, 2)
        self.box.setSpacing(2)

    def dragEnterEvent(self, event) -> None:  # noqa: N802
        if event.mimeData().hasFormat(MIME):
            event.acceptProposedAction()

    def dropEvent(self, event) -> None:  # noqa: N802
        label = bytes(event.mimeData().data(MIME)).decode("utf-8")
        event.acceptProposedAction()
        self.view.moveRequested.emit(label, self.round)


class ScheduleView(QWidget):
    """Rows are rounds (with dates or times when known), columns are venues (pitches apart)."""

    moveRequested = Signal(str, int)
    pinRequested = Signal(str, object)
    tieRequested = Signal(str, str)

    def __init__(self, doc: LeagueDocument, parent: QWidget | None = None) -> None:
        super().__init__(parent)
        self.doc = doc
        self.info = QLabel("No schedule yet: choose the rounds in the toolbar and draw one "
                           "(Ctrl+D).")
        self.info.setWordWrap(True)
        self.info.setTextInteractionFlags(Qt.TextInteractionFlag.TextSelectableByMouse)
        self.status = QLabel("")
        self.status.setObjectName("validityMessage")
        self.status.setWordWrap(True)
        self.status.setTextInteractionFlags(Qt.TextInteractionFlag.TextSelectableByMouse)
        self.grid = QTableWidget(0, 0)
        self.grid.setObjectName("scheduleGrid")
        self.grid.setEditTriggers(QAbstractItemView.EditTrigger.NoEditTriggers)
        self.grid.setSelectionMode(QAbstractItemView.SelectionMode.NoSelection)
        self.chips: dict[str, Chip] = {}
        self.violations: list[Any] = []
        layout = QVBoxLayout(self)
        layout.addWidget(self.info)
        layout.addWidget(self.status)
        layout.addWidget(self.grid, 1)
        doc.selectionChanged.connect(self._selection_changed)
        doc.scheduleChanged.connect(self.refresh)
        doc.loaded.connect(self.refresh)

    def _selection_changed(self, _label: object) -> None:
        self._paint_chips()

    @staticmethod
    def venue_key(fixture: Any) -> str:
        if not fixture.venue:
            return NO_VENUE
        return f"{fixture.venue} · {fixture.pitch}" if fixture.pitch else fixture.venue

    def refresh(self, message: str | None = None) -> None:
        """Rebuild the grid from the document's schedule and check it."""
        schedule, league = self.doc.schedule, self.doc.working_league()
        self.chips = {}
        self.grid.clear()
        if schedule is None or league is None:
            self.grid.setRowCount(0)
            self.grid.setColumnCount(0)
            self.violations = []
            self.info.setText(message or "No schedule yet: choose the rounds in the toolbar and "
                              "draw one (Ctrl+D).")
            self.status.setText("")
            return
        fixtures = {f.label: f for f in league.fixtures}
        venues = sorted({self.venue_key(f) for f in league.fixtures},
                        key=lambda v: (v == NO_VENUE, v.casefold()))
        column = {v: i for i, v in enumerate(venues)}
        k = schedule.rounds
        self.grid.setColumnCount(len(venues))
        self.grid.setRowCount(k)
        self.grid.setHorizontalHeaderLabels(venues)
        self.grid.setVerticalHeaderLabels(planning.round_titles(league, k))
        cells = [[Cell(self, r + 1) for _c in venues] for r in range(k)]
        for label, r in sorted(schedule.assignment.items(), key=lambda kv: kv[0].casefold()):
            f = fixtures.get(label)
            if f is None or not 1 <= r <= k:
                continue
            chip = Chip(self, label, r)
            cells[r - 1][column[self.venue_key(f)]].box.addWidget(chip)
            self.chips[label] = chip
        for r in range(k):
            for c in range(len(venues)):
                cells[r][c].box.addStretch(1)
                self.grid.setCellWidget(r, c, cells[r][c])
        self.grid.horizontalHeader().setStretchLastSection(True)
        self.violations = planning.schedule_problems(league, self.doc.graph, schedule) \
            if self.doc.graph is not None else []
        self.info.setText(message or wording.schedule_summary(schedule))
        self.status.setText(self.validity_text())
        self._paint_chips()
        self._fit_cells(cells)

    def _fit_cells(self, cells: list[list[Cell]]) -> None:
        """Rows and columns as large as the chips they hold (cell widgets are not measured by
        the table itself)."""
        for c in range(self.grid.columnCount()):
            width = max((cells[r][c].sizeHint().width() for r in range(len(cells))), default=0)
            header = self.grid.horizontalHeader().sectionSizeHint(c)
            self.grid.setColumnWidth(c, max(width, header) + 6)
        for r, row in enumerate(cells):
            self.grid.setRowHeight(r, max((cell.sizeHint().height() for cell in row),
                                          default=24) + 4)

    def validity_text(self) -> str:
        """One line: the schedule holds, or the first few things it breaks."""
        if not self.violations:
            return "✔ This schedule holds: no clash inside a round and every rule met."
        shown = "; ".join(str(v) for v in self.violations[:4])
        more = f" (and {len(self.violations) - 4} more)" if len(self.violations) > 4 else ""
        return f"✘ This schedule breaks {len(self.violations)} rule(s): {shown}{more}"

    def _paint_chips(self) -> None:
        pal = self.palette()
        selected = self.doc.selected
        near = set(self.doc.clashes_of(selected)) if selected else set()
        broken: dict[str, list[str]] = {}
        for v in self.violations:
            for label in getattr(v, "fixtures", ()):
                broken.setdefault(label, []).append(str(v))
        text_colour = pal.color(QPalette.ColorRole.Text).name()
        highlight = pal.color(QPalette.ColorRole.Highlight).name()
        for label, chip in self.chips.items():
            fill = palette.round_colour(chip.round, pal).name()
            pin = self.doc.pin_of(label)
            text = label + (f"  [pinned {pin}]" if pin is not None else "")
            chip.setText(("⚠ " + text) if label in broken else text)
            if label == selected:
                border = f"3px solid {highlight}"
            elif label in broken:
                border = f"2px solid {palette.conflict_colour(pal).name()}"
            elif label in near:
                border = f"2px dashed {highlight}"
            else:
                border = f"1px solid {pal.color(QPalette.ColorRole.Mid).name()}"
            chip.setStyleSheet(f"QLabel {{ background-color: {fill}; color: {text_colour}; "
                               f"border: {border}; border-radius: 3px; padding: 2px; }}")
            tip = [label, f"round {chip.round}"]
            tip += broken.get(label, [])
            if label in near:
                tip.append("clashes with the selected fixture: " +
                           "; ".join(str(r) for r in self.doc.clashes_of(selected)[label]))
            chip.setToolTip("\n".join(tip))

    def fixture_menu(self, label: str, round_: int, where: QPoint) -> None:
        menu = QMenu(self)
        pin = menu.addAction(f"Pin to round {round_}")
        unpin = menu.addAction("Unpin")
        unpin.setEnabled(self.doc.pin_of(label) is not None)
        tie = menu.addAction("Tie with…")
        move = menu.addAction("Move to round…")
        chosen = menu.exec(where)
        if chosen is pin:
            self.pinRequested.emit(label, round_)
        elif chosen is unpin:
            self.pinRequested.emit(label, None)
        elif chosen is tie:
            labels = sorted((x for x in self.chips if x != label), key=str.casefold)
            other = pick_tie_partner(self, label, labels)
            if other:
                self.tieRequested.emit(label, other)
        elif chosen is move and self.doc.schedule is not None:
            k = ask_round(self, "Move fixture", label, round_, self.doc.schedule.rounds)
            if k is not None:
                self.moveRequested.emit(label, k)

    def chip_colour(self, label: str) -> QColor:
        """The fill of a fixture's chip: its round's colour."""
        return palette.round_colour(self.chips[label].round, self.palette())
