"""A coordinator's edits on top of the workbook: pins, ties, waived and added clashes, and
moves in a schedule, each checked at once. The workbook's league itself is never changed."""

from __future__ import annotations

import copy
from dataclasses import dataclass, field

import networkx as nx

from leaguegrid.core.model import League, Reason, Schedule, Split, Tie
from leaguegrid.scheduling.edit import EditResult, move

ADDED_REASON = "added in the window"


@dataclass
class Edits:
    """Everything the coordinator changed relative to the workbook."""

    pins: dict[str, int | None] = field(default_factory=dict)  # label -> round, None = unpinned
    ties: list[tuple[str, str]] = field(default_factory=list)
    waived: list[Reason] = field(default_factory=list)
    added: list[tuple[str, str]] = field(default_factory=list)


def working_league(league: League, edits: Edits) -> League:
    """A copy of the league with the edits' pins, ties and added clashes applied."""
    out = copy.deepcopy(league)
    for fixture in out.fixtures:
        if fixture.label in edits.pins:
            fixture.pin = edits.pins[fixture.label]
    out.ties.extend(Tie(a, b) for a, b in edits.ties)
    out.splits.extend(Split(a, b, reason=ADDED_REASON) for a, b in edits.added)
    return out


def pin_of(league: League, edits: Edits, label: str) -> int | None:
    """A fixture's pin as it stands with the edits."""
    if label in edits.pins:
        return edits.pins[label]
    return league.fixture(label).pin


def move_fixture(league: League, graph: nx.Graph, schedule: Schedule, label: str,
                 new_round: int) -> EditResult:
    """The schedule with one fixture moved, and every clash or rule the move breaks."""
    return move(league, graph, schedule, label, new_round)
