"""The fewest rounds with a proof on each side, by a portfolio of exact and heuristic methods.

Lower side: a largest clique (max_clique) or the largest pinned round, then for each k from
there a proof that k rounds are too few: DSatur backtracking while it stays small, else the SAT
encoding (rounds_sat). Upper side: a schedule found by a DSatur pass, improved by tabu search
(tabucol), or the schedule that an exact method found. Measured against each other in the
benchmark results ("Fewest rounds on DIMACS colouring graphs").
"""

from __future__ import annotations

from dataclasses import dataclass

from .chromatic_number import (
    MAX_SEARCH,
    domains_for,
    find_assignment,
    greedy_assignment,
    max_clique,
)
from .graph import Graph
from .hooks import BudgetExceeded, Hooks
from .rounds_sat import RoundsSat
from .tabucol import tabucol

SEARCH_NODES = 1000  # DSatur backtracking nodes per k before the SAT solver takes over
TABU_MOVES = 100  # tabu search moves per fixture, per number of rounds tried (2,000 to 50,000)
TABU_SHARE = 0.25  # at most this share of the time left goes to tabu search
TABU_SEED = 20260  # a fixed seed: the same league gives the same schedule every time


@dataclass
class Bounds:
    """Proven bounds on the fewest rounds; `colouring` has `high` rounds (1-based rounds per
    vertex); `low_method` says why low - 1 rounds are too few ("clique", "pin", "search" or
    "sat"), `high_method` who found the colouring ("dsatur", "tabucol", "search" or "sat")."""

    low: int
    high: int
    low_method: str
    high_method: str
    colouring: list[int]
    clique: list[int]

    @property
    def exact(self) -> bool:
        return self.low == self.high


def special_rounds(k: int, ip: dict[int, int], ie: dict[int, set[int]]) -> int:
    """Bitmask of rounds (bit r-1) that pins or exclusions single out."""
    out = 0
    for r in ip.values():
        if r <= k:
            out |= 1 << (r - 1)
    for rs in ie.values():
        for r in rs:
            if r <= k:
                out |= 1 << (r - 1)
    return out


def fewest_bounds(g: Graph, ip: dict[int, int], ie: dict[int, set[int]], hooks: Hooks,
                  partial: bool) -> Bounds:
    """The bounds reached within the budget (exact when they meet). With `partial` False a
    budget that runs out raises BudgetExceeded instead of returning open bounds."""
    clique = max_clique(g, hooks)
    top_pin = max(ip.values(), default=0)
    low = max(len(clique), top_pin, 1)
    low_method = "clique" if len(clique) == low else "pin"
    # a bounded number of passes, so only a cancel stops it: the bounds always have an upper side
    high, colouring = greedy_assignment(g, lambda k: domains_for(g.n, k, ip, ie),
                                        Hooks(cancel=hooks.cancel), start=low)
    out = Bounds(low, max(high, low), low_method, "dsatur", colouring, clique)
    if out.high == low:  # the pass used no more rounds than the lower bound: exact
        return out
    try:
        _tabu(g, ip, ie, out, hooks)
        _exact(g, ip, ie, out, hooks)
    except BudgetExceeded:
        if not partial:
            raise
    return out


def _tabu(g: Graph, ip: dict[int, int], ie: dict[int, set[int]], out: Bounds,
          hooks: Hooks) -> None:
    """Tabu search for schedules with fewer rounds than `out.high`, one round fewer at a time."""
    part = hooks.part(share=TABU_SHARE)
    while out.high > out.low:
        k = out.high - 1
        doms = domains_for(g.n, k, ip, ie)
        try:
            found = None if doms is None else tabucol(
                g, k, doms, part, moves=min(max(TABU_MOVES * g.n, 2000), 50000), seed=TABU_SEED)
        except BudgetExceeded:
            hooks.check()  # the whole budget, not only the tabu share, may be gone
            return
        if found is None:
            return
        out.high, out.colouring, out.high_method = k, found, "tabucol"


def _exact(g: Graph, ip: dict[int, int], ie: dict[int, set[int]], out: Bounds,
           hooks: Hooks) -> None:
    """Settle each k from `out.low` up: a small DSatur search, else the SAT solver."""
    sat: RoundsSat | None = None
    try:
        while out.low < out.high:
            hooks.check()
            k = out.low
            doms = domains_for(g.n, k, ip, ie)
            if doms is None:  # a pin beyond k rounds
                out.low, out.low_method = k + 1, "pin"
                continue
            special = special_rounds(k, ip, ie)
            symmetric = not special_rounds(out.high, ip, ie)
            if symmetric:  # rounds are only names: the clique takes rounds 1..q
                for r, v in enumerate(out.clique):
                    doms[v] = 1 << r
                special = (1 << len(out.clique)) - 1
            try:
                if g.n > MAX_SEARCH:
                    raise StopIteration
                found = find_assignment(g, k, doms, hooks, special, node_limit=SEARCH_NODES)
                method = "search"
            except StopIteration:
                if sat is None:
                    top = out.high - 1
                    sat = RoundsSat(g, top, domains_for(g.n, top, ip, ie), out.clique,
                                    symmetric, hooks)
                found = sat.solve(k, hooks)
                method = "sat"
            if found is None:
                out.low, out.low_method = k + 1, method
            else:
                out.high, out.colouring, out.high_method = k, found, method
    finally:
        if sat is not None:
            sat.close()
