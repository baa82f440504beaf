"""Shared fixtures for the window tests: an isolated settings file and a ready main window."""

import os

os.environ["QT_QPA_PLATFORM"] = "offscreen"

import pytest  # noqa: E402
from PySide6.QtCore import QSettings  # noqa: E402


@pytest.fixture
def settings(tmp_path):
    """Settings in a file of the test's own, so no test sees another's recent files."""
    return QSettings(str(tmp_path / "settings.ini"), QSettings.Format.IniFormat)


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
