"""The rule search: every generator rule is met by what it finds, an impossible rule set is
reported as impossible naming the rule, and a stop at the budget is its own outcome."""

from __future__ import annotations

import itertools
import random
import threading
from collections import Counter

import pytest
from schedule_helpers import brute, fx, make_league, round_robin, textbook_graph

from leaguegrid.core.model import Blocked, Settings, Tie, Venue
from leaguegrid.engine import Hooks
from leaguegrid.scheduling.check import ScheduleChecker
from leaguegrid.scheduling.constraints import build_model
from leaguegrid.scheduling.rules import check_generator
from leaguegrid.scheduling.search import search

SIX = ["Ash", "Birch", "Cedar", "Daisy", "Elm", "Fir"]


def run(lg, k, seed=1, **kw):
    model = build_model(lg, textbook_graph(lg), k)
    return model, search(model, random.Random(seed), **kw)


def holds(lg, k, assignment):
    """No clash, count rule or generator rule broken (the full checker)."""
    return ScheduleChecker(lg, textbook_graph(lg), k).check(assignment) == []


def capacity_league(fixtures=6):
    """Fixtures of distinct teams at one ground with two pitches: only capacity binds them."""
    fixtures = [fx(f"T{2 * i}", f"T{2 * i + 1}", "Heron Park") for i in range(fixtures)]
    return make_league(fixtures, venues={"Heron Park": Venue("Heron Park", pitches=2)})


def test_capacity_is_met():
    lg = capacity_league()
    _, out = run(lg, 3)
    assert out.status == "found"
    per_round = [list(out.assignment.values()).count(r) for r in (1, 2, 3)]
    assert per_round == [2, 2, 2]
    assert holds(lg, 3, out.assignment)


def test_capacity_impossible_names_the_venue_and_rounds():
    lg = capacity_league(7)
    lg.blocked = [Blocked(4, venue="Heron Park", row=2), Blocked(5, venue="Heron Park", row=3)]
    _, out = run(lg, 5)
    assert out.status == "impossible"
    assert out.reasons == [
        "venue capacity: venue Heron Park has 2 pitches but rounds 1..3 must hold 7 of its "
        "fixtures"
    ]


def test_home_and_away_runs_are_met_on_a_double_round_robin():
    lg = make_league(round_robin(SIX, legs=2),
                     settings=Settings(legs=2, max_home_run=2, max_away_run=2))
    model, out = run(lg, 10, seed=7)
    assert out.status == "found"
    assert check_generator(lg, model.generator, out.assignment, 10) == []
    assert holds(lg, 10, out.assignment)


def test_home_run_impossible_by_counting_names_the_team():
    lg = make_league([fx("Ash", "Birch"), fx("Ash", "Cedar"), fx("Ash", "Daisy"),
                      fx("Elm", "Ash")], settings=Settings(max_home_run=1))
    _, out = run(lg, 4)
    assert out.status == "impossible"
    assert out.reasons == [
        "most home games in a row: team Ash has 3 home fixtures and 1 away, so some run of "
        "home fixtures "
        "is longer than 1"
    ]


def test_away_run_impossible_by_counting_names_the_team():
    lg = make_league([fx("Birch", "Ash"), fx("Cedar", "Ash"), fx("Daisy", "Ash")],
                     settings=Settings(max_away_run=2))
    _, out = run(lg, 3)
    assert out.reasons == [
        "most away games in a row: team Ash has 3 away fixtures and 0 home, so some run of "
        "away fixtures "
        "is longer than 2"
    ]


FOUR = [fx("Ash", "Birch"), fx("Ash", "Cedar"), fx("Daisy", "Ash"), fx("Birch", "Cedar"),
        fx("Birch", "Daisy"), fx("Cedar", "Daisy")]


