"""The Excel calendar, read back with openpyxl: every fixture once, rounds kept, no clash inside a
round, text never a formula, clash reasons never written, real date cells, atomic writing."""

from __future__ import annotations

import datetime as dt
import errno
import importlib.util
import io
import zipfile
from collections import Counter
from pathlib import Path

import openpyxl
import pytest
from openpyxl.writer.excel import ExcelWriter

from leaguegrid.core.model import ClashRow, Fixture, League, RoundInfo, Schedule, Settings, Team
from leaguegrid.io.write.atomic import InputOverwriteError, WriteError
from leaguegrid.io.write.calendar_xlsx import (
    CAUTION,
    CalendarSummary,
    build_calendar_workbook,
    sheet_title,
    write_calendar_xlsx,
)
from leaguegrid.scheduling.dates import date_schedule

REASONS = ("Family of Ilse B. (two children)", "Coach Tomas R. runs both sides")
TEAMS = {
    # team: (club, home ground)
    "Heron Reds": ("Heron Vale", "Marsh Lane"),
    "Heron Blues": ("Heron Vale", "Marsh Lane"),
    "Otterburn": ("Otter Rise", "Alder Green"),
    "=Hawks": ("Hawk Hill", "Stonecross Rec"),
    "Wrens/Falcons [A]": (None, "Tarn Field"),
    "Summary": ("Hawk Hill", "Tarn Field"),
}


