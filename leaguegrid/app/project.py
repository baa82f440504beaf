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

from leaguegrid import engine
from leaguegrid.app import league, schema
from leaguegrid.app.editing import Edits, working_league
from leaguegrid.core.model import League, LoadResult, Reason, Schedule
from leaguegrid.core.wording import clipped, counted, listed, message
from leaguegrid.io.write.atomic import atomic_write

FORMAT = schema.FORMAT
VERSION = schema.VERSION
SUFFIX = ".leaguegrid"


MAX_PROJECT_BYTES = 20 * 1024 * 1024  # a season of 50,000 fixtures pinned and drawn: ~6 MB


class ProjectError(Exception):
    """A project file that cannot be read (one sentence)."""


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
    saved_schedule: dict[str, Any] | None = None  # as read and checked, before it is laid on
    notices: list[str] = field(default_factory=list)  # what was damaged and left out

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


def read_project(path: str | Path, hooks: engine.Hooks | None = None) -> Project:
    """Read a project file as untrusted input: size and nesting checked before parsing, every
    field checked against the format (schema.py); ProjectError (one sentence) when it cannot
    be used at all, else the valid parts, with `notices` naming what was dropped."""
    if hooks is not None:
        hooks.report(0.05, f"Reading {Path(path).name}")
    raw = load_json(path)
    found = schema.check_project(raw)
    if found.fatal is not None:
        raise ProjectError(message(f"{path} {found.fatal}"))
    fields = found.fields
    book = fields["workbook"]
    edits = Edits(pins=fields["pins"], ties=fields["ties"],
                  waived=[Reason(kind=w["kind"], key=w["key"], row=w["row"])
                          for w in fields["waived"]],
                  added=fields["added_clashes"])
    notices = []
    if found.problems:
        notices.append(message(
            f"The project file {Path(path).name} is damaged in "
            f"{counted(len(found.problems), 'place')}; those parts were left out: "
            f"{listed(found.problems)}."
            + (" The saved schedule was not restored." if found.schedule_dropped else "")))
    return Project(
        workbook=book["path"], workbook_relative=book["relative"], sha256=book["sha256"],
        mapping=fields["mapping"], edits=edits, saved_schedule=fields["schedule"],
        rounds=fields["rounds"], notices=notices,
    )


def load_json(path: str | Path) -> Any:
    """The JSON value of a project file: at most MAX_PROJECT_BYTES, nested at most
    schema.MAX_DEPTH deep (checked before parsing), UTF-8; else ProjectError."""
    name = Path(path)
    try:
        if not name.is_file():  # a folder, a pipe or a device is never opened
            raise ProjectError(f"{path} is not a file" if name.exists() else
                               f"{path} could not be read: it does not exist")
        with open(name, "rb") as handle:
            size = os.fstat(handle.fileno()).st_size
            data = b"" if size > MAX_PROJECT_BYTES else handle.read(MAX_PROJECT_BYTES + 1)
    except OSError as err:
        reason = (err.strerror or str(err)).lower()
        raise ProjectError(f"{path} could not be read: {reason}") from err
    if size > MAX_PROJECT_BYTES or len(data) > MAX_PROJECT_BYTES:
        raise ProjectError(
            f"{path} is too large for a LeagueGrid project ({max(size, len(data)):,} bytes; "
            f"at most {MAX_PROJECT_BYTES:,})")
    try:
        text = data.decode("utf-8-sig")
    except UnicodeDecodeError as err:
        raise ProjectError(f"{path} is damaged: the byte at offset {err.start:,} is not UTF-8 "
                           "text, so it is not a LeagueGrid project") from err
    if schema.too_deep(text):
        raise ProjectError(f"{path} is damaged: its data is nested more than "
                           f"{schema.MAX_DEPTH} levels deep (a project needs 4), so it is not "
                           "read")
    try:
        return json.loads(text, parse_constant=schema.constant)
    except json.JSONDecodeError as err:
        raise ProjectError(f"{path} is damaged: {err.msg.lower()} (line {err.lineno:,}, "
                           f"column {err.colno:,})") from err
    except schema.NotJson as err:
        raise ProjectError(f"{path} is damaged: {err}") from err
    except ValueError as err:  # Python converts no number of more than 4,300 digits
        raise ProjectError(f"{path} is damaged: it holds a number of thousands of digits, "
                           "which no part of a project can be") from err
    except RecursionError as err:  # too_deep() said no, so this is not expected
        raise ProjectError(f"{path} is damaged: its data is nested too deeply") from err


