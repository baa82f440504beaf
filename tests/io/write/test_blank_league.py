"""The blank league workbook: every sheet the reader knows, and example rows that read as a
tiny valid league."""

from __future__ import annotations

import openpyxl
import pytest

from leaguegrid.app.counting import count_report
from leaguegrid.app.demos import write_blank_league
from leaguegrid.app.league import clash_graph, open_league
from leaguegrid.io.read.league_reader import SHEET_COLUMNS, SHEETS


def test_every_reader_sheet_is_there_with_the_reader_headers(tmp_path):
    path = write_blank_league(tmp_path / "blank.xlsx")
    wb = openpyxl.load_workbook(path)
    assert wb.sheetnames[0] == "Instructions"
    assert set(wb.sheetnames[1:]) == set(SHEETS.values())
    for key, title in SHEETS.items():
        header = [c.value for c in wb[title][1]]
        assert header == list(SHEET_COLUMNS[key].values()), title


def test_untouched_it_reads_with_no_problem_at_all(tmp_path):
    opened = open_league(write_blank_league(tmp_path / "blank.xlsx"))
    assert opened.result.problems == []
    league = opened.result.league
    assert [f.label for f in league.fixtures] == [
        "Reds v Blues", "Greens v Golds", "Blues v Reds", "Golds v Greens"]
    assert len(league.teams) == 4


def test_its_example_counts_as_worked_by_hand(tmp_path):
    # By hand: the team clashes and the two Clashes rows make a 4-cycle; the Ties join its
    # opposite corners, leaving one clashing pair of tied couples: k(k - 1) ways in k rounds.
    # Round 3 is blocked for Example Park, whose fixtures sit in both couples: 2 ways in 2 or 3
    # rounds, none in 1.
    league = open_league(write_blank_league(tmp_path / "blank.xlsx")).result.league
    report = count_report(league, clash_graph(league), rounds=[1, 2, 3])
    assert report.min_rounds == 2
    assert [row.assignments for row in report.rows] == [0, 2, 2]


def test_every_sheet_has_two_example_rows_or_the_rows_its_league_needs(tmp_path):
    wb = openpyxl.load_workbook(write_blank_league(tmp_path / "blank.xlsx"))
    rows = {title: wb[title].max_row - 1 for title in SHEETS.values()}
    assert rows == {"Fixtures": 4, "Teams": 4, "Clashes": 2, "Rounds": 3, "Settings": 2,
                    "Together": 2, "Apart": 2, "Blocked": 2, "Requests": 2, "Venues": 2,
                    "Distances": 1}


def test_it_never_overwrites(tmp_path):
    path = tmp_path / "mine.xlsx"
    path.write_bytes(b"my league")
    with pytest.raises(FileExistsError):
        write_blank_league(path)
    assert path.read_bytes() == b"my league"
    assert list(tmp_path.iterdir()) == [path]


def test_the_instructions_say_the_name_rule_and_the_caution(tmp_path):
    wb = openpyxl.load_workbook(write_blank_league(tmp_path / "blank.xlsx"))
    text = " ".join(str(c.value) for row in wb["Instructions"].iter_rows() for c in row if c.value)
    assert "read as the same team" in text
    assert "association's rules" in text
    assert "tiny valid league" in text
