"""Hostile project files and failing writes: seconds and peak memory of each case in a fresh
child process, with what the child answered and what it left beside the target.

    python -m benchmarks.hostile_project [CASE ...] [--limit SECONDS]

The files are built in a temporary folder by this script (nothing large is kept). The child
imports leaguegrid from PYTHONPATH (the checkout by default), so the same script measures the
code before and after a change. Peak = the child's largest resident set (ru_maxrss).
"""

from __future__ import annotations

import argparse
import json
import os
import shutil
import signal
import subprocess
import sys
import tempfile
import threading
import time
from collections.abc import Callable
from pathlib import Path

ROOT = Path(__file__).resolve().parents[1]
SMALL = ROOT / "demo_leagues" / "small.xlsx"
HEAD = '{"format": "leaguegrid-project", "version": 1, "workbook": {"path": "small.xlsx"}'

READ_PROJECT = """
import sys, time
from leaguegrid.app import project
started = time.perf_counter()
try:
    data = project.read_project(sys.argv[1])
except project.ProjectError as err:
    text = str(err)
    answer = f"refused ({len(text)} chars): {text[:70]}"
except BaseException as err:
    answer = f"unhandled {type(err).__name__}"
else:
    notes = getattr(data, "notices", [])
    answer = f"opened, {len(data.edits.pins)} pins, {len(notes)} notices"
print(f"read {time.perf_counter() - started:.2f} s; {answer}")
"""

RUN_CLI = """
import resource, signal, sys
limit = int(sys.argv[1])
if limit:
    signal.signal(signal.SIGXFSZ, signal.SIG_IGN)
    resource.setrlimit(resource.RLIMIT_FSIZE, (limit, limit))
from leaguegrid.launch import main
if sys.argv[2] == "nobody":  # root writes anywhere: run as nobody, imports done first
    import os
    import encodings.cp437, leaguegrid.cli.commands, leaguegrid.app.export, openpyxl.writer.excel
    os.setgid(65534)
    os.setuid(65534)
sys.exit(main(sys.argv[3:]))
"""

SLOW_WRITE = """
import sys, time
from leaguegrid.io.write.atomic import atomic_write
with atomic_write(sys.argv[1], "wb") as handle:
    handle.write(b"new" * 1000)
    handle.flush()
    print("writing", flush=True)
    time.sleep(60)
"""


# A child of a large process starts with that process's peak as its own ru_maxrss (Linux keeps
# the high-water mark across fork and exec), so each case is started by a small launcher.
LAUNCH = "import subprocess, sys; sys.exit(subprocess.run(sys.argv[1:]).returncode)"
PEAK = ("import atexit, resource, sys\n"  # ru_maxrss is KiB on Linux, bytes on macOS
        "atexit.register(lambda: print('peak-kib', resource.getrusage(resource.RUSAGE_SELF)"
        ".ru_maxrss // (1024 if sys.platform == 'darwin' else 1), file=sys.__stderr__))\n")


def run_child(code: str, args: list[str], limit: float) -> tuple[float, float, int, str]:
    """(seconds, peak MiB, exit code, stdout + stderr) of `python -c code args`; the peak is
    the child's own ru_maxrss as it exits (0 when it was killed)."""
    env = dict(os.environ, PYTHONPATH=os.environ.get("PYTHONPATH", str(ROOT)))
    started = time.perf_counter()
    child = subprocess.Popen([sys.executable, "-c", LAUNCH, sys.executable, "-c", PEAK + code,
                              *args], env=env, text=True,
                             stdout=subprocess.PIPE, stderr=subprocess.STDOUT)
    timer = threading.Timer(limit, child.kill)
    timer.start()
    out = child.stdout.read() if child.stdout else ""
    code = child.wait()
    timer.cancel()
    seconds = time.perf_counter() - started
    kept = [line for line in out.splitlines() if not line.startswith("peak-kib")]
    peaks = [int(line.split()[1]) for line in out.splitlines() if line.startswith("peak-kib")]
    return seconds, (peaks[-1] / 1024 if peaks else 0.0), code, "\n".join(kept)


def _pins_project(path: Path, megabytes: float, value: str = "1") -> Path:
    """A project whose pins map generated labels to `value`, about `megabytes` MB long."""
    entry = len(f'"F0000000": {value},\n')
    count = int(megabytes * 1e6 / entry)
    with open(path, "w", encoding="utf-8") as out:
        out.write(HEAD + ', "pins": {\n')
        for start in range(0, count, 100_000):
            stop = min(count, start + 100_000)
            out.write(",\n".join(f'"F{i:07d}": {value}' for i in range(start, stop)))
            out.write(",\n" if stop < count else "\n")
        out.write("}}\n")
    return path


def _deep(path: Path) -> Path:
    path.write_text(HEAD + ', "pins": ' + "[" * 200_000 + "]" * 200_000 + "}\n")
    return path


def _wrong_types(path: Path) -> Path:
    raw = {"format": "leaguegrid-project", "version": 1, "workbook": {"path": 5},
           "pins": [["A", 1]], "ties": {"a": "b"}, "waived": "all", "schedule": [1, 2],
           "mapping": {"Home": ["x"]}, "rounds": "soon"}
    path.write_text(json.dumps(raw))
    return path


