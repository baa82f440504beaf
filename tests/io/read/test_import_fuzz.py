"""Property tests: whatever bytes or cell values the importer is fed, load_league returns a
LoadResult (a league or problems) and never raises, never hits its last-resort handler, and
never changes the input file."""

from __future__ import annotations

import datetime as dt
import io
import os
import tempfile
import zipfile
from functools import cache
from pathlib import Path

import openpyxl
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

from leaguegrid.core.model import LoadResult, Problem
from leaguegrid.io.read.league_reader import SHEETS, load_league

DEMOS = sorted((Path(__file__).resolve().parents[3] / "demo_leagues").glob("*.xlsx"))
FUZZ = settings(max_examples=40, deadline=None, suppress_health_check=[HealthCheck.too_slow])
UNEXPECTED = "could not be read because of an unexpected error"


def realistic_sheets() -> dict[str, list[list[object]]]:
    """A league using every sheet of the format."""
    return {
        "Fixtures": [
            [
                "Fixture",
                "Home",
                "Away",
                "Venue",
                "Pitch",
                "Division",
                "Round",
                "Played",
                "Score",
                "Referee",
            ],
            [None, "Alder U10", "Birch U10", "Oak Rd", 1, "U10", 1, "yes", "2-1", "Ann; Bo"],
            [None, "Cedar U10", "Damson U10", "Oak Rd", 2, "U10", None, None, None, "Bo"],
            [
                None,
                "Alder U10",
                "Cedar U10",
                "Pine St",
                None,
                "U10",
                "2025-09-13",
                None,
                None,
                None,
            ],
            ["Cup Final", None, None, "Pine St", None, None, None, None, None, "Cy"],
            [None, "Birch U10", "Damson U10", "=A2", None, "U10", None, None, None, None],
            [None, "Elm U10", "Fir U10", "Elm Park", None, "U10", None, None, None, "Di"],
        ],
        "Teams": [
            ["Team", "Venue", "Division", "Club"],
            ["Alder U10", "Oak Rd", "U10", "Alder"],
            ["Birch U10", "Pine St", "U10", "Birch"],
        ],
        "Clashes": [
            ["First", "Second", "Reason"],
            ["team: Alder U10", "Birch U10", "coach"],
            ["venue: Oak Rd", "Cup Final", "stewards"],
        ],
        "Rounds": [
            ["Round", "Date", "Time"],
            [1, dt.date(2025, 9, 6), dt.time(9, 0)],
            [2, dt.date(2025, 9, 13), None],
            [3, "2025-09-20", None],
            [4, None, None],
        ],
        "Settings": [
            ["Setting", "Value"],
            ["Shared", "Home, Away, Venue, Referee"],
            ["League", "Fuzz Valley"],
            ["Max home run", 2],
            ["Return half", "no"],
        ],
        "Ties": [["First", "Second"], ["Elm U10 v Fir U10", "Cup Final"]],
        "Splits": [["First", "Second", "Reason"], ["Cup Final", "Alder U10 v Cedar U10", "split"]],
        "Blocked": [
            ["Team", "Venue", "Round", "Date", "Reason"],
            ["Birch U10", None, 4, None, "bye"],
            [None, "Pine St", None, "2025-09-20", "fair"],
        ],
        "Venues": [
            ["Venue", "Pitches", "Latitude", "Longitude"],
            ["Oak Rd", 2, 51.5, -0.1],
            ["Pine St", 1, 51.6, -0.2],
        ],
        "Distances": [["From", "To", "Km"], ["Oak Rd", "Pine St", 11.5]],
    }


def workbook_bytes(sheets: dict[str, list[list[object]]]) -> bytes:
    book = openpyxl.Workbook()
    book.remove(book.active)
    for name, rows in sheets.items():
        sheet = book.create_sheet(name)
        for r, row in enumerate(rows, start=1):
            for c, value in enumerate(row, start=1):
                if value is not None:
                    sheet.cell(r, c, value)
    buffer = io.BytesIO()
    book.save(buffer)
    return buffer.getvalue()


@cache
def originals() -> tuple[bytes, ...]:
    return (workbook_bytes(realistic_sheets()), *(p.read_bytes() for p in DEMOS))


def check_load(data: bytes, suffix: str = ".xlsx") -> LoadResult:
    """Load `data` from a file; the result must be well formed and the file left as it was."""
    with tempfile.TemporaryDirectory() as folder:
        path = Path(folder) / f"fuzzed{suffix}"
        path.write_bytes(data)
        stamp = os.stat(path).st_mtime_ns
        result = load_league(path)
        assert path.read_bytes() == data and os.stat(path).st_mtime_ns == stamp
    assert isinstance(result, LoadResult)
    assert all(isinstance(p, Problem) and p.file == str(path) for p in result.problems)
    assert not [p for p in result.problems if p.message.startswith(UNEXPECTED)], [
        str(p) for p in result.problems
    ]
    if result.league is None:
        assert result.errors
    return result


