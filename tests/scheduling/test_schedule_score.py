"""Score terms on tiny schedules checked by hand, the haversine distance against the textbook
formula, and best-of weighing terms by their mean over the draws."""

from __future__ import annotations

import datetime as dt
import math

import pytest
from schedule_helpers import fx, make_league

from leaguegrid.core.model import RoundInfo, Schedule, Venue
from leaguegrid.scheduling.score import (
    EARTH_RADIUS_KM,
    best_of,
    haversine_km,
    parse_terms,
    score_terms,
)


def tiny():
    """Ash, Birch and Cedar meet once each over four rounds (round 3 is empty)."""
    lg = make_league([fx("Ash", "Birch", "North"), fx("Cedar", "Ash", "South"),
                      fx("Cedar", "Birch", "West")])
    s = Schedule(4, {"Ash v Birch": 1, "Cedar v Ash": 2, "Cedar v Birch": 4})
    return lg, s


def value(lg, s, name):
    (t,) = score_terms(lg, s, [name])
    return t


def test_balance_by_hand():
    t = value(*tiny(), "balance")
    # counts 1, 1, 0, 1 against the mean 3/4: 3 x 0.25 + 0.75
    assert t.value == pytest.approx(1.5)
    assert t.explanation == "fixtures per round range from 0 to 1, mean 0.75"


def test_alternation_by_hand():
    t = value(*tiny(), "alternation")
    # Ash H then A; Birch A, A; Cedar H, H
    assert t.value == 2
    assert t.explanation == ("2 times a team played home twice or away twice in a row; "
                             "most: Cedar (1)")


def test_spread_by_hand():
    t = value(*tiny(), "spread")
    # two games each in 4 rounds: even gap 2; Ash 1->2 (off 1), Birch 1->4 (off 1), Cedar 2->4
    assert t.value == pytest.approx(2.0)
    assert t.explanation.endswith("most: Birch (1 rounds)")


def test_rest_by_hand():
    t = value(*tiny(), "rest")
    assert t.value == 1
    assert t.explanation == "1 times a team played in two adjacent rounds; most: Ash (1)"


def test_slots_only_when_rounds_are_time_slots():
    lg, s = tiny()
    assert not value(lg, s, "slots").applicable
    lg.rounds = [RoundInfo(r, dt.date(2025, 5, 3), dt.time(8 + r)) for r in range(1, 5)]
    t = value(lg, s, "slots")
    # middle slot 2.5; averages Ash 1.5, Birch 2.5, Cedar 3
    assert t.applicable and t.value == pytest.approx(1.5)
    assert t.explanation == ("each team's average slot against the middle slot 2.5; "
                             "most: Ash (1 slots off)")


def test_haversine_matches_the_arc_length_formula():
    # textbook: on a great circle an arc of angle theta has length R x theta
    assert haversine_km(0, 0, 0, 1) == pytest.approx(2 * math.pi * EARTH_RADIUS_KM / 360)
    assert haversine_km(0, 0, 90, 0) == pytest.approx(math.pi * EARTH_RADIUS_KM / 2)
    assert haversine_km(51.5, -0.1, 51.5, -0.1) == 0


def test_travel_from_the_distances_sheet_and_positions():
    lg, s = tiny()
    assert not value(lg, s, "travel").applicable
    lg.distances = {("North", "South"): 10.0, ("West", "South"): 4.0}
    lg.venues = {"North": Venue("North", latitude=0.0, longitude=0.0),
                 "West": Venue("West", latitude=0.0, longitude=1.0)}
    t = value(lg, s, "travel")
    one_degree = 2 * math.pi * EARTH_RADIUS_KM / 360
    # Ash North -> South 10 km (sheet); Birch North -> West by position; Cedar South -> West
    # 4 km (sheet, listed the other way round)
    assert t.value == pytest.approx(10 + one_degree + 4)
    assert t.explanation == (f"{10 + one_degree + 4:.1f} km between the grounds of consecutive "
                             f"fixtures; most: Birch ({one_degree:.1f} km)")


def test_travel_reports_moves_with_no_known_distance():
    lg, s = tiny()
    lg.distances = {("North", "South"): 10.0}
    t = value(lg, s, "travel")
    assert t.value == 10
    assert t.explanation.endswith("; 2 moves had no known distance and count 0")


def test_best_of_divides_each_term_by_its_mean_and_keeps_the_lowest():
    lg, s = tiny()
    other = Schedule(4, {"Ash v Birch": 1, "Cedar v Ash": 3, "Cedar v Birch": 4})
    # other: balance 1.5, rest: Cedar 3 -> 4 adjacent = 1; s: balance 1.5, rest 1
    # spread: other Ash 1->3 (0), Birch 1->4 (1), Cedar 3->4 (1) = 2; s = 2
    third = Schedule(4, {"Ash v Birch": 1, "Cedar v Ash": 3, "Cedar v Birch": 2})
    # third: rest Ash 1->3 no, Birch 1->2 yes, Cedar 2->3 yes = 2
    best = best_of(lg, [third, s, other], {"rest": 2.0})
    assert [c.terms[0].value for c in best.cards] == [2, 1, 1]
    assert best.card.means == {"rest": pytest.approx(4 / 3)}
    assert [c.total for c in best.cards] == pytest.approx([3.0, 1.5, 1.5])
    assert best.index == 1 and best.schedule is s
    assert best.card.lines() == [
        "rest: 1.00 times (1 times a team played in two adjacent rounds; most: Ash (1)); the 3 "
        "schedules averaged 1.33 x weight 2 -> 1.500",
        "total: 1.500 (lower is better)",
    ]


def test_parse_terms():
    assert parse_terms("balance, travel:0.5") == {"balance": 1.0, "travel": 0.5}
    assert parse_terms("Rest=2") == {"rest": 2.0}
    with pytest.raises(ValueError, match="unknown score term 'speed'; terms: balance, "
                                         "alternation, spread, slots, rest, travel"):
        parse_terms("speed")
    with pytest.raises(ValueError, match="the weight of rest must be a number, not 'x'"):
        parse_terms("rest:x")
    with pytest.raises(ValueError, match="no score terms given"):
        parse_terms(" , ")
