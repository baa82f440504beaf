"""iCalendar (RFC 5545) files, written by hand: one per team, one per club, one for the league.

Rules (for the README):
- Files in the target folder: "team-<team>.ics" for every team, "club-<club>.ics" for every
  club named in the Teams sheet (its teams' fixtures), and "league-<league>.ics" with every
  fixture (the only file holding fixtures that name no teams). The names are safe on every
  file system (leaguegrid/io/write/names.py): forbidden characters become "_", and a name too
  long in bytes is cut and kept unique with a short hash.
- Event identifiers (UID) come from stable keys, never from row order nor the file's name or
  place: the League setting (when given), the division, home team and away team (compared case-
  and space-insensitively), or the fixture label for a fixture with no teams; where two
  fixtures share those keys, the label is added. The same
  fixture has the same UID in every file and in every re-export, so calendar apps update it.
- Times: a round with a date and a time becomes an event in the league's time zone (the
  `Time zone` setting, else the computer's), written in UTC ("...Z"), which every calendar app
  shows in its own local time; no VTIMEZONE is needed. A timed event lasts until the next later
  time slot on the same date; the last slot of a date lasts as long as the slot before it; a
  lone time lasts 90 minutes. A fixture's own Time (Kick-off) column overrides its round's
  time, and its event lasts 90 minutes. A round with a date and no time (and a fixture with no
  Time) becomes an all-day event.
- A team or club with no fixtures gets no file (a calendar needs at least one event).
- Every round that holds a fixture must have a date: otherwise nothing is written and
  IcsError names the rounds without one.
- Text is escaped (backslash, semicolon, comma, newline) and lines are folded at 75 octets.
- The calendar description and every event description carry the safety caution; clash
  reasons are never written.
"""

from __future__ import annotations

import datetime as dt
import hashlib
import re
from collections.abc import Iterable, Sequence
from pathlib import Path

from leaguegrid.core.dated import (
    DatedFixture,
    DatedSchedule,
    club_teams,
    in_date_order,
    team_fixtures,
    team_names,
    teams_fixtures,
)
from leaguegrid.core.model import Fixture, League, RoundInfo
from leaguegrid.core.names import name_key
from leaguegrid.core.wording import CAUTION
from leaguegrid.io.write import names
from leaguegrid.io.write.atomic import (
    ExportError,
    StrPath,
    atomic_write,
    refuse_overwriting_input,
    write_error,
)

PRODID = "-//LeagueGrid//LeagueGrid calendar export//EN"
UID_DOMAIN = "leaguegrid.invalid"
DEFAULT_GAME_MINUTES = 90
MAX_LINE_OCTETS = 75
_CONTROL = re.compile(r"[\x00-\x08\x0b-\x1f\x7f]")  # every control character but tab and LF


class IcsError(ExportError):
    """The schedule cannot be written as iCalendar (a round that holds fixtures has no date)."""


def escape_text(text: str) -> str:
    """RFC 5545 TEXT escaping: backslash, semicolon, comma and newlines; other control
    characters, which TEXT may not hold, become spaces."""
    text = text.replace("\\", "\\\\").replace(";", "\\;").replace(",", "\\,")
    text = _CONTROL.sub(" ", text.replace("\r\n", "\n").replace("\r", "\n"))
    return text.replace("\n", "\\n")


def fold_line(line: str) -> str:
    """Fold one content line into pieces of at most 75 octets, joined by CRLF and a space."""
    pieces: list[str] = []
    current: list[str] = []
    size = 0
    limit = MAX_LINE_OCTETS
    for ch in line:
        width = len(ch.encode("utf-8"))
        if size + width > limit:
            pieces.append("".join(current))
            current, size, limit = [" "], 1, MAX_LINE_OCTETS
        current.append(ch)
        size += width
    pieces.append("".join(current))
    return "\r\n".join(pieces)


def _uid(parts: Iterable[str]) -> str:
    digest = hashlib.sha256("\x1f".join(parts).encode("utf-8")).hexdigest()[:32]
    return f"{digest}@{UID_DOMAIN}"


def fixture_uids(league: League) -> dict[str, str]:
    """Fixture label -> UID from stable keys: the League setting (when given), the division,
    home and away (the direction tells the return leg from the first); the label where a
    fixture has no teams or a pairing repeats in the same direction. Never the file's name or
    place, nor the leg number or row order: the reader numbers legs in sheet order."""
    league_key = name_key(league.settings.league or "")

    def key(f: Fixture) -> tuple[str, ...]:
        if f.teams:
            return (league_key, name_key(f.division or ""), "teams", name_key(f.home),
                    name_key(f.away))
        return (league_key, "fixture", name_key(f.label))

    keys = {f.label: key(f) for f in league.fixtures}
    seen: dict[tuple[str, ...], int] = {}
    for k in keys.values():
        seen[k] = seen.get(k, 0) + 1
    return {
        label: _uid(k if seen[k] == 1 else (*k, "label", name_key(label)))
        for label, k in keys.items()
    }


def _utc_stamp(moment: dt.datetime) -> str:
    return moment.astimezone(dt.UTC).strftime("%Y%m%dT%H%M%SZ")


