"""Rules the clash graph cannot express, enforced by the schedule generator only.

- venue capacity: a venue of the Venues sheet with Pitches N > 1, where some fixture gives no
  pitch (no Pitch column), hosts at most N fixtures a round; the clash graph has no venue
  edges there (a fixture that names a pitch still clashes with that pitch's fixtures);
- most home / away games in a row: a team's fixtures in round order (its Home/Away column) hold no
  more than that many home (away) fixtures in a row; a round without a fixture for the team (a
  bye) neither breaks nor extends a run;
- round balance: over all K rounds, empty ones included, the fullest and emptiest round differ
  by at most that many fixtures;
- leg gap: the two meetings of a pairing (first leg and return) lie at least that many rounds
  apart;
- mirrored (Return half = mirrored): with H = ceil(K/2), each return fixture is played in round
  H + r when its first leg is in round r;
- byes apart (Settings `Byes apart`, yes unless it says no): in a league of round robins played
  on matchdays (rounds that are not time slots of one day), no team has byes (rounds without a
  game) in two rounds in a row, for every team with few enough byes for that (byes <= games
  + 1).
Each rule checks a complete schedule, and `prove_impossible` finds the cases where counting
alone proves that no schedule can meet it, naming where it bites.
"""

from __future__ import annotations

from collections import defaultdict
from dataclasses import dataclass

from leaguegrid.core.model import League
from leaguegrid.core.names import name_key
from leaguegrid.core.wording import plural
from leaguegrid.scheduling.breaks import team_byes


@dataclass(frozen=True)
class Violation:
    """One broken clash or rule in a schedule, in words, with the fixtures and rounds involved."""

    rule: str  # clash, split, tie, pin, played, blocked, return half, capacity, home run,
    # away run, balance, rounds, missing
    message: str
    fixtures: tuple[str, ...] = ()
    rounds: tuple[int, ...] = ()

    def __str__(self) -> str:
        return self.message


@dataclass(frozen=True)
class Capacity:
    """A venue with several pitches where some fixture names no pitch: at most `pitches`
    fixtures there a round (fixtures with a pitch count too; they also clash per pitch)."""

    venue: str
    pitches: int
    fixtures: tuple[str, ...]


@dataclass(frozen=True)
class GeneratorRules:
    """The generator-only rules that are active for a league."""

    capacities: tuple[Capacity, ...] = ()
    max_home_run: int | None = None
    max_away_run: int | None = None
    round_balance: int | None = None
    leg_gap: int | None = None
    mirrored: bool = False
    legs: tuple[tuple[str, str], ...] = ()  # (first leg, return) labels, for gap and mirror
    byes_apart: bool = False

    @property
    def names(self) -> list[str]:
        """Short names of the active rules: capacity, home run, away run, balance, leg gap,
        mirrored, byes."""
        out = []
        if self.capacities:
            out.append("capacity")
        if self.max_home_run is not None:
            out.append("home run")
        if self.max_away_run is not None:
            out.append("away run")
        if self.round_balance is not None:
            out.append("balance")
        if self.leg_gap is not None and self.legs:
            out.append("leg gap")
        if self.mirrored and self.legs:
            out.append("mirrored")
        if self.byes_apart:
            out.append("byes")
        return out

    @staticmethod
    def title(name: str) -> str:
        """The rule's name as a coordinator reads it: "capacity" -> "venue capacity"."""
        return {"capacity": "venue capacity", "home run": "most home games in a row",
                "away run": "most away games in a row", "balance": "round balance",
                "leg gap": "leg gap",
                "mirrored": "mirrored return half", "byes": "byes apart"}[name]

    @property
    def active(self) -> bool:
        return bool(self.names)

    def only(self, name: str) -> GeneratorRules:
        """These rules with every rule but `name` dropped."""
        return GeneratorRules(
            capacities=self.capacities if name == "capacity" else (),
            max_home_run=self.max_home_run if name == "home run" else None,
            max_away_run=self.max_away_run if name == "away run" else None,
            round_balance=self.round_balance if name == "balance" else None,
            leg_gap=self.leg_gap if name == "leg gap" else None,
            mirrored=self.mirrored and name == "mirrored",
            legs=self.legs,
            byes_apart=self.byes_apart and name == "byes",
        )

    def describe(self) -> list[str]:
        """Each active rule in plain words."""
        out = [
            f"venue capacity: {c.venue} hosts at most {c.pitches} fixtures a round "
            f"({c.pitches} pitches)"
            for c in self.capacities
        ]
        if self.max_home_run is not None:
            out.append(
                f"most home games in a row: no team plays more than "
                f"{plural(self.max_home_run, 'home fixture', 'home fixtures')} in a row"
            )
        if self.max_away_run is not None:
            out.append(
                f"most away games in a row: no team plays more than "
                f"{plural(self.max_away_run, 'away fixture', 'away fixtures')} in a row"
            )
        if self.round_balance is not None:
            out.append(
                f"round balance: fixtures per round differ by at most {self.round_balance}"
            )
        if "leg gap" in self.names:
            out.append(f"leg gap: a pairing's two meetings are at least "
                       f"{plural(self.leg_gap or 0, 'round')} apart")
        if "mirrored" in self.names:
            out.append("mirrored return half: with H rounds in the first half, round H + r "
                       "repeats round r's pairings with home and away swapped")
        if self.byes_apart:
            out.append("byes apart: no team has byes in two rounds in a row")
        return out


