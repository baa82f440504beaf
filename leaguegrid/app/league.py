"""Opening a league: read a workbook or CSV, check it, build its clash graph."""

from __future__ import annotations

import hashlib
from dataclasses import dataclass
from pathlib import Path
from typing import Any

import networkx as nx

from leaguegrid import engine
from leaguegrid.app.defaults import PREVIEW_ROWS
from leaguegrid.app.matching import ColumnsError, misses_text
from leaguegrid.clashes.graph import build_clash_graph, without_reasons
from leaguegrid.core.model import League, LoadResult, Reason
from leaguegrid.core.names import suggestion
from leaguegrid.core.wording import plural, stale_matching
from leaguegrid.io.read.league_reader import load_league
from leaguegrid.io.read.sheets import UnreadableFile, read_book

Preview = dict[str, list[tuple[int, list]]]


class RoundsError(ValueError):
    """A round count the league cannot have (not positive, or past its Rounds sheet)."""


@dataclass
class OpenedLeague:
    """A league as read: every problem found, the clash graph when usable, the file's hash."""

    path: Path
    result: LoadResult
    graph: nx.Graph | None
    sha256: str | None = None
    preview: Preview | None = None
    columns: dict[str, str] | None = None  # the column matching the file was read with
    notice: str | None = None  # a one-line notice: a remembered matching was dropped

    @property
    def ok(self) -> bool:
        return self.result.ok

    @property
    def league(self) -> League | None:
        return self.result.league


def open_league(path: str | Path, columns: dict[str, str] | None = None, *,
                preview: bool = False, hooks: engine.Hooks | None = None,
                typed: bool = False) -> OpenedLeague:
    """Read a league workbook or CSV (`columns`: the column matching, our Fixtures column ->
    the file's, see app.matching) and build its clash graph; with `preview`, also every
    sheet's rows and the file's SHA-256 (to notice later that the workbook changed).

    A remembered matching naming a column the file no longer has is dropped, with a notice,
    and the file read without it; one the coordinator just `typed` raises ColumnsError."""
    hooks = hooks or engine.Hooks()
    path = Path(path)
    hooks.report(0.1, f"Reading {path.name}")
    result = load_league(path, columns=columns or None)
    notice = None
    if columns and result.unmatched:
        if typed:
            raise ColumnsError(_typed_misses(path, result))
        notice = stale_matching(path.name, misses_text(result.unmatched))
        columns = None
        result = load_league(path)
    opened = OpenedLeague(path, result, None, columns=columns or None, notice=notice)
    if preview:
        hooks.report(0.6, "Preparing the preview")
        opened.preview = preview_sheets(path)
        opened.sha256 = sha256_of(path) if path.is_file() else None
    if result.ok:
        hooks.report(0.8, "Building the clash graph")
        opened.graph = build_clash_graph(result.league)
    return opened


def _typed_misses(path: Path, result: LoadResult) -> str:
    """Why a typed matching does not fit: each header missing, the closest one there is."""
    parts = [f"{path.name} has no column {theirs!r} for {ours}"
             + suggestion(theirs, result.headers) for ours, theirs in result.unmatched]
    said = "; ".join(parts)
    return said + ("" if said.endswith("?") else ".") + (
        f" Its Fixtures columns: {', '.join(result.headers)}.")


def clash_graph(league: League, waived: list[Reason] | None = None) -> nx.Graph:
    """The league's clash graph; edges that exist only for waived reasons are left out."""
    graph = build_clash_graph(league)
    return without_reasons(graph, waived) if waived else graph


def check_rounds(league: League, rounds: int) -> None:
    """Raise RoundsError unless the league can have `rounds` rounds (a Rounds sheet lists every
    round there is)."""
    if rounds < 1:
        raise RoundsError(f"the number of rounds must be a positive whole number, not {rounds}")
    if league.rounds_fixed and rounds > len(league.rounds):
        raise RoundsError(f"the Rounds sheet lists {plural(len(league.rounds), 'round')}; "
                          f"{rounds} asks for more")


def sha256_of(path: str | Path) -> str:
    """The SHA-256 of a file's bytes, to notice a workbook changed since a project was saved."""
    digest = hashlib.sha256()
    with open(path, "rb") as handle:
        for chunk in iter(lambda: handle.read(1 << 16), b""):
            digest.update(chunk)
    return digest.hexdigest()


def preview_sheets(path: str | Path, limit: int = PREVIEW_ROWS) -> Preview:
    """Each sheet's non-empty rows as (row number, cells), read by the importer's own reader,
    so the row numbers are the ones its problems name; {} when unreadable.

    A CSV shows as its one sheet, Fixtures; a cell holding a spreadsheet error shows its code.
    """
    try:
        book = read_book(Path(path))
    except UnreadableFile:  # a damaged file has no preview; its problems are listed instead
        return {}
    return {name: _preview_rows(book.sheets[name], limit)
            for name in book.sheet_names if name in book.sheets}


def _preview_rows(sheet: Any, limit: int) -> list[tuple[int, list]]:
    """A RawSheet's rows (and its error cells, such as #REF!) as (row number, cells A, B, ...)."""
    rows: dict[int, dict[int, object]] = {n: dict(cells) for n, cells in sheet.rows}
    for n, column, code in sheet.error_cells:
        rows.setdefault(n, {})[column] = code
    out = []
    for n in sorted(rows)[:limit]:
        cells = rows[n]
        out.append((n, [cells.get(c) for c in range(1, max(cells) + 1)]))
    return out
