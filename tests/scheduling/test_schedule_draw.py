"""Planning: exact uniform draws (seeded, reproducible), rules kept by rejection with the share
reported, the search as fallback, and impossibility named."""

from __future__ import annotations

import itertools
import math
import random
from collections import Counter

from schedule_helpers import brute, fx, make_league, round_robin, textbook_graph

from leaguegrid import engine
from leaguegrid.core.model import Blocked, Settings, Tie
from leaguegrid.scheduling.check import check_schedule
from leaguegrid.scheduling.constraints import build_model
from leaguegrid.scheduling.draw import draw_many, fresh_seed, plan
from leaguegrid.scheduling.rules import check_generator
from leaguegrid.scheduling.score import best_of

FOUR = ["Ash", "Birch", "Cedar", "Daisy"]


def chi2_survival(x: float, df: int) -> float:
    """P(X > x) for chi-square with df degrees of freedom: 1 - P(df/2, x/2), the regularized
    lower incomplete gamma by its series (textbook: Abramowitz and Stegun 6.5.29)."""
    a, z = df / 2, x / 2
    term = total = 1 / a
    n = 0
    while term > 1e-15 * total:
        n += 1
        term *= z / (a + n)
        total += term
    return 1 - math.exp(a * math.log(z) - z - math.lgamma(a)) * total


def test_chi2_survival_matches_the_closed_form_for_two_degrees_of_freedom():
    # textbook: for 2 degrees of freedom P(X > x) = exp(-x / 2)
    assert abs(chi2_survival(3.0, 2) - math.exp(-1.5)) < 1e-12


def test_plan_without_rules_is_a_valid_uniform_draw():
    lg = make_league(round_robin(FOUR))
    g = textbook_graph(lg)
    out = plan(lg, g, 4, seed=17)
    assert out.status == "found"
    s = out.schedule
    assert check_schedule(lg, g, s) == []
    assert out.assignments == s.assignments == len(brute(lg, g, 4))
    assert (s.seed, s.method, s.rounds) == (17, "uniform", 4)
    assert s.notes == [f"drawn uniformly from all {out.assignments:,} valid schedules"]
    assert s.rules_counted == ["clashes: 12 pairs of fixtures never share a round"]
    assert s.rules_generator == []


def test_same_seed_same_schedule_and_seeds_differ():
    lg = make_league(round_robin(FOUR))
    g = textbook_graph(lg)
    first = plan(lg, g, 5, seed=99).schedule.assignment
    assert plan(lg, g, 5, seed=99).schedule.assignment == first
    seen = {tuple(sorted(plan(lg, g, 5, seed=s).schedule.assignment.items())) for s in range(6)}
    assert len(seen) >= 2


def test_fresh_seeds_are_whole_numbers_that_vary():
    seeds = {fresh_seed() for _ in range(8)}
    assert all(isinstance(s, int) and 0 <= s < 2**32 for s in seeds)
    assert len(seeds) > 1


def test_draws_with_ties_pins_and_blocked_rounds_are_uniform():
    """Every valid assignment (brute force) appears, and the frequencies pass chi-square."""
    fixtures = [fx("Ash", "Birch"), fx("Cedar", "Daisy"), fx("Ash", "Cedar"), fx("Birch", "Elm")]
    lg = make_league(fixtures)
    lg.ties = [Tie("Cedar v Daisy", "Birch v Elm", row=2)]
    lg.fixtures[0].pin = 2
    lg.blocked = [Blocked(3, team="Cedar", row=2)]
    g = textbook_graph(lg)
    valid = brute(lg, g, 6)
    model = build_model(lg, g, 6)
    # by hand: the tied pair and Ash v Cedar each take one of rounds 1, 4, 5, 6, differently
    assert model.count() == len(valid) == 4 * 3
    drawn = draw_many(model, random.Random(5), 2000)
    keys = Counter(tuple(sorted(a.items())) for a in drawn)
    assert set(keys) == {tuple(sorted(a.items())) for a in valid}
    expected = len(drawn) / len(valid)
    stat = sum((c - expected) ** 2 / expected for c in keys.values())
    assert chi2_survival(stat, len(valid) - 1) > 0.001


def test_rules_kept_by_rejection_and_the_share_reported():
    lg = make_league(round_robin(FOUR, legs=2),
                     settings=Settings(legs=2, max_home_run=2, max_away_run=2))
    g = textbook_graph(lg)
    out = plan(lg, g, 6, seed=3, rule_draws=50)
    model = build_model(lg, g, 6)
    again = draw_many(model, random.Random(3), 50)
    met = [a for a in again if not check_generator(lg, model.generator, a, 6)]
    assert out.status == "found" and out.draws == 50 and out.draws_met == len(met) > 0
    assert out.schedule.assignment == met[0]
    assert out.schedule.notes == [
        f"{len(met)} of 50 draws met every rule",
        f"drawn uniformly from all {out.assignments:,} valid schedules and kept as the first "
        "to meet every rule",
    ]
    assert out.schedule.rules_generator == [
        "most home games in a row: no team plays more than 2 home fixtures in a row",
        "most away games in a row: no team plays more than 2 away fixtures in a row",
    ]
    assert check_schedule(lg, g, out.schedule) == []


