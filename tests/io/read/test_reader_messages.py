"""The rarer problems of the workbook format, each with its exact message and place."""

from __future__ import annotations

import zipfile

from test_reader_support import errors, load_book, one, warnings_of, write_book

from leaguegrid.io.read.league_reader import load_league

FIXTURES = [["Home", "Away", "Venue"], ["Alder", "Birch", "Oak Rd"], ["Cedar", "Damson", "Pine St"]]


def where(problem):
    return (problem.sheet, problem.row, problem.column, problem.value)


def listed(result):
    return [(p.severity, p.message, where(p)) for p in result.problems]


def test_qualifier_without_a_name(tmp_path):
    result = load_book(
        tmp_path, {"Fixtures": FIXTURES, "Clashes": [["First", "Second"], ["team:", "Alder"]]}
    )
    assert listed(result) == [
        ("error", "no name follows 'team:'", ("Clashes", 2, "First", "team:"))
    ]


def test_clash_whose_only_pair_is_a_fixture_with_itself(tmp_path):
    rows = [["First", "Second"], ["Alder", "Alder v Birch"]]
    result = load_book(tmp_path, {"Fixtures": FIXTURES, "Clashes": rows})
    assert listed(result) == [
        (
            "warning",
            "the row adds no clash: its only pair is a fixture with itself",
            ("Clashes", 2, "Second", "Alder v Birch"),
        )
    ]
    assert result.league.clash_rows[0].pairs == []


def test_missing_names_in_teams_and_venues(tmp_path):
    sheets = {
        "Fixtures": FIXTURES,
        "Teams": [["Team", "Club"], [None, "Woodland"]],
        "Venues": [["Venue", "Pitches"], [None, 2]],
    }
    assert listed(load_book(tmp_path, sheets)) == [
        ("error", "the venue name is missing", ("Venues", 2, "Venue", None)),
        ("error", "the team name is missing", ("Teams", 2, "Team", None)),
    ]


def test_played_no_with_a_score(tmp_path):
    rows = [["Home", "Away", "Round", "Played", "Score"], ["Alder", "Birch", 1, "no", "1-1"]]
    result = load_book(tmp_path, {"Fixtures": rows})
    assert listed(result) == [
        (
            "warning",
            "Played says no but Score holds a result; read as played",
            ("Fixtures", 2, "Played", "no"),
        )
    ]
    assert result.league.fixtures[0].played


def test_shared_without_teams(tmp_path):
    sheets = {"Fixtures": FIXTURES, "Settings": [["Setting", "Value"], ["Shared", "Venue"]]}
    result = load_book(tmp_path, sheets)
    assert listed(result) == [
        (
            "warning",
            "Clash on names neither Home nor Away, so a team may get two fixtures in one round",
            ("Settings", 2, "Value", "Venue"),
        )
    ]


def test_shared_for_generated_fixtures(tmp_path):
    settings = [["Setting", "Value"], ["Shared", "Home, Away, Division, Referee"]]
    result = load_book(
        tmp_path, {"Teams": [["Team", "Division"], ["A", "U9"], ["B", "U9"]], "Settings": settings}
    )
    assert listed(result) == [
        (
            "error",
            "Clash on names the column 'Referee', which fixtures generated from Teams do not "
            "have (they have Home, Away, Venue and Division)",
            ("Settings", 2, "Value", "Referee"),
        )
    ]
    assert result.league.fixtures[0].shared == {"Division": ("U9",)}


def test_legs_without_return_fixtures_and_return_half_without_legs(tmp_path):
    sheets = {"Fixtures": FIXTURES, "Settings": [["Setting", "Value"], ["Legs", 2]]}
    assert listed(load_book(tmp_path, sheets)) == [
        (
            "warning",
            "Legs is 2, but no two teams meet twice in the Fixtures sheet, so there are no "
            "return fixtures",
            ("Settings", 2, "Value", "2"),
        )
    ]
    sheets = {"Fixtures": FIXTURES, "Settings": [["Setting", "Value"], ["Return half", "yes"]]}
    assert listed(load_book(tmp_path, sheets)) == [
        ("warning", "Return half has no effect unless Legs is 2", ("Settings", 1, None, None))
    ]


def test_league_without_fixtures(tmp_path):
    result = load_book(tmp_path, {"Teams": [["Team"], ["Alder"]]})
    assert listed(result) == [
        (
            "warning",
            "the division has only one team, so it has no fixtures",
            ("Teams", 2, "Division", None),
        ),
        ("error", "the league has no fixtures", ("Teams", None, None, None)),
    ]


