"""The fixed-k frontier programme on numpy arrays, for large state tables.

Same states and transitions as frontier.py, held as a matrix: one row per state, its
rounds' sets as bitmasks (over "slots": each unplaced fixture gets a bit while it has a
placed neighbour, at most 64 at a time) in increasing order after zero padding. Weights
are residues modulo several primes below 2^31 whose product exceeds a proven upper bound
on the count (count_bound); the count is rebuilt by the Chinese remainder theorem. A step
builds the successor rows a chunk (a set number of bytes) at a time, sorts each row, and
merges equal rows: rows are grouped by a 64-bit hash (first by its high bits, sorted packed
with the row index), and every row is then compared in full with its group's first row, so
a collision is detected (and the grouping redone by the full hash, then by an exact
lexicographic sort), never trusted. The chunks' merged tables are then dealt into a few
buckets by a second hash and each bucket merged on its own, which keeps a step's memory
near that of its tables rather than several copies of them.
"""

from __future__ import annotations

from collections.abc import Callable

import numpy as np
from flint import fmpz

from .graph import Graph, bits

CHUNK_BYTES = 80 * 2**20  # successor rows built at a time, in bytes (bounds one step's memory)
MIN_CHUNK_ROWS = 10_000  # a chunk is never smaller than this (few large numpy calls)
NBUCKET_BITS = 3  # a step's chunk tables are merged in 2^3 buckets of equal rows
CHECK_ROWS = 1 << 20  # rows compared at a time when a hash grouping is checked
_M1 = np.uint64(0x9E3779B97F4A7C15)
_M2 = np.uint64(0xBF58476D1CE4E5B9)
_S29 = np.uint64(29)
_S32 = np.uint64(32)


def primes_for(bound: int) -> list[int]:
    """Primes below 2^31 whose product exceeds `bound`."""
    out: list[int] = []
    product = 1
    p = 2**31 - 1
    while product <= bound:
        if fmpz(p).is_prime():  # python-flint's test: 0.12 ms for 33 primes, 2.1 ms by hand
            out.append(p)
            product *= p
        p -= 2
    return out


def count_bound(g: Graph, order: list[int], k: int) -> int:
    """An upper bound on the number of k-colourings: placing the vertices in `order`, each
    has at most k - q rounds left, q the size of a clique among its earlier neighbours
    (found greedily), since that clique's rounds are all different."""
    bound = 1
    earlier = 0
    for v in order:
        cand = g.adj[v] & earlier
        q = 0
        while cand:
            best = max(bits(cand), key=lambda u: (g.adj[u] & cand).bit_count())
            q += 1
            cand &= g.adj[best]
        bound *= max(k - q, 0)
        earlier |= 1 << v
    return bound


def crt(residues: list[int], primes: list[int]) -> int:
    """The integer in [0, prod primes) with the given residues (Garner's form of the Chinese
    remainder theorem; python-flint 0.9 has none for integers; 0.07 ms for 33 primes)."""
    x, m = 0, 1
    for r, p in zip(residues, primes, strict=True):
        t = ((r - x) * pow(m, -1, p)) % p
        x += m * t
        m *= p
    return x


def slot_steps(g: Graph, order: list[int], start: int) -> tuple[list[tuple[int, int]], dict]:
    """From step `start` on: each step's (slot bit of v or 0, slot mask of v's unplaced
    neighbours), and the slot of every fixture that is on the boundary before `start`.
    Raises OverflowError when more than 64 fixtures are on the boundary at once."""
    placed = set(order[:start])
    slot: dict[int, int] = {}
    free = list(range(63, -1, -1))
    for v in order[:start]:
        for u in bits(g.adj[v]):
            if u not in placed and u not in slot:
                if not free:
                    raise OverflowError("more than 64 fixtures on the boundary")
                slot[u] = free.pop()
    initial = dict(slot)
    steps = []
    for v in order[start:]:
        placed.add(v)
        later = [u for u in bits(g.adj[v]) if u not in placed]
        for u in later:
            if u not in slot:
                if not free:
                    raise OverflowError("more than 64 fixtures on the boundary")
                slot[u] = free.pop()
        s = slot.pop(v, None)
        mask = 0
        for u in later:
            mask |= 1 << slot[u]
        steps.append((0 if s is None else 1 << s, mask))
        if s is not None:
            free.append(s)
    return steps, initial


