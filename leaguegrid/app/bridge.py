"""TRANSITIONAL: the window's former calls, each delegating to the application layer; removed
once the window calls leaguegrid.app's use cases directly."""

from __future__ import annotations

import threading
from collections.abc import Callable
from pathlib import Path
from typing import Any

import networkx as nx

from leaguegrid import engine
from leaguegrid.app import counting, export, league, planning
from leaguegrid.app import whatif as what
from leaguegrid.app.defaults import COUNT_BUDGET, LONG_WORK_SECONDS, PREVIEW_ROWS
from leaguegrid.app.demos import demo_leagues  # noqa: F401
from leaguegrid.core import wording
from leaguegrid.core.model import League, LoadResult, Reason, Schedule
from leaguegrid.core.polytext import expanded
from leaguegrid.io.write.atomic import atomic_write
from leaguegrid.scheduling.dates import DatesError, round_dates

Progress = Callable[[float, str], None]
sha256_of = league.sha256_of
clash_graph = league.clash_graph


def _hooks(progress: Progress | None, cancel: threading.Event | None,
           budget: float | None = None) -> engine.Hooks:
    return engine.Hooks(progress, cancel, budget)


def load(path: str | Path, mapping: dict[str, str] | None = None) -> LoadResult:
    return league.open_league(path, mapping).result


def preview_sheets(path: str | Path, limit: int = PREVIEW_ROWS) -> dict:
    return league.preview_sheets(path, limit)


def estimate_seconds(graph: nx.Graph) -> float | None:
    return counting.estimate_seconds(graph)


def count(lg: League, graph: nx.Graph, progress: Progress, cancel: threading.Event,
          rounds: list[int] | None = None, budget: float | None = COUNT_BUDGET) -> Any:
    return counting.count_report(lg, graph, rounds=rounds, hooks=_hooks(progress, cancel, budget))


def count_with_estimate(lg: League, graph: nx.Graph, progress: Progress,
                        cancel: threading.Event, budget: float | None = COUNT_BUDGET) -> Any:
    return counting.count_league(lg, graph, hooks=_hooks(progress, cancel, budget))


def long_work_text(seconds: float | None, budget: float | None) -> str | None:
    return wording.long_work_text(seconds, budget, LONG_WORK_SECONDS)


def polynomial_of_graph(graph: nx.Graph, progress: Progress, cancel: threading.Event) -> Any:
    return engine.chromatic_polynomial(graph, hooks=_hooks(progress, cancel))


def expanded_polynomial(poly: Any) -> str:
    return expanded(poly)


def caution() -> str:
    return wording.CAUTION


def export_calendar(path: str | Path, lg: League, schedule: Schedule, graph: nx.Graph,
                    min_rounds: int | None) -> None:
    export.export_schedule(lg, graph, schedule, export.ExportTargets(xlsx=Path(path)),
                           min_rounds)


def export_csv(path: str | Path, lg: League, schedule: Schedule) -> None:
    export.export_schedule(lg, nx.Graph(), schedule, export.ExportTargets(csv=Path(path)))


def export_ics(folder: str | Path, lg: League, schedule: Schedule) -> list[Path]:
    return export.export_schedule(lg, nx.Graph(), schedule,
                                  export.ExportTargets(ics=Path(folder))).written


def ics_plan(lg: League, schedule: Schedule) -> tuple[list[str], str | None]:
    return export.ics_file_names(lg, schedule)


def calendar_sheet_plan(lg: League) -> list[str]:
    return export.calendar_sheet_names(lg)


def write_text_atomic(path: str | Path, text: str) -> None:
    with atomic_write(path, "w", encoding="utf-8", newline="\n") as handle:
        handle.write(text)


def check_schedule(lg: League, graph: nx.Graph, schedule: Schedule) -> list[Any]:
    return planning.schedule_problems(lg, graph, schedule)


def round_titles(lg: League, k: int) -> list[str]:
    try:
        infos = round_dates(lg, k)
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
    return wording.schedule_summary(schedule)


def rules_note(lg: League | None) -> str:
    return wording.rules_note(planning.generator_only_rules(lg))


def draw(lg: League, graph: nx.Graph, k: int, seed: int, draws: int, progress: Progress,
         cancel: threading.Event, terms: dict[str, float] | None = None,
         budget: float | None = None) -> tuple[Schedule | None, str]:
    outcome = planning.make_schedule(lg, graph, k, seed, draws, terms,
                                     hooks=_hooks(progress, cancel, budget))
    return outcome.schedule, outcome.message


def whatif(lg: League, graph: nx.Graph, k: int, progress: Progress,
           cancel: threading.Event, budget: float | None = COUNT_BUDGET) -> tuple[Any, dict]:
    outcome = what.what_if(lg, graph, k, hooks=_hooks(progress, cancel, budget))
    return outcome.report, outcome.reasons


__all__ = ["COUNT_BUDGET", "Reason"]
