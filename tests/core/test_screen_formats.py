"""Counts as the window and the exports show them: exact digits grouped, a short form for huge
ones, estimates always labelled; long work announced against the budget."""

from leaguegrid.app.defaults import LONG_WORK_SECONDS
from leaguegrid.core import wording
from leaguegrid.engine import Estimate


def test_exact_counts_are_grouped_and_huge_ones_get_a_short_form():
    assert wording.cell_text(161280) == "161,280"
    assert wording.cell_text(0) == "0"
    assert wording.cell_text(10**15) == "1,000,000,000,000,000"
    huge = 12345678901234567890123
    assert wording.cell_text(huge) == "1.23 × 10²² (23 digits)"
    assert wording.full_text(huge) == "12,345,678,901,234,567,890,123"
    assert wording.cell_text(None) == "not computed"


def test_estimates_are_always_labelled_as_estimates():
    est = Estimate(value=2.5e30, low=1.0e30, high=4.0e30, method="sampling")
    assert wording.cell_text(est) == "≈ 1.00 × 10³⁰–4.00 × 10³⁰ (estimate)"
    assert wording.full_text(est) == (
        "estimate ~2.50e30: between 1.0e30 and 4.0e30 (sampling); not an exact count")


def test_scientific_rounds_up_across_a_power_of_ten():
    assert wording.scientific(99999) == "1.00 × 10⁵"
    assert wording.scientific(-1234) == "-1.23 × 10³"


def test_long_work_is_announced_against_the_budget():
    assert wording.long_work_text(None, 60, LONG_WORK_SECONDS) is None  # no guess, nothing said
    assert wording.long_work_text(3.0, 60, LONG_WORK_SECONDS) is None  # a blink
    assert wording.long_work_text(40.0, 60, LONG_WORK_SECONDS) == (
        "Counting; this may take about 40 s (Esc cancels)")
    assert wording.long_work_text(420.0, 60, LONG_WORK_SECONDS) == (
        "Counting; the exact work may take longer than the 60 s allowed: what does not finish "
        "in time is shown as a labelled estimate (Esc cancels)")
    assert wording.long_work_text(420.0, None, LONG_WORK_SECONDS) == (
        "Counting; this may take about 420 s (Esc cancels)")
