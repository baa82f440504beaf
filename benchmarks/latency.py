"""An event-loop latency probe: a QTimer that notes how late each of its ticks arrives.

While the engine works in another thread, the largest gap between ticks is how long the
window could not react; it is what the tests and the benchmark report.
"""

from __future__ import annotations

import time

from PySide6.QtCore import QObject, Qt, QTimer


class LatencyProbe(QObject):
    """Ticks every `interval_ms`; `max_gap` is the longest time seen between two ticks (s)."""

    def __init__(self, interval_ms: int = 10, parent: QObject | None = None) -> None:
        super().__init__(parent)
        self.interval = interval_ms / 1000.0
        self.timer = QTimer(self)
        self.timer.setTimerType(Qt.TimerType.PreciseTimer)
        self.timer.setInterval(interval_ms)
        self.timer.timeout.connect(self._tick)
        self.max_gap = 0.0
        self.ticks = 0
        self._last: float | None = None
        self.gaps: list[float] = []

    def start(self) -> None:
        self.max_gap = 0.0
        self.ticks = 0
        self.gaps = []
        self._last = time.perf_counter()
        self.timer.start()

    def stop(self) -> float:
        """Stop ticking; return the largest gap seen (seconds)."""
        self.timer.stop()
        self._tick()
        return self.max_gap

    def percentile(self, q: float) -> float:
        """The q-quantile (0..1) of the gaps seen, 0.0 when none were."""
        if not self.gaps:
            return 0.0
        ordered = sorted(self.gaps)
        return ordered[min(len(ordered) - 1, int(q * len(ordered)))]

    def _tick(self) -> None:
        now = time.perf_counter()
        if self._last is not None:
            gap = now - self._last
            self.gaps.append(gap)
            self.max_gap = max(self.max_gap, gap)
        self._last = now
        self.ticks += 1
