"""The engine's counts against outside references: networkx, textbook closed forms and
published values (sources named beside each check)."""

from __future__ import annotations

import itertools
import math
import random

import networkx as nx
import pytest
import sympy  # networkx.chromatic_polynomial returns sympy expressions
from flint import fmpz_poly

from leaguegrid.engine import (
    chromatic_polynomial,
    count_all_rounds_used,
    count_assignments,
    count_table,
    groupings,
)
from leaguegrid.engine.falling import falling, stirling2_rows


def coeffs(p: fmpz_poly) -> list[int]:
    return [int(c) for c in p.coeffs()]


def networkx_coeffs(G: nx.Graph) -> list[int]:
    """networkx.chromatic_polynomial (deletion-contraction in sympy), constant term first."""
    x = sympy.Symbol("x")
    expr = nx.chromatic_polynomial(G)
    return [int(c) for c in reversed(sympy.Poly(expr, x).all_coeffs())]


def round_robin(teams: int) -> nx.Graph:
    """A node per fixture of a single round-robin; an edge where two fixtures share a team."""
    return nx.line_graph(nx.complete_graph(teams))


def rook(n: int) -> nx.Graph:
    """n teams visit n venues over the rounds: cells clash in a row (team) or column (venue)."""
    return nx.cartesian_product(nx.complete_graph(n), nx.complete_graph(n))


