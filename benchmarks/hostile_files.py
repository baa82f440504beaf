"""Hostile and broken league files, built on demand (never committed): compression bombs,
entity declarations, far-away cells, dense CSV text. Used by benchmarks/hostile.py and by the
reader's tests; every builder writes one file and returns its path."""

from __future__ import annotations

import zipfile
from collections.abc import Callable, Iterable
from pathlib import Path

from openpyxl.utils import get_column_letter

MAIN = "http://schemas.openxmlformats.org/spreadsheetml/2006/main"
RELS = "http://schemas.openxmlformats.org/officeDocument/2006/relationships"
PACKAGE_RELS = "http://schemas.openxmlformats.org/package/2006/relationships"
SHEET_TYPE = f"{RELS}/worksheet"
CHART_TYPE = f"{RELS}/chartsheet"
STRINGS_TYPE = f"{RELS}/sharedStrings"
MiB = 1024 * 1024
FIXTURES = [["Home", "Away", "Round"], ["Alder", "Birch", 1], ["Cedar", "Damson", None]]


def cell_xml(row: int, column: int, value: object) -> str:
    """One cell: a number, or an inline string."""
    ref = f"{get_column_letter(column)}{row}"
    if isinstance(value, (int, float)) and not isinstance(value, bool):
        return f'<c r="{ref}"><v>{value}</v></c>'
    text = str(value).replace("&", "&amp;").replace("<", "&lt;")
    return f'<c r="{ref}" t="inlineStr"><is><t>{text}</t></is></c>'


def row_xml(row: int, cells: dict[int, object]) -> str:
    body = "".join(cell_xml(row, c, v) for c, v in sorted(cells.items()) if v is not None)
    return f'<row r="{row}">{body}</row>'


def rows_xml(rows: Iterable[tuple[int, dict[int, object]]]) -> Iterable[str]:
    """The <sheetData> of a worksheet, row by row."""
    yield from (row_xml(r, cells) for r, cells in rows)


def table_rows(rows: list[list[object]], first: int = 1) -> Iterable[tuple[int, dict]]:
    return ((first + i, dict(enumerate(row, start=1))) for i, row in enumerate(rows))


def worksheet(body: Iterable[str], head: str = "", dimension: str | None = None) -> Iterable[str]:
    """A worksheet part around the rows `body` (chunks of XML text)."""
    yield f'<?xml version="1.0" encoding="UTF-8" standalone="yes"?>{head}'
    yield f'<worksheet xmlns="{MAIN}" xmlns:r="{RELS}">'
    if dimension:
        yield f'<dimension ref="{dimension}"/>'
    yield "<sheetData>"
    yield from body
    yield "</sheetData></worksheet>"


Part = Iterable[str] | Callable[[], Iterable[str]]


