"""Raw tables from a league file: an .xlsx workbook (openpyxl, read-only, cached values) or a
.csv file read as one sheet. The file is read once into memory and never written."""

from __future__ import annotations

import csv
import io
import warnings
import zipfile
import zlib
from collections.abc import Callable
from dataclasses import dataclass, field
from pathlib import Path
from typing import Literal

import openpyxl
from openpyxl.utils import get_column_letter

MAX_BYTES = 200 * 1024 * 1024
ZIP_MAGIC = b"PK"
OLE_MAGIC = b"\xd0\xcf\x11\xe0\xa1\xb1\x1a\xe1"
ENCRYPTED_STREAM = "EncryptedPackage".encode("utf-16-le")
UTF16_BOMS = (b"\xff\xfe", b"\xfe\xff")
TEXT_SUFFIXES = {".csv", ".txt"}


class UnreadableFile(Exception):
    """The file cannot be read as a workbook or CSV; the message says why, for a coordinator."""


@dataclass
class RawSheet:
    """One sheet's non-empty rows: (row number as shown, {column number: value}), plus the cells
    whose value is missing (a formula never calculated) or is a spreadsheet error like #REF!."""

    name: str
    rows: list[tuple[int, dict[int, object]]] = field(default_factory=list)
    uncalculated: list[tuple[int, int]] = field(default_factory=list)
    error_cells: list[tuple[int, int, str]] = field(default_factory=list)


@dataclass
class RawBook:
    """The sheets read from one file; `sheet_names` lists every sheet, read or not."""

    kind: Literal["xlsx", "csv"]
    sheet_names: list[str]
    sheets: dict[str, RawSheet]


def cell_name(row: int, column: int) -> str:
    """The spreadsheet name of a cell, e.g. 'B7'."""
    return f"{get_column_letter(column)}{row}"


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
        if size > MAX_BYTES:
            raise UnreadableFile(f"the file is too large to be a league ({size} bytes)")
        with open(path, "rb") as handle:
            return handle.read()
    except FileNotFoundError:
        raise UnreadableFile("the file does not exist") from None
    except PermissionError:
        raise UnreadableFile("the file cannot be opened: permission denied") from None
    except OSError as exc:
        raise UnreadableFile(f"the file cannot be read: {exc.strerror or exc}") from None


def _read_xlsx(data: bytes, wanted: Callable[[str], bool]) -> RawBook:
    _check_archive(data)
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        try:
            names, sheets, suspects = _read_values(data, wanted)
            if suspects:
                formulas = _formula_cells(data, set(suspects))
                for name, cells in suspects.items():
                    sheets[name].uncalculated = sorted(cells & formulas.get(name, set()))
        except UnreadableFile:
            raise
        except Exception as exc:  # openpyxl raises many kinds on damaged parts
            raise UnreadableFile(
                f"the workbook is damaged and cannot be read ({_brief(exc)})"
            ) from None
    return RawBook("xlsx", names, sheets)


def _check_archive(data: bytes) -> None:
    """Tell truncated, damaged and non-Excel archives apart before openpyxl sees them."""
    try:
        archive = zipfile.ZipFile(io.BytesIO(data))
    except (zipfile.BadZipFile, ValueError, OSError, EOFError):
        raise UnreadableFile(
            "the file is truncated or damaged: it begins like an Excel workbook but is incomplete"
        ) from None
    with archive:
        names = set(archive.namelist())
        if "mimetype" in names and b"opendocument" in _member(archive, "mimetype"):
            raise UnreadableFile(
                "this is an OpenDocument spreadsheet (.ods): save it as an Excel workbook (.xlsx)"
            )
        if "[Content_Types].xml" not in names or not any(n.startswith("xl/") for n in names):
            raise UnreadableFile("not a workbook: a zip archive without Excel workbook parts")
        try:
            bad = archive.testzip()
        except (
            zipfile.BadZipFile,
            zlib.error,
            EOFError,
            OSError,
            ValueError,
            NotImplementedError,
            RuntimeError,
        ) as exc:
            raise UnreadableFile(
                f"the file is truncated or damaged: its parts cannot be unpacked ({_brief(exc)})"
            ) from None
        if bad is not None:
            raise UnreadableFile(f"the workbook is damaged: part {bad} fails its checksum")


