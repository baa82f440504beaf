"""The association season of the demo leagues, planned, and checked here against the workbook
read with openpyxl (not by the generator's code): eight divisions of ten teams home and away with
a return half, grounds with pitches, grounds let out on dates, grounds that share a car park."""

from __future__ import annotations

import datetime as dt
import itertools
from collections import Counter
from pathlib import Path

import openpyxl

from leaguegrid import engine
from leaguegrid.app import league as opening
from leaguegrid.app import planning

DEMO = Path(__file__).resolve().parents[2] / "demo_leagues" / "association.xlsx"


def sheet_rows(book, name: str) -> list[dict]:
    rows = list(book[name].iter_rows(values_only=True))
    return [dict(zip(rows[0], row, strict=True)) for row in rows[1:]]


def test_the_association_season_meets_every_rule_with_the_fewest_breaks():
    book = openpyxl.load_workbook(DEMO)
    teams = {r["Team"]: r for r in sheet_rows(book, "Teams")}
    pitches = {r["Venue"]: r["Pitches"] for r in sheet_rows(book, "Venues")}
    settings = {r["Setting"]: r["Value"] for r in sheet_rows(book, "Settings")}
    skip = {dt.date.fromisoformat(d.strip()) for d in settings["Skip"].split(",")}
    start = settings["Start date"]
    start = start.date() if isinstance(start, dt.datetime) else start
    days = [d for d in (start + dt.timedelta(weeks=w) for w in range(30)) if d not in skip][:18]

    opened = opening.open_league(DEMO)
    assert opened.ok
    outcome = planning.make_schedule(opened.league, opened.graph, 18, seed=1,
                                     hooks=engine.Hooks(budget=2.0))
    schedule = outcome.schedule
    assert schedule is not None
    games = [(f.home, f.away, schedule.assignment[f.label]) for f in opened.league.fixtures]
    assert len(games) == 720 == len(schedule.assignment)

    # every pair of a division meets twice, once at each ground; first legs in rounds 1..9
    meetings: dict[frozenset, list[tuple[int, str]]] = {}
    for home, away, r in games:
        assert teams[home]["Division"] == teams[away]["Division"]
        assert 1 <= r <= 18
        meetings.setdefault(frozenset((home, away)), []).append((r, home))
    assert len(meetings) == 8 * 45
    for legs in meetings.values():
        (r1, h1), (r2, h2) = sorted(legs)
        assert h1 != h2 and r1 <= 9 < r2

    # a team once a round (so every round, with ten teams); a ground no more than its pitches
    per_team = Counter((t, r) for home, away, r in games for t in (home, away))
    assert set(per_team.values()) == {1} and len(per_team) == 80 * 18
    at_ground = Counter((teams[home]["Venue"], r) for home, _, r in games)
    for (ground, _), count in at_ground.items():
        assert count <= pitches.get(ground, 1), ground

    # grounds let out on a date host nothing then; grounds sharing a car park never together
    for row in sheet_rows(book, "Blocked"):
        day = row["Date"].date() if isinstance(row["Date"], dt.datetime) else row["Date"]
        assert at_ground[(row["Venue"], days.index(day) + 1)] == 0, row
    for row in sheet_rows(book, "Clashes"):
        a, b = (row[c].removeprefix("venue: ") for c in ("First", "Second"))
        assert not any(at_ground[(a, r)] and at_ground[(b, r)] for r in range(1, 19)), row

    # breaks recounted: each half a single round robin of 10, so 2n - 4 = 16 a division is the
    # fewest there can be (de Werra 1981), and every division has exactly that
    sides: dict[str, list[tuple[int, str]]] = {}
    for home, away, r in games:
        sides.setdefault(home, []).append((r, "H"))
        sides.setdefault(away, []).append((r, "A"))
    per_division = Counter()
    for team, played in sides.items():
        played.sort()
        per_division[teams[team]["Division"]] += sum(
            a[1] == b[1] for a, b in itertools.pairwise(played))
        assert Counter(s for _, s in played) == {"H": 9, "A": 9}
    assert per_division == dict.fromkeys(per_division, 16) and len(per_division) == 8
    assert outcome.breaks.total == 128 == outcome.breaks_bound and outcome.optimal
