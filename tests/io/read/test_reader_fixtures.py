"""The Fixtures sheet (and a CSV read as it): labels, teams, venues, pitches, pins, played
fixtures, Shared columns, notes, and every problem located at its cell."""

from __future__ import annotations

import datetime as dt

from test_reader_support import errors, load_book, one, warnings_of

from leaguegrid.io.read.league_reader import load_league

HEAD = ["Fixture", "Home", "Away", "Venue", "Division", "Round"]


def where(problem):
    return (problem.sheet, problem.row, problem.column, problem.value)


def test_sheet_and_column_names_ignore_case_and_spaces_header_below_blank_rows(tmp_path):
    rows = [
        [],
        [None, " home ", "AWAY", "venue", "Referee "],
        [None, "Alder", "Birch", "Oak Rd", "Ann"],
    ]
    result = load_book(tmp_path, {" fixtures ": rows})
    assert result.ok, [str(p) for p in result.problems]
    fixture = one(result.league.fixtures)
    assert (fixture.label, fixture.home, fixture.away, fixture.venue, fixture.row) == (
        "Alder v Birch",
        "Alder",
        "Birch",
        "Oak Rd",
        3,
    )
    assert fixture.notes == {"Referee": "Ann"}


def test_default_labels_number_repeated_pairings_around_written_labels(tmp_path):
    rows = [
        HEAD,
        [None, "Alder", "Birch"],
        ["alder v BIRCH (2)", "Cedar", "Damson"],
        [None, "Alder", "Birch"],
        [None, "Birch", "Alder"],
    ]
    result = load_book(tmp_path, {"Fixtures": rows})
    assert result.ok
    assert [f.label for f in result.league.fixtures] == [
        "Alder v Birch",
        "alder v BIRCH (2)",
        "Alder v Birch (3)",
        "Birch v Alder",
    ]
    assert [f.leg for f in result.league.fixtures] == [1, 1, 2, 3]


def test_duplicate_labels_differing_only_in_case_and_spacing(tmp_path):
    rows = [HEAD, ["Cup Final", "Alder", "Birch"], ["cup  final", "Cedar", "Damson"]]
    result = load_book(tmp_path, {"Fixtures": rows})
    problem = one(errors(result))
    assert problem.message == (
        "the label is used twice (rows 2 and 3); labels that differ only in case or spacing "
        "count as the same"
    )
    assert where(problem) == ("Fixtures", 3, "Fixture", "cup  final")
    assert [f.label for f in result.league.fixtures] == ["Cup Final"]


def test_home_equal_to_away(tmp_path):
    rows = [HEAD, [None, "Alder", "Birch"], [None, "Cedar", " cedar"]]
    result = load_book(tmp_path, {"Fixtures": rows})
    problem = one(errors(result))
    assert problem.message == "Home and Away are the same team"
    assert where(problem) == ("Fixtures", 3, "Away", "cedar")


def test_row_needs_a_label_or_both_teams(tmp_path):
    rows = [
        HEAD,
        [None, "Alder", None, "Oak Rd"],
        [None, None, None, "Oak Rd"],
        ["Final", None, None, "Oak Rd"],
    ]
    result = load_book(tmp_path, {"Fixtures": rows})
    found = errors(result)
    assert [(p.message, where(p)) for p in found] == [
        ("'Alder v ?' has no Away team: give both Home and Away, or a Fixture label",
         ("Fixtures", 2, "Away", None)),
        ("the row needs a Fixture label or both Home and Away", ("Fixtures", 3, "Fixture", None)),
    ]
    assert [f.label for f in result.league.fixtures] == ["Final"]


def test_missing_columns(tmp_path):
    result = load_book(tmp_path, {"Fixtures": [["Home", "Guests"], ["Alder", "Birch"]]})
    problem = one(errors(result))
    assert problem.message == "the sheet has no Away column (columns found: Home, Guests)"
    assert where(problem) == ("Fixtures", 1, "Away", None)
    result = load_book(tmp_path, {"Fixtures": [["Venue", "Round"], ["Oak Rd", 1]]})
    problem = one(errors(result))
    assert problem.message == "the sheet has no Fixture column, nor Home and Away columns"
    assert where(problem) == ("Fixtures", 1, None, None)


def test_missing_column_suggests_the_closest_header(tmp_path):
    result = load_book(tmp_path, {"Fixtures": [["Home", "Awya"], ["Alder", "Birch"]]})
    assert [p.message for p in result.problems] == [
        "the column is kept as a note; did you mean 'Away'?",
        "the sheet has no Away column; did you mean 'Awya'?",
    ]
    assert result.problems[0].severity == "warning"


