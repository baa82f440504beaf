"""What the Venues, Blocked and Clashes sheets say about grounds, read ahead of fixture
generation so that the generated timetable seats teams to fit their grounds.

Only read here, never reported: the sheets are read again, with every problem named, once the
fixtures exist (rules_sheets, clash_rows). A row this pass cannot understand is skipped.
"""

from __future__ import annotations

from dataclasses import replace

from leaguegrid.core.names import name_key
from leaguegrid.core.seating import Grounds
from leaguegrid.io.read.clash_rows import QUALIFIED
from leaguegrid.io.read.columns import Table
from leaguegrid.io.read.context import ReadContext
from leaguegrid.io.read.problems import Report
from leaguegrid.io.read.rules_sheets import blocked_rounds


def ground_limits(ctx: ReadContext, blocked: Table | None, clashes: Table | None,
                  requests: Table | None = None) -> Grounds:
    """Pitches of every venue, rounds a venue is blocked in (Blocked rows naming a venue and
    no team), pairs of venues a Clashes row keeps apart, and the Requests sheet's wishes."""
    pitches = {name_key(v.name): v.pitches for v in ctx.venues.values()}
    quiet = replace(ctx, report=Report(ctx.report.file))
    closed: dict[str, set[int]] = {}
    if blocked is not None and blocked.has("venue"):
        for row in blocked.rows:
            venue = _venue(blocked.text(row, "venue"), ctx)
            if venue is None or (blocked.has("team") and blocked.text(row, "team")):
                continue
            if rounds := blocked_rounds(blocked, row, quiet):
                closed.setdefault(venue, set()).update(rounds)
    apart = []
    if clashes is not None and clashes.has("first") and clashes.has("second"):
        for row in clashes.rows:
            a = _venue(clashes.text(row, "first"), ctx)
            b = _venue(clashes.text(row, "second"), ctx)
            if a and b and a != b:
                apart.append((a, b))
    wishes: dict[str, list[tuple[int, bool]]] = {}
    if requests is not None and all(requests.has(c) for c in ("team", "side")):
        for row in requests.rows:
            text = requests.text(row, "team") or ""
            if match := QUALIFIED.fullmatch(text):
                text = match[2].strip() if match[1].casefold() == "team" else ""
            team = ctx.team_names.get(text) if text else None
            side = (requests.text(row, "side") or "").strip().casefold()
            if team is None or side not in ("home", "away"):
                continue
            for r in blocked_rounds(requests, row, quiet) or []:
                wishes.setdefault(team, []).append((r, side == "home"))
    return Grounds(pitches, {g: frozenset(r) for g, r in closed.items()}, tuple(apart),
                   {team: tuple(w) for team, w in wishes.items()})


def _venue(text: str | None, ctx: ReadContext) -> str | None:
    """The venue key a cell names: `venue: X`, or a plain name that is a venue and no team."""
    if not text:
        return None
    if match := QUALIFIED.fullmatch(text):
        if match[1].casefold() != "venue":
            return None
        text = match[2].strip()
    elif ctx.team_names.get(text) is not None:
        return None
    name = ctx.venue_names.get(text)
    return name_key(name) if name else None

