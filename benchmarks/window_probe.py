"""The window's responsiveness, measured for the benchmark runner.

    python -m benchmarks.window_probe [LEAGUE] [--seconds 3] [--thread]

Opens LEAGUE (default: demo_leagues/bigseason.xlsx, a long count) in the main window offscreen,
lets counting run for the given seconds while a 10 ms QTimer probe notes the gaps between its
ticks, cancels from the window, and reports the largest gap (target under 200 ms), the 99th
percentile and how long the cancel took. `--thread` runs the engine in a thread instead of the
engine process, for comparison.
"""

from __future__ import annotations

import argparse
import json
import os
import sys
import tempfile
import time
from pathlib import Path

DEFAULT_LEAGUE = Path(__file__).resolve().parents[2] / "demo_leagues" / "bigseason.xlsx"


def measure(league: str | Path = DEFAULT_LEAGUE, seconds: float = 3.0,
            engine_process: bool = True) -> dict[str, float]:
    """Largest gap and 99th percentile (ms) of the event loop while counting, then cancel (s)."""
    os.environ.setdefault("QT_QPA_PLATFORM", "offscreen")
    from PySide6.QtCore import QSettings

    from benchmarks.latency import LatencyProbe
    from leaguegrid.gui.app import create_application
    from leaguegrid.gui.main_window import MainWindow

    app = create_application()
    with tempfile.TemporaryDirectory() as folder:
        settings = QSettings(str(Path(folder) / "s.ini"), QSettings.Format.IniFormat)
        settings.setValue("countBudget", 3600)
        settings.setValue("engineProcess", "true" if engine_process else "false")
        window = MainWindow(settings)
        window.show()
        window.open_path(str(league))

        def spin(until, limit: float) -> None:
            end = time.monotonic() + limit
            while not until() and time.monotonic() < end:
                app.processEvents()
                time.sleep(0.001)

        spin(lambda: window.runner.current_name == "Counting", 60)
        probe = LatencyProbe(10)
        probe.start()
        spin(lambda: not window.runner.busy, seconds)
        asked = time.perf_counter()
        window.act_cancel.trigger()
        spin(lambda: not window.runner.busy, 60)
        cancel_seconds = time.perf_counter() - asked
        largest = probe.stop()
        window.close()
    return {"largest_gap_ms": round(largest * 1000, 1),
            "p99_gap_ms": round(probe.percentile(0.99) * 1000, 1),
            "ticks": probe.ticks, "cancel_seconds": round(cancel_seconds, 2)}


def main(argv: list[str] | None = None) -> int:
    parser = argparse.ArgumentParser(description="Measure the window's event-loop latency.")
    parser.add_argument("league", nargs="?", default=str(DEFAULT_LEAGUE))
    parser.add_argument("--seconds", type=float, default=3.0)
    parser.add_argument("--thread", action="store_true", help="engine in a thread, not a process")
    args = parser.parse_args(argv)
    print(json.dumps(measure(args.league, args.seconds, not args.thread)))
    return 0


if __name__ == "__main__":
    sys.exit(main())
