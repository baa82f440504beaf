"""What a league file may hold: the limits checked before and while reading it (the same numbers
are listed for coordinators in docs/user/workbook-format.md).

Real leagues stay far below them. They bound the memory and time a hostile file can take: no
limit counts row or column numbers or empty rows, only bytes and the cells that hold data."""

from __future__ import annotations

from leaguegrid.core.wording import grouped

MiB = 1024 * 1024
MAX_FILE_BYTES = 200 * MiB  # the file as stored
MAX_SHEET_BYTES = 128 * MiB  # one worksheet part of an .xlsx, unpacked (read as a stream)
MAX_STRINGS_BYTES = 16 * MiB  # the shared-strings part, unpacked (held in memory)
MAX_SMALL_PART_BYTES = 8 * MiB  # the workbook, relationships and styles parts, unpacked
MAX_UNPACKED_BYTES = 256 * MiB  # every part read from one workbook, unpacked, together
MAX_PARTS = 10_000  # parts listed in a workbook's zip directory
MAX_DATA_ROWS = 50_000  # rows holding data, in one sheet (or the CSV file)
MAX_DATA_CELLS = 300_000  # cells holding data, in the whole file
MAX_CSV_LINE_BYTES = MiB  # one line of CSV text
MAX_PROBLEMS_LISTED = 1_000  # problems listed for one file; the rest are counted in one line
MAX_CLASH_PAIRS = 300_000  # pairs of fixtures that may not share a round (the clash graph's
# edges, about 350 bytes each in memory); a season of 2,000 fixtures has about 150,000


def size_text(n: int) -> str:
    """A limit in bytes as a coordinator reads it: '128 MB'."""
    return f"{grouped(n // MiB)} MB" if n >= MiB else f"{grouped(n)} bytes"


def too_large(what: str, limit: str) -> str:
    """The one sentence of a limit passed: 'the file is too large to read: sheet Fixtures has
    more than 50,000 rows with data (the limit)'."""
    return f"the file is too large to read: {what} more than {limit} (the limit)"
