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
