"""The clash graph: a node per fixture, an edge per pair of fixtures that may not share a round,
each edge carrying every reason it exists (a list of model.Reason, one per cause)."""

from __future__ import annotations

import itertools
import unicodedata
from collections.abc import Iterable

import networkx as nx

from leaguegrid.core.model import Fixture, League, Reason


def _key(text: str) -> str:
    """Names match case- and space-insensitively (the workbook format's rule)."""
    return "".join(unicodedata.normalize("NFKC", text).casefold().split())


def build_clash_graph(league: League) -> nx.Graph:
    """Fixtures clash when they share a team (Home/Away in Shared), a venue or pitch (Venue in
    Shared; a venue with several pitches and no pitch given is left to the capacity rule),
    an equal value of another Shared column, a Clashes row, or an Apart row."""
    graph = nx.Graph()
    for f in league.fixtures:
        graph.add_node(
            f.label, division=f.division, venue=f.venue, pitch=f.pitch, home=f.home, away=f.away
        )
    shared = {_key(name) for name in league.settings.shared}
    if shared & {"home", "away"}:
        _add_groups(graph, _team_groups(league.fixtures))
    if "venue" in shared:
        _add_groups(graph, _venue_groups(league))
    _add_groups(graph, _shared_groups(league.fixtures, league.settings.team_shared))
    for clash in league.clash_rows:
        reason = Reason("clash", clash.reason or "no reason given", clash.row)
        for a, b in clash.pairs:
            add_reason(graph, a, b, reason)
    for split in league.splits:
        add_reason(graph, split.first, split.second, Reason("split", split.reason, split.row))
    return graph


