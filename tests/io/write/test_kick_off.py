"""A fixture's own Kick-off (the Fixtures sheet's Time) is its start in every export, over its
round's time; a fixture without one keeps the round's time."""

from __future__ import annotations

import csv
import datetime as dt
import re

import openpyxl

from leaguegrid.core.model import Schedule
from leaguegrid.io.read.league_reader import load_league
from leaguegrid.io.write.calendar_xlsx import CalendarSummary, write_calendar_xlsx
from leaguegrid.io.write.csv_out import write_schedule_csv
from leaguegrid.io.write.ics import write_ics_files
from leaguegrid.scheduling.dates import date_schedule

SUMMER = dt.date(2027, 6, 5)  # Europe/Berlin keeps summer time (CEST, UTC+2) then
NOW = dt.datetime(2027, 5, 1, 12, 0, tzinfo=dt.UTC)


def league_book(path):
    book = openpyxl.Workbook()
    fixtures = book.active
    fixtures.title = "Fixtures"
    for row in (["Home Team", "Away Team", "Ground", "Kick-off"],
                ["Herons", "Otters", "Mill Field", "10:30"],
                ["Kites", "Voles", "Brook Lane", None]):
        fixtures.append(row)
    rounds = book.create_sheet("Rounds")
    rounds.append(["Round", "Date", "Time"])
    rounds.append([1, SUMMER, "09:00"])
    settings = book.create_sheet("Settings")
    settings.append(["Setting", "Value"])
    settings.append(["Time zone", "Europe/Berlin"])
    book.save(path)
    return path


def dated(tmp_path):
    result = load_league(league_book(tmp_path / "kickoff.xlsx"))
    assert result.ok, [str(p) for p in result.problems]
    league = result.league
    schedule = Schedule(1, {f.label: 1 for f in league.fixtures})
    return date_schedule(league, schedule, now=NOW)


def events(text: str) -> dict[str, dict[str, str]]:
    """SUMMARY -> {property: value} for each VEVENT (RFC 5545 3.1: a line starting with a space
    continues the one before)."""
    out = {}
    unfolded = re.sub(r"\r\n[ \t]", "", text)
    for block in re.findall(r"BEGIN:VEVENT\r\n(.*?)END:VEVENT", unfolded, re.S):
        props = dict(line.split(":", 1) for line in block.split("\r\n") if line)
        out[props["SUMMARY"]] = props
    return out


def test_ics_starts_at_the_fixtures_kick_off(tmp_path):
    paths = write_ics_files(tmp_path / "ics", dated(tmp_path))
    league = next(p for p in paths if p.name.startswith("league-"))
    found = events(league.read_bytes().decode("utf-8"))
    # 10:30 CEST = 08:30 UTC, lasting 90 minutes; the other fixture keeps the round's 09:00
    assert found["Herons v Otters"]["DTSTART"] == "20270605T083000Z"
    assert found["Herons v Otters"]["DTEND"] == "20270605T100000Z"
    assert found["Kites v Voles"]["DTSTART"] == "20270605T070000Z"


def test_csv_and_excel_calendar_show_the_kick_off(tmp_path):
    schedule = dated(tmp_path)
    write_schedule_csv(tmp_path / "out.csv", schedule)
    with open(tmp_path / "out.csv", encoding="utf-8-sig", newline="") as handle:
        rows = {r["Fixture"]: r["Time"] for r in csv.DictReader(handle)}
    assert rows == {"Herons v Otters": "10:30", "Kites v Voles": "09:00"}
    summary = CalendarSummary.for_schedule(schedule.league, schedule.schedule, clashes=0,
                                           min_rounds=1)
    write_calendar_xlsx(tmp_path / "out.xlsx", schedule, summary)
    sheet = openpyxl.load_workbook(tmp_path / "out.xlsx")["Calendar"]
    header = [c.value for c in sheet[1]]
    times = {r[header.index("Fixture")]: r[header.index("Time")]
             for r in sheet.iter_rows(min_row=2, values_only=True)}
    assert times == {"Herons v Otters": dt.time(10, 30), "Kites v Voles": dt.time(9, 0)}
