"""The `leaguegrid` program: the window (on FILE, or on the demo league) or a command.

This module chooses between the window and the command line, so neither imports the other.
"""

from __future__ import annotations

import sys
import time
from collections.abc import Sequence
from pathlib import Path

from leaguegrid.cli.main import COMMANDS

STARTED = time.monotonic()  # the process's start, from which its own command's --budget counts


def wants_window(argv: Sequence[str]) -> bool:
    """No arguments, or one that is not a command or an option: open the window."""
    return not argv or (len(argv) == 1 and argv[0] not in COMMANDS
                        and not argv[0].startswith("-"))


def open_window(path: Path | None) -> int:
    """Open the desktop window on FILE (or the demo league). When no window can start (no
    display, missing system libraries), say why in one sentence and print the counts."""
    from leaguegrid.app.demos import default_demo
    from leaguegrid.cli.main import main as command_line
    from leaguegrid.gui.startup import check as window_problem

    target = path if path is not None else default_demo()
    problem = window_problem()
    if problem is None:
        from leaguegrid.gui.app import run

        return run(str(target), checked=True)
    print(problem, file=sys.stderr)
    print(f"Showing the counts of {target.name} on the command line instead.\n", file=sys.stderr)
    return command_line(["count", str(target)])


def main(argv: Sequence[str] | None = None) -> int:
    """Entry point of the `leaguegrid` console script and of `python -m leaguegrid`."""
    from leaguegrid.cli.main import main as command_line
    from leaguegrid.engine import keep_freed_memory

    keep_freed_memory()
    args = list(sys.argv[1:] if argv is None else argv)
    if args[:1] == ["--engine-process"]:  # the frozen app starting its own engine process
        from leaguegrid.gui.procchild import main as engine_process

        return engine_process(args[1:])
    if wants_window(args):
        return open_window(Path(args[0]) if args else None)
    # the process's own command line (argv None) counts its budget from the process's start
    return command_line(args, started=STARTED if argv is None else None)


if __name__ == "__main__":
    sys.exit(main())
