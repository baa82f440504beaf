"""Schedules for K rounds: exact uniform draws, best of many, and the rule search as fallback.

Without generator-only rules, each draw is exactly uniform over the valid assignments of the
counting model (engine.sample_assignments). With them, draws are made the same way and those
that meet every rule are kept: a kept draw is uniform over the schedules meeting the rules, and
the share kept shows how tight the rules are. When no draw meets them, or the exact count or
the draws do not finish within their share of the budget, the backtracking search (search.py)
takes over and the schedule's notes say so. One seed drives everything: the same league, seed
and version give the same schedule (within the same budget outcome).
"""

from __future__ import annotations

import random
import secrets
from dataclasses import dataclass, field, replace
from typing import Literal

import networkx as nx

from leaguegrid import engine
from leaguegrid.core.model import League, Schedule
from leaguegrid.core.wording import plural
from leaguegrid.scheduling.constraints import CountingModel, build_model
from leaguegrid.scheduling.optimise import holds
from leaguegrid.scheduling.rules import check_generator, prove_impossible
from leaguegrid.scheduling.score import BestOf, ScoreCard, best_of
from leaguegrid.scheduling.search import search

Status = Literal["found", "impossible", "budget", "cancelled"]

RULE_DRAWS = 100  # uniform draws tried at least, when generator-only rules are active
MAX_SEARCHES = 20  # schedules searched at most for best-of when no draw met the rules
COUNT_SHARE = 0.4  # of the budget, at most, for the exact count
DRAW_SHARE = 0.6  # of what is left after the count, at most, for the uniform draws


@dataclass
class PlanResult:
    """The outcome of planning: a schedule, a proven impossibility, or a stop."""

    status: Status
    seed: int
    schedule: Schedule | None = None
    reasons: list[str] = field(default_factory=list)  # impossible: which rule and where it bites
    assignments: int | None = None  # exact count of the counting model for K rounds
    draws: int = 0  # uniform draws made
    draws_met: int = 0  # of those, meeting every generator-only rule
    score: ScoreCard | None = None
    model: CountingModel | None = None


def fresh_seed() -> int:
    """A new random seed (to be printed and recorded) for a plan made without --seed."""
    return secrets.randbelow(2**32)


def draw_many(
    model: CountingModel, rng: random.Random, count: int, hooks: engine.Hooks | None = None
) -> list[dict[str, int]]:
    """`count` independent, exactly uniform valid assignments, fixture label -> round.

    Raises engine.NoAssignment when there is none."""
    if model.contradictions:
        raise engine.NoAssignment("; ".join(model.contradictions))
    drawn = engine.sample_assignments(
        model.counted(), model.rounds, rng, count, pins=model.pins, exclusions=model.exclusions,
        hooks=hooks,
    )
    return [model.expand(nodes) for nodes in drawn]


def plan(
    league: League,
    graph: nx.Graph,
    rounds: int,
    seed: int,
    draws: int = 1,
    terms: dict[str, float] | None = None,
    hooks: engine.Hooks | None = None,
    rule_draws: int = RULE_DRAWS,
    given: dict[str, int] | None = None,
) -> PlanResult:
    """A schedule for K rounds: uniform draws (best of `draws` by `terms`), or the rule search.

    `graph` is the league's clash graph (build_clash_graph). `seed` drives every random
    choice; draw it with fresh_seed() when the user gave none, and record it. With a budget,
    the exact count may use COUNT_SHARE of it and the draws DRAW_SHARE of what is left; when
    either does not finish, the rule search (seeded, not uniform) makes the schedule with the
    rest, and the notes say so. `given`, a complete schedule known to keep every rule (the
    generated timetable), is taken instead of any draw; the count is still made."""
    job = hooks or engine.Hooks()
    model = build_model(league, graph, rounds)
    result = _plan(league, model, seed, draws, terms, job, rule_draws, given)
    if result.status != "impossible" or not model.generator.byes_apart:
        return result
    # byes apart holds wherever the rounds allow it: when they do not, plan without it
    model.generator = replace(model.generator, byes_apart=False)
    model.rules_generator = model.generator.describe()
    relaxed = _plan(league, model, seed, draws, terms, job, rule_draws, given)
    if relaxed.schedule is not None:
        relaxed.schedule.notes.append(
            f"byes apart: no schedule in {plural(rounds, 'round')} keeps every team's byes "
            "apart, so some team has byes in two rounds in a row")
    return relaxed


