"""The cached values of an .xlsx workbook's sheets, read as a stream of its XML parts (ECMA-376
Part 1, SpreadsheetML: sections 18.2 workbook, 18.3 sheet data, 18.4 shared strings, 18.8
styles) within the limits of limits.py.

Each part is unpacked piece by piece and counted as it is (the zip directory's sizes are checked
first, but the directory can lie); its XML goes to expat with document type declarations refused,
so no entity is ever expanded. Only cells that hold something are looked at, so a sheet's
declared size, its empty rows and far-away columns cost nothing."""

from __future__ import annotations

import posixpath
import zipfile
import zlib
from collections.abc import Callable, Iterator
from pyexpat import ExpatError, ParserCreate

from openpyxl.styles.numbers import builtin_format_code, is_date_format, is_timedelta_format
from openpyxl.utils.cell import column_index_from_string
from openpyxl.utils.datetime import (
    CALENDAR_MAC_1904,
    CALENDAR_WINDOWS_1900,
    from_excel,
    from_ISO8601,
)

from leaguegrid.core.wording import grouped
from leaguegrid.io.read.limits import (
    MAX_DATA_CELLS,
    MAX_DATA_ROWS,
    MAX_SHEET_BYTES,
    MAX_SMALL_PART_BYTES,
    MAX_STRINGS_BYTES,
    MAX_UNPACKED_BYTES,
    size_text,
    too_large,
)
from leaguegrid.io.read.raw import RawSheet, UnreadableFile, cell_name

PIECE = 1 << 20  # bytes unpacked at a time
CHECK_FIRST_BYTES = 16 << 20  # parts larger than this are checked (unpacked once) before parsing
WORKSHEET = "/worksheet"
OTHER_SHEETS = ("/chartsheet", "/dialogsheet", "/xlMacrosheet", "/xlIntlMacrosheet")
ZIP_ERRORS = (zipfile.BadZipFile, zlib.error, EOFError, OSError, ValueError,
              NotImplementedError, RuntimeError)
Start = Callable[[str, dict[str, str]], None]


class _Refused(Exception):
    """A part declares a document type (and so perhaps entities)."""


def damaged(text: str) -> UnreadableFile:
    return UnreadableFile(f"the workbook is damaged: {text}")


