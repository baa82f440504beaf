"""The frontier dynamic programme over a vertex order.

A state describes the rounds that still matter for the fixtures not yet placed: for each
round in use by a placed fixture that clashes with an unplaced one, the set of unplaced
fixtures it rules out (a bitmask). Rounds with the same set are interchangeable, so a state
is the sorted tuple of these sets (a multiset). Placing fixture v either joins a round
whose set does not hold v (one way per round) or opens a round not in the state
(k - b ways, b = rounds in the state). This is the partition-of-the-frontier programme
with partitions that no later step can tell apart merged into one state.

The step functions (`advance_packed`, `advance_at`, `advance_many`) share their shape but not
their weight arithmetic; they are written out one by one because they are the innermost loop
of every count, where a shared helper would add a call per state.
"""

from __future__ import annotations

import math
from collections.abc import Callable

from flint import fmpz_poly

from .allocator import release_freed_memory, resident_bytes
from .graph import Graph
from .hooks import Hooks, MemoryBound
from .orders import frontier_sizes

State = tuple[int, ...]
CHECK_EVERY = 2048


def step_masks(g: Graph, order: list[int]) -> list[tuple[int, int]]:
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


def kronecker_bits(n: int, edges: int) -> int:
    """Bits per coefficient that hold every coefficient of the chromatic polynomial of a
    graph with n vertices and `edges` edges, in signed form, plus a spare bit.

    |coefficient of k^(n-i)| <= C(edges, i) (Whitney's broken-circuit theorem), and
    <= the same coefficient of K_n, the unsigned Stirling number of the first kind
    (deletion-contraction adds absolute values, so adding edges never lowers them)."""
    first = [1]  # unsigned Stirling numbers of the first kind, row n: x(x+1)...(x+n-1)
    for j in range(n):
        first = [0, *first]
        for i in range(len(first) - 1):
            first[i] += j * first[i + 1]
    bound = max(
        min(math.comb(edges, i), first[n - i]) for i in range(min(edges, n) + 1)
    )
    return bound.bit_length() + 2


def unpack(value: int, bits: int, degree: int) -> fmpz_poly:
    """The polynomial whose value at 2^bits is `value` (signed base-2^bits digits)."""
    mask = (1 << bits) - 1
    half = 1 << (bits - 1)
    coeffs = []
    for _ in range(degree + 1):
        d = value & mask
        if d >= half:
            d -= 1 << bits
        coeffs.append(d)
        value = (value - d) >> bits
    if value:
        raise ArithmeticError("coefficient bound exceeded in unpacking")
    return fmpz_poly(coeffs)


Check = Callable[[int], None]


def advance_packed(layer: dict, vb: int, nb: int, shift: int, check: Check) -> dict:
    """One step with packed-polynomial weights (a new round multiplies by x - b)."""
    new: dict[State, int] = {}
    get = new.get
    tick = 0
    for state, w in layer.items():
        tick += 1
        if tick & 4095 == 0:
            check(len(new))
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
        ww = (w << shift) - len(state) * w
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
    return new


def advance_at(layer: dict, vb: int, nb: int, k: int, check: Check) -> dict:
    """One step with integer weights at k rounds (states needing more rounds dropped, and
    states in which all k rounds rule out one unplaced fixture)."""
    new: dict[State, int] = {}
    get = new.get
    tick = 0
    for state, w in layer.items():
        tick += 1
        if tick & 4095 == 0:
            check(len(new))
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
        full = len(base) == k
        prev = -1
        for i in joinable:
            f = base[i]
            if f == prev:
                continue
            prev = f
            nbase = base[:]
            nbase[i] = f | nb
            ns = tuple(sorted(nbase))
            if full and not _alive(ns, k):
                continue
            mult = state.count(f)
            ww = w * mult if mult > 1 else w
            old = get(ns)
            new[ns] = ww if old is None else old + ww
    return new


def advance_many(layer: dict, vb: int, nb: int, ks: tuple[int, ...], check: Check) -> dict:
    """One step with one integer weight per k in ks (a weight for k becomes zero once the
    state has needed more than k rounds); states beyond max(ks) rounds are dropped."""
    kmax = max(ks)
    new: dict[State, list[int]] = {}
    get = new.get
    tick = 0
    for state, w in layer.items():
        tick += 1
        if tick & 4095 == 0:
            check(len(new))
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
        if b < kmax:
            ns = tuple(sorted([*base, nb])) if nb else tuple(sorted(base))
            if len(ns) < kmax or _alive(ns, kmax):
                ww = [x * (k - b) if k > b else 0 for x, k in zip(w, ks, strict=True)]
                old = get(ns)
                new[ns] = ww if old is None else [x + y for x, y in zip(old, ww, strict=True)]
        full = len(base) == kmax
        prev = -1
        for i in joinable:
            f = base[i]
            if f == prev:
                continue
            prev = f
            nbase = base[:]
            nbase[i] = f | nb
            ns = tuple(sorted(nbase))
            if full and not _alive(ns, kmax):
                continue
            mult = state.count(f)
            ww = [x * mult for x in w] if mult > 1 else w
            old = get(ns)
            new[ns] = ww if old is None else [x + y for x, y in zip(old, ww, strict=True)]
    return new


