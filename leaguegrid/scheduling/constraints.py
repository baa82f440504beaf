"""The exact counting model of a league for K rounds, and the rules it does not count.

The engine counts maps of a graph's nodes to rounds 1..K with no clash inside a round, pins
and per-node excluded rounds respected. A league becomes such a graph exactly:
- splits are clash edges of their own;
- tied fixtures (Together sheet: they must share a round) are merged into one node, named by the
  first of them in league order; a tie between clashing fixtures is a contradiction;
- pins and played fixtures (frozen in the round they were played) pin their node;
- Blocked rows exclude rounds: a blocked team excludes the round for every fixture of that
  team, a blocked venue for every fixture at that venue;
- Return half (Legs = 2): with H = ceil(K / 2), first-leg fixtures may use rounds 1..H only
  and return fixtures rounds H+1..K only; also an exclusion, so it is counted exactly.
Venue capacity, the longest home or away run and round balance are not counted: only the
generator enforces them (rules.py).
"""

from __future__ import annotations

from dataclasses import dataclass, field

import networkx as nx

from leaguegrid import engine
from leaguegrid.core.model import League, Reason
from leaguegrid.core.names import name_key
from leaguegrid.core.wording import plural
from leaguegrid.scheduling.rules import GeneratorRules, generator_rules


@dataclass
class CountingModel:
    """A league for K rounds as the engine's graph, pins and exclusions, plus the words for it."""

    league: League
    rounds: int
    clashes: nx.Graph  # fixture-level: the clash graph plus split edges, "reasons" on each edge
    graph: nx.Graph  # tied fixtures merged (every clash and split edge, with reasons)
    node_of: dict[str, str]  # fixture label -> its node in `graph`
    members: dict[str, tuple[str, ...]]  # node -> its fixture labels, league order
    pins: dict[str, int]  # node -> round
    exclusions: dict[str, frozenset[int]]  # node -> rounds in 1..K it may not use
    fixed: dict[str, str]  # fixture label -> why its round is fixed ("pinned to round 3")
    blocks: dict[str, dict[int, str]]  # fixture label -> excluded round -> why
    half: int | None  # H when Return half is active: first legs in 1..H
    generator: GeneratorRules
    rules_counted: list[str]
    rules_generator: list[str]
    contradictions: list[str] = field(default_factory=list)  # proven impossibilities, in words
    notes: list[str] = field(default_factory=list)
    engine_graph: nx.Graph | None = None  # `graph` less edges whose ends share no round

    def counted(self) -> nx.Graph:
        """The graph handed to the engine: `graph` without the edges that cannot bind for K
        rounds (their two nodes have no allowed round in common, e.g. a first leg and a return
        fixture under Return half), so it falls apart into independent pieces. Same counts."""
        if self.engine_graph is None:
            doms = {v: self.domain(v) for v in self.graph}
            g = nx.Graph()
            g.add_nodes_from(self.graph)
            g.add_edges_from((u, v) for u, v in self.graph.edges if doms[u] & doms[v])
            self.engine_graph = g
        return self.engine_graph

    def expand(self, assignment: dict[str, int]) -> dict[str, int]:
        """Node -> round as fixture label -> round, in league order."""
        out = {}
        for f in self.league.fixtures:
            node = self.node_of[f.label]
            if node in assignment:
                out[f.label] = assignment[node]
        return out

    def domain(self, node: str) -> set[int]:
        """The rounds a node may use."""
        if node in self.pins:
            p = self.pins[node]
            ok = 1 <= p <= self.rounds and p not in self.exclusions.get(node, ())
            return {p} if ok else set()
        return set(range(1, self.rounds + 1)) - self.exclusions.get(node, frozenset())

    def fixture_domains(self) -> dict[str, set[int]]:
        """Fixture label -> the rounds it may use (a tied fixture shares its node's)."""
        doms = {node: self.domain(node) for node in self.graph}
        return {f.label: set(doms[self.node_of[f.label]]) for f in self.league.fixtures}

    def at(self, rounds: int) -> CountingModel:
        """The same league and clashes for another number of rounds."""
        return model_from_clashes(self.league, self.clashes, rounds)

    def with_clashes(self, clashes: nx.Graph) -> CountingModel:
        """The same league, pins and exclusions on another fixture-level clash graph."""
        return model_from_clashes(self.league, clashes, self.rounds)

    def count(self, hooks: engine.Hooks | None = None) -> int:
        """Exact number of valid assignments for K rounds (0 on a contradiction)."""
        if self.contradictions:
            return 0
        return engine.count_assignments(
            self.counted(), self.rounds, pins=self.pins, exclusions=self.exclusions, hooks=hooks
        )

    def count_all_rounds_used(self, hooks: engine.Hooks | None = None) -> int:
        """Exact number of valid assignments that use every round 1..K."""
        if self.contradictions:
            return 0
        return engine.count_all_rounds_used(
            self.counted(), self.rounds, pins=self.pins, exclusions=self.exclusions, hooks=hooks
        )

    def fewest_rounds(self, hooks: engine.Hooks | None = None) -> int | None:
        """The fewest rounds for which a valid assignment exists; None when none ever does."""
        return fewest_rounds(self, hooks)

    def fewest_rounds_proof(self, hooks: engine.Hooks | None = None) -> engine.RoundsBounds | None:
        """The fewest rounds with the method of each side (fewest_rounds_proof)."""
        return fewest_rounds_proof(self, hooks)


