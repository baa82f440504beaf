"""The counts a coordinator asks for, computed once for the command line and the window.

For a league: the fewest rounds, the chromatic polynomial of the clash graph (factored), and for
each round count K the exact number of assignments, of assignments that use every round, and of
groupings. Work that does not finish within the budget is left as None or a labelled estimate.
"""

from __future__ import annotations

import math
from collections.abc import Callable
from dataclasses import dataclass, field, replace

import networkx as nx
from flint import fmpz_poly

from leaguegrid import engine
from leaguegrid.app.defaults import LONG_WORK_SECONDS
from leaguegrid.core import wording
from leaguegrid.core.model import League
from leaguegrid.core.polytext import factored
from leaguegrid.scheduling.constraints import (
    CountingModel,
    build_model,
    model_from_clashes,
    return_half,
)

Number = int | engine.Estimate | None
Progress = Callable[[float, str], None]
RANGE_ABOVE_MIN = 4  # default table: fewest rounds up to fewest + 4
ROWS_SHARE = 0.5  # in the default range, the rows' exact counts get at most this share first
ESTIMATE_SHARE = 0.2  # this share of the whole budget is kept for estimates of unfinished rows
POLYNOMIAL_FLOOR = 0.5  # seconds the optional polynomial gets after the rounds asked for ...
POLYNOMIAL_TIMES = 0.5  # ... or this many times the seconds those rounds took, if more
BUDGET, MEMORY = "budget", "memory bound"  # why exact work stopped short
RETURN_HALF = ("return half: with K rounds, first legs in rounds 1..H and return fixtures in "
               "rounds H+1..K, H = K/2 rounded up")


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
    # how each side of min_rounds_bounds is proven (engine.RoundsBounds's low/high methods)
    min_rounds_methods: tuple[str, str] | None = None
    min_rounds_schedule: dict[str, int] | None = None  # fixture label -> round, `high` rounds
    polynomial: fmpz_poly | None = None
    rows: list[CountRow] = field(default_factory=list)
    complete: bool = True  # False when the budget ran out or the work was cancelled
    cancelled: bool = False
    stopped: list[str] = field(default_factory=list)  # BUDGET and/or MEMORY, when they bit
    polynomial_cut: bool = False  # the optional polynomial was left for the rounds asked for
    notes: list[str] = field(default_factory=list)  # e.g. pins or ties that contradict clashes
    rules_counted: list[str] = field(default_factory=list)  # in words: what the counts include
    rules_generator: list[str] = field(default_factory=list)  # enforced by the generator only

    @property
    def polynomial_text(self) -> str | None:
        """The polynomial in k, factored where it factors."""
        return None if self.polynomial is None else factored(self.polynomial)


class _Stop(Exception):
    """Raised inside this module when the whole computation was cancelled."""


def _exact(func: Callable[[], object], stopped: list[str] | None = None) -> object | None:
    """Run one engine step: None when it hit its budget or the memory bound (said in
    `stopped`, when given); _Stop when the job was cancelled."""
    try:
        return func()
    except engine.BudgetExceeded as short:
        why = MEMORY if isinstance(short, engine.MemoryBound) else BUDGET
        if stopped is not None and why not in stopped:
            stopped.append(why)
        return None
    except engine.Cancelled as stop:
        raise _Stop from stop


def default_rounds(min_rounds: int, limit: int | None) -> list[int]:
    """The default range: the fewest rounds up to fewest + 4, stopping at a Rounds sheet's end."""
    top = min_rounds + RANGE_ABOVE_MIN
    if limit is not None:
        top = min(top, limit)
    return list(range(max(min_rounds, 1), top + 1))