def test_missing_and_empty_sheets(tmp_path):
    result = load_book(tmp_path, {"Fixtrues": [["Home", "Away"], ["A", "B"]]})
    assert [(p.severity, p.sheet, p.message) for p in result.problems] == [
        ("warning", "Fixtrues", "the sheet is not read; did you mean 'Fixtures'?"),
        (
            "error",
            "Fixtures",
            "the workbook has no Fixtures sheet (nor a Teams sheet to generate fixtures from)",
        ),
    ]
    assert result.league is None
    result = load_book(tmp_path, {"Fixtures": []})
    assert where(one(result.problems)) == ("Fixtures", None, None, None)
    assert one(result.problems).message == "the sheet is empty"
    result = load_book(tmp_path, {"Fixtures": [["Home", "Away"]]})
    assert one(result.problems).message == "the sheet has a header row but no fixtures"
    assert where(one(result.problems)) == ("Fixtures", 1, None, None)


def test_duplicate_column(tmp_path):
    rows = [["Home", "Away", "home"], ["Alder", "Birch", "Cedar"]]
    result = load_book(tmp_path, {"Fixtures": rows})
    problem = one(errors(result))
    assert problem.message == "the column appears twice (cells A1 and C1); only the first is read"
    assert where(problem) == ("Fixtures", 1, "home", None)


def test_team_in_two_divisions_names_both_rows(tmp_path):
    rows = [
        HEAD,
        [None, "Kestrel", "Birch", None, "U10"],
        [None, "Cedar", "Damson", None, "U12"],
        [None, "Cedar", "Kestrel", None, "U12"],
        [None, "Kestrel", "Elm", None, "U12"],
    ]
    result = load_book(tmp_path, {"Fixtures": rows})
    problem = one(errors(result))
    assert problem.message == (
        "team 'Kestrel' is in division 'U10' (Fixtures row 2) and in division 'U12' "
        "(Fixtures row 4): a team name belongs to one division; give each division's team its "
        "own name, e.g. 'Kestrel U12'"
    )
    assert where(problem) == ("Fixtures", 4, "Division", "U12")


def test_team_division_from_teams_sheet_conflict(tmp_path):
    sheets = {
        "Teams": [["Team", "Division"], ["Kestrel", "U10"]],
        "Fixtures": [HEAD, [None, "Kestrel", "Birch", None, "U12"]],
    }
    problem = one(errors(load_book(tmp_path, sheets)))
    assert problem.message.startswith(
        "team 'Kestrel' is in division 'U10' (Teams row 2) and in division 'U12' (Fixtures row 2)"
    )


def test_spelling_variants_warn_once_and_read_as_one_name(tmp_path):
    rows = [
        HEAD,
        [None, "Marsh Lane", "Birch", "Oak Road"],
        [None, "marsh lane", "Cedar", "OAK ROAD"],
        [None, "Cedar", "MarshLane", "oak road"],
        [None, "marsh lane", "Elm", "Oak Road"],
    ]
    result = load_book(tmp_path, {"Fixtures": rows})
    assert not errors(result)
    assert [(p.message, where(p)) for p in warnings_of(result)] == [
        (
            "written differently from 'Marsh Lane' (Fixtures row 2); read as the same team",
            ("Fixtures", 3, "Home", "marsh lane"),
        ),
        (
            "written differently from 'Oak Road' (Fixtures row 2); read as the same venue",
            ("Fixtures", 3, "Venue", "OAK ROAD"),
        ),
        (
            "written differently from 'Marsh Lane' (Fixtures row 2); read as the same team",
            ("Fixtures", 4, "Away", "MarshLane"),
        ),
        (
            "written differently from 'Oak Road' (Fixtures row 2); read as the same venue",
            ("Fixtures", 4, "Venue", "oak road"),
        ),
    ]
    assert {f.home for f in result.league.fixtures} == {"Marsh Lane", "Cedar"}
    assert {f.venue for f in result.league.fixtures} == {"Oak Road"}


def test_pins_as_numbers_and_dates_of_the_rounds_sheet(tmp_path):
    sheets = {
        "Fixtures": [
            HEAD,
            [None, "A", "B", None, None, 2],
            [None, "C", "D", None, None, "3"],
            [None, "E", "F", None, None, dt.datetime(2025, 9, 13)],
            [None, "G", "H", None, None, "2025-09-20"],
            [None, "I", "J", None, None, 4.0],
        ],
        "Rounds": [
            ["Round", "Date"],
            [1, dt.date(2025, 9, 6)],
            [2, dt.date(2025, 9, 13)],
            [3, "2025-09-20"],
            [4, None],
        ],
    }
    result = load_book(tmp_path, sheets)
    assert result.ok, [str(p) for p in result.problems]
    assert result.league.pins == {"A v B": 2, "C v D": 3, "E v F": 2, "G v H": 3, "I v J": 4}
    assert result.league.rounds_fixed
    assert [(r.number, r.date) for r in result.league.rounds] == [
        (1, dt.date(2025, 9, 6)),
        (2, dt.date(2025, 9, 13)),
        (3, dt.date(2025, 9, 20)),
        (4, None),
    ]


