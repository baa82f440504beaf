"""Shared fixtures for the window tests: an isolated settings file and a ready main window."""

import os

os.environ["QT_QPA_PLATFORM"] = "offscreen"

import pytest  # noqa: E402
from PySide6.QtCore import QSettings  # noqa: E402


@pytest.fixture
def settings(tmp_path):
    """Settings in a file of the test's own, so no test sees another's recent files or
    recovery files (kept in the test's own folder)."""
    settings = QSettings(str(tmp_path / "settings.ini"), QSettings.Format.IniFormat)
    settings.setValue("recoveryFolder", str(tmp_path / "recovery"))
    return settings


@pytest.fixture
def window(qtbot, settings):
    """A main window with no league open, shown offscreen."""
    from leaguegrid.gui.main_window import MainWindow

    win = MainWindow(settings)
    qtbot.addWidget(win)
    win.show()
    yield win
    win.runner.cancel()
    win.runner.wait()
