"""Pins, ties, moves (dragged or asked for), waived and added clashes from the window: each
changes the counts exactly as the engine says, and Undo/Redo take it back. Project files and
column matching."""

import os

os.environ["QT_QPA_PLATFORM"] = "offscreen"

import json  # noqa: E402
import shutil  # noqa: E402
from pathlib import Path  # noqa: E402

import networkx as nx  # noqa: E402
from openpyxl import load_workbook  # noqa: E402
from PySide6.QtCore import Qt  # noqa: E402
from PySide6.QtGui import QDragEnterEvent, QDragMoveEvent, QDropEvent  # noqa: E402
from PySide6.QtWidgets import QApplication, QFileDialog, QInputDialog  # noqa: E402

from leaguegrid import engine  # noqa: E402
from leaguegrid.clashes.graph import build_clash_graph, without_reasons  # noqa: E402
from leaguegrid.gui import mapping_dialog  # noqa: E402
from leaguegrid.gui.schedule_model import fixture_mime  # noqa: E402
from leaguegrid.io.read.league_reader import load_league  # noqa: E402

SMALL = Path(__file__).resolve().parents[2] / "demo_leagues" / "small.xlsx"


def wait_idle(qtbot, win):
    qtbot.waitUntil(lambda: not win.runner.busy and not win._recount.isActive(), timeout=30_000)


def open_small(qtbot, win, tmp_path):
    path = tmp_path / "small.xlsx"
    shutil.copy(SMALL, path)
    win.open_path(str(path))
    qtbot.waitUntil(lambda: win.report is not None, timeout=30_000)
    wait_idle(qtbot, win)
    return path


def shown(win, k):
    return next(r["assignments"] for r in win.counts_view.values() if r["rounds"] == k)


def engine_count(graph, k, pins):
    return engine.count_assignments(graph, k, pins=pins)


def test_pin_from_the_window_updates_counts_and_undo_redo(qtbot, window, tmp_path, monkeypatch):
    path = open_small(qtbot, window, tmp_path)
    graph = build_clash_graph(load_league(path).league)
    assert shown(window, 5) == engine_count(graph, 5, {"Otters v Badgers": 1})
    window.doc.select("Herons v Wrens")
    monkeypatch.setattr(QInputDialog, "getInt", staticmethod(lambda *a, **k: (2, True)))
    window.act_pin.trigger()
    wait_idle(qtbot, window)
    pinned = {"Otters v Badgers": 1, "Herons v Wrens": 2}
    assert shown(window, 5) == engine_count(graph, 5, pinned)
    assert window.windowTitle() == "LeagueGrid — Fenwick Vale Under-11s"
    window.act_undo.trigger()
    wait_idle(qtbot, window)
    assert shown(window, 5) == engine_count(graph, 5, {"Otters v Badgers": 1})
    window.act_redo.trigger()
    wait_idle(qtbot, window)
    assert shown(window, 5) == engine_count(graph, 5, pinned)


def test_tie_merges_two_fixtures_in_the_counts(qtbot, window, tmp_path):
    path = open_small(qtbot, window, tmp_path)
    graph = build_clash_graph(load_league(path).league)
    window.fixtures_view.tieRequested.emit("Herons v Wrens", "Otters v Badgers")
    wait_idle(qtbot, window)
    merged = nx.contracted_nodes(graph, "Otters v Badgers", "Herons v Wrens", self_loops=False)
    assert shown(window, 5) == engine_count(merged, 5, {"Otters v Badgers": 1})
    assert "(together)" in window.fixtures_view.model.index(
        window.fixtures_view.rows["Herons v Wrens"], 0).data()
    window.act_undo.trigger()
    wait_idle(qtbot, window)
    assert shown(window, 5) == engine_count(graph, 5, {"Otters v Badgers": 1})


