"""The chosen schedule as a grid of rounds against venues; drag a fixture to another round and
see at once whether the schedule still holds. Pin and tie from a fixture's menu."""

from __future__ import annotations

from PySide6.QtCore import QPoint, Qt, Signal
from PySide6.QtGui import QContextMenuEvent, QDrag, QMouseEvent
from PySide6.QtWidgets import (
    QAbstractItemView,
    QApplication,
    QLabel,
    QMenu,
    QTableView,
    QVBoxLayout,
    QWidget,
)

from leaguegrid.app import planning
from leaguegrid.core import wording
from leaguegrid.gui.chip_delegate import ChipDelegate, chip_at, chip_pixmap
from leaguegrid.gui.document import LeagueDocument
from leaguegrid.gui.pickers import ask_round, pick_tie_partner
from leaguegrid.gui.schedule_model import ScheduleGridModel, fixture_mime
from leaguegrid.scheduling.rules import Violation

NO_SCHEDULE = "No schedule yet: choose the rounds in the toolbar and draw one (Ctrl+D)."
SHOWN_PROBLEMS = 4  # problems named in the validity line


def validity_text(violations: list[Violation]) -> str:
    """One line: the schedule holds, or the first few things it breaks."""
    if not violations:
        return "✔ This schedule holds: no clash inside a round and every rule met."
    shown = "; ".join(str(v) for v in violations[:SHOWN_PROBLEMS])
    extra = len(violations) - SHOWN_PROBLEMS
    more = f" (and {extra} more)" if extra > 0 else ""
    return f"✘ This schedule breaks {wording.plural(len(violations), 'rule')}: {shown}{more}"


class ScheduleGrid(QTableView):
    """The grid: a click selects the fixture under it, a drag carries it to another cell (the
    drop goes to the model), a right-click opens its menu."""

    def __init__(self, view: ScheduleView) -> None:
        super().__init__()
        self.view = view
        self._press: QPoint | None = None
        self._pressed: str | None = None
        self.setObjectName("scheduleGrid")
        self.setAccessibleName("Schedule: rounds down, venues across")
        self.setEditTriggers(QAbstractItemView.EditTrigger.NoEditTriggers)
        self.setSelectionMode(QAbstractItemView.SelectionMode.NoSelection)
        self.setDragDropMode(QAbstractItemView.DragDropMode.DropOnly)
        self.setDefaultDropAction(Qt.DropAction.MoveAction)
        self.setAcceptDrops(True)
        self.setDropIndicatorShown(True)
        self.setItemDelegate(ChipDelegate(self))
        self.horizontalHeader().setStretchLastSection(True)

    def fixture_at(self, point: QPoint) -> str | None:
        """The fixture whose chip is under a point of the viewport."""
        index = self.indexAt(point)
        model = self.view.model
        if not index.isValid():
            return None
        labels = model.labels_at(index.row(), index.column())
        return chip_at(self.visualRect(index), labels, self.fontMetrics(), point)

    def mousePressEvent(self, event: QMouseEvent) -> None:  # noqa: N802
        point = event.position().toPoint()
        if event.button() == Qt.MouseButton.LeftButton:
            self._press, self._pressed = point, self.fixture_at(point)
            self.view.doc.select(self._pressed)
        super().mousePressEvent(event)

    def mouseMoveEvent(self, event: QMouseEvent) -> None:  # noqa: N802
        label = self._pressed
        if (label is None or self._press is None
                or not event.buttons() & Qt.MouseButton.LeftButton):
            return
        if ((event.position().toPoint() - self._press).manhattanLength()
                < QApplication.startDragDistance()):
            return
        self._press = self._pressed = None
        drag = QDrag(self)
        drag.setMimeData(fixture_mime(label))
        drag.setPixmap(chip_pixmap(self, self.view.model, label))
        drag.exec(Qt.DropAction.MoveAction)

    def contextMenuEvent(self, event: QContextMenuEvent) -> None:  # noqa: N802
        label = self.fixture_at(event.pos())
        if label is not None:
            self.view.fixture_menu(label, event.globalPos())


class ScheduleView(QWidget):
    """Rows are rounds (with dates or times when known), columns are venues (pitches apart)."""

    moveRequested = Signal(str, int)
    pinRequested = Signal(str, object)
    tieRequested = Signal(str, str)

    def __init__(self, doc: LeagueDocument, parent: QWidget | None = None) -> None:
        super().__init__(parent)
        self.doc = doc
        self.info = QLabel(NO_SCHEDULE)
        self.info.setWordWrap(True)
        self.info.setTextInteractionFlags(Qt.TextInteractionFlag.TextSelectableByMouse)
        self.status = QLabel("")
        self.status.setObjectName("validityMessage")
        self.status.setWordWrap(True)
        self.status.setTextInteractionFlags(Qt.TextInteractionFlag.TextSelectableByMouse)
        self.model = ScheduleGridModel(self)
        self.model.moveRequested.connect(self.moveRequested)
        self.grid = ScheduleGrid(self)
        self.grid.setModel(self.model)
        self.violations: list[Violation] = []
        layout = QVBoxLayout(self)
        layout.addWidget(self.info)
        layout.addWidget(self.status)
        layout.addWidget(self.grid, 1)
        doc.selectionChanged.connect(self._selection_changed)
        doc.scheduleChanged.connect(self.refresh)
        doc.loaded.connect(self.refresh)

    def _selection_changed(self, label: str | None) -> None:
        self.model.set_selection(label, self.doc.clashes_of(label) if label else {})

    def refresh(self, message: str | None = None) -> None:
        """Lay out the document's schedule and check it."""
        schedule, league = self.doc.schedule, self.doc.working_league()
        if schedule is None or league is None:
            self.violations = []
            self.model.set_schedule([], None, [], {}, [])
            self.info.setText(message or NO_SCHEDULE)
            self.status.setText("")
            return
        graph = self.doc.graph
        self.violations = [] if graph is None else \
            planning.schedule_problems(league, graph, schedule)
        pins = {f.label: self.doc.pin_of(f.label) for f in league.fixtures}
        self.model.set_schedule(league.fixtures, schedule,
                                planning.round_titles(league, schedule.rounds), pins,
                                self.violations)
        self._selection_changed(self.doc.selected)
        self.grid.resizeColumnsToContents()
        self.grid.resizeRowsToContents()
        self.grid.horizontalHeader().setStretchLastSection(True)
        self.info.setText(message or wording.schedule_summary(schedule))
        self.status.setText(validity_text(self.violations))

    def fixture_menu(self, label: str, where: QPoint) -> None:
        round_ = self.model.round_of[label]
        menu = QMenu(self)
        pin = menu.addAction(f"Pin to round {round_}")
        unpin = menu.addAction("Unpin")
        unpin.setEnabled(self.doc.pin_of(label) is not None)
        tie = menu.addAction("Play together with…")
        move = menu.addAction("Move to round…")
        chosen = menu.exec(where)
        if chosen is pin:
            self.pinRequested.emit(label, round_)
        elif chosen is unpin:
            self.pinRequested.emit(label, None)
        elif chosen is tie:
            labels = sorted((x for x in self.model.labels() if x != label), key=str.casefold)
            other = pick_tie_partner(self, label, labels)
            if other:
                self.tieRequested.emit(label, other)
        elif chosen is move and self.doc.schedule is not None:
            k = ask_round(self, "Move fixture", label, round_, self.doc.schedule.rounds)
            if k is not None:
                self.moveRequested.emit(label, k)
