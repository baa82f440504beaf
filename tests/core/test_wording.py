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
        "estimate ~2.00e30: between 1.0e30 and 4.0e30 (sequential importance sampling); "
        "not an exact count")
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


def sampled(value: int, low: int, high: int, samples: int = 2000, found: int = 1800) -> Estimate:
    return Estimate(value, low, high, "sequential importance sampling", samples, found)


def test_an_estimate_gives_its_interval_confidence_and_samples_in_words() -> None:
    est = sampled(2_430_000 * 10**36, 21 * 10**41, 34 * 10**41, samples=4000)
    assert wording.estimate_text(est) == (
        "estimate ~2.43e42: between 2.1e42 and 3.4e42, 95% confidence, from 4,000 samples")
    assert wording.estimate_marker(est) == "estimate ~2.43e42"
    assert wording.rough(9_999) == "9,999" and wording.rough(99_950) == "1.00e5"


def test_a_trivial_low_end_says_too_few_samples() -> None:
    # the 10 x 10 grid at 3 rounds once read "likely between 1 and 3.71e+20" for 5.08e20
    est = sampled(2 * 10**20, 1, 37 * 10**19, found=1500)
    assert est.too_few
    assert wording.estimate_text(est) == (
        "estimate ~2.00e20: too few samples for an interval (1,500 of 2,000 found one)")
    assert sampled(5000, 10, 9000, found=12).too_few  # fewer than 20 draws found one


def test_no_sample_finding_one_says_so_instead_of_an_interval() -> None:
    est = sampled(0, 0, 6 * 10**57, found=0)
    assert wording.estimate_text(est) == "no estimate: none of 2,000 samples found one"
    assert wording.estimate_marker(est) == "no estimate"
    assert wording.estimate_note(8, "schedules", est) == (
        "8 rounds, schedules: no estimate: none of 2,000 samples found one")


def test_estimate_lines_stay_within_a_hundred_characters() -> None:
    widest = sampled(99_949 * 10**995, 99 * 10**996, 99 * 10**997, samples=2_000_000)
    for label in ("schedules", "every round", "groupings"):
        line = wording.estimate_line(label, widest)
        assert len(line) <= wording.LINE_CHARS == 100
        assert "estimate ~9.99e999" in line and "95% confidence" in line


def test_incomplete_says_the_true_reason() -> None:
    assert wording.incomplete_text(False, ["memory bound"]) == (
        "Incomplete: stopped at the memory bound; 'not computed' and estimates are not exact.")
    assert wording.incomplete_text(False, ["budget", "memory bound"]).startswith(
        "Incomplete: stopped at the budget and at the memory bound;")
    assert wording.incomplete_text(True, ["budget"]).startswith("Incomplete: cancelled;")
