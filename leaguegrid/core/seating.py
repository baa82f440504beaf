"""Places in the round robin timetable for teams whose grounds limit them: pitches, closed
rounds, grounds that may not both host in one round; then, where the grounds allow, the
clubs' requests to be at home (or not) in a round.

Each division's teams take the places 0..n-1 of core.round_robin's timetable; any seating keeps
its breaks at the fewest there can be (de Werra 1981), so the grounds decide the seating alone.
Starting from seat_teams (partners on shared grounds), a seeded local search swaps two teams of
one division while the ground conflicts do not rise (min-conflicts, Minton et al. 1992), for a
fixed number of steps: the same sheets give the same seating on any machine.
"""

from __future__ import annotations

import random
from collections.abc import Sequence
from dataclasses import dataclass, field

from leaguegrid.core.round_robin import seat_teams, single_round_robin

STEPS = 4000  # swaps made at most
NOISE = 0.1  # share of steps that make a random swap instead of the best one


@dataclass(frozen=True)
class Grounds:
    """What the grounds allow: pitches (1 unless given), season rounds in which a ground hosts
    nothing, and pairs of grounds that never both host in one round."""

    pitches: dict[str, int] = field(default_factory=dict)
    closed: dict[str, frozenset[int]] = field(default_factory=dict)
    apart: tuple[tuple[str, str], ...] = ()
    wishes: dict[str, tuple[tuple[int, bool], ...]] = field(default_factory=dict)  # team ->
    # (round, at home?) from the Requests sheet: met where the grounds allow


@dataclass(frozen=True)
class Season:
    """How the timetable's rounds fall in the season: legs, and the second leg's order."""

    legs: int = 1
    mirrored: bool = False  # the second leg in the first's order (else in reverse order)

    def home_rounds(self, teams: int) -> list[set[int]]:
        """Place -> the season rounds (1-based) in which it is at home, as timetable_start
        lays them out: leg 1 in rounds 1..span, leg 2 from span + 1 with sides swapped."""
        rounds = single_round_robin(teams)
        span = len(rounds)
        same = self.mirrored or teams % 2 == 1
        out: list[set[int]] = [set() for _ in range(teams)]
        for i, games in enumerate(rounds):
            for home, away in games:
                out[home].add(i + 1)
                if self.legs == 2:
                    out[away].add(span + (i + 1 if same else span - i))
        return out


def seat_for_grounds(divisions: Sequence[Sequence[str]], ground: dict[str, str | None],
                     grounds: Grounds, season: Season, seed: int = 0) -> list[list[str]]:
    """Each division's teams in timetable order, seated so that no ground holds more home
    teams than pitches in a round, none in a closed round, and grounds kept apart never host
    together; where no seating the search finds does that, the one with fewest conflicts."""
    seated = seat_teams(divisions, ground)
    search = _Search(seated, ground, grounds, season)
    if search.conflicts or search.missed:
        search.run(random.Random(seed))
    return search.seated