class Workbook:
    """The parts of one workbook archive: sheet names and states, shared strings, date styles."""

    def __init__(self, archive: zipfile.ZipFile) -> None:
        self.archive = archive
        self.unpacked = 0
        self.cells = 0
        self.names: list[str] = []
        self.states: dict[str, str] = {}  # sheet name -> hidden / veryHidden
        self.parts: dict[str, tuple[str, str | None]] = {}  # name -> (relationship type, part)
        self.strings: list[str] | None = None
        self.strings_part: str | None = None
        self.date_styles: set[int] = set()
        self.duration_styles: set[int] = set()
        self.epoch = CALENDAR_WINDOWS_1900
        self._read_structure()

    # -- unpacking and parsing

    def pieces(self, part: str, limit: int) -> Iterator[bytes]:
        """The part's bytes, unpacked a piece at a time, stopping at `limit` (and at the
        workbook's total) whatever the zip directory says. A large part is first unpacked
        once without being kept, so that a checksum that fails stops it before it is parsed."""
        try:
            info = self.archive.getinfo(part)
        except KeyError:
            raise damaged(f"part {part} is missing") from None
        if info.file_size > limit:
            raise UnreadableFile(too_large(f"part {part} unpacks to", size_text(limit)))
        if info.file_size > CHECK_FIRST_BYTES:
            for _ in self._unpack(info, limit):
                pass
        for piece in self._unpack(info, limit):
            self._count(len(piece))
            yield piece

    def _unpack(self, info: zipfile.ZipInfo, limit: int) -> Iterator[bytes]:
        part, size = info.filename, 0
        try:
            with self.archive.open(info) as stream:
                while piece := stream.read(PIECE):
                    size += len(piece)
                    if size > limit:
                        raise UnreadableFile(too_large(f"part {part} unpacks to",
                                                       size_text(limit)))
                    yield piece
        except zipfile.BadZipFile as exc:
            if "CRC" in str(exc):
                raise damaged(f"part {part} fails its checksum") from None
            raise damaged(f"part {part} cannot be unpacked") from None
        except ZIP_ERRORS:
            raise UnreadableFile(f"the file is truncated or damaged: part {part} cannot be "
                                 "unpacked") from None

    def _count(self, added: int) -> None:
        """Count bytes unpacked toward the workbook's total."""
        self.unpacked += added
        if self.unpacked > MAX_UNPACKED_BYTES:
            raise UnreadableFile(too_large("the parts read unpack to",
                                           f"{size_text(MAX_UNPACKED_BYTES)} together"))

    def parse(self, part: str, limit: int, start: Start, end: Callable[[str], None] | None = None,
              text: Callable[[str], None] | None = None, prefixed: bool = False) -> None:
        """Feed the part's XML to expat, element names without their prefix (or as written,
        when `prefixed`: the handlers strip it); a document type declaration is refused before
        any entity in it is read."""
        parser = ParserCreate()
        parser.buffer_text = True
        parser.buffer_size = 1 << 16

        def refuse(*_args: object) -> None:
            raise _Refused

        parser.StartDoctypeDeclHandler = refuse
        parser.EntityDeclHandler = refuse
        if prefixed:
            parser.StartElementHandler = start
            parser.EndElementHandler = end
        else:
            parser.StartElementHandler = lambda name, attrs: start(local(name), attrs)
            if end is not None:
                parser.EndElementHandler = lambda name: end(local(name))
        if text is not None:
            parser.CharacterDataHandler = text
        try:
            for piece in self.pieces(part, limit):
                parser.Parse(piece, False)
            parser.Parse(b"", True)
        except _Refused:
            raise damaged(f"part {part} declares a document type or entities, which are not "
                          "allowed in a workbook") from None
        except ExpatError as exc:
            raise damaged(f"part {part} is not well-formed XML (line {exc.lineno}, "
                          f"column {exc.offset + 1})") from None
        except (ValueError, IndexError, OverflowError, TypeError) as exc:
            raise damaged(f"part {part} holds a value that cannot be read ({_brief(exc)})") \
                from None

    # -- the workbook's structure

    def _read_structure(self) -> None:
        """Sheet names, states and parts (ECMA-376 Part 1, 18.2.19 sheet), the date system and
        the date styles, through the package's relationships."""
        found: list[str] = []

        def root_rel(name: str, attrs: dict[str, str]) -> None:
            if name == "Relationship" and attrs.get("Type", "").endswith("/officeDocument"):
                found.append(_target("", attrs.get("Target", "")))

        if "_rels/.rels" in self.archive.NameToInfo:
            self.parse("_rels/.rels", MAX_SMALL_PART_BYTES, root_rel)
        main = found[0] if found else "xl/workbook.xml"
        folder = posixpath.dirname(main)
        rels: dict[str, tuple[str, str]] = {}

        def relationship(name: str, attrs: dict[str, str]) -> None:
            if name == "Relationship" and "Id" in attrs:
                target = _target(folder, attrs.get("Target", ""))
                rels[attrs["Id"]] = (attrs.get("Type", ""), target)

        rels_part = posixpath.join(folder, "_rels", posixpath.basename(main) + ".rels")
        if rels_part in self.archive.NameToInfo:
            self.parse(rels_part, MAX_SMALL_PART_BYTES, relationship)
        sheets: list[tuple[str, str | None, str | None]] = []

        def workbook(name: str, attrs: dict[str, str]) -> None:
            if name == "sheet":
                rid = next((v for k, v in attrs.items() if local(k) == "id"), None)
                sheets.append((attrs.get("name", ""), attrs.get("state"), rid))
            elif name == "workbookPr" and attrs.get("date1904", "").lower() in ("1", "true"):
                self.epoch = CALENDAR_MAC_1904

        self.parse(main, MAX_SMALL_PART_BYTES, workbook)
        for name, state, rid in sheets:
            kind, part = rels.get(rid or "", ("", None))
            if name in self.parts:
                continue  # openpyxl and Excel refuse duplicates; the first one is kept
            self.names.append(name)
            self.parts[name] = (kind, part)
            if state in ("hidden", "veryHidden"):
                self.states[name] = state
        for kind, part in rels.values():
            if kind.endswith("/sharedStrings"):
                self.strings_part = part
            elif kind.endswith("/styles") and part in self.archive.NameToInfo:
                self._read_styles(part)

    def is_rows(self, name: str) -> bool:
        """Whether the sheet is a worksheet (not a chart sheet, a dialog or a macro sheet)."""
        kind, part = self.parts[name]
        if kind.endswith(WORKSHEET) and part is not None:
            return True
        if kind.endswith(OTHER_SHEETS):
            return False
        raise damaged(f"sheet {name} has no part in the archive")

    def _read_styles(self, part: str) -> None:
        """Which cell styles show a number as a date or time (as openpyxl decides it)."""
        custom: dict[int, str] = {}
        formats: list[int] = []
        where: list[str] = []

        def start(name: str, attrs: dict[str, str]) -> None:
            if name == "numFmt" and attrs.get("numFmtId", "").isdigit():
                custom[int(attrs["numFmtId"])] = attrs.get("formatCode", "")
            elif name == "xf" and where and where[-1] == "cellXfs":
                ident = attrs.get("numFmtId", "0")
                formats.append(int(ident) if ident.isdigit() else 0)
            elif name in ("cellXfs", "cellStyleXfs"):
                where.append(name)

        def end(name: str) -> None:
            if name in ("cellXfs", "cellStyleXfs") and where:
                where.pop()

        self.parse(part, MAX_SMALL_PART_BYTES, start, end)
        for index, ident in enumerate(formats):
            code = custom.get(ident) if ident in custom else builtin_format_code(ident)
            if code and is_date_format(code):
                self.date_styles.add(index)
            if code and is_timedelta_format(code):
                self.duration_styles.add(index)

    def shared_strings(self) -> list[str]:
        """The shared strings (read once, when a sheet first needs them)."""
        if self.strings is not None:
            return self.strings
        self.strings = []
        if self.strings_part is None or self.strings_part not in self.archive.NameToInfo:
            return self.strings
        strings = self.strings
        state = {"depth": 0, "phonetic": 0, "in_t": False}
        pieces: list[str] = []

        def start(name: str, attrs: dict[str, str]) -> None:
            if ":" in name:
                name = name.rpartition(":")[2]
            if name == "si":
                pieces.clear()
            elif name == "rPh":
                state["phonetic"] += 1
            elif name == "t" and not state["phonetic"]:
                state["in_t"] = True

        def end(name: str) -> None:
            if ":" in name:
                name = name.rpartition(":")[2]
            if name == "si":
                strings.append("".join(pieces).replace("x005F_", ""))
            elif name == "rPh":
                state["phonetic"] -= 1
            elif name == "t":
                state["in_t"] = False

        def text(data: str) -> None:
            if state["in_t"]:
                pieces.append(data)

        self.parse(self.strings_part, MAX_STRINGS_BYTES, start, end, text, prefixed=True)
        return strings

    # -- a sheet's cells

    def read_sheet(self, name: str) -> RawSheet:
        """The sheet's rows that hold data, its uncalculated formulas and its error cells."""
        part = self.parts[name][1]
        if part is None:
            raise damaged(f"sheet {name} has no part")
        return _SheetReader(self, name).read(part)


