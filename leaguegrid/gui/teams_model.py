"""The Teams view's models: a row per team with its strip of rounds (home, away, bye; breaks
marked) and totals, and the selected team's rounds one by one (opponent, venue, pitch)."""

from __future__ import annotations

from typing import Any

from leaguegrid.app.printout import TEAM_COLUMNS
from leaguegrid.app.seasons import Game, SeasonRound, Seasons, TeamSeason
from leaguegrid.core import wording
from leaguegrid.gui.season_strip import BREAK_ROLE, SIDE_ROLE
from leaguegrid.gui.table_model import RIGHT, ReadOnlyTable, Role

ACCESSIBLE = Role.AccessibleTextRole


class TeamsModel(ReadOnlyTable):
    """One row per team: Team, Division (when the league has divisions), a column per round,
    then the totals and the warnings; the team's name is behind every cell (UserRole)."""

    def __init__(self, parent: Any = None) -> None:
        super().__init__((), parent=parent)
        self.seasons: Seasons | None = None
        self.lead = 1  # columns before the first round
        self.rounds = 0

    def set_seasons(self, seasons: Seasons | None) -> None:
        """Show `seasons` (None: an empty table)."""
        self.beginResetModel()
        self.seasons = seasons
        teams = seasons.teams if seasons is not None else ()
        divided = any(t.division for t in teams)
        head = ["Team", *(["Division"] if divided else [])]
        self.lead = len(head)
        self.rounds = len(seasons.rounds) if seasons is not None else 0
        titles = [f"Round {i.number}" + (f" ({w})" if (w := wording.when_text(i.date, i.time))
                                         else "")
                  for i in (seasons.rounds if seasons is not None else ())]
        totals = wording.SEASON_TOTAL_COLUMNS if seasons is not None else ()
        self.columns = [*head, *(str(n) for n in range(1, self.rounds + 1)),
                        *(name for name, _tip in totals)]
        self.tips = [*head, *(wording.round_column_tip(t) for t in titles),
                     *(tip for _name, tip in totals)]
        self.endResetModel()

    def team(self, row: int) -> TeamSeason | None:
        teams = self.seasons.teams if self.seasons is not None else ()
        return teams[row] if 0 <= row < len(teams) else None

    def row_of(self, name: str) -> int | None:
        teams = self.seasons.teams if self.seasons is not None else ()
        return next((i for i, t in enumerate(teams) if t.team == name), None)

    def round_at(self, row: int, column: int) -> SeasonRound | None:
        """The round shown in a cell, or None outside the strip."""
        team = self.team(row)
        i = column - self.lead
        return team.rounds[i] if team is not None and 0 <= i < self.rounds else None

    def breaks_marked(self) -> int:
        """How many games the strips mark as breaks."""
        return sum(1 for t in (self.seasons.teams if self.seasons else ())
                   for r in t.rounds for g in r.games if g.is_break)

    def row_count(self) -> int:
        return len(self.seasons.teams) if self.seasons is not None else 0

    def row_title(self, row: int) -> str:
        return ""

    def _total(self, team: TeamSeason, i: int) -> Any:
        return (team.home, team.away, len(team.byes), team.breaks, team.longest,
                "; ".join(team.warnings))[i]

    def cell(self, row: int, column: int, role: int) -> Any:
        team = self.team(row)
        if team is None:
            return None
        if role == Role.UserRole:
            return team.team
        played = self.round_at(row, column)
        if played is not None:
            return self._round_cell(played, role)
        if column < self.lead:
            text = (team.team, team.division or "")[column]
            if role == Role.DisplayRole:
                return (f"{wording.WARNING_SIGN} " if column == 0 and team.warnings
                        else "") + text
            if role == Role.ToolTipRole and column == 0 and team.warnings:
                return "\n".join(team.warnings)
            return None
        value = self._total(team, column - self.lead - self.rounds)
        if role == Role.DisplayRole:
            return str(value)
        if role == Role.TextAlignmentRole and isinstance(value, int):
            return RIGHT
        if role == Role.ToolTipRole and isinstance(value, str) and team.warnings and \
                column == len(self.columns) - 1:
            return "\n".join(team.warnings)
        return None

    def _round_cell(self, played: SeasonRound, role: int) -> Any:
        if role == Role.DisplayRole:
            return played.letter
        if role in (Role.ToolTipRole, ACCESSIBLE):
            return played.tip()
        if role == SIDE_ROLE:
            return played.side
        if role == BREAK_ROLE:
            return played.is_break
        return None


class TeamRoundsModel(ReadOnlyTable):
    """The selected team's rounds, a row per game and per bye: round, date, side, opponent,
    venue, pitch and whether the game is a break."""

    def __init__(self, parent: Any = None) -> None:
        columns = (*TEAM_COLUMNS, "Break")
        super().__init__(columns, [wording.COLUMN_TIPS[c] for c in columns], parent)
        self.rows: list[tuple[SeasonRound, Game | None]] = []

    def set_team(self, team: TeamSeason | None) -> None:
        self.beginResetModel()
        self.rows = [] if team is None else [
            (r, g) for r in team.rounds for g in (r.games or (None,))]
        self.endResetModel()

    def row_count(self) -> int:
        return len(self.rows)

    def row_title(self, row: int) -> str:
        return ""

    def cell(self, row: int, column: int, role: int) -> Any:
        played, game = self.rows[row]
        if role == SIDE_ROLE and column == 2:
            return game.side if game is not None else "bye"
        if role == BREAK_ROLE and column == 2:
            return game is not None and game.is_break
        if role not in (Role.DisplayRole, Role.ToolTipRole, ACCESSIBLE):
            return None
        if game is None:
            cells = (str(played.info.number), played.when, wording.SIDE_WORDS["bye"], "", "",
                     "", "")
        else:
            cells = (str(played.info.number), played.when, wording.SIDE_WORDS[game.side],
                     game.opponent or "", game.venue or "", game.pitch or "",
                     wording.break_note(game.side) if game.is_break else "")
        if role == Role.DisplayRole:
            if column == 2:  # the strip's letter first, so the side reads as in the strip
                letter = wording.SIDE_LETTERS[game.side if game else "bye"]
                mark = wording.BREAK_MARK if game is not None and game.is_break else ""
                return f"{letter}{mark}  {cells[2]}"
            return cells[column]
        return played.tip() if game is None else wording.strip_tip(
            played.title, game.side, game.opponent, game.place, game.is_break)
