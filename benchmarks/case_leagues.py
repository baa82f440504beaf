"""League workbooks made from benchmark graphs, so that `leaguegrid count` can be timed on them.

    python -m benchmarks.case_leagues OUTDIR CASE ...

A case is a name from ../shared/bench/cases.py (CASES or HARD), or `grid-AxB`, `torus-AxB` or
`rook-AxB` of any size. Each fixture gets two teams of its own; every clash edge becomes a
Clashes row between the two fixtures, so the league's clash graph is the case's graph.
"""

from __future__ import annotations

import argparse
import itertools
import re
from pathlib import Path

from openpyxl import Workbook

from benchmarks.bench import DEFAULT_CASES, load_cases


def named_graph(name: str, cases_path: Path = DEFAULT_CASES) -> tuple[int, list[tuple[int, int]]]:
    """(n, edges) of a benchmark case or of a grid, torus or rook's graph of any size."""
    m = re.fullmatch(r"(grid|torus|rook)-(\d+)x(\d+)", name)
    if m:
        kind, a, b = m.group(1), int(m.group(2)), int(m.group(3))
        cells = [(i, j) for i in range(a) for j in range(b)]
        index = {c: x for x, c in enumerate(cells)}
        if kind == "rook":
            edges = [(x, y) for x, y in itertools.combinations(range(len(cells)), 2)
                     if cells[x][0] == cells[y][0] or cells[x][1] == cells[y][1]]
        else:
            wrap = kind == "torus"
            edges = set()
            for i, j in cells:
                for di, dj in ((0, 1), (1, 0)):
                    ni, nj = i + di, j + dj
                    if wrap:
                        ni, nj = ni % a, nj % b
                    if (ni, nj) in index and (ni, nj) != (i, j):
                        edges.add(tuple(sorted((index[(i, j)], index[(ni, nj)]))))
            edges = sorted(edges)
        return len(cells), edges
    cases = load_cases(cases_path)
    table = {**cases.CASES, **getattr(cases, "HARD", {})}
    return table[name]


def write_league(path: Path, n: int, edges: list[tuple[int, int]]) -> Path:
    """A workbook whose clash graph is (n, edges): one fixture per vertex, Clashes rows."""
    wb = Workbook()
    fixtures = wb.active
    fixtures.title = "Fixtures"
    fixtures.append(["Fixture", "Home", "Away"])
    for v in range(n):
        fixtures.append([f"G{v}", f"H{v}", f"A{v}"])
    clashes = wb.create_sheet("Clashes")
    clashes.append(["First", "Second", "Reason"])
    for u, v in edges:
        clashes.append([f"fixture: G{u}", f"fixture: G{v}", "graph edge"])
    wb.save(path)
    return path


def main(argv: list[str] | None = None) -> int:
    ap = argparse.ArgumentParser(prog="python -m benchmarks.case_leagues", description=__doc__)
    ap.add_argument("outdir", type=Path)
    ap.add_argument("cases", nargs="+")
    ap.add_argument("--cases-file", type=Path, default=DEFAULT_CASES,
                    help="the benchmark cases.py (default ../shared/bench/cases.py)")
    args = ap.parse_args(argv)
    args.outdir.mkdir(parents=True, exist_ok=True)
    for name in args.cases:
        n, edges = named_graph(name, args.cases_file)
        print(write_league(args.outdir / f"{name}.xlsx", n, edges))
    return 0


if __name__ == "__main__":
    raise SystemExit(main())
