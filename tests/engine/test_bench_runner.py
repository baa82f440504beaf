"""The benchmark runner's per-case record: a result, or where the engine stopped."""

from __future__ import annotations

import networkx as nx

from benchmarks.bench import run_one
from leaguegrid.engine import frontier


def test_fixed_count_is_recorded_with_time_and_memory():
    # P(Petersen, 3) = 120: the Petersen graph's chromatic polynomial (textbook value,
    # also checked against networkx in test_engine_properties.py).
    got = run_one(nx.petersen_graph(), "fixed", 3)
    assert got["value"] == 120
    assert got["stopped"] is None
    assert got["seconds"] >= 0 and got["peak_mib"] > 0


def test_a_stop_at_the_memory_bound_is_recorded_not_raised(monkeypatch):
    monkeypatch.setattr(frontier, "MEMORY_BYTES", 2_000)
    got = run_one(nx.cartesian_product(nx.complete_graph(4), nx.complete_graph(4)), "poly", None)
    assert got["value"] is None
    assert got["stopped"].startswith("state table passed the memory bound")
