"""The small questions the window asks about fixtures: which round, which other fixture."""

from __future__ import annotations

from collections.abc import Callable, Sequence

from PySide6.QtWidgets import QInputDialog, QWidget

HIGHEST_ROUND = 999
Partner = Callable[[QWidget, str, Sequence[str]], str | None]  # asks for a fixture to pair


def ask_round(parent: QWidget, title: str, label: str, current: int,
              highest: int = HIGHEST_ROUND) -> int | None:
    """A round (1..highest) for the fixture `label`, starting at `current`; None on Cancel."""
    k, ok = QInputDialog.getInt(parent, title, f"Round for {label}:", current, 1, highest)
    return k if ok else None


def pick_fixture(parent: QWidget, title: str, prompt: str,
                 labels: Sequence[str]) -> str | None:
    """One of `labels` (in the order given), or None on Cancel."""
    choice, ok = QInputDialog.getItem(parent, title, prompt, list(labels), 0, False)
    return choice if ok and choice else None


def pick_tie_partner(parent: QWidget, label: str, labels: Sequence[str]) -> str | None:
    """The fixture to share a round with `label`, or None on Cancel."""
    return pick_fixture(parent, "Play together", f"Fixture to share a round with {label}:",
                        labels)


def pick_clash_partner(parent: QWidget, label: str, labels: Sequence[str]) -> str | None:
    """The fixture that may not share a round with `label` (an added clash), or None."""
    return pick_fixture(parent, "Add a clash",
                        f"Fixture that may not share a round with {label}:", labels)


def pick_pair(parent: QWidget, title: str, labels: Sequence[str], partner: Partner,
              first: str | None = None) -> tuple[str, str] | None:
    """`first` (asked for under `title` when None) and the fixture `partner` asks for, from
    the other `labels`; None on Cancel."""
    first = first or pick_fixture(parent, title, "First fixture:", labels)
    if not first:
        return None
    second = partner(parent, first, [x for x in labels if x != first])
    return (first, second) if second else None
