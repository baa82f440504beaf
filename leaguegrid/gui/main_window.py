"""The main window: menus, toolbar, the views in tabs, progress and Cancel in the status bar."""

from __future__ import annotations

import random
from pathlib import Path
from typing import Any

import networkx as nx
from PySide6.QtCore import QByteArray, QSettings, Qt, QTimer, Signal
from PySide6.QtGui import QAction, QCloseEvent, QDragEnterEvent, QDropEvent, QKeySequence
from PySide6.QtWidgets import (
    QFileDialog,
    QInputDialog,
    QLabel,
    QMainWindow,
    QMessageBox,
    QProgressBar,
    QPushButton,
    QSpinBox,
    QStyle,
    QTabWidget,
    QToolBar,
    QWidget,
)

from leaguegrid import __version__
from leaguegrid.app import bridge
from leaguegrid.gui import commands, icons, procworker, project
from leaguegrid.gui.clash_view import ClashGraphView
from leaguegrid.gui.counts_view import CountsView
from leaguegrid.gui.document import LeagueDocument
from leaguegrid.gui.export_dialog import ExportDialog
from leaguegrid.gui.fixtures_view import FixturesView
from leaguegrid.gui.import_view import ImportView
from leaguegrid.gui.mapping_dialog import MappingDialog, load_mapping, save_mapping
from leaguegrid.gui.pickers import (
    Partner,
    ask_round,
    pick_clash_partner,
    pick_pair,
    pick_tie_partner,
)
from leaguegrid.gui.schedule_view import ScheduleView
from leaguegrid.gui.whatif_view import WhatIfView
from leaguegrid.gui.worker import Job, Runner

APP_NAME = "LeagueGrid"
MAX_RECENT = 8
OPEN_FILTER = ("League workbooks and projects (*.xlsx *.csv *.leaguegrid);;"
               "Workbooks (*.xlsx);;CSV files (*.csv);;LeagueGrid projects (*.leaguegrid)")


def _many(n: int, one: str, many: str | None = None) -> str:
    """'1 venue', '3 venues'."""
    return f"{n} {one if n == 1 else (many or one + 's')}"


