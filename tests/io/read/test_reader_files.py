"""Files that are not a usable league workbook: each gets one clear problem naming the file."""

from __future__ import annotations

import io
import os
import zipfile
from pathlib import Path

from test_reader_support import errors, load_book, one, patch_cells, write_book

from leaguegrid.io.read.league_reader import load_league

FIXTURES = [["Home", "Away", "Round"], ["Alder", "Birch", 1], ["Cedar", "Damson", None]]


def file_problem(path: Path) -> str:
    result = load_league(path)
    assert result.league is None and not result.ok
    problem = one(result.problems)
    assert problem.file == str(path)
    assert (problem.sheet, problem.row, problem.column, problem.value) == (None,) * 4
    return problem.message


def test_empty_file(tmp_path):
    path = tmp_path / "league.xlsx"
    path.write_bytes(b"")
    assert file_problem(path) == "the file is empty (0 bytes)"


def test_missing_file_and_folder(tmp_path):
    assert file_problem(tmp_path / "nowhere.xlsx") == "the file does not exist"
    assert file_problem(tmp_path) == "this is a folder, not a file"


def test_text_is_not_a_workbook(tmp_path):
    path = tmp_path / "league.xlsx"
    path.write_text("Home,Away\nAlder,Birch\n")
    assert file_problem(path) == (
        "not a workbook: the file is neither an Excel workbook (.xlsx) nor CSV"
    )


def test_zip_without_workbook_parts(tmp_path):
    path = tmp_path / "league.xlsx"
    with zipfile.ZipFile(path, "w") as archive:
        archive.writestr("notes.txt", "hello")
    assert file_problem(path) == "not a workbook: a zip archive without Excel workbook parts"


def test_opendocument_spreadsheet(tmp_path):
    path = tmp_path / "league.ods"
    with zipfile.ZipFile(path, "w") as archive:
        archive.writestr("mimetype", "application/vnd.oasis.opendocument.spreadsheet")
        archive.writestr("content.xml", "<office:document-content/>")
    assert file_problem(path) == (
        "this is an OpenDocument spreadsheet (.ods): save it as an Excel workbook (.xlsx)"
    )


def ole_file(*stream_names: str) -> bytes:
    """The start of an OLE2 compound file (the container of encrypted .xlsx and of .xls):
    its signature, then directory entries whose names are UTF-16LE, as in the format."""
    header = b"\xd0\xcf\x11\xe0\xa1\xb1\x1a\xe1" + bytes(504)
    entries = b"".join(n.encode("utf-16-le").ljust(64, b"\0") + bytes(64) for n in stream_names)
    return header + entries


def test_password_protected_workbook(tmp_path):
    path = tmp_path / "league.xlsx"
    path.write_bytes(ole_file("Root Entry", "EncryptionInfo", "EncryptedPackage"))
    assert file_problem(path) == (
        "the workbook is password-protected: save a copy without a password and load that"
    )


def test_old_excel_format(tmp_path):
    path = tmp_path / "league.xls"
    path.write_bytes(ole_file("Root Entry", "Workbook"))
    assert file_problem(path) == (
        "this is an Excel 97-2003 workbook (.xls): save it as an Excel workbook (.xlsx)"
    )


