"""load_league(path): the league workbook (or CSV) read into a model.League, with every problem
found reported at once. Never raises: anything unexpected becomes a Problem naming the file."""

from __future__ import annotations

import difflib
from dataclasses import dataclass, field
from pathlib import Path

from leaguegrid.clashes.graph import build_clash_graph, pair_bound
from leaguegrid.core.model import Fixture, League, LoadResult
from leaguegrid.core.names import name_key, suggestion
from leaguegrid.core.wording import grouped
from leaguegrid.io.read.clash_rows import (
    PAIR_COLUMNS,
    Resolver,
    read_clashes,
    read_splits,
    read_ties,
)
from leaguegrid.io.read.columns import Table, make_table, report_bad_cells
from leaguegrid.io.read.consistency import check_blocked, check_pins, check_ties
from leaguegrid.io.read.context import ReadContext
from leaguegrid.io.read.fixtures_sheet import (
    FIXTURES_COLUMNS,
    STANDARD_SHARED,
    TEAM_READ,
    TEAMS_COLUMNS,
    TeamsRead,
    add_team_shared,
    complete_from_teams,
    generate_fixtures,
    read_fixtures,
    read_team_shared,
    read_teams,
)
from leaguegrid.io.read.ground_limits import ground_limits
from leaguegrid.io.read.limits import MAX_CLASH_PAIRS, too_large
from leaguegrid.io.read.problems import Place, Report
from leaguegrid.io.read.rounds_sheet import ROUNDS_COLUMNS, RoundLookup, read_rounds
from leaguegrid.io.read.rules_sheets import (
    BLOCKED_COLUMNS,
    DISTANCES_COLUMNS,
    REQUESTS_COLUMNS,
    VENUES_COLUMNS,
    read_blocked,
    read_distances,
    read_requests,
    read_venues,
)
from leaguegrid.io.read.settings_sheet import SETTINGS_COLUMNS, read_settings
from leaguegrid.io.read.sheets import RawBook, UnreadableFile, read_book
from leaguegrid.io.read.values import split_values

SHEETS = {
    name_key(n): n
    for n in (
        "Fixtures",
        "Teams",
        "Clashes",
        "Rounds",
        "Settings",
        "Together",
        "Apart",
        "Blocked",
        "Requests",
        "Venues",
        "Distances",
    )
}
# the sheets' earlier names, still read
FORMER_SHEETS = {name_key("Ties"): name_key("Together"), name_key("Splits"): name_key("Apart")}


def sheet_key(name: str) -> str:
    """The key of the sheet a workbook sheet name stands for (earlier names included)."""
    key = name_key(name)
    return FORMER_SHEETS.get(key, key)


SHEET_COLUMNS = {
    "fixtures": FIXTURES_COLUMNS,
    "teams": TEAMS_COLUMNS,
    "clashes": PAIR_COLUMNS,
    "rounds": ROUNDS_COLUMNS,
    "settings": SETTINGS_COLUMNS,
    "together": PAIR_COLUMNS,
    "apart": PAIR_COLUMNS,
    "blocked": BLOCKED_COLUMNS,
    "requests": REQUESTS_COLUMNS,
    "venues": VENUES_COLUMNS,
    "distances": DISTANCES_COLUMNS,
}
SHEET_TYPO_CUTOFF = 0.8
EMPTY_IGNORED = "the sheet is empty; nothing is read from it"


def load_league(path: str | Path, columns: dict[str, str] | None = None) -> LoadResult:
    """Read a league file. `league` is set whenever fixtures could be read (even with errors,
    so a checker can show what was found); it is usable only when `ok` (no errors).

    `columns` (from the window's column matching) maps our Fixtures column names (Fixture, Home,
    Away, Venue, Pitch, Division, Round, ...) to the file's own; its "Shared" entry lists, ";"-
    separated, more of the file's columns whose equal values clash. Entries naming a column the
    file does not have are listed in the result's `unmatched` (what to do about them is the
    caller's: app.league drops a remembered matching, and refuses one typed on a command line)."""
    report = Report(str(path))
    fit = _Fit()
    try:
        league = _load(Path(path), report, columns or {}, fit)
    except Exception as exc:  # the promise: never a traceback, always a Problem
        report.error(
            f"could not be read because of an unexpected error "
            f"({type(exc).__name__}: {exc}); please report this"
        )
        league = None
    if league is not None:
        league.warnings = report.warnings
    return LoadResult(league, report.listed(), fit.unmatched, fit.headers)


