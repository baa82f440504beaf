"""Progress, cancel and budget hooks shared by every engine entry point."""

from __future__ import annotations

import threading
import time
from collections.abc import Callable
from dataclasses import dataclass


class Cancelled(Exception):
    """The caller set the cancel event; no result is returned."""


class BudgetExceeded(Exception):
    """The time budget ran out before the exact result was finished."""


class NoAssignment(Exception):
    """No valid round assignment exists for the rounds asked for (proven)."""


@dataclass
class Hooks:
    """What a caller passes to watch and stop long work.

    `progress(fraction, stage)` is called with fractions rising from 0 to 1, `cancel` is a
    `threading.Event` checked often, `budget` is a number of seconds for the whole call.
    """

    progress: Callable[[float, str], None] | None = None
    cancel: threading.Event | None = None
    budget: float | None = None


class Ticker:
    """Checks cancel and budget and forwards progress for one public call.

    Progress is kept monotone and mapped into the window [lo, hi] of the current part of
    the work, so nested steps can report their own 0..1 fractions.
    """

    def __init__(self, hooks: Hooks | None = None) -> None:
        self.hooks = hooks or Hooks()
        budget = self.hooks.budget
        self.deadline = None if budget is None else time.monotonic() + budget
        self.lo = 0.0
        self.hi = 1.0
        self.last = -1.0

    def check(self) -> None:
        """Raise Cancelled or BudgetExceeded when the caller asked to stop."""
        cancel = self.hooks.cancel
        if cancel is not None and cancel.is_set():
            raise Cancelled("cancelled by the caller")
        if self.deadline is not None and time.monotonic() > self.deadline:
            raise BudgetExceeded(f"budget of {self.hooks.budget} s exceeded")

    def remaining(self) -> float | None:
        """Seconds left in the budget, or None when there is no budget."""
        if self.deadline is None:
            return None
        return self.deadline - time.monotonic()

    def report(self, fraction: float, stage: str) -> None:
        """Report progress `fraction` (0..1) of the current window; never goes backwards."""
        self.check()
        cb = self.hooks.progress
        if cb is None:
            return
        f = self.lo + (self.hi - self.lo) * min(max(fraction, 0.0), 1.0)
        if f < self.last:
            f = self.last
        self.last = f
        cb(f, stage)

    def window(self, lo: float, hi: float) -> Window:
        """A context in which fractions 0..1 map to [lo, hi] of the current window."""
        return Window(self, lo, hi)


class Window:
    """Context manager that narrows a Ticker's progress window for a sub-step."""

    def __init__(self, ticker: Ticker, lo: float, hi: float) -> None:
        self.ticker = ticker
        span = ticker.hi - ticker.lo
        self.new = (ticker.lo + span * lo, ticker.lo + span * hi)
        self.old = (ticker.lo, ticker.hi)

    def __enter__(self) -> Ticker:
        self.ticker.lo, self.ticker.hi = self.new
        return self.ticker

    def __exit__(self, *exc: object) -> None:
        self.ticker.lo, self.ticker.hi = self.old

