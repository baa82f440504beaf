"""Check a complete schedule against every clash, count rule and generator rule, in words."""

from __future__ import annotations

import networkx as nx

from leaguegrid.core.model import League, Reason, Schedule
from leaguegrid.scheduling.constraints import CountingModel, build_model, reasons_text
from leaguegrid.scheduling.rules import Violation, check_generator


class ScheduleChecker:
    """Checks schedules of one league for K rounds; build once, check many (an editor's moves)."""

    def __init__(self, league: League, graph: nx.Graph, rounds: int) -> None:
        self.model: CountingModel = build_model(league, graph, rounds)
        self._index = {f.label: i for i, f in enumerate(league.fixtures)}

    @property
    def rounds(self) -> int:
        return self.model.rounds

    def check(self, assignment: dict[str, int]) -> list[Violation]:
        """Every broken clash or rule, fixtures in league order, clashes before rules."""
        m = self.model
        league = m.league
        out: list[Violation] = []
        known = {f.label for f in league.fixtures}
        for label in assignment:
            if label not in known:
                out.append(Violation("missing", f"{label} is not a fixture of this league",
                                     (label,)))
        for f in league.fixtures:
            r = assignment.get(f.label)
            if r is None:
                out.append(Violation("missing", f"{f.label} has no round", (f.label,)))
            elif not 1 <= r <= m.rounds:
                out.append(Violation("rounds", f"{f.label} is in round {r}, outside 1..{m.rounds}",
                                     (f.label,), (r,)))
        out += self._clashes(assignment)
        out += self._ties(assignment)
        out += self._fixed_and_blocked(assignment)
        placed = {lab: r for lab, r in assignment.items() if lab in known}
        out += check_generator(league, m.generator, placed, m.rounds)
        return out

    def _clashes(self, assignment: dict[str, int]) -> list[Violation]:
        out = []
        for u, v, data in self.model.clashes.edges(data=True):
            r = assignment.get(u)
            if r is None or r != assignment.get(v):
                continue
            reasons: list[Reason] = data.get("reasons", [])
            kind = "split" if reasons and all(x.kind == "split" for x in reasons) else "clash"
            first, second = sorted((u, v), key=self._order)
            out.append(Violation(
                kind,
                f"{first} and {second} are both in round {r}: {reasons_text(reasons)}",
                (first, second), (r,)))
        return out

    def _ties(self, assignment: dict[str, int]) -> list[Violation]:
        out = []
        for t in self.model.league.ties:
            a, b = assignment.get(t.first), assignment.get(t.second)
            if a is not None and b is not None and a != b:
                row = f" (Together row {t.row})" if t.row is not None else ""
                out.append(Violation(
                    "tie",
                    f"{t.first} and {t.second} must share a round{row} but are in rounds "
                    f"{a} and {b}",
                    (t.first, t.second), (a, b)))
        return out

    def _fixed_and_blocked(self, assignment: dict[str, int]) -> list[Violation]:
        m = self.model
        out = []
        for f in m.league.fixtures:
            r = assignment.get(f.label)
            if r is None:
                continue
            if f.label in m.fixed and f.pin != r:
                out.append(Violation(
                    "played" if f.played else "pin",
                    f"{f.label} is in round {r}, but it was {m.fixed[f.label]}",
                    (f.label,), (r,)))
            why = m.blocks.get(f.label, {}).get(r)
            if why:
                out.append(Violation(
                    "return half" if why.startswith("Return half") else "blocked",
                    f"{f.label} is in round {r}, but {why}", (f.label,), (r,)))
        return out

    def _order(self, label: str) -> int:
        return self._index.get(label, len(self._index))


def check_schedule(league: League, graph: nx.Graph, schedule: Schedule) -> list[Violation]:
    """Every clash or rule a schedule breaks, each named in words (empty when it holds)."""
    return ScheduleChecker(league, graph, schedule.rounds).check(schedule.assignment)
