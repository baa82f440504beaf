"""The Rounds sheet, and turning a Round cell (a round number or a date) into round numbers."""

from __future__ import annotations

import datetime as dt
from dataclasses import dataclass, field

from leaguegrid.core.model import RoundInfo
from leaguegrid.io.read.columns import Table
from leaguegrid.io.read.problems import Place, Report
from leaguegrid.io.read.values import (
    date_advice,
    is_number,
    looks_like_date,
    to_date,
    to_time,
    whole_number,
)

ROUNDS_COLUMNS = {"round": "Round", "date": "Date", "time": "Time", "note": "Note"}
NOT_POSITIVE = "not a positive whole number: rounds are numbered 1, 2, 3, …"
MAX_ROUND = 1000
NOT_TIME = "not a time: write times as HH:MM (24-hour), e.g. 10:30"


@dataclass
class RoundLookup:
    """Where rounds fall: the Rounds sheet when there is one (`fixed`), else the Settings grid
    (Start date, then every `every` days, Skip dates left out and later rounds moved on)."""

    rounds: list[RoundInfo] = field(default_factory=list)
    fixed: bool = False
    start: dt.date | None = None
    every: int = 7
    skip: tuple[dt.date, ...] = ()

    @property
    def last(self) -> int | None:
        """The last round when a Rounds sheet fixes them, else None (no limit)."""
        return max((r.number for r in self.rounds), default=0) if self.fixed else None

    def on_date(self, day: dt.date) -> tuple[list[int], str]:
        """The rounds that fall on `day`, or [] and why none does."""
        if self.fixed:
            found = [r.number for r in self.rounds if r.date == day]
            return found, f"no round of the Rounds sheet falls on {day.isoformat()}"
        if self.start is None:
            return [], (
                "a date needs a Rounds sheet (or a Start date in Settings) to find its round; "
                "or write the round number"
            )
        offset = (day - self.start).days
        if offset < 0 or offset % self.every:
            return [], (
                f"no round falls on {day.isoformat()}: rounds fall every {self.every} days "
                f"from {self.start.isoformat()}"
            )
        if day in self.skip:
            return [], f"no round falls on {day.isoformat()}: it is a Skip date in Settings"
        skipped = sum(
            1
            for s in set(self.skip)
            if s < day and (s - self.start).days >= 0 and (s - self.start).days % self.every == 0
        )
        return [offset // self.every + 1 - skipped], ""


def round_cell(value: object, lookup: RoundLookup) -> tuple[list[int], str | None]:
    """The rounds a Round cell names (a whole number, or a date of a round), or an error message."""
    number = whole_number(value)
    if number is not None:
        if number < 1:
            return [], NOT_POSITIVE
        if number > MAX_ROUND:
            return [], f"there is no round {number}: LeagueGrid handles at most {MAX_ROUND} rounds"
        last = lookup.last
        if last is not None and number > last:
            return [], f"there is no round {number}: the Rounds sheet lists rounds 1 to {last}"
        return [number], None
    if is_number(value):
        return [], NOT_POSITIVE
    day = to_date(value)
    if day is not None:
        found, why = lookup.on_date(day)
        if len(found) > 1 and isinstance(value, dt.datetime) and value.time() != dt.time(0):
            slot = [r.number for r in lookup.rounds if r.date == day and r.time == value.time()]
            found = slot or found
        if found and found[0] > MAX_ROUND:
            return (
                [],
                f"there is no round {found[0]}: LeagueGrid handles at most {MAX_ROUND} rounds",
            )
        return (found, None) if found else ([], why)
    if looks_like_date(value):
        return [], f"not a date: {date_advice(value)}"
    advice = date_advice(value)
    hint = advice[advice.index(" (") :] if " (" in advice else ""
    return [], (
        "not a round number or a date: write a round number (1, 2, 3, …) "
        f"or a date as YYYY-MM-DD{hint}"
    )


def read_rounds(table: Table, report: Report) -> list[RoundInfo]:
    """The rounds listed in the Rounds sheet, sorted by number; every problem reported."""
    if not (table.has("round") or table.has("date")):
        report.error("the sheet needs a Round or a Date column", table.sheet_place())
        return []
    if not table.rows:
        report.error(
            "the sheet lists no rounds: list the rounds, or delete the sheet", table.sheet_place()
        )
        return []
    rounds: dict[int, RoundInfo] = {}
    first_row: dict[int, int] = {}
    for position, row in enumerate(table.rows, start=1):
        number = _round_number(table, row, position, report)
        info = RoundInfo(
            number or 0,
            _date(table, row, report),
            _time(table, row, report),
            table.text(row, "note") or "",
        )
        if number is None:
            continue
        if number in rounds:
            report.error(
                f"round {number} is listed twice (rows {first_row[number]} and {row.number})",
                table.at(row, "round"),
            )
            continue
        rounds[number] = info
        first_row[number] = row.number
    _check_numbering(table, rounds, report)
    _check_order(table, rounds, first_row, report)
    return [rounds[n] for n in sorted(rounds)]


def _round_number(table: Table, row, position: int, report: Report) -> int | None:
    if not table.has("round"):
        return position
    value = table.raw(row, "round")
    if value is None:
        report.error("the round number is missing", table.at(row, "round"))
        return None
    number = whole_number(value)
    if number is None or number < 1:
        report.error(NOT_POSITIVE, table.at(row, "round"))
        return None
    if number > MAX_ROUND:
        report.error(
            f"there is no round {number}: LeagueGrid handles at most {MAX_ROUND} rounds",
            table.at(row, "round"),
        )
        return None
    return number


def _date(table: Table, row, report: Report) -> dt.date | None:
    value = table.raw(row, "date")
    if value is None:
        return None
    day = to_date(value)
    if day is None:
        report.error(f"not a date: {date_advice(value)}", table.at(row, "date"))
    return day


def _time(table: Table, row, report: Report) -> dt.time | None:
    value = table.raw(row, "time")
    if value is None:
        return None
    moment = to_time(value)
    if moment is None:
        report.error(NOT_TIME, table.at(row, "time"))
    return moment


def _check_numbering(table: Table, rounds: dict[int, RoundInfo], report: Report) -> None:
    if not rounds:
        return
    top = max(rounds)
    missing: list[int] = []
    number = 1
    while number < top and len(missing) <= 10:
        if number not in rounds:
            missing.append(number)
        number += 1
    if missing:
        shown = ", ".join(str(n) for n in missing[:10]) + (", …" if len(missing) > 10 else "")
        report.error(
            f"rounds are numbered 1 to {top} without gaps; missing: {shown}",
            table.at(None, "round"),
        )


def _check_order(
    table: Table, rounds: dict[int, RoundInfo], first_row: dict[int, int], report: Report
) -> None:
    previous: RoundInfo | None = None
    for number in sorted(rounds):
        info = rounds[number]
        if info.date is None:
            continue
        if previous is not None and previous.date is not None and info.date < previous.date:
            report.warn(
                f"round {number} is dated {info.date.isoformat()}, before round "
                f"{previous.number} ({previous.date.isoformat()})",
                Place(
                    table.sheet,
                    first_row[number],
                    table.header("date", "Date"),
                    info.date.isoformat(),
                ),
            )
        previous = info
