"""The frontier dynamic programme over a vertex order.

A state describes the rounds that still matter for the fixtures not yet placed: for each
round in use by a placed fixture that clashes with an unplaced one, the set of unplaced
fixtures it rules out (a bitmask). Rounds with the same set are interchangeable, so a state
is the sorted tuple of these sets (a multiset). Placing fixture v either joins a round
whose set does not hold v (one way per round) or opens a round not in the state
(k - b ways, b = rounds in the state). This is the partition-of-the-frontier programme
with partitions that no later step can tell apart merged into one state.
"""

from __future__ import annotations

from flint import fmpz_poly

from .graph import Graph
from .hooks import Ticker

State = tuple[int, ...]
CHECK_EVERY = 2048


def _step_masks(g: Graph, order: list[int]) -> list[tuple[int, int]]:
    """For each step: v's bit and v's neighbours among the vertices placed after v."""
    rest = 0
    for v in order:
        rest |= 1 << v
    out = []
    for v in order:
        vb = 1 << v
        rest &= ~vb
        out.append((vb, g.adj[v] & rest))
    return out


def successors(state: State, vb: int, nb: int, k: int) -> list[tuple[State, int]]:
    """The states reachable by placing v (bit `vb`, later neighbours `nb`) with k rounds,
    each with the number of rounds that lead there (new rounds counted k - b)."""
    base: list[int] = []
    joinable: list[int] = []
    for f in state:
        if f & vb:
            f2 = f ^ vb
            if f2:
                base.append(f2)
        else:
            joinable.append(len(base))
            base.append(f)
    out: list[tuple[State, int]] = []
    b = len(state)
    if b < k:
        ns = tuple(sorted([*base, nb])) if nb else tuple(sorted(base))
        if _alive(ns, k):
            out.append((ns, k - b))
    prev = -1
    for i in joinable:
        f = base[i]
        if f == prev:
            continue
        prev = f
        mult = state.count(f)
        nbase = base[:]
        nbase[i] = f | nb
        ns = tuple(sorted(nbase))
        if _alive(ns, k):
            out.append((ns, mult))
    return out


def _alive(state: State, k: int) -> bool:
    """False when k rounds are all in use and some unplaced fixture is ruled out of all."""
    if len(state) < k:
        return True
    common = -1
    for f in state:
        common &= f
    return common == 0


def count_polynomial(g: Graph, order: list[int], ticker: Ticker) -> fmpz_poly:
    """P(g, x) for a graph with no self-loop, by the frontier programme over `order`."""
    n = len(order)
    lin = [fmpz_poly([-b, 1]) for b in range(n + 1)]
    layer: dict[State, fmpz_poly] = {(): fmpz_poly([1])}
    tick = 0
    for step, (vb, nb) in enumerate(_step_masks(g, order)):
        ticker.report(step / n, "counting")
        new: dict[State, fmpz_poly] = {}
        get = new.get
        for state, w in layer.items():
            tick += 1
            if tick % CHECK_EVERY == 0:
                ticker.check()
            base: list[int] = []
            joinable: list[int] = []
            for f in state:
                if f & vb:
                    f2 = f ^ vb
                    if f2:
                        base.append(f2)
                else:
                    joinable.append(len(base))
                    base.append(f)
            ns = tuple(sorted([*base, nb])) if nb else tuple(sorted(base))
            ww = w * lin[len(state)]
            old = get(ns)
            new[ns] = ww if old is None else old + ww
            prev = -1
            for i in joinable:
                f = base[i]
                if f == prev:
                    continue
                prev = f
                nbase = base[:]
                nbase[i] = f | nb
                ns = tuple(sorted(nbase))
                mult = state.count(f)
                ww = w * mult if mult > 1 else w
                old = get(ns)
                new[ns] = ww if old is None else old + ww
        layer = new
    ticker.report(1.0, "counting")
    return layer[()]


def count_at(g: Graph, order: list[int], k: int, ticker: Ticker) -> int:
    """P(g, k) as an exact integer; states needing more than k rounds are dropped."""
    n = len(order)
    if k <= 0:
        return 1 if n == 0 else 0
    layer: dict[State, int] = {(): 1}
    tick = 0
    for step, (vb, nb) in enumerate(_step_masks(g, order)):
        ticker.report(step / n, "counting")
        new: dict[State, int] = {}
        get = new.get
        for state, w in layer.items():
            tick += 1
            if tick % CHECK_EVERY == 0:
                ticker.check()
            base: list[int] = []
            joinable: list[int] = []
            for f in state:
                if f & vb:
                    f2 = f ^ vb
                    if f2:
                        base.append(f2)
                else:
                    joinable.append(len(base))
                    base.append(f)
            b = len(state)
            if b < k:
                ns = tuple(sorted([*base, nb])) if nb else tuple(sorted(base))
                if len(ns) < k or _alive(ns, k):
                    ww = w * (k - b)
                    old = get(ns)
                    new[ns] = ww if old is None else old + ww
            prev = -1
            for i in joinable:
                f = base[i]
                if f == prev:
                    continue
                prev = f
                nbase = base[:]
                nbase[i] = f | nb
                ns = tuple(sorted(nbase))
                if len(ns) == k and not _alive(ns, k):
                    continue
                mult = state.count(f)
                ww = w * mult if mult > 1 else w
                old = get(ns)
                new[ns] = ww if old is None else old + ww
        layer = new
        if not layer:
            ticker.report(1.0, "counting")
            return 0
    ticker.report(1.0, "counting")
    return layer.get((), 0)


def completion_tables(
    g: Graph, order: list[int], k: int, ticker: Ticker
) -> list[dict[State, int]]:
    """For each step i, the states before placing order[i] mapped to their number of
    completions with k rounds (only states that have at least one); the last table is
    the finished state. Used for exactly uniform draws."""
    steps = _step_masks(g, order)
    n = len(order)
    layers: list[set[State]] = [{()}]
    tick = 0
    for step, (vb, nb) in enumerate(steps):
        ticker.report(0.5 * step / max(n, 1), "sampling tables")
        nxt: set[State] = set()
        for state in layers[-1]:
            tick += 1
            if tick % CHECK_EVERY == 0:
                ticker.check()
            for ns, _ in successors(state, vb, nb, k):
                nxt.add(ns)
        layers.append(nxt)
    tables: list[dict[State, int]] = [{} for _ in layers]
    if () in layers[-1]:
        tables[-1][()] = 1
    for i in range(n - 1, -1, -1):
        ticker.report(0.5 + 0.5 * (n - i) / max(n, 1), "sampling tables")
        vb, nb = steps[i]
        after = tables[i + 1]
        here: dict[State, int] = {}
        for state in layers[i]:
            tick += 1
            if tick % CHECK_EVERY == 0:
                ticker.check()
            total = 0
            for ns, mult in successors(state, vb, nb, k):
                c = after.get(ns)
                if c:
                    total += mult * c
            if total:
                here[state] = total
        tables[i] = here
    return tables
