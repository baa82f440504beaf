"""The public engine functions: networkx graphs in, exact integers and fmpz_poly out."""

from __future__ import annotations

import itertools
import math
import random
from collections.abc import Hashable, Iterable, Mapping
from dataclasses import dataclass

import networkx as nx
from flint import fmpz_poly

from . import solve
from .chromatic_number import domains_for
from .estimate import Estimate, summarise
from .falling import falling, to_falling
from .fewest import Bounds, fewest_bounds
from .graph import Graph, from_networkx
from .hooks import Hooks, NoAssignment, begin
from .parallel import estimate_draws
from .pins import assignment_back, transform
from .sampling import Sampler

Pins = Mapping[Hashable, int]
Exclusions = Mapping[Hashable, Iterable[int]]

BOUNDS_SECONDS = 2.0  # default effort of min_rounds_bounds when the caller gives no budget


def _prepare(
    G: nx.Graph, pins: Pins | None, exclusions: Exclusions | None
) -> tuple[Graph, list[Hashable], dict[int, int], dict[int, set[int]]]:
    """The engine graph, its node list, and pins/exclusions keyed by vertex index."""
    g, nodes = from_networkx(G)
    index = {v: i for i, v in enumerate(nodes)}
    ip: dict[int, int] = {}
    for node, r in (pins or {}).items():
        if node not in index:
            raise ValueError(f"pinned fixture {node!r} is not in the graph")
        if not isinstance(r, int) or isinstance(r, bool) or r < 1:
            raise ValueError(f"pinned round {r!r} of {node!r} is not a positive whole number")
        ip[index[node]] = r
    ie: dict[int, set[int]] = {}
    for node, rs in (exclusions or {}).items():
        if node not in index:
            raise ValueError(f"excluded fixture {node!r} is not in the graph")
        rounds = set()
        for r in rs:
            if not isinstance(r, int) or isinstance(r, bool) or r < 1:
                raise ValueError(f"excluded round {r!r} of {node!r} is not a positive whole number")
            rounds.add(r)
        if rounds:
            ie[index[node]] = rounds
    return g, nodes, ip, ie


def _check_k(k: int) -> None:
    if not isinstance(k, int) or isinstance(k, bool) or k < 0:
        raise ValueError(f"round count {k!r} is not a whole number >= 0")


def _count(g: Graph, k: int, ip: dict[int, int], ie: dict[int, set[int]], hooks: Hooks) -> int:
    """Assignments of g to rounds 1..k honouring pins and exclusions."""
    if k == 0:
        return 1 if g.n == 0 else 0
    if not ip and not ie:
        return solve.value(g, k, hooks)
    t = transform(g, k, ip, ie)
    if t is None:
        return 0
    return solve.value(t.graph, k, hooks) // falling(k, len(t.reps))


def _count_on_rounds(
    g: Graph, rounds: list[int], ip: dict[int, int], ie: dict[int, set[int]], hooks: Hooks
) -> int:
    """Assignments using only the given rounds (renumbered 1..len(rounds))."""
    new = {r: i + 1 for i, r in enumerate(rounds)}
    pins = {}
    for v, r in ip.items():
        if r not in new:
            return 0
        pins[v] = new[r]
    excl = {v: {new[r] for r in rs if r in new} for v, rs in ie.items()}
    return _count(g, len(rounds), pins, {v: rs for v, rs in excl.items() if rs}, hooks)


def _counted(
    count, G: nx.Graph, k: int, pins: Pins | None, exclusions: Exclusions | None,
    hooks: Hooks | None,
):
    """Check k, prepare the graph, run one count (exact or estimated) with progress 0 to 1."""
    _check_k(k)
    hooks = begin(hooks)
    hooks.report(0.0, "starting")
    g, _, ip, ie = _prepare(G, pins, exclusions)
    out = count(g, k, ip, ie, hooks)
    hooks.report(1.0, "done")
    return out


