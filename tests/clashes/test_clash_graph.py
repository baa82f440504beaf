"""The clash graph: which fixtures clash, and why (one Reason per cause, one edge per pair)."""

from __future__ import annotations

from itertools import combinations

import networkx as nx

from leaguegrid.clashes.graph import (
    build_clash_graph,
    describe,
    edge_reasons,
    reason_edges,
    sole_reason_edges,
    without_reasons,
)
from leaguegrid.core.model import ClashRow, Fixture, League, Reason, Settings, Split, Venue
from leaguegrid.core.round_robin import pairings


def league_of(*fixtures: Fixture, **extra) -> League:
    return League("test", "test.xlsx", list(fixtures), **extra)


def edges(graph: nx.Graph) -> dict[frozenset, list[Reason]]:
    return {frozenset((a, b)): data["reasons"] for a, b, data in graph.edges(data=True)}


def test_round_robin_clash_graph_is_the_line_graph_of_the_complete_graph():
    # Textbook: fixtures of a single round-robin clash exactly when they share a team, so the
    # clash graph is the line graph of K_n (n(n-1)/2 vertices, each of degree 2(n-2)).
    teams = [f"T{i}" for i in range(6)]
    league = league_of(*[Fixture(f"{h} v {a}", h, a) for h, a in pairings(teams)])
    graph = build_clash_graph(league)
    assert (graph.number_of_nodes(), graph.number_of_edges()) == (15, 60)
    assert nx.is_isomorphic(graph, nx.line_graph(nx.complete_graph(6)))
    assert graph.nodes["T0 v T1" if graph.has_node("T0 v T1") else "T1 v T0"]["venue"] is None


def test_team_on_either_side_and_two_reasons_on_one_edge():
    league = league_of(
        Fixture("A v B", "A", "B"),
        Fixture("B v A", "B", "A"),
        Fixture("C v A", "C", "A"),
        Fixture("D v E", "D", "E"),
    )
    assert edges(build_clash_graph(league)) == {
        frozenset({"A v B", "B v A"}): [Reason("team", "A"), Reason("team", "B")],
        frozenset({"A v B", "C v A"}): [Reason("team", "A")],
        frozenset({"B v A", "C v A"}): [Reason("team", "A")],
    }


def test_node_attributes():
    graph = build_clash_graph(league_of(Fixture("A v B", "A", "B", venue="Oak", division="U9")))
    assert graph.nodes["A v B"] == {
        "division": "U9",
        "venue": "Oak",
        "pitch": None,
        "home": "A",
        "away": "B",
    }


def test_venue_blank_never_clashes_and_case_is_ignored():
    league = league_of(
        Fixture("1", venue="Oak Rd"), Fixture("2", venue="oak rd"), Fixture("3"), Fixture("4")
    )
    assert edges(build_clash_graph(league)) == {frozenset({"1", "2"}): [Reason("venue", "Oak Rd")]}


def test_pitch_keys():
    league = league_of(
        Fixture("p1", venue="Oak", pitch="1"),
        Fixture("p1b", venue="Oak", pitch="1"),
        Fixture("p2", venue="Oak", pitch="2"),
        Fixture("court", venue="Hall", pitch="Court A"),
        Fixture("court2", venue="Hall", pitch="court a"),
        Fixture("whole", venue="Oak"),
    )
    assert edges(build_clash_graph(league)) == {
        frozenset({"p1", "p1b"}): [Reason("venue", "Oak, pitch 1")],
        frozenset({"court", "court2"}): [Reason("venue", "Hall, Court A")],
        # no pitch given: the whole ground, so it clashes with every fixture there
        frozenset({"whole", "p1"}): [Reason("venue", "Oak")],
        frozenset({"whole", "p1b"}): [Reason("venue", "Oak")],
        frozenset({"whole", "p2"}): [Reason("venue", "Oak")],
    }


