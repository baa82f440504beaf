"""The one budget/progress/cancel object (engine.Hooks): progress, cancel, the budget, parts.

Deterministic: budgets run on a fake clock that advances by one at every reading (a budget in
steps), and cancels are set from inside the work, never after a wall-clock delay."""

from __future__ import annotations

import itertools
import threading

import networkx as nx
import pytest

from leaguegrid.engine import (
    BudgetExceeded,
    Cancelled,
    Hooks,
    chromatic_polynomial,
    count_assignments,
    min_rounds_bounds,
)


def steps() -> itertools.count:
    """A clock that reads 0, 1, 2, ...: a budget of n lasts n readings."""
    return itertools.count()


def long_case() -> nx.Graph:
    """The 12-team round-robin fixture graph: its polynomial takes far longer than a test."""
    return nx.line_graph(nx.complete_graph(12))


def test_cancel_set_while_counting_stops_the_count() -> None:
    # The cancel is set by the progress callback after the third report, as another thread
    # would set it; the engine must notice at its next check and raise.
    stop = threading.Event()
    seen: list[float] = []

    def progress(fraction: float, stage: str) -> None:
        seen.append(fraction)
        if len(seen) == 3:
            stop.set()

    with pytest.raises(Cancelled):
        chromatic_polynomial(long_case(), Hooks(progress, stop))
    assert len(seen) == 3


def test_budget_in_steps_stops_exact_work() -> None:
    with pytest.raises(BudgetExceeded, match="budget of 50 s exceeded"):
        count_assignments(long_case(), 40, hooks=Hooks(budget=50, clock=steps().__next__))


def test_progress_rises_from_zero_to_one() -> None:
    seen: list[tuple[float, str]] = []
    G = nx.line_graph(nx.complete_graph(6))
    chromatic_polynomial(G, Hooks(progress=lambda f, s: seen.append((f, s))))
    values = [f for f, _ in seen]
    assert values[0] == 0.0
    assert values[-1] == 1.0
    assert all(a <= b for a, b in itertools.pairwise(values))
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


def test_a_part_maps_progress_and_prefixes_its_stage() -> None:
    seen: list[tuple[float, str]] = []
    job = Hooks(lambda f, s: seen.append((f, s)))
    step = job.part(0.5, 0.75, stage="6 rounds")
    step.report(0.0, "counting")
    step.report(1.0, "")
    with step.window(0.0, 0.5):
        step.report(1.0, "inner")  # the end of the first half of the part's own window
    assert seen == [(0.5, "6 rounds: counting"), (0.75, "6 rounds"), (0.75, "6 rounds: inner")]


def test_a_part_gets_its_share_of_the_time_left() -> None:
    clock = itertools.chain([0.0], itertools.repeat(40.0)).__next__
    job = Hooks(budget=100.0, clock=clock)  # deadline 100; the part is made at 40
    step = job.part(share=0.5)  # half of the 60 left: deadline 70
    assert step.deadline == 70.0
    assert job.part(seconds=5.0, share=1.0).deadline == 45.0
    assert Hooks().part(seconds=5.0).budget == 5.0


def test_cancel_reaches_every_part() -> None:
    stop = threading.Event()
    step = Hooks(cancel=stop).part(0.2, 0.4).part(share=0.1)
    step.check()
    stop.set()
    with pytest.raises(Cancelled):
        step.check()
