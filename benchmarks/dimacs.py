"""The fewest rounds on DIMACS colouring benchmark graphs: the exact methods timed side by side.

    python -m benchmarks.bench --mode fewest [--limit SECONDS] [--cpsat-python PYTHON]

Graphs (built here, not read from files): the Mycielski graphs myciel3..myciel5
(networkx.mycielski_graph(i + 1)) and the queen graphs queen5_5..queen8_8 (a vertex per square,
an edge where a queen could move between the two squares). Their published chromatic numbers
and sizes are those of the DIMACS colouring challenge instances (D. S. Johnson and M. A. Trick,
eds., "Cliques, Coloring, and Satisfiability: Second DIMACS Implementation Challenge", 1996;
the instance files list each edge once per direction for the queen graphs, so 2 x the edges
below). Methods: "portfolio" (what `count` uses: engine.min_rounds_proof), "dsatur" (the same
with DSatur backtracking alone below, no SAT solver), "sat" (the SAT solver for every k), and
"cpsat" (OR-tools CP-SAT with one worker, all-different on every maximal clique, run by
another interpreter that has ortools: --cpsat-python; never a dependency).
"""

from __future__ import annotations

import argparse
import json
import os
import subprocess
import sys
import time
from pathlib import Path

import networkx as nx

REPO = Path(__file__).resolve().parents[1]

# name -> (vertices, edges, chromatic number), as published for the DIMACS instances
PUBLISHED = {
    "myciel3": (11, 20, 4),
    "myciel4": (23, 71, 5),
    "myciel5": (47, 236, 6),
    "queen5_5": (25, 160, 5),
    "queen6_6": (36, 290, 7),
    "queen7_7": (49, 476, 7),
    "queen8_8": (64, 728, 9),
}
METHODS = ("portfolio", "dsatur", "sat", "cpsat")


def queen_graph(n: int) -> nx.Graph:
    """The n x n queen graph: squares (row, column), adjacent when on one row, column or
    diagonal."""
    G = nx.Graph()
    squares = [(r, c) for r in range(n) for c in range(n)]
    G.add_nodes_from(squares)
    for i, (r, c) in enumerate(squares):
        for s, d in squares[i + 1:]:
            if r == s or c == d or abs(r - s) == abs(c - d):
                G.add_edge((r, c), (s, d))
    return G


def dimacs_graph(name: str) -> nx.Graph:
    """myciel3..myciel5 or queen5_5..queen8_8."""
    if name.startswith("myciel"):
        return nx.mycielski_graph(int(name[len("myciel"):]) + 1)
    return queen_graph(int(name.split("_")[1]))


def run_method(G: nx.Graph, method: str) -> dict:
    """The fewest rounds of G by one method, with its seconds and both sides' methods."""
    if method == "cpsat":
        from ortools.sat.python import cp_model  # noqa: F401 (imported before the clock starts)

        t = time.perf_counter()
        return {"rounds": cpsat_rounds(G), "seconds": time.perf_counter() - t}
    from leaguegrid import engine
    from leaguegrid.engine import fewest

    t = time.perf_counter()

    if method == "dsatur":
        fewest.SEARCH_NODES = None  # backtracking without a node limit, never the SAT solver
    elif method == "sat":
        fewest.SEARCH_NODES = 0  # straight to the SAT solver at every k
    proof = engine.min_rounds_proof(G)
    ok = all(proof.schedule[u] != proof.schedule[v] for u, v in G.edges)
    return {"rounds": proof.rounds, "seconds": time.perf_counter() - t, "lower": proof.lower,
            "upper": proof.upper, "valid": ok and max(proof.schedule.values()) == proof.rounds}