def generator_rules(league: League) -> GeneratorRules:
    """The generator-only rules a league's Venues sheet and Settings ask for."""
    s = league.settings
    shared = {name_key(c) for c in s.shared}
    caps: list[Capacity] = []
    if "venue" in shared:
        for venue in league.venues.values():
            if venue.pitches <= 1:
                continue
            at = [f for f in league.fixtures if name_key(f.venue) == name_key(venue.name)]
            if at and not all(f.pitch for f in at):
                caps.append(Capacity(venue.name, venue.pitches, tuple(f.label for f in at)))
    legs = leg_pairs(league) if s.legs == 2 and (s.leg_gap or s.mirrored) else ()
    return GeneratorRules(
        capacities=tuple(caps),
        max_home_run=s.max_home_run,
        max_away_run=s.max_away_run,
        round_balance=s.round_balance,
        leg_gap=s.leg_gap,
        mirrored=s.mirrored and s.return_half,
        legs=tuple(legs),
        byes_apart=(s.byes_apart and round_robins(league) is not None
                    and not any(info.time for info in league.rounds)),
    )


def leg_pairs(league: League) -> list[tuple[str, str]]:
    """(first leg, return) fixture labels: the meetings of one pair of teams, leg 1 with leg 2
    (and leg 2 with leg 3, ...)."""
    meetings: dict[frozenset[str], dict[int, str]] = defaultdict(dict)
    for f in league.fixtures:
        if f.home and f.away:
            meetings[frozenset((f.home, f.away))].setdefault(f.leg, f.label)
    out = []
    for legs in meetings.values():
        for leg in sorted(legs):
            if leg + 1 in legs:
                out.append((legs[leg], legs[leg + 1]))
    return out


def round_robins(league: League) -> dict[str | None, list[str]] | None:
    """Division -> its teams (in Teams order) when every division is a complete round robin
    (each pair of its teams meets Legs times, and only its teams play in it); else None."""
    teams: dict[str | None, list[str]] = {}
    for name, team in league.teams.items():
        teams.setdefault(team.division, []).append(name)
    met: dict[str | None, dict[frozenset[str], int]] = {}
    for f in league.fixtures:
        if not (f.home and f.away) or f.division not in teams:
            return None
        key = frozenset((f.home, f.away))
        if not key <= set(teams[f.division]):
            return None
        pairs = met.setdefault(f.division, {})
        pairs[key] = pairs.get(key, 0) + 1
    legs = league.settings.legs
    for division, members in teams.items():
        n = len(members)
        pairs = met.get(division, {})
        if n < 2 or len(pairs) != n * (n - 1) // 2 or set(pairs.values()) != {legs}:
            return None
    return teams if teams else None


def team_sides(league: League) -> dict[str, list[tuple[str, str]]]:
    """Team -> its fixtures as (label, "home" | "away"), in league order."""
    out: dict[str, list[tuple[str, str]]] = defaultdict(list)
    for f in league.fixtures:
        if f.home:
            out[f.home].append((f.label, "home"))
        if f.away:
            out[f.away].append((f.label, "away"))
    return dict(out)


def _rounds_text(rounds: list[int]) -> str:
    return ", ".join(str(r) for r in rounds)


def check_capacity(rules: GeneratorRules, assignment: dict[str, int]) -> list[Violation]:
    """Rounds in which a venue holds more fixtures than it has pitches."""
    out = []
    for cap in rules.capacities:
        by_round: dict[int, list[str]] = defaultdict(list)
        for label in cap.fixtures:
            if label in assignment:
                by_round[assignment[label]].append(label)
        for r in sorted(by_round):
            held = by_round[r]
            if len(held) > cap.pitches:
                out.append(
                    Violation(
                        "capacity",
                        f"venue {cap.venue} holds {len(held)} fixtures in round {r} but has "
                        f"{cap.pitches} pitches: {', '.join(held)}",
                        tuple(held),
                        (r,),
                    )
                )
    return out


