"""Progress, cancel from another thread, and the time budget."""

from __future__ import annotations

import networkx as nx
import pytest

from benchmarks.bench import cancel_latency
from leaguegrid.engine import (
    BudgetExceeded,
    Hooks,
    chromatic_polynomial,
    count_assignments,
    min_rounds_bounds,
)


def long_case() -> nx.Graph:
    """The 12-team round-robin fixture graph: its polynomial takes far longer than a test."""
    return nx.line_graph(nx.complete_graph(12))


def test_cancel_from_another_thread_returns_quickly() -> None:
    # The 5x5 rook's graph: its polynomial takes about 1.5 s in about 110 MiB, so it is
    # still running, well inside the memory bound, when the cancel comes.
    rook = nx.cartesian_product(nx.complete_graph(5), nx.complete_graph(5))
    seconds, outcome = cancel_latency(rook, 0.3, wait=5.0)
    assert outcome == "cancelled", outcome
    assert seconds < 5.0


def test_budget_stops_exact_work() -> None:
    with pytest.raises(BudgetExceeded, match="budget of 0.3 s exceeded"):
        count_assignments(long_case(), 40, hooks=Hooks(budget=0.3))


def test_progress_rises_from_zero_to_one() -> None:
    seen: list[tuple[float, str]] = []
    G = nx.line_graph(nx.complete_graph(6))
    chromatic_polynomial(G, Hooks(progress=lambda f, s: seen.append((f, s))))
    values = [f for f, _ in seen]
    assert values[0] == 0.0
    assert values[-1] == 1.0
    assert all(a <= b for a, b in zip(values, values[1:], strict=False))
    assert any(0.0 < v < 1.0 for v in values)
    assert {s for _, s in seen} >= {"starting", "counting", "done"}


def test_bounds_within_budget_are_proven() -> None:
    # The Grotzsch graph (Mycielski of C5): chromatic number 4, largest clique 2 (textbook).
    G = nx.mycielski_graph(4)
    assert min_rounds_bounds(G, hooks=Hooks(budget=5.0)) == (4, 4)


def test_memory_bound_stops_exact_work(monkeypatch) -> None:
    from leaguegrid.engine import frontier

    monkeypatch.setattr(frontier, "MEMORY_BYTES", 200_000)
    with pytest.raises(BudgetExceeded, match="state table passed the memory bound"):
        chromatic_polynomial(nx.line_graph(nx.complete_graph(7)))
