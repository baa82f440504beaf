"""Benchmark runner: times the engine on the shared benchmark graphs and the demo leagues.

    python -m benchmarks.bench [CASE ...] [--mode poly|fixed|table|cancel|window|fewest]
                               [--reference sage|networkx]

Modes: poly (the whole polynomial), fixed (the published fixed-K counts, checked), table
(the fewest rounds and the counts table up to fewest + 4), cancel (cancel a running
polynomial, or the 10-team round-robin's count at 9 rounds, from another thread after 1 s
and time how long the engine takes to return),
window (the desktop window counts a demo league for 4 s, offscreen, while a 10 ms timer
measures the event loop's largest gap; then Cancel; target: largest gap under 200 ms),
fewest (the fewest rounds of the DIMACS Mycielski and queen graphs, each exact method timed
against the others: benchmarks/dimacs.py).

Each case runs in a fresh child process (so the peak resident memory is that case's own),
with a time limit. The graphs come from ../shared/bench/cases.py beside the repository
(loaded at run time, not copied), or from --cases PATH. With --reference, the same case is
run through a reference implementation in a scratch environment (default /tmp/refenv, see
../shared/bench/README.md) and the ratio of times is printed; the published times of the
deletion-contraction program listed in that README are compared as well.
"""

from __future__ import annotations

import argparse
import hashlib
import importlib.util
import json
import os
import re
import resource
import statistics
import subprocess
import sys
import time
from pathlib import Path
from types import ModuleType

import networkx as nx

REPO = Path(__file__).resolve().parents[1]
DEFAULT_CASES = REPO.parent / "shared" / "bench" / "cases.py"
LIMIT = 120.0


def load_cases(path: Path) -> ModuleType:
    """Import the benchmark cases module from its path, with a clear error when missing."""
    if not path.is_file():
        raise SystemExit(
            f"benchmark cases not found at {path}; pass --cases PATH to the cases.py file"
        )
    spec = importlib.util.spec_from_file_location("leaguegrid_bench_cases", path)
    module = importlib.util.module_from_spec(spec)
    assert spec.loader is not None
    spec.loader.exec_module(module)
    return module


def hpr_times(readme: Path) -> dict[str, float | None]:
    """The deletion-contraction program's listed times per case (None where it did not finish)."""
    out: dict[str, float | None] = {}
    if not readme.is_file():
        return out
    for line in readme.read_text(encoding="utf-8").splitlines():
        cells = [c.strip() for c in line.strip().strip("|").split("|")]
        if len(cells) == 4 and re.fullmatch(r"\d+/\d+", cells[1]):
            m = re.fullmatch(r"([\d.]+) s", cells[3])
            out[cells[0]] = float(m.group(1)) if m else None
    return out


def graph_of(n: int, edges: list[tuple[int, int]]) -> nx.Graph:
    """The networkx graph of a case."""
    G = nx.Graph()
    G.add_nodes_from(range(n))
    G.add_edges_from(edges)
    return G


def demo_graphs() -> dict[str, nx.Graph]:
    """Clash graphs of the demo leagues, when the reader and clash-graph modules exist."""
    try:
        from leaguegrid.clashes.graph import build_clash_graph
        from leaguegrid.io.read.league_reader import load_league
    except ImportError:
        return {}
    out = {}
    for path in sorted((REPO / "demo_leagues").glob("*.xlsx")):
        result = load_league(path)
        if result.league is not None:
            out[f"demo:{path.stem}"] = build_clash_graph(result.league)
    return out


def digest(text: str) -> str:
    """A short digest of a result's text form."""
    return hashlib.sha256(text.encode()).hexdigest()[:12]


def run_one(G: nx.Graph, mode: str, k: int | None) -> dict:
    """Run the engine on one graph in this process; the result as a JSON-able dict."""
    from leaguegrid import engine

    t = time.perf_counter()
    c = time.process_time()
    try:
        value, text = _compute(G, mode, k)
    except engine.BudgetExceeded as exc:
        value, text, stopped = None, "", str(exc)
    else:
        stopped = None
    seconds = time.perf_counter() - t
    cpu = time.process_time() - c
    peak = resource.getrusage(resource.RUSAGE_SELF).ru_maxrss / 1024  # KiB -> MiB on Linux
    return {
        "seconds": seconds,
        "cpu": cpu,
        "peak_mib": peak,
        "digest": digest(text),
        "value": value,
        "stopped": stopped,
    }


def _compute(G: nx.Graph, mode: str, k: int | None) -> tuple[int | None, str]:
    """The mode's result (a count or None) and its text for the digest."""
    from leaguegrid import engine

    if mode == "poly":
        p = engine.chromatic_polynomial(G)
        return None, " ".join(str(int(c)) for c in reversed(p.coeffs()))
    if mode == "fixed":
        value = engine.count_assignments(G, k)
        return value, str(value)
    low = engine.min_rounds(G)
    table = engine.count_table(G, range(low, low + 5))
    return None, repr((low, sorted(table.items())))


