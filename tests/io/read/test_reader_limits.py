"""Hostile workbooks and CSV files, each built here: every limit answers with one sentence
naming the file, the part and the limit; far-away cells and empty rows are read; the memory
of the whole `leaguegrid check` stays bounded (measured in a child process)."""

from __future__ import annotations

import io
import json
import sys
import zipfile
from pathlib import Path

import pytest
from test_reader_support import errors, one, warnings_of, write_book

from benchmarks import hostile_files as hf
from leaguegrid.io.read import limits, sheets, xlsx
from leaguegrid.io.read.league_reader import load_league

REPO = Path(__file__).resolve().parents[3]
MiB = 1024 * 1024


def file_problem(path: Path) -> str:
    """The one problem of an unreadable file; it names the file, no sheet or cell."""
    result = load_league(path)
    assert result.league is None
    problem = one(result.problems)
    assert (problem.file, problem.sheet, problem.row) == (str(path), None, None)
    return problem.message


def test_the_limits_are_the_ones_the_user_docs_list():
    text = (REPO / "docs" / "user" / "workbook-format.md").read_text(encoding="utf-8")
    table = dict(line.strip("|").rsplit("|", 1) for line in text.splitlines()
                 if line.startswith("| ") and line.count("|") == 3)
    listed = {what.strip(): limit.strip() for what, limit in table.items()}
    assert {
        "the file": limits.size_text(limits.MAX_FILE_BYTES),
        "rows holding data, in one sheet or the CSV file": f"{limits.MAX_DATA_ROWS:,}",
        "cells holding data, in the whole workbook (values, in a CSV file)":
            f"{limits.MAX_DATA_CELLS:,}",
        "one worksheet of a workbook, unpacked": limits.size_text(limits.MAX_SHEET_BYTES),
        "the shared text of a workbook, unpacked": limits.size_text(limits.MAX_STRINGS_BYTES),
        "the workbook's own description (workbook, relationships and styles), unpacked, each":
            limits.size_text(limits.MAX_SMALL_PART_BYTES),
        "all parts of a workbook that are read, unpacked, together":
            limits.size_text(limits.MAX_UNPACKED_BYTES),
        "parts of a workbook": f"{limits.MAX_PARTS:,}",
        "one line of a CSV file": limits.size_text(limits.MAX_CSV_LINE_BYTES),
        "pairs of fixtures that may not share a round (the clash graph's pairs)":
            f"{limits.MAX_CLASH_PAIRS:,}",
    }.items() <= listed.items()
    assert (limits.MAX_DATA_ROWS, limits.MAX_DATA_CELLS) == (50_000, 300_000)


def test_a_sheet_that_unpacks_past_its_limit(tmp_path):
    path = hf.sheet_bomb(tmp_path / "league.xlsx", unpacked=129 * MiB, level=1)
    assert path.stat().st_size < 2 * MiB
    assert file_problem(path) == (
        "the file is too large to read: part xl/worksheets/sheet1.xml unpacks to more than "
        "128 MB (the limit)"
    )


def test_a_shared_strings_part_that_unpacks_past_its_limit(tmp_path):
    path = hf.strings_bomb(tmp_path / "league.xlsx", unpacked=17 * MiB)
    assert file_problem(path) == (
        "the file is too large to read: part xl/sharedStrings.xml unpacks to more than 16 MB "
        "(the limit)"
    )


def test_a_directory_that_understates_a_part_stops_at_the_stated_size(tmp_path):
    """The zip directory says 2 MiB; the data unpacks to 40 MiB. Unpacking stops at what the
    directory says, and the part then fails its checksum."""
    path = hf.sheet_bomb(tmp_path / "league.xlsx", unpacked=40 * MiB)
    hf.lie_about_size(path, "xl/worksheets/sheet1.xml", 2 * MiB)
    assert file_problem(path) == (
        "the workbook is damaged: part xl/worksheets/sheet1.xml fails its checksum"
    )


def test_the_parts_read_are_counted_together_as_they_unpack(tmp_path, monkeypatch):
    monkeypatch.setattr(xlsx, "MAX_UNPACKED_BYTES", MiB)
    rows = [["Home", "Away"]] + [[f"Team {i}", f"Side {i}"] for i in range(9000)]
    path = write_book(tmp_path / "league.xlsx", {"Fixtures": rows, "Teams": [["Team"]]})
    assert file_problem(path) == (
        "the file is too large to read: the parts read unpack to more than 1 MB together "
        "(the limit)"
    )


