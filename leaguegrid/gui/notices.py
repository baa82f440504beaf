"""Messages and dialogs that never block the window: each opened window-modal (open(), not
exec()), so work and the event loop go on while it is shown; what it answers comes by signal."""

from __future__ import annotations

from collections.abc import Callable

from PySide6.QtCore import Qt
from PySide6.QtWidgets import QDialog, QMessageBox, QWidget

APP_NAME = "LeagueGrid"


def show_dialog(dialog: QDialog) -> QDialog:
    """Open `dialog` over its parent without waiting for it; it is deleted once closed."""
    dialog.setAttribute(Qt.WidgetAttribute.WA_DeleteOnClose)
    dialog.setWindowModality(Qt.WindowModality.WindowModal)
    dialog.open()
    return dialog


def warn(parent: QWidget, text: str, details: str = "") -> QMessageBox:
    """Show `text` in a warning box over `parent`; `details` behind its Show Details button."""
    box = QMessageBox(QMessageBox.Icon.Warning, APP_NAME, text, QMessageBox.StandardButton.Ok,
                      parent)
    if details:
        box.setDetailedText(details)
    show_dialog(box)
    return box


def inform(parent: QWidget, title: str, rich_text: str) -> QMessageBox:
    """Show `rich_text` (HTML) in an information box titled `title` over `parent`."""
    box = QMessageBox(QMessageBox.Icon.Information, title, rich_text,
                      QMessageBox.StandardButton.Ok, parent)
    box.setTextFormat(Qt.TextFormat.RichText)
    show_dialog(box)
    return box


def ask_save_discard(parent: QWidget, text: str, on_save: Callable[[], None],
                     on_discard: Callable[[], None]) -> QMessageBox:
    """Save / Discard / Cancel over `parent` (Save the default); Cancel does nothing."""
    buttons = QMessageBox.StandardButton
    box = QMessageBox(QMessageBox.Icon.Question, APP_NAME, text,
                      buttons.Save | buttons.Discard | buttons.Cancel, parent)
    box.setDefaultButton(buttons.Save)

    def answered(_code: int) -> None:
        choice = box.standardButton(box.clickedButton())
        if choice == buttons.Save:
            on_save()
        elif choice == buttons.Discard:
            on_discard()

    box.finished.connect(answered)
    show_dialog(box)
    return box
