"""Is there a valid assignment with k rounds? A SAT encoding for an incremental solver.

The direct encoding of graph colouring (one variable per fixture and round; each fixture in one
of its allowed rounds; no two clashing fixtures in one round), solved by CaDiCaL through
python-sat (A. Ignatiev, A. Morgado, J. Marques-Silva, "PySAT: a Python toolkit for prototyping
with SAT oracles", SAT 2018). One solver serves every k up to `top`: round r is switched off by
assuming a selector literal, so what the solver learns at one k is kept for the next. Two
additions keep the proofs short: a largest clique is placed in rounds 1..q when every round is
interchangeable (rounds are only names), and every clique of exactly k fixtures must use each of
the k rounds (a clause per round, switched on at k only). An unsatisfiable answer is a proof
that no assignment with k rounds exists.
"""

from __future__ import annotations

import itertools

import networkx as nx
from pysat.solvers import Solver

from .graph import Graph, bits
from .hooks import Hooks

SOLVER = "cadical195"
CONFLICTS_PER_CHECK = 2000  # the solver stops this often to check the budget and cancel
CLIQUE_LIMIT = 20000  # most maximal cliques looked at for the full-clique clauses


class RoundsSat:
    """One incremental solver for `g` with rounds 1..top, fixture v allowed the rounds in
    domains[v] (bit r-1 for round r); `clique` goes to rounds 1..q when `symmetric`."""

    def __init__(self, g: Graph, top: int, domains: list[int], clique: list[int],
                 symmetric: bool, hooks: Hooks) -> None:
        self.g, self.top = g, top
        n = g.n
        self.solver = Solver(name=SOLVER)
        self.var = lambda v, r: v * top + r + 1  # r counts from 0
        self.off = [n * top + r + 1 for r in range(top)]  # assumed: round r+1 is not used
        self.next_var = n * top + top + 1
        self.full: dict[int, int] = {}  # k -> the selector of its full-clique clauses
        add = self.solver.add_clause
        for v in range(n):
            add([self.var(v, r) for r in range(top) if domains[v] >> r & 1])
            for r in range(top):
                add([-self.off[r], -self.var(v, r)])
            for u in bits(g.adj[v] >> (v + 1)):
                for r in range(top):
                    add([-self.var(v, r), -self.var(u + v + 1, r)])
            if v % 64 == 0:
                hooks.check()
        if symmetric:
            for r, v in enumerate(clique[:top]):
                add([self.var(v, r)])
        self.cliques = self._cliques(hooks)

    def _cliques(self, hooks: Hooks) -> list[list[int]]:
        """The maximal cliques of at least 3 fixtures (at most CLIQUE_LIMIT are looked at)."""
        G = nx.Graph()
        G.add_nodes_from(range(self.g.n))
        G.add_edges_from((v, u) for v in range(self.g.n) for u in bits(self.g.adj[v]) if u > v)
        out = []
        for i, q in enumerate(itertools.islice(nx.find_cliques(G), CLIQUE_LIMIT)):
            if len(q) >= 3:
                out.append(q)
            if i % 256 == 0:
                hooks.check()
        return out

    def _full_cliques(self, k: int) -> int:
        """The selector of 'each clique of k fixtures uses all k rounds', added on first use."""
        if k not in self.full:
            sel = self.next_var
            self.next_var += 1
            for q in self.cliques:
                if len(q) == k:
                    for r in range(k):
                        self.solver.add_clause([-sel] + [self.var(v, r) for v in q])
            self.full[k] = sel
        return self.full[k]

    def solve(self, k: int, hooks: Hooks) -> list[int] | None:
        """A colouring with rounds 1..k (k <= top), or None when the solver proves none exists.
        Raises BudgetExceeded or Cancelled (from hooks.check) when stopped."""
        assumptions = [self.off[r] for r in range(k, self.top)] + [self._full_cliques(k)]
        while True:
            hooks.check()
            self.solver.conf_budget(CONFLICTS_PER_CHECK)
            answer = self.solver.solve_limited(assumptions=assumptions)
            if answer is not None:
                break
        if not answer:
            return None
        model = self.solver.get_model()
        chosen = {lit for lit in model if lit > 0}
        return [next(r + 1 for r in range(k) if self.var(v, r) in chosen)
                for v in range(self.g.n)]

    def close(self) -> None:
        """Free the solver's memory."""
        self.solver.delete()
