"""Project files (JSON, `.leaguegrid`): the workbook's path and SHA-256, the column mapping,
pins, ties, waived and added clashes, the chosen schedule and its seed.

The workbook is referenced, never copied; on reopen a different SHA-256 is reported so the
coordinator knows the fixtures may have changed under the saved pins and schedule.
"""

from __future__ import annotations

import json
import os
from dataclasses import dataclass, field
from pathlib import Path
from typing import Any

from leaguegrid.app import bridge
from leaguegrid.core.model import Reason, Schedule
from leaguegrid.gui.document import Edits, LeagueDocument

FORMAT = "leaguegrid-project"
VERSION = 1


class ProjectError(Exception):
    """A project file that cannot be read."""


@dataclass
class ProjectData:
    """A project file's content, as read."""

    workbook: str
    workbook_relative: str | None
    sha256: str | None
    mapping: dict[str, str] = field(default_factory=dict)
    pins: dict[str, int | None] = field(default_factory=dict)
    ties: list[tuple[str, str]] = field(default_factory=list)
    waived: list[Reason] = field(default_factory=list)
    added: list[tuple[str, str]] = field(default_factory=list)
    schedule: dict[str, Any] | None = None
    rounds: int | None = None

    def workbook_path(self, project_path: str) -> str:
        """The workbook beside the project when it is there, else the absolute path saved."""
        if self.workbook_relative:
            near = Path(project_path).resolve().parent / self.workbook_relative
            if near.is_file():
                return str(near)
        return self.workbook


def to_json(doc: LeagueDocument, project_path: str, rounds: int | None) -> dict[str, Any]:
    """The project file's JSON object for a document."""
    assert doc.path is not None
    workbook = Path(doc.path).resolve()
    try:
        relative: str | None = os.path.relpath(workbook, Path(project_path).resolve().parent)
    except ValueError:  # another drive on Windows
        relative = None
    schedule = doc.schedule
    return {
        "format": FORMAT,
        "version": VERSION,
        "workbook": {"path": str(workbook), "relative": relative, "sha256": doc.sha256},
        "mapping": doc.mapping or {},
        "pins": doc.edits.pins,
        "ties": [list(t) for t in doc.edits.ties],
        "waived": [{"kind": r.kind, "key": r.key, "row": r.row} for r in doc.edits.waived],
        "added_clashes": [list(a) for a in doc.edits.added],
        "rounds": rounds,
        "schedule": None if schedule is None else {
            "rounds": schedule.rounds,
            "seed": schedule.seed,
            "method": schedule.method,
            "assignment": schedule.assignment,
        },
        "seed": None if schedule is None else schedule.seed,
    }


def save(path: str, doc: LeagueDocument, rounds: int | None) -> None:
    """Write the project file atomically."""
    text = json.dumps(to_json(doc, path, rounds), indent=2, ensure_ascii=False)
    bridge.write_text_atomic(path, text + "\n")


def _pairs(value: Any, name: str) -> list[tuple[str, str]]:
    if not isinstance(value, list) or not all(
            isinstance(p, list) and len(p) == 2 and all(isinstance(x, str) for x in p)
            for p in value):
        raise ProjectError(f"the project's {name} must be a list of fixture pairs")
    return [(p[0], p[1]) for p in value]


def read(path: str) -> ProjectData:
    """Read and check a project file; ProjectError says what is wrong with it."""
    try:
        with open(path, encoding="utf-8") as handle:
            raw = json.load(handle)
    except (OSError, UnicodeDecodeError, json.JSONDecodeError) as err:
        raise ProjectError(f"{path} is not a readable LeagueGrid project: {err}") from err
    if not isinstance(raw, dict) or raw.get("format") != FORMAT:
        raise ProjectError(f"{path} is not a LeagueGrid project file")
    if raw.get("version") != VERSION:
        raise ProjectError(f"{path} is a project of version {raw.get('version')}; "
                           f"this LeagueGrid reads version {VERSION}")
    book = raw.get("workbook") or {}
    if not isinstance(book, dict) or not isinstance(book.get("path"), str):
        raise ProjectError(f"{path} does not name its workbook")
    pins = raw.get("pins") or {}
    if not isinstance(pins, dict) or not all(
            isinstance(k, str) and (v is None or isinstance(v, int)) for k, v in pins.items()):
        raise ProjectError("the project's pins must map fixture labels to round numbers")
    waived = []
    for item in raw.get("waived") or []:
        try:
            waived.append(Reason(kind=item["kind"], key=item["key"], row=item.get("row")))
        except (TypeError, KeyError) as err:
            raise ProjectError(f"the project's waived clashes are malformed: {err}") from err
    schedule = raw.get("schedule")
    if schedule is not None and not (isinstance(schedule, dict)
                                     and isinstance(schedule.get("assignment"), dict)
                                     and isinstance(schedule.get("rounds"), int)):
        raise ProjectError("the project's schedule is malformed")
    mapping = raw.get("mapping") or {}
    return ProjectData(
        workbook=book["path"], workbook_relative=book.get("relative"),
        sha256=book.get("sha256"),
        mapping={str(k): str(v) for k, v in mapping.items()} if isinstance(mapping, dict) else {},
        pins=pins, ties=_pairs(raw.get("ties") or [], "ties"), waived=waived,
        added=_pairs(raw.get("added_clashes") or [], "added clashes"),
        schedule=schedule, rounds=raw.get("rounds") if isinstance(raw.get("rounds"), int) else None,
    )


def apply(data: ProjectData, doc: LeagueDocument, current_sha: str | None) -> str | None:
    """Restore edits and schedule onto a freshly read document; a warning sentence or None."""
    notes = []
    if current_sha is None:
        return f"The project's workbook {data.workbook} could not be found."
    if data.sha256 and current_sha != data.sha256:
        notes.append(f"The workbook {Path(data.workbook).name} has changed since the project "
                     f"was saved; the saved pins, ties and schedule were kept where their "
                     f"fixtures still exist: check them.")
    league = doc.league
    labels = {f.label for f in league.fixtures} if league is not None else set()
    dropped = sorted({x for x in data.pins if x not in labels}
                     | {x for pair in data.ties + data.added for x in pair if x not in labels})
    doc.edits = Edits(
        pins={k: v for k, v in data.pins.items() if k in labels},
        ties=[t for t in data.ties if set(t) <= labels],
        waived=list(data.waived),
        added=[a for a in data.added if set(a) <= labels],
    )
    if data.schedule is not None:
        assignment = {str(k): int(v) for k, v in data.schedule["assignment"].items()}
        if set(assignment) == labels:
            doc.set_schedule(Schedule(rounds=int(data.schedule["rounds"]), assignment=assignment,
                                      seed=data.schedule.get("seed"),
                                      method=str(data.schedule.get("method", "uniform"))))
        else:
            notes.append("The saved schedule no longer matches the workbook's fixtures and was "
                         "not restored.")
    if dropped:
        notes.append(f"Fixtures no longer in the workbook were dropped from pins and ties: "
                     f"{', '.join(dropped)}.")
    doc.changed_edits()
    return " ".join(notes) or None
