"""What the printout holds, part by part, checked against the league and schedule directly (the
fixtures, teams and venues counted here from the league's own lists, not by the printout)."""

from __future__ import annotations

import datetime as dt
from pathlib import Path

import pytest

from leaguegrid import engine
from leaguegrid.app import league as opening
from leaguegrid.app import planning
from leaguegrid.app.export import ExportFailed
from leaguegrid.app.printout import (
    SCHEDULE_HEAD,
    TEAMS_HEAD,
    VENUES_HEAD,
    build_printout,
    write_pdf,
)
from leaguegrid.core.model import Fixture, League, Schedule, Settings
from leaguegrid.core.wording import CAUTION

DEMOS = Path(__file__).resolve().parents[2] / "demo_leagues"


@pytest.fixture(scope="module")
def clubday():
    opened = opening.open_league(DEMOS / "clubday.xlsx")
    outcome = planning.make_schedule(opened.league, opened.graph, 6, seed=1,
                                     hooks=engine.Hooks(budget=10))
    assert outcome.schedule is not None
    return opened.league, outcome.schedule


def test_a_part_per_round_then_team_then_venue(clubday):
    league, schedule = clubday
    printout = build_printout(league, schedule)
    teams = {t for f in league.fixtures for t in (f.home, f.away)}
    venues = {f.venue for f in league.fixtures}
    assert [p.head for p in printout.parts] == (
        [SCHEDULE_HEAD] * 6 + [TEAMS_HEAD] * len(teams) + [VENUES_HEAD] * len(venues))
    assert (len(teams), len(venues)) == (20, 1)
    assert printout.caution == CAUTION
    assert printout.league == "Brackenlow Juniors match day"


def test_round_parts_list_the_fixtures_and_who_is_not_playing(clubday):
    league, schedule = clubday
    printout = build_printout(league, schedule)
    teams = {t for f in league.fixtures for t in (f.home, f.away)}
    for number, part in enumerate(printout.parts[:6], start=1):
        mine = [f for f in league.fixtures if schedule.assignment[f.label] == number]
        assert part.title == f"Round {number}"
        assert part.table.columns == ("Home", "Away", "Venue", "Pitch", "Division")
        assert sorted(part.table.rows) == sorted(
            (f.home, f.away, f.venue, f.pitch, f.division) for f in mine)
        resting = teams - {t for f in mine for t in (f.home, f.away)}
        info = next(r for r in league.rounds if r.number == number)
        assert part.lines[0] == f"{info.date.isoformat()} {info.time.strftime('%H:%M')}"
        # the rounds of this demo are time slots of one day: not a bye, just no game now
        prefix = "Not playing in this time slot: "
        note = next(n for n in part.notes if n.startswith(prefix))
        assert set(note.removeprefix(prefix).split(", ")) == resting


def test_a_team_part_has_its_season_byes_in_place_and_totals(clubday):
    league, schedule = clubday
    printout = build_printout(league, schedule)
    part = next(p for p in printout.parts if p.title == "Brackenlow U10")
    games = {schedule.assignment[f.label]: f for f in league.fixtures
             if "Brackenlow U10" in (f.home, f.away)}
    assert [row[0] for row in part.table.rows] == [str(r) for r in range(1, 7)]
    for row in part.table.rows:
        f = games.get(int(row[0]))
        if f is None:
            assert row[2:] == ("Bye", "", "", "")
        else:
            side = "Home" if f.home == "Brackenlow U10" else "Away"
            other = f.away if side == "Home" else f.home
            assert row[2:] == (side, other, f.venue, f.pitch)
    home = sum(1 for f in games.values() if f.home == "Brackenlow U10")
    away = len(games) - home
    byes = 6 - len(games)
    assert part.notes == (f"{home} home game{'s' * (home != 1)}, {away} away game"
                          f"{'s' * (away != 1)}, {byes} bye{'s' * (byes != 1)}",)
    assert part.lines == ("Division U10", "Club Brackenlow")


