"""How often the estimates' "95%" intervals hold the true count, over graphs whose exact count
is known (published or computed exactly by the engine), under relabellings and seeds.

    python -m benchmarks.coverage [--draws N ...] [--labellings L] [--cases NAME ...]

For each graph, K and labelling, the sampler's draws (engine.estimate.sis_draws, the draws
`count` uses) give an estimate of the assignments and of those using every round, and the
groupings as every-round-used / K!; a row says in how many of the runs the interval held the
exact value, how many misses fell below and above, and the median high / low ratio; the
column `normal` says how often the plain mean +/- 1.96 standard errors (the interval used
before) held it.
"""

from __future__ import annotations

import argparse
import math
import random
import statistics
import time
from pathlib import Path

import networkx as nx

from benchmarks.bench import DEFAULT_CASES
from benchmarks.case_leagues import named_graph
from leaguegrid import engine
from leaguegrid.engine.chromatic_number import domains_for
from leaguegrid.engine.estimate import _normal_interval, sis_draws, summarise
from leaguegrid.engine.graph import from_networkx

# (case, K, published value or None, source): published values are checked before use.
CASES = [
    ("rook-4x4", 4, 576, "OEIS A002860"),
    ("rook-5x5", 5, 161280, "OEIS A002860"),
    ("rook-6x6", 6, 812851200, "OEIS A002860"),
    ("roundrobin-6", 5, 6 * math.factorial(5), "OEIS A000438 x 5!"),
    ("roundrobin-8", 7, 6240 * math.factorial(7), "OEIS A000438 x 7!"),
    ("petersen", 3, None, ""),
    ("petersen", 4, None, ""),
    ("grid-4x4", 3, None, ""),
    ("grid-5x5", 3, None, ""),
    ("grid-6x6", 3, None, ""),
    ("grid-4x8", 3, None, ""),
    ("grid-6x8", 3, None, ""),
    ("grid-8x8", 3, None, ""),
    ("grid-5x10", 3, None, ""),
    ("grid-10x10", 3, None, ""),
    ("grid-3x12", 3, None, ""),
    ("grid-7x7", 3, None, ""),
    ("grid-5x5", 4, None, ""),
    ("grid-6x6", 4, None, ""),
    ("torus-4x4", 3, None, ""),
    ("torus-6x6", 3, None, ""),
    ("torus-4x8", 3, None, ""),
    ("torus-6x8", 3, None, ""),
    ("torus-8x8", 3, None, ""),
    ("torus-5x5", 3, None, ""),
    ("torus-5x8", 3, None, ""),
    ("queen-5x5", 5, None, ""),
    ("queen-6x6", 7, None, ""),
    ("queen-7x7", 7, None, ""),
    ("gnp-20-0.3", 4, None, ""),
    ("gnp-20-0.3", 5, None, ""),
    ("gnp-25-0.3", 5, None, ""),
    ("gnp-30-0.2", 4, None, ""),
    ("gnp-30-0.2", 5, None, ""),
    ("club-40", 4, None, ""),
    ("club-40", 5, None, ""),
    ("season-2x6", 6, None, ""),
    ("season-2x6", 7, None, ""),
]


def queen(n: int) -> nx.Graph:
    """The n x n queen graph: squares clash on a row, a column or a diagonal."""
    G = nx.Graph()
    cells = [(i, j) for i in range(n) for j in range(n)]
    G.add_nodes_from(cells)
    for a in cells:
        for b in cells:
            if a < b and (a[0] == b[0] or a[1] == b[1] or abs(a[0] - b[0]) == abs(a[1] - b[1])):
                G.add_edge(a, b)
    return nx.convert_node_labels_to_integers(G)


def graph(name: str, cases_file: Path = DEFAULT_CASES) -> nx.Graph:
    """The networkx graph of a case name."""
    if name.startswith("queen-"):
        return queen(int(name.split("-")[1].split("x")[0]))
    n, edges = named_graph(name, cases_file)
    G = nx.Graph()
    G.add_nodes_from(range(n))
    G.add_edges_from(edges)
    return G


