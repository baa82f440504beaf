"""What-if on clashes: what waiving a reason, or adding a clash, does to the exact counts.

Coordinators waive reasons, not edges. Waiving a reason removes every clash edge that exists
only because of it (an edge with a second reason stays); the count is recomputed on that
graph with the same ties, pins, frozen and blocked rounds. For a single edge e the identity
P(G - e, K) = P(G, K) + P(G / e, K) is used (contraction merges the two fixtures, joining their
pins and excluded rounds); for a new clash, P(G + e, K) = P(G, K) - P(G / e, K). Everything
works on the league's clash graph (clashes and splits): the extra edges the engine adds to
handle pins are never clashes and never offered here.
"""

from __future__ import annotations

import datetime as dt
import difflib
from collections.abc import Callable
from dataclasses import dataclass, field, replace
from itertools import product

import networkx as nx

from leaguegrid import engine
from leaguegrid.core.model import Blocked, Fixture, League, Reason
from leaguegrid.core.names import name_key
from leaguegrid.core.wording import ratio_of
from leaguegrid.scheduling.constraints import CountingModel, build_model

Edge = tuple[str, str]
GraphBuilder = Callable[[League], nx.Graph]


@dataclass
class Waived:
    """One reason waived: the edges only it makes, and the counts without them."""

    reason: str  # "team X", "venue Y", "Column=value", or the Clashes row's text "(row N)"
    kind: str  # team, venue, shared, clash, split
    edges: list[Edge]
    assignments_if_waived: int | None  # None when not computed within the budget
    gain: int | None
    min_rounds_if_waived: int | None
    ratio: float | None = None  # schedules if waived / schedules now

    def to_json(self) -> dict:
        return {
            "reason": self.reason,
            "kind": self.kind,
            "edges": [list(e) for e in self.edges],
            "assignments_if_waived": self.assignments_if_waived,
            "gain": self.gain,
            "ratio": self.ratio,
            "min_rounds_if_waived": self.min_rounds_if_waived,
        }


@dataclass
class Added:
    """A proposed new clash between two named fixtures, teams or venues."""

    first: str
    second: str
    edges: list[Edge]  # the new clash edges (pairs that clashed already are not repeated)
    assignments_if_added: int | None
    loss: int | None
    min_rounds_if_added: int | None

    def to_json(self) -> dict:
        return {
            "first": self.first,
            "second": self.second,
            "edges": [list(e) for e in self.edges],
            "assignments_if_added": self.assignments_if_added,
            "loss": self.loss,
            "min_rounds_if_added": self.min_rounds_if_added,
        }


@dataclass
class WhatIf:
    """The whatif report: counts for K rounds, every reason ranked by gain, a proposed clash."""

    rounds: int
    assignments: int | None
    min_rounds: int | None
    reasons: list[Waived] = field(default_factory=list)
    added: Added | None = None
    complete: bool = True  # False when the budget ran out or the job was cancelled

    def to_json(self) -> dict:
        out = {
            "rounds": self.rounds,
            "assignments": self.assignments,
            "min_rounds": self.min_rounds,
            "complete": self.complete,
            "reasons": [w.to_json() for w in self.reasons],
        }
        if self.added is not None:
            out["added"] = self.added.to_json()
        return out


@dataclass
class BeforeAfter:
    """Counts for K rounds before and after a change to the league."""

    change: str
    rounds: int
    assignments_before: int
    assignments_after: int
    min_rounds_before: int | None
    min_rounds_after: int | None
    fixtures_added: list[str] = field(default_factory=list)

    def to_json(self) -> dict:
        return {
            "change": self.change,
            "rounds": self.rounds,
            "assignments_before": self.assignments_before,
            "assignments_after": self.assignments_after,
            "min_rounds_before": self.min_rounds_before,
            "min_rounds_after": self.min_rounds_after,
            "fixtures_added": list(self.fixtures_added),
        }


