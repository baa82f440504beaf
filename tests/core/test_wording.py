"""One wording for counts and plurals, whichever front end shows them."""

from __future__ import annotations

from leaguegrid.core import wording
from leaguegrid.engine import Estimate


def test_plurals_are_spelled_out() -> None:
    assert wording.plural(1, "round") == "1 round"
    assert wording.plural(2, "round") == "2 rounds"
    assert wording.plural(0, "clash", "clashes") == "0 clashes"


def test_a_long_exact_count_keeps_every_digit_and_gains_the_short_form() -> None:
    n = 12_345_678_901_234_567_890_123
    assert wording.full_text(n) == "12,345,678,901,234,567,890,123"
    assert wording.count_text(n) == "12,345,678,901,234,567,890,123 (about 1.23 × 10²²)"
    assert wording.cell_text(n) == "1.23 × 10²² (23 digits)"
    assert wording.count_text(161280) == wording.cell_text(161280) == "161,280"


def test_an_estimate_always_says_so() -> None:
    est = Estimate(2 * 10**30, 10**30, 4 * 10**30, "sequential importance sampling")
    assert wording.full_text(est) == wording.count_text(est) == (
        "estimate by sequential importance sampling: between 1.00 × 10³⁰ and 4.00 × 10³⁰, "
        "about 2.00 × 10³⁰; not an exact count")
    assert wording.cell_text(est) == "≈ 1.00 × 10³⁰–4.00 × 10³⁰ (estimate)"
    assert wording.count_text(None) == "not computed"


def test_changes_read_as_times_as_many() -> None:
    """Issue 12: what-if as a ratio ("3.2 × as many schedules", "no change")."""
    assert wording.times_text(3_200_000_000, 1_000_000_000) == "3.2 × as many schedules"
    assert wording.times_text(250, 1000) == "4 × fewer schedules"
    assert wording.times_text(7, 7) == "no change"
    assert wording.times_text(0, 7) == "none left"
    assert wording.gained_text(2_200_000_000) == "+2,200,000,000 schedules"
    assert wording.gained_text(1) == "+1 schedule"
    assert wording.gained_text(0) == "0 schedules"


def test_a_round_reads_its_date_and_time_as_one() -> None:
    import datetime as dt

    from leaguegrid.core.wording import when_text

    assert when_text(dt.date(2025, 9, 6), dt.time(10, 30)) == "2025-09-06 10:30"  # ISO 8601
    assert when_text(dt.date(2025, 9, 6), None) == "2025-09-06"
    assert when_text(None, dt.time(9, 5)) == "09:05"
    assert when_text(None, None) == ""


def test_printed_pages_read_plainly() -> None:
    assert wording.page_text(3, 12) == "Page 3 of 12"
    assert wording.continued("Venue Tarn Field") == "Venue Tarn Field (continued)"
    assert wording.season_totals(9, 8, 1) == "9 home games, 8 away games, 1 bye"
    assert wording.season_totals(1, 1, 0) == "1 home game, 1 away game, 0 byes"
