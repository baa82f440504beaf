"""Exact counts of the engine's own graphs: split into independent pieces, then the
frontier programme on each piece."""

from __future__ import annotations

from flint import fmpz_poly

from .frontier import count_at, count_polynomial
from .graph import Graph, components
from .hooks import Ticker
from .orders import best_order

X = fmpz_poly([0, 1])


def pieces(g: Graph) -> tuple[int, list[Graph]]:
    """Isolated vertices (each a factor k) and the other connected components."""
    isolated = 0
    out = []
    for comp in components(g):
        if len(comp) == 1:
            isolated += 1
        else:
            out.append(g.induced(comp))
    return isolated, out


def _shares(parts: list[Graph]) -> list[float]:
    """Progress shares of the pieces, by a rough cost weight."""
    w = [float(p.n * p.n + p.edges()) for p in parts]
    total = sum(w) or 1.0
    return [x / total for x in w]


def polynomial(g: Graph, ticker: Ticker) -> fmpz_poly:
    """P(g, x)."""
    if g.loop:
        return fmpz_poly([])
    isolated, parts = pieces(g)
    result = X**isolated
    pos = 0.0
    for part, share in zip(parts, _shares(parts), strict=True):
        with ticker.window(pos, pos + share):
            result *= piece_polynomial(part, ticker)
        pos += share
    return result


def piece_polynomial(g: Graph, ticker: Ticker) -> fmpz_poly:
    """P(g, x) of one connected piece."""
    return count_polynomial(g, best_order(g), ticker)


def value(g: Graph, k: int, ticker: Ticker) -> int:
    """P(g, k) as an exact integer."""
    if g.loop and g.n:
        return 0
    if k <= 0:
        return 1 if g.n == 0 else 0
    isolated, parts = pieces(g)
    result = k**isolated
    pos = 0.0
    for part, share in zip(parts, _shares(parts), strict=True):
        with ticker.window(pos, pos + share):
            result *= piece_value(part, k, ticker)
        pos += share
        if result == 0:
            break
    return result


def piece_value(g: Graph, k: int, ticker: Ticker) -> int:
    """P(g, k) of one connected piece."""
    return count_at(g, best_order(g, k), k, ticker)
