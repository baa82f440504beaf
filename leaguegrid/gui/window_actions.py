"""The main window's actions, menus, toolbar and status bar (built once, wired by the window)."""

from __future__ import annotations

from typing import Any

from PySide6.QtCore import Qt
from PySide6.QtGui import QAction, QKeySequence
from PySide6.QtWidgets import (
    QLabel,
    QMainWindow,
    QProgressBar,
    QPushButton,
    QSpinBox,
    QStyle,
    QToolBar,
)

from leaguegrid.app.demos import demo_leagues
from leaguegrid.gui import icons


def make_action(window: QMainWindow, text: str, slot: Any, shortcut: Any = None, tip: str = "",
                icon: Any = None) -> QAction:
    """A QAction of the window; `shortcut` is a key name ("Ctrl+R") or a standard key."""
    action = QAction(text, window)
    if shortcut is not None:
        action.setShortcut(QKeySequence(shortcut) if isinstance(shortcut, str) else shortcut)
    if tip:
        action.setStatusTip(tip)
        action.setToolTip(tip)
    if icon is not None:
        action.setIcon(icon)
    action.triggered.connect(slot)
    return action


def build_actions(w: Any) -> None:
    """Every action as an attribute of the window `w` (act_open, act_count, ...)."""
    std = w.style().standardIcon
    sp = QStyle.StandardPixmap
    key = QKeySequence.StandardKey
    specs = (  # attribute, text, slot, shortcut, tip, icon
        ("act_new", "&New league…", w.new_league, key.New,
         "Write a blank league workbook to fill in, open it in your spreadsheet program and "
         "here", std(sp.SP_FileIcon)),
        ("act_open", "&Open…", w.open_dialog, key.Open,
         "Open a league workbook, CSV or project", std(sp.SP_DialogOpenButton)),
        ("act_reload", "&Reload workbook", w.reload, "F5",
         "Read the workbook again from disk", None),
        ("act_mapping", "&Match columns…", w.edit_mapping, None,
         "Say which of the workbook's columns are Home, Away, Venue and the shared "
         "resources", None),
        ("act_save", "&Save project", w.save_project, key.Save,
         "Save the league's project file (workbook path, pins, ties, schedule, seed)",
         std(sp.SP_DialogSaveButton)),
        ("act_save_as", "Save project &as…", w.save_project_as, key.SaveAs, "", None),
        ("act_export", "&Export…", w.export_dialog, "Ctrl+E",
         "Write the schedule as an Excel calendar, iCalendar files or CSV",
         icons.export_icon()),
        ("act_print", "&Print…", w.print_preview, "Ctrl+Alt+P",
         "Print the schedule by round, a page per team and per venue (with a preview first)",
         None),
        ("act_pdf", "Export PD&F…", w.export_pdf_dialog, "Ctrl+Shift+E",
         "Write the schedule by round, a page per team and per venue as a PDF (A4 or Letter)",
         None),
        ("act_quit", "&Quit", w.close, key.Quit, "", None),
        ("act_pin", "&Pin fixture to its round", w.pin_selected, "Ctrl+P",
         "Fix the selected fixture to the round it has in the schedule (or a round you "
         "choose)", None),
        ("act_unpin", "U&npin fixture", w.unpin_selected, "Ctrl+Shift+P", "", None),
        ("act_tie", "Play &together with another fixture…", w.tie_selected, "Ctrl+T",
         "The two fixtures must share a round", None),
        ("act_add_clash", "&Add a clash…", w.add_clash_dialog, "Ctrl+L",
         "Two fixtures that must not share a round (what-if)", None),
        ("act_count", "&Count schedules", w.compute_counts, "Ctrl+R",
         "Count the valid schedules for each number of rounds", icons.count_icon()),
        ("act_cancel", "&Cancel", w.runner.cancel, "Esc",
         "Stop the computation that is running", std(sp.SP_BrowserStop)),
        ("act_draw", "&Draw a schedule", w.draw_schedule, "Ctrl+D",
         "A schedule that keeps every rule, with the fewest breaks found (a new seed)",
         icons.draw_icon()),
        ("act_uniform", "Draw &uniformly at random", w.draw_uniform, "Ctrl+Alt+D",
         "Any one of the valid schedules, each equally likely (breaks not minimised)", None),
        ("act_redraw", "Draw with the &same seed", w.redraw_same_seed, "Ctrl+Shift+D",
         "Draw again with the seed shown: the same schedule", None),
        ("act_best", "&Best of many…", w.best_of_dialog, "Ctrl+B",
         "Draw many schedules and keep the best-scoring one", None),
        ("act_replan", "&Re-plan from an earlier schedule…", w.replan_dialog, None,
         "Keep a schedule written before (its CSV) where every rule allows, moving as few "
         "fixtures as possible, and list what moved for each club", None),
        ("act_budget", "&Time allowed for counting…", w.budget_dialog, None,
         "Seconds a count may take before what is left is shown as estimates", None),
        ("act_whatif", "Rank clash &reasons", w.compute_whatif, "Ctrl+I",
         "How many more schedules each waived clash reason gives", None),
        ("act_zoom_in", "Zoom &in", w.clash_view.zoom_in, key.ZoomIn, "", None),
        ("act_zoom_out", "Zoom &out", w.clash_view.zoom_out, key.ZoomOut, "", None),
        ("act_zoom_fit", "&Fit graph", w.clash_view.fit, "Ctrl+0", "", None),
        ("act_guide", "&Guide", w.show_guide, QKeySequence.StandardKey.HelpContents,
         "What the numbers mean, with this league's own; every shortcut; the cautions", None),
        ("act_about", "&About LeagueGrid", w.about, None, "", None),
    )
    for name, text, slot, shortcut, tip, icon in specs:
        setattr(w, name, make_action(w, text, slot, shortcut, tip, icon))
    w.act_undo = w.doc.undo.createUndoAction(w, "&Undo")
    w.act_undo.setShortcut(QKeySequence.StandardKey.Undo)
    w.act_redo = w.doc.undo.createRedoAction(w, "&Redo")
    w.act_redo.setShortcuts([QKeySequence.StandardKey.Redo, QKeySequence("Ctrl+Y")])
    w.tab_actions = [
        make_action(w, w.tabs.tabText(i), lambda _c=False, i=i: w.tabs.setCurrentIndex(i),
                    f"Alt+{i + 1}")
        for i in range(w.tabs.count())]


