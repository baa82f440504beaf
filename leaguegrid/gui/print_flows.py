"""File > Print (with a preview) and File > Export PDF: the schedule by round, a page per team
and per venue (leaguegrid.app.printout), laid out and painted by gui.print_pages. The PDF is
painted and written as a job of the window's runner (progress, Cancel), off the GUI thread."""

from __future__ import annotations

from dataclasses import dataclass
from pathlib import Path
from typing import Any

from PySide6.QtPrintSupport import QPrinter, QPrintPreviewDialog

from leaguegrid.app.export import ExportFailed
from leaguegrid.app.printout import Printout, build_printout, write_pdf
from leaguegrid.core.wording import plural
from leaguegrid.engine import Hooks
from leaguegrid.gui.notices import show_dialog
from leaguegrid.gui.pdf_dialog import PdfDialog, chosen_paper
from leaguegrid.gui.print_pages import page_layout, paint, pdf_bytes
from leaguegrid.gui.worker import Job
from leaguegrid.scheduling.dates import DatesError

WRITING_PDF = "Writing the PDF"


@dataclass(frozen=True)
class PdfWritten:
    """What a PDF job did: the file and its pages, or why it could not be written."""

    path: Path
    pages: int = 0
    problem: str | None = None


def pdf_job(printout: Printout, paper: str, path: str, league: Any, hooks: Hooks) -> PdfWritten:
    """Paint `printout` on `paper` and write it to `path` (run by the window's runner)."""
    data, pages = pdf_bytes(printout, paper, hooks)
    hooks.check()
    try:
        written = write_pdf(path, data, league)
    except ExportFailed as err:
        return PdfWritten(Path(path), problem=str(err))
    return PdfWritten(written, pages)


class PrintFlows:
    """Printing and the PDF for the window's schedule (mixed into the main window)."""

    def printout(self: Any) -> Printout | None:
        """The window's schedule made ready for paper, or None (said why) when it cannot be."""
        league, schedule = self.doc.working_league(), self.doc.schedule
        if league is None or schedule is None:
            return None
        try:
            return build_printout(league, schedule)
        except DatesError as err:
            self._warn(str(err), "The schedule cannot be printed.")
            return None

    def print_preview(self: Any) -> QPrintPreviewDialog | None:
        """The print preview (its Print button prints); paper from the locale or the last
        choice, changeable in the preview's page setup."""
        printout = self.printout()
        if printout is None:
            return None
        printer = QPrinter(QPrinter.PrinterMode.HighResolution)
        printer.setPageLayout(page_layout(chosen_paper(self.settings)))
        printer.setDocName(printout.league)
        dialog = QPrintPreviewDialog(printer, self)
        dialog.setWindowTitle("Print the schedule")
        dialog.printer = printer  # the dialog does not own it: kept alive with the dialog
        dialog.paintRequested.connect(lambda device: paint(printout, device))
        show_dialog(dialog)
        return dialog

    def export_pdf_dialog(self: Any) -> None:
        printout = self.printout()
        if printout is None:
            return
        dialog = PdfDialog(self, printout, self.settings)
        dialog.accepted.connect(lambda: self.export_pdf(*dialog.choices(), printout))
        show_dialog(dialog)

    def export_pdf(self: Any, path: str, paper: str, printout: Printout | None = None) -> None:
        """Paint and write the PDF at `path` on `paper` as a job; the status line says how
        many pages were written, or why not."""
        printout = printout or self.printout()
        league = self.doc.working_league()
        if printout is None or league is None:
            return

        def work(hooks: Hooks) -> PdfWritten:
            return pdf_job(printout, paper, path, league, hooks)

        self.runner.start(Job(WRITING_PDF, work, self._pdf_written))

    def _pdf_written(self: Any, outcome: PdfWritten) -> None:
        if outcome.problem is not None:
            self._warn(outcome.problem, "The PDF was not written.")
            return
        self.last_export = [str(outcome.path)]
        self.stage_label.setText(f"Wrote {plural(outcome.pages, 'page')} to {outcome.path}.")