def build_model(league: League, graph: nx.Graph, rounds: int) -> CountingModel:
    """The counting model of a league and its clash graph (from build_clash_graph) for K rounds."""
    return model_from_clashes(league, with_splits(league, graph), rounds)


def with_splits(league: League, graph: nx.Graph) -> nx.Graph:
    """A copy of the clash graph with every fixture as a node and each split as a clash edge."""
    g = nx.Graph()
    g.add_nodes_from(f.label for f in league.fixtures)
    for u, v, data in graph.edges(data=True):
        g.add_edge(u, v, reasons=list(data.get("reasons", [])))
    for s in league.splits:
        _known(league, s.first, "Apart", s.row)
        _known(league, s.second, "Apart", s.row)
        if s.first == s.second:
            raise ValueError(f"Apart row {s.row} names {s.first!r} on both sides")
        reason = Reason("split", s.reason, s.row)
        if g.has_edge(s.first, s.second):
            if reason not in g.edges[s.first, s.second]["reasons"]:
                g.edges[s.first, s.second]["reasons"].append(reason)
        else:
            g.add_edge(s.first, s.second, reasons=[reason])
    return g


def _known(league: League, label: str, sheet: str, row: int | None) -> None:
    if not any(f.label == label for f in league.fixtures):
        where = f" row {row}" if row is not None else ""
        raise ValueError(f"{sheet}{where} names {label!r}, which is not a fixture")


def reasons_text(reasons: list[Reason]) -> str:
    """Reasons of a clash edge, joined for a message."""
    return "; ".join(str(r) for r in reasons) or "a clash"


def tie_groups(league: League) -> tuple[dict[str, str], dict[str, tuple[str, ...]]]:
    """Union the Together pairs: fixture label -> node (first such label in league order),
    members."""
    order = {f.label: i for i, f in enumerate(league.fixtures)}
    parent = {lab: lab for lab in order}

    def find(x: str) -> str:
        while parent[x] != x:
            parent[x] = parent[parent[x]]
            x = parent[x]
        return x

    for t in league.ties:
        _known(league, t.first, "Together", t.row)
        _known(league, t.second, "Together", t.row)
        a, b = find(t.first), find(t.second)
        if a != b:
            a, b = sorted((a, b), key=order.__getitem__)
            parent[b] = a
    groups: dict[str, list[str]] = {}
    for lab in order:
        groups.setdefault(find(lab), []).append(lab)
    node_of = {lab: root for root, labs in groups.items() for lab in labs}
    return node_of, {root: tuple(labs) for root, labs in groups.items()}


def fixture_blocks(league: League) -> dict[str, dict[int, str]]:
    """Fixture label -> round -> why the Blocked sheet keeps it out of that round."""
    out: dict[str, dict[int, str]] = {}
    for b in league.blocked:
        who = f"team {b.team}" if b.team else f"venue {b.venue}"
        row = f"Blocked row {b.row}" if b.row is not None else "Blocked"
        why = f"{who} is blocked in round {b.round} ({row}{': ' + b.reason if b.reason else ''})"
        for f in league.fixtures:
            hit = (b.team and name_key(b.team) in {name_key(t) for t in f.teams}) or (
                b.venue and name_key(b.venue) == name_key(f.venue)
            )
            if hit:
                out.setdefault(f.label, {}).setdefault(b.round, why)
    return out


