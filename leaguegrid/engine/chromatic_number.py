"""The fewest rounds: a clique for the lower bound, exact DSatur backtracking for the rest.

Brélaz's DSatur order (most constrained fixture first) with colour symmetry broken: among
rounds that no pin or exclusion mentions and that are still unused, only the first is tried,
since any schedule can rename them. A failed search is an exhaustive proof that no
schedule exists with that many rounds.
"""

from __future__ import annotations

from collections.abc import Callable, Mapping, Set

from .graph import Graph, bits
from .hooks import BudgetExceeded, Hooks

CHECK_EVERY = 1024
MAX_SEARCH = 900  # the search recurses once per fixture


def max_clique(g: Graph, hooks: Hooks) -> list[int]:
    """A maximum clique (branch and bound with a greedy-colouring bound on bitmasks)."""
    adj = g.adj
    best: list[int] = []
    order = sorted(range(g.n), key=lambda v: -adj[v].bit_count())
    counter = [0]

    def colour_bound(cand: int) -> list[tuple[int, int]]:
        # Greedy colour classes of the candidates; returns (vertex, colour number) pairs.
        out = []
        colour = 0
        rest = cand
        while rest:
            colour += 1
            avail = rest
            while avail:
                low = avail & -avail
                v = low.bit_length() - 1
                avail &= ~low & ~adj[v]
                rest &= ~low
                out.append((v, colour))
        return out

    def expand(clique: list[int], cand: int) -> None:
        nonlocal best
        counter[0] += 1
        if counter[0] % CHECK_EVERY == 0:
            hooks.check()
        for v, c in reversed(colour_bound(cand)):
            if len(clique) + c <= len(best):
                return
            clique.append(v)
            new = cand & adj[v]
            if new:
                expand(clique, new)
            elif len(clique) > len(best):
                best = list(clique)
            clique.pop()
            cand &= ~(1 << v)

    full = 0
    for v in order:
        full |= 1 << v
    if full:
        expand([], full)
    return best


def domains_for(
    n: int, k: int, pins: Mapping[int, int], exclusions: Mapping[int, Set[int]]
) -> list[int] | None:
    """Bitmask of allowed rounds (bit r-1 for round r) per vertex, or None if a pin is
    outside 1..k or excluded."""
    full = (1 << k) - 1
    out = [full] * n
    for v, rs in exclusions.items():
        for r in rs:
            if 1 <= r <= k:
                out[v] &= ~(1 << (r - 1))
    for v, r in pins.items():
        if not 1 <= r <= k or not out[v] >> (r - 1) & 1:
            return None
        out[v] = 1 << (r - 1)
    return out


def find_assignment(
    g: Graph,
    k: int,
    domains: list[int],
    hooks: Hooks,
    special: int = 0,
    node_limit: int | None = None,
) -> list[int] | None:
    """A colouring (rounds 1..k per vertex) within `domains`, or None when none exists.

    `special` is the bitmask of rounds mentioned by pins or exclusions (not interchangeable).
    Raises StopIteration when `node_limit` search nodes are used without an answer, and
    BudgetExceeded for graphs too large for the recursive search.
    """
    n = g.n
    if n > MAX_SEARCH:
        raise BudgetExceeded(f"{n} fixtures are too many for the exhaustive search")
    adj = g.adj
    if g.loop and n:
        return None
    colour = [0] * n
    forbidden = [0] * n  # rounds used by coloured neighbours, as bits
    used_count = [0] * (k + 1)
    plain = ((1 << k) - 1) & ~special
    nodes = [0]

    def pick() -> int:
        best = -1
        best_key = None
        for v in range(n):
            if colour[v]:
                continue
            avail = (domains[v] & ~forbidden[v]).bit_count()
            if avail == 0:
                return v
            key = (avail, -sum(1 for u in bits(adj[v]) if not colour[u]))
            if best_key is None or key < best_key:
                best_key = key
                best = v
        return best

    def solve(left: int) -> bool:
        if left == 0:
            return True
        nodes[0] += 1
        if nodes[0] % CHECK_EVERY == 0:
            hooks.check()
        if node_limit is not None and nodes[0] > node_limit:
            raise StopIteration
        v = pick()
        avail = domains[v] & ~forbidden[v]
        fresh_tried = False
        for r0 in bits(avail):
            r = r0 + 1
            if plain >> r0 & 1 and used_count[r] == 0:
                if fresh_tried:
                    continue
                fresh_tried = True
            colour[v] = r
            used_count[r] += 1
            changed = []
            for u in bits(adj[v]):
                if not forbidden[u] >> r0 & 1:
                    forbidden[u] |= 1 << r0
                    changed.append(u)
            if solve(left - 1):
                return True
            for u in changed:
                forbidden[u] &= ~(1 << r0)
            used_count[r] -= 1
            colour[v] = 0
        return False

    if solve(n):
        return colour
    return None


def greedy_assignment(
    g: Graph, domains_of: Callable[[int], list[int] | None], hooks: Hooks, start: int = 1
) -> tuple[int, list[int]]:
    """A quick DSatur colouring respecting pins and exclusions: (rounds used, colouring).

    `domains_of(k)` gives the domains for k rounds; k grows from `start` (a proven lower
    bound) one at a time, then doubling, until a greedy pass succeeds; the rounds used are
    the highest round the pass gave (exclusions above it do not apply, pins are below it)."""
    n = g.n
    k = max(start, 1)
    while True:
        doms = domains_of(k)
        if doms is not None:
            col = greedy_pass(g, doms)
            if col is not None:
                return max(col, default=k), col
        k = k + 1 if k < start + 3 else 2 * k
        if k > 4 * n + 64 and k > 2 * start:
            raise RuntimeError("no greedy assignment found")
        hooks.check()


def greedy_pass(g: Graph, domains: list[int]) -> list[int] | None:
    """One DSatur pass without backtracking: lowest allowed round for the most constrained."""
    n = g.n
    colour = [0] * n
    forbidden = [0] * n
    for _ in range(n):
        best, best_key = -1, None
        for v in range(n):
            if colour[v]:
                continue
            key = ((domains[v] & ~forbidden[v]).bit_count(), -g.adj[v].bit_count())
            if best_key is None or key < best_key:
                best, best_key = v, key
        avail = domains[best] & ~forbidden[best]
        if not avail:
            return None
        r0 = (avail & -avail).bit_length() - 1
        colour[best] = r0 + 1
        for u in bits(g.adj[best]):
            forbidden[u] |= 1 << r0
    return colour
