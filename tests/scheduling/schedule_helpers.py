"""Small leagues built directly from model.py, and reference answers by the textbook definition.

`textbook_graph` builds the clash graph from the workbook format's definition (a shared team,
a shared venue or venue + pitch, a Clashes row); `brute` enumerates every map of fixtures to
rounds 1..K and keeps those meeting each rule as the issue words it. Both are for tests only.
"""

from __future__ import annotations

import itertools

import networkx as nx

from leaguegrid.core.model import Fixture, League, Reason, Settings


def fx(home: str, away: str, venue: str | None = None, **kw) -> Fixture:
    """A fixture 'Home v Away' (label overridable)."""
    label = kw.pop("label", f"{home} v {away}")
    return Fixture(label, home=home, away=away, venue=venue, **kw)


def make_league(fixtures: list[Fixture], **kw) -> League:
    settings = kw.pop("settings", Settings())
    return League(name="Test league", source="test", fixtures=fixtures, settings=settings, **kw)


def textbook_graph(league: League) -> nx.Graph:
    """Clash graph: shared team, shared venue (venue + pitch when a pitch is given; a venue
    with several pitches and no pitch is left to capacity), Clashes rows; splits not added."""
    g = nx.Graph()
    g.add_nodes_from(f.label for f in league.fixtures)
    multi = {v.name for v in league.venues.values() if v.pitches > 1}

    def add(a: str, b: str, reason: Reason) -> None:
        if g.has_edge(a, b):
            if reason not in g.edges[a, b]["reasons"]:
                g.edges[a, b]["reasons"].append(reason)
        else:
            g.add_edge(a, b, reasons=[reason])

    for f, h in itertools.combinations(league.fixtures, 2):
        for t in sorted(set(f.teams) & set(h.teams)):
            add(f.label, h.label, Reason("team", t))
        same_ground = f.venue and f.venue == h.venue and f.venue not in multi
        if same_ground and (f.pitch is None or h.pitch is None or f.pitch == h.pitch):
            add(f.label, h.label, Reason("venue", f.venue))
    for row in league.clash_rows:
        for a, b in row.pairs:
            add(a, b, Reason("clash", row.reason, row.row))
    return g


def brute(league: League, graph: nx.Graph, k: int) -> list[dict[str, int]]:
    """Every assignment of fixtures to rounds 1..k meeting the clashes, splits, ties, pins,
    played rounds, Blocked rows and Return half (first legs in 1..ceil(k/2))."""
    labels = [f.label for f in league.fixtures]
    half = -(-k // 2)
    use_half = league.settings.return_half and any(f.leg >= 2 for f in league.fixtures)
    out = []
    for rounds in itertools.product(range(1, k + 1), repeat=len(labels)):
        a = dict(zip(labels, rounds, strict=True))
        if any(a[u] == a[v] for u, v in graph.edges):
            continue
        if any(a[s.first] == a[s.second] for s in league.splits):
            continue
        if any(a[t.first] != a[t.second] for t in league.ties):
            continue
        if any(f.pin is not None and a[f.label] != f.pin for f in league.fixtures):
            continue
        if any(
            a[f.label] == b.round and (b.team in f.teams or (b.venue and b.venue == f.venue))
            for b in league.blocked
            for f in league.fixtures
        ):
            continue
        if use_half and any(
            (a[f.label] > half) if f.leg == 1 else (a[f.label] <= half) for f in league.fixtures
        ):
            continue
        out.append(a)
    return out


def round_robin(teams: list[str], venues: dict[str, str] | None = None,
                legs: int = 1) -> list[Fixture]:
    """Every pair once; for teams i < j (list order) i is at home when i + j is odd, which
    balances home games to within one; the return leg is swapped."""
    venues = venues or {}
    first = [
        (teams[i], teams[j]) if (i + j) % 2 else (teams[j], teams[i])
        for i, j in itertools.combinations(range(len(teams)), 2)
    ]
    out = [fx(h, a, venues.get(h)) for h, a in first]
    if legs == 2:
        out += [fx(a, h, venues.get(a), leg=2) for h, a in first]
    return out