def test_home_run_impossible_found_by_exhausting_the_search():
    """Every team has 1 or 2 home games, so counting proves nothing; brute force confirms
    that none of the 6 round-robin schedules in 3 rounds avoids two home games in a row."""
    lg = make_league(FOUR, settings=Settings(max_home_run=1))
    model, out = run(lg, 3)
    every = brute(lg, textbook_graph(lg), 3)
    assert len(every) == 6
    assert all(check_generator(lg, model.generator, a, 3) for a in every)
    assert out.status == "impossible"
    assert out.reasons == [
        f"most home games in a row: no schedule meets it together with the clashes, pins and "
        f"blocked "
        f"rounds (the search tried every option, {out.steps} steps)"
    ]


def test_several_rules_impossible_each_impossible_alone_are_named():
    lg = make_league(FOUR, settings=Settings(max_home_run=1, max_away_run=1))
    _, out = run(lg, 3)
    assert out.status == "impossible"
    assert out.reasons[1:] == [
        "most home games in a row cannot hold even alone with the clashes, pins and blocked rounds",
        "most away games in a row cannot hold even alone with the clashes, pins and blocked rounds",
    ]


def test_rules_possible_alone_but_not_together_are_named():
    """Ash must play home, away, home (most home games in a row 1), so its away game at Hub
    takes round 2,
    where closed rounds already force Hub's two other fixtures: Hub has only two pitches."""
    fixtures = [fx("Ash", "Birch", "North"), fx("Ash", "Cedar", "North"),
                fx("Daisy", "Ash", "Hub"), fx("Elm", "Fir", "Hub"), fx("Gorse", "Holly", "Hub")]
    lg = make_league(fixtures, venues={"Hub": Venue("Hub", pitches=2)},
                     settings=Settings(max_home_run=1))
    lg.blocked = [Blocked(r, team=t, row=2) for t in ("Elm", "Gorse") for r in (1, 3)]
    model, out = run(lg, 3)
    every = brute(lg, textbook_graph(lg), 3)
    assert not any(check_generator(lg, model.generator, a, 3) == [] for a in every)
    for name in model.generator.names:
        alone = model.generator.only(name)
        assert any(check_generator(lg, alone, a, 3) == [] for a in every)
    assert out.status == "impossible"
    assert out.reasons == [
        f"no schedule meets every rule together (the search tried every option, "
        f"{out.steps} steps)",
        "each rule can hold alone, but not all together: venue capacity, most home games in a row",
    ]


def test_round_balance_is_met():
    lg = make_league(round_robin(SIX), settings=Settings(round_balance=0))
    _, out = run(lg, 5, seed=3)
    assert out.status == "found"
    assert sorted(list(out.assignment.values()).count(r) for r in range(1, 6)) == [3] * 5


def test_round_balance_impossible_by_division_is_named():
    lg = make_league(round_robin(SIX), settings=Settings(round_balance=0))
    _, out = run(lg, 7)
    assert out.reasons == [
        "round balance: with a difference of at most 0, 15 fixtures cannot be spread over 7 "
        "rounds (at most 2 a round)"
    ]


def test_round_balance_impossible_when_a_round_cannot_be_filled():
    fixtures = [fx(f"T{2 * i}", f"T{2 * i + 1}", f"Ground {i}") for i in range(6)]
    lg = make_league(fixtures, settings=Settings(round_balance=1))
    lg.blocked = [Blocked(3, venue=f"Ground {i}", row=i + 2) for i in range(6)]
    _, out = run(lg, 3)
    assert out.reasons == [
        "round balance: round 3 must hold at least 1 fixtures (6 fixtures over 3 rounds, "
        "difference 1), but only 0 may go there"
    ]


def test_count_rules_contradiction_is_reported_before_searching():
    lg = capacity_league()
    lg.fixtures[0].pin = 9
    _, out = run(lg, 3)
    assert out.status == "impossible"
    assert out.reasons == ["T0 v T1 is pinned to round 9, but there are only 3 rounds"]


def test_search_respects_pins_ties_blocked_and_return_half():
    lg = make_league(round_robin(SIX, legs=2),
                     settings=Settings(legs=2, return_half=True, max_home_run=2))
    lg.fixtures[0].pin = 2
    lg.fixtures[1].pin = 5
    lg.fixtures[1].played = True
    lg.ties = [Tie("Cedar v Daisy", "Elm v Fir", row=2)]
    lg.blocked = [Blocked(1, team="Elm", row=2)]
    model, out = run(lg, 11, seed=11)
    assert model.count() > 0
    assert out.status == "found"
    assert holds(lg, 11, out.assignment)


