"""check_schedule names every broken clash and rule; move() edits a schedule and says at once
what the move breaks."""

from __future__ import annotations

import pytest
from schedule_helpers import fx, make_league, textbook_graph

from leaguegrid.core.model import Blocked, ClashRow, Schedule, Settings, Split, Tie, Venue
from leaguegrid.scheduling.check import ScheduleChecker, check_schedule
from leaguegrid.scheduling.edit import move


def league():
    fixtures = [
        fx("Ash", "Birch", "North"),
        fx("Cedar", "Daisy", "South"),
        fx("Ash", "Cedar", "North"),
        fx("Birch", "Daisy", "South"),
    ]
    lg = make_league(fixtures)
    lg.clash_rows = [ClashRow("Ash", "Daisy", "coach Robin", 4,
                              pairs=[("Ash v Birch", "Cedar v Daisy")])]
    return lg


VALID = {"Ash v Birch": 1, "Cedar v Daisy": 2, "Ash v Cedar": 3, "Birch v Daisy": 3}


def test_a_valid_schedule_has_no_violations():
    lg = league()
    s = Schedule(3, dict(VALID))
    assert check_schedule(lg, textbook_graph(lg), s) == []


def test_clash_named_with_every_reason():
    lg = league()
    s = Schedule(3, {"Ash v Birch": 1, "Cedar v Daisy": 1, "Ash v Cedar": 2, "Birch v Daisy": 3})
    (v,) = check_schedule(lg, textbook_graph(lg), s)
    assert (v.rule, v.fixtures, v.rounds) == ("clash", ("Ash v Birch", "Cedar v Daisy"), (1,))
    assert v.message == "Ash v Birch and Cedar v Daisy are both in round 1: coach Robin (row 4)"


def test_team_and_venue_clash_named():
    lg = league()
    s = Schedule(3, {"Ash v Birch": 2, "Cedar v Daisy": 1, "Ash v Cedar": 2, "Birch v Daisy": 3})
    assert [v.message for v in check_schedule(lg, textbook_graph(lg), s)] == [
        "Ash v Birch and Ash v Cedar are both in round 2: team Ash; venue North"
    ]


def test_split_tie_pin_played_blocked_and_range_named():
    lg = league()
    lg.splits = [Split("Ash v Cedar", "Birch v Daisy", "referee Kim", row=2)]
    lg.ties = [Tie("Ash v Birch", "Birch v Daisy", row=3)]
    lg.fixtures[1].pin = 2
    lg.fixtures[2].pin = 3
    lg.fixtures[2].played = True
    lg.blocked = [Blocked(1, team="Birch", reason="camp", row=5)]
    s = Schedule(3, {"Ash v Birch": 1, "Cedar v Daisy": 3, "Ash v Cedar": 2, "Birch v Daisy": 2})
    got = [(v.rule, v.message) for v in check_schedule(lg, textbook_graph(lg), s)]
    assert got == [
        ("split", "Ash v Cedar and Birch v Daisy are both in round 2: referee Kim (row 2)"),
        ("tie", "Ash v Birch and Birch v Daisy must share a round (Together row 3) but are in "
                "rounds 1 and 2"),
        ("blocked", "Ash v Birch is in round 1, but team Birch is blocked in round 1 "
                    "(Blocked row 5: camp)"),
        ("pin", "Cedar v Daisy is in round 3, but it was pinned to round 2"),
        ("played", "Ash v Cedar is in round 2, but it was played in round 3"),
    ]


def test_missing_and_out_of_range_named():
    lg = league()
    s = Schedule(3, {"Ash v Birch": 4, "Cedar v Daisy": 1, "Ash v Cedar": 2, "Nobody v X": 1})
    assert [(v.rule, v.message) for v in check_schedule(lg, textbook_graph(lg), s)] == [
        ("missing", "Nobody v X is not a fixture of this league"),
        ("rounds", "Ash v Birch is in round 4, outside 1..3"),
        ("missing", "Birch v Daisy has no round"),
    ]


def test_return_half_named():
    lg = make_league([fx("Ash", "Birch"), fx("Birch", "Ash", leg=2)],
                     settings=Settings(legs=2, return_half=True))
    s = Schedule(4, {"Ash v Birch": 3, "Birch v Ash": 1})
    assert [(v.rule, v.message) for v in check_schedule(lg, textbook_graph(lg), s)] == [
        ("return half", "Ash v Birch is in round 3, but Return half puts first legs in "
                        "rounds 1..2"),
        ("return half", "Birch v Ash is in round 1, but Return half puts return fixtures in "
                        "rounds 3..4"),
    ]


