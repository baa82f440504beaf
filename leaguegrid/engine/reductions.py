"""Exact reductions applied before any search.

- Simplicial vertices: a vertex whose neighbours form a clique of size d contributes a
  factor (k - d) and is removed; repeated, this solves chordal graphs (and isolated
  vertices, d = 0) with no search at all.
- Connected components multiply.
- Clique separators (cut vertices are the case s = 1): if a clique S of size s separates
  G into G1 (one side plus S) and G2 (the rest plus S), P(G) = P(G1) P(G2) / P(K_s),
  P(K_s) = k (k-1) ... (k-s+1). Candidate separators are the later-neighbour sets of a
  min-degree elimination ordering's triangulation, which include every minimal separator
  of that triangulation; a candidate is used only when it is a clique of G and separates G.

The result is a plan: linear factors, divisors, and the irreducible pieces left for the
frontier programme.
"""

from __future__ import annotations

from dataclasses import dataclass, field

from .graph import Graph, bits, components


@dataclass
class Plan:
    """P(G) = prod (k - d) for d in linear * prod P(piece) / prod P(K_s) for s in divisors."""

    linear: list[int] = field(default_factory=list)
    pieces: list[Graph] = field(default_factory=list)
    divisors: list[int] = field(default_factory=list)

    def clique_bound(self) -> int:
        """The largest clique size the plan proves (from separators and simplicial cliques)."""
        return max([d + 1 for d in self.linear] + self.divisors + [0])


def is_clique(g: Graph, mask: int) -> bool:
    """True when the vertices in `mask` are pairwise adjacent."""
    return all(not (mask & ~(1 << u)) & ~g.adj[u] for u in bits(mask))


def peel_simplicial(g: Graph) -> tuple[list[tuple[int, int]], int]:
    """Remove simplicial vertices until none is left: the removed vertices in order, each
    with its neighbours (a clique) at the time it was removed, and the mask of the vertices
    that remain."""
    alive = (1 << g.n) - 1
    peeled: list[tuple[int, int]] = []
    todo = list(range(g.n))
    queued = alive
    while todo:
        v = todo.pop()
        queued &= ~(1 << v)
        if not alive >> v & 1:
            continue
        nb = g.adj[v] & alive
        if is_clique(g, nb):
            peeled.append((v, nb))
            alive &= ~(1 << v)
            for u in bits(nb & ~queued):
                todo.append(u)
                queued |= 1 << u
    return peeled, alive


def find_clique_separator(g: Graph) -> tuple[int, int] | None:
    """A clique separator of a connected graph: (S mask, mask of one side), or None."""
    n = g.n
    adj = list(g.adj)
    alive = (1 << n) - 1
    full = alive
    seen: set[int] = set()
    for _ in range(n):
        v = min(bits(alive), key=lambda u: (adj[u] & alive).bit_count())
        nb = adj[v] & alive
        alive &= ~(1 << v)
        for u in bits(nb):
            adj[u] |= nb & ~(1 << u)
        if not nb or nb in seen or nb == alive:
            continue
        seen.add(nb)
        if not is_clique(g, nb):
            continue
        side = _component_of(g, v, full & ~nb)
        if side | nb != full:
            return nb, side
    return None


def _component_of(g: Graph, v: int, allowed: int) -> int:
    """The vertices reachable from v inside `allowed`."""
    comp = 1 << v
    todo = comp
    while todo:
        low = todo & -todo
        todo ^= low
        new = g.adj[low.bit_length() - 1] & allowed & ~comp
        comp |= new
        todo |= new
    return comp


def plan(g: Graph) -> Plan:
    """Reduce g as far as the exact reductions go."""
    out = Plan()
    _reduce(g, out)
    return out


def _reduce(g: Graph, out: Plan) -> None:
    peeled, alive = peel_simplicial(g)
    out.linear.extend(nb.bit_count() for _, nb in peeled)
    if not alive:
        return
    core = g.induced(list(bits(alive)))
    for comp in components(core):
        piece = core.induced(comp)
        found = find_clique_separator(piece)
        if found is None:
            out.pieces.append(piece)
            continue
        sep, side = found
        rest = ((1 << piece.n) - 1) & ~side
        out.divisors.append(sep.bit_count())
        _reduce(piece.induced(list(bits(side | sep))), out)
        _reduce(piece.induced(list(bits(rest))), out)