def to_arrays(layer: dict, slot: dict, ks: tuple[int, ...], primes: list[int]):
    """A frontier.py layer (state tuple -> int or list of ints) as (rows, residues)."""
    width = max((len(s) for s in layer), default=0)
    rows = np.zeros((len(layer), width), np.uint64)
    res = np.zeros((len(ks) * len(primes), len(layer)), np.int64)
    converted: dict[int, int] = {}
    for i, (state, w) in enumerate(layer.items()):
        masks = []
        for f in state:
            m = converted.get(f)
            if m is None:
                m = 0
                for u in bits(f):
                    m |= 1 << slot[u]
                converted[f] = m
            masks.append(m)
        masks.sort()
        rows[i, width - len(masks) :] = masks
        ws = w if isinstance(w, list) else [w]
        for j, x in enumerate(ws):
            for q, p in enumerate(primes):
                res[j * len(primes) + q, i] = x % p
    return rows, res


def _hash(rows: np.ndarray) -> np.ndarray:
    h = np.zeros(rows.shape[0], np.uint64)
    for c in range(rows.shape[1]):
        h ^= rows[:, c]
        h *= _M1
        h ^= h >> _S29
    h *= _M2
    h ^= h >> _S32
    return h


def _sorted_by_hash(h: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
    """Row indices sorted by the high bits of their hashes, and the start of each run of
    equal high bits: one sort of hash and index packed into a 64-bit key (a plain sort
    is about twice as fast as an argsort). Rows the truncation puts together wrongly are
    caught by the row-by-row check in _merge."""
    n = len(h)
    low_bits = max((n - 1).bit_length(), 1)
    low = np.uint64((1 << low_bits) - 1)
    key = h & ~low
    key |= np.arange(n, dtype=np.uint64)
    key.sort()
    order = (key & low).astype(np.int64)
    key &= ~low
    start = np.empty(n, bool)
    start[0] = True
    np.not_equal(key[1:], key[:-1], out=start[1:])
    return order, start


def _sorted_exactly(
    rows: np.ndarray, h: np.ndarray, full_hash: bool
) -> tuple[np.ndarray, np.ndarray]:
    """Row indices sorted so that equal rows are adjacent, and the start of each run:
    by the full hash, or (full_hash False) lexicographically by the rows themselves."""
    if full_hash:
        order = np.argsort(h)
        hs = h[order]
        start = np.empty(len(h), bool)
        start[0] = True
        np.not_equal(hs[1:], hs[:-1], out=start[1:])
        return order, start
    order = np.lexsort(rows.T[::-1])
    srt = rows[order]
    start = np.empty(len(h), bool)
    start[0] = True
    start[1:] = (srt[1:] != srt[:-1]).any(axis=1)
    return order, start


def _grouped_rows_equal(rows: np.ndarray, reps: np.ndarray, gid: np.ndarray) -> bool:
    """True when every row equals its group's first row (compared a block at a time, so that
    no full copy of the table is made)."""
    for lo in range(0, rows.shape[0], CHECK_ROWS):
        hi = lo + CHECK_ROWS
        if not np.array_equal(rows[lo:hi], rows[reps[gid[lo:hi]]]):
            return False
    return True


def _merge(
    rows: np.ndarray,
    res: np.ndarray,
    mods: np.ndarray,
    check: Callable[[int], None] = lambda _: None,
) -> tuple[np.ndarray, np.ndarray]:
    """Merge equal rows, adding their residues (then reducing modulo `mods` per line).

    Rows are grouped by the high bits of a 64-bit hash, then by the full hash, then by a
    lexicographic sort, each tried only when the previous put two different rows together
    (every row is compared with its group's first, so a grouping is never trusted).
    `check` is called between the phases (cancel)."""
    n = rows.shape[0]
    if n == 0:
        return rows, res
    h = _hash(rows)
    for attempt in range(3):
        check(0)
        if attempt == 0:
            order, start = _sorted_by_hash(h)
        else:
            order, start = _sorted_exactly(rows, h, attempt == 1)
        gid_sorted = np.cumsum(start) - 1
        reps = order[start]
        gid = np.empty(n, np.int64)
        gid[order] = gid_sorted
        if attempt == 2 or _grouped_rows_equal(rows, reps, gid):
            break
    groups = len(reps)
    check(0)
    if n < 2**22:
        # Residues < 2^31 and fewer than 2^22 rows in a group: float64 sums stay exact.
        out = np.empty((res.shape[0], groups), np.int64)
        for line in range(res.shape[0]):
            s = np.bincount(gid, weights=res[line].astype(np.float64), minlength=groups)
            out[line] = s.astype(np.int64) % mods[line]
    else:
        starts = np.nonzero(np.bincount(gid, minlength=groups))[0]  # all groups are non-empty
        by_group = np.argsort(gid, kind="stable")
        first = np.searchsorted(gid[by_group], starts)
        out = np.add.reduceat(res[:, by_group], first, axis=1) % mods[:, None]
    return rows[reps], out


def advance(
    rows: np.ndarray,
    res: np.ndarray,
    vb: int,
    nb: int,
    ks: tuple[int, ...],
    mods: np.ndarray,
    check: Callable[[int], None],
    chunk_bytes: int = CHUNK_BYTES,
) -> tuple[np.ndarray, np.ndarray]:
    """One step of the programme with one residue line per (k, prime); successors are built
    and merged `chunk_bytes` at a time."""
    kmax = max(ks)
    nprimes = len(mods) // len(ks)
    n, width = rows.shape
    vbu = np.uint64(vb)
    nbu = np.uint64(nb)
    nz = rows != 0
    b = nz.sum(axis=1)
    base = rows & ~vbu if vb else rows
    joinable = nz & ~((rows & vbu) != 0) if vb else nz
    ks_col = np.repeat(np.array(ks, np.int64), nprimes)[:, None]
    chunk_rows = max(chunk_bytes // (8 * (width + 1 + len(mods))), MIN_CHUNK_ROWS)
    pieces_rows: list[np.ndarray] = []
    pieces_res: list[np.ndarray] = []
    pending = 0
    merged_rows: list[np.ndarray] = []
    merged_res: list[np.ndarray] = []

    def flush() -> None:
        nonlocal pending
        if not pieces_rows:
            return
        cand = np.concatenate(pieces_rows)
        cres = np.concatenate(pieces_res, axis=1)
        pieces_rows.clear()
        pieces_res.clear()
        pending = 0
        check(0)
        cand.sort(axis=1)  # ascending: empty (zero) slots first
        keep_cols = int(cand.any(axis=0).sum())
        cand = cand[:, cand.shape[1] - keep_cols :]
        if keep_cols == kmax:
            dead = (cand[:, 0] != 0) & (np.bitwise_and.reduce(cand, axis=1) != 0)
            if dead.any():
                cand = cand[~dead]
                cres = cres[:, ~dead]
        check(0)
        r, w = _merge(cand, cres, mods, check)
        merged_rows.append(r)
        merged_res.append(w)
        check(sum(len(x) for x in merged_rows))

    def add(sel: np.ndarray, column: int | None) -> None:
        """Queue the successors of the states `sel`: v opens a round (column None) or joins
        the round in `column`; weights are built a chunk at a time."""
        for lo in range(0, len(sel), chunk_rows):
            part = sel[lo : lo + chunk_rows]
            weights = res[:, part]
            if column is None:
                weights = weights * np.maximum(ks_col - b[part][None, :], 0) % mods[:, None]
            add_chunk(part, column, weights)

    def add_chunk(sel: np.ndarray, column: int | None, weights: np.ndarray) -> None:
        nonlocal pending
        cand = np.empty((len(sel), width + 1), np.uint64)
        cand[:, 1:] = base[sel]
        cand[:, 0] = nbu if column is None else 0
        if column is not None:
            cand[:, column + 1] |= nbu
        pieces_rows.append(cand)
        pieces_res.append(weights)
        pending += len(sel)
        if pending >= chunk_rows:
            flush()
        else:
            check(sum(len(x) for x in merged_rows))

    opens = np.nonzero(b < kmax)[0]
    if len(opens):
        add(opens, None)
    for j in range(width):
        sel = np.nonzero(joinable[:, j])[0]
        if len(sel):
            add(sel, j)
    flush()
    if not merged_rows:
        return np.zeros((0, 0), np.uint64), np.zeros((len(mods), 0), np.int64)
    if len(merged_rows) == 1:
        return merged_rows[0], merged_res[0]
    return _merge_tables(merged_rows, merged_res, mods, check)


def _bucket_of(rows: np.ndarray) -> np.ndarray:
    """A bucket 0..2^NBUCKET_BITS - 1 for each row, equal for equal rows whatever their zero
    padding (a sum of mixed entries, and a mixed zero is zero)."""
    h = np.zeros(rows.shape[0], np.uint64)
    for c in range(rows.shape[1]):
        x = rows[:, c] * _M1
        x ^= x >> _S29
        h += x
    h *= _M2
    return (h >> np.uint64(64 - NBUCKET_BITS)).astype(np.intp)


def _merge_tables(
    tables: list[np.ndarray],
    weights: list[np.ndarray],
    mods: np.ndarray,
    check: Callable[[int], None] = lambda _: None,
) -> tuple[np.ndarray, np.ndarray]:
    """Merge the chunks' tables (emptying both lists): each table in turn is dealt into
    buckets by _bucket_of and freed, then each bucket is merged on its own, so that no
    moment holds more than the tables and one bucket's working copies."""
    width = max(r.shape[1] for r in tables)
    nb = 1 << NBUCKET_BITS
    bucket_rows: list[list[np.ndarray]] = [[] for _ in range(nb)]
    bucket_res: list[list[np.ndarray]] = [[] for _ in range(nb)]
    while tables:
        check(0)
        r = tables.pop()
        w = weights.pop()
        bucket = _bucket_of(r)
        order = np.argsort(bucket, kind="stable")
        ends = np.cumsum(np.bincount(bucket, minlength=nb))
        for i, idx in enumerate(np.split(order, ends[:-1])):
            if len(idx):
                bucket_rows[i].append(np.pad(r[idx], ((0, 0), (width - r.shape[1], 0))))
                bucket_res[i].append(w[:, idx])
        del r, w, bucket, order
    out_rows = []
    out_res = []
    for i in range(nb):
        check(0)
        if bucket_rows[i]:
            rows = np.concatenate(bucket_rows[i])
            res = np.concatenate(bucket_res[i], axis=1)
            bucket_rows[i] = bucket_res[i] = []
            r, w = _merge(rows, res, mods, check)
            del rows, res
            out_rows.append(r)
            out_res.append(w)
    return np.concatenate(out_rows), np.concatenate(out_res, axis=1)


def finish(
    g: Graph,
    order: list[int],
    start: int,
    layer: dict,
    ks: tuple[int, ...],
    check_for: Callable[[int], Callable[[int], None]],
    progress: Callable[[int], None],
    chunk_bytes: int = CHUNK_BYTES,
) -> list[int] | None:
    """Continue a frontier.py programme (integer weights for each k in ks) from step
    `start` with arrays; the counts for each k, or None when no state survives."""
    kmax = max(ks)
    primes = primes_for(max(count_bound(g, order, kmax), 1))
    steps, slot = slot_steps(g, order, start)
    rows, res = to_arrays(layer, slot, ks, primes)
    mods = np.array([p for _ in ks for p in primes], np.int64)
    for i, (vb, nb) in enumerate(steps):
        progress(start + i)
        rows, res = advance(rows, res, vb, nb, ks, mods, check_for(start + i), chunk_bytes)
        if rows.shape[0] == 0:
            return None
    if rows.shape[1] and rows.any():
        raise AssertionError("the programme must end in the empty state")
    np_ = len(primes)
    return [crt([int(x) for x in res[j * np_ : (j + 1) * np_, 0]], primes) for j in range(len(ks))]


def bytes_per_row(width: int, lines: int) -> int:
    """Memory of one stored state in the arrays (row and residues, with some slack)."""
    return 8 * (width + 1) + 8 * lines + 24

