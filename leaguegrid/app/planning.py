"""Making a schedule for K rounds, and checking one edited by hand."""

from __future__ import annotations

from dataclasses import dataclass
from pathlib import Path

import networkx as nx

from leaguegrid import engine
from leaguegrid.app.defaults import SCORE_TERMS
from leaguegrid.core import wording
from leaguegrid.core.model import League, Request, Schedule
from leaguegrid.io.read import previous as previous_schedule
from leaguegrid.io.read.previous import PreviousSchedule
from leaguegrid.scheduling import score
from leaguegrid.scheduling.breaks import BreakCount, count_breaks, team_byes
from leaguegrid.scheduling.check import check_schedule
from leaguegrid.scheduling.dates import DatesError, round_dates
from leaguegrid.scheduling.draw import PlanResult, fresh_seed, plan
from leaguegrid.scheduling.optimise import breaks_bound, fewer_breaks, timetable_start
from leaguegrid.scheduling.replan import Move, keep_previous
from leaguegrid.scheduling.requests import unmet_requests
from leaguegrid.scheduling.rules import Violation, generator_rules


@dataclass
class PlanOutcome:
    """A schedule (or why there is none), the seed that makes it again, and in words what
    happened."""

    rounds: int
    seed: int
    seed_given: bool  # False: drawn here; the same seed gives the same schedule again
    result: PlanResult
    breaks: BreakCount | None = None  # of the schedule, when there is one
    breaks_bound: int | None = None  # a proven lower bound on the breaks, when one is known

    @property
    def optimal(self) -> bool:
        """True when the schedule's breaks reach the proven lower bound."""
        return (self.breaks is not None and self.breaks_bound is not None
                and self.breaks.total <= self.breaks_bound)

    @property
    def breaks_line(self) -> str | None:
        """'Breaks: 8 (lower bound 8: optimal)', when there is a schedule."""
        if self.breaks is None:
            return None
        return wording.breaks_text(self.breaks.total, self.breaks_bound)

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
                  hooks: engine.Hooks | None = None, uniform: bool = False) -> PlanOutcome:
    """A schedule for K rounds: optimised for the fewest breaks (the default), a uniform draw
    (`uniform`), or the best of `draws` by `terms` (every score term, equally weighted, when
    more than one draw is asked for without terms). `seed` None draws a fresh one, recorded in
    the outcome. ValueError when draws < 1."""
    if draws < 1:
        raise ValueError(f"the number of schedules to draw must be at least 1, not {draws}")
    given = seed is not None
    seed = seed if seed is not None else fresh_seed()
    if draws > 1 and not terms:
        terms = dict.fromkeys(SCORE_TERMS, 1.0)
    job = hooks or engine.Hooks()
    timetable = timetable_start(league, rounds) if not uniform and draws == 1 else None
    result = plan(league, graph, rounds, seed, draws=draws, terms=terms,
                  hooks=job.part(0.0, 0.7, share=0.7), given=timetable)
    schedule = result.schedule
    if schedule is not None and result.score is not None:
        schedule.notes = [*schedule.notes, *("score " + line for line in result.score.lines())]
    outcome = PlanOutcome(rounds, seed, given, result, breaks_bound=breaks_bound(league, rounds))
    if schedule is None or result.model is None:
        return outcome
    if uniform or draws > 1:
        outcome.breaks = count_breaks(league, schedule.assignment)
    else:
        better = fewer_breaks(result.model, schedule.assignment, seed, job.part(0.7, 1.0))
        start = (wording.METHODS["timetable"].removeprefix("taken from ")
                 if schedule.method == "timetable"
                 else f"a schedule {wording.METHODS.get(schedule.method, schedule.method)}")
        schedule.assignment = better.assignment
        schedule.method = "optimised"
        kept = [n for n in schedule.notes if not n.startswith("drawn uniformly")]
        schedule.notes = [*kept, f"optimised for the fewest breaks from {start}"
                          + (", stopped early at the budget" if better.stopped else "")]
        outcome.breaks = better.breaks
    schedule.notes = [*schedule.notes, *request_notes(league, schedule.assignment)]
    return outcome


