"""The demo league workbooks that ship inside the package (read with importlib.resources), and
the blank league to start from."""

from __future__ import annotations

from importlib import resources
from pathlib import Path

from leaguegrid.io.write import blank_league

DEMO_PACKAGE = "leaguegrid.demos"
DEFAULT_DEMO = "season.xlsx"


def demo_leagues() -> list[Path]:
    """Every bundled demo workbook, as an absolute path, sorted by name."""
    folder = resources.files(DEMO_PACKAGE)
    return sorted(Path(str(item)).resolve() for item in folder.iterdir()
                  if item.name.endswith(".xlsx"))


def default_demo() -> Path:
    """The demo league the window opens when started without a file."""
    by_name = {path.name: path for path in demo_leagues()}
    return by_name.get(DEFAULT_DEMO) or next(iter(by_name.values()))


def write_blank_league(path: str | Path) -> Path:
    """A new blank league workbook to fill in (FileExistsError rather than overwrite)."""
    return blank_league.write_blank_league(path)
