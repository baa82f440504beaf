"""A sheet with the coordinator's own headers on the command line: read as it is by `check` and
`plan`, or matched with --columns (bad values are usage errors, exit 2)."""

from __future__ import annotations

import csv
import datetime as dt

import openpyxl
import pytest

from leaguegrid.app.project import Project, save_project

SATURDAYS = [dt.date(2027, 3, 6), dt.date(2027, 3, 13), dt.date(2027, 3, 20)]


def own_headers(path, header=("Home Team", "Away Team", "Ground", "Kick-off", "Match Date")):
    """Four invented teams, three rounds by date; one fixture pinned by its date."""
    wb = openpyxl.Workbook()
    sheet = wb.active
    sheet.title = "Fixtures"
    sheet.append(list(header))
    for row in (["Herons", "Otters", "Mill Field", "10:30", SATURDAYS[1]],
                ["Kites", "Voles", "Brook Lane", None, None],
                ["Herons", "Kites", "Mill Field", None, None],
                ["Otters", "Voles", "Brook Lane", "14:00", None]):
        sheet.append(row)
    rounds = wb.create_sheet("Rounds")
    rounds.append(["Round", "Date"])
    for number, day in enumerate(SATURDAYS, start=1):
        rounds.append([number, day])
    wb.save(path)
    return path


def test_check_reads_the_usual_headers(cli, tmp_path):
    code, out, err = cli("check", str(own_headers(tmp_path / "spring.xlsx")))
    assert (code, err) == (0, "")
    assert "  Herons v Otters  [at Mill Field, round 2, starts 10:30]" in out.splitlines()
    lines = out.splitlines()
    assert lines[lines.index("Problems: none") + 1] == "Usable: yes"


def test_plan_keeps_the_date_pin_and_writes_the_kick_off(cli, tmp_path):
    book = own_headers(tmp_path / "spring.xlsx")
    code, out, _ = cli("plan", str(book), "--rounds", "3", "--seed", "4",
                       "--csv", str(tmp_path / "out.csv"))
    assert code == 0
    with open(tmp_path / "out.csv", encoding="utf-8-sig", newline="") as handle:
        rows = {r["Fixture"]: r for r in csv.DictReader(handle)}
    assert (rows["Herons v Otters"]["Round"], rows["Herons v Otters"]["Date"],
            rows["Herons v Otters"]["Time"]) == ("2", "2027-03-13", "10:30")
    assert rows["Otters v Voles"]["Time"] == "14:00"
    assert rows["Kites v Voles"]["Time"] == ""


def test_columns_matches_headers_of_the_coordinators_own(cli, tmp_path):
    book = own_headers(tmp_path / "spring.xlsx",
                       ("Hosts", "Guests", "Playing at", "Face-off", "When"))
    code, out, _ = cli("check", str(book), "--columns",
                       'home=Hosts,away="Guests",venue=Playing at,time=Face-off,date=When')
    assert code == 0, out
    assert "  Herons v Otters  [at Mill Field, round 2, starts 10:30]" in out.splitlines()


@pytest.mark.parametrize(("value", "message"), [
    ("home", "'home' has no '=': write KEY=HEADER, e.g. home=\"Home Team\",venue=Ground"),
    ("ground=Ground", "'ground' is not one of our columns (fixture, home, away, venue, pitch, "
                      "division, round, date, time, played, score, clash on); did you mean "
                      "'venue'?"),
])
def test_a_bad_columns_value_is_a_usage_error(cli, capsys, tmp_path, value, message):
    book = own_headers(tmp_path / "spring.xlsx")
    with pytest.raises(SystemExit) as stop:
        cli("count", str(book), "--columns", value)
    out, err = capsys.readouterr()
    assert (stop.value.code, out) == (2, "")
    assert err.splitlines()[-1] == f"leaguegrid count: error: argument --columns: {message}"


def test_columns_naming_a_missing_header_is_a_usage_error(cli, tmp_path):
    book = own_headers(tmp_path / "spring.xlsx")
    code, out, err = cli("plan", str(book), "--rounds", "3", "--columns", "venue=Field")
    assert (code, out) == (2, "")
    assert err == ("leaguegrid plan: --columns: spring.xlsx has no column 'Field' for Venue. "
                   "Its Fixtures columns: Home Team, Away Team, Ground, Kick-off, Match Date.\n")


def test_a_projects_stale_matching_is_dropped_and_columns_replace_it(cli, tmp_path):
    book = own_headers(tmp_path / "spring.xlsx")
    project = tmp_path / "spring.leaguegrid"
    save_project(project, Project(workbook=str(book), mapping={"Venue": "Pitch site"}))
    code, out, err = cli("check", str(project))
    assert code == 0
    assert err == ("The column matching remembered for spring.xlsx no longer fits it (no "
                   "column 'Pitch site' for Venue), so it was dropped and the file read by its "
                   "own headers.\n")
    code, out, err = cli("check", str(project), "--columns", "venue=Ground")
    assert (code, err) == (0, "")


def test_a_project_file_that_cannot_be_read_is_an_input_problem(cli, tmp_path):
    project = tmp_path / "spring.leaguegrid"
    project.write_text('{"format": "something else"}', encoding="utf-8")
    code, out, err = cli("count", str(project))
    assert (code, out) == (1, "")
    assert err == f"leaguegrid count: {project} is not a LeagueGrid project file\n"
