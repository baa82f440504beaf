"""A schedule with its dates: what every export is handed, dated once by the app layer."""

from __future__ import annotations

import datetime as dt
import re
from collections.abc import Iterable, Sequence
from dataclasses import dataclass

from leaguegrid.core.model import Fixture, League, RoundInfo, Schedule


def natural_key(text: str | None) -> tuple:
    """Sort key reading digit runs as numbers, so "U8" comes before "U10" and "Pitch 2" before
    "Pitch 10"; case-insensitive, with the text itself breaking ties."""
    parts = re.split(r"(\d+)", text or "")
    return (tuple((0, int(p), "") if p.isdigit() else (1, 0, p.casefold()) for p in parts if p),
            text or "")


def round_order(info: RoundInfo) -> tuple:
    """Date, time (rounds without them last), then number: the order rounds are played in."""
    return (info.date is None, info.date or dt.date.min, info.time is None,
            info.time or dt.time.min, info.number)


@dataclass(frozen=True)
class DatedFixture:
    """A fixture of a schedule with the round it was given."""

    fixture: Fixture
    round: RoundInfo

    @property
    def time(self) -> dt.time | None:
        """When it starts: the fixture's own kick-off, else its round's time."""
        return self.fixture.time or self.round.time

    def sort_key(self) -> tuple:
        """Round, then division, venue, pitch and label (in natural order), so every export
        lists rows alike."""
        f = self.fixture
        return (self.round.number, natural_key(f.division), natural_key(f.venue),
                natural_key(f.pitch), natural_key(f.label))

    def date_order(self) -> tuple:
        """Date, start time (the fixture's own kick-off first), then the round order: how a
        team or a venue reads its games."""
        r, time = self.round, self.time
        return (r.date is None, r.date or dt.date.min, time is None, time or dt.time.min,
                r.number, *self.sort_key()[1:])

    def side(self, team: str) -> str:
        """'home' or 'away': where `team` plays this fixture."""
        return "home" if self.fixture.home == team else "away"

    def opponent(self, team: str) -> str | None:
        """The other team of the fixture, seen from `team`."""
        f = self.fixture
        return f.away if f.home == team else f.home


@dataclass(frozen=True)
class DatedSchedule:
    """A league's schedule with every fixture's round date and time (rows sorted by round),
    the league's time zone and the moment it was dated (the exports' time stamp)."""

    league: League
    schedule: Schedule
    rows: list[DatedFixture]
    time_zone: dt.tzinfo
    stamp: dt.datetime


def team_names(league: League) -> list[str]:
    """Every team, in natural order: those of the Teams sheet and those named by fixtures (a
    sheet, a calendar or a page each, in every export)."""
    names = set(league.teams)
    for f in league.fixtures:
        names.update(f.teams)
    return sorted(names, key=natural_key)


def club_teams(league: League, teams: list[str]) -> dict[str, set[str]]:
    """Club name -> its teams (Team.club), in natural order of club, for teams naming a club."""
    clubs: dict[str, set[str]] = {}
    for name in teams:
        team = league.teams.get(name)
        if team is not None and team.club:
            clubs.setdefault(team.club, set()).add(name)
    return dict(sorted(clubs.items(), key=lambda kv: natural_key(kv[0])))


def venue_names(fixtures: Iterable[Fixture]) -> list[str]:
    """Every venue the fixtures name, in natural order (a sheet or a page each)."""
    return sorted({f.venue for f in fixtures if f.venue}, key=natural_key)


def in_date_order(rows: Iterable[DatedFixture]) -> list[DatedFixture]:
    """The rows by date, time and round (DatedFixture.date_order)."""
    return sorted(rows, key=DatedFixture.date_order)


def team_fixtures(rows: Sequence[DatedFixture], team: str) -> list[DatedFixture]:
    """The rows `team` plays in, in the order of `rows`."""
    return [r for r in rows if team in (r.fixture.home, r.fixture.away)]


def venue_fixtures(rows: Sequence[DatedFixture], venue: str) -> list[DatedFixture]:
    """The rows played at `venue`, in the order of `rows`."""
    return [r for r in rows if r.fixture.venue == venue]


def teams_fixtures(rows: Sequence[DatedFixture], teams: set[str]) -> list[DatedFixture]:
    """The rows any of `teams` plays in (a club's), in the order of `rows`."""
    return [r for r in rows if teams.intersection(r.fixture.teams)]
