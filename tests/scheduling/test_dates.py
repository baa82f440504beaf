"""Round dates from the Rounds sheet or Settings, the time zone, and dated schedule rows."""

from __future__ import annotations

import datetime as dt
import zoneinfo

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from leaguegrid.core.dated import natural_key
from leaguegrid.core.model import Fixture, League, RoundInfo, Schedule, Settings
from leaguegrid.scheduling.dates import (
    DatesError,
    dated_fixtures,
    league_time_zone,
    round_dates,
)

D = dt.date


def league_with(settings_: Settings | None = None, rounds=(), fixed=False, fixtures=()) -> League:
    return League(
        name="Test League",
        source="",
        fixtures=list(fixtures),
        rounds=list(rounds),
        rounds_fixed=fixed,
        settings=settings_ or Settings(),
    )


def test_numbers_only_without_rounds_sheet_or_start_date():
    assert round_dates(league_with(), 3) == [RoundInfo(1), RoundInfo(2), RoundInfo(3)]


def test_start_date_and_spacing():
    lg = league_with(Settings(start_date=D(2025, 9, 6), every_days=7))
    assert [r.date for r in round_dates(lg, 4)] == [
        D(2025, 9, 6), D(2025, 9, 13), D(2025, 9, 20), D(2025, 9, 27)
    ]
    assert all(r.time is None for r in round_dates(lg, 4))


def test_skipped_date_moves_that_round_and_every_later_round_one_step():
    lg = league_with(
        Settings(start_date=D(2025, 9, 6), every_days=7, skip=(D(2025, 9, 13), D(2025, 9, 27)))
    )
    assert [r.date for r in round_dates(lg, 4)] == [
        D(2025, 9, 6), D(2025, 9, 20), D(2025, 10, 4), D(2025, 10, 11)
    ]


def test_consecutive_skips_and_a_skipped_start():
    lg = league_with(
        Settings(start_date=D(2025, 1, 1), every_days=2, skip=(D(2025, 1, 1), D(2025, 1, 3)))
    )
    assert [r.date for r in round_dates(lg, 2)] == [D(2025, 1, 5), D(2025, 1, 7)]


def test_skip_date_between_steps_changes_nothing():
    lg = league_with(Settings(start_date=D(2025, 9, 6), every_days=7, skip=(D(2025, 9, 14),)))
    assert [r.date for r in round_dates(lg, 3)] == [D(2025, 9, 6), D(2025, 9, 13), D(2025, 9, 20)]


def test_rounds_sheet_time_slots_on_one_day():
    day = D(2025, 10, 4)
    rounds = [RoundInfo(1, day, dt.time(9, 0)), RoundInfo(2, day, dt.time(9, 45), "mini pitches")]
    lg = league_with(Settings(start_date=D(2030, 1, 1)), rounds=rounds, fixed=True)
    got = round_dates(lg, 2)
    assert got == rounds
    assert got[1] is not rounds[1]  # copies: callers may not alter the league's rounds


def test_rounds_sheet_lists_every_round_there_is():
    rounds = [RoundInfo(1, D(2025, 10, 4)), RoundInfo(2, D(2025, 10, 11))]
    lg = league_with(rounds=rounds, fixed=True)
    with pytest.raises(DatesError) as err:
        round_dates(lg, 3)
    assert str(err.value) == (
        "the Rounds sheet lists 2 rounds; round 3 is not among them "
        "(ask for at most 2 rounds or add rows to the Rounds sheet)"
    )


def test_listed_rounds_take_precedence_over_generated_ones_when_not_fixed():
    lg = league_with(
        Settings(start_date=D(2025, 9, 6)), rounds=[RoundInfo(2, D(2025, 9, 14), note="Sunday")]
    )
    assert round_dates(lg, 3) == [
        RoundInfo(1, D(2025, 9, 6)),
        RoundInfo(2, D(2025, 9, 14), note="Sunday"),
        RoundInfo(3, D(2025, 9, 20)),
    ]