PROJECT_CASES: dict[str, Callable[[Path], Path]] = {
    "project-100MB": lambda d: _pins_project(d / "big.leaguegrid", 100),
    "project-20MB-valid": lambda d: _pins_project(d / "near.leaguegrid", 20.9),
    "project-deep-nesting": lambda d: _deep(d / "deep.leaguegrid"),
    "project-300k-bad-pins": lambda d: _pins_project(d / "bad.leaguegrid", 6, '"soon"'),
    "project-wrong-types": lambda d: _wrong_types(d / "types.leaguegrid"),
}


def _plan(out_option: str, target: Path) -> list[str]:
    return ["plan", str(SMALL), "--rounds", "4", "--seed", "1", out_option, str(target)]


def _left(folder: Path, keep: set[str]) -> str:
    extra = sorted(p.name for p in folder.iterdir() if p.name not in keep)
    return ", ".join(extra) if extra else "nothing"


def write_case(name: str, folder: Path, limit: float) -> tuple[float, float, str]:
    """Run one write case; (seconds, peak MiB, what happened)."""
    out = folder / "out"
    out.mkdir()
    target = out / "calendar.xlsx"
    keep = {"calendar.xlsx"}
    size, user, argv = 0, "same", _plan("--out", target)
    if name != "write-folder-in-way":
        target.write_bytes(b"OLD")
    if name == "write-disk-full-xlsx":
        size = 3000
    elif name == "write-disk-full-ics":
        size, argv = 3000, _plan("--ics", out)
        target = out / "team-Badgers.ics"
        target.write_bytes(b"OLD")
        keep = {"calendar.xlsx", target.name}
    elif name == "write-read-only-folder":
        os.chmod(folder, 0o755)
        out.chmod(0o555)
        user = "nobody" if os.geteuid() == 0 else "same"
        shutil.copy(SMALL, folder / "small.xlsx")
        argv = ["plan", str(folder / "small.xlsx"), *argv[2:]]
    elif name == "write-folder-in-way":
        target.mkdir()
    elif name == "write-after-kill":
        slow = subprocess.Popen([sys.executable, "-c", SLOW_WRITE, str(target)],
                                env=dict(os.environ, PYTHONPATH=os.environ.get(
                                    "PYTHONPATH", str(ROOT))),
                                stdout=subprocess.PIPE, text=True)
        assert slow.stdout is not None
        slow.stdout.readline()
        slow.send_signal(signal.SIGKILL)
        slow.wait()
        for stray in out.iterdir():  # as if the killed write were an hour ago
            if stray.name != "calendar.xlsx":
                os.utime(stray, (time.time() - 3600,) * 2)
    elif name == "write-long-names-ics":
        from openpyxl import Workbook

        league = folder / "long.xlsx"
        book = Workbook()
        book.active.title = "Teams"
        book.active.append(["Team"])
        for c in "ABCD":
            book.active.append(["緑" * 100 + f" Rovers {c}"])
        book.create_sheet("Settings").append(["Setting", "Value"])
        book["Settings"].append(["Start date", "2025-09-06"])
        book.save(league)
        argv = ["plan", str(league), "--rounds", "3", "--seed", "1", "--ics", str(out)]
        target.unlink()
        keep = set()
    seconds, peak, code, text = run_child(RUN_CLI, [str(size), user, *argv], limit)
    lines = [line for line in text.splitlines() if line.strip()]
    last = lines[-1] if lines else ""
    intact = "old kept" if (target.is_file() and target.read_bytes() == b"OLD") else "old gone"
    if name == "write-folder-in-way":
        intact = "folder kept" if target.is_dir() else "folder gone"
    if name == "write-long-names-ics":
        names = [p.name for p in out.glob("*.ics")]
        longest = max((len(n.encode()) for n in names), default=0)
        intact = f"{len(names)} calendars, longest name {longest} bytes"
        keep = set(names)
    if name == "write-after-kill":
        intact = "new written" if target.read_bytes() != b"OLD" else "old kept"
    out.chmod(0o755)
    trace = "traceback" if "Traceback" in text else "no traceback"
    answer = f"exit {code}, {trace}, {intact}, left: {_left(out, keep)}; {last[:90]}"
    return seconds, peak, answer


WRITE_CASES = ("write-disk-full-xlsx", "write-disk-full-ics", "write-read-only-folder",
               "write-folder-in-way", "write-after-kill", "write-long-names-ics")


def main(argv: list[str] | None = None) -> int:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("cases", nargs="*")
    parser.add_argument("--limit", type=float, default=120.0)
    args = parser.parse_args(argv)
    names = args.cases or [*PROJECT_CASES, *WRITE_CASES]
    print(f"{'case':24} {'seconds':>8} {'peak MiB':>9}  answer")
    for name in names:
        folder = Path(tempfile.mkdtemp(prefix="hostile-"))
        try:
            if name in PROJECT_CASES:
                path = PROJECT_CASES[name](folder)
                shutil.copy(SMALL, folder / "small.xlsx")
                seconds, peak, code, text = run_child(READ_PROJECT, [str(path)], args.limit)
                answer = text.strip().splitlines()[-1] if text.strip() else f"exit {code}"
            else:
                seconds, peak, answer = write_case(name, folder, args.limit)
            print(f"{name:24} {seconds:8.2f} {peak:9.0f}  {answer}", flush=True)
        finally:
            shutil.rmtree(folder, ignore_errors=True)
    return 0


if __name__ == "__main__":
    sys.exit(main())