@dataclass
class _Fit:
    """How the column matching fits the file: the entries naming a header it lacks, and the
    Fixtures headers there are."""

    unmatched: list[tuple[str, str]] = field(default_factory=list)
    headers: list[str] = field(default_factory=list)


def _load(path: Path, report: Report, columns: dict[str, str], fit: _Fit) -> League | None:
    try:
        book = read_book(path, lambda name: sheet_key(name) in SHEETS)
    except UnreadableFile as exc:
        report.error(str(exc))
        return None
    found = _locate_sheets(book, report)
    rename, extra_shared = _column_mapping(columns)
    tables: dict[str, Table | None] = {}
    for key, name in found.items():
        raw = book.sheets[name]
        label = name if book.kind == "xlsx" else None
        table = make_table(
            raw,
            label,
            report,
            SHEET_COLUMNS[key],
            notes_kept=key == "fixtures",
            rename=rename if key == "fixtures" else None,
        )
        report_bad_cells(raw, table, report)
        tables[key] = table
    if (fixtures := tables.get("fixtures")) is not None:
        fit.headers = [c.header for c in fixtures.columns.values()]
        fit.unmatched = _unmatched(fixtures, tables.get("teams"), columns)
    return _build(path, found, tables, book.kind, report, extra_shared)


def _column_mapping(columns: dict[str, str]) -> tuple[dict[str, str], list[str]]:
    """(the file's header key -> our column key, the extra Shared column names)."""
    rename = {
        name_key(theirs): name_key(ours)
        for ours, theirs in columns.items()
        if name_key(ours) in FIXTURES_COLUMNS and theirs.strip()
    }
    shared = split_values(columns.get("Shared", ""), ";")
    return rename, shared


def _unmatched(
    fixtures: Table, teams: Table | None, columns: dict[str, str]
) -> list[tuple[str, str]]:
    """The matching's entries naming a header the sheet lacks (a Shared entry may also name a
    column of Teams)."""
    headers = {name_key(c.header) for c in fixtures.columns.values()}
    also = {name_key(c.header) for c in teams.columns.values()} if teams is not None else set()
    out = [(ours, theirs) for ours, theirs in columns.items()
           if name_key(ours) in FIXTURES_COLUMNS and theirs.strip()
           and name_key(theirs) not in headers]
    for name in split_values(columns.get("Shared", ""), ";"):
        if name_key(name) not in headers | also | STANDARD_SHARED:
            out.append(("Shared", name))
    return out


def _locate_sheets(book: RawBook, report: Report) -> dict[str, str]:
    """Known sheets by key -> name as written; near-miss names get a warning."""
    found: dict[str, str] = {}
    for name in book.sheet_names:
        key = sheet_key(name)
        if key in SHEETS:
            if name not in book.sheets:
                report.error("the sheet holds a chart, not rows", Place(name))
            elif key in found:
                report.error(
                    f"two sheets are named {SHEETS[key]} ('{found[key]}' and '{name}'); "
                    "only the first is read",
                    Place(name),
                )
            else:
                found[key] = name
                if name in book.hidden:
                    report.warn(f"sheet {name} is hidden in the workbook; its rows are used",
                                Place(name))
            continue
        near = difflib.get_close_matches(key, list(SHEETS), n=1, cutoff=SHEET_TYPO_CUTOFF)
        if near and near[0] not in {sheet_key(n) for n in book.sheet_names}:
            report.warn(f"the sheet is not read; did you mean '{SHEETS[near[0]]}'?", Place(name))
    return found


