"""Entry point of the window: `run(path)` is what `leaguegrid` and `leaguegrid FILE` call."""

from __future__ import annotations

import sys

from leaguegrid.gui.startup import ensure_window_can_start


def create_application() -> object:
    """The QApplication (created once), named so QSettings has a home, high-DPI clean."""
    from PySide6.QtCore import QCoreApplication, Qt
    from PySide6.QtGui import QGuiApplication
    from PySide6.QtWidgets import QApplication

    app = QApplication.instance()
    if app is None:
        QGuiApplication.setHighDpiScaleFactorRoundingPolicy(
            Qt.HighDpiScaleFactorRoundingPolicy.PassThrough)
        app = QApplication(sys.argv[:1])
    QCoreApplication.setOrganizationName("LeagueGrid")
    QCoreApplication.setApplicationName("LeagueGrid")
    QGuiApplication.setApplicationDisplayName("LeagueGrid")
    return app


def run(path: str | None = None, *, checked: bool = False) -> int:
    """Open the window on `path` (a workbook, CSV or project; the demo league when None).

    `checked`: the caller already ran `startup.check()`, so the start is not probed again."""
    if not checked and ensure_window_can_start() != 0:
        return 1
    app = create_application()
    from leaguegrid.app.demos import default_demo
    from leaguegrid.gui import icons
    from leaguegrid.gui.main_window import MainWindow

    app.setWindowIcon(icons.app_icon())
    window = MainWindow()
    window.show()
    window.open_path(path if path is not None else str(default_demo()))
    return int(app.exec())
