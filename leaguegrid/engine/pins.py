"""Pins and exclusions as an exact graph transformation (the clique transform).

Fixtures pinned to the same round merge into one representative vertex for that round;
an exclusion "v may not use round r" joins v to round r's representative (one is added
when no fixture is pinned to r); the representatives form a clique. With j representatives
and K rounds, every valid assignment of the original problem corresponds to exactly
K (K-1) ... (K-j+1) colourings of the transformed graph (one per choice of the
representatives' distinct colours), so the count is P'(K) / K (K-1) ... (K-j+1).
"""

from __future__ import annotations

from collections.abc import Mapping, Set
from dataclasses import dataclass

from .graph import Graph, bits


@dataclass
class Transformed:
    """The transformed graph and how to map its colourings back.

    `where[v]` is v's vertex in `graph`; `reps` lists (vertex, round) for the
    representatives, which are the last `len(reps)` vertices of `graph`.
    """

    graph: Graph
    where: list[int]
    reps: list[tuple[int, int]]
    pinned: dict[int, int]


def transform(
    g: Graph, k: int, pins: Mapping[int, int], exclusions: Mapping[int, Set[int]]
) -> Transformed | None:
    """The clique transform of g for k rounds, or None when no assignment can exist
    (a pin beyond k, clashing fixtures pinned to one round, a pin to an excluded round).
    Exclusions of rounds beyond k do not apply."""
    for v, r in pins.items():
        if r > k:
            return None
        if r in exclusions.get(v, ()):
            return None
    pin_rounds = sorted(set(pins.values()))
    excl_rounds = sorted(
        {r for v, rs in exclusions.items() if v not in pins for r in rs if 1 <= r <= k}
    )
    rounds = sorted(set(pin_rounds) | set(excl_rounds))
    free = [v for v in range(g.n) if v not in pins]
    where = [-1] * g.n
    for i, v in enumerate(free):
        where[v] = i
    rep_of = {r: len(free) + i for i, r in enumerate(rounds)}
    for v, r in pins.items():
        where[v] = rep_of[r]
    size = len(free) + len(rounds)
    adj = [0] * size
    for v in range(g.n):
        a = where[v]
        for u in bits(g.adj[v]):
            b = where[u]
            if a == b:
                return None  # two clashing fixtures pinned to the same round
            adj[a] |= 1 << b
    for v, rs in exclusions.items():
        if v in pins:
            continue
        a = where[v]
        for r in rs:
            if 1 <= r <= k:
                b = rep_of[r]
                adj[a] |= 1 << b
                adj[b] |= 1 << a
    reps = [rep_of[r] for r in rounds]
    for a in reps:
        for b in reps:
            if a != b:
                adj[a] |= 1 << b
    return Transformed(Graph(adj, g.loop), where, [(rep_of[r], r) for r in rounds], dict(pins))


def assignment_back(t: Transformed, colours: list[int], k: int) -> list[int]:
    """Rounds (1..k) of the original vertices from a colouring (colours 1..k) of t.graph.

    The colouring's rounds are renamed so that each representative gets its own round;
    the other colours go to the other rounds in increasing order. The renaming is a
    bijection fixed by the representatives' colours, so a uniform colouring gives a
    uniform assignment."""
    rename: dict[int, int] = {}
    for vertex, r in t.reps:
        rename[colours[vertex]] = r
    spare_colours = [c for c in range(1, k + 1) if c not in rename]
    spare_rounds = [r for r in range(1, k + 1) if r not in rename.values()]
    rename.update(zip(spare_colours, spare_rounds, strict=True))
    return [rename[colours[w]] for w in t.where]
