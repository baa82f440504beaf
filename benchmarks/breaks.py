"""Breaks benchmark: the schedules `leaguegrid plan` makes, against the published bound.

    python -m benchmarks.breaks [--quick]

Families (invented leagues, written as workbooks and read by the reader, as a coordinator's
would be): single round robins of 6-30 teams (n even, n - 1 rounds; bound n - 2, de Werra
1981), odd counts with byes (n rounds; bound 0), double round robins with a return half
(2n - 2 rounds; bound 2n - 4), mirrored double round robins (bound 3n - 6; n odd: n), two
divisions whose clubs share grounds, the association season of the demo leagues (8 divisions
of 10, return half, shared grounds, blocked dates, clashes; bound 8 x 16), and round robins
given on a Fixtures sheet (home sides the coordinator's, in a shuffled order, so the generator
cannot start from its own timetable). Beside each: the breaks of a uniform draw with the same
seed where the exact count that draws need finishes within the budget, and the seconds.
"""

from __future__ import annotations

import argparse
import random
import tempfile
import time
from pathlib import Path

import openpyxl

from leaguegrid.app import league as opening
from leaguegrid.app import planning
from leaguegrid.app.demos import demo_leagues
from leaguegrid.core.round_robin import pairings
from leaguegrid.engine import Hooks, keep_freed_memory

BUDGET = 30.0  # seconds for each plan


def teams_book(folder: Path, name: str, divisions: list[list[tuple[str, str]]],
               legs: int = 1, return_half: bool | str = False) -> Path:
    """A Teams-only workbook: each division a list of (team, ground)."""
    book = openpyxl.Workbook()
    sheet = book.active
    sheet.title = "Teams"
    sheet.append(["Team", "Venue", "Division"])
    for d, members in enumerate(divisions):
        for team, ground in members:
            sheet.append([team, ground, f"Division {d + 1}"])
    settings = book.create_sheet("Settings")
    settings.append(["Setting", "Value"])
    settings.append(["Legs", legs])
    settings.append(["Start date", "2027-03-06"])
    if return_half:
        settings.append(["Return half", "yes" if return_half is True else return_half])
    path = folder / f"{name}.xlsx"
    book.save(path)
    return path


def fixtures_book(folder: Path, name: str, n: int, seed: int) -> Path:
    """A Fixtures sheet of a single round robin (home sides balanced), rows shuffled."""
    games = pairings([f"Side {i + 1}" for i in range(n)])
    random.Random(seed).shuffle(games)
    book = openpyxl.Workbook()
    sheet = book.active
    sheet.title = "Fixtures"
    sheet.append(["Home", "Away", "Venue"])
    for home, away in games:
        sheet.append([home, away, f"{home} Ground"])
    path = folder / f"{name}.xlsx"
    book.save(path)
    return path


def families(folder: Path, quick: bool) -> list[tuple[str, Path, int]]:
    """(family, workbook, rounds) for every case."""
    evens = range(6, 17, 2) if quick else range(6, 31, 2)
    out = []
    for n in evens:
        sides = [(f"Side {i + 1}", f"Ground {i + 1}") for i in range(n)]
        out.append((f"single, {n} teams", teams_book(folder, f"single-{n}", [sides]), n - 1))
    for n in (range(5, 16, 2) if quick else range(5, 30, 4)):
        sides = [(f"Side {i + 1}", f"Ground {i + 1}") for i in range(n)]
        out.append((f"single, {n} teams (byes)", teams_book(folder, f"odd-{n}", [sides]), n))
    for n in (range(6, 13, 2) if quick else range(6, 31, 4)):
        sides = [(f"Side {i + 1}", f"Ground {i + 1}") for i in range(n)]
        path = teams_book(folder, f"double-{n}", [sides], legs=2, return_half=True)
        out.append((f"double, return half, {n} teams", path, 2 * n - 2))
    for n in (range(6, 13, 2) if quick else range(6, 31, 4)):
        sides = [(f"Side {i + 1}", f"Ground {i + 1}") for i in range(n)]
        path = teams_book(folder, f"mirrored-{n}", [sides], legs=2, return_half="mirrored")
        out.append((f"double, mirrored, {n} teams", path, 2 * n - 2))
    for n in (5, 9):
        sides = [(f"Side {i + 1}", f"Ground {i + 1}") for i in range(n)]
        path = teams_book(folder, f"mirrored-{n}", [sides], legs=2, return_half="mirrored")
        out.append((f"double, mirrored, {n} teams (byes)", path, 2 * n))
    for n in (6, 8, 10):
        a = [(f"Club {i} A", f"Ground {i}") for i in range(n)]
        b = [(f"Club {i} B", f"Ground {i}" if i < n // 2 else f"Field {i}") for i in range(n)]
        path = teams_book(folder, f"shared-{n}", [a, b])
        out.append((f"two divisions of {n}, {n // 2} grounds shared", path, n - 1))
    for n in (6, 8, 10, 12):
        out.append((f"Fixtures sheet, {n} teams", fixtures_book(folder, f"sheet-{n}", n, n),
                    n - 1))
    association = next(p for p in demo_leagues() if p.name == "association.xlsx")
    out.append(("association season (demo, 720 fixtures)", association, 18))
    return out


def run(path: Path, rounds: int, uniform: bool) -> tuple[planning.PlanOutcome, float]:
    opened = opening.open_league(path)
    assert opened.ok and opened.graph is not None, path
    started = time.perf_counter()
    outcome = planning.make_schedule(opened.result.league, opened.graph, rounds, seed=1,
                                     hooks=Hooks(budget=BUDGET), uniform=uniform)
    return outcome, time.perf_counter() - started


def main(argv: list[str] | None = None) -> int:
    ap = argparse.ArgumentParser(prog="python -m benchmarks.breaks", description=__doc__)
    ap.add_argument("--quick", action="store_true", help="the smaller cases only")
    args = ap.parse_args(argv)
    keep_freed_memory()
    print(f"{'case':<40}{'rounds':>7}{'breaks':>8}{'bound':>7}{'optimal':>9}{'s':>7}"
          f"{'uniform':>9}{'s':>7}")
    with tempfile.TemporaryDirectory() as tmp:
        for family, path, rounds in families(Path(tmp), args.quick):
            made, seconds = run(path, rounds, uniform=False)
            drawn, drawn_s = run(path, rounds, uniform=True)
            breaks = made.breaks.total if made.breaks else "-"
            bound = "-" if made.breaks_bound is None else made.breaks_bound
            uniform_breaks = "-"
            if drawn.breaks is not None and drawn.schedule.method == "uniform":
                uniform_breaks = drawn.breaks.total
            print(f"{family:<40}{rounds:>7}{breaks:>8}{bound:>7}"
                  f"{'yes' if made.optimal else 'no':>9}{seconds:>7.2f}"
                  f"{uniform_breaks:>9}{drawn_s:>7.2f}", flush=True)
    print("uniform '-': the exact count the uniform draw needs did not finish in "
          f"{BUDGET:g} s, so no uniform draw exists to compare with")
    return 0


if __name__ == "__main__":
    raise SystemExit(main())