def test_sheets_missing_their_key_columns(tmp_path):
    sheets = {
        "Fixtures": FIXTURES,
        "Rounds": [["Note"], ["x"]],
        "Blocked": [["Reason"], ["x"]],
        "Settings": [["Name", "Value"], ["Legs", 2]],
        "Distances": [["From", "To"], ["a", "b"]],
        "Venues": [["Place"], ["Oak Rd"]],
    }
    assert listed(load_book(tmp_path, sheets)) == [
        (
            "error",
            "the sheet has no Setting column (columns found: Name, Value)",
            ("Settings", 1, "Setting", None),
        ),
        ("error", "the sheet needs a Round or a Date column", ("Rounds", 1, None, None)),
        (
            "error",
            "the sheet has no Venue column (columns found: Place)",
            ("Venues", 1, "Venue", None),
        ),
        ("error", "the sheet needs a Team or a Venue column", ("Blocked", 1, None, None)),
        ("error", "the sheet needs a Round or a Date column", ("Blocked", 1, None, None)),
        (
            "error",
            "the sheet has no Km column (columns found: From, To)",
            ("Distances", 1, "Km", None),
        ),
    ]


def test_longitude_range_and_distance_needs_both_ends(tmp_path):
    sheets = {
        "Fixtures": FIXTURES,
        "Venues": [["Venue", "Latitude", "Longitude"], ["Oak Rd", 10, 181]],
        "Distances": [["From", "To", "Km"], ["Oak Rd", None, 3]],
    }
    assert listed(load_book(tmp_path, sheets)) == [
        ("error", "not a longitude: a number from -180 to 180", ("Venues", 2, "Longitude", "181")),
        ("error", "the row needs both From and To", ("Distances", 2, "To", None)),
    ]


def test_round_numbers_beyond_what_is_handled(tmp_path):
    rows = [["Home", "Away", "Round"], ["Alder", "Birch", 1001]]
    problem = one(errors(load_book(tmp_path, {"Fixtures": rows})))
    assert problem.message == "there is no round 1001: LeagueGrid handles at most 1000 rounds"
    problem = one(
        errors(load_book(tmp_path, {"Fixtures": FIXTURES, "Rounds": [["Round"], [10**12]]}))
    )
    assert (problem.message, where(problem)) == (
        "there is no round 1000000000000: LeagueGrid handles at most 1000 rounds",
        ("Rounds", 2, "Round", "1000000000000"),
    )


def test_empty_teams_sheet_beside_fixtures(tmp_path):
    result = load_book(tmp_path, {"Fixtures": FIXTURES, "Teams": []})
    assert listed(result) == [
        ("warning", "the sheet is empty; nothing is read from it", ("Teams", None, None, None))
    ]


def test_csv_field_too_long(tmp_path):
    path = tmp_path / "league.csv"
    path.write_text('Home,Away\n"' + "x" * 200_000 + '",B\n')
    problem = one(load_league(path).problems)
    assert problem.message == (
        "the CSV text cannot be read: line 2 has a value longer than 131,072 characters"
    )


def test_part_that_cannot_be_unpacked(tmp_path):
    path = write_book(tmp_path / "league.xlsx", {"Fixtures": FIXTURES})
    data = bytearray(path.read_bytes())
    with zipfile.ZipFile(path) as archive:
        info = archive.getinfo("xl/worksheets/sheet1.xml")
    start = info.header_offset + 30 + len(info.filename.encode()) + len(info.extra)
    data[start : start + 8] = b"\xff" * 8  # the deflate stream itself is broken
    path.write_bytes(bytes(data))
    problem = one(load_league(path).problems)
    assert problem.message == (
        "the file is truncated or damaged: part xl/worksheets/sheet1.xml cannot be unpacked"
    )


def test_spelling_warnings_for_divisions_and_clubs(tmp_path):
    sheets = {
        "Teams": [["Team", "Division", "Club"], ["A", "U9", "Woodland"], ["B", "u 9", "WOODLAND"]]
    }
    result = load_book(tmp_path, sheets)
    assert [(p.message, where(p)) for p in warnings_of(result)] == [
        (
            "written differently from 'U9' (Teams row 2); read as the same division",
            ("Teams", 3, "Division", "u 9"),
        ),
        (
            "written differently from 'Woodland' (Teams row 2); read as the same club",
            ("Teams", 3, "Club", "WOODLAND"),
        ),
    ]
    assert {t.division for t in result.league.teams.values()} == {"U9"}


def test_chart_sheet_with_a_known_name(tmp_path):
    import openpyxl
    from openpyxl.chart import BarChart, Reference

    book = openpyxl.Workbook()
    fixtures = book.active
    fixtures.title = "Fixtures"
    for row in FIXTURES:
        fixtures.append(row)
    chart = BarChart()
    chart.add_data(Reference(fixtures, min_col=1, min_row=1, max_row=3))
    book.create_chartsheet("Clashes").add_chart(chart)
    book.save(tmp_path / "league.xlsx")
    result = load_league(tmp_path / "league.xlsx")
    assert listed(result) == [
        ("error", "the sheet holds a chart, not rows", ("Clashes", None, None, None))
    ]
