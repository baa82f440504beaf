"""The window's recovery: its unsaved work written to a recovery file (gui.recovery) after
every change and removed once saved, discarded or closed cleanly; work left by a window that
ended without saving offered back in a bar (gui.recovery_bar), never a dialog."""

from __future__ import annotations

from pathlib import Path
from typing import Any

from PySide6.QtCore import QTimer
from PySide6.QtWidgets import QVBoxLayout, QWidget

from leaguegrid.core import wording
from leaguegrid.gui.recovery import LeftOver, RecoveryFile, left_over, recovery_folder
from leaguegrid.gui.recovery_bar import RecoveryBar


class RecoveryFlows:
    """Mixed into MainWindow: the recovery file and the restore bar."""

    def _start_recovery(self: Any) -> None:
        """Put the bar above the tabs, follow the undo stack, offer what windows left behind."""
        folder = recovery_folder(self.settings)
        self.recovery = RecoveryFile(folder)
        self._recovery_due = QTimer(self)  # one write for the signals of one change
        self._recovery_due.setSingleShot(True)
        self._recovery_due.setInterval(0)
        self._recovery_due.timeout.connect(self._keep_recovery)
        self.doc.undo.indexChanged.connect(lambda _i: self._recovery_due.start())
        self.doc.undo.cleanChanged.connect(lambda _c: self._recovery_due.start())
        self.recovery_bar = RecoveryBar()
        self.recovery_bar.restoreRequested.connect(self.restore_left_over)
        self.recovery_bar.discardRequested.connect(self.discard_left_over)
        tabs = self.takeCentralWidget()
        holder = QWidget()
        layout = QVBoxLayout(holder)
        layout.setContentsMargins(0, 0, 0, 0)
        layout.setSpacing(0)
        layout.addWidget(self.recovery_bar)
        layout.addWidget(tabs, 1)
        self.setCentralWidget(holder)
        self.left_over: list[LeftOver] = left_over(folder)
        self._offer_left_over()

    def _keep_recovery(self: Any) -> None:
        """Write the recovery file while there is unsaved work; remove it when there is none."""
        try:
            if self.doc.unsaved and self.doc.path:
                self.recovery.write(self.doc.project(self.rounds_box.value()))
            else:
                self.recovery.remove()
        except OSError as err:
            self.stage_label.setText(f"The unsaved work could not be written to "
                                     f"{self.recovery.path}: {err}")

    def _end_recovery(self: Any) -> None:
        """The window closes cleanly: nothing is left to recover."""
        self._recovery_due.stop()
        self.recovery.remove()

    def _offer_left_over(self: Any) -> None:
        if not self.left_over:
            self.recovery_bar.hide()
            return
        first = self.left_over[0]
        when = f"{first.changed:%d %B %Y, %H:%M}"
        self.recovery_bar.offer(wording.recovery_offer(Path(first.workbook()).name, when,
                                                       len(self.left_over) - 1))

    def restore_left_over(self: Any) -> None:
        """Read the offered work's workbook and lay its edits and schedule on, unsaved."""
        if not self.left_over:
            return
        item = self.left_over[0]
        workbook = item.workbook()

        def lay() -> None:
            if not self.doc.usable:  # the file stays, offered again at the next start
                self._warn(f"The unsaved work on {Path(workbook).name} could not be restored: "
                           "its workbook cannot be read as it is now.")
                return
            self._lay_project(item.work, workbook, saved=False)
            item.discard()
            self.stage_label.setText(f"Restored the unsaved work on {Path(workbook).name}; "
                                     "it is not saved yet (Save project keeps it).")

        def read() -> None:
            self.left_over.remove(item)
            self._offer_left_over()
            self._read(workbook, item.work.mapping or None, after=lay)

        self.settle_unsaved(read)

    def discard_left_over(self: Any) -> None:
        """Delete the offered work's recovery file."""
        if self.left_over:
            self.left_over.pop(0).discard()
            self._offer_left_over()
