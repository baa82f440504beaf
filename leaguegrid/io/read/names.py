"""Canonical spellings of the names a workbook uses (matched by the one name key)."""

from __future__ import annotations

from leaguegrid.core.names import name_key
from leaguegrid.io.read.problems import Place, Report


class NameBook:
    """The canonical spelling of each name of one kind (team, venue, division): the first spelling
    seen wins; a later spelling that differs only in case or spacing gets one warning."""

    def __init__(self, kind: str, report: Report) -> None:
        self.kind = kind
        self.report = report
        self._canon: dict[str, str] = {}
        self._first: dict[str, Place] = {}
        self._warned: set[str] = set()

    def add(self, text: str, place: Place) -> str:
        """Register a spelling seen at `place` and return the canonical one."""
        key = name_key(text)
        if key not in self._canon:
            self._canon[key] = text
            self._first[key] = place
            return text
        canon = self._canon[key]
        if text != canon and text not in self._warned:
            self._warned.add(text)
            self.report.warn(
                f"written differently from '{canon}' ({self._first[key].where()}); "
                f"read as the same {self.kind}",
                place,
            )
        return canon

    def get(self, text: str) -> str | None:
        """The canonical spelling of a known name, or None."""
        return self._canon.get(name_key(text))

    def first_place(self, text: str) -> Place | None:
        return self._first.get(name_key(text))

    def names(self) -> list[str]:
        return list(self._canon.values())

    def __contains__(self, text: str) -> bool:
        return name_key(text) in self._canon
