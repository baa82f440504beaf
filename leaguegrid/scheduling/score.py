"""Score terms for choosing the best of many schedules, each computed and explained in words.

Every term is a penalty: 0 is ideal, lower is better.
- balance: fixtures per round against the mean n/K, summed over all K rounds (|count - mean|).
- alternation: times a team plays two home (or two away) fixtures in a row, over all teams.
- spread: for each team with two or more fixtures, how far the gaps between its games (in
  rounds) are from even spacing K/g, summed (|gap - K/g|).
- slots: when rounds are time slots (a Time in the Rounds sheet), how far each team's average
  slot is from the middle slot (K+1)/2, summed over teams: early and late slots shared fairly.
- rest: times a team plays in two adjacent rounds (no round off between), over all teams.
- travel: km between the grounds of a team's consecutive fixtures, summed over teams, from the
  Distances sheet or, failing that, the great-circle (haversine) distance between the venues'
  Latitude/Longitude; a move with no known distance counts 0 and is reported.
Best of N: each term is divided by its mean over the N schedules (so terms in different units
weigh alike), multiplied by its weight (default 1), and summed; the lowest total wins, the
earliest draw on a tie.
"""

from __future__ import annotations

import math
from collections.abc import Callable, Sequence
from dataclasses import dataclass, field
from itertools import pairwise

from leaguegrid.core.model import League, Schedule
from leaguegrid.core.names import name_key
from leaguegrid.scheduling.rules import side_runs, team_sides

TERMS = ("balance", "alternation", "spread", "slots", "rest", "travel")
EARTH_RADIUS_KM = 6371.0088  # mean Earth radius (IUGG)


@dataclass(frozen=True)
class TermScore:
    """One term's penalty for one schedule (lower is better), with its unit and explanation."""

    name: str
    value: float
    unit: str
    explanation: str
    applicable: bool = True


@dataclass
class ScoreCard:
    """A schedule's terms, each weighted and compared with the mean over the draws."""

    terms: list[TermScore]
    weights: dict[str, float]
    means: dict[str, float]
    parts: dict[str, float]  # term -> weight x value / mean over the draws (0 when mean is 0)
    total: float
    draws: int = 1

    def lines(self) -> list[str]:
        """The score term by term, in words."""
        out = []
        for t in self.terms:
            if not t.applicable:
                out.append(f"{t.name}: not used: {t.explanation}")
                continue
            w = self.weights.get(t.name, 1.0)
            weight = f" x weight {w:g}" if w != 1.0 else ""
            out.append(
                f"{t.name}: {t.value:.2f} {t.unit} ({t.explanation}); the {self.draws} "
                f"schedules averaged {self.means[t.name]:.2f}{weight} -> {self.parts[t.name]:.3f}"
            )
        out.append(f"total: {self.total:.3f} (lower is better)")
        return out


@dataclass
class BestOf:
    """The best-scoring schedule of many, its position among them, and every card."""

    index: int
    schedule: Schedule
    card: ScoreCard
    cards: list[ScoreCard] = field(default_factory=list)


def parse_terms(text: str) -> dict[str, float]:
    """'balance,travel:0.5' (or 'travel=0.5') -> {'balance': 1.0, 'travel': 0.5}; ValueError
    names a bad term or weight."""
    out: dict[str, float] = {}
    for part in (p.strip() for p in text.split(",")):
        if not part:
            continue
        name, _, weight = part.replace("=", ":").partition(":")
        name = name.strip().lower()
        if name not in TERMS:
            raise ValueError(f"unknown score term {name!r}; terms: {', '.join(TERMS)}")
        try:
            w = float(weight) if weight.strip() else 1.0
        except ValueError as err:
            raise ValueError(f"the weight of {name} must be a number, not {weight!r}") from err
        if w < 0 or not math.isfinite(w):
            raise ValueError(f"the weight of {name} must be zero or more, not {weight!r}")
        out[name] = w
    if not out:
        raise ValueError(f"no score terms given; terms: {', '.join(TERMS)}")
    return out