def test_a_file_too_large_to_read(tmp_path, monkeypatch):
    monkeypatch.setattr(sheets, "MAX_FILE_BYTES", 1000)
    path = hf.fixtures_book(tmp_path / "league.xlsx")
    size = path.stat().st_size
    assert file_problem(path) == (
        f"the file is too large to read: it holds {size:,} bytes, more than 1,000 bytes "
        "(the limit)"
    )


def test_a_zip_directory_of_too_many_parts(tmp_path, monkeypatch):
    monkeypatch.setattr(sheets, "MAX_PARTS", 5)
    path = hf.fixtures_book(tmp_path / "league.xlsx")  # 5 parts
    with zipfile.ZipFile(path, "a") as archive:
        archive.writestr("xl/media/logo.txt", "a club logo")
    assert file_problem(path) == (
        "the file is too large to read: its zip directory lists more than 5 parts (the limit)"
    )


@pytest.mark.parametrize("part", ["xl/worksheets/sheet1.xml", "xl/workbook.xml",
                                  "xl/sharedStrings.xml"])
def test_entity_declarations_are_refused_in_any_part(tmp_path, part):
    path = hf.entity_book(tmp_path / "league.xlsx")
    if part != "xl/worksheets/sheet1.xml":
        with zipfile.ZipFile(path) as archive:
            parts = {n: archive.read(n) for n in archive.namelist()}
        parts["xl/worksheets/sheet1.xml"] = parts["xl/worksheets/sheet1.xml"].replace(
            hf.LAUGHS.encode(), b"").replace(
            b'<c r="A2" t="inlineStr"><is><t>&i;</t></is></c>', b'<c r="A2" t="s"><v>0</v></c>')
        parts[part] = parts.get(part, f'<sst xmlns="{hf.MAIN}"></sst>'.encode())
        at = parts[part].index(b"<", 2 if parts[part].startswith(b"<?") else 0)
        if parts[part].startswith(b"<?"):
            at = parts[part].index(b"?>") + 2
        parts[part] = parts[part][:at] + hf.LAUGHS.encode() + parts[part][at:]
        rels = parts["xl/_rels/workbook.xml.rels"]
        if b"sharedStrings" not in rels:
            parts["xl/_rels/workbook.xml.rels"] = rels.replace(
                b"</Relationships>",
                f'<Relationship Id="rIdS" Type="{hf.STRINGS_TYPE}" '
                f'Target="sharedStrings.xml"/></Relationships>'.encode())
        buffer = io.BytesIO()
        with zipfile.ZipFile(buffer, "w", zipfile.ZIP_DEFLATED) as archive:
            for name, data in parts.items():
                archive.writestr(name, data)
        path.write_bytes(buffer.getvalue())
    assert file_problem(path) == (
        f"the workbook is damaged: part {part} declares a document type or entities, which "
        "are not allowed in a workbook"
    )


def test_a_lone_fixture_on_the_last_row(tmp_path):
    result = load_league(hf.far_fixture_book(tmp_path / "league.xlsx"))
    assert result.ok, [str(p) for p in result.problems]
    fixture = one(result.league.fixtures)
    assert (fixture.label, fixture.row) == ("Alder v Birch", 1_048_576)


def test_empty_rows_are_not_rows_with_data(tmp_path):
    """Twice as many formatted empty rows as the data-row limit, then two fixtures (a million
    of them are timed in benchmarks/hostile.py)."""
    result = load_league(hf.empty_rows_book(tmp_path / "league.xlsx", empty=100_001))
    assert result.ok, [str(p) for p in result.problems]
    assert [(f.label, f.row) for f in result.league.fixtures] == [
        ("Alder v Birch", 100_003), ("Cedar v Damson", 100_004)]


def test_notes_in_the_last_column_are_read(tmp_path):
    result = load_league(hf.wide_book(tmp_path / "league.xlsx", rows=50))
    assert result.ok, [str(p) for p in result.problems]
    assert len(result.league.fixtures) == 50
    assert result.league.fixtures[0].notes == {"Note": "n"}


def test_rows_with_data_past_the_limit(tmp_path):
    path = hf.many_rows_book(tmp_path / "league.xlsx", rows=50_001)
    assert file_problem(path) == (
        "the file is too large to read: sheet Fixtures has more than 50,000 rows with data "
        "(the limit)"
    )


def test_cells_with_data_past_the_limit(tmp_path, monkeypatch):
    monkeypatch.setattr(xlsx, "MAX_DATA_CELLS", 100)
    rows = [["Home", "Away", "Venue"]] + [[f"H{i}", f"A{i}", "Oak Rd"] for i in range(40)]
    path = write_book(tmp_path / "league.xlsx", {"Fixtures": rows})
    assert file_problem(path) == (
        "the file is too large to read: its sheets hold more than 100 cells with data "
        "(the limit)"
    )


