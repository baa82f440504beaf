"""Work done in a second process (graph pieces, estimate draws): same results, and it stops."""

from __future__ import annotations

import random
import threading

import networkx as nx
import pytest

from leaguegrid.engine import (
    Cancelled,
    chromatic_polynomial,
    count_assignments,
    count_table,
    parallel,
)
from leaguegrid.engine.estimate import sis_draws
from leaguegrid.engine.graph import from_networkx
from leaguegrid.engine.hooks import Hooks


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


def _spied_background(monkeypatch, on_wait=None) -> list:
    """Record each second process started; `on_wait()` runs when the parent starts waiting."""
    monkeypatch.setattr(parallel, "PARALLEL_SCORE", 0)
    monkeypatch.delenv(parallel.ENV, raising=False)
    started: list = []

    class Spy(parallel.Background):
        def __init__(self, *args) -> None:
            super().__init__(*args)
            started.append(self)

        def result(self, hooks):
            if on_wait is not None:
                on_wait()
            return super().result(hooks)

    monkeypatch.setattr(parallel, "Background", Spy)
    return started


def test_cancel_while_this_process_counts_stops_the_second_one(monkeypatch) -> None:
    # Two copies of the 5x5 rook's graph: one goes to a second process; the cancel comes with
    # the first progress report after it started, while the other is still running.
    started = _spied_background(monkeypatch)
    cancel = threading.Event()
    rook = nx.cartesian_product(nx.complete_graph(5), nx.complete_graph(5))
    G = nx.disjoint_union(rook, rook)
    with pytest.raises(Cancelled):
        chromatic_polynomial(G, Hooks(lambda f, s: started and cancel.set(), cancel))
    assert len(started) == 1
    assert started[0].proc.exitcode is not None  # killed and joined, not left running


def test_cancel_while_waiting_for_the_second_process_stops_it(monkeypatch) -> None:
    cancel = threading.Event()
    started = _spied_background(monkeypatch, on_wait=cancel.set)
    rook = nx.cartesian_product(nx.complete_graph(5), nx.complete_graph(5))
    G = nx.disjoint_union(rook, nx.petersen_graph())  # the rook's graph goes outside
    with pytest.raises(Cancelled):
        chromatic_polynomial(G, Hooks(cancel=cancel))
    assert started[0].proc.exitcode is not None


@pytest.mark.parametrize("value", ["1"])
def test_single_process_switch(monkeypatch, value: str) -> None:
    monkeypatch.setenv(parallel.ENV, value)
    assert not parallel.available()


def test_estimate_draws_are_shared_with_a_second_process(monkeypatch) -> None:
    # Half the draws come from the child (seed 1), the rest from this process (seed 0): the
    # pooled draws are exactly the two seeded runs side by side.
    monkeypatch.delenv(parallel.ENV, raising=False)
    monkeypatch.setattr(parallel, "SIS_PARALLEL_FROM", 5)
    g, _ = from_networkx(nx.petersen_graph())
    domains = [0b111] * g.n
    here = sis_draws(g, domains, 3, Hooks(), random.Random(0), 30)
    there = sis_draws(g, domains, 3, Hooks(), random.Random(1), 30)
    pooled = parallel.estimate_draws(g, domains, 3, Hooks(), draws=60)
    assert pooled == (here[0] + there[0], here[1] + there[1])


def test_estimate_draws_stay_in_one_process_when_asked(monkeypatch) -> None:
    monkeypatch.setenv(parallel.ENV, "1")
    monkeypatch.setattr(parallel, "SIS_PARALLEL_FROM", 5)
    g, _ = from_networkx(nx.petersen_graph())
    domains = [0b111] * g.n
    alone = parallel.estimate_draws(g, domains, 3, Hooks(), draws=60)
    assert alone == sis_draws(g, domains, 3, Hooks(), random.Random(0), 60)
