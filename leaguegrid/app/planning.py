"""Making a schedule for K rounds, and checking one edited by hand."""

from __future__ import annotations

from dataclasses import dataclass

import networkx as nx

from leaguegrid import engine
from leaguegrid.app.defaults import SCORE_TERMS
from leaguegrid.core import wording
from leaguegrid.core.model import League, Schedule
from leaguegrid.scheduling import score
from leaguegrid.scheduling.check import check_schedule
from leaguegrid.scheduling.dates import DatesError, round_dates
from leaguegrid.scheduling.draw import PlanResult, fresh_seed, plan
from leaguegrid.scheduling.rules import Violation, generator_rules


@dataclass
class PlanOutcome:
    """A schedule (or why there is none), the seed that makes it again, and in words what
    happened."""

    rounds: int
    seed: int
    seed_given: bool  # False: drawn here; the same seed gives the same schedule again
    result: PlanResult

    @property
    def schedule(self) -> Schedule | None:
        return self.result.schedule if self.result.status == "found" else None

    @property
    def score_lines(self) -> list[str]:
        """The score term by term, when the schedule was kept as the best of several."""
        return [] if self.result.score is None else self.result.score.lines()

    @property
    def message(self) -> str:
        """One sentence: what was made, or why nothing was."""
        schedule = self.schedule
        if schedule is not None:
            return wording.schedule_summary(schedule)
        return wording.plan_failure(self.result.status, self.rounds, self.result.reasons)


def parse_terms(text: str | None) -> dict[str, float] | None:
    """'balance,travel=2' as weights by term; None when no terms were given (ValueError when a
    term is unknown)."""
    return score.parse_terms(text) if text else None


def make_schedule(league: League, graph: nx.Graph, rounds: int, seed: int | None = None,
                  draws: int = 1, terms: dict[str, float] | None = None,
                  hooks: engine.Hooks | None = None) -> PlanOutcome:
    """A schedule for K rounds: a uniform draw, or the best of `draws` by `terms` (every score
    term, equally weighted, when more than one draw is asked for without terms). `seed` None
    draws a fresh one, recorded in the outcome. ValueError when draws < 1."""
    if draws < 1:
        raise ValueError(f"the number of schedules to draw must be at least 1, not {draws}")
    given = seed is not None
    seed = seed if seed is not None else fresh_seed()
    if draws > 1 and not terms:
        terms = dict.fromkeys(SCORE_TERMS, 1.0)
    result = plan(league, graph, rounds, seed, draws=draws, terms=terms, hooks=hooks)
    if result.schedule is not None and result.score is not None:
        result.schedule.notes = [*result.schedule.notes,
                                 *("score " + line for line in result.score.lines())]
    return PlanOutcome(rounds, seed, given, result)


def fewest_rounds(result: PlanResult, hooks: engine.Hooks | None = None) -> int | None:
    """The fewest rounds of a plan's counting model, or None when not found within the hooks'
    budget."""
    if result.model is None:
        return None
    try:
        return result.model.fewest_rounds(hooks)
    except (engine.BudgetExceeded, engine.Cancelled):
        return None


def schedule_problems(league: League, graph: nx.Graph, schedule: Schedule) -> list[Violation]:
    """Every clash or rule a schedule (edited by hand, say) breaks; empty when it holds."""
    return check_schedule(league, graph, schedule)


def generator_only_rules(league: League | None) -> list[str]:
    """The rules only the schedule generator enforces (the counts do not include them)."""
    if league is None:
        return []
    try:
        return list(generator_rules(league).describe())
    except AttributeError:
        return []


def round_titles(league: League, rounds: int) -> list[str]:
    """'Round 3' and, under it, its date and time where the league gives them."""
    try:
        infos = round_dates(league, rounds)
    except DatesError:
        infos = []
    titles = []
    for r in range(1, rounds + 1):
        info = infos[r - 1] if r - 1 < len(infos) else None
        extra = []
        if info is not None and info.date is not None:
            extra.append(info.date.isoformat())
        if info is not None and info.time is not None:
            extra.append(info.time.strftime("%H:%M"))
        titles.append(f"Round {r}" + (f"\n{' '.join(extra)}" if extra else ""))
    return titles