def test_venue_with_several_pitches_and_no_pitch_column_has_no_venue_edges():
    venues = {"Oak": Venue("Oak", pitches=2), "Elm": Venue("Elm", pitches=1)}
    league = league_of(
        Fixture("a", venue="Oak"),
        Fixture("b", venue="oak"),
        Fixture("c", venue="Elm"),
        Fixture("d", venue="Elm"),
        venues=venues,
    )
    assert edges(build_clash_graph(league)) == {frozenset({"c", "d"}): [Reason("venue", "Elm")]}


def test_shared_settings_choose_the_rules():
    fixtures = [
        Fixture("A v B", "A", "B", venue="Oak", shared={"Referee": ("Ann", "Bo")}),
        Fixture("A v C", "A", "C", venue="Oak", shared={"Referee": ("bo",)}),
        Fixture("D v E", "D", "E", shared={"Referee": ("Cy",)}),
    ]
    graph = build_clash_graph(league_of(*fixtures, settings=Settings(shared=("Venue", "Referee"))))
    assert edges(graph) == {
        frozenset({"A v B", "A v C"}): [Reason("venue", "Oak"), Reason("shared", "Referee=Bo")]
    }
    graph = build_clash_graph(league_of(*fixtures))
    assert edges(graph)[frozenset({"A v B", "A v C"})] == [
        Reason("team", "A"),
        Reason("venue", "Oak"),
        Reason("shared", "Referee=Bo"),
    ]


def test_clash_rows_and_splits_deduplicated_with_their_rows():
    clash = ClashRow("Ann", "Bo", "coach", 4, [("x", "y"), ("x", "z")])
    again = ClashRow("Ann", "Bo", "coach", 5, [("x", "y")])
    blank = ClashRow("x", "z", "", 6, [("z", "x")])
    league = league_of(
        Fixture("x"),
        Fixture("y"),
        Fixture("z"),
        clash_rows=[clash, again, blank],
        splits=[Split("y", "x", "county", 2), Split("y", "x", "county", 2)],
    )
    graph = build_clash_graph(league)
    assert edges(graph) == {
        frozenset({"x", "y"}): [
            Reason("clash", "coach", 4),
            Reason("clash", "coach", 5),
            Reason("split", "county", 2),
        ],
        frozenset({"x", "z"}): [Reason("clash", "coach", 4), Reason("clash", "no reason given", 6)],
    }
    assert [describe(r) for r in edge_reasons(graph, "x", "z")] == [
        "Clashes row 4: coach",
        "Clashes row 6: no reason given",
    ]
    assert edge_reasons(graph, "y", "z") == []


def test_reason_helpers():
    league = league_of(
        Fixture("A v B", "A", "B", venue="Oak"),
        Fixture("A v C", "A", "C"),
        Fixture("D v E", "D", "E", venue="Oak"),
    )
    graph = build_clash_graph(league)
    assert reason_edges(graph) == {
        Reason("team", "A"): {frozenset({"A v B", "A v C"})},
        Reason("venue", "Oak"): {frozenset({"A v B", "D v E"})},
    }
    assert sole_reason_edges(graph) == reason_edges(graph)
    lighter = without_reasons(graph, [Reason("venue", "Oak")])
    assert set(lighter.nodes) == set(graph.nodes) and lighter.number_of_edges() == 1
    assert graph.number_of_edges() == 2  # the original is untouched


def test_sole_reason_edges_skip_edges_with_two_reasons():
    league = league_of(
        Fixture("A v B", "A", "B"), Fixture("B v A", "B", "A"), Fixture("A v C", "A", "C")
    )
    sole = sole_reason_edges(build_clash_graph(league))
    assert sole == {
        Reason("team", "A"): {frozenset({"A v B", "A v C"}), frozenset({"B v A", "A v C"})},
        Reason("team", "B"): set(),
    }


def test_every_pair_sharing_a_team_is_an_edge():
    teams = "ABCDE"
    fixtures = [Fixture(f"{h}{a}", h, a) for h, a in combinations(teams, 2)]
    graph = build_clash_graph(league_of(*fixtures))
    for f, g in combinations(fixtures, 2):
        assert graph.has_edge(f.label, g.label) == bool(set(f.teams) & set(g.teams))
