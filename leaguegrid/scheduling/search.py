"""Backtracking schedule generator for the clash model plus the generator-only rules.

Fewest-options-first: the node with the fewest rounds left goes next (ties: most clashes,
then a seeded random key); its rounds are tried in a seeded random order. Forward checking
removes a round from a node's options when a clash, a venue's pitches or the round-balance
ceiling rules it out; a pigeonhole check on each clique (a team's fixtures) forces a round
only one fixture can still take; counting checks cut runs of home or away fixtures that nothing
can break any more and rounds that can no longer be filled. Restarts with step limits from the
Luby sequence keep one unlucky early choice from eating the budget; a run that finishes within
its limit has tried every option, so its "no schedule" is a proof.
"""

from __future__ import annotations

import random
import time
from dataclasses import dataclass, field
from typing import Literal

from leaguegrid.engine import BudgetExceeded, Cancelled, Hooks
from leaguegrid.scheduling.constraints import CountingModel
from leaguegrid.scheduling.rules import (
    GeneratorRules,
    balance_bounds,
    check_generator,
    prove_impossible,
    team_sides,
)

Status = Literal["found", "impossible", "budget", "cancelled"]

RESTART_UNIT = 1000  # steps; run i may take RESTART_UNIT x luby(i) steps


def luby(i: int) -> int:
    """The i-th term (from 1) of the Luby restart sequence 1 1 2 1 1 2 4 1 1 2 ... (Luby,
    Sinclair and Zuckerman, 1993): short runs often, longer runs ever more rarely, so heavy
    tails are cut while every limit, however large, is reached in time."""
    k = 1
    while (1 << k) - 1 < i:
        k += 1
    while i != (1 << k) - 1:
        i -= (1 << (k - 1)) - 1
        k = 1
        while (1 << k) - 1 < i:
            k += 1
    return 1 << (k - 1)


@dataclass
class SearchResult:
    """What the generator found: a schedule, a proof that none exists, or a stop."""

    status: Status
    assignment: dict[str, int] | None = None  # fixture label -> round, when found
    reasons: list[str] = field(default_factory=list)  # when impossible: which rule, and where
    steps: int = 0
    restarts: int = 0
    seconds: float = 0.0