def requests_unmet(league: League, schedule: Schedule) -> list[Request]:
    """The Requests sheet's requests the schedule does not meet."""
    return unmet_requests(league, schedule.assignment)


def request_notes(league: League, assignment: dict[str, int]) -> list[str]:
    """'requests: 5 of 6 met', then each one not met, with its reason."""
    if not league.requests:
        return []
    unmet = unmet_requests(league, assignment)
    met = len(league.requests) - len(unmet)
    out = [f"requests: {met} of {wording.plural(len(league.requests), 'request')} met"]
    out += [f"request not met: {q}" + (f" ({q.reason})" if q.reason else "")
            + (f", Requests row {q.row}" if q.row else "") for q in unmet]
    return out


@dataclass
class Replan:
    """A schedule made again from a previous one, and what changed for each club."""

    outcome: PlanOutcome
    moves: list[Move]
    by_club: dict[str, list[str]]  # club (or team, without a Club) -> its fixtures that moved


def read_previous(path: str | Path, league: League) -> PreviousSchedule:
    """A schedule published before (a CSV with Fixture and Round columns), with its problems."""
    return previous_schedule.read_previous(path, league)


def replan(league: League, graph: nx.Graph, rounds: int, previous: dict[str, int],
           seed: int | None = None, hooks: engine.Hooks | None = None) -> Replan:
    """Keep `previous` (fixture label -> round) where every rule allows, moving as few
    fixtures as possible; what moved, club by club, with dates where the league has them."""
    given = seed is not None
    seed = seed if seed is not None else fresh_seed()
    done = keep_previous(league, graph, rounds, previous, seed, hooks)
    outcome = PlanOutcome(rounds, seed, given, done.result,
                          breaks_bound=breaks_bound(league, rounds))
    if outcome.schedule is not None:
        outcome.breaks = count_breaks(league, outcome.schedule.assignment)
    titles = [t.replace("\n", " ") for t in round_titles(league, rounds)]
    by_club: dict[str, list[str]] = {}
    for move in done.moves:
        f = league.fixture(move.label)
        was = titles[move.before - 1] if move.before and move.before <= rounds else (
            f"round {move.before}" if move.before else "not in the previous schedule")
        line = f"{f.label}: {was} -> {titles[move.after - 1]}"
        clubs = {(league.teams[t].club if t in league.teams and league.teams[t].club else t)
                 for t in f.teams}
        for club in sorted(clubs):
            by_club.setdefault(club, []).append(line)
    return Replan(outcome, done.moves, dict(sorted(by_club.items())))


RULE_OF = {"clashes": "clash", "splits": "split", "ties": "tie", "pins": "pin",
           "played": "played", "blocked": "blocked", "return half": "return half",
           "venue capacity": "capacity", "most home games in a row": "home run",
           "most away games in a row": "away run", "round balance": "balance", "leg gap": "leg gap",
           "mirrored return half": "mirrored", "byes apart": "byes"}


def rules_met(league: League, graph: nx.Graph, schedule: Schedule) -> list[tuple[str, bool]]:
    """Each rule the schedule was made under, in words, and whether the schedule keeps it
    (checked again here, as for a schedule edited by hand)."""
    broken = {v.rule for v in check_schedule(league, graph, schedule)}
    out = []
    for text in [*schedule.rules_counted, *schedule.rules_generator]:
        name = RULE_OF.get(text.split(":", 1)[0].strip(), text)
        out.append((text, name not in broken))
    return out


def byes(league: League, schedule: Schedule) -> dict[str, list[int]]:
    """Team -> the rounds in which it has no game."""
    return team_byes(league, schedule.assignment, schedule.rounds)


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
        when = wording.when_text(info.date, info.time) if info is not None else ""
        titles.append(f"Round {r}" + (f"\n{when}" if when else ""))
    return titles
