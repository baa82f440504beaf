"""The uniform draw: frequencies of every valid assignment pass a chi-square test."""

from __future__ import annotations

import math
import random
from collections import Counter

import networkx as nx
import pytest
from engine_brute import assignments

from leaguegrid.engine import NoAssignment, sample_assignment, sample_assignments


def chi_square_limit(df: int, z: float = 3.09) -> float:
    """Upper 0.1% point of chi-square with df degrees of freedom, by the Wilson-Hilferty
    approximation (textbook): df (1 - 2/(9 df) + z sqrt(2/(9 df)))^3, z = 3.09."""
    c = 2 / (9 * df)
    return df * (1 - c + z * math.sqrt(c)) ** 3


def chi_square(G, k, pins=None, exclusions=None, per_cell=40, seed=12345) -> tuple[float, int]:
    valid = [tuple(sorted(a.items())) for a in assignments(G, k, pins, exclusions)]
    draws = per_cell * len(valid)
    got = sample_assignments(G, k, random.Random(seed), draws, pins, exclusions)
    freq = Counter(tuple(sorted(a.items())) for a in got)
    assert set(freq) <= set(valid)
    expect = draws / len(valid)
    stat = sum((freq.get(v, 0) - expect) ** 2 / expect for v in valid)
    return stat, len(valid) - 1


def test_uniform_on_small_graph() -> None:
    # A 4-cycle with a chord and a pendant fixture, 4 rounds: 4*3*2 for the triangle,
    # 2 for the fourth fixture, 3 for the pendant: 144 valid assignments.
    G = nx.Graph([(0, 1), (1, 2), (2, 3), (3, 0), (0, 2), (3, 4)])
    stat, df = chi_square(G, 4)
    assert df + 1 == 144
    assert stat < chi_square_limit(df)


def test_uniform_with_pins_and_exclusions() -> None:
    G = nx.Graph([(0, 1), (1, 2), (2, 3), (3, 4), (4, 0), (5, 0)])
    pins, exclusions = {2: 1}, {0: {2}, 5: {3}}
    stat, df = chi_square(G, 4, pins, exclusions, per_cell=20)
    assert stat < chi_square_limit(df)


def test_uniform_on_graph_with_a_core_left_for_the_tables() -> None:
    # A 5-cycle (not chordal: it stays for the counting tables) with two pendant fixtures
    # (peeled and put back): 3 rounds, 30 x 2 x 2 = 120 valid assignments.
    G = nx.cycle_graph(5)
    G.add_edges_from([(0, 5), (2, 6)])
    stat, df = chi_square(G, 3)
    assert df + 1 == 120
    assert stat < chi_square_limit(df)


def test_uniform_two_components() -> None:
    G = nx.disjoint_union(nx.path_graph(3), nx.complete_graph(2))
    stat, df = chi_square(G, 3)
    assert stat < chi_square_limit(df)


def test_single_draw_is_first_of_batch() -> None:
    G = nx.petersen_graph()
    a = sample_assignment(G, 3, random.Random(5))
    b = sample_assignments(G, 3, random.Random(5), 3)[0]
    assert a == b
    assert all(a[u] != a[v] for u, v in G.edges)


def test_no_assignment_raises() -> None:
    with pytest.raises(NoAssignment, match="no valid assignment with 2 rounds"):
        sample_assignment(nx.complete_graph(3), 2, random.Random(1))
