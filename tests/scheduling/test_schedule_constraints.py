"""The counting model: ties, splits, pins, played, blocked and return half, checked against
brute-force enumeration by the textbook definition (schedule_helpers.brute)."""

from __future__ import annotations

import random

import pytest
from schedule_helpers import brute, fx, make_league, round_robin, textbook_graph

from leaguegrid.core.model import Blocked, ClashRow, Settings, Split, Tie, Venue
from leaguegrid.scheduling.constraints import build_model


def small_league():
    """Six fixtures of four teams at two grounds, with a coach shared by two teams."""
    fixtures = [
        fx("Ash", "Birch", "North Park"),
        fx("Cedar", "Daisy", "South Park"),
        fx("Ash", "Cedar", "North Park"),
        fx("Birch", "Daisy", "South Park"),
        fx("Daisy", "Ash", "South Park"),
        fx("Birch", "Cedar", "North Park"),
    ]
    return make_league(fixtures)


def test_ties_merge_fixtures_into_one_node_and_expand_back():
    lg = small_league()
    lg.ties = [Tie("Ash v Birch", "Cedar v Daisy", row=2)]
    m = build_model(lg, nx_graph(lg), 3)
    assert m.node_of["Cedar v Daisy"] == "Ash v Birch"
    assert m.members["Ash v Birch"] == ("Ash v Birch", "Cedar v Daisy")
    assert m.graph.number_of_nodes() == 5
    expanded = m.expand({"Ash v Birch": 2, "Ash v Cedar": 1})
    assert expanded == {"Ash v Birch": 2, "Cedar v Daisy": 2, "Ash v Cedar": 1}


def nx_graph(lg):
    return textbook_graph(lg)


@pytest.mark.parametrize("k", [2, 3, 4])
def test_counts_with_every_exact_rule_match_brute_force(k):
    lg = small_league()
    lg.ties = [Tie("Ash v Birch", "Cedar v Daisy", row=2)]
    lg.splits = [Split("Ash v Cedar", "Birch v Daisy", "same referee", row=2)]
    lg.fixtures[4].pin = 3
    lg.fixtures[4].played = True
    lg.blocked = [Blocked(1, team="Birch", reason="camp", row=2),
                  Blocked(2, venue="North Park", row=3)]
    g = textbook_graph(lg)
    assert build_model(lg, g, k).count() == len(brute(lg, g, k))


def test_counts_match_brute_force_on_random_small_leagues():
    """Seeded random leagues of 6 fixtures: ties, splits, pins and blocked rows at random."""
    rng = random.Random(20240607)
    teams = ["Ash", "Birch", "Cedar", "Daisy", "Elm", "Fir"]
    checked = nonzero = 0
    for _ in range(40):
        fixtures = []
        for i in range(6):
            h, a = rng.sample(teams, 2)
            fixtures.append(fx(h, a, rng.choice(["North", None, None]), label=f"F{i}"))
        lg = make_league(fixtures)
        labels = [f.label for f in fixtures]
        if rng.random() < 0.7:
            a, b = rng.sample(labels, 2)
            lg.ties = [Tie(a, b, row=2)]
        if rng.random() < 0.7:
            a, b = rng.sample(labels, 2)
            lg.splits = [Split(a, b, "split", row=2)]
        for f in rng.sample(fixtures, rng.randint(0, 2)):
            f.pin = rng.randint(1, 4)
            f.played = rng.random() < 0.5
        if rng.random() < 0.7:
            lg.blocked = [Blocked(rng.randint(1, 4), team=rng.choice(teams), row=2)]
        g = textbook_graph(lg)
        for k in (3, 4, 5):
            expected = len(brute(lg, g, k))
            assert build_model(lg, g, k).count() == expected, (k, lg)
            checked += 1
            nonzero += expected > 0
    assert checked == 120 and nonzero >= 40


