"""A long computation cancelled from the window, which stays responsive all the while.

The latency probe is a 10 ms QTimer in the GUI thread; the largest gap between its ticks while
the engine works in the worker thread is how long the window could not react. The 1 s bound is
generous on purpose (a loaded 2-core machine); the real figure is in /work/notes/gui.md.
"""

import os

os.environ["QT_QPA_PLATFORM"] = "offscreen"

import time  # noqa: E402
from pathlib import Path  # noqa: E402

from benchmarks.latency import LatencyProbe  # noqa: E402

BIG = Path(__file__).resolve().parents[2] / "demo_leagues" / "bigseason.xlsx"


def test_cancel_long_count_from_the_window_without_freezing(qtbot, window, settings):
    settings.setValue("countBudget", 600)
    probe = LatencyProbe(10)
    window.open_path(str(BIG))
    qtbot.waitUntil(lambda: window.runner.current_name == "Counting", timeout=30_000)
    probe.start()
    qtbot.wait(2000)
    assert window.runner.busy
    assert window.cancel_button.isVisible()
    asked = time.perf_counter()
    window.act_cancel.trigger()
    qtbot.waitUntil(lambda: not window.runner.busy, timeout=15_000)
    stopped_after = time.perf_counter() - asked
    largest = probe.stop()
    print(f"\nlatency probe: largest gap {largest * 1000:.0f} ms, 99th percentile "
          f"{probe.percentile(0.99) * 1000:.0f} ms over {probe.ticks} ticks; "
          f"cancel took {stopped_after:.2f} s")
    assert probe.ticks > 50
    assert largest < 1.0
    assert window.report is None
    assert window.stage_label.text() == "Counting: cancelled."
    assert not window.cancel_button.isVisible()