def _member(archive: zipfile.ZipFile, name: str) -> bytes:
    try:
        return archive.read(name)[:200]
    except Exception:
        return b""


def _read_values(
    data: bytes, wanted: Callable[[str], bool]
) -> tuple[list[str], dict[str, RawSheet], dict[str, set[tuple[int, int]]]]:
    """Cached values of the wanted sheets; also the cells that may be uncalculated formulas."""
    book = openpyxl.load_workbook(io.BytesIO(data), read_only=True, data_only=True)
    try:
        names = list(book.sheetnames)
        sheets: dict[str, RawSheet] = {}
        suspects: dict[str, set[tuple[int, int]]] = {}
        for name in names:
            sheet = book[name]
            if not wanted(name) or not hasattr(sheet, "iter_rows"):
                continue
            raw = RawSheet(name)
            maybe: set[tuple[int, int]] = set()
            sheet.reset_dimensions()
            for cells in sheet.iter_rows():
                values: dict[int, object] = {}
                number = 0
                for cell in cells:
                    number = getattr(cell, "row", None) or number
                    if not hasattr(cell, "row"):
                        continue
                    value, kind = cell.value, cell.data_type
                    if kind == "e":
                        raw.error_cells.append((cell.row, cell.column, str(value)))
                    elif value is None:
                        if kind == "n":
                            maybe.add((cell.row, cell.column))
                    elif not (isinstance(value, str) and not value.strip()):
                        values[cell.column] = value
                if values:
                    raw.rows.append((number, values))
            sheets[name] = raw
            if maybe:
                suspects[name] = maybe
        return names, sheets, suspects
    finally:
        book.close()


def _formula_cells(data: bytes, names: set[str]) -> dict[str, set[tuple[int, int]]]:
    """The formula cells of the named sheets (a second read-only pass without cached values)."""
    book = openpyxl.load_workbook(io.BytesIO(data), read_only=True, data_only=False)
    try:
        found: dict[str, set[tuple[int, int]]] = {}
        for name in names:
            sheet = book[name]
            sheet.reset_dimensions()
            cells = found.setdefault(name, set())
            for row in sheet.iter_rows():
                for cell in row:
                    if getattr(cell, "data_type", None) == "f" and hasattr(cell, "row"):
                        cells.add((cell.row, cell.column))
        return found
    finally:
        book.close()


def _read_csv(data: bytes) -> RawBook:
    """A CSV file as the one sheet 'Fixtures': UTF-8 with or without BOM, comma or semicolon."""
    if data.startswith(UTF16_BOMS):
        raise UnreadableFile("the file is UTF-16 text: save it as CSV UTF-8")
    try:
        text = data.decode("utf-8-sig")
    except UnicodeDecodeError as exc:
        raise UnreadableFile(
            f"the file is not UTF-8 text (byte {exc.start + 1} cannot be read): "
            "save it as CSV UTF-8"
        ) from None
    if "\x00" in text:
        raise UnreadableFile("not a workbook: the file holds binary data, not CSV text")
    raw = RawSheet("Fixtures")
    try:
        reader = csv.reader(io.StringIO(text, newline=""), delimiter=sniff_delimiter(text))
        for number, record in enumerate(reader, start=1):
            values = {i: v for i, v in enumerate(record, start=1) if v.strip()}
            if values:
                raw.rows.append((number, values))
    except csv.Error as exc:
        raise UnreadableFile(f"the CSV text cannot be read ({_brief(exc)})") from None
    return RawBook("csv", ["Fixtures"], {"Fixtures": raw})


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


def _brief(exc: BaseException) -> str:
    text = str(exc).strip() or type(exc).__name__
    return text if len(text) <= 160 else text[:157] + "..."
