"""The command line's exit codes, the same for every command, and its usage error."""

OK, INPUT_PROBLEMS, USAGE, IMPOSSIBLE, WRITE_FAILED, STOPPED = 0, 1, 2, 3, 4, 5
PLAN_EXITS = {"found": OK, "impossible": IMPOSSIBLE, "budget": STOPPED, "cancelled": STOPPED}


class UsageError(Exception):
    """A command line that cannot be carried out as asked (exit 2)."""
