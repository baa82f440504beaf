"""Exact counts of the engine's own graphs: exact reductions first (reductions.py), then
the frontier programme on each irreducible piece with the best order found."""

from __future__ import annotations

from flint import fmpz_poly

from .falling import falling, falling_poly
from .frontier import count_at, count_polynomial
from .graph import Graph
from .hooks import Ticker
from .orders import best_order
from .reductions import plan


def _shares(parts: list[Graph]) -> list[float]:
    """Progress shares of the pieces, by a rough cost weight."""
    w = [float(2 ** min(p.n, 60) if p.n > 40 else p.n * p.n + p.edges()) for p in parts]
    total = sum(w) or 1.0
    return [x / total for x in w]


def polynomial(g: Graph, ticker: Ticker, reduce: bool = True) -> fmpz_poly:
    """P(g, x); `reduce=False` skips the reductions (for cross-checks)."""
    if g.loop and g.n:
        return fmpz_poly([])
    if not reduce:
        return count_polynomial(g, best_order(g), ticker) if g.n else fmpz_poly([1])
    p = plan(g)
    result = fmpz_poly([1])
    for d in p.linear:
        result *= fmpz_poly([-d, 1])
    pos = 0.0
    for part, share in zip(p.pieces, _shares(p.pieces), strict=True):
        with ticker.window(pos, pos + share):
            result *= count_polynomial(part, best_order(part), ticker)
        pos += share
    for s in p.divisors:
        result, rem = divmod(result, falling_poly(s))
        assert rem == 0, "clique separator division is exact"
    return result


def value(g: Graph, k: int, ticker: Ticker, reduce: bool = True) -> int:
    """P(g, k) as an exact integer; `reduce=False` skips the reductions."""
    if g.loop and g.n:
        return 0
    if k <= 0:
        return 1 if g.n == 0 else 0
    if not reduce:
        return count_at(g, best_order(g, k), k, ticker) if g.n else 1
    p = plan(g)
    if p.clique_bound() > k:
        return 0
    result = 1
    for d in p.linear:
        result *= k - d
    pos = 0.0
    pieces = sorted(p.pieces, key=lambda q: q.n)  # cheap pieces first: a zero ends early
    for part, share in zip(pieces, _shares(pieces), strict=True):
        with ticker.window(pos, pos + share):
            result *= count_at(part, best_order(part, k), k, ticker)
        pos += share
        if result == 0:
            return 0
    for s in p.divisors:
        result //= falling(k, s)
    return result