def _build(
    path: Path,
    found: dict[str, str],
    tables: dict[str, Table | None],
    kind: str,
    report: Report,
    extra_shared: list[str],
) -> League | None:
    """The League from the located tables, sheet by sheet in dependency order."""
    ctx = ReadContext(report)
    _settings_and_rounds(ctx, tables, found, extra_shared)
    rounds_fixed = ctx.lookup.fixed
    if (venues := _optional(tables, found, "venues", report)) is not None:
        read_venues(venues, ctx)
    fixtures_table, teams_table = _fixture_source(tables, found, kind, report)
    teams = read_teams(teams_table, ctx) if teams_table is not None else TeamsRead()
    if fixtures_table is None and teams_table is None:
        return None
    _shared_columns(ctx, fixtures_table, teams_table)
    if teams_table is not None:
        read_team_shared(teams_table, teams, ctx)
    if fixtures_table is not None:
        fixtures = read_fixtures(fixtures_table, ctx)
        complete_from_teams(fixtures, ctx)
        _after_sheet_fixtures(fixtures, teams, ctx)
    else:
        limits = ground_limits(ctx, tables.get("blocked"), tables.get("clashes"),
                               tables.get("requests"))
        fixtures = generate_fixtures(teams, ctx, limits)
    add_team_shared(fixtures, ctx)
    ctx.fixtures = fixtures
    league = League(
        name=ctx.settings.league or path.stem,
        source=str(path),
        fixtures=fixtures,
        teams=ctx.teams,
        venues=ctx.venues,
        rounds=ctx.lookup.rounds,
        rounds_fixed=rounds_fixed,
        settings=ctx.settings,
    )
    _read_rules(league, tables, found, ctx)
    if pair_bound(league) > MAX_CLASH_PAIRS:
        report.error(too_large("its fixtures make", f"{grouped(MAX_CLASH_PAIRS)} clashing pairs"))
        return None
    graph = build_clash_graph(league)
    check_pins(league, graph, ctx.pin_places, report)
    check_ties(league, graph, tables.get("together"), report)
    check_blocked(league, tables.get("blocked"), report)
    if not fixtures and not report.has_errors:
        report.error(
            "the league has no fixtures", Place(found.get("fixtures") or found.get("teams"))
        )
    return league


def _settings_and_rounds(
    ctx: ReadContext,
    tables: dict[str, Table | None],
    found: dict[str, str],
    extra_shared: list[str],
) -> None:
    """Settings first (every later sheet depends on them), then where rounds fall."""
    report = ctx.report
    settings_table = _optional(tables, found, "settings", report)
    if settings_table is not None:
        read = read_settings(settings_table, report)
        ctx.settings, ctx.shared_place = read.settings, read.shared_place
        ctx.legs_place = read.legs_place
    if extra_shared:
        ctx.settings.shared = tuple(dict.fromkeys([*ctx.settings.shared, *extra_shared]))
    s = ctx.settings
    ctx.lookup = RoundLookup(
        start=s.start_date, every=s.every_days, skip=s.skip, fixed="rounds" in found
    )
    if "rounds" not in found:
        return
    rounds_table = tables["rounds"]
    if rounds_table is None:
        report.error(
            "the sheet is empty: list the rounds, or delete the sheet", Place(found["rounds"])
        )
    else:
        ctx.lookup.rounds = read_rounds(rounds_table, report)


def _optional(
    tables: dict[str, Table | None], found: dict[str, str], key: str, report: Report
) -> Table | None:
    """An optional sheet's table; an entirely empty one gets a warning."""
    if key in found and tables.get(key) is None:
        report.warn(EMPTY_IGNORED, Place(found[key]))
    return tables.get(key)


def _fixture_source(
    tables: dict[str, Table | None], found: dict[str, str], kind: str, report: Report
) -> tuple[Table | None, Table | None]:
    """(Fixtures table to read, Teams table): Fixtures when it has rows, else generation from
    Teams; a missing or empty source is reported."""
    fixtures, teams = tables.get("fixtures"), tables.get("teams")
    teams_usable = teams is not None and bool(teams.rows)
    if "teams" in found and teams is None:
        report.add(
            EMPTY_IGNORED if fixtures is not None else "the sheet is empty",
            Place(found["teams"]),
            "warning" if fixtures is not None else "error",
        )
    if fixtures is not None and fixtures.rows:
        return fixtures, teams
    if "fixtures" in found:
        where = Place(found["fixtures"] if kind == "xlsx" else None)
        if teams_usable:
            report.warn(
                "the sheet has no fixtures; fixtures are generated from the Teams sheet", where
            )
        elif fixtures is None:
            report.error("the file has no rows" if kind == "csv" else "the sheet is empty", where)
            return None, None
        else:
            report.error(
                f"{fixtures.noun} has a header row but no fixtures",
                Place(where.sheet, fixtures.header_row),
            )
            return None, None
    if teams is not None:
        if not teams.rows:
            report.error(
                "the sheet has a header row but no teams", Place(found["teams"], teams.header_row)
            )
            return None, None
        return None, teams
    if "teams" not in found:
        report.error(
            "the workbook has no Fixtures sheet (nor a Teams sheet to generate fixtures from)",
            Place("Fixtures"),
        )
    return None, None