def test_a_venue_part_is_a_grid_of_rounds_by_pitch(clubday):
    league, schedule = clubday
    part = build_printout(league, schedule).parts[-1]
    assert part.title == "Venue Brackenlow Park"
    assert part.table.columns == ("Round", "Date", "Mini 1", "Mini 2", "Pitch 3", "Pitch 4")
    assert part.table.keep == 2
    for row in part.table.rows:
        for pitch, cell in zip(part.table.columns[2:], row[2:], strict=True):
            here = [f"{f.label} ({f.division})" for f in league.fixtures
                    if f.pitch == pitch and schedule.assignment[f.label] == int(row[0])]
            assert cell.split("\n") == (here or [""])


def tiny_league(tmp_path: Path) -> tuple[League, Schedule]:
    """Three teams with no pitches and no dates: a bye a round, fixtures by label alone."""
    fixtures = [Fixture("A v B", "A", "B", "Field"), Fixture("B v C", "B", "C", "Field"),
                Fixture("C v A", "C", "A", "Field"), Fixture("Tidy-up", venue="Field")]
    source = tmp_path / "tiny.xlsx"
    source.write_bytes(b"not read")
    league = League("tiny", str(source), fixtures, settings=Settings(start_date=None))
    return league, Schedule(3, {"A v B": 1, "B v C": 2, "C v A": 3, "Tidy-up": 3})


def test_without_dates_pitches_or_teams(tmp_path):
    league, schedule = tiny_league(tmp_path)
    printout = build_printout(league, schedule)
    first = printout.parts[0]
    assert first.lines == ()
    assert first.table.columns == ("Home", "Away", "Venue")
    assert first.notes == ("1 fixture", "Bye: C")
    third = printout.parts[2]
    assert third.table.columns == ("Fixture", "Home", "Away", "Venue")
    assert sorted(third.table.rows) == [("C v A", "C", "A", "Field"),
                                        ("Tidy-up", "", "", "Field")]
    team_a = printout.parts[3]
    assert team_a.table.columns == ("Round", "Home/Away", "Opponent", "Venue")
    assert team_a.table.rows == (("1", "Home", "B", "Field"), ("2", "Bye", "", ""),
                                 ("3", "Away", "C", "Field"))
    venue = printout.parts[-1]
    assert venue.table.columns == ("Round", "Fixtures")
    assert venue.table.keep == 1
    assert venue.table.rows == (("1", "A v B"), ("2", "B v C"), ("3", "C v A\nTidy-up"))


def test_the_pdf_is_written_whole_and_never_over_the_workbook(tmp_path):
    league, _schedule = tiny_league(tmp_path)
    target = tmp_path / "out" / "schedule.pdf"
    target.parent.mkdir()
    assert write_pdf(target, b"%PDF-1.4 test", league) == target
    assert target.read_bytes() == b"%PDF-1.4 test"
    assert [p.name for p in target.parent.iterdir()] == ["schedule.pdf"]
    with pytest.raises(ExportFailed, match="it is the input file"):
        write_pdf(league.source, b"%PDF", league)
    assert Path(league.source).read_bytes() == b"not read"
    missing = tmp_path / "no such folder" / "x.pdf"
    with pytest.raises(ExportFailed) as failed:
        write_pdf(missing, b"%PDF", league)
    assert str(failed.value) == (f"could not write {missing}: the folder does not exist; "
                                 "nothing there was changed")


def test_rounds_with_dates_keep_date_order_on_team_pages(tmp_path):
    league, schedule = tiny_league(tmp_path)
    league.settings.start_date = dt.date(2027, 9, 4)
    team_a = build_printout(league, schedule).parts[3]
    assert [row[:3] for row in team_a.table.rows] == [
        ("1", "2027-09-04", "Home"), ("2", "2027-09-11", "Bye"), ("3", "2027-09-18", "Away")]
