"""Number formats on screen, and the startup check that replaces Qt's abort with a sentence."""

import os

os.environ["QT_QPA_PLATFORM"] = "offscreen"

import subprocess  # noqa: E402
import sys  # noqa: E402

import pytest  # noqa: E402

from leaguegrid.app import bridge
from leaguegrid.core import wording as numbers
from leaguegrid.engine import Estimate  # noqa: E402
from leaguegrid.gui import startup  # noqa: E402


def test_exact_counts_are_grouped_and_huge_ones_get_a_short_form():
    assert numbers.cell_text(161280) == "161,280"
    assert numbers.cell_text(0) == "0"
    assert numbers.cell_text(10**15) == "1,000,000,000,000,000"
    huge = 12345678901234567890123
    assert numbers.cell_text(huge) == "1.23 × 10²² (23 digits)"
    assert numbers.full_text(huge) == "12,345,678,901,234,567,890,123"
    assert numbers.cell_text(None) == "not computed"


def test_estimates_are_always_labelled_as_estimates():
    est = Estimate(value=2.5e30, low=1.0e30, high=4.0e30, method="sampling")
    assert numbers.cell_text(est) == "≈ 1.00 × 10³⁰–4.00 × 10³⁰ (estimate)"
    assert "not an exact count" in numbers.full_text(est)


def test_scientific_rounds_up_across_a_power_of_ten():
    assert numbers.scientific(99999) == "1.00 × 10⁵"
    assert numbers.scientific(-1234) == "-1.23 × 10³"


def test_missing_display_is_one_sentence_naming_the_fix_and_the_commands():
    text = startup.static_problem({}, platform="linux")
    assert text is not None
    assert text.count(". ") == 0 and text.endswith(".")
    assert "DISPLAY is not set" in text
    assert "leaguegrid check, count, plan, whatif" in text


def test_missing_libraries_are_named_with_apt_and_dnf_lines(monkeypatch):
    monkeypatch.setattr(startup, "_loadable", lambda soname: soname != "libxcb-cursor.so.0")
    text = startup.static_problem({"DISPLAY": ":0"}, platform="linux")
    assert text == (
        "The LeagueGrid window cannot start because the system libraries libxcb-cursor0 are "
        "missing: install with `sudo apt-get install libxcb-cursor0` (Debian/Ubuntu) or "
        "`sudo dnf install xcb-util-cursor` (Fedora); the command-line commands (leaguegrid "
        "check, count, plan, whatif) keep working without a window.")


def test_nothing_to_report_off_linux_or_when_all_is_there(monkeypatch):
    assert startup.static_problem({}, platform="win32") is None
    monkeypatch.setattr(startup, "_loadable", lambda soname: True)
    assert startup.static_problem({"DISPLAY": ":0"}, platform="linux") is None
    assert startup.static_problem({"QT_QPA_PLATFORM": "offscreen"}, platform="linux") is None


@pytest.mark.skipif(not sys.platform.startswith("linux"), reason="the X11 check is Linux-only")
def test_run_returns_1_with_a_sentence_instead_of_an_abort_when_no_display():
    env = {k: v for k, v in os.environ.items()
           if k not in ("DISPLAY", "WAYLAND_DISPLAY", "QT_QPA_PLATFORM")}
    done = subprocess.run(
        [sys.executable, "-c",
         "import sys; from leaguegrid.gui.app import run; sys.exit(run(None))"],
        capture_output=True, text=True, env=env, timeout=120, check=False,
        cwd=os.path.dirname(os.path.dirname(os.path.dirname(os.path.abspath(__file__)))))
    assert done.returncode == 1
    lines = [ln for ln in done.stderr.splitlines() if ln.strip()]
    assert len(lines) == 1
    assert lines[0].startswith("The LeagueGrid window cannot start")
    assert "keep working" in lines[0]


def test_long_work_is_announced_against_the_budget():
    assert bridge.long_work_text(None, 60) is None  # no guess, nothing said
    assert bridge.long_work_text(3.0, 60) is None  # a blink
    assert bridge.long_work_text(40.0, 60) == "Counting; this may take about 40 s (Esc cancels)"
    assert bridge.long_work_text(420.0, 60) == (
        "Counting; the exact work may take longer than the 60 s allowed: what does not finish "
        "in time is shown as a labelled estimate (Esc cancels)")
    assert bridge.long_work_text(420.0, None) == (
        "Counting; this may take about 420 s (Esc cancels)")
