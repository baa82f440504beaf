"""The project file's format (`leaguegrid-project`, version 1), checked field by field.

A project file may come from anywhere (a USB stick, an email), so every field is checked for
its type, its length and, where the names are ours, its name. What is wrong is named by its
place in the file, as in `pins["Herons v Wrens"] is 'soon', not a round number`. The
workbook's path, the format and the version must be right or the file is refused; any other
damaged part is left out and named, and the rest is used: a pin, tie, waived or added clash
one at a time, the column matching entry by entry, and the saved schedule whole or not at all
(part of a schedule is not a schedule).
"""

from __future__ import annotations

import re
from dataclasses import dataclass, field
from typing import Any

from leaguegrid.core.names import name_key
from leaguegrid.core.wording import clipped, counted, grouped
from leaguegrid.io.read.fixtures_sheet import FIXTURES_COLUMNS
from leaguegrid.io.read.rounds_sheet import MAX_ROUND  # the workbook's own limit

FORMAT = "leaguegrid-project"
VERSION = 1
MAX_DEPTH = 16  # the format needs 4 (root, schedule, assignment, value)
MAX_TEXT = 1000  # characters in a fixture label, a name or a column name
MAX_PATH = 4096  # characters in a path
MAX_DIGITS = 40  # a longer number is never a round, a row or a seed
REASON_KINDS = ("team", "venue", "shared", "clash", "split")
KNOWN_KEYS = ("format", "version", "workbook", "mapping", "pins", "ties", "waived",
              "added_clashes", "rounds", "schedule", "seed")
_STRING = re.compile(r'"[^"\\]*(?:\\.[^"\\]*)*"', re.DOTALL)
_NOT_BRACKET = re.compile(r"[^\[\]{}]+")
_INNERMOST = re.compile(r"\[\]|\{\}")
_SHA256 = re.compile(r"[0-9a-f]{64}\Z")


class NotJson(ValueError):
    """NaN or Infinity, which Python's json reads but JSON does not allow."""


def constant(text: str) -> None:
    """json's parse_constant: NaN and Infinity are refused."""
    raise NotJson(f"it holds {text}, which is not a number JSON allows")


def too_deep(text: str) -> bool:
    """True when the JSON text's arrays and objects nest more than MAX_DEPTH deep, found
    without parsing it (strings skipped; unbalanced brackets are left for parsing to name)."""
    if text.count("[") + text.count("{") <= MAX_DEPTH:  # cannot be deeper: no need to look
        return False
    brackets = _NOT_BRACKET.sub("", _STRING.sub("", text))
    for _level in range(MAX_DEPTH):
        brackets = _INNERMOST.sub("", brackets)  # the innermost pairs, all at once
    return any(ch in brackets for ch in "[{")


def shown(value: Any) -> str:
    """A value as a problem names it: short, whatever its size."""
    if value is None:
        return "null"
    if isinstance(value, bool):
        return "true" if value else "false"
    if isinstance(value, int) and abs(value) >= 10 ** MAX_DIGITS:
        return f"a number of {grouped(len(str(abs(value))))} digits"
    if isinstance(value, str):
        return repr(clipped(value, 40)) if len(value) <= MAX_TEXT else \
            f"a text of {counted(len(value), 'character')}"
    if isinstance(value, list):
        return f"a list of {counted(len(value), 'item')}"
    if isinstance(value, dict):
        return f"an object of {counted(len(value), 'entry', 'entries')}"
    return clipped(repr(value), 40)


def _label(key: str) -> str:
    return '"' + clipped(key, 60) + '"'


def _is_int(value: Any, low: int, high: int) -> bool:
    return (isinstance(value, int) and not isinstance(value, bool)
            and low <= value <= high)


def _is_text(value: Any, most: int = MAX_TEXT) -> bool:
    return isinstance(value, str) and 0 < len(value) <= most and "\x00" not in value


