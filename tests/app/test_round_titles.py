"""The schedule grid's round titles (app.planning.round_titles): a round's date and time under
its number, as the league gives them; dates worked out by hand on a calendar."""

from __future__ import annotations

import datetime as dt

from leaguegrid.app import planning
from leaguegrid.core.model import League, RoundInfo, Settings


def test_rounds_sheet_dates_and_times_go_under_the_round_number() -> None:
    league = League("L", "l.xlsx", [], rounds=[
        RoundInfo(1, dt.date(2026, 4, 4), dt.time(10, 0)), RoundInfo(2, dt.date(2026, 4, 11)),
        RoundInfo(3, None, dt.time(9, 30))], rounds_fixed=True)
    assert planning.round_titles(league, 3) == [
        "Round 1\n2026-04-04 10:00", "Round 2\n2026-04-11", "Round 3\n09:30"]


def test_a_start_date_every_seven_days_dates_every_round() -> None:
    league = League("L", "l.xlsx", [], settings=Settings(start_date=dt.date(2026, 9, 5)))
    # 5 September 2026 and every 7 days after it: 12 and 19 September (by hand).
    assert planning.round_titles(league, 3) == [
        "Round 1\n2026-09-05", "Round 2\n2026-09-12", "Round 3\n2026-09-19"]


def test_rounds_past_the_rounds_sheet_or_without_dates_are_numbers_only() -> None:
    assert planning.round_titles(League("L", "l.xlsx", []), 2) == ["Round 1", "Round 2"]
    short = League("L", "l.xlsx", [], rounds=[RoundInfo(1, dt.date(2026, 4, 4))],
                   rounds_fixed=True)
    assert planning.round_titles(short, 2) == ["Round 1", "Round 2"]
