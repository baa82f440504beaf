"""`leaguegrid check` and `leaguegrid count` end to end on real workbooks."""

from __future__ import annotations

import json
import math

import pytest

from leaguegrid.cli.main import main


def test_count_six_team_round_robin_matches_one_factorizations(cli, round_robin) -> None:
    # OEIS A000438: K6 has 6 one-factorizations, so a 6-team single round-robin can be split
    # into 5 rounds in 6 ways (groupings), and P(5) = 6 x 5!.
    code, out, _ = cli("count", str(round_robin(6)), "--rounds", "5", "--json")
    assert code == 0
    data = json.loads(out)
    assert data["fixtures"] == 15
    assert data["clashes"] == 15 * 8 // 2  # each fixture shares a team with 8 others
    assert data["min_rounds"] == 5
    assert data["counts"] == [{"rounds": 5, "exact": True, "assignments": 6 * 120,
                               "all_rounds_used": 6 * 120, "groupings": 6}]


def test_count_default_range_and_polynomial_of_a_path(cli, workbook) -> None:
    # Three fixtures in a chain of clashes form a path: P(k) = k (k - 1)^2 (trees, textbook).
    book = workbook("path.xlsx", {"Fixtures": [
        ("Fixture", "Home", "Away"),
        ("A v B", "A", "B"),
        ("B v C", "B", "C"),
        ("C v D", "C", "D"),
    ]})
    code, out, _ = cli("count", str(book), "--json")
    assert code == 0
    data = json.loads(out)
    assert data["min_rounds"] == 2
    assert data["polynomial"] == [0, 1, -2, 1]
    assert [row["rounds"] for row in data["counts"]] == [2, 3, 4, 5, 6]
    for row in data["counts"]:
        k = row["rounds"]
        assert row["assignments"] == k * (k - 1) ** 2
    # groupings: 2 rounds -> 1 way ({AB, CD} | {BC}); 3 rounds -> 1 way (each alone)
    assert [row["groupings"] for row in data["counts"]] == [1, 1, 0, 0, 0]
    code, out, _ = cli("count", str(book))
    assert "Chromatic polynomial: k (k - 1)^2" in out
    assert "Fewest rounds: 2" in out


def test_count_with_pin_divides_by_symmetry(cli, workbook) -> None:
    # A triangle of clashes with one fixture pinned to round 3: of the k(k-1)(k-2) assignments,
    # exactly 1/k put that fixture in round 3 (symmetry of rounds), so (k-1)(k-2) remain.
    book = workbook("pin.xlsx", {"Fixtures": [
        ("Fixture", "Home", "Away", "Round"),
        ("A v B", "A", "B", 3),
        ("A v C", "A", "C", None),
        ("B v C", "B", "C", None),
    ]})
    code, out, _ = cli("count", str(book), "--rounds", "2..5", "--json")
    assert code == 0
    data = json.loads(out)
    assert data["pinned"] is True
    assert data["min_rounds"] == 3
    assert [r["assignments"] for r in data["counts"]] == [0, 2, 6, 12]
    # every round used with k = 3: the two free fixtures take rounds 1 and 2 in either order
    assert data["counts"][1]["all_rounds_used"] == 2
    assert data["polynomial"] == [0, 2, -3, 1]  # the graph's own polynomial, pins aside


def test_count_rejects_more_rounds_than_the_rounds_sheet(cli, workbook) -> None:
    book = workbook("r.xlsx", {
        "Fixtures": [("Home", "Away"), ("A", "B")],
        "Rounds": [("Round", "Date"), (1, None), (2, None)],
    })
    code, _, err = cli("count", str(book), "--rounds", "1..3")
    assert code == 2
    assert "--rounds: the Rounds sheet lists 2 rounds; 3 asks for more" in err


def test_count_usage_error_on_bad_range(cli, round_robin) -> None:
    with pytest.raises(SystemExit) as stop:
        main(["count", str(round_robin(4)), "--rounds", "5..3"])
    assert stop.value.code == 2


def test_count_budget_exhausted_exits_5_and_marks_rows(cli, demo) -> None:
    # bigseason's full polynomial is far beyond a 0.5 s budget
    code, out, _ = cli("count", str(demo / "bigseason.xlsx"), "--budget", "0.5",
                       "--json")
    assert code == 5
    data = json.loads(out)
    assert data["polynomial"] is None
    assert data["complete"] is False
    assert any(row["exact"] is False for row in data["counts"]) or data["min_rounds"] is None