def chromatic_polynomial(G: nx.Graph, hooks: Hooks | None = None) -> fmpz_poly:
    """P(G, x): the number of clash-free assignments to x rounds, as a polynomial."""
    hooks = begin(hooks)
    hooks.report(0.0, "starting")
    g, _ = from_networkx(G)
    p = solve.polynomial(g, hooks)
    hooks.report(1.0, "done")
    return p


def count_assignments(
    G: nx.Graph,
    k: int,
    pins: Pins | None = None,
    exclusions: Exclusions | None = None,
    hooks: Hooks | None = None,
) -> int:
    """Exact number of assignments to rounds 1..k with no clash in a round, pins and
    exclusions respected (rounds may stay empty)."""
    return _counted(_count, G, k, pins, exclusions, hooks)


def count_all_rounds_used(
    G: nx.Graph,
    k: int,
    pins: Pins | None = None,
    exclusions: Exclusions | None = None,
    hooks: Hooks | None = None,
) -> int:
    """Exact number of assignments to rounds 1..k that use every round."""
    return _counted(_all_rounds_used, G, k, pins, exclusions, hooks)


def _all_rounds_used(
    g: Graph, k: int, ip: dict[int, int], ie: dict[int, set[int]], hooks: Hooks
) -> int:
    """Assignments using every round 1..k, by inclusion-exclusion over the rounds left empty.

    Without pins or exclusions, one pass gives P(0..k) and the sum is over how many rounds
    are empty. Pinned rounds are never empty; the other rounds are grouped by the set of
    fixtures excluding them (rounds in one group are interchangeable), so only how many of
    each group are left out matters."""
    if k == 0:
        return 1 if g.n == 0 else 0
    if not ip and not ie:
        vals = solve.values(g, list(range(k + 1)), hooks)
        return sum((-1) ** i * math.comb(k, i) * vals[k - i] for i in range(k + 1))
    pinned = set(ip.values())
    groups: dict[frozenset[int], list[int]] = {}
    for r in range(1, k + 1):
        if r not in pinned:
            key = frozenset(v for v, rs in ie.items() if r in rs)
            groups.setdefault(key, []).append(r)
    sizes = [len(rs) for rs in groups.values()]
    combos = list(itertools.product(*(range(s + 1) for s in sizes)))
    total = 0
    for i, drop in enumerate(combos):
        with hooks.window(i / len(combos), (i + 1) / len(combos)):
            removed = set()
            for rs, d in zip(groups.values(), drop, strict=True):
                removed.update(rs[:d])
            rounds = [r for r in range(1, k + 1) if r not in removed]
            c = _count_on_rounds(g, rounds, ip, ie, hooks)
        ways = math.prod(math.comb(s, d) for s, d in zip(sizes, drop, strict=True))
        total += (-1) ** sum(drop) * ways * c
    return total


def count_table(
    G: nx.Graph,
    ks: Iterable[int],
    pins: Pins | None = None,
    exclusions: Exclusions | None = None,
    hooks: Hooks | None = None,
) -> dict[int, tuple[int, int]]:
    """{k: (assignments, all_rounds_used)} for every k in ks, exact.

    Without pins or exclusions, one pass of the programme gives P(0..max k) and both
    numbers for every k; with them, each k is counted on its own transformed graph."""
    wanted = sorted(set(ks))
    for k in wanted:
        _check_k(k)
    hooks = begin(hooks)
    hooks.report(0.0, "starting")
    g, _, ip, ie = _prepare(G, pins, exclusions)
    out: dict[int, tuple[int, int]] = {}
    if not wanted:
        return out
    if not ip and not ie:
        vals = solve.values(g, list(range(max(wanted) + 1)), hooks)
        for k in wanted:
            used = sum((-1) ** i * math.comb(k, i) * vals[k - i] for i in range(k + 1))
            out[k] = (vals[k], used)
    else:
        for i, k in enumerate(wanted):
            with hooks.window(i / len(wanted), (i + 1) / len(wanted)):
                out[k] = (_count(g, k, ip, ie, hooks), _all_rounds_used(g, k, ip, ie, hooks))
    hooks.report(1.0, "done")
    return out


