"""What a printed schedule holds, as plain data (no Qt): the league's schedule round by round, then
a part per team (its season, byes and totals), then a part per venue (a grid of rounds by pitch).
Every part starts on a new page; the window lays the parts out on paper and paints them.

Rules:
- Round parts list every round 1..K with its date and time where the league has them, its
  fixtures (Home, Away, Venue, Pitch, Division; Fixture only where a fixture lacks a team) and
  the teams with a bye.
- Team parts list the team's rounds in date order, a bye as a row of its own, and the totals.
- Venue parts are a grid: a row per round the venue is used in (date order), a column per pitch
  (one "Fixtures" column where no pitch is given); a cell holds the fixtures, one a line.
- Where rounds are time slots of one day, the teams without a game are "not playing in this
  time slot" rather than having a bye.
- Columns empty in every row are left out; rows keep their text whole (the layout wraps it).
- The PDF is written through a temporary file moved into place, never over the workbook.
"""

from __future__ import annotations

from dataclasses import dataclass
from pathlib import Path

from leaguegrid.app.export import ExportFailed
from leaguegrid.core.dated import (
    DatedFixture,
    in_date_order,
    natural_key,
    round_order,
    team_fixtures,
    team_names,
    venue_fixtures,
    venue_names,
)
from leaguegrid.core.model import League, RoundInfo, Schedule
from leaguegrid.core.wording import CAUTION, plural, season_totals, when_text, write_failure
from leaguegrid.io.write.atomic import ExportError, atomic_write, refuse_overwriting_input
from leaguegrid.scheduling.breaks import team_byes
from leaguegrid.scheduling.dates import dated_fixtures, round_dates

SCHEDULE_HEAD = "Schedule by round"
TEAMS_HEAD = "Teams"
VENUES_HEAD = "Venues"
ROUND_COLUMNS = ("Fixture", "Home", "Away", "Venue", "Pitch", "Division")
TEAM_COLUMNS = ("Round", "Date", "Home/Away", "Opponent", "Venue", "Pitch")
NO_PITCH = "Pitch not given"
ALL_PITCHES = "Fixtures"


@dataclass(frozen=True)
class Table:
    """A header and rows of text; `keep` leading columns are repeated when the layout has to
    split the table's columns across the page width (the venue grid's Round and Date)."""

    columns: tuple[str, ...]
    rows: tuple[tuple[str, ...], ...]
    keep: int = 0


@dataclass(frozen=True)
class Part:
    """What starts on a new page: a running head, a title, lines under it, a table, notes."""

    head: str
    title: str
    lines: tuple[str, ...]
    table: Table
    notes: tuple[str, ...] = ()


@dataclass(frozen=True)
class Printout:
    """A schedule ready for paper: the league's name for the running head, the caution every
    page carries, and the parts in order (rounds, teams, venues)."""

    league: str
    caution: str
    parts: tuple[Part, ...]

    def count(self, head: str) -> int:
        """How many parts have the running head `head` (SCHEDULE_HEAD, TEAMS_HEAD, ...)."""
        return sum(1 for p in self.parts if p.head == head)


def _table(columns: tuple[str, ...], rows: list[tuple[str, ...]], keep: int = 0,
           always: tuple[str, ...] = ()) -> Table:
    """The table without the columns that are empty in every row (`always` are kept)."""
    used = [i for i, name in enumerate(columns)
            if name in always or any(row[i] for row in rows)]
    kept = sum(1 for i in used if i < keep)
    return Table(tuple(columns[i] for i in used),
                 tuple(tuple(row[i] for i in used) for row in rows), kept)


def _when(info: RoundInfo) -> str:
    return when_text(info.date, info.time)


def _round_part(info: RoundInfo, rows: list[DatedFixture], byes: list[str]) -> Part:
    some_without_team = any(not (r.fixture.home and r.fixture.away) for r in rows)
    cells = [(r.fixture.label if some_without_team else "", r.fixture.home or "",
              r.fixture.away or "", r.fixture.venue or "", r.fixture.pitch or "",
              r.fixture.division or "") for r in rows]
    lines = tuple(t for t in (_when(info), info.note) if t)
    notes = [plural(len(rows), "fixture")]
    if byes:
        notes.append(("Not playing in this time slot: " if info.time else "Bye: ")
                     + ", ".join(byes))
    return Part(SCHEDULE_HEAD, f"Round {info.number}", lines,
                _table(ROUND_COLUMNS, cells, always=("Home", "Away")), tuple(notes))


