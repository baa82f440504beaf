"""The main window: the views in tabs, progress and Cancel in the status bar, wired to the
file, work and edit flows (each a module of its own) over leaguegrid.app's use cases."""

from __future__ import annotations

from pathlib import Path
from typing import Any

from PySide6.QtCore import QByteArray, QSettings, QTimer, Signal
from PySide6.QtGui import QCloseEvent, QDragEnterEvent, QDropEvent
from PySide6.QtWidgets import QMainWindow, QTabWidget, QWidget

from leaguegrid import __version__
from leaguegrid.core import wording
from leaguegrid.core.wording import CAUTION, failure_sentence
from leaguegrid.gui import icons, procworker, window_actions
from leaguegrid.gui.clash_view import ClashGraphView
from leaguegrid.gui.counts_view import CountsView
from leaguegrid.gui.document import LeagueDocument
from leaguegrid.gui.edit_flows import EditFlows
from leaguegrid.gui.file_flows import FileFlows
from leaguegrid.gui.fixtures_view import FixturesView
from leaguegrid.gui.help_view import GuideWindow
from leaguegrid.gui.import_view import ImportView
from leaguegrid.gui.notices import APP_NAME, inform, warn
from leaguegrid.gui.print_flows import PrintFlows
from leaguegrid.gui.recovery_flows import RecoveryFlows
from leaguegrid.gui.schedule_view import ScheduleView
from leaguegrid.gui.teams_view import TeamsView
from leaguegrid.gui.venues_view import VenuesView
from leaguegrid.gui.whatif_view import WhatIfView
from leaguegrid.gui.work_flows import WorkFlows
from leaguegrid.gui.workbook_flows import WorkbookFlows
from leaguegrid.gui.worker import Runner

OPENABLE = (".xlsx", ".csv", ".leaguegrid")