def test_tie_and_add_a_clash_ask_for_the_fixtures_they_pair(qtbot, window, monkeypatch):
    window.open_path(str(SMALL))
    qtbot.waitUntil(lambda: window.doc.usable, timeout=30_000)
    labels = [f.label for f in window.doc.league.fixtures]
    others = [label for label in labels if label != "Herons v Wrens"]
    asked = []
    answers = iter(["Herons v Wrens", "Otters v Badgers", "Otters v Badgers",
                    "Wrens v Badgers", "Herons v Otters"])

    def get_item(_parent, title, prompt, items, *_args):
        asked.append((title, prompt, list(items)))
        return next(answers), True

    monkeypatch.setattr(QInputDialog, "getItem", staticmethod(get_item))
    window.act_tie.trigger()  # nothing selected: both fixtures are asked for
    assert window.doc.edits.ties == [("Herons v Wrens", "Otters v Badgers")]
    window.doc.select("Herons v Wrens")
    window.act_add_clash.trigger()  # the selected fixture is the first
    window.whatif_view.add_button.click()
    assert window.doc.edits.added == [("Herons v Wrens", "Otters v Badgers"),
                                      ("Wrens v Badgers", "Herons v Otters")]
    assert asked == [
        ("Play together", "First fixture:", labels),
        ("Play together", "Fixture to share a round with Herons v Wrens:", others),
        ("Add a clash", "Fixture that may not share a round with Herons v Wrens:", others),
        ("Add a clash", "First fixture:", labels),
        ("Add a clash", "Fixture that may not share a round with Wrens v Badgers:",
         [label for label in labels if label != "Wrens v Badgers"]),
    ]


def test_draw_optimises_and_the_uniform_draw_stays_uniform(qtbot, window, tmp_path):
    open_small(qtbot, window, tmp_path)
    window.act_draw.trigger()
    wait_idle(qtbot, window)
    assert window.doc.schedule.method == "optimised"
    window.act_uniform.trigger()
    wait_idle(qtbot, window)
    uniform = window.doc.schedule
    assert uniform.method == "uniform"
    window.act_redraw.trigger()  # the same seed, the same kind of draw, the same schedule
    wait_idle(qtbot, window)
    assert window.doc.schedule.method == "uniform"
    assert window.doc.schedule.assignment == uniform.assignment


def test_moving_a_fixture_says_at_once_what_it_breaks(qtbot, window, tmp_path):
    open_small(qtbot, window, tmp_path)
    window.act_draw.trigger()
    wait_idle(qtbot, window)
    schedule = window.doc.schedule
    assert window.schedule_view.status.text().startswith("✔")
    label, other = "Herons v Wrens", "Herons v Otters"  # both Herons: a team clash
    window.schedule_view.moveRequested.emit(label, schedule.assignment[other])
    status = window.schedule_view.status.text()
    assert status.startswith("✘ This schedule breaks")
    assert label in status and other in status and "team Herons" in status
    assert window.schedule_view.model.chip_text(label).startswith("⚠")
    window.act_undo.trigger()
    assert window.schedule_view.status.text().startswith("✔")
    assert window.doc.schedule.assignment[label] != schedule.assignment[other]


def test_waive_the_top_reason_and_add_a_clash_then_undo(qtbot, window, tmp_path):
    path = open_small(qtbot, window, tmp_path)
    league = load_league(path).league
    graph = build_clash_graph(league)
    window.act_whatif.trigger()
    wait_idle(qtbot, window)
    view = window.whatif_view
    assert view.model.rowCount() == len(view.rows) > 0
    view.table.selectRow(0)
    reason = view.current_reason()
    top = view.rows[0]
    view.waive_button.click()
    wait_idle(qtbot, window)
    k = window.rounds_box.value()
    pins = {"Otters v Badgers": 1}
    assert shown(window, k) == engine_count(without_reasons(graph, [reason]), k, pins)
    assert top.assignments_if_waived == shown(window, k)
    assert "Waived: " in view.state.text()
    window.act_undo.trigger()
    wait_idle(qtbot, window)
    assert shown(window, k) == engine_count(graph, k, pins)
    view.addRequested.emit("Herons v Wrens", "Otters v Badgers")
    wait_idle(qtbot, window)
    added = graph.copy()
    added.add_edge("Herons v Wrens", "Otters v Badgers")
    assert shown(window, k + 1) == engine_count(added, k + 1, pins)
    window.act_undo.trigger()
    wait_idle(qtbot, window)
    assert shown(window, k + 1) == engine_count(graph, k + 1, pins)