def write_workbook(
    path: Path,
    sheets: dict[str, Part],
    *,
    strings: Part | None = None,
    states: dict[str, str] | None = None,
    charts: tuple[str, ...] = (),
    level: int = 9,
) -> Path:
    """An .xlsx written part by part (each part streamed through the compressor, so a part of
    a gigabyte is built in little memory). `states` marks sheets hidden or veryHidden;
    `charts` adds chart sheets (a chartsheet part and no rows)."""
    states = states or {}
    names = [*sheets, *charts]
    overrides = "".join(
        f'<Override PartName="/xl/worksheets/sheet{i}.xml" ContentType="application/'
        'vnd.openxmlformats-officedocument.spreadsheetml.worksheet+xml"/>'
        for i in range(1, len(sheets) + 1)
    ) + "".join(
        f'<Override PartName="/xl/chartsheets/sheet{i}.xml" ContentType="application/'
        'vnd.openxmlformats-officedocument.spreadsheetml.chartsheet+xml"/>'
        for i in range(len(sheets) + 1, len(names) + 1)
    )
    if strings is not None:
        overrides += (
            '<Override PartName="/xl/sharedStrings.xml" ContentType="application/'
            'vnd.openxmlformats-officedocument.spreadsheetml.sharedStrings+xml"/>'
        )
    content_types = (
        '<?xml version="1.0" encoding="UTF-8"?>'
        '<Types xmlns="http://schemas.openxmlformats.org/package/2006/content-types">'
        '<Default Extension="rels" ContentType="application/'
        'vnd.openxmlformats-package.relationships+xml"/>'
        '<Default Extension="xml" ContentType="application/xml"/>'
        '<Override PartName="/xl/workbook.xml" ContentType="application/'
        'vnd.openxmlformats-officedocument.spreadsheetml.sheet.main+xml"/>'
        f"{overrides}</Types>"
    )
    root_rels = (
        f'<?xml version="1.0" encoding="UTF-8"?><Relationships xmlns="{PACKAGE_RELS}">'
        f'<Relationship Id="rId1" Type="{RELS}/officeDocument" Target="xl/workbook.xml"/>'
        "</Relationships>"
    )
    entries, rels = [], []
    for i, name in enumerate(names, start=1):
        state = f' state="{states[name]}"' if name in states else ""
        entries.append(f'<sheet name="{name}" sheetId="{i}"{state} r:id="rId{i}"/>')
        if name in sheets:
            rels.append(f'<Relationship Id="rId{i}" Type="{SHEET_TYPE}" '
                        f'Target="worksheets/sheet{i}.xml"/>')
        else:
            rels.append(f'<Relationship Id="rId{i}" Type="{CHART_TYPE}" '
                        f'Target="chartsheets/sheet{i}.xml"/>')
    if strings is not None:
        rels.append(f'<Relationship Id="rIdS" Type="{STRINGS_TYPE}" Target="sharedStrings.xml"/>')
    book = (
        f'<?xml version="1.0" encoding="UTF-8"?><workbook xmlns="{MAIN}" xmlns:r="{RELS}">'
        f'<sheets>{"".join(entries)}</sheets></workbook>'
    )
    book_rels = (
        f'<?xml version="1.0" encoding="UTF-8"?><Relationships xmlns="{PACKAGE_RELS}">'
        f'{"".join(rels)}</Relationships>'
    )
    with zipfile.ZipFile(path, "w", zipfile.ZIP_DEFLATED, compresslevel=level) as archive:
        archive.writestr("[Content_Types].xml", content_types)
        archive.writestr("_rels/.rels", root_rels)
        archive.writestr("xl/workbook.xml", book)
        archive.writestr("xl/_rels/workbook.xml.rels", book_rels)
        for i, name in enumerate(names, start=1):
            if name in sheets:
                _stream(archive, f"xl/worksheets/sheet{i}.xml", sheets[name])
            else:
                archive.writestr(
                    f"xl/chartsheets/sheet{i}.xml",
                    f'<chartsheet xmlns="{MAIN}" xmlns:r="{RELS}"><sheetViews><sheetView '
                    'workbookViewId="0"/></sheetViews></chartsheet>',
                )
        if strings is not None:
            _stream(archive, "xl/sharedStrings.xml", strings)
    return path


def _stream(archive: zipfile.ZipFile, name: str, part: Part) -> None:
    chunks = part() if callable(part) else part
    with archive.open(name, "w", force_zip64=True) as out:
        pending: list[bytes] = []
        size = 0
        for chunk in chunks:
            data = chunk.encode("utf-8")
            pending.append(data)
            size += len(data)
            if size > MiB:
                out.write(b"".join(pending))
                pending, size = [], 0
        out.write(b"".join(pending))


def fixtures_book(path: Path, rows: list[list[object]] = FIXTURES, **options) -> Path:
    """A plain Fixtures sheet from rows (row 1 first)."""
    return write_workbook(path, {"Fixtures": worksheet(rows_xml(table_rows(rows)))}, **options)