def test_search_takes_over_when_no_draw_meets_the_rules():
    """Round balance 0 with six unrelated fixtures over six rounds: 6!/6^6 of draws meet it."""
    lg = make_league([fx(f"T{2 * i}", f"T{2 * i + 1}") for i in range(6)],
                     settings=Settings(round_balance=0))
    g = textbook_graph(lg)
    seed = next(s for s in range(50) if plan(lg, g, 6, seed=s, rule_draws=3).draws_met == 0)
    out = plan(lg, g, 6, seed=seed, rule_draws=3)
    assert out.status == "found" and out.schedule.method == "search"
    assert sorted(out.schedule.assignment.values()) == [1, 2, 3, 4, 5, 6]
    assert out.schedule.notes == [
        "0 of 3 draws met every rule",
        "no uniform draw met every rule",
        "1 schedule came from the rule search, which is not uniform",
    ]
    assert plan(lg, g, 6, seed=seed, rule_draws=3).schedule.assignment == \
        out.schedule.assignment


def test_too_few_rounds_is_impossible_and_says_the_fewest():
    lg = make_league(round_robin(FOUR))
    out = plan(lg, textbook_graph(lg), 2, seed=1)
    assert out.status == "impossible" and out.schedule is None
    assert out.reasons == [
        "no valid assignment of the fixtures to 2 rounds exists: the clashes need at least "
        "3 rounds"
    ]


def test_too_few_rounds_with_blocked_rounds_says_so():
    lg = make_league(round_robin(FOUR))
    lg.blocked = [Blocked(1, team="Ash", row=2)]
    out = plan(lg, textbook_graph(lg), 3, seed=1)
    assert out.reasons == [
        "no valid assignment of the fixtures to 3 rounds exists: the clashes with the blocked "
        "rounds need at least 4 rounds"
    ]


def test_contradiction_and_generator_proof_are_impossible():
    lg = make_league(round_robin(FOUR))
    lg.fixtures[0].pin = 7
    assert plan(lg, textbook_graph(lg), 4, seed=1).reasons == [
        "Ash v Birch is pinned to round 7, but there are only 4 rounds"
    ]
    lg = make_league(round_robin(FOUR), settings=Settings(round_balance=0))
    out = plan(lg, textbook_graph(lg), 4, seed=1)
    assert out.status == "impossible"
    assert out.reasons == [
        "round balance: with a difference of at most 0, 6 fixtures cannot be spread over 4 "
        "rounds (at most 1 a round)"
    ]


def test_budget_spent_is_its_own_outcome():
    lg = make_league(round_robin(FOUR))
    out = plan(lg, textbook_graph(lg), 4, seed=1,
               hooks=engine.Hooks(budget=0, clock=itertools.count().__next__))
    assert out.status == "budget" and out.schedule is None
    assert out.reasons == ["the exact count did not finish within its share of the budget, so "
                           "no uniform draw was made"]


def _stopped(*args, **kwargs):
    raise engine.BudgetExceeded("budget")


def test_count_beyond_its_share_hands_over_to_the_search(monkeypatch):
    lg = make_league(round_robin(FOUR), settings=Settings(max_home_run=2))
    g = textbook_graph(lg)
    monkeypatch.setattr(engine, "count_assignments", _stopped)
    out = plan(lg, g, 3, seed=2, hooks=engine.Hooks(budget=30))
    assert out.status == "found" and out.schedule.method == "search"
    assert out.assignments is None and out.draws == 0
    assert out.schedule.notes == [
        "the exact count did not finish within its share of the budget, so no uniform draw "
        "was made",
        "1 schedule came from the rule search, which is not uniform",
    ]
    assert check_schedule(lg, g, out.schedule) == []


def test_draws_beyond_their_share_hand_over_to_the_search(monkeypatch):
    lg = make_league(round_robin(FOUR))
    g = textbook_graph(lg)
    monkeypatch.setattr(engine, "sample_assignments", _stopped)
    out = plan(lg, g, 3, seed=2, hooks=engine.Hooks(budget=30))
    assert out.status == "found" and out.schedule.method == "search"
    # K4 has 1 one-factorization (OEIS A000438), in 3! orders of its rounds
    assert out.assignments == 1 * 6
    assert out.schedule.notes[0] == ("the uniform draws did not finish within their share of "
                                     "the budget")


def test_best_of_many_keeps_the_best_scoring_draw():
    lg = make_league(round_robin(FOUR))
    g = textbook_graph(lg)
    out = plan(lg, g, 5, seed=8, draws=30, terms={"balance": 1.0})
    model = build_model(lg, g, 5)
    drawn = draw_many(model, random.Random(8), 30)
    from leaguegrid.core.model import Schedule
    best = best_of(lg, [Schedule(5, a) for a in drawn], {"balance": 1.0})
    assert out.schedule.assignment == drawn[best.index]
    assert out.score.total == best.card.total
    assert min(c.total for c in best.cards) == best.card.total
    assert out.schedule.notes[-1] == f"best of 30 schedules by balance (schedule {best.index + 1})"


def test_too_few_rounds_names_every_extra_constraint():
    lg = make_league(round_robin(FOUR))
    lg.fixtures[0].pin = 1
    lg.ties = [Tie("Ash v Birch", "Cedar v Daisy", row=2)]
    lg.blocked = [Blocked(1, team="Cedar", row=2)]
    out = plan(lg, textbook_graph(lg), 3, seed=1)
    assert out.reasons == [
        "Cedar v Daisy is together with Ash v Birch, pinned to round 1, but team Cedar is "
        "blocked in "
        "round 1 (Blocked row 2)"
    ]
    lg.blocked = [Blocked(2, team="Cedar", row=2)]
    out = plan(lg, textbook_graph(lg), 3, seed=1)
    assert out.reasons == [
        "no valid assignment of the fixtures to 3 rounds exists: the clashes with the pins, "
        "ties and blocked rounds need at least 4 rounds"
    ]
