"""Build LeagueGrid as a one-folder desktop app with PyInstaller, then check the app it built.

    python packaging/build_app.py [--smoke]

It makes its own build environment (packaging/build/venv, with LeagueGrid installed from this
checkout as a plain, non-editable package, and PyInstaller), so it runs the same from any
Python 3.11+ on Windows, macOS or Linux. The app lands in packaging/dist/LeagueGrid/; nothing
built is committed. `--smoke` then runs the built app's `demos` and `check` on every bundled
demo.
"""

from __future__ import annotations

import argparse
import subprocess
import sys
from pathlib import Path

HERE = Path(__file__).resolve().parent
CHECKOUT = HERE.parent
PYINSTALLER = "pyinstaller>=6.10"


def build_python() -> Path:
    """The build environment's Python, created and filled on first use."""
    venv = HERE / "build" / "venv"
    python = venv / ("Scripts/python.exe" if sys.platform == "win32" else "bin/python")
    if not python.exists():
        subprocess.run([sys.executable, "-m", "venv", str(venv)], check=True)
    subprocess.run([str(python), "-m", "pip", "install", "-q", str(CHECKOUT), PYINSTALLER],
                   check=True)
    return python


def folder_size(folder: Path) -> int:
    """Bytes in every file under `folder`."""
    files = (p for p in folder.rglob("*") if p.is_file() and not p.is_symlink())
    return sum(p.stat().st_size for p in files)


def smoke(app: Path) -> int:
    """The built app lists its demos and checks each one; the first failure's code, or 0."""
    listed = subprocess.run([str(app), "demos"], capture_output=True, text=True, check=False)
    if listed.returncode != 0 or not listed.stdout.strip():
        print(listed.stderr or "the app listed no demo", file=sys.stderr)
        return listed.returncode or 1
    for demo in listed.stdout.split():
        code = subprocess.run([str(app), "check", demo], capture_output=True,
                              check=False).returncode
        print(f"check {Path(demo).name}: exit {code}")
        if code != 0:
            return code
    return 0


def main() -> int:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--smoke", action="store_true", help="run the built app's checks")
    args = parser.parse_args()
    built = subprocess.run(
        [str(build_python()), "-m", "PyInstaller", "--noconfirm", "--clean",
         "--distpath", str(HERE / "dist"), "--workpath", str(HERE / "build" / "work"),
         str(HERE / "leaguegrid.spec")],
        cwd=HERE, check=False,
    )
    if built.returncode != 0:
        return built.returncode
    folder = HERE / "dist" / "LeagueGrid"
    print(f"Built {folder} ({folder_size(folder) / 1e6:.0f} MB)")
    if not args.smoke:
        return 0
    name = "LeagueGrid.exe" if sys.platform == "win32" else "LeagueGrid"
    return smoke(folder / name)


if __name__ == "__main__":
    sys.exit(main())
