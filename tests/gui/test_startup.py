"""The startup check that replaces Qt's abort with a sentence."""

import os

os.environ["QT_QPA_PLATFORM"] = "offscreen"

import subprocess  # noqa: E402
import sys  # noqa: E402

import pytest  # noqa: E402

from leaguegrid.gui import startup  # noqa: E402


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
