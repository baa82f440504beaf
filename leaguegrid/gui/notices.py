"""Messages to the coordinator that never block the window: a warning box opened window-modal
(QMessageBox.open), so work and the event loop go on while it is shown."""

from __future__ import annotations

from PySide6.QtCore import Qt
from PySide6.QtWidgets import QMessageBox, QWidget

APP_NAME = "LeagueGrid"


def warn(parent: QWidget, text: str) -> QMessageBox:
    """Show `text` in a warning box over `parent` without waiting for it to be closed."""
    box = QMessageBox(QMessageBox.Icon.Warning, APP_NAME, text, QMessageBox.StandardButton.Ok,
                      parent)
    box.setAttribute(Qt.WidgetAttribute.WA_DeleteOnClose)
    box.setWindowModality(Qt.WindowModality.WindowModal)
    box.open()
    return box
