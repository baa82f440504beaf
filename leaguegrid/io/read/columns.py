"""A sheet as a table: the header is the first non-empty row, columns are found by name
(case and spaces ignored), rows keep the number the spreadsheet shows."""

from __future__ import annotations

import difflib
from dataclasses import dataclass, field

from leaguegrid.core.names import name_key
from leaguegrid.io.read.problems import Place, Report
from leaguegrid.io.read.sheets import RawSheet, cell_name
from leaguegrid.io.read.values import cell_text

TYPO_CUTOFF = 0.75
# the usual spreadsheet words for our columns (case and spaces ignored): a header so named is
# read as that column when the sheet has no column of the standard name (Round, Date, Time and
# Coach are standard names of their own)
ALIASES = {
    name_key(alias): key
    for key, aliases in {
        "home": ("Home Team", "Home Side", "Host"),
        "away": ("Away Team", "Away Side", "Visitor", "Visitors"),
        "venue": ("Ground", "Field", "Court", "Location"),
        "pitch": ("Pitch Number",),
        "round": ("Matchday", "Week"),
        "date": ("Match Date",),
        "time": ("Kick-off", "Kick off", "Start"),
        "division": ("Grade", "Age group", "Competition"),
        "coach": ("Manager",),
    }.items()
    for alias in aliases
}


@dataclass(frozen=True)
class Column:
    key: str
    header: str  # as written in the header row
    index: int  # 1-based column number


@dataclass
class Row:
    number: int  # as the spreadsheet shows it
    values: dict[str, object]  # column key -> raw cell value (non-blank cells of named columns)


@dataclass
class Table:
    """A sheet read as a table. `sheet` is the name used in problems (None for a CSV file)."""

    sheet: str | None
    header_row: int
    columns: dict[str, Column]
    rows: list[Row] = field(default_factory=list)
    standard: dict[str, str] = field(default_factory=dict)  # key -> standard column name

    def has(self, key: str) -> bool:
        return key in self.columns

    def header(self, key: str, default: str | None = None) -> str:
        """The column's header as written, or its standard name when the sheet lacks it."""
        column = self.columns.get(key)
        return column.header if column else (default or self.standard.get(key, key))

    def raw(self, row: Row, key: str) -> object:
        return row.values.get(key)

    def text(self, row: Row, key: str) -> str | None:
        return cell_text(row.values.get(key))

    def at(self, row: Row | None, key: str | None = None) -> Place:
        """The place of a cell (or of a row when key is None) for a problem."""
        if row is None:
            return Place(self.sheet, self.header_row, self.header(key) if key else None)
        value = cell_text(row.values.get(key)) if key else None
        return Place(self.sheet, row.number, self.header(key) if key else None, value)

    @property
    def noun(self) -> str:
        """'the sheet', or 'the file' for a CSV file."""
        return "the sheet" if self.sheet else "the file"

    def sheet_place(self) -> Place:
        return Place(self.sheet, self.header_row)


def make_table(
    raw: RawSheet,
    label: str | None,
    report: Report,
    known: dict[str, str],
    notes_kept: bool = False,
    rename: dict[str, str] | None = None,
) -> Table | None:
    """The sheet as a Table (None when it has no non-empty row). Duplicate headers are errors;
    a header in ALIASES stands for its column when the sheet lacks that column by name; an
    unknown header spelled like a known one gets a warning. `rename` maps a header's key to
    the standard column it stands for; a header already named like a renamed-to column is then
    an ordinary (note) column."""
    rename = rename or {}
    taken = set(rename.values())
    if not raw.rows:
        return None
    header_row, header_cells = raw.rows[0]
    present = {name_key(t) for c in header_cells.values() if (t := cell_text(c)) is not None}
    present |= taken
    by_index: dict[int, Column] = {}
    columns: dict[str, Column] = {}
    for index in sorted(header_cells):
        text = cell_text(header_cells[index])
        if text is None:
            continue
        key = name_key(text)
        if key in rename:
            key = rename[key]
        elif key in taken:
            key = "~" + key
        elif ALIASES.get(key) in known and ALIASES[key] not in present:
            key = ALIASES[key]
        if key in columns:
            first = columns[key]
            report.error(
                f"the column appears twice (cells {cell_name(header_row, first.index)} and "
                f"{cell_name(header_row, index)}); only the first is read",
                Place(label, header_row, text),
            )
            continue
        column = Column(key, text, index)
        columns[key] = column
        by_index[index] = column
        if key not in known and not key.startswith("~"):
            _warn_typo(column, header_row, label, report, known, notes_kept)
    table = Table(label, header_row, columns, standard=known)
    for number, cells in raw.rows[1:]:
        values = {by_index[i].key: v for i, v in cells.items() if i in by_index}
        if values:
            table.rows.append(Row(number, values))
    return table


def _warn_typo(
    column: Column, row: int, label: str | None, report: Report, known: dict[str, str], notes: bool
) -> None:
    match = difflib.get_close_matches(column.key, list(known), n=1, cutoff=TYPO_CUTOFF)
    if not match:
        return
    fate = "kept as a note" if notes else "not read"
    report.warn(
        f"the column is {fate}; did you mean '{known[match[0]]}'?",
        Place(label, row, column.header),
    )


def report_bad_cells(raw: RawSheet, table: Table | None, report: Report) -> None:
    """Formula cells with no saved result and cells holding spreadsheet errors are errors."""
    headers = {c.index: c.header for c in table.columns.values()} if table else {}
    label = table.sheet if table else raw.name
    for row, col in raw.uncalculated:
        report.error(
            f"cell {cell_name(row, col)} holds a formula with no saved result: open the workbook "
            "in a spreadsheet program, let it calculate, and save it",
            Place(label, row, headers.get(col)),
        )
    for row, col, code in raw.error_cells:
        report.error(
            f"cell {cell_name(row, col)} holds the spreadsheet error {code}",
            Place(label, row, headers.get(col), code),
        )


def require(table: Table, key: str, display: str, report: Report) -> bool:
    """True when the column exists; otherwise report it missing (naming the closest header)."""
    if table.has(key):
        return True
    headers = [c.header for c in table.columns.values()]
    match = difflib.get_close_matches(key, [c.key for c in table.columns.values()], n=1, cutoff=0.6)
    if match:
        hint = f"; did you mean '{table.columns[match[0]].header}'?"
    else:
        hint = f" (columns found: {', '.join(headers)})" if headers else ""
    report.error(
        f"{table.noun} has no {display} column{hint}", Place(table.sheet, table.header_row, display)
    )
    return False
