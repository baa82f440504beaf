"""The one budget, progress and cancel object of LeagueGrid, and the engine's stop signals.

`Hooks` is what every long piece of work accepts: the engine's entry points, the schedule
search, the counts table and the what-if analyses. A caller makes one for a whole job; each
step gets a `part` of it (its own share of the time left, its progress mapped into a slice of
the whole); the engine checks it often. It lives here so the engine imports nothing else of the
package; everything else passes it on.
"""

from __future__ import annotations

import threading
import time
from collections.abc import Callable, Iterator
from contextlib import contextmanager

from .memo import Memo

Progress = Callable[[float, str], None]
Clock = Callable[[], float]


class Cancelled(Exception):
    """The caller set the cancel event; no result is returned."""


class BudgetExceeded(Exception):
    """The time budget ran out before the exact result was finished."""


class MemoryBound(BudgetExceeded):
    """A table of the exact programme passed the memory bound before it finished."""


class NoAssignment(Exception):
    """No valid round assignment exists for the rounds asked for (proven)."""


class Hooks:
    """A budget in seconds, a cancel event and a progress callback, for one job or one step.

    `progress(fraction, stage)` receives fractions that never go backwards; `cancel` is a
    `threading.Event` set from any thread; `budget` is seconds from now (None: no limit);
    `clock` is the time source (time.monotonic; a test may pass a fake clock, for instance
    one that advances by one at every reading, which makes the budget a number of checks);
    `memo` keeps the exact counts worked out under these hooks and their parts (a fresh one
    unless the caller shares one between jobs, as the window's engine process does).
    """

    def __init__(self, progress: Progress | None = None, cancel: threading.Event | None = None,
                 budget: float | None = None, clock: Clock | None = None,
                 memo: Memo | None = None) -> None:
        self.memo = Memo() if memo is None else memo
        self.progress = progress
        self.cancel = cancel
        self.budget = budget
        self.clock: Clock = clock or time.monotonic
        self.deadline = None if budget is None else self.clock() + budget
        self.allowed = budget  # the budget as the caller gave it, for messages
        self.lo, self.hi, self.last = 0.0, 1.0, -1.0

    def __repr__(self) -> str:
        return f"Hooks(budget={self.budget!r}, cancelled={self.cancelled})"

    @property
    def cancelled(self) -> bool:
        """True once the cancel event is set."""
        return self.cancel is not None and self.cancel.is_set()

    def remaining(self) -> float | None:
        """Seconds left (never below 0), or None without a budget."""
        return None if self.deadline is None else max(0.0, self.deadline - self.clock())

    def check(self) -> None:
        """Raise Cancelled or BudgetExceeded when the caller asked to stop."""
        if self.cancelled:
            raise Cancelled("cancelled by the caller")
        if self.deadline is not None and self.clock() > self.deadline:
            raise BudgetExceeded(f"budget of {self.allowed:g} s exceeded")

    def report(self, fraction: float, stage: str) -> None:
        """Check, then report `fraction` (0..1) of the current window; never goes backwards."""
        self.check()
        if self.progress is None:
            return
        f = self.lo + (self.hi - self.lo) * min(max(fraction, 0.0), 1.0)
        self.last = f = max(f, self.last)
        self.progress(f, stage)

    @contextmanager
    def window(self, lo: float, hi: float) -> Iterator[Hooks]:
        """Within the block, fractions 0..1 reported here map to [lo, hi] of the current
        window (for the nested steps of one call)."""
        old = self.lo, self.hi
        span = self.hi - self.lo
        self.lo, self.hi = self.lo + span * lo, self.lo + span * hi
        try:
            yield self
        finally:
            self.lo, self.hi = old

    def part(self, lo: float = 0.0, hi: float = 1.0, *, share: float = 1.0,
             seconds: float | None = None, stage: str | None = None) -> Hooks:
        """Hooks for one step: the same cancel and clock; `share` of the time left (and at
        most `seconds`, when given); progress 0..1 mapped into [lo, hi] of this window, its
        stage text prefixed with `stage`."""
        left = self.remaining()
        if left is not None:
            left *= share
        if seconds is not None:
            left = seconds if left is None else min(left, seconds)
        child = Hooks(self._forward(lo, hi, stage), self.cancel, left, self.clock, self.memo)
        if self.allowed is not None and (seconds is None or left != seconds):
            child.allowed = self.allowed
        return child

    def _forward(self, lo: float, hi: float, stage: str | None) -> Progress | None:
        if self.progress is None:
            return None
        span = self.hi - self.lo
        a, b = self.lo + span * lo, self.lo + span * hi

        def forward(fraction: float, text: str) -> None:
            if stage is not None:
                text = f"{stage}: {text}" if text else stage
            f = a + (b - a) * min(max(fraction, 0.0), 1.0)
            self.last = f = max(f, self.last)
            self.progress(f, text)

        return forward


def begin(hooks: Hooks | None) -> Hooks:
    """The hooks one engine call works with: a fresh part of the caller's (its own progress
    window, the caller's cancel and time left), or unlimited hooks when none were given."""
    return Hooks() if hooks is None else hooks.part()