def test_project_saves_pins_and_schedule_and_notices_a_changed_workbook(
        qtbot, window, tmp_path, monkeypatch):
    path = open_small(qtbot, window, tmp_path)
    window.pin_fixture("Herons v Wrens", 2)
    wait_idle(qtbot, window)
    window.act_draw.trigger()
    wait_idle(qtbot, window)
    drawn = dict(window.doc.schedule.assignment)
    project = tmp_path / "season.leaguegrid"
    monkeypatch.setattr(QFileDialog, "getSaveFileName",
                        staticmethod(lambda *a, **k: (str(project), "")))
    window.act_save_as.trigger()
    saved = json.loads(project.read_text(encoding="utf-8"))
    assert saved["pins"] == {"Herons v Wrens": 2}
    assert saved["schedule"]["assignment"] == drawn
    assert saved["workbook"]["relative"] == "small.xlsx"
    assert not list(tmp_path.glob(".*.tmp"))

    window.open_path(str(project))
    qtbot.waitUntil(lambda: window.doc.project_path == str(project), timeout=30_000)
    wait_idle(qtbot, window)
    assert window.doc.edits.pins == {"Herons v Wrens": 2}
    assert window.doc.schedule.assignment == drawn
    assert window.last_error is None

    book = load_workbook(path)
    book["Fixtures"]["F2"] = "changed note"
    book.save(path)
    window.open_path(str(project))
    qtbot.waitUntil(lambda: window.last_error is not None, timeout=30_000)
    assert window.last_error.startswith("The workbook small.xlsx has changed since the project "
                                        "was saved")


def test_column_matching_is_applied_and_remembered(qtbot, window, settings, tmp_path):
    path = tmp_path / "clubs.csv"
    path.write_text("Hosts;Guests;Playing at\nOtters;Herons;Alder Green\n"
                    "Wrens;Badgers;Alder Green\nOtters;Wrens;Millbrook\n", encoding="utf-8")
    window.open_path(str(path))
    qtbot.waitUntil(lambda: window.doc.result is not None and not window.runner.busy)
    assert not window.doc.usable

    window.act_mapping.trigger()  # the dialog opens without waiting for an answer
    qtbot.waitUntil(lambda: isinstance(QApplication.activeModalWidget(),
                                       mapping_dialog.MappingDialog))
    dialog = QApplication.activeModalWidget()
    dialog.combos["Home"].setCurrentText("Hosts")
    dialog.combos["Away"].setCurrentText("Guests")
    dialog.combos["Venue"].setCurrentText("Playing at")
    dialog.accept()
    qtbot.waitUntil(lambda: window.report is not None, timeout=30_000)
    wait_idle(qtbot, window)
    assert window.doc.usable
    assert [f.label for f in window.doc.league.fixtures] == [
        "Otters v Herons", "Wrens v Badgers", "Otters v Wrens"]
    assert window.report.clashes == 3  # Otters twice, Wrens twice, Alder Green twice
    assert path.read_text(encoding="utf-8").startswith("Hosts;Guests;Playing at")
    assert mapping_dialog.load_mapping(settings, str(path)) == {
        "Home": "Hosts", "Away": "Guests", "Venue": "Playing at"}
    window.open_path(str(path))
    qtbot.waitUntil(lambda: window.report is not None and window.doc.usable, timeout=30_000)
    wait_idle(qtbot, window)


def test_best_of_many_keeps_the_best_scoring_schedule(qtbot, window, tmp_path, monkeypatch):
    open_small(qtbot, window, tmp_path)
    monkeypatch.setattr(QInputDialog, "getInt", staticmethod(lambda *a, **k: (5, True)))
    window.act_best.trigger()
    wait_idle(qtbot, window)
    schedule = window.doc.schedule
    assert schedule is not None
    assert any(note.startswith("best of 5 schedules") for note in schedule.notes)
    assert any(note.startswith("score total:") for note in schedule.notes)
    assert window.schedule_view.status.text().startswith("✔")
    seed = schedule.seed
    window.act_redraw.trigger()
    wait_idle(qtbot, window)
    assert window.doc.schedule.seed == seed