def pin_problem(tmp_path, value, rounds=None):
    sheets = {"Fixtures": [HEAD, [None, "A", "B", None, None, value]]}
    if rounds is not None:
        sheets["Rounds"] = rounds
    return one(errors(load_book(tmp_path, sheets)))


def test_round_not_a_positive_whole_number(tmp_path):
    for value, shown in ((0, "0"), (2.5, "2.5"), ("-1", "-1"), ("3.5", "3.5")):
        problem = pin_problem(tmp_path, value)
        assert problem.message == "not a positive whole number: rounds are numbered 1, 2, 3, …"
        assert where(problem) == ("Fixtures", 2, "Round", shown)


def test_round_text_that_is_neither(tmp_path):
    problem = pin_problem(tmp_path, "week three")
    assert problem.message == (
        "not a round number or a date: write a round number (1, 2, 3, …) or a date as YYYY-MM-DD"
    )
    assert where(problem) == ("Fixtures", 2, "Round", "week three")


def test_date_not_iso_suggests_the_iso_form(tmp_path):
    rounds = [["Round", "Date"], [1, "2025-09-13"]]
    problem = pin_problem(tmp_path, "13/09/2025", rounds)
    assert problem.message == "not a date: write dates as YYYY-MM-DD (did you mean 2025-09-13?)"
    assert where(problem) == ("Fixtures", 2, "Round", "13/09/2025")
    problem = pin_problem(tmp_path, "05/09/2025", rounds)  # day and month cannot be told apart
    assert problem.message == "not a date: write dates as YYYY-MM-DD"
    problem = pin_problem(tmp_path, "2025-02-30", rounds)
    assert problem.message == "not a date: write dates as YYYY-MM-DD"


def test_date_pin_not_in_rounds_sheet(tmp_path):
    problem = pin_problem(tmp_path, "2025-09-20", [["Round", "Date"], [1, "2025-09-13"]])
    assert problem.message == "no round of the Rounds sheet falls on 2025-09-20"
    assert where(problem) == ("Fixtures", 2, "Round", "2025-09-20")


def test_date_pin_without_any_dates(tmp_path):
    problem = pin_problem(tmp_path, "2025-09-20")
    assert problem.message == (
        "a date needs a Rounds sheet (or a Start date in Settings) to find its round; "
        "or write the round number"
    )


def test_date_pin_on_a_day_of_several_time_slots(tmp_path):
    rounds = [["Round", "Date", "Time"], [1, "2025-09-13", "09:00"], [2, "2025-09-13", "10:30"]]
    problem = pin_problem(tmp_path, "2025-09-13", rounds)
    assert (
        problem.message == "several rounds fall on 2025-09-13 (rounds 1, 2): write the round number"
    )


def test_date_and_time_pin_picks_the_time_slot(tmp_path):
    rounds = [["Round", "Date", "Time"], [1, "2025-09-13", "09:00"], [2, "2025-09-13", "10:30"]]
    sheets = {
        "Fixtures": [HEAD, [None, "A", "B", None, None, dt.datetime(2025, 9, 13, 10, 30)]],
        "Rounds": rounds,
    }
    result = load_book(tmp_path, sheets)
    assert result.ok and result.league.pins == {"A v B": 2}


def test_round_beyond_the_rounds_sheet(tmp_path):
    problem = pin_problem(tmp_path, 3, [["Round"], [1], [2]])
    assert problem.message == "there is no round 3: the Rounds sheet lists rounds 1 to 2"


def test_date_pin_from_settings_dates(tmp_path):
    rows = [HEAD] + [
        [None, h, a, None, None, day]
        for h, a, day in (
            ("A", "B", "2025-09-27"),
            ("C", "D", "2025-09-20"),
            ("E", "F", "2025-09-21"),
            ("G", "H", "2025-09-13"),
        )
    ]
    sheets = {
        "Fixtures": rows,
        "Settings": [["Setting", "Value"], ["Start date", "2025-09-06"], ["Skip", "2025-09-13"]],
    }
    result = load_book(tmp_path, sheets)
    assert [(p.message, p.row) for p in errors(result)] == [
        ("no round falls on 2025-09-21: rounds fall every 7 days from 2025-09-06", 4),
        ("no round falls on 2025-09-13: it is a Skip date in Settings", 5),
    ]
    # 09-06 is round 1, 09-13 is skipped (the round moves on), 09-20 is round 2, 09-27 round 3
    assert result.league.pins == {"A v B": 3, "C v D": 2}


