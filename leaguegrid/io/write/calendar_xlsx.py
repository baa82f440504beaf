"""The Excel calendar: the league's schedule, a sheet per team, venue and club, and a summary.

Rules (for the README):
- Sheets, in order: "Calendar" (a row per fixture, sorted by round, then division, venue, pitch
  and label), "Summary" (the numbers, the rules the schedule meets, the seed and the caution),
  then a sheet per team (named by the team), per venue ("Venue <name>") and per club
  ("Club <name>", the fixtures of the teams whose Club is that name). Team, venue and club
  sheets list fixtures in date and time order.
- Sheet names follow Excel's rules (leaguegrid/io/write/names.py): the characters Excel forbids
  ([ ] : * ? / \\) become "_", at most 31 characters, no leading or trailing apostrophe, never
  "History", unique ignoring case; Calendar and Summary keep their names and a team, venue or
  club sheet that would take one gets " (2)".
- Header rows are frozen and filterable, dates are real date cells (yyyy-mm-dd), times real
  time cells (hh:mm), column widths fit the longest value (at most 60).
- Text that starts with = + - or @ is stored as a text cell (with Excel's quote prefix), never
  as a formula.
- Clash reasons (the Clashes sheet's Reason texts may name families or coaches) are never
  written; the summary gives only their number.
- Whole numbers above 10^15 (exact counts, seeds) are written as text so no digit is lost.
"""

from __future__ import annotations

import datetime as dt
from collections.abc import Iterable, Sequence
from dataclasses import dataclass, field
from pathlib import Path
from typing import Any

from openpyxl import Workbook
from openpyxl.cell.cell import ILLEGAL_CHARACTERS_RE
from openpyxl.styles import Alignment, Font
from openpyxl.utils import get_column_letter
from openpyxl.worksheet.worksheet import Worksheet

from leaguegrid.core.dated import (
    DatedFixture,
    DatedSchedule,
    club_teams,
    in_date_order,
    team_fixtures,
    team_names,
    teams_fixtures,
    venue_fixtures,
    venue_names,
)
from leaguegrid.core.model import League, Schedule
from leaguegrid.core.wording import CAUTION, METHODS
from leaguegrid.io.write.atomic import (
    StrPath,
    atomic_write,
    refuse_overwriting_input,
    write_error,
)
from leaguegrid.io.write.csv_out import FORMULA_START
from leaguegrid.io.write.names import sheet_title
from leaguegrid.io.write.xlsx_bytes import workbook_bytes

CALENDAR_SHEET = "Calendar"
SUMMARY_SHEET = "Summary"
LEAGUE_COLUMNS = ("Round", "Date", "Time", "Fixture", "Home", "Away", "Venue", "Pitch", "Division")
TEAM_COLUMNS = ("Round", "Date", "Time", "Fixture", "Home/Away", "Opponent", "Venue", "Pitch")
VENUE_COLUMNS = ("Round", "Date", "Time", "Pitch", "Fixture", "Home", "Away", "Division")
SUMMARY_COLUMNS = ("Item", "Value")
DATE_FORMAT = "yyyy-mm-dd"
TIME_FORMAT = "hh:mm"
MAX_WIDTH = 60
EXACT_NUMBER_LIMIT = 10**15  # Excel keeps 15 significant digits


@dataclass
class CalendarSummary:
    """The numbers the Summary sheet shows beside a schedule."""

    fixtures: int
    clashes: int  # clash edges: pairs of fixtures that may not share a round
    clash_reasons_count: int  # Clashes sheet rows; their texts are never written
    min_rounds: int | None
    assignments: int | None  # exact P(K) for the schedule's K, None when not computed
    seed: int | None
    rules_counted: list[str] = field(default_factory=list)
    rules_generator: list[str] = field(default_factory=list)
    notes: list[str] = field(default_factory=list)
    min_rounds_bounds: tuple[int, int] | None = None  # proven bounds when min_rounds is None
    assignments_estimate: str | None = None  # a labelled estimate when the exact count is None
    breaks: str | None = None  # "8 (lower bound 8: optimal)"

    @classmethod
    def for_schedule(
        cls,
        league: League,
        schedule: Schedule,
        *,
        clashes: int,
        min_rounds: int | None,
        **extra: Any,
    ) -> CalendarSummary:
        """A summary taking the seed, count, rules and notes from the schedule itself."""
        values: dict[str, Any] = {
            "fixtures": len(league.fixtures),
            "clashes": clashes,
            "clash_reasons_count": len(league.clash_rows),
            "min_rounds": min_rounds,
            "assignments": schedule.assignments,
            "seed": schedule.seed,
            "rules_counted": list(schedule.rules_counted),
            "rules_generator": list(schedule.rules_generator),
            "notes": list(schedule.notes),
        }
        values.update(extra)
        return cls(**values)