def child(args: argparse.Namespace) -> None:
    """Entry point of the child process: run one case, print one JSON line."""
    G = case_graph(args)
    print(json.dumps(run_one(G, args.mode, args.k)))


def case_graph(args: argparse.Namespace) -> nx.Graph:
    """The graph named by args.one (a benchmark case or a demo league)."""
    if args.one.startswith("demo:"):
        return demo_graphs()[args.one]
    cases = load_cases(Path(args.cases))
    table = {**cases.CASES, **getattr(cases, "HARD", {})}
    n, edges = table[args.one]
    return graph_of(n, edges)


def in_child(name: str, args: argparse.Namespace, k: int | None) -> dict | None:
    """Run one case in a fresh process with the time limit; None when it did not finish."""
    cmd = [sys.executable, "-m", "benchmarks.bench", "--one", name, "--mode", args.mode]
    cmd += ["--cases", str(args.cases)]
    if k is not None:
        cmd += ["--k", str(k)]
    env = dict(os.environ, PYTHONPATH=str(REPO) + os.pathsep + os.environ.get("PYTHONPATH", ""))
    try:
        out = subprocess.run(
            cmd, capture_output=True, text=True, timeout=args.limit, env=env, check=True
        )
    except subprocess.TimeoutExpired:
        return None
    except subprocess.CalledProcessError as exc:
        return {"error": exc.stderr.strip().splitlines()[-1] if exc.stderr else "failed"}
    return json.loads(out.stdout.strip().splitlines()[-1])


def reference(name: str, engine: str, python: str, limit: float) -> dict | None:
    """Run the reference implementation on one case; None when it did not finish."""
    script = DEFAULT_CASES.parent / "reference.py"
    try:
        out = subprocess.run(
            [python, str(script.name), engine, name],
            capture_output=True,
            text=True,
            timeout=limit,
            cwd=script.parent,
            check=True,
        )
    except subprocess.TimeoutExpired:
        return None
    fields = out.stdout.split()
    return {"seconds": float(fields[0]), "digest": digest(" ".join(fields[1:]))}


def fmt(x: float | None) -> str:
    return "-" if x is None else f"{x:.3f}"


def ratio_text(theirs: float | None, ours: float | None, limit: float, into: list[float]) -> str:
    """Their seconds over ours, kept in `into`: '>' marks a lower bound (they did not finish and
    count at the limit); '<1' when only ours did not finish; '-' when neither did."""
    if ours is None:
        return "-" if theirs is None else "<1"
    ratio = (theirs if theirs is not None else limit) / max(ours, 1e-9)
    into.append(ratio)
    return f">{ratio:.0f}" if theirs is None else f"{ratio:.1f}"


def cancel_latency(
    G: nx.Graph, after: float, k: int | None = None, wait: float | None = None
) -> tuple[float, str]:
    """Start the exact polynomial (or the count at k rounds) in a thread, cancel it after
    `after` seconds: the seconds until the engine returned (or `wait`, when given and it did
    not), and how it ended ("finished", "cancelled", "stopped: ..." or "no answer")."""
    import threading

    from leaguegrid import engine

    cancel = threading.Event()
    ended: list[str] = []

    def work() -> None:
        try:
            if k is None:
                engine.chromatic_polynomial(G, engine.Hooks(cancel=cancel))
            else:
                engine.count_assignments(G, k, hooks=engine.Hooks(cancel=cancel))
            ended.append("finished")
        except engine.Cancelled:
            ended.append("cancelled")
        except engine.BudgetExceeded as exc:
            ended.append(f"stopped: {exc}")

    t = threading.Thread(target=work, daemon=True)
    t.start()
    t.join(after)
    cancel.set()
    asked = time.perf_counter()
    t.join(wait)
    return time.perf_counter() - asked, ended[0] if ended else "no answer"


CANCEL_CASES = [("roundrobin-8", None), ("rook-5x5", None), ("roundrobin-10", 9)]


def cancel_table(cases: ModuleType, wanted: list[str]) -> int:
    """Cancel each long case 1 s in (the polynomial, or the count at K on the array path)
    and print how long the engine took to return."""
    table = {**cases.CASES, **getattr(cases, "HARD", {})}
    print(f"{'case':<16}{'K':>4}{'cancel -> return s':>20}  outcome")
    for name, k in [(n, None) for n in wanted] or CANCEL_CASES:
        latency, how = cancel_latency(graph_of(*table[name]), 1.0, k)
        print(f"{name:<16}{k or '':>4}{latency:>20.3f}  {how}", flush=True)
    return 0


def window_latency(leagues: list[str]) -> int:
    """The window's responsiveness while the engine counts each demo league, then Cancel."""
    from benchmarks.window_probe import measure

    print(f"{'league':<16}{'largest gap ms':>16}{'p99 gap ms':>12}{'cancel s':>10}")
    for name in leagues:
        got = measure(REPO / "demo_leagues" / f"{name}.xlsx", seconds=4.0)
        print(f"{name:<16}{got['largest_gap_ms']:>16.0f}{got['p99_gap_ms']:>12.0f}"
              f"{got['cancel_seconds']:>10.2f}", flush=True)
    return 0


