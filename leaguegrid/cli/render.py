"""Text and JSON output of the command line: problems, the check listing, the counts table."""

from __future__ import annotations

import json
from collections import Counter
from typing import TextIO

import networkx as nx

from leaguegrid.app.counting import CountReport, Number
from leaguegrid.core.model import League, LoadResult, Problem

SHORT_DIGITS = 15  # numbers longer than this also get a short scientific form


def print_problems(problems: list[Problem], out: TextIO) -> None:
    """Every problem, one per line, errors first."""
    for problem in sorted(problems, key=lambda p: p.severity != "error"):
        print(str(problem), file=out)


def short_form(value: int) -> str:
    """A short scientific form for a huge integer, e.g. 1.23e45 (for reading, never exact)."""
    digits = str(abs(value))
    if len(digits) <= SHORT_DIGITS:
        return ""
    mantissa = f"{digits[0]}.{digits[1:3]}"
    return f"{'-' if value < 0 else ''}{mantissa}e{len(digits) - 1}"


def number_text(value: Number) -> str:
    """An exact integer with digit grouping, an estimate marked as one, or 'not computed'."""
    if value is None:
        return "not computed"
    if isinstance(value, int):
        short = short_form(value)
        return f"{value:,}" + (f" (~{short})" if short else "")
    return (f"estimate ~{value.value:.3g} (likely between {value.low:.3g} and {value.high:.3g}, "
            f"{value.method})")


def number_json(value: Number) -> int | dict | None:
    """JSON form: an exact int, an estimate object, or null."""
    if value is None or isinstance(value, int):
        return value
    return {"value": value.value, "low": value.low, "high": value.high, "method": value.method}


def print_check(result: LoadResult, graph: nx.Graph | None, out: TextIO) -> None:
    """What `check` prints: the league's contents, then every problem."""
    league = result.league
    if league is not None:
        _print_contents(league, graph, out)
    errors = result.errors
    warnings = [p for p in result.problems if p.severity == "warning"]
    if result.problems:
        print(f"\nProblems: {len(errors)} error(s), {len(warnings)} warning(s)", file=out)
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
        print(f"Clash graph: {graph.number_of_nodes()} fixtures, "
              f"{graph.number_of_edges()} clashing pairs", file=out)
    print("\nFixtures:", file=out)
    for f in league.fixtures:
        extra = [x for x in (f.division, f.venue and f"at {f.venue}" + (f" pitch {f.pitch}"
                 if f.pitch else "")) if x]
        if f.pin is not None:
            extra.append(f"round {f.pin}" + (" (played)" if f.played else ""))
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
        "rules_counted": report.rules_counted,
        "rules_generator": report.rules_generator,
        "notes": report.notes,
    }


def print_counts(report: CountReport, league: League, out: TextIO, as_json: bool) -> None:
    """What `count` prints, as text or as one JSON object."""
    if as_json:
        json.dump(counts_json(report), out, indent=2)
        out.write("\n")
        return
    print(f"{league.name}: {report.fixtures} fixtures, {report.clashes} clashing pairs"
          + (f", {len(league.pins)} pinned" if report.pinned else ""), file=out)
    low, high = report.min_rounds_bounds
    if report.min_rounds is not None:
        print(f"Fewest rounds: {report.min_rounds}", file=out)
    else:
        print(f"Fewest rounds: not proven; bounds {low} to {high} (a clash clique of {low} "
              f"below, a schedule with {high} rounds above)", file=out)
    poly = report.polynomial_text
    print(f"Chromatic polynomial: {poly if poly is not None else 'not computed within the budget'}",
          file=out)
    if report.pinned:
        print("(The polynomial and the groupings are of the clash graph itself; assignments and "
              "every-round-used respect the pins, ties, played and blocked rounds.)", file=out)
    for note in report.notes:
        print(f"Note: {note}", file=out)
    if report.rules_counted:
        print("Counts include: " + "; ".join(report.rules_counted), file=out)
    if report.rules_generator:
        print("Not in the counts (only the schedule generator enforces them): "
              + "; ".join(report.rules_generator), file=out)
    print("", file=out)
    print("Rounds | Assignments | Every round used | Groupings", file=out)
    for row in report.rows:
        cells = [number_text(v) for v in (row.assignments, row.all_rounds_used, row.groupings)]
        print(f"{row.rounds:>6} | " + " | ".join(cells), file=out)
    if not report.complete:
        what = "cancelled" if report.cancelled else "stopped at the budget"
        print(f"\nIncomplete: {what}; 'not computed' and estimates are not exact.", file=out)
