"""Breaks, byes and the canonical timetables against published values, recounted by a checker
written here, independently of leaguegrid.scheduling.breaks."""

from __future__ import annotations

import itertools
from collections import Counter

import pytest
from hypothesis import given
from hypothesis import strategies as st

from leaguegrid.core.model import Fixture, League
from leaguegrid.core.round_robin import (
    halves_double,
    mirrored_double,
    partners,
    seat_teams,
    single_round_robin,
)
from leaguegrid.scheduling.breaks import break_lower_bound, count_breaks, team_byes

Rounds = list[list[tuple[int, int]]]


def checked_breaks(rounds: Rounds, teams: int, legs: int, byes_apart: bool = True) -> int:
    """Check the timetable (each pair `legs` times, home once each in a double; a team at most
    once a round; never two byes in a row) and recount its breaks, byes skipped."""
    met = Counter()
    sides: dict[int, list[str]] = {t: [] for t in range(teams)}
    byes: dict[int, list[int]] = {t: [] for t in range(teams)}
    for number, games in enumerate(rounds):
        playing = [t for g in games for t in g]
        assert len(playing) == len(set(playing)), f"a team twice in round {number}"
        for h, a in games:
            met[(h, a)] += 1
            sides[h].append("H")
            sides[a].append("A")
        for t in set(range(teams)) - set(playing):
            byes[t].append(number)
    for i, j in itertools.combinations(range(teams), 2):
        if legs == 1:
            assert met[(i, j)] + met[(j, i)] == 1
        else:
            assert met[(i, j)] == met[(j, i)] == 1
    for t, rest in byes.items():
        apart = all(b - a > 1 for a, b in itertools.pairwise(rest))
        assert apart or not byes_apart, f"team {t} byes {rest}"
    return sum(x == y for s in sides.values() for x, y in itertools.pairwise(s))


@pytest.mark.parametrize("n", range(4, 21, 2))
def test_single_round_robin_reaches_n_minus_2(n):
    # de Werra 1981: a compact single round robin of n teams (n even) has at least n - 2
    # breaks, and the canonical schedule has exactly n - 2.
    rounds = single_round_robin(n)
    assert len(rounds) == n - 1
    assert checked_breaks(rounds, n, 1) == n - 2 == break_lower_bound(n, "single", n - 1)


@pytest.mark.parametrize("n", range(4, 21, 2))
def test_mirrored_double_reaches_3n_minus_6(n):
    # de Werra 1981: a mirrored double round robin (n even), junction included, has >= 3n - 6.
    rounds = mirrored_double(n)
    assert checked_breaks(rounds, n, 2) == 3 * n - 6 == break_lower_bound(n, "mirrored", 2 * n - 2)


@pytest.mark.parametrize("n", range(4, 21, 2))
def test_two_halves_reach_2n_minus_4(n):
    # Each half is a single round robin (de Werra 1981: n - 2 each); the junction adds none.
    rounds = halves_double(n)
    assert checked_breaks(rounds, n, 2) == 2 * n - 4 == break_lower_bound(n, "halves", 2 * n - 2)


@pytest.mark.parametrize("n", range(3, 20, 2))
def test_odd_counts_have_no_break_single_and_n_mirrored(n):
    # de Werra 1981: n odd, a single round robin (one bye each) can have no break; a mirrored
    # double one needs n (every break-free half pattern has even length, so its junction breaks).
    single, double = single_round_robin(n), mirrored_double(n)
    assert len(single) == n and len(double) == 2 * n
    assert checked_breaks(single, n, 1) == 0 == break_lower_bound(n, "single", n)
    assert checked_breaks(double, n, 2) == n == break_lower_bound(n, "mirrored", 2 * n)


def _all_single_round_robins_of_4():
    """Every compact single round robin of 4 teams, round order and sides included."""
    matchings = [((0, 1), (2, 3)), ((0, 2), (1, 3)), ((0, 3), (1, 2))]
    for order in itertools.permutations(matchings):
        for flips in itertools.product((False, True), repeat=6):
            games = [g[::-1] if f else g for g, f in
                     zip([g for m in order for g in m], flips, strict=True)]
            yield [games[0:2], games[2:4], games[4:6]]


def test_brute_force_confirms_the_minimum_for_4_teams():
    # Exhaustive over all 3! x 2^6 = 384 schedules: 2 = n - 2 single, 6 = 3n - 6 mirrored.
    schedules = list(_all_single_round_robins_of_4())
    assert len(schedules) == 384
    assert min(checked_breaks(s, 4, 1) for s in schedules) == 2
    mirrored = [s + [[(a, h) for h, a in g] for g in s] for s in schedules]
    assert min(checked_breaks(s, 4, 2) for s in mirrored) == 6


