"""A malformed workbook shows its problems in the window (each one goes to its cell), and
nothing crashes: no counts are attempted and the window stays usable."""

import os
from pathlib import Path

os.environ["QT_QPA_PLATFORM"] = "offscreen"

from openpyxl import Workbook  # noqa: E402
from PySide6.QtCore import QMimeData, QPointF, Qt, QUrl  # noqa: E402
from PySide6.QtGui import QDropEvent  # noqa: E402
from PySide6.QtWidgets import QApplication, QMessageBox  # noqa: E402


def wait_idle(qtbot, win):
    qtbot.waitUntil(lambda: win.doc.result is not None and not win.runner.busy, timeout=30_000)


def bad_workbook(path):
    wb = Workbook()
    ws = wb.active
    ws.title = "Fixtures"
    ws.append(["Fixture", "Home", "Away", "Venue"])
    ws.append([None, "Otters", "Otters", "Alder Green"])
    ws.append([None, "Herons", "Wrens", "Millbrook"])
    ws.append([None, "Wrens", None, "Millbrook"])
    clashes = wb.create_sheet("Clashes")
    clashes.append(["First", "Second", "Reason"])
    clashes.append(["Herons v Wrenz", "Herons", "one coach"])
    wb.save(path)


def test_problems_are_listed_and_each_goes_to_its_cell(qtbot, window, tmp_path):
    path = tmp_path / "bad.xlsx"
    bad_workbook(path)
    window.open_path(str(path))
    wait_idle(qtbot, window)
    view = window.import_view
    problems = view.problem_model
    texts = [problems.index(i).data() for i in range(problems.rowCount())]
    assert texts == [
        f"{path}, sheet Fixtures, row 2, column Away: 'Otters': Home and Away are the same team",
        f"{path}, sheet Fixtures, row 4, column Away: 'Wrens v ?' has no Away team: give both "
        "Home and Away, or a Fixture label",
        f"{path}, sheet Clashes, row 2, column First: 'Herons v Wrenz': no fixture, team or "
        "venue is named 'Herons v Wrenz'; did you mean 'Herons v Wrens'?",
    ]
    assert view.problem_heading.text() == ("Problems: 3 errors, 0 warnings "
                                           "(click one to go to it)")
    assert window.tabs.currentWidget() is view
    view.go_to_problem(problems.index(2))
    table = view.sheets.currentWidget()
    assert view.sheets.tabText(view.sheets.currentIndex()) == "Clashes"
    assert (table.currentIndex().row(), table.currentIndex().column()) == (1, 0)
    assert table.model().headerData(1, Qt.Orientation.Vertical) == "2"
    view.go_to_problem(problems.index(0))
    table = view.sheets.currentWidget()
    assert table.currentIndex().data() == "Otters"
    assert table.currentIndex().column() == 2
    assert window.report is None
    assert not window.act_count.isEnabled()
    assert not window.act_draw.isEnabled()
    window.act_count.trigger()
    assert not window.runner.busy


def test_a_file_that_is_not_a_workbook_is_reported_not_raised(qtbot, window, tmp_path):
    path = tmp_path / "junk.xlsx"
    path.write_bytes(b"PK\x03\x04 truncated")
    window.open_path(str(path))
    wait_idle(qtbot, window)
    assert window.windowTitle() == "LeagueGrid — junk.xlsx"
    problems = window.import_view.problem_model
    assert problems.rowCount() == 1
    assert problems.index(0).data() == (
        f"{path}: the file is truncated or damaged: it begins like an Excel workbook but is "
        "incomplete")
    assert window.import_view.sheets.count() == 0


def test_a_missing_file_is_reported(qtbot, window, tmp_path):
    window.open_path(str(tmp_path / "nowhere.xlsx"))
    wait_idle(qtbot, window)
    assert window.import_view.problem_model.rowCount() >= 1
    assert window.last_error is None


def test_dropping_a_workbook_on_the_window_opens_it(qtbot, window, tmp_path):
    path = tmp_path / "bad.xlsx"
    bad_workbook(path)
    data = QMimeData()
    data.setUrls([QUrl.fromLocalFile(str(path))])
    event = QDropEvent(QPointF(10, 10), Qt.DropAction.CopyAction, data,
                       Qt.MouseButton.LeftButton, Qt.KeyboardModifier.NoModifier)
    window.dropEvent(event)
    wait_idle(qtbot, window)
    assert window.doc.path == str(path)
    assert window.recent_files()[0] == str(path)


