"""A coordinator's own sheet read as it is: the usual headers, a Coach column on Teams that
clashes, a Date column that pins, a Time (Kick-off) column that is the fixture's start."""

from __future__ import annotations

import datetime as dt

from test_reader_support import errors, load_book, one, warnings_of

from leaguegrid.clashes.graph import build_clash_graph, edge_reasons

SPRING = dt.date(2027, 3, 6)
ROUNDS = [["Round", "Date", "Time"], [1, SPRING, "09:00"], [2, dt.date(2027, 3, 13), "09:00"],
          [3, dt.date(2027, 3, 20), "09:00"]]


def where(problem):
    return (problem.sheet, problem.row, problem.column, problem.value)


def reasons(league, a, b):
    return [str(r) for r in edge_reasons(build_clash_graph(league), a, b)]


def test_usual_headers_are_our_columns(tmp_path):
    fixtures = [["Home Team", "Away Team", "Ground", "Kick-off", "Match Date", "Grade"],
                ["Herons", "Otters", "Mill Field", "10:30", SPRING, "U10"],
                ["Kites", "Voles", "Brook Lane", None, None, "U10"]]
    result = load_book(tmp_path, {"Fixtures": fixtures, "Rounds": ROUNDS})
    assert result.ok and not result.problems, [str(p) for p in result.problems]
    first, second = result.league.fixtures
    assert (first.home, first.away, first.venue, first.division) == (
        "Herons", "Otters", "Mill Field", "U10")
    assert (first.pin, first.time, first.notes) == (1, dt.time(10, 30), {})
    assert (second.pin, second.time) == (None, None)


def test_same_coach_clashes_with_the_coach_as_reason(tmp_path):
    fixtures = [["Home", "Away"], ["Herons", "Otters"], ["Kites", "Voles"], ["Wrens", "Larks"]]
    teams = [["Team", "Coach"], ["Herons", "Pat Quill"], ["Otters", None],
             ["Kites", "pat  quill"], ["Voles", "Sam Reed"], ["Wrens", None], ["Larks", None]]
    result = load_book(tmp_path, {"Fixtures": fixtures, "Teams": teams})
    assert result.ok
    league = result.league
    assert reasons(league, "Herons v Otters", "Kites v Voles") == ["coach Pat Quill"]
    assert reasons(league, "Herons v Otters", "Wrens v Larks") == []
    assert league.settings.shared == ("Home", "Away", "Venue", "Coach")
    spelling = one(warnings_of(result))  # one coach, written two ways
    assert (spelling.message, where(spelling)) == (
        "written differently from 'Pat Quill' (Teams row 2); read as the same coach",
        ("Teams", 4, "Coach", "pat  quill"))


def test_manager_reads_as_coach_on_generated_fixtures(tmp_path):
    teams = [["Team", "Division", "Manager"], ["Herons", "U9", "Jo Fell"], ["Otters", "U9", None],
             ["Kites", "U11", "Jo Fell"], ["Voles", "U11", None]]
    result = load_book(tmp_path, {"Teams": teams})
    assert result.ok, [str(p) for p in result.problems]
    league = result.league
    labels = {f.division: f.label for f in league.fixtures}
    assert reasons(league, labels["U9"], labels["U11"]) == ["coach Jo Fell"]


def test_shared_may_name_a_teams_column_and_leaving_coach_out_warns(tmp_path):
    fixtures = [["Home", "Away"], ["Herons", "Otters"], ["Kites", "Voles"]]
    teams = [["Team", "Coach", "Minibus"], ["Herons", "Pat", "Blue"], ["Kites", "Pat", "blue"],
             ["Otters", None, None], ["Voles", None, None]]
    settings = [["Setting", "Value"], ["Shared", "Home, Away, Minibus"]]
    result = load_book(tmp_path, {"Fixtures": fixtures, "Teams": teams, "Settings": settings})
    assert not errors(result)
    assert reasons(result.league, "Herons v Otters", "Kites v Voles") == ["minibus Blue"]
    coach = [p for p in warnings_of(result) if "Coach" in p.message]
    assert [(p.message, where(p)) for p in coach] == [(
        "the Teams sheet has a Coach column, but Clash on does not name it, so teams with the "
        "same coach may play in the same round", ("Settings", 2, "Value", "Home, Away, Minibus"))]


