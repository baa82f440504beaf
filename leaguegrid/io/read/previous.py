"""A schedule published before (the CSV LeagueGrid writes, or any CSV with Fixture and Round
columns), read to be kept as far as the rules allow when planning again."""

from __future__ import annotations

import csv
from dataclasses import dataclass, field
from pathlib import Path

from leaguegrid.core.model import League, Problem
from leaguegrid.core.names import name_key, suggestion

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
        with path.open(newline="", encoding="utf-8-sig") as handle:
            reader = csv.reader(handle)
            header = next(reader, None)
            if header is None:
                problem("the file is empty")
                return out
            columns = {name_key(h): i for i, h in enumerate(header)}
            missing = [c for c in ("Fixture", "Round") if name_key(c) not in columns]
            if missing:
                problem("the header row needs " + " and ".join(missing) + " columns", 1)
                return out
            fixture_at, round_at = columns[name_key("Fixture")], columns[name_key("Round")]
            for number, cells in enumerate(reader, start=2):
                if not any(c.strip() for c in cells):
                    continue
                text = cells[fixture_at].strip() if fixture_at < len(cells) else ""
                raw = cells[round_at].strip() if round_at < len(cells) else ""
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
    except (OSError, UnicodeDecodeError, csv.Error) as err:
        problem(f"the file cannot be read: {err}")
    return out