def test_a_bad_project_is_said_in_a_box_that_does_not_wait(qtbot, window, tmp_path):
    path = tmp_path / "season.leaguegrid"
    path.write_text('["a list, not a project"]', encoding="utf-8")
    window.open_path(str(path))  # read in the worker; the box then opens and nothing waits
    message = f"{path} is not a LeagueGrid project file"
    qtbot.waitUntil(lambda: window.last_error is not None)
    assert window.last_error == message
    assert window.stage_label.text() == message
    qtbot.waitUntil(lambda: isinstance(QApplication.activeModalWidget(), QMessageBox))
    box = QApplication.activeModalWidget()
    assert (box.text(), box.icon()) == (message, QMessageBox.Icon.Warning)
    box.accept()
    qtbot.waitUntil(lambda: QApplication.activeModalWidget() is None)


def test_a_damaged_project_is_read_in_the_worker_and_its_sound_parts_open(qtbot, window,
                                                                           tmp_path, demo):
    import json
    import shutil

    shutil.copy(demo / "small.xlsx", tmp_path / "small.xlsx")
    path = tmp_path / "season.leaguegrid"
    path.write_text(json.dumps({
        "format": "leaguegrid-project", "version": 1,
        "workbook": {"path": str(tmp_path / "small.xlsx"), "relative": "small.xlsx"},
        "pins": {"Herons v Wrens": "soon", "Otters v Wrens": 3}, "ties": 7}), encoding="utf-8")
    window.open_path(str(path))
    assert window.runner.busy and window.last_error is None  # read off the window's thread
    qtbot.waitUntil(lambda: window.doc.project_path == str(path), timeout=30_000)
    assert window.doc.edits.pins == {"Otters v Wrens": 3}
    assert window.last_error == (
        "The project file season.leaguegrid is damaged in 2 places; those parts were left out: "
        "pins[\"Herons v Wrens\"] is 'soon', not a round number; ties is 7, not a list.")
    qtbot.waitUntil(lambda: isinstance(QApplication.activeModalWidget(), QMessageBox))
    QApplication.activeModalWidget().accept()
    qtbot.waitUntil(lambda: QApplication.activeModalWidget() is None)


def test_recent_files_are_absolute_once_each_and_only_those_that_exist(window, tmp_path,
                                                                      monkeypatch, settings):
    kept = tmp_path / "league.xlsx"
    kept.write_bytes(b"x")
    monkeypatch.chdir(tmp_path)
    settings.setValue("recent", ["league.xlsx", str(kept), str(tmp_path / "gone.xlsx")])
    assert window.recent_files() == [str(kept.resolve())]
    window._remember("league.xlsx")
    assert settings.value("recent") == [str(kept.resolve())]


def test_exports_default_to_the_documents_folder_not_the_workbooks(qtbot, window, settings):
    from PySide6.QtCore import QStandardPaths

    from leaguegrid.app.demos import demo_leagues
    from leaguegrid.gui.export_dialog import export_folder

    documents = QStandardPaths.writableLocation(
        QStandardPaths.StandardLocation.DocumentsLocation)
    assert export_folder(settings) == (Path(documents) if documents else Path.home())
    assert export_folder(settings) != demo_leagues()[0].parent
    settings.setValue("exportFolder", str(demo_leagues()[0].parent.parent))
    assert export_folder(settings) == demo_leagues()[0].parent.parent


def test_a_failed_job_says_one_sentence_and_keeps_the_details_behind_a_button(window, qtbot):
    """Issue 12: a failed job says one sentence (details behind a button); no view is stuck."""
    from PySide6.QtWidgets import QMessageBox

    from leaguegrid.core.wording import FAILURE_LIMIT
    from leaguegrid.gui.worker import Job

    def fails(hooks):
        raise ValueError("the sheet went away\nsecond line of internals " + "x" * 400)

    with qtbot.waitSignal(window.runner.failed, timeout=10_000):
        window.runner.start(Job("Counting", fails))
    assert window.last_error == "Counting failed: the sheet went away."
    assert window.stage_label.text() == window.last_error
    box = next(b for b in window.findChildren(QMessageBox) if b.isVisible())
    assert box.text() == "Counting failed: the sheet went away."
    assert "Traceback" in box.detailedText() and "second line of internals" in box.detailedText()
    assert not window.runner.busy
    long = "a" * 500
    from leaguegrid.core.wording import failure_sentence

    assert len(failure_sentence("Drawing", long)) <= FAILURE_LIMIT + len("Drawing failed: .")
