"""The problems found while reading one league file, each located as the spreadsheet shows it."""

from __future__ import annotations

from dataclasses import dataclass

from leaguegrid.core.model import Problem, Severity


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
    """Every problem of one file, in the order found."""

    def __init__(self, file: str) -> None:
        self.file = file
        self.problems: list[Problem] = []

    def add(self, message: str, place: Place = Place(), severity: Severity = "error") -> None:
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

    @property
    def warnings(self) -> list[Problem]:
        return [p for p in self.problems if p.severity == "warning"]

    @property
    def has_errors(self) -> bool:
        return any(p.severity == "error" for p in self.problems)
