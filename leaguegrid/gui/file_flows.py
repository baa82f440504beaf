"""The window's file work: opening workbooks, CSVs and projects (read in the worker), column
matching, recent files, saving projects and exporting calendars, all through leaguegrid.app."""

from __future__ import annotations

import dataclasses
from collections.abc import Callable
from pathlib import Path
from typing import Any

from PySide6.QtWidgets import QFileDialog

from leaguegrid.app import export, league, project
from leaguegrid.app.export import ExportFailed, ExportTargets
from leaguegrid.core import wording
from leaguegrid.core.wording import plural
from leaguegrid.gui import commands
from leaguegrid.gui.export_dialog import ExportDialog
from leaguegrid.gui.mapping_dialog import MappingDialog, load_mapping, save_mapping
from leaguegrid.gui.notices import ask_save_discard, show_dialog
from leaguegrid.gui.worker import Job, call

EXPORTING = "Exporting"  # the export job's name, as the status line shows it

MAX_RECENT = 8
OPEN_FILTER = ("League workbooks and projects (*.xlsx *.csv *.leaguegrid);;"
               "Workbooks (*.xlsx);;CSV files (*.csv);;LeagueGrid projects (*.leaguegrid)")


class FileFlows:
    """Mixed into MainWindow: what the File menu does."""

    def open_dialog(self: Any) -> None:
        start = self.settings.value("lastFolder", str(Path.home()))
        path, _f = QFileDialog.getOpenFileName(self, "Open a league", str(start), OPEN_FILTER)
        if path:
            self.open_path(path)

    def settle_unsaved(self: Any, then: Callable[[], None], question: str | None = None) -> None:
        """Run `then` at once when nothing is unsaved; otherwise ask Save / Discard / Cancel
        first (in a box that never blocks) and run it after a save that worked or a Discard."""
        if not self.doc.unsaved:
            then()
            return

        def save() -> None:
            self.save_project()
            if not self.doc.unsaved:
                then()

        ask_save_discard(self, question or wording.unsaved_question("opening another league"),
                         save, then)

    def open_path(self: Any, path: str) -> None:
        """Open a workbook, a CSV or a project file, asking first when work is unsaved."""
        self.settle_unsaved(lambda: self._open_now(path))

    def _open_now(self: Any, path: str) -> None:
        """Open a workbook, a CSV or a project file (read in the worker thread)."""
        if path.lower().endswith(project.SUFFIX):
            self.open_project(path)
            return
        self.settings.setValue("lastFolder", str(Path(path).parent))
        self._read(path, load_mapping(self.settings, path))

    def reload(self: Any) -> None:
        """Read the workbook again from scratch (asking first when work is unsaved)."""
        if self.doc.path:
            path, mapping = self.doc.path, self.doc.mapping
            self.settle_unsaved(lambda: self._read(path, mapping),
                                wording.unsaved_question("reading the workbook again"))

    def _read(self: Any, path: str, mapping: dict[str, str] | None, after: Any = None,
              accept: Callable[[league.OpenedLeague], bool] | None = None) -> None:
        """Read `path` in the worker and show it (unless `accept` says no), then call `after`."""
        def done(opened: league.OpenedLeague) -> None:
            if accept is not None and not accept(opened):
                return
            if opened.notice and load_mapping(self.settings, path) == mapping:
                save_mapping(self.settings, path, {})  # remembered, no longer fits: forget it
            self._opened(path, opened.columns, opened)
            if after is not None:
                after()

        work = call(league.open_league, path, mapping, preview=True)
        self.runner.start(Job(f"Reading {Path(path).name}", work, done))

    def _opened(self: Any, path: str, mapping: dict[str, str] | None,
                opened: league.OpenedLeague) -> None:
        result, graph = opened.result, opened.graph
        self.report = None
        self.graph = graph
        self._user_rounds = False
        self._draw_after_count = None
        self.doc.graph = graph
        self.doc.set_result(path, result, opened.sha256, mapping)
        self.doc.project_path = None
        self._remember(path)
        lg = result.league
        if lg is not None:
            venues = len({f.venue for f in lg.fixtures if f.venue})
            clashes = graph.number_of_edges() if graph is not None else 0
            parts = [plural(len(lg.fixtures), "fixture"), plural(len(lg.teams), "team"),
                     plural(venues, "venue"), plural(clashes, "clash", "clashes")]
            summary = f"{Path(path).name}: {', '.join(parts)}."
        else:
            summary = f"{Path(path).name} could not be used: see the problems below."
        if not result.ok and lg is not None:
            summary += " It has errors: fix them in the workbook and reload (F5)."
        if opened.notice:
            summary = f"{opened.notice} {summary}"
        self.import_view.show_workbook(path, opened.preview or {}, list(result.problems),
                                       summary)
        self.fixtures_view.refresh()
        self.doc.set_graph(graph)
        self.counts_view.clear("Counting…" if result.ok else "No counts: the league has errors.")
        self.schedule_view.refresh()
        self.whatif_view.clear()
        self._update_enabled()
        self.stage_label.setText(summary)
        if not result.ok or opened.notice:
            self.tabs.setCurrentWidget(self.import_view)
        self.leagueOpened.emit(path)
        if result.ok:
            self.compute_counts()

    def edit_mapping(self: Any) -> None:
        """Match the workbook's columns to ours; the choice is remembered for this file."""
        if not self.doc.path:
            return
        path = self.doc.path
        dialog = MappingDialog(league.preview_sheets(path), self.doc.mapping or {}, self)

        def chosen() -> None:
            mapping = dialog.mapping()
            save_mapping(self.settings, path, mapping)
            self._read_keeping(path, mapping)

        dialog.accepted.connect(chosen)
        show_dialog(dialog)

    # recent files -----------------------------------------------------------------------
    def recent_files(self: Any) -> list[str]:
        """Recently opened files: absolute, each once, those that no longer exist left out."""
        value = self.settings.value("recent", [])
        if isinstance(value, str):
            value = [value]
        out: list[str] = []
        for item in value or []:
            path = str(Path(str(item)).expanduser().resolve())
            if path not in out and Path(path).is_file():
                out.append(path)
        return out

    def _remember(self: Any, path: str) -> None:
        path = str(Path(path).expanduser().resolve())
        items = [p for p in self.recent_files() if p != path]
        items.insert(0, path)
        self.settings.setValue("recent", items[:MAX_RECENT])
        self._fill_recent()

    def _fill_recent(self: Any) -> None:
        self.recent_menu.clear()
        for path in self.recent_files():
            act = self.recent_menu.addAction(Path(path).name)
            act.setToolTip(path)
            act.setStatusTip(path)
            act.triggered.connect(lambda _c=False, p=path: self.open_path(p))
        self.recent_menu.setEnabled(bool(self.recent_files()))

    # projects ---------------------------------------------------------------------------
    def save_project(self: Any) -> None:
        if self.doc.project_path:
            self._write_project(self.doc.project_path)
        else:
            self.save_project_as()

    def save_project_as(self: Any) -> None:
        if not self.doc.path:
            return
        suggested = str(Path(self.doc.path).with_suffix(project.SUFFIX))
        path, _f = QFileDialog.getSaveFileName(self, "Save project", suggested,
                                               f"LeagueGrid projects (*{project.SUFFIX})")
        if path:
            if not path.endswith(project.SUFFIX):
                path += project.SUFFIX
            self._write_project(path)

    def _write_project(self: Any, path: str) -> None:
        try:
            project.save_project(path, self.doc.project(self.rounds_box.value()))
        except OSError as err:  # a WriteError: "could not write <path>: <why>", in a box
            self._warn(str(err), "The project could not be saved.")
            return
        self.doc.project_path = path
        self.doc.mark_saved()
        self._remember(path)
        self.stage_label.setText(f"Project saved to {path}.")

    def open_project(self: Any, path: str) -> None:
        """Read the project file in the worker thread, then its workbook, then lay it on."""
        def read(found: project.ProjectRead) -> None:
            if found.project is None:
                self._warn(str(found.problem))
                return
            data = found.project
            workbook = data.workbook_path(path)

            def restore() -> None:
                self._lay_project(data, workbook, saved=True)
                self.doc.project_path = path
                self._remember(path)

            self._read(workbook, data.mapping or None, after=restore)

        work = call(project.try_read_project, path)
        self.runner.start(Job(f"Reading {Path(path).name}", work, read))

    def _lay_project(self: Any, data: project.Project, workbook: str, saved: bool,
                     text: str = "Restore recovered work") -> None:
        """Lay a project's edits and schedule onto the league just read from `workbook`: as
        saved work, or (`saved` false) as an undoable change that leaves the work unsaved."""
        current = league.sha256_of(workbook) if Path(workbook).is_file() else None
        if saved:
            warning = self.doc.restore(data, current)
        else:
            restored = project.restore(data, self.doc.league, current)
            self.doc.undo.push(commands.StateCommand(self.doc, restored.edits,
                                                     restored.schedule, text))
            warning = restored.warning
        if data.rounds:
            self._set_rounds(data.rounds, user=True)
        if warning:
            self._warn(warning)
        self.schedule_view.refresh()
        self.clash_view.colour_by(self.doc.schedule)
        self._update_enabled()

    def _read_keeping(self: Any, path: str, mapping: dict[str, str] | None,
                      notice: Callable[[bool], str] | None = None) -> None:
        """Read the open workbook again (it changed, or its matching did) keeping the pins,
        edits and schedule where their fixtures still exist. A read that cannot be used does
        not replace a league holding unsaved work; `notice(kept)` is the status line after."""
        keep = dataclasses.replace(self.doc.project(self.rounds_box.value()), sha256=None)
        keep.saved_schedule = project.to_json(keep, path)["schedule"]
        unsaved, project_path = self.doc.unsaved, self.doc.project_path
        name = Path(path).name

        def accept(opened: league.OpenedLeague) -> bool:
            if opened.result.ok or not unsaved:
                return True
            self._warn(wording.not_reloaded_notice(name, [str(p) for p in opened.result.errors]))
            return False

        def lay() -> None:
            self.doc.project_path = project_path
            if (unsaved or keep.schedule is not None) and self.doc.usable:
                self._lay_project(keep, path, saved=not unsaved,
                                  text="Keep the edits after reading the workbook again")
            if notice is not None:  # said in the status line and above the workbook, which
                said = notice(unsaved)  # keeps it once the count's news has replaced the first
                self.stage_label.setText(said)
                self.import_view.heading.setText(f"{said} {self.import_view.heading.text()}")

        self._read(path, mapping, after=lay, accept=accept)

    # export -----------------------------------------------------------------------------
    def export_dialog(self: Any) -> None:
        if self.doc.schedule is None:
            return
        dialog = ExportDialog(self, self.doc.working_league(), self.doc.schedule,
                              self.settings)
        dialog.accepted.connect(lambda: self.export(dialog.choices()))
        show_dialog(dialog)

    def export(self: Any, choices: dict[str, str | None]) -> None:
        """Write what `choices` names (xlsx, csv: file paths; ics: a folder) as a job of the
        runner, after any count or draw running (progress and Cancel as for them); the paths
        written end in `last_export`."""
        lg, graph = self.working()
        schedule = self.doc.schedule
        if lg is None or schedule is None:
            return
        targets = ExportTargets(**{kind: Path(choices[kind]) for kind in ("xlsx", "csv", "ics")
                                   if choices.get(kind)})
        fewest = self.report.min_rounds if self.report is not None else None

        def work(hooks: Any) -> export.ExportOutcome | ExportFailed:
            try:
                return export.export_schedule(lg, graph, schedule, targets, fewest,
                                              hooks=hooks)
            except ExportFailed as err:  # it says why, and leaves no half-written file
                return err

        self._start_when_free(Job(EXPORTING, work, self._exported))

    def _exported(self: Any, outcome: export.ExportOutcome | ExportFailed) -> None:
        written = [str(p) for p in outcome.written]
        self.last_export = written
        if isinstance(outcome, ExportFailed):
            self._warn(str(outcome), "Export failed.")
            self.stage_label.setText(f"Export failed: {outcome}")
            return
        self.stage_label.setText(f"Exported {plural(len(written), 'file')}.")
