"""The Rounds, Settings, Venues, Distances and Blocked sheets, and the window's column matching."""

from __future__ import annotations

import datetime as dt

from test_reader_support import errors, load_book, one, warnings_of, write_book

from leaguegrid.core.model import Blocked, Settings
from leaguegrid.io.read.league_reader import load_league

FIXTURES = [["Home", "Away", "Venue"], ["Alder", "Birch", "Oak Rd"], ["Cedar", "Damson", "Pine St"]]


def where(problem):
    return (problem.sheet, problem.row, problem.column, problem.value)


def with_sheet(tmp_path, name, rows):
    return load_book(tmp_path, {"Fixtures": FIXTURES, name: rows})


def test_rounds_sheet(tmp_path):
    rows = [
        ["Round", "Date", "Time", "Note"],
        [2, "2025-09-06", "10:30", None],
        [1, dt.datetime(2025, 9, 6), dt.time(9, 0), "opening"],
    ]
    result = with_sheet(tmp_path, "Rounds", rows)
    assert result.ok, [str(p) for p in result.problems]
    assert result.league.rounds_fixed
    assert [(r.number, r.date, r.time, r.note) for r in result.league.rounds] == [
        (1, dt.date(2025, 9, 6), dt.time(9, 0), "opening"),
        (2, dt.date(2025, 9, 6), dt.time(10, 30), ""),
    ]


def test_rounds_numbered_by_position_without_round_column(tmp_path):
    result = with_sheet(tmp_path, "Rounds", [["Date"], ["2025-09-06"], ["2025-09-13"]])
    assert result.ok
    assert [(r.number, r.date) for r in result.league.rounds] == [
        (1, dt.date(2025, 9, 6)),
        (2, dt.date(2025, 9, 13)),
    ]


def test_rounds_problems(tmp_path):
    rows = [
        ["Round", "Date", "Time"],
        [1, "06/09/2025", "9am"],
        [1, None, None],
        [0, None, None],
        [4, "2025-09-01", None],
        [None, "2025-09-20", None],
    ]
    found = with_sheet(tmp_path, "Rounds", rows).problems
    assert [(p.severity, p.message, where(p)) for p in found] == [
        ("error", "not a date: write dates as YYYY-MM-DD", ("Rounds", 2, "Date", "06/09/2025")),
        (
            "error",
            "not a time: write times as HH:MM (24-hour), e.g. 10:30",
            ("Rounds", 2, "Time", "9am"),
        ),
        ("error", "round 1 is listed twice (rows 2 and 3)", ("Rounds", 3, "Round", "1")),
        (
            "error",
            "not a positive whole number: rounds are numbered 1, 2, 3, …",
            ("Rounds", 4, "Round", "0"),
        ),
        ("error", "the round number is missing", ("Rounds", 6, "Round", None)),
        (
            "error",
            "rounds are numbered 1 to 4 without gaps; missing: 2, 3",
            ("Rounds", 1, "Round", None),
        ),
    ]


def test_rounds_dated_out_of_order_warn(tmp_path):
    rows = [["Round", "Date"], [1, "2025-09-13"], [2, "2025-09-06"]]
    problem = one(with_sheet(tmp_path, "Rounds", rows).problems)
    assert (problem.severity, problem.message, where(problem)) == (
        "warning",
        "round 2 is dated 2025-09-06, before round 1 (2025-09-13)",
        ("Rounds", 3, "Date", "2025-09-06"),
    )


def test_empty_rounds_sheet_is_an_error(tmp_path):
    problem = one(with_sheet(tmp_path, "Rounds", [["Round", "Date"]]).problems)
    assert (problem.message, where(problem)) == (
        "the sheet lists no rounds: list the rounds, or delete the sheet",
        ("Rounds", 1, None, None),
    )
    problem = one(with_sheet(tmp_path, "Rounds", []).problems)
    assert (problem.message, where(problem)) == (
        "the sheet is empty: list the rounds, or delete the sheet",
        ("Rounds", None, None, None),
    )


