"""What each command does: parse its options, call the application layer, print the result."""

from __future__ import annotations

import argparse
import datetime as dt
import json
import sys
import time

from leaguegrid import engine
from leaguegrid.app import counting, export, league, planning, project
from leaguegrid.app import whatif as what
from leaguegrid.app.demos import demo_leagues
from leaguegrid.app.matching import ColumnsError
from leaguegrid.cli import render
from leaguegrid.cli.exits import INPUT_PROBLEMS, OK, PLAN_EXITS, STOPPED, WRITE_FAILED, UsageError


def _read(args: argparse.Namespace) -> tuple[league.OpenedLeague | None, bool]:
    """The league a command works on: a workbook or CSV as read, or a project file's workbook
    with the project's pins, ties and clash edits (its notices on stderr), and whether parts
    of the project file were damaged; None when the project file cannot be used (said on
    stderr in one sentence). `--columns` replaces any remembered matching and must fit."""
    typed = args.columns is not None
    try:
        if not project.is_project(args.file):
            opened, damaged = league.open_league(args.file, args.columns, typed=typed), False
        else:
            found = project.open_project(args.file, args.columns)
            for text in (found.problem, found.warning):
                if text:
                    print(f"leaguegrid {args.command}: {text}", file=sys.stderr)
            opened, damaged = found.opened, found.damaged
    except ColumnsError as err:
        raise UsageError(f"--columns: {err}") from err
    if opened is not None and opened.notice:
        print(opened.notice, file=sys.stderr)
    return opened, damaged


def _open(args: argparse.Namespace, rounds: int | None = None) -> league.OpenedLeague | None:
    """Read a league, print its problems to stderr; None when it cannot be used. `rounds`, when
    given, must be a round count the league can have."""
    opened = _read(args)[0]
    if opened is None:
        return None
    render.print_problems(opened.result.problems, sys.stderr)
    if not opened.ok:
        return None
    if rounds is not None:
        _check_rounds(opened, rounds)
    return opened


def _check_rounds(opened: league.OpenedLeague, rounds: int) -> None:
    try:
        league.check_rounds(opened.league, rounds)
    except league.RoundsError as err:
        raise UsageError(f"--rounds: {err}") from err


EXIT_SECONDS = 0.3  # kept back from a --budget (at most a tenth of it) for the process's exit


def _whole_command(args: argparse.Namespace) -> engine.Hooks:
    """Hooks whose budget is the command's whole --budget, counted from the process's start,
    less the moment the process needs to end and hand its memory back."""
    spent = time.monotonic() - args.started
    keep = min(EXIT_SECONDS, args.budget / 10)
    hooks = engine.Hooks(budget=max(args.budget - spent - keep, 0.0))
    hooks.allowed = args.budget
    return hooks


def cmd_check(args: argparse.Namespace) -> int:
    opened, damaged = _read(args)
    if opened is None:
        return INPUT_PROBLEMS
    render.print_check(opened, sys.stdout)
    return OK if opened.ok and not damaged else INPUT_PROBLEMS


def cmd_count(args: argparse.Namespace) -> int:
    hooks = _whole_command(args)
    opened = _open(args)
    if opened is None:
        return INPUT_PROBLEMS
    rounds = None
    if args.rounds is not None:
        first, last = args.rounds
        _check_rounds(opened, last)
        rounds = list(range(first, last + 1))
    report = counting.count_report(opened.league, opened.graph, rounds=rounds, hooks=hooks)
    render.print_counts(report, opened.league, sys.stdout, as_json=args.json)
    return OK if report.complete else STOPPED


