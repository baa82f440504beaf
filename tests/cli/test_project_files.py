"""Project files read as untrusted input: each hostile file is built here, and the command line
(in-process, or in a child process where memory is measured) says what is wrong in one
sentence of at most 2,000 characters, keeps what is sound, and never changes the file."""

from __future__ import annotations

import json
import os
import shutil
import sys
from pathlib import Path

import pytest

from leaguegrid.app import project
from leaguegrid.core.wording import MESSAGE_CHARS

SMALL_LABELS = ["Herons v Wrens", "Otters v Badgers", "Herons v Otters", "Wrens v Badgers",
                "Otters v Wrens", "Badgers v Herons"]
ASSIGNMENT = dict(zip(SMALL_LABELS, [2, 1, 1, 3, 3, 4], strict=True))  # clash-free for small
posix_only = pytest.mark.skipif(os.name != "posix", reason="resource limits are POSIX")


def sound(tmp_path: Path, demo: Path) -> dict:
    """A sound project of the small demo league (copied beside it)."""
    shutil.copy(demo / "small.xlsx", tmp_path / "small.xlsx")
    return {
        "format": "leaguegrid-project", "version": 1,
        "workbook": {"path": str(tmp_path / "small.xlsx"), "relative": "small.xlsx",
                     "sha256": None},
        "mapping": {}, "pins": {"Herons v Wrens": 2},
        "ties": [], "waived": [], "added_clashes": [["Herons v Wrens", "Otters v Badgers"]],
        "rounds": 4,
        "schedule": {"rounds": 4, "seed": 7, "method": "uniform",
                     "assignment": dict(ASSIGNMENT)},
        "seed": 7,
    }


def write(tmp_path: Path, raw: object, name: str = "season.leaguegrid") -> Path:
    path = tmp_path / name
    path.write_text(raw if isinstance(raw, str) else json.dumps(raw), encoding="utf-8")
    return path


def check(cli, path: Path) -> tuple[int, str]:
    """Run `leaguegrid check` on a project; the exit code and stderr; the file unchanged."""
    before = path.read_bytes()
    code, _out, err = cli("check", str(path))
    assert path.read_bytes() == before
    assert "Traceback" not in err
    return code, err


def test_a_sound_project_is_checked_with_its_pins_and_clash_edits(cli, tmp_path, demo):
    path = write(tmp_path, sound(tmp_path, demo))
    code, out, err = cli("check", str(path))
    assert (code, err) == (0, "")
    assert "Pinned: 2" in out  # the workbook's own pin and the project's
    found = project.open_project(path)
    assert found.opened.graph.has_edge("Herons v Wrens", "Otters v Badgers")  # added clash
    assert found.restored.schedule.assignment == ASSIGNMENT


def test_a_pin_that_is_not_a_round_is_named_and_left_out_the_rest_kept(cli, tmp_path, demo):
    raw = sound(tmp_path, demo)
    raw["pins"] = {"Herons v Wrens": "soon", "Otters v Wrens": 3}
    path = write(tmp_path, raw)
    code, err = check(cli, path)
    assert code == 1
    assert err == ("leaguegrid check: The project file season.leaguegrid is damaged in 1 place; "
                   "those parts were left out: pins[\"Herons v Wrens\"] is 'soon', not a round "
                   "number.\n")
    assert project.read_project(path).edits.pins == {"Otters v Wrens": 3}


def test_fields_of_the_wrong_type_are_each_named(cli, tmp_path, demo):
    raw = sound(tmp_path, demo)
    raw.update(pins=[["Herons v Wrens", 2]], ties={"a": "b"}, waived="all",
               added_clashes=[["Herons v Wrens"], ["Otters v Wrens", 5]],
               mapping={"Home": ["Hosts"], "Colour": "Kit"}, rounds="soon",
               schedule=[1, 2], extra=True)
    raw["workbook"]["sha256"] = 12
    code, err = check(cli, write(tmp_path, raw))
    assert code == 1
    assert err == (
        "leaguegrid check: The project file season.leaguegrid is damaged in 11 places; those "
        "parts were left out: workbook.sha256 is 12, not a SHA-256 fingerprint, so a change "
        "to the workbook since saving cannot be noticed; mapping[\"Home\"] is a list of 1 "
        "item, not a column name; mapping[\"Colour\"] is not one of our columns (Fixture, "
        "Home, Away, Venue, Pitch, Division, Round, Date, Time, Played, Score, Shared); pins "
        "is a list of 1 item, not an object of fixture labels and rounds; ties is an object "
        "of 1 entry, not a list; and 6 more. The saved schedule was not restored.\n")
    checked = project.schema.check_project(raw)
    assert checked.problems[5:] == [
        "added_clashes[0] is a list of 1 item, not a pair of fixture labels",
        "added_clashes[1] is a list of 2 items, not a pair of fixture labels",
        "waived is 'all', not a list",
        "rounds is 'soon', not a number of rounds",
        "schedule is a list of 2 items, not a schedule",
        "\"extra\" is not part of a LeagueGrid project",
    ]


def test_a_damaged_schedule_is_left_out_whole_and_huge_values_are_named(cli, tmp_path, demo):
    raw = sound(tmp_path, demo)
    raw["schedule"]["assignment"]["Otters v Wrens"] = 10 ** 60
    raw["pins"] = {"Herons v Wrens": 2, "Wrens v Badgers": 0, "Otters v Wrens": True,
                   "x" * 5000: 1}
    code, err = check(cli, write(tmp_path, raw))
    assert code == 1
    assert "pins[\"Wrens v Badgers\"] is 0, not a round number" in err
    assert "pins[\"Otters v Wrens\"] is true, not a round number" in err
    assert "pins has a fixture label of a text of 5,000 characters" in err
    assert ("schedule.assignment[\"Otters v Wrens\"] is a number of 61 digits, not a round "
            "from 1 to 4") in err
    assert err.endswith("The saved schedule was not restored.\n")
    found = project.open_project(tmp_path / "season.leaguegrid")
    assert found.restored.schedule is None
    assert found.restored.edits.pins == {"Herons v Wrens": 2}


