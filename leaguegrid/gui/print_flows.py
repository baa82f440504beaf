"""File > Print (with a preview) and File > Export PDF: the schedule by round, a page per team
and per venue (leaguegrid.app.printout), laid out and painted by gui.print_pages. The PDF is
made, painted and written as a job of the window's runner (progress, Cancel), off the GUI
thread (Qt's "Thread-Support in Qt Modules": QPainter may paint in a thread onto QImage,
QPrinter and QPicture; QPdfWriter shares QPrinter's PDF engine); the preview's pages are made
as a job too, and Qt's preview paints them in the GUI thread."""

from __future__ import annotations

from dataclasses import dataclass
from pathlib import Path
from typing import Any

from PySide6.QtPrintSupport import QPrinter, QPrintPreviewDialog

from leaguegrid.app.export import ExportFailed
from leaguegrid.app.printout import Printout, build_printout, write_pdf
from leaguegrid.core.model import League, Schedule
from leaguegrid.core.wording import plural
from leaguegrid.engine import Hooks
from leaguegrid.gui.notices import show_dialog
from leaguegrid.gui.pdf_dialog import PdfDialog, chosen_paper
from leaguegrid.gui.print_pages import page_layout, paint, pdf_bytes
from leaguegrid.gui.worker import Job
from leaguegrid.scheduling.dates import DatesError

WRITING_PDF = "Writing the PDF"
PREPARING = "Preparing the pages"


@dataclass(frozen=True)
class PdfWritten:
    """What a PDF job did: the file and its pages, or why it could not be written."""

    path: Path
    pages: int = 0
    problem: str | None = None


def pdf_job(league: League, schedule: Schedule, paper: str, path: str,
            hooks: Hooks) -> PdfWritten:
    """Make the printout, paint it on `paper` and write it to `path` (a job of the runner)."""
    try:
        printout = build_printout(league, schedule)
        data, pages = pdf_bytes(printout, paper, hooks)
        hooks.check()
        written = write_pdf(path, data, league)
    except (DatesError, ExportFailed) as err:
        return PdfWritten(Path(path), problem=str(err))
    return PdfWritten(written, pages)


class PrintFlows:
    """Printing and the PDF for the window's schedule (mixed into the main window)."""

    def print_preview(self: Any) -> None:
        """Make the printout as a job, then show the print preview (its Print button prints);
        paper from the locale or the last choice, changeable in the preview's page setup."""
        league, schedule = self.doc.working_league(), self.doc.schedule
        if league is None or schedule is None:
            return

        def work(_hooks: Hooks) -> Printout | str:
            try:
                return build_printout(league, schedule)
            except DatesError as err:
                return str(err)

        self._start_when_free(Job(PREPARING, work, self._show_preview))

    def _show_preview(self: Any, printout: Printout | str) -> None:
        if isinstance(printout, str):
            self._warn(printout, "The schedule cannot be printed.")
            return
        printer = QPrinter(QPrinter.PrinterMode.HighResolution)
        printer.setPageLayout(page_layout(chosen_paper(self.settings)))
        printer.setDocName(printout.league)
        dialog = QPrintPreviewDialog(printer, self)
        dialog.setWindowTitle("Print the schedule")
        dialog.printer = printer  # the dialog does not own it: kept alive with the dialog
        dialog.paintRequested.connect(lambda device: paint(printout, device))
        show_dialog(dialog)

    def export_pdf_dialog(self: Any) -> None:
        league, schedule = self.doc.working_league(), self.doc.schedule
        if league is None or schedule is None:
            return
        dialog = PdfDialog(self, league, schedule, self.settings)
        dialog.accepted.connect(lambda: self.export_pdf(*dialog.choices()))
        show_dialog(dialog)

    def export_pdf(self: Any, path: str, paper: str) -> None:
        """Make, paint and write the PDF at `path` on `paper` as a job; the status line says
        how many pages were written, or why not."""
        league, schedule = self.doc.working_league(), self.doc.schedule
        if league is None or schedule is None:
            return

        def work(hooks: Hooks) -> PdfWritten:
            return pdf_job(league, schedule, paper, path, hooks)

        self._start_when_free(Job(WRITING_PDF, work, self._pdf_written))

    def _start_when_free(self: Any, job: Job) -> None:
        """Start `job` once the runner has nothing to do (a new job would cancel a count or a
        draw that is running), saying so in the status line meanwhile."""
        if not self.runner.busy:
            self.runner.start(job)
            return
        self.stage_label.setText(f"{job.name}: waiting for {self.runner.current_name} to end…")

        def free(busy: bool) -> None:
            if not busy:
                self.runner.busyChanged.disconnect(free)
                self.runner.start(job)

        self.runner.busyChanged.connect(free)

    def _pdf_written(self: Any, outcome: PdfWritten) -> None:
        if outcome.problem is not None:
            self._warn(outcome.problem, "The PDF was not written.")
            return
        self.last_export = [str(outcome.path)]
        self.stage_label.setText(f"Wrote {plural(outcome.pages, 'page')} to {outcome.path}.")
