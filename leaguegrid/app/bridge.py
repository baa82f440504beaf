"""The thin layer between the window and the rest of LeagueGrid.

Every call into the reader, the clash graph, the engine, the schedules and the exports goes
through here, as plain functions; the window runs the slow ones in a worker thread
(`worker.Runner`) with `progress(fraction, stage)` and a `threading.Event` to cancel.
"""

from __future__ import annotations

import hashlib
import threading
from collections.abc import Callable
from pathlib import Path
from typing import Any

import networkx as nx

from leaguegrid.core.model import League, LoadResult, Reason, Schedule

Progress = Callable[[float, str], None]
DEMO_FOLDER = Path(__file__).resolve().parent.parent.parent / "demo_leagues"
LONG_WORK_SECONDS = 5.0  # above this estimate the window says how long counting may take
COUNT_BUDGET = 60.0  # seconds for one counts table, as on the command line


def demo_leagues() -> list[Path]:
    """The bundled demo workbooks, sorted by name."""
    return sorted(DEMO_FOLDER.glob("*.xlsx")) if DEMO_FOLDER.is_dir() else []


def sha256_of(path: str | Path) -> str:
    """The SHA-256 of a file's bytes, to notice a workbook changed since a project was saved."""
    digest = hashlib.sha256()
    with open(path, "rb") as handle:
        for chunk in iter(lambda: handle.read(1 << 16), b""):
            digest.update(chunk)
    return digest.hexdigest()


def load(path: str | Path, mapping: dict[str, str] | None = None) -> LoadResult:
    """Read a league workbook or CSV; `mapping` (our Fixtures column -> the file's, and
    "Shared": more of the file's columns, ";"-joined) is the window's column matching."""
    from leaguegrid.io.read.league_reader import load_league

    return load_league(path, columns=mapping or None)


def clash_graph(league: League, waived: list[Reason] | None = None) -> nx.Graph:
    """The league's clash graph; edges that exist only for waived reasons are left out."""
    from leaguegrid.clashes.graph import build_clash_graph, without_reasons

    graph = build_clash_graph(league)
    return without_reasons(graph, waived) if waived else graph


def estimate_seconds(graph: nx.Graph) -> float | None:
    """The engine's guess of how long the full polynomial takes (None when it cannot say)."""
    from leaguegrid import engine

    try:
        return float(engine.estimate_cost(graph).seconds)
    except Exception:  # an estimate is advice only; counting goes ahead without it
        return None


def count(league: League, graph: nx.Graph, progress: Progress, cancel: threading.Event,
          rounds: list[int] | None = None, budget: float | None = COUNT_BUDGET) -> Any:
    """The counts table (analysis.CountReport) of a league with the window's edits: pins, ties,
    splits and blocked rounds counted exactly; what the budget (seconds) cuts short is missing
    or a labelled estimate. The report's `notes` name contradictions that make every count 0."""
    from leaguegrid.app import counting as analysis

    return analysis.count_report(league, graph, rounds=rounds, budget=budget,
                                 progress=progress, cancel=cancel)


def count_with_estimate(league: League, graph: nx.Graph, progress: Progress,
                        cancel: threading.Event, budget: float | None = COUNT_BUDGET) -> Any:
    """The counts table, saying first how long the work may take when that is long."""
    text = long_work_text(estimate_seconds(graph), budget)
    if text is not None:
        progress(0.0, text)
    return count(league, graph, progress, cancel, budget=budget)


def long_work_text(seconds: float | None, budget: float | None) -> str | None:
    """What the window says before a long count: the engine's guess of the time, or, when
    that passes the budget, that what does not finish in time will be estimated."""
    if seconds is None or seconds <= LONG_WORK_SECONDS:
        return None
    if budget is not None and seconds > budget:
        return (f"Counting; the exact work may take longer than the {budget:.0f} s allowed: what "
                "does not finish in time is shown as a labelled estimate (Esc cancels)")
    return f"Counting; this may take about {seconds:.0f} s (Esc cancels)"


def polynomial_of_graph(graph: nx.Graph, progress: Progress, cancel: threading.Event) -> Any:
    """Only the chromatic polynomial of a graph (a long, cancellable computation)."""
    from leaguegrid import engine

    return engine.chromatic_polynomial(graph, hooks=engine.Hooks(progress=progress,
                                                                 cancel=cancel))