class _SheetReader:
    """The expat handlers of one worksheet part. A cell's reference is decoded only when the
    cell holds something (or the next cell, lacking one, counts on from it)."""

    def __init__(self, book: Workbook, name: str) -> None:
        self.book = book
        self.raw = RawSheet(name)
        self.row = 0
        self.column = 0
        self.ref: str | None = None  # the current cell's reference, not yet decoded
        self.cell_row = 0  # the row its reference names
        self.values: dict[int, object] = {}
        self.kind = "n"
        self.style = 0
        self.formula = False
        self.text: list[str] | None = None
        self.value: str | None = None
        self.inline: list[str] | None = None
        self.phonetic = 0

    def read(self, part: str) -> RawSheet:
        self.book.parse(part, MAX_SHEET_BYTES, self.start, self.end, self.chars, prefixed=True)
        self.end_row()
        return self.raw

    def start(self, name: str, attrs: dict[str, str]) -> None:
        if ":" in name:
            name = name.rpartition(":")[2]
        if name == "c":
            ref = attrs.get("r")
            if ref is None:
                self.column = self.at()[1] + 1
            self.ref = ref
            self.kind = attrs.get("t", "n")
            self.style = int(attrs["s"]) if "s" in attrs else 0
            self.formula = False
            self.value = None
            self.inline = None
        elif name == "row":
            if self.values:
                self.end_row()
            number = attrs.get("r")
            self.row = int(number) if number else self.row + 1
            self.column = 0
            self.ref = None
        elif name == "v":
            self.text = []
        elif name == "f":
            self.formula = True
        elif name == "is":
            self.inline = []
        elif name == "rPh":
            self.phonetic += 1
        elif name == "t" and self.inline is not None and not self.phonetic:
            self.text = []

    def end(self, name: str) -> None:
        if ":" in name:
            name = name.rpartition(":")[2]
        if name == "c":
            if self.value is not None or self.inline is not None or self.formula:
                self.end_cell()
        elif name == "v":
            self.value = "".join(self.text or ())
            self.text = None
        elif name == "t" and self.inline is not None and self.text is not None:
            self.inline.append("".join(self.text))
            self.text = None
        elif name == "rPh":
            self.phonetic -= 1

    def chars(self, data: str) -> None:
        if self.text is not None:
            self.text.append(data)

    def at(self) -> tuple[int, int]:
        """(row, column) of the current cell, decoding its reference (such as 'XFD7')."""
        if self.ref is not None:
            letters = self.ref.rstrip("0123456789")
            digits = self.ref[len(letters):]
            self.column = column_index_from_string(letters)
            self.cell_row = int(digits) if digits else self.row
            self.ref = None
            return self.cell_row, self.column
        return self.row, self.column

    def end_cell(self) -> None:
        """Keep the cell's value (as openpyxl reads cached values) when it holds one."""
        raw, text = self.raw, self.value or None
        row, column = self.at()
        if self.kind == "inlineStr":
            value: object = "".join(self.inline) if self.inline is not None else None
        elif text is None:
            if self.formula and self.kind == "n":
                raw.uncalculated.append((row, column))
            return
        elif self.kind == "n":
            value = float(text) if ("." in text or "e" in text or "E" in text) else int(text)
            if self.style in self.book.date_styles:
                try:
                    value = from_excel(value, self.book.epoch,
                                       timedelta=self.style in self.book.duration_styles)
                except (OverflowError, ValueError):
                    value, self.kind = "#VALUE!", "e"
        elif self.kind == "s":
            strings = self.book.shared_strings()
            index = int(text)
            if not 0 <= index < len(strings):
                raise damaged(f"cell {_ref(row, column)} of sheet {raw.name} names shared text "
                              f"{index}, which the workbook does not have")
            value = strings[index]
        elif self.kind == "b":
            value = bool(int(text))
        elif self.kind == "d":
            value = from_ISO8601(text)
        else:  # str (a formula's text), e (an error such as #REF!), or unknown: the text
            value = text
        if self.kind == "e":
            raw.error_cells.append((row, column, str(value)))
        elif value is None or (isinstance(value, str) and not value.strip()):
            return
        else:
            if row != self.row:  # a cell whose reference leaves its row element
                self.end_row()
                self.row = row
            self.values[column] = value
        self.book.cells += 1
        if self.book.cells > MAX_DATA_CELLS:
            raise UnreadableFile(too_large("its sheets hold",
                                           f"{grouped(MAX_DATA_CELLS)} cells with data"))

    def end_row(self) -> None:
        if not self.values:
            return
        self.raw.rows.append((self.row, self.values))
        self.values = {}
        if len(self.raw.rows) > MAX_DATA_ROWS:
            raise UnreadableFile(too_large(f"sheet {self.raw.name} has",
                                           f"{grouped(MAX_DATA_ROWS)} rows with data"))


def local(name: str) -> str:
    """An XML name without its namespace prefix."""
    return name.rpartition(":")[2]


def _target(folder: str, target: str) -> str:
    """A relationship's target as a part name inside the archive."""
    if target.startswith("/"):
        return target.lstrip("/")
    return posixpath.normpath(posixpath.join(folder, target))


def _ref(row: int, column: int) -> str:
    return cell_name(row, column) if 0 < column <= 18278 else f"row {row}"


def _brief(exc: BaseException) -> str:
    text = " ".join(str(exc).split()) or type(exc).__name__
    return text if len(text) <= 80 else text[:77] + "..."
