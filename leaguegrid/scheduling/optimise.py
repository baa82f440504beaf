"""Schedules with few breaks: a seeded local search over valid schedules, every hard rule kept.

The start is the round robin timetable LeagueGrid generated from a Teams sheet (each division's
pairings in core.round_robin's order, whose rounds in that order have the fewest breaks there
can be: de Werra 1981), when it holds every rule; otherwise a valid schedule from the uniform
draw or the rule search. Then Kempe-chain moves (textbook graph colouring: swapping two rounds
along a connected set of clashing fixtures keeps every clash apart), accepted when the breaks
do not rise and now and then when they do (simulated annealing), for a fixed number of steps:
the same league and seed give the same schedule on any machine and under any load. A budget
or Cancel only ends the search early, with the best schedule so far. The clubs' requests
(Requests sheet) come first: an unmet request weighs as much as one break per team, and one.
Among schedules with as few breaks, return legs further apart are better (legs_close): a pair's
two meetings aim for half the season between them, as a mirrored season has; Leg gap and
Return half, when set, are hard rules on top.
"""

from __future__ import annotations

import math
import random
from dataclasses import dataclass

from leaguegrid import engine
from leaguegrid.core.model import League
from leaguegrid.scheduling.breaks import BreakCount, break_lower_bound, count_breaks
from leaguegrid.scheduling.constraints import CountingModel
from leaguegrid.scheduling.requests import unmet_requests
from leaguegrid.scheduling.rules import check_generator, leg_pairs, round_robins

STEPS = 4000  # local-search steps (each one Kempe-chain move tried)
CHECK_EVERY = 64  # steps between budget and cancel checks


@dataclass
class Optimised:
    """The improved schedule (fixture label -> round) and its breaks against the bound."""

    assignment: dict[str, int]
    breaks: BreakCount
    bound: int | None  # a proven lower bound on the breaks, None when none is known
    steps: int
    stopped: bool = False  # the budget or Cancel ended the search before its last step

    @property
    def optimal(self) -> bool:
        """True when the breaks reach the proven lower bound."""
        return self.bound is not None and self.breaks.total <= self.bound


def breaks_bound(league: League, rounds: int) -> int | None:
    """The sum over divisions of the published lower bounds on breaks, when every division is
    a complete round robin played compactly in `rounds`; None when no bound is known."""
    divisions = round_robins(league)
    if divisions is None:
        return None
    s = league.settings
    style = ("single" if s.legs == 1 else "mirrored" if s.mirrored and s.return_half
             else "halves" if s.return_half else "double")
    total = 0
    for teams in divisions.values():
        n = len(teams)
        if rounds != s.legs * (n - 1 + n % 2):
            return None
        total += break_lower_bound(n, style, rounds)
    return total


