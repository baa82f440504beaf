"""The `plan` and `whatif` commands: draw a schedule and export it; rank what clashes cost."""

from __future__ import annotations

import argparse
import datetime as dt
import json
import sys

import networkx as nx

from leaguegrid import engine
from leaguegrid.cli.main import UsageError
from leaguegrid.core.model import League, Schedule
from leaguegrid.io.write.atomic import ExportError
from leaguegrid.scheduling import score
from leaguegrid.scheduling.dates import DatesError, dated_fixtures
from leaguegrid.scheduling.draw import PlanResult, fresh_seed, plan

EXIT = {"found": 0, "impossible": 3, "budget": 5, "cancelled": 5}


def parse_terms(text: str | None) -> dict[str, float] | None:
    """--score 'balance,travel=2' as weights by term; None when no terms were given."""
    if not text:
        return None
    try:
        return score.parse_terms(text)
    except ValueError as err:
        raise UsageError(str(err)) from err


def print_schedule(league: League, schedule: Schedule) -> None:
    """The schedule round by round, with dates and times where the league gives them."""
    rows = dated_fixtures(league, schedule)
    current = None
    for row in rows:
        info = row.round
        if info.number != current:
            current = info.number
            when = " ".join(x for x in (info.date and info.date.isoformat(),
                                        info.time and info.time.strftime("%H:%M")) if x)
            print(f"\nRound {info.number}" + (f" ({when})" if when else ""))
        f = row.fixture
        place = f" at {f.venue}" + (f", pitch {f.pitch}" if f.pitch else "") if f.venue else ""
        print(f"  {f.label}{place}")
    empty = [r for r, labels in schedule.by_round().items() if not labels]
    if empty:
        print(f"\nEmpty rounds: {', '.join(map(str, empty))}")


def run_plan(args: argparse.Namespace, league: League, graph: nx.Graph) -> int:
    """`leaguegrid plan`: one schedule for K rounds, printed and optionally exported."""
    terms = parse_terms(args.score)
    if args.draws < 1:
        raise UsageError(f"--draws must be at least 1, not {args.draws}")
    seed = args.seed if args.seed is not None else fresh_seed()
    result = plan(league, graph, args.rounds, seed, draws=args.draws, terms=terms,
                  budget=args.budget)
    print(f"{league.name}: {args.rounds} rounds, seed {seed}"
          + ("" if args.seed is not None else f" (drawn; --seed {seed} gives this again)"))
    if result.status != "found" or result.schedule is None:
        return _report_failure(result, args.rounds)
    schedule = result.schedule
    if result.assignments is not None:
        print(f"Valid assignments for {args.rounds} rounds: {result.assignments:,} (exact)")
    for note in schedule.notes:
        print(f"Note: {note}")
    if schedule.rules_counted:
        print("Counts include: " + "; ".join(schedule.rules_counted))
    if schedule.rules_generator:
        print("Enforced by the generator only (not in the counts): "
              + "; ".join(schedule.rules_generator))
    if result.score is not None:
        print("Score:")
        for line in result.score.lines():
            print(f"  {line}")
    try:
        print_schedule(league, schedule)
        return _export(args, league, graph, result)
    except DatesError as err:
        print(f"leaguegrid plan: {err}", file=sys.stderr)
        return 1


def _report_failure(result: PlanResult, rounds: int) -> int:
    """Say why no schedule came out: proven impossible (3) or stopped (5)."""
    if result.status == "impossible":
        print(f"No schedule with {rounds} rounds exists:", file=sys.stderr)
        for reason in result.reasons:
            print(f"  {reason}", file=sys.stderr)
    elif result.status == "budget":
        print("Stopped at the budget before a schedule was found; nothing is proven. "
              "Try a larger --budget.", file=sys.stderr)
        for reason in result.reasons:
            print(f"  {reason}", file=sys.stderr)
    else:
        print("Cancelled before a schedule was found.", file=sys.stderr)
    return EXIT[result.status]


def _export(args: argparse.Namespace, league: League, graph: nx.Graph, result: PlanResult) -> int:
    """Write the files asked for; exit 4 when one cannot be written."""
    from leaguegrid.io.write.calendar_xlsx import CalendarSummary, write_calendar_xlsx
    from leaguegrid.io.write.csv_out import write_schedule_csv
    from leaguegrid.io.write.ics import write_ics_files

    schedule = result.schedule
    assert schedule is not None
    written: list[str] = []
    try:
        if args.out is not None:
            summary = CalendarSummary(
                fixtures=len(league.fixtures),
                clashes=graph.number_of_edges(),
                clash_reasons_count=len(league.clash_rows),
                min_rounds=_fewest(result, args.budget),
                assignments=result.assignments,
                seed=schedule.seed,
                rules_counted=list(schedule.rules_counted),
                rules_generator=list(schedule.rules_generator),
                notes=list(schedule.notes),
            )
            write_calendar_xlsx(args.out, league, schedule, summary)
            written.append(str(args.out))
        if args.ics is not None:
            written += [str(p) for p in write_ics_files(args.ics, league, schedule)]
        if args.csv is not None:
            write_schedule_csv(args.csv, league, schedule)
            written.append(str(args.csv))
    except (ExportError, OSError) as err:
        print(f"leaguegrid plan: could not write: {err}", file=sys.stderr)
        return 4
    if written:
        print("\nWrote: " + ", ".join(written))
    return 0


