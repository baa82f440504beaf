"""Vertex orders for the frontier programme: cheap greedy heuristics, several tried."""

from __future__ import annotations

import random

from .graph import Graph, bits


def frontier_sizes(g: Graph, order: list[int]) -> list[int]:
    """Frontier size after each step: processed vertices that still have unprocessed neighbours."""
    done = 0
    out = []
    full = (1 << g.n) - 1
    for v in order:
        done |= 1 << v
        rest = full & ~done
        out.append(sum(1 for u in bits(done) if g.adj[u] & rest))
    return out


def greedy_order(g: Graph, rng: random.Random | None = None, start: int | None = None) -> list[int]:
    """Grow the order one vertex at a time, keeping the frontier small.

    Picks the vertex whose addition changes the frontier least; ties go to the vertex with
    most processed neighbours, then (randomly when `rng` is given) among the rest.
    """
    n = g.n
    adj = g.adj
    unproc_deg = [a.bit_count() for a in adj]  # unprocessed neighbours of each vertex
    processed = 0
    order: list[int] = []
    candidates = set(range(n))
    first = start
    while candidates:
        if first is not None:
            v = first
            first = None
        else:
            best_key = None
            v = -1
            for c in candidates:
                nb_done = adj[c] & processed
                leaving = sum(1 for u in bits(nb_done) if unproc_deg[u] == 1)
                entering = 1 if unproc_deg[c] > 0 else 0
                key = (entering - leaving, -nb_done.bit_count(), rng.random() if rng else c)
                if best_key is None or key < best_key:
                    best_key = key
                    v = c
        candidates.discard(v)
        order.append(v)
        processed |= 1 << v
        for u in bits(adj[v]):
            unproc_deg[u] -= 1
    return order