def test_every_must_be_positive():
    with pytest.raises(DatesError, match="Every must be a whole number of days of at least 1"):
        round_dates(league_with(Settings(start_date=D(2025, 1, 1), every_days=0)), 1)


@settings(max_examples=200, deadline=None)
@given(
    start=st.dates(min_value=D(2000, 1, 1), max_value=D(2090, 1, 1)),
    every=st.integers(1, 14),
    skipped_steps=st.sets(st.integers(0, 40), max_size=15),
    k=st.integers(0, 25),
)
def test_generated_dates_property(start, every, skipped_steps, k):
    """Dates are steps of `every` from the start, never skipped, and the earliest such steps."""
    skip = tuple(start + dt.timedelta(days=every * s) for s in skipped_steps)
    lg = league_with(Settings(start_date=start, every_days=every, skip=skip))
    dates = [r.date for r in round_dates(lg, k)]
    steps = [(d - start).days // every for d in dates]
    assert all((d - start).days % every == 0 for d in dates)
    assert not set(dates) & set(skip)
    expected = [s for s in range(k + len(skipped_steps)) if s not in skipped_steps][:k]
    assert steps == expected


def test_time_zone_from_settings():
    tz = league_time_zone(league_with(Settings(time_zone=" Europe/Madrid ")))
    assert isinstance(tz, zoneinfo.ZoneInfo) and tz.key == "Europe/Madrid"


def test_unknown_time_zone_is_a_clear_error():
    with pytest.raises(DatesError) as err:
        league_time_zone(league_with(Settings(time_zone="Mars/Olympus")))
    assert str(err.value) == (
        "unknown time zone 'Mars/Olympus' in Settings: give an IANA name such as "
        "'Europe/Madrid' or 'America/Chicago'"
    )


def test_default_time_zone_is_the_computers(monkeypatch):
    monkeypatch.setenv("TZ", "Asia/Tokyo")
    tz = league_time_zone(league_with())
    assert getattr(tz, "key", None) == "Asia/Tokyo"


def _two_fixture_league() -> League:
    fixtures = [Fixture("A v B", "A", "B", division="D1"), Fixture("C v D", "C", "D")]
    return league_with(Settings(start_date=D(2025, 9, 6)), fixtures=fixtures)


def test_dated_fixtures_sorted_by_round_with_dates():
    rows = dated_fixtures(_two_fixture_league(), Schedule(3, {"A v B": 3, "C v D": 1}))
    assert [(r.fixture.label, r.round.number, r.round.date) for r in rows] == [
        ("C v D", 1, D(2025, 9, 6)),
        ("A v B", 3, D(2025, 9, 20)),
    ]


@pytest.mark.parametrize(
    ("assignment", "message"),
    [
        ({"A v B": 1}, "the schedule does not match the league: no round for C v D"),
        (
            {"A v B": 1, "C v D": 2, "E v F": 1},
            "the schedule does not match the league: unknown fixtures E v F",
        ),
        ({"A v B": 1, "C v D": 4}, "fixture 'C v D' is in round 4, outside 1..3"),
    ],
)
def test_dated_fixtures_rejects_a_schedule_that_does_not_fit(assignment, message):
    with pytest.raises(DatesError) as err:
        dated_fixtures(_two_fixture_league(), Schedule(3, assignment))
    assert str(err.value) == message


def test_rows_of_a_round_in_natural_division_and_pitch_order():
    fixtures = [
        Fixture("E v F", "E", "F", "Park", "Pitch 10", "U10"),
        Fixture("A v B", "A", "B", "Park", "Pitch 2", "U8"),
        Fixture("C v D", "C", "D", "Park", "Pitch 1", "U10"),
    ]
    lg = league_with(fixtures=fixtures)
    rows = dated_fixtures(lg, Schedule(1, {"A v B": 1, "C v D": 1, "E v F": 1}))
    assert [r.fixture.label for r in rows] == ["A v B", "C v D", "E v F"]
    assert sorted(["u10", "U9", "U10", "Pitch 2", "pitch 10"], key=natural_key) == [
        "Pitch 2", "pitch 10", "U9", "U10", "u10"
    ]
