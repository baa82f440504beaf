"""The window's edits: pins, ties, added and waived clashes and moves, each an undo command."""

from __future__ import annotations

from typing import Any

from leaguegrid.gui import commands
from leaguegrid.gui.pickers import (
    Partner,
    ask_round,
    pick_clash_partner,
    pick_pair,
    pick_tie_partner,
)


class EditFlows:
    """Mixed into MainWindow: what the Edit menu and the views' edit requests do."""

    def move_fixture(self: Any, label: str, to_round: int) -> None:
        if self.doc.schedule is None or self.doc.schedule.assignment.get(label) == to_round:
            return
        self.doc.undo.push(commands.MoveCommand(self.doc, label, to_round, *self.working()))
        self.clash_view.colour_by(self.doc.schedule)

    def pin_fixture(self: Any, label: str, round_: int | None) -> None:
        self.doc.undo.push(commands.PinCommand(self.doc, label, round_))

    def tie_fixtures(self: Any, first: str, second: str) -> None:
        if first != second and (first, second) not in self.doc.edits.ties:
            self.doc.undo.push(commands.TieCommand(self.doc, first, second))

    def pin_selected(self: Any) -> None:
        label = self.doc.selected
        if label is None:
            self.stage_label.setText("Select a fixture first (in the fixtures, graph or "
                                     "schedule view).")
            return
        schedule = self.doc.schedule
        if schedule is not None and label in schedule.assignment:
            self.pin_fixture(label, schedule.assignment[label])
            return
        k = ask_round(self, "Pin fixture", label, 1)
        if k is not None:
            self.pin_fixture(label, k)

    def unpin_selected(self: Any) -> None:
        label = self.doc.selected
        if label is not None and self.doc.pin_of(label) is not None:
            self.pin_fixture(label, None)

    def _ask_pair(self: Any, title: str, partner: Partner) -> tuple[str, str] | None:
        """The selected fixture (asked for when none is) and the other one `partner` asks for."""
        lg = self.doc.league
        if lg is None:
            return None
        return pick_pair(self, title, [f.label for f in lg.fixtures], partner, self.doc.selected)

    def tie_selected(self: Any) -> None:
        pair = self._ask_pair("Play together", pick_tie_partner)
        if pair:
            self.tie_fixtures(*pair)

    def add_clash_dialog(self: Any) -> None:
        pair = self._ask_pair("Add a clash", pick_clash_partner)
        if pair:
            self.add_clash(*pair)

    def add_clash(self: Any, first: str, second: str) -> None:
        if first != second:
            self.doc.undo.push(commands.AddClashCommand(self.doc, first, second))

    def waive_reason(self: Any, reason: Any, waive: bool) -> None:
        self.doc.undo.push(commands.WaiveCommand(self.doc, reason, waive))
