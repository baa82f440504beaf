"""Edit a schedule by hand: move a fixture and say at once what the move breaks."""

from __future__ import annotations

from dataclasses import dataclass, field, replace

import networkx as nx

from leaguegrid.core.model import League, Schedule
from leaguegrid.scheduling.check import ScheduleChecker
from leaguegrid.scheduling.rules import Violation


@dataclass
class EditResult:
    """The schedule after a move, what it breaks, and which fixtures moved."""

    schedule: Schedule
    violations: list[Violation] = field(default_factory=list)
    moved: tuple[str, ...] = ()

    @property
    def holds(self) -> bool:
        """True when the edited schedule breaks no clash and no rule."""
        return not self.violations


def move(
    league: League,
    graph: nx.Graph,
    schedule: Schedule,
    label: str,
    new_round: int,
    carry_ties: bool = False,
    checker: ScheduleChecker | None = None,
) -> EditResult:
    """Move one fixture (and, with carry_ties, the fixtures tied to it) to `new_round`.

    The result is a new Schedule (method "edited"); the input schedule is not changed.
    Pass a ScheduleChecker built for this league and K to answer repeated moves quickly."""
    if label not in schedule.assignment:
        raise KeyError(f"{label} is not in this schedule")
    if new_round < 1:
        raise ValueError(f"round {new_round} is not a positive whole number")
    checker = checker or ScheduleChecker(league, graph, schedule.rounds)
    moved = [label]
    if carry_ties:
        node = checker.model.node_of[label]
        moved = [lab for lab in checker.model.members[node] if lab in schedule.assignment]
    old = schedule.assignment[label]
    assignment = dict(schedule.assignment)
    for lab in moved:
        assignment[lab] = new_round
    note = f"edited: {label} moved from round {old} to round {new_round}"
    if len(moved) > 1:
        note += f" with {', '.join(lab for lab in moved if lab != label)}"
    edited = replace(schedule, assignment=assignment, method="edited",
                     notes=[*schedule.notes, note])
    return EditResult(edited, checker.check(assignment), tuple(moved))
