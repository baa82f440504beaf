"""The Teams and Fixtures sheets, and fixtures generated from Teams by round-robin."""

from __future__ import annotations

import datetime as dt
from collections import Counter
from dataclasses import dataclass, field

from leaguegrid.core.model import Fixture
from leaguegrid.core.names import name_key
from leaguegrid.core.round_robin import pairings, seat_teams
from leaguegrid.core.seating import Grounds, Season, seat_for_grounds
from leaguegrid.io.read.columns import Row, Table, require
from leaguegrid.io.read.context import ReadContext
from leaguegrid.io.read.names import NameBook
from leaguegrid.io.read.problems import Place
from leaguegrid.io.read.rounds_sheet import NOT_TIME, round_cell
from leaguegrid.io.read.values import date_advice, split_values, to_date, to_time, yes_no

TEAMS_COLUMNS = {
    "team": "Team",
    "venue": "Venue",
    "division": "Division",
    "club": "Club",
    "coach": "Coach",
}
FIXTURES_COLUMNS = {
    "fixture": "Fixture",
    "home": "Home",
    "away": "Away",
    "venue": "Venue",
    "pitch": "Pitch",
    "division": "Division",
    "round": "Round",
    "date": "Date",
    "time": "Time",
    "played": "Played",
    "score": "Score",
}
READ_NOT_NOTED = {
    "fixture", "home", "away", "venue", "pitch", "division", "round", "date", "time", "played"
}
STANDARD_SHARED = {"home", "away", "venue"}
TEAM_READ = {"team", "venue", "division", "club"}  # Teams columns that are no Shared column


@dataclass
class TeamsRead:
    """What the Teams sheet gave: its teams in order, their rows, and where they were."""

    order: list[str] = field(default_factory=list)  # canonical names in sheet order
    sheet: str = "Teams"  # the sheet's name as written
    team_header: str = "Team"
    division_header: str = "Division"
    rows: dict[str, int] = field(default_factory=dict)  # canonical name -> Teams row


def read_teams(table: Table, ctx: ReadContext) -> TeamsRead:
    """Teams with their venue (home ground), division and club."""
    out = TeamsRead(
        sheet=table.sheet or "Teams",
        team_header=table.header("team"),
        division_header=table.header("division"),
    )
    if not require(table, "team", "Team", ctx.report):
        return out
    for row in table.rows:
        name = table.text(row, "team")
        if name is None:
            ctx.report.error("the team name is missing", table.at(row, "team"))
            continue
        known = ctx.team_names.get(name)
        if known in out.rows:
            ctx.report.error(
                f"the team is listed twice (rows {out.rows[known]} and {row.number})",
                table.at(row, "team"),
            )
            continue
        team = ctx.teams[ctx.add_team(name, table.at(row, "team"))]
        out.order.append(team.name)
        out.rows[team.name] = row.number
        if venue := table.text(row, "venue"):
            team.venue = ctx.add_venue(venue, table.at(row, "venue"))
        if division := table.text(row, "division"):
            place = table.at(row, "division")
            ctx.set_division(team.name, ctx.division_names.add(division, place), place)
        if club := table.text(row, "club"):
            team.club = ctx.club_names.add(club, table.at(row, "club"))
    return out


def read_team_shared(table: Table, teams: TeamsRead, ctx: ReadContext) -> None:
    """Each team's values in the Shared columns of the Teams sheet (a coach; a cell may hold
    several, ';'-separated), spellings matched by the name key."""
    for key, name in ctx.team_shared.items():
        book = NameBook(name.casefold(), ctx.report)
        for row in table.rows:
            team = ctx.team_names.get(table.text(row, "team") or "")
            text = table.text(row, key)
            if team is None or text is None or teams.rows.get(team) != row.number:
                continue
            place = table.at(row, key)
            values = tuple(dict.fromkeys(book.add(v, place) for v in split_values(text)))
            ctx.team_values.setdefault(team, {})[name] = values


def add_team_shared(fixtures: list[Fixture], ctx: ReadContext) -> None:
    """Give each fixture its teams' values of the Teams sheet's Shared columns."""
    for fixture in fixtures:
        for name in ctx.team_shared.values():
            values = [v for t in fixture.teams for v in ctx.team_values.get(t, {}).get(name, ())]
            if values:
                fixture.shared[name] = tuple(dict.fromkeys(values))


