"""What a change would do: waive each clash reason in turn, add a clash, a team joining a
division, a venue closing for a round."""

from __future__ import annotations

import datetime as dt
from dataclasses import dataclass, field

import networkx as nx

from leaguegrid import engine
from leaguegrid.clashes.graph import reason_edges
from leaguegrid.core.model import League, Reason
from leaguegrid.scheduling import whatif as what
from leaguegrid.scheduling.constraints import with_splits


class UnknownName(ValueError):
    """A name that matches nothing (or two kinds of thing), or a change that cannot be made."""


@dataclass
class Join:
    """A team joining a division (playing at `venue` when given)."""

    team: str
    division: str
    venue: str | None = None


@dataclass
class Close:
    """A venue closed for one round (a round number or a date of the Rounds sheet)."""

    venue: str
    when: int | dt.date


@dataclass
class WhatIfOutcome:
    """The ranked clash reasons (and a proposed clash) for K rounds, the changes asked for, and
    each reason's text -> its Reason (to waive it)."""

    report: what.WhatIf
    changes: list[what.BeforeAfter] = field(default_factory=list)
    reasons: dict[str, Reason] = field(default_factory=dict)

    @property
    def complete(self) -> bool:
        return self.report.complete

    def to_json(self) -> dict:
        data = self.report.to_json()
        if self.changes:
            data["changes"] = [c.to_json() for c in self.changes]
        return data


def what_if(league: League, graph: nx.Graph, rounds: int, add: tuple[str, str] | None = None,
            join: Join | None = None, close: Close | None = None,
            hooks: engine.Hooks | None = None) -> WhatIfOutcome:
    """Every clash reason ranked by what waiving it would gain for K rounds, a proposed clash
    between two names (fixtures, teams or venues), a team joining, a venue closing. Raises
    UnknownName for an unknown or ambiguous name; what the budget cuts short is marked
    incomplete."""
    hooks = hooks or engine.Hooks()
    try:
        outcome = WhatIfOutcome(what.whatif(league, graph, rounds, add=add, hooks=hooks))
    except ValueError as err:
        raise UnknownName(str(err)) from err
    try:
        if join is not None:
            outcome.changes.append(what.team_joins(league, rounds, join.team, join.division,
                                                   join.venue, hooks=hooks))
        if close is not None:
            what.resolve(league, f"venue: {close.venue}")  # an unknown venue is named
            outcome.changes.append(what.venue_closes(league, graph, rounds, close.venue,
                                                     close.when, hooks=hooks))
    except ValueError as err:
        raise UnknownName(str(err)) from err
    except (engine.BudgetExceeded, engine.Cancelled):
        outcome.report.complete = False
    outcome.reasons = {str(r): r for r in reason_edges(with_splits(league, graph))}
    return outcome
