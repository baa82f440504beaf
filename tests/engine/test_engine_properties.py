"""Hypothesis property tests: identities every correct engine satisfies, and agreement of
the engine's internal paths with each other and with networkx."""

from __future__ import annotations

import math
import random

import networkx as nx
import sympy  # networkx.chromatic_polynomial returns sympy expressions
from flint import fmpz_poly
from hypothesis import HealthCheck, assume, given, settings
from hypothesis import strategies as st

from leaguegrid.engine import (
    chromatic_polynomial,
    count_all_rounds_used,
    count_assignments,
    groupings,
)
from leaguegrid.engine.falling import from_falling
from leaguegrid.engine.frontier import count_at, count_many, count_polynomial
from leaguegrid.engine.graph import from_networkx
from leaguegrid.engine.hooks import Hooks

SETTINGS = settings(max_examples=40, deadline=None, suppress_health_check=[HealthCheck.too_slow])


@st.composite
def graphs(draw, max_n: int = 9) -> nx.Graph:
    n = draw(st.integers(0, max_n))
    pairs = [(i, j) for i in range(n) for j in range(i + 1, n)]
    chosen = draw(st.lists(st.sampled_from(pairs), unique=True)) if pairs else []
    G = nx.Graph()
    G.add_nodes_from(range(n))
    G.add_edges_from(chosen)
    return G


@SETTINGS
@given(graphs(), st.data())
def test_deletion_contraction(G: nx.Graph, data) -> None:
    # P(G) = P(G - e) - P(G / e) for any edge e.
    if G.number_of_edges() == 0:
        return
    u, v = data.draw(st.sampled_from(sorted(G.edges)))
    deleted = G.copy()
    deleted.remove_edge(u, v)
    contracted = nx.contracted_nodes(G, u, v, self_loops=False)
    assert chromatic_polynomial(G) == chromatic_polynomial(deleted) - chromatic_polynomial(
        contracted
    )


@SETTINGS
@given(graphs())
def test_falling_factorial_coefficients_rebuild_polynomial(G: nx.Graph) -> None:
    a = groupings(G)
    assert from_falling(a) == chromatic_polynomial(G)
    assert all(c >= 0 for c in a)


@SETTINGS
@given(graphs())
def test_fixed_k_equals_polynomial_value(G: nx.Graph) -> None:
    p = chromatic_polynomial(G)
    a = groupings(G)
    for k in range(0, G.number_of_nodes() + 2):
        assert count_assignments(G, k) == p(k)
        expect = a[k] * math.factorial(k) if k < len(a) else 0
        assert count_all_rounds_used(G, k) == expect


@SETTINGS
@given(graphs(), st.randoms(use_true_random=False))
def test_every_vertex_order_agrees(G: nx.Graph, rnd: random.Random) -> None:
    # The frontier programme's result does not depend on the vertex order.
    g, _ = from_networkx(G)
    order = list(range(g.n))
    rnd.shuffle(order)
    hooks = Hooks()
    p = count_polynomial(g, order, hooks)
    assert p == chromatic_polynomial(G)
    for k in range(0, 5):
        assert count_at(g, order, k, hooks) == p(k)
    ks = list(range(0, g.n + 2))
    assert count_many(g, order, ks, hooks) == [p(k) for k in ks]


@settings(max_examples=15, deadline=None)
@given(graphs(max_n=7))
def test_agrees_with_networkx(G: nx.Graph) -> None:
    # Reference: networkx.chromatic_polynomial (sympy), at most 7 vertices and 15 edges
    # here (its deletion-contraction takes about a minute on K7's 21 edges).
    assume(G.number_of_edges() <= 15)
    x = sympy.Symbol("x")
    ref = sympy.Poly(nx.chromatic_polynomial(G), x) if G.number_of_nodes() else None
    p = chromatic_polynomial(G)
    if ref is None:
        assert p(3) == 1
        return
    for k in range(0, 6):
        assert p(k) == int(ref.eval(k))


@SETTINGS
@given(graphs(max_n=10))
def test_reductions_agree_with_plain_programme(G: nx.Graph) -> None:
    # Simplicial vertices, components and clique separators change nothing in the result.
    from leaguegrid.engine import solve

    g, _ = from_networkx(G)
    hooks = Hooks()
    p = solve.polynomial(g, hooks, reduce=True)
    assert p == solve.polynomial(g, hooks, reduce=False)
    for k in range(0, 5):
        assert solve.value(g, k, hooks, reduce=True) == p(k)


@SETTINGS
@given(st.integers(2, 6), st.integers(2, 14), st.randoms(use_true_random=False))
def test_chordal_graphs_need_no_search(width: int, n: int, rnd: random.Random) -> None:
    # A random graph built by adding vertices joined to a clique is chordal: the simplicial
    # peel solves it; P = prod (k - d) over the attachment clique sizes (textbook).
    from leaguegrid.engine.reductions import plan

    G = nx.complete_graph(1)
    sizes = [0]
    for v in range(1, n):
        anchor = rnd.choice(list(nx.find_cliques(G)))
        attach = rnd.sample(anchor, min(len(anchor), rnd.randint(0, width)))
        G.add_node(v)
        G.add_edges_from((v, u) for u in attach)
        sizes.append(len(attach))
    g, _ = from_networkx(G)
    assert plan(g).pieces == []
    x = fmpz_poly([0, 1])
    expect = fmpz_poly([1])
    for d in sizes:
        expect *= x - d
    assert chromatic_polynomial(G) == expect