def build_menus(w: Any) -> None:
    """File, Edit, League, View and Help menus of the window `w`."""
    bar = w.menuBar()
    file_menu = bar.addMenu("&File")
    file_menu.addAction(w.act_new)
    file_menu.addAction(w.act_open)
    w.recent_menu = file_menu.addMenu("Open &recent")
    w.demo_menu = file_menu.addMenu("Open a &demo league")
    for path in demo_leagues():
        act = w.demo_menu.addAction(path.stem.replace("_", " ").capitalize())
        act.triggered.connect(lambda _c=False, p=str(path): w.open_path(p))
    groups = {
        file_menu: (w.act_reload, w.act_mapping, None, w.act_save, w.act_save_as, w.act_export,
                    w.act_pdf, w.act_print, None, w.act_quit),
        bar.addMenu("&Edit"): (w.act_undo, w.act_redo, None, w.act_pin, w.act_unpin, w.act_tie,
                               w.act_add_clash),
        bar.addMenu("&League"): (w.act_count, w.act_cancel, w.act_budget, None, w.act_draw,
                                 w.act_uniform, w.act_redraw, w.act_best, w.act_replan, None,
                                 w.act_whatif),
        bar.addMenu("&View"): (*w.tab_actions, None, w.act_zoom_in, w.act_zoom_out,
                               w.act_zoom_fit),
        bar.addMenu("&Help"): (w.act_guide, None, w.act_about),
    }
    for menu, actions in groups.items():
        for act in actions:
            menu.addSeparator() if act is None else menu.addAction(act)


def build_toolbar(w: Any) -> None:
    """The main toolbar, with the rounds box (`w.rounds_box`)."""
    bar = QToolBar("Main")
    bar.setObjectName("mainToolbar")
    bar.setToolButtonStyle(Qt.ToolButtonStyle.ToolButtonTextBesideIcon)
    bar.addAction(w.act_open)
    bar.addAction(w.act_save)
    bar.addSeparator()
    bar.addAction(w.act_count)
    bar.addWidget(QLabel(" Rounds: "))
    w.rounds_box = QSpinBox()
    w.rounds_box.setObjectName("roundsBox")
    w.rounds_box.setAccessibleName("Rounds")
    w.rounds_box.setRange(1, 999)
    w.rounds_box.setToolTip("K, the number of rounds for drawing schedules and what-if")
    bar.addWidget(w.rounds_box)
    bar.addAction(w.act_draw)
    bar.addAction(w.act_export)
    w.addToolBar(bar)


def build_status(w: Any) -> None:
    """Stage text, progress bar and Cancel button in the status bar."""
    status = w.statusBar()
    w.stage_label = QLabel("")
    w.progress = QProgressBar()
    w.progress.setMaximumWidth(220)
    w.progress.setRange(0, 1000)
    w.progress.setVisible(False)
    w.cancel_button = QPushButton("Cancel")
    w.cancel_button.setObjectName("cancelButton")
    w.cancel_button.clicked.connect(w.act_cancel.trigger)
    w.cancel_button.setVisible(False)
    status.addWidget(w.stage_label, 1)
    status.addPermanentWidget(w.progress)
    status.addPermanentWidget(w.cancel_button)
