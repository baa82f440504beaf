"""What the command line prints, as text or JSON: problems, the check listing, the counts
table, a schedule, the what-if report. Numbers and plurals come from core.wording."""

from __future__ import annotations

import json
from collections import Counter
from typing import TextIO

import networkx as nx

from leaguegrid.app.counting import CountReport, Number
from leaguegrid.app.league import OpenedLeague
from leaguegrid.app.planning import PlanOutcome, requests_unmet
from leaguegrid.app.seasons import team_seasons
from leaguegrid.app.whatif import WhatIfOutcome
from leaguegrid.core.model import League, Problem
from leaguegrid.core.wording import (
    POLYNOMIAL_LEFT,
    REASON_KINDS,
    SCHEDULES_EXPLAINED,
    count_text,
    counted_note,
    estimate_line,
    estimate_marker,
    estimate_note,
    estimated_rows_head,
    fewest_lower_text,
    fewest_upper_text,
    incomplete_text,
    is_estimate,
    plural,
    rules_note,
    season_warnings_head,
    times_text,
    when_text,
)
from leaguegrid.scheduling.dates import DatesError, dated_fixtures


def print_problems(problems: list[Problem], out: TextIO) -> None:
    """Every problem, one per line, errors first."""
    for problem in sorted(problems, key=lambda p: p.severity != "error"):
        print(str(problem), file=out)


ESTIMATED = (("assignments", "schedules"), ("all_rounds_used", "every round"),
             ("groupings", "groupings"))  # a row's numbers: JSON key, label under the table


def number_json(value: Number) -> int | dict | None:
    """JSON form: an exact int, an estimate object (integers `value`, `low`, `high`, with its
    samples and confidence), or null (also for an estimate with none found: see its note)."""
    if value is None or isinstance(value, int):
        return value
    if value.samples and not value.found:
        return None
    return {"value": value.value, "low": value.low, "high": value.high, "method": value.method,
            "confidence": 0.95, "samples": value.samples, "found": value.found,
            "too_few_samples": value.too_few}


def print_check(opened: OpenedLeague, out: TextIO) -> None:
    """What `check` prints: the league's contents, then every problem."""
    result = opened.result
    if result.league is not None:
        _print_contents(result.league, opened.graph, out)
    errors = result.errors
    warnings = [p for p in result.problems if p.severity == "warning"]
    if result.problems:
        print(f"\nProblems: {plural(len(errors), 'error')}, {plural(len(warnings), 'warning')}",
              file=out)
        print_problems(result.problems, out)
    else:
        print("\nProblems: none", file=out)
    print("Usable: yes" if result.ok else "Usable: no", file=out)


def _print_contents(league: League, graph: nx.Graph | None, out: TextIO) -> None:
    """Counts of what was read, then the fixtures, teams, venues and clash reasons."""
    divisions = sorted({f.division for f in league.fixtures if f.division})
    venues = sorted({f.venue for f in league.fixtures if f.venue})
    print(f"League: {league.name}  ({league.source})", file=out)
    print(f"Fixtures: {len(league.fixtures)}  Teams: {len(league.teams)}  "
          f"Venues: {len(venues)}  Divisions: {len(divisions)}  "
          f"Clash rows: {len(league.clash_rows)}  Pinned: {len(league.pins)}", file=out)
    if graph is not None:
        print(f"Clash graph: {plural(graph.number_of_nodes(), 'fixture')}, "
              f"{plural(graph.number_of_edges(), 'clashing pair')}", file=out)
    print("\nFixtures:", file=out)
    for f in league.fixtures:
        extra = [x for x in (f.division, f.venue and f"at {f.venue}" + (f" pitch {f.pitch}"
                 if f.pitch else "")) if x]
        if f.pin is not None:
            extra.append(f"round {f.pin}" + (" (played)" if f.played else ""))
        if f.time is not None:
            extra.append(f"starts {f.time.strftime('%H:%M')}")
        print(f"  {f.label}" + (f"  [{', '.join(extra)}]" if extra else ""), file=out)
    if league.teams:
        print("\nTeams: " + ", ".join(sorted(league.teams)), file=out)
    if venues:
        print("Venues: " + ", ".join(venues), file=out)
    if graph is not None and graph.number_of_edges():
        reasons: Counter[str] = Counter()
        for _, _, data in graph.edges(data=True):
            for reason in data.get("reasons", []):
                reasons[str(reason)] += 1
        print("\nClashes (reason: clashing pairs):", file=out)
        for text, n in sorted(reasons.items(), key=lambda kv: (-kv[1], kv[0])):
            print(f"  {text}: {n}", file=out)