@pytest.mark.parametrize(("text", "sentence"), [
    ('["a list"]', "is not a LeagueGrid project file"),
    ('{"format": "leaguegrid-project", "version": "1"}',
     "is damaged: version is '1', not a version number"),
    ('{"format": "leaguegrid-project", "version": 2}',
     "is a project of version 2; this LeagueGrid reads version 1"),
    ('{"format": "leaguegrid-project", "version": 1, "workbook": {"path": 5}}',
     "is damaged: workbook.path is 5, not the workbook's file path, so the project does not "
     "say which workbook it belongs to"),
    ('{"format": "leaguegrid-project", "version": 1, "workbook": {"path": "a.xlsx"}, "pins": '
     + "[" * 100_000 + "]" * 100_000 + "}",
     "is damaged: its data is nested more than 16 levels deep (a project needs 4), so it is "
     "not read"),
    ('{"format": "leaguegrid-project", "version": 1, "pins": {"a": NaN}}',
     "is damaged: it holds NaN, which is not a number JSON allows"),
    ('{"format": "leaguegrid-project", "version": 1, "pins": {"a": ' + "9" * 5000 + "}}",
     "is damaged: it holds a number of thousands of digits, which no part of a project can be"),
    ('{"format": "leaguegrid-project", "version": 1, "workbook": {"pa',
     "is damaged: unterminated string starting at (line 1, column 61)"),
])
def test_a_project_that_cannot_be_used_is_refused_in_one_sentence(cli, tmp_path, text,
                                                                   sentence):
    path = write(tmp_path, text)
    code, err = check(cli, path)
    assert (code, err) == (1, f"leaguegrid check: {path} {sentence}\n")


def test_a_project_that_is_not_utf8_or_not_a_file_is_refused(cli, tmp_path):
    path = tmp_path / "season.leaguegrid"
    path.write_bytes(b'{"format": "leaguegrid-project", "v\xe9rsion": 1}')
    assert check(cli, path) == (1, f"leaguegrid check: {path} is damaged: the byte at "
                                   "offset 35 is not UTF-8 text, so it is not a LeagueGrid "
                                   "project\n")
    folder = tmp_path / "folder.leaguegrid"
    folder.mkdir()
    assert cli("check", str(folder))[::2] == (1, f"leaguegrid check: {folder} is not a file\n")


def test_a_long_list_of_problems_is_counted_not_printed(cli, tmp_path, demo):
    raw = sound(tmp_path, demo)
    raw["pins"] = {f"F{i:06d}": "soon" for i in range(300_000)}
    raw["pins"]["Herons v Wrens"] = 2
    raw["ties"] = [["Gone", f"Away {i}"] for i in range(500)]
    code, err = check(cli, write(tmp_path, raw))
    assert code == 1
    assert len(err) <= MESSAGE_CHARS + len("leaguegrid check: \n")
    assert "damaged in 300,000 places" in err
    assert "pins[\"F000004\"] is 'soon', not a round number; and 299,995 more." in err
    assert err.endswith("dropped from pins and ties: Away 0; Away 1; Away 10; Away 100; "
                        "Away 101; Away 102; Away 103; Away 104; Away 105; Away 106; and 491 "
                        "more.\n")


def test_the_changed_and_dropped_notices_are_kept(cli, tmp_path, demo):
    raw = sound(tmp_path, demo)
    raw["workbook"]["sha256"] = "0" * 64
    raw["pins"]["Kestrels v Owls"] = 3
    code, err = check(cli, write(tmp_path, raw))
    assert code == 0
    assert err == (
        "leaguegrid check: The workbook small.xlsx has changed since the project was saved; "
        "the saved pins, ties and schedule were kept where their fixtures still exist: check "
        "them. Fixtures no longer in the workbook were dropped from pins and ties: Kestrels v "
        "Owls.\n")


@posix_only
def test_a_100_mb_project_is_refused_before_it_is_read_in_bounded_memory(child, tmp_path):
    path = tmp_path / "huge.leaguegrid"
    with open(path, "w", encoding="utf-8") as out:  # real content: pins of 6.7 million labels
        out.write('{"format": "leaguegrid-project", "version": 1, "workbook": {"path": "a.xlsx"}'
                  ', "pins": {')
        line = "".join(f'"F{i:07d}": 1,\n' for i in range(100_000))
        for _ in range(67):
            out.write(line)
        out.write('"last": 1}}\n')
    size = path.stat().st_size
    assert size > 100_000_000
    code, _out, err, peak = child(
        "import sys; from leaguegrid.launch import main; sys.exit(main(sys.argv[1:]))",
        "check", str(path))
    assert (code, err) == (1, f"leaguegrid check: {path} is too large for a LeagueGrid project "
                              f"({size:,} bytes; at most 20,971,520)\n")
    assert peak < 300
    assert [p.name for p in tmp_path.iterdir()] == ["huge.leaguegrid"]


def test_the_window_path_reads_a_refused_project_without_raising(tmp_path):
    path = write(tmp_path, "[" * 50_000)
    found = project.try_read_project(path)
    assert found.project is None
    assert found.problem == (f"{path} is damaged: its data is nested more than 16 levels deep "
                             "(a project needs 4), so it is not read")
    assert sys.getrecursionlimit() >= 1000  # nothing was changed to get there