@dataclass
class Checked:
    """The fields that passed (ready to use), every problem found, and `fatal` when the file
    cannot be used at all."""

    fields: dict[str, Any] = field(default_factory=dict)
    problems: list[str] = field(default_factory=list)
    fatal: str | None = None
    schedule_dropped: bool = False


def check_project(raw: Any) -> Checked:
    """Check a parsed project file against the format."""
    out = Checked()
    if not isinstance(raw, dict) or raw.get("format") != FORMAT:
        out.fatal = "is not a LeagueGrid project file"
        return out
    version = raw.get("version")
    if not _is_int(version, 1, 10 ** 9):
        out.fatal = f"is damaged: version is {shown(version)}, not a version number"
        return out
    if version != VERSION:
        out.fatal = f"is a project of version {version}; this LeagueGrid reads version {VERSION}"
        return out
    book = raw.get("workbook")
    path = book.get("path") if isinstance(book, dict) else None
    if not _is_text(path, MAX_PATH):
        where = "workbook.path" if isinstance(book, dict) else "workbook"
        value = path if isinstance(book, dict) else book
        out.fatal = (f"is damaged: {where} is {shown(value)}, not the workbook's file path, so "
                     "the project does not say which workbook it belongs to")
        return out
    assert isinstance(book, dict)
    bad = out.problems
    out.fields["workbook"] = {"path": path, "relative": _relative(book, bad),
                              "sha256": _sha256(book, bad)}
    out.fields["mapping"] = _mapping(raw.get("mapping"), bad)
    out.fields["pins"] = _pins(raw.get("pins"), bad)
    out.fields["ties"] = _pairs(raw.get("ties"), "ties", bad)
    out.fields["added_clashes"] = _pairs(raw.get("added_clashes"), "added_clashes", bad)
    out.fields["waived"] = _waived(raw.get("waived"), bad)
    rounds = raw.get("rounds")
    if rounds is not None and not _is_int(rounds, 1, MAX_ROUND):
        bad.append(f"rounds is {shown(rounds)}, not a number of rounds")
        rounds = None
    out.fields["rounds"] = rounds
    out.fields["schedule"] = _schedule(raw.get("schedule"), bad)
    out.schedule_dropped = raw.get("schedule") is not None and out.fields["schedule"] is None
    seed = raw.get("seed")
    if seed is not None and not _is_int(seed, -(10 ** MAX_DIGITS), 10 ** MAX_DIGITS):
        bad.append(f"seed is {shown(seed)}, not a whole number")
    for key in raw:
        if key not in KNOWN_KEYS:
            bad.append(f"{_label(str(key))} is not part of a LeagueGrid project")
    return out


def _relative(book: dict, bad: list[str]) -> str | None:
    value = book.get("relative")
    if value is None or _is_text(value, MAX_PATH):
        return value
    bad.append(f"workbook.relative is {shown(value)}, not a path")
    return None


def _sha256(book: dict, bad: list[str]) -> str | None:
    value = book.get("sha256")
    if value is None or (isinstance(value, str) and _SHA256.match(value)):
        return value
    bad.append(f"workbook.sha256 is {shown(value)}, not a SHA-256 fingerprint, so a change "
               "to the workbook since saving cannot be noticed")
    return None


def _mapping(value: Any, bad: list[str]) -> dict[str, str]:
    if value is None:
        return {}
    if not isinstance(value, dict):
        bad.append(f"mapping is {shown(value)}, not an object of column names")
        return {}
    out = {}
    for ours, theirs in value.items():
        if ours != "Shared" and name_key(ours) not in FIXTURES_COLUMNS:
            bad.append(f"mapping[{_label(ours)}] is not one of our columns "
                       f"({', '.join([*FIXTURES_COLUMNS.values(), 'Shared'])})")
        elif not isinstance(theirs, str) or len(theirs) > MAX_TEXT or "\x00" in theirs:
            bad.append(f"mapping[{_label(ours)}] is {shown(theirs)}, not a column name")
        else:
            out[ours] = theirs
    return out