def counts_json(report: CountReport) -> dict:
    """The count command's JSON object."""
    return {
        "fixtures": report.fixtures,
        "clashes": report.clashes,
        "min_rounds": report.min_rounds,
        "min_rounds_bounds": list(report.min_rounds_bounds),
        "min_rounds_proof": min_rounds_proof_json(report),
        "pinned": report.pinned,
        "polynomial": None if report.polynomial is None
        else [int(c) for c in report.polynomial.coeffs()],
        "counts": [
            {
                "rounds": row.rounds,
                "exact": row.exact,
                "assignments": number_json(row.assignments),
                "all_rounds_used": number_json(row.all_rounds_used),
                "groupings": number_json(row.groupings),
            }
            for row in report.rows
        ],
        "complete": report.complete,
        "stopped": None if report.complete else (
            "cancelled" if report.cancelled else (report.stopped or ["budget"])),
        "rules_counted": report.rules_counted,
        "rules_generator": report.rules_generator,
        "notes": report.notes + [note for row in report.rows for key, label in ESTIMATED
                                 if (note := estimate_note(row.rounds, label,
                                                           getattr(row, key))) is not None],
    }


def min_rounds_proof_json(report: CountReport) -> dict | None:
    """The bounds on the fewest rounds with the method of each side and the schedule above."""
    if report.min_rounds_methods is None:
        return None
    low, high = report.min_rounds_bounds
    low_method, high_method = report.min_rounds_methods
    return {"low": low, "high": high, "low_method": low_method, "high_method": high_method,
            "schedule": report.min_rounds_schedule}


def print_counts(report: CountReport, league: League, out: TextIO, as_json: bool) -> None:
    """What `count` prints, as text or as one JSON object."""
    if as_json:
        json.dump(counts_json(report), out, indent=2)
        out.write("\n")
        return
    print(f"{league.name}: {plural(report.fixtures, 'fixture')}, "
          f"{plural(report.clashes, 'clashing pair')}"
          + (f", {len(league.pins)} pinned" if report.pinned else ""), file=out)
    low, high = report.min_rounds_bounds
    if report.min_rounds is not None:
        print(f"Fewest rounds: {report.min_rounds}", file=out)
    else:
        print(f"Fewest rounds: not proven; between {low} and {high}", file=out)
    if report.min_rounds_methods is not None and high:
        print(fewest_lower_text(low, report.min_rounds_methods[0]), file=out)
        print(fewest_upper_text(high, report.min_rounds_methods[1]), file=out)
    poly = report.polynomial_text
    if poly is None:
        poly = POLYNOMIAL_LEFT if report.polynomial_cut else "not computed within the budget"
    print(f"Chromatic polynomial: {poly}", file=out)
    if report.pinned:
        print("(The polynomial and the groupings are of the clash graph itself: they ignore "
              "pins; the schedules respect the pins, Together, played and blocked rounds.)",
              file=out)
    for note in report.notes:
        print(f"Note: {note}", file=out)
    for line in (counted_note(report.rules_counted), rules_note(report.rules_generator)):
        if line:
            print(line, file=out)
    print("", file=out)
    print(SCHEDULES_EXPLAINED, file=out)
    print("Rounds | Schedules | Using every round | Groupings", file=out)
    for row in report.rows:
        cells = [estimate_marker(v) if is_estimate(v) else count_text(v)
                 for v in (row.assignments, row.all_rounds_used, row.groupings)]
        print(f"{row.rounds:>6} | " + " | ".join(cells), file=out)
    for row in report.rows:
        estimated = [(label, getattr(row, key)) for key, label in ESTIMATED
                     if is_estimate(getattr(row, key))]
        if estimated:
            print(f"\n{estimated_rows_head(row.rounds)}", file=out)
            for label, value in estimated:
                print(estimate_line(label, value), file=out)
    if not report.complete:
        print(f"\n{incomplete_text(report.cancelled, report.stopped)}", file=out)