def groupings(G: nx.Graph, hooks: Hooks | None = None) -> list[int]:
    """a_j for j = 0..n: the ways to split the fixtures into exactly j non-empty clash-free
    rounds, rounds unordered (the falling-factorial coefficients of P)."""
    p = chromatic_polynomial(G, hooks)
    n = G.number_of_nodes()
    a = to_falling(p)
    return (a + [0] * (n + 1))[: n + 1]


def _never_possible(g: Graph, ip: dict[int, int], ie: dict[int, set[int]]) -> str | None:
    """Why no number of rounds can work (clashing pins, pin to an excluded round), if so."""
    if g.loop:
        return "a fixture clashes with itself"
    for v, r in ip.items():
        if r in ie.get(v, ()):
            return f"a fixture is pinned to round {r}, which it may not use"
        for u, s in ip.items():
            if u != v and s == r and g.adj[v] >> u & 1:
                return f"two clashing fixtures are pinned to round {r}"
    return None


@dataclass(frozen=True)
class RoundsProof:
    """The fewest rounds with its proof both ways.

    `schedule` is a valid assignment with `rounds` rounds; `lower` says why one fewer has
    none: "clique" (the fixtures in `clique` clash pairwise), "pin" (a fixture is pinned to
    round `rounds`), "search" (an exhaustive DSatur search with one round fewer found nothing)
    or "sat" (the SAT solver proved one round fewer unsatisfiable); `upper` names who found
    the schedule: "dsatur" (one DSatur pass), "tabucol" (tabu search), "search" or "sat".
    """

    rounds: int
    schedule: dict[Hashable, int]
    lower: str
    clique: list[Hashable]
    upper: str = "search"


@dataclass(frozen=True)
class RoundsBounds:
    """Proven bounds on the fewest rounds, each with its method (as in RoundsProof): a
    schedule with `high` rounds exists (`schedule`, found by `high_method`), and none with
    fewer than `low` (`low_method`). Exact when low == high."""

    low: int
    high: int
    low_method: str
    high_method: str
    schedule: dict[Hashable, int]

    @property
    def exact(self) -> bool:
        return self.low == self.high


def _fewest(G: nx.Graph, pins: Pins | None, exclusions: Exclusions | None, hooks: Hooks | None,
            partial: bool) -> tuple[Bounds, list[Hashable]]:
    hooks = begin(hooks)
    hooks.report(0.0, "starting")
    g, nodes, ip, ie = _prepare(G, pins, exclusions)
    why = _never_possible(g, ip, ie)
    if why:
        raise NoAssignment(why)
    if g.n == 0:
        return Bounds(0, 0, "clique", "dsatur", [], []), nodes
    out = fewest_bounds(g, ip, ie, hooks, partial)
    hooks.deadline = None
    hooks.report(1.0, "done")
    return out, nodes


def min_rounds(
    G: nx.Graph,
    pins: Pins | None = None,
    exclusions: Exclusions | None = None,
    hooks: Hooks | None = None,
) -> int:
    """The fewest rounds that admit a valid assignment (exact; raises NoAssignment when
    pins contradict the clashes, BudgetExceeded or Cancelled when stopped)."""
    return min_rounds_proof(G, pins, exclusions, hooks).rounds


def min_rounds_proof(
    G: nx.Graph,
    pins: Pins | None = None,
    exclusions: Exclusions | None = None,
    hooks: Hooks | None = None,
) -> RoundsProof:
    """The fewest rounds, a schedule using them, and why one fewer is impossible."""
    b, nodes = _fewest(G, pins, exclusions, hooks, partial=False)
    schedule = {node: b.colouring[i] for i, node in enumerate(nodes)}
    return RoundsProof(b.high, schedule, b.low_method, [nodes[i] for i in b.clique],
                       b.high_method)


