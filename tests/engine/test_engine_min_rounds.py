"""The fewest rounds (chromatic number), with textbook values."""

from __future__ import annotations

import networkx as nx
import pytest

from leaguegrid.engine import min_rounds, min_rounds_bounds


@pytest.mark.parametrize(
    ("G", "chi"),
    [
        (nx.empty_graph(0), 0),
        (nx.empty_graph(4), 1),
        (nx.path_graph(5), 2),
        (nx.cycle_graph(7), 3),  # odd cycle (textbook)
        (nx.petersen_graph(), 3),  # textbook
        (nx.complete_graph(6), 6),
        (nx.mycielski_graph(4), 4),  # Grotzsch graph, triangle-free (textbook)
        (nx.line_graph(nx.complete_graph(6)), 5),  # K6 has a one-factorization
        (nx.line_graph(nx.complete_graph(5)), 5),  # chromatic index of K5 is 5 (odd order)
        (nx.wheel_graph(6), 4),  # hub + odd 5-cycle rim: 3 + 1 (textbook)
    ],
)
def test_known_chromatic_numbers(G: nx.Graph, chi: int) -> None:
    assert min_rounds(G) == chi
    assert min_rounds_bounds(G) == (chi, chi)


def test_pin_beyond_chromatic_number() -> None:
    assert min_rounds(nx.path_graph(3), pins={1: 6}) == 6


def test_proof_by_clique_and_by_search() -> None:
    from leaguegrid.engine import count_assignments, min_rounds_proof

    G = nx.petersen_graph()  # largest clique 2, chromatic number 3 (textbook)
    proof = min_rounds_proof(G)
    assert proof.rounds == 3
    assert proof.lower == "search"
    assert count_assignments(G, 2) == 0
    assert all(proof.schedule[u] != proof.schedule[v] for u, v in G.edges)
    assert set(proof.schedule.values()) <= {1, 2, 3}
    K5 = nx.complete_graph(5)
    proof = min_rounds_proof(K5)
    assert (proof.rounds, proof.lower, sorted(proof.clique)) == (5, "clique", [0, 1, 2, 3, 4])
    pinned = min_rounds_proof(nx.path_graph(3), pins={0: 4})
    assert (pinned.rounds, pinned.lower, pinned.schedule[0]) == (4, "pin", 4)