def test_empty_and_blank_cells_are_not_data(tmp_path, monkeypatch):
    monkeypatch.setattr(xlsx, "MAX_DATA_CELLS", 6)
    path = write_book(tmp_path / "league.xlsx",
                      {"Fixtures": [["Home", "Away"], ["Alder", "Birch", "  "], [None, None, ""],
                                    ["Cedar", "Damson"]]})
    assert load_league(path).ok


def test_a_dense_csv_past_the_row_limit(tmp_path):
    path = hf.dense_csv(tmp_path / "league.csv", rows=100_000)
    assert file_problem(path) == (
        "the file is too large to read: it has more than 50,000 rows with data (the limit)"
    )


def test_a_csv_line_past_its_limit(tmp_path):
    path = tmp_path / "league.csv"
    path.write_bytes(b"Home,Away\nAlder,Birch\n" + b"," * (MiB + 1) + b"\n")
    assert file_problem(path) == (
        "the file is too large to read: line 3 holds more than 1 MB (the limit)"
    )


def test_a_league_of_too_many_clashing_pairs(tmp_path, monkeypatch):
    """Ten fixtures of one team clash pairwise: 45 pairs, past a limit of 40."""
    from leaguegrid.io.read import league_reader

    monkeypatch.setattr(league_reader, "MAX_CLASH_PAIRS", 40)
    path = tmp_path / "league.csv"
    path.write_text("Home,Away\n" + "".join(f"Alder,Side {i}\n" for i in range(10)))
    assert file_problem(path) == (
        "the file is too large to read: its fixtures make more than 40 clashing pairs "
        "(the limit)"
    )


def test_a_clashes_sheet_keeping_too_many_pairs_apart(tmp_path, monkeypatch):
    from leaguegrid.io.read import clash_rows

    monkeypatch.setattr(clash_rows, "MAX_CLASH_PAIRS", 20)
    fixtures = [["Home", "Away"]] + [[f"Alder {i}", f"Birch {i}"] for i in range(10)]
    clashes = [["First", "Second"]] + [
        [f"team: Alder {i}", f"team: Birch {j}"] for i in range(10) for j in range(3)]
    result = load_league(write_book(tmp_path / "league.xlsx",
                                    {"Fixtures": fixtures, "Clashes": clashes}))
    problem = one(errors(result))
    assert (problem.message, problem.sheet, problem.row) == (
        "the file is too large to read: sheet Clashes keeps apart more than 20 pairs of "
        "fixtures (the limit)", "Clashes", 22)


def test_hidden_and_very_hidden_sheets_are_read_with_a_warning(tmp_path):
    for state in ("hidden", "veryHidden"):
        result = load_league(hf.hidden_book(tmp_path / f"{state}.xlsx", state))
        assert result.ok
        assert len(result.league.clash_rows) == 1
        warning = one(warnings_of(result))
        assert (warning.message, warning.sheet) == (
            "sheet Clashes is hidden in the workbook; its rows are used", "Clashes")


def test_a_chart_sheet_where_fixtures_belong(tmp_path):
    teams = hf.worksheet(hf.rows_xml(hf.table_rows([["Team"], ["Alder"], ["Birch"]])))
    path = hf.write_workbook(tmp_path / "league.xlsx", {"Teams": teams}, charts=("Fixtures",))
    problem = one(errors(load_league(path)))
    assert (problem.message, problem.sheet) == ("the sheet holds a chart, not rows", "Fixtures")


def test_dates_times_booleans_and_errors_read_as_before(tmp_path):
    """Cached values of each cell type, as openpyxl reads them (the reference)."""
    import datetime as dt

    import openpyxl

    path = write_book(tmp_path / "league.xlsx", {"Fixtures": [
        ["Home", "Away", "Date", "Time", "Played", "Score", "Round"],
        ["Alder", "Birch", dt.date(2025, 9, 6), dt.time(9, 30), True, 2.5, 3],
    ]})
    book = sheets.read_book(path)
    got = book.sheets["Fixtures"].rows[1][1]
    reference = openpyxl.load_workbook(path, read_only=True, data_only=True)
    expected = {c.column: c.value for c in next(reference["Fixtures"].iter_rows(min_row=2))}
    reference.close()
    assert got == expected
    assert got[3] == dt.datetime(2025, 9, 6) and got[4] == dt.time(9, 30) and got[5] is True


