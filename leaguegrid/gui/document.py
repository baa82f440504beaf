"""The open league and what the coordinator changed in the window, with undo.

The workbook's league is never modified: pins, ties, waived and added clashes are kept as edits
and applied to a copy (`working_league`) whenever counts or schedules are computed.
"""

from __future__ import annotations

from pathlib import Path
from typing import Any

from PySide6.QtCore import QObject, Signal
from PySide6.QtGui import QUndoStack

from leaguegrid.app import editing
from leaguegrid.app.editing import Edits
from leaguegrid.app.project import Project, restore
from leaguegrid.core.model import League, LoadResult, Schedule


class LeagueDocument(QObject):
    """One open league: the load result, the edits, the chosen schedule, the selection."""

    loaded = Signal()
    edited = Signal()  # pins, ties, waived or added clashes changed: counts are stale
    scheduleChanged = Signal()
    selectionChanged = Signal(object)  # fixture label or None
    graphChanged = Signal()

    def __init__(self, parent: QObject | None = None) -> None:
        super().__init__(parent)
        self.path: str | None = None
        self.result: LoadResult | None = None
        self.mapping: dict[str, str] | None = None
        self.sha256: str | None = None
        self.edits = Edits()
        self.schedule: Schedule | None = None
        self.selected: str | None = None
        self.project_path: str | None = None
        self.graph: Any = None  # the working clash graph (networkx), set by the window
        self.undo = QUndoStack(self)  # every change goes through it (gui.commands)

    @property
    def league(self) -> League | None:
        """The league as read from the workbook (never changed)."""
        return None if self.result is None else self.result.league

    @property
    def usable(self) -> bool:
        return self.result is not None and self.result.ok

    def set_result(self, path: str, result: LoadResult, sha256: str | None,
                   mapping: dict[str, str] | None = None) -> None:
        """A freshly read workbook: edits, schedule and history start again."""
        self.path = path
        self.result = result
        self.sha256 = sha256
        self.mapping = mapping
        self.edits = Edits()
        self.schedule = None
        self.selected = None
        self.undo.clear()
        self.loaded.emit()

    def title_name(self) -> str:
        """The league's name, or the file name when it has none."""
        league = self.league
        if league is not None and league.name:
            return league.name
        if self.path:
            return Path(self.path).name
        return "no league open"

    def working_league(self) -> League | None:
        """A copy of the league with the window's pins, ties and added clashes applied."""
        league = self.league
        return None if league is None else editing.working_league(league, self.edits)

    def pin_of(self, label: str) -> int | None:
        """The fixture's pin as it stands with the window's edits."""
        league = self.league
        return None if league is None else editing.pin_of(league, self.edits, label)

    def select(self, label: str | None) -> None:
        if label != self.selected:
            self.selected = label
            self.selectionChanged.emit(label)

    def set_graph(self, graph: Any) -> None:
        self.graph = graph
        self.graphChanged.emit()

    def clashes_of(self, label: str) -> dict[str, list]:
        """Fixture label -> the reasons it clashes with `label`, in the working graph."""
        graph = self.graph
        if graph is None or label not in graph:
            return {}
        return {other: list(graph.edges[label, other].get("reasons", []))
                for other in graph.neighbors(label)}

    def set_schedule(self, schedule: Schedule | None) -> None:
        """Show `schedule` (called by undo commands, and when a project is laid on)."""
        self.schedule = schedule
        self.scheduleChanged.emit()

    @property
    def unsaved(self) -> bool:
        """True when edits or a schedule would be lost by closing without saving: every change
        is an undo command, so this is the undo stack away from where it was last saved."""
        return not self.undo.isClean()

    def mark_saved(self) -> None:
        """The project file now holds the edits and the schedule."""
        self.undo.setClean()

    def project(self, rounds: int | None) -> Project:
        """What a project file of this document holds."""
        return Project(workbook=self.path or "", sha256=self.sha256,
                       mapping=dict(self.mapping or {}), edits=self.edits,
                       schedule=self.schedule, rounds=rounds)

    def restore(self, project: Project, current_sha: str | None) -> str | None:
        """Lay a project's edits and schedule onto the freshly read league; a warning or None."""
        restored = restore(project, self.league, current_sha)
        self.edits = restored.edits
        if restored.schedule is not None:
            self.set_schedule(restored.schedule)
        self.changed_edits()
        self.mark_saved()
        return restored.warning

    def changed_edits(self) -> None:
        """Called by undo commands after they change `edits`."""
        self.edited.emit()
