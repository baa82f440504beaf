"""The Settings sheet (Setting, Value): unknown settings warn, bad values are errors."""

from __future__ import annotations

import zoneinfo
from dataclasses import dataclass, field, replace

from leaguegrid.core.model import Settings
from leaguegrid.core.names import name_key, suggestion
from leaguegrid.io.read.columns import Row, Table, require
from leaguegrid.io.read.problems import Place, Report
from leaguegrid.io.read.values import (
    cell_text,
    date_advice,
    split_values,
    to_date,
    whole_number,
    yes_no,
)

SETTINGS_COLUMNS = {"setting": "Setting", "value": "Value"}
KNOWN_SETTINGS = {
    name_key(n): n
    for n in (
        "Clash on",
        "Legs",
        "Start date",
        "Every",
        "Skip",
        "League",
        "Time zone",
        "Most home games in a row",
        "Most away games in a row",
        "Round balance",
        "Return half",
        "Leg gap",
        "Byes apart",
    )
}
# the settings' earlier names, still read: old key -> the key of the name used now
FORMER_SETTINGS = {
    name_key(old): name_key(new)
    for old, new in (
        ("Shared", "Clash on"),
        ("Max home run", "Most home games in a row"),
        ("Max away run", "Most away games in a row"),
    )
}
NOT_POSITIVE = "not a positive whole number"


@dataclass
class SettingsRead:
    settings: Settings = field(default_factory=Settings)
    shared_place: Place | None = None  # the cell that gave Clash on
    legs_place: Place | None = None  # the cell that gave Legs


def read_settings(table: Table, report: Report) -> SettingsRead:
    """Settings from the sheet; each value checked and reported at its Value cell."""
    out = SettingsRead()
    if not (
        require(table, "setting", "Setting", report) & require(table, "value", "Value", report)
    ):
        return out
    seen: dict[str, int] = {}
    for row in table.rows:
        name = table.text(row, "setting")
        if name is None:
            report.warn("a value with no setting name is ignored", table.at(row, "value"))
            continue
        key = FORMER_SETTINGS.get(name_key(name), name_key(name))
        if key not in KNOWN_SETTINGS:
            report.warn(
                "not a setting LeagueGrid knows; it is ignored"
                + suggestion(name, KNOWN_SETTINGS.values()),
                table.at(row, "setting"),
            )
            continue
        if key in seen:
            report.error(
                f"the setting appears twice (rows {seen[key]} and {row.number}); "
                "only the first is read",
                table.at(row, "setting"),
            )
            continue
        seen[key] = row.number
        if table.raw(row, "value") is not None:
            _apply(key, table, row, out, report)
    for name, on in (("Return half", out.settings.return_half),
                     ("Leg gap", out.settings.leg_gap is not None)):
        if on and out.settings.legs != 2:
            report.warn(f"{name} has no effect unless Legs is 2",
                        out.legs_place or table.sheet_place())
    return out


def _apply(key: str, table: Table, row: Row, out: SettingsRead, report: Report) -> None:
    """Read one setting's Value cell into `out.settings`."""
    value = table.raw(row, "value")
    place = table.at(row, "value")
    s = out.settings
    if key == "clashon":
        names = split_values(cell_text(value) or "", ",;")
        out.settings = replace(s, shared=tuple(names))
        out.shared_place = place
    elif key == "legs":
        legs = whole_number(value)
        out.legs_place = place
        if legs in (1, 2):
            out.settings = replace(s, legs=legs)
        else:
            report.error("Legs must be 1 or 2", place)
    elif key == "startdate":
        day = to_date(value)
        if day is None:
            report.error(f"not a date: {date_advice(value)}", place)
        out.settings = replace(s, start_date=day)
    elif key == "every":
        out.settings = replace(s, every_days=_positive(value, "days", place, report)
                               or s.every_days)
    elif key == "skip":
        out.settings = replace(s, skip=_skip_dates(value, place, report))
    elif key == "league":
        out.settings = replace(s, league=cell_text(value))
    elif key == "timezone":
        out.settings = replace(s, time_zone=_time_zone(cell_text(value) or "", place, report))
    elif key in ("mosthomegamesinarow", "mostawaygamesinarow"):
        run = whole_number(value)
        if run is None or run < 1:
            report.error(NOT_POSITIVE, place)
        field_name = "max_home_run" if key == "mosthomegamesinarow" else "max_away_run"
        out.settings = replace(s, **{field_name: run if run and run >= 1 else None})
    elif key == "roundbalance":
        balance = whole_number(value)
        if balance is None or balance < 0:
            report.error("not a whole number (0 or more)", place)
        else:
            out.settings = replace(s, round_balance=balance)
    elif key == "returnhalf":
        mirrored = name_key(cell_text(value) or "") == "mirrored"
        answer = True if mirrored else yes_no(value)
        if answer is None:
            report.error("not yes, no or mirrored", place)
        else:
            out.settings = replace(s, return_half=answer, mirrored=mirrored)
    elif key == "byesapart":
        answer = yes_no(value)
        if answer is None:
            report.error("not yes or no", place)
        else:
            out.settings = replace(s, byes_apart=answer)
    elif key == "leggap":
        out.settings = replace(s, leg_gap=_positive(value, "rounds", place, report)
                               or s.leg_gap)


def _positive(value: object, unit: str, place: Place, report: Report) -> int | None:
    """A positive whole number of days or rounds, or None after reporting it is not one."""
    number = whole_number(value)
    if number is None or number < 1:
        report.error(f"{NOT_POSITIVE} of {unit}", place)
        return None
    return number


def _skip_dates(value: object, place: Place, report: Report) -> tuple:
    """Skip: a date cell, or ISO dates separated by commas (or semicolons)."""
    day = to_date(value)
    if day is not None:
        return (day,)
    days = []
    for item in split_values(cell_text(value) or "", ",;"):
        parsed = to_date(item)
        if parsed is None:
            report.error(
                f"not a date: {date_advice(item)}",
                Place(place.sheet, place.row, place.column, item),
            )
        else:
            days.append(parsed)
    return tuple(sorted(set(days)))


def _time_zone(name: str, place: Place, report: Report) -> str | None:
    """An IANA time zone name, checked when this computer has the time zone database."""
    try:
        zoneinfo.ZoneInfo(name)
        return name
    except (zoneinfo.ZoneInfoNotFoundError, ValueError, OSError):
        if not zoneinfo.available_timezones():
            return name
    report.error("not a time zone: use an IANA name such as Europe/London", place)
    return None