def test_played_and_score_freeze_a_fixture(tmp_path):
    head = ["Home", "Away", "Round", "Played", "Score"]
    rows = [
        head,
        ["A", "B", 1, "yes", None],
        ["C", "D", 1, None, "2-1"],
        ["E", "F", 2, "X", None],
        ["G", "H", 2, "no", None],
        ["I", "J", None, None, None],
    ]
    result = load_book(tmp_path, {"Fixtures": rows})
    assert result.ok, [str(p) for p in result.problems]
    assert [f.played for f in result.league.fixtures] == [True, True, True, False, False]
    assert result.league.fixture("C v D").notes == {"Score": "2-1"}


def test_played_without_round(tmp_path):
    rows = [["Home", "Away", "Round", "Played"], ["A", "B", None, "yes"]]
    result = load_book(tmp_path, {"Fixtures": rows})
    problem = one(errors(result))
    assert problem.message == (
        "the fixture is marked played but has no Round: give the round it was played in"
    )
    assert where(problem) == ("Fixtures", 2, "Round", None)
    assert result.league.fixtures[0].played is False


def test_played_not_yes_or_no(tmp_path):
    rows = [["Home", "Away", "Round", "Played"], ["A", "B", 1, "maybe"]]
    problem = one(errors(load_book(tmp_path, {"Fixtures": rows})))
    assert problem.message == "not yes or no: write yes (or x) for a fixture already played"
    assert where(problem) == ("Fixtures", 2, "Played", "maybe")


def test_pinned_fixtures_that_clash_in_one_round(tmp_path):
    rows = [
        HEAD,
        [None, "Alder", "Birch", "Oak Rd", None, 2],
        [None, "Cedar", "Damson", None, None, 2],
        [None, "Alder", "Cedar", "Oak Rd", None, 2],
    ]
    found = errors(load_book(tmp_path, {"Fixtures": rows}))
    assert [(p.message, where(p)) for p in found] == [
        (
            "'Alder v Birch' (row 2) and 'Alder v Cedar' (row 4) are both pinned to round 2 but "
            "clash (team Alder; venue Oak Rd): no schedule can keep both pins",
            ("Fixtures", 4, "Round", "2"),
        ),
        (
            "'Cedar v Damson' (row 3) and 'Alder v Cedar' (row 4) are both pinned to round 2 but "
            "clash (team Cedar): no schedule can keep both pins",
            ("Fixtures", 4, "Round", "2"),
        ),
    ]


def test_shared_columns_with_several_values(tmp_path):
    rows = [
        ["Home", "Away", "Referee", "Coach"],
        ["A", "B", "Ann; Bo", "Cy"],
        ["C", "D", "bo", "Cy"],
    ]
    sheets = {
        "Fixtures": rows,
        "Settings": [["Setting", "Value"], ["Shared", "Home, Away; referee"]],
    }
    result = load_book(tmp_path, sheets)
    assert result.ok
    league = result.league
    assert league.settings.shared == ("Home", "Away", "Referee")
    assert [f.shared for f in league.fixtures] == [{"Referee": ("Ann", "Bo")}, {"Referee": ("bo",)}]
    assert league.fixtures[0].notes == {"Referee": "Ann; Bo", "Coach": "Cy"}


def test_shared_names_an_unknown_column(tmp_path):
    sheets = {
        "Fixtures": [["Home", "Away", "Referee"], ["A", "B", "Ann"]],
        "Settings": [["Setting", "Value"], ["Shared", "Home, Away, Referees"]],
    }
    problem = one(errors(load_book(tmp_path, sheets)))
    assert problem.message == (
        "Clash on names the column 'Referees', which the Fixtures sheet does not have; "
        "did you mean 'Referee'?"
    )
    assert where(problem) == ("Settings", 2, "Value", "Referees")


def test_typo_column_warns_and_a_date_needs_rounds_with_dates(tmp_path):
    rows = [["Home", "Away", "Date", "Venu"], ["A", "B", "2025-09-13", "Oak"]]
    result = load_book(tmp_path, {"Fixtures": rows})
    assert [(p.message, where(p)) for p in warnings_of(result)] == [
        ("the column is kept as a note; did you mean 'Venue'?", ("Fixtures", 1, "Venu", None)),
    ]
    assert [(p.message, where(p)) for p in errors(result)] == [(
        "a date needs a Rounds sheet (or a Start date in Settings) to find its round; or write "
        "the round number", ("Fixtures", 2, "Date", "2025-09-13"))]
    assert result.league.fixtures[0].notes == {"Venu": "Oak"}


