"""Clubs' requests (Requests sheet): a team at home, or not at home, in a round; met where the
rules allow, and reported one by one."""

from __future__ import annotations

from leaguegrid.core.model import League, Request


def request_met(league: League, request: Request, assignment: dict[str, int]) -> bool:
    """True when the schedule has the team at home in that round (home), or not at home there
    (away: an away game or a bye)."""
    home = any(f.home == request.team and assignment.get(f.label) == request.round
               for f in league.fixtures)
    return home if request.side == "home" else not home


def unmet_requests(league: League, assignment: dict[str, int]) -> list[Request]:
    """The requests the schedule does not meet, in sheet order."""
    if not league.requests:
        return []
    at_home = {(f.home, assignment.get(f.label)) for f in league.fixtures if f.home}
    return [q for q in league.requests
            if ((q.team, q.round) in at_home) != (q.side == "home")]