def _team_part(league: League, team: str, rows: list[DatedFixture], byes: list[RoundInfo]) -> Part:
    entries = [(r.date_order(), (str(r.round.number), _when(r.round), r.side(team).capitalize(),
                                 r.opponent(team) or "", r.fixture.venue or "",
                                 r.fixture.pitch or ""))
               for r in rows]
    entries += [(round_order(info), (str(info.number), _when(info), "Bye", "", "", ""))
                for info in byes]
    entries.sort(key=lambda e: e[0])
    known = league.teams.get(team)
    lines = tuple(t for t in ((f"Division {known.division}" if known and known.division else ""),
                              (f"Club {known.club}" if known and known.club else "")) if t)
    home = sum(1 for r in rows if r.side(team) == "home")
    totals = season_totals(home, len(rows) - home, len(byes))
    return Part(TEAMS_HEAD, team, lines,
                _table(TEAM_COLUMNS, [cells for _key, cells in entries], always=("Round",)),
                (totals,))


def _venue_part(venue: str, rows: list[DatedFixture]) -> Part:
    given = sorted({r.fixture.pitch for r in rows if r.fixture.pitch}, key=natural_key)
    pitches = [*given, NO_PITCH] if any(not r.fixture.pitch for r in rows) and given else given
    columns = ("Round", "Date", *(pitches or [ALL_PITCHES]))
    grid: dict[int, tuple[RoundInfo, dict[str, list[str]]]] = {}
    for r in rows:
        cell = r.fixture.label + (f" ({r.fixture.division})" if r.fixture.division else "")
        pitch = r.fixture.pitch or (NO_PITCH if given else ALL_PITCHES)
        grid.setdefault(r.round.number, (r.round, {}))[1].setdefault(pitch, []).append(cell)
    cells = [(str(info.number), _when(info), *("\n".join(at.get(p, [])) for p in columns[2:]))
             for info, at in grid.values()]
    return Part(VENUES_HEAD, f"Venue {venue}", (plural(len(rows), "fixture"),),
                _table(columns, cells, keep=2, always=("Round", *columns[2:])))


def _venue_parts(league: League, by_date: list[DatedFixture]) -> list[Part]:
    return [_venue_part(venue, venue_fixtures(by_date, venue))
            for venue in venue_names(league.fixtures)]


def venue_parts(league: League, schedule: Schedule) -> list[Part]:
    """A part per venue (in natural order): its rounds by date down, its pitches across (the
    window's Venues view shows these). Raises DatesError as build_printout does."""
    return _venue_parts(league, in_date_order(dated_fixtures(league, schedule)))


def part_counts(league: League, schedule: Schedule) -> tuple[int, int, int]:
    """How many round, team and venue parts the printout of `schedule` has (without making it)."""
    return schedule.rounds, len(team_names(league)), len(venue_names(league.fixtures))


def build_printout(league: League, schedule: Schedule) -> Printout:
    """The printout of `schedule`: a part per round, per team and per venue. Raises DatesError
    when the schedule does not match the league (as every export does)."""
    rows = dated_fixtures(league, schedule)
    infos = round_dates(league, schedule.rounds)
    byes = team_byes(league, schedule.assignment, schedule.rounds)
    by_round: dict[int, list[DatedFixture]] = {info.number: [] for info in infos}
    for r in rows:
        by_round[r.round.number].append(r)
    resting = {info.number: [t for t in team_names(league) if info.number in byes.get(t, ())]
               for info in infos}
    parts = [_round_part(info, by_round[info.number], resting[info.number]) for info in infos]
    by_date = in_date_order(rows)
    parts += [_team_part(league, team, team_fixtures(by_date, team),
                         [infos[n - 1] for n in byes.get(team, [])])
              for team in team_names(league)]
    parts += _venue_parts(league, by_date)
    return Printout(league.settings.league or league.name, CAUTION, tuple(parts))


def write_pdf(path: str | Path, data: bytes, league: League) -> Path:
    """Write the printed schedule's PDF to `path` through a temporary file moved into place,
    never over the league's own file; raises ExportFailed saying why."""
    try:
        refuse_overwriting_input(path, [league.source])
        with atomic_write(path, "wb") as handle:
            handle.write(data)
    except ExportError as err:
        raise ExportFailed(str(err), []) from err
    except OSError as err:
        raise ExportFailed(write_failure(str(path), err), []) from err
    return Path(path)
