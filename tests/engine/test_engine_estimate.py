"""Labelled estimates and the cost estimate."""

from __future__ import annotations

import random

import networkx as nx

from leaguegrid.engine import (
    Cost,
    Hooks,
    count_all_rounds_used,
    count_assignments,
    estimate_assignments,
    estimate_cost,
    estimate_counts,
)
from leaguegrid.engine.chromatic_number import domains_for
from leaguegrid.engine.estimate import _normal_interval, sis_draws, summarise
from leaguegrid.engine.frontier import step_masks, successors
from leaguegrid.engine.graph import from_networkx
from leaguegrid.engine.orders import best_order


def test_estimate_is_labelled_and_brackets_exact_count() -> None:
    G = nx.petersen_graph()
    for k in (3, 4, 5):
        exact = count_assignments(G, k)
        est = estimate_assignments(G, k)
        assert est.method.startswith("sequential importance sampling, 2000 draws")
        # The interval is about 95%: allow three half-widths (seeded, so deterministic).
        half = max(est.high - est.value, est.value - est.low)
        assert est.low <= est.value <= est.high
        assert abs(est.value - exact) <= 3 * half
        assert abs(est.value - exact) <= exact // 20


def test_estimate_with_pins_and_impossible_cases() -> None:
    G = nx.cycle_graph(6)
    exact = count_assignments(G, 3, pins={0: 1}, exclusions={3: {2}})
    est = estimate_assignments(G, 3, pins={0: 1}, exclusions={3: {2}})
    assert est.low <= exact <= est.high
    none = estimate_assignments(G, 2, pins={0: 3})
    assert (none.value, none.low, none.high) == (0, 0, 0)
    assert none.method == "exact: no assignment is possible"


def test_estimate_with_no_valid_draw_reports_proven_ceiling() -> None:
    est = estimate_assignments(nx.complete_graph(4), 3)
    assert (est.value, est.low, est.high) == (0, 0, 3**4)


def test_cost_of_small_graph_is_its_largest_table() -> None:
    G = nx.line_graph(nx.complete_graph(6))
    g, _ = from_networkx(G)
    order = best_order(g)
    layer, largest = {()}, 1
    for vb, nb in step_masks(g, order):
        layer = {ns for s in layer for ns, _ in successors(s, vb, nb, g.n + 1)}
        largest = max(largest, len(layer))
    cost = estimate_cost(G)
    assert isinstance(cost, Cost)
    assert cost.states == largest
    assert cost.seconds > 0
    assert estimate_cost(G, 5).states <= cost.states


def test_every_round_used_estimate_comes_from_the_same_draws() -> None:
    # Three fixtures with no clash and 3 rounds: 27 assignments, 3! = 6 use every round
    # (textbook: surjections of a 3-set onto a 3-set). Every draw has weight 27, and a draw
    # counts towards every-round-used only when its leaf uses all three rounds.
    est, every = estimate_counts(nx.empty_graph(3), 3)
    assert (est.value, est.low, est.high) == (27, 27, 27)
    assert every.low <= 6 <= every.high
    assert abs(every.value - 6) <= 1
    assert every.method == est.method


def test_every_round_used_estimate_brackets_exact_count() -> None:
    G = nx.petersen_graph()
    for k in (4, 5):
        exact = count_all_rounds_used(G, k)
        est, every = estimate_counts(G, k)
        assert est.value == estimate_assignments(G, k).value  # the same seeded draws
        half = max(every.high - every.value, every.value - every.low)
        assert every.low <= every.value <= every.high
        assert abs(every.value - exact) <= 3 * half


def test_every_round_used_is_zero_with_more_rounds_than_fixtures() -> None:
    est, every = estimate_counts(nx.path_graph(2), 3)
    assert est.low <= 6 <= est.high  # P(path on 2 vertices, 3) = 3 x 2
    assert (every.value, every.low, every.high) == (0, 0, 0)
    assert every.method.startswith("exact:")


def test_skewed_draws_get_an_interval_that_holds_the_count_where_the_plain_one_misses() -> None:
    # 3-colourings of the 5 x 5 grid: 580,986 (the engine's exact count; the transfer-matrix
    # count in tests/cli/test_count_asked.py agrees on grids). With 200 seeded draws the mean
    # +/- 1.96 standard errors stops below it; the union with the delta-lognormal interval
    # (Zhou and Gao 1997) reaches above it.
    G = nx.convert_node_labels_to_integers(nx.grid_2d_graph(5, 5))
    exact = count_assignments(G, 3)
    assert exact == 580986
    g, _ = from_networkx(G)
    doms = domains_for(g.n, 3, {}, {})
    weights, full = sis_draws(g, doms, 3, Hooks(), random.Random(0), 200)
    assert _normal_interval(weights) == (383345, 573952)
    est, _ = summarise(weights, full, doms)
    assert (est.low, est.high, est.samples, est.found) == (383345, 968295, 200, 200)
    assert est.low <= exact <= est.high and not est.too_few
