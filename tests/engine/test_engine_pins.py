"""Pins and exclusions against brute-force enumeration, for every K (including K below the
largest pinned round and exclusions of rounds beyond K)."""

from __future__ import annotations

import random

import networkx as nx
import pytest
from engine_brute import assignments, count, count_all_used

from leaguegrid.engine import (
    NoAssignment,
    count_all_rounds_used,
    count_assignments,
    count_table,
    min_rounds,
    min_rounds_bounds,
    sample_assignment,
)


def random_case(seed: int):
    """A small random graph with random pins and exclusions."""
    r = random.Random(seed)
    n = r.randint(2, 6)
    G = nx.gnm_random_graph(n, r.randint(0, n * (n - 1) // 2), seed=seed)
    nodes = list(G.nodes)
    pins = {v: r.randint(1, 4) for v in r.sample(nodes, r.randint(0, min(3, n)))}
    exclusions = {
        v: set(r.sample(range(1, 6), r.randint(1, 2)))
        for v in r.sample(nodes, r.randint(0, min(3, n)))
    }
    return G, pins, exclusions


@pytest.mark.parametrize("seed", range(40))
def test_counts_with_pins_and_exclusions_match_enumeration(seed: int) -> None:
    G, pins, exclusions = random_case(seed)
    for k in range(0, 6):
        assert count_assignments(G, k, pins, exclusions) == count(G, k, pins, exclusions), k
        assert count_all_rounds_used(G, k, pins, exclusions) == count_all_used(
            G, k, pins, exclusions
        ), k


@pytest.mark.parametrize("seed", range(40))
def test_min_rounds_with_pins_matches_enumeration(seed: int) -> None:
    G, pins, exclusions = random_case(seed)
    feasible = [next((k for k in range(0, 12) if count(G, k, pins, exclusions)), None)]
    if feasible[0] is None:
        with pytest.raises(NoAssignment):
            min_rounds(G, pins, exclusions)
        return
    assert min_rounds(G, pins, exclusions) == feasible[0]
    assert min_rounds_bounds(G, pins, exclusions) == (feasible[0], feasible[0])


def test_pin_beyond_k_gives_zero() -> None:
    G = nx.path_graph(3)
    assert count_assignments(G, 2, pins={0: 3}) == 0
    assert count_assignments(G, 3, pins={0: 3}) == count(G, 3, {0: 3}) == 4


def test_exclusion_beyond_k_does_not_apply() -> None:
    G = nx.path_graph(3)
    assert count_assignments(G, 2, exclusions={1: {3, 4}}) == 2


def test_clashing_pins_in_one_round() -> None:
    G = nx.path_graph(3)
    assert count_assignments(G, 4, pins={0: 2, 1: 2}) == 0
    with pytest.raises(NoAssignment, match="two clashing fixtures are pinned to round 2"):
        min_rounds(G, pins={0: 2, 1: 2})


def test_same_round_pins_merge() -> None:
    # 0 and 2 do not clash; both in round 1 leaves round choices for 1 only.
    G = nx.path_graph(3)
    assert count_assignments(G, 3, pins={0: 1, 2: 1}) == 2


def test_pin_to_excluded_round() -> None:
    G = nx.path_graph(2)
    assert count_assignments(G, 3, pins={0: 2}, exclusions={0: {2}}) == 0


def test_sample_honours_pins_and_exclusions() -> None:
    G, pins, exclusions = nx.cycle_graph(5), {0: 3, 2: 3}, {1: {1, 2}, 4: {1}}
    valid = {tuple(sorted(a.items())) for a in assignments(G, 4, pins, exclusions)}
    rng = random.Random(7)
    for _ in range(50):
        a = sample_assignment(G, 4, rng, pins, exclusions)
        assert tuple(sorted(a.items())) in valid


def test_bad_pins_are_rejected() -> None:
    G = nx.path_graph(2)
    with pytest.raises(ValueError, match="pinned fixture 'x' is not in the graph"):
        count_assignments(G, 2, pins={"x": 1})
    with pytest.raises(ValueError, match="pinned round 0 of 1 is not a positive whole number"):
        count_assignments(G, 2, pins={1: 0})
    with pytest.raises(ValueError, match="round count -1 is not a whole number >= 0"):
        count_assignments(G, -1)


@pytest.mark.parametrize("seed", range(0, 40, 4))
def test_count_table_matches_enumeration(seed: int) -> None:
    G, pins, exclusions = random_case(seed)
    table = count_table(G, range(0, 6), pins, exclusions)
    for k in range(0, 6):
        assert table[k] == (count(G, k, pins, exclusions), count_all_used(G, k, pins, exclusions))