class _State:
    """Domains, counters and an undo trail for one league on K rounds."""

    def __init__(self, model: CountingModel, rules: GeneratorRules) -> None:
        self.model = model
        self.rules = rules
        self.k = model.rounds
        self.nodes = list(model.graph.nodes)
        index = {v: i for i, v in enumerate(self.nodes)}
        self.n = len(self.nodes)
        counted = model.counted()
        self.adj = [[index[u] for u in counted[v]] for v in self.nodes]
        self.cliques = _cliques(model, index)
        self.node_cliques: list[list[int]] = [[] for _ in self.nodes]
        for ci, members in enumerate(self.cliques):
            for i in members:
                self.node_cliques[i].append(ci)
        self.touched: set[int] = set()
        self.prefer: list[int] = []  # node -> round to try first (0: none)
        self.size = [len(model.members[v]) for v in self.nodes]
        self.fixtures = sum(self.size)
        order = {f.label: i for i, f in enumerate(model.league.fixtures)}
        self.first = [min(order[lab] for lab in model.members[v]) for v in self.nodes]
        node_of = model.node_of
        # venue capacity: per rule, the nodes it touches and how many fixtures each brings
        self.caps = [c.pitches for c in rules.capacities]
        self.cap_nodes: list[dict[int, int]] = []
        for c in rules.capacities:
            bring: dict[int, int] = {}
            for lab in c.fixtures:
                i = index[node_of[lab]]
                bring[i] = bring.get(i, 0) + 1
            self.cap_nodes.append(bring)
        self.node_caps = [[ci for ci, b in enumerate(self.cap_nodes) if i in b]
                          for i in range(self.n)]
        # leg gap and mirror: the other meeting's node, and +1 (return) or -1 (first leg)
        self.gap, self.half = rules.leg_gap, -(-self.k // 2)
        self.mirrored = rules.mirrored
        self.links: list[list[tuple[int, int]]] = [[] for _ in range(self.n)]
        for first, back in rules.legs:
            a, b = index[node_of[first]], index[node_of[back]]
            if a != b:
                self.links[a].append((b, 1))
                self.links[b].append((a, -1))
        # byes apart: each team's nodes, for teams with few enough byes to keep them apart
        self.bye_teams: list[list[int]] = []
        self.node_bye_teams: list[list[int]] = [[] for _ in range(self.n)]
        if rules.byes_apart:
            for sides in team_sides(model.league).values():
                nodes = sorted({index[node_of[lab]] for lab, _ in sides})
                games = len(sides)
                if self.k - games <= games + 1:
                    for i in nodes:
                        self.node_bye_teams[i].append(len(self.bye_teams))
                    self.bye_teams.append(nodes)
        # round balance
        self.balance = rules.round_balance
        if self.balance is not None and self.k:
            self.low, self.high = balance_bounds(self.fixtures, self.k, self.balance)
        else:
            self.low, self.high = 0, None
        # runs
        self.limit = {"home": rules.max_home_run, "away": rules.max_away_run}
        self.team_entries: list[list[tuple[int, str]]] = []
        self.node_teams: list[list[int]] = [[] for _ in range(self.n)]
        if rules.max_home_run is not None or rules.max_away_run is not None:
            for sides in team_sides(model.league).values():
                t = len(self.team_entries)
                entries = [(index[node_of[lab]], side) for lab, side in sides]
                self.team_entries.append(entries)
                for i, _ in entries:
                    if t not in self.node_teams[i]:
                        self.node_teams[i].append(t)

    def reset(self) -> None:
        """Every node unassigned with its full options."""
        self.dom = [set(self.model.domain(v)) for v in self.nodes]
        self.val = [0] * self.n
        self.unassigned = self.n
        self.left = self.fixtures  # fixtures not yet placed
        self.cap_count = [[0] * (self.k + 1) for _ in self.caps]
        self.tot = [0] * (self.k + 1)
        self.avail = [0] * (self.k + 1)
        for i in range(self.n):
            for r in self.dom[i]:
                self.avail[r] += self.size[i]
        self.trail: list[tuple] = []

    def undo(self, mark: int) -> None:
        """Roll every change back to the trail position `mark`."""
        trail = self.trail
        while len(trail) > mark:
            op = trail.pop()
            if op[0] == "d":
                _, j, r = op
                self.dom[j].add(r)
                self.avail[r] += self.size[j]
            elif op[0] == "v":
                _, i, r = op
                self.val[i] = 0
                self.unassigned += 1
                self.left += self.size[i]
                self.tot[r] -= self.size[i]
                for ci in self.node_caps[i]:
                    self.cap_count[ci][r] -= self.cap_nodes[ci][i]
                for q in self.dom[i]:
                    self.avail[q] += self.size[i]

    def _drop(self, j: int, r: int) -> bool:
        """Remove round r from unassigned node j; False when j has no round left."""
        if r in self.dom[j]:
            self.dom[j].discard(r)
            self.avail[r] -= self.size[j]
            self.trail.append(("d", j, r))
            self.touched.add(j)
            return bool(self.dom[j])
        return True

    def assign(self, i: int, r: int) -> bool:
        """Put node i in round r and propagate; False on a dead end (undo to the mark)."""
        self.val[i] = r
        self.unassigned -= 1
        self.left -= self.size[i]
        self.tot[r] += self.size[i]
        for ci in self.node_caps[i]:
            self.cap_count[ci][r] += self.cap_nodes[ci][i]
        for q in self.dom[i]:
            self.avail[q] -= self.size[i]
        self.trail.append(("v", i, r))
        self.touched = {i}
        for j in self.adj[i]:
            if not self.val[j] and not self._drop(j, r):
                return False
        for j, sign in self.links[i]:
            if not self.val[j]:
                for q in [q for q in self.dom[j] if not self._legs_fit(r, q, sign)]:
                    if not self._drop(j, q):
                        return False
        for ci in self.node_caps[i]:
            room = self.caps[ci] - self.cap_count[ci][r]
            for j, b in self.cap_nodes[ci].items():
                if not self.val[j] and b > room and not self._drop(j, r):
                    return False
        if self.high is not None:
            room = self.high - self.tot[r]
            for j in range(self.n):
                if not self.val[j] and self.size[j] > room and not self._drop(j, r):
                    return False
            if not self._fillable():
                return False
        if not self._cliques_hold():
            return False
        if self.bye_teams and not self._byes_apart_open():
            return False
        return all(self._runs_open(t) for t in self.node_teams[i])

    def _byes_apart_open(self) -> bool:
        """False when a team touched by this step is sure to have byes in two rounds in a
        row: rounds that no game of the team holds or can still take."""
        for t in {t for j in self.touched for t in self.node_bye_teams[j]}:
            can = [False] * (self.k + 2)
            for j in self.bye_teams[t]:
                if self.val[j]:
                    can[self.val[j]] = True
                else:
                    for q in self.dom[j]:
                        can[q] = True
            if any(not can[r] and not can[r + 1] for r in range(1, self.k)):
                return False
        return True

    def _legs_fit(self, r: int, q: int, sign: int) -> bool:
        """Can the other meeting go in round q when this one is in round r (sign +1: q is
        the return)?"""
        if self.gap is not None and abs(q - r) < self.gap:
            return False
        return not self.mirrored or q == r + sign * self.half

    def _cliques_hold(self) -> bool:
        """Pigeonhole on each clash clique (a team's or a pitch's fixtures) touched by this
        step: its unplaced fixtures need as many distinct rounds; when the rounds left are
        exactly enough, a round only one of them can take is forced on it."""
        queue = {ci for j in self.touched for ci in self.node_cliques[j]}
        while queue:
            members = self.cliques[queue.pop()]
            open_ = [j for j in members if not self.val[j]]
            if not open_:
                continue
            takers: dict[int, int] = {}  # round -> the one node that can take it, or -1
            for j in open_:
                for r in self.dom[j]:
                    takers[r] = -1 if r in takers else j
            if len(takers) < len(open_):
                return False
            if len(takers) > len(open_):
                continue
            for r, j in takers.items():
                if j >= 0 and len(self.dom[j]) > 1:
                    for q in [q for q in self.dom[j] if q != r]:
                        self._drop(j, q)
                    queue.update(self.node_cliques[j])
        return True

    def _fillable(self) -> bool:
        """Can every round still reach the fewest fixtures round balance allows?"""
        need_at_least = max(max(self.tot[1:]) - self.balance, self.low)
        need = 0
        for r in range(1, self.k + 1):
            short = need_at_least - self.tot[r]
            if short > 0:
                if self.avail[r] < short:
                    return False
                need += short
        return need <= self.left

    def _runs_open(self, t: int) -> bool:
        """False when team t has a run longer than allowed that no unplaced fixture can break."""
        entries = self.team_entries[t]
        placed = sorted((self.val[i], self.first[i], side) for i, side in entries if self.val[i])
        runs: list[list[tuple[int, str]]] = []
        for r, _, side in placed:
            if runs and runs[-1][0][1] == side:
                runs[-1].append((r, side))
            else:
                runs.append([(r, side)])
        for run in runs:
            side = run[0][1]
            limit = self.limit[side]
            if limit is None or len(run) <= limit:
                continue
            breakers = [i for i, s in entries if s != side and not self.val[i]]
            for w in range(len(run) - limit):
                a, b = run[w][0], run[w + limit][0]
                if not any(a <= q <= b for i in breakers for q in self.dom[i]):
                    return False
        return True

    def pick(self, tiebreak: list[float]) -> int:
        """The unassigned node with the fewest rounds left (then most clashes, then random)."""
        best, key = -1, None
        for i in range(self.n):
            if self.val[i]:
                continue
            k = (len(self.dom[i]), -len(self.adj[i]), tiebreak[i])
            if self.prefer:  # keeping a schedule: the fixtures that must move go first
                k = (self.prefer[i] in self.dom[i], *k)
            if key is None or k < key:
                best, key = i, k
        return best

    def fixture_assignment(self) -> dict[str, int]:
        return self.model.expand({v: self.val[i] for i, v in enumerate(self.nodes)})


def _cliques(model: CountingModel, index: dict[str, int]) -> list[list[int]]:
    """Groups of nodes that pairwise clash, one per team, venue or shared value whose edges
    form a clique (a team plays once a round), as node indices; pairs of one are left out."""
    groups: dict[object, set[str]] = {}
    for u, v, data in model.graph.edges(data=True):
        for reason in data.get("reasons", []):
            if reason.kind in ("team", "venue", "shared"):
                groups.setdefault(reason, set()).update((u, v))
    out = []
    for nodes in groups.values():
        members = sorted(nodes, key=index.__getitem__)
        if all(model.graph.has_edge(a, b) for k, a in enumerate(members)
               for b in members[k + 1:]):
            out.append([index[v] for v in members])
    return out


def search(
    model: CountingModel,
    rng: random.Random,
    rules: GeneratorRules | None = None,
    hooks: Hooks | None = None,
    explain: bool = True,
    prefer: dict[str, int] | None = None,
) -> SearchResult:
    """A schedule meeting the counting model and the generator rules, or why there is none.

    `rules` defaults to the model's generator rules. A proven impossibility names the rule
    and where it bites; with `explain`, a search that exhausts every option then tries each
    rule alone (within what is left of the budget) to say which rule cannot hold."""
    started = time.monotonic()
    hooks = hooks or Hooks()
    rules = model.generator if rules is None else rules
    if model.contradictions:
        return SearchResult("impossible", reasons=list(model.contradictions))
    proofs = prove_impossible(model.league, rules, model.fixture_domains(), model.rounds)
    if proofs:
        return SearchResult("impossible", reasons=proofs,
                            seconds=time.monotonic() - started)
    state = _State(model, rules)
    if prefer:
        state.prefer = [next((prefer[lab] for lab in model.members[v] if lab in prefer), 0)
                        for v in state.nodes]
    steps = restarts = 0
    deepest = 0
    while True:
        try:
            limit = RESTART_UNIT * luby(restarts + 1)
            found, used, depth = _run(state, rng, limit, hooks, deepest)
        except (Cancelled, BudgetExceeded) as stop:
            status = "cancelled" if isinstance(stop, Cancelled) else "budget"
            return SearchResult(status, steps=steps, restarts=restarts,
                                seconds=time.monotonic() - started)
        steps += used
        deepest = max(deepest, depth)
        if found is not None:
            return SearchResult("found", assignment=found, steps=steps, restarts=restarts,
                                seconds=time.monotonic() - started)
        if used <= limit:
            break
        restarts += 1
    tried = f"the search tried every option, {steps} steps"
    if not rules.names:
        reasons = [f"no schedule meets the clashes, pins and blocked rounds ({tried})"]
    elif len(rules.names) == 1:
        reasons = [f"{rules.title(rules.names[0])}: no schedule meets it together with the "
                   f"clashes, pins and blocked rounds ({tried})"]
    else:
        reasons = [f"no schedule meets every rule together ({tried})"]
        if explain:
            reasons += _isolate(model, rules, rng, hooks)
    return SearchResult("impossible", reasons=reasons, steps=steps, restarts=restarts,
                        seconds=time.monotonic() - started)


def _isolate(
    model: CountingModel,
    rules: GeneratorRules,
    rng: random.Random,
    hooks: Hooks,
) -> list[str]:
    """Try each active rule on its own: which ones cannot hold even alone."""
    alone_fail, unknown = [], []
    names = rules.names
    for pos, name in enumerate(names):
        part = hooks.part(share=1 / (len(names) - pos) / 2)
        sub = search(model, rng, rules.only(name), hooks=part, explain=False)
        if sub.status == "impossible":
            alone_fail.append(name)
        elif sub.status != "found":
            unknown.append(name)
    titles = [rules.title(name) for name in names]
    if alone_fail:
        return [f"{rules.title(name)} cannot hold even alone with the clashes, pins and "
                "blocked rounds" for name in alone_fail]
    if unknown:
        return [f"not settled within the budget when tried alone: "
                f"{', '.join(rules.title(name) for name in unknown)}"]
    return [f"each rule can hold alone, but not all together: {', '.join(titles)}"]


def _run(
    state: _State,
    rng: random.Random,
    limit: int,
    hooks: Hooks,
    deepest: int,
) -> tuple[dict[str, int] | None, int, int]:
    """One run from scratch: (schedule or None, steps used, deepest depth reached).

    Steps used above `limit` means the run was cut short; otherwise it tried everything."""
    hooks.check()
    state.reset()
    n = state.n
    tiebreak = [rng.random() for _ in range(n)]
    stack: list[list] = []  # frames: [node, values, next position, trail mark or None]
    steps = 0
    push = True
    while True:
        if push:
            if state.unassigned == 0:
                placed = state.fixture_assignment()
                if not check_generator(state.model.league, state.rules, placed, state.k):
                    return placed, steps, n
            else:
                i = state.pick(tiebreak)
                values = _ordered(state, i, rng)
                stack.append([i, values, 0, None])
        push = False
        while stack:
            frame = stack[-1]
            if frame[3] is not None:
                state.undo(frame[3])
                frame[3] = None
            if frame[2] >= len(frame[1]):
                stack.pop()
                continue
            r = frame[1][frame[2]]
            frame[2] += 1
            frame[3] = len(state.trail)
            steps += 1
            if steps > limit:
                return None, steps, deepest
            if steps % 256 == 0:
                hooks.check()
            if state.assign(frame[0], r):
                push = True
                depth = n - state.unassigned
                if depth > deepest:
                    deepest = depth
                    if n:
                        hooks.report(deepest / n, "search")
                break
        if not push:
            return None, steps, deepest


def _ordered(state: _State, i: int, rng: random.Random) -> list[int]:
    """Node i's rounds in a seeded random order (emptiest rounds first under round balance)."""
    values = sorted(state.dom[i])
    rng.shuffle(values)
    if state.high is not None:
        values.sort(key=lambda r: state.tot[r])
    if state.prefer and state.prefer[i] in state.dom[i]:
        values.remove(state.prefer[i])
        values.insert(0, state.prefer[i])
    return values

