"""Round robin timetables with fewest breaks, over team indices 0..n-1, and the pairings
LeagueGrid generates from a Teams sheet (in the same order, with the same home sides).

Circle method with de Werra's home-away rule ("Scheduling in sports", 1981): team n-1 stays
put and meets team r in round r; teams r + i and r - i (mod n - 1) meet too, the first at home
when i is odd. Every compact single round robin so made has n - 2 breaks, the mirrored double
3n - 6; with n odd, team n (a dummy) is dropped and its opponent has the bye: 0 breaks single.
"""

from __future__ import annotations

from collections.abc import Sequence

Game = tuple[int, int]  # (home, away)


def single_round_robin(teams: int) -> list[list[Game]]:
    """Rounds of a single round robin of `teams` teams (byes as missing games when odd)."""
    n = teams + teams % 2
    m = n - 1
    rounds: list[list[Game]] = []
    for r in range(m):
        games = [(r, n - 1) if r % 2 == 0 else (n - 1, r)]
        for i in range(1, n // 2):
            a, b = (r + i) % m, (r - i) % m
            games.append((a, b) if i % 2 else (b, a))
        rounds.append([g for g in games if max(g) < teams])
    return rounds


def swapped(rounds: list[list[Game]]) -> list[list[Game]]:
    """The same rounds with home and away swapped in every game."""
    return [[(a, h) for h, a in games] for games in rounds]


def mirrored_double(teams: int) -> list[list[Game]]:
    """Mirrored double round robin: round H + r repeats round r with sides swapped."""
    first = single_round_robin(teams)
    return first + swapped(first)


def halves_double(teams: int) -> list[list[Game]]:
    """Double round robin in two halves, each a single round robin: the second half plays the
    first half's rounds in reverse order with sides swapped, so the junction adds no break.
    With n odd that would give the last round's bye twice in a row: mirrored instead."""
    first = single_round_robin(teams)
    return first + swapped(first[::-1] if teams % 2 == 0 else first)


def pairings(teams: Sequence[str]) -> list[tuple[str, str]]:
    """Every pair of `teams` once as (home, away), round by round of the single round robin
    above: home counts within one of each other, and with these sides some order of the
    rounds (that one) has the fewest breaks there can be."""
    return [(teams[h], teams[a]) for games in single_round_robin(len(teams)) for h, a in games]


def partners(teams: int) -> list[tuple[int, int]]:
    """Pairs of places in single_round_robin whose home-away patterns are complementary (one
    at home while the other is away, in every round both play): two teams that share a ground
    placed there never want it on the same day."""
    if teams % 2:
        return [(s, s + 1) for s in range(0, teams - 1, 2)]
    return [(0, teams - 1)] + [(s, s + 1) for s in range(1, teams - 1, 2)]


def seat_teams(divisions: Sequence[Sequence[str]],
               ground: dict[str, str | None]) -> list[list[str]]:
    """Each division's teams in the order of their places in the timetable, so that teams
    sharing a ground get complementary places: within a division, and across divisions of the
    same size (which play their rounds side by side), the third on a ground back on the first's
    place, so a ground of two pitches holds four such teams. Otherwise sheet order."""
    taken: dict[tuple[str, int], list[int]] = {}  # (ground, size) -> places used there
    out = []
    for members in divisions:
        n = len(members)
        mate = {a: b for p in partners(n) for a, b in (p, p[::-1])}
        seat: dict[int, str] = {}
        left = list(members)
        for name in members:  # the ground is used by an earlier division of the same size
            g = ground.get(name)
            used = taken.get((g, n), []) if g else []
            # alternate: the second team on a ground gets the first's mate, the third the
            # first's place again, so at most half (rounded up) are at home in any round
            want = (mate.get(used[0]) if len(used) % 2 else used[0]) if used else None
            if want is not None and want not in seat:
                seat[want] = name
                left.remove(name)
        by_ground: dict[str, list[str]] = {}
        for name in left:
            if ground.get(name):
                by_ground.setdefault(ground[name], []).append(name)
        pairs = [p for p in partners(n) if p[0] not in seat and p[1] not in seat]
        for names in by_ground.values():  # two teams of one division share a ground
            while len(names) >= 2 and pairs:
                a, b = pairs.pop(0)
                seat[a], seat[b] = names.pop(0), names.pop(0)
                left.remove(seat[a])
                left.remove(seat[b])
        free = [s for s in range(n) if s not in seat]
        seat.update(zip(free, left, strict=True))
        order = [seat[s] for s in range(n)]
        for s, name in enumerate(order):
            if ground.get(name):
                taken.setdefault((ground[name], n), []).append(s)
        out.append(order)
    return out
