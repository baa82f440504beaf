"""Writes that survive the disk: a full disk (a child process under RLIMIT_FSIZE, SIGXFSZ
ignored, so writes fail with EFBIG as on a full disk), a read-only folder, a folder in the way
and a write killed half-way each leave the old file as it was and nothing beside it (after the
next write), and say so in one sentence with exit 4."""

from __future__ import annotations

import os
import re
import shutil
import signal
import subprocess
import sys
import tempfile
import time
from pathlib import Path

import pytest

from benchmarks.hostile_project import SLOW_WRITE
from leaguegrid.app import project
from leaguegrid.io.write.atomic import STALE_SECONDS, atomic_write, remove_stale_temporaries
from leaguegrid.launch import main

pytestmark = pytest.mark.skipif(os.name != "posix", reason="POSIX resource limits and signals")

FULL_DISK = """
import resource, signal, sys
signal.signal(signal.SIGXFSZ, signal.SIG_IGN)
limit = int(sys.argv[1])
resource.setrlimit(resource.RLIMIT_FSIZE, (limit, limit))
from leaguegrid.launch import main
sys.exit(main(sys.argv[2:]))
"""
AS_NOBODY = """
import os, sys
import encodings.cp437, openpyxl.writer.excel, leaguegrid.app.export, leaguegrid.cli.commands
from leaguegrid.launch import main
if os.geteuid() == 0:  # root writes anywhere: write as nobody, everything imported first
    os.setgid(65534)
    os.setuid(65534)
sys.exit(main(sys.argv[1:]))
"""
EFBIG = "the file would be larger than this system allows (or the disk is full)"
OURS = re.compile(r"\.calendar\.xlsx\.[a-z0-9_]{8}\.tmp")


def plan(league: Path, *options: str) -> list[str]:
    return ["plan", str(league), "--rounds", "4", "--seed", "1", *options]


@pytest.fixture
def small(tmp_path, demo) -> Path:
    league = tmp_path / "small.xlsx"
    shutil.copy(demo / "small.xlsx", league)
    return league


@pytest.mark.parametrize(("option", "name", "limit"), [
    ("--out", "calendar.xlsx", 3000),
    ("--csv", "schedule.csv", 100),
    ("--ics", "league-Fenwick Vale Under-11s.ics", 1000),
])
def test_a_full_disk_leaves_the_old_file_and_no_half_file(child, small, tmp_path, option, name,
                                                          limit):
    out = tmp_path / "out"
    out.mkdir()
    target = out / name
    target.write_bytes(b"OLD")
    code, _out, err, _peak = child(FULL_DISK, str(limit),
                                   *plan(small, option, str(out if option == "--ics" else target)))
    assert (code, err) == (4, f"leaguegrid plan: could not write {target}: {EFBIG}; nothing "
                              "there was changed\n")  # no traceback, no zip library complaint
    assert target.read_bytes() == b"OLD"
    assert [p.name for p in out.iterdir()] == [name]


def test_a_project_that_meets_a_full_disk_keeps_the_old_one(child, tmp_path):
    path = tmp_path / "season.leaguegrid"
    path.write_bytes(b"OLD")
    code, out, err, _peak = child(
        FULL_DISK.replace("from leaguegrid.launch import main\nsys.exit(main(sys.argv[2:]))",
                          "from leaguegrid.app import project\n"
                          "p = project.Project(workbook='small.xlsx')\n"
                          "p.edits.pins = {f'F{i}': 1 for i in range(1000)}\n"
                          "try:\n    project.save_project(sys.argv[2], p)\n"
                          "except OSError as err:\n    print(err)\n"),
        "2000", str(path))
    assert (code, out, err) == (0, f"could not write {path}: {EFBIG}; nothing there was "
                                   "changed\n", "")
    assert [p.name for p in tmp_path.iterdir()] == ["season.leaguegrid"]
    assert path.read_bytes() == b"OLD"


def test_a_read_only_folder_is_said_in_one_sentence(child, demo):
    folder = Path(tempfile.mkdtemp())  # outside pytest's private folders, so nobody reaches it
    try:
        folder.chmod(0o755)
        league = folder / "small.xlsx"
        shutil.copy(demo / "small.xlsx", league)
        league.chmod(0o644)
        out = folder / "out"
        out.mkdir()
        target = out / "calendar.xlsx"
        target.write_bytes(b"OLD")
        target.chmod(0o644)
        out.chmod(0o555)
        code, _out, err, _peak = child(AS_NOBODY, *plan(league, "--out", str(target)))
        assert (code, err) == (4, f"leaguegrid plan: could not write {target}: the folder or "
                                  "file does not allow writing; nothing there was changed\n")
        assert target.read_bytes() == b"OLD"
        assert [p.name for p in out.iterdir()] == ["calendar.xlsx"]
    finally:
        out.chmod(0o755)
        shutil.rmtree(folder)


