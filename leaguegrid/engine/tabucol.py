"""A schedule with k rounds by tabu search, for the upper side of the fewest rounds.

TabuCol (A. Hertz and D. de Werra, "Using tabu search techniques for graph coloring",
Computing 39, 1987), with the dynamic tenure of P. Galinier and J.-K. Hao ("Hybrid evolutionary
algorithms for graph coloring", J. Comb. Optim. 3, 1999): repeatedly move one clashing fixture
to the round that removes the most clashes, not moving it back for a while. Each fixture keeps
to its allowed rounds (pins and exclusions). A heuristic: it finds a schedule or gives up, and
proves nothing when it gives up.
"""

from __future__ import annotations

import random

from .graph import Graph, bits
from .hooks import Hooks

CHECK_EVERY = 256


def tabucol(
    g: Graph, k: int, domains: list[int], hooks: Hooks, moves: int, seed: int = 0
) -> list[int] | None:
    """A colouring (rounds 1..k per vertex, each within its domain bitmask), or None when
    `moves` moves found none."""
    n = g.n
    if g.loop:
        return None
    rng = random.Random(seed)
    allowed = [[r for r in bits(domains[v]) if r < k] for v in range(n)]
    if any(not a for a in allowed):
        return None
    nbrs = [list(bits(g.adj[v])) for v in range(n)]
    colour = [rng.choice(a) for a in allowed]
    clash = [[0] * k for _ in range(n)]  # clash[v][r]: neighbours of v in round r
    for v in range(n):
        for u in nbrs[v]:
            clash[v][colour[u]] += 1
    conflicts = sum(clash[v][colour[v]] for v in range(n)) // 2
    clashing = {v for v in range(n) if clash[v][colour[v]]}  # fixtures in a clash now
    tabu = [[0] * k for _ in range(n)]  # move v to r forbidden until this move number
    best = conflicts
    for step in range(moves):
        if conflicts == 0:
            return [c + 1 for c in colour]
        if step % CHECK_EVERY == 0:
            hooks.check()
        pick = None
        pick_delta = None
        ties = 0
        for v in clashing:
            cv = colour[v]
            row = clash[v]
            here = row[cv]
            tv = tabu[v]
            for r in allowed[v]:
                if r == cv:
                    continue
                delta = row[r] - here
                if tv[r] > step and conflicts + delta >= best:
                    continue  # tabu, and not better than the best seen (aspiration)
                if pick_delta is None or delta < pick_delta:
                    pick, pick_delta, ties = (v, r), delta, 1
                elif delta == pick_delta:
                    ties += 1
                    if rng.randrange(ties) == 0:
                        pick = (v, r)
        if pick is None:
            continue  # every move is tabu: wait for one to be freed
        v, r = pick
        old = colour[v]
        colour[v] = r
        conflicts += pick_delta
        for u in nbrs[v]:
            clash[u][old] -= 1
            clash[u][r] += 1
            if clash[u][colour[u]]:
                clashing.add(u)
            else:
                clashing.discard(u)
        if clash[v][r]:
            clashing.add(v)
        else:
            clashing.discard(v)
        tabu[v][old] = step + 1 + int(0.6 * conflicts) + rng.randrange(10)
        best = min(best, conflicts)
    return [c + 1 for c in colour] if conflicts == 0 else None