def test_settings_read(tmp_path):
    rows = [
        ["Setting", "Value"],
        ["League", "Moorside Juniors"],
        ["Start date", dt.date(2025, 9, 6)],
        ["every", 14],
        ["SKIP", "2025-10-25, 2025-12-20"],
        ["Time zone", "Europe/London"],
        ["Max home run", 2],
        ["Max away run", "3"],
        ["Round balance", 0],
        ["Return half", "Mirrored"],
        ["Leg gap", 3],
        ["Byes apart", "no"],
        ["Legs", 2],
    ]
    result = load_book(tmp_path, {"Teams": [["Team"], ["A"], ["B"]], "Settings": rows})
    assert result.ok, [str(p) for p in result.problems]
    assert result.league.settings == Settings(
        shared=("Home", "Away", "Venue"),
        legs=2,
        start_date=dt.date(2025, 9, 6),
        every_days=14,
        skip=(dt.date(2025, 10, 25), dt.date(2025, 12, 20)),
        league="Moorside Juniors",
        time_zone="Europe/London",
        max_home_run=2,
        max_away_run=3,
        round_balance=0,
        return_half=True,
        mirrored=True,
        leg_gap=3,
        byes_apart=False,
    )
    assert result.league.name == "Moorside Juniors"


def test_settings_plain_names_and_their_earlier_names_read_alike(tmp_path):
    """Issue 12's fixed names: Clash on, Most home/away games in a row (earlier: Shared, Max
    home run, Max away run); giving both names of one setting is the setting twice."""
    now = [["Setting", "Value"], ["Clash on", "Home, Away, Venue, Referee"],
           ["Most home games in a row", 2], ["most away games in a row", 3]]
    before = [["Setting", "Value"], ["Shared", "Home, Away, Venue, Referee"],
              ["Max home run", 2], ["Max away run", 3]]
    teams = {"Teams": [["Team"], ["A"], ["B"]]}
    read = [load_book(tmp_path, {**teams, "Settings": rows}) for rows in (now, before)]
    assert read[0].league.settings == read[1].league.settings
    assert read[0].league.settings.max_home_run == 2
    assert read[0].league.settings.max_away_run == 3
    both = [["Setting", "Value"], ["Max home run", 2], ["Most home games in a row", 3]]
    result = load_book(tmp_path, {**teams, "Settings": both})
    assert [(p.message, p.row) for p in result.problems] == [
        ("the setting appears twice (rows 2 and 3); only the first is read", 3)
    ]


def test_leg_gap_must_be_a_positive_whole_number_and_needs_two_legs(tmp_path):
    rows = [["Setting", "Value"], ["Leg gap", 0], ["Return half", "halfway"]]
    result = load_book(tmp_path, {"Teams": [["Team"], ["A"], ["B"]], "Settings": rows})
    assert [(p.message, p.row, p.value) for p in result.problems] == [
        ("not a positive whole number of rounds", 2, "0"),
        ("not yes, no or mirrored", 3, "halfway"),
    ]
    rows = [["Setting", "Value"], ["Leg gap", 2]]
    result = load_book(tmp_path, {"Teams": [["Team"], ["A"], ["B"]], "Settings": rows})
    assert [p.message for p in result.problems] == ["Leg gap has no effect unless Legs is 2"]


def test_league_name_defaults_to_the_file_stem(tmp_path):
    result = load_book(tmp_path, {"Fixtures": FIXTURES}, name="Autumn Cup.xlsx")
    assert result.league.name == "Autumn Cup"


def test_settings_problems(tmp_path):
    rows = [
        ["Setting", "Value"],
        ["Legs", 3],
        ["Start date", "6 Sept"],
        ["Every", 0],
        ["Skip", "2025-10-25, 25/12/2025"],
        ["Time zone", "Mars/Olympus"],
        ["Max home run", 0],
        ["Round balance", -1],
        ["Return half", "perhaps"],
        ["Leggs", 2],
        ["legs", 1],
        [None, "orphan"],
    ]
    found = with_sheet(tmp_path, "Settings", rows).problems
    assert [(p.severity, p.message, where(p)) for p in found] == [
        ("error", "Legs must be 1 or 2", ("Settings", 2, "Value", "3")),
        ("error", "not a date: write dates as YYYY-MM-DD", ("Settings", 3, "Value", "6 Sept")),
        ("error", "not a positive whole number of days", ("Settings", 4, "Value", "0")),
        (
            "error",
            "not a date: write dates as YYYY-MM-DD (did you mean 2025-12-25?)",
            ("Settings", 5, "Value", "25/12/2025"),
        ),
        (
            "error",
            "not a time zone: use an IANA name such as Europe/London",
            ("Settings", 6, "Value", "Mars/Olympus"),
        ),
        ("error", "not a positive whole number", ("Settings", 7, "Value", "0")),
        ("error", "not a whole number (0 or more)", ("Settings", 8, "Value", "-1")),
        ("error", "not yes, no or mirrored", ("Settings", 9, "Value", "perhaps")),
        (
            "warning",
            "not a setting LeagueGrid knows; it is ignored; did you mean 'Legs'?",
            ("Settings", 10, "Setting", "Leggs"),
        ),
        (
            "error",
            "the setting appears twice (rows 2 and 11); only the first is read",
            ("Settings", 11, "Setting", "legs"),
        ),
        ("warning", "a value with no setting name is ignored", ("Settings", 12, "Value", "orphan")),
    ]


