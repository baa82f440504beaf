"""Recovery files: a window's unsaved work, written as a project file (app.project, the format
of Save project) after every change, so that a crash or a kill loses nothing.

Each window writes a file of its own, named by a random token, and holds a lock file beside it
for as long as it lives (QLockFile: the lock names the process, and a lock whose process has
gone is stale). Two windows, in one program or in several, therefore never write over each
other's file, and the next start offers only files whose window is gone.
"""

from __future__ import annotations

import datetime as dt
import uuid
from dataclasses import dataclass
from pathlib import Path

from PySide6.QtCore import QLockFile, QSettings, QStandardPaths

from leaguegrid.app import project

FOLDER_SETTING = "recoveryFolder"  # where recovery files go, when not the usual place


def recovery_folder(settings: QSettings) -> Path:
    """The folder of recovery files: the `recoveryFolder` setting, else a folder `recovery` in
    the user's application data folder (QStandardPaths.AppDataLocation)."""
    chosen = settings.value(FOLDER_SETTING)
    if chosen:
        return Path(str(chosen))
    base = QStandardPaths.writableLocation(QStandardPaths.StandardLocation.AppDataLocation)
    return (Path(base) if base else Path.home() / ".leaguegrid") / "recovery"


def _lock_for(path: Path) -> QLockFile:
    lock = QLockFile(f"{path}.lock")
    lock.setStaleLockTime(0)  # stale only when its process is gone, however long it lived
    return lock


class RecoveryFile:
    """The recovery file of one window, locked while the window lives."""

    def __init__(self, folder: Path) -> None:
        self.path = folder / f"{uuid.uuid4().hex}{project.SUFFIX}"
        self._lock = _lock_for(self.path)

    def write(self, work: project.Project) -> None:
        """Write `work` (atomically, as Save project does), taking the lock on the first write."""
        self.path.parent.mkdir(parents=True, exist_ok=True)
        if not self._lock.isLocked():
            self._lock.tryLock(0)
        project.save_project(self.path, work)

    def remove(self) -> None:
        """Delete the file (the work was saved or discarded, or the window closed cleanly)."""
        self.path.unlink(missing_ok=True)
        if self._lock.isLocked():
            self._lock.unlock()


@dataclass
class LeftOver:
    """A recovery file whose window ended without saving, claimed (locked) by this window."""

    path: Path
    work: project.Project
    changed: dt.datetime
    lock: QLockFile

    def workbook(self) -> str:
        """The workbook the work was done on, by its full path (the recovery folder has
        nothing to do with where workbooks are, so the path relative to it means nothing)."""
        return self.work.workbook

    def discard(self) -> None:
        """Delete the file and give up the claim."""
        self.path.unlink(missing_ok=True)
        self.lock.unlock()


def left_over(folder: Path) -> list[LeftOver]:
    """Every recovery file in `folder` whose window is gone, newest first, each claimed so no
    other window offers it too; files that cannot be read as projects are deleted."""
    found = []
    for path in folder.glob(f"*{project.SUFFIX}") if folder.is_dir() else ():
        lock = _lock_for(path)
        if not lock.tryLock(0):
            continue  # its window is still open (here or in another LeagueGrid)
        try:
            work = project.read_project(path)
        except project.ProjectError:
            path.unlink(missing_ok=True)
            lock.unlock()
            continue
        changed = dt.datetime.fromtimestamp(path.stat().st_mtime)
        found.append(LeftOver(path, work, changed, lock))
    return sorted(found, key=lambda item: item.changed, reverse=True)