class MainWindow(FileFlows, WorkbookFlows, RecoveryFlows, WorkFlows, EditFlows, PrintFlows,
                 QMainWindow):
    """One league at a time; every long computation runs in the Runner's worker."""

    countsReady = Signal(object)
    scheduleReady = Signal(object)
    leagueOpened = Signal(str)

    def __init__(self, settings: QSettings | None = None, parent: QWidget | None = None) -> None:
        super().__init__(parent)
        self.settings = settings if settings is not None else QSettings()
        self.doc = LeagueDocument(self)
        self.runner = Runner(self)
        self.report: Any = None
        self.graph: Any = None
        self.last_error: str | None = None
        self.last_export: list[str] = []
        self._user_rounds = False
        self._draw_after_count: tuple | None = None  # a Draw asked for while counting
        self._discarding = False  # the coordinator chose to close without saving
        self.guide: GuideWindow | None = None
        self.setWindowIcon(icons.app_icon())
        self.setAcceptDrops(True)
        self._build_views()
        window_actions.build_actions(self)
        window_actions.build_menus(self)
        window_actions.build_toolbar(self)
        window_actions.build_status(self)
        self._fill_recent()
        self._connect()
        self._start_recovery()
        self._start_watching()
        self._recount = QTimer(self)
        self._recount.setSingleShot(True)
        self._recount.setInterval(300)
        self._recount.timeout.connect(self.compute_counts)
        self._restore_state()
        self._update_title()
        self._update_enabled()
        if self._engine_in_process():
            procworker.shared_worker().start()  # it imports while the user looks around

    def _build_views(self) -> None:
        self.tabs = QTabWidget()
        self.tabs.setDocumentMode(True)
        self.import_view = ImportView()
        self.fixtures_view = FixturesView(self.doc)
        self.clash_view = ClashGraphView(self.doc)
        self.counts_view = CountsView()
        self.schedule_view = ScheduleView(self.doc)
        self.whatif_view = WhatIfView(self.doc)
        self.teams_view = TeamsView(self.doc)
        self.venues_view = VenuesView(self.doc)
        for widget, title in ((self.import_view, "Workbook"), (self.fixtures_view, "Fixtures"),
                              (self.clash_view, "Clash graph"), (self.counts_view, "Counts"),
                              (self.schedule_view, "Schedule"), (self.whatif_view, "What-if"),
                              (self.teams_view, "Teams"), (self.venues_view, "Venues")):
            self.tabs.addTab(widget, title)
        self.setCentralWidget(self.tabs)

    def _connect(self) -> None:
        self.rounds_box.valueChanged.connect(self._rounds_edited)
        self.runner.busyChanged.connect(self._busy)
        self.runner.progressed.connect(self._progress)
        self.runner.failed.connect(self._failed)
        self.runner.cancelled.connect(self._cancelled)
        self.doc.edited.connect(self._edited)
        self.doc.loaded.connect(self._update_title)
        self.doc.undo.cleanChanged.connect(self._clean_changed)
        self.doc.scheduleChanged.connect(self._update_enabled)
        self.counts_view.roundsChosen.connect(self._rounds_from_table)
        self.schedule_view.moveRequested.connect(self.move_fixture)
        for view in (self.fixtures_view, self.schedule_view):
            view.pinRequested.connect(self.pin_fixture)
            view.tieRequested.connect(self.tie_fixtures)
        self.whatif_view.waiveRequested.connect(self.waive_reason)
        self.whatif_view.addRequested.connect(self.add_clash)

    # state ----------------------------------------------------------------------------------
    def _restore_state(self) -> None:
        geometry = self.settings.value("window/geometry")
        if isinstance(geometry, QByteArray):
            self.restoreGeometry(geometry)
        else:
            self.resize(1100, 760)
        state = self.settings.value("window/state")
        if isinstance(state, QByteArray):
            self.restoreState(state)
        tab = self.settings.value("window/tab", 0)
        self.tabs.setCurrentIndex(int(tab) if str(tab).isdigit() else 0)

    def closeEvent(self, event: QCloseEvent) -> None:  # noqa: N802
        if self.doc.unsaved and not self._discarding:
            event.ignore()  # asked first, in a box that does not block the window
            self.settle_unsaved(self._close_now, wording.unsaved_question("closing"))
            return
        self._end_recovery()
        self.settings.setValue("window/geometry", self.saveGeometry())
        self.settings.setValue("window/state", self.saveState())
        self.settings.setValue("window/tab", self.tabs.currentIndex())
        self.settings.sync()
        self.runner.cancel()
        self.runner.wait()
        super().closeEvent(event)

    def _close_now(self) -> None:
        """Close without asking again (the work was saved or the coordinator discarded it)."""
        self._discarding = True
        self.close()

    def _clean_changed(self, _clean: bool) -> None:
        self._update_title()

    def _update_title(self) -> None:
        name = self.doc.title_name() if self.doc.result is not None else None
        self.setWindowTitle(f"{APP_NAME} — {name}" if name else APP_NAME)

    def _update_enabled(self) -> None:
        usable = self.doc.usable
        has_schedule = self.doc.schedule is not None
        for act in (self.act_count, self.act_draw, self.act_uniform, self.act_best,
                    self.act_replan, self.act_whatif, self.act_save, self.act_save_as,
                    self.act_add_clash, self.act_tie, self.act_pin, self.act_unpin):
            act.setEnabled(usable)
        self.act_redraw.setEnabled(usable and has_schedule and self.doc.schedule.seed is not None)
        for act in (self.act_export, self.act_pdf, self.act_print):
            act.setEnabled(usable and has_schedule)
        self.act_reload.setEnabled(self.doc.path is not None)
        self.act_mapping.setEnabled(self.doc.path is not None)

    def _edited(self) -> None:
        self._update_title()
        self.fixtures_view.refresh()
        self.schedule_view.refresh()
        self._recount.start()

    # progress and problems ------------------------------------------------------------------
    def _busy(self, busy: bool) -> None:
        self.progress.setVisible(busy)
        self.cancel_button.setVisible(busy)
        self.act_cancel.setEnabled(busy)
        if busy:
            self.progress.setValue(0)

    def _progress(self, fraction: float, stage: str) -> None:
        if fraction < 0:
            self.progress.setRange(0, 0)
        else:
            self.progress.setRange(0, 1000)
            self.progress.setValue(int(1000 * min(fraction, 1.0)))
        self.stage_label.setText(stage)

    def _cancelled(self, name: str) -> None:
        self._draw_after_count = None
        self.stage_label.setText(f"{name}: cancelled.")

    def _failed(self, name: str, message: str, details: str) -> None:
        """A job that failed: one sentence in the status bar and a box, the traceback behind
        the box's Show Details button."""
        self._draw_after_count = None
        text = failure_sentence(name, message)
        self.last_error = text
        self.stage_label.setText(text)
        warn(self, text, details)

    def _warn(self, text: str, headline: str | None = None) -> None:
        """Record `text` as the last problem, show it, and say it in a box that never blocks."""
        self.last_error = text
        self.stage_label.setText(text)
        warn(self, f"{headline}\n\n{text}" if headline else text)

    # drag and drop, about -------------------------------------------------------------------
    def dragEnterEvent(self, event: QDragEnterEvent) -> None:  # noqa: N802
        urls = event.mimeData().urls()
        if (urls and urls[0].isLocalFile()
                and Path(urls[0].toLocalFile()).suffix.lower() in OPENABLE):
            event.acceptProposedAction()

    def dropEvent(self, event: QDropEvent) -> None:  # noqa: N802
        urls = event.mimeData().urls()
        if urls and urls[0].isLocalFile():
            self.open_path(urls[0].toLocalFile())
            event.acceptProposedAction()

    def show_guide(self) -> None:
        """Help > Guide (F1): the guide beside the window, made once and raised after."""
        if self.guide is None:
            self.guide = GuideWindow(self)
        self.guide.refresh()
        self.guide.show()
        self.guide.raise_()

    def about(self) -> None:
        inform(self, f"About {APP_NAME}",
               f"<b>{APP_NAME} {__version__}</b><p>Counts the clash-free ways to put a league's "
               f"fixtures into rounds, finds the fewest rounds, draws schedules and writes "
               f"calendars.</p><p>{CAUTION}</p>")