def _plan(league: League, model: CountingModel, seed: int, draws: int,
          terms: dict[str, float] | None, job: engine.Hooks, rule_draws: int,
          given: dict[str, int] | None) -> PlanResult:
    """plan() on a counting model already built."""
    rounds = model.rounds
    result = PlanResult("impossible", seed, model=model)
    if given is not None and not holds(model, given):
        given = None
    if model.contradictions:
        result.reasons = list(model.contradictions)
        return result
    rules = model.generator
    if rules.active:
        proofs = prove_impossible(league, rules, model.fixture_domains(), rounds)
        if proofs:
            result.reasons = proofs
            return result
    notes: list[str] = []
    try:
        result.assignments = model.count(job.part(0.0, 0.3, share=COUNT_SHARE))
    except engine.Cancelled:
        result.status = "cancelled"
        return result
    except engine.BudgetExceeded:
        if given is not None:
            notes.append("the exact count did not finish within its share of the budget")
            return _finish(result, league, model, [given], "timetable", terms, notes)
        notes.append("the exact count did not finish within its share of the budget, so no "
                     "uniform draw was made")
        return _by_search(result, league, model, seed, draws, terms, job, notes)
    if given is not None and result.assignments:
        return _finish(result, league, model, [given], "timetable", terms, notes)
    if result.assignments == 0:
        result.reasons = [why_none(model, job)]
        return result
    rng = random.Random(seed)
    wanted = max(draws, rule_draws) if rules.active else (max(draws, 1) if terms else 1)
    try:
        drawn = draw_many(model, rng, wanted, job.part(0.3, 0.8, share=DRAW_SHARE))
    except engine.Cancelled:
        result.status = "cancelled"
        return result
    except engine.BudgetExceeded:
        notes.append("the uniform draws did not finish within their share of the budget")
        return _by_search(result, league, model, seed, draws, terms, job, notes)
    result.draws = len(drawn)
    kept = [a for a in drawn
            if not rules.active or not check_generator(league, rules, a, rounds)]
    result.draws_met = len(kept)
    if rules.active:
        notes.append(f"{len(kept)} of {result.draws} draws met every rule")
    if kept:  # the best of as many as were asked for, though more were drawn to meet the rules
        return _finish(result, league, model, kept[:draws], "uniform", terms, notes)
    notes.append("no uniform draw met every rule")
    return _by_search(result, league, model, seed, draws, terms, job, notes)


def _by_search(
    result: PlanResult,
    league: League,
    model: CountingModel,
    seed: int,
    draws: int,
    terms: dict[str, float] | None,
    job: engine.Hooks,
    notes: list[str],
) -> PlanResult:
    """The schedule (best of several when scoring) from the rule search."""
    found = _search_fallback(result, model, seed, draws if terms else 1, job)
    if not found:
        if result.status == "budget":
            result.reasons = [*notes, *result.reasons]
        return result
    notes.append(f"{plural(len(found), 'schedule')} came from the rule search, which is not "
                 "uniform")
    return _finish(result, league, model, found, "search", terms, notes)


def _search_fallback(
    result: PlanResult, model: CountingModel, seed: int, wanted: int, job: engine.Hooks
) -> list[dict[str, int]]:
    """Up to `wanted` schedules from the rule search; sets result status when none is found."""
    rng = random.Random(f"{seed}:search")
    found: list[dict[str, int]] = []
    for _ in range(min(wanted, MAX_SEARCHES)):
        out = search(model, rng, hooks=job.part(0.8, 1.0))
        if out.status == "found" and out.assignment is not None:
            found.append(out.assignment)
            continue
        if not found:
            result.status = out.status
            result.reasons = out.reasons
        break
    return found


def _finish(
    result: PlanResult,
    league: League,
    model: CountingModel,
    assignments: list[dict[str, int]],
    method: str,
    terms: dict[str, float] | None,
    notes: list[str],
) -> PlanResult:
    """Pick the schedule (best by terms, else the first) and fill the result."""
    schedules = [
        Schedule(
            rounds=model.rounds,
            assignment=a,
            seed=result.seed,
            method=method,
            assignments=result.assignments,
            rules_counted=list(model.rules_counted),
            rules_generator=list(model.rules_generator),
        )
        for a in assignments
    ]
    chosen = schedules[0]
    if terms:
        best: BestOf = best_of(league, schedules, terms)
        chosen, result.score = best.schedule, best.card
        notes.append(f"best of {len(schedules)} schedules by {', '.join(terms)} "
                     f"(schedule {best.index + 1})")
    elif method == "uniform":
        notes.append(f"drawn uniformly from all {result.assignments:,} valid schedules"
                     + (" and kept as the first to meet every rule"
                        if model.generator.active else ""))
    chosen.notes = [*notes, *model.notes]
    result.schedule = chosen
    result.status = "found"
    return result


def why_none(model: CountingModel, job: engine.Hooks | None = None) -> str:
    """Why a counting model has no valid assignment, in words (the fewest rounds if known)."""
    k = model.rounds
    head = f"no valid assignment of the fixtures to {k} rounds exists"
    try:
        fewest = model.fewest_rounds(job.part(0.3, 0.4) if job is not None else None)
    except (engine.BudgetExceeded, engine.Cancelled):
        return f"{head} (the fewest rounds needed was not found within the budget)"
    extras = [name for name, present in (
        ("pins", model.pins), ("ties", model.league.ties), ("blocked rounds", model.league.blocked),
        ("Return half", model.half is not None)) if present]
    what = "the clashes"
    if extras:
        what += " with the " + (", ".join(extras[:-1]) + " and " + extras[-1]
                                if len(extras) > 1 else extras[0])
    if fewest is None:
        return f"{head}, and no number of rounds works for {what}"
    if fewest > k:
        return f"{head}: {what} need at least {fewest} rounds"
    return f"{head}, though {fewest} rounds would work: with Return half the split moves with K"
