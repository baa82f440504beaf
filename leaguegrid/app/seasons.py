"""Each team's season in a schedule, as plain data (no Qt): its rounds home, away or bye, its
breaks, runs and totals, and the warnings a family would raise.

Rules:
- A team's rounds are 1..K in round order; a round holds the team's games there (none: a bye).
- A break is a game on the same side as the team's game before it, byes skipped (as in
  scheduling.breaks; the first game of each run of scheduling.rules.side_runs is not one).
- Warnings: three or more games in a row on one side (byes skipped); byes in two rounds next to
  each other (not where rounds are time slots of one day); home and away counts more than one
  apart; within a division, one team with two byes or more than another.
- Teams are those that play a fixture, in natural order.
"""

from __future__ import annotations

from dataclasses import dataclass, replace
from itertools import groupby

from leaguegrid.core import wording
from leaguegrid.core.dated import natural_key, team_names
from leaguegrid.core.model import Fixture, League, RoundInfo, Schedule
from leaguegrid.scheduling.breaks import team_byes
from leaguegrid.scheduling.dates import DatesError, round_dates
from leaguegrid.scheduling.rules import side_runs, team_sides
from leaguegrid.scheduling.score import is_time_slots

LONG_RUN = 3  # games in a row on one side that a family notices
BYES_APART = 2  # byes in rounds next to each other: this many in a row is a warning
BYES_GAP = 2  # a team with this many byes more than another of its division
HOME_GAP = 1  # home and away counts further apart than this


@dataclass(frozen=True)
class Game:
    """One game of a team: its fixture, side, opponent and place, and whether it is a break."""

    fixture: str
    side: str  # "home" | "away"
    opponent: str | None
    venue: str | None
    pitch: str | None
    is_break: bool

    @property
    def place(self) -> str:
        """'Alder Green, pitch 2', 'Alder Green' or ''."""
        if not self.venue:
            return ""
        return self.venue + (f", pitch {self.pitch}" if self.pitch else "")


@dataclass(frozen=True)
class SeasonRound:
    """A round of one team's season: the round and the team's games in it (none: a bye)."""

    info: RoundInfo
    games: tuple[Game, ...]

    @property
    def side(self) -> str:
        """'home', 'away' or 'bye' (the first game's side when a team plays twice)."""
        return self.games[0].side if self.games else "bye"

    @property
    def is_break(self) -> bool:
        return any(g.is_break for g in self.games)

    @property
    def letter(self) -> str:
        """'H', 'A' or 'B' (one letter a game when a team plays twice), then the break mark."""
        if not self.games:
            return wording.SIDE_LETTERS["bye"]
        return "".join(wording.SIDE_LETTERS[g.side] + (wording.BREAK_MARK if g.is_break else "")
                       for g in self.games)

    @property
    def when(self) -> str:
        return wording.when_text(self.info.date, self.info.time)

    @property
    def title(self) -> str:
        """'Round 3 (2027-09-18)' or 'Round 3'."""
        return f"Round {self.info.number}" + (f" ({self.when})" if self.when else "")

    def tip(self) -> str:
        """The round in words, one line a game."""
        if not self.games:
            return wording.strip_tip(self.title, "bye", None, "", False)
        return "\n".join(wording.strip_tip(self.title, g.side, g.opponent, g.place, g.is_break)
                         for g in self.games)


@dataclass(frozen=True)
class TeamSeason:
    """One team's rounds 1..K, totals, longest runs and warnings."""

    team: str
    division: str | None
    rounds: tuple[SeasonRound, ...]
    home: int
    away: int
    byes: tuple[int, ...]
    breaks: int
    longest_home: int
    longest_away: int
    warnings: tuple[str, ...]

    @property
    def totals(self) -> str:
        """'3 home games, 2 away games, 1 bye'."""
        return wording.season_totals(self.home, self.away, len(self.byes))

    @property
    def longest(self) -> str:
        return wording.longest_run_text(self.longest_home, self.longest_away)


@dataclass(frozen=True)
class Seasons:
    """Every team's season in one schedule, and all the warnings (team by team, then the
    divisions' byes)."""

    rounds: tuple[RoundInfo, ...]
    teams: tuple[TeamSeason, ...]
    warnings: tuple[str, ...]
    time_slots: bool = False

    @property
    def breaks(self) -> int:
        return sum(t.breaks for t in self.teams)

    def team(self, name: str) -> TeamSeason | None:
        return next((t for t in self.teams if t.team == name), None)


