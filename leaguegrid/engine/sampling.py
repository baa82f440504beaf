"""Exactly uniform draws of a valid assignment from the frontier programme's tables.

The tables give, for every state before each step, its number of completions. Walking
forward, every concrete choice for the next fixture (each allowed round by name) is taken
with probability proportional to the completions of the state it leads to, so every valid
assignment comes out with probability exactly 1 / P(G, k). The tables are built once per
piece and reused for every draw.
"""

from __future__ import annotations

import random

from .frontier import State, completion_tables
from .graph import Graph, bits, components
from .hooks import Hooks
from .orders import greedy_order
from .reductions import peel_simplicial


class PieceSampler:
    """Uniform colourings of one connected piece with rounds 1..k."""

    def __init__(self, g: Graph, k: int, hooks: Hooks) -> None:
        self.g = g
        self.k = k
        self.order = greedy_order(g)
        self.tables: list[dict[State, int]] = completion_tables(g, self.order, k, hooks)
        self.total = self.tables[0].get((), 0)

    def draw(self, rng: random.Random) -> list[int]:
        """One colouring; requires self.total > 0."""
        g, k = self.g, self.k
        colours = [0] * g.n
        active: dict[int, int] = {}  # round -> unplaced fixtures it rules out (non-empty)
        rest = 0
        for v in self.order:
            rest |= 1 << v
        for i, v in enumerate(self.order):
            vb = 1 << v
            rest &= ~vb
            nb = g.adj[v] & rest
            after = self.tables[i + 1]
            others = {c: m & ~vb for c, m in active.items() if m & ~vb}
            options: list[tuple[int, int]] = []  # (completions, round)
            for r in range(1, k + 1):
                f = active.get(r)
                if f is not None and f & vb:
                    continue
                new = dict(others)
                merged = (f or 0) | nb
                if merged:
                    new[r] = merged
                else:
                    new.pop(r, None)
                w = after.get(tuple(sorted(new.values())), 0)
                if w:
                    options.append((w, r))
            pick = _choose(options, rng)
            colours[v] = pick
            merged = active.get(pick, 0) | nb
            active = others
            if merged:
                active[pick] = merged
            else:
                active.pop(pick, None)
        return colours


class Sampler:
    """Uniform colourings of a whole graph.

    Simplicial vertices are peeled first (reductions.py); the rest is drawn per connected
    component from the programme's tables, then the peeled vertices are put back in reverse
    order, each in a round drawn uniformly from the k - d its clique of d neighbours leaves
    free. Every colouring of the rest extends in exactly the same number of ways, so the
    draw stays exactly uniform.
    """

    def __init__(self, g: Graph, k: int, hooks: Hooks) -> None:
        self.g = g
        self.k = k
        self.peeled, alive = peel_simplicial(g)
        self.core = list(bits(alive))
        core = g.induced(self.core)
        self.comps = components(core)
        self.pieces: list[PieceSampler] = []
        self.possible = k > 0 and not (g.loop and g.n)
        self.possible = self.possible and all(nb.bit_count() < k for _, nb in self.peeled)
        if not self.possible:
            return
        for i, comp in enumerate(self.comps):
            with hooks.window(i / len(self.comps), (i + 1) / len(self.comps)):
                piece = PieceSampler(core.induced(comp), k, hooks)
            if piece.total == 0:
                self.possible = False
                return
            self.pieces.append(piece)

    def draw(self, rng: random.Random) -> list[int]:
        """One uniform colouring; requires self.possible."""
        colours = [0] * self.g.n
        for comp, piece in zip(self.comps, self.pieces, strict=True):
            for v, c in zip(comp, piece.draw(rng), strict=True):
                colours[self.core[v]] = c
        for v, nb in reversed(self.peeled):
            taken = {colours[u] for u in bits(nb)}
            free = [r for r in range(1, self.k + 1) if r not in taken]
            colours[v] = free[rng.randrange(len(free))]
        return colours


def _choose(options: list[tuple[int, int]], rng: random.Random) -> int:
    """A round chosen with probability proportional to its weight."""
    total = sum(w for w, _ in options)
    x = rng.randrange(total)
    for w, r in options:
        if x < w:
            return r
        x -= w
    raise AssertionError("weights exhausted")
