"""Exact counts of the engine's own graphs: exact reductions first (reductions.py), then
the frontier programme on each irreducible piece with the best order found."""

from __future__ import annotations

import math

from flint import fmpz_poly

from .falling import falling, falling_poly
from .frontier import count_many, count_polynomial
from .graph import Graph
from .hooks import Hooks
from .orders import PartitionBounds, best_order, frontier_sizes, score
from .parallel import solve_pieces
from .reductions import plan


def _shares(parts: list[Graph]) -> list[float]:
    """Progress shares of the pieces, by a rough cost weight."""
    w = [float(2 ** min(p.n, 60) if p.n > 40 else p.n * p.n + p.edges()) for p in parts]
    total = sum(w) or 1.0
    return [x / total for x in w]


def polynomial(g: Graph, hooks: Hooks, reduce: bool = True) -> fmpz_poly:
    """P(g, x); `reduce=False` skips the reductions (for cross-checks)."""
    if g.loop and g.n:
        return fmpz_poly([])
    if not reduce:
        if g.n == 0:
            return fmpz_poly([1])
        return count_polynomial(g, best_order(g, None, hooks.check), hooks)
    p = plan(g)
    result = fmpz_poly([1])
    for d in p.linear:
        result *= fmpz_poly([-d, 1])
    orders = [best_order(part, None, hooks.check) for part in p.pieces]
    bounds = PartitionBounds()
    scores = [score(frontier_sizes(q, o), None, bounds)
              for q, o in zip(p.pieces, orders, strict=True)]
    got = solve_pieces("poly", p.pieces, orders, scores, None, hooks, _shares(p.pieces))
    for piece_poly in got:
        result *= piece_poly
    for s in p.divisors:
        result, rem = divmod(result, falling_poly(s))
        assert rem == 0, "clique separator division is exact"
    return result


def value(g: Graph, k: int, hooks: Hooks, reduce: bool = True) -> int:
    """P(g, k) as an exact integer; `reduce=False` skips the reductions."""
    return values(g, [k], hooks, reduce)[0]


def values(g: Graph, ks: list[int], hooks: Hooks, reduce: bool = True) -> list[int]:
    """P(g, k) for each k in ks, in one pass of the programme per piece.

    Values are remembered in the hooks' memo (per piece and k), so that a table of counts
    asked for one number at a time under one Memo does not repeat work."""
    if g.loop and g.n:
        return [0] * len(ks)
    if not reduce:
        return [_values(g, [k], hooks, reduce=False)[0] for k in ks]
    key = tuple(g.adj)
    known = hooks.memo.known(key, set(ks))
    todo = sorted(set(ks) - set(known))
    if todo:
        got = dict(zip(todo, _values(g, todo, hooks, reduce), strict=True))
        hooks.memo.remember(key, got)
        known.update(got)
    return [known[k] for k in ks]


def _values(g: Graph, ks: list[int], hooks: Hooks, reduce: bool) -> list[int]:
    """P(g, k) for each k in ks (sorted, distinct), computed."""
    out = {k: (1 if g.n == 0 else 0) for k in ks if k <= 0}
    live = [k for k in ks if k > 0]
    if not live or g.n == 0:
        return [out.get(k, 1) for k in ks]
    if not reduce:
        got = count_many(g, best_order(g, max(live), hooks.check), live, hooks)
        out.update(zip(live, got, strict=True))
        return [out[k] for k in ks]
    p = plan(g)
    bound = p.clique_bound()
    for k in live:
        if k < bound:
            out[k] = 0
    live = [k for k in live if k >= bound]
    result = {k: math.prod(k - d for d in p.linear) for k in live}
    if not live:
        return [out[k] for k in ks]
    pieces = sorted(p.pieces, key=lambda q: q.n)  # cheap pieces first: zeros end early
    kind, param = ("at", live[0]) if len(live) == 1 else ("many", live)
    orders = [best_order(part, max(live), hooks.check) for part in pieces]
    bounds = PartitionBounds()
    scores = [score(frontier_sizes(q, o), max(live), bounds)
              for q, o in zip(pieces, orders, strict=True)]

    def all_zero(got: object) -> bool:
        return not any(got if isinstance(got, list) else [got])

    got = solve_pieces(kind, pieces, orders, scores, param, hooks, _shares(pieces), all_zero)
    if any(all_zero(x) for x in got if x is not None):
        got = [[0] * len(live)]
    for piece_counts in got:
        counts = piece_counts if isinstance(piece_counts, list) else [piece_counts]
        for k, v in zip(live, counts, strict=True):
            result[k] *= v
    for k, v in result.items():
        for s in p.divisors:
            v //= falling(k, s)
        out[k] = v
    return [out[k] for k in ks]