def test_a_date_pins_to_its_round(tmp_path):
    fixtures = [["Home", "Away", "Date"], ["Herons", "Otters", dt.date(2027, 3, 13)],
                ["Kites", "Voles", "2027-03-20"]]
    result = load_book(tmp_path, {"Fixtures": fixtures, "Rounds": ROUNDS})
    assert result.ok
    assert result.league.pins == {"Herons v Otters": 2, "Kites v Voles": 3}


def test_a_date_with_no_round_is_an_error_at_its_cell(tmp_path):
    fixtures = [["Home Team", "Away Team", "Match Date"], ["Herons", "Otters", SPRING],
                ["Kites", "Voles", dt.date(2027, 3, 7)]]
    result = load_book(tmp_path, {"Fixtures": fixtures, "Rounds": ROUNDS})
    problem = one(errors(result))
    assert str(problem) == (
        f"{tmp_path / 'league.xlsx'}, sheet Fixtures, row 3, column Match Date: '2027-03-07': "
        "no round of the Rounds sheet falls on 2027-03-07")


def test_a_date_off_the_settings_grid_says_where_rounds_fall(tmp_path):
    fixtures = [["Home", "Away", "Date"], ["Herons", "Otters", "2027-03-10"]]
    settings = [["Setting", "Value"], ["Start date", SPRING]]
    problem = one(errors(load_book(tmp_path, {"Fixtures": fixtures, "Settings": settings})))
    assert (problem.message, where(problem)) == (
        "no round falls on 2027-03-10: rounds fall every 7 days from 2027-03-06",
        ("Fixtures", 2, "Date", "2027-03-10"))


def test_date_and_round_that_disagree_are_an_error(tmp_path):
    fixtures = [["Home", "Away", "Round", "Match Date"], ["Herons", "Otters", 3, SPRING],
                ["Kites", "Voles", 1, SPRING]]
    result = load_book(tmp_path, {"Fixtures": fixtures, "Rounds": ROUNDS})
    problem = one(errors(result))
    assert (problem.message, where(problem)) == (
        "Match Date 2027-03-06 is round 1, but Round says round 3: give one, or make them agree",
        ("Fixtures", 2, "Match Date", "2027-03-06"))
    assert result.league.pins == {"Kites v Voles": 1}


def test_date_and_time_find_a_time_slot(tmp_path):
    slots = [["Round", "Date", "Time"], [1, SPRING, "09:00"], [2, SPRING, "10:30"]]
    fixtures = [["Home", "Away", "Date", "Start"], ["Herons", "Otters", SPRING, "10:30"],
                ["Kites", "Voles", SPRING, None]]
    result = load_book(tmp_path, {"Fixtures": fixtures, "Rounds": slots})
    problem = one(errors(result))
    assert (problem.message, where(problem)) == (
        "several rounds fall on 2027-03-06 (rounds 1, 2): write the round number in the Round "
        "column", ("Fixtures", 3, "Date", "2027-03-06"))
    assert result.league.pins == {"Herons v Otters": 2}


def test_bad_time_and_bad_date_are_errors_at_their_cells(tmp_path):
    fixtures = [["Home", "Away", "Kick-off", "Date"], ["Herons", "Otters", "25:00", None],
                ["Kites", "Voles", None, "6/3/2027"]]
    result = load_book(tmp_path, {"Fixtures": fixtures, "Rounds": ROUNDS})
    assert [(p.message, where(p)) for p in errors(result)] == [
        ("not a time: write times as HH:MM (24-hour), e.g. 10:30",
         ("Fixtures", 2, "Kick-off", "25:00")),
        ("not a date: write dates as YYYY-MM-DD", ("Fixtures", 3, "Date", "6/3/2027")),
    ]
