"""Each team's season in the chosen schedule: a strip of its rounds (home, away, bye; breaks
marked), totals and warnings, a legend, and the selected team's rounds with opponents and
venues. It follows the document's schedule, so a fixture moved by hand shows here at once."""

from __future__ import annotations

from PySide6.QtCore import Qt
from PySide6.QtWidgets import QHeaderView, QLabel, QSplitter, QVBoxLayout, QWidget

from leaguegrid.app.seasons import Seasons, team_seasons
from leaguegrid.core import wording
from leaguegrid.gui.document import LeagueDocument
from leaguegrid.gui.season_strip import StripDelegate, legend, strip_size
from leaguegrid.gui.table_model import row_view, selected_row
from leaguegrid.gui.teams_model import TeamRoundsModel, TeamsModel

SHOWN_WARNINGS = 6  # warnings spelled out in the line above the table


def _label(name: str, accessible: str) -> QLabel:
    label = QLabel("")
    label.setObjectName(name)
    label.setAccessibleName(accessible)
    label.setWordWrap(True)
    label.setTextInteractionFlags(Qt.TextInteractionFlag.TextSelectableByMouse)
    return label


class TeamsView(QWidget):
    """A row per team; selecting one lists its rounds underneath."""

    def __init__(self, doc: LeagueDocument, parent: QWidget | None = None) -> None:
        super().__init__(parent)
        self.doc = doc
        self.seasons: Seasons | None = None
        self.summary = _label("teamsSummary", "Teams summary")
        self.warnings = _label("seasonWarnings", "Season warnings")
        self.model = TeamsModel(self)
        self.table = row_view("teamsTable", self.model, "Teams and their rounds")
        self.table.setItemDelegate(StripDelegate(self.table))
        self.table.verticalHeader().setVisible(False)
        self.table.verticalHeader().setDefaultSectionSize(
            strip_size(self.table.fontMetrics()).height())
        self.table.horizontalHeader().setResizeContentsPrecision(0)  # the rows in sight
        self.table.horizontalHeader().setStretchLastSection(True)
        self.table.selectionModel().selectionChanged.connect(self._picked)
        self.heading = _label("teamHeading", "Selected team")
        self.rounds_model = TeamRoundsModel(self)
        self.rounds_table = row_view("teamRoundsTable", self.rounds_model,
                                     "The selected team's rounds")
        self.rounds_table.setItemDelegate(StripDelegate(self.rounds_table))
        self.rounds_table.verticalHeader().setVisible(False)
        self.rounds_table.horizontalHeader().setSectionResizeMode(
            QHeaderView.ResizeMode.ResizeToContents)
        self.rounds_table.horizontalHeader().setStretchLastSection(True)
        lower = QWidget()
        below = QVBoxLayout(lower)
        below.setContentsMargins(0, 0, 0, 0)
        below.addWidget(self.heading)
        below.addWidget(self.rounds_table, 1)
        split = QSplitter(Qt.Orientation.Vertical)
        split.addWidget(self.table)
        split.addWidget(lower)
        split.setStretchFactor(0, 3)
        split.setStretchFactor(1, 2)
        layout = QVBoxLayout(self)
        layout.addWidget(self.summary)
        layout.addWidget(self.warnings)
        layout.addWidget(legend(self))
        layout.addWidget(split, 1)
        doc.scheduleChanged.connect(self.refresh)
        doc.loaded.connect(self.refresh)
        self.refresh()

    def refresh(self) -> None:
        """Lay out the document's schedule team by team, keeping the selected team."""
        keep = self.selected_team()
        schedule, league = self.doc.schedule, self.doc.league  # edits add no fixture
        self.seasons = None if schedule is None or league is None else \
            team_seasons(league, schedule)
        self.model.set_seasons(self.seasons)
        self._size_columns()
        if self.seasons is None:
            self.summary.setText(wording.NO_SEASON)
            self.warnings.setText("")
            self._show_team(None)
            return
        found = self.seasons.warnings
        self.summary.setText(wording.teams_summary(len(self.seasons.teams),
                                                   self.seasons.breaks, len(found)))
        self.warnings.setText(wording.more_warnings(list(found[:SHOWN_WARNINGS]), len(found))
                              if found else "✔ " + wording.NO_SEASON_WARNINGS)
        row = self.model.row_of(keep) if keep is not None else None
        self.table.selectRow(row if row is not None else 0)
        self._show_team(self.selected_team())

    def _size_columns(self) -> None:
        """Rounds as wide as the widest strip cell (two games in a round after a move that
        breaks a clash: 'H•A'); the other columns as wide as their contents."""
        letters = [r.letter for t in (self.seasons.teams if self.seasons else ())
                   for r in t.rounds]
        width = strip_size(self.table.fontMetrics(), max(letters, key=len, default="")).width()
        for column in range(self.model.columnCount()):
            if self.model.lead <= column < self.model.lead + self.model.rounds:
                self.table.setColumnWidth(column, width)
            else:
                self.table.resizeColumnToContents(column)

    def selected_team(self) -> str | None:
        row = selected_row(self.table)
        team = self.model.team(row) if row is not None else None
        return team.team if team is not None else None

    def _picked(self, *_args: object) -> None:
        self._show_team(self.selected_team())

    def _show_team(self, name: str | None) -> None:
        team = self.seasons.team(name) if self.seasons is not None and name else None
        self.rounds_model.set_team(team)
        self.heading.setText("" if team is None else
                             wording.team_heading(team.team, team.totals, team.longest))
