"""The `leaguegrid` command: open the window, or check, count, plan and what-if from a shell.

Exit codes, the same for every command: 0 success; 1 input problems; 2 usage errors; 3 nothing
possible (proven); 4 a file could not be written; 5 stopped at the budget or cancelled.
"""

from __future__ import annotations

import argparse
import os
import sys
from collections.abc import Sequence
from pathlib import Path

import networkx as nx

from leaguegrid import __version__
from leaguegrid.cli.render import (
    print_check,
    print_counts,
    print_problems,
)
from leaguegrid.core.model import League

OK, INPUT_PROBLEMS, USAGE, IMPOSSIBLE, WRITE_FAILED, STOPPED = 0, 1, 2, 3, 4, 5
COMMANDS = ("check", "count", "plan", "whatif")


class UsageError(Exception):
    """A command line that cannot be carried out as asked (exit 2)."""


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
    check.add_argument("file", type=Path)

    count = sub.add_parser(
        "count", help="fewest rounds, the polynomial, exact counts per round count")
    count.add_argument("file", type=Path)
    count.add_argument("--rounds", type=parse_rounds, metavar="K|A..B")
    count.add_argument("--json", action="store_true", help="one JSON object on stdout")
    count.add_argument("--budget", type=float, default=60.0, metavar="SECONDS",
                       help="time limit for the whole command (default 60)")

    plan = sub.add_parser("plan", help="draw a schedule for K rounds and export it")
    plan.add_argument("file", type=Path)
    plan.add_argument("--rounds", type=int, required=True, metavar="K")
    plan.add_argument("--seed", type=int)
    plan.add_argument("--draws", type=int, default=1, metavar="N",
                      help="draw N schedules and keep the best by --score")
    plan.add_argument("--score", metavar="TERMS", help="comma-separated score terms")
    plan.add_argument("--out", type=Path, metavar="CALENDAR.xlsx")
    plan.add_argument("--ics", type=Path, metavar="DIR")
    plan.add_argument("--csv", type=Path, metavar="FILE")
    plan.add_argument("--budget", type=float, default=60.0, metavar="SECONDS")

    whatif = sub.add_parser("whatif", help="what waiving or adding a clash would change")
    whatif.add_argument("file", type=Path)
    whatif.add_argument("--rounds", type=int, required=True, metavar="K")
    whatif.add_argument("--add", metavar="NAME,NAME", help="a proposed clash between two "
                        "fixtures, teams or venues")
    whatif.add_argument("--join", metavar="TEAM,DIVISION[,VENUE]",
                        help="counts before and after a new team joins a division")
    whatif.add_argument("--close", metavar="VENUE,ROUND",
                        help="counts before and after a venue closes for a round (or a date)")
    whatif.add_argument("--json", action="store_true")
    whatif.add_argument("--budget", type=float, default=60.0, metavar="SECONDS")
    return parser


def load(path: Path) -> tuple[League, nx.Graph] | None:
    """Read a league; print its problems to stderr. Returns (league, graph) or None."""
    from leaguegrid.clashes.graph import build_clash_graph
    from leaguegrid.io.read.league_reader import load_league

    result = load_league(path)
    print_problems(result.problems, sys.stderr)
    if not result.ok:
        return None
    return result.league, build_clash_graph(result.league)


def cmd_check(args: argparse.Namespace) -> int:
    from leaguegrid.clashes.graph import build_clash_graph
    from leaguegrid.io.read.league_reader import load_league

    result = load_league(args.file)
    graph = build_clash_graph(result.league) if result.ok else None
    print_check(result, graph, sys.stdout)
    return OK if result.ok else INPUT_PROBLEMS


def cmd_count(args: argparse.Namespace) -> int:
    from leaguegrid.app.counting import count_report

    loaded = load(args.file)
    if loaded is None:
        return INPUT_PROBLEMS
    league, graph = loaded
    rounds = None
    if args.rounds is not None:
        first, last = args.rounds
        check_round_limit(league, last)
        rounds = list(range(first, last + 1))
    report = count_report(league, graph, rounds=rounds, budget=args.budget)
    print_counts(report, league, sys.stdout, as_json=args.json)
    return OK if report.complete else STOPPED


def check_round_limit(league: League, rounds: int) -> None:
    """A Rounds sheet lists every round there is: asking for more is a usage error."""
    if rounds < 1:
        raise UsageError(f"--rounds must be a positive whole number, not {rounds}")
    if league.rounds_fixed and rounds > len(league.rounds):
        raise UsageError(f"the Rounds sheet lists {len(league.rounds)} rounds; "
                         f"--rounds {rounds} asks for more")


def load_for_rounds(args: argparse.Namespace) -> tuple[League, nx.Graph] | None:
    """Read the league of a plan or whatif command and check its --rounds; None on problems."""
    loaded = load(args.file)
    if loaded is not None:
        check_round_limit(loaded[0], args.rounds)
    return loaded


def cmd_plan(args: argparse.Namespace) -> int:
    from leaguegrid.cli.commands import run_plan

    loaded = load_for_rounds(args)
    return INPUT_PROBLEMS if loaded is None else run_plan(args, *loaded)


def cmd_whatif(args: argparse.Namespace) -> int:
    from leaguegrid.cli.commands import run_whatif

    loaded = load_for_rounds(args)
    return INPUT_PROBLEMS if loaded is None else run_whatif(args, *loaded)


def main(argv: Sequence[str] | None = None) -> int:
    """The command line: `leaguegrid COMMAND ...` (the launcher hands commands here)."""
    argv = list(sys.argv[1:] if argv is None else argv)
    if argv and argv[0] not in COMMANDS and not argv[0].startswith("-"):
        build_parser().error(f"unknown command {argv[0]!r}; commands: {', '.join(COMMANDS)}")
    parser = build_parser()
    args = parser.parse_args(argv)
    if args.command is None:
        parser.print_help()
        return USAGE
    handler = {"check": cmd_check, "count": cmd_count, "plan": cmd_plan,
               "whatif": cmd_whatif}[args.command]
    try:
        return handler(args)
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
