"""Undoable edits: pins, ties, waived and added clashes, drawn schedules and moves in them,
and recovered or kept work: every change the coordinator makes is one of these."""

from __future__ import annotations

import networkx as nx
from PySide6.QtGui import QUndoCommand

from leaguegrid.app import editing
from leaguegrid.app.editing import Edits
from leaguegrid.core.model import League, Reason, Schedule
from leaguegrid.gui.document import LeagueDocument

_MISSING = object()


class PinCommand(QUndoCommand):
    """Pin a fixture to a round (or unpin it with `round_=None`)."""

    def __init__(self, doc: LeagueDocument, label: str, round_: int | None) -> None:
        text = f"Pin {label} to round {round_}" if round_ is not None else f"Unpin {label}"
        super().__init__(text)
        self.doc, self.label, self.round = doc, label, round_
        self.before = doc.edits.pins.get(label, _MISSING)

    def redo(self) -> None:
        self.doc.edits.pins[self.label] = self.round
        self.doc.changed_edits()

    def undo(self) -> None:
        if self.before is _MISSING:
            self.doc.edits.pins.pop(self.label, None)
        else:
            self.doc.edits.pins[self.label] = self.before
        self.doc.changed_edits()


class _PairCommand(QUndoCommand):
    """Append a pair of fixtures to one of the edits' lists of pairs; undo removes it."""

    edits_field = ""  # the Edits attribute holding the pairs: "ties" or "added"

    def __init__(self, doc: LeagueDocument, pair: tuple[str, str], text: str) -> None:
        super().__init__(text)
        self.doc, self.pair = doc, pair

    def _pairs(self) -> list[tuple[str, str]]:
        return getattr(self.doc.edits, self.edits_field)

    def redo(self) -> None:
        self._pairs().append(self.pair)
        self.doc.changed_edits()

    def undo(self) -> None:
        self._pairs().remove(self.pair)
        self.doc.changed_edits()


class TieCommand(_PairCommand):
    """Tie two fixtures: they must share a round."""

    edits_field = "ties"

    def __init__(self, doc: LeagueDocument, first: str, second: str) -> None:
        super().__init__(doc, (first, second), f"Keep {first} together with {second}")


class ScheduleCommand(QUndoCommand):
    """Put another schedule in place of the one shown (a draw, a re-plan); undo brings the one
    before back."""

    def __init__(self, doc: LeagueDocument, after: Schedule | None, text: str) -> None:
        super().__init__(text)
        self.doc, self.before, self.after = doc, doc.schedule, after

    def redo(self) -> None:
        self.doc.set_schedule(self.after)

    def undo(self) -> None:
        self.doc.set_schedule(self.before)


class MoveCommand(ScheduleCommand):
    """Move a fixture to another round of the chosen schedule (app.editing.move_fixture: the
    schedule after the move is a new one, marked as edited by hand)."""

    def __init__(self, doc: LeagueDocument, label: str, to_round: int, league: League,
                 graph: nx.Graph) -> None:
        before = doc.schedule
        assert before is not None
        from_round = before.assignment[label]
        after = editing.move_fixture(league, graph, before, label, to_round).schedule
        super().__init__(doc, after, f"Move {label} from round {from_round} to round {to_round}")


class StateCommand(QUndoCommand):
    """Put edits and a schedule in place together (recovered work, or the work kept when the
    workbook is read again); undo brings back what was there before."""

    def __init__(self, doc: LeagueDocument, edits: Edits, schedule: Schedule | None,
                 text: str) -> None:
        super().__init__(text)
        self.doc = doc
        self.before = (doc.edits, doc.schedule)
        self.after = (edits, schedule)

    def _put(self, state: tuple[Edits, Schedule | None]) -> None:
        self.doc.edits = state[0]
        self.doc.set_schedule(state[1])
        self.doc.changed_edits()

    def redo(self) -> None:
        self._put(self.after)

    def undo(self) -> None:
        self._put(self.before)


class WaiveCommand(QUndoCommand):
    """Waive a clash reason (or take the waiver back with `waive=False`)."""

    def __init__(self, doc: LeagueDocument, reason: Reason, waive: bool = True) -> None:
        super().__init__(f"{'Waive' if waive else 'Restore'} clash: {reason}")
        self.doc, self.reason, self.waive = doc, reason, waive

    def _apply(self, waive: bool) -> None:
        waived = self.doc.edits.waived
        if waive and self.reason not in waived:
            waived.append(self.reason)
        elif not waive and self.reason in waived:
            waived.remove(self.reason)
        self.doc.changed_edits()

    def redo(self) -> None:
        self._apply(self.waive)

    def undo(self) -> None:
        self._apply(not self.waive)


class AddClashCommand(_PairCommand):
    """Add a clash between two fixtures (a split: they must not share a round)."""

    edits_field = "added"

    def __init__(self, doc: LeagueDocument, first: str, second: str) -> None:
        super().__init__(doc, (first, second), f"Add a clash: {first} and {second}")
