"""What the sheet readers share while one file is read: the report, the settings, the rounds,
and the canonical names of teams, venues, divisions and fixtures seen so far."""

from __future__ import annotations

from dataclasses import dataclass, field

from leaguegrid.core.model import Fixture, Settings, Team, Venue
from leaguegrid.io.read.names import NameBook
from leaguegrid.io.read.problems import Place, Report
from leaguegrid.io.read.rounds_sheet import RoundLookup


@dataclass
class ReadContext:
    report: Report
    settings: Settings = field(default_factory=Settings)
    shared_place: Place | None = None  # the Settings cell that gave Shared, when it did
    legs_place: Place | None = None  # the Settings cell that gave Legs, when it did
    lookup: RoundLookup = field(default_factory=RoundLookup)
    team_names: NameBook = field(init=False)
    venue_names: NameBook = field(init=False)
    division_names: NameBook = field(init=False)
    fixture_names: NameBook = field(init=False)
    club_names: NameBook = field(init=False)
    shared_columns: dict[str, str] = field(default_factory=dict)  # other Shared: key -> header
    team_shared: dict[str, str] = field(default_factory=dict)  # Shared of Teams: key -> name
    team_values: dict[str, dict[str, tuple[str, ...]]] = field(default_factory=dict)
    teams: dict[str, Team] = field(default_factory=dict)  # canonical name -> Team
    team_division: dict[str, tuple[str, Place]] = field(default_factory=dict)
    venues: dict[str, Venue] = field(default_factory=dict)  # canonical name -> Venue
    fixtures: list[Fixture] = field(default_factory=list)
    pin_places: dict[str, Place] = field(default_factory=dict)  # label -> its Round cell
    division_conflicts: set[tuple[str, str]] = field(default_factory=set)

    def __post_init__(self) -> None:
        self.team_names = NameBook("team", self.report)
        self.venue_names = NameBook("venue", self.report)
        self.division_names = NameBook("division", self.report)
        self.fixture_names = NameBook("fixture", self.report)
        self.club_names = NameBook("club", self.report)

    def add_team(self, name: str, place: Place) -> str:
        """Register a team name seen at `place`; return its canonical spelling."""
        canon = self.team_names.add(name, place)
        self.teams.setdefault(canon, Team(canon))
        return canon

    def add_venue(self, name: str, place: Place) -> str:
        """Register a venue name seen at `place`; return its canonical spelling."""
        canon = self.venue_names.add(name, place)
        self.venues.setdefault(canon, Venue(canon))
        return canon

    def set_division(self, team: str, division: str, place: Place) -> bool:
        """Record the team's division; a second, different division is an error naming both rows."""
        known = self.team_division.get(team)
        if known is None:
            self.team_division[team] = (division, place)
            self.teams[team].division = division
            return True
        if known[0] == division:
            return True
        if (team, division) in self.division_conflicts:
            return False
        self.division_conflicts.add((team, division))
        self.report.error(
            f"team '{team}' is in division '{known[0]}' ({known[1].where()}) and in division "
            f"'{division}' ({place.where()}): a team name belongs to one division; give each "
            f"division's team its own name, e.g. '{team} {division}'",
            place,
        )
        return False