def test_truncated_workbook(tmp_path):
    path = write_book(tmp_path / "league.xlsx", {"Fixtures": FIXTURES})
    data = path.read_bytes()
    path.write_bytes(data[: len(data) // 2])
    assert file_problem(path) == (
        "the file is truncated or damaged: it begins like an Excel workbook but is incomplete"
    )


def test_damaged_part_fails_its_checksum(tmp_path):
    path = write_book(tmp_path / "league.xlsx", {"Fixtures": FIXTURES})
    with zipfile.ZipFile(path) as archive:
        parts = {n: archive.read(n) for n in archive.namelist()}
    buffer = io.BytesIO()
    with zipfile.ZipFile(buffer, "w", zipfile.ZIP_STORED) as archive:
        for name, data in parts.items():
            archive.writestr(name, data)
    data = bytearray(buffer.getvalue())
    at = data.index(b"Damson")
    data[at] = ord("X")  # the stored part no longer matches its CRC-32
    path.write_bytes(bytes(data))
    assert file_problem(path) == (
        "the workbook is damaged: part xl/worksheets/sheet1.xml fails its checksum"
    )


def test_damaged_sheet_xml(tmp_path):
    path = write_book(tmp_path / "league.xlsx", {"Fixtures": FIXTURES})
    with zipfile.ZipFile(path) as archive:
        parts = {n: archive.read(n) for n in archive.namelist()}
    parts["xl/worksheets/sheet1.xml"] = b"<worksheet><sheetData><row r='1'><c"
    with zipfile.ZipFile(path, "w") as archive:
        for name, data in parts.items():
            archive.writestr(name, data)
    assert file_problem(path) == (
        "the workbook is damaged: part xl/worksheets/sheet1.xml is not well-formed XML "
        "(line 1, column 34)"
    )


def test_csv_not_utf8(tmp_path):
    path = tmp_path / "league.csv"
    path.write_bytes(b"Home,Away\nA,\xff\n")
    assert file_problem(path) == (
        "the file is not UTF-8 text (byte 13 is 0xFF, perhaps Windows-1252): save it again "
        'choosing the file type "CSV UTF-8"'
    )


def test_csv_utf16(tmp_path):
    path = tmp_path / "league.csv"
    path.write_bytes("Home,Away\n".encode("utf-16"))
    assert file_problem(path) == (
        'the file is UTF-16 text, not UTF-8: save it again choosing the file type "CSV UTF-8"'
    )


def test_csv_with_binary_bytes(tmp_path):
    path = tmp_path / "league.csv"
    path.write_bytes(b"Home,Away\nA\x00,B\n")
    assert file_problem(path) == "not a workbook: the file holds binary data, not CSV text"


def test_formula_without_saved_result_names_the_cell(tmp_path):
    path = write_book(
        tmp_path / "league.xlsx",
        {"Fixtures": [["Home", "Away", "Round"], ["Alder", "Birch", "=1+1"]]},
    )
    result = load_league(path)
    problem = one(errors(result))
    assert problem.message == (
        "cell C2 holds a formula with no saved result: open the workbook in a spreadsheet "
        "program, let it calculate, and save it"
    )
    assert (problem.sheet, problem.row, problem.column, problem.value) == (
        "Fixtures",
        2,
        "Round",
        None,
    )


def test_formula_with_saved_result_is_read(tmp_path):
    path = write_book(
        tmp_path / "league.xlsx",
        {"Fixtures": [["Home", "Away", "Round", "Note"], ["x", "Birch", 2, "x"]]},
    )
    patch_cells(
        path,
        "xl/worksheets/sheet1.xml",
        {
            "A2": '<c r="A2" t="str"><f>"Al"&amp;"der"</f><v>Alder</v></c>',
            "C2": '<c r="C2"><f>1+1</f><v>2</v></c>',
            "D2": '<c r="D2" t="str"><f>""</f><v></v></c>',  # a formula whose result is empty text
        },
    )
    result = load_league(path)
    assert result.ok, [str(p) for p in result.problems]
    fixture = result.league.fixtures[0]
    assert (fixture.label, fixture.home, fixture.pin, fixture.notes) == (
        "Alder v Birch",
        "Alder",
        2,
        {},
    )


def test_spreadsheet_error_value(tmp_path):
    path = write_book(tmp_path / "league.xlsx", {"Fixtures": FIXTURES})
    patch_cells(path, "xl/worksheets/sheet1.xml", {"B3": '<c r="B3" t="e"><v>#REF!</v></c>'})
    result = load_league(path)
    found = errors(result)
    assert [(p.message, p.row, p.column, p.value) for p in found] == [
        ("cell B3 holds the spreadsheet error #REF!", 3, "Away", "#REF!"),
        ("'Cedar v ?' has no Away team: give both Home and Away, or a Fixture label", 3, "Away",
         None),
    ]


def test_input_file_unchanged(tmp_path):
    path = write_book(tmp_path / "league.xlsx", {"Fixtures": FIXTURES})
    old = os.stat(path).st_mtime_ns
    os.utime(path, ns=(old - 10**9, old - 10**9))
    before, stamp = path.read_bytes(), os.stat(path).st_mtime_ns
    assert load_league(path).ok
    assert path.read_bytes() == before and os.stat(path).st_mtime_ns == stamp


def test_two_sheets_with_one_name(tmp_path):
    result = load_book(tmp_path, {"Fixtures": FIXTURES, "FIXTURES ": FIXTURES})
    problem = one(errors(result))
    assert problem.message == (
        "two sheets are named Fixtures ('Fixtures' and 'FIXTURES '); only the first is read"
    )
    assert problem.sheet == "FIXTURES "


def test_unexpected_failure_becomes_a_problem_naming_the_file(tmp_path, monkeypatch):
    from leaguegrid.io.read import league_reader

    def broken(league):
        raise RuntimeError("boom")

    monkeypatch.setattr(league_reader, "build_clash_graph", broken)
    path = write_book(tmp_path / "league.xlsx", {"Fixtures": FIXTURES})
    result = load_league(path)
    assert result.league is None
    problem = one(result.problems)
    assert (problem.file, problem.message) == (
        str(path),
        "could not be read because of an unexpected error (RuntimeError: boom); please report this",
    )


def test_previous_schedule_is_read_as_league_files_are(tmp_path):
    """A schedule to keep (plan --keep) saved as Windows-1252 gets the same sentence as a
    league CSV, naming the first byte that is not UTF-8."""
    from leaguegrid.io.read.previous import read_previous

    league = load_league(write_book(tmp_path / "league.xlsx", {"Fixtures": FIXTURES})).league
    path = tmp_path / "before.csv"
    path.write_bytes("Fixture;Round\nAlder v Birch;1\nCafé v Damson;2\n".encode("cp1252"))
    previous = read_previous(path, league)
    assert [(p.file, p.message) for p in previous.problems] == [(
        "before.csv",
        "the file is not UTF-8 text (byte 34 is 0xE9, perhaps Windows-1252): save it again "
        'choosing the file type "CSV UTF-8"',
    )]
    path.write_bytes(b"\xef\xbb\xbfFixture;Round\nAlder v Birch;1\nCedar v Damson;x\n")
    previous = read_previous(path, league)
    assert previous.rounds == {"Alder v Birch": 1}
    assert [(p.row, p.column, p.value, p.message) for p in previous.problems] == [
        (3, "Round", "x", "not a round number")]
