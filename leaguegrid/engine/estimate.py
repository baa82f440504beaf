"""A labelled estimate of the number of assignments when the exact count is out of reach.

Sequential importance sampling (Knuth's estimator for the size of a backtrack tree): place
the fixtures one at a time, always the most constrained one next (as in DSatur), each in a
round drawn uniformly from those still allowed; the product of the numbers of allowed
rounds is an unbiased estimate of the count (0 on a dead end), because the choice of the
next fixture depends only on the rounds given so far, so every valid assignment is exactly
one leaf of the tree. The most-constrained rule makes dead ends rare. The mean over many
draws is the value; the interval is mean +/- 1.96 standard errors, an approximation that
can be too narrow when the weights are heavy-tailed, so it is always shown as an estimate.
The high end never exceeds the proven bound (product of each fixture's allowed rounds);
with no valid draw it is that bound and the low end is 0.

The same draws also estimate the assignments that use every round: a draw's weight counts
towards it only when its leaf uses all K rounds (the indicator is a function of the leaf,
so the estimator stays unbiased).
"""

from __future__ import annotations

import math
import random
import time
from dataclasses import dataclass

from .graph import Graph, bits
from .hooks import Hooks


def _one_draw(
    adj: list[int], domains: list[int], by_degree: list[int], rng: random.Random
) -> tuple[int, int]:
    """One path down the search tree: the most constrained fixture next (fewest allowed
    rounds, then most clashes), a round drawn uniformly from those allowed. Returns the
    product of the numbers of choices (0 at a dead end) and the rounds the leaf uses."""
    avail = list(domains)
    count = [d.bit_count() for d in domains]
    left = list(by_degree)
    w = 1
    used = 0
    while left:
        v = min(left, key=count.__getitem__)
        left.remove(v)
        a = count[v]
        if a == 0:
            return 0, used
        w *= a
        pick = rng.randrange(a)
        for r0 in bits(avail[v]):
            if pick == 0:
                bit = 1 << r0
                used |= bit
                for u in bits(adj[v]):
                    if avail[u] & bit:
                        avail[u] ^= bit
                        count[u] -= 1
                break
            pick -= 1
    return w, used


@dataclass(frozen=True)
class Estimate:
    """An estimated count: never exact; `low`/`high` an approximate 95% interval."""

    value: int
    low: int
    high: int
    method: str


def sis_draws(
    g: Graph,
    domains: list[int],
    rounds: int,
    hooks: Hooks,
    rng: random.Random,
    draws: int,
) -> tuple[list[int], list[int]]:
    """The weights of up to `draws` draws, and the same weights where the draw's leaf uses
    every one of rounds 1..`rounds` (0 elsewhere). Deterministic for a given rng seed;
    stops early (fewer draws) only when half the caller's remaining budget is spent."""
    adj = g.adj
    weights: list[int] = []
    full: list[int] = []
    every = (1 << rounds) - 1
    left = hooks.remaining()
    stop = None if left is None else time.monotonic() + left / 2
    by_degree = sorted(range(g.n), key=lambda v: -adj[v].bit_count())
    for d in range(draws):
        if d % 64 == 0:
            hooks.report(d / draws, "estimating")
            if d and stop is not None and time.monotonic() > stop:
                break
        w, used = _one_draw(adj, domains, by_degree, rng)
        weights.append(w)
        full.append(w if used & every == every else 0)
    hooks.report(1.0, "estimating")
    return weights, full


def summarise(
    weights: list[int], full: list[int], domains: list[int]
) -> tuple[Estimate, Estimate]:
    """The estimates of all colourings and of those using every round, from the draws."""
    ceiling = 1
    for d in domains:
        ceiling *= d.bit_count()
    return _summary(weights, ceiling), _summary(full, ceiling)


def _summary(weights: list[int], ceiling: int) -> Estimate:
    """Mean of the draws' weights with an approximate 95% interval, clipped to [0, ceiling]
    (at least 1 when some draw reached a counted leaf)."""
    m = len(weights)
    found = any(weights)
    total = sum(weights)
    squares = sum(w * w for w in weights)
    scale = 10**6
    # (1.96 standard errors)^2 = 1.96^2 (m S2 - T^2) / (m^2 (m - 1)), in units of 1/scale.
    num = (m * squares - total * total) * 196 * 196 * scale * scale
    den = m * m * max(m - 1, 1) * 100 * 100
    spread = math.isqrt(num // den) + 1
    mean = total * scale // m
    value = (2 * total + m) // (2 * m)
    low = max(-(-(mean - spread) // scale), 1 if found else 0)
    high = min((mean + spread) // scale + 1, ceiling) if found else ceiling
    return Estimate(
        value=value,
        low=low,
        high=high,
        method=f"sequential importance sampling, {m} draws, approximate 95% interval",
    )
