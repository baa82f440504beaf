"""The whole schedule as one CSV file: a row per fixture, sorted by round.

Formula protection: a spreadsheet opening a CSV runs any cell that starts with = + - or @ (and
some also a leading tab or carriage return) as a formula. Such text is written with a single
quote in front ("'=Kestrel" for "=Kestrel"), which spreadsheets show as text. Numbers, dates
and times are written plainly (dates as YYYY-MM-DD, times as HH:MM).
"""

from __future__ import annotations

import csv
import datetime as dt

from leaguegrid.core.dated import DatedFixture, DatedSchedule
from leaguegrid.io.write.atomic import StrPath, atomic_write, refuse_overwriting_input

FORMULA_START = ("=", "+", "-", "@", "\t", "\r")
CSV_COLUMNS = ("Round", "Date", "Time", "Fixture", "Home", "Away", "Venue", "Pitch", "Division")


def protect_text(text: str) -> str:
    """Text a spreadsheet will not run as a formula: a leading quote where it starts like one."""
    return "'" + text if text.startswith(FORMULA_START) else text


def _csv_row(row: DatedFixture) -> list[str]:
    """One fixture's CSV cells, text protected."""
    f, r = row.fixture, row.round
    date = r.date.isoformat() if isinstance(r.date, dt.date) else ""
    time = row.time.strftime("%H:%M") if isinstance(row.time, dt.time) else ""
    texts = [f.label, f.home or "", f.away or "", f.venue or "", f.pitch or "", f.division or ""]
    return [str(r.number), date, time, *(protect_text(t) for t in texts)]


def write_schedule_csv(path: StrPath, dated: DatedSchedule) -> None:
    """Write the schedule as UTF-8 CSV (with a BOM so spreadsheets read accents right)."""
    refuse_overwriting_input(path, [dated.league.source])
    rows = dated.rows
    with atomic_write(path, "w", encoding="utf-8-sig", newline="") as handle:
        writer = csv.writer(handle)
        writer.writerow(CSV_COLUMNS)
        writer.writerows(_csv_row(row) for row in rows)