def generate_fixtures(teams: TeamsRead, ctx: ReadContext, grounds: Grounds) -> list[Fixture]:
    """A single round-robin inside each division (teams with no division form one group), in
    the timetable's order with its home sides, teams seated to fit their `grounds` (pitches,
    closed rounds, grounds kept apart); with Legs = 2 the return fixtures follow, home and
    away swapped."""
    groups: dict[str | None, list[str]] = {}
    for name in teams.order:
        groups.setdefault(ctx.teams[name].division, []).append(name)
    ground = {name: name_key(team.venue) if team.venue else None
              for name, team in ctx.teams.items()}
    if "venue" in {name_key(c) for c in ctx.settings.shared}:
        season = Season(ctx.settings.legs, ctx.settings.mirrored and ctx.settings.return_half)
        seated = seat_for_grounds(list(groups.values()), ground, grounds, season)
    else:  # grounds do not clash: any seating fits them
        seated = seat_teams(list(groups.values()), ground)
    first: list[Fixture] = []
    for (division, _), members in zip(groups.items(), seated, strict=True):
        if len(members) < 2:
            ctx.report.warn(
                "the division has only one team, so it has no fixtures",
                Place(teams.sheet, teams.rows[members[0]], teams.division_header, division),
            )
        for home, away in pairings(members):
            first.append(_generated(home, away, division, 1, ctx))
    fixtures = list(first)
    if ctx.settings.legs == 2:
        fixtures += [_generated(f.away or "", f.home or "", f.division, 2, ctx) for f in first]
    taken: set[str] = set()
    for fixture in fixtures:  # team names holding " v " could make two labels alike
        base, n = fixture.label, 1
        while name_key(fixture.label) in taken:
            n += 1
            fixture.label = f"{base} ({n})"
        taken.add(name_key(fixture.label))
    return fixtures


def _generated(home: str, away: str, division: str | None, leg: int, ctx: ReadContext) -> Fixture:
    fixture = Fixture(
        f"{home} v {away}",
        home=home,
        away=away,
        venue=ctx.teams[home].venue,
        division=division,
        leg=leg,
    )
    if "division" in ctx.shared_columns and division:
        fixture.shared[ctx.shared_columns["division"]] = (division,)
    return fixture


@dataclass
class _Draft:
    """A Fixtures row read but not yet labelled."""

    row: Row
    fixture: Fixture


def read_fixtures(table: Table, ctx: ReadContext) -> list[Fixture]:
    """Fixtures from the sheet, one per usable row; every problem reported at its cell."""
    if not _columns_ok(table, ctx):
        return []
    drafts: list[_Draft] = []
    labels: dict[str, int] = {}
    for row in table.rows:
        draft = _read_row(table, row, ctx)
        if draft is None:
            continue
        label = draft.fixture.label
        if label:
            key = name_key(label)
            if key in labels:
                ctx.report.error(
                    f"the label is used twice (rows {labels[key]} and {row.number}); labels that "
                    "differ only in case or spacing count as the same",
                    table.at(row, "fixture"),
                )
                continue
            labels[key] = row.number
        drafts.append(draft)
    _default_labels(drafts, set(labels))
    _set_legs(drafts)
    fixtures = [d.fixture for d in drafts]
    for d in drafts:
        if d.fixture.pin is not None:
            by = "round" if table.raw(d.row, "round") is not None else "date"
            ctx.pin_places[d.fixture.label] = table.at(d.row, by)
    return fixtures


def _columns_ok(table: Table, ctx: ReadContext) -> bool:
    if table.has("fixture") or (table.has("home") and table.has("away")):
        return True
    if not (table.has("home") or table.has("away")):
        ctx.report.error(
            f"{table.noun} has no Fixture column, nor Home and Away columns",
            table.sheet_place(),
        )
        return False
    return require(table, "home", "Home", ctx.report) and require(table, "away", "Away", ctx.report)


def _read_row(table: Table, row: Row, ctx: ReadContext) -> _Draft | None:
    """One Fixtures row as a draft fixture, or None when the row cannot be a fixture."""
    report = ctx.report
    label = table.text(row, "fixture")
    home_text, away_text = table.text(row, "home"), table.text(row, "away")
    if not label and not (home_text and away_text):
        missing = "away" if home_text else "home" if away_text else "fixture"
        if missing == "fixture" and not table.has("fixture"):
            missing = "home"
        if home_text or away_text:
            side = "Away" if home_text else "Home"
            shown = f"{home_text} v ?" if home_text else f"? v {away_text}"
            report.error(f"'{shown}' has no {side} team: give both Home and Away, or a "
                         "Fixture label", table.at(row, missing))
        else:
            report.error("the row needs a Fixture label or both Home and Away",
                         table.at(row, missing))
        return None
    if home_text and away_text and name_key(home_text) == name_key(away_text):
        report.error("Home and Away are the same team", table.at(row, "away"))
        return None
    home = ctx.add_team(home_text, table.at(row, "home")) if home_text else None
    away = ctx.add_team(away_text, table.at(row, "away")) if away_text else None
    fixture = Fixture(label or "", home=home, away=away, row=row.number)
    if division := table.text(row, "division"):
        place = table.at(row, "division")
        fixture.division = ctx.division_names.add(division, place)
        for team in fixture.teams:
            ctx.set_division(team, fixture.division, place)
    if venue := table.text(row, "venue"):
        fixture.venue = ctx.add_venue(venue, table.at(row, "venue"))
    fixture.pitch = table.text(row, "pitch")
    _read_pin(table, row, fixture, ctx)
    for key, header in ctx.shared_columns.items():
        if key != "division" and (text := table.text(row, key)):
            fixture.shared[header] = tuple(split_values(text))
    for key, column in table.columns.items():
        if key not in READ_NOT_NOTED and key in row.values:
            fixture.notes[column.header] = table.text(row, key) or ""
    return _Draft(row, fixture)


