"""The Clashes, Together and Apart sheets: names resolved to fixtures (a team or venue expands to
all its fixtures), qualifiers `team:`, `venue:`, `fixture:` settling names of two kinds."""

from __future__ import annotations

import re
from dataclasses import dataclass

from leaguegrid.core.model import ClashRow, Fixture, Split, Tie
from leaguegrid.core.names import suggestion
from leaguegrid.core.wording import grouped
from leaguegrid.io.read.columns import Row, Table, require
from leaguegrid.io.read.context import ReadContext
from leaguegrid.io.read.limits import MAX_CLASH_PAIRS, too_large
from leaguegrid.io.read.names import NameBook
from leaguegrid.io.read.problems import Place

PAIR_COLUMNS = {"first": "First", "second": "Second", "reason": "Reason"}
KINDS = ("fixture", "team", "venue")
QUALIFIED = re.compile(r"\s*(fixture|team|venue)\s*:\s*(.*)", re.IGNORECASE | re.DOTALL)


@dataclass(frozen=True)
class Target:
    """What a First/Second cell names: one fixture, or a team or venue and all its fixtures."""

    kind: str
    name: str  # canonical
    fixtures: tuple[str, ...]  # labels, in fixture order


class Resolver:
    """Finds fixtures, teams and venues by name for the Clashes, Together, Apart and Blocked
    sheets."""

    def __init__(self, ctx: ReadContext, fixtures: list[Fixture]) -> None:
        self.ctx = ctx
        self.books: dict[str, NameBook] = {
            "fixture": ctx.fixture_names,
            "team": ctx.team_names,
            "venue": ctx.venue_names,
        }
        self.members: dict[tuple[str, str], list[str]] = {}
        for f in fixtures:
            self.members[("fixture", f.label)] = [f.label]
            for team in f.teams:
                self.members.setdefault(("team", team), []).append(f.label)
            if f.venue:
                self.members.setdefault(("venue", f.venue), []).append(f.label)

    def resolve(self, text: str, place: Place, kinds: tuple[str, ...] = KINDS) -> Target | None:
        """The target a cell names, or None after reporting why it names nothing usable."""
        report = self.ctx.report
        if match := QUALIFIED.fullmatch(text):
            kind, name = match[1].casefold(), match[2].strip()
            if not name:
                report.error(f"no name follows '{match[1]}:'", place)
                return None
            if kind not in kinds:
                report.error(f"this sheet names {self._plural(kinds)} only, not a {kind}", place)
                return None
            candidates = (kind,)
        else:
            name, candidates = text, kinds
        found = [k for k in candidates if name in self.books[k]]
        if len(found) > 1:
            written = " or ".join(f"'{k}: {name}'" for k in found)
            report.error(f"'{name}' is {_both(found)}: write {written}", place)
            return None
        if not found:
            every = [n for k in candidates for n in self.books[k].names()]
            report.error(
                f"no {_either(candidates)} is named '{name}'" + suggestion(name, every), place
            )
            return None
        kind = found[0]
        canon = self.books[kind].add(name, place)
        return Target(kind, canon, tuple(self.members.get((kind, canon), ())))

    @staticmethod
    def _plural(kinds: tuple[str, ...]) -> str:
        return _either(tuple(f"{k}s" for k in kinds)).replace(" or ", " and ")


def _either(kinds: tuple[str, ...]) -> str:
    """'fixture, team or venue'."""
    return kinds[0] if len(kinds) == 1 else f"{', '.join(kinds[:-1])} or {kinds[-1]}"


def _both(kinds: list[str]) -> str:
    """'both a team and a venue', or 'a fixture, a team and a venue'."""
    named = [f"a {k}" for k in kinds]
    if len(named) == 2:
        return f"both {named[0]} and {named[1]}"
    return f"{', '.join(named[:-1])} and {named[-1]}"