def _write_cell(ws: Worksheet, row: int, col: int, value: object) -> int:
    """Write one value as text, number, date or time; return its display width."""
    cell = ws.cell(row=row, column=col)
    if value is None or value == "":
        return 0
    if isinstance(value, dt.datetime):
        raise TypeError("calendar cells take dates and times, not datetimes")
    if isinstance(value, dt.date):
        cell.value = value
        cell.number_format = DATE_FORMAT
        return 10
    if isinstance(value, dt.time):
        cell.value = value
        cell.number_format = TIME_FORMAT
        return 5
    if isinstance(value, bool):
        value = "yes" if value else "no"
    if isinstance(value, int) and abs(value) >= EXACT_NUMBER_LIMIT:
        value = str(value)
        cell.alignment = Alignment(horizontal="right")
    if isinstance(value, int | float):
        cell.value = value
        return len(str(value))
    text = ILLEGAL_CHARACTERS_RE.sub("", str(value))  # control characters XML cannot hold
    cell.value = text
    cell.data_type = "s"  # never a formula, whatever the text starts with
    if text.startswith(FORMULA_START):
        cell.quotePrefix = True
    return max((len(line) for line in text.splitlines()), default=0)


def _write_table(ws: Worksheet, header: Sequence[str], rows: Iterable[Sequence[object]]) -> None:
    """A header row (bold, frozen, filterable) and the rows below it, columns sized to fit."""
    widths = [len(h) for h in header]
    for col, name in enumerate(header, start=1):
        ws.cell(row=1, column=col, value=name).font = Font(bold=True)
    last_row = 1
    for r, values in enumerate(rows, start=2):
        last_row = r
        for col, value in enumerate(values, start=1):
            widths[col - 1] = max(widths[col - 1], _write_cell(ws, r, col, value))
    for col, width in enumerate(widths, start=1):
        ws.column_dimensions[get_column_letter(col)].width = min(width + 2, MAX_WIDTH)
    ws.freeze_panes = "A2"
    ws.auto_filter.ref = f"A1:{get_column_letter(len(header))}{last_row}"


def _league_row(row: DatedFixture) -> list[object]:
    f, r = row.fixture, row.round
    return [r.number, r.date, row.time, f.label, f.home, f.away, f.venue, f.pitch, f.division]


def _team_row(team: str, row: DatedFixture) -> list[object]:
    f, r = row.fixture, row.round
    return [r.number, r.date, row.time, f.label, row.side(team), row.opponent(team), f.venue,
            f.pitch]


def _venue_row(row: DatedFixture) -> list[object]:
    f, r = row.fixture, row.round
    return [r.number, r.date, row.time, f.pitch, f.label, f.home, f.away, f.division]


GENERATOR_SCOPE = ("breaks, byes, leg gap and the mirrored return half are the schedule "
                   "generator's objectives and rules; the counts above do not include them")


