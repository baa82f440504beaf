"""Brute-force enumeration of round assignments, the outside check for small graphs."""

from __future__ import annotations

import itertools
from collections.abc import Hashable, Iterable, Mapping

import networkx as nx


def assignments(
    G: nx.Graph,
    k: int,
    pins: Mapping[Hashable, int] | None = None,
    exclusions: Mapping[Hashable, Iterable[int]] | None = None,
) -> list[dict[Hashable, int]]:
    """Every map node -> round in 1..k with no clash in a round, pins and exclusions kept."""
    nodes = list(G.nodes)
    pins = pins or {}
    exclusions = {v: set(rs) for v, rs in (exclusions or {}).items()}
    choices = []
    for v in nodes:
        opts = list(range(1, k + 1))
        if v in pins:
            opts = [pins[v]] if 1 <= pins[v] <= k else []
        choices.append([r for r in opts if r not in exclusions.get(v, set())])
    out = []
    for combo in itertools.product(*choices):
        a = dict(zip(nodes, combo, strict=True))
        if all(a[u] != a[v] for u, v in G.edges):
            out.append(a)
    return out


def count(G, k, pins=None, exclusions=None) -> int:
    """Number of valid assignments, by enumeration."""
    return len(assignments(G, k, pins, exclusions))


def count_all_used(G, k, pins=None, exclusions=None) -> int:
    """Number of valid assignments using every round 1..k, by enumeration."""
    every = set(range(1, k + 1))
    return sum(1 for a in assignments(G, k, pins, exclusions) if set(a.values()) == every)


def random_graph(n: int, m: int, seed: int) -> nx.Graph:
    """A seeded random graph on n nodes with (up to) m edges."""
    G = nx.gnm_random_graph(n, m, seed=seed)
    return G
