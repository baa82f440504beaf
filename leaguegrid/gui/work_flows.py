"""The window's long work: counting, drawing schedules and ranking clash reasons, each a use
case of leaguegrid.app run by the Runner (in the engine process by default, else a thread)."""

from __future__ import annotations

import html
import random
from pathlib import Path
from typing import Any

import networkx as nx
from PySide6.QtCore import QTimer
from PySide6.QtWidgets import QFileDialog, QInputDialog

from leaguegrid.app import counting, league, planning
from leaguegrid.app import whatif as what
from leaguegrid.app.defaults import BEST_OF, COUNT_BUDGET, PLAN_BUDGET, WHATIF_BUDGET
from leaguegrid.core import wording
from leaguegrid.gui import commands, procworker
from leaguegrid.gui.notices import inform
from leaguegrid.gui.worker import Job, JobFn, call

COUNTING = "Counting"  # the count's job name


class WorkFlows:
    """Mixed into MainWindow: what the League menu does."""

    def working(self: Any) -> tuple[Any, Any]:
        """The league with the window's edits, and its clash graph without waived reasons."""
        lg = self.doc.working_league()
        return lg, league.clash_graph(lg, self.doc.edits.waived)

    def _engine_in_process(self: Any) -> bool:
        return self.settings.value("engineProcess", "true") in (True, "true", "1", 1)

    def _engine_job(self: Any, target: Any, *args: Any, **kwargs: Any) -> JobFn:
        """A use case as a Runner job: in the engine process (the default) or in a thread."""
        if self._engine_in_process():
            return procworker.remote(target, *args, **kwargs)
        return call(target, *args, **kwargs)

    def _count_budget(self: Any) -> float:
        return float(self.settings.value("countBudget", COUNT_BUDGET))

    def compute_counts(self: Any) -> None:
        """Count in the worker; what passes the budget is estimated (and labelled so)."""
        if not self.doc.usable:
            return
        lg, graph = self.working()
        if self.doc.graph is None or not nx.utils.graphs_equal(self.doc.graph, graph):
            self.doc.set_graph(graph)
        self.graph = graph
        work = self._engine_job(counting.count_league, lg, graph)
        self.runner.start(Job(COUNTING, work, self._counts_done, budget=self._count_budget()))

    def budget_dialog(self: Any) -> None:
        seconds, ok = QInputDialog.getInt(
            self, "Time allowed for counting",
            "Seconds a count may take (what is not finished by then is shown as a labelled "
            "estimate or as not computed):", int(self._count_budget()), 1, 24 * 3600)
        if ok:
            self.settings.setValue("countBudget", seconds)

    def _counts_done(self: Any, report: counting.CountReport) -> None:
        self.report = report
        note = wording.rules_note(planning.generator_only_rules(self.doc.working_league()))
        self.counts_view.show_report(report, note)
        if report.min_rounds is not None and not self._user_rounds:
            self._set_rounds(report.min_rounds, user=False)
        self.stage_label.setText(
            f"Counted: fewest rounds {report.min_rounds}." if report.complete else
            "Counting stopped before the end; what is missing is marked.")
        self.countsReady.emit(report)
        if self._draw_after_count is not None:
            pending, self._draw_after_count = self._draw_after_count, None
            QTimer.singleShot(0, lambda: self.draw_schedule(*pending))

    def _set_rounds(self: Any, k: int, user: bool) -> None:
        self.rounds_box.blockSignals(True)
        self.rounds_box.setValue(k)
        self.rounds_box.blockSignals(False)
        self._user_rounds = user

    def _rounds_edited(self: Any, _k: int) -> None:
        self._user_rounds = True

    def _rounds_from_table(self: Any, k: int) -> None:
        self._set_rounds(k, user=True)

    # schedules --------------------------------------------------------------------------
    def draw_schedule(self: Any, seed: int | None = None, draws: int = 1,
                      uniform: bool = False) -> None:
        """Make a schedule for the rounds in the toolbar (a new seed unless one is given):
        optimised for breaks, or a uniform draw."""
        if not self.doc.usable:
            return
        if self.runner.current_name == COUNTING and not self._user_rounds:
            # the fewest rounds is on its way: draw for it once the count has found it
            self._draw_after_count = (seed, draws, uniform)
            self.stage_label.setText("The schedule is drawn as soon as the count has found "
                                     "the fewest rounds.")
            return
        k = self.rounds_box.value()
        seed = random.SystemRandom().randrange(1, 2**31) if seed in (None, False) else seed
        lg, graph = self.working()
        work = self._engine_job(planning.make_schedule, lg, graph, k, seed, draws,
                                uniform=uniform)
        label = "Drawing a schedule" if draws == 1 else f"Drawing {draws} schedules"
        self.runner.start(Job(label, work, self._schedule_done, budget=PLAN_BUDGET))

    def draw_uniform(self: Any) -> None:
        """Any one valid schedule, each equally likely (a new seed)."""
        self.draw_schedule(uniform=True)

    def redraw_same_seed(self: Any) -> None:
        schedule = self.doc.schedule
        if schedule is not None and schedule.seed is not None:
            self.draw_schedule(schedule.seed, uniform=schedule.method == "uniform")

    def best_of_dialog(self: Any) -> None:
        n, ok = QInputDialog.getInt(self, "Best of many", "Schedules to draw:",
                                    int(self.settings.value("bestOf", BEST_OF)), 2, 100000)
        if ok:
            self.settings.setValue("bestOf", n)
            self.draw_schedule(draws=n)

    def replan_dialog(self: Any) -> None:
        """Plan again from a schedule written before (its CSV), keeping what the rules allow."""
        if not self.doc.usable:
            return
        start = str(Path(self.doc.path).parent) if self.doc.path else ""
        path, _f = QFileDialog.getOpenFileName(self, "Re-plan from an earlier schedule", start,
                                               "Schedule CSV (*.csv)")
        if path:
            self.replan_from(path)

    def replan_from(self: Any, path: str) -> None:
        """Keep the schedule in `path` where every rule allows; say what moved, club by club."""
        lg, graph = self.working()
        previous = planning.read_previous(path, lg)
        if not previous.ok:
            self._warn("\n".join(str(p) for p in previous.problems),
                       f"{Path(path).name} cannot be used to re-plan.")
            return
        k = self.rounds_box.value()
        seed = random.SystemRandom().randrange(1, 2**31)
        work = self._engine_job(planning.replan, lg, graph, k, previous.rounds, seed)
        self.runner.start(Job("Re-planning", work, self._replan_done, budget=PLAN_BUDGET))

    def _replan_done(self: Any, done: planning.Replan) -> None:
        self._schedule_done(done.outcome, "Re-plan from an earlier schedule")
        if done.outcome.schedule is None:
            return
        moved = wording.plural(len(done.moves), "fixture")
        self.stage_label.setText(f"Re-planned: {moved} moved.")
        lines = [f"<b>{html.escape(club)}</b><br>" + "<br>".join(html.escape(x) for x in rows)
                 for club, rows in done.by_club.items()]
        inform(self, "Re-planned", f"{moved} moved." + (
            "<p>" + "</p><p>".join(lines) + "</p>" if lines else ""))

    def _schedule_done(self: Any, outcome: planning.PlanOutcome,
                       text: str = "Draw a schedule") -> None:
        """Show a drawn (or re-planned) schedule, undoably; a failed draw keeps the one shown."""
        schedule = outcome.schedule
        if schedule is not None:
            self.doc.undo.push(commands.ScheduleCommand(self.doc, schedule, text))
        self.schedule_view.refresh(outcome.message)
        self.clash_view.colour_by(self.doc.schedule)
        if schedule is not None:
            self.tabs.setCurrentWidget(self.schedule_view)
            rounds = wording.plural(schedule.rounds, "round")
            self.stage_label.setText(f"Schedule drawn for {rounds} (seed {schedule.seed}).")
        else:
            self.stage_label.setText(outcome.message)
        self.scheduleReady.emit(schedule)

    # what-if ----------------------------------------------------------------------------
    def compute_whatif(self: Any) -> None:
        """Rank the clash reasons by what waiving each would gain, for the toolbar's rounds."""
        if not self.doc.usable:
            return
        k = self.rounds_box.value()
        lg, graph = self.working()
        work = self._engine_job(what.what_if, lg, graph, k)

        def done(outcome: what.WhatIfOutcome) -> None:
            self.whatif_view.show_result(k, outcome.report, outcome.reasons)
            self.tabs.setCurrentWidget(self.whatif_view)
            self.stage_label.setText(f"Clash reasons ranked for {wording.plural(k, 'round')}.")

        self.runner.start(Job("Ranking clash reasons", work, done, budget=WHATIF_BUDGET))