def _summary_rows(league: League, schedule: Schedule, s: CalendarSummary) -> list[list[object]]:
    """The Summary sheet: numbers, rules, seed, notes, caution; clash reasons only counted."""
    if s.min_rounds is not None:
        fewest: object = s.min_rounds
    elif s.min_rounds_bounds is not None:
        low, high = s.min_rounds_bounds
        fewest = f"not proven: at least {low}, at most {high}"
    else:
        fewest = "not computed"
    k = schedule.rounds
    if s.assignments is not None:
        count_row = [f"Valid round assignments for {k} rounds (exact)", s.assignments]
    elif s.assignments_estimate:
        count_row = [f"Valid round assignments for {k} rounds (estimate)", s.assignments_estimate]
    else:
        count_row = [f"Valid round assignments for {k} rounds", "not computed"]
    method = METHODS.get(schedule.method, schedule.method)
    rows: list[list[object]] = [
        ["League", league.settings.league or league.name],
        ["Made from", Path(league.source).name if league.source else ""],
        ["Fixtures", s.fixtures],
        ["Clashes (pairs of fixtures that may not share a round)", s.clashes],
        ["Clash reasons from the Clashes sheet (counted, not shown)", s.clash_reasons_count],
        ["Fewest rounds", fewest],
        ["Rounds in this schedule", k],
        count_row,
        ["Schedule made by", method],
        ["Seed", s.seed if s.seed is not None else "none"],
    ]
    if s.breaks is not None:
        rows.append(["Breaks (two home or two away games in a row)", s.breaks])
    rows.append(["Not in the counts", GENERATOR_SCOPE])
    rows += [["Rule met, included in the counts", rule] for rule in s.rules_counted]
    rows += [["Rule met, enforced by the generator only", rule] for rule in s.rules_generator]
    rows += [["Note", note] for note in s.notes]
    rows.append(["Caution", CAUTION])
    return rows


def _add_sheet(
    wb: Workbook,
    taken: set[str],
    name: str,
    header: Sequence[str],
    rows: Iterable[Sequence[object]],
) -> Worksheet:
    ws = wb.create_sheet(sheet_title(name, taken))
    _write_table(ws, header, rows)
    return ws


def build_calendar_workbook(dated: DatedSchedule, summary: CalendarSummary) -> Workbook:
    """The calendar workbook in memory (written by write_calendar_xlsx)."""
    league, schedule, rows = dated.league, dated.schedule, dated.rows
    by_date = in_date_order(rows)
    wb = Workbook()
    wb.remove(wb.active)
    taken: set[str] = set()
    _add_sheet(wb, taken, CALENDAR_SHEET, LEAGUE_COLUMNS, (_league_row(r) for r in rows))
    summary_ws = _add_sheet(
        wb, taken, SUMMARY_SHEET, SUMMARY_COLUMNS, _summary_rows(league, schedule, summary)
    )
    summary_ws.column_dimensions["B"].width = MAX_WIDTH
    for (value_cell,) in summary_ws.iter_rows(min_row=2, min_col=2, max_col=2):
        value_cell.alignment = Alignment(
            wrap_text=True, vertical="top", horizontal=value_cell.alignment.horizontal
        )
    teams = team_names(league)
    for team in teams:
        mine = team_fixtures(by_date, team)
        _add_sheet(wb, taken, team, TEAM_COLUMNS, (_team_row(team, r) for r in mine))
    for venue in venue_names(r.fixture for r in rows):
        here = venue_fixtures(by_date, venue)
        _add_sheet(wb, taken, f"Venue {venue}", VENUE_COLUMNS, (_venue_row(r) for r in here))
    for club, members in club_teams(league, teams).items():
        theirs = teams_fixtures(by_date, members)
        _add_sheet(wb, taken, f"Club {club}", LEAGUE_COLUMNS, (_league_row(r) for r in theirs))
    wb.active = 0
    return wb


def write_calendar_xlsx(path: StrPath, dated: DatedSchedule, summary: CalendarSummary) -> None:
    """Write the calendar workbook to `path` atomically; never over the league's own file."""
    refuse_overwriting_input(path, [dated.league.source])
    wb = build_calendar_workbook(dated, summary)
    wb.properties.modified = dt.datetime.now(tz=dt.UTC).replace(tzinfo=None)
    try:
        data = workbook_bytes(wb)  # openpyxl's own temporary files may meet a full disk too
    except OSError as err:
        raise write_error(path, err) from err
    with atomic_write(path, "wb") as handle:
        handle.write(data)