@pytest.mark.parametrize("seed", range(30))
def test_matches_networkx_on_random_small_graphs(seed: int) -> None:
    # Reference: networkx.chromatic_polynomial, graphs of at most 8 vertices and 15 edges.
    r = random.Random(seed)
    n = r.randint(1, 8)
    m = r.randint(0, min(15, n * (n - 1) // 2))
    G = nx.gnm_random_graph(n, m, seed=seed)
    assert coeffs(chromatic_polynomial(G)) == networkx_coeffs(G)


def test_matches_networkx_with_hashable_labels() -> None:
    # Reference: networkx.chromatic_polynomial; nodes are fixture labels, not integers.
    G = nx.Graph([("A v B", "C v A"), ("C v A", "B v C"), ("B v C", "A v B"), ("B v C", "D v E")])
    G.add_node("F v G")
    assert coeffs(chromatic_polynomial(G)) == networkx_coeffs(G)


@pytest.mark.parametrize("n", [1, 2, 5, 12, 30])
def test_trees(n: int) -> None:
    # Textbook: a tree on n vertices has P = k (k-1)^(n-1).
    G = nx.random_labeled_tree(n, seed=n) if n > 1 else nx.empty_graph(1)
    k = fmpz_poly([0, 1])
    assert chromatic_polynomial(G) == k * (k - 1) ** (n - 1)


@pytest.mark.parametrize("n", range(3, 13))
def test_cycles(n: int) -> None:
    # Textbook: P(C_n) = (k-1)^n + (-1)^n (k-1).
    k = fmpz_poly([0, 1])
    assert chromatic_polynomial(nx.cycle_graph(n)) == (k - 1) ** n + (-1) ** n * (k - 1)


@pytest.mark.parametrize("n", range(1, 11))
def test_complete_graphs(n: int) -> None:
    # Textbook: P(K_n) = k (k-1) ... (k-n+1).
    p = chromatic_polynomial(nx.complete_graph(n))
    assert [p(k) for k in range(12)] == [falling(k, n) for k in range(12)]


@pytest.mark.parametrize("n", range(3, 11))
def test_wheels(n: int) -> None:
    # Textbook: the wheel with a hub and an n-cycle rim has P = k ((k-2)^n + (-1)^n (k-2)).
    k = fmpz_poly([0, 1])
    assert chromatic_polynomial(nx.wheel_graph(n + 1)) == k * ((k - 2) ** n + (-1) ** n * (k - 2))


@pytest.mark.parametrize(("a", "b"), [(1, 1), (2, 3), (3, 3), (4, 5), (6, 6)])
def test_complete_bipartite(a: int, b: int) -> None:
    # Textbook: P(K_{a,b}, k) = sum_j S(a, j) k(k-1)...(k-j+1) (k-j)^b, S = Stirling numbers
    # of the second kind (the a side uses exactly j rounds, the b side avoids them).
    p = chromatic_polynomial(nx.complete_bipartite_graph(a, b))
    s = stirling2_rows(a)[a]
    for k in range(0, 9):
        assert p(k) == sum(s[j] * falling(k, j) * (k - j) ** b for j in range(a + 1))


def test_petersen() -> None:
    # The Petersen graph's chromatic polynomial, from memory (Read 1968 lists it); our value
    # was also checked once against networkx.chromatic_polynomial in a scratch run.
    expected = [0, -704, 2606, -4305, 4275, -2861, 1353, -455, 105, -15, 1]
    assert coeffs(chromatic_polynomial(nx.petersen_graph())) == expected


@pytest.mark.parametrize(("n", "latin"), [(4, 576), (5, 161280), (6, 812851200)])
def test_latin_squares_from_rook_graph(n: int, latin: int) -> None:
    # OEIS A002860, number of Latin squares of order n: P(n) of the n x n rook's graph.
    assert count_assignments(rook(n), n) == latin


def test_latin_square_polynomial_order_4() -> None:
    # OEIS A002860: the full polynomial of rook 4x4 evaluated at 4.
    assert chromatic_polynomial(rook(4))(4) == 576


def test_six_team_round_robin() -> None:
    # OEIS A000438, one-factorizations of K6: 6; schedules in 5 rounds = 6 x 5!.
    G = round_robin(6)
    assert groupings(G)[5] == 6
    assert count_assignments(G, 5) == 6 * math.factorial(5)
    assert count_all_rounds_used(G, 5) == 6 * math.factorial(5)
    assert count_assignments(G, 4) == 0


def test_eight_team_round_robin_at_seven_rounds() -> None:
    # OEIS A000438, one-factorizations of K8: 6240; P(7) = 6240 x 7!.
    assert count_assignments(round_robin(8), 7) == 6240 * math.factorial(7)


def test_groupings_rebuild_polynomial_and_count_partitions() -> None:
    # Textbook: the empty graph on n vertices has a_j = S(n, j) (Stirling, second kind).
    G = nx.empty_graph(7)
    assert groupings(G) == list(stirling2_rows(7)[7])
    H = nx.petersen_graph()
    a = groupings(H)
    p = chromatic_polynomial(H)
    for k in range(12):
        assert p(k) == sum(c * falling(k, j) for j, c in enumerate(a))


def test_empty_graph_and_zero_rounds() -> None:
    G = nx.Graph()
    assert chromatic_polynomial(G) == fmpz_poly([1])
    assert count_assignments(G, 0) == 1
    assert groupings(G) == [1]
    assert count_assignments(nx.path_graph(2), 0) == 0
    assert count_all_rounds_used(nx.empty_graph(3), 2) == 6


def test_disjoint_pieces_multiply() -> None:
    # Components multiply: K3 + C5 + two isolated fixtures.
    G = nx.disjoint_union_all([nx.complete_graph(3), nx.cycle_graph(5), nx.empty_graph(2)])
    k = fmpz_poly([0, 1])
    c5 = (k - 1) ** 5 - (k - 1)
    assert chromatic_polynomial(G) == k * (k - 1) * (k - 2) * c5 * k**2


def test_all_rounds_used_matches_groupings() -> None:
    for G in (nx.petersen_graph(), round_robin(5), nx.cycle_graph(7)):
        a = groupings(G)
        p = chromatic_polynomial(G)
        table = count_table(G, range(0, 8))
        for k in range(0, 8):
            expect = a[k] * math.factorial(k) if k < len(a) else 0
            assert count_all_rounds_used(G, k) == expect
            assert table[k] == (p(k), expect)


def test_brute_force_counts_small() -> None:
    from engine_brute import count

    for seed in range(6):
        G = nx.gnm_random_graph(6, 8, seed=seed)
        for k in range(5):
            assert count_assignments(G, k) == count(G, k)


def test_itertools_sanity_rook_three() -> None:
    # OEIS A002860: 12 Latin squares of order 3 (enumerated here as a second check).
    rows = [p for p in itertools.permutations(range(3))]
    squares = sum(
        1
        for a, b, c in itertools.product(rows, repeat=3)
        if all(len({a[i], b[i], c[i]}) == 3 for i in range(3))
    )
    assert squares == 12 == count_assignments(rook(3), 3)
