"""`leaguegrid plan` and `leaguegrid whatif` end to end on real workbooks."""

from __future__ import annotations

import json
from pathlib import Path

import networkx as nx
import pytest
import sympy
from openpyxl import load_workbook

from leaguegrid.cli.main import main


def test_plan_six_team_round_robin_is_a_valid_schedule(cli, round_robin, tmp_path) -> None:
    book = round_robin(6)
    out_file = tmp_path / "calendar.xlsx"
    code, out, _ = cli("plan", str(book), "--rounds", "5", "--seed", "11",
                       "--out", str(out_file))
    assert code == 0
    # OEIS A000438 (6 one-factorizations of K6) x 5! orderings
    assert "Valid schedules for 5 rounds: 720 (exact)" in out
    rows = list(load_workbook(out_file, read_only=True)["Calendar"].iter_rows(values_only=True))
    header, body = rows[0], rows[1:]
    col = {name: i for i, name in enumerate(header)}
    assert len(body) == 15
    assert len({r[col["Fixture"]] for r in body}) == 15
    for rnd in range(1, 6):
        teams = [t for r in body if r[col["Round"]] == rnd for t in (r[col["Home"]],
                                                                     r[col["Away"]])]
        assert sorted(teams) == sorted(set(teams)) and len(teams) == 6  # each team once


def test_plan_prints_breaks_against_the_published_bound(cli, round_robin) -> None:
    book = round_robin(8)
    code, out, _ = cli("plan", str(book), "--rounds", "7", "--seed", "3")
    assert code == 0
    # de Werra 1981: a compact single round robin of 8 teams has at least 6 breaks
    assert "Breaks: 6 (lower bound 6: optimal)" in out.splitlines()
    assert "Note: optimised for the fewest breaks from the round robin timetable LeagueGrid " \
           "generated" in out.splitlines()
    code, out, _ = cli("plan", str(book), "--rounds", "7", "--seed", "3", "--uniform")
    assert code == 0
    line = next(x for x in out.splitlines() if x.startswith("Breaks: "))
    assert line.endswith("(lower bound 6)") or line == "Breaks: 6 (lower bound 6: optimal)"
    assert f"Note: drawn uniformly from all {6240 * 5040:,} valid schedules" in out  # A000438


def test_plan_json_holds_the_schedule_its_breaks_and_nothing_else(cli, round_robin,
                                                                   tmp_path) -> None:
    book = round_robin(8)
    code, out, err = cli("plan", str(book), "--rounds", "7", "--seed", "5", "--json",
                         "--csv", str(tmp_path / "s.csv"))
    assert code == 0
    data = json.loads(out)  # stdout is the JSON object alone
    assert "Wrote:" in err and "Wrote:" not in out
    assert (data["rounds"], data["seed"], data["method"]) == (7, 5, "optimised")
    assert len(data["fixtures"]) == 28
    sides: dict[str, list[tuple[int, str]]] = {}
    for f in data["fixtures"]:
        sides.setdefault(f["home"], []).append((f["round"], "H"))
        sides.setdefault(f["away"], []).append((f["round"], "A"))
    recount = {t: sum(a[1] == b[1] for a, b in zip(sorted(g), sorted(g)[1:], strict=False))
               for t, g in sides.items()}
    assert data["breaks"]["per_team"] == recount
    # de Werra 1981: 8 teams, one leg, 7 rounds: at least 6 breaks, and 6 can be reached
    assert data["breaks"] == {"total": 6, "lower_bound": 6, "optimal": True,
                              "per_team": recount}
    assert data["byes"] == {t: [] for t in sorted(sides)}
    assert data["rules"] == [{"rule": "clashes: 168 pairs of fixtures never share a round",
                              "met": True},
                             {"rule": "byes apart: no team has byes in two rounds in a row",
                              "met": True}]


def test_plan_json_when_nothing_is_possible(cli, round_robin) -> None:
    code, out, err = cli("plan", str(round_robin(6)), "--rounds", "4", "--seed", "1", "--json")
    assert code == 3
    data = json.loads(out)
    assert (data["status"], data["fixtures"], data["breaks"]) == ("impossible", [], None)
    assert "No schedule with 4 rounds exists:" in err


def test_plan_same_seed_same_schedule_and_seed_printed(cli, round_robin) -> None:
    book = str(round_robin(6))
    _, first, _ = cli("plan", book, "--rounds", "6", "--seed", "2024")
    _, second, _ = cli("plan", book, "--rounds", "6", "--seed", "2024")
    assert first == second
    code, drawn, _ = cli("plan", book, "--rounds", "6")
    assert code == 0
    seed = drawn.split("seed ", 1)[1].split(" ", 1)[0]
    assert f"(drawn; --seed {seed} gives this again)" in drawn
    _, again, _ = cli("plan", book, "--rounds", "6", "--seed", seed)
    assert again.splitlines()[2:] == drawn.splitlines()[2:]


def test_plan_too_few_rounds_is_proven_impossible(cli, round_robin) -> None:
    code, _, err = cli("plan", str(round_robin(6)), "--rounds", "4", "--seed", "1")
    assert code == 3
    assert "No schedule with 4 rounds exists" in err


def test_plan_cannot_write_exits_4_and_never_overwrites_input(cli, round_robin) -> None:
    book = round_robin(4)
    before = book.read_bytes()
    code, _, err = cli("plan", str(book), "--rounds", "3", "--seed", "1",
                       "--out", str(book))
    assert code == 4
    assert "could not write" in err
    assert book.read_bytes() == before
    missing = book.parent / "no such folder" / "cal.xlsx"
    code, _, _ = cli("plan", str(book), "--rounds", "3", "--seed", "1",
                     "--out", str(missing))
    assert code == 4
    assert not missing.exists()