def sole_edges(clashes: nx.Graph) -> dict[Reason, list[Edge]]:
    """Every reason on the clash graph -> the edges that exist only because of it, sorted."""
    out: dict[Reason, list[Edge]] = {}
    for u, v, data in clashes.edges(data=True):
        reasons = list(dict.fromkeys(data.get("reasons", [])))
        for r in reasons:
            out.setdefault(r, [])
        if len(reasons) == 1:
            out[reasons[0]].append(tuple(sorted((u, v))))
    return {r: sorted(es) for r, es in out.items()}


def contract(model: CountingModel, a: str, b: str) -> int:
    """P(G / ab, K) with pins and exclusions: assignments of the model with nodes a, b equal."""
    pa, pb = model.pins.get(a), model.pins.get(b)
    if pa is not None and pb is not None and pa != pb:
        return 0
    g = nx.contracted_nodes(model.counted(), a, b, self_loops=False, copy=True)
    pins = {v: r for v, r in model.pins.items() if v != b}
    if pb is not None:
        pins[a] = pb
    excl = {v: rs for v, rs in model.exclusions.items() if v != b}
    joined = model.exclusions.get(a, frozenset()) | model.exclusions.get(b, frozenset())
    if joined:
        excl[a] = joined
    return engine.count_assignments(g, model.rounds, pins=pins, exclusions=excl)


def _merged_edges(model: CountingModel, clashes: nx.Graph) -> set[frozenset]:
    out = set()
    for u, v in clashes.edges:
        a, b = model.node_of[u], model.node_of[v]
        if a != b:
            out.add(frozenset((a, b)))
    return out


def count_variant(model: CountingModel, clashes: nx.Graph, base: int,
                  hooks: engine.Hooks | None = None) -> int:
    """Assignments for K rounds on another fixture-level clash graph, same pins and exclusions.

    When the merged graphs differ by exactly one edge, deletion-contraction gives the count
    from the model's own count `base`; otherwise it is counted directly."""
    before, after = _merged_edges(model, model.clashes), _merged_edges(model, clashes)
    variant = model.with_clashes(clashes)
    if variant.contradictions:
        return 0
    if before == after and not model.contradictions:
        return base
    if not model.contradictions and len(before ^ after) == 1:
        a, b = sorted(next(iter(before ^ after)))
        together = contract(model if before > after else variant, a, b)
        return base + together if before > after else base - together
    return variant.count(hooks)


def _fewest_after(model: CountingModel, variant: CountingModel, base_min: int | None,
                  hooks: engine.Hooks | None, removed: bool) -> int | None:
    """The fewest rounds of a variant, using that removing (adding) edges cannot raise (lower)
    it when Return half is off: one count at the old minimum settles the common case."""
    if base_min is not None and model.half is None and not variant.contradictions:
        if removed and base_min > 1:
            probe = variant.at(base_min - 1)
            if not probe.contradictions and probe.count(hooks) == 0:
                return base_min
        if not removed:
            probe = variant.at(base_min)
            if not probe.contradictions and probe.count(hooks) > 0:
                return base_min
    return variant.fewest_rounds(hooks)


def waive_all(
    model: CountingModel,
    job: engine.Hooks | None = None,
    min_rounds: bool = True,
) -> tuple[int, int | None, list[Waived], bool]:
    """(assignments, fewest rounds, every reason waived in turn ranked by gain, complete)."""
    def hooks(lo: float, hi: float) -> engine.Hooks | None:
        return job.part(lo, hi) if job is not None else None

    base = model.count(hooks(0.0, 0.05))
    base_min = model.fewest_rounds(hooks(0.05, 0.1)) if min_rounds else None
    sole = sole_edges(model.clashes)
    out: list[Waived] = []
    complete = True
    # a team's own clashes are not offered: a team can never play twice in one round
    offered = ((r, e) for r, e in sole.items() if r.kind != "team")
    items = sorted(offered, key=lambda kv: str(kv[0]))
    for i, (reason, edges) in enumerate(items):
        h = hooks(0.1 + 0.9 * i / len(items), 0.1 + 0.9 * (i + 1) / len(items))
        entry = Waived(str(reason), reason.kind, edges, None, None, None)
        out.append(entry)
        if not complete:
            continue
        try:
            g = model.clashes.copy()
            g.remove_edges_from(edges)
            entry.assignments_if_waived = count_variant(model, g, base, h)
            entry.gain = entry.assignments_if_waived - base
            entry.ratio = ratio_of(entry.assignments_if_waived, base)
            if min_rounds:
                entry.min_rounds_if_waived = _fewest_after(
                    model, model.with_clashes(g), base_min, h, removed=True)
        except (engine.BudgetExceeded, engine.Cancelled):
            complete = False
    out.sort(key=lambda w: (w.gain is None, -(w.gain or 0), -len(w.edges), w.reason))
    return base, base_min, out, complete