def count_report(
    league: League,
    graph: nx.Graph,
    rounds: list[int] | None = None,
    hooks: engine.Hooks | None = None,
    estimate: bool = True,
) -> CountReport:
    """The counts table of a league and its clash graph (build_clash_graph), within a budget.

    Assignments and every-round-used follow the counting model (pins, played fixtures, ties,
    splits, blocked rounds, return half: schedule.constraints); the polynomial and groupings are
    of the clash graph with its splits. `rounds` None means the default range, which stops at a
    Rounds sheet's last round. Exact numbers are ints; what the budget cuts short is None, or an
    engine.Estimate when `estimate` is set (always labelled, never shown as exact).
    """
    job = hooks or engine.Hooks()
    began = job.clock()
    asked = rounds is not None
    budget = job.remaining()
    exact = job.part(share=1 - ESTIMATE_SHARE) if budget is not None and estimate else job
    estimate_seconds = None if budget is None else budget * ESTIMATE_SHARE
    top = max(rounds) if rounds else graph.number_of_nodes() or 1
    base = build_model(league, graph, max(top, 1))
    ties = base.graph.number_of_nodes() != base.clashes.number_of_nodes()
    constrained = bool(base.pins or base.exclusions or ties)
    report = CountReport(
        fixtures=base.clashes.number_of_nodes(),
        clashes=base.clashes.number_of_edges(),
        pinned=constrained,
        min_rounds=None,
        min_rounds_bounds=(0, 0),
        notes=list(base.contradictions),
        rules_counted=[RETURN_HALF if rule.startswith("return half") else rule
                       for rule in base.rules_counted],
        rules_generator=list(base.rules_generator),
    )
    bounds = _bounds(base)
    _set_bounds(report, bounds)
    if bounds is not None and bounds.exact and return_half(league, top) is None:
        report.min_rounds = bounds.low  # proven both ways already
    try:
        found = _exact(lambda: base.fewest_rounds_proof(
            exact.part(0.0, 0.2, stage="fewest rounds")))
        if found is not None:
            report.min_rounds = found.high
            _set_bounds(report, found)
        if rounds is None:
            limit = len(league.rounds) if league.rounds_fixed else None
            rounds = default_rounds(report.min_rounds_bounds[0], limit)
        report.rows = [CountRow(rounds=k) for k in rounds]
        _exact_rows(report, base, exact, asked=asked)
        _polynomial(report, base, exact, job.clock() - began if asked else None)
        if estimate:
            for row in report.rows:
                if row.assignments is None or row.all_rounds_used is None:
                    _estimate_row(report, row, base.at(row.rounds), job, estimate_seconds,
                                  len(report.rows))
    except _Stop:
        report.cancelled = True
    for row in report.rows:
        row.exact = all(isinstance(v, int)
                        for v in (row.assignments, row.all_rounds_used, row.groupings))
    if not report.cancelled and report.min_rounds is None and not report.stopped:
        report.stopped.append(BUDGET)
    report.complete = not report.cancelled and report.min_rounds is not None and all(
        row.exact for row in report.rows)
    return report


def _bounds(model: CountingModel) -> engine.RoundsBounds | None:
    """Proven bounds on the fewest rounds with their methods (None on a contradiction).

    With Return half the split point moves with K, so the low side comes from the league
    without it (the rule only adds constraints) and the high side from a schedule of the
    model itself."""
    if model.contradictions:
        return None
    found = engine.fewest_rounds_bounds(model.graph, pins=model.pins,
                                        exclusions=model.exclusions)
    if return_half(model.league, model.rounds) is None:
        return replace(found, schedule=model.expand(found.schedule))
    plain = model_from_clashes(model.league, model.clashes, model.rounds, use_return_half=False)
    low = engine.fewest_rounds_bounds(plain.graph, pins=plain.pins, exclusions=plain.exclusions)
    at_high = model.at(found.high)  # the halves of `high` rounds, not of model.rounds
    high = found.high if all(r in at_high.domain(node) for node, r in found.schedule.items()) \
        else model.rounds
    return replace(found, low=low.low, low_method=low.low_method, high=high,
                   schedule=model.expand(found.schedule))


def _set_bounds(report: CountReport, bounds: engine.RoundsBounds | None) -> None:
    """The report's bounds on the fewest rounds, the method of each side and the schedule."""
    if bounds is None:
        return
    report.min_rounds_bounds = (bounds.low, bounds.high)
    report.min_rounds_methods = (bounds.low_method, bounds.high_method)
    report.min_rounds_schedule = dict(bounds.schedule) or None


def _exact_rows(report: CountReport, base: CountingModel, job: engine.Hooks,
                asked: bool) -> None:
    """Each row's exact numbers at its K directly (the engine's fixed-K programme, its
    fastest route), before any whole polynomial; what follows from others is filled in:
    below the proven fewest rounds everything is 0, at the fewest every assignment uses
    every round, and groupings are every-round-used / K! when only clashes constrain."""
    low = report.min_rounds_bounds[0] if report.min_rounds is None else report.min_rounds
    pool = job.part(0.2, 0.9 if asked else 0.55, share=1.0 if asked else ROWS_SHARE)
    n = max(len(report.rows), 1)
    for i, row in enumerate(report.rows):
        k = row.rounds
        step = pool.part(i / n, (i + 1) / n, share=1 / (n - i), stage=f"{k} rounds")
        if k < low:
            row.assignments = row.all_rounds_used = 0
            row.groupings = 0 if not report.pinned else _groupings_at(report, base, k, row, step)
            continue
        model = base.at(k)
        row.assignments = _exact(lambda m=model, h=step: m.count(h.part(0.0, 0.5)),
                                 report.stopped)
        if not report.pinned and k <= low:
            row.all_rounds_used = row.assignments  # none can leave a round empty
        else:
            row.all_rounds_used = _exact(
                lambda m=model, h=step: m.count_all_rounds_used(
                    h.part(0.5, 0.9, stage="every round used")), report.stopped)
        row.groupings = _groupings_at(report, base, k, row, step)