def timetable_start(league: League, rounds: int) -> dict[str, int] | None:
    """The generated round robin in its own round order (first legs, then the return legs in
    reverse order, so each half is a single round robin with the fewest breaks; in the same
    order when mirrored), or None when the fixtures are not LeagueGrid's generated ones or do
    not fit `rounds`."""
    teams = round_robins(league)
    if teams is None or any(f.row is not None for f in league.fixtures):
        return None
    by_division: dict[str | None, list[list[str]]] = {}
    for f in league.fixtures:
        legs = by_division.setdefault(f.division, [[], []])
        if f.leg not in (1, 2):
            return None
        legs[f.leg - 1].append(f.label)
    out: dict[str, int] = {}
    for division, (first, second) in by_division.items():
        n = len(teams.get(division, []))
        per_round = n // 2
        span = n - 1 + n % 2  # rounds of one leg: n - 1, or n with a bye each when n is odd
        if per_round == 0 or len(first) != per_round * span:
            return None
        if second and len(second) != len(first):
            return None
        half = max(span, (rounds + 1) // 2) if league.settings.return_half else span
        same_order = n % 2 == 1 or league.settings.mirrored
        for i, label in enumerate(first):
            out[label] = i // per_round + 1
        for i, label in enumerate(second):
            r = i // per_round
            out[label] = half + (r + 1 if same_order else span - r)
    if max(out.values(), default=0) > rounds:
        return None
    return out


def legs_close(pairs: list[tuple[str, str]], assignment: dict[str, int], rounds: int) -> int:
    """How far the return legs fall short of half the season after their first meetings:
    the sum over pairs of max(0, rounds // 2 - the rounds between them); 0 when every pair
    is at least half a season apart."""
    aim = rounds // 2
    return sum(max(0, aim - abs(assignment[b] - assignment[a])) for a, b in pairs
               if a in assignment and b in assignment)


def holds(model: CountingModel, assignment: dict[str, int]) -> bool:
    """True when a complete schedule keeps every counted and generator-only rule."""
    node_round: dict[str, int] = {}
    for label, r in assignment.items():
        node = model.node_of[label]
        if node_round.setdefault(node, r) != r:
            return False  # tied fixtures apart
    if len(node_round) != model.graph.number_of_nodes():
        return False
    if any(r not in model.domain(v) for v, r in node_round.items()):
        return False
    if any(node_round[u] == node_round[v] for u, v in model.graph.edges):
        return False
    rules = model.generator
    return not (rules.active and check_generator(model.league, rules, assignment, model.rounds))


def fewer_breaks(model: CountingModel, start: dict[str, int], seed: int,
                 hooks: engine.Hooks | None = None, steps: int = STEPS,
                 keep: dict[str, int] | None = None) -> Optimised:
    """The best schedule the local search finds from `start` (a valid schedule: the generated
    timetable when it holds), by breaks; deterministic for a given seed and `steps`. With
    `keep` (a previous schedule), fixtures moved from it count first, then requests, then
    breaks."""
    league, rounds = model.league, model.rounds
    current = dict(start)
    bound = breaks_bound(league, rounds)
    best, best_breaks = dict(current), count_breaks(league, current)
    weight = len(league.teams) + 1  # an unmet request weighs more than any team's breaks
    moved_weight = weight * (len(league.requests) + 1)

    def shifted(assignment: dict[str, int]) -> int:
        return 0 if keep is None else sum(keep.get(lab) != r for lab, r in assignment.items())

    pairs = leg_pairs(league)
    # legs apart come after breaks: all of it weighs less than one break
    apart = 1.0 / (len(pairs) * (rounds // 2) + 1)
    best_penalty = len(unmet_requests(league, current)) + moved_weight * shifted(current)
    best_close = legs_close(pairs, current, rounds)
    cost = best_breaks.total + weight * best_penalty + apart * best_close
    rng = random.Random(f"{seed}:breaks")
    nodes = sorted(model.graph.nodes)
    members = {v: list(model.members[v]) for v in nodes}
    done, stopped = 0, False
    rules = model.generator
    mirror = ({a: b for pair in rules.legs for a, b in (pair, pair[::-1])}
              if rules.mirrored else {})
    half = -(-rounds // 2)
    for step in range(steps):
        if (bound is not None and best_breaks.total <= bound and not best_penalty and not keep
                and not best_close):
            break
        if hooks is not None and step % CHECK_EVERY == 0:
            try:
                hooks.report(step / steps, "fewer breaks")
            except (engine.BudgetExceeded, engine.Cancelled):
                stopped = True
                break
        done = step + 1
        moved = _kempe_move(model, current, rng.choice(nodes), rng.randint(1, rounds), members)
        if moved is not None and mirror:
            moved = _mirrored(model, current, moved, mirror, half, members)
        if moved is None:
            continue
        trial = {**current, **moved}
        if model.generator.active and check_generator(league, model.generator, trial, rounds):
            continue
        counted = count_breaks(league, trial)
        penalty = len(unmet_requests(league, trial)) + moved_weight * shifted(trial)
        close = legs_close(pairs, trial, rounds)
        new = counted.total + weight * penalty + apart * close
        heat = 2.0 * (1 - step / steps) + 0.05
        if new <= cost or rng.random() < math.exp((cost - new) / heat):
            current, cost = trial, new
            if (penalty, counted.total, close) < (best_penalty, best_breaks.total, best_close):
                best, best_breaks, best_penalty, best_close = trial, counted, penalty, close
    return Optimised(best, best_breaks, bound, done, stopped)


def _mirrored(model: CountingModel, assignment: dict[str, int], moved: dict[str, int],
              mirror: dict[str, str], half: int, members: dict[str, list[str]]
              ) -> dict[str, int] | None:
    """`moved` with each moved fixture's other meeting moved to stay `half` rounds away; None
    when that lands a fixture on a pinned node, an excluded round or a clash."""
    out = dict(moved)
    for label, new in moved.items():
        other = mirror.get(label)
        if other is None or other in moved:
            continue
        shift = new + half if assignment[other] > assignment[label] else new - half
        node = model.node_of[other]
        if node in model.pins or shift in model.exclusions.get(node, ()):
            return None
        if not 1 <= shift <= model.rounds:
            return None
        for lab in members[node]:
            out[lab] = shift
    extra = {model.node_of[lab] for lab in out if lab not in moved}
    for node in extra:
        r = out[members[node][0]]
        for w in model.graph[node]:
            if out.get(members[w][0], assignment[members[w][0]]) == r:
                return None
    return out


def _kempe_move(model: CountingModel, assignment: dict[str, int], node: str, target: int,
                members: dict[str, list[str]]) -> dict[str, int] | None:
    """The fixtures' new rounds when `node` and its Kempe chain between its round and `target`
    swap rounds; None when the chain holds a pinned node or lands one on an excluded round."""
    here = assignment[members[node][0]]
    if target == here:
        return None
    chain, todo = {node}, [node]
    graph = model.graph
    while todo:
        u = todo.pop()
        for w in graph[u]:
            if w not in chain and assignment[members[w][0]] in (here, target):
                chain.add(w)
                todo.append(w)
    moved: dict[str, int] = {}
    for u in chain:
        new = target if assignment[members[u][0]] == here else here
        if u in model.pins or new in model.exclusions.get(u, ()):
            return None
        for label in members[u]:
            moved[label] = new
    return moved