def test_same_seed_same_schedule():
    lg = make_league(round_robin(SIX, legs=2), settings=Settings(legs=2, max_home_run=2))
    a = run(lg, 10, seed=5)[1].assignment
    b = run(lg, 10, seed=5)[1].assignment
    c = run(lg, 10, seed=6)[1].assignment
    assert a == b
    assert a != c


def test_budget_exhausted_is_its_own_outcome():
    lg = make_league(round_robin(SIX, legs=2), settings=Settings(legs=2, max_home_run=2))
    _, out = run(lg, 10, hooks=Hooks(budget=0, clock=itertools.count().__next__))
    assert out.status == "budget"
    assert out.assignment is None and out.reasons == []


def test_cancel_is_its_own_outcome():
    lg = make_league(round_robin(SIX, legs=2), settings=Settings(legs=2, max_home_run=2))
    stop = threading.Event()
    stop.set()
    _, out = run(lg, 10, hooks=Hooks(cancel=stop))
    assert out.status == "cancelled"


def test_progress_rises_to_one_when_found():
    lg = make_league(round_robin(SIX), settings=Settings(max_home_run=2))
    seen = []
    _, out = run(lg, 5, hooks=Hooks(lambda f, stage: seen.append((f, stage))))
    assert out.status == "found"
    assert seen == sorted(seen) and seen[-1] == (1.0, "search")


@pytest.mark.parametrize("k", [5, 6])
def test_every_schedule_found_is_among_the_brute_force_schedules(k):
    lg = make_league([fx("Ash", "Birch"), fx("Cedar", "Ash"), fx("Birch", "Cedar"),
                      fx("Ash", "Daisy"), fx("Daisy", "Birch")],
                     settings=Settings(max_home_run=1, max_away_run=1, round_balance=1))
    model, out = run(lg, k, seed=2)
    ok = [a for a in brute(lg, textbook_graph(lg), k)
          if not check_generator(lg, model.generator, a, k)]
    assert out.status == ("found" if ok else "impossible")
    if ok:
        assert out.assignment in ok


def test_search_agrees_with_brute_force_on_random_small_leagues():
    """Seeded random leagues with random rules: the search finds a schedule exactly when one
    meets every rule (brute force), and says impossible otherwise (its pruning is sound)."""
    rng = random.Random(4242)
    teams = ["Ash", "Birch", "Cedar", "Daisy", "Elm"]
    outcomes = Counter()
    for _ in range(100):
        fixtures, pairs = [], set()
        while len(fixtures) < 6:
            h, a = rng.sample(teams, 2)
            if (h, a) not in pairs:
                pairs.add((h, a))
                fixtures.append(fx(h, a, rng.choice(["Hub", "Hub", "Vale", None])))
        settings = Settings(
            max_home_run=rng.choice([None, 1, 2]),
            max_away_run=rng.choice([None, 1, 2]),
            round_balance=rng.choice([None, 0, 1, 2]),
        )
        lg = make_league(fixtures, venues={"Hub": Venue("Hub", pitches=2)}, settings=settings)
        if rng.random() < 0.4:
            lg.blocked = [Blocked(rng.randint(1, 4), team=rng.choice(teams), row=2)]
        if rng.random() < 0.3:
            rng.choice(fixtures).pin = rng.randint(1, 3)
        if rng.random() < 0.3:
            first, second = rng.sample(fixtures, 2)
            lg.ties = [Tie(first.label, second.label, row=2)]
        k = rng.choice([3, 4])
        model, out = run(lg, k, seed=rng.randint(0, 99))
        ok = [a for a in brute(lg, textbook_graph(lg), k)
              if not check_generator(lg, model.generator, a, k)]
        assert out.status == ("found" if ok else "impossible"), (lg, k, out)
        if ok:
            assert out.assignment in ok
        outcomes[out.status] += 1
    assert outcomes["found"] >= 15 and outcomes["impossible"] >= 15