def test_plan_more_rounds_than_the_rounds_sheet_is_a_usage_error(cli, workbook) -> None:
    book = workbook("r.xlsx", {
        "Fixtures": [("Home", "Away"), ("A", "B")],
        "Rounds": [("Round", "Date"), (1, None), (2, None)],
    })
    code, _, err = cli("plan", str(book), "--rounds", "3")
    assert code == 2
    assert "--rounds: the Rounds sheet lists 2 rounds; 3 asks for more" in err


def _nx_count(edges: list[tuple[str, str]], nodes: list[str], k: int) -> int:
    """networkx.chromatic_polynomial (reference library) evaluated at k."""
    g = nx.Graph()
    g.add_nodes_from(nodes)
    g.add_edges_from(edges)
    poly = nx.chromatic_polynomial(g)
    return int(poly.subs(sympy.Symbol("x"), k))


def test_whatif_matches_networkx_on_the_modified_graph(cli, workbook) -> None:
    # Four fixtures; a coach runs teams A and D (Clashes row), so A v B and C v D clash.
    book = workbook("w.xlsx", {
        "Fixtures": [("Fixture", "Home", "Away"), ("A v B", "A", "B"), ("B v C", "B", "C"),
                     ("C v D", "C", "D"), ("D v E", "D", "E")],
        "Clashes": [("First", "Second", "Reason"), ("team: A", "team: D", "Coach Pell")],
    })
    code, out, _ = cli("whatif", str(book), "--rounds", "3", "--json",
                       "--add", "A v B,D v E")
    assert code == 0
    data = json.loads(out)
    nodes = ["A v B", "B v C", "C v D", "D v E"]
    edges = [("A v B", "B v C"), ("B v C", "C v D"), ("C v D", "D v E"),
             ("A v B", "C v D"), ("A v B", "D v E")]
    assert data["assignments"] == _nx_count(edges, nodes, 3)
    coach = next(r for r in data["reasons"] if r["kind"] == "clash")
    assert coach["reason"] == "Coach Pell (row 2)"
    assert sorted(map(sorted, coach["edges"])) == [["A v B", "C v D"], ["A v B", "D v E"]]
    without = [e for e in edges if e not in (("A v B", "C v D"), ("A v B", "D v E"))]
    assert coach["assignments_if_waived"] == _nx_count(without, nodes, 3)
    assert coach["gain"] == coach["assignments_if_waived"] - data["assignments"]
    assert not [r for r in data["reasons"] if r["kind"] == "team"]  # never offered
    gains = [r["gain"] for r in data["reasons"]]
    assert gains == sorted(gains, reverse=True)
    added = data["added"]
    assert added["edges"] == []  # A v B and D v E clash already, through the coach
    assert added["loss"] == 0


def test_whatif_add_unknown_name_is_a_usage_error(cli, round_robin) -> None:
    code, _, err = cli("whatif", str(round_robin(4)), "--rounds", "3",
                       "--add", "Team Q,Team A")
    assert code == 2
    assert "'Team Q' is not a fixture, team or venue of this league" in err


@pytest.mark.parametrize("argv", [["plan", "--rounds", "3"], ["whatif"]])
def test_missing_arguments_exit_2(argv: list[str]) -> None:
    with pytest.raises(SystemExit) as stop:
        main(argv)
    assert stop.value.code == 2


def test_demo_path_exists() -> None:
    from leaguegrid.app.demos import default_demo as demo_path

    assert Path(demo_path()).is_file()


def test_whatif_team_joins_and_venue_closes(cli, round_robin) -> None:
    # Four teams, Team A's ground closes in round 1, then a fifth team joins.
    book = str(round_robin(4))
    code, out, _ = cli("whatif", book, "--rounds", "5", "--json", "--close", "Ground A,1",
                       "--join", "Team E,Open,Ground E")
    assert code == 0
    joined, closed = json.loads(out)["changes"]
    # The fixtures of a 4-team round-robin clash as the line graph of K4, the octahedron
    # K_{2,2,2} (textbook); its count is checked against networkx.
    octahedron = nx.complete_multipartite_graph(2, 2, 2)
    assert joined["assignments_before"] == _nx_count(
        list(octahedron.edges), list(octahedron.nodes), 5)
    # A 5-team round-robin needs 5 rounds: the chromatic index of K_n is n for odd n
    # (textbook); the new team brings 4 fixtures.
    assert joined["min_rounds_after"] == 5
    assert len(joined["fixtures_added"]) == 4
    assert closed["change"] == "venue Ground A closed in round 1"
    assert closed["assignments_after"] < closed["assignments_before"]
    code, _, err = cli("whatif", book, "--rounds", "5", "--close", "Grund A,1")
    assert code == 2
    assert "did you mean 'Ground A'?" in err


def test_plan_exits_3_naming_a_leg_gap_the_rounds_cannot_hold(cli, workbook) -> None:
    teams = [("Team", "Venue")] + [(f"Side {i}", f"Ground {i}") for i in range(4)]
    book = workbook("gap.xlsx", {"Teams": teams,
                                 "Settings": [("Setting", "Value"), ("Legs", 2), ("Leg gap", 6)]})
    code, out, err = cli("plan", str(book), "--rounds", "6", "--seed", "1")
    assert code == 3
    assert ("leg gap: a pairing's two meetings cannot be 6 rounds apart in 6 rounds "
            "(at most 5)") in out + err
