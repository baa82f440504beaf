"""Nothing is lost: opening another league with unsaved work asks Save / Discard / Cancel; the
recovery file is written only after a real edit and removed once the work is saved; a window
killed mid-session leaves it behind, and the next window offers it in a bar and restores it."""

import os

os.environ["QT_QPA_PLATFORM"] = "offscreen"

import json  # noqa: E402
import shutil  # noqa: E402
import subprocess  # noqa: E402
import sys  # noqa: E402
import time  # noqa: E402
from pathlib import Path  # noqa: E402

from PySide6.QtWidgets import QFileDialog, QMessageBox  # noqa: E402

from leaguegrid.app import project  # noqa: E402

ROOT = Path(__file__).resolve().parents[2]
SMALL = ROOT / "demo_leagues" / "small.xlsx"
PIN = ("Herons v Wrens", 2)


def wait_idle(qtbot, win):
    qtbot.waitUntil(lambda: not win.runner.busy and not win._recount.isActive(), timeout=30_000)


def open_copy(qtbot, win, tmp_path, name="small.xlsx"):
    path = tmp_path / name
    shutil.copy(SMALL, path)
    win.open_path(str(path))
    qtbot.waitUntil(lambda: win.doc.path == str(path) and win.report is not None,
                    timeout=30_000)
    wait_idle(qtbot, win)
    return path


def recovery_files(settings):
    folder = Path(settings.value("recoveryFolder"))
    return sorted(folder.glob(f"*{project.SUFFIX}")) if folder.is_dir() else []


def answer(qtbot, win, button, question):
    qtbot.waitUntil(lambda: any(b.isVisible() for b in win.findChildren(QMessageBox)))
    box = next(b for b in win.findChildren(QMessageBox) if b.isVisible())
    assert box.text() == ("This league has pins, edits or a schedule that are not saved in a "
                          f"project file. Save them before {question}?")
    box.button(button).click()


def test_opening_another_league_with_unsaved_pins_and_cancel_keeps_them(qtbot, window,
                                                                        tmp_path):
    first = open_copy(qtbot, window, tmp_path)
    other = shutil.copy(SMALL, tmp_path / "other.xlsx")
    window.pin_fixture(*PIN)
    window.open_path(str(other))
    answer(qtbot, window, QMessageBox.StandardButton.Cancel, "opening another league")
    qtbot.wait(50)
    assert window.doc.path == str(first)
    assert window.doc.edits.pins == {PIN[0]: PIN[1]} and window.doc.unsaved


def test_opening_another_league_and_discard_opens_it_and_drops_the_recovery(qtbot, window,
                                                                            settings, tmp_path):
    open_copy(qtbot, window, tmp_path)
    other = shutil.copy(SMALL, tmp_path / "other.xlsx")
    window.pin_fixture(*PIN)
    qtbot.waitUntil(lambda: len(recovery_files(settings)) == 1)
    window.open_path(str(other))
    answer(qtbot, window, QMessageBox.StandardButton.Discard, "opening another league")
    qtbot.waitUntil(lambda: window.doc.path == str(other), timeout=30_000)
    wait_idle(qtbot, window)
    assert window.doc.edits.pins == {} and not window.doc.unsaved
    assert recovery_files(settings) == []


def test_opening_another_league_and_save_writes_the_project_first(qtbot, window, tmp_path,
                                                                  monkeypatch):
    open_copy(qtbot, window, tmp_path)
    other = shutil.copy(SMALL, tmp_path / "other.xlsx")
    window.pin_fixture(*PIN)
    target = tmp_path / f"season{project.SUFFIX}"
    monkeypatch.setattr(QFileDialog, "getSaveFileName",
                        staticmethod(lambda *a, **k: (str(target), "")))
    window.open_path(str(other))
    answer(qtbot, window, QMessageBox.StandardButton.Save, "opening another league")
    qtbot.waitUntil(lambda: window.doc.path == str(other), timeout=30_000)
    assert project.read_project(target).edits.pins == {PIN[0]: PIN[1]}
    assert window.doc.edits.pins == {}


def test_recovery_file_is_written_only_after_an_edit_and_removed_once_saved(
        qtbot, window, settings, tmp_path, monkeypatch):
    path = open_copy(qtbot, window, tmp_path)
    window.compute_counts()
    wait_idle(qtbot, window)
    assert recovery_files(settings) == []  # opening and counting change nothing
    window.pin_fixture(*PIN)
    qtbot.waitUntil(lambda: len(recovery_files(settings)) == 1)
    written = project.read_project(recovery_files(settings)[0])
    assert written.edits.pins == {PIN[0]: PIN[1]} and written.workbook == str(path)
    window.act_undo.trigger()  # back where it was saved: nothing to recover
    qtbot.waitUntil(lambda: recovery_files(settings) == [])
    window.act_redo.trigger()
    wait_idle(qtbot, window)
    window.act_draw.trigger()
    wait_idle(qtbot, window)
    qtbot.waitUntil(lambda: project.read_project(
        recovery_files(settings)[0]).saved_schedule is not None)
    saved = json.loads(recovery_files(settings)[0].read_text(encoding="utf-8"))
    assert saved["schedule"]["assignment"] == window.doc.schedule.assignment
    target = tmp_path / f"season{project.SUFFIX}"
    monkeypatch.setattr(QFileDialog, "getSaveFileName",
                        staticmethod(lambda *a, **k: (str(target), "")))
    window.act_save.trigger()
    qtbot.waitUntil(lambda: recovery_files(settings) == [])
    assert target.is_file()