def _shared_columns(ctx: ReadContext, fixtures: Table | None, teams: Table | None) -> None:
    """Check the Clash on setting's column names; record the other columns to read whose equal
    values clash, of Fixtures or of Teams. A Coach column on Teams clashes unless Settings
    says otherwise."""
    names = []
    has_coach = teams is not None and teams.has("coach")
    if has_coach and ctx.shared_place is None:
        ctx.settings.shared = (*ctx.settings.shared, TEAMS_COLUMNS["coach"])
    for name in ctx.settings.shared:
        key = name_key(name)
        if key in STANDARD_SHARED:
            names.append(FIXTURES_COLUMNS[key])
        elif fixtures is not None and fixtures.has(key):
            ctx.shared_columns[key] = fixtures.header(key)
            names.append(fixtures.header(key))
        elif teams is not None and teams.has(key) and key not in TEAM_READ:
            ctx.team_shared[key] = TEAMS_COLUMNS.get(key) or teams.header(key)
            names.append(ctx.team_shared[key])
        elif fixtures is None and key == "division":
            ctx.shared_columns[key] = "Division"
            names.append("Division")
        else:
            place = ctx.shared_place or Place()
            where = Place(place.sheet, place.row, place.column, name)
            if fixtures is None:
                ctx.report.error(
                    f"Clash on names the column '{name}', which fixtures generated "
                    "from Teams do not have (they have Home, Away, Venue and "
                    "Division)",
                    where,
                )
            else:
                headers = [c.header for c in fixtures.columns.values()]
                ctx.report.error(
                    f"Clash on names the column '{name}', which the Fixtures sheet "
                    "does not have" + suggestion(name, headers),
                    where,
                )
    if teams is not None and has_coach and not {"coach"} & {*ctx.team_shared, *ctx.shared_columns}:
        ctx.report.warn(
            f"the Teams sheet has a {teams.header('coach')} column, but Clash on does not name "
            "it, so teams with the same coach may play in the same round",
            ctx.shared_place or Place(),
        )
    ctx.settings.team_shared = tuple(ctx.team_shared.values())
    if names and not {name_key(n) for n in names} & {"home", "away"}:
        ctx.report.warn(
            "Clash on names neither Home nor Away, so a team may get two fixtures in one round",
            ctx.shared_place or Place(),
        )
    ctx.settings.shared = tuple(dict.fromkeys(names))


def _after_sheet_fixtures(fixtures: list[Fixture], teams: TeamsRead, ctx: ReadContext) -> None:
    """Warnings that only make sense once a Fixtures sheet has been read."""
    if ctx.settings.legs == 2 and not any(f.leg >= 2 for f in fixtures):
        ctx.report.warn(
            "Legs is 2, but no two teams meet twice in the Fixtures sheet, so there are no "
            "return fixtures",
            ctx.legs_place or Place("Settings"),
        )
    playing = {t for f in fixtures for t in f.teams}
    for name in teams.order:
        if name not in playing:
            ctx.report.warn(
                "the team has no fixtures",
                Place(teams.sheet, teams.rows[name], teams.team_header, name),
            )


def _read_rules(
    league: League, tables: dict[str, Table | None], found: dict[str, str], ctx: ReadContext
) -> None:
    """Clashes, Together, Apart, Blocked and Distances, once fixtures, teams and venues are
    known."""
    fixtures = tables.get("fixtures")
    sheet = fixtures.sheet if fixtures is not None else None
    for f in league.fixtures:
        ctx.fixture_names.add(
            f.label, Place(sheet, f.row, "Fixture") if f.row else Place(found.get("teams"))
        )
    resolver = Resolver(ctx, league.fixtures)
    order = {f.label: i for i, f in enumerate(league.fixtures)}
    if (table := _optional(tables, found, "clashes", ctx.report)) is not None:
        league.clash_rows = read_clashes(table, resolver, order)
    if (table := _optional(tables, found, "together", ctx.report)) is not None:
        league.ties = read_ties(table, resolver)
    if (table := _optional(tables, found, "apart", ctx.report)) is not None:
        league.splits = read_splits(table, resolver)
    if (table := _optional(tables, found, "blocked", ctx.report)) is not None:
        league.blocked = read_blocked(table, resolver)
    if (table := _optional(tables, found, "requests", ctx.report)) is not None:
        league.requests = read_requests(table, resolver)
    if (table := _optional(tables, found, "distances", ctx.report)) is not None:
        league.distances = read_distances(table, ctx)