def pair_bound(league: League) -> int:
    """At most how many clashing pairs build_clash_graph makes, counted from the sizes of the
    groups it joins (never building them), so that a league too large to hold is refused."""
    shared = {_key(name) for name in league.settings.shared}
    sizes: list[int] = []
    pairs = 0
    if shared & {"home", "away"}:
        teams: dict[str, int] = {}
        for f in league.fixtures:
            for team in {_key(t) for t in f.teams}:
                teams[team] = teams.get(team, 0) + 1
        sizes += teams.values()
    if "venue" in shared:
        pitches = {_key(v.name): v.pitches for v in league.venues.values()}
        venues: dict[str, list[Fixture]] = {}
        for f in league.fixtures:
            if f.venue:
                venues.setdefault(_key(f.venue), []).append(f)
        for key, at_venue in venues.items():
            whole = sum(1 for f in at_venue if not f.pitch)
            if whole and pitches.get(key, 1) <= 1:
                pairs += whole * (len(at_venue) - 1)
            by_pitch: dict[str, int] = {}
            for f in at_venue:
                if f.pitch:
                    by_pitch[_key(f.pitch)] = by_pitch.get(_key(f.pitch), 0) + 1
            sizes += by_pitch.values()
    values: dict[tuple[str, str], set[str]] = {}
    for f in league.fixtures:
        for column, cells in f.shared.items():
            for value in cells:
                if value.strip():
                    values.setdefault((_key(column), _key(value)), set()).add(f.label)
    sizes += (len(labels) for labels in values.values())
    pairs += sum(len(c.pairs) for c in league.clash_rows) + len(league.splits)
    return pairs + sum(k * (k - 1) // 2 for k in sizes)


def add_reason(graph: nx.Graph, a: str, b: str, reason: Reason) -> None:
    """Add `reason` to the edge a-b (creating it); a self-pair or an unknown fixture is ignored."""
    if a == b or a not in graph or b not in graph:
        return
    if graph.has_edge(a, b):
        reasons = graph.edges[a, b]["reasons"]
        if reason not in reasons:
            reasons.append(reason)
    else:
        graph.add_edge(a, b, reasons=[reason])


def _add_groups(graph: nx.Graph, groups: Iterable[tuple[Reason, list[str]]]) -> None:
    for reason, members in groups:
        for a, b in itertools.combinations(members, 2):
            add_reason(graph, a, b, reason)


def _team_groups(fixtures: list[Fixture]) -> list[tuple[Reason, list[str]]]:
    """Each team's fixtures (home or away) form one group."""
    groups: dict[str, tuple[Reason, list[str]]] = {}
    for f in fixtures:
        for team in dict.fromkeys(f.teams):
            groups.setdefault(_key(team), (Reason("team", team), []))[1].append(f.label)
    return list(groups.values())


def _venue_groups(league: League) -> list[tuple[Reason, list[str]]]:
    """A fixture with a pitch clashes with the same venue and pitch; a fixture with no pitch
    takes the whole ground (clashes with every fixture there), unless the Venues sheet gives
    the venue several pitches: then it makes no edge and the capacity rule applies."""
    pitches = {_key(v.name): v.pitches for v in league.venues.values()}
    venues: dict[str, list[Fixture]] = {}
    for f in league.fixtures:
        if f.venue:
            venues.setdefault(_key(f.venue), []).append(f)
    groups: list[tuple[Reason, list[str]]] = []
    for key, at_venue in venues.items():
        name = at_venue[0].venue or ""
        whole = [f.label for f in at_venue if not f.pitch]
        if whole and pitches.get(key, 1) <= 1:
            reason = Reason("venue", name)
            everyone = [f.label for f in at_venue]
            groups += [(reason, [w, other]) for w in whole for other in everyone if other != w]
        by_pitch: dict[str, list[Fixture]] = {}
        for f in at_venue:
            if f.pitch:
                by_pitch.setdefault(_key(f.pitch), []).append(f)
        for members in by_pitch.values():
            groups.append(
                (
                    Reason("venue", pitch_key(name, members[0].pitch or "")),
                    [f.label for f in members],
                )
            )
    return groups


def pitch_key(venue: str, pitch: str) -> str:
    """'Marsh Lane, pitch 2' for a numbered pitch; 'Hall, Court 3' when the pitch has a name."""
    if any(ch.isalpha() for ch in pitch):
        return f"{venue}, {pitch}"
    return f"{venue}, pitch {pitch}"


def _shared_groups(
    fixtures: list[Fixture], team_columns: Iterable[str] = ()
) -> list[tuple[Reason, list[str]]]:
    """Equal values of one other Shared column (a cell may hold several, ';'-separated). A
    Fixtures column's reason reads 'Referee=Bo'; a Teams column's, like a team's, 'coach Bo'."""
    of_teams = {_key(c) for c in team_columns}
    groups: dict[tuple[str, str], tuple[Reason, list[str]]] = {}
    for f in fixtures:
        for column, values in f.shared.items():
            for value in dict.fromkeys(values):
                if value.strip():
                    key = (f"{column.casefold()} {value}" if _key(column) in of_teams
                           else f"{column}={value}")
                    reason = Reason("shared", key)
                    entry = groups.setdefault((_key(column), _key(value)), (reason, []))
                    if f.label not in entry[1]:
                        entry[1].append(f.label)
    return list(groups.values())


def edge_reasons(graph: nx.Graph, a: str, b: str) -> list[Reason]:
    """Why a and b clash ([] when they do not)."""
    return list(graph.edges[a, b]["reasons"]) if graph.has_edge(a, b) else []


def reason_edges(graph: nx.Graph) -> dict[Reason, set[frozenset]]:
    """For each reason, the edges that carry it."""
    out: dict[Reason, set[frozenset]] = {}
    for a, b, data in graph.edges(data=True):
        for reason in data["reasons"]:
            out.setdefault(reason, set()).add(frozenset((a, b)))
    return out


def sole_reason_edges(graph: nx.Graph) -> dict[Reason, set[frozenset]]:
    """For each reason, the edges that exist only because of it (waiving it removes them)."""
    out: dict[Reason, set[frozenset]] = {r: set() for r in reason_edges(graph)}
    for a, b, data in graph.edges(data=True):
        if len(data["reasons"]) == 1:
            out[data["reasons"][0]].add(frozenset((a, b)))
    return out


def without_reasons(graph: nx.Graph, waived: Iterable[Reason]) -> nx.Graph:
    """A copy with the waived reasons removed; edges left with no reason are deleted."""
    gone = set(waived)
    out = nx.Graph()
    out.add_nodes_from(graph.nodes(data=True))
    for a, b, data in graph.edges(data=True):
        kept = [r for r in data["reasons"] if r not in gone]
        if kept:
            out.add_edge(a, b, reasons=kept)
    return out


def describe(reason: Reason) -> str:
    """A reason as a coordinator reads it: 'team X', 'venue Y', 'Referee=Z', 'Clashes row 4: …'."""
    if reason.kind == "clash":
        return f"Clashes row {reason.row}: {reason.key}" if reason.row else reason.key
    if reason.kind == "split":
        return f"Apart row {reason.row}: {reason.key}" if reason.row else reason.key
    return str(reason)