ADVANCE = {"packed": advance_packed, "at": advance_at, "many": advance_many}


MEMORY_BYTES = 400 * 2**20  # bound on one state table; two are alive at a time
# The array path (vectorized.py) holds the previous table, the new table's chunks before
# their final merge (bounded at 3/4 of MEMORY_BYTES), one bucket's merge copies, and one
# chunk of successors (1/5) with its sort and merge copies. Where the process's resident
# memory can be read (Linux), every check also stops when it has grown by RESIDENT_GROWTH
# since the programme started (freed memory kept by the allocator is handed back first),
# so that in a fresh process the step in progress stays under 1 GiB; growth, not the total,
# so that a long-lived process (the window's engine) is not stopped by what earlier work
# left behind. Measured peaks: 10-team round-robin at 9 rounds 620-653 MiB; stopped at
# the bound: the 90-fixture demo season at 18 rounds 851 MiB (all rounds used 808 MiB),
# clubday-60's counts table 821 MiB.
VECTOR_TABLE_SHARE = 3 / 4
VECTOR_CHUNK_SHARE = 1 / 5
RESIDENT_GROWTH = 700 * 2**20
TRIM_ABOVE = 200 * 2**20  # resident memory above which a programme first hands back freed memory


def _state_bytes(mode: str, param: object, step: int, width: int) -> int:
    """Rough bytes per stored state at a given step, `width` fixtures on the frontier: the
    dict slot, the tuple with a pointer per round (the round's int is mostly shared with
    other states), and the weight."""
    size = 300 + 8 * width
    if mode == "packed":
        return size + (step + 1) * int(param) // 8  # packed weight grows by B bits a step
    if mode == "many":
        return size + 40 * len(param)
    return size + 40


def resident_baseline() -> int | None:
    """The resident memory a programme starts from (None where it cannot be read), after
    handing back freed memory when there is much of it (say from an earlier, stopped count)."""
    resident = resident_bytes()
    if resident is not None and resident > TRIM_ABOVE:
        release_freed_memory()
        resident = resident_bytes()
    return resident


def _resident_too_high(base: int | None) -> bool:
    """True when the resident memory has grown by more than RESIDENT_GROWTH since `base`,
    even after freed memory that the allocator kept is handed back."""
    resident = resident_bytes()
    if base is None or resident is None or resident - base <= RESIDENT_GROWTH:
        return False
    release_freed_memory()
    resident = resident_bytes()
    return resident is not None and resident - base > RESIDENT_GROWTH


def _guard(hooks: Hooks, limit: int, step: int, n: int, base: int | None) -> Check:
    """The check called while a table grows: cancel, budget, and the memory bound (the
    table's size, and where it can be read, the growth of the resident memory since `base`)."""

    def check(size: int) -> None:
        hooks.check()
        if size > limit or _resident_too_high(base):
            raise MemoryBound(
                f"state table passed the memory bound ({size} states at step {step + 1} of {n})"
            )

    return check


VECTOR_THRESHOLD = 20_000  # fixed-k tables at least this large move to numpy arrays


def run(g: Graph, order: list[int], mode: str, param: object, one: object, hooks: Hooks):
    """Run the programme over `order` with the step function of `mode`: the final weight,
    or None when every state died. Raises BudgetExceeded when a state table would pass
    the memory bound. Fixed-k tables that grow large continue on numpy arrays
    (vectorized.py) when at most 64 fixtures are on the boundary at a time."""
    advance = ADVANCE[mode]
    steps = step_masks(g, order)
    widths = frontier_sizes(g, order)
    n = len(steps)
    layer: dict = {(): one}
    vector = mode != "packed"
    base = resident_baseline()
    for i, (vb, nb) in enumerate(steps):
        hooks.report(i / max(n, 1), "counting")
        if vector and len(layer) >= VECTOR_THRESHOLD:
            done = _vector_finish(g, order, i, layer, mode, param, hooks, base)
            if done is not _NOT_VECTOR:
                hooks.report(1.0, "counting")
                return done
            vector = False
        limit = MEMORY_BYTES // _state_bytes(mode, param, i, widths[i])
        check = _guard(hooks, limit, i, n, base)
        layer = advance(layer, vb, nb, param, check)
        check(len(layer))
        if not layer:
            return None
    hooks.report(1.0, "counting")
    return layer.get(())