def cpsat_rounds(G: nx.Graph) -> int:
    """The chromatic number by CP-SAT: a clique below, then each k up until feasible."""
    from ortools.sat.python import cp_model

    clique = max(nx.find_cliques(G), key=len)
    cliques = [q for q in nx.find_cliques(G) if len(q) >= 3]
    k = len(clique)
    while True:
        m = cp_model.CpModel()
        x = {v: m.NewIntVar(0, k - 1, str(i)) for i, v in enumerate(G)}
        for u, v in G.edges:
            m.Add(x[u] != x[v])
        for q in cliques:
            m.AddAllDifferent([x[v] for v in q])
        for r, v in enumerate(clique):
            m.Add(x[v] == r)
        solver = cp_model.CpSolver()
        solver.parameters.num_workers = 1
        status = solver.Solve(m)
        if status in (cp_model.OPTIMAL, cp_model.FEASIBLE):
            return k
        if status != cp_model.INFEASIBLE:
            raise RuntimeError(f"CP-SAT answered {solver.StatusName(status)}")
        k += 1


def in_child(name: str, method: str, python: str, limit: float) -> dict | None:
    """One graph and method in a fresh process; None when it did not finish in time."""
    cmd = [python, "-m", "benchmarks.dimacs", "--one", name, "--method", method]
    env = dict(os.environ, PYTHONPATH=str(REPO) + os.pathsep + os.environ.get("PYTHONPATH", ""))
    try:
        out = subprocess.run(cmd, capture_output=True, text=True, timeout=limit, cwd=REPO,
                             env=env, check=True)
    except subprocess.TimeoutExpired:
        return None
    except subprocess.CalledProcessError as exc:
        return {"error": (exc.stderr.strip().splitlines() or ["failed"])[-1]}
    return json.loads(out.stdout.strip().splitlines()[-1])


def fewest_table(limit: float, cpsat_python: str | None, wanted: list[str]) -> int:
    """Print seconds per graph and method, with the published chromatic number beside."""
    methods = [m for m in METHODS if m != "cpsat" or cpsat_python]
    head = f"{'graph':<10}{'V':>4}{'E':>5}{'chi':>5}  {'proof below / above':<20}"
    print(head + "".join(f"{m + ' s':>12}" for m in methods))
    for name in wanted or list(PUBLISHED):
        n, m, chi = PUBLISHED[name]
        G = dimacs_graph(name)
        if (G.number_of_nodes(), G.number_of_edges()) != (n, m):
            raise SystemExit(f"{name}: built {G.number_of_nodes()}/{G.number_of_edges()}, "
                             f"published {n}/{m}")
        cells, how = [], ""
        for method in methods:
            python = cpsat_python if method == "cpsat" else sys.executable
            got = in_child(name, method, python, limit)
            if got is None:
                cells.append(f">{limit:.0f}")
            elif "error" in got:
                cells.append("error")
                print(f"  {method}: {got['error']}", file=sys.stderr)
            elif got["rounds"] != chi or not got.get("valid", True):
                cells.append(f"WRONG {got['rounds']}")
            else:
                cells.append(f"{got['seconds']:.2f}")
                if method == "portfolio":
                    how = f"{got['lower']} / {got['upper']}"
        print(f"{name:<10}{n:>4}{m:>5}{chi:>5}  {how:<20}" + "".join(f"{c:>12}" for c in cells),
              flush=True)
    return 0


def main(argv: list[str] | None = None) -> int:
    ap = argparse.ArgumentParser(prog="python -m benchmarks.dimacs", description=__doc__)
    ap.add_argument("graphs", nargs="*", metavar="GRAPH")
    ap.add_argument("--limit", type=float, default=60.0)
    ap.add_argument("--cpsat-python")
    ap.add_argument("--one", help=argparse.SUPPRESS)
    ap.add_argument("--method", choices=METHODS, help=argparse.SUPPRESS)
    args = ap.parse_args(argv)
    if args.one:
        print(json.dumps(run_method(dimacs_graph(args.one), args.method)))
        return 0
    return fewest_table(args.limit, args.cpsat_python, args.graphs)


if __name__ == "__main__":
    sys.exit(main())