def expanded_polynomial(poly: Any) -> str:
    """The polynomial written out term by term."""
    from leaguegrid.core.polytext import expanded

    return expanded(poly)


def caution() -> str:
    """The one wording of the caution to check schedules against the association's rules and
    local regulations: the same the calendars carry."""
    from leaguegrid.io.write.calendar_xlsx import CAUTION

    return CAUTION


def export_calendar(path: str | Path, league: League, schedule: Schedule, graph: nx.Graph,
                    min_rounds: int | None) -> None:
    """The Excel calendar of a schedule, written atomically."""
    from leaguegrid.io.write.calendar_xlsx import CalendarSummary, write_calendar_xlsx

    summary = CalendarSummary.for_schedule(league, schedule, clashes=graph.number_of_edges(),
                                           min_rounds=min_rounds)
    write_calendar_xlsx(path, league, schedule, summary)


def export_csv(path: str | Path, league: League, schedule: Schedule) -> None:
    """The whole schedule as CSV, written atomically."""
    from leaguegrid.io.write.csv_out import write_schedule_csv

    write_schedule_csv(path, league, schedule)


PREVIEW_ROWS = 5000


def preview_sheets(path: str | Path,
                   limit: int = PREVIEW_ROWS) -> dict[str, list[tuple[int, list]]]:
    """Each sheet's non-empty rows as (row number, cells), read by the importer's own reader
    (io.sheets), so the row numbers are the ones its problems name; {} when unreadable.

    A CSV shows as its one sheet, Fixtures; a cell holding a spreadsheet error shows its code.
    """
    from leaguegrid.io.read.sheets import UnreadableFile, read_book

    try:
        book = read_book(Path(path))
    except UnreadableFile:  # a damaged file has no preview; its problems are listed instead
        return {}
    return {name: _preview_rows(book.sheets[name], limit)
            for name in book.sheet_names if name in book.sheets}


def _preview_rows(sheet: Any, limit: int) -> list[tuple[int, list]]:
    """A RawSheet's rows (and its error cells, such as #REF!) as (row number, cells A, B, ...)."""
    rows: dict[int, dict[int, object]] = {n: dict(cells) for n, cells in sheet.rows}
    for n, column, code in sheet.error_cells:
        rows.setdefault(n, {})[column] = code
    out = []
    for n in sorted(rows)[:limit]:
        cells = rows[n]
        out.append((n, [cells.get(c) for c in range(1, max(cells) + 1)]))
    return out


def ics_plan(league: League, schedule: Schedule) -> tuple[list[str], str | None]:
    """The iCalendar file names an export would write, or the reason it cannot (no dates)."""
    from leaguegrid.io.write import ics

    try:
        calendars = ics.ics_calendars(league, schedule)
    except ics.IcsError as err:
        return [], str(err)
    taken: set[str] = set()
    return [ics.file_name(prefix, name, taken) for prefix, name, _rows in calendars], None


def export_ics(folder: str | Path, league: League, schedule: Schedule) -> list[Path]:
    """The league, team and club calendars, each written atomically."""
    from leaguegrid.io.write.ics import write_ics_files

    return write_ics_files(folder, league, schedule)


def calendar_sheet_plan(league: League) -> list[str]:
    """The sheets an Excel calendar holds, in order (team, venue and club sheets by name)."""
    teams = sorted(set(league.teams) | {t for f in league.fixtures for t in f.teams},
                   key=str.casefold)
    venues = sorted({f.venue for f in league.fixtures if f.venue}, key=str.casefold)
    clubs = sorted({t.club for t in league.teams.values() if t.club}, key=str.casefold)
    return (["Calendar", "Summary"] + teams + [f"Venue {v}" for v in venues]
            + [f"Club {c}" for c in clubs])


def write_text_atomic(path: str | Path, text: str) -> None:
    """Write a text file through a temporary file in the same folder, then move it into place."""
    from leaguegrid.io.write.atomic import atomic_write

    with atomic_write(path, "w", encoding="utf-8", newline="\n") as handle:
        handle.write(text)


