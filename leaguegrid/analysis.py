"""The counts a coordinator asks for, computed once for the command line and the window.

For a league: the fewest rounds, the chromatic polynomial of the clash graph (factored), and for
each round count K the exact number of assignments, of assignments that use every round, and of
groupings. Work that does not finish within the budget is left as None or a labelled estimate.
"""

from __future__ import annotations

import math
import threading
import time
from collections.abc import Callable
from dataclasses import dataclass, field

import networkx as nx
from flint import fmpz_poly

from leaguegrid import engine
from leaguegrid.polytext import factored

Number = int | engine.Estimate | None
Progress = Callable[[float, str], None]
RANGE_ABOVE_MIN = 4  # default table: fewest rounds up to fewest + 4
POLYNOMIAL_SHARE = 0.5  # at most this share of the remaining budget goes to the polynomial


@dataclass
class CountRow:
    """The numbers for one round count K; each an exact int, a labelled Estimate, or None."""

    rounds: int
    exact: bool = True
    assignments: Number = None
    all_rounds_used: Number = None
    groupings: Number = None


@dataclass
class CountReport:
    """Everything the count command prints and the window's counts view shows."""

    fixtures: int
    clashes: int
    pinned: bool
    min_rounds: int | None
    min_rounds_bounds: tuple[int, int]
    polynomial: fmpz_poly | None = None
    rows: list[CountRow] = field(default_factory=list)
    complete: bool = True  # False when the budget ran out or the work was cancelled
    cancelled: bool = False

    @property
    def polynomial_text(self) -> str | None:
        """The polynomial in k, factored where it factors."""
        return None if self.polynomial is None else factored(self.polynomial)


class _Stop(Exception):
    """Raised inside this module when the whole computation was cancelled."""


class _Clock:
    """One budget for the whole computation, handed to each engine call as the time left."""

    def __init__(self, budget: float | None, progress: Progress | None,
                 cancel: threading.Event | None) -> None:
        self.deadline = None if budget is None else time.monotonic() + budget
        self.progress = progress
        self.cancel = cancel

    def remaining(self) -> float | None:
        return None if self.deadline is None else max(0.0, self.deadline - time.monotonic())

    def hooks(self, stage: str, start: float, span: float, share: float = 1.0) -> engine.Hooks:
        """Hooks for one step, its progress mapped into [start, start + span] of the whole."""
        left = self.remaining()

        def report(fraction: float, text: str) -> None:
            if self.progress is not None:
                done = start + span * min(max(fraction, 0.0), 1.0)
                self.progress(done, f"{stage}: {text}" if text else stage)

        return engine.Hooks(progress=report, cancel=self.cancel,
                            budget=None if left is None else left * share)

    def run(self, func: Callable[[], object]) -> object | None:
        """Run one engine step: None when it hit the budget; _Stop when cancelled."""
        try:
            return func()
        except engine.BudgetExceeded:
            return None
        except engine.Cancelled as stop:
            raise _Stop from stop


def default_rounds(min_rounds: int, limit: int | None) -> list[int]:
    """The default range: the fewest rounds up to fewest + 4, stopping at a Rounds sheet's end."""
    top = min_rounds + RANGE_ABOVE_MIN
    if limit is not None:
        top = min(top, limit)
    return list(range(max(min_rounds, 1), top + 1))


def groupings_from_polynomial(poly: fmpz_poly) -> list[int]:
    """Falling-factorial coefficients a_j of P (P(k) = sum a_j k(k-1)...(k-j+1)), by Stirling
    numbers of the second kind: k^n = sum_j S(n, j) (k)_j (textbook identity)."""
    coeffs = [int(c) for c in poly.coeffs()]
    n = len(coeffs) - 1
    stirling = [[1]]  # stirling[m][j] = S(m, j)
    for m in range(1, n + 1):
        prev = stirling[-1]
        row = [0] * (m + 1)
        for j in range(1, m + 1):
            left = prev[j - 1] if j - 1 < len(prev) else 0
            row[j] = left + j * (prev[j] if j < len(prev) else 0)
        stirling.append(row)
    out = [0] * (n + 1)
    for m, c in enumerate(coeffs):
        for j in range(m + 1):
            out[j] += c * stirling[m][j]
    return out


