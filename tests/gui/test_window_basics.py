"""The window's title, its caution (the calendars' own wording) and the start that skips a
second check when the command line has made it already."""

import os

os.environ["QT_QPA_PLATFORM"] = "offscreen"

from pathlib import Path  # noqa: E402

import pytest  # noqa: E402
from PySide6.QtWidgets import QApplication, QMessageBox  # noqa: E402

from leaguegrid.gui import app  # noqa: E402
from leaguegrid.io.write.calendar_xlsx import CAUTION  # noqa: E402

SEASON = Path(__file__).resolve().parents[2] / "demo_leagues" / "season.xlsx"


def test_title_is_leaguegrid_and_the_league_name(qtbot, window):
    assert window.windowTitle() == "LeagueGrid"
    window.open_path(str(SEASON))
    qtbot.waitUntil(lambda: window.doc.result is not None, timeout=30_000)
    assert window.windowTitle() == "LeagueGrid — Hollowmere Junior League"


def test_about_shows_the_calendars_caution_word_for_word(qtbot, window):
    window.act_about.trigger()  # opens without waiting: the test goes on with the box shown
    qtbot.waitUntil(lambda: isinstance(QApplication.activeModalWidget(), QMessageBox))
    box = QApplication.activeModalWidget()
    assert box.windowTitle() == "About LeagueGrid"
    assert box.text().endswith(f"<p>{CAUTION}</p>")
    box.accept()
    qtbot.waitUntil(lambda: QApplication.activeModalWidget() is None)


class Started(Exception):
    """Raised where run() would create the QApplication: the check is behind it."""


def test_run_checks_the_start_unless_told_it_was_checked(monkeypatch):
    checks = []

    def check() -> int:
        checks.append(1)
        return 1

    def no_application() -> None:
        raise Started

    monkeypatch.setattr(app, "ensure_window_can_start", check)
    monkeypatch.setattr(app, "create_application", no_application)
    assert app.run("league.xlsx") == 1
    assert checks == [1]
    with pytest.raises(Started):
        app.run("league.xlsx", checked=True)
    assert checks == [1]