def test_unfinished_rows_carry_labelled_estimates_of_all_three_numbers(cli, demo) -> None:
    # With no pins, groupings = every-round-used / K! (falling-factorial identity), so the
    # groupings estimate is the every-round-used estimate divided by K!.
    # a 6 s budget: under load (two cores shared) 3 s has left the sampler no time at all
    code, out, _ = cli("count", str(demo / "bigseason.xlsx"), "--rounds", "18", "--budget",
                       "6", "--json")
    assert code == 5
    row = json.loads(out)["counts"][0]
    assert row["rounds"] == 18 and row["exact"] is False
    every = row["all_rounds_used"]
    assert every["method"].startswith("sequential importance sampling")
    assert every["low"] <= every["value"] <= every["high"]
    assert row["assignments"]["low"] <= every["value"] <= row["assignments"]["high"]
    f = math.factorial(18)
    assert row["groupings"]["value"] == (2 * every["value"] + f) // (2 * f)  # nearest whole
    assert row["groupings"]["low"] == -(-every["low"] // f) >= 1  # whole, and one exists
    assert row["groupings"]["method"] == every["method"] + ", every round used / 18!"


def test_check_reports_input_problems_with_exit_1(cli, workbook) -> None:
    book = workbook("bad.xlsx", {"Fixtures": [
        ("Home", "Away"),
        ("Heron", "Heron"),
    ]})
    code, out, _ = cli("check", str(book))
    assert code == 1
    assert "row 2" in out and "column Away" in out and "'Heron'" in out
    assert "Usable: no" in out


@pytest.mark.parametrize("name", ["small", "clubday", "season", "bigseason", "schedules"])
def test_check_demo_leagues_have_no_problems(cli, demo, name: str) -> None:
    code, out, _ = cli("check", str(demo / f"{name}.xlsx"))
    assert code == 0, out
    assert "Problems: none" in out


def test_counts_rows_agree_with_groupings_identity(cli, demo) -> None:
    # Without pins, every-round-used = groupings(K) x K! (falling-factorial basis, textbook).
    code, out, _ = cli("count", str(demo / "season.xlsx"), "--json")
    assert code == 0
    for row in json.loads(out)["counts"]:
        k = row["rounds"]
        assert row["all_rounds_used"] == row["groupings"] * math.factorial(k)


def test_no_window_prints_the_reason_and_the_demo_counts(cli, monkeypatch) -> None:
    sentence = "The LeagueGrid window cannot start because there is no graphical display."
    monkeypatch.setattr("leaguegrid.gui.startup.check", lambda *a, **k: sentence)
    code, out, err = cli()
    assert code == 0
    assert err.startswith(sentence + "\n")
    assert "Showing the counts of season.xlsx on the command line instead." in err
    # the demo season: two six-team divisions, 30 fixtures; clubs with a team in each share a
    # ground on complementary patterns, so 5 rounds do (a 6-team round robin needs n - 1 = 5)
    assert out.startswith("Hollowmere Junior League: 30 fixtures, 138 clashing pairs\n")
    assert "Fewest rounds: 5\n" in out


def test_count_says_which_rules_it_includes(cli, demo) -> None:
    code, out, _ = cli("count", str(demo / "schedules.xlsx"), "--rounds", "10", "--json")
    assert code == 0
    data = json.loads(out)
    assert data["pinned"] is True
    assert data["min_rounds"] == 10
    assert data["rules_counted"][0] == "clashes: 256 pairs of fixtures never share a round"
    assert any(r.startswith("played: 6 fixtures frozen") for r in data["rules_counted"])
    assert data["rules_generator"][0] == (
        "venue capacity: Kestrelmoor Rec hosts at most 2 fixtures a round (2 pitches)")


def test_new_writes_a_blank_league_that_checks_and_is_never_overwritten(cli, tmp_path):
    target = tmp_path / "blank.xlsx"
    code, out, _ = cli("new", str(target))
    assert code == 0
    assert out == (f"Wrote a blank league workbook to {target}; fill it in, then run "
                   f"`leaguegrid check {target}`.\n")
    code, out, _ = cli("check", str(target))
    assert code == 0 and out.endswith("Problems: none\nUsable: yes\n")
    code, _, err = cli("new", str(target))
    assert code == 2
    assert err == f"leaguegrid new: {target} exists already; choose another name\n"


def test_count_proves_the_fewest_rounds_of_a_mycielski_league(cli, workbook, monkeypatch) -> None:
    # DIMACS challenge: myciel4 (23 vertices, 71 edges) has chi = 5 and no triangle, so the
    # proof below is a search, not a clique. Fixtures with their own teams, clashing by
    # Clashes rows along the graph's edges; SEARCH_NODES = 0 sends the proof to the SAT solver.
    import networkx as nx

    from leaguegrid.engine import fewest

    monkeypatch.setattr(fewest, "SEARCH_NODES", 0)
    G = nx.mycielski_graph(5)
    label = {v: f"T{v}a v T{v}b" for v in G}
    book = workbook("myciel4.xlsx", {
        "Fixtures": [("Fixture", "Home", "Away")]
        + [(label[v], f"T{v}a", f"T{v}b") for v in G],
        "Clashes": [("First", "Second", "Reason")]
        + [(label[u], label[v], "graph edge") for u, v in G.edges]})
    code, out, _ = cli("count", str(book), "--rounds", "5", "--json")
    assert code == 0
    data = json.loads(out)
    assert (data["fixtures"], data["clashes"], data["min_rounds"]) == (23, 71, 5)
    assert data["min_rounds_bounds"] == [5, 5]
    proof = data["min_rounds_proof"]
    assert {k: proof[k] for k in ("low", "high", "low_method")} == {
        "low": 5, "high": 5, "low_method": "sat"}
    assert proof["high_method"] in {"dsatur", "tabucol", "sat"}
    schedule = proof["schedule"]
    assert sorted(schedule) == sorted(label.values())
    assert set(schedule.values()) == {1, 2, 3, 4, 5}
    assert all(schedule[label[u]] != schedule[label[v]] for u, v in G.edges)
    code, out, _ = cli("count", str(book), "--rounds", "5")
    lines = out.splitlines()
    assert lines[1:3] == [
        "Fewest rounds: 5",
        "At least 5 rounds: a SAT solver proved that no schedule fits in 4 rounds "
        "(unsatisfiable)"]
    assert lines[3].startswith("At most 5 rounds: a schedule with 5 rounds found by ")
