"""Planning again after a change (a washed-out round, a new blocked date): keep a previous
schedule, moving as few fixtures as the rules force.

The rule search (search.py) with each fixture's previous round tried first and the fixtures
whose previous round is gone (missing, beyond K, now blocked, taken by a clash) placed first:
where the previous schedule still holds it comes back unchanged. Then the breaks search
(optimise.py) with the fixtures moved from the previous schedule counted first, so Kempe-chain
moves bring back what the search moved needlessly (a minimal-perturbation heuristic, not a
proof that fewer moves are impossible). Every rule holds, the generator-only ones included.
"""

from __future__ import annotations

import random
from dataclasses import dataclass

import networkx as nx

from leaguegrid import engine
from leaguegrid.core.model import League, Schedule
from leaguegrid.core.wording import plural
from leaguegrid.scheduling.constraints import build_model
from leaguegrid.scheduling.draw import PlanResult
from leaguegrid.scheduling.optimise import fewer_breaks
from leaguegrid.scheduling.search import search


@dataclass(frozen=True)
class Move:
    """A fixture the new schedule puts in another round than the previous one did."""

    label: str
    before: int | None  # None: the previous schedule did not have it
    after: int


@dataclass
class Replanned:
    """The new schedule (as plan() gives it) and the fixtures it moved."""

    result: PlanResult
    moves: list[Move]


def keep_previous(league: League, graph: nx.Graph, rounds: int, previous: dict[str, int],
                  seed: int, hooks: engine.Hooks | None = None) -> Replanned:
    """A schedule for K rounds keeping `previous` (label -> round) wherever the rules allow."""
    model = build_model(league, graph, rounds)
    result = PlanResult("impossible", seed, model=model)
    labels = [f.label for f in league.fixtures]
    found = search(model, random.Random(f"{seed}:keep"), hooks=hooks, prefer=previous)
    result.status, result.reasons = found.status, found.reasons
    moves = []
    if found.status == "found" and found.assignment is not None:
        kept = fewer_breaks(model, found.assignment, seed, hooks, keep=previous).assignment
        moves = [Move(label, previous.get(label), kept[label]) for label in labels
                 if previous.get(label) != kept[label]]
        result.schedule = Schedule(
            rounds=rounds, assignment=kept, seed=seed, method="kept",
            rules_counted=list(model.rules_counted),
            rules_generator=list(model.rules_generator),
            notes=[f"re-planned from the previous schedule: {len(moves)} of "
                   f"{plural(len(labels), 'fixture')} moved", *model.notes])
    return Replanned(result, moves)