@dataclass
class Restored:
    """A project laid onto a freshly read league: the edits and schedule that still fit, and a
    warning sentence when something changed or was dropped."""

    edits: Edits
    schedule: Schedule | None
    warning: str | None


def restore(project: Project, fresh: League | None, current_sha: str | None) -> Restored:
    """Keep the project's edits and schedule where their fixtures still exist in the league."""
    notes = list(project.notices)
    if current_sha is None or fresh is None:
        why = "found" if current_sha is None else "read (see its problems)"
        notes.append(f"The project's workbook {clipped(project.workbook, 300)} could not be "
                     f"{why}.")
        return Restored(Edits(), None, message(" ".join(notes)))
    if project.sha256 and current_sha != project.sha256:
        notes.append(f"The workbook {clipped(Path(project.workbook).name, 200)} has changed "
                     f"since the project was saved; the saved pins, ties and schedule were "
                     f"kept where their fixtures still exist: check them.")
    labels = {f.label for f in fresh.fixtures}
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
                     f"{listed(dropped, 10)}.")
    return Restored(edits, schedule, message(" ".join(notes)) if notes else None)


def is_project(path: str | Path) -> bool:
    """True for a project file's name (`.leaguegrid`)."""
    return Path(path).suffix.casefold() == SUFFIX


@dataclass
class ProjectRead:
    """A project file as read: the project, or the one sentence saying why it cannot be used."""

    project: Project | None
    problem: str | None = None


def try_read_project(path: str | Path, hooks: engine.Hooks | None = None) -> ProjectRead:
    """read_project, its refusal returned rather than raised (for the window's worker)."""
    try:
        return ProjectRead(read_project(path, hooks))
    except ProjectError as err:
        return ProjectRead(None, message(str(err)))


@dataclass
class OpenedProject:
    """A project file opened on its workbook: the league with the project's pins, ties and
    clash edits applied and its clash graph; `problem` when the project cannot be used."""

    opened: league.OpenedLeague | None
    restored: Restored | None = None
    problem: str | None = None
    damaged: bool = False  # parts of the project file were damaged and left out

    @property
    def warning(self) -> str | None:
        """The 'changed' and 'dropped' notices (and damaged parts left out), or None."""
        return self.restored.warning if self.restored is not None else None


def open_project(path: str | Path, columns: dict[str, str] | None = None,
                 hooks: engine.Hooks | None = None) -> OpenedProject:
    """Read a project file and its workbook (as the command line works on it). `columns`,
    typed by the coordinator, replaces the project's matching and must fit the file
    (ColumnsError otherwise); the project's own is dropped with a notice when it no longer
    fits."""
    found = try_read_project(path, hooks)
    if found.project is None:
        return OpenedProject(None, problem=found.problem)
    data = found.project
    workbook = data.workbook_path(path)
    typed = columns is not None
    opened = league.open_league(workbook, columns if typed else (data.mapping or None),
                                hooks=hooks, typed=typed)
    sha = league.sha256_of(workbook) if Path(workbook).is_file() else None
    restored = restore(data, opened.league, sha)
    if opened.ok and opened.league is not None:
        working = working_league(opened.league, restored.edits)
        opened = league.OpenedLeague(
            opened.path, LoadResult(working, opened.result.problems),
            league.clash_graph(working, restored.edits.waived), sha, columns=opened.columns,
            notice=opened.notice)
    return OpenedProject(opened, restored, damaged=bool(data.notices))