def test_clique_separator_split() -> None:
    # Two wheels glued on a triangle: P = P(W1) P(W2) / (k (k-1) (k-2)) (textbook gluing).
    from leaguegrid.engine.reductions import plan

    a = nx.wheel_graph(6)
    b = nx.relabel_nodes(nx.wheel_graph(7), {0: 0, 1: 1, 2: 2, **{i: 10 + i for i in range(3, 7)}})
    G = nx.compose(a, b)
    assert {0, 1, 2} <= set(a) & set(b)
    g, _ = from_networkx(G)
    assert plan(g).divisors
    pa, pb = chromatic_polynomial(a), chromatic_polynomial(b)
    tri = chromatic_polynomial(nx.complete_graph(3))
    assert chromatic_polynomial(G) == pa * pb // tri


def _array_path_agrees(G: nx.Graph, k: int, chunk_rows: int | None) -> None:
    """The numpy path (vectorized.py), forced from the first step, gives the dict
    programme's counts; with `chunk_rows`, successors are built that many rows at a time,
    merged per chunk and then across chunks in buckets (vectorized._merge_tables)."""
    from leaguegrid.engine import frontier, vectorized
    from leaguegrid.engine.orders import greedy_order

    g, _ = from_networkx(G)
    order = greedy_order(g)
    hooks = Hooks()
    ks = list(range(0, 7))
    plain = [count_at(g, order, j, hooks) for j in ks]
    saved = frontier.VECTOR_THRESHOLD, frontier.VECTOR_CHUNK_SHARE, vectorized.MIN_CHUNK_ROWS
    frontier.VECTOR_THRESHOLD = 1
    if chunk_rows is not None:
        frontier.VECTOR_CHUNK_SHARE, vectorized.MIN_CHUNK_ROWS = 0, chunk_rows
    try:
        assert count_at(g, order, k, hooks) == plain[k]
        assert count_many(g, order, ks, hooks) == plain
    finally:
        frontier.VECTOR_THRESHOLD, frontier.VECTOR_CHUNK_SHARE, vectorized.MIN_CHUNK_ROWS = saved


@SETTINGS
@given(graphs(max_n=12), st.integers(0, 6))
def test_array_programme_agrees_with_dict_programme(G: nx.Graph, k: int) -> None:
    _array_path_agrees(G, k, None)


@SETTINGS
@given(graphs(max_n=12), st.integers(0, 6))
def test_chunked_steps_agree_with_dict_programme(G: nx.Graph, k: int) -> None:
    _array_path_agrees(G, k, 3)


def test_array_programme_on_published_counts(monkeypatch) -> None:
    # OEIS A002860 (Latin squares of order 6) and A000438 (6240 one-factorizations of K8),
    # with the array path taking over early.
    from leaguegrid.engine import frontier

    monkeypatch.setattr(frontier, "VECTOR_THRESHOLD", 50)
    rook6 = nx.cartesian_product(nx.complete_graph(6), nx.complete_graph(6))
    assert count_assignments(rook6, 6) == 812851200
    assert count_assignments(nx.line_graph(nx.complete_graph(8)), 7) == 6240 * math.factorial(7)


def test_hash_collisions_are_caught(monkeypatch) -> None:
    # A hash that maps every row to one value must not merge different states.
    import numpy as np

    from leaguegrid.engine import vectorized

    monkeypatch.setattr(vectorized, "_hash", lambda rows: np.zeros(rows.shape[0], np.uint64))
    calls = []
    lexsort = np.lexsort
    monkeypatch.setattr(np, "lexsort", lambda keys: calls.append(1) or lexsort(keys))
    from leaguegrid.engine import frontier

    monkeypatch.setattr(frontier, "VECTOR_THRESHOLD", 1)
    G = nx.petersen_graph()
    g, _ = from_networkx(G)
    p = chromatic_polynomial(G)  # the packed-polynomial path does not use arrays
    assert count_many(g, list(range(10)), [3, 4], Hooks()) == [p(3), p(4)]
    assert p(3) == 120
    assert calls  # the collisions were seen and the exact sort used


def test_truncated_hash_groups_are_checked(monkeypatch) -> None:
    # Hashes that differ only in their low bits fall in one group of the packed sort;
    # the row check must send the merge to the full hash, which keeps them apart.
    import numpy as np

    from leaguegrid.engine import vectorized

    monkeypatch.setattr(vectorized, "_hash", lambda rows: rows[:, -1].copy())
    rows = np.array([[0, 1], [0, 2], [0, 1], [0, 3]], np.uint64)
    res = np.array([[1, 2, 3, 4]], np.int64)
    merged, weights = vectorized._merge(rows, res, np.array([7], np.int64))
    got = sorted(zip(merged[:, 1].tolist(), weights[0].tolist(), strict=True))
    assert got == [(1, 4), (2, 2), (3, 4)]


def test_merge_tables_joins_rows_that_differ_only_in_padding() -> None:
    import numpy as np

    from leaguegrid.engine import vectorized

    tables = [
        np.array([[0, 5], [3, 6]], np.uint64),
        np.array([[5], [7]], np.uint64),  # [5] is [0, 5] without its zero padding
        np.array([[3, 6], [0, 7]], np.uint64),
    ]
    weights = [np.array([[1, 2]], np.int64), np.array([[4, 8]], np.int64),
               np.array([[16, 32]], np.int64)]
    rows, res = vectorized._merge_tables(tables, weights, np.array([1000], np.int64))
    got = sorted((tuple(r), int(w)) for r, w in zip(rows.tolist(), res[0], strict=True))
    assert got == [((0, 5), 5), ((0, 7), 40), ((3, 6), 18)]
    assert tables == [] and weights == []  # the inputs are handed over and freed
