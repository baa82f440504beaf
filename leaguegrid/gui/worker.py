"""Running long work off the GUI thread: one job at a time in a QThread, with progress,
stage text and Cancel, results delivered by signals.

The job is a plain function `fn(hooks) -> result` given the one budget/progress/cancel object
(engine.Hooks); its progress may be reported as often as the engine likes: the latest value is
polled by a GUI-thread timer, so a busy engine never floods the event queue.
"""

from __future__ import annotations

import threading
import time
import traceback
from collections.abc import Callable
from dataclasses import dataclass, field
from typing import Any

from PySide6.QtCore import QObject, QThread, QTimer, Signal

from leaguegrid.engine import Cancelled, Hooks
from leaguegrid.gui.procworker import RemoteCancelled

Progress = Callable[[float, str], None]
JobFn = Callable[[Hooks], Any]
POLL_MS = 100


def call(target: Callable[..., Any], *args: Any, **kwargs: Any) -> JobFn:
    """A job function running `target(*args, hooks=hooks, **kwargs)` in the worker thread."""
    return lambda hooks: target(*args, hooks=hooks, **kwargs)


@dataclass
class Job:
    """A named piece of work and what to do with its result in the GUI thread."""

    name: str
    fn: JobFn
    on_done: Callable[[Any], None] | None = None
    budget: float | None = None  # seconds the work may take (None: no limit)
    cancel: threading.Event = field(default_factory=threading.Event)
    started: float = 0.0


class _Thread(QThread):
    """Runs one job's function; its outcome goes back through queued signals."""

    done = Signal(object)
    error = Signal(str, str)  # what went wrong (its message), the details (a traceback)
    stopped = Signal()

    def __init__(self, job: Job, progress: Progress, parent: QObject | None = None) -> None:
        super().__init__(parent)
        self.job = job
        self.report = progress

    def run(self) -> None:
        try:
            result = self.job.fn(Hooks(self.report, self.job.cancel, self.job.budget))
        except Exception as exc:  # every failure reaches the window as text, never a crash
            if self.job.cancel.is_set() or is_cancellation(exc):
                self.stopped.emit()
            else:
                self.error.emit(*failure_of(exc))
            return
        if self.job.cancel.is_set():
            self.stopped.emit()
        else:
            self.done.emit(result)


def failure_of(exc: BaseException) -> tuple[str, str]:
    """(the exception's message, or its type when it has none; the traceback, the engine
    process's own when the job ran there)."""
    details = getattr(exc, "details", "") or "".join(traceback.format_exception(exc))
    return str(exc) or type(exc).__name__, details


def is_cancellation(exc: BaseException) -> bool:
    """True when the job stopped because it was cancelled: in this process (the engine's
    Cancelled) or in the engine process."""
    return isinstance(exc, Cancelled | RemoteCancelled)


class Runner(QObject):
    """One job at a time; a new job while one runs cancels it and starts when it has stopped."""

    busyChanged = Signal(bool)
    progressed = Signal(float, str)  # fraction in [0, 1] (or -1 when unknown), stage text
    failed = Signal(str, str, str)  # job name, what went wrong, the details (a traceback)
    cancelled = Signal(str)  # job name

    def __init__(self, parent: QObject | None = None) -> None:
        super().__init__(parent)
        self._current: Job | None = None
        self._thread: _Thread | None = None
        self._queued: Job | None = None
        self._alive: list[_Thread] = []  # threads not yet ended (a result may precede the end)
        self._latest: tuple[float, str] | None = None
        self._lock = threading.Lock()
        self._poll = QTimer(self)
        self._poll.setInterval(POLL_MS)
        self._poll.timeout.connect(self._publish_progress)

    @property
    def busy(self) -> bool:
        return self._current is not None

    @property
    def current_name(self) -> str | None:
        return None if self._current is None else self._current.name

    def start(self, job: Job) -> None:
        """Run `job` now, or as soon as the running one has stopped (which is asked to)."""
        if self._current is not None:
            self._queued = job
            self._current.cancel.set()
            return
        self._launch(job)

    def cancel(self) -> None:
        """Ask the running job to stop and drop any queued one."""
        self._queued = None
        if self._current is not None:
            self._current.cancel.set()
            self.progressed.emit(-1.0, f"Cancelling {self._current.name}…")

    def wait(self, timeout_ms: int = 30000) -> bool:
        """Block until the worker thread ends (for shutdown); True when it did."""
        return all(thread.wait(timeout_ms) for thread in list(self._alive))

    def _launch(self, job: Job) -> None:
        job.started = time.monotonic()
        self._current = job
        with self._lock:
            self._latest = (0.0, f"{job.name}…")
        thread = _Thread(job, self._store_progress)
        thread.done.connect(self._on_done)
        thread.error.connect(self._on_error)
        thread.stopped.connect(self._on_stopped)
        thread.finished.connect(lambda: self._ended(thread))
        self._thread = thread
        self._alive.append(thread)
        self._poll.start()
        self.busyChanged.emit(True)
        self._publish_progress()
        thread.start()

    def _ended(self, thread: _Thread) -> None:
        if thread in self._alive:
            self._alive.remove(thread)
        thread.deleteLater()

    def _store_progress(self, fraction: float, stage: str) -> None:
        """Called from the worker thread: keep only the latest report."""
        with self._lock:
            self._latest = (fraction, stage)

    def _publish_progress(self) -> None:
        with self._lock:
            latest, self._latest = self._latest, None
        if latest is not None and self._current is not None and not self._current.cancel.is_set():
            self.progressed.emit(*latest)

    def _finish(self) -> Job:
        job = self._current
        assert job is not None
        self._current = None
        self._thread = None
        self._poll.stop()
        return job

    def _next(self) -> None:
        if self._current is not None:  # the result's handler already started the next job
            return
        queued, self._queued = self._queued, None
        if queued is not None:
            self._launch(queued)
        else:
            self.busyChanged.emit(False)

    def _on_done(self, result: object) -> None:
        job = self._finish()
        try:
            if job.on_done is not None:
                job.on_done(result)
        except Exception as exc:  # showing a result must not take the window down
            message, details = failure_of(exc)
            self.failed.emit(job.name, f"showing the result failed: {message}", details)
        self._next()

    def _on_error(self, message: str, details: str) -> None:
        job = self._finish()
        self.failed.emit(job.name, message, details)
        self._next()

    def _on_stopped(self) -> None:
        job = self._finish()
        self.cancelled.emit(job.name)
        self._next()