def _pins(value: Any, bad: list[str]) -> dict[str, int | None]:
    if value is None:
        return {}
    if not isinstance(value, dict):
        bad.append(f"pins is {shown(value)}, not an object of fixture labels and rounds")
        return {}
    out: dict[str, int | None] = {}
    for label, pin in value.items():
        if (pin is None or type(pin) is int and 1 <= pin <= MAX_ROUND) and \
                0 < len(label) <= MAX_TEXT and "\x00" not in label:  # the usual case, first
            out[label] = pin
        elif not _is_text(label):
            bad.append(f"pins has a fixture label of {shown(label)}")
        else:
            bad.append(f"pins[{_label(label)}] is {shown(pin)}, not a round number")
    return out


def _items(value: Any, name: str, bad: list[str]) -> list[Any]:
    if value is None:
        return []
    if not isinstance(value, list):
        bad.append(f"{name} is {shown(value)}, not a list")
        return []
    return value


def _pairs(value: Any, name: str, bad: list[str]) -> list[tuple[str, str]]:
    out = []
    for i, pair in enumerate(_items(value, name, bad)):
        if isinstance(pair, list) and len(pair) == 2 and all(_is_text(x) for x in pair):
            out.append((pair[0], pair[1]))
        else:
            bad.append(f"{name}[{i}] is {shown(pair)}, not a pair of fixture labels")
    return out


def _waived(value: Any, bad: list[str]) -> list[dict[str, Any]]:
    out = []
    for i, item in enumerate(_items(value, "waived", bad)):
        if not isinstance(item, dict):
            bad.append(f"waived[{i}] is {shown(item)}, not a clash reason")
            continue
        kind, key, row = item.get("kind"), item.get("key"), item.get("row")
        if kind not in REASON_KINDS:
            bad.append(f"waived[{i}].kind is {shown(kind)}, not one of "
                       f"{', '.join(REASON_KINDS)}")
        elif not _is_text(key):
            bad.append(f"waived[{i}].key is {shown(key)}, not a name")
        elif row is not None and not _is_int(row, 1, 10 ** 7):
            bad.append(f"waived[{i}].row is {shown(row)}, not a row number")
        else:
            out.append({"kind": kind, "key": key, "row": row})
    return out


def _schedule(value: Any, bad: list[str]) -> dict[str, Any] | None:
    """The saved schedule, whole, or None (with its problems named) when any part is wrong."""
    if value is None:
        return None
    if not isinstance(value, dict):
        bad.append(f"schedule is {shown(value)}, not a schedule")
        return None
    before = len(bad)
    rounds, assignment = value.get("rounds"), value.get("assignment")
    seed, method = value.get("seed"), value.get("method", "uniform")
    if not _is_int(rounds, 1, MAX_ROUND):
        bad.append(f"schedule.rounds is {shown(rounds)}, not a number of rounds")
        rounds = MAX_ROUND
    if not isinstance(assignment, dict):
        bad.append(f"schedule.assignment is {shown(assignment)}, not an object of fixture "
                   "labels and rounds")
        assignment = {}
    for label, number in assignment.items():
        if not _is_text(label):
            bad.append(f"schedule.assignment has a fixture label of {shown(label)}")
        elif not _is_int(number, 1, rounds):
            bad.append(f"schedule.assignment[{_label(label)}] is {shown(number)}, not a round "
                       f"from 1 to {rounds}")
    if seed is not None and not _is_int(seed, -(10 ** MAX_DIGITS), 10 ** MAX_DIGITS):
        bad.append(f"schedule.seed is {shown(seed)}, not a whole number")
    if not _is_text(method, 40):
        bad.append(f"schedule.method is {shown(method)}, not how the schedule was made")
    if len(bad) > before:
        return None
    return {"rounds": rounds, "assignment": assignment, "seed": seed, "method": method}
