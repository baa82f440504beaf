"""A blank league workbook to fill in: every sheet the reader knows, with its column headers,
example rows that read as a tiny valid league, and an Instructions sheet."""

from __future__ import annotations

import datetime as dt
from pathlib import Path

from openpyxl import Workbook
from openpyxl.styles import Alignment, Font
from openpyxl.utils import get_column_letter

from leaguegrid.core.wording import CAUTION
from leaguegrid.io.read.clash_rows import PAIR_COLUMNS
from leaguegrid.io.read.fixtures_sheet import FIXTURES_COLUMNS, TEAMS_COLUMNS
from leaguegrid.io.read.rounds_sheet import ROUNDS_COLUMNS
from leaguegrid.io.read.rules_sheets import (
    BLOCKED_COLUMNS,
    DISTANCES_COLUMNS,
    REQUESTS_COLUMNS,
    VENUES_COLUMNS,
)
from leaguegrid.io.read.settings_sheet import SETTINGS_COLUMNS
from leaguegrid.io.write.atomic import atomic_write
from leaguegrid.io.write.xlsx_bytes import workbook_bytes

DIVISION = "Example Under-10s"
FIXED_TIME = dt.datetime(2026, 1, 1, 12, 0)  # workbook properties, so every copy is the same

# (sheet, its columns as the reader names them, example rows by column key, what it holds)
SHEETS: list[tuple[str, dict[str, str], list[dict[str, object]], str]] = [
    ("Fixtures", FIXTURES_COLUMNS, [
        {"fixture": "Reds v Blues", "home": "Example Reds", "away": "Example Blues",
         "venue": "Example Park", "pitch": 1, "division": DIVISION},
        {"fixture": "Greens v Golds", "home": "Example Greens", "away": "Example Golds",
         "venue": "Example Oval", "division": DIVISION, "time": "10:30"},
        {"fixture": "Blues v Reds", "home": "Example Blues", "away": "Example Reds",
         "venue": "Example Park", "pitch": 1, "division": DIVISION},
        {"fixture": "Golds v Greens", "home": "Example Golds", "away": "Example Greens",
         "venue": "Example Oval", "division": DIVISION},
    ], "One row per game. Home and Away name the teams; Venue where it is played; Round pins "
       "a fixture to a round, and so does Date (the date of one of the rounds); Time is the "
       "fixture's own kick-off in the calendars (otherwise its round's time); Played (yes) "
       "marks a game already played. Leave this sheet without rows to have every fixture of a "
       "division generated from the Teams sheet."),
    ("Teams", TEAMS_COLUMNS, [
        {"team": "Example Reds", "venue": "Example Park", "division": DIVISION,
         "club": "Example Club", "coach": "Example Coach"},
        {"team": "Example Blues", "venue": "Example Park", "division": DIVISION,
         "club": "Example Club", "coach": "Example Coach"},
        {"team": "Example Greens", "venue": "Example Oval", "division": DIVISION},
        {"team": "Example Golds", "venue": "Example Oval", "division": DIVISION},
    ], "One row per team: its home venue, division, club and coach. Teams with the same "
       "coach never play in the same round (a coach cannot be in two places)."),
    ("Clashes", PAIR_COLUMNS, [
        {"first": "Reds v Blues", "second": "Golds v Greens", "reason": "same coach (example)"},
        {"first": "Blues v Reds", "second": "Greens v Golds",
         "reason": "same referee (example)"},
    ], "Two fixtures, teams or venues that must never share a round (a coach with two teams, "
       "families, a shared referee). A team or venue stands for all its fixtures."),
    ("Rounds", ROUNDS_COLUMNS, [
        {"round": 1, "date": dt.date(2027, 3, 6), "time": "09:00", "note": "first matchday"},
        {"round": 2, "date": dt.date(2027, 3, 13), "time": "09:00"},
        {"round": 3, "date": dt.date(2027, 3, 20), "time": "09:00", "note": "spare day"},
    ], "One row per round (matchday or time slot) with its date; delete the sheet to date "
       "rounds from the Start date and Every settings instead."),
    ("Settings", SETTINGS_COLUMNS, [
        {"setting": "League", "value": "Example league"},
        {"setting": "Time zone", "value": "Europe/London"},
    ], "League name, Time zone, Legs, Start date, Every, Skip, Clash on, Most home games "
       "in a row, Most away games in a row, Round balance, Return half (yes, no or "
       "mirrored), Leg gap, Byes apart: see the workbook format guide."),
    ("Together", PAIR_COLUMNS, [
        {"first": "Reds v Blues", "second": "Greens v Golds", "reason": "same day (example)"},
        {"first": "Blues v Reds", "second": "Golds v Greens", "reason": "same day (example)"},
    ], "Two fixtures that must be in the same round (for example a double-header)."),
    ("Apart", PAIR_COLUMNS, [
        {"first": "Reds v Blues", "second": "Blues v Reds", "reason": "legs apart (example)"},
        {"first": "Greens v Golds", "second": "Golds v Greens",
         "reason": "legs apart (example)"},
    ], "Two fixtures that must be in different rounds without clashing otherwise."),
    ("Blocked", BLOCKED_COLUMNS, [
        {"venue": "Example Park", "round": 3, "reason": "ground closed (example)"},
        {"team": "Example Reds", "date": dt.date(2027, 3, 20), "reason": "camp (example)"},
    ], "A team or venue that cannot play in a round (or on a date), with the reason."),
    ("Requests", REQUESTS_COLUMNS, [
        {"team": "Example Reds", "date": dt.date(2027, 3, 13), "side": "home",
         "reason": "club fun day (example)"},
        {"team": "Example Blues", "round": 2, "side": "away",
         "reason": "ground let out (example)"},
    ], "A club's wish: a team at home (or away) in a round or on a date. Met where every "
       "rule allows it; the schedule's notes list the requests it could not meet."),
    ("Venues", VENUES_COLUMNS, [
        {"venue": "Example Park", "pitches": 1},
        {"venue": "Example Oval", "pitches": 1},
    ], "How many games each venue can host at once (its pitches); optional position."),
    ("Distances", DISTANCES_COLUMNS, [
        {"from": "Example Park", "to": "Example Oval", "km": 6},
    ], "Travel between venues, used to keep long trips apart."),
]

