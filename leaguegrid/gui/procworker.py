"""Heavy engine work in a separate process, so the window never waits for the interpreter lock.

Measured (see the developers' notes): with the engine in a thread of the window's own process
the window's event loop stalled up to ~130-200 ms while counting and 400-600 ms when a large
count was cancelled (freeing millions of states holds the lock); with the engine in a child
process the stalls stay near the 10-20 ms of an idle loop.

One child (`python -m leaguegrid.gui.procchild`) is started on first use and kept for later
jobs. It is an ordinary subprocess, not multiprocessing, so it never re-runs the parent's main
module. Messages are length-prefixed pickles on two private pipes. The parent sends
("run", job, function, args, kwargs, budget) and ("cancel", job); the child calls
`function(*args, hooks=engine.Hooks(progress, cancel, budget), **kwargs)` and answers
("progress", fraction, stage) (at most every 50 ms), then ("done", result), ("error", text)
or ("cancelled",). A child that has not answered within `KILL_AFTER` seconds of Cancel is
killed and replaced.
"""

from __future__ import annotations

import atexit
import contextlib
import copyreg
import os
import pickle
import struct
import subprocess
import sys
import threading
import time
from collections.abc import Callable
from pathlib import Path
from typing import Any

from flint import fmpz_poly

from leaguegrid.engine import Hooks

KILL_AFTER = 5.0  # seconds a cancelled child may take before it is killed
HEADER = struct.Struct("!Q")


def _poly_reduce(poly: fmpz_poly) -> tuple:
    return fmpz_poly, ([int(c) for c in poly.coeffs()],)


copyreg.pickle(fmpz_poly, _poly_reduce)  # fmpz_poly cannot be pickled on its own


class RemoteCancelled(Exception):
    """The job in the child process stopped because it was cancelled."""


class RemoteError(Exception):
    """The job in the child process raised: its message, and its traceback as `details`."""

    def __init__(self, message: str, details: str = "") -> None:
        super().__init__(message)
        self.details = details


def send(fd: int, message: Any) -> None:
    """Write one message (length-prefixed pickle) to a pipe."""
    data = pickle.dumps(message, protocol=pickle.HIGHEST_PROTOCOL)
    view = memoryview(HEADER.pack(len(data)) + data)
    while view:
        view = view[os.write(fd, view):]


def _read_exactly(fd: int, size: int) -> bytes:
    chunks, left = [], size
    while left:
        chunk = os.read(fd, min(left, 1 << 20))
        if not chunk:
            raise EOFError("pipe closed")
        chunks.append(chunk)
        left -= len(chunk)
    return b"".join(chunks)


def receive(fd: int) -> Any:
    """Read one message from a pipe (EOFError when it is closed)."""
    (size,) = HEADER.unpack(_read_exactly(fd, HEADER.size))
    return pickle.loads(_read_exactly(fd, size))


def _ready(fd: int, timeout: float) -> bool:
    import select

    return bool(select.select([fd], [], [], timeout)[0])


ENGINE_PROCESS_FLAG = "--engine-process"  # how a frozen (one-folder) app starts its engine


def child_command() -> list[str]:
    """The command that starts the engine process: this Python running procchild, or, in a
    frozen desktop app (which has no `python -m`), the app itself with ENGINE_PROCESS_FLAG."""
    if getattr(sys, "frozen", False):
        return [sys.executable, ENGINE_PROCESS_FLAG]
    return [sys.executable, "-m", "leaguegrid.gui.procchild"]


class WorkerProcess:
    """The parent's handle on the child; `run` blocks (call it from a worker thread)."""

    def __init__(self) -> None:
        self._lock = threading.Lock()
        self._proc: subprocess.Popen | None = None
        self._to_child: int | None = None
        self._from_child: int | None = None
        self._registered = False
        self._jobs = 0

    def _ensure(self) -> None:
        if self._proc is not None and self._proc.poll() is None:
            return
        self._close_pipes()
        if not self._registered:
            atexit.register(self.shutdown)
            self._registered = True
        child_in, self._to_child = os.pipe()
        self._from_child, child_out = os.pipe()
        env = dict(os.environ)
        root = str(Path(__file__).resolve().parents[2])
        env["PYTHONPATH"] = os.pathsep.join(filter(None, [root, env.get("PYTHONPATH")]))
        self._proc = subprocess.Popen(
            [*child_command(), str(child_in), str(child_out)],
            pass_fds=(child_in, child_out), env=env, stdin=subprocess.DEVNULL)
        os.close(child_in)
        os.close(child_out)

    def start(self) -> None:
        """Start the child now (it takes a second to import), so the first job need not wait."""
        with self._lock:
            self._ensure()

    def run(self, target: Callable, args: tuple, kwargs: dict, hooks: Hooks) -> Any:
        """Run target in the child under the hooks' budget, reporting its progress to them and
        passing on their cancel; raises RemoteCancelled or RemoteError."""
        cancel = hooks.cancel or threading.Event()
        with self._lock:
            self._ensure()
            assert self._to_child is not None and self._from_child is not None
            try:
                self._jobs += 1
                job = self._jobs
                send(self._to_child, ("run", job, target, args, kwargs, hooks.budget))
            except OSError as err:
                self._kill()
                raise RemoteError(f"the engine process could not be reached ({err})") from err
            asked: float | None = None
            while True:
                if cancel.is_set() and asked is None:
                    asked = time.monotonic()
                    send(self._to_child, ("cancel", job))
                if asked is not None and time.monotonic() - asked > KILL_AFTER:
                    self._kill()
                    raise RemoteCancelled()
                if not _ready(self._from_child, 0.05):
                    continue
                try:
                    message = receive(self._from_child)
                except (EOFError, OSError, pickle.UnpicklingError) as err:
                    self._kill()
                    raise RemoteError("the engine process ended unexpectedly") from err
                kind = message[0]
                if kind == "progress":
                    if hooks.progress is not None:
                        hooks.progress(message[1], message[2])
                elif kind == "done":
                    return message[1]
                elif kind == "cancelled":
                    raise RemoteCancelled()
                else:
                    raise RemoteError(message[1], message[2] if len(message) > 2 else "")

    def _close_pipes(self) -> None:
        for fd in (self._to_child, self._from_child):
            if fd is not None:
                with contextlib.suppress(OSError):
                    os.close(fd)
        self._to_child = self._from_child = None

    def _kill(self) -> None:
        if self._proc is not None and self._proc.poll() is None:
            self._proc.kill()
            self._proc.wait(5)
        self._proc = None
        self._close_pipes()

    def shutdown(self) -> None:
        """Close the pipes (the child then ends) and wait a moment for it."""
        with self._lock:
            proc = self._proc
            self._close_pipes()
            if proc is not None:
                try:
                    proc.wait(2)
                except subprocess.TimeoutExpired:
                    proc.kill()
                    proc.wait(2)
            self._proc = None


_shared: WorkerProcess | None = None


def shared_worker() -> WorkerProcess:
    """The one engine process of this window (started on first use)."""
    global _shared
    if _shared is None:
        _shared = WorkerProcess()
    return _shared


def remote(target: Callable, *args: Any, **kwargs: Any) -> Callable:
    """A job function for worker.Runner that runs `target` in the engine process."""
    def run(hooks: Hooks) -> Any:
        return shared_worker().run(target, args, kwargs, hooks)

    return run
