"""A cost estimate before any exact work: the largest state table and the seconds expected.

After the exact reductions, the frontier programme is probed on each piece with a small
cap on work. A probe that finishes gives the exact table sizes; one that stops early is
extrapolated with the partition bound (at most Bell(w) states for a frontier of w
fixtures, or the partitions into at most k classes at fixed k), scaled by how far below
that bound the probed layers stayed. Seconds come from the probe's own speed. Always an
estimate.
"""

from __future__ import annotations

import time
from dataclasses import dataclass

import networkx as nx

from .frontier import State, step_masks, successors
from .graph import Graph, from_networkx
from .hooks import Ticker
from .orders import best_order, frontier_sizes, partitions_bound
from .reductions import plan

PROBE_STATES = 30_000
POLY_FACTOR = 2.5  # polynomial weights cost about this much more than integer weights


@dataclass(frozen=True)
class Cost:
    """Estimated largest number of live states and seconds for the exact work."""

    states: int
    seconds: float


def piece_cost(g: Graph, k: int | None, ticker: Ticker) -> tuple[int, float]:
    """(largest layer, seconds) for one connected piece."""
    order = best_order(g, k, ticker.check)
    steps = step_masks(g, order)
    widths = frontier_sizes(g, order)
    kk = k if k is not None else g.n + 1
    layer: set[State] = {()}
    largest = 1
    work = 0
    start = time.perf_counter()
    done_steps = 0
    for vb, nb in steps:
        nxt: set[State] = set()
        for state in layer:
            for ns, _ in successors(state, vb, nb, kk):
                nxt.add(ns)
        work += len(layer)
        layer = nxt
        largest = max(largest, len(layer))
        done_steps += 1
        ticker.check()
        if work > PROBE_STATES:
            break
    elapsed = time.perf_counter() - start
    rate = elapsed / max(work, 1)
    if done_steps < len(steps):
        w_last = widths[done_steps - 1]
        scale = len(layer) / max(partitions_bound(w_last, k), 1)
        rest = [max(1, int(scale * partitions_bound(w, k))) for w in widths[done_steps:]]
        largest = max(largest, *rest)
        work += sum(rest)
    factor = POLY_FACTOR if k is None else 1.0
    return largest, work * rate * factor


def estimate_cost(G: nx.Graph, k: int | None = None) -> Cost:
    """Estimated cost of the exact polynomial (k None) or of the count at k rounds."""
    g, _ = from_networkx(G)
    ticker = Ticker()
    parts = plan(g).pieces
    largest = 1
    seconds = 0.0
    for part in parts:
        s, t = piece_cost(part, k, ticker)
        largest = max(largest, s)
        seconds += t
    return Cost(states=largest, seconds=seconds)
