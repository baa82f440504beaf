"""A cost estimate before any exact work: the largest state table and the seconds expected.

After the exact reductions, the frontier programme is probed on each piece with a small
cap on work. A probe that finishes gives the exact table sizes; one that stops early is
extrapolated with the partition bound (at most Bell(w) states for a frontier of w
fixtures, or the partitions into at most k classes at fixed k): the probed sizes are fitted
as a power of that bound and the fit predicts the later steps. Seconds come from the
probe's own speed. Always an estimate: on the benchmark graphs it is within a factor of
about 3 where the probe reaches the largest tables, and can be 10-1000 times too high
where it has to extrapolate far (dense symmetric graphs).
"""

from __future__ import annotations

import math
import time
from dataclasses import dataclass

import networkx as nx

from .frontier import State, step_masks, successors
from .graph import Graph, from_networkx
from .hooks import Hooks
from .orders import PartitionBounds, best_order, frontier_sizes
from .reductions import plan

PROBE_STATES = 30_000
POLY_FACTOR = 1.5  # packed polynomial weights cost about this much more than integers


@dataclass(frozen=True)
class Cost:
    """Estimated largest number of live states and seconds for the exact work."""

    states: int
    seconds: float


def piece_cost(g: Graph, k: int | None, hooks: Hooks) -> tuple[int, float]:
    """(largest layer, seconds) for one connected piece."""
    order = best_order(g, k, hooks.check)
    steps = step_masks(g, order)
    widths = frontier_sizes(g, order)
    kk = k if k is not None else g.n + 1
    layer: set[State] = {()}
    sizes: list[int] = []
    work = 0
    start = time.perf_counter()
    for vb, nb in steps:
        nxt: set[State] = set()
        for state in layer:
            for ns, _ in successors(state, vb, nb, kk):
                nxt.add(ns)
        work += len(layer)
        layer = nxt
        sizes.append(len(layer))
        hooks.check()
        if work > PROBE_STATES:
            break
    elapsed = time.perf_counter() - start
    rate = elapsed / max(work, 1)
    if len(sizes) < len(steps):
        bounds = PartitionBounds()
        rest = _extrapolate(sizes, [bounds(w, k) for w in widths])
        sizes += rest
        work += sum(rest)
    factor = POLY_FACTOR if k is None else 1.0
    return max(sizes, default=1), work * rate * factor


def _extrapolate(sizes: list[int], bounds: list[int]) -> list[int]:
    """Table sizes for the steps not probed: the probed sizes follow roughly a power of the
    partition bound (sizes ~ C bound^beta, beta fitted on the probed steps, kept in
    [0.3, 1]); the later steps are predicted from their bounds."""
    pts = [
        (math.log(b), math.log(s))
        for s, b in zip(sizes, bounds, strict=False)
        if s >= 2 and b >= 2
    ]
    beta = 1.0
    if len(pts) >= 3:
        mx = sum(x for x, _ in pts) / len(pts)
        my = sum(y for _, y in pts) / len(pts)
        sxx = sum((x - mx) ** 2 for x, _ in pts)
        if sxx > 0:
            beta = sum((x - mx) * (y - my) for x, y in pts) / sxx
    beta = min(max(beta, 0.3), 1.0)
    last = len(sizes) - 1
    base_b = max(bounds[last], 1)
    return [
        max(1, int(sizes[last] * math.exp(beta * (math.log(max(b, 1)) - math.log(base_b)))))
        for b in bounds[last + 1 :]
    ]


def estimate_cost(G: nx.Graph, k: int | None = None) -> Cost:
    """Estimated cost of the exact polynomial (k None) or of the count at k rounds."""
    g, _ = from_networkx(G)
    hooks = Hooks()
    parts = plan(g).pieces
    largest = 1
    seconds = 0.0
    for part in parts:
        s, t = piece_cost(part, k, hooks)
        largest = max(largest, s)
        seconds += t
    return Cost(states=largest, seconds=seconds)
