"""Column matching in the application layer: the --columns text parsed into the window's own
representation, the reader's guess, and a remembered matching that no longer fits dropped with
a notice (one typed on a command line refused instead)."""

from __future__ import annotations

import openpyxl
import pytest

from leaguegrid.app.editing import Edits
from leaguegrid.app.league import open_league
from leaguegrid.app.matching import ColumnsError, guess_matching, parse_columns
from leaguegrid.app.project import Project, open_project, save_project

KEYS = ("fixture, home, away, venue, pitch, division, round, date, time, played, score, "
        "clash on")


def book(path, header):
    wb = openpyxl.Workbook()
    sheet = wb.active
    sheet.title = "Fixtures"
    sheet.append(header)
    sheet.append(["Herons", "Otters", "Mill Field"])
    sheet.append(["Kites", "Voles", "Brook Lane"])
    wb.save(path)
    return path


def test_parse_columns_gives_the_windows_matching():
    assert parse_columns('home="Home Team",venue=Ground') == {"Home": "Home Team",
                                                              "Venue": "Ground"}
    assert parse_columns('AWAY = "Side, away" , Shared="Ref;Kit"') == {
        "Away": "Side, away", "Shared": "Ref;Kit"}


@pytest.mark.parametrize(("text", "message"), [
    ("hom=Host", f"'hom' is not one of our columns ({KEYS}); did you mean 'home'?"),
    ("home", "'home' has no '=': write KEY=HEADER, e.g. home=\"Home Team\",venue=Ground"),
    ("home=", "'home=' names no header after '='"),
    ("home=A,,away=B", "an empty part in 'home=A,,away=B': write KEY=HEADER pairs separated "
                       "by commas, e.g. home=\"Home Team\",venue=Ground"),
    ("home=A,Home=B", "'Home' is given twice"),
    ("home=Side,away=side", "the header 'side' is given for both Home and Away"),
])
def test_parse_columns_names_the_bad_part(text, message):
    with pytest.raises(ColumnsError) as caught:
        parse_columns(text)
    assert str(caught.value) == message


def test_guess_is_the_readers_own():
    headers = ["Home Team", "Visitors", "Field", "Kick-off", "Match Date", "Age group", "Home"]
    assert guess_matching(headers) == {"Home": "Home", "Away": "Visitors", "Venue": "Field",
                                       "Time": "Kick-off", "Date": "Match Date",
                                       "Division": "Age group"}


def test_a_remembered_matching_that_no_longer_fits_is_dropped(tmp_path):
    path = book(tmp_path / "spring.xlsx", ["Home", "Away", "Venue"])
    remembered = {"Home": "Home Team", "Away": "Away Team"}  # the headers before an edit
    opened = open_league(path, remembered)
    assert opened.ok, [str(p) for p in opened.result.problems]
    assert not opened.result.problems  # nothing is blamed on the workbook
    assert opened.columns is None
    assert opened.notice == (
        "The column matching remembered for spring.xlsx no longer fits it (no column "
        "'Home Team' for Home, no column 'Away Team' for Away), so it was dropped and the file "
        "read by its own headers.")
    assert [f.label for f in opened.league.fixtures] == ["Herons v Otters", "Kites v Voles"]


def test_a_matching_that_fits_is_kept(tmp_path):
    path = book(tmp_path / "spring.xlsx", ["Hosts", "Guests", "Ground"])
    opened = open_league(path, {"Home": "Hosts", "Away": "Guests"})
    assert opened.ok and opened.notice is None
    assert opened.columns == {"Home": "Hosts", "Away": "Guests"}


def test_a_typed_matching_naming_a_missing_header_is_refused(tmp_path):
    path = book(tmp_path / "spring.xlsx", ["Home Team", "Away Team", "Ground"])
    with pytest.raises(ColumnsError) as caught:
        open_league(path, {"Home": "Home Team", "Venue": "Grounds"}, typed=True)
    assert str(caught.value) == (
        "spring.xlsx has no column 'Grounds' for Venue; did you mean 'Ground'? Its Fixtures "
        "columns: Home Team, Away Team, Ground.")


def test_project_matching_and_columns_that_replace_it(tmp_path):
    path = book(tmp_path / "spring.xlsx", ["Hosts", "Guests", "Ground"])
    project = tmp_path / "spring.leaguegrid"
    save_project(project, Project(workbook=str(path), mapping={"Home": "Host team"},
                                  edits=Edits(pins={"Kites v Voles": 2})))
    stale = open_project(project).opened
    assert stale.notice.startswith("The column matching remembered for spring.xlsx no longer "
                                   "fits it (no column 'Host team' for Home)")
    assert not stale.ok  # read by its own headers, which are not ours: the file's problems
    typed = open_project(project, {"Home": "Hosts", "Away": "Guests"}).opened
    assert typed.ok and typed.notice is None
    assert typed.league.pins == {"Kites v Voles": 2}  # the project's pin, on the workbook