def league_of(rounds: Rounds, teams: int) -> tuple[League, dict[str, int]]:
    names = [f"T{t}" for t in range(teams)]
    fixtures, assignment = [], {}
    for number, games in enumerate(rounds, start=1):
        for h, a in games:
            label = f"{names[h]} v {names[a]} ({number})"
            fixtures.append(Fixture(label, names[h], names[a]))
            assignment[label] = number
    return League("test", "test", fixtures), assignment


@given(st.integers(3, 14), st.sampled_from(["single", "mirrored", "halves"]),
       st.randoms(use_true_random=False))
def test_league_breaks_and_byes_agree_with_the_checker(teams, style, rnd):
    make = {"single": single_round_robin, "mirrored": mirrored_double,
            "halves": halves_double}[style]
    rounds = make(teams)
    rnd.shuffle(rounds)  # any round order: the count must follow it
    league, assignment = league_of(rounds, teams)
    got = count_breaks(league, assignment)
    assert got.total == checked_breaks(rounds, teams, 1 if style == "single" else 2, False)
    assert sum(got.per_team.values()) == got.total
    byes = team_byes(league, assignment, len(rounds))
    for t in range(teams):
        expected = [r for r, games in enumerate(rounds, start=1)
                    if all(t not in g for g in games)]
        assert byes[f"T{t}"] == expected


def test_a_bye_between_two_home_games_is_a_break():
    # The convention of the break count: byes skipped (home, bye, home is a break).
    league = League("t", "t", [Fixture("a", "X", "Y"), Fixture("b", "X", "Z")])
    assert count_breaks(league, {"a": 1, "b": 3}).per_team == {"X": 1, "Y": 0, "Z": 0}
    assert team_byes(league, {"a": 1, "b": 3}, 3) == {"X": [2], "Y": [2, 3], "Z": [1, 2]}


def _pattern(rounds: Rounds, team: int) -> str:
    return "".join("H" if any(h == team for h, _ in g) else "A" if any(a == team for _, a in g)
                   else "-" for g in rounds)


@pytest.mark.parametrize("n", range(3, 21))
def test_partners_are_home_while_the_other_is_away(n):
    rounds = single_round_robin(n)
    pairs = partners(n)
    assert len(pairs) == n // 2 and len({s for p in pairs for s in p}) == 2 * (n // 2)
    for a, b in pairs:
        both = [(x, y) for x, y in zip(_pattern(rounds, a), _pattern(rounds, b), strict=True)
                if "-" not in (x, y)]
        assert both and all(x != y for x, y in both), (a, b)


def test_teams_sharing_a_ground_are_seated_as_partners_within_and_across_divisions():
    under12 = ["Ash", "Beech", "Cedar", "Damson", "Elm", "Fir"]
    under14 = ["Ash 14", "Gorse", "Holly", "Beech 14", "Ivy", "Juniper"]
    ground = {name: name for name in under12 + under14}
    ground.update({"Ash 14": "Ash", "Beech 14": "Beech", "Fir": "Cedar"})
    first, second = seat_teams([under12, under14], ground)
    assert sorted(first) == sorted(under12) and sorted(second) == sorted(under14)
    mates = {frozenset(p) for p in partners(6)}
    assert frozenset((first.index("Cedar"), first.index("Fir"))) in mates
    for old, new in (("Ash", "Ash 14"), ("Beech", "Beech 14")):
        assert frozenset((first.index(old), second.index(new))) in mates
    assert seat_teams([under12], {}) == [under12]  # nothing shared: sheet order


def test_four_divisions_on_one_ground_of_two_pitches_have_at_most_two_at_home():
    # A club with a team in each of four 8-team divisions on one ground: seated alternately
    # on a place and its partner, two of them are at home in every round, never three.
    divisions = [[f"Club {d}"] + [f"Other {d}{i}" for i in range(7)] for d in range(4)]
    ground = {f"Club {d}": "Club ground" for d in range(4)}
    seated = seat_teams(divisions, ground)
    rounds = single_round_robin(8)
    home = [sum(_pattern(rounds, order.index(f"Club {d}"))[r] == "H"
                for d, order in enumerate(seated)) for r in range(7)]
    assert home == [2] * 7