def _read_pin(table: Table, row: Row, fixture: Fixture, ctx: ReadContext) -> None:
    """Round or Date (a pin; both must name the same round), Time (the fixture's own kick-off),
    Played and Score: a played fixture is frozen in its round."""
    value = table.raw(row, "round")
    by_round = _rounds_of(table, row, "round", ctx)
    fixture.time = _kick_off(table, row, ctx)
    by_date = _rounds_of(table, row, "date", ctx)
    if by_date and len(by_date) > 1 and fixture.time is not None:
        by_date = [r.number for r in ctx.lookup.rounds
                   if r.number in by_date and r.time == fixture.time] or by_date
    if by_round and by_date and not set(by_round) & set(by_date):
        ctx.report.error(
            f"{table.header('date')} {table.text(row, 'date')} is "
            f"{_rounds_text(by_date)}, but {table.header('round')} says "
            f"{_rounds_text(by_round)}: give one, or make them agree",
            table.at(row, "date"),
        )
    elif by_round or by_date:
        rounds = sorted(set(by_round) & set(by_date)) if by_round and by_date else (
            by_round or by_date)
        key = "round" if by_round else "date"
        if len(rounds) > 1:
            ctx.report.error(
                f"several rounds fall on {table.text(row, key)} ({_rounds_text(rounds)}): "
                "write the round number"
                + (f" in the {table.header('round')} column" if key == "date" else ""),
                table.at(row, key),
            )
        else:
            fixture.pin = rounds[0]
    played = False
    mark = table.raw(row, "played")
    if mark is not None:
        answer = yes_no(mark)
        if answer is None:
            ctx.report.error(
                "not yes or no: write yes (or x) for a fixture already played",
                table.at(row, "played"),
            )
        played = bool(answer)
    if table.text(row, "score"):
        if mark is not None and yes_no(mark) is False:
            ctx.report.warn(
                "Played says no but Score holds a result; read as played", table.at(row, "played")
            )
        played = True
    if played and value is None and table.raw(row, "date") is None:
        ctx.report.error(
            "the fixture is marked played but has no Round: give the round it was played in",
            table.at(row, "round"),
        )
    fixture.played = played and fixture.pin is not None


def _rounds_of(table: Table, row: Row, key: str, ctx: ReadContext) -> list[int]:
    """The rounds a Round cell (a number or a date) or a Date cell names; [] when blank or
    after reporting why it names none."""
    value = table.raw(row, key)
    if value is None:
        return []
    if key == "date" and to_date(value) is None:
        ctx.report.error(f"not a date: {date_advice(value)}", table.at(row, key))
        return []
    rounds, message = round_cell(value, ctx.lookup)
    if message:
        ctx.report.error(message, table.at(row, key))
    return rounds


def _rounds_text(rounds: list[int]) -> str:
    """'round 3', or 'rounds 3, 4'."""
    if len(rounds) == 1:
        return f"round {rounds[0]}"
    return f"rounds {', '.join(map(str, rounds))}"


def _kick_off(table: Table, row: Row, ctx: ReadContext) -> dt.time | None:
    """The Time cell (or the time of a Date cell holding a date and a time), or None."""
    value = table.raw(row, "time")
    if value is None:
        day = table.raw(row, "date")
        if isinstance(day, dt.datetime) and day.time() != dt.time(0):
            return day.time()
        return None
    moment = to_time(value)
    if moment is None:
        ctx.report.error(NOT_TIME, table.at(row, "time"))
    return moment


def _default_labels(drafts: list[_Draft], taken: set[str]) -> None:
    """Unlabelled rows become 'Home v Away', then 'Home v Away (2)', … avoiding every label."""
    for draft in drafts:
        fixture = draft.fixture
        if fixture.label:
            continue
        base = f"{fixture.home} v {fixture.away}"
        label, n = base, 1
        while name_key(label) in taken:
            n += 1
            label = f"{base} ({n})"
        taken.add(name_key(label))
        fixture.label = label


def _set_legs(drafts: list[_Draft]) -> None:
    """Leg = which meeting of the two teams this is, in sheet order: 1 for the first, 2 for the
    return (whichever side is at home), 3 for a third meeting, ..."""
    seen: Counter[frozenset[str]] = Counter()
    for draft in drafts:
        fixture = draft.fixture
        if fixture.home and fixture.away:
            pair = frozenset((fixture.home, fixture.away))
            seen[pair] += 1
            fixture.leg = seen[pair]


def complete_from_teams(fixtures: list[Fixture], ctx: ReadContext) -> None:
    """A blank Division or Venue is filled from the Teams sheet: the teams' shared division,
    and the home team's ground."""
    for fixture in fixtures:
        if fixture.division is None:
            divisions = {ctx.teams[t].division for t in fixture.teams} - {None}
            if len(divisions) == 1:
                fixture.division = divisions.pop()
        if fixture.venue is None and fixture.home and ctx.teams[fixture.home].venue:
            fixture.venue = ctx.teams[fixture.home].venue
        if "division" in ctx.shared_columns and fixture.division:
            fixture.shared[ctx.shared_columns["division"]] = (fixture.division,)
