"""Hostile and broken league files through `leaguegrid check`: seconds, peak memory, exit code
and the first line of output, each case in a fresh child process.

    python -m benchmarks.hostile [CASE ...] [--limit SECONDS] [--memory MIB]

The files are built in a temporary folder (benchmarks/hostile_files.py) and removed after.
"""

from __future__ import annotations

import argparse
import os
import resource
import subprocess
import sys
import tempfile
import time
from collections.abc import Callable
from pathlib import Path

from benchmarks import hostile_files as hf

REPO = Path(__file__).resolve().parents[1]
CASES: dict[str, tuple[str, Callable[[Path], Path]]] = {
    "sheet-bomb": ("league.xlsx", hf.sheet_bomb),
    "sheet-bomb-lying": (
        "league.xlsx",
        lambda p: hf.lie_about_size(hf.sheet_bomb(p), "xl/worksheets/sheet1.xml", 60 * hf.MiB),
    ),
    "empty-bomb-lying": (
        "league.xlsx",
        lambda p: hf.lie_about_size(hf.empty_bomb(p), "xl/worksheets/sheet1.xml", 127 * hf.MiB),
    ),
    "strings-bomb": ("league.xlsx", hf.strings_bomb),
    "entities": ("league.xlsx", hf.entity_book),
    "last-row": ("league.xlsx", hf.far_fixture_book),
    "million-empty-rows": ("league.xlsx", hf.empty_rows_book),
    "notes-in-D": ("league.xlsx", lambda p: hf.wide_book(p, note_column=4)),
    "notes-in-XFD": ("league.xlsx", hf.wide_book),
    "100k-rows-xlsx": ("league.xlsx", hf.many_rows_book),
    "100k-rows-csv": ("league.csv", hf.dense_csv),
    "40k-rows-csv": ("league.csv", lambda p: hf.dense_csv(p, 40_000)),
    "largest-within-limits": ("league.xlsx", hf.largest_within_limits),
    "demo-bigseason": ("league.xlsx",
                       lambda p: p.write_bytes((REPO / "demo_leagues" / "bigseason.xlsx")
                                               .read_bytes()) and p),
}
CHILD = (
    "import sys; from leaguegrid.launch import main; code = main(['check', sys.argv[1]]); "
    "sys.stdout.flush(); sys.exit(code)"
)


def run_case(name: str, limit: float, memory_mib: int) -> dict:
    """Build the case's file, run the command on it in a child process, measure it."""
    suffix, build = CASES[name]
    with tempfile.TemporaryDirectory() as folder:
        path = build(Path(folder) / suffix)
        size = path.stat().st_size
        env = dict(os.environ, PYTHONPATH=str(REPO))

        def cap() -> None:  # a runaway case fails inside its bound instead of swapping
            cap_bytes = memory_mib * 1024 * 1024
            resource.setrlimit(resource.RLIMIT_AS, (cap_bytes, cap_bytes))

        start = time.perf_counter()
        with tempfile.TemporaryFile("w+") as out, tempfile.TemporaryFile("w+") as err:
            child = subprocess.Popen(
                [sys.executable, "-c", CHILD, str(path)], stdout=out, stderr=err, env=env,
                cwd=REPO, preexec_fn=cap, text=True,
            )
            stopped = _wait(child.pid, limit)
            seconds = time.perf_counter() - start
            status, usage = stopped
            if status is None:
                return {"case": name, "bytes": size, "seconds": None,
                        "peak": usage.ru_maxrss / 1024, "exit": None,
                        "said": f"stopped after {limit:.0f} s"}
            out.seek(0)
            err.seek(0)
            out, err = out.read(), err.read()
        peak = usage.ru_maxrss / 1024  # KiB -> MiB on Linux
        code = os.waitstatus_to_exitcode(status)
        child.returncode = code
    said = _first_problem(out, err)
    return {"case": name, "bytes": size, "seconds": seconds, "peak": peak,
            "exit": code, "said": said}


def _wait(pid: int, limit: float) -> tuple[int | None, resource.struct_rusage]:
    """The child's exit status and its own resource use (os.wait4); the status is None when
    the child was killed after `limit` seconds."""
    deadline = time.monotonic() + limit
    while time.monotonic() < deadline:
        done, status, usage = os.wait4(pid, os.WNOHANG)
        if done:
            return status, usage
        time.sleep(0.02)
    os.kill(pid, 9)
    return None, os.wait4(pid, 0)[2]


def _first_problem(out: str, err: str) -> str:
    """The line that says why (a problem, a usage line, or the last traceback line)."""
    lines = [line.strip() for line in out.splitlines() if line.strip()]
    if "Problems: none" in lines:
        counts = next((line for line in lines if line.startswith("Fixtures:")), "")
        return f"read: {counts}"
    if "Traceback" in err or "Error" in err:
        return "TRACEBACK: " + err.strip().splitlines()[-1][:110]
    after = lines[lines.index(next(x for x in lines if x.startswith("Problems:"))) + 1:] if any(
        x.startswith("Problems:") for x in lines) else lines
    return (after[0] if after else (err.strip() or "-"))[:140]


def main(argv: list[str] | None = None) -> int:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("cases", nargs="*", help="cases to run (default: all)")
    parser.add_argument("--limit", type=float, default=120, help="seconds per case")
    parser.add_argument("--memory", type=int, default=3072,
                        help="address-space cap of each child, MiB (a runaway case stops there)")
    args = parser.parse_args(argv)
    names = args.cases or list(CASES)
    print(f"{'case':20} {'file KiB':>9} {'seconds':>8} {'peak MiB':>9} {'exit':>5}  said")
    for name in names:
        row = run_case(name, args.limit, args.memory)
        seconds = "-" if row["seconds"] is None else f"{row['seconds']:.2f}"
        peak = "-" if row["peak"] is None else f"{row['peak']:.0f}"
        print(f"{row['case']:20} {row['bytes'] / 1024:9.0f} {seconds:>8} {peak:>9} "
              f"{row['exit']!s:>5}  {row['said']}", flush=True)
    return 0


if __name__ == "__main__":
    sys.exit(main())
