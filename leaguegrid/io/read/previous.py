"""A schedule published before (the CSV LeagueGrid writes, or any CSV with Fixture and Round
columns), read to be kept as far as the rules allow when planning again. The file is read as
league files are (sheets.read_book): the same encodings, limits and sentences."""

from __future__ import annotations

from dataclasses import dataclass, field
from pathlib import Path

from leaguegrid.core.model import League, Problem
from leaguegrid.core.names import name_key, suggestion
from leaguegrid.io.read.sheets import UnreadableFile, read_book

MAX_PROBLEMS = 200  # problems listed at most; the rest are counted


@dataclass
class PreviousSchedule:
    """Fixture label -> the round it had, and every problem found (use it only when `ok`)."""

    rounds: dict[str, int] = field(default_factory=dict)
    problems: list[Problem] = field(default_factory=list)

    @property
    def ok(self) -> bool:
        return not any(p.severity == "error" for p in self.problems)


def read_previous(path: str | Path, league: League) -> PreviousSchedule:
    """The rounds of a CSV schedule, matched to the league's fixtures by name."""
    path = Path(path)
    out = PreviousSchedule()
    name = path.name

    def problem(message: str, row: int | None = None, column: str | None = None,
                value: str | None = None, severity: str = "error") -> None:
        if len(out.problems) < MAX_PROBLEMS:
            out.problems.append(Problem(name, message, None, row, column, value, severity))

    labels = {name_key(f.label): f.label for f in league.fixtures}
    try:
        book = read_book(path)
    except UnreadableFile as err:
        problem(str(err))
        return out
    sheet = next(iter(book.sheets.values()), None)
    rows = sheet.rows if sheet is not None else []
    if not rows:
        problem("the file is empty")
        return out
    header_row, header = rows[0]
    columns = {name_key(str(h)): i for i, h in header.items()}
    missing = [c for c in ("Fixture", "Round") if name_key(c) not in columns]
    if missing:
        problem("the header row needs " + " and ".join(missing) + " columns", header_row)
        return out
    fixture_at, round_at = columns[name_key("Fixture")], columns[name_key("Round")]
    for number, cells in rows[1:]:
        text = str(cells.get(fixture_at, "")).strip()
        raw = str(cells.get(round_at, "")).strip()
        label = labels.get(name_key(text))
        if label is None:
            problem("not a fixture of this league" + suggestion(text, labels.values()),
                    number, "Fixture", text)
            continue
        if not raw.isdigit() or int(raw) < 1:
            problem("not a round number", number, "Round", raw)
            continue
        if label in out.rounds:
            problem("the fixture is listed twice; the first row is kept", number,
                    "Fixture", text, "warning")
            continue
        out.rounds[label] = int(raw)
    return out