def whatif(
    league: League,
    graph: nx.Graph,
    rounds: int,
    add: tuple[str, str] | None = None,
    hooks: engine.Hooks | None = None,
) -> WhatIf:
    """The whatif report for K rounds: every reason ranked by gain, and an optional new clash
    between two names (fixture, team or venue; 'team: X' qualifies an ambiguous name)."""
    hooks = hooks or engine.Hooks()
    model = build_model(league, graph, rounds)
    added = None
    if add is not None:
        added = Added(add[0], add[1], new_edges(league, model.clashes, *add), None, None, None)
    try:
        base, base_min, reasons, complete = waive_all(model, hooks)
    except (engine.BudgetExceeded, engine.Cancelled):
        return WhatIf(rounds, None, None, [], added, complete=False)
    report = WhatIf(rounds, base, base_min, reasons, added, complete)
    if added is not None and complete:
        try:
            _fill_added(model, added, base, base_min, hooks.part(0.95, 1.0))
        except (engine.BudgetExceeded, engine.Cancelled):
            report.complete = False
    return report


def _fill_added(model: CountingModel, added: Added, base: int, base_min: int | None,
                hooks: engine.Hooks) -> None:
    g = model.clashes.copy()
    reason = Reason("clash", f"proposed: {added.first} / {added.second}")
    for u, v in added.edges:
        g.add_edge(u, v, reasons=[reason])
    added.assignments_if_added = count_variant(model, g, base, hooks)
    added.loss = base - added.assignments_if_added
    added.min_rounds_if_added = _fewest_after(model, model.with_clashes(g), base_min, hooks,
                                              removed=False)


def add_clash(
    league: League, graph: nx.Graph, rounds: int, first: str, second: str,
    hooks: engine.Hooks | None = None,
) -> Added:
    """How many assignments a new clash between two names removes, and the fewest rounds."""
    model = build_model(league, graph, rounds)
    added = Added(first, second, new_edges(league, model.clashes, first, second), None, None,
                  None)
    _fill_added(model, added, model.count(hooks), model.fewest_rounds(hooks), hooks)
    return added


def resolve(league: League, name: str) -> list[str]:
    """The fixtures a name stands for: a fixture, a team's or a venue's fixtures.

    'fixture: …', 'team: …' or 'venue: …' picks the kind; a name of two kinds is an error."""
    kind, sep, rest = name.partition(":")
    kinds = ("fixture", "team", "venue")
    if sep and kind.strip().lower() in kinds:
        wanted, text = [kind.strip().lower()], rest.strip()
    else:
        wanted, text = list(kinds), name.strip()
    key = name_key(text)
    found = {
        "fixture": [f.label for f in league.fixtures if name_key(f.label) == key],
        "team": [f.label for f in league.fixtures if key in {name_key(t) for t in f.teams}],
        "venue": [f.label for f in league.fixtures if name_key(f.venue) == key],
    }
    hits = [k for k in wanted if found[k]]
    if len(hits) > 1:
        raise ValueError(f"{text!r} names a {' and a '.join(hits)}; write "
                         f"'{hits[0]}: {text}' or '{hits[1]}: {text}'")
    if not hits:
        names = [f.label for f in league.fixtures] + [t for f in league.fixtures
                                                      for t in f.teams]
        names += [f.venue for f in league.fixtures if f.venue]
        close = difflib.get_close_matches(text, list(dict.fromkeys(names)), n=1)
        hint = f"; did you mean {close[0]!r}?" if close else ""
        raise ValueError(f"{text!r} is not a fixture, team or venue of this league{hint}")
    return found[hits[0]]


