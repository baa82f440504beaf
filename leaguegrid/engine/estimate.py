"""A labelled estimate of the number of assignments when the exact count is out of reach.

Sequential importance sampling (Knuth's estimator for backtrack trees, used for colourings
as in Rosenbluth-style sampling): place the fixtures in a fixed order, each in a round drawn
uniformly from those still allowed; the product of the numbers of allowed rounds is an
unbiased estimate of the count (0 on a dead end). The mean over many draws is the value;
the interval is mean +/- 1.96 standard errors, an approximation that can be too narrow when
the weights are heavy-tailed, so it is always shown as an estimate. The high end never
exceeds the proven bound (product of each fixture's allowed rounds); with no valid draw
it is that bound and the low end is 0.
"""

from __future__ import annotations

import math
import random
import time
from dataclasses import dataclass

from .graph import Graph, bits
from .hooks import Ticker
from .orders import greedy_order


@dataclass(frozen=True)
class Estimate:
    """An estimated count: never exact; `low`/`high` an approximate 95% interval."""

    value: int
    low: int
    high: int
    method: str


def sis_estimate(
    g: Graph,
    domains: list[int],
    ticker: Ticker,
    rng: random.Random,
    draws: int = 2000,
) -> Estimate:
    """Estimate the number of colourings of g within `domains` (bit r-1 = round r allowed).

    Deterministic for a given rng seed; stops early (fewer draws) only when the caller's
    budget is nearly spent."""
    order = greedy_order(g)
    adj = g.adj
    n = g.n
    weights: list[int] = []
    found = False
    left = ticker.remaining()
    stop = None if left is None else time.monotonic() + left / 2
    colour = [0] * n
    for d in range(draws):
        if d % 64 == 0:
            ticker.report(d / draws, "estimating")
            if d and stop is not None and time.monotonic() > stop:
                break
        w = 1
        for v in order:
            used = 0
            for u in bits(adj[v]):
                c = colour[u]
                if c:
                    used |= 1 << (c - 1)
            avail = domains[v] & ~used
            a = avail.bit_count()
            if a == 0:
                w = 0
                break
            w *= a
            pick = rng.randrange(a)
            for r0 in bits(avail):
                if pick == 0:
                    colour[v] = r0 + 1
                    break
                pick -= 1
        for v in order:
            colour[v] = 0
        if w:
            found = True
        weights.append(w)
    m = len(weights)
    total = sum(weights)
    squares = sum(w * w for w in weights)
    scale = 10**6
    # (1.96 standard errors)^2 = 1.96^2 (m S2 - T^2) / (m^2 (m - 1)), in units of 1/scale.
    num = (m * squares - total * total) * 196 * 196 * scale * scale
    den = m * m * max(m - 1, 1) * 100 * 100
    spread = math.isqrt(num // den) + 1
    mean = total * scale // m
    ceiling = 1
    for d in domains:
        ceiling *= d.bit_count()
    value = (2 * total + m) // (2 * m)
    low = max(-(-(mean - spread) // scale), 1 if found else 0)
    high = min((mean + spread) // scale + 1, ceiling) if found else ceiling
    ticker.report(1.0, "estimating")
    return Estimate(
        value=value,
        low=low,
        high=high,
        method=f"sequential importance sampling, {m} draws, approximate 95% interval",
    )