def _team_rounds(league: League, assignment: dict[str, int]) -> dict[str, list[int]]:
    """Team -> the rounds of its fixtures, in order."""
    out: dict[str, list[int]] = {}
    for team, sides in team_sides(league).items():
        out[team] = sorted(assignment[lab] for lab, _ in sides if lab in assignment)
    return out


def _worst(per_team: dict[str, float], unit: str) -> str:
    if not per_team or max(per_team.values()) <= 0:
        return ""
    team = max(per_team, key=lambda t: (per_team[t], t))
    return f"; most: {team} ({per_team[team]:g}{unit})"


def term_balance(league: League, schedule: Schedule) -> TermScore:
    """Fixtures per round against the mean, over all K rounds."""
    k = schedule.rounds
    per = {r: len(labs) for r, labs in schedule.by_round().items()}
    mean = len(schedule.assignment) / k if k else 0.0
    value = sum(abs(c - mean) for c in per.values())
    lo, hi = (min(per.values()), max(per.values())) if per else (0, 0)
    return TermScore("balance", value, "fixtures",
                     f"fixtures per round range from {lo} to {hi}, mean {mean:.2f}")


def term_alternation(league: League, schedule: Schedule) -> TermScore:
    """Times a team plays two home or two away fixtures in a row."""
    per_team: dict[str, float] = {}
    for team, sides in team_sides(league).items():
        repeats = sum(len(run) - 1 for _, run in side_runs(sides, schedule.assignment))
        per_team[team] = repeats
    if not per_team:
        return TermScore("alternation", 0.0, "repeats", "no fixture has a home and away team",
                         applicable=False)
    value = sum(per_team.values())
    return TermScore("alternation", value, "repeats",
                     f"{value:g} times a team played home twice or away twice in a row"
                     + _worst(per_team, ""))


def term_spread(league: League, schedule: Schedule) -> TermScore:
    """Distance of each team's gaps between games from even spacing K/g."""
    per_team: dict[str, float] = {}
    k = schedule.rounds
    for team, rounds in _team_rounds(league, schedule.assignment).items():
        if len(rounds) < 2:
            continue
        even = k / len(rounds)
        per_team[team] = sum(abs((b - a) - even) for a, b in pairwise(rounds))
    if not per_team:
        return TermScore("spread", 0.0, "rounds", "no team has two fixtures", applicable=False)
    value = sum(per_team.values())
    return TermScore("spread", value, "rounds",
                     "gaps between a team's games against even spacing K/games"
                     + _worst(per_team, " rounds"))


def is_time_slots(league: League) -> bool:
    """Rounds are time slots when the Rounds sheet gives a Time."""
    return any(r.time is not None for r in league.rounds)


def term_slots(league: League, schedule: Schedule) -> TermScore:
    """Each team's average slot against the middle slot, when rounds are time slots."""
    if not is_time_slots(league):
        return TermScore("slots", 0.0, "slots", "rounds are not time slots (no Time given)",
                         applicable=False)
    middle = (schedule.rounds + 1) / 2
    per_team = {
        team: abs(sum(rounds) / len(rounds) - middle)
        for team, rounds in _team_rounds(league, schedule.assignment).items()
        if rounds
    }
    value = sum(per_team.values())
    return TermScore("slots", value, "slots",
                     f"each team's average slot against the middle slot {middle:g}"
                     + _worst(per_team, " slots off"))


def term_rest(league: League, schedule: Schedule) -> TermScore:
    """Times a team plays in two adjacent rounds with no round off between."""
    per_team = {
        team: float(sum(1 for a, b in pairwise(rounds) if b - a <= 1))
        for team, rounds in _team_rounds(league, schedule.assignment).items()
    }
    value = sum(per_team.values())
    return TermScore("rest", value, "times",
                     f"{value:g} times a team played in two adjacent rounds"
                     + _worst(per_team, ""))