def test_export_dialog_shows_what_is_written_and_keeps_reasons_private(
        qtbot, window, tmp_path, settings):
    from leaguegrid.gui.export_dialog import PRIVACY, ExportDialog

    open_small(qtbot, window, tmp_path)
    window.act_draw.trigger()
    wait_idle(qtbot, window)
    dialog = ExportDialog(window, window.doc.working_league(), window.doc.schedule, settings)
    qtbot.addWidget(dialog)
    dialog.xlsx_path.setText(str(tmp_path / "out.xlsx"))
    dialog.ics_on.setChecked(True)
    dialog.ics_path.setText(str(tmp_path / "ics"))
    dialog.csv_on.setChecked(True)
    dialog.csv_path.setText(str(tmp_path / "out.csv"))
    preview = dialog.preview_text()
    assert f"{tmp_path / 'out.xlsx'}" in preview
    assert "team-Herons.ics" in preview
    assert "one row per fixture (6 rows)" in preview
    assert "clash reasons" in PRIVACY.lower()
    window.export(dialog.choices())  # a job of the runner, like counting and drawing
    assert window.runner.busy and window.runner.current_name == "Exporting"
    wait_idle(qtbot, window)
    written = window.last_export
    assert str(tmp_path / "out.xlsx") in written and str(tmp_path / "out.csv") in written
    calendars = sorted(p.name for p in (tmp_path / "ics").iterdir())
    assert "team-Herons.ics" in calendars
    for name in calendars:
        assert "One set of goals" not in (tmp_path / "ics" / name).read_text(encoding="utf-8")
    csv_text = (tmp_path / "out.csv").read_text(encoding="utf-8-sig")
    for label in window.doc.schedule.assignment:
        assert csv_text.count(label) >= 1
    assert "One set of goals" not in csv_text


def test_dropping_a_fixture_on_another_rounds_cell_moves_it(qtbot, window, tmp_path):
    open_small(qtbot, window, tmp_path)
    window.act_draw.trigger()
    wait_idle(qtbot, window)
    window.tabs.setCurrentWidget(window.schedule_view)
    label = "Herons v Wrens"
    before = window.doc.schedule.assignment[label]
    target = 1 if before != 1 else 2
    grid, model = window.schedule_view.grid, window.schedule_view.model
    column = next(c for c in range(model.columnCount())
                  if label in model.labels_at(before - 1, c))
    point = grid.visualRect(model.index(target - 1, column)).center()
    data = fixture_mime(label)
    move, left, none = (Qt.DropAction.MoveAction, Qt.MouseButton.LeftButton,
                        Qt.KeyboardModifier.NoModifier)
    for event in (QDragEnterEvent(point, move, data, left, none),
                  QDragMoveEvent(point, move, data, left, none),
                  QDropEvent(point.toPointF(), move, data, left, none)):
        QApplication.sendEvent(grid.viewport(), event)
    assert window.doc.schedule.assignment[label] == target
    assert window.doc.schedule.method == "edited"
    assert window.doc.undo.undoText() == f"Move {label} from round {before} to round {target}"
    window.act_undo.trigger()
    assert window.doc.schedule.assignment[label] == before


def test_replan_keeps_an_earlier_schedule_and_says_what_moved(qtbot, window, tmp_path,
                                                             monkeypatch):
    from PySide6.QtWidgets import QFileDialog

    from leaguegrid.cli.main import main

    path = open_small(qtbot, window, tmp_path)
    previous = tmp_path / "before.csv"
    assert main(["plan", str(path), "--rounds", "4", "--seed", "5", "--csv", str(previous)]) == 0
    monkeypatch.setattr(QFileDialog, "getOpenFileName",
                        staticmethod(lambda *a, **k: (str(previous), "")))
    window.rounds_box.setValue(4)
    window.act_replan.trigger()
    wait_idle(qtbot, window)
    schedule = window.doc.schedule
    assert schedule is not None and schedule.method == "kept"
    assert "re-planned from the previous schedule: 0 of 6 fixtures moved" in schedule.notes
    assert window.stage_label.text() == "Re-planned: 0 fixtures moved."
    rows = previous.read_text(encoding="utf-8").splitlines()[1:]
    assert {r.split(",")[3]: int(r.split(",")[0]) for r in rows} == schedule.assignment


