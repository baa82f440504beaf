"""Raw tables from a league file: an .xlsx workbook (its XML read as a stream, xlsx.py) or a
.csv file read as one sheet, within the limits of limits.py. The file is read once into memory
and never written."""

from __future__ import annotations

import codecs
import csv
import io
import re
import zipfile
from collections.abc import Callable
from pathlib import Path

from leaguegrid.core.wording import grouped
from leaguegrid.io.read.limits import (
    MAX_CSV_LINE_BYTES,
    MAX_DATA_CELLS,
    MAX_DATA_ROWS,
    MAX_FILE_BYTES,
    MAX_PARTS,
    size_text,
    too_large,
)
from leaguegrid.io.read.raw import RawBook, RawSheet, UnreadableFile, cell_name
from leaguegrid.io.read.xlsx import Workbook

__all__ = ["RawBook", "RawSheet", "UnreadableFile", "cell_name", "read_book", "sniff_delimiter"]

ZIP_MAGIC = b"PK"
OLE_MAGIC = b"\xd0\xcf\x11\xe0\xa1\xb1\x1a\xe1"
ENCRYPTED_STREAM = "EncryptedPackage".encode("utf-16-le")
UTF16_BOMS = (b"\xff\xfe", b"\xfe\xff")
TEXT_SUFFIXES = {".csv", ".txt"}
SAVE_AS_UTF8 = 'save it again choosing the file type "CSV UTF-8"'
UTF8_PIECE = 1 << 20
LONG_LINE = re.compile(rb"[^\n]{%d}" % (MAX_CSV_LINE_BYTES + 1))


def read_book(path: Path, wanted: Callable[[str], bool] = lambda name: True) -> RawBook:
    """Read the sheets whose names `wanted` accepts; raise UnreadableFile with a plain reason."""
    data = _read_bytes(path)
    if not data:
        raise UnreadableFile("the file is empty (0 bytes)")
    if data.startswith(ZIP_MAGIC):
        return _read_xlsx(data, wanted)
    if data.startswith(OLE_MAGIC):
        if ENCRYPTED_STREAM in data:
            raise UnreadableFile(
                "the workbook is password-protected: save a copy without a password and load that"
            )
        raise UnreadableFile(
            "this is an Excel 97-2003 workbook (.xls): save it as an Excel workbook (.xlsx)"
        )
    if path.suffix.casefold() in TEXT_SUFFIXES:
        return _read_csv(data)
    raise UnreadableFile("not a workbook: the file is neither an Excel workbook (.xlsx) nor CSV")


def _read_bytes(path: Path) -> bytes:
    try:
        if path.is_dir():
            raise UnreadableFile("this is a folder, not a file")
        size = path.stat().st_size
        if size > MAX_FILE_BYTES:
            raise UnreadableFile(too_large(f"it holds {grouped(size)} bytes,",
                                           size_text(MAX_FILE_BYTES)))
        with open(path, "rb") as handle:
            return handle.read()
    except FileNotFoundError:
        raise UnreadableFile("the file does not exist") from None
    except PermissionError:
        raise UnreadableFile("the file cannot be opened: permission denied") from None
    except OSError as exc:
        raise UnreadableFile(f"the file cannot be read: {exc.strerror or exc}") from None


def _read_xlsx(data: bytes, wanted: Callable[[str], bool]) -> RawBook:
    with _open_archive(data) as archive:
        book = Workbook(archive)
        sheets = {name: book.read_sheet(name)
                  for name in book.names if wanted(name) and book.is_rows(name)}
    return RawBook("xlsx", book.names, sheets, dict(book.states))


def _open_archive(data: bytes) -> zipfile.ZipFile:
    """The workbook's zip archive, once truncated, damaged, oversized and non-Excel archives are
    told apart."""
    if data.count(b"PK\x01\x02") > MAX_PARTS:  # directory entries
        raise UnreadableFile(too_large("its zip directory lists", f"{grouped(MAX_PARTS)} parts"))
    try:
        archive = zipfile.ZipFile(io.BytesIO(data))
    except (zipfile.BadZipFile, ValueError, OSError, EOFError, NotImplementedError):
        raise UnreadableFile(
            "the file is truncated or damaged: it begins like an Excel workbook but is incomplete"
        ) from None
    names = set(archive.namelist())
    if "mimetype" in names and b"opendocument" in _member(archive, "mimetype"):
        archive.close()
        raise UnreadableFile(
            "this is an OpenDocument spreadsheet (.ods): save it as an Excel workbook (.xlsx)"
        )
    if "[Content_Types].xml" not in names or not any(n.startswith("xl/") for n in names):
        archive.close()
        raise UnreadableFile("not a workbook: a zip archive without Excel workbook parts")
    return archive


