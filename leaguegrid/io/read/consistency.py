"""Contradictions no schedule can meet, found when the workbook is read: clashing fixtures
pinned (or tied) into one round, ties joining different pins, pins in blocked rounds."""

from __future__ import annotations

import networkx as nx

from leaguegrid.clashes.graph import describe, edge_reasons
from leaguegrid.core.model import League
from leaguegrid.io.read.columns import Table
from leaguegrid.io.read.problems import Place, Report


def rows_text(rows: list[int]) -> str:
    """'row 3', 'rows 3 and 5', 'rows 2, 3 and 5'."""
    rows = sorted(set(rows))
    if len(rows) == 1:
        return f"row {rows[0]}"
    return f"rows {', '.join(map(str, rows[:-1]))} and {rows[-1]}"


def reasons_text(graph: nx.Graph, a: str, b: str) -> str:
    return "; ".join(describe(r) for r in edge_reasons(graph, a, b))


def check_pins(
    league: League, graph: nx.Graph, pin_places: dict[str, Place], report: Report
) -> None:
    """Two fixtures pinned to one round that clash: no schedule exists."""
    rows = {f.label: f.row or 0 for f in league.fixtures}
    pins = league.pins
    for a, b in graph.edges():
        if a in pins and b in pins and pins[a] == pins[b]:
            first, second = sorted((a, b), key=lambda label: rows[label])
            report.error(
                f"'{first}' (row {rows[first]}) and '{second}' (row {rows[second]}) are both "
                f"pinned to round {pins[a]} but clash ({reasons_text(graph, a, b)}): "
                "no schedule can keep both pins",
                pin_places.get(second, Place()),
            )


def _ordered(edges, league: League) -> list[tuple[str, str]]:
    """Edges with their ends (and the edges themselves) in fixture order."""
    index = {f.label: i for i, f in enumerate(league.fixtures)}
    pairs = [tuple(sorted((a, b), key=index.__getitem__)) for a, b in edges]
    return sorted(pairs, key=lambda p: (index[p[0]], index[p[1]]))


class _Groups:
    """Union-find over tied fixtures."""

    def __init__(self) -> None:
        self.parent: dict[str, str] = {}

    def find(self, x: str) -> str:
        self.parent.setdefault(x, x)
        while self.parent[x] != x:
            self.parent[x] = self.parent[self.parent[x]]
            x = self.parent[x]
        return x

    def union(self, a: str, b: str) -> None:
        self.parent[self.find(a)] = self.find(b)


def check_ties(league: League, graph: nx.Graph, ties: Table | None, report: Report) -> None:
    """Tied fixtures share a round: they must not clash, and their pins must agree."""
    if not league.ties or ties is None:
        return
    groups = _Groups()
    for tie in league.ties:
        groups.union(tie.first, tie.second)
    members: dict[str, list[str]] = {}
    rows: dict[str, list[int]] = {}
    for label in groups.parent:
        members.setdefault(groups.find(label), []).append(label)
    for tie in league.ties:
        rows.setdefault(groups.find(tie.first), []).append(tie.row or 0)
    pins = league.pins
    group_pin: dict[str, int] = {}
    for root, labels in members.items():
        place = Place(ties.sheet, min(rows[root]))
        pinned = sorted({(pins[x], x) for x in labels if x in pins})
        rounds = sorted({p for p, _ in pinned})
        if len(rounds) > 1:
            (p, a), (q, b) = pinned[0], next(item for item in pinned if item[0] != pinned[0][0])
            report.error(
                f"Together ({rows_text(rows[root])}) keeps '{a}' (pinned to round {p}) and "
                f"'{b}' (pinned to round {q}) in one round",
                place,
            )
        elif rounds:
            group_pin[root] = rounds[0]
        for a, b in _ordered(graph.subgraph(labels).edges(), league):
            report.error(
                f"'{a}' and '{b}' clash ({reasons_text(graph, a, b)}) but Together "
                f"({rows_text(rows[root])}) keeps them in one round",
                place,
            )
    _check_tied_pins(league, graph, groups, group_pin, rows, ties, report)


def _check_tied_pins(
    league: League,
    graph: nx.Graph,
    groups: _Groups,
    group_pin: dict[str, int],
    rows: dict[str, list[int]],
    ties: Table,
    report: Report,
) -> None:
    """A fixture tied into a pinned round must not clash with another fixture in that round."""
    pins = league.pins

    def effective(label: str) -> int | None:
        if label in pins:
            return pins[label]
        return group_pin.get(groups.find(label)) if label in groups.parent else None

    for a, b in _ordered(graph.edges(), league):
        if a in pins and b in pins:
            continue  # both pinned directly: reported by check_pins
        ra, rb = effective(a), effective(b)
        if ra is None or ra != rb:
            continue
        if a in groups.parent and b in groups.parent and groups.find(a) == groups.find(b):
            continue  # inside one tie group: reported above
        tied = a if a not in pins else b
        root = groups.find(tied)
        report.error(
            f"'{a}' and '{b}' clash ({reasons_text(graph, a, b)}) but pins and Together "
            f"({rows_text(rows[root])}) put both in round {ra}",
            Place(ties.sheet, min(rows[root])),
        )


def check_blocked(league: League, blocked: Table | None, report: Report) -> None:
    """A pinned fixture in a round its team or venue is blocked from."""
    if not league.blocked or blocked is None:
        return
    for b in league.blocked:
        for f in league.fixtures:
            if f.pin != b.round:
                continue
            if b.team and b.team in f.teams:
                kind, name = "team", b.team
            elif b.venue and f.venue == b.venue:
                kind, name = "venue", b.venue
            else:
                continue
            report.error(
                f"{kind} '{name}' is blocked in round {b.round}, but '{f.label}' "
                f"(Fixtures row {f.row}) is pinned to round {b.round}",
                Place(blocked.sheet, b.row, blocked.header(kind, kind.title()), name),
            )