def return_half(league: League, rounds: int) -> int | None:
    """H = ceil(K/2) when Return half is on and return fixtures exist, else None."""
    if not league.settings.return_half or not any(f.leg >= 2 for f in league.fixtures):
        return None
    return -(-rounds // 2)


def model_from_clashes(
    league: League, clashes: nx.Graph, rounds: int, use_return_half: bool = True
) -> CountingModel:
    """The counting model on a fixture-level clash graph that already holds the splits."""
    if rounds < 1:
        raise ValueError(f"the number of rounds must be a positive whole number, not {rounds}")
    node_of, members = tie_groups(league)
    contradictions: list[str] = []
    notes: list[str] = []
    fixed: dict[str, str] = {}
    fixed_round: dict[str, int] = {}
    for f in league.fixtures:
        if f.pin is not None:
            fixed_round[f.label] = f.pin
            fixed[f.label] = (
                f"played in round {f.pin}" if f.played else f"pinned to round {f.pin}"
            )
        elif f.played:
            notes.append(f"{f.label} is marked played but has no round, so it is not frozen")
    blocks = {
        lab: {r: why for r, why in rs.items() if r <= rounds}
        for lab, rs in fixture_blocks(league).items()
    }
    half = return_half(league, rounds) if use_return_half else None
    if half is not None:
        for f in league.fixtures:
            span = range(half + 1, rounds + 1) if f.leg == 1 else range(1, half + 1)
            which = "first legs" if f.leg == 1 else "return fixtures"
            where = _rounds_span(1, half) if f.leg == 1 else _rounds_span(half + 1, rounds)
            for r in span:
                blocks.setdefault(f.label, {}).setdefault(
                    r, f"Return half puts {which} in {where}"
                )

    pins: dict[str, int] = {}
    exclusions: dict[str, frozenset[int]] = {}
    for node, labs in members.items():
        pinned = [(lab, fixed_round[lab]) for lab in labs if lab in fixed_round]
        if len({r for _, r in pinned}) > 1:
            shown = ", ".join(f"{lab} ({fixed[lab]})" for lab, _ in pinned)
            contradictions.append(f"fixtures kept together must share a round, but {shown}")
        elif pinned:
            pins[node] = pinned[0][1]
        excl = frozenset(r for lab in labs for r in blocks.get(lab, {}))
        if excl:
            exclusions[node] = excl
    contradictions += _fixed_contradictions(
        league, members, pins, fixed, fixed_round, blocks, rounds
    )
    graph, loops = merged_graph(clashes, node_of, members)
    contradictions += [_loop_text(league, node_of, u, v, reasons) for u, v, reasons in loops]
    for u, v, data in graph.edges(data=True):
        if u in pins and v in pins and pins[u] == pins[v]:
            contradictions.append(
                f"{u} and {v} clash ({reasons_text(data['reasons'])}) but both are fixed "
                f"to round {pins[u]}"
            )
    generator = generator_rules(league)
    return CountingModel(
        league=league,
        rounds=rounds,
        clashes=clashes,
        graph=graph,
        node_of=node_of,
        members=members,
        pins=pins,
        exclusions=exclusions,
        fixed=fixed,
        blocks=blocks,
        half=half,
        generator=generator,
        rules_counted=counted_rules(league, clashes, half, rounds),
        rules_generator=generator.describe(),
        contradictions=contradictions,
        notes=notes,
    )


def _fixed_contradictions(
    league: League,
    members: dict[str, tuple[str, ...]],
    pins: dict[str, int],
    fixed: dict[str, str],
    fixed_round: dict[str, int],
    blocks: dict[str, dict[int, str]],
    rounds: int,
) -> list[str]:
    """Pins beyond K or on an excluded round, and fixtures left with no round at all."""
    out = []
    for node, labs in members.items():
        if node in pins:
            p = pins[node]
            source = next(lab for lab in labs if lab in fixed_round)
            if p > rounds:
                out.append(f"{source} is {fixed[source]}, but there are only "
                           f"{plural(rounds, 'round')}")
                continue
            for lab in labs:
                if p in blocks.get(lab, {}):
                    how = (fixed[lab] if lab == source
                           else f"together with {source}, {fixed[source]}")
                    out.append(f"{lab} is {how}, but {blocks[lab][p]}")
        elif rounds >= 1:
            free = set(range(1, rounds + 1))
            for lab in labs:
                free -= set(blocks.get(lab, {}))
            if not free:
                out.append(
                    f"no round in 1..{rounds} is left for {' + '.join(labs)}: every round is "
                    "blocked for it"
                )
    return out


def merged_graph(
    clashes: nx.Graph, node_of: dict[str, str], members: dict[str, tuple[str, ...]]
) -> tuple[nx.Graph, list[tuple[str, str, list[Reason]]]]:
    """Merge tied fixtures; edges join their reasons. Also the clashes inside a tie."""
    g = nx.Graph()
    g.add_nodes_from(members)
    loops = []
    for u, v, data in clashes.edges(data=True):
        a, b = node_of[u], node_of[v]
        reasons = list(data.get("reasons", []))
        if a == b:
            loops.append((u, v, reasons))
        elif g.has_edge(a, b):
            have = g.edges[a, b]["reasons"]
            have.extend(r for r in reasons if r not in have)
        else:
            g.add_edge(a, b, reasons=reasons)
    return g, loops


def _loop_text(
    league: League, node_of: dict[str, str], u: str, v: str, reasons: list[Reason]
) -> str:
    rows = [t.row for t in league.ties if t.row is not None and node_of[t.first] == node_of[u]]
    where = f" (Together row {', '.join(str(r) for r in sorted(set(rows)))})" if rows else ""
    return (
        f"{u} and {v} must be played together{where} but they clash: {reasons_text(reasons)}"
    )


def counted_rules(league: League, clashes: nx.Graph, half: int | None, rounds: int) -> list[str]:
    """The rules the exact counts include, in plain words."""
    pairs = plural(clashes.number_of_edges(), "pair", "pairs")
    out = [f"clashes: {pairs} of fixtures never share a round"]
    if league.splits:
        out.append(f"apart: {plural(len(league.splits), 'pair', 'pairs')} kept apart by hand "
                   "(counted as clashes)")
    if league.ties:
        out.append(f"together: {plural(len(league.ties), 'pair', 'pairs')} of fixtures share "
                   "a round")
    pinned = sum(1 for f in league.fixtures if f.pin is not None and not f.played)
    played = sum(1 for f in league.fixtures if f.pin is not None and f.played)
    if pinned:
        fixed = plural(pinned, "fixture fixed to its round", "fixtures fixed to their rounds")
        out.append(f"pins: {fixed}")
    if played:
        out.append(f"played: {plural(played, 'fixture', 'fixtures')} frozen in the rounds they "
                   "were played")
    if league.blocked:
        out.append(
            f"blocked: {plural(len(league.blocked), 'Blocked row keeps', 'Blocked rows keep')} "
            "teams or venues out of rounds"
        )
    if half is not None:
        out.append(
            f"return half: first legs in {_rounds_span(1, half)}, return fixtures in "
            f"{_rounds_span(half + 1, rounds)}"
        )
    return out


def _rounds_span(a: int, b: int) -> str:
    """'rounds 1..5', 'round 3' or 'no round'."""
    if b < a:
        return "no round"
    return f"round {a}" if a == b else f"rounds {a}..{b}"


def fewest_rounds(model: CountingModel, hooks: engine.Hooks | None = None) -> int | None:
    """The fewest rounds with a valid assignment of this model's league; None if no K works."""
    proof = fewest_rounds_proof(model, hooks)
    return None if proof is None else proof.high


def fewest_rounds_proof(model: CountingModel,
                        hooks: engine.Hooks | None = None) -> engine.RoundsBounds | None:
    """The fewest rounds proven both ways (low == high), or None if no K works.

    Without Return half this is the engine's min_rounds_proof with every blocked round
    excluded, its schedule by fixture label; with it the split point moves with K, so each K
    from that lower bound up is counted (methods "count", no schedule)."""
    league = model.league
    top = max(
        [model.graph.number_of_nodes(), model.rounds]
        + [f.pin for f in league.fixtures if f.pin is not None]
        + [b.round for b in league.blocked]
    ) + 1
    base = model_from_clashes(league, model.clashes, top, use_return_half=False)
    if base.contradictions:
        return None
    proof = engine.min_rounds_proof(base.counted(), pins=base.pins, exclusions=base.exclusions,
                                    hooks=hooks)
    if return_half(league, top) is None:
        return engine.RoundsBounds(proof.rounds, proof.rounds, proof.lower, proof.upper,
                                   base.expand(proof.schedule))
    for k in range(max(proof.rounds, 1), 2 * top + 1):
        m = model_from_clashes(league, model.clashes, k)
        if not m.contradictions and m.count(hooks) > 0:
            low = proof.lower if k == proof.rounds else "count"
            return engine.RoundsBounds(k, k, low, "count", {})
    return None
    low = engine.min_rounds(base.counted(), pins=base.pins, exclusions=base.exclusions,
                            hooks=hooks)
    if return_half(league, top) is None:
        return low
    for k in range(max(low, 1), 2 * top + 1):
        m = model_from_clashes(league, model.clashes, k)
        if not m.contradictions and m.count(hooks) > 0:
            return k
    return None