def print_plan(outcome: PlanOutcome, league: League, out: TextIO, err: TextIO) -> None:
    """What `plan` prints: the seed, the count, notes and rules, the score, the schedule round
    by round, then the season warnings (what a family would notice); why there is none on
    `err`."""
    seed, k = outcome.seed, outcome.rounds
    print(f"{league.name}: {plural(k, 'round')}, seed {seed}"
          + ("" if outcome.seed_given else f" (drawn; --seed {seed} gives this again)"), file=out)
    schedule, result = outcome.schedule, outcome.result
    if schedule is None:
        if result.status == "impossible":
            print(f"No schedule with {plural(k, 'round')} exists:", file=err)
        elif result.status == "budget":
            print("Stopped at the budget before a schedule was found; nothing is proven. "
                  "Try a larger --budget.", file=err)
        else:
            print("Cancelled before a schedule was found.", file=err)
        for reason in result.reasons:
            print(f"  {reason}", file=err)
        return
    if result.assignments is not None:
        print(f"Valid schedules for {plural(k, 'round')}: {count_text(result.assignments)} "
              "(exact)", file=out)
    if outcome.breaks_line:
        print(outcome.breaks_line, file=out)
    for note in schedule.notes:
        print(f"Note: {note}", file=out)
    for line in (counted_note(schedule.rules_counted), rules_note(schedule.rules_generator)):
        if line:
            print(line, file=out)
    try:
        rows = dated_fixtures(league, schedule)
    except DatesError as problem:
        print(f"leaguegrid plan: {problem}", file=err)
        return
    current = None
    for row in rows:
        info = row.round
        if info.number != current:
            current = info.number
            when = when_text(info.date, info.time)
            print(f"\nRound {info.number}" + (f" ({when})" if when else ""), file=out)
        f = row.fixture
        place = f" at {f.venue}" + (f", pitch {f.pitch}" if f.pitch else "") if f.venue else ""
        print(f"  {f.label}{place}", file=out)
    empty = [r for r, labels in schedule.by_round().items() if not labels]
    if empty:
        print(f"\nEmpty rounds: {', '.join(map(str, empty))}", file=out)
    warnings = team_seasons(league, schedule).warnings
    print(f"\n{season_warnings_head(len(warnings))}", file=out)
    for line in warnings:
        print(f"  {line}", file=out)


