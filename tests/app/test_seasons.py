"""Each team's season (app.seasons) on a league built here by hand, where every side, bye, break
and warning is worked out below, and on de Werra's round robins, whose breaks are published."""

from __future__ import annotations

import datetime as dt
import itertools

import pytest

from leaguegrid.app.seasons import team_seasons
from leaguegrid.core.model import Fixture, League, RoundInfo, Schedule, Settings, Team
from leaguegrid.core.round_robin import single_round_robin
from leaguegrid.scheduling.breaks import break_lower_bound, count_breaks

# round -> fixtures (home, away) of the hand-built league, six rounds, one division
BY_HAND = {1: [("Wrens", "Kites"), ("Otters", "Herons")], 2: [("Herons", "Badgers")],
           3: [("Herons", "Wrens")], 4: [("Otters", "Wrens")], 5: [("Badgers", "Wrens")],
           6: [("Badgers", "Otters"), ("Kites", "Herons")]}
TEAMS = ("Badgers", "Herons", "Kites", "Otters", "Wrens")


def league_of(by_round: dict[int, list[tuple[str, str]]], division: str | None = "U10",
              **settings) -> tuple[League, Schedule]:
    fixtures, assignment = [], {}
    for r, games in by_round.items():
        for home, away in games:
            label = f"{home} v {away}"
            fixtures.append(Fixture(label, home=home, away=away, venue=f"{home} ground",
                                    division=division))
            assignment[label] = r
    teams = sorted({t for f in fixtures for t in f.teams})
    league = League(name="Hand-built", source="test", fixtures=fixtures,
                    teams={t: Team(t, division=division) for t in teams},
                    settings=Settings(**settings))
    return league, Schedule(max(by_round), assignment, method="edited")


def sides_by_hand(by_round: dict[int, list[tuple[str, str]]], team: str) -> list[str]:
    """The team's sides in round order, worked out from the table above (not by the app)."""
    return ["H" if home == team else "A" for r in sorted(by_round)
            for home, away in by_round[r] if team in (home, away)]


def test_the_hand_built_season_round_by_round():
    league, schedule = league_of(BY_HAND)
    seasons = team_seasons(league, schedule)
    strips = {t.team: "".join(r.letter for r in t.rounds) for t in seasons.teams}
    assert strips == {"Badgers": "BABBHH•", "Herons": "AHH•BBA", "Kites": "ABBBBH",
                      "Otters": "HBBH•BA", "Wrens": "HBAA•A•B"}
    assert [t.team for t in seasons.teams] == list(TEAMS)
    wrens = seasons.team("Wrens")
    assert (wrens.home, wrens.away, wrens.byes, wrens.breaks) == (1, 3, (2, 6), 2)
    assert (wrens.longest_home, wrens.longest_away) == (1, 3)
    assert wrens.totals == "1 home game, 3 away games, 2 byes"
    third = wrens.rounds[3]  # round 4: away at Otters, a break
    assert third.tip() == "Round 4: away v Otters at Otters ground; break: away again"
    assert wrens.rounds[1].tip() == "Round 2: bye"
    kites = seasons.team("Kites")
    assert (kites.home, kites.away, kites.byes, kites.breaks) == (1, 1, (2, 3, 4, 5), 0)


def test_the_hand_built_warnings_word_for_word():
    league, schedule = league_of(BY_HAND)
    seasons = team_seasons(league, schedule)
    unequal = "Byes are unequal in division U10: Kites have 4 byes, Herons 2"
    assert seasons.warnings == (
        "Badgers have byes in rounds 3 and 4",
        "Herons have byes in rounds 4 and 5",
        "Kites have byes in rounds 2, 3, 4 and 5",
        "Otters have byes in rounds 2 and 3",
        "Wrens play away in rounds 3, 4 and 5",
        "Wrens play 1 home game and 3 away games",
        unequal,
    )
    assert seasons.team("Kites").warnings[-1] == unequal
    assert seasons.team("Herons").warnings[-1] == unequal
    assert unequal not in seasons.team("Wrens").warnings


def test_breaks_agree_with_a_count_by_hand_and_with_the_scheduling_count():
    league, schedule = league_of(BY_HAND)
    seasons = team_seasons(league, schedule)
    for t in seasons.teams:
        sides = sides_by_hand(BY_HAND, t.team)
        assert t.breaks == sum(a == b for a, b in itertools.pairwise(sides)), t.team
    assert seasons.breaks == 5 == count_breaks(league, schedule.assignment).total


def test_one_bye_more_is_no_warning_and_two_apart_are_none():
    # Kites play once more (round 3): 3 byes against Herons' 2, and their byes split in two
    by_round = {**BY_HAND, 3: [("Herons", "Wrens"), ("Kites", "Otters")]}
    league, schedule = league_of(by_round)
    warnings = team_seasons(league, schedule).warnings
    assert not any(w.startswith("Byes are unequal") for w in warnings)
    assert "Kites have byes in rounds 4 and 5" in warnings


def test_each_division_compares_its_own_byes():
    league, schedule = league_of(BY_HAND, division=None)
    assert team_seasons(league, schedule).warnings[-1] == (
        "Byes are unequal: Kites have 4 byes, Herons 2")


def test_time_slots_have_no_byes_to_warn_about():
    league, schedule = league_of(BY_HAND)
    league.rounds = [RoundInfo(r, dt.date(2027, 9, 4), dt.time(9 + r)) for r in range(1, 7)]
    seasons = team_seasons(league, schedule)
    assert seasons.time_slots
    assert seasons.warnings == ("Wrens play away in rounds 3, 4 and 5",
                                "Wrens play 1 home game and 3 away games")
    assert seasons.team("Wrens").rounds[0].title == "Round 1 (2027-09-04 10:00)"


@pytest.mark.parametrize("n", [4, 6, 8, 10, 12])
def test_de_werra_round_robin_has_n_minus_2_breaks_and_nothing_to_warn(n):
    # de Werra, "Scheduling in sports" (1981): a compact single round robin of n teams, n even,
    # has at least n - 2 breaks, and the circle method with his home-away rule reaches it.
    names = [f"Team {i + 1}" for i in range(n)]
    by_round = {r + 1: [(names[h], names[a]) for h, a in games]
                for r, games in enumerate(single_round_robin(n))}
    league, schedule = league_of(by_round)
    seasons = team_seasons(league, schedule)
    marked = sum(g.is_break for t in seasons.teams for r in t.rounds for g in r.games)
    assert marked == seasons.breaks == n - 2 == break_lower_bound(n, "single", n - 1)
    assert seasons.warnings == ()
    assert all(not t.byes and t.home + t.away == n - 1 for t in seasons.teams)