def test_generator_rules_named():
    fixtures = [fx("Ash", "Birch", "Hub"), fx("Cedar", "Daisy", "Hub"), fx("Elm", "Fir", "Hub"),
                fx("Gorse", "Ash", "Vale")]
    lg = make_league(fixtures, venues={"Hub": Venue("Hub", pitches=2)},
                     settings=Settings(max_away_run=0, round_balance=0))
    s = Schedule(3, {"Ash v Birch": 1, "Cedar v Daisy": 2, "Elm v Fir": 2, "Gorse v Ash": 3})
    g = textbook_graph(lg)
    assert [(v.rule, v.message) for v in check_schedule(lg, g, s)] == [
        ("away run", "team Ash plays 1 away fixture in a row (rounds 3); Most away games in a "
                     "row is 0"),
        ("away run", "team Birch plays 1 away fixture in a row (rounds 1); Most away games in "
                     "a row is 0"),
        ("away run", "team Daisy plays 1 away fixture in a row (rounds 2); Most away games in "
                     "a row is 0"),
        ("away run", "team Fir plays 1 away fixture in a row (rounds 2); Most away games in a "
                     "row is 0"),
        ("balance", "rounds hold 1 to 2 fixtures (round 2: 2, round 1: 1); Round balance "
                    "allows a difference of 0"),
    ]
    s.assignment["Ash v Birch"] = 2
    caps = [v.message for v in check_schedule(lg, g, s) if v.rule == "capacity"]
    assert caps == ["venue Hub holds 3 fixtures in round 2 but has 2 pitches: Ash v Birch, "
                    "Cedar v Daisy, Elm v Fir"]


def test_home_run_named_with_its_rounds():
    fixtures = [fx("Ash", "Birch"), fx("Ash", "Cedar"), fx("Ash", "Daisy"), fx("Elm", "Ash")]
    lg = make_league(fixtures, settings=Settings(max_home_run=2))
    s = Schedule(5, {"Ash v Birch": 1, "Ash v Cedar": 2, "Ash v Daisy": 4, "Elm v Ash": 5})
    (v,) = check_schedule(lg, textbook_graph(lg), s)
    assert v.message == ("team Ash plays 3 home fixtures in a row (rounds 1, 2, 4); "
                         "Most home games in a row is 2")
    assert v.fixtures == ("Ash v Birch", "Ash v Cedar", "Ash v Daisy")


def test_move_that_holds():
    lg = league()
    s = Schedule(4, dict(VALID), seed=4)
    out = move(lg, textbook_graph(lg), s, "Birch v Daisy", 4)
    assert out.holds and out.moved == ("Birch v Daisy",)
    assert out.schedule.assignment["Birch v Daisy"] == 4
    assert out.schedule.method == "edited" and out.schedule.seed == 4
    assert out.schedule.notes == ["edited: Birch v Daisy moved from round 3 to round 4"]
    assert s.assignment["Birch v Daisy"] == 3


def test_move_that_breaks_a_clash_says_which():
    lg = league()
    s = Schedule(3, dict(VALID))
    checker = ScheduleChecker(lg, textbook_graph(lg), 3)
    out = move(lg, textbook_graph(lg), s, "Ash v Cedar", 1, checker=checker)
    assert not out.holds
    assert [v.message for v in out.violations] == [
        "Ash v Birch and Ash v Cedar are both in round 1: team Ash; venue North"
    ]


def test_move_with_ties_carries_the_tied_fixture():
    lg = league()
    lg.ties = [Tie("Ash v Cedar", "Birch v Daisy", row=2)]
    s = Schedule(4, dict(VALID))
    g = textbook_graph(lg)
    alone = move(lg, g, s, "Birch v Daisy", 4)
    assert [v.message for v in alone.violations] == [
        "Ash v Cedar and Birch v Daisy must share a round (Together row 2) but are in rounds 3 "
        "and 4"
    ]
    both = move(lg, g, s, "Birch v Daisy", 4, carry_ties=True)
    assert both.moved == ("Ash v Cedar", "Birch v Daisy")
    assert both.holds
    assert both.schedule.notes == [
        "edited: Birch v Daisy moved from round 3 to round 4 with Ash v Cedar"
    ]


def test_move_of_unknown_fixture_or_bad_round_is_refused():
    lg = league()
    s = Schedule(3, {"Ash v Birch": 1})
    with pytest.raises(KeyError):
        move(lg, textbook_graph(lg), s, "Nobody v X", 2)
    with pytest.raises(ValueError, match="round 0 is not a positive whole number"):
        move(lg, textbook_graph(lg), s, "Ash v Birch", 0)
