"""The Requests sheet: a club's wish to be at home (or not) in a round, met where the rules allow,
and the ones that cannot be met named."""

from __future__ import annotations

import json

from leaguegrid.app import league as opening
from leaguegrid.app import planning
from leaguegrid.cli.main import main

TEAMS = [("Team", "Venue")] + [(f"Side {i}", f"Ground {i}") for i in range(1, 7)]


def planned(book, rounds: int = 5):
    opened = opening.open_league(book)
    assert opened.ok, [str(p) for p in opened.result.problems]
    return opened.league, planning.make_schedule(opened.league, opened.graph, rounds, seed=4)


def at_home(league, assignment) -> set[tuple[str, int]]:
    return {(f.home, assignment[f.label]) for f in league.fixtures}


def test_requests_are_met_and_the_breaks_stay_at_the_bound(workbook):
    requests = [("Team", "Round", "Side", "Reason"), ("Side 1", 2, "home", "fun day"),
                ("Side 2", 2, "home", "presentation"), ("Side 3", 1, "away", "ground let out"),
                ("Side 4", 5, "home", "")]
    book = workbook("r.xlsx", {"Teams": TEAMS, "Requests": requests})
    league, outcome = planned(book)
    home = at_home(league, outcome.schedule.assignment)
    assert {("Side 1", 2), ("Side 2", 2), ("Side 4", 5)} <= home
    assert ("Side 3", 1) not in home
    # de Werra 1981: 6 teams in 5 rounds, at least 4 breaks; the requests cost none here
    assert (outcome.breaks.total, outcome.breaks_bound) == (4, 4)
    assert "requests: 4 of 4 requests met" in outcome.schedule.notes


def test_a_request_no_schedule_can_meet_is_named_with_its_row(workbook, capsys):
    # Sides 1 and 2 share a one-pitch ground: both cannot be at home in round 3.
    teams = [("Team", "Venue")] + [("Side 1", "Shared Ground"), ("Side 2", "Shared Ground")] + [
        (f"Side {i}", f"Ground {i}") for i in range(3, 7)]
    requests = [("Team", "Round", "Side", "Reason"), ("Side 1", 3, "home", "fun day"),
                ("Side 2", 3, "home", "fun day too")]
    book = workbook("r.xlsx", {"Teams": teams, "Requests": requests})
    league, outcome = planned(book)
    home = at_home(league, outcome.schedule.assignment)
    assert (("Side 1", 3) in home) != (("Side 2", 3) in home)
    notes = [n for n in outcome.schedule.notes if n.startswith("request")]
    assert notes[0] == "requests: 1 of 2 requests met"
    assert notes[1] in ("request not met: Side 1 home in round 3 (fun day), Requests row 2",
                        "request not met: Side 2 home in round 3 (fun day too), Requests row 3")
    code = main(["plan", str(book), "--rounds", "5", "--seed", "4", "--json"])
    data = json.loads(capsys.readouterr().out)
    assert code == 0 and sorted(q["met"] for q in data["requests"]) == [False, True]


def test_request_rows_are_checked_cell_by_cell(workbook):
    requests = [("Team", "Round", "Side"), ("Side 9", 2, "home"), ("Side 1", 2, "homeish"),
                ("Side 2", 0, "away")]
    book = workbook("r.xlsx", {"Teams": TEAMS, "Requests": requests})
    problems = opening.open_league(book).result.problems
    assert [(p.row, p.column, p.value, p.message.split(";")[0]) for p in problems] == [
        (2, "Team", "Side 9", "no team is named 'Side 9'"),
        (3, "Side", "homeish", "the side must be home or away"),
        (4, "Round", "0", "not a positive whole number: rounds are numbered 1, 2, 3, …"),
    ]