@pytest.mark.parametrize("k", [2, 3, 4, 5])
def test_return_half_is_counted_exactly(k):
    lg = make_league(round_robin(["Ash", "Birch", "Cedar"], legs=2),
                     settings=Settings(legs=2, return_half=True))
    g = textbook_graph(lg)
    m = build_model(lg, g, k)
    assert m.count() == len(brute(lg, g, k))
    assert m.half == -(-k // 2)


def test_fewest_rounds_with_return_half_matches_brute_force():
    lg = make_league(round_robin(["Ash", "Birch", "Cedar"], legs=2),
                     settings=Settings(legs=2, return_half=True))
    g = textbook_graph(lg)
    brute_min = next(k for k in range(1, 8) if brute(lg, g, k))
    assert build_model(lg, g, 3).fewest_rounds() == brute_min == 6


def test_fewest_rounds_with_pins_and_blocked_matches_brute_force():
    lg = small_league()
    lg.fixtures[0].pin = 4
    lg.blocked = [Blocked(1, team="Ash", row=2)]
    g = textbook_graph(lg)
    brute_min = next(k for k in range(1, 7) if brute(lg, g, k))
    assert build_model(lg, g, 3).fewest_rounds() == brute_min == 4


def test_tie_between_clashing_fixtures_is_named():
    lg = small_league()
    lg.ties = [Tie("Ash v Birch", "Ash v Cedar", row=5)]
    m = build_model(lg, textbook_graph(lg), 4)
    assert m.contradictions == [
        "Ash v Birch and Ash v Cedar must be played together (Together row 5) but they clash: "
        "team Ash; venue North Park"
    ]
    assert m.count() == 0
    assert m.fewest_rounds() is None


def test_conflicting_pins_within_a_tie_are_named():
    lg = small_league()
    lg.ties = [Tie("Ash v Birch", "Cedar v Daisy", row=2)]
    lg.fixtures[0].pin = 1
    lg.fixtures[1].pin = 2
    lg.fixtures[1].played = True
    m = build_model(lg, textbook_graph(lg), 3)
    assert m.contradictions == [
        "fixtures kept together must share a round, but Ash v Birch (pinned to round 1), "
        "Cedar v Daisy (played in round 2)"
    ]
    assert m.count() == 0


def test_pin_beyond_k_and_pin_on_blocked_round_are_named():
    lg = small_league()
    lg.fixtures[0].pin = 5
    lg.fixtures[1].pin = 2
    lg.blocked = [Blocked(2, venue="South Park", reason="gala", row=4)]
    m = build_model(lg, textbook_graph(lg), 4)
    assert m.contradictions == [
        "Ash v Birch is pinned to round 5, but there are only 4 rounds",
        "Cedar v Daisy is pinned to round 2, but venue South Park is blocked in round 2 "
        "(Blocked row 4: gala)",
    ]


def test_clashing_fixtures_pinned_to_one_round_are_named():
    lg = small_league()
    lg.fixtures[0].pin = 2
    lg.fixtures[2].pin = 2
    m = build_model(lg, textbook_graph(lg), 3)
    assert m.contradictions == [
        "Ash v Birch and Ash v Cedar clash (team Ash; venue North Park) but both are fixed "
        "to round 2"
    ]


def test_fixture_with_every_round_blocked_is_named():
    lg = small_league()
    lg.blocked = [Blocked(1, team="Ash", row=2), Blocked(2, team="Ash", row=3)]
    m = build_model(lg, textbook_graph(lg), 2)
    assert m.contradictions[0] == (
        "no round in 1..2 is left for Ash v Birch: every round is blocked for it"
    )


def test_rules_lists_say_what_is_counted_and_what_only_the_generator_enforces():
    lg = make_league(
        round_robin(["Ash", "Birch", "Cedar", "Daisy"], {"Ash": "Hub", "Birch": "Hub",
                                                                "Cedar": "Vale", "Daisy": "Vale"},
                           legs=2),
        venues={"Hub": Venue("Hub", pitches=2)},
        settings=Settings(legs=2, return_half=True, max_home_run=2, max_away_run=2,
                          round_balance=1),
    )
    lg.splits = [Split("Ash v Daisy", "Birch v Cedar", "referee", row=2)]
    lg.fixtures[0].pin = 1
    lg.blocked = [Blocked(3, team="Cedar", row=2)]
    m = build_model(lg, textbook_graph(lg), 6)
    assert m.rules_counted == [
        f"clashes: {m.clashes.number_of_edges()} pairs of fixtures never share a round",
        "apart: 1 pair kept apart by hand (counted as clashes)",
        "pins: 1 fixture fixed to its round",
        "blocked: 1 Blocked row keeps teams or venues out of rounds",
        "return half: first legs in rounds 1..3, return fixtures in rounds 4..6",
    ]
    assert m.rules_generator == [
        "venue capacity: Hub hosts at most 2 fixtures a round (2 pitches)",
        "most home games in a row: no team plays more than 2 home fixtures in a row",
        "most away games in a row: no team plays more than 2 away fixtures in a row",
        "round balance: fixtures per round differ by at most 1",
    ]


def test_capacity_rule_needs_several_pitches_and_a_fixture_without_pitch():
    fixtures = [fx("Ash", "Birch", "Hub"), fx("Cedar", "Daisy", "Hub", pitch="2")]
    one = make_league(fixtures, venues={"Hub": Venue("Hub", pitches=1)})
    assert build_model(one, textbook_graph(one), 2).generator.capacities == ()
    two = make_league(fixtures, venues={"Hub": Venue("Hub", pitches=2)})
    caps = build_model(two, textbook_graph(two), 2).generator.capacities
    assert [(c.venue, c.pitches, c.fixtures) for c in caps] == [
        ("Hub", 2, ("Ash v Birch", "Cedar v Daisy"))
    ]


def test_clash_rows_and_splits_carry_their_reasons_into_the_model():
    lg = small_league()
    lg.clash_rows = [ClashRow("Ash", "Daisy", "coach Robin", 3,
                              pairs=[("Ash v Birch", "Cedar v Daisy")])]
    lg.splits = [Split("Ash v Birch", "Cedar v Daisy", "referee", row=4)]
    m = build_model(lg, textbook_graph(lg), 3)
    reasons = m.clashes.edges["Ash v Birch", "Cedar v Daisy"]["reasons"]
    assert [str(r) for r in reasons] == ["coach Robin (row 3)", "referee (row 4)"]


def test_real_clash_graph_builder_and_model_agree_with_brute_force():
    """The importer's build_clash_graph (splits included) gives the same counts."""
    from leaguegrid.clashes.graph import build_clash_graph

    lg = small_league()
    lg.splits = [Split("Ash v Birch", "Cedar v Daisy", "referee", row=2)]
    lg.ties = [Tie("Ash v Cedar", "Birch v Daisy", row=2)]
    for k in (3, 4):
        assert (build_model(lg, build_clash_graph(lg), k).count()
                == len(brute(lg, textbook_graph(lg), k)))