def repeated(chunk: str, total_bytes: int) -> Iterable[str]:
    """`chunk` over and over, about `total_bytes` in all (in pieces of about 1 MiB)."""
    piece = chunk * max(1, MiB // len(chunk))
    for _ in range(max(1, total_bytes // len(piece))):
        yield piece


def sheet_bomb(path: Path, unpacked: int = 1024 * MiB, level: int = 9) -> Path:
    """A Fixtures sheet whose rows (the same fixture, without row numbers) unpack to
    `unpacked` bytes from a file of about a thousandth of that."""
    header = row_xml(1, {1: "Home", 2: "Away"})
    row = ('<row><c t="inlineStr"><is><t>Alder</t></is></c>'
           '<c t="inlineStr"><is><t>Birch</t></is></c></row>')
    return write_workbook(
        path, {"Fixtures": lambda: worksheet([header, *repeated(row, unpacked)])}, level=level
    )


def empty_bomb(path: Path, unpacked: int = 1024 * MiB) -> Path:
    """A Fixtures sheet of one fixture and then formatted empty cells that unpack to
    `unpacked` bytes: nothing in it counts as data, so only the size limits stop it."""
    fixture = row_xml(1, {1: "Home", 2: "Away"}) + row_xml(2, {1: "Alder", 2: "Birch"})
    row = '<row spans="1:4"><c s="1"/><c s="1"/><c s="1"/><c s="1"/></row>'
    return write_workbook(path,
                          {"Fixtures": lambda: worksheet([fixture, *repeated(row, unpacked)])})


def strings_bomb(path: Path, unpacked: int = 1024 * MiB, level: int = 9) -> Path:
    """A shared-strings part that unpacks to `unpacked` bytes; the sheet uses its first two."""
    sheet = worksheet([
        row_xml(1, {1: "Home", 2: "Away"}),
        '<row r="2"><c r="A2" t="s"><v>0</v></c><c r="B2" t="s"><v>1</v></c></row>',
    ])

    def strings() -> Iterable[str]:
        yield f'<?xml version="1.0" encoding="UTF-8"?><sst xmlns="{MAIN}">'
        yield "<si><t>Alder</t></si><si><t>Birch</t></si>"
        yield from repeated("<si><t>Cedar</t></si>", unpacked)
        yield "</sst>"

    return write_workbook(path, {"Fixtures": sheet}, strings=strings, level=level)


def lie_about_size(path: Path, part: str, claimed: int) -> Path:
    """Rewrite the zip directory so that `part` claims to unpack to `claimed` bytes (readers
    take the size from the directory); its data is unchanged."""
    data = bytearray(path.read_bytes())
    name = part.encode()
    at = 0
    while (at := data.find(b"PK\x01\x02", at)) >= 0:  # central directory entries
        length = int.from_bytes(data[at + 28 : at + 30], "little")
        if data[at + 46 : at + 46 + length] == name:
            assert data[at + 24 : at + 28] != b"\xff" * 4, "a zip64 size is not rewritten"
            data[at + 24 : at + 28] = claimed.to_bytes(4, "little")
        at += 4
    path.write_bytes(bytes(data))
    return path


LAUGHS = (
    '<!DOCTYPE worksheet [<!ENTITY a "ha">'
    + "".join(f'<!ENTITY {chr(98 + i)} "{("&" + chr(97 + i) + ";") * 10}">' for i in range(8))
    + "]>"
)


def entity_book(path: Path) -> Path:
    """A Fixtures sheet whose part declares nested entities (one cell would expand to 10^8
    characters)."""
    body = [row_xml(1, {1: "Home", 2: "Away"}),
            '<row r="2"><c r="A2" t="inlineStr"><is><t>&i;</t></is></c></row>']
    return write_workbook(path, {"Fixtures": worksheet(body, head=LAUGHS)})


def far_fixture_book(path: Path) -> Path:
    """A header on row 1 and one fixture on the last row a sheet has (1,048,576)."""
    rows = [(1, {1: "Home", 2: "Away"}), (1_048_576, {1: "Alder", 2: "Birch"})]
    return write_workbook(path, {"Fixtures": worksheet(rows_xml(rows), dimension="A1:B1048576")})


def empty_rows_book(path: Path, empty: int = 1_000_000) -> Path:
    """A million formatted rows with no values, then two fixtures."""
    def body() -> Iterable[str]:
        yield row_xml(1, {1: "Home", 2: "Away"})
        for r in range(2, empty + 2):
            yield f'<row r="{r}" spans="1:4" s="1" customFormat="1"><c r="A{r}" s="1"/></row>'
        yield row_xml(empty + 2, {1: "Alder", 2: "Birch"})
        yield row_xml(empty + 3, {1: "Cedar", 2: "Damson"})

    return write_workbook(path, {"Fixtures": lambda: worksheet(body())})


def wide_book(path: Path, rows: int = 2000, note_column: int = 16384) -> Path:
    """`rows` fixtures of Home, Away, Venue and a note in `note_column` (16384 = XFD; 4 = D),
    declared as reaching that column; no two share a team or ground, so reading dominates."""
    header = {1: "Home", 2: "Away", 3: "Venue", note_column: "Note"}

    def body() -> Iterable[str]:
        yield row_xml(1, header)
        for r in range(2, rows + 2):
            yield row_xml(r, {1: f"Home {r}", 2: f"Away {r}", 3: f"Ground {r}",
                              note_column: "n"})

    last = get_column_letter(note_column)
    return write_workbook(path, {"Fixtures": lambda: worksheet(body(), dimension=f"A1:{last}"
                                                                                 f"{rows + 1}")})


def many_rows_book(path: Path, rows: int = 100_000) -> Path:
    """A Fixtures sheet of `rows` data rows."""
    def body() -> Iterable[str]:
        yield row_xml(1, {1: "Home", 2: "Away"})
        for r in range(2, rows + 2):
            yield row_xml(r, {1: f"T{r % 997}", 2: f"U{r % 991}"})

    return write_workbook(path, {"Fixtures": lambda: worksheet(body())})


def dense_csv(path: Path, rows: int = 100_000) -> Path:
    """A CSV of `rows` fixtures among a thousand teams, about 16 bytes a row."""
    lines = ["Home,Away"] + [f"T{r % 997},U{(r * 7) % 991}" for r in range(rows)]
    path.write_text("\n".join(lines) + "\n", encoding="utf-8")
    return path


def hidden_book(path: Path, state: str = "hidden") -> Path:
    """A Fixtures sheet and a Clashes sheet that is hidden (or veryHidden)."""
    clashes = [["First", "Second", "Reason"], ["Alder", "Cedar", "coach"]]
    return write_workbook(path, {"Fixtures": worksheet(rows_xml(table_rows(FIXTURES))),
                                 "Clashes": worksheet(rows_xml(table_rows(clashes)))},
                          states={"Clashes": state})


def largest_within_limits(path: Path) -> Path:
    """A workbook just inside every limit that costs memory at once: 15.9 MB of shared text,
    48,998 fixtures of six cells (294,000 cells with data) whose teams make 294,000 clashing
    pairs. It is read, and its peak is the bound the limits were chosen for (under 300 MB)."""
    def strings() -> Iterable[str]:
        yield f'<?xml version="1.0" encoding="UTF-8"?><sst xmlns="{MAIN}"><si><t>Notes</t></si>'
        size = 0
        while size < 15.9 * MiB:
            chunk = "".join(f"<si><t>s{i}</t></si>" for i in range(size, size + 10_000))
            size += len(chunk)
            yield chunk
        yield "</sst>"

    def body() -> Iterable[str]:
        head = ["Home", "Away", "Venue", "Division", "Referee"]
        yield ('<row r="1">' + "".join(cell_xml(1, c, v) for c, v in enumerate(head, 1))
               + '<c r="F1" t="s"><v>0</v></c></row>')
        for r in range(2, 49_000):
            yield row_xml(r, {1: f"Home {r % 7000}", 2: f"Away {r % 7000}", 3: f"Ground {r}",
                              4: "U12", 5: f"Ref {r}", 6: f"note {r}"})

    return write_workbook(path, {"Fixtures": lambda: worksheet(body())}, strings=strings)