def test_replan_from_a_csv_naming_unknown_fixtures_is_refused(qtbot, window, tmp_path,
                                                              monkeypatch):
    open_small(qtbot, window, tmp_path)
    bad = tmp_path / "old.csv"
    bad.write_text("Round,Fixture\n1,Nobody v Wrens\n", encoding="utf-8")
    window.replan_from(str(bad))
    assert window.last_error == ("old.csv, row 2, column Fixture: 'Nobody v Wrens': not a "
                                 "fixture of this league")


def test_draw_before_the_first_count_waits_for_the_fewest_rounds(qtbot, window, tmp_path):
    open_small(qtbot, window, tmp_path)
    window.doc.set_schedule(None)
    window.compute_counts()  # a count is running: its result comes back through the event loop
    assert window.runner.current_name == "Counting"
    window.act_draw.trigger()
    assert window.doc.schedule is None
    assert window.stage_label.text() == ("The schedule is drawn as soon as the count has "
                                         "found the fewest rounds.")
    qtbot.waitUntil(lambda: window.doc.schedule is not None, timeout=30_000)
    wait_idle(qtbot, window)
    assert window.report.min_rounds == 4 == window.doc.schedule.rounds
    assert window.counts_view.report is window.report


def test_usual_spreadsheet_headers_are_understood_without_matching(qtbot, window, tmp_path):
    path = tmp_path / "clubs.csv"
    path.write_text("Home Team;Away Team;Ground;Grade\nOtters;Herons;Alder Green;U9\n"
                    "Wrens;Badgers;Alder Green;U9\n", encoding="utf-8")
    window.open_path(str(path))
    qtbot.waitUntil(lambda: window.report is not None, timeout=30_000)
    wait_idle(qtbot, window)
    assert window.doc.usable
    assert [(f.home, f.away, f.venue, f.division) for f in window.doc.league.fixtures] == [
        ("Otters", "Herons", "Alder Green", "U9"), ("Wrens", "Badgers", "Alder Green", "U9")]


def _answer_unsaved(qtbot, window, button):
    from PySide6.QtWidgets import QMessageBox

    qtbot.waitUntil(lambda: any(b.isVisible() for b in window.findChildren(QMessageBox)))
    box = next(b for b in window.findChildren(QMessageBox) if b.isVisible())
    assert box.text().startswith("This league has pins, edits or a schedule that are not saved")
    box.button(button).click()


def test_closing_with_a_schedule_not_saved_asks_and_cancel_keeps_the_window(qtbot, window,
                                                                           tmp_path):
    from PySide6.QtWidgets import QMessageBox

    open_small(qtbot, window, tmp_path)
    window.act_draw.trigger()
    wait_idle(qtbot, window)
    window.act_quit.trigger()
    assert window.isVisible()
    _answer_unsaved(qtbot, window, QMessageBox.StandardButton.Cancel)
    assert window.isVisible() and window.doc.schedule is not None
    window.act_quit.trigger()
    _answer_unsaved(qtbot, window, QMessageBox.StandardButton.Discard)
    qtbot.waitUntil(lambda: not window.isVisible())


def test_closing_with_unsaved_work_can_save_it_as_a_project_first(qtbot, window, tmp_path,
                                                                  monkeypatch):
    from PySide6.QtWidgets import QFileDialog, QMessageBox

    from leaguegrid.app import project

    open_small(qtbot, window, tmp_path)
    window.act_draw.trigger()
    wait_idle(qtbot, window)
    drawn = dict(window.doc.schedule.assignment)
    target = tmp_path / f"season{project.SUFFIX}"
    monkeypatch.setattr(QFileDialog, "getSaveFileName",
                        staticmethod(lambda *a, **k: (str(target), "")))
    window.close()
    _answer_unsaved(qtbot, window, QMessageBox.StandardButton.Save)
    qtbot.waitUntil(lambda: not window.isVisible())
    assert project.read_project(str(target)).saved_schedule["assignment"] == drawn


def test_closing_with_nothing_unsaved_asks_nothing(qtbot, window, tmp_path):
    open_small(qtbot, window, tmp_path)
    window.close()
    assert not window.isVisible()