def new_edges(league: League, clashes: nx.Graph, first: str, second: str) -> list[Edge]:
    """The fixture pairs a new clash between two names adds (a fixture never with itself)."""
    a, b = resolve(league, first), resolve(league, second)
    if a == b and len(a) == 1:
        raise ValueError(f"{first!r} and {second!r} are the same fixture")
    pairs = {tuple(sorted((x, y))) for x, y in product(a, b) if x != y}
    return sorted(p for p in pairs if not clashes.has_edge(*p))


def _counts(league: League, graph: nx.Graph, rounds: int, hooks: engine.Hooks | None
            ) -> tuple[int, int | None]:
    m = build_model(league, graph, rounds)
    return m.count(hooks), m.fewest_rounds(hooks)


def venue_closes(
    league: League, graph: nx.Graph, rounds: int, venue: str, when: int | dt.date,
    hooks: engine.Hooks | None = None,
) -> BeforeAfter:
    """Counts before and after a venue closes for one round (a number or a Rounds-sheet date)."""
    r = round_of(league, when)
    closed = replace(league, blocked=[*league.blocked,
                                      Blocked(r, venue=venue, reason="what-if: closed")])
    before, min_before = _counts(league, graph, rounds, hooks)
    after, min_after = _counts(closed, graph, rounds, hooks)
    return BeforeAfter(f"venue {venue} closed in round {r}", rounds, before, after,
                       min_before, min_after)


def round_of(league: League, when: int | dt.date) -> int:
    """A round number, or the round of a date in the Rounds sheet."""
    if isinstance(when, dt.date):
        for info in league.rounds:
            if info.date == when:
                return info.number
        raise ValueError(f"{when.isoformat()} is not a date of the Rounds sheet")
    if when < 1:
        raise ValueError(f"round {when} is not a positive whole number")
    return when


def division_teams(league: League, division: str) -> list[str]:
    """The teams of a division, from the Teams sheet and the fixtures, first seen first."""
    key = name_key(division)
    out = [t.name for t in league.teams.values() if name_key(t.division) == key]
    for f in league.fixtures:
        if name_key(f.division) == key:
            out += list(f.teams)
    return list(dict.fromkeys(out))


def joining_fixtures(league: League, team: str, division: str, venue: str | None = None
                     ) -> list[Fixture]:
    """A new team's fixtures: one per opponent per leg (Legs), at home against every other
    opponent in division order, the return leg swapped; the venue is the home side's ground."""
    opponents = division_teams(league, division)
    if not opponents:
        raise ValueError(f"division {division!r} has no teams")
    if name_key(team) in {name_key(t) for t in opponents} or any(
        name_key(team) in {name_key(t) for t in f.teams} for f in league.fixtures
    ):
        raise ValueError(f"team {team!r} already plays in this league")
    grounds = {name_key(t.name): t.venue for t in league.teams.values()}
    grounds[name_key(team)] = venue
    labels = {name_key(f.label) for f in league.fixtures}
    out = []
    for leg in range(1, max(1, league.settings.legs) + 1):
        for i, opp in enumerate(opponents):
            home, away = (team, opp) if (i + leg) % 2 == 1 else (opp, team)
            label = f"{home} v {away}"
            if name_key(label) in labels:
                label = f"{label} ({leg})"
            labels.add(name_key(label))
            out.append(Fixture(label, home=home, away=away, venue=grounds.get(name_key(home)),
                               division=division, leg=leg))
    return out


def team_joins(
    league: League, rounds: int, team: str, division: str, venue: str | None = None,
    build_graph: GraphBuilder | None = None, hooks: engine.Hooks | None = None,
) -> BeforeAfter:
    """Counts before and after a new team joins a division (its fixtures generated)."""
    if build_graph is None:
        from leaguegrid.clashes.graph import build_clash_graph as build_graph
    extra = joining_fixtures(league, team, division, venue)
    grown = replace(league, fixtures=[*league.fixtures, *extra])
    before, min_before = _counts(league, build_graph(league), rounds, hooks)
    after, min_after = _counts(grown, build_graph(grown), rounds, hooks)
    return BeforeAfter(f"team {team} joins division {division}", rounds, before, after,
                       min_before, min_after, [f.label for f in extra])