def fewest_rounds_bounds(
    G: nx.Graph,
    pins: Pins | None = None,
    exclusions: Exclusions | None = None,
    hooks: Hooks | None = None,
) -> RoundsBounds:
    """Proven bounds on the fewest rounds with the method of each side, as far as the budget
    allows (BOUNDS_SECONDS when the caller gives none)."""
    hooks = begin(hooks)
    if hooks.deadline is None:
        hooks = hooks.part(seconds=BOUNDS_SECONDS)
    b, nodes = _fewest(G, pins, exclusions, hooks, partial=True)
    schedule = {node: b.colouring[i] for i, node in enumerate(nodes)}
    return RoundsBounds(b.low, b.high, b.low_method, b.high_method, schedule)


def min_rounds_bounds(
    G: nx.Graph,
    pins: Pins | None = None,
    exclusions: Exclusions | None = None,
    hooks: Hooks | None = None,
) -> tuple[int, int]:
    """Proven (low, high) for the fewest rounds (fewest_rounds_bounds without the methods)."""
    b = fewest_rounds_bounds(G, pins, exclusions, hooks)
    return b.low, b.high


def sample_assignment(
    G: nx.Graph,
    k: int,
    rng: random.Random,
    pins: Pins | None = None,
    exclusions: Exclusions | None = None,
    hooks: Hooks | None = None,
) -> dict[Hashable, int]:
    """One valid assignment (node -> round in 1..k) drawn uniformly from all of them;
    raises NoAssignment when there is none."""
    return sample_assignments(G, k, rng, 1, pins, exclusions, hooks)[0]


def sample_assignments(
    G: nx.Graph,
    k: int,
    rng: random.Random,
    count: int,
    pins: Pins | None = None,
    exclusions: Exclusions | None = None,
    hooks: Hooks | None = None,
) -> list[dict[Hashable, int]]:
    """`count` independent uniform draws (the counting tables are built once for all)."""
    _check_k(k)
    hooks = begin(hooks)
    hooks.report(0.0, "starting")
    g, nodes, ip, ie = _prepare(G, pins, exclusions)
    if g.n == 0:
        return [{} for _ in range(count)]
    t = transform(g, k, ip, ie) if k > 0 else None
    if t is None:
        raise NoAssignment(f"no valid assignment with {k} rounds")
    with hooks.window(0.0, 0.9):
        sampler = Sampler(t.graph, k, hooks)
    if not sampler.possible:
        raise NoAssignment(f"no valid assignment with {k} rounds")
    out = []
    for i in range(count):
        if i % 64 == 0:
            hooks.report(0.9 + 0.1 * i / count, "drawing")
        rounds = assignment_back(t, sampler.draw(rng), k)
        out.append({node: rounds[j] for j, node in enumerate(nodes)})
    hooks.report(1.0, "done")
    return out


def estimate_assignments(
    G: nx.Graph,
    k: int,
    pins: Pins | None = None,
    exclusions: Exclusions | None = None,
    hooks: Hooks | None = None,
) -> Estimate:
    """An estimate (never exact) of count_assignments, with an approximate interval."""
    return estimate_counts(G, k, pins, exclusions, hooks)[0]


def estimate_counts(
    G: nx.Graph,
    k: int,
    pins: Pins | None = None,
    exclusions: Exclusions | None = None,
    hooks: Hooks | None = None,
) -> tuple[Estimate, Estimate]:
    """Estimates (never exact) of count_assignments and count_all_rounds_used at k, from the
    same sequential importance sampling draws, each with an approximate interval."""
    return _counted(_estimates, G, k, pins, exclusions, hooks)


def _estimates(
    g: Graph, k: int, ip: dict[int, int], ie: dict[int, set[int]], hooks: Hooks
) -> tuple[Estimate, Estimate]:
    """The two estimates of estimate_counts on the engine's graph."""
    doms = domains_for(g.n, k, ip, ie) if k > 0 else None
    if doms is None or (g.loop and g.n):
        zero = 1 if g.n == 0 else 0
        none = Estimate(zero, zero, zero, "exact: no assignment is possible")
        return none, none
    est, every = summarise(*estimate_draws(g, doms, k, hooks), doms)
    if k > g.n:
        every = Estimate(0, 0, 0, "exact: more rounds than fixtures, so some round is empty")
    return est, every