INSTRUCTIONS = [
    "A blank LeagueGrid league. Fill in the sheets, then run: leaguegrid check FILE.xlsx",
    "",
    "The rows marked Example are read as a tiny valid league (four teams, four fixtures, "
    "three rounds), so this workbook passes the check untouched. Replace them with your own.",
    "Only Fixtures (or Teams) is needed; every other sheet is optional and may be deleted.",
    "Names are matched ignoring case and every space (and Unicode compatibility forms such as "
    "full-width letters): 'Red Lions', 'red lions' and 'RedLions' are read as the same team, "
    "with a warning when spellings differ.",
    "",
    CAUTION,
    "",
]


def blank_league_workbook() -> Workbook:
    """The blank league as an openpyxl workbook (the same cells every time)."""
    wb = Workbook()
    guide = wb.active
    guide.title = "Instructions"
    for line in INSTRUCTIONS:
        guide.append([line])
    guide.append(["Sheet", "What goes there"])
    guide.cell(guide.max_row, 1).font = guide.cell(guide.max_row, 2).font = Font(bold=True)
    for title, _columns, _rows, purpose in SHEETS:
        guide.append([title, purpose])
    guide.column_dimensions["A"].width = 14
    guide.column_dimensions["B"].width = 100
    for row in guide.iter_rows():
        for cell in row:
            cell.alignment = Alignment(wrap_text=True, vertical="top")
    for title, columns, rows, _purpose in SHEETS:
        sheet = wb.create_sheet(title)
        sheet.append(list(columns.values()))
        for cell in sheet[1]:
            cell.font = Font(bold=True)
        for example in rows:
            sheet.append([example.get(key) for key in columns])
        for index, header in enumerate(columns.values(), start=1):
            sheet.column_dimensions[get_column_letter(index)].width = max(12, len(header) + 4)
    wb.properties.creator = "LeagueGrid"
    wb.properties.created = wb.properties.modified = FIXED_TIME
    return wb


def write_blank_league(path: str | Path) -> Path:
    """Write the blank league to a new file (FileExistsError when it exists: never overwrite)."""
    target = Path(path)
    if target.exists():  # said before any work; atomic_write checks again as it finishes
        raise FileExistsError(str(target))
    with atomic_write(target, "wb", replace=False) as handle:
        handle.write(workbook_bytes(blank_league_workbook()))
    return target