def relabelled(G: nx.Graph, seed: int) -> nx.Graph:
    """G with its vertices renumbered by a seeded shuffle (0: as it is)."""
    if seed == 0:
        return G
    order = list(G.nodes)
    random.Random(seed).shuffle(order)
    H = nx.Graph()
    H.add_nodes_from(range(len(order)))
    index = {v: i for i, v in enumerate(order)}
    H.add_edges_from((index[u], index[v]) for u, v in G.edges)
    return H


def one_run(G: nx.Graph, k: int, draws: int, seed: int) -> tuple[list, list]:
    """The three estimates of one run (assignments, every round used, groupings), and the
    plain normal intervals (low, high) of the same three."""
    g, _ = from_networkx(G)
    doms = domains_for(g.n, k, {}, {})
    weights, full = sis_draws(g, doms, k, engine.Hooks(), random.Random(seed), draws)
    est, every = summarise(weights, full, doms)
    f = math.factorial(k)
    groups = engine.Estimate(every.value // f, -(-every.low // f), -(-every.high // f),
                             every.method, every.samples, every.found)
    plain = [_normal_interval(weights), _normal_interval(full)]
    plain.append((-(-plain[1][0] // f), -(-plain[1][1] // f)))
    return [est, every, groups], plain


def main(argv: list[str] | None = None) -> int:
    ap = argparse.ArgumentParser(prog="python -m benchmarks.coverage", description=__doc__)
    ap.add_argument("--draws", type=int, nargs="+", default=[2000])
    ap.add_argument("--labellings", type=int, default=4)
    ap.add_argument("--cases", nargs="*", metavar="NAME")
    ap.add_argument("--cases-file", type=Path, default=DEFAULT_CASES,
                    help="the benchmark cases.py (default ../shared/bench/cases.py)")
    args = ap.parse_args(argv)
    wanted = [c for c in CASES if not args.cases or c[0] in args.cases]
    quantities = ("assignments", "every round used", "groupings")
    totals = {(q, d): [0, 0, 0, 0] for q in quantities for d in args.draws}
    print(f"{'case':<14} {'K':>2} {'draws':>5} {'quantity':<17} {'held':>5} {'below':>5} "
          f"{'above':>5} {'high/low':>9} {'normal':>6} {'s':>6}")
    for name, k, published, source in wanted:
        G = graph(name, args.cases_file)
        exact = engine.count_assignments(G, k)
        if published is not None:
            assert exact == published, f"{name} at {k}: {exact} != {published} ({source})"
        every = engine.count_all_rounds_used(G, k)
        truth = (exact, every, every // math.factorial(k))
        for draws in args.draws:
            rows = {q: [0, 0, 0, [], 0] for q in quantities}
            started = time.perf_counter()
            for lab in range(args.labellings):
                H = relabelled(G, lab)
                ests, plain = one_run(H, k, draws, 1000 + lab)
                for q, est, (lo, hi), true in zip(quantities, ests, plain, truth, strict=True):
                    r = rows[q]
                    r[0 if est.low <= true <= est.high else (1 if est.high < true else 2)] += 1
                    r[4] += lo <= true <= hi
                    if est.low > 0:
                        r[3].append(est.high / est.low)
            seconds = time.perf_counter() - started
            for q in quantities:
                held, below, above, ratios, normal = rows[q]
                for i, x in enumerate((held, below, above, normal)):
                    totals[(q, draws)][i] += x
                ratio = f"{statistics.median(ratios):.2f}" if ratios else "-"
                print(f"{name:<14} {k:>2} {draws:>5} {q:<17} {held:>5} {below:>5} {above:>5} "
                      f"{ratio:>9} {normal:>6} {seconds:>6.1f}", flush=True)
    print()
    for (q, draws), (held, below, above, normal) in totals.items():
        runs = held + below + above
        print(f"all cases, {draws} draws, {q}: held {held} of {runs} "
              f"({100 * held / max(runs, 1):.1f}%), below {below}, above {above}; "
              f"normal interval held {normal} ({100 * normal / max(runs, 1):.1f}%)")
    return 0


if __name__ == "__main__":
    raise SystemExit(main())