def check_schedule(league: League, graph: nx.Graph, schedule: Schedule) -> list[Any]:
    """Every clash or rule the schedule breaks (schedule.check Violations; empty: it holds)."""
    from leaguegrid.scheduling.check import check_schedule as check

    return check(league, graph, schedule)


def round_titles(league: League, k: int) -> list[str]:
    """Row titles for rounds 1..k: the number, and the date and time when the league has them."""
    from leaguegrid.scheduling.dates import DatesError, round_dates

    try:
        infos = round_dates(league, k)
    except DatesError:
        infos = []
    titles = []
    for r in range(1, k + 1):
        info = infos[r - 1] if r - 1 < len(infos) else None
        extra = []
        if info is not None and info.date is not None:
            extra.append(info.date.isoformat())
        if info is not None and info.time is not None:
            extra.append(info.time.strftime("%H:%M"))
        titles.append(f"Round {r}" + (f"\n{' '.join(extra)}" if extra else ""))
    return titles


def schedule_summary(schedule: Schedule) -> str:
    """One paragraph: rounds, seed, how it was made, which rules the counts include."""
    how = {"uniform": "drawn uniformly at random from every valid assignment",
           "search": "found by the rule-aware generator",
           "edited": "edited by hand"}.get(schedule.method, schedule.method)
    parts = [f"{schedule.rounds} rounds, seed {schedule.seed}, {how}."]
    if schedule.rules_counted:
        parts.append("Counted exactly: " + "; ".join(schedule.rules_counted) + ".")
    if schedule.rules_generator:
        parts.append("Enforced by the generator only: " + "; ".join(schedule.rules_generator)
                     + ".")
    parts += [(n[:1].upper() + n[1:]).rstrip(".") + "." for n in schedule.notes]
    return " ".join(parts)


def rules_note(league: League | None) -> str:
    """Which rules the counts include and which only the schedule generator enforces."""
    if league is None:
        return ""
    from leaguegrid.scheduling.rules import generator_rules

    try:
        described = generator_rules(league).describe()
    except AttributeError:
        described = []
    if not described:
        return ""
    return ("Only the schedule generator enforces: " + "; ".join(described) +
            " (the counts do not include these).")


SCORE_TERMS = ("balance", "alternation", "spread", "slots", "rest", "travel")


def draw(league: League, graph: nx.Graph, k: int, seed: int, draws: int, progress: Progress,
         cancel: threading.Event, terms: dict[str, float] | None = None,
         budget: float | None = None) -> tuple[Schedule | None, str]:
    """A schedule for K rounds from a seed (best of `draws` by score `terms` when more than
    one), and a sentence saying what happened; (None, why) when none exists or work stopped."""
    from leaguegrid.scheduling.draw import plan

    if draws > 1 and not terms:
        terms = dict.fromkeys(SCORE_TERMS, 1.0)
    result = plan(league, graph, k, seed, draws=draws, terms=terms if draws > 1 else None,
                  budget=budget, progress=progress, cancel=cancel)
    if result.status == "found" and result.schedule is not None:
        schedule = result.schedule
        if result.score is not None:
            schedule.notes = [*schedule.notes, *("score " + line for line in result.score.lines())]
        return schedule, schedule_summary(schedule)
    if result.status == "impossible":
        return None, f"No schedule with {k} rounds: " + "; ".join(result.reasons)
    if result.status == "budget":
        return None, f"No schedule found for {k} rounds within the time allowed."
    return None, "Drawing was cancelled."


def whatif(league: League, graph: nx.Graph, k: int, progress: Progress,
           cancel: threading.Event, budget: float | None = COUNT_BUDGET) -> tuple[Any, dict]:
    """The clash reasons ranked by what waiving each gains for K rounds (schedule.whatif), and
    each reason's text -> its Reason, so the window can waive it."""
    from leaguegrid.clashes.graph import reason_edges
    from leaguegrid.scheduling.constraints import with_splits
    from leaguegrid.scheduling.whatif import whatif as rank

    result = rank(league, graph, k, budget=budget, progress=progress, cancel=cancel)
    by_text = {str(r): r for r in reason_edges(with_splits(league, graph))}
    return result, by_text