def main(argv: list[str] | None = None) -> int:
    ap = argparse.ArgumentParser(prog="python -m benchmarks.bench", description=__doc__)
    ap.add_argument("cases_wanted", nargs="*", metavar="CASE", help="cases to run (default all)")
    ap.add_argument("--mode", choices=["poly", "fixed", "table", "cancel", "window", "fewest"],
                    default="poly")
    ap.add_argument("--reference", choices=["sage", "networkx"])
    ap.add_argument("--refpython", default="/tmp/refenv/bin/python")
    ap.add_argument("--cases", default=str(DEFAULT_CASES))
    ap.add_argument("--limit", type=float, default=LIMIT, help="seconds per case (default 120)")
    ap.add_argument("--cpsat-python", help="an interpreter with ortools, for --mode fewest")
    ap.add_argument("--one", help=argparse.SUPPRESS)
    ap.add_argument("--k", type=int, help=argparse.SUPPRESS)
    args = ap.parse_args(argv)
    from leaguegrid.engine import keep_freed_memory

    keep_freed_memory()  # as the `leaguegrid` command sets the allocator up
    if args.one:
        child(args)
        return 0
    if args.mode == "fewest":
        from benchmarks.dimacs import fewest_table

        return fewest_table(args.limit, args.cpsat_python, args.cases_wanted)
    if args.mode == "window":
        return window_latency(args.cases_wanted or ["bigseason"])
    cases = load_cases(Path(args.cases))
    if args.mode == "cancel":
        return cancel_table(cases, args.cases_wanted)
    hpr = hpr_times(Path(args.cases).parent / "README.md")
    jobs: list[tuple[str, int | None, int | None, nx.Graph]] = []
    if args.mode == "fixed":
        table = {**cases.CASES, **getattr(cases, "HARD", {})}
        for name, k, expected in cases.FIXED_K:
            jobs.append((name, k, expected, graph_of(*table[name])))
    else:
        for name, (n, edges) in cases.CASES.items():
            if args.mode == "table" and not name.startswith(("season-", "clubday-", "club-")):
                continue
            jobs.append((name, None, None, graph_of(n, edges)))
        for name, G in demo_graphs().items():
            jobs.append((name, None, None, G))
    if args.cases_wanted:
        jobs = [j for j in jobs if j[0] in args.cases_wanted]
    head = f"{'case':<16}{'V':>4}{'E':>5}{'K':>4}{'seconds':>10}{'cpu s':>9}{'peak MiB':>10}"
    head += f"  {'digest':<14}"
    if args.reference:
        head += f"{args.reference + ' s':>12}{'ratio':>9}"
    if args.mode == "poly":
        head += f"{'HPR s':>9}{'HPR/ours':>10}"
    print(head)
    ratios: list[float] = []
    ref_ratios: list[float] = []
    for name, k, expected, G in jobs:
        res = in_child(name, args, k)
        secs = res.get("seconds") if res else None
        line = f"{name:<16}{G.number_of_nodes():>4}{G.number_of_edges():>5}{k or '':>4}"
        if res is None:
            line += f"{'>' + str(int(args.limit)):>10}{'-':>9}{'-':>10}  {'not finished':<14}"
        elif "error" in res:
            line += f"  error: {res['error']}"
            secs = None
        elif res.get("stopped"):
            line += f"{'-':>10}{res['cpu']:>9.3f}{res['peak_mib']:>10.0f}"
            line += f"  stopped: {res['stopped']}"
            secs = None
        else:
            dg = res["digest"]
            if expected is not None:
                dg = "ok" if res["value"] == expected else f"WRONG {res['value']}"
            line += f"{secs:>10.3f}{res['cpu']:>9.3f}{res['peak_mib']:>10.0f}  {dg:<14}"
        if args.reference and name.startswith("demo:"):
            line += f"{'n/a':>12}{'-':>9}"  # the reference script knows the shared cases only
        elif args.reference:
            ref = reference(name, args.reference, args.refpython, args.limit)
            rsec = ref["seconds"] if ref else None
            agree = "" if not (ref and res and "digest" in res) else (
                "" if ref["digest"] == res["digest"] else " DIFFERENT"
            )
            line += f"{fmt(rsec):>12}{ratio_text(rsec, secs, args.limit, ref_ratios):>9}{agree}"
        if args.mode == "poly":
            h = hpr.get(name)
            line += f"{fmt(h):>9}"
            if name in hpr:
                line += f"{ratio_text(h, secs, args.limit, ratios):>10}"
        print(line, flush=True)
    for who, got in ((args.reference, ref_ratios), ("HPR", ratios)):
        if got:
            print(f"median {who}/ours over {len(got)} cases (a side that did not finish counted "
                  f"at the {int(args.limit)} s limit, so '>' marks a lower bound): "
                  f"{statistics.median(got):.1f}")
    return 0


if __name__ == "__main__":
    sys.exit(main())