class _Search:
    """Home counts per ground and round, kept up to date as teams swap places."""

    def __init__(self, seated: list[list[str]], ground: dict[str, str | None],
                 grounds: Grounds, season: Season) -> None:
        self.seated = [list(order) for order in seated]
        self.grounds = grounds
        self.partners: dict[str, list[str]] = {}
        for a, b in grounds.apart:
            self.partners.setdefault(a, []).append(b)
            self.partners.setdefault(b, []).append(a)
        at: dict[str, int] = {}
        for order in seated:
            for name in order:
                if g := ground.get(name):
                    at[g] = at.get(g, 0) + 1
        # only grounds that can be in conflict matter
        self.watched = {g for g, count in at.items() if count > grounds.pitches.get(g, 1)
                        or grounds.closed.get(g) or g in self.partners}
        self.ground = {name: g for order in seated for name in order
                       if (g := ground.get(name)) in self.watched}
        self.patterns = {len(o): season.home_rounds(len(o)) for o in seated if o}
        last = max((r for pats in self.patterns.values() for p in pats for r in p), default=0)
        self.home: dict[str, list[int]] = {g: [0] * (last + 1) for g in self.watched}
        for order in self.seated:
            for place, name in enumerate(order):
                self._add(name, len(order), place, 1)
        self.conflicts = sum(self._cost(g) for g in self.watched)
        members = {name for order in seated for name in order}
        self.wishes = {n: w for n, w in grounds.wishes.items() if n in members}
        self.missed = sum(self._missed(order[p], len(order), p) for order in self.seated
                          for p in range(len(order)) if order[p] in self.wishes)

    def _missed(self, name: str, size: int, place: int) -> int:
        """The team's wishes its place does not meet (away: not at home, a bye will do)."""
        home = self.patterns[size][place]
        return sum(1 for r, at_home in self.wishes.get(name, ()) if (r in home) != at_home)

    def _add(self, name: str, size: int, place: int, sign: int) -> None:
        g = self.ground.get(name)
        if g is not None:
            counts = self.home[g]
            for r in self.patterns[size][place]:
                counts[r] += sign

    def _cost(self, g: str) -> int:
        """Conflicts at ground g: home teams beyond its pitches (all of them in a closed
        round), and rounds shared with a ground kept apart from it (counted once a pair)."""
        cost = 0
        pitches, closed = self.grounds.pitches.get(g, 1), self.grounds.closed.get(g, ())
        others = [self.home[o] for o in self.partners.get(g, ()) if o < g]
        for r, count in enumerate(self.home[g]):
            if count:
                cost += max(0, count - (0 if r in closed else pitches))
                cost += sum(1 for other in others if other[r])
        return cost

    def _affected(self, names: Sequence[str]) -> set[str]:
        out = {self.ground[n] for n in names if n in self.ground}
        return out | {p for g in list(out) for p in self.partners.get(g, ())}

    def run(self, rng: random.Random) -> None:
        """Min-conflicts: take a team on a ground in conflict (or with a wish unmet) and make
        the swap within its division that lowers the conflicts most, then the unmet wishes
        (ties broken at random; now and then a random swap instead, to leave a local
        minimum), keeping the best seating seen."""
        where = {name: order for order in self.seated for name in order}
        at: dict[str, list[str]] = {}
        for name, g in self.ground.items():
            at.setdefault(g, []).append(name)
        cost = {g: self._cost(g) for g in self.watched}
        best = [list(o) for o in self.seated]
        best_key = (self.conflicts, self.missed)
        for _ in range(STEPS):
            if best_key == (0, 0):
                break
            bad = sorted(g for g, c in cost.items() if c)
            wanting = sorted(n for n in self.wishes
                             if self._missed(n, len(where[n]), where[n].index(n)))
            if bad and (not wanting or rng.random() < 0.8):
                g = rng.choice(bad)
                name = rng.choice(at[rng.choice([g, *self.partners.get(g, ())])])
            elif wanting:
                name = rng.choice(wanting)
            else:
                break
            order = where[name]
            a = order.index(name)
            others = [b for b in range(len(order)) if b != a]
            choices = [rng.choice(others)] if rng.random() < NOISE else others
            scored = []
            for b in choices:
                touched = self._affected((order[a], order[b]))
                before = sum(cost[t] for t in touched)
                missed = self._missed(order[a], len(order), a) + self._missed(
                    order[b], len(order), b)
                self._swap(order, a, b)
                after = {t: self._cost(t) for t in touched}
                missed = self._missed(order[a], len(order), a) + self._missed(
                    order[b], len(order), b) - missed
                self._swap(order, a, b)
                scored.append((sum(after.values()) - before, missed, rng.random(), b, after))
            delta, missed, _, b, after = min(scored)
            self._swap(order, a, b)
            cost.update(after)
            self.conflicts += delta
            self.missed += missed
            if (self.conflicts, self.missed) < best_key:
                best, best_key = [list(o) for o in self.seated], (self.conflicts, self.missed)
        self.seated = best
        self.conflicts, self.missed = best_key

    def _swap(self, order: list[str], a: int, b: int) -> None:
        size = len(order)
        self._add(order[a], size, a, -1)
        self._add(order[b], size, b, -1)
        order[a], order[b] = order[b], order[a]
        self._add(order[a], size, a, 1)
        self._add(order[b], size, b, 1)