def _member(archive: zipfile.ZipFile, name: str) -> bytes:
    """The first bytes of a part (never more, whatever it unpacks to)."""
    try:
        with archive.open(name) as stream:
            return stream.read(200)
    except Exception:
        return b""


def _read_csv(data: bytes) -> RawBook:
    """A CSV file as the one sheet 'Fixtures': UTF-8 with or without BOM, comma or semicolon."""
    _check_text(data)
    if (long := LONG_LINE.search(data)) is not None:
        line = data.count(b"\n", 0, long.start()) + 1
        raise UnreadableFile(too_large(f"line {grouped(line)} holds",
                                       f"{size_text(MAX_CSV_LINE_BYTES)}"))
    text = io.TextIOWrapper(io.BytesIO(data), encoding="utf-8-sig", newline="")
    first = text.readline()
    text.seek(0)
    raw = RawSheet("Fixtures")
    cells = 0
    reader = csv.reader(text, delimiter=sniff_delimiter(first))
    try:
        for number, record in enumerate(reader, start=1):
            values = {i: v for i, v in enumerate(record, start=1) if v.strip()}
            if not values:
                continue
            raw.rows.append((number, values))
            cells += len(values)
            if len(raw.rows) > MAX_DATA_ROWS:
                raise UnreadableFile(too_large("it has",
                                               f"{grouped(MAX_DATA_ROWS)} rows with data"))
            if cells > MAX_DATA_CELLS:
                raise UnreadableFile(too_large("it holds",
                                               f"{grouped(MAX_DATA_CELLS)} values"))
    except csv.Error as exc:
        what = ("a value longer than "
                f"{grouped(csv.field_size_limit())} characters" if "field limit" in str(exc)
                else "quoting that is not closed")
        raise UnreadableFile(
            f"the CSV text cannot be read: line {reader.line_num} has {what}"
        ) from None
    return RawBook("csv", ["Fixtures"], {"Fixtures": raw})


def _check_text(data: bytes) -> None:
    """Refuse UTF-16 (with or without its byte order mark), any other text that is not UTF-8
    (naming the first byte that is not) and binary data; read a piece at a time."""
    if data.startswith(UTF16_BOMS) or _looks_utf16(data[:4096]):
        raise UnreadableFile(f"the file is UTF-16 text, not UTF-8: {SAVE_AS_UTF8}")
    pending, at = b"", 0
    for start in range(0, len(data), UTF8_PIECE):
        piece = pending + data[start : start + UTF8_PIECE]
        at = start - len(pending)
        final = start + UTF8_PIECE >= len(data)
        try:
            _, used = codecs.utf_8_decode(piece, "strict", final)
        except UnicodeDecodeError as exc:
            byte = piece[exc.start]
            raise UnreadableFile(
                f"the file is not UTF-8 text (byte {grouped(at + exc.start + 1)} is "
                f"0x{byte:02X}, perhaps Windows-1252): {SAVE_AS_UTF8}"
            ) from None
        pending = piece[used:]
    if b"\x00" in data:
        raise UnreadableFile("not a workbook: the file holds binary data, not CSV text")


def _looks_utf16(head: bytes) -> bool:
    """UTF-16 without a byte order mark: text whose every other byte is zero."""
    pairs = len(head) // 2
    if pairs < 2:
        return False
    even, odd = head[0 : pairs * 2 : 2].count(0), head[1 : pairs * 2 : 2].count(0)
    return max(even, odd) >= 0.4 * pairs and min(even, odd) <= 0.05 * pairs


def sniff_delimiter(text: str) -> str:
    """Comma or semicolon: whichever splits the first non-empty line into more fields (comma on
    a tie)."""
    for line in text.splitlines():
        if line.strip():
            try:
                commas = len(next(csv.reader([line], delimiter=",")))
                semicolons = len(next(csv.reader([line], delimiter=";")))
            except (csv.Error, StopIteration):
                return ","
            return ";" if semicolons > commas else ","
    return ","
