"""The Export PDF dialog: where the printed schedule goes and on which paper (A4 or Letter)."""

from __future__ import annotations

from pathlib import Path

from PySide6.QtCore import QSettings
from PySide6.QtWidgets import (
    QComboBox,
    QDialog,
    QDialogButtonBox,
    QFileDialog,
    QFormLayout,
    QHBoxLayout,
    QLabel,
    QLineEdit,
    QPushButton,
    QVBoxLayout,
    QWidget,
)

from leaguegrid.app.printout import part_counts
from leaguegrid.core.model import League, Schedule
from leaguegrid.core.wording import plural
from leaguegrid.gui.export_dialog import export_folder, safe_stem
from leaguegrid.gui.print_pages import PAPERS, default_paper

PAPER_KEY = "printPaper"


def chosen_paper(settings: QSettings) -> str:
    """The paper last chosen, else the locale's (Letter in the US and Canada, else A4)."""
    paper = str(settings.value(PAPER_KEY, "") or "")
    return paper if paper in PAPERS else default_paper()


class PdfDialog(QDialog):
    """A file name (in the export folder by default) and the paper; says what the PDF holds."""

    def __init__(self, parent: QWidget, league: League, schedule: Schedule,
                 settings: QSettings) -> None:
        super().__init__(parent)
        self.setWindowTitle("Export the schedule as PDF")
        self.settings = settings
        stem = safe_stem(league.settings.league or league.name)
        self.path = QLineEdit(str(export_folder(settings) / f"{stem}-schedule.pdf"))
        self.path.setAccessibleName("PDF file")
        browse = QPushButton("Choose…")
        browse.clicked.connect(self._browse)
        row = QHBoxLayout()
        row.addWidget(self.path, 1)
        row.addWidget(browse)
        self.paper = QComboBox()
        self.paper.setAccessibleName("Paper size")
        self.paper.addItems(list(PAPERS))
        self.paper.setCurrentText(chosen_paper(settings))
        form = QFormLayout()
        form.addRow("File:", row)
        form.addRow("Paper:", self.paper)
        rounds, teams, venues = part_counts(league, schedule)
        contents = QLabel(
            f"The schedule by round ({plural(rounds, 'round')}, each on a new page), then a page "
            f"for each team ({teams}) and each venue ({venues}); every page carries the caution "
            "and its page number.")
        contents.setWordWrap(True)
        self.buttons = QDialogButtonBox(QDialogButtonBox.StandardButton.Cancel)
        self.write_button = self.buttons.addButton("Write PDF",
                                                   QDialogButtonBox.ButtonRole.AcceptRole)
        self.buttons.accepted.connect(self._accept)
        self.buttons.rejected.connect(self.reject)
        layout = QVBoxLayout(self)
        layout.addLayout(form)
        layout.addWidget(contents)
        layout.addWidget(self.buttons)
        self.resize(620, 180)

    def _browse(self) -> None:
        chosen, _f = QFileDialog.getSaveFileName(self, "Export PDF to", self.path.text(),
                                                 "PDF (*.pdf)")
        if chosen:
            self.path.setText(chosen)

    def choices(self) -> tuple[str, str]:
        """The file to write (".pdf" added when it has no suffix) and the paper ("A4" or
        "Letter")."""
        path = self.path.text().strip()
        if path and not Path(path).suffix:
            path += ".pdf"
        return path, self.paper.currentText()

    def _accept(self) -> None:
        path, paper = self.choices()
        if path:
            self.settings.setValue("exportFolder", str(Path(path).parent))
        self.settings.setValue(PAPER_KEY, paper)
        self.accept()
