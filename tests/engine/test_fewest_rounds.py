"""The fewest rounds proven both ways: DIMACS benchmark graphs with their published chromatic
numbers, and every exact route (DSatur backtracking, the SAT solver) against brute force."""

from __future__ import annotations

import itertools
import threading

import engine_brute
import networkx as nx
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from benchmarks.dimacs import PUBLISHED, dimacs_graph
from leaguegrid.engine import Cancelled, Hooks, fewest, fewest_rounds_bounds, min_rounds_proof
from leaguegrid.engine.graph import from_networkx
from leaguegrid.engine.rounds_sat import RoundsSat
from leaguegrid.engine.tabucol import tabucol

# DIMACS colouring challenge (Johnson and Trick, eds., 1996), the published chromatic numbers:
# myciel3 chi = 4, myciel4 chi = 5, myciel5 chi = 6 (also Mycielski 1955: the graph built from
# K2 by i - 1 steps has chi = i + 1 and no triangle), queen5_5 chi = 5, queen6_6 chi = 7,
# queen7_7 chi = 7, queen8_8 chi = 9; sizes as in the instance files (vertices/edges):
# myciel3 11/20, myciel4 23/71, myciel5 47/236, queen8_8 64/728.
DIMACS = {"myciel3": 4, "myciel4": 5, "myciel5": 6, "queen5_5": 5, "queen6_6": 7,
          "queen7_7": 7, "queen8_8": 9}
SIZES = {"myciel3": (11, 20), "myciel4": (23, 71), "myciel5": (47, 236), "queen8_8": (64, 728)}


def valid(G: nx.Graph, schedule: dict, rounds: int) -> bool:
    """Every fixture in 1..rounds, no clash inside a round."""
    return (set(schedule) == set(G) and all(1 <= r <= rounds for r in schedule.values())
            and all(schedule[u] != schedule[v] for u, v in G.edges))


def brute_chromatic(G: nx.Graph) -> int:
    """The chromatic number by the subset recurrence chi(S) = 1 + min chi(S - I) over
    independent sets I holding S's first vertex (exhaustive; Lawler 1976 without the trick)."""
    nodes = list(G)
    n = len(nodes)
    adj = [sum(1 << nodes.index(u) for u in G[v]) for v in nodes]
    independent = [all(not (adj[v] >> u & 1) for v in range(n) for u in range(n)
                       if s >> v & 1 and s >> u & 1) for s in range(1 << n)]
    chi = [0] * (1 << n)
    for s in range(1, 1 << n):
        low = s & -s
        rest = s & ~low
        best = n
        sub = rest
        while True:
            if independent[sub | low]:
                best = min(best, 1 + chi[s & ~(sub | low)])
            if sub == 0:
                break
            sub = (sub - 1) & rest
        chi[s] = best
    return chi[(1 << n) - 1]


@pytest.mark.parametrize("name", list(DIMACS))
def test_dimacs_graphs_proven_both_ways(name: str) -> None:
    G = dimacs_graph(name)
    assert (G.number_of_nodes(), G.number_of_edges()) == SIZES.get(name, PUBLISHED[name][:2])
    assert PUBLISHED[name][2] == DIMACS[name]
    proof = min_rounds_proof(G)
    assert proof.rounds == DIMACS[name]  # DIMACS challenge: e.g. queen8_8 chi = 9
    assert valid(G, proof.schedule, proof.rounds)
    assert max(proof.schedule.values()) == proof.rounds
    assert proof.lower in {"clique", "search", "sat"}
    assert proof.upper in {"dsatur", "tabucol", "search", "sat"}
    if name.startswith("myciel"):  # no triangle: a clique proves only 2
        assert proof.lower != "clique" and len(proof.clique) == 2


def test_queen8_8_and_myciel5_need_the_sat_proof() -> None:
    # queen8_8: a clique of 8 (a row) and no schedule with 8 rounds; myciel5: clique 2,
    # no schedule with 5 rounds. DSatur gives up after SEARCH_NODES; the SAT solver settles it.
    for name, low in (("queen8_8", "sat"), ("myciel5", "sat"), ("queen6_6", "search")):
        b = fewest_rounds_bounds(dimacs_graph(name), hooks=Hooks(budget=60))
        assert (b.low, b.high, b.low_method) == (DIMACS[name], DIMACS[name], low)
    assert fewest_rounds_bounds(dimacs_graph("queen8_8")).high_method == "tabucol"


graphs = st.integers(1, 9).flatmap(lambda n: st.tuples(
    st.just(n), st.lists(st.tuples(st.integers(0, n - 1), st.integers(0, n - 1)), max_size=30)))


def graph_of(spec: tuple[int, list[tuple[int, int]]]) -> nx.Graph:
    n, edges = spec
    G = nx.Graph()
    G.add_nodes_from(range(n))
    G.add_edges_from((u, v) for u, v in edges if u != v)
    return G