def test_a_draw_is_undone_to_the_schedule_before_it(qtbot, window, tmp_path):
    open_copy(qtbot, window, tmp_path)
    window.draw_schedule(seed=11)
    wait_idle(qtbot, window)
    first = dict(window.doc.schedule.assignment)
    window.draw_schedule(seed=12)
    wait_idle(qtbot, window)
    assert window.doc.undo.undoText() == "Draw a schedule"
    window.act_undo.trigger()
    assert window.doc.schedule.assignment == first and window.doc.schedule.seed == 11
    window.act_undo.trigger()
    assert window.doc.schedule is None and not window.doc.unsaved


CHILD = """
import os, sys
os.environ["QT_QPA_PLATFORM"] = "offscreen"
from PySide6.QtCore import QSettings, QTimer
from PySide6.QtWidgets import QApplication
app = QApplication([])
from leaguegrid.gui.main_window import MainWindow
window = MainWindow(QSettings(sys.argv[1], QSettings.Format.IniFormat))
window.show()
window.open_path(sys.argv[2])
steps = [lambda: window.pin_fixture("Herons v Wrens", 2), lambda: window.draw_schedule(seed=7)]
def edit():  # each step once the window is idle (an edit's recount would cancel a draw)
    if window.report is not None and not window.runner.busy and not window._recount.isActive():
        steps.pop(0)()
    if steps:
        QTimer.singleShot(50, edit)
edit()
app.exec()
"""


def test_a_killed_window_leaves_its_work_and_the_next_one_restores_it(qtbot, settings,
                                                                      tmp_path):
    from leaguegrid.gui.main_window import MainWindow

    book = tmp_path / "small.xlsx"
    shutil.copy(SMALL, book)
    settings.setValue("engineProcess", "false")  # one process to kill, no engine child
    settings.sync()
    env = dict(os.environ, PYTHONPATH=os.pathsep.join([str(ROOT), os.environ.get(
        "PYTHONPATH", "")]))
    child = subprocess.Popen([sys.executable, "-c", CHILD, settings.fileName(), str(book)],
                             env=env, cwd=ROOT)
    try:
        deadline = time.monotonic() + 60
        left = None
        while time.monotonic() < deadline and left is None:
            for path in recovery_files(settings):
                work = project.read_project(path)
                if work.saved_schedule is not None and work.edits.pins:
                    left = (path, work)
            time.sleep(0.1)
        assert child.poll() is None, "the window ended by itself"
    finally:
        child.kill()  # SIGKILL: no clean close, no chance to remove anything
        child.wait()
    assert left is not None, "no recovery file with the pin and the schedule appeared"
    path, work = left
    assert path.with_name(path.name + ".lock").exists()  # the dead window's lock stays behind

    settings.sync()
    window = MainWindow(settings)
    qtbot.addWidget(window)
    window.show()
    bar = window.recovery_bar
    assert bar.isVisible()
    assert bar.text.text().startswith("LeagueGrid ended without saving the work on "
                                      "small.xlsx (last change ")
    assert window.findChildren(QMessageBox) == []  # a bar, never a dialog
    bar.restore_button.click()
    qtbot.waitUntil(lambda: window.doc.schedule is not None, timeout=30_000)
    wait_idle(qtbot, window)
    assert not bar.isVisible()
    assert window.doc.path == str(book)
    assert window.doc.edits.pins == {PIN[0]: PIN[1]}
    assert window.doc.schedule.assignment == work.saved_schedule["assignment"]
    assert window.doc.schedule.seed == 7
    assert window.doc.unsaved  # restored, not saved
    qtbot.waitUntil(lambda: recovery_files(settings) == [window.recovery.path])
    window.act_undo.trigger()  # the restore itself is one undoable change
    assert window.doc.edits.pins == {} and window.doc.schedule is None
    window.runner.cancel()
    window.runner.wait()


def test_discard_in_the_bar_deletes_the_left_over_work(qtbot, settings, tmp_path):
    from leaguegrid.app.editing import Edits
    from leaguegrid.gui.main_window import MainWindow

    folder = Path(settings.value("recoveryFolder"))
    folder.mkdir()
    left = folder / f"gone{project.SUFFIX}"
    project.save_project(left, project.Project(workbook=str(SMALL),
                                               edits=Edits(pins={PIN[0]: PIN[1]})))
    window = MainWindow(settings)
    qtbot.addWidget(window)
    window.show()
    assert window.recovery_bar.isVisible()
    second = MainWindow(settings)  # another window at the same time: the file is claimed
    qtbot.addWidget(second)
    assert second.left_over == []
    window.recovery_bar.discard_button.click()
    assert not left.exists() and not window.recovery_bar.isVisible()


def test_reload_with_unsaved_pins_asks_and_discard_reads_the_workbook_afresh(qtbot, window,
                                                                           tmp_path):
    open_copy(qtbot, window, tmp_path)
    window.pin_fixture(*PIN)
    wait_idle(qtbot, window)
    window.act_reload.trigger()
    answer(qtbot, window, QMessageBox.StandardButton.Cancel, "reading the workbook again")
    assert window.doc.edits.pins == {PIN[0]: PIN[1]}
    window.act_reload.trigger()
    answer(qtbot, window, QMessageBox.StandardButton.Discard, "reading the workbook again")
    qtbot.waitUntil(lambda: window.doc.edits.pins == {}, timeout=30_000)
    assert not window.doc.unsaved
