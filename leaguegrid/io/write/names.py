"""Names safe for every file system and for Excel: calendar file names and sheet titles.

File names: the characters Windows, macOS or Linux forbid become "_", trailing dots and spaces
go, a Windows device name (CON, NUL, COM1, ...) gets "_" added; a name longer than
FILE_NAME_BYTES (UTF-8 bytes, so that the temporary name `.<name>.<8 characters>.tmp` still
fits the common limit of 255 bytes) is cut at a character boundary and gets "~" and 8 hex
digits of the SHA-256 of the whole name, so two long names that start alike stay apart. Names
equal but for case (or Unicode normalisation) get " (2)", " (3)" ...

Sheet titles (Excel's rules): at most 31 characters (UTF-16 units, as Excel counts them), none
of [ ] : * ? / \\, no leading or trailing apostrophe, not "History", unique ignoring case.
The first titles taken (Calendar, Summary) keep their names; a later one that collides gets
" (2)", " (3)" ...
"""

from __future__ import annotations

import hashlib
import re
import unicodedata

from leaguegrid.io.write.atomic import MAX_NAME_BYTES, TEMP_AFFIX_BYTES, fit_bytes

FILE_NAME_BYTES = MAX_NAME_BYTES - TEMP_AFFIX_BYTES
SHEET_TITLE_UNITS = 31
_FORBIDDEN_IN_FILE_NAME = re.compile(r'[<>:"/\\|?*\x00-\x1f\x7f]')
_FORBIDDEN_IN_SHEET_NAME = re.compile(r"[\[\]:*?/\\\x00-\x1f]")
_DEVICE_NAMES = {"CON", "PRN", "AUX", "NUL", *(f"COM{i}" for i in range(1, 10)),
                 *(f"LPT{i}" for i in range(1, 10))}


def _key(name: str) -> str:
    """Names a case-insensitive, normalising file system (or Excel) takes for the same."""
    return unicodedata.normalize("NFC", name).casefold()


def _tag(text: str) -> str:
    return "~" + hashlib.sha256(text.encode("utf-8")).hexdigest()[:8]


def _fitted(clean: str, room: int, extra: str) -> str:
    """`clean` + `extra` within `room` bytes: cut and tagged with a hash when too long."""
    if len((clean + extra).encode("utf-8")) <= room:
        return clean + extra
    tag = _tag(clean)
    cut = fit_bytes(clean, room - len((tag + extra).encode("utf-8"))).rstrip(". ")
    return cut + tag + extra


def file_name(stem: str, suffix: str, taken: set[str]) -> str:
    """A file name `stem` + `suffix` safe on every file system and unique among `taken`
    (compared ignoring case); adds it to `taken`."""
    clean = unicodedata.normalize("NFC", _FORBIDDEN_IN_FILE_NAME.sub("_", stem))
    clean = clean.strip().rstrip(". ") or "calendar"
    if clean.split(".")[0].strip().upper() in _DEVICE_NAMES:
        clean += "_"
    room = FILE_NAME_BYTES - len(suffix.encode("utf-8"))
    candidate = _fitted(clean, room, "") + suffix
    n = 2
    while _key(candidate) in taken:
        candidate = _fitted(clean, room, f" ({n})") + suffix
        n += 1
    taken.add(_key(candidate))
    return candidate


def _units(text: str) -> int:
    """Length in UTF-16 code units, as Excel counts a sheet title."""
    return len(text.encode("utf-16-le")) // 2


def _cut_units(text: str, most: int) -> str:
    while _units(text) > most:
        text = text[:-1]
    return text


def _tidy_title(text: str) -> str:
    """No leading or trailing spaces or apostrophes."""
    return text.strip().strip("'").strip()


def sheet_title(name: str, taken: set[str]) -> str:
    """An Excel-safe sheet title for `name`, unique among `taken` (case-insensitive); adds it."""
    base = _tidy_title(_FORBIDDEN_IN_SHEET_NAME.sub("_", name)) or "Sheet"
    if base.casefold() == "history":  # reserved by Excel
        base = "History_"
    title = _tidy_title(_cut_units(base, SHEET_TITLE_UNITS)) or "Sheet"
    n = 2
    while _key(title) in taken:
        suffix = f" ({n})"
        title = _tidy_title(_cut_units(base, SHEET_TITLE_UNITS - len(suffix))) + suffix
        n += 1
    taken.add(_key(title))
    return title