@pytest.mark.parametrize("nodes", [None, 0], ids=["dsatur-only", "sat-only"])
@settings(max_examples=60, deadline=None)
@given(spec=graphs)
def test_each_exact_route_agrees_with_brute_force(nodes: int | None, spec) -> None:
    G = graph_of(spec)
    with pytest.MonkeyPatch.context() as mp:
        mp.setattr(fewest, "SEARCH_NODES", nodes)
        proof = min_rounds_proof(G)
    assert proof.rounds == brute_chromatic(G)
    assert valid(G, proof.schedule, proof.rounds)
    greedy = nx.greedy_color(G, "DSATUR")
    assert proof.rounds <= max(greedy.values()) + 1  # never worse than networkx's heuristic


pinned = st.integers(2, 6).flatmap(lambda n: st.tuples(
    st.just(n),
    st.lists(st.tuples(st.integers(0, n - 1), st.integers(0, n - 1)), max_size=12),
    st.dictionaries(st.integers(0, n - 1), st.integers(1, 4), max_size=2),
    st.dictionaries(st.integers(0, n - 1), st.sets(st.integers(1, 4), max_size=2), max_size=3)))


@settings(max_examples=60, deadline=None)
@given(spec=pinned)
def test_sat_route_with_pins_and_exclusions_agrees_with_brute_force(spec) -> None:
    n, edges, pins, exclusions = spec
    G = graph_of((n, edges))
    if any(pins[v] in exclusions.get(v, ()) for v in pins) or any(
            u in pins and v in pins and pins[u] == pins[v] for u, v in G.edges):
        return  # never possible: the engine raises NoAssignment (tested elsewhere)
    expected = next(k for k in itertools.count(1)
                    if engine_brute.count(G, k, pins, exclusions) > 0)
    with pytest.MonkeyPatch.context() as mp:
        mp.setattr(fewest, "SEARCH_NODES", 0)
        proof = min_rounds_proof(G, pins=pins, exclusions=exclusions)
    assert proof.rounds == expected
    assert valid(G, proof.schedule, proof.rounds)
    assert all(proof.schedule[v] == r for v, r in pins.items())
    assert all(proof.schedule[v] not in rs for v, rs in exclusions.items())


def test_tabu_search_keeps_to_the_allowed_rounds() -> None:
    g, nodes = from_networkx(dimacs_graph("queen7_7"))
    full = (1 << 7) - 1
    doms = [full] * g.n
    doms[0] = 1 << 6  # square (0, 0) only in round 7
    found = tabucol(g, 7, doms, Hooks(), moves=20000, seed=3)
    assert found is not None and found[0] == 7
    assert all(found[v] != found[u] for v in range(g.n) for u in range(g.n) if g.adj[v] >> u & 1)
    assert tabucol(g, 6, [full] * g.n, Hooks(), moves=2000) is None  # a clique of 7: impossible


def test_the_sat_solver_stops_when_cancelled() -> None:
    g, _ = from_networkx(dimacs_graph("myciel5"))
    cancel = threading.Event()
    cancel.set()
    sat = RoundsSat(g, 5, [31] * g.n, [0, 1], True, Hooks())
    try:
        with pytest.raises(Cancelled):
            sat.solve(5, Hooks(cancel=cancel))
    finally:
        sat.close()


def test_open_bounds_name_their_methods_when_the_budget_is_short() -> None:
    # A fake clock that advances one second per reading: the budget is a number of checks.
    ticks = itertools.count()
    b = fewest_rounds_bounds(dimacs_graph("myciel5"),
                             hooks=Hooks(budget=20, clock=lambda: float(next(ticks))))
    assert b.low < DIMACS["myciel5"] == b.high  # stopped before the proof below was done
    assert b.low_method in {"search", "sat"}
    assert valid(dimacs_graph("myciel5"), b.schedule, b.high)


@settings(max_examples=40, deadline=None)
@given(spec=graphs, symmetric=st.booleans())
def test_the_sat_encoding_at_every_k_agrees_with_brute_force(spec, symmetric: bool) -> None:
    G = graph_of(spec)
    chi = brute_chromatic(G)
    g, nodes = from_networkx(G)
    clique = max(nx.find_cliques(G), key=len)
    sat = RoundsSat(g, g.n, [(1 << g.n) - 1] * g.n, [nodes.index(v) for v in clique],
                    symmetric, Hooks())
    try:
        for k in range(len(clique), g.n + 1):  # one solver, every k (incremental)
            found = sat.solve(k, Hooks())
            assert (found is not None) == (k >= chi)
            if found is not None:
                assert valid(G, dict(zip(nodes, found, strict=True)), k)
    finally:
        sat.close()