class MainWindow(QMainWindow):
    """One league at a time; every long computation runs in the Runner's worker thread."""

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
        self.setWindowIcon(icons.app_icon())
        self.setAcceptDrops(True)
        self._build_views()
        self._build_actions()
        self._build_menus()
        self._build_toolbar()
        self._build_status()
        self._connect()
        self._recount = QTimer(self)
        self._recount.setSingleShot(True)
        self._recount.setInterval(300)
        self._recount.timeout.connect(self.compute_counts)
        self._restore_state()
        self._update_title()
        self._update_enabled()
        if self._engine_in_process():
            procworker.shared_worker().start()  # it imports while the user looks around

    # construction -----------------------------------------------------------------------
    def _build_views(self) -> None:
        self.tabs = QTabWidget()
        self.tabs.setDocumentMode(True)
        self.import_view = ImportView()
        self.fixtures_view = FixturesView(self.doc)
        self.clash_view = ClashGraphView(self.doc)
        self.counts_view = CountsView()
        self.schedule_view = ScheduleView(self.doc)
        self.whatif_view = WhatIfView(self.doc)
        for widget, title in ((self.import_view, "Workbook"), (self.fixtures_view, "Fixtures"),
                              (self.clash_view, "Clash graph"), (self.counts_view, "Counts"),
                              (self.schedule_view, "Schedule"), (self.whatif_view, "What-if")):
            self.tabs.addTab(widget, title)
        self.setCentralWidget(self.tabs)

    def _action(self, text: str, slot: Any, shortcut: Any = None, tip: str = "",
                icon: Any = None) -> QAction:
        """A QAction of the window; `shortcut` is a key name ("Ctrl+R") or a standard key."""
        action = QAction(text, self)
        if shortcut is not None:
            action.setShortcut(QKeySequence(shortcut) if isinstance(shortcut, str) else shortcut)
        if tip:
            action.setStatusTip(tip)
            action.setToolTip(tip)
        if icon is not None:
            action.setIcon(icon)
        action.triggered.connect(slot)
        return action

    def _build_actions(self) -> None:
        std = self.style().standardIcon
        sp = QStyle.StandardPixmap
        key = QKeySequence.StandardKey
        specs = (  # attribute, text, slot, shortcut, tip, icon
            ("act_open", "&Open…", self.open_dialog, key.Open,
             "Open a league workbook, CSV or project", std(sp.SP_DialogOpenButton)),
            ("act_reload", "&Reload workbook", self.reload, "F5",
             "Read the workbook again from disk", None),
            ("act_mapping", "&Match columns…", self.edit_mapping, None,
             "Say which of the workbook's columns are Home, Away, Venue and the shared "
             "resources", None),
            ("act_save", "&Save project", self.save_project, key.Save,
             "Save the league's project file (workbook path, pins, ties, schedule, seed)",
             std(sp.SP_DialogSaveButton)),
            ("act_save_as", "Save project &as…", self.save_project_as, key.SaveAs, "", None),
            ("act_export", "&Export…", self.export_dialog, "Ctrl+E",
             "Write the schedule as an Excel calendar, iCalendar files or CSV",
             icons.export_icon()),
            ("act_quit", "&Quit", self.close, key.Quit, "", None),
            ("act_pin", "&Pin fixture to its round", self.pin_selected, "Ctrl+P",
             "Fix the selected fixture to the round it has in the schedule (or a round you "
             "choose)", None),
            ("act_unpin", "U&npin fixture", self.unpin_selected, "Ctrl+Shift+P", "", None),
            ("act_tie", "&Tie with another fixture…", self.tie_selected, "Ctrl+T",
             "The two fixtures must share a round", None),
            ("act_add_clash", "&Add a clash…", self.add_clash_dialog, "Ctrl+L",
             "Two fixtures that must not share a round (what-if)", None),
            ("act_count", "&Count schedules", self.compute_counts, "Ctrl+R",
             "Count the valid round assignments per number of rounds", icons.count_icon()),
            ("act_cancel", "&Cancel", self.runner.cancel, "Esc",
             "Stop the computation that is running", std(sp.SP_BrowserStop)),
            ("act_draw", "&Draw a schedule", self.draw_schedule, "Ctrl+D",
             "Draw one valid schedule at random (a new seed)", icons.draw_icon()),
            ("act_redraw", "Draw with the &same seed", self.redraw_same_seed, "Ctrl+Shift+D",
             "Draw again with the seed shown: the same schedule", None),
            ("act_best", "&Best of many…", self.best_of_dialog, "Ctrl+B",
             "Draw many schedules and keep the best-scoring one", None),
            ("act_budget", "&Time allowed for counting…", self.budget_dialog, None,
             "Seconds a count may take before what is left is shown as estimates", None),
            ("act_whatif", "Rank clash &reasons", self.compute_whatif, "Ctrl+I",
             "How many more schedules each waived clash reason gives", None),
            ("act_zoom_in", "Zoom &in", self.clash_view.zoom_in, key.ZoomIn, "", None),
            ("act_zoom_out", "Zoom &out", self.clash_view.zoom_out, key.ZoomOut, "", None),
            ("act_zoom_fit", "&Fit graph", self.clash_view.fit, "Ctrl+0", "", None),
            ("act_about", "&About LeagueGrid", self.about, None, "", None),
        )
        for name, text, slot, shortcut, tip, icon in specs:
            setattr(self, name, self._action(text, slot, shortcut, tip, icon))
        self.act_undo = self.doc.undo.createUndoAction(self, "&Undo")
        self.act_undo.setShortcut(QKeySequence.StandardKey.Undo)
        self.act_redo = self.doc.undo.createRedoAction(self, "&Redo")
        self.act_redo.setShortcuts([QKeySequence.StandardKey.Redo, QKeySequence("Ctrl+Y")])
        self.tab_actions = [
            self._action(self.tabs.tabText(i), lambda _c=False, i=i: self.tabs.setCurrentIndex(i),
                         f"Alt+{i + 1}")
            for i in range(self.tabs.count())]

    def _build_menus(self) -> None:
        bar = self.menuBar()
        file_menu = bar.addMenu("&File")
        file_menu.addAction(self.act_open)
        self.recent_menu = file_menu.addMenu("Open &recent")
        self.demo_menu = file_menu.addMenu("Open a &demo league")
        for path in bridge.demo_leagues():
            act = self.demo_menu.addAction(path.stem.replace("_", " ").capitalize())
            act.triggered.connect(lambda _c=False, p=str(path): self.open_path(p))
        file_menu.addAction(self.act_reload)
        file_menu.addAction(self.act_mapping)
        file_menu.addSeparator()
        file_menu.addAction(self.act_save)
        file_menu.addAction(self.act_save_as)
        file_menu.addAction(self.act_export)
        file_menu.addSeparator()
        file_menu.addAction(self.act_quit)
        edit = bar.addMenu("&Edit")
        for act in (self.act_undo, self.act_redo, None, self.act_pin, self.act_unpin,
                    self.act_tie, self.act_add_clash):
            edit.addSeparator() if act is None else edit.addAction(act)
        league = bar.addMenu("&League")
        for act in (self.act_count, self.act_cancel, self.act_budget, None, self.act_draw,
                    self.act_redraw, self.act_best, None, self.act_whatif):
            league.addSeparator() if act is None else league.addAction(act)
        view = bar.addMenu("&View")
        for act in self.tab_actions:
            view.addAction(act)
        view.addSeparator()
        for act in (self.act_zoom_in, self.act_zoom_out, self.act_zoom_fit):
            view.addAction(act)
        help_menu = bar.addMenu("&Help")
        help_menu.addAction(self.act_about)
        self._fill_recent()

    def _build_toolbar(self) -> None:
        bar = QToolBar("Main")
        bar.setObjectName("mainToolbar")
        bar.setToolButtonStyle(Qt.ToolButtonStyle.ToolButtonTextBesideIcon)
        bar.addAction(self.act_open)
        bar.addAction(self.act_save)
        bar.addSeparator()
        bar.addAction(self.act_count)
        bar.addWidget(QLabel(" Rounds: "))
        self.rounds_box = QSpinBox()
        self.rounds_box.setObjectName("roundsBox")
        self.rounds_box.setRange(1, 999)
        self.rounds_box.setToolTip("K, the number of rounds for drawing schedules and what-if")
        self.rounds_box.valueChanged.connect(self._rounds_edited)
        bar.addWidget(self.rounds_box)
        bar.addAction(self.act_draw)
        bar.addAction(self.act_export)
        self.addToolBar(bar)

    def _build_status(self) -> None:
        status = self.statusBar()
        self.stage_label = QLabel("")
        self.progress = QProgressBar()
        self.progress.setMaximumWidth(220)
        self.progress.setRange(0, 1000)
        self.progress.setVisible(False)
        self.cancel_button = QPushButton("Cancel")
        self.cancel_button.setObjectName("cancelButton")
        self.cancel_button.clicked.connect(self.act_cancel.trigger)
        self.cancel_button.setVisible(False)
        status.addWidget(self.stage_label, 1)
        status.addPermanentWidget(self.progress)
        status.addPermanentWidget(self.cancel_button)

    def _connect(self) -> None:
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
        self.fixtures_view.pinRequested.connect(self.pin_fixture)
        self.fixtures_view.tieRequested.connect(self.tie_fixtures)
        self.schedule_view.pinRequested.connect(self.pin_fixture)
        self.schedule_view.tieRequested.connect(self.tie_fixtures)
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
        self.settings.setValue("window/geometry", self.saveGeometry())
        self.settings.setValue("window/state", self.saveState())
        self.settings.setValue("window/tab", self.tabs.currentIndex())
        self.settings.sync()
        self.runner.cancel()
        self.runner.wait()
        super().closeEvent(event)

    def recent_files(self) -> list[str]:
        value = self.settings.value("recent", [])
        if isinstance(value, str):
            value = [value]
        return [str(v) for v in (value or [])]

    def _remember(self, path: str) -> None:
        items = [p for p in self.recent_files() if p != path]
        items.insert(0, path)
        self.settings.setValue("recent", items[:MAX_RECENT])
        self._fill_recent()

    def _fill_recent(self) -> None:
        self.recent_menu.clear()
        for path in self.recent_files():
            act = self.recent_menu.addAction(Path(path).name)
            act.setToolTip(path)
            act.setStatusTip(path)
            act.triggered.connect(lambda _c=False, p=path: self.open_path(p))
        self.recent_menu.setEnabled(bool(self.recent_files()))

    def _update_title(self) -> None:
        name = self.doc.title_name() if self.doc.result is not None else None
        self.setWindowTitle(f"{APP_NAME} — {name}" if name else APP_NAME)

    def _update_enabled(self) -> None:
        usable = self.doc.usable
        has_schedule = self.doc.schedule is not None
        for act in (self.act_count, self.act_draw, self.act_best, self.act_whatif,
                    self.act_save, self.act_save_as, self.act_add_clash, self.act_tie,
                    self.act_pin, self.act_unpin):
            act.setEnabled(usable)
        self.act_redraw.setEnabled(usable and has_schedule and self.doc.schedule.seed is not None)
        self.act_export.setEnabled(usable and has_schedule)
        self.act_reload.setEnabled(self.doc.path is not None)
        self.act_mapping.setEnabled(self.doc.path is not None)

    # progress -----------------------------------------------------------------------------
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
        self.stage_label.setText(f"{name}: cancelled.")

    def _clean_changed(self, _clean: bool) -> None:
        self._update_title()

    def _failed(self, name: str, message: str) -> None:
        self.last_error = f"{name}: {message}"
        self.stage_label.setText(f"{name} failed: {message}")
        QMessageBox.warning(self, APP_NAME, f"{name} failed.\n\n{message}") \
            if self.isVisible() and not self._quiet() else None

    def _quiet(self) -> bool:
        """True under tests (no modal boxes): the platform is offscreen."""
        from PySide6.QtGui import QGuiApplication

        return QGuiApplication.platformName() in ("offscreen", "minimal")

    # opening ------------------------------------------------------------------------------
    def open_dialog(self) -> None:
        start = self.settings.value("lastFolder", str(Path.home()))
        path, _f = QFileDialog.getOpenFileName(self, "Open a league", str(start), OPEN_FILTER)
        if path:
            self.open_path(path)

    def open_path(self, path: str) -> None:
        """Open a workbook, a CSV or a project file (read in the worker thread)."""
        if path.lower().endswith(".leaguegrid"):
            self.open_project(path)
            return
        self.settings.setValue("lastFolder", str(Path(path).parent))
        self._read(path, load_mapping(self.settings, path))

    def reload(self) -> None:
        if self.doc.path:
            self._read(self.doc.path, self.doc.mapping)

    def _read(self, path: str, mapping: dict[str, str] | None,
              after: Any = None) -> None:
        def work(progress, cancel):
            progress(0.1, f"Reading {Path(path).name}")
            result = bridge.load(path, mapping)
            progress(0.6, "Preparing the preview")
            sheets = bridge.preview_sheets(path)
            digest = bridge.sha256_of(path) if Path(path).is_file() else None
            graph = None
            if result.ok:
                progress(0.8, "Building the clash graph")
                graph = bridge.clash_graph(result.league)
            return result, sheets, digest, graph

        def done(out: tuple) -> None:
            result, sheets, digest, graph = out
            self._opened(path, mapping, result, sheets, digest, graph)
            if after is not None:
                after()

        self.runner.start(Job(f"Reading {Path(path).name}", work, done))

    def _opened(self, path: str, mapping, result, sheets, digest, graph) -> None:
        self.report = None
        self.graph = graph
        self._user_rounds = False
        self.doc.graph = graph
        self.doc.set_result(path, result, digest, mapping)
        self.doc.project_path = None
        self._remember(path)
        league = result.league
        if league is not None:
            venues = len({f.venue for f in league.fixtures if f.venue})
            clashes = graph.number_of_edges() if graph is not None else 0
            parts = [_many(len(league.fixtures), "fixture"), _many(len(league.teams), "team"),
                     _many(venues, "venue"), _many(clashes, "clash", "clashes")]
            summary = f"{Path(path).name}: {', '.join(parts)}."
        else:
            summary = f"{Path(path).name} could not be used: see the problems below."
        if not result.ok and league is not None:
            summary += " It has errors: fix them in the workbook and reload (F5)."
        self.import_view.show_workbook(path, sheets, list(result.problems), summary)
        self.fixtures_view.refresh()
        self.doc.set_graph(graph)
        self.counts_view.clear("Counting…" if result.ok else "No counts: the league has errors.")
        self.schedule_view.refresh()
        self.whatif_view.clear()
        self._update_enabled()
        self.stage_label.setText(summary)
        if not result.ok:
            self.tabs.setCurrentWidget(self.import_view)
        self.leagueOpened.emit(path)
        if result.ok:
            self.compute_counts()

    def edit_mapping(self) -> None:
        """Match the workbook's columns to ours; the choice is remembered for this file."""
        if not self.doc.path:
            return
        sheets = bridge.preview_sheets(self.doc.path)
        dialog = MappingDialog(sheets, self.doc.mapping or {}, self)
        if dialog.exec():
            mapping = dialog.mapping()
            save_mapping(self.settings, self.doc.path, mapping)
            self._read(self.doc.path, mapping)

    # projects -----------------------------------------------------------------------------
    def save_project(self) -> None:
        if self.doc.project_path:
            self._write_project(self.doc.project_path)
        else:
            self.save_project_as()

    def save_project_as(self) -> None:
        if not self.doc.path:
            return
        suggested = str(Path(self.doc.path).with_suffix(".leaguegrid"))
        path, _f = QFileDialog.getSaveFileName(self, "Save project", suggested,
                                               "LeagueGrid projects (*.leaguegrid)")
        if path:
            if not path.endswith(".leaguegrid"):
                path += ".leaguegrid"
            self._write_project(path)

    def _write_project(self, path: str) -> None:
        try:
            project.save(path, self.doc, self.rounds_box.value())
        except OSError as err:
            self.last_error = str(err)
            self.stage_label.setText(f"The project could not be saved: {err}")
            return
        self.doc.project_path = path
        self.doc.undo.setClean()
        self._remember(path)
        self.stage_label.setText(f"Project saved to {path}.")

    def open_project(self, path: str) -> None:
        try:
            data = project.read(path)
        except project.ProjectError as err:
            self.last_error = str(err)
            self.stage_label.setText(str(err))
            if not self._quiet():
                QMessageBox.warning(self, APP_NAME, str(err))
            return
        workbook = data.workbook_path(path)

        def restore() -> None:
            warning = project.apply(data, self.doc, bridge.sha256_of(workbook)
                                    if Path(workbook).is_file() else None)
            self.doc.project_path = path
            self._remember(path)
            if data.rounds:
                self._set_rounds(data.rounds, user=True)
            if warning:
                self.last_error = warning
                self.stage_label.setText(warning)
                if not self._quiet():
                    QMessageBox.warning(self, APP_NAME, warning)
            self.schedule_view.refresh()
            self._update_enabled()
            self.doc.undo.setClean()

        self._read(workbook, data.mapping or None, after=restore)

    # counting -------------------------------------------------------------------------------
    def working(self) -> tuple[Any, Any]:
        """The league with the window's edits, and its clash graph without waived reasons."""
        league = self.doc.working_league()
        return league, bridge.clash_graph(league, self.doc.edits.waived)

    def compute_counts(self) -> None:
        """Count in the worker thread; an estimate of the time comes first when it is long."""
        if not self.doc.usable:
            return
        league, graph = self.working()
        if self.doc.graph is None or not nx.utils.graphs_equal(self.doc.graph, graph):
            self.doc.set_graph(graph)
        self.graph = graph
        budget = float(self.settings.value("countBudget", bridge.COUNT_BUDGET))

        work = self._job_fn(bridge.count_with_estimate, league, graph, budget=budget)
        self.runner.start(Job("Counting", work, self._counts_done))

    def budget_dialog(self) -> None:
        now = float(self.settings.value("countBudget", bridge.COUNT_BUDGET))
        seconds, ok = QInputDialog.getInt(
            self, "Time allowed for counting",
            "Seconds a count may take (what is not finished by then is shown as a labelled "
            "estimate or as not computed):", int(now), 1, 24 * 3600)
        if ok:
            self.settings.setValue("countBudget", seconds)

    def _engine_in_process(self) -> bool:
        return self.settings.value("engineProcess", "true") in (True, "true", "1", 1)

    def _job_fn(self, target, *args, **kwargs):
        """Engine work as a Runner job: in the engine process (the default) or in a thread."""
        if self._engine_in_process():
            return procworker.remote(target, *args, **kwargs)
        return lambda progress, cancel: target(*args, progress, cancel, **kwargs)

    def _counts_done(self, report: Any) -> None:
        self.report = report
        self.counts_view.show_report(report, bridge.rules_note(self.doc.working_league()))
        if report.min_rounds is not None and not self._user_rounds:
            self._set_rounds(report.min_rounds, user=False)
        self.stage_label.setText(
            f"Counted: fewest rounds {report.min_rounds}." if report.complete else
            "Counting stopped before the end; what is missing is marked.")
        self.countsReady.emit(report)

    def _set_rounds(self, k: int, user: bool) -> None:
        self.rounds_box.blockSignals(True)
        self.rounds_box.setValue(k)
        self.rounds_box.blockSignals(False)
        self._user_rounds = user

    def _rounds_edited(self, _k: int) -> None:
        self._user_rounds = True

    def _rounds_from_table(self, k: int) -> None:
        self._set_rounds(k, user=True)

    def _edited(self) -> None:
        self._update_title()
        self.fixtures_view.refresh()
        self.schedule_view.refresh()
        self._recount.start()

    # schedules ----------------------------------------------------------------------------
    def draw_schedule(self, seed: int | None = None, draws: int = 1) -> None:
        """Draw a schedule for the rounds in the toolbar (a new seed unless one is given)."""
        if not self.doc.usable:
            return
        k = self.rounds_box.value()
        seed = random.SystemRandom().randrange(1, 2**31) if seed in (None, False) else seed
        league, graph = self.working()

        work = self._job_fn(bridge.draw, league, graph, k, seed, draws)

        label = "Drawing a schedule" if draws == 1 else f"Drawing {draws} schedules"
        self.runner.start(Job(label, work, self._schedule_done))

    def redraw_same_seed(self) -> None:
        if self.doc.schedule is not None and self.doc.schedule.seed is not None:
            self.draw_schedule(self.doc.schedule.seed)

    def best_of_dialog(self) -> None:
        n, ok = QInputDialog.getInt(self, "Best of many", "Schedules to draw:",
                                    int(self.settings.value("bestOf", 50)), 2, 100000)
        if ok:
            self.settings.setValue("bestOf", n)
            self.draw_schedule(draws=n)

    def _schedule_done(self, outcome: Any) -> None:
        schedule, message = outcome
        self.doc.set_schedule(schedule)
        self.schedule_view.refresh(message)
        self.clash_view.colour_by(schedule)
        if schedule is not None:
            self.tabs.setCurrentWidget(self.schedule_view)
            self.stage_label.setText(f"Schedule drawn for {schedule.rounds} rounds "
                                     f"(seed {schedule.seed}).")
        else:
            self.stage_label.setText(message)
        self.scheduleReady.emit(schedule)

    def move_fixture(self, label: str, to_round: int) -> None:
        if self.doc.schedule is None or self.doc.schedule.assignment.get(label) == to_round:
            return
        self.doc.undo.push(commands.MoveCommand(self.doc, label, to_round))
        self.clash_view.colour_by(self.doc.schedule)

    # pins, ties, what-if --------------------------------------------------------------------
    def _selected_label(self) -> str | None:
        return self.doc.selected

    def pin_fixture(self, label: str, round_: int | None) -> None:
        self.doc.undo.push(commands.PinCommand(self.doc, label, round_))

    def tie_fixtures(self, first: str, second: str) -> None:
        if first != second and (first, second) not in self.doc.edits.ties:
            self.doc.undo.push(commands.TieCommand(self.doc, first, second))

    def pin_selected(self) -> None:
        label = self._selected_label()
        if label is None:
            self.stage_label.setText("Select a fixture first (in the fixtures, graph or "
                                     "schedule view).")
            return
        schedule = self.doc.schedule
        if schedule is not None and label in schedule.assignment:
            self.pin_fixture(label, schedule.assignment[label])
            return
        k = ask_round(self, "Pin fixture", label, 1)
        if k is not None:
            self.pin_fixture(label, k)

    def unpin_selected(self) -> None:
        label = self._selected_label()
        if label is not None and self.doc.pin_of(label) is not None:
            self.pin_fixture(label, None)

    def _ask_pair(self, title: str, partner: Partner) -> tuple[str, str] | None:
        """The selected fixture (asked for when none is) and the other one `partner` asks for."""
        league = self.doc.league
        if league is None:
            return None
        return pick_pair(self, title, [f.label for f in league.fixtures], partner,
                         self._selected_label())

    def tie_selected(self) -> None:
        pair = self._ask_pair("Tie fixtures", pick_tie_partner)
        if pair:
            self.tie_fixtures(*pair)

    def add_clash_dialog(self) -> None:
        pair = self._ask_pair("Add a clash", pick_clash_partner)
        if pair:
            self.add_clash(*pair)

    def add_clash(self, first: str, second: str) -> None:
        if first != second:
            self.doc.undo.push(commands.AddClashCommand(self.doc, first, second))

    def waive_reason(self, reason: Any, waive: bool) -> None:
        self.doc.undo.push(commands.WaiveCommand(self.doc, reason, waive))

    def compute_whatif(self) -> None:
        """Rank the clash reasons by what waiving each would gain, for the toolbar's rounds."""
        if not self.doc.usable:
            return
        k = self.rounds_box.value()
        league, graph = self.working()

        work = self._job_fn(bridge.whatif, league, graph, k)

        def done(out: Any) -> None:
            self.whatif_view.show_result(k, *out)
            self.tabs.setCurrentWidget(self.whatif_view)
            self.stage_label.setText(f"Clash reasons ranked for {k} rounds.")

        self.runner.start(Job("Ranking clash reasons", work, done))

    # export -------------------------------------------------------------------------------
    def export_dialog(self) -> None:
        if self.doc.schedule is None:
            return
        dialog = ExportDialog(self, self.doc.working_league(), self.doc.schedule,
                              self.settings)
        if dialog.exec():
            self.export(dialog.choices())

    def export(self, choices: dict[str, str | None]) -> list[str]:
        """Write what `choices` names (xlsx, csv: file paths; ics: a folder); returns paths."""
        league, graph = self.working()
        schedule = self.doc.schedule
        if league is None or schedule is None:
            return []
        fewest = self.report.min_rounds if self.report is not None else None
        written: list[str] = []
        try:
            if choices.get("xlsx"):
                bridge.export_calendar(choices["xlsx"], league, schedule, graph, fewest)
                written.append(str(choices["xlsx"]))
            if choices.get("csv"):
                bridge.export_csv(choices["csv"], league, schedule)
                written.append(str(choices["csv"]))
            if choices.get("ics"):
                written += [str(p) for p in bridge.export_ics(choices["ics"], league, schedule)]
        except Exception as err:  # an export that fails says why and leaves no half file
            self.last_error = str(err)
            self.stage_label.setText(f"Export failed: {err}")
            if not self._quiet():
                QMessageBox.warning(self, APP_NAME, f"Export failed.\n\n{err}")
            return written
        self.last_export = written
        self.stage_label.setText(f"Exported {len(written)} file(s).")
        return written

    # drag and drop, about -------------------------------------------------------------------
    def dragEnterEvent(self, event: QDragEnterEvent) -> None:  # noqa: N802
        urls = event.mimeData().urls()
        if urls and urls[0].isLocalFile() and Path(urls[0].toLocalFile()).suffix.lower() in (
                ".xlsx", ".csv", ".leaguegrid"):
            event.acceptProposedAction()

    def dropEvent(self, event: QDropEvent) -> None:  # noqa: N802
        urls = event.mimeData().urls()
        if urls and urls[0].isLocalFile():
            self.open_path(urls[0].toLocalFile())
            event.acceptProposedAction()

    def about(self) -> None:
        QMessageBox.about(self, f"About {APP_NAME}",
                          f"<b>{APP_NAME} {__version__}</b><p>Counts the clash-free ways to put "
                          f"a league's fixtures into rounds, finds the fewest rounds, draws "
                          f"schedules and writes calendars.</p><p>{bridge.caution()}</p>")