CHILD = """
import json, resource, sys
from leaguegrid.launch import main
peaks = []
for path in sys.argv[1:]:
    code = main(["check", path])
    peaks.append((path.rsplit("/", 1)[-1], code,
                  resource.getrusage(resource.RUSAGE_SELF).ru_maxrss // 1024))
print(json.dumps(peaks))
"""


@pytest.mark.skipif(sys.platform == "win32", reason="peak memory read with the resource module")
def test_hostile_files_stay_within_300_mb(tmp_path, child):
    """One child process checks each file in turn; its peak resident memory after each one
    (interpreter and imports included) stays under 300 MB."""
    files = [
        hf.sheet_bomb(tmp_path / "sheet-bomb.xlsx", unpacked=200 * MiB, level=1),
        hf.lie_about_size(hf.sheet_bomb(tmp_path / "lying.xlsx", unpacked=200 * MiB, level=1),
                          "xl/worksheets/sheet1.xml", 120 * MiB),
        hf.strings_bomb(tmp_path / "strings-bomb.xlsx", unpacked=200 * MiB, level=1),
        hf.dense_csv(tmp_path / "dense.csv", rows=100_000),
        hf.dense_csv(tmp_path / "pairs.csv", rows=45_000),
    ]
    before = {p: p.read_bytes() for p in files}
    # started through tests/conftest.py's launcher: a direct child of pytest would report
    # pytest's own peak as its ru_maxrss
    code, out, err, _ = child(CHILD, *map(str, files), timeout=300)
    assert code == 0, err
    peaks = json.loads(out.strip().splitlines()[-1])
    assert [(name, code) for name, code, _ in peaks] == [(p.name, 1) for p in files]
    assert max(peak for *_, peak in peaks) < 300, peaks
    assert "Traceback" not in err
    assert {p: p.read_bytes() for p in files} == before
    assert sorted(p.name for p in tmp_path.iterdir()) == sorted(p.name for p in files)


def test_problems_past_a_thousand_are_counted_not_listed(tmp_path):
    path = tmp_path / "league.csv"
    path.write_text("Home,Away\n" + "".join(f"Team {i},Team {i}\n" for i in range(1500)))
    result = load_league(path)
    assert len(result.problems) == 1001
    assert result.problems[0].message == "Home and Away are the same team"
    last = result.problems[-1]
    assert (last.message, last.severity, last.file) == (
        "500 more problems are not listed (only the first 1,000 are)", "error", str(path))


UTF16 = 'the file is UTF-16 text, not UTF-8: save it again choosing the file type "CSV UTF-8"'


@pytest.mark.parametrize("encoding", ["utf-16", "utf-16-le", "utf-16-be"])
def test_utf16_csv_with_or_without_its_byte_order_mark(tmp_path, encoding):
    path = tmp_path / "league.csv"
    path.write_bytes("Home,Away\nAlder,Birch\n".encode(encoding))
    assert file_problem(path) == UTF16


@pytest.mark.parametrize("bom", [b"", b"\xef\xbb\xbf"])
def test_utf8_csv_with_or_without_its_byte_order_mark(tmp_path, bom):
    path = tmp_path / "league.csv"
    path.write_bytes(bom + "Home;Away\nÆble;Birch\n".encode())
    result = load_league(path)
    assert result.ok and [f.label for f in result.league.fixtures] == ["Æble v Birch"]


def test_windows_1252_csv_names_the_first_byte_that_is_not_utf8(tmp_path):
    path = tmp_path / "league.csv"
    text = "Home,Away\n" + "Alder,Birch\n" * 100_000 + "Café,Damson\n"
    path.write_bytes(text.encode("cp1252"))
    at = text.index("é") + 1
    assert file_problem(path) == (
        f"the file is not UTF-8 text (byte {at:,} is 0xE9, perhaps Windows-1252): save it again "
        'choosing the file type "CSV UTF-8"'
    )


def test_the_command_says_one_sentence_naming_the_file_and_exits_1(tmp_path, capsys):
    from leaguegrid.launch import main

    path = hf.sheet_bomb(tmp_path / "league.xlsx", unpacked=129 * MiB, level=1)
    assert main(["check", str(path)]) == 1
    out, err = capsys.readouterr()
    assert out.splitlines() == [
        "",
        "Problems: 1 error, 0 warnings",
        f"{path}: the file is too large to read: part xl/worksheets/sheet1.xml unpacks to more "
        "than 128 MB (the limit)",
        "Usable: no",
    ]
    assert err == ""
    assert [p.name for p in tmp_path.iterdir()] == ["league.xlsx"]