def side_runs(
    sides: list[tuple[str, str]], assignment: dict[str, int]
) -> list[tuple[str, list[tuple[int, str]]]]:
    """A team's maximal runs of same-side fixtures in round order, as (side, [(round, label)])."""
    placed = sorted((assignment[lab], lab, side) for lab, side in sides if lab in assignment)
    runs: list[tuple[str, list[tuple[int, str]]]] = []
    for r, lab, side in placed:
        if runs and runs[-1][0] == side:
            runs[-1][1].append((r, lab))
        else:
            runs.append((side, [(r, lab)]))
    return runs


def check_runs(
    league: League, rules: GeneratorRules, assignment: dict[str, int]
) -> list[Violation]:
    """Teams playing more home (or away) fixtures in a row than the settings allow."""
    limits = {"home": rules.max_home_run, "away": rules.max_away_run}
    if limits["home"] is None and limits["away"] is None:
        return []
    out = []
    for team, sides in team_sides(league).items():
        for side, run in side_runs(sides, assignment):
            limit = limits[side]
            if limit is not None and len(run) > limit:
                rounds = [r for r, _ in run]
                out.append(
                    Violation(
                        f"{side} run",
                        f"team {team} plays "
                        f"{plural(len(run), side + ' fixture', side + ' fixtures')} in a row "
                        f"(rounds {_rounds_text(rounds)}); Most {side} games in a row is {limit}",
                        tuple(lab for _, lab in run),
                        tuple(rounds),
                    )
                )
    return out


def check_balance(
    rules: GeneratorRules, assignment: dict[str, int], rounds: int
) -> list[Violation]:
    """Fixtures per round (all rounds 1..K, empty ones too) differing by more than allowed."""
    if rules.round_balance is None or rounds < 1:
        return []
    per = dict.fromkeys(range(1, rounds + 1), 0)
    for r in assignment.values():
        if r in per:
            per[r] += 1
    hi, lo = max(per.values()), min(per.values())
    if hi - lo <= rules.round_balance:
        return []
    r_hi = min(r for r, c in per.items() if c == hi)
    r_lo = min(r for r, c in per.items() if c == lo)
    return [
        Violation(
            "balance",
            f"rounds hold {lo} to {hi} fixtures (round {r_hi}: {hi}, round {r_lo}: {lo}); "
            f"Round balance allows a difference of {rules.round_balance}",
            (),
            (r_hi, r_lo),
        )
    ]


