"""Round dates and times, the league's time zone, and a schedule's fixtures with their dates.

Rules (for the README):
- With a Rounds sheet, its rows give each round's date, time and note; when the sheet lists
  every round there is (`League.rounds_fixed`), asking for more rounds is an error.
- Otherwise, with `Start date` in Settings, round 1 is on the start date and each later round
  takes the next step of `Every` days (default 7). A step whose date is listed in `Skip` is
  passed over: that round moves to the next step, and every later round moves with it.
  Skip dates that fall between steps change nothing, so list the match day itself.
- Otherwise rounds carry numbers only.
- Rounds that are time slots on one day carry a Time (from the Rounds sheet).
- Time zone: the `Time zone` setting (an IANA name such as "Europe/Madrid"), else the
  computer's own zone.
"""

from __future__ import annotations

import datetime as dt
import os
import zoneinfo
from pathlib import Path

from leaguegrid.core.dated import DatedFixture, DatedSchedule
from leaguegrid.core.model import League, RoundInfo, Schedule


class DatesError(ValueError):
    """The rounds asked for cannot be given dates (or the time zone is unknown)."""


def _generated_date(start: dt.date, every: int, skip: set[dt.date], number: int) -> dt.date:
    """The date of round `number` (1-based) from a start date, a spacing and skipped dates."""
    day = start
    placed = 0
    while True:
        if day not in skip:
            placed += 1
            if placed == number:
                return day
        day += dt.timedelta(days=every)


def round_dates(league: League, k: int) -> list[RoundInfo]:
    """RoundInfo for rounds 1..k, from the Rounds sheet, the Settings dates, or numbers only."""
    if k < 0:
        raise DatesError(f"the number of rounds must be at least 0, not {k}")
    listed = {r.number: r for r in league.rounds}
    settings = league.settings
    if settings.every_days < 1:
        raise DatesError(
            f"Every must be a whole number of days of at least 1, not {settings.every_days}"
        )
    skip = set(settings.skip)
    out: list[RoundInfo] = []
    for number in range(1, k + 1):
        if number in listed:
            r = listed[number]
            out.append(RoundInfo(number, r.date, r.time, r.note))
        elif league.rounds_fixed:
            raise DatesError(
                f"the Rounds sheet lists {len(listed)} rounds; round {number} is not among them "
                f"(ask for at most {len(listed)} rounds or add rows to the Rounds sheet)"
            )
        elif settings.start_date is not None:
            day = _generated_date(settings.start_date, settings.every_days, skip, number)
            out.append(RoundInfo(number, day))
        else:
            out.append(RoundInfo(number))
    return out


def _local_zone_name() -> str | None:
    """The computer's IANA zone name, from TZ or /etc/localtime, when it can be found."""
    candidates: list[str] = []
    env = os.environ.get("TZ", "").lstrip(":")
    if env:
        candidates.append(env)
    localtime = Path("/etc/localtime")
    if localtime.is_symlink():
        target = str(localtime.resolve())
        marker = "zoneinfo/"
        if marker in target:
            candidates.append(target.split(marker, 1)[1])
    tz_file = Path("/etc/timezone")
    if tz_file.is_file():
        candidates.append(tz_file.read_text(encoding="utf-8", errors="replace").strip())
    for name in candidates:
        try:
            zoneinfo.ZoneInfo(name)
        except (zoneinfo.ZoneInfoNotFoundError, ValueError, OSError):
            continue
        return name
    return None


def league_time_zone(league: League) -> dt.tzinfo:
    """The league's time zone: the Time zone setting, else the computer's zone."""
    name = league.settings.time_zone
    if name:
        try:
            return zoneinfo.ZoneInfo(name.strip())
        except (zoneinfo.ZoneInfoNotFoundError, ValueError, OSError) as exc:
            raise DatesError(
                f"unknown time zone {name!r} in Settings: give an IANA name such as "
                "'Europe/Madrid' or 'America/Chicago'"
            ) from exc
    local = _local_zone_name()
    if local is not None:
        return zoneinfo.ZoneInfo(local)
    zone = dt.datetime.now().astimezone().tzinfo
    return zone if zone is not None else dt.UTC


def dated_fixtures(league: League, schedule: Schedule) -> list[DatedFixture]:
    """Every fixture of the league with its round's date and time, sorted by round.

    Raises DatesError when the schedule misses a fixture, names an unknown one, or uses a round
    outside 1..K.
    """
    labels = {f.label for f in league.fixtures}
    missing = [f.label for f in league.fixtures if f.label not in schedule.assignment]
    unknown = sorted(set(schedule.assignment) - labels)
    if missing or unknown:
        parts = []
        if missing:
            more = " …" if len(missing) > 5 else ""
            parts.append("no round for " + ", ".join(missing[:5]) + more)
        if unknown:
            parts.append("unknown fixtures " + ", ".join(unknown[:5]))
        raise DatesError("the schedule does not match the league: " + "; ".join(parts))
    bad = sorted(
        (label, r) for label, r in schedule.assignment.items() if not 1 <= r <= schedule.rounds
    )
    if bad:
        label, r = bad[0]
        raise DatesError(f"fixture {label!r} is in round {r}, outside 1..{schedule.rounds}")
    rounds = round_dates(league, schedule.rounds)
    rows = [DatedFixture(f, rounds[schedule.assignment[f.label] - 1]) for f in league.fixtures]
    rows.sort(key=DatedFixture.sort_key)
    return rows


def date_schedule(league: League, schedule: Schedule,
                  now: dt.datetime | None = None) -> DatedSchedule:
    """The schedule dated once, for every export: rows as dated_fixtures, the league's time
    zone, and `now` (default: this moment, UTC) as the time stamp. Raises DatesError."""
    return DatedSchedule(league, schedule, dated_fixtures(league, schedule),
                         league_time_zone(league), now or dt.datetime.now(dt.UTC))