def _fewest(result: PlanResult, budget: float) -> int | None:
    """The fewest rounds of the counting model for the summary, or None beyond the budget."""
    if result.model is None:
        return None
    try:
        return result.model.fewest_rounds(engine.Hooks(budget=budget))
    except (engine.BudgetExceeded, engine.Cancelled):
        return None


def parse_add(text: str | None) -> tuple[str, str] | None:
    """'NAME,NAME' -> the two names of a proposed clash (each a fixture, team or venue)."""
    if text is None:
        return None
    first, sep, second = text.partition(",")
    if not sep or not first.strip() or not second.strip():
        raise UsageError(f"--add takes two names separated by a comma, not {text!r}")
    return first.strip(), second.strip()


def split_names(option: str, text: str, least: int, most: int) -> list[str]:
    """An option's comma-separated names, between `least` and `most` of them, none blank."""
    parts = [p.strip() for p in text.split(",")]
    if not least <= len(parts) <= most or not all(parts):
        raise UsageError(f"{option} takes {least} to {most} comma-separated names, not {text!r}")
    return parts


def parse_round(text: str) -> int | dt.date:
    """A round number or an ISO date (YYYY-MM-DD)."""
    if text.isdigit() and int(text) >= 1:
        return int(text)
    try:
        return dt.date.fromisoformat(text)
    except ValueError as err:
        raise UsageError(f"{text!r} is neither a round number nor a date (YYYY-MM-DD)") from err


def run_whatif(args: argparse.Namespace, league: League, graph: nx.Graph) -> int:
    """`leaguegrid whatif`: every clash reason ranked by what waiving it would add, a proposed
    clash, a team joining, a venue closing."""
    from leaguegrid.scheduling import whatif as what

    add = parse_add(args.add)
    changes = []
    try:
        report = what.whatif(league, graph, args.rounds, add=add, budget=args.budget)
        hooks = engine.Hooks(budget=args.budget)
        if args.join:
            team, division, *venue = split_names("--join", args.join, 2, 3)
            changes.append(what.team_joins(league, args.rounds, team, division,
                                           venue[0] if venue else None, hooks=hooks))
        if args.close:
            venue, when = split_names("--close", args.close, 2, 2)
            what.resolve(league, f"venue: {venue}")  # an unknown venue is a usage error
            changes.append(what.venue_closes(league, graph, args.rounds, venue,
                                             parse_round(when), hooks=hooks))
    except ValueError as err:  # an unknown or ambiguous name, or the same fixture twice
        raise UsageError(str(err)) from err
    except (engine.BudgetExceeded, engine.Cancelled):
        report.complete = False
    if args.json:
        data = report.to_json()
        if changes:
            data["changes"] = [c.to_json() for c in changes]
        json.dump(data, sys.stdout, indent=2)
        sys.stdout.write("\n")
    else:
        _print_whatif(league, report)
        for change in changes:
            _print_change(change)
    return 0 if report.complete else 5


def _print_change(change) -> None:
    """Counts before and after a change to the league."""
    print(f"\nIf {change.change}: {_count_text(change.assignments_before)} -> "
          f"{_count_text(change.assignments_after)} valid assignments for {change.rounds} rounds; "
          f"fewest rounds {change.min_rounds_before} -> {change.min_rounds_after}")
    if change.fixtures_added:
        print(f"  new fixtures: {', '.join(change.fixtures_added)}")


def _count_text(value: int | None) -> str:
    return "not computed" if value is None else f"{value:,}"


def _print_whatif(league: League, report) -> None:
    """The ranked reasons as a table, then the proposed clash."""
    k = report.rounds
    print(f"{league.name}, {k} rounds: {_count_text(report.assignments)} valid assignments; "
          f"fewest rounds {report.min_rounds if report.min_rounds is not None else 'unknown'}")
    if report.reasons:
        print("\nWaiving one clash reason (every clash that exists only because of it):")
        print("Gain | Assignments if waived | Fewest rounds if waived | Clashes | Reason")
        for w in report.reasons:
            fewest = w.min_rounds_if_waived if w.min_rounds_if_waived is not None else "?"
            print(f"{_count_text(w.gain)} | {_count_text(w.assignments_if_waived)} | {fewest} | "
                  f"{len(w.edges)} | {w.reason} ({w.kind})")
    if report.added is not None:
        a = report.added
        print(f"\nAdding a clash between {a.first} and {a.second} ({len(a.edges)} new clashing "
              f"pairs): {_count_text(a.assignments_if_added)} assignments remain, "
              f"{_count_text(a.loss)} fewer; fewest rounds "
              f"{a.min_rounds_if_added if a.min_rounds_if_added is not None else 'unknown'}")
    if not report.complete:
        print("\nIncomplete: stopped at the budget; 'not computed' values are missing.")