_NOT_VECTOR = object()


def _vector_finish(g, order, start, layer, mode, param, hooks, base):
    """The rest of a fixed-k programme on arrays, or _NOT_VECTOR when it does not fit."""
    from . import vectorized

    ks = (param,) if mode == "at" else tuple(param)
    try:
        vectorized.slot_steps(g, order, start)
    except OverflowError:
        return _NOT_VECTOR
    n = len(order)
    lines = len(ks) * len(vectorized.primes_for(max(vectorized.count_bound(g, order, max(ks)), 1)))

    def check_for(step: int) -> Check:
        limit = int(MEMORY_BYTES * VECTOR_TABLE_SHARE) // vectorized.bytes_per_row(max(ks), lines)
        return _guard(hooks, limit, step, n, base)

    def progress(step: int) -> None:
        hooks.report(step / max(n, 1), "counting")

    chunk = int(MEMORY_BYTES * VECTOR_CHUNK_SHARE)
    try:
        got = vectorized.finish(g, order, start, layer, ks, check_for, progress, chunk)
    finally:
        release_freed_memory()
    if got is None:
        return None
    return got[0] if mode == "at" else got


def count_polynomial(g: Graph, order: list[int], hooks: Hooks) -> fmpz_poly:
    """P(g, x) for a graph with no self-loop, by the frontier programme over `order`.

    Weights are polynomials packed into integers (Kronecker substitution x = 2^B): every
    operation of the programme is a ring operation, so the final integer is exactly
    P(2^B), from which the coefficients are read back; B is chosen so that every final
    coefficient fits. Integer arithmetic on the packed form is several times cheaper than
    polynomial objects.
    """
    shift = kronecker_bits(len(order), g.edges())
    packed = run(g, order, "packed", shift, 1, hooks)
    return unpack(packed or 0, shift, len(order))


def count_at(g: Graph, order: list[int], k: int, hooks: Hooks) -> int:
    """P(g, k) as an exact integer."""
    if k <= 0:
        return 1 if not order else 0
    return run(g, order, "at", k, 1, hooks) or 0


def count_many(g: Graph, order: list[int], ks: list[int], hooks: Hooks) -> list[int]:
    """P(g, k) for every k in `ks` in one pass."""
    if max(ks, default=0) <= 0:
        return [1 if not order else 0 for _ in ks]
    out = run(g, order, "many", tuple(ks), [1] * len(ks), hooks)
    return out if out is not None else [0] * len(ks)


def completion_tables(
    g: Graph, order: list[int], k: int, hooks: Hooks
) -> list[dict[State, int]]:
    """For each step i, the states before placing order[i] mapped to their number of
    completions with k rounds (only states that have at least one); the last table is
    the finished state. Used for exactly uniform draws."""
    steps = step_masks(g, order)
    n = len(order)
    layers: list[set[State]] = [{()}]
    tick = 0
    stored = 1
    limit = MEMORY_BYTES // 600  # every table is kept, with its completion counts
    for step, (vb, nb) in enumerate(steps):
        hooks.report(0.5 * step / max(n, 1), "sampling tables")
        nxt: set[State] = set()
        for state in layers[-1]:
            tick += 1
            if tick % CHECK_EVERY == 0:
                hooks.check()
                if stored + len(nxt) > limit:
                    raise MemoryBound(
                        f"sampling tables passed the memory bound at step {step + 1} of {n}"
                    )
            for ns, _ in successors(state, vb, nb, k):
                nxt.add(ns)
        stored += len(nxt)
        layers.append(nxt)
    tables: list[dict[State, int]] = [{} for _ in layers]
    if () in layers[-1]:
        tables[-1][()] = 1
    for i in range(n - 1, -1, -1):
        hooks.report(0.5 + 0.5 * (n - i) / max(n, 1), "sampling tables")
        vb, nb = steps[i]
        after = tables[i + 1]
        here: dict[State, int] = {}
        for state in layers[i]:
            tick += 1
            if tick % CHECK_EVERY == 0:
                hooks.check()
            total = 0
            for ns, mult in successors(state, vb, nb, k):
                c = after.get(ns)
                if c:
                    total += mult * c
            if total:
                here[state] = total
        tables[i] = here
    return tables
