"""The command line run in-process, as the `leaguegrid` program runs it."""

from __future__ import annotations

import pytest

from leaguegrid.launch import main


@pytest.fixture
def cli(capsys):
    """Run the command line in-process: cli(*argv) -> (exit code, stdout, stderr)."""

    def run(*argv: str) -> tuple[int, str, str]:
        code = main(list(argv))
        out, err = capsys.readouterr()
        return code, out, err

    return run
