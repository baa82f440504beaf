"""Fixtures generated from the Teams sheet: a single round-robin inside each division, home and
away balanced, the return leg with Legs = 2."""

from __future__ import annotations

from collections import Counter
from itertools import combinations

from test_reader_support import errors, load_book, one, six_teams, warnings_of

from leaguegrid.core.round_robin import pairings


def test_six_teams_fifteen_fixtures_home_and_away_balanced(tmp_path):
    result = load_book(tmp_path, {"Teams": six_teams()})
    assert result.ok, [str(p) for p in result.problems]
    fixtures = result.league.fixtures
    assert len(fixtures) == 15  # 6 choose 2
    pairs = {frozenset(f.teams) for f in fixtures}
    assert pairs == {
        frozenset(p) for p in combinations(["Alder", "Birch", "Cedar", "Damson", "Elm", "Fir"], 2)
    }
    home = Counter(f.home for f in fixtures)
    assert sorted(home.values()) == [2, 2, 2, 3, 3, 3]  # 5 games each: home 2 or 3 times
    for f in fixtures:
        assert (f.label, f.venue, f.division, f.leg, f.row, f.pin) == (
            f"{f.home} v {f.away}",
            f"{f.home} Park",
            "U12",
            1,
            None,
            None,
        )


def test_two_legs_thirty_fixtures_with_home_and_away_swapped(tmp_path):
    settings = [["Setting", "Value"], ["Legs", 2]]
    result = load_book(tmp_path, {"Teams": six_teams(), "Settings": settings})
    assert result.ok
    fixtures = result.league.fixtures
    assert len(fixtures) == 30
    first, second = fixtures[:15], fixtures[15:]
    assert [(f.away, f.home) for f in first] == [(f.home, f.away) for f in second]
    assert {f.leg for f in first} == {1} and {f.leg for f in second} == {2}
    assert Counter(f.home for f in fixtures) == Counter(
        {t: 5 for t in ["Alder", "Birch", "Cedar", "Damson", "Elm", "Fir"]}
    )
    assert second[0].venue == f"{second[0].home} Park"


def test_balance_for_every_division_size():
    for n in range(2, 15):
        teams = [f"T{i}" for i in range(n)]
        fixtures = pairings(teams)
        assert len(fixtures) == n * (n - 1) // 2
        assert len({frozenset(p) for p in fixtures}) == len(fixtures)
        home = Counter(h for h, _ in fixtures)
        assert {home.get(t, 0) for t in teams} <= {(n - 1) // 2, n // 2}, n


def test_round_robin_inside_each_division(tmp_path):
    rows = (
        [["Team", "Division"]]
        + [[f"A{i}", "A"] for i in range(4)]
        + [[f"B{i}", "B"] for i in range(5)]
    )
    result = load_book(tmp_path, {"Teams": rows})
    assert result.ok
    divisions = Counter(f.division for f in result.league.fixtures)
    assert divisions == {"A": 6, "B": 10}
    for f in result.league.fixtures:
        assert f.home[0] == f.away[0] == f.division


def test_team_listed_twice(tmp_path):
    rows = six_teams() + [["  alder", "Elsewhere", "U12"]]
    result = load_book(tmp_path, {"Teams": rows})
    problem = one(errors(result))
    assert problem.message == "the team is listed twice (rows 2 and 8)"
    assert (problem.sheet, problem.row, problem.column, problem.value) == (
        "Teams",
        8,
        "Team",
        "alder",
    )


def test_division_with_one_team(tmp_path):
    rows = six_teams() + [["Gorse", None, "U14"]]
    result = load_book(tmp_path, {"Teams": rows})
    assert result.ok
    problem = one(warnings_of(result))
    assert problem.message == "the division has only one team, so it has no fixtures"
    assert (problem.sheet, problem.row, problem.column, problem.value) == (
        "Teams",
        8,
        "Division",
        "U14",
    )


def test_empty_teams_sheet(tmp_path):
    result = load_book(tmp_path, {"Teams": [["Team", "Venue"]]})
    problem = one(result.problems)
    assert (problem.message, problem.sheet, problem.row) == (
        "the sheet has a header row but no teams",
        "Teams",
        1,
    )
    result = load_book(tmp_path, {"Teams": []})
    assert one(result.problems).message == "the sheet is empty"


def test_teams_sheet_missing_team_column(tmp_path):
    result = load_book(tmp_path, {"Teams": [["Name", "Venue"], ["Alder", "Park"]]})
    assert (
        one(errors(result)).message == "the sheet has no Team column (columns found: Name, Venue)"
    )


def test_empty_fixtures_sheet_falls_back_to_teams(tmp_path):
    result = load_book(tmp_path, {"Fixtures": [["Home", "Away"]], "Teams": six_teams()})
    assert result.ok and len(result.league.fixtures) == 15
    assert one(warnings_of(result)).message == (
        "the sheet has no fixtures; fixtures are generated from the Teams sheet"
    )


def test_teams_with_fixtures_sheet_add_details_only(tmp_path):
    sheets = {"Fixtures": [["Home", "Away"], ["Alder", "Birch"]], "Teams": six_teams()}
    result = load_book(tmp_path, sheets)
    assert result.ok and len(result.league.fixtures) == 1
    fixture = result.league.fixtures[0]
    assert (fixture.venue, fixture.division) == ("Alder Park", "U12")
    assert [(p.message, p.row, p.value) for p in warnings_of(result)] == [
        ("the team has no fixtures", n, name)
        for n, name in ((4, "Cedar"), (5, "Damson"), (6, "Elm"), (7, "Fir"))
    ]


def test_generated_labels_stay_unique(tmp_path):
    rows = [["Team"], ["B v C"], ["C"], ["A"], ["A v B"]]
    result = load_book(tmp_path, {"Teams": rows})
    labels = [f.label for f in result.league.fixtures]
    assert len(labels) == 6 and len({label.casefold() for label in labels}) == 6
    assert "A v B v C (2)" in labels