def count_report(
    graph: nx.Graph,
    pins: dict | None = None,
    rounds: list[int] | None = None,
    round_limit: int | None = None,
    budget: float | None = None,
    progress: Progress | None = None,
    cancel: threading.Event | None = None,
    estimate: bool = True,
) -> CountReport:
    """The counts table for a clash graph with optional pins, within a budget (seconds).

    `rounds` None means the default range, capped at `round_limit` (a Rounds sheet's length).
    Exact numbers are ints; what the budget cuts short is None, or an engine.Estimate when
    `estimate` is set (always labelled, never shown as exact).
    """
    pins = pins or None
    clock = _Clock(budget, progress, cancel)
    report = CountReport(
        fixtures=graph.number_of_nodes(),
        clashes=graph.number_of_edges(),
        pinned=bool(pins),
        min_rounds=None,
        min_rounds_bounds=engine.min_rounds_bounds(graph, pins=pins),
    )
    try:
        found = clock.run(lambda: engine.min_rounds(
            graph, pins=pins, hooks=clock.hooks("fewest rounds", 0.0, 0.2)))
        if found is not None:
            report.min_rounds = int(found)
            report.min_rounds_bounds = (report.min_rounds, report.min_rounds)
        if rounds is None:
            rounds = default_rounds(report.min_rounds_bounds[0], round_limit)
        report.rows = [CountRow(rounds=k) for k in rounds]
        report.polynomial = clock.run(lambda: engine.chromatic_polynomial(
            graph, hooks=clock.hooks("polynomial", 0.2, 0.3, POLYNOMIAL_SHARE)))
        _fill_rows(report, graph, pins, clock, estimate)
    except _Stop:
        report.cancelled = True
    report.complete = not report.cancelled and report.min_rounds is not None and all(
        row.exact for row in report.rows)
    return report


def _fill_rows(report: CountReport, graph: nx.Graph, pins: dict | None, clock: _Clock,
               estimate: bool) -> None:
    """Each row's numbers: from the polynomial where it is known and nothing is pinned, else
    from the engine's fixed-K counts; labelled estimates where exact work ran out of budget."""
    groups = groupings_from_polynomial(report.polynomial) if report.polynomial is not None else None
    n = max(len(report.rows), 1)
    for i, row in enumerate(report.rows):
        k = row.rounds
        if report.min_rounds is not None and k < report.min_rounds:
            row.assignments = row.all_rounds_used = row.groupings = 0
            continue
        if groups is not None:
            row.groupings = groups[k] if k < len(groups) else 0
            if not pins:
                row.assignments = int(report.polynomial(k))
                row.all_rounds_used = row.groupings * math.factorial(k)
                continue
        start = 0.5 + 0.5 * i / n
        row.assignments = clock.run(lambda k=k, s=start: engine.count_assignments(
            graph, k, pins=pins, hooks=clock.hooks(f"{k} rounds", s, 0.25 / n)))
        row.all_rounds_used = clock.run(lambda k=k, s=start: engine.count_all_rounds_used(
            graph, k, pins=pins, hooks=clock.hooks(f"{k} rounds, every round used",
                                                   s + 0.25 / n, 0.25 / n)))
        if row.groupings is None:
            if pins:
                unpinned = clock.run(lambda k=k, s=start: engine.count_all_rounds_used(
                    graph, k, hooks=clock.hooks(f"{k} rounds, groupings", s, 0.0)))
            else:
                unpinned = row.all_rounds_used
            if unpinned is not None:
                row.groupings = unpinned // math.factorial(k)
        row.exact = None not in (row.assignments, row.all_rounds_used, row.groupings)
        if not row.exact and estimate and row.assignments is None:
            row.assignments = engine.estimate_assignments(graph, k, pins=pins)
