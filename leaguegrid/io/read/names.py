"""Name matching: case- and space-insensitive keys, closest-name hints, canonical spellings."""

from __future__ import annotations

import difflib
import unicodedata
from collections.abc import Iterable

from leaguegrid.io.read.problems import Place, Report


def name_key(text: str) -> str:
    """The matching key of a name: Unicode-normalised, case-folded, every space removed."""
    return "".join(unicodedata.normalize("NFKC", text).casefold().split())


def closest(name: str, candidates: Iterable[str], cutoff: float = 0.6) -> str | None:
    """The candidate spelled most like `name` (difflib ratio on keys), or None if none is close."""
    by_key: dict[str, str] = {}
    for c in candidates:
        by_key.setdefault(name_key(c), c)
    found = difflib.get_close_matches(name_key(name), list(by_key), n=1, cutoff=cutoff)
    return by_key[found[0]] if found else None


def suggestion(name: str, candidates: Iterable[str]) -> str:
    """'; did you mean 'X'?' for the closest candidate, or '' when none is close."""
    best = closest(name, candidates)
    return f"; did you mean '{best}'?" if best else ""


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
