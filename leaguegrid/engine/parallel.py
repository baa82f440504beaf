"""Independent work on both cores: pieces of a graph, and estimate draws.

After the reductions a graph may fall into several irreducible pieces whose programmes do
not interact. When at least two of them are heavy (by the order score), the heaviest is
computed in a child process while this process does the others. The draws of an estimate
(estimate.py) are independent too: on large graphs half of them run in a child process
with its own seed, so that a budget buys twice the draws. The parent checks cancel and
budget while it waits and kills the child when it stops; the child keeps half the memory
bound. Set LEAGUEGRID_ENGINE_PROCESSES=1 to keep everything in one process.

(Splitting one programme's layers between two processes was measured and rejected: the
exchange of states after every step cost as much CPU as it saved.)
"""

from __future__ import annotations

import multiprocessing as mp
import os
import random
import threading
from collections.abc import Callable
from multiprocessing.connection import Connection

from flint import fmpz_poly

from .estimate import sis_draws
from .graph import Graph
from .hooks import BudgetExceeded, Hooks, MemoryBound

ENV = "LEAGUEGRID_ENGINE_PROCESSES"
PARALLEL_SCORE = 10**9  # order score from which a piece is worth a second process
SIS_PARALLEL_FROM = 40  # fixtures from which an estimate's draws are shared with a child
SIS_DRAWS = 2000


def available() -> bool:
    """True when a second process may be used."""
    if os.environ.get(ENV, "") == "1" or (os.cpu_count() or 1) < 2:
        return False
    return not mp.current_process().daemon


def _compute(kind: str, g: Graph, order: list[int], param, hooks: Hooks):
    from .frontier import count_at, count_many, count_polynomial

    if kind == "sis":
        domains, rounds, seed, draws = param
        return sis_draws(g, domains, rounds, hooks, random.Random(seed), draws)
    if kind == "poly":
        return count_polynomial(g, order, hooks)
    if kind == "at":
        return count_at(g, order, param, hooks)
    return count_many(g, order, param, hooks)


def _work(conn: Connection, kind: str, adj: list[int], order: list[int], param, left) -> None:
    """The child's side: compute one piece and send back ("ok", result) or the failure."""
    from . import frontier

    frontier.MEMORY_BYTES //= 2
    frontier.RESIDENT_GROWTH //= 2
    try:
        out = _compute(kind, Graph(adj), order, param, Hooks(budget=left))
        if isinstance(out, fmpz_poly):
            out = [int(c) for c in out.coeffs()]
        conn.send(("ok", out))
    except MemoryBound as exc:
        conn.send(("memory", str(exc)))
    except BudgetExceeded as exc:
        conn.send(("budget", str(exc)))
    except Exception as exc:  # reported to the parent, which raises it there
        conn.send(("error", repr(exc)))
    conn.close()


class Background:
    """One piece computed in a child process."""

    def __init__(self, kind: str, g: Graph, order: list[int], param, left: float | None):
        self.kind = kind
        ctx = mp.get_context("fork" if threading.active_count() == 1 else "forkserver")
        self.conn, child = ctx.Pipe(duplex=False)
        self.proc = ctx.Process(
            target=_work, args=(child, kind, g.adj, order, param, left), daemon=True
        )
        self.proc.start()
        child.close()

    def result(self, hooks: Hooks):
        """Wait for the child's answer, checking cancel and budget meanwhile."""
        while not self.conn.poll(0.05):
            hooks.check()
            if not self.proc.is_alive() and not self.conn.poll(0):
                raise RuntimeError("the engine's second process stopped without an answer")
        status, payload = self.conn.recv()
        if status == "memory":
            raise MemoryBound(payload)
        if status == "budget":
            raise BudgetExceeded(payload)
        if status != "ok":
            raise RuntimeError(f"the engine's second process failed: {payload}")
        return fmpz_poly(payload) if self.kind == "poly" else payload

    def close(self) -> None:
        """Stop the child if it is still running and release the pipe."""
        if self.proc.is_alive():
            self.proc.kill()
        self.proc.join(timeout=5)
        self.conn.close()


def solve_pieces(
    kind: str,
    parts: list[Graph],
    orders: list[list[int]],
    scores: list[int],
    param: object,
    hooks: Hooks,
    shares: list[float],
    stop_early: Callable[[object], bool] = lambda _: False,
) -> list:
    """Each piece's result (kind "poly", "at" or "many"), the heaviest piece in a second
    process when two or more pieces are heavy. `stop_early(result)` true after a piece
    computed here (e.g. a zero count) skips the remaining local pieces (their results are
    then None)."""
    heavy = [i for i, s in enumerate(scores) if s >= PARALLEL_SCORE]
    back = None
    outside = -1
    if len(heavy) >= 2 and available():
        outside = max(heavy, key=lambda i: scores[i])
        back = Background(kind, parts[outside], orders[outside], param, hooks.remaining())
    results: list = [None] * len(parts)
    try:
        pos = 0.0
        for i, part in enumerate(parts):
            if i == outside:
                continue
            with hooks.window(pos, pos + shares[i]):
                results[i] = _compute(kind, part, orders[i], param, hooks)
            pos += shares[i]
            if stop_early(results[i]):
                return results
        if back is not None:
            results[outside] = back.result(hooks)
    finally:
        if back is not None:
            back.close()
    return results


def estimate_draws(
    g: Graph, domains: list[int], rounds: int, hooks: Hooks, draws: int = SIS_DRAWS
) -> tuple[list[int], list[int]]:
    """The draws of an estimate (estimate.sis_draws, seed 0); on graphs of SIS_PARALLEL_FROM
    fixtures or more, half of them in a second process with seed 1."""
    if g.n < SIS_PARALLEL_FROM or not available():
        return sis_draws(g, domains, rounds, hooks, random.Random(0), draws)
    half = draws // 2
    back = Background("sis", g, [], (domains, rounds, 1, half), hooks.remaining())
    try:
        weights, full = sis_draws(g, domains, rounds, hooks, random.Random(0), draws - half)
        try:
            more, more_full = back.result(hooks)
        except BudgetExceeded:  # the second process is late: this process's draws suffice
            more, more_full = [], []
    finally:
        back.close()
    return weights + more, full + more_full
