"""Breaks and byes of a schedule, and the published lower bounds on breaks.

A break is two consecutive games of one team on the same side (home, home or away, away), the
team's games taken in round order with byes skipped: home, bye, home is a break. A bye is a
round of the season in which a team of the division has no game.
"""

from __future__ import annotations

from dataclasses import dataclass, field
from typing import Literal

from leaguegrid.core.model import League

Style = Literal["single", "mirrored", "halves", "double"]


@dataclass(frozen=True)
class BreakCount:
    """Breaks in total and per team (every team with a home or away game listed)."""

    total: int
    per_team: dict[str, int] = field(default_factory=dict)


def team_games(league: League, assignment: dict[str, int]) -> dict[str, list[tuple[int, str]]]:
    """Team -> its placed games as (round, "home" | "away"), in round order."""
    out: dict[str, list[tuple[int, str]]] = {}
    for f in league.fixtures:
        r = assignment.get(f.label)
        if r is None:
            continue
        if f.home:
            out.setdefault(f.home, []).append((r, "home"))
        if f.away:
            out.setdefault(f.away, []).append((r, "away"))
    for games in out.values():
        games.sort()
    return out


def count_breaks(league: League, assignment: dict[str, int]) -> BreakCount:
    """The schedule's breaks, per team and in total (byes skipped)."""
    per_team = {
        team: sum(1 for (_, a), (_, b) in zip(games, games[1:], strict=False) if a == b)
        for team, games in team_games(league, assignment).items()
    }
    return BreakCount(sum(per_team.values()), dict(sorted(per_team.items())))


def team_byes(league: League, assignment: dict[str, int], rounds: int) -> dict[str, list[int]]:
    """Team -> the rounds 1..rounds in which it has no game (teams with at least one game)."""
    playing: dict[str, set[int]] = {}
    for f in league.fixtures:
        r = assignment.get(f.label)
        for team in f.teams:
            playing.setdefault(team, set())
            if r is not None:
                playing[team].add(r)
    return {team: [r for r in range(1, rounds + 1) if r not in got]
            for team, got in sorted(playing.items())}


def break_lower_bound(teams: int, style: Style, rounds: int) -> int:
    """The fewest breaks any schedule of a round robin of `teams` teams can have in `rounds`
    rounds, as far as a published result proves it (0 when nothing better is known).

    n even and compact (n - 1 rounds a leg): single n - 2, mirrored double 3n - 6, double with
    each half a single round robin 2n - 4 (de Werra, "Scheduling in sports", 1981). Any compact
    round robin of n even has at least n - 2: two teams with the same home-away pattern never
    meet, and only two patterns have no break (the same argument). n odd: 0 single, n mirrored
    (de Werra 1981)."""
    if teams < 2:
        return 0
    legs = 1 if style == "single" else 2
    if teams % 2:
        compact_odd = rounds == legs * teams
        return teams if style == "mirrored" and compact_odd else 0
    if rounds != legs * (teams - 1):
        return 0
    return {"single": teams - 2, "mirrored": 3 * teams - 6, "halves": 2 * teams - 4,
            "double": teams - 2}[style]
