"""The engine process started by procworker: runs one job at a time, cancellable.

    python -m leaguegrid.gui.procchild IN_FD OUT_FD

A reader thread takes messages from the parent: jobs go to a queue, "cancel" sets the event
the running job's engine hooks watch. It ends when the parent closes its pipe. No Qt here.
"""

from __future__ import annotations

import queue
import sys
import threading
import time
import traceback

from leaguegrid.engine import Cancelled, Hooks, Memo, keep_freed_memory
from leaguegrid.gui.procworker import receive, send

PROGRESS_EVERY = 0.05  # seconds between progress messages


def _reader(in_fd: int, jobs: queue.Queue, cancel: threading.Event, cancelled: set) -> None:
    while True:
        try:
            message = receive(in_fd)
        except (EOFError, OSError):
            jobs.put(None)
            return
        if message[0] == "cancel":
            cancelled.add(message[1])
            cancel.set()
        else:
            jobs.put(message)


def _run(message: tuple, out_fd: int, cancel: threading.Event, memo: Memo) -> None:
    _kind, _job, target, args, kwargs, budget = message
    last = [0.0]

    def progress(fraction: float, stage: str) -> None:
        now = time.monotonic()
        if now - last[0] >= PROGRESS_EVERY:
            last[0] = now
            send(out_fd, ("progress", fraction, stage))

    try:
        result = target(*args, hooks=Hooks(progress, cancel, budget, memo=memo), **kwargs)
    except Exception as exc:  # reported to the window as text
        if cancel.is_set() or isinstance(exc, Cancelled):
            send(out_fd, ("cancelled",))
        else:
            send(out_fd, ("error", str(exc) or type(exc).__name__, traceback.format_exc()))
        return
    if cancel.is_set():
        send(out_fd, ("cancelled",))
        return
    try:
        send(out_fd, ("done", result))
    except (TypeError, AttributeError, ValueError) as exc:  # a result that cannot be pickled
        send(out_fd, ("error", f"the result could not be sent back: {exc}"))


def main(argv: list[str]) -> int:
    in_fd, out_fd = int(argv[0]), int(argv[1])
    keep_freed_memory()
    memo = Memo()  # counts shared by this process's jobs (a recount after an edit reuses them)
    jobs: queue.Queue = queue.Queue()
    cancel = threading.Event()
    cancelled: set[int] = set()
    threading.Thread(target=_reader, args=(in_fd, jobs, cancel, cancelled), daemon=True).start()
    while True:
        message = jobs.get()
        if message is None:
            return 0
        cancel.clear()
        if message[1] in cancelled:  # cancelled before it started
            cancel.set()
        try:
            _run(message, out_fd, cancel, memo)
        except OSError:  # the parent went away
            return 0


if __name__ == "__main__":
    sys.exit(main(sys.argv[1:]))
