"""The schedule as CSV, read back with the csv module: exact header and rows, formula-looking
text quoted, atomic writing, the input never overwritten."""

from __future__ import annotations

import csv
import datetime as dt

import pytest

from leaguegrid.core.model import Fixture, League, RoundInfo, Schedule, Settings
from leaguegrid.io.write.atomic import InputOverwriteError
from leaguegrid.io.write.csv_out import protect_text, write_schedule_csv
from leaguegrid.scheduling.dates import date_schedule


def league_and_schedule(source: str = "") -> tuple[League, Schedule]:
    day = dt.date(2025, 10, 4)
    fixtures = [
        Fixture("=Hawks v Kite", "=Hawks", "Kite", "Brackenhill Park", "Pitch 2", "U10"),
        Fixture("Kite v Linnet", "Kite", "Linnet", "Brackenhill Park", "Pitch 1", "U10"),
        Fixture("+Plus v -Minus", "+Plus", "-Minus", "@Tarn Field", None, "U12"),
        Fixture("Linnet v Wren, \"B\"", "Linnet", "Wren, \"B\"", "Ölmühle Ground", None, "U10"),
    ]
    league = League(
        name="Kite Saturday",
        source=source,
        fixtures=fixtures,
        rounds=[RoundInfo(1, day, dt.time(9, 0)), RoundInfo(2, day, dt.time(9, 45))],
        rounds_fixed=True,
        settings=Settings(),
    )
    schedule = Schedule(2, {"=Hawks v Kite": 2, "Kite v Linnet": 1, "+Plus v -Minus": 1,
                            "Linnet v Wren, \"B\"": 2})
    return league, schedule


def test_rows_exact(tmp_path):
    league, schedule = league_and_schedule()
    out = tmp_path / "schedule.csv"
    write_schedule_csv(out, date_schedule(league, schedule))
    raw = out.read_bytes()
    assert raw.startswith(b"\xef\xbb\xbf")  # UTF-8 BOM, so spreadsheets read accents right
    with out.open(encoding="utf-8-sig", newline="") as fh:
        rows = list(csv.reader(fh))
    assert rows == [
        ["Round", "Date", "Time", "Fixture", "Home", "Away", "Venue", "Pitch", "Division"],
        ["1", "2025-10-04", "09:00", "Kite v Linnet", "Kite", "Linnet", "Brackenhill Park",
         "Pitch 1", "U10"],
        ["1", "2025-10-04", "09:00", "'+Plus v -Minus", "'+Plus", "'-Minus", "'@Tarn Field", "",
         "U12"],
        ["2", "2025-10-04", "09:45", "'=Hawks v Kite", "'=Hawks", "Kite", "Brackenhill Park",
         "Pitch 2", "U10"],
        ["2", "2025-10-04", "09:45", "Linnet v Wren, \"B\"", "Linnet", "Wren, \"B\"",
         "Ölmühle Ground", "", "U10"],
    ]
    assert [p.name for p in tmp_path.iterdir()] == ["schedule.csv"]


def test_every_fixture_once_and_no_team_twice_in_a_round(tmp_path):
    league, schedule = league_and_schedule()
    out = tmp_path / "schedule.csv"
    write_schedule_csv(out, date_schedule(league, schedule))
    with out.open(encoding="utf-8-sig", newline="") as fh:
        rows = list(csv.DictReader(fh))
    labels = [r["Fixture"].removeprefix("'") for r in rows]
    assert sorted(labels) == sorted(f.label for f in league.fixtures)
    for r in {row["Round"] for row in rows}:
        teams = [row[s] for row in rows if row["Round"] == r for s in ("Home", "Away")]
        assert len(teams) == len(set(teams))


def test_protect_text():
    assert [protect_text(t) for t in ("=1+1", "+44", "-x", "@a", "\tcmd", "a=b", "")] == [
        "'=1+1", "'+44", "'-x", "'@a", "'\tcmd", "a=b", ""
    ]


def test_numbers_only_rounds_leave_date_and_time_blank(tmp_path):
    league, schedule = league_and_schedule()
    league.rounds, league.rounds_fixed = [], False
    out = tmp_path / "s.csv"
    write_schedule_csv(out, date_schedule(league, schedule))
    with out.open(encoding="utf-8-sig", newline="") as fh:
        rows = list(csv.DictReader(fh))
    assert {(r["Round"], r["Date"], r["Time"]) for r in rows} == {("1", "", ""), ("2", "", "")}


def test_failure_mid_write_leaves_the_old_file(tmp_path, monkeypatch):
    league, schedule = league_and_schedule()
    out = tmp_path / "s.csv"
    out.write_text("old\n")
    real_writer = csv.writer

    class BreaksOnThirdRow:
        def __init__(self, handle):
            self.inner = real_writer(handle)
            self.rows = 0

        def writerow(self, row):
            self.rows += 1
            if self.rows == 3:
                raise RuntimeError("interrupted")
            self.inner.writerow(row)

        def writerows(self, rows):
            for row in rows:
                self.writerow(row)

    monkeypatch.setattr(csv, "writer", BreaksOnThirdRow)
    with pytest.raises(RuntimeError, match="interrupted"):
        write_schedule_csv(out, date_schedule(league, schedule))
    assert out.read_text() == "old\n"
    assert [p.name for p in tmp_path.iterdir()] == ["s.csv"]


def test_never_overwrites_the_input(tmp_path):
    source = tmp_path / "league.csv"
    source.write_text("Fixture,Home,Away\n")
    league, schedule = league_and_schedule(source=str(source))
    with pytest.raises(InputOverwriteError):
        write_schedule_csv(source, date_schedule(league, schedule))
    assert source.read_text() == "Fixture,Home,Away\n"


def test_demo_league_round_trip(tmp_path):
    from pathlib import Path

    from leaguegrid.clashes.graph import build_clash_graph
    from leaguegrid.io.read.league_reader import load_league
    from leaguegrid.scheduling.draw import plan

    demo = Path(__file__).resolve().parents[3] / "demo_leagues" / "clubday.xlsx"
    league = load_league(demo).league
    graph = build_clash_graph(league)
    schedule = plan(league, graph, 6, seed=9).schedule
    out = tmp_path / "clubday.csv"
    write_schedule_csv(out, date_schedule(league, schedule))
    with out.open(encoding="utf-8-sig", newline="") as fh:
        rows = list(csv.DictReader(fh))
    assert sorted(r["Fixture"] for r in rows) == sorted(f.label for f in league.fixtures)
    for r in rows:
        assert int(r["Round"]) == schedule.assignment[r["Fixture"]]
        assert r["Date"] == "2027-10-02"
        assert r["Pitch"] == league.fixture(r["Fixture"]).pitch
    slot = {1: "09:00", 2: "09:50", 3: "10:40", 4: "11:30", 5: "12:20", 6: "13:10"}
    assert all(r["Time"] == slot[int(r["Round"])] for r in rows)
    text = out.read_text(encoding="utf-8-sig")
    assert not any(clash.reason in text for clash in league.clash_rows)
