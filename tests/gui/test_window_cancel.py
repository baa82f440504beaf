"""A long count cancelled from the window, which keeps answering all the while.

While the engine process counts, timers posted to the window's event loop still run (the
window is not frozen); Cancel ends the job and every view says so. How long the event loop
may wait is measured by `python -m benchmarks.bench --mode window`, not asserted here.
"""

import os

os.environ["QT_QPA_PLATFORM"] = "offscreen"

from pathlib import Path  # noqa: E402

from PySide6.QtCore import QTimer  # noqa: E402

BIG = Path(__file__).resolve().parents[2] / "demo_leagues" / "bigseason.xlsx"


def test_cancel_long_count_from_the_window_without_freezing(qtbot, window, settings):
    settings.setValue("countBudget", 600)
    window.open_path(str(BIG))
    qtbot.waitUntil(lambda: window.runner.current_name == "Counting", timeout=30_000)
    answered: list[bool] = []
    for turn in range(1, 4):
        QTimer.singleShot(0, lambda: answered.append(window.runner.busy))
        qtbot.waitUntil(lambda n=turn: len(answered) == n, timeout=10_000)
    assert answered == [True, True, True]  # the event loop ran while the count was still going
    assert window.cancel_button.isVisible()
    window.act_cancel.trigger()
    qtbot.waitUntil(lambda: not window.runner.busy, timeout=15_000)
    assert window.report is None
    assert window.stage_label.text() == "Counting: cancelled."
    assert not window.cancel_button.isVisible()
