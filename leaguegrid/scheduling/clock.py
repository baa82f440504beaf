"""One budget, cancel event and progress callback shared by the steps of a long job."""

from __future__ import annotations

import threading
import time
from collections.abc import Callable

from leaguegrid import engine

Progress = Callable[[float, str], None]


class Clock:
    """The job's deadline, cancel event and progress; hands each step its share."""

    def __init__(self, budget: float | None = None, progress: Progress | None = None,
                 cancel: threading.Event | None = None) -> None:
        self.deadline = None if budget is None else time.monotonic() + budget
        self.progress = progress
        self.cancel = cancel

    def left(self) -> float | None:
        """Seconds left, or None without a budget."""
        return None if self.deadline is None else max(0.0, self.deadline - time.monotonic())

    def hooks(self, lo: float = 0.0, hi: float = 1.0, share: float = 1.0) -> engine.Hooks:
        """Engine hooks with `share` of what is left of the budget, progress into [lo, hi]."""
        left = self.left()
        return engine.Hooks(progress=self.scaled(lo, hi), cancel=self.cancel,
                            budget=None if left is None else left * share)

    def scaled(self, lo: float, hi: float) -> Progress | None:
        """A progress callback for a step whose 0..1 maps into [lo, hi] of the job."""
        if self.progress is None:
            return None
        outer = self.progress

        def report(fraction: float, stage: str) -> None:
            outer(lo + (hi - lo) * fraction, stage)

        return report

    def report(self, fraction: float, stage: str) -> None:
        if self.progress is not None:
            self.progress(fraction, stage)
