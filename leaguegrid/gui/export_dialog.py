"""The export dialog: choose the files, see exactly what will be written before writing it."""

from __future__ import annotations

import re
from pathlib import Path

from PySide6.QtCore import QSettings, QStandardPaths
from PySide6.QtWidgets import (
    QCheckBox,
    QDialog,
    QDialogButtonBox,
    QFileDialog,
    QGridLayout,
    QLabel,
    QLineEdit,
    QPlainTextEdit,
    QPushButton,
    QVBoxLayout,
    QWidget,
)

from leaguegrid.app import export
from leaguegrid.core.model import League, Schedule

PRIVACY = ("Clash reasons (which may name families or coaches) stay out of every club-facing "
           "file: the calendar's team, venue and club sheets, the iCalendar files and the CSV "
           "never contain them; the Summary sheet only counts them.")


def safe_stem(name: str) -> str:
    """A file-name stem from a league name."""
    return re.sub(r"[^\w\- ]+", "_", name).strip().replace(" ", "-") or "league"


def export_folder(settings: QSettings) -> Path:
    """Where exports go unless the coordinator says otherwise: the last export folder, else the
    user's Documents folder (never the workbook's folder, which may be the demos')."""
    last = settings.value("exportFolder")
    if last and Path(str(last)).is_dir():
        return Path(str(last))
    documents = QStandardPaths.writableLocation(QStandardPaths.StandardLocation.DocumentsLocation)
    return Path(documents) if documents else Path.home()


class ExportDialog(QDialog):
    """Excel calendar, iCalendar per team and club, CSV: each with its target and a preview."""

    def __init__(self, parent: QWidget, league: League, schedule: Schedule,
                 settings: QSettings) -> None:
        super().__init__(parent)
        self.setWindowTitle("Export the schedule")
        self.league, self.schedule, self.settings = league, schedule, settings
        folder = export_folder(settings)
        stem = safe_stem(league.settings.league or league.name)
        self.xlsx_on = QCheckBox("Excel calendar")
        self.xlsx_on.setChecked(True)
        self.xlsx_path = QLineEdit(str(folder / f"{stem}-calendar.xlsx"))
        self.ics_on = QCheckBox("iCalendar files (one per team, per club, and the league)")
        self.ics_path = QLineEdit(str(folder / f"{stem}-calendars"))
        self.csv_on = QCheckBox("CSV of the whole schedule")
        self.csv_path = QLineEdit(str(folder / f"{stem}-schedule.csv"))
        grid = QGridLayout()
        for r, (box, line, is_dir) in enumerate(((self.xlsx_on, self.xlsx_path, False),
                                                 (self.ics_on, self.ics_path, True),
                                                 (self.csv_on, self.csv_path, False))):
            browse = QPushButton("Choose…")
            browse.clicked.connect(lambda _c=False, ln=line, d=is_dir: self._browse(ln, d))
            grid.addWidget(box, r, 0)
            grid.addWidget(line, r, 1)
            grid.addWidget(browse, r, 2)
            box.toggled.connect(self._preview)
            line.textChanged.connect(self._preview)
        self.preview = QPlainTextEdit()
        self.preview.setObjectName("exportPreview")
        self.preview.setReadOnly(True)
        privacy = QLabel(PRIVACY)
        privacy.setWordWrap(True)
        self.buttons = QDialogButtonBox(QDialogButtonBox.StandardButton.Cancel)
        self.write_button = self.buttons.addButton("Write files",
                                                   QDialogButtonBox.ButtonRole.AcceptRole)
        self.buttons.accepted.connect(self._accept)
        self.buttons.rejected.connect(self.reject)
        layout = QVBoxLayout(self)
        layout.addLayout(grid)
        layout.addWidget(QLabel("What will be written:"))
        layout.addWidget(self.preview, 1)
        layout.addWidget(privacy)
        layout.addWidget(self.buttons)
        self.resize(720, 480)
        self._preview()

    def _browse(self, line: QLineEdit, is_dir: bool) -> None:
        if is_dir:
            chosen = QFileDialog.getExistingDirectory(self, "Folder for the calendars",
                                                      line.text())
        else:
            chosen, _f = QFileDialog.getSaveFileName(self, "Export to", line.text())
        if chosen:
            line.setText(chosen)

    def preview_text(self) -> str:
        """The files and their contents, in words."""
        lines = []
        fixtures = len(self.schedule.assignment)
        if self.xlsx_on.isChecked():
            sheets = export.calendar_sheet_names(self.league)
            lines.append(f"{self.xlsx_path.text()}")
            lines.append(f"  {len(sheets)} sheets: " + ", ".join(sheets[:12])
                         + (", …" if len(sheets) > 12 else ""))
            lines.append(f"  {fixtures} fixtures, {self.schedule.rounds} rounds, "
                         f"seed {self.schedule.seed}")
        if self.ics_on.isChecked():
            names, problem = export.ics_file_names(self.league, self.schedule)
            if problem:
                lines.append(f"{self.ics_path.text()}: cannot be written: {problem}")
            else:
                lines.append(f"{self.ics_path.text()}/ ({len(names)} files)")
                lines += [f"  {n}" for n in names[:40]]
                if len(names) > 40:
                    lines.append(f"  … and {len(names) - 40} more")
        if self.csv_on.isChecked():
            lines.append(f"{self.csv_path.text()}")
            lines.append(f"  one row per fixture ({fixtures} rows)")
        if self.league.source:
            lines.append("")
            lines.append(f"The workbook {Path(self.league.source).name} is only read; no export "
                         "may write over it.")
        return "\n".join(lines)

    def _preview(self) -> None:
        self.preview.setPlainText(self.preview_text())
        self.write_button.setEnabled(any(b.isChecked() for b in (self.xlsx_on, self.ics_on,
                                                                 self.csv_on)))

    def choices(self) -> dict[str, str | None]:
        """What to write: "xlsx" and "csv" file paths, "ics" a folder; None where unchecked."""
        return {
            "xlsx": self.xlsx_path.text() if self.xlsx_on.isChecked() else None,
            "ics": self.ics_path.text() if self.ics_on.isChecked() else None,
            "csv": self.csv_path.text() if self.csv_on.isChecked() else None,
        }

    def _accept(self) -> None:
        first = next((p for p in self.choices().values() if p), None)
        if first:
            self.settings.setValue("exportFolder", str(Path(first).parent))
        self.accept()
