"""The Venues, Distances and Blocked sheets: pitch counts, positions, travel, byes and closures."""

from __future__ import annotations

import datetime as dt

from leaguegrid.core.model import Blocked, Request
from leaguegrid.core.names import suggestion
from leaguegrid.io.read.clash_rows import Resolver
from leaguegrid.io.read.columns import Row, Table, require
from leaguegrid.io.read.context import ReadContext
from leaguegrid.io.read.problems import Place, Report
from leaguegrid.io.read.rounds_sheet import round_cell
from leaguegrid.io.read.values import date_advice, to_date, to_number, whole_number

VENUES_COLUMNS = {
    "venue": "Venue",
    "pitches": "Pitches",
    "latitude": "Latitude",
    "longitude": "Longitude",
}
DISTANCES_COLUMNS = {"from": "From", "to": "To", "km": "Km"}
REQUESTS_COLUMNS = {
    "team": "Team",
    "round": "Round",
    "date": "Date",
    "side": "Side",
    "reason": "Reason",
}
BLOCKED_COLUMNS = {
    "team": "Team",
    "venue": "Venue",
    "round": "Round",
    "date": "Date",
    "reason": "Reason",
}


def read_venues(table: Table, ctx: ReadContext) -> None:
    """Venues with their pitch counts and positions, into ctx.venues."""
    report = ctx.report
    if not require(table, "venue", "Venue", report):
        return
    rows: dict[str, int] = {}
    for row in table.rows:
        name = table.text(row, "venue")
        if name is None:
            report.error("the venue name is missing", table.at(row, "venue"))
            continue
        known = ctx.venue_names.get(name)
        if known in rows:
            report.error(
                f"the venue is listed twice (rows {rows[known]} and {row.number})",
                table.at(row, "venue"),
            )
            continue
        venue = ctx.venues[ctx.add_venue(name, table.at(row, "venue"))]
        rows[venue.name] = row.number
        pitches = table.raw(row, "pitches")
        if pitches is not None:
            count = whole_number(pitches)
            if count is None or count < 1:
                report.error("not a positive whole number of pitches", table.at(row, "pitches"))
            else:
                venue.pitches = count
        venue.latitude, venue.longitude = _position(table, row, ctx)


def _position(table: Table, row: Row, ctx: ReadContext) -> tuple[float | None, float | None]:
    found: dict[str, float | None] = {}
    for key, limit, word in (("latitude", 90, "latitude"), ("longitude", 180, "longitude")):
        value = table.raw(row, key)
        number = to_number(value) if value is not None else None
        if value is not None and (number is None or abs(number) > limit):
            ctx.report.error(f"not a {word}: a number from -{limit} to {limit}", table.at(row, key))
            value = None
        found[key] = number if value is not None else None
    given = [k for k in found if table.raw(row, k) is not None]
    if len(given) == 1:
        other = "longitude" if given[0] == "latitude" else "latitude"
        ctx.report.error(
            "Latitude and Longitude go together: give both or neither", table.at(row, other)
        )
        return None, None
    return found["latitude"], found["longitude"]


def read_distances(table: Table, ctx: ReadContext) -> dict[tuple[str, str], float]:
    """Km between venues, stored both ways (a pair given twice is an error)."""
    report = ctx.report
    ok = True
    for key, display in DISTANCES_COLUMNS.items():
        ok = require(table, key, display, report) and ok
    if not ok:
        return {}
    out: dict[tuple[str, str], float] = {}
    rows: dict[frozenset, int] = {}
    for row in table.rows:
        ends = [_venue(table, row, key, ctx) for key in ("from", "to")]
        km = _km(table, row, ctx)
        if None in ends or km is None:
            continue
        a, b = ends[0] or "", ends[1] or ""
        if a == b:
            report.error("From and To are the same venue", table.at(row, "to"))
            continue
        pair = frozenset((a, b))
        if pair in rows:
            report.error(
                f"the distance between these venues is given twice (rows {rows[pair]} and "
                f"{row.number})",
                table.at(row, "to"),
            )
            continue
        rows[pair] = row.number
        out[(a, b)] = out[(b, a)] = km
    return out


def _venue(table: Table, row: Row, key: str, ctx: ReadContext) -> str | None:
    name = table.text(row, key)
    if name is None:
        ctx.report.error("the row needs both From and To", table.at(row, key))
        return None
    if name not in ctx.venue_names:
        ctx.report.error(
            f"no venue is named '{name}'" + suggestion(name, ctx.venue_names.names()),
            table.at(row, key),
        )
        return None
    return ctx.venue_names.add(name, table.at(row, key))


