"""The `leaguegrid` commands: check, count, plan, whatif, demos, new (argument parsing).

Exit codes, the same for every command: 0 success; 1 input problems; 2 usage errors; 3 nothing
possible (proven); 4 a file could not be written; 5 stopped at the budget or cancelled.
"""

from __future__ import annotations

import argparse
import math
import os
import sys
import time
from collections.abc import Sequence
from pathlib import Path

from leaguegrid import __version__
from leaguegrid.app.defaults import COUNT_BUDGET, PLAN_BUDGET, WHATIF_BUDGET
from leaguegrid.cli.exits import OK, STOPPED, USAGE, UsageError
from leaguegrid.core.wording import budget_problem

COMMANDS = ("check", "count", "plan", "whatif", "demos", "new")


def parse_rounds(text: str) -> tuple[int, int]:
    """'7' -> (7, 7); '5..9' -> (5, 9). Rounds are positive whole numbers."""
    low, sep, high = text.partition("..")
    try:
        a = int(low)
        b = int(high) if sep else a
    except ValueError as err:
        raise argparse.ArgumentTypeError(
            f"--rounds takes a whole number (7) or a range (5..9), not {text!r}") from err
    if a < 1 or b < a:
        raise argparse.ArgumentTypeError(
            f"--rounds needs 1 <= first <= last, not {text!r}")
    return a, b


def parse_columns(text: str) -> dict[str, str]:
    """--columns home="Home Team",venue=Ground: our column keys = the file's headers."""
    from leaguegrid.app.matching import ColumnsError
    from leaguegrid.app.matching import parse_columns as parse

    try:
        return parse(text)
    except ColumnsError as err:
        raise argparse.ArgumentTypeError(str(err)) from err


def _league_file(parser: argparse.ArgumentParser) -> None:
    """The league to read (a workbook, a CSV or a project file) and its column matching."""
    parser.add_argument("file", type=Path, help="a league workbook (.xlsx), a CSV file, or a "
                        "project file (.leaguegrid)")
    parser.add_argument("--columns", type=parse_columns, metavar='KEY="HEADER",...',
                        help='which of the file\'s headers are our columns, e.g. '
                        'home="Home Team",venue=Ground (replaces a project\'s matching)')


def _budget(parser: argparse.ArgumentParser, default: float) -> None:
    parser.add_argument("--budget", default=default, metavar="SECONDS",
                        help=f"time limit for the whole command (default {default:g})")


def budget_seconds(value: str | float) -> float:
    """A --budget value as seconds: a positive, finite number, else a usage error naming it."""
    try:
        seconds = float(value)
    except ValueError:
        seconds = math.nan
    if not math.isfinite(seconds) or seconds <= 0:
        raise UsageError(budget_problem(str(value)))
    return seconds


def build_parser() -> argparse.ArgumentParser:
    """The argument parser for every command."""
    parser = argparse.ArgumentParser(
        prog="leaguegrid",
        description="Count, plan and publish clash-free round schedules for a sports league. "
        "With no command, opens the window (on FILE, or on the demo league).",
    )
    parser.add_argument("--version", action="version", version=f"leaguegrid {__version__}")
    sub = parser.add_subparsers(dest="command", metavar="COMMAND")

    check = sub.add_parser("check", help="validate a league workbook and list what it holds")
    _league_file(check)

    count = sub.add_parser(
        "count", help="fewest rounds, the polynomial, exact counts per round count")
    _league_file(count)
    count.add_argument("--rounds", type=parse_rounds, metavar="K|A..B")
    count.add_argument("--json", action="store_true", help="one JSON object on stdout")
    _budget(count, COUNT_BUDGET)

    plan = sub.add_parser("plan", help="make a schedule for K rounds and export it")
    _league_file(plan)
    plan.add_argument("--rounds", type=int, required=True, metavar="K")
    plan.add_argument("--seed", type=int)
    plan.add_argument("--draws", type=int, default=1, metavar="N",
                      help="draw N schedules and keep the best by --score (every term when "
                      "--score is not given)")
    plan.add_argument("--score", metavar="TERMS", help="comma-separated score terms")
    plan.add_argument("--json", action="store_true", help="one JSON object on stdout")
    plan.add_argument("--uniform", action="store_true",
                      help="draw uniformly among all valid schedules instead of optimising")
    plan.add_argument("--keep", type=Path, metavar="PREVIOUS.csv",
                      help="keep this earlier schedule (its Fixture and Round columns) where "
                           "every rule allows, moving as few fixtures as possible")
    plan.add_argument("--out", type=Path, metavar="CALENDAR.xlsx")
    plan.add_argument("--ics", type=Path, metavar="DIR")
    plan.add_argument("--csv", type=Path, metavar="FILE")
    _budget(plan, PLAN_BUDGET)

    whatif = sub.add_parser("whatif", help="what waiving or adding a clash would change")
    _league_file(whatif)
    whatif.add_argument("--rounds", type=int, required=True, metavar="K")
    whatif.add_argument("--add", metavar="NAME,NAME", help="a proposed clash between two "
                        "fixtures, teams or venues")
    whatif.add_argument("--join", metavar="TEAM,DIVISION[,VENUE]",
                        help="counts before and after a new team joins a division")
    whatif.add_argument("--close", metavar="VENUE,ROUND",
                        help="counts before and after a venue closes for a round (or a date)")
    whatif.add_argument("--json", action="store_true")
    _budget(whatif, WHATIF_BUDGET)

    sub.add_parser("demos", help="list the demo league workbooks that come with LeagueGrid")

    new = sub.add_parser("new", help="write a blank league workbook to fill in")
    new.add_argument("file", type=Path, metavar="FILE.xlsx")
    return parser


def _plain_output() -> None:
    """Names and counts print whatever the console's encoding: what it cannot show is replaced,
    never a crash."""
    for stream in (sys.stdout, sys.stderr):
        encoding = (getattr(stream, "encoding", None) or "").lower().replace("-", "")
        if encoding != "utf8" and hasattr(stream, "reconfigure"):
            stream.reconfigure(errors="replace")


def main(argv: Sequence[str] | None = None, started: float | None = None) -> int:
    """The command line: `leaguegrid COMMAND ...` (the launcher hands commands here, with the
    time.monotonic() its process started at, from which a --budget counts)."""
    started = time.monotonic() if started is None else started
    from leaguegrid.cli import commands

    argv = list(sys.argv[1:] if argv is None else argv)
    if argv and argv[0] not in COMMANDS and not argv[0].startswith("-"):
        build_parser().error(f"unknown command {argv[0]!r}; commands: {', '.join(COMMANDS)}")
    parser = build_parser()
    args = parser.parse_args(argv)
    if args.command is None:
        parser.print_help()
        return USAGE
    _plain_output()
    try:
        if hasattr(args, "budget"):
            args.budget = budget_seconds(args.budget)
            args.started = started
        return commands.HANDLERS[args.command](args)
    except UsageError as err:
        print(f"leaguegrid {args.command}: {err}", file=sys.stderr)
        return USAGE
    except KeyboardInterrupt:
        print("leaguegrid: cancelled", file=sys.stderr)
        return STOPPED
    except BrokenPipeError:  # the reader of our output went away (e.g. `| head`): stop quietly
        os.dup2(os.open(os.devnull, os.O_WRONLY), sys.stdout.fileno())
        return OK


if __name__ == "__main__":
    sys.exit(main())
