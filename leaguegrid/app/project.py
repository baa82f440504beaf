"""Project files (JSON, `.leaguegrid`): the workbook's path and SHA-256, the column matching,
the edits, the chosen schedule and its seed.

The workbook is referenced, never copied; on reopen a different SHA-256 is reported so the
coordinator knows the fixtures may have changed under the saved pins and schedule.
"""

from __future__ import annotations

import json
import os
from dataclasses import dataclass, field
from pathlib import Path
from typing import Any

from leaguegrid.app.editing import Edits
from leaguegrid.core.model import League, Reason, Schedule
from leaguegrid.io.write.atomic import atomic_write

FORMAT = "leaguegrid-project"
VERSION = 1
SUFFIX = ".leaguegrid"


class ProjectError(Exception):
    """A project file that cannot be read."""


@dataclass
class Project:
    """What a project file holds."""

    workbook: str
    sha256: str | None = None
    mapping: dict[str, str] = field(default_factory=dict)
    edits: Edits = field(default_factory=Edits)
    schedule: Schedule | None = None
    rounds: int | None = None
    workbook_relative: str | None = None
    saved_schedule: dict[str, Any] | None = None  # as read, before it is checked

    def workbook_path(self, project_path: str | Path) -> str:
        """The workbook beside the project when it is there, else the absolute path saved."""
        if self.workbook_relative:
            near = Path(project_path).resolve().parent / self.workbook_relative
            if near.is_file():
                return str(near)
        return self.workbook


def to_json(project: Project, project_path: str | Path) -> dict[str, Any]:
    """The project file's JSON object."""
    workbook = Path(project.workbook).resolve()
    try:
        relative: str | None = os.path.relpath(workbook, Path(project_path).resolve().parent)
    except ValueError:  # another drive on Windows
        relative = None
    schedule, edits = project.schedule, project.edits
    return {
        "format": FORMAT,
        "version": VERSION,
        "workbook": {"path": str(workbook), "relative": relative, "sha256": project.sha256},
        "mapping": project.mapping or {},
        "pins": edits.pins,
        "ties": [list(t) for t in edits.ties],
        "waived": [{"kind": r.kind, "key": r.key, "row": r.row} for r in edits.waived],
        "added_clashes": [list(a) for a in edits.added],
        "rounds": project.rounds,
        "schedule": None if schedule is None else {
            "rounds": schedule.rounds,
            "seed": schedule.seed,
            "method": schedule.method,
            "assignment": schedule.assignment,
        },
        "seed": None if schedule is None else schedule.seed,
    }


def save_project(path: str | Path, project: Project) -> None:
    """Write the project file through a temporary file moved into place."""
    text = json.dumps(to_json(project, path), indent=2, ensure_ascii=False)
    with atomic_write(path, "w", encoding="utf-8", newline="\n") as handle:
        handle.write(text + "\n")


def _pairs(value: Any, name: str) -> list[tuple[str, str]]:
    if not isinstance(value, list) or not all(
            isinstance(p, list) and len(p) == 2 and all(isinstance(x, str) for x in p)
            for p in value):
        raise ProjectError(f"the project's {name} must be a list of fixture pairs")
    return [(p[0], p[1]) for p in value]


def read_project(path: str | Path) -> Project:
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
    edits = Edits(pins=pins, ties=_pairs(raw.get("ties") or [], "ties"), waived=waived,
                  added=_pairs(raw.get("added_clashes") or [], "added clashes"))
    return Project(
        workbook=book["path"], workbook_relative=book.get("relative"),
        sha256=book.get("sha256"),
        mapping={str(k): str(v) for k, v in mapping.items()} if isinstance(mapping, dict) else {},
        edits=edits, saved_schedule=schedule,
        rounds=raw.get("rounds") if isinstance(raw.get("rounds"), int) else None,
    )


@dataclass
class Restored:
    """A project laid onto a freshly read league: the edits and schedule that still fit, and a
    warning sentence when something changed or was dropped."""

    edits: Edits
    schedule: Schedule | None
    warning: str | None


def restore(project: Project, league: League | None, current_sha: str | None) -> Restored:
    """Keep the project's edits and schedule where their fixtures still exist in the league."""
    if current_sha is None or league is None:
        return Restored(Edits(), None,
                        f"The project's workbook {project.workbook} could not be found.")
    notes = []
    if project.sha256 and current_sha != project.sha256:
        notes.append(f"The workbook {Path(project.workbook).name} has changed since the project "
                     f"was saved; the saved pins, ties and schedule were kept where their "
                     f"fixtures still exist: check them.")
    labels = {f.label for f in league.fixtures}
    saved = project.edits
    dropped = sorted({x for x in saved.pins if x not in labels}
                     | {x for pair in saved.ties + saved.added for x in pair if x not in labels})
    edits = Edits(
        pins={k: v for k, v in saved.pins.items() if k in labels},
        ties=[t for t in saved.ties if set(t) <= labels],
        waived=list(saved.waived),
        added=[a for a in saved.added if set(a) <= labels],
    )
    schedule = None
    if project.saved_schedule is not None:
        data = project.saved_schedule
        assignment = {str(k): int(v) for k, v in data["assignment"].items()}
        if set(assignment) == labels:
            schedule = Schedule(rounds=int(data["rounds"]), assignment=assignment,
                                seed=data.get("seed"), method=str(data.get("method", "uniform")))
        else:
            notes.append("The saved schedule no longer matches the workbook's fixtures and was "
                         "not restored.")
    if dropped:
        notes.append(f"Fixtures no longer in the workbook were dropped from pins and ties: "
                     f"{', '.join(dropped)}.")
    return Restored(edits, schedule, " ".join(notes) or None)