def _km(table: Table, row: Row, ctx: ReadContext) -> float | None:
    value = table.raw(row, "km")
    km = to_number(value) if value is not None else None
    if km is None or km < 0:
        ctx.report.error("not a distance: a number of kilometres, 0 or more", table.at(row, "km"))
        return None
    return km


def _round_or_date(table: Table, report: Report) -> bool:
    """True when the sheet has a Round or a Date column; otherwise reported."""
    if table.has("round") or table.has("date"):
        return True
    report.error("the sheet needs a Round or a Date column", table.sheet_place())
    return False


def read_blocked(table: Table, resolver: Resolver) -> list[Blocked]:
    """Blocked rows: a team or venue (or both) kept out of a round, or of every round on a date."""
    ctx = resolver.ctx
    report = ctx.report
    ok = True
    if not (table.has("team") or table.has("venue")):
        report.error("the sheet needs a Team or a Venue column", table.sheet_place())
        ok = False
    if not (_round_or_date(table, report) and ok):
        return []
    out = []
    for row in table.rows:
        whom = _whom(table, row, resolver)
        rounds = blocked_rounds(table, row, ctx)
        if whom is None or rounds is None:
            continue
        reason = table.text(row, "reason") or ""
        for number in rounds:
            for kind, name in whom:
                out.append(Blocked(number, reason=reason, row=row.number, **{kind: name}))
    return out


def read_requests(table: Table, resolver: Resolver) -> list[Request]:
    """Requests rows: a team at home or away in a round (or in every round on a date)."""
    ctx = resolver.ctx
    report = ctx.report
    ok = require(table, "team", "Team", report) & require(table, "side", "Side", report)
    if not (_round_or_date(table, report) and ok):
        return []
    out = []
    for row in table.rows:
        text = table.text(row, "team")
        target = None
        if text is None:
            report.error("the row needs a Team", table.at(row, "team"))
        else:
            target = resolver.resolve(text, table.at(row, "team"), ("team",))
        side = (table.text(row, "side") or "").strip().casefold()
        if side not in ("home", "away"):
            report.error("the side must be home or away", table.at(row, "side"))
        rounds = blocked_rounds(table, row, ctx)
        if target is None or rounds is None or side not in ("home", "away"):
            continue
        reason = table.text(row, "reason") or ""
        out += [Request(target.name, number, "home" if side == "home" else "away", reason,
                        row.number) for number in rounds]
    return out


def _whom(table: Table, row: Row, resolver: Resolver) -> list[tuple[str, str]] | None:
    found: list[tuple[str, str]] = []
    failed = False
    for kind in ("team", "venue"):
        text = table.text(row, kind)
        if text is None:
            continue
        target = resolver.resolve(text, table.at(row, kind), (kind,))
        if target is None:
            failed = True
        else:
            found.append((kind, target.name))
    if not found and not failed:
        key = "team" if table.has("team") else "venue"
        resolver.ctx.report.error("the row needs a Team or a Venue", table.at(row, key))
    return None if failed or not found else found


def blocked_rounds(table: Table, row: Row, ctx: ReadContext) -> list[int] | None:
    """The rounds a Blocked row covers: its Round (number or date), or every round on its Date."""
    report = ctx.report
    by_round, by_date = table.raw(row, "round"), table.raw(row, "date")
    if by_round is not None and by_date is not None:
        report.error("give a Round or a Date, not both", table.at(row, "date"))
        return None
    if by_round is None and by_date is None:
        key = "round" if table.has("round") else "date"
        report.error("the row needs a Round or a Date", table.at(row, key))
        return None
    key = "round" if by_round is not None else "date"
    value = by_round if by_round is not None else by_date
    day = to_date(value)
    if day is None:
        if key == "date":
            report.error(f"not a date: {date_advice(value)}", table.at(row, key))
            return None
        rounds, message = round_cell(value, ctx.lookup)
        if message:
            report.error(message, table.at(row, key))
            return None
        return rounds
    return _rounds_on(day, table.at(row, key), ctx)


def _rounds_on(day: dt.date, place: Place, ctx: ReadContext) -> list[int] | None:
    found, why = ctx.lookup.on_date(day)
    if found:
        return found
    if ctx.lookup.fixed or ctx.lookup.start is not None:
        ctx.report.warn(f"{why}, so nothing is blocked", place)
        return []
    ctx.report.error(why, place)
    return None
