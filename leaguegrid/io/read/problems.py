"""The problems found while reading one league file, each located as the spreadsheet shows it."""

from __future__ import annotations

from dataclasses import dataclass

from leaguegrid.core.model import Problem, Severity
from leaguegrid.core.wording import grouped
from leaguegrid.io.read.limits import MAX_PROBLEMS_LISTED


@dataclass(frozen=True)
class Place:
    """A cell (or row, or sheet) of the input: sheet name, 1-based row, header as written, value."""

    sheet: str | None = None
    row: int | None = None
    column: str | None = None
    value: str | None = None

    def where(self) -> str:
        """Short text for a message: 'Teams row 4', or 'row 4' in a CSV file."""
        if self.row is None:
            return f"sheet {self.sheet}" if self.sheet else "the file"
        return f"{self.sheet} row {self.row}" if self.sheet else f"row {self.row}"


class Report:
    """Every problem of one file, in the order found: the first MAX_PROBLEMS_LISTED listed, the
    rest counted (a file of 50,000 bad rows must not fill the memory with sentences)."""

    def __init__(self, file: str) -> None:
        self.file = file
        self.problems: list[Problem] = []
        self.unlisted: dict[Severity, int] = {"error": 0, "warning": 0}
        self._errors = False

    def add(self, message: str, place: Place = Place(), severity: Severity = "error") -> None:
        self._errors = self._errors or severity == "error"
        if len(self.problems) >= MAX_PROBLEMS_LISTED:
            self.unlisted[severity] = self.unlisted.get(severity, 0) + 1
            return
        self.problems.append(
            Problem(
                file=self.file,
                message=message,
                sheet=place.sheet,
                row=place.row,
                column=place.column,
                value=place.value,
                severity=severity,
            )
        )

    def error(self, message: str, place: Place = Place()) -> None:
        self.add(message, place, "error")

    def warn(self, message: str, place: Place = Place()) -> None:
        self.add(message, place, "warning")

    def listed(self) -> list[Problem]:
        """The problems listed, then one line counting those that are not."""
        more = sum(self.unlisted.values())
        if not more:
            return list(self.problems)
        severity: Severity = "error" if self.unlisted["error"] else "warning"
        return [*self.problems, Problem(
            file=self.file, message=f"{grouped(more)} more problems are not listed (only the "
            f"first {grouped(MAX_PROBLEMS_LISTED)} are)", severity=severity)]

    @property
    def warnings(self) -> list[Problem]:
        return [p for p in self.problems if p.severity == "warning"]

    @property
    def has_errors(self) -> bool:
        return self._errors