def _polynomial(report: CountReport, base: CountingModel, job: engine.Hooks,
                asked_took: float | None) -> None:
    """The whole polynomial with the time left, then the rows' missing numbers from it.
    When the rounds were asked for (`asked_took`: the seconds they took) and all counted, it
    is optional: it gets POLYNOMIAL_FLOOR s or POLYNOMIAL_TIMES that time, whichever is more,
    so that a bigger budget never makes the asked-for answer slower."""
    done = all(None not in (r.assignments, r.all_rounds_used, r.groupings) for r in report.rows)
    cap = None
    if asked_took is not None and done:
        cap = max(POLYNOMIAL_FLOOR, POLYNOMIAL_TIMES * asked_took)
    stopped: list[str] = []
    report.polynomial = _exact(lambda: engine.chromatic_polynomial(
        base.clashes, hooks=job.part(0.55 if asked_took is None else 0.9, 1.0, seconds=cap,
                                     stage="polynomial")), stopped)
    if report.polynomial is None:
        if cap is None:
            report.stopped.extend(w for w in stopped if w not in report.stopped)
        else:  # optional work cut short is not a reason the answer is short
            report.polynomial_cut = True
        return
    groups = engine.to_falling(report.polynomial)
    for row in report.rows:
        k = row.rounds
        got = groups[k] if k < len(groups) else 0
        if row.groupings is None:
            row.groupings = got
        if not report.pinned:
            if row.assignments is None:
                row.assignments = int(report.polynomial(k))
            if row.all_rounds_used is None:
                row.all_rounds_used = got * math.factorial(k)


def _estimate_row(report: CountReport, row: CountRow, model: CountingModel, job: engine.Hooks,
                  estimate_seconds: float | None, n: int) -> None:
    """Labelled estimates for the numbers of a row that exact work did not finish: the
    assignments and every-round-used from the same draws, and (when nothing but clashes
    constrains the league, so that they describe the same graph) groupings as
    every-round-used / K!."""
    k = row.rounds
    share = None if estimate_seconds is None else estimate_seconds / n
    left = job.remaining()
    if share is not None and left is not None:
        share = min(share, left)
    hooks = engine.Hooks(cancel=job.cancel, budget=share, clock=job.clock, memo=job.memo)
    got = _exact(lambda: engine.estimate_counts(
        model.graph, k, pins=model.pins, exclusions=model.exclusions, hooks=hooks),
        report.stopped)
    if got is None:
        return
    if row.assignments is None:
        row.assignments = got[0]
    every = got[1]
    if row.all_rounds_used is None:
        row.all_rounds_used = every
    if row.groupings is None and not report.pinned:
        f = math.factorial(k)
        low = -(-every.low // f)  # groupings are whole: at least ceil(low / K!), 1 if low >= 1
        row.groupings = engine.Estimate((2 * every.value + f) // (2 * f), low,
                                        -(-every.high // f),
                                        f"{every.method}, every round used / {k}!",
                                        every.samples, every.found)


def _groupings_at(report: CountReport, base: CountingModel, k: int, row: CountRow,
                  job: engine.Hooks) -> int | None:
    """Groupings of the clash graph into exactly K rounds without the polynomial:
    every-round-used of the unconstrained graph divided by K!."""
    if report.pinned:
        unconstrained = _exact(lambda: engine.count_all_rounds_used(
            base.clashes, k, hooks=job.part(0.9, 1.0, stage="groupings")), report.stopped)
    else:
        unconstrained = row.all_rounds_used
    return None if unconstrained is None else unconstrained // math.factorial(k)


def estimate_seconds(graph: nx.Graph) -> float | None:
    """The engine's guess of how long the full polynomial takes (None when it cannot say)."""
    try:
        return float(engine.estimate_cost(graph).seconds)
    except Exception:  # an estimate is advice only; counting goes ahead without it
        return None


def count_league(league: League, graph: nx.Graph, rounds: list[int] | None = None,
                 hooks: engine.Hooks | None = None) -> CountReport:
    """The counts table, saying first (as progress) how long the work may take when long."""
    hooks = hooks or engine.Hooks()
    notice = wording.long_work_text(estimate_seconds(graph), hooks.remaining(),
                                    LONG_WORK_SECONDS)
    if notice is not None:
        hooks.report(0.0, notice)
    return count_report(league, graph, rounds=rounds, hooks=hooks)
