"""The engine's own graph form: vertices 0..n-1 and neighbour sets as integer bitmasks."""

from __future__ import annotations

from collections.abc import Hashable, Iterable
from dataclasses import dataclass

import networkx as nx


@dataclass
class Graph:
    """A simple graph on vertices 0..n-1; `adj[v]` is the bitmask of v's neighbours.

    `loop` is True when some vertex clashes with itself (then no assignment exists).
    """

    adj: list[int]
    loop: bool = False

    @property
    def n(self) -> int:
        return len(self.adj)

    def edges(self) -> int:
        """Number of edges."""
        return sum(a.bit_count() for a in self.adj) // 2

    def induced(self, verts: list[int]) -> Graph:
        """The subgraph on `verts`, renumbered 0..len(verts)-1 in the given order."""
        pos = {v: i for i, v in enumerate(verts)}
        adj = []
        for v in verts:
            m = 0
            for u in bits(self.adj[v]):
                i = pos.get(u)
                if i is not None:
                    m |= 1 << i
            adj.append(m)
        return Graph(adj, self.loop)


def bits(mask: int) -> Iterable[int]:
    """The positions of the set bits of `mask`, lowest first."""
    while mask:
        low = mask & -mask
        yield low.bit_length() - 1
        mask ^= low


def from_edges(n: int, edges: Iterable[tuple[int, int]]) -> Graph:
    """A Graph on 0..n-1 from an edge list (repeated edges are one edge)."""
    adj = [0] * n
    loop = False
    for a, b in edges:
        if a == b:
            loop = True
            continue
        adj[a] |= 1 << b
        adj[b] |= 1 << a
    return Graph(adj, loop)


def from_networkx(G: nx.Graph) -> tuple[Graph, list[Hashable]]:
    """The engine graph of a networkx graph, and the node list giving each index's node."""
    nodes = list(G.nodes)
    index = {v: i for i, v in enumerate(nodes)}
    g = from_edges(len(nodes), ((index[a], index[b]) for a, b in G.edges))
    return g, nodes


def components(g: Graph) -> list[list[int]]:
    """The connected components, each a sorted vertex list."""
    seen = 0
    out = []
    for v in range(g.n):
        if seen >> v & 1:
            continue
        comp = 1 << v
        todo = 1 << v
        while todo:
            low = todo & -todo
            todo ^= low
            new = g.adj[low.bit_length() - 1] & ~comp
            comp |= new
            todo |= new
        seen |= comp
        out.append(list(bits(comp)))
    return out
