"""The bar across the top of the window that offers work left unsaved by a window that ended
(a crash, a kill): a sentence, Restore and Discard. Never a dialog: the window stays usable."""

from __future__ import annotations

from PySide6.QtCore import Signal
from PySide6.QtGui import QPalette
from PySide6.QtWidgets import QFrame, QHBoxLayout, QLabel, QPushButton, QStyle, QWidget


class RecoveryBar(QFrame):
    """Hidden until `offer(text)`; says which button was pressed by signal."""

    restoreRequested = Signal()
    discardRequested = Signal()

    def __init__(self, parent: QWidget | None = None) -> None:
        super().__init__(parent)
        self.setObjectName("recoveryBar")
        self.setFrameShape(QFrame.Shape.StyledPanel)
        self.setAutoFillBackground(True)
        self.setBackgroundRole(QPalette.ColorRole.ToolTipBase)
        self.setForegroundRole(QPalette.ColorRole.ToolTipText)
        icon = QLabel()
        size = self.style().pixelMetric(QStyle.PixelMetric.PM_SmallIconSize)
        icon.setPixmap(self.style().standardIcon(
            QStyle.StandardPixmap.SP_MessageBoxInformation).pixmap(size, size))
        self.text = QLabel()
        self.text.setWordWrap(True)
        self.restore_button = QPushButton("&Restore")
        self.restore_button.setAccessibleName("Restore the unsaved work")
        self.restore_button.clicked.connect(self.restoreRequested)
        self.discard_button = QPushButton("&Discard")
        self.discard_button.setAccessibleName("Discard the unsaved work")
        self.discard_button.clicked.connect(self.discardRequested)
        layout = QHBoxLayout(self)
        layout.addWidget(icon)
        layout.addWidget(self.text, 1)
        layout.addWidget(self.restore_button)
        layout.addWidget(self.discard_button)
        self.setAccessibleName("Unsaved work to restore")
        self.hide()

    def offer(self, text: str) -> None:
        """Show the bar with `text`."""
        self.text.setText(text)
        self.setAccessibleDescription(text)
        self.show()
