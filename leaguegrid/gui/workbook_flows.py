"""Starting from nothing and following the workbook: File > New league writes the blank
template (app.demos.write_blank_league), opens it in the coordinator's spreadsheet program and
in the window; the open workbook is read again whenever its file changes on disk."""

from __future__ import annotations

from pathlib import Path
from typing import Any

from PySide6.QtCore import QFileSystemWatcher, QTimer, QUrl
from PySide6.QtGui import QDesktopServices
from PySide6.QtWidgets import QFileDialog

from leaguegrid.app import league
from leaguegrid.app.demos import write_blank_league
from leaguegrid.core import wording
from leaguegrid.gui.export_dialog import export_folder
from leaguegrid.gui.notices import show_dialog

SETTLE_MS = 700  # a workbook is read again once its file has been quiet this long
NEW_NAME = "new-league.xlsx"


class WorkbookFlows:
    """Mixed into MainWindow: File > New league, and reading a changed workbook again."""

    def new_league(self: Any) -> None:
        """Ask where to write the blank league (after Save / Discard / Cancel when needed)."""
        self.settle_unsaved(self._ask_new_place,
                            wording.unsaved_question("starting a new league"))

    def _ask_new_place(self: Any) -> None:
        dialog = QFileDialog(self, "New league: where to save the workbook",
                             str(export_folder(self.settings) / NEW_NAME), "Workbooks (*.xlsx)")
        dialog.setObjectName("newLeagueDialog")
        dialog.setAcceptMode(QFileDialog.AcceptMode.AcceptSave)
        dialog.setDefaultSuffix("xlsx")
        dialog.setOption(QFileDialog.Option.DontConfirmOverwrite)  # never overwritten anyway
        dialog.fileSelected.connect(self.new_league_at)
        show_dialog(dialog)

    def new_league_at(self: Any, path: str) -> None:
        """Write the blank league to `path` (never over a file), open it in the spreadsheet
        program and in the window."""
        try:
            written = write_blank_league(path)
        except FileExistsError:
            self._warn(f"{path} already exists; LeagueGrid never writes over a file. Choose a "
                       "new name for the league.")
            return
        except OSError as err:
            self._warn(f"The blank league could not be written to {path}: {err}")
            return
        self._open_now(str(written))
        if QDesktopServices.openUrl(QUrl.fromLocalFile(str(written))):
            note = "it is open in your spreadsheet program"
        else:
            note = "open it in your spreadsheet program"
        self.stage_label.setText(f"Wrote a blank league to {written}: {note}; fill it in and "
                                 "save, and the window reads it again.")

    # following the workbook on disk -----------------------------------------------------
    def _start_watching(self: Any) -> None:
        """Watch the open workbook and its folder (an editor may save by writing a new file and
        renaming it over the old one, which ends a watch on the file itself)."""
        self.watcher = QFileSystemWatcher(self)
        self.watcher.fileChanged.connect(self._workbook_touched)
        self.watcher.directoryChanged.connect(self._workbook_touched)
        self._settle = QTimer(self)
        self._settle.setSingleShot(True)
        self._settle.setInterval(SETTLE_MS)
        self._settle.timeout.connect(self._workbook_settled)
        self.leagueOpened.connect(self._watch)

    def _watch(self: Any, path: str) -> None:
        watched = self.watcher.files() + self.watcher.directories()
        if watched:
            self.watcher.removePaths(watched)
        self.watcher.addPaths([path, str(Path(path).parent)])

    def _workbook_touched(self: Any, _path: str) -> None:
        self._settle.start()  # (re)started by every change: read once the file is quiet

    def _workbook_settled(self: Any) -> None:
        """Read the workbook again when its bytes changed (not for other files in its folder)."""
        path = self.doc.path
        if not path or not Path(path).is_file():
            return  # gone or being replaced: the folder's next change comes back here
        if path not in self.watcher.files():
            self.watcher.addPath(path)  # the file was replaced: watch the new one
        try:
            sha = league.sha256_of(path)
        except OSError:  # still held by the program writing it
            self._settle.start()
            return
        if sha not in (self.doc.sha256, getattr(self, "_sha_read_again", None)):
            self._sha_read_again = sha  # a version that cannot be used is not read twice
            name = Path(path).name
            self._read_keeping(path, self.doc.mapping,
                               lambda kept: wording.reloaded_notice(name, kept))
