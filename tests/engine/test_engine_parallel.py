"""Independent pieces computed in a second process give the same results, and stop."""

from __future__ import annotations

import networkx as nx
import pytest

from leaguegrid.bench import cancel_latency
from leaguegrid.engine import (
    chromatic_polynomial,
    count_assignments,
    count_table,
    parallel,
)


def two_pieces() -> nx.Graph:
    """The Petersen graph and the 5-team round-robin fixture graph, side by side."""
    return nx.disjoint_union(nx.petersen_graph(), nx.line_graph(nx.complete_graph(5)))


def test_second_process_gives_the_same_results(monkeypatch) -> None:
    G = two_pieces()
    p_a = chromatic_polynomial(nx.petersen_graph())
    p_b = chromatic_polynomial(nx.line_graph(nx.complete_graph(5)))
    monkeypatch.setattr(parallel, "PARALLEL_SCORE", 0)
    monkeypatch.delenv(parallel.ENV, raising=False)
    started: list[str] = []

    class Spy(parallel.Background):
        def __init__(self, kind, *args) -> None:
            started.append(kind)
            super().__init__(kind, *args)

    monkeypatch.setattr(parallel, "Background", Spy)
    assert chromatic_polynomial(G) == p_a * p_b
    H = nx.relabel_nodes(G, {v: ("x", v) for v in G})  # new graph: no cached counts
    assert count_assignments(H, 5) == p_a(5) * p_b(5)
    table = count_table(nx.relabel_nodes(G, {v: ("y", v) for v in G}), [4, 5, 6])
    assert {k: a for k, (a, _) in table.items()} == {k: p_a(k) * p_b(k) for k in (4, 5, 6)}
    assert started == ["poly", "at", "many"]


def test_cancel_stops_the_second_process(monkeypatch) -> None:
    monkeypatch.setattr(parallel, "PARALLEL_SCORE", 0)
    monkeypatch.delenv(parallel.ENV, raising=False)
    big = nx.line_graph(nx.complete_graph(11))
    G = nx.disjoint_union(big, big)
    seconds, outcome = cancel_latency(G, 1.0, wait=5.0)
    assert outcome == "cancelled"
    assert seconds < 5.0


@pytest.mark.parametrize("value", ["1"])
def test_single_process_switch(monkeypatch, value: str) -> None:
    monkeypatch.setenv(parallel.ENV, value)
    assert not parallel.available()