def test_venues_sheet(tmp_path):
    rows = [
        ["Venue", "Pitches", "Latitude", "Longitude"],
        ["oak rd", 3, 51.5, "-0.12"],
        ["Pine St", None, None, None],
    ]
    result = with_sheet(tmp_path, "Venues", rows)
    assert not errors(result)
    venues = result.league.venues
    assert (venues["oak rd"].pitches, venues["oak rd"].latitude, venues["oak rd"].longitude) == (
        3,
        51.5,
        -0.12,
    )
    assert venues["Pine St"].pitches == 1
    assert result.league.fixtures[0].venue == "oak rd"  # the Venues sheet's spelling wins
    assert one(warnings_of(result)).message == (
        "written differently from 'oak rd' (Venues row 2); read as the same venue"
    )


def test_venues_problems(tmp_path):
    rows = [
        ["Venue", "Pitches", "Latitude", "Longitude"],
        ["Oak Rd", 0, 95, 10],
        ["Pine St", 2, 50, None],
        ["oak rd", 1, None, None],
    ]
    found = errors(with_sheet(tmp_path, "Venues", rows))
    assert [(p.message, where(p)) for p in found] == [
        ("not a positive whole number of pitches", ("Venues", 2, "Pitches", "0")),
        ("not a latitude: a number from -90 to 90", ("Venues", 2, "Latitude", "95")),
        (
            "Latitude and Longitude go together: give both or neither",
            ("Venues", 3, "Longitude", None),
        ),
        ("the venue is listed twice (rows 2 and 4)", ("Venues", 4, "Venue", "oak rd")),
    ]


def test_distances(tmp_path):
    rows = [["From", "To", "Km"], ["Oak Rd", "pine st", 12.5]]
    result = with_sheet(tmp_path, "Distances", rows)
    assert not errors(result)
    assert result.league.distances == {("Oak Rd", "Pine St"): 12.5, ("Pine St", "Oak Rd"): 12.5}


def test_distances_problems(tmp_path):
    rows = [
        ["From", "To", "Km"],
        ["Oak Rd", "Pine Str", 3],
        ["Oak Rd", "Oak Rd", 0],
        ["Oak Rd", "Pine St", "far"],
        ["Oak Rd", "Pine St", 4],
        ["Pine St", "Oak Rd", 5],
    ]
    found = errors(with_sheet(tmp_path, "Distances", rows))
    assert [(p.message, where(p)) for p in found] == [
        (
            "no venue is named 'Pine Str'; did you mean 'Pine St'?",
            ("Distances", 2, "To", "Pine Str"),
        ),
        ("From and To are the same venue", ("Distances", 3, "To", "Oak Rd")),
        ("not a distance: a number of kilometres, 0 or more", ("Distances", 4, "Km", "far")),
        (
            "the distance between these venues is given twice (rows 5 and 6)",
            ("Distances", 6, "To", "Oak Rd"),
        ),
    ]