def cmd_plan(args: argparse.Namespace) -> int:
    opened = _open(args, args.rounds)
    if opened is None:
        return INPUT_PROBLEMS
    try:
        terms = planning.parse_terms(args.score)
        hooks = engine.Hooks(budget=args.budget)
        started = time.perf_counter()
        replanned = None
        if args.keep is not None:
            previous = planning.read_previous(args.keep, opened.league)
            if not previous.ok:
                render.print_problems(previous.problems, sys.stderr)
                return INPUT_PROBLEMS
            replanned = planning.replan(opened.league, opened.graph, args.rounds,
                                        previous.rounds, args.seed, hooks)
            outcome = replanned.outcome
        else:
            outcome = planning.make_schedule(opened.league, opened.graph, args.rounds,
                                             args.seed, args.draws, terms, hooks=hooks,
                                             uniform=args.uniform)
        seconds = time.perf_counter() - started
    except ValueError as err:
        raise UsageError(str(err)) from err
    report = sys.stderr if args.json else sys.stdout  # with --json stdout holds the JSON only
    if args.json:
        schedule = outcome.schedule
        rules = planning.rules_met(opened.league, opened.graph, schedule) if schedule else []
        byes = planning.byes(opened.league, schedule) if schedule else {}
        data = render.plan_json(outcome, opened.league, rules, byes, seconds)
        if replanned is not None:
            data["moved"] = [{"label": m.label, "before": m.before, "after": m.after}
                             for m in replanned.moves]
            data["changes_by_club"] = replanned.by_club
        print(json.dumps(data, indent=2, ensure_ascii=False), file=sys.stdout)
        if schedule is None:
            render.print_plan(outcome, opened.league, sys.stderr, sys.stderr)
    else:
        render.print_plan(outcome, opened.league, sys.stdout, sys.stderr)
        if replanned is not None and outcome.schedule is not None:
            render.print_changes(replanned.by_club, sys.stdout)
    if outcome.schedule is None:
        return PLAN_EXITS[outcome.result.status]
    targets = export.ExportTargets(xlsx=args.out, csv=args.csv, ics=args.ics)
    if targets == export.ExportTargets():
        return OK
    fewest = planning.fewest_rounds(outcome.result, hooks) if args.out is not None else None
    try:
        written = export.export_schedule(opened.league, opened.graph, outcome.schedule,
                                         targets, fewest, inputs=[args.file, args.keep]).written
    except export.ExportFailed as err:
        render.print_written(err.written, report)
        print(f"leaguegrid plan: {err}", file=sys.stderr)
        return WRITE_FAILED
    render.print_written(written, report)
    return OK


def _names(option: str, text: str, least: int, most: int) -> list[str]:
    """An option's comma-separated names, between `least` and `most` of them, none blank."""
    parts = [p.strip() for p in text.split(",")]
    if not least <= len(parts) <= most or not all(parts):
        if (least, most) == (2, 2):
            raise UsageError(f"{option} takes two names separated by a comma, not {text!r}")
        raise UsageError(f"{option} takes {least} to {most} comma-separated names, not {text!r}")
    return parts


def _round(text: str) -> int | dt.date:
    """A round number or an ISO date (YYYY-MM-DD)."""
    if text.isdigit() and int(text) >= 1:
        return int(text)
    try:
        return dt.date.fromisoformat(text)
    except ValueError as err:
        raise UsageError(f"{text!r} is neither a round number nor a date (YYYY-MM-DD)") from err


def cmd_whatif(args: argparse.Namespace) -> int:
    opened = _open(args, args.rounds)
    if opened is None:
        return INPUT_PROBLEMS
    add = tuple(_names("--add", args.add, 2, 2)) if args.add is not None else None
    join = what.Join(*_names("--join", args.join, 2, 3)) if args.join else None
    close = None
    if args.close:
        venue, when = _names("--close", args.close, 2, 2)
        close = what.Close(venue, _round(when))
    try:
        outcome = what.what_if(opened.league, opened.graph, args.rounds, add=add, join=join,
                               close=close, hooks=engine.Hooks(budget=args.budget))
    except what.UnknownName as err:
        raise UsageError(str(err)) from err
    render.print_whatif(outcome, opened.league, sys.stdout, as_json=args.json)
    return OK if outcome.complete else STOPPED


def cmd_demos(args: argparse.Namespace) -> int:
    for path in demo_leagues():
        print(path)
    return OK


def cmd_new(args: argparse.Namespace) -> int:
    from leaguegrid.app.demos import write_blank_league

    try:
        written = write_blank_league(args.file)
    except FileExistsError as err:
        raise UsageError(f"{args.file} exists already; choose another name") from err
    except OSError as err:
        print(f"leaguegrid new: {export.failure_text(err)}", file=sys.stderr)
        return WRITE_FAILED
    print(f"Wrote a blank league workbook to {written}; fill it in, then run "
          f"`leaguegrid check {args.file}`.")
    return OK


HANDLERS = {"check": cmd_check, "count": cmd_count, "plan": cmd_plan, "whatif": cmd_whatif,
            "demos": cmd_demos, "new": cmd_new}
