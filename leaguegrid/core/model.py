"""The league as plain data: fixtures, teams, rounds, clash rows and settings.

No Qt and no I/O here; readers build these objects and every other layer reads them.
"""

from __future__ import annotations

import datetime as dt
from dataclasses import dataclass, field
from typing import Literal

Severity = Literal["error", "warning"]


@dataclass(frozen=True)
class Problem:
    """One thing wrong (or worth a warning) in an input file, located as a spreadsheet shows it."""

    file: str
    message: str
    sheet: str | None = None
    row: int | None = None
    column: str | None = None
    value: str | None = None
    severity: Severity = "error"

    def __str__(self) -> str:
        where = [self.file]
        if self.sheet:
            where.append(f"sheet {self.sheet}")
        if self.row is not None:
            where.append(f"row {self.row}")
        if self.column:
            where.append(f"column {self.column}")
        head = ", ".join(where)
        shown = f" {self.value!r}:" if self.value not in (None, "") else ""
        tag = "warning: " if self.severity == "warning" else ""
        return f"{head}:{shown} {tag}{self.message}"


@dataclass(frozen=True)
class Reason:
    """Why two fixtures clash: a shared team or venue, a shared value of another column,
    a Clashes row, or a split added by hand. One reason can make many edges."""

    kind: Literal["team", "venue", "shared", "clash", "split"]
    key: str  # team name, venue key, "Column=value", or the Clashes row's Reason text
    row: int | None = None  # Clashes/Apart sheet row, for kind "clash"/"split"

    def __str__(self) -> str:
        if self.kind in ("team", "venue"):
            return f"{self.kind} {self.key}"
        if self.kind == "shared":
            return self.key
        return f"{self.key} (row {self.row})" if self.row is not None else self.key


@dataclass
class Team:
    """A team: a league-wide identifier, with its division, home ground and club."""

    name: str
    division: str | None = None
    venue: str | None = None
    club: str | None = None


@dataclass
class Fixture:
    """One game to be placed in a round."""

    label: str
    home: str | None = None
    away: str | None = None
    venue: str | None = None
    pitch: str | None = None
    division: str | None = None
    pin: int | None = None  # round number the fixture is fixed to (1-based), if any
    time: dt.time | None = None  # its own kick-off (Fixtures' Time), before the round's time
    played: bool = False  # already played: the pin is frozen in every schedule and count
    leg: int = 1  # 1 for the first meeting of a pairing, 2 for the return, ...
    shared: dict[str, tuple[str, ...]] = field(default_factory=dict)  # other Shared columns
    notes: dict[str, str] = field(default_factory=dict)  # unrecognised columns, kept verbatim
    row: int | None = None  # spreadsheet row it came from (None when generated from Teams)

    @property
    def teams(self) -> tuple[str, ...]:
        """The teams taking part (home first)."""
        return tuple(t for t in (self.home, self.away) if t)


@dataclass
class RoundInfo:
    """A round: a matchday (date) or a time slot (time on one day)."""

    number: int
    date: dt.date | None = None
    time: dt.time | None = None
    note: str = ""


@dataclass
class ClashRow:
    """A row of the Clashes sheet, resolved to the fixture pairs it forbids in one round."""

    first: str
    second: str
    reason: str
    row: int
    pairs: list[tuple[str, str]] = field(default_factory=list)  # fixture labels


@dataclass
class Tie:
    """Two fixtures that must share a round (Together sheet)."""

    first: str
    second: str
    row: int | None = None


@dataclass
class Split:
    """Two fixtures that must not share a round, added by hand (a clash of its own)."""

    first: str
    second: str
    reason: str = "split"
    row: int | None = None


@dataclass
class Blocked:
    """A team or venue that cannot be used in a round (bye, closure, blocked date)."""

    round: int
    team: str | None = None
    venue: str | None = None
    reason: str = ""
    row: int | None = None


@dataclass
class Request:
    """A club's wish (Requests sheet): a team at home (or away) in a round, met where possible."""

    team: str
    round: int
    side: Literal["home", "away"]
    reason: str = ""
    row: int | None = None

    def __str__(self) -> str:
        return f"{self.team} {self.side} in round {self.round}"