def _two_targets(
    table: Table, row: Row, resolver: Resolver, kinds: tuple[str, ...]
) -> tuple[Target, Target] | None:
    """Both sides of a First/Second row, or None after reporting what is wrong."""
    report = resolver.ctx.report
    texts = {key: table.text(row, key) for key in ("first", "second")}
    missing = [key for key, text in texts.items() if text is None]
    if missing:
        for key in missing:
            report.error("the row needs both First and Second", table.at(row, key))
        return None
    first = resolver.resolve(texts["first"] or "", table.at(row, "first"), kinds)
    second = resolver.resolve(texts["second"] or "", table.at(row, "second"), kinds)
    if first is None or second is None:
        return None
    if (first.kind, first.name) == (second.kind, second.name):
        report.error(f"the row names the same {first.kind} on both sides", table.at(row, "second"))
        return None
    return first, second


def read_clashes(table: Table, resolver: Resolver, order: dict[str, int]) -> list[ClashRow]:
    """Clashes rows, each expanded to the fixture pairs it keeps apart (self-pairs skipped)."""
    report = resolver.ctx.report
    if not (require(table, "first", "First", report) & require(table, "second", "Second", report)):
        return []
    out = []
    total = 0
    for row in table.rows:
        targets = _two_targets(table, row, resolver, KINDS)
        if targets is None:
            continue
        first, second = targets
        total += len(first.fixtures) * len(second.fixtures)
        if total > MAX_CLASH_PAIRS:
            report.error(too_large(f"sheet {table.sheet or 'Clashes'} keeps apart",
                                   f"{grouped(MAX_CLASH_PAIRS)} pairs of fixtures"),
                         Place(table.sheet, row.number))
            return out
        pairs = _pairs(first, second, order)
        if not pairs:
            _warn_empty(table, row, first, second, resolver)
        out.append(
            ClashRow(
                table.text(row, "first") or "",
                table.text(row, "second") or "",
                table.text(row, "reason") or "",
                row.number,
                pairs,
            )
        )
    return out


def _pairs(first: Target, second: Target, order: dict[str, int]) -> list[tuple[str, str]]:
    """Every (a, b) with a from one side and b from the other, a != b, each pair once, a first."""
    found: set[tuple[str, str]] = set()
    for a in first.fixtures:
        for b in second.fixtures:
            if a != b:
                found.add((a, b) if order[a] < order[b] else (b, a))
    return sorted(found, key=lambda p: (order[p[0]], order[p[1]]))


def _warn_empty(table: Table, row: Row, first: Target, second: Target, resolver: Resolver) -> None:
    for key, target in (("first", first), ("second", second)):
        if not target.fixtures:
            resolver.ctx.report.warn(
                f"the {target.kind} '{target.name}' has no fixtures, so the row adds no clash",
                table.at(row, key),
            )
            return
    resolver.ctx.report.warn(
        "the row adds no clash: its only pair is a fixture with itself", table.at(row, "second")
    )


def _fixture_pairs(table: Table, resolver: Resolver) -> list[tuple]:
    """Rows of a First/Second sheet naming two fixtures: (row, first label, second label);
    rows with problems are reported and left out."""
    report = resolver.ctx.report
    if not (require(table, "first", "First", report) & require(table, "second", "Second", report)):
        return []
    out = []
    for row in table.rows:
        targets = _two_targets(table, row, resolver, ("fixture",))
        if targets:
            out.append((row, targets[0].name, targets[1].name))
    return out


def read_ties(table: Table, resolver: Resolver) -> list[Tie]:
    """Together rows: two fixture labels that must share a round."""
    pairs = _fixture_pairs(table, resolver)
    return [Tie(first, second, row.number) for row, first, second in pairs]


def read_splits(table: Table, resolver: Resolver) -> list[Split]:
    """Apart rows: two fixture labels that must not share a round, with a reason."""
    return [Split(first, second, table.text(row, "reason") or "kept apart", row.number)
            for row, first, second in _fixture_pairs(table, resolver)]