def _slot_minutes(rounds: Sequence[RoundInfo]) -> dict[int, int]:
    """Round number -> minutes its events last, from the gaps between time slots on its date."""
    times_by_date: dict[dt.date, list[dt.time]] = {}
    for r in rounds:
        if r.date is not None and r.time is not None:
            times_by_date.setdefault(r.date, []).append(r.time)
    minutes: dict[int, int] = {}
    for r in rounds:
        if r.date is None or r.time is None:
            continue
        times = sorted(set(times_by_date[r.date]))
        at = [dt.datetime.combine(r.date, t) for t in times]
        i = times.index(r.time)
        if i + 1 < len(at):
            gap = at[i + 1] - at[i]
        elif i > 0:
            gap = at[i] - at[i - 1]
        else:
            gap = dt.timedelta(minutes=DEFAULT_GAME_MINUTES)
        minutes[r.number] = int(gap.total_seconds() // 60)
    return minutes


def _event_lines(
    row: DatedFixture, uid: str, stamp: str, tz: dt.tzinfo, minutes: dict[int, int]
) -> list[str]:
    """The content lines of one VEVENT."""
    f, r = row.fixture, row.round
    assert r.date is not None
    lines = ["BEGIN:VEVENT", f"UID:{uid}", f"DTSTAMP:{stamp}"]
    if row.time is None:
        lines.append(f"DTSTART;VALUE=DATE:{r.date.strftime('%Y%m%d')}")
        end_day = r.date + dt.timedelta(days=1)
        lines.append(f"DTEND;VALUE=DATE:{end_day.strftime('%Y%m%d')}")
    else:
        start = dt.datetime.combine(r.date, row.time)
        length = DEFAULT_GAME_MINUTES if f.time else minutes[r.number]
        end = start + dt.timedelta(minutes=length)
        lines.append(f"DTSTART:{_utc_stamp(start.replace(tzinfo=tz))}")
        lines.append(f"DTEND:{_utc_stamp(end.replace(tzinfo=tz))}")
    lines.append(f"SUMMARY:{escape_text(f.label)}")
    place = ", ".join(p for p in (f.venue, f.pitch) if p)
    if place:
        lines.append(f"LOCATION:{escape_text(place)}")
    about = [f"Round {r.number}"]
    if f.division:
        about.append(f"Division: {f.division}")
    if f.home and f.away:
        about.append(f"Home: {f.home}. Away: {f.away}")
    if place:
        about.append(f"Venue: {place}")
    description = ". ".join(about) + ".\n\n" + CAUTION
    lines.append(f"DESCRIPTION:{escape_text(description)}")
    lines.append("END:VEVENT")
    return lines


def calendar_text(
    title: str,
    rows: Sequence[DatedFixture],
    uids: dict[str, str],
    tz: dt.tzinfo,
    now: dt.datetime,
    minutes: dict[int, int],
) -> str:
    """A whole VCALENDAR with one VEVENT per row, CRLF line ends, folded lines."""
    lines = [
        "BEGIN:VCALENDAR",
        "VERSION:2.0",
        f"PRODID:{PRODID}",
        "CALSCALE:GREGORIAN",
        "METHOD:PUBLISH",
        f"X-WR-CALNAME:{escape_text(title)}",
        f"X-WR-CALDESC:{escape_text(CAUTION)}",
    ]
    zone_name = getattr(tz, "key", None)
    if zone_name:
        lines.append(f"X-WR-TIMEZONE:{zone_name}")
    stamp = _utc_stamp(now)
    for row in rows:
        lines += _event_lines(row, uids[row.fixture.label], stamp, tz, minutes)
    lines.append("END:VCALENDAR")
    return "".join(fold_line(line) + "\r\n" for line in lines)


def file_name(prefix: str, name: str, taken: set[str]) -> str:
    """A safe, unique (case-insensitive) "<prefix>-<name>.ics" file name; adds it to `taken`."""
    return names.file_name(f"{prefix}-{name}", ".ics", taken)


def _check_dates(rows: Sequence[DatedFixture]) -> None:
    undated = sorted({row.round.number for row in rows if row.round.date is None})
    if undated:
        shown = ", ".join(str(n) for n in undated[:10]) + (" …" if len(undated) > 10 else "")
        raise IcsError(
            f"rounds without a date cannot be exported to iCalendar (round {shown}): give the "
            "Rounds sheet a Date for every round, or set Start date in Settings"
        )


def ics_calendars(dated: DatedSchedule) -> list[tuple[str, str, list[DatedFixture]]]:
    """(file prefix, name, rows in date order) for the league, each team and each club."""
    league = dated.league
    _check_dates(dated.rows)
    rows = in_date_order(dated.rows)
    teams = team_names(league)
    clubs = club_teams(league, teams)
    out = [("league", league.settings.league or league.name, rows)]
    out += [("team", t, team_fixtures(rows, t)) for t in teams]
    out += [("club", c, teams_fixtures(rows, members)) for c, members in clubs.items()]
    return out


def write_ics_files(folder: StrPath, dated: DatedSchedule) -> list[Path]:
    """Write the league, team and club calendars into `folder` (created if missing), stamped
    with the moment the schedule was dated."""
    league = dated.league
    calendars = ics_calendars(dated)
    tz = dated.time_zone
    moment = dated.stamp
    uids = fixture_uids(league)
    minutes = _slot_minutes([r.round for r in calendars[0][2]])
    target = Path(folder)
    league_title = league.settings.league or league.name
    taken: set[str] = set()
    planned: list[tuple[Path, str]] = []
    for prefix, name, rows in calendars:
        if not rows:  # RFC 5545 wants at least one component in a calendar
            continue
        path = target / file_name(prefix, name, taken)
        refuse_overwriting_input(path, [league.source])
        title = league_title if prefix == "league" else f"{league_title}: {name}"
        planned.append((path, calendar_text(title, rows, uids, tz, moment, minutes)))
    try:
        target.mkdir(parents=True, exist_ok=True)
    except OSError as err:
        raise write_error(target, err) from err
    for i, (path, text) in enumerate(planned):
        with atomic_write(path, "wb", tidy=i == 0) as handle:  # one folder: tidied once
            handle.write(text.encode("utf-8"))
    return [path for path, _ in planned]