def test_blocked(tmp_path):
    rows = [
        ["Team", "Venue", "Round", "Date", "Reason"],
        ["alder", None, 2, None, "bye"],
        [None, "Pine St", None, "2025-09-13", "fair"],
        ["Cedar", "Oak Rd", "2025-09-06", None, None],
    ]
    sheets = {
        "Fixtures": FIXTURES,
        "Blocked": rows,
        "Rounds": [
            ["Round", "Date", "Time"],
            [1, "2025-09-06", "09:00"],
            [2, "2025-09-06", "11:00"],
            [3, "2025-09-13", None],
        ],
    }
    result = load_book(tmp_path, sheets)
    assert not errors(result)
    assert result.league.blocked == [
        Blocked(2, team="Alder", reason="bye", row=2),
        Blocked(3, venue="Pine St", reason="fair", row=3),
        Blocked(1, team="Cedar", row=4),
        Blocked(1, venue="Oak Rd", row=4),
        Blocked(2, team="Cedar", row=4),
        Blocked(2, venue="Oak Rd", row=4),
    ]


def test_blocked_problems(tmp_path):
    rows = [
        ["Team", "Venue", "Round", "Date"],
        ["Aldr", None, 1, None],
        [None, None, 1, None],
        ["Alder", None, None, None],
        ["Alder", None, 1, "2025-09-06"],
        ["Alder", None, None, "Sat"],
        [None, "Oak Rd", None, "2025-09-20"],
        ["Alder", None, 7, None],
    ]
    sheets = {
        "Fixtures": FIXTURES,
        "Blocked": rows,
        "Rounds": [["Round", "Date"], [1, "2025-09-06"], [2, "2025-09-13"]],
    }
    found = load_book(tmp_path, sheets).problems
    assert [(p.severity, p.message, where(p)) for p in found] == [
        ("error", "no team is named 'Aldr'; did you mean 'Alder'?", ("Blocked", 2, "Team", "Aldr")),
        ("error", "the row needs a Team or a Venue", ("Blocked", 3, "Team", None)),
        ("error", "the row needs a Round or a Date", ("Blocked", 4, "Round", None)),
        ("error", "give a Round or a Date, not both", ("Blocked", 5, "Date", "2025-09-06")),
        ("error", "not a date: write dates as YYYY-MM-DD", ("Blocked", 6, "Date", "Sat")),
        (
            "warning",
            "no round of the Rounds sheet falls on 2025-09-20, so nothing is blocked",
            ("Blocked", 7, "Date", "2025-09-20"),
        ),
        (
            "error",
            "there is no round 7: the Rounds sheet lists rounds 1 to 2",
            ("Blocked", 8, "Round", "7"),
        ),
    ]


def test_blocked_pinned_fixture(tmp_path):
    sheets = {
        "Fixtures": [["Home", "Away", "Venue", "Round"], ["Alder", "Birch", "Oak Rd", 2]],
        "Blocked": [["Venue", "Round", "Reason"], ["Oak Rd", 2, "closed"]],
    }
    problem = one(errors(load_book(tmp_path, sheets)))
    assert (problem.message, where(problem)) == (
        "venue 'Oak Rd' is blocked in round 2, but 'Alder v Birch' (Fixtures row 2) is pinned "
        "to round 2",
        ("Blocked", 2, "Venue", "Oak Rd"),
    )


def test_column_matching_from_the_window(tmp_path):
    rows = [
        ["Host", "Guest", "Home", "Ground", "Ref"],
        ["Alder", "Birch", "x", "Oak Rd", "Ann"],
        ["Cedar", "Damson", "y", "Pine St", "Ann"],
    ]
    path = write_book(tmp_path / "league.xlsx", {"Games": rows, "Fixtures": rows})
    mapping = {
        "Home": "Host",
        "Away": "guest",
        "Venue": "Ground",
        "Pitch": "Court",
        "Shared": "Ref",
    }
    result = load_league(path, columns=mapping)
    assert not errors(result), [str(p) for p in result.problems]
    league = result.league
    assert [(f.home, f.away, f.venue, f.notes["Home"]) for f in league.fixtures] == [
        ("Alder", "Birch", "Oak Rd", "x"),
        ("Cedar", "Damson", "Pine St", "y"),
    ]
    assert league.settings.shared == ("Home", "Away", "Venue", "Ref")
    assert league.fixtures[0].shared == {"Ref": ("Ann",)}
    assert not warnings_of(result)  # the entry that does not fit is the caller's to judge
    assert result.unmatched == [("Pitch", "Court")]
    assert result.headers == ["Host", "Guest", "Home", "Ground", "Ref"]