def test_a_folder_in_the_way_is_said_in_one_sentence(cli, small, tmp_path):
    target = tmp_path / "calendar.xlsx"
    (target / "inside").mkdir(parents=True)
    code, _out, err = cli(*plan(small, "--out", str(target)))
    assert (code, err) == (4, f"leaguegrid plan: could not write {target}: a folder of that "
                              "name is in the way; nothing there was changed\n")
    assert [p.name for p in target.iterdir()] == ["inside"]
    assert sorted(p.name for p in tmp_path.iterdir()) == ["calendar.xlsx", "small.xlsx"]


def test_refusing_to_write_over_a_project_file_names_the_input_file(cli, small, tmp_path):
    season = tmp_path / "season.leaguegrid"
    project.save_project(season, project.Project(workbook=str(small)))
    before = season.read_bytes()
    code, _out, err = cli(*plan(season, "--csv", str(season)))
    assert (code, err) == (4, f"leaguegrid plan: could not write: refusing to write {season}: "
                              f"it is the input file {season}, which LeagueGrid only reads; "
                              "choose another output name\n")
    assert season.read_bytes() == before


def test_a_write_killed_half_way_is_cleaned_up_by_a_later_write(cli, small, tmp_path):
    out = tmp_path / "out"
    out.mkdir()
    target = out / "calendar.xlsx"
    target.write_bytes(b"OLD")
    env = dict(os.environ, PYTHONPATH=os.pathsep.join([str(Path(__file__).parents[2]),
                                                       os.environ.get("PYTHONPATH", "")]))
    writer = subprocess.Popen([sys.executable, "-c", SLOW_WRITE, str(target)], env=env,
                              stdout=subprocess.PIPE, text=True)
    assert writer.stdout is not None and writer.stdout.readline() == "writing\n"
    writer.send_signal(signal.SIGKILL)
    writer.wait()
    writer.stdout.close()
    (stray,) = [p for p in out.iterdir() if p.name != "calendar.xlsx"]
    assert OURS.fullmatch(stray.name) and target.read_bytes() == b"OLD"

    assert cli(*plan(small, "--out", str(target)))[0] == 0
    assert stray.exists()  # young: it may be another program's write still going on
    old = time.time() - STALE_SECONDS - 60
    others = [out / ".notes.tmp", out / ".calendar.xlsx.short.tmp", out / "keep.tmp"]
    for path in [stray, *others]:
        path.write_bytes(b"x")
        os.utime(path, (old, old))
    (out / ".folder.abcdefgh.tmp").mkdir()
    assert cli(*plan(small, "--out", str(target)))[0] == 0
    assert not stray.exists()
    assert sorted(p.name for p in out.iterdir()) == sorted(
        [".calendar.xlsx.short.tmp", ".folder.abcdefgh.tmp", ".notes.tmp", "calendar.xlsx",
         "keep.tmp"])
    assert target.read_bytes()[:2] == b"PK"


def test_temporary_names_fit_beside_a_target_of_the_longest_name(tmp_path):
    target = tmp_path / ("é" * 127 + ".x")  # 256 bytes would not do; 256 - 2 = 254 + ".x"
    target = tmp_path / (target.name.encode()[:255].decode("utf-8", "ignore"))
    seen = []
    with atomic_write(target) as handle:
        seen.append(Path(handle.name).name)
        handle.write("new")
    assert target.read_text() == "new"
    (name,) = seen
    assert len(name.encode()) <= 255 and name.startswith(".é") and name.endswith(".tmp")


def test_only_stale_temporaries_of_ours_are_removed(tmp_path):
    now = time.time()
    stale, fresh = tmp_path / ".a.xlsx.abcd1234.tmp", tmp_path / ".a.xlsx.efgh5678.tmp"
    for path, age in ((stale, STALE_SECONDS + 1), (fresh, STALE_SECONDS - 60)):
        path.write_bytes(b"x")
        os.utime(path, (now - age, now - age))
    assert remove_stale_temporaries(tmp_path, now) == [stale]
    assert [p.name for p in tmp_path.iterdir()] == [fresh.name]


def test_a_missing_folder_is_one_sentence(small, tmp_path, capsys):
    missing = tmp_path / "no such folder" / "cal.xlsx"
    assert main(plan(small, "--out", str(missing))) == 4
    assert capsys.readouterr().err == (f"leaguegrid plan: could not write {missing}: the folder "
                                       "does not exist; nothing there was changed\n")