def haversine_km(lat1: float, lon1: float, lat2: float, lon2: float) -> float:
    """Great-circle distance in km (haversine formula, mean Earth radius)."""
    p1, p2 = math.radians(lat1), math.radians(lat2)
    dp, dl = p2 - p1, math.radians(lon2 - lon1)
    h = math.sin(dp / 2) ** 2 + math.cos(p1) * math.cos(p2) * math.sin(dl / 2) ** 2
    return 2 * EARTH_RADIUS_KM * math.asin(min(1.0, math.sqrt(h)))


def distance_lookup(league: League) -> Callable[[str, str], float | None]:
    """(venue, venue) -> km from the Distances sheet, else from positions; None if unknown."""
    table = {(name_key(a), name_key(b)): km for (a, b), km in league.distances.items()}
    where = {
        name_key(v.name): (v.latitude, v.longitude)
        for v in league.venues.values()
        if v.latitude is not None and v.longitude is not None
    }

    def km(a: str, b: str) -> float | None:
        x, y = name_key(a), name_key(b)
        if x == y:
            return 0.0
        if (x, y) in table:
            return table[x, y]
        if (y, x) in table:
            return table[y, x]
        if x in where and y in where:
            return haversine_km(*where[x], *where[y])
        return None

    return km


def term_travel(league: League, schedule: Schedule) -> TermScore:
    """Km between the grounds of each team's consecutive fixtures."""
    has_positions = any(v.latitude is not None for v in league.venues.values())
    if not league.distances and not has_positions:
        return TermScore("travel", 0.0, "km", "no Distances sheet and no venue positions",
                         applicable=False)
    km = distance_lookup(league)
    venue = {f.label: f.venue for f in league.fixtures}
    per_team: dict[str, float] = {}
    unknown = 0
    for team, sides in team_sides(league).items():
        labs = sorted((schedule.assignment[lab], lab) for lab, _ in sides
                      if lab in schedule.assignment)
        total = 0.0
        for (_, a), (_, b) in pairwise(labs):
            va, vb = venue[a], venue[b]
            d = km(va, vb) if va and vb else None
            if d is None:
                unknown += 1
            else:
                total += d
        per_team[team] = total
    value = sum(per_team.values())
    text = f"{value:.1f} km between the grounds of consecutive fixtures" + _worst(
        {t: round(v, 1) for t, v in per_team.items()}, " km")
    if unknown:
        text += f"; {unknown} moves had no known distance and count 0"
    return TermScore("travel", value, "km", text)


TERM_FUNCTIONS: dict[str, Callable[[League, Schedule], TermScore]] = {
    "balance": term_balance,
    "alternation": term_alternation,
    "spread": term_spread,
    "slots": term_slots,
    "rest": term_rest,
    "travel": term_travel,
}


def score_terms(league: League, schedule: Schedule, terms: Sequence[str]) -> list[TermScore]:
    """The raw value of each named term for one schedule."""
    return [TERM_FUNCTIONS[name](league, schedule) for name in terms]


def best_of(
    league: League, schedules: Sequence[Schedule], terms: dict[str, float] | Sequence[str]
) -> BestOf:
    """The schedule with the lowest weighted total of its terms, each over its mean."""
    if not schedules:
        raise ValueError("best_of needs at least one schedule")
    weights = dict(terms) if isinstance(terms, dict) else dict.fromkeys(terms, 1.0)
    raw = [score_terms(league, s, list(weights)) for s in schedules]
    means = {
        name: sum(row[i].value for row in raw) / len(raw) for i, name in enumerate(weights)
    }
    cards = []
    for row in raw:
        parts = {
            t.name: (weights[t.name] * t.value / means[t.name] if means[t.name] > 0 else 0.0)
            for t in row
        }
        cards.append(ScoreCard(row, weights, means, parts, sum(parts.values()),
                               len(schedules)))
    index = min(range(len(cards)), key=lambda i: (cards[i].total, i))
    return BestOf(index, schedules[index], cards[index], cards)
