"""A labelled estimate of the number of assignments when the exact count is out of reach.

Sequential importance sampling (Knuth's estimator for the size of a backtrack tree): place
the fixtures one at a time, always the most constrained one next (as in DSatur), each in a
round drawn uniformly from those still allowed; the product of the numbers of allowed
rounds is an unbiased estimate of the count (0 on a dead end), because the choice of the
next fixture depends only on the rounds given so far, so every valid assignment is exactly
one leaf of the tree. The most-constrained rule makes dead ends rare. The mean over many
draws is the value. Such weights are products of many factors, so they are strongly skewed:
the usual mean +/- 1.96 standard errors is too narrow (a sample rarely holds the rare heavy
weights), and misses almost always fall below the truth. The interval is therefore the union
of that one (its low end only when above 1) and the delta-lognormal interval for the mean
of zero-inflated positive data (log weights treated as normal, with a share of zeros): the
modified Cox interval of X.-H. Zhou and S. Gao, "Confidence intervals for the log-normal
mean", Statistics in Medicine 16 (1997), extended to zeros by L. Tian, "Inferences on the
mean of zero-inflated lognormal data", Statistics in Medicine 24 (2005). Its coverage is
measured over graphs with known counts, outside the package. The high end never exceeds the
proven bound (product of each fixture's allowed rounds); with no valid draw it is that bound
and the low end is 0.

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


CONFIDENCE = 0.95
Z = 1.959964  # the standard normal quantile of 0.975: a two-sided 95% interval
FEW_FOUND = 20  # with fewer draws than this reaching a counted leaf, the interval is not trusted


@dataclass(frozen=True)
class Estimate:
    """An estimated count: never exact; `low`/`high` an approximate 95% interval from
    `samples` draws of which `found` reached a counted leaf (0, 0 when not sampled)."""

    value: int
    low: int
    high: int
    method: str
    samples: int = 0
    found: int = 0

    @property
    def too_few(self) -> bool:
        """True when too few draws found one for the interval to mean much."""
        return 0 < self.found < FEW_FOUND or (self.found > 0 and self.low <= 1 < self.value // 100)


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
    """Mean of the draws' weights with an approximate 95% interval (the union of the normal
    and the delta-lognormal intervals), clipped to [0, ceiling] (at least 1 when some draw
    reached a counted leaf)."""
    m = len(weights)
    positive = [w for w in weights if w > 0]
    total = sum(weights)
    value = (2 * total + m) // (2 * m)
    method = f"sequential importance sampling, {m} draws, approximate 95% interval"
    if not positive:
        return Estimate(0, 0, ceiling, method, m, 0)
    low, high = _normal_interval(weights)
    lo2, hi2 = _lognormal_interval(positive, m)
    low = max(lo2 if low <= 1 else min(low, lo2), 1)  # a normal low end of 0 says nothing
    high = min(max(high, hi2), ceiling)
    return Estimate(min(max(value, low), high), low, high, method, m, len(positive))


def _normal_interval(weights: list[int]) -> tuple[int, int]:
    """Mean +/- 1.96 standard errors, in exact integer arithmetic (weights can be huge)."""
    m = len(weights)
    total = sum(weights)
    squares = sum(w * w for w in weights)
    scale = 10**6
    # (1.96 standard errors)^2 = 1.96^2 (m S2 - T^2) / (m^2 (m - 1)), in units of 1/scale.
    num = (m * squares - total * total) * 196 * 196 * scale * scale
    den = m * m * max(m - 1, 1) * 100 * 100
    spread = math.isqrt(num // den) + 1
    mean = total * scale // m
    return -(-(mean - spread) // scale), (mean + spread) // scale + 1


def _lognormal_interval(positive: list[int], m: int) -> tuple[int, int]:
    """The delta-lognormal 95% interval of the mean of m draws, `positive` their non-zero
    weights: log mean = log p + mu + s^2 / 2, its variance (1 - p) / (m p) + s^2 / n
    + s^4 / (2 (n - 1)) (Zhou and Gao 1997; Tian 2005). Computed on logs, so any size."""
    n = len(positive)
    logs = [math.log(w) for w in positive]
    mu = math.fsum(logs) / n
    s2 = math.fsum((x - mu) ** 2 for x in logs) / max(n - 1, 1)
    p = n / m
    centre = math.log(p) + mu + s2 / 2
    var = (1 - p) / (m * p) + s2 / n + s2 * s2 / (2 * max(n - 1, 1))
    half = Z * math.sqrt(var)
    return _from_log(centre - half, floor=True), _from_log(centre + half, floor=False)


def _from_log(x: float, floor: bool) -> int:
    """round(e^x) down or up as an exact integer, also far beyond the range of floats."""
    if x < 700:
        y = math.exp(x)
        return math.floor(y) if floor else math.ceil(y)
    digits = x / math.log(10)
    whole = int(digits) - 15
    lead = 10 ** (digits - whole)
    return (math.floor(lead) if floor else math.ceil(lead)) * 10**whole