@dataclass
class Venue:
    """A ground: its pitch count and, optionally, its position."""

    name: str
    pitches: int = 1
    latitude: float | None = None
    longitude: float | None = None


@dataclass
class Settings:
    """The Settings sheet, with defaults for what it does not say."""

    shared: tuple[str, ...] = ("Home", "Away", "Venue")
    legs: int = 1
    start_date: dt.date | None = None
    every_days: int = 7
    skip: tuple[dt.date, ...] = ()
    league: str | None = None
    time_zone: str | None = None
    max_home_run: int | None = None
    max_away_run: int | None = None
    round_balance: int | None = None
    return_half: bool = False
    mirrored: bool = False  # Return half = mirrored: round H + r repeats round r, sides swapped
    leg_gap: int | None = None  # a pairing's two meetings at least this many rounds apart
    byes_apart: bool = True  # no team has byes in two rounds in a row (matchday round robins)
    team_shared: tuple[str, ...] = ()  # the Shared columns read from Teams (a coach, a minibus)


@dataclass
class League:
    """Everything read from one workbook, ready for the clash graph and the engine."""

    name: str
    source: str
    fixtures: list[Fixture]
    teams: dict[str, Team] = field(default_factory=dict)
    venues: dict[str, Venue] = field(default_factory=dict)
    rounds: list[RoundInfo] = field(default_factory=list)
    rounds_fixed: bool = False  # a Rounds sheet lists every round there is
    clash_rows: list[ClashRow] = field(default_factory=list)
    settings: Settings = field(default_factory=Settings)
    ties: list[Tie] = field(default_factory=list)
    splits: list[Split] = field(default_factory=list)
    blocked: list[Blocked] = field(default_factory=list)
    requests: list[Request] = field(default_factory=list)
    distances: dict[tuple[str, str], float] = field(default_factory=dict)
    warnings: list[Problem] = field(default_factory=list)

    def fixture(self, label: str) -> Fixture:
        """The fixture with this exact label."""
        for f in self.fixtures:
            if f.label == label:
                return f
        raise KeyError(label)

    @property
    def pins(self) -> dict[str, int]:
        """Fixture label -> pinned round, for pinned fixtures only."""
        return {f.label: f.pin for f in self.fixtures if f.pin is not None}


@dataclass
class LoadResult:
    """What a reader returns: every problem found, and the league as far as it could be read
    (rows with errors left out). Use the league only when `ok`."""

    league: League | None
    problems: list[Problem] = field(default_factory=list)
    # column matching entries (our column, the file's header) naming a header the file lacks
    unmatched: list[tuple[str, str]] = field(default_factory=list)
    headers: list[str] = field(default_factory=list)  # the Fixtures sheet's headers as written

    @property
    def errors(self) -> list[Problem]:
        return [p for p in self.problems if p.severity == "error"]

    @property
    def ok(self) -> bool:
        return self.league is not None and not self.errors


@dataclass
class Schedule:
    """A concrete schedule: every fixture's round, and how it was made."""

    rounds: int  # K, the number of rounds available
    assignment: dict[str, int]  # fixture label -> round in 1..K
    seed: int | None = None
    method: str = "uniform"  # "uniform" draw, "search" (generator rules), or "edited" by hand
    assignments: int | None = None  # exact P(K) of the model it was drawn from, when known
    rules_counted: list[str] = field(default_factory=list)  # rules the exact counts include
    rules_generator: list[str] = field(default_factory=list)  # rules only the generator enforces
    notes: list[str] = field(default_factory=list)  # e.g. "412 of 1000 draws met the rules"

    def by_round(self) -> dict[int, list[str]]:
        """Round -> fixture labels in it, rounds 1..K in order (empty rounds included)."""
        out: dict[int, list[str]] = {r: [] for r in range(1, self.rounds + 1)}
        for label, r in self.assignment.items():
            out[r].append(label)
        return out