def check_legs(rules: GeneratorRules, assignment: dict[str, int], rounds: int
               ) -> list[Violation]:
    """Pairings whose return is closer than the leg gap, or not mirrored H rounds later."""
    out = []
    gap, half = rules.leg_gap, -(-rounds // 2)
    for first, back in rules.legs:
        if first not in assignment or back not in assignment:
            continue
        a, b = assignment[first], assignment[back]
        if gap is not None and abs(b - a) < gap:
            out.append(Violation(
                "leg gap", f"{first} (round {a}) and its return {back} (round {b}) are "
                f"{plural(abs(b - a), 'round')} apart; Leg gap is {gap}", (first, back), (a, b)))
        if rules.mirrored and b != a + half:
            out.append(Violation(
                "mirrored", f"{back} is in round {b}, but mirrored it repeats round {a} "
                f"({first}) in round {a + half}", (first, back), (a, b)))
    return out


def check_byes(league: League, rules: GeneratorRules, assignment: dict[str, int],
               rounds: int) -> list[Violation]:
    """Teams with byes in two rounds in a row, where their byes could be kept apart."""
    if not rules.byes_apart or len(assignment) < len(league.fixtures):
        return []
    out = []
    for team, byes in team_byes(league, assignment, rounds).items():
        if len(byes) > rounds - len(byes) + 1:
            continue  # more byes than games + 1: some two must be next to each other
        close = [r for r in byes if r + 1 in byes]
        if close:
            r = close[0]
            out.append(Violation("byes", f"team {team} has byes in rounds {r} and {r + 1}",
                                 (), (r, r + 1)))
    return out


def check_generator(
    league: League, rules: GeneratorRules, assignment: dict[str, int], rounds: int
) -> list[Violation]:
    """Every generator-only rule that a complete schedule breaks."""
    return (
        check_capacity(rules, assignment)
        + check_runs(league, rules, assignment)
        + check_balance(rules, assignment, rounds)
        + check_legs(rules, assignment, rounds)
        + check_byes(league, rules, assignment, rounds)
    )


def balance_bounds(fixtures: int, rounds: int, balance: int) -> tuple[int, int]:
    """(fewest, most) fixtures any round can hold under Round balance.

    The final most-filled round holds at least ceil(n/K) and the least-filled at most
    floor(n/K), so every round holds between ceil(n/K) - B and floor(n/K) + B."""
    low = max(0, -(-fixtures // rounds) - balance)
    return low, fixtures // rounds + balance


def _hall_windows(
    items: list[tuple[str, set[int]]], per_round: int, rounds: int
) -> tuple[int, int, list[str]] | None:
    """The first window of rounds a..b that must hold more items than per_round x (b-a+1)."""
    for a in range(1, rounds + 1):
        for b in range(a, rounds + 1):
            inside = [lab for lab, dom in items if dom and min(dom) >= a and max(dom) <= b]
            if len(inside) > per_round * (b - a + 1):
                return a, b, inside
    return None


def _span(a: int, b: int) -> str:
    return f"round {a}" if a == b else f"rounds {a}..{b}"


def prove_impossible(
    league: League, rules: GeneratorRules, domains: dict[str, set[int]], rounds: int
) -> list[str]:
    """Proofs by counting that no schedule meets a rule, each naming the rule and where.

    `domains` gives each fixture's allowed rounds (pins, blocked rounds, return half)."""
    out: list[str] = []
    for cap in rules.capacities:
        items = [(lab, domains[lab]) for lab in cap.fixtures]
        hit = _hall_windows(items, cap.pitches, rounds)
        if hit:
            a, b, inside = hit
            out.append(
                f"venue capacity: venue {cap.venue} has {cap.pitches} pitches but "
                f"{_span(a, b)} must hold {len(inside)} of its fixtures"
            )
    sides_of = team_sides(league)
    for side, limit in (("home", rules.max_home_run), ("away", rules.max_away_run)):
        if limit is None:
            continue
        for team, sides in sides_of.items():
            mine = sum(1 for _, s in sides if s == side)
            other = len(sides) - mine
            if mine > (other + 1) * limit:
                out.append(
                    f"most {side} games in a row: team {team} has {mine} {side} fixtures and "
                    f"{other} "
                    f"{'away' if side == 'home' else 'home'}, so some run of {side} fixtures "
                    f"is longer than {limit}"
                )
    if rules.round_balance is not None:
        out.extend(_prove_balance(rules.round_balance, domains, rounds))
    out.extend(_prove_legs(rules, domains, rounds))
    return out


def _prove_legs(rules: GeneratorRules, domains: dict[str, set[int]], rounds: int) -> list[str]:
    """The first pairing whose two meetings cannot keep the leg gap (or the mirror) in the
    rounds their pins, blocked rounds and Return half leave them."""
    gap, half = rules.leg_gap, -(-rounds // 2)
    if gap is not None and rules.legs and gap >= rounds:
        return [f"leg gap: a pairing's two meetings cannot be {gap} rounds apart in "
                f"{plural(rounds, 'round')} (at most {rounds - 1})"]
    out = []
    for first, back in rules.legs:
        a, b = domains.get(first, set()), domains.get(back, set())
        if gap is not None and not any(abs(y - x) >= gap for x in a for y in b):
            out.append(f"leg gap: {first} and its return {back} cannot be {gap} rounds apart "
                       "in the rounds left to them")
            break
        if rules.mirrored and not any(x + half in b for x in a):
            out.append(f"mirrored return half: {back} cannot be played {half} rounds after "
                       f"{first} in the rounds left to them")
            break
    return out


def _prove_balance(balance: int, domains: dict[str, set[int]], rounds: int) -> list[str]:
    n = len(domains)
    low, high = balance_bounds(n, rounds, balance)
    if high * rounds < n:
        return [
            f"round balance: with a difference of at most {balance}, {n} fixtures cannot be "
            f"spread over {rounds} rounds (at most {high} a round)"
        ]
    out = []
    hit = _hall_windows(list(domains.items()), high, rounds)
    if hit:
        a, b, inside = hit
        out.append(
            f"round balance: at most {high} fixtures a round are allowed ({n} fixtures over "
            f"{rounds} rounds, difference {balance}), but {_span(a, b)} must hold {len(inside)}"
        )
    for r in range(1, rounds + 1):
        can = sum(1 for dom in domains.values() if r in dom)
        if can < low:
            out.append(
                f"round balance: round {r} must hold at least {low} fixtures ({n} fixtures over "
                f"{rounds} rounds, difference {balance}), but only {can} may go there"
            )
            break
    return out

