"""Vertex orders for the frontier programme.

The programme's cost is set by its largest state tables, which depend on the order far
more than on the graph's size. Orders are grown greedily (the next vertex is the one that
keeps the frontier, the placed fixtures still clashing with unplaced ones, smallest), with
random tie-breaking and random starts; each order is scored by the sum over steps of the
number of partitions of its frontier (Bell numbers; at a fixed k, partitions into at most k
classes), which ranks orders well against measured table sizes, and the best is kept.
The number of tries grows with the expected cost, so small graphs spend almost nothing.
The search is deterministic, so the same graph always gets the same order.
"""

from __future__ import annotations

import random
from collections.abc import Callable

from .falling import stirling2_rows
from .graph import Graph, bits


class PartitionBounds:
    """Partitions of `width` items into at most k classes (all of them when k is None),
    remembered by the one search or estimate that owns the table."""

    def __init__(self) -> None:
        self._rows: tuple[tuple[int, ...], ...] = ((1,),)
        self._known: dict[tuple[int, int | None], int] = {}

    def __call__(self, width: int, k: int | None) -> int:
        got = self._known.get((width, k))
        if got is None:
            if width >= len(self._rows):
                self._rows = stirling2_rows(max(width, 2 * len(self._rows)))
            row = self._rows[width]
            got = self._known[(width, k)] = sum(row if k is None else row[: k + 1])
        return got


def frontier_sizes(g: Graph, order: list[int]) -> list[int]:
    """Frontier size after each step: placed vertices that still have unplaced neighbours."""
    unplaced_deg = [a.bit_count() for a in g.adj]
    ones = _mask_of(i for i, d in enumerate(unplaced_deg) if d == 1)
    size = 0
    out = []
    placed = 0
    for v in order:
        leaving = (g.adj[v] & placed & ones).bit_count()
        ones = _decrement(g.adj[v], unplaced_deg, ones)
        size += (1 if unplaced_deg[v] > 0 else 0) - leaving
        placed |= 1 << v
        out.append(size)
    return out


def _mask_of(verts) -> int:
    """The bitmask of the given vertices."""
    m = 0
    for v in verts:
        m |= 1 << v
    return m


def _decrement(nbrs: int, unplaced_deg: list[int], ones: int) -> int:
    """Lower the unplaced degree of each vertex in `nbrs` by one; the updated mask of
    vertices with exactly one unplaced neighbour."""
    for u in bits(nbrs):
        d = unplaced_deg[u] - 1
        unplaced_deg[u] = d
        if d == 1:
            ones |= 1 << u
        elif d == 0:
            ones &= ~(1 << u)
    return ones


def score(widths: list[int], k: int | None, bounds: PartitionBounds | None = None) -> int:
    """The order's score: sum over steps of the partition bound of the frontier."""
    bounds = bounds or PartitionBounds()
    return sum(bounds(w, k) for w in widths)


def greedy_order(
    g: Graph, rng: random.Random | None = None, start: int | None = None
) -> list[int]:
    """An order grown one vertex at a time, keeping the frontier small.

    Among the unplaced neighbours of placed vertices, picks the one whose placement changes
    the frontier least, then the one with most placed neighbours; remaining ties are broken
    by index, or at random when `rng` is given. A new component starts at `start`, or at a
    vertex of least degree (a random one when `rng` is given).
    """
    n = g.n
    adj = g.adj
    unplaced_deg = [a.bit_count() for a in adj]
    ones = _mask_of(i for i, d in enumerate(unplaced_deg) if d == 1)
    placed = 0
    boundary = 0  # unplaced vertices with a placed neighbour
    order: list[int] = []
    unplaced = (1 << n) - 1
    while unplaced:
        if boundary:
            best_key = None
            v = -1
            for c in bits(boundary):
                nb_done = adj[c] & placed
                leaving = (nb_done & ones).bit_count()
                entering = 1 if unplaced_deg[c] > 0 else 0
                key = (entering - leaving, -nb_done.bit_count(), rng.random() if rng else c)
                if best_key is None or key < best_key:
                    best_key = key
                    v = c
        elif start is not None and unplaced >> start & 1:
            v = start
        else:
            left = list(bits(unplaced))
            low = min(adj[u].bit_count() for u in left)
            ends = [u for u in left if adj[u].bit_count() == low]
            v = rng.choice(ends) if rng else ends[0]
        order.append(v)
        vb = 1 << v
        placed |= vb
        unplaced &= ~vb
        boundary = (boundary | adj[v]) & unplaced
        ones = _decrement(adj[v], unplaced_deg, ones)
    return order


def best_order(
    g: Graph,
    k: int | None = None,
    check: Callable[[], None] | None = None,
    seed: int = 0,
    max_tries: int = 300,
) -> list[int]:
    """The best-scoring of many greedy orders (deterministic for a given graph and seed).

    The number of tries grows with the logarithm of the best score (a proxy for the work
    the programme will do): one on trivial graphs, up to `max_tries` on the hardest, fewer
    on large graphs where each try costs more. `check` is called between tries (cancel).
    """
    rng = random.Random(seed)
    bounds = PartitionBounds()
    best = greedy_order(g)
    best_score = score(frontier_sizes(g, best), k, bounds)
    tries = 1
    limit = min(max_tries, 1 + 8 * max(0, best_score.bit_length() - 10), 500_000 // g.n**2 + 8)
    while tries < limit:
        if check is not None:
            check()
        cand = greedy_order(g, rng)
        s = score(frontier_sizes(g, cand), k, bounds)
        if s < best_score:
            best, best_score = cand, s
        tries += 1
    return best
