"""The code base stays ruff clean (the rules are in pyproject.toml)."""

import shutil
import subprocess
import sys
from pathlib import Path

import pytest

ROOT = Path(__file__).resolve().parents[1]


def test_ruff_check_is_clean() -> None:
    ruff = shutil.which("ruff") or shutil.which("ruff", path=str(Path(sys.executable).parent))
    if ruff is None:
        pytest.fail("ruff is not installed; it comes with the test extra: pip install -e '.[test]'")
    done = subprocess.run([ruff, "check", "--no-cache", str(ROOT)], capture_output=True,
                          text=True, check=False)
    assert done.returncode == 0, done.stdout + done.stderr