def test_pitch_column_and_venue_from_teams(tmp_path):
    sheets = {
        "Teams": [["Team", "Venue", "Club"], ["Alder", "Alder Park", "Woodland"]],
        "Fixtures": [["Home", "Away", "Pitch"], ["Alder", "Birch", 2], ["Birch", "Alder", None]],
    }
    result = load_book(tmp_path, sheets)
    assert result.ok
    assert [(f.venue, f.pitch) for f in result.league.fixtures] == [
        ("Alder Park", "2"),
        (None, None),
    ]
    assert result.league.teams["Alder"].club == "Woodland"


def csv_result(tmp_path, text: str, encoding="utf-8"):
    path = tmp_path / "league.csv"
    path.write_bytes(text.encode(encoding))
    return load_league(path)


def test_csv_comma(tmp_path):
    result = csv_result(
        tmp_path, 'Home,Away,Venue,Round\nAlder,Birch,"Oak Rd, North",2\nCedar,Damson,,\n'
    )
    assert result.ok
    assert [(f.label, f.venue, f.pin, f.row) for f in result.league.fixtures] == [
        ("Alder v Birch", "Oak Rd, North", 2, 2),
        ("Cedar v Damson", None, None, 3),
    ]
    assert result.league.name == "league"


def test_csv_semicolon_with_bom(tmp_path):
    result = csv_result(tmp_path, "\ufeffHome;Away;Venue\r\nAlder;Birch;Oak Rd, North\r\n", "utf-8")
    assert result.ok
    fixture = one(result.league.fixtures)
    assert (fixture.home, fixture.away, fixture.venue) == ("Alder", "Birch", "Oak Rd, North")


def test_csv_problem_rows_count_records(tmp_path):
    result = csv_result(tmp_path, 'Home,Away,Note\nAlder,Birch,"two\nlines"\nCedar,cedar,x\n')
    problem = one(errors(result))
    assert (problem.message, where(problem)) == (
        "Home and Away are the same team",
        (None, 3, "Away", "cedar"),
    )
    assert (
        str(problem) == f"{tmp_path / 'league.csv'}, row 3, column Away: 'cedar': "
        "Home and Away are the same team"
    )


def test_csv_missing_column_and_header_only(tmp_path):
    problem = one(csv_result(tmp_path, "Home;Guests\nAlder;Birch\n").problems)
    assert (problem.message, where(problem)) == (
        "the file has no Away column (columns found: Home, Guests)",
        (None, 1, "Away", None),
    )
    problem = one(csv_result(tmp_path, "Home,Away\n").problems)
    assert (problem.message, where(problem)) == (
        "the file has a header row but no fixtures",
        (None, 1, None, None),
    )
    problem = one(csv_result(tmp_path, "\n \n").problems)
    assert (problem.message, where(problem)) == ("the file has no rows", (None, None, None, None))


def test_league_warnings_are_the_warning_problems(tmp_path):
    rows = [HEAD, [None, "Alder", "Birch"], [None, "alder", "Cedar"]]
    result = load_book(tmp_path, {"Fixtures": rows})
    assert result.ok and result.league.warnings == warnings_of(result) != []


def test_usual_headers_stand_for_our_columns_and_name_them_in_problems(tmp_path):
    rows = [["Home Team", "Away Team", "Field", "Age group", "Matchday"],
            ["Alder", "Birch", "North Field", "U10", 1], ["Cedar", None, "South Field", "U10", 2]]
    result = load_book(tmp_path, {"Fixtures": rows})
    fixture = result.league.fixtures[0]
    assert (fixture.home, fixture.away, fixture.venue, fixture.division, fixture.pin) == (
        "Alder", "Birch", "North Field", "U10", 1)
    assert [(p.message, p.row, p.column) for p in result.problems] == [
        ("'Cedar v ?' has no Away team: give both Home and Away, or a Fixture label", 3,
         "Away Team")]


def test_a_standard_header_wins_over_an_alias_which_stays_a_note(tmp_path):
    rows = [["Home", "Away", "Home Team"], ["Alder", "Birch", "Alder FC"]]
    result = load_book(tmp_path, {"Fixtures": rows})
    assert result.ok and result.league.fixtures[0].home == "Alder"
    assert result.league.fixtures[0].notes == {"Home Team": "Alder FC"}