def test_the_realistic_workbook_and_the_demos_load():
    result = check_load(originals()[0])
    assert [p.message for p in result.errors] == [
        "cell D6 holds a formula with no saved result: open the workbook in a spreadsheet "
        "program, let it calculate, and save it"
    ]
    for data in originals()[1:]:
        assert check_load(data).ok


@FUZZ
@given(st.binary(max_size=3000), st.sampled_from([".xlsx", ".csv", ".txt", ""]))
def test_random_bytes(data, suffix):
    check_load(data, suffix)


@FUZZ
@given(st.data())
def test_damaged_file_bytes(data):
    original = bytearray(data.draw(st.sampled_from(originals())))
    for _ in range(data.draw(st.integers(1, 4))):
        at = data.draw(st.integers(0, len(original) - 1))
        action = data.draw(st.sampled_from(["flip", "cut", "insert", "zero"]))
        if action == "flip":
            original[at] ^= data.draw(st.integers(1, 255))
        elif action == "cut":
            del original[at:]
            if not original:
                break
        elif action == "insert":
            original[at:at] = data.draw(st.binary(min_size=1, max_size=16))
        else:
            original[at : at + 64] = bytes(len(original[at : at + 64]))
    check_load(bytes(original))


@FUZZ
@given(st.data())
def test_damaged_parts_inside_the_archive(data):
    """Damage the XML of one part and store it back with a valid checksum, so the damage
    reaches the spreadsheet parser instead of the zip layer."""
    with zipfile.ZipFile(io.BytesIO(data.draw(st.sampled_from(originals())))) as archive:
        parts = {n: archive.read(n) for n in archive.namelist()}
    name = data.draw(st.sampled_from(sorted(parts)))
    part = bytearray(parts[name])
    for _ in range(data.draw(st.integers(1, 3))):
        if not part:
            break
        at = data.draw(st.integers(0, len(part) - 1))
        action = data.draw(st.sampled_from(["flip", "cut", "insert"]))
        if action == "flip":
            part[at] = data.draw(st.sampled_from(b"<>/\"'=&;0123456789az \x00\xff"))
        elif action == "cut":
            del part[at:]
        else:
            part[at:at] = data.draw(
                st.sampled_from(
                    [
                        b'<c r="A1" t="s"><v>999</v></c>',
                        b'<row r="0">',
                        b"]]>",
                        b"&bogus;",
                        b"<f>1/0</f>",
                        b"<v>-1e999</v>",
                        b'<c r="XFD1048576"><v>1</v></c>',
                    ]
                )
            )
    parts[name] = bytes(part)
    buffer = io.BytesIO()
    with zipfile.ZipFile(buffer, "w", zipfile.ZIP_DEFLATED) as archive:
        for part_name, content in parts.items():
            archive.writestr(part_name, content)
    check_load(buffer.getvalue())


CELLS = st.one_of(
    st.none(),
    st.text(st.characters(blacklist_categories=("Cs", "Cc")), max_size=12),
    st.sampled_from(
        [
            "Alder",
            "alder ",
            "Birch",
            "team: Alder",
            "venue: Oak",
            "fixture: Alder v Birch",
            "Oak",
            "2025-09-13",
            "13/09/2025",
            "yes",
            "x",
            "0",
            "-3",
            "1e400",
            "Home",
            "Away",
            "Round",
            "Fixture",
            "Venue",
            "Pitch",
            "Team",
            "Division",
            "First",
            "Second",
            "Setting",
            "Value",
            "Legs",
            "Shared",
            "Start date",
            "Skip",
            "#N/A",
        ]
    ),
    st.integers(-5, 10**12),
    st.floats(allow_nan=False, allow_infinity=False),
    st.booleans(),
    st.dates(min_value=dt.date(1901, 1, 1), max_value=dt.date(2200, 1, 1)),
    st.times(),
)


@FUZZ
@given(
    st.dictionaries(
        st.sampled_from(sorted(SHEETS.values())),
        st.lists(st.lists(CELLS, max_size=6), max_size=8),
        min_size=1,
        max_size=5,
    )
)
def test_random_cells_in_known_sheets(sheets):
    check_load(workbook_bytes(sheets))


@FUZZ
@given(
    st.lists(st.lists(CELLS, max_size=5), max_size=8), st.sampled_from([",", ";"]), st.booleans()
)
def test_random_csv(rows, delimiter, bom):
    text = "\n".join(delimiter.join(str(v) if v is not None else "" for v in row) for row in rows)
    check_load(("\ufeff" if bom else "").encode() + text.encode("utf-8", "surrogatepass"), ".csv")