def plan_json(outcome: PlanOutcome, league: League, rules: list[tuple[str, bool]],
              byes: dict[str, list[int]], seconds: float) -> dict:
    """`plan --json`: the schedule, its breaks against the bound, byes, rules and the season
    warnings, as data."""
    schedule, result = outcome.schedule, outcome.result
    method = None
    if schedule is not None:
        method = {"optimised": "optimised", "uniform": "uniform"}.get(
            schedule.method, "best-of" if result.score is not None else schedule.method)
    fixtures = []
    if schedule is not None:
        for row in dated_fixtures(league, schedule):
            f = row.fixture
            fixtures.append({"label": f.label, "home": f.home, "away": f.away,
                             "venue": f.venue, "pitch": f.pitch, "division": f.division,
                             "round": row.round.number,
                             "date": row.round.date.isoformat() if row.round.date else None})
    unmet = [] if schedule is None else requests_unmet(league, schedule)
    requests = [{"team": q.team, "round": q.round, "side": q.side, "reason": q.reason,
                 "met": q not in unmet} for q in league.requests] if schedule else []
    breaks = None if outcome.breaks is None else {
        "total": outcome.breaks.total, "lower_bound": outcome.breaks_bound,
        "optimal": outcome.optimal, "per_team": outcome.breaks.per_team}
    return {"rounds": outcome.rounds, "seed": outcome.seed, "method": method,
            "status": result.status, "reasons": result.reasons,
            "assignments": result.assignments, "fixtures": fixtures, "breaks": breaks,
            "byes": byes, "rules": [{"rule": text, "met": met} for text, met in rules],
            "requests": requests,
            "warnings": [] if schedule is None else list(team_seasons(league, schedule).warnings),
            "notes": schedule.notes if schedule is not None else [],
            "seconds": round(seconds, 3)}


def print_changes(by_club: dict[str, list[str]], out: TextIO) -> None:
    """What the re-plan moved, club by club."""
    if not by_club:
        print("\nChanges: none; every fixture is where it was", file=out)
        return
    print("\nChanges by club:", file=out)
    for club, lines in by_club.items():
        print(f"  {club}:", file=out)
        for line in lines:
            print(f"    {line}", file=out)


def print_written(paths: list, out: TextIO) -> None:
    """The files an export wrote."""
    if paths:
        print("\nWrote: " + ", ".join(str(p) for p in paths), file=out)


def print_whatif(outcome: WhatIfOutcome, league: League, out: TextIO, as_json: bool) -> None:
    """What `whatif` prints: the reasons ranked by gain, the proposed clash, the changes."""
    if as_json:
        json.dump(outcome.to_json(), out, indent=2)
        out.write("\n")
        return
    report = outcome.report
    k = report.rounds
    fewest = report.min_rounds if report.min_rounds is not None else "unknown"
    print(f"{league.name}, {plural(k, 'round')}: {count_text(report.assignments)} valid "
          f"schedules; fewest rounds {fewest}", file=out)
    if report.reasons:
        print("\nWaiving one clash reason (every clash that exists only because of it):",
              file=out)
        print("Schedules gained | Schedules if waived | Fewest rounds if waived | "
              "Clashes | Reason", file=out)
        for w in report.reasons:
            more = ("not computed" if w.assignments_if_waived is None or report.assignments is None
                    else times_text(w.assignments_if_waived, report.assignments))
            if_waived = w.min_rounds_if_waived if w.min_rounds_if_waived is not None else "?"
            print(f"{more} | {count_text(w.assignments_if_waived)} | {if_waived} | "
                  f"{len(w.edges)} | {w.reason} ({REASON_KINDS.get(w.kind, w.kind)})", file=out)
    if report.added is not None:
        a = report.added
        fewest_added = a.min_rounds_if_added if a.min_rounds_if_added is not None else "unknown"
        print(f"\nAdding a clash between {a.first} and {a.second} "
              f"({plural(len(a.edges), 'new clashing pair')}): "
              f"{count_text(a.assignments_if_added)} schedules remain, "
              f"{count_text(a.loss)} fewer; fewest rounds {fewest_added}", file=out)
    for change in outcome.changes:
        print(f"\nIf {change.change}: {count_text(change.assignments_before)} -> "
              f"{count_text(change.assignments_after)} valid schedules for "
              f"{plural(change.rounds, 'round')}; fewest rounds {change.min_rounds_before} -> "
              f"{change.min_rounds_after}", file=out)
        if change.fixtures_added:
            print(f"  new fixtures: {', '.join(change.fixtures_added)}", file=out)
    if not report.complete:
        print("\nIncomplete: stopped at the budget; 'not computed' values are missing.",
              file=out)
