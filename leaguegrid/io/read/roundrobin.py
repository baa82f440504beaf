"""Single round-robin pairings with home and away balanced (each team at home in half its
games, rounded), listed round by round in circle-method order."""

from __future__ import annotations

from collections.abc import Sequence


def circle_rounds(count: int) -> list[list[tuple[int, int]]]:
    """Rounds of the circle method over indices 0..count-1: every pair meets exactly once."""
    slots: list[int | None] = list(range(count)) + ([None] if count % 2 else [])
    size = len(slots)
    rounds = []
    for _ in range(size - 1):
        pairs = []
        for i in range(size // 2):
            a, b = slots[i], slots[size - 1 - i]
            if a is not None and b is not None:
                pairs.append((min(a, b), max(a, b)))
        rounds.append(pairs)
        slots = [slots[0], slots[-1], *slots[1:-1]]
    return rounds


def home_index(i: int, j: int, count: int) -> int:
    """Which of teams i < j is at home. Odd count: i hosts j when (j - i) mod count is at most
    (count - 1) / 2, so everyone hosts exactly half. Even count: the same rule on the first
    count - 1 teams, and the last team hosts the even-indexed ones."""
    odd = count if count % 2 else count - 1
    if j == odd:  # j is the extra (last) team of an even count
        return j if i % 2 == 0 else i
    return i if (j - i) % odd <= (odd - 1) // 2 else j


def round_robin(teams: Sequence[str]) -> list[tuple[str, str]]:
    """Every pair of `teams` once as (home, away), home and away balanced."""
    count = len(teams)
    out = []
    for pairs in circle_rounds(count):
        for i, j in pairs:
            h = home_index(i, j, count)
            a = j if h == i else i
            out.append((teams[h], teams[a]))
    return out
