"""What a plain (non-editable) `pip install .` ships: every package folder, the demo workbooks."""

from __future__ import annotations

import tomllib
from pathlib import Path

import leaguegrid
from leaguegrid.app.demos import DEMO_PACKAGE, demo_leagues

ROOT = Path(__file__).resolve().parent.parent
PROJECT = tomllib.loads((ROOT / "pyproject.toml").read_text(encoding="utf-8"))
SETUPTOOLS = PROJECT["tool"]["setuptools"]


def test_every_package_folder_is_listed_for_installation():
    folders = {
        ".".join(p.parent.relative_to(ROOT).parts)
        for p in (ROOT / "leaguegrid").rglob("__init__.py")
    }
    assert folders | {DEMO_PACKAGE} == set(SETUPTOOLS["packages"])


def test_the_demo_workbooks_are_package_data_built_from_the_checkout_folder():
    assert SETUPTOOLS["package-dir"][DEMO_PACKAGE] == "demo_leagues"
    assert SETUPTOOLS["package-data"][DEMO_PACKAGE] == ["*.xlsx"]
    shipped = sorted(p.name for p in demo_leagues())
    assert shipped == sorted(p.name for p in (ROOT / "demo_leagues").glob("*.xlsx"))
    assert len(shipped) >= 3 and all(" " not in name for name in shipped)


def test_the_version_has_one_source():
    assert PROJECT["project"]["dynamic"] == ["version"]
    assert SETUPTOOLS["dynamic"]["version"] == {"attr": "leaguegrid.__version__"}
    assert leaguegrid.__version__.count(".") == 2