def circle_rounds(teams: list[str]) -> list[tuple[int, str, str]]:
    """A single round-robin by the circle method (textbook construction): (round, home, away)."""
    n = len(teams)
    order = list(teams)
    games = []
    for r in range(1, n):
        for i in range(n // 2):
            home, away = order[i], order[n - 1 - i]
            if (r + i) % 2:
                home, away = away, home
            games.append((r, home, away))
        order = [order[0], order[-1], *order[1:-1]]
    return games


def make_league(source: str = "", rounds: list[RoundInfo] | None = None) -> tuple[League, Schedule]:
    """Six teams, 15 fixtures over 5 rounds (plus an empty sixth round), two clash rows."""
    games = circle_rounds(list(TEAMS))
    fixtures = [
        Fixture(f"{h} v {a}", h, a, venue=TEAMS[h][1], division="U12 North") for _, h, a in games
    ]
    assignment = {f"{h} v {a}": r for r, h, a in games}
    teams = {t: Team(t, "U12 North", venue, club) for t, (club, venue) in TEAMS.items()}
    by_round: dict[int, list[str]] = {}
    for label, r in assignment.items():
        by_round.setdefault(r, []).append(label)
    # clash rows between fixtures the schedule already keeps apart
    clash_rows = [
        ClashRow("a", "b", REASONS[0], 2, [(by_round[1][0], by_round[2][0])]),
        ClashRow("c", "d", REASONS[1], 3, [(by_round[3][1], by_round[4][2])]),
    ]
    league = League(
        name="Fenwick Vale Juniors",
        source=source,
        fixtures=fixtures,
        teams=teams,
        rounds=rounds or [],
        clash_rows=clash_rows,
        settings=Settings(start_date=dt.date(2025, 9, 6), skip=(dt.date(2025, 9, 20),)),
    )
    schedule = Schedule(
        6, assignment, seed=2**70 + 5, assignments=12345678901234567890,
        rules_counted=["clashes", "pins"], rules_generator=["Max home run 2"],
        notes=["412 of 1000 draws met the generator's rules"],
    )
    return league, schedule


def summary_for(league: League, schedule: Schedule) -> CalendarSummary:
    return CalendarSummary.for_schedule(league, schedule, clashes=41, min_rounds=5)


def written(tmp_path: Path, league: League, schedule: Schedule) -> Path:
    out = tmp_path / "calendar.xlsx"
    write_calendar_xlsx(out, date_schedule(league, schedule), summary_for(league, schedule))
    return out


def rows_of(ws) -> list[dict[str, object]]:
    header = [c.value for c in ws[1]]
    rows = ws.iter_rows(min_row=2, values_only=True)
    return [dict(zip(header, row, strict=True)) for row in rows]


def test_calendar_sheet_holds_every_fixture_once_in_its_round(tmp_path):
    league, schedule = make_league()
    wb = openpyxl.load_workbook(written(tmp_path, league, schedule))
    assert wb.sheetnames[:2] == ["Calendar", "Summary"]
    rows = rows_of(wb["Calendar"])
    labels = Counter(r["Fixture"] for r in rows)
    assert labels == Counter(f.label for f in league.fixtures)
    assert all(v == 1 for v in labels.values())
    for r in rows:
        f = league.fixture(r["Fixture"])
        assert r["Round"] == schedule.assignment[f.label]
        assert (r["Home"], r["Away"], r["Venue"], r["Division"]) == (
            f.home, f.away, f.venue, f.division
        )
    assert [r["Round"] for r in rows] == sorted(r["Round"] for r in rows)


def test_no_two_fixtures_in_a_round_share_a_team_or_a_listed_clash(tmp_path):
    league, schedule = make_league()
    wb = openpyxl.load_workbook(written(tmp_path, league, schedule))
    by_round: dict[int, list[dict]] = {}
    for r in rows_of(wb["Calendar"]):
        by_round.setdefault(r["Round"], []).append(r)
    clash_pairs = {frozenset(p) for c in league.clash_rows for p in c.pairs}
    for rows in by_round.values():
        teams = [t for r in rows for t in (r["Home"], r["Away"])]
        assert len(teams) == len(set(teams))
        labels = [r["Fixture"] for r in rows]
        assert not any(frozenset((a, b)) in clash_pairs for a in labels for b in labels if a != b)


def test_dates_follow_settings_and_are_real_date_cells(tmp_path):
    league, schedule = make_league()
    wb = openpyxl.load_workbook(written(tmp_path, league, schedule))
    ws = wb["Calendar"]
    expected = {1: dt.date(2025, 9, 6), 2: dt.date(2025, 9, 13), 3: dt.date(2025, 9, 27),
                4: dt.date(2025, 10, 4), 5: dt.date(2025, 10, 11)}
    for row in ws.iter_rows(min_row=2):
        round_cell, date_cell, time_cell = row[0], row[1], row[2]
        assert date_cell.is_date and date_cell.number_format == "yyyy-mm-dd"
        assert date_cell.value.date() == expected[round_cell.value]
        assert time_cell.value is None
    assert ws.freeze_panes == "A2"


def test_time_slots_are_time_cells(tmp_path):
    day = dt.date(2025, 10, 4)
    slots = [RoundInfo(n, day, dt.time(9 + n, 30)) for n in range(1, 7)]
    league, schedule = make_league(rounds=slots)
    wb = openpyxl.load_workbook(written(tmp_path, league, schedule))
    for row in wb["Calendar"].iter_rows(min_row=2):
        assert row[2].is_date and row[2].number_format == "hh:mm"
        assert row[2].value == dt.time(9 + row[0].value, 30)


def test_formula_looking_names_are_text_never_formulas(tmp_path):
    league, schedule = make_league()
    out = written(tmp_path, league, schedule)
    wb = openpyxl.load_workbook(out)
    hawks = [c for ws in wb for row in ws.iter_rows() for c in row if c.value == "=Hawks"]
    assert len(hawks) >= 5 + 5  # in the Calendar and on its own sheet, at least
    assert all(c.data_type == "s" for c in hawks)
    with zipfile.ZipFile(out) as z:
        sheets = [n for n in z.namelist() if n.startswith("xl/worksheets/sheet")]
        assert sheets and not any(b"<f>" in z.read(n) or b"<f " in z.read(n) for n in sheets)


def test_control_characters_are_dropped(tmp_path):
    league, schedule = make_league()
    league.fixtures[0].venue = "Marsh\x07 Lane\x1b"
    wb = openpyxl.load_workbook(written(tmp_path, league, schedule))
    first = rows_of(wb["Calendar"])
    assert "Marsh Lane" in {r["Venue"] for r in first}


def test_clash_reasons_appear_nowhere(tmp_path):
    league, schedule = make_league()
    out = written(tmp_path, league, schedule)
    wb = openpyxl.load_workbook(out)
    texts = [str(c.value) for ws in wb for row in ws.iter_rows() for c in row if c.value]
    for reason in REASONS:
        assert not any(reason in t for t in texts)
    with zipfile.ZipFile(out) as z:
        raw = b"".join(z.read(n) for n in z.namelist())
    assert b"Ilse" not in raw and b"Tomas" not in raw


def test_summary_sheet_rows(tmp_path):
    league, schedule = make_league(source=str(tmp_path / "fenwick.xlsx"))
    wb = openpyxl.load_workbook(written(tmp_path, league, schedule))
    assert [tuple(r) for r in wb["Summary"].iter_rows(values_only=True)] == [
        ("Item", "Value"),
        ("League", "Fenwick Vale Juniors"),
        ("Made from", "fenwick.xlsx"),
        ("Fixtures", 15),
        ("Clashes (pairs of fixtures that may not share a round)", 41),
        ("Clash reasons from the Clashes sheet (counted, not shown)", 2),
        ("Fewest rounds", 5),
        ("Rounds in this schedule", 6),
        ("Valid round assignments for 6 rounds (exact)", "12345678901234567890"),
        ("Schedule made by", "drawn uniformly at random from every valid assignment"),
        ("Seed", str(2**70 + 5)),
        ("Not in the counts", "breaks, byes, leg gap and the mirrored return half are the "
                              "schedule generator's objectives and rules; the counts above do "
                              "not include them"),
        ("Rule met, included in the counts", "clashes"),
        ("Rule met, included in the counts", "pins"),
        ("Rule met, enforced by the generator only", "Max home run 2"),
        ("Note", "412 of 1000 draws met the generator's rules"),
        ("Caution", CAUTION),
    ]


def test_summary_with_bounds_and_an_estimate(tmp_path):
    league, schedule = make_league()
    schedule.assignments = None
    summary = CalendarSummary.for_schedule(
        league, schedule, clashes=41, min_rounds=None, min_rounds_bounds=(5, 6),
        assignments_estimate="about 3.1e12 (95% range 2.8e12 to 3.4e12, sampling)",
    )
    wb = build_calendar_workbook(date_schedule(league, schedule), summary)
    values = {r[0]: r[1] for r in wb["Summary"].iter_rows(min_row=2, values_only=True)}
    assert values["Fewest rounds"] == "not proven: at least 5, at most 6"
    assert values["Valid round assignments for 6 rounds (estimate)"] == (
        "about 3.1e12 (95% range 2.8e12 to 3.4e12, sampling)"
    )


def test_team_sheets_in_date_order_with_home_away_and_opponent(tmp_path):
    league, schedule = make_league()
    wb = openpyxl.load_workbook(written(tmp_path, league, schedule))
    sheet_of = {"Heron Reds": "Heron Reds", "=Hawks": "=Hawks",
                "Wrens/Falcons [A]": "Wrens_Falcons _A_", "Summary": "Summary (2)"}
    for team, title in sheet_of.items():
        rows = rows_of(wb[title])
        mine = [f for f in league.fixtures if team in f.teams]
        assert sorted(r["Fixture"] for r in rows) == sorted(f.label for f in mine)
        assert [r["Date"] for r in rows] == sorted(r["Date"] for r in rows)
        for r in rows:
            f = league.fixture(r["Fixture"])
            assert r["Home/Away"] == ("home" if f.home == team else "away")
            assert r["Opponent"] == (f.away if f.home == team else f.home)


def test_venue_and_club_sheets(tmp_path):
    league, schedule = make_league()
    wb = openpyxl.load_workbook(written(tmp_path, league, schedule))
    marsh = rows_of(wb["Venue Marsh Lane"])
    assert sorted(r["Fixture"] for r in marsh) == sorted(
        f.label for f in league.fixtures if f.venue == "Marsh Lane"
    )
    hawk_hill = rows_of(wb["Club Hawk Hill"])
    assert sorted(r["Fixture"] for r in hawk_hill) == sorted(
        f.label for f in league.fixtures if {"=Hawks", "Summary"} & set(f.teams)
    )
    assert len(hawk_hill) == 9  # 5 + 5 fixtures, one of them between the two club teams
    assert "Club Otter Rise" in wb.sheetnames and not any("None" in n for n in wb.sheetnames)


def test_column_widths_fit_the_longest_value(tmp_path):
    league, schedule = make_league()
    wb = openpyxl.load_workbook(written(tmp_path, league, schedule))
    ws = wb["Calendar"]
    longest = max(len(f.label) for f in league.fixtures)
    assert ws.column_dimensions["D"].width == longest + 2


def test_sheet_titles_are_sanitised_cut_and_unique():
    taken: set[str] = set()
    assert sheet_title("Hawks/Falcons [A]: U10*?\\", taken) == "Hawks_Falcons _A__ U10___"
    long = "Upper Tarnwater Kingfisher Juniors U14"
    assert sheet_title(long, taken) == long[:31]
    assert sheet_title(long, taken) == "Upper Tarnwater Kingfisher (2)"
    assert sheet_title("history", taken) == "History_"
    assert sheet_title("'quoted'", taken) == "quoted"
    assert sheet_title("", taken) == "Sheet"
    assert all(len(t) <= 31 for t in taken)


def test_export_never_overwrites_the_input(tmp_path):
    source = tmp_path / "league.xlsx"
    source.write_bytes(b"the coordinator's workbook")
    league, schedule = make_league(source=str(source))
    with pytest.raises(InputOverwriteError):
        write_calendar_xlsx(source, date_schedule(league, schedule), summary_for(league, schedule))
    assert source.read_bytes() == b"the coordinator's workbook"


def test_failed_save_leaves_no_half_file(tmp_path, monkeypatch):
    league, schedule = make_league()
    out = tmp_path / "calendar.xlsx"
    out.write_bytes(b"last week's calendar")

    def broken_write(self):
        self._archive.writestr("xl/half.xml", "<half")
        raise OSError(errno.ENOSPC, "No space left on device")

    monkeypatch.setattr(ExcelWriter, "write_data", broken_write)
    with pytest.raises(WriteError) as failed:
        write_calendar_xlsx(out, date_schedule(league, schedule), summary_for(league, schedule))
    assert str(failed.value) == (f"could not write {out}: the disk is full; nothing there was "
                                 "changed")
    assert out.read_bytes() == b"last week's calendar"
    assert [p.name for p in tmp_path.iterdir()] == ["calendar.xlsx"]


# --- the demo leagues: rebuilt identically, loaded by the reader, planned and exported ---------

DEMO_DIR = Path(__file__).resolve().parents[3] / "demo_leagues"
DEMO_ROUNDS = {"small.xlsx": 4, "clubday.xlsx": 6, "season.xlsx": 6, "schedules.xlsx": 10}


def load_make_demos():
    script = DEMO_DIR.parent / "scripts" / "make_demos.py"
    spec = importlib.util.spec_from_file_location("make_demos", script)
    module = importlib.util.module_from_spec(spec)
    spec.loader.exec_module(module)
    return module


def cell_values(wb) -> dict[str, list[tuple]]:
    return {ws.title: [tuple(r) for r in ws.iter_rows(values_only=True)] for ws in wb}


def saved_and_read(wb) -> dict[str, list[tuple]]:
    buffer = io.BytesIO()
    wb.save(buffer)
    buffer.seek(0)
    return cell_values(openpyxl.load_workbook(buffer))


def test_demo_files_match_their_generator():
    make_demos = load_make_demos()
    assert set(make_demos.DEMOS) == set(DEMO_ROUNDS) | {"bigseason.xlsx", "association.xlsx"}
    for name, build in make_demos.DEMOS.items():
        on_disk = cell_values(openpyxl.load_workbook(DEMO_DIR / name))
        fresh = saved_and_read(build())
        assert on_disk == fresh, f"{name} differs from what make_demos.py writes: run it"
        assert saved_and_read(build()) == fresh  # deterministic


def planned_demo(name: str):
    from leaguegrid.clashes.graph import build_clash_graph
    from leaguegrid.io.read.league_reader import load_league
    from leaguegrid.scheduling.draw import plan

    result = load_league(DEMO_DIR / name)
    assert result.ok, [str(p) for p in result.problems]
    league = result.league
    graph = build_clash_graph(league)
    planned = plan(league, graph, DEMO_ROUNDS[name], seed=20251004)
    assert planned.status == "found", planned.reasons
    return league, graph, planned.schedule


@pytest.mark.parametrize("name", sorted(DEMO_ROUNDS))
def test_demo_league_calendar_round_trip(tmp_path, name):
    league, graph, schedule = planned_demo(name)
    out = tmp_path / "calendar.xlsx"
    summary = CalendarSummary.for_schedule(
        league, schedule, clashes=graph.number_of_edges(), min_rounds=DEMO_ROUNDS[name]
    )
    write_calendar_xlsx(out, date_schedule(league, schedule), summary)
    wb = openpyxl.load_workbook(out)
    rows = rows_of(wb["Calendar"])
    assert sorted(r["Fixture"] for r in rows) == sorted(f.label for f in league.fixtures)
    in_round: dict[int, list[str]] = {}
    for r in rows:
        assert r["Round"] == schedule.assignment[r["Fixture"]]
        in_round.setdefault(r["Round"], []).append(r["Fixture"])
    for labels in in_round.values():
        assert not any(graph.has_edge(a, b) for a in labels for b in labels if a < b)
    dated = [c for row in wb["Calendar"].iter_rows(min_row=2) for c in row[1:2] if c.value]
    assert len(dated) == len(rows) and all(c.is_date for c in dated)  # every demo has dates
    texts = [str(c.value) for ws in wb for row in ws.iter_rows() for c in row if c.value]
    for clash in league.clash_rows:
        assert not any(clash.reason in t for t in texts)
    summary_values = {r[0]: r[1] for r in wb["Summary"].iter_rows(min_row=2, values_only=True)}
    assert summary_values["Clash reasons from the Clashes sheet (counted, not shown)"] == len(
        league.clash_rows
    )
