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
