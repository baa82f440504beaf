"""Publishing a schedule: the Excel calendar, one CSV, iCalendar files for the league, each team
and each club. The schedule is dated once and the same dated schedule goes to every writer."""

from __future__ import annotations

import datetime as dt
from collections.abc import Sequence
from dataclasses import dataclass, field
from pathlib import Path

import networkx as nx

from leaguegrid import engine
from leaguegrid.core.dated import DatedSchedule, club_teams, team_names, venue_names
from leaguegrid.core.model import League, Schedule
from leaguegrid.core.wording import breaks_text
from leaguegrid.io.write import ics
from leaguegrid.io.write.atomic import ExportError, WriteError, refuse_overwriting_input
from leaguegrid.io.write.calendar_xlsx import CalendarSummary, write_calendar_xlsx
from leaguegrid.io.write.csv_out import write_schedule_csv
from leaguegrid.io.write.names import sheet_title
from leaguegrid.scheduling.breaks import count_breaks
from leaguegrid.scheduling.dates import DatesError, date_schedule
from leaguegrid.scheduling.optimise import breaks_bound


@dataclass
class ExportTargets:
    """Where to write: an Excel calendar file, a CSV file, a folder for iCalendar files."""

    xlsx: Path | None = None
    csv: Path | None = None
    ics: Path | None = None


class ExportFailed(Exception):
    """A file could not be written (nothing half-written is left); `written` were written."""

    def __init__(self, message: str, written: list[Path]) -> None:
        super().__init__(message)
        self.written = written


@dataclass
class ExportOutcome:
    """The files written, in order."""

    written: list[Path] = field(default_factory=list)


def summary_for(league: League, graph: nx.Graph, schedule: Schedule,
                min_rounds: int | None) -> CalendarSummary:
    """The numbers the calendar's Summary sheet shows beside a schedule, its breaks with the
    published lower bound where one is known."""
    breaks = count_breaks(league, schedule.assignment).total
    text = breaks_text(breaks, breaks_bound(league, schedule.rounds)).removeprefix("Breaks: ")
    return CalendarSummary.for_schedule(league, schedule, clashes=graph.number_of_edges(),
                                        min_rounds=min_rounds, breaks=text)


def export_schedule(league: League, graph: nx.Graph, schedule: Schedule,
                    targets: ExportTargets, min_rounds: int | None = None,
                    now: dt.datetime | None = None,
                    inputs: Sequence[Path | None] = (),
                    hooks: engine.Hooks | None = None) -> ExportOutcome:
    """Write every target asked for, each through a temporary file moved into place; raises
    ExportFailed naming the problem (files written before it stay written). No target may be
    the league's file nor one of `inputs` (a project file, a previous schedule). `hooks`
    hears which file is being written and may cancel between files."""
    hooks = hooks or engine.Hooks()
    out = ExportOutcome()
    try:
        for target in (targets.xlsx, targets.csv):
            if target is not None:
                refuse_overwriting_input(target, inputs)
        dated = date_schedule(league, schedule, now)
        if targets.xlsx is not None:
            hooks.check()
            hooks.report(0.1, f"Writing {Path(targets.xlsx).name}")
            write_calendar_xlsx(targets.xlsx, dated,
                                summary_for(league, graph, schedule, min_rounds))
            out.written.append(Path(targets.xlsx))
        if targets.csv is not None:
            hooks.check()
            hooks.report(0.5, f"Writing {Path(targets.csv).name}")
            write_schedule_csv(targets.csv, dated)
            out.written.append(Path(targets.csv))
        if targets.ics is not None:
            hooks.check()
            hooks.report(0.6, "Writing the calendars")
            out.written += ics.write_ics_files(targets.ics, dated)
    except (ExportError, DatesError, OSError) as err:
        raise ExportFailed(failure_text(err), out.written) from err
    return out


def failure_text(err: Exception) -> str:
    """The one sentence for a write that failed or was refused, starting "could not write"."""
    return str(err) if isinstance(err, WriteError) else f"could not write: {err}"


def ics_file_names(league: League, schedule: Schedule) -> tuple[list[str], str | None]:
    """The iCalendar file names an export would write, or the reason it cannot (no dates)."""
    try:
        calendars = ics.ics_calendars(_dated(league, schedule))
    except (ics.IcsError, DatesError) as err:
        return [], str(err)
    taken: set[str] = set()
    return [ics.file_name(prefix, name, taken) for prefix, name, _rows in calendars], None


def calendar_sheet_names(league: League) -> list[str]:
    """The sheets an Excel calendar holds, in order (team, venue and club sheets by name)."""
    teams = team_names(league)
    venues = venue_names(league.fixtures)
    taken: set[str] = set()
    return [sheet_title(name, taken) for name in
            ["Calendar", "Summary"] + teams + [f"Venue {v}" for v in venues]
            + [f"Club {c}" for c in club_teams(league, teams)]]


def _dated(league: League, schedule: Schedule) -> DatedSchedule:
    return date_schedule(league, schedule)