def _infos(league: League, rounds: int) -> list[RoundInfo]:
    """Rounds 1..K with their dates, or numbers only when they cannot be dated."""
    try:
        return round_dates(league, rounds)
    except DatesError:
        return [RoundInfo(n) for n in range(1, rounds + 1)]


def _division(league: League, team: str, fixtures: list[Fixture]) -> str | None:
    known = league.teams.get(team)
    if known is not None and known.division:
        return known.division
    return next((f.division for f in fixtures if f.division), None)


def _consecutive(rounds: list[int]) -> list[list[int]]:
    """The runs of rounds next to each other: [1, 2, 4] -> [[1, 2], [4]]."""
    return [[r for _, r in group]
            for _, group in groupby(enumerate(rounds), key=lambda pair: pair[1] - pair[0])]


def _team_season(team: str, sides: list[tuple[str, str]], by_label: dict[str, Fixture],
                 schedule: Schedule, infos: list[RoundInfo], byes: list[int], slots: bool,
                 division: str | None) -> TeamSeason:
    runs = side_runs(sides, schedule.assignment)
    per_round: dict[int, list[Game]] = {}
    warnings: list[str] = []
    for side, run in runs:
        for i, (r, label) in enumerate(run):
            f = by_label[label]
            other = f.away if side == "home" else f.home
            per_round.setdefault(r, []).append(
                Game(label, side, other, f.venue, f.pitch, is_break=i > 0))
        if len(run) >= LONG_RUN:
            warnings.append(wording.run_warning(team, side, [r for r, _ in run]))
    if not slots:
        warnings += [wording.bye_run_warning(team, together) for together in _consecutive(byes)
                     if len(together) >= BYES_APART]
    home = sum(len(run) for side, run in runs if side == "home")
    away = sum(len(run) for side, run in runs if side == "away")
    if abs(home - away) > HOME_GAP:
        warnings.append(wording.home_balance_warning(team, home, away))

    def longest(side: str) -> int:
        return max((len(run) for s, run in runs if s == side), default=0)

    return TeamSeason(
        team, division,
        tuple(SeasonRound(info, tuple(per_round.get(info.number, ()))) for info in infos),
        home, away, tuple(byes), sum(len(run) - 1 for _, run in runs),
        longest("home"), longest("away"), tuple(warnings))


def _unequal_byes(seasons: list[TeamSeason]) -> dict[str, list[str]]:
    """Division warnings about byes, keyed by the teams they name."""
    out: dict[str, list[str]] = {}
    keyed = sorted(seasons, key=lambda s: natural_key(s.division))
    for division, group in groupby(keyed, key=lambda s: s.division):
        members = list(group)
        most = max(members, key=lambda s: len(s.byes))
        fewest = min(members, key=lambda s: len(s.byes))
        if len(most.byes) - len(fewest.byes) >= BYES_GAP:
            text = wording.unequal_byes_warning(division, (most.team, len(most.byes)),
                                                (fewest.team, len(fewest.byes)))
            for name in (most.team, fewest.team):
                out.setdefault(name, []).append(text)
    return out


def team_seasons(league: League, schedule: Schedule) -> Seasons:
    """Every playing team's season in `schedule`, with the warnings."""
    infos = _infos(league, schedule.rounds)
    slots = is_time_slots(league)
    by_label = {f.label: f for f in league.fixtures}
    sides = team_sides(league)
    byes = team_byes(league, schedule.assignment, schedule.rounds)
    mine: dict[str, list[Fixture]] = {}
    for f in league.fixtures:
        for t in f.teams:
            mine.setdefault(t, []).append(f)
    seasons = [_team_season(team, sides.get(team, []), by_label, schedule, infos,
                            byes.get(team, []), slots, _division(league, team, mine[team]))
               for team in team_names(league) if team in mine]
    shared = {} if slots else _unequal_byes(seasons)
    division_warnings: list[str] = []
    done = []
    for s in seasons:
        extra = shared.get(s.team, [])
        division_warnings += [w for w in extra if w not in division_warnings]
        done.append(replace(s, warnings=s.warnings + tuple(extra)) if extra else s)
    own = [w for s in seasons for w in s.warnings]
    return Seasons(tuple(infos), tuple(done), tuple(own + division_warnings), slots)
